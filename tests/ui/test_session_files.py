"""Session commands in the window: hostile files change nothing; paths are kept absolute."""

from __future__ import annotations

import json
from pathlib import Path

import numpy as np
import pytest
from PySide6.QtCore import QSettings
from PySide6.QtWidgets import QMessageBox

from zeffir.export import save_session
from zeffir.state import OrbitalChoice, SliceSettings, Source, ViewState


@pytest.fixture
def warnings(monkeypatch):
    """Record message boxes instead of showing them (they would block)."""
    shown: list[str] = []
    monkeypatch.setattr(QMessageBox, "warning", lambda _parent, _title, text, *a: shown.append(text))
    return shown


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                                 slice=SliceSettings(resolution=64, extent=10.0)))


def _good_state() -> dict:
    return ViewState(left=Source("Ne", "slater"), orbital=OrbitalChoice("2p"),
                     slice=SliceSettings(resolution=48)).validated().to_dict()


def _session_text(state: dict, **top) -> str:
    return json.dumps({"kind": "zeffir-session", "version": 1, "state": state, **top})


def _with(path: tuple[str, ...], literal: str) -> str:
    """A valid session whose state holds the JSON ``literal`` at ``path``."""
    state = _good_state()
    node = state
    for key in path[:-1]:
        node = node[key]
    node[path[-1]] = "@@here@@"
    return _session_text(state).replace('"@@here@@"', literal)


HOSTILE = [
    (_with(("slice", "resolution"), "9" * 5000), "slice.resolution: must be between 16 and"),
    (_with(("slice", "extent"), "1e17"), "slice.extent: must be a positive number of bohr"),
    (_with(("slice", "extent"), "NaN"), "slice.extent: expected a finite number"),
    (_with(("pair", "reference"), "[0, Infinity, 0]"), "pair.reference: expected 3 finite numbers"),
    (_with(("slice",), "[1, 2]"), "slice: expected an object"),
    (_with(("radial", "weighted"), "1"), "radial.weighted: expected true or false"),
    (_with(("left", "model"), '"nope"'), "model: nope: unknown model"),
    (_with(("left", "spec"), json.dumps("Ne" * 500_000)), "spec: at most 256 characters"),
    (_with(("compare", "more"), json.dumps([{}] * 5)), "compare.more: at most 4 further series"),
    (_with(("orbital", "m"), "2"), "orbital.m: must be between -1 and 1 for 2p"),
    ("[" * 100_000 + "]" * 100_000, "JSON nested too deeply"),
    ("", "the file is empty"),
    (_with(("slice", "extent"), "NaN"), "slice.extent"),
    ('{"kind": "zeffir-session", "kind": "zeffir-session", "version": 1, "state": {}}',
     "the key 'kind' appears twice"),
    ("[]", "expected a JSON object, found an array"),
]


@pytest.mark.parametrize(("content", "message"), HOSTILE)
def test_a_hostile_session_is_refused_naming_the_problem_and_the_window_keeps_everything(
        window, tmp_path, warnings, content, message):
    good = tmp_path / "good.zeffir"
    assert window.save_session_as(good)
    before_state = window.model.state
    before_curves = window.radial_trio.views[0].curve_data()
    before_recent = window.sessions.recent()
    before_title = window.windowTitle()
    path = tmp_path / "hostile.zeffir"
    path.write_bytes(content.encode("utf-8", "surrogatepass"))

    assert not window.open_session(path)

    assert len(warnings) == 1 and warnings[0].startswith(f"{path}: ") and message in warnings[0]
    assert len(warnings[0]) < len(str(path)) + 400
    assert window.model.state == before_state
    assert window.session_path == good.resolve()
    assert window.sessions.recent() == before_recent
    assert window.windowTitle() == before_title
    after = window.radial_trio.views[0].curve_data()
    assert after.keys() == before_curves.keys()
    for label, (x, y) in before_curves.items():
        np.testing.assert_array_equal(after[label][0], x)
        np.testing.assert_array_equal(after[label][1], y)


def test_a_file_over_two_mebibytes_is_refused_and_nothing_changes(window, tmp_path, warnings):
    before = window.model.state
    path = tmp_path / "big.zeffir"
    text = _session_text(_good_state())
    path.write_text(text[:-1] + " " * (2 * 1024 * 1024) + "}", encoding="utf-8")
    assert not window.open_session(path)
    assert warnings == [f"{path}: not a Zeffir session (larger than 2 MiB)"]
    assert window.model.state == before and window.session_path is None


def test_a_relative_path_is_remembered_absolute_and_reopens_from_another_folder(
        window, tmp_path, monkeypatch, warnings):
    first, second = tmp_path / "first", tmp_path / "second"
    first.mkdir()
    second.mkdir()
    monkeypatch.chdir(first)
    window.model.update(left=Source("Ar", "slater"))
    assert window.save_session_as("argon.zeffir")  # relative to ``first``
    saved = (first / "argon.zeffir").resolve()
    assert window.session_path == saved
    assert window.sessions.recent()[0] == str(saved)
    assert window.sessions.last_dir() == str(saved.parent)

    monkeypatch.chdir(second)
    window.model.update(left=Source("Kr", "slater"))
    assert window.save_session()  # still the file in ``first``, not a new one here
    assert not (second / "argon.zeffir").exists()
    assert json.loads(saved.read_text(encoding="utf-8"))["state"]["left"]["spec"] == "Kr"

    # Through ``..`` from the other folder: the same file, one entry, no ``..`` in it.
    window.model.update(left=Source("Na", "slater"))
    assert window.open_session(Path("..") / "first" / "argon.zeffir")
    assert window.model.state.left.spec == "Kr"
    assert window.sessions.recent() == [str(saved)]
    assert ".." not in window.sessions.recent()[0]

    # The recent menu's entry opens the file whatever the working directory is.
    window.model.update(left=Source("Na", "slater"))
    monkeypatch.chdir(tmp_path)
    actions = window.recent_menu.actions()
    assert [a.text() for a in actions] == [str(saved)]
    actions[0].trigger()
    assert window.model.state.left.spec == "Kr"
    assert not warnings


def test_a_relative_path_in_a_fresh_window_appears_absolute_in_its_recent_list(
        make_window, tmp_path, monkeypatch):
    folder = tmp_path / "work"
    folder.mkdir()
    save_session(folder / "neon.zeffir", ViewState(left=Source("Ne", "slater")).validated())
    monkeypatch.chdir(folder)
    window = make_window(ViewState())
    assert window.open_session("neon.zeffir")
    assert window.session_path == folder.resolve() / "neon.zeffir"
    monkeypatch.chdir(tmp_path)
    assert window.sessions.recent() == [str(folder.resolve() / "neon.zeffir")]
    assert Path(window.sessions.recent()[0]).is_file()


def test_an_export_to_a_relative_path_keeps_the_folder_absolute(window, tmp_path, monkeypatch):
    folder = tmp_path / "figures"
    folder.mkdir()
    monkeypatch.chdir(folder)
    assert window.export_data("curves.csv")
    assert (folder / "curves.csv").stat().st_size > 0
    monkeypatch.chdir(tmp_path)
    assert window.sessions.last_dir() == str(folder.resolve())


def test_a_last_folder_that_is_not_absolute_falls_back_to_home(window, tmp_path):
    window.settings.setValue("last_dir", "somewhere/relative")
    assert window.sessions.last_dir() == str(Path.home())
    window.settings.setValue("last_dir", str(tmp_path))
    assert window.sessions.last_dir() == str(tmp_path)


def test_recent_list_in_settings_is_never_longer_than_eight(make_window, tmp_path):
    window = make_window(ViewState())
    for index in range(10):
        assert window.save_session_as(tmp_path / f"s{index}.zeffir")
    recent = window.sessions.recent()
    assert recent == [str((tmp_path / f"s{i}.zeffir").resolve()) for i in range(9, 1, -1)]
    settings = QSettings(window.settings.fileName(), QSettings.Format.IniFormat)
    assert len(settings.value("recent_sessions")) == 8

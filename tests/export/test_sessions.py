"""Session files: round trip, and a clear SessionError for every kind of bad file."""

import json

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from zeffir.core._resources import resource_path
from zeffir.export import (
    SESSION_SUFFIX,
    SESSION_VERSION,
    SessionError,
    export_view,
    load_session,
    save_session,
)
from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    RadialSettings,
    SliceSettings,
    Source,
    ViewState,
)

STATE = ViewState(
    left=Source("Fe3+", "clementi"),
    orbital=OrbitalChoice("3d", "complex", -2),
    view="slice",
    length_unit="angstrom",
    radial=RadialSettings(quantity="Q", weighted=False, log_r=True, r_limit=9.5),
    slice=SliceSettings(plane="custom", normal=(1.0, -1.0, 0.5), offset=0.25, extent=5.0,
                        resolution=96, quantity="psi2", colour=ColourSettings(log_scale=True),
                        contours=3),
    compare=CompareSettings(True, Source("Fe 1s2 2s2 2p6 3s2 3p6 3d6 4s2", "slater"), False, same_atom=False),
).validated()


def _document(**changes):
    document = {"kind": "zeffir-session", "version": 1, "saved_by": "zeffir 0.1.0",
                "state": STATE.to_dict()}
    document.update(changes)
    return document


def _write(tmp_path, document, name="s.zeffir"):
    path = tmp_path / name
    path.write_text(json.dumps(document) if not isinstance(document, str) else document, encoding="utf-8")
    return path


def test_round_trip_restores_an_equal_state(tmp_path):
    path = save_session(tmp_path / f"s{SESSION_SUFFIX}", STATE)
    assert load_session(path) == STATE
    stored = json.loads(path.read_text(encoding="utf-8"))
    assert stored["kind"] == "zeffir-session" and stored["version"] == SESSION_VERSION == 1
    assert stored["saved_by"].startswith("zeffir ")
    assert stored["state"] == STATE.to_dict()


def test_file_that_is_not_json_is_not_a_session(tmp_path):
    path = _write(tmp_path, '{"kind": "zeffir-session", "version": 1, "state": {')
    with pytest.raises(SessionError, match=r"s\.zeffir: not a Zeffir session: invalid JSON at line 1"):
        load_session(path)


def test_binary_file_is_not_a_session(tmp_path):
    path = tmp_path / "s.zeffir"
    path.write_bytes(b"\x89PNG\r\n\x1a\n\xff\xfe")
    with pytest.raises(SessionError, match="not a Zeffir session"):
        load_session(path)


@pytest.mark.parametrize(
    ("document", "found"),
    [
        ({"state": {}}, "no 'kind' field"),
        ({"kind": "zeffir-demo", "version": 1}, "its kind is 'zeffir-demo'"),
        ([1, 2, 3], "expected a JSON object, found an array"),
    ],
)
def test_foreign_json_is_not_a_session(tmp_path, document, found):
    with pytest.raises(SessionError, match="not a Zeffir session") as caught:
        load_session(_write(tmp_path, document))
    assert found in str(caught.value)


def test_shipped_demo_description_is_not_mistaken_for_a_session():
    with pytest.raises(SessionError, match="its kind is 'zeffir-demo'"):
        load_session(str(resource_path("demo", "sodium-valence.json")))


def test_newer_version_is_refused_with_both_versions_named(tmp_path):
    path = _write(tmp_path, _document(version=2))
    with pytest.raises(SessionError) as caught:
        load_session(path)
    assert str(caught.value) == f"{path}: made by a newer Zeffir (version 2); this one reads up to 1"


@pytest.mark.parametrize("version", ["1", 0, 1.5, None, True])
def test_malformed_version_is_not_a_session(tmp_path, version):
    with pytest.raises(SessionError, match="not a Zeffir session"):
        load_session(_write(tmp_path, _document(version=version)))


@pytest.mark.parametrize(
    ("change", "message"),
    [
        (("slice", "resolution", 5), "invalid session: slice.resolution: must be between 16 and"),
        (("slice", "resolution", "high"), "invalid session: slice.resolution: expected a whole number"),
        (("left", "spec", "Xx"), "invalid session: spec: Xx: unknown element"),
        (("left", "model", "nope"), "invalid session: model: nope: unknown model"),
        (("radial", "quantity", "Z"), "invalid session: radial.quantity: 'Z' is not one of"),
        (("slice", "normal", [0, 0, 0]), "invalid session: slice.normal: three numbers, not all zero"),
    ],
)
def test_invalid_field_is_named(tmp_path, change, message):
    document = _document()
    group, field, value = change
    document["state"][group][field] = value
    with pytest.raises(SessionError, match=message):
        load_session(_write(tmp_path, document))


def test_missing_state_and_unreadable_file(tmp_path):
    with pytest.raises(SessionError, match="invalid session: no 'state' field"):
        load_session(_write(tmp_path, {"kind": "zeffir-session", "version": 1}))
    with pytest.raises(SessionError, match=r"gone\.zeffir: cannot read \(No such file or directory\)"):
        load_session(tmp_path / "gone.zeffir")
    with pytest.raises(SessionError, match="cannot read"):
        load_session(tmp_path)


def test_saving_an_invalid_state_changes_nothing(tmp_path):
    path = save_session(tmp_path / "s.zeffir", STATE)
    before = path.read_bytes()
    bad = STATE.with_changes(slice=SliceSettings(resolution=3))
    with pytest.raises(SessionError, match=r"cannot save an invalid state: slice\.resolution"):
        save_session(path, bad)
    assert path.read_bytes() == before
    with pytest.raises(SessionError, match="cannot write"):
        save_session(tmp_path / "missing" / "s.zeffir", STATE)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["s.zeffir"]


_json = st.recursive(
    st.none() | st.booleans() | st.integers(-5, 2000) | st.floats(allow_nan=True)
    | st.sampled_from(["Na", "xz", "psi", "3s", "slater", "custom", "", "radial", "D"]),
    lambda inner: st.lists(inner, max_size=4) | st.dictionaries(
        st.sampled_from(["left", "right", "spec", "model", "orbital", "subshell", "kind", "m",
                         "view", "slice", "radial", "plane", "normal", "resolution", "extent",
                         "compare", "enabled", "quantity", "r_limit", "contours"]),
        inner, max_size=5),
    max_leaves=12,
)


@settings(max_examples=150, deadline=None)
@given(state=_json)
def test_any_json_state_either_loads_or_raises_session_error(tmp_path_factory, state):
    path = tmp_path_factory.mktemp("fuzz") / "s.zeffir"
    path.write_text(json.dumps({"kind": "zeffir-session", "version": 1, "state": state}), encoding="utf-8")
    try:
        assert isinstance(load_session(path), ViewState)
    except SessionError as error:
        assert str(error).startswith(str(path))


def test_demo_session_loads_and_exports(tmp_path):
    state = load_session(str(resource_path("demo", "sodium-valence.zeffir")))
    assert (state.left.spec, state.left.model) == ("Na", "slater")
    right = state.compare.right
    assert state.compare.enabled and (right.spec, right.model) == ("Na", "clementi")
    assert state.view == "radial" and state.orbital.subshell == "3s"
    assert (state.slice.plane, state.slice.extent, state.slice.resolution, state.slice.quantity) == (
        "xz", 12.0, 256, "psi")
    assert export_view(state, tmp_path / "demo.csv").stat().st_size > 0
    assert export_view(state, tmp_path / "demo.png", dpi=72).read_bytes()[:4] == b"\x89PNG"

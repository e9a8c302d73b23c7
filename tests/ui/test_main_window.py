"""The main window: typed input, models, comparison, export and sessions, checked on the data."""

from __future__ import annotations

import json

import numpy as np
import pytest
from PySide6.QtCore import QSettings, Qt
from PySide6.QtWidgets import QMessageBox
from scipy.integrate import trapezoid

from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui._main_window import MainWindow


@pytest.fixture
def warnings(monkeypatch):
    """Record message boxes instead of showing them (they would block)."""
    shown: list[str] = []
    monkeypatch.setattr(QMessageBox, "warning", lambda _parent, _title, text, *a: shown.append(text))
    return shown


@pytest.fixture
def window(qtbot, tmp_path):
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    state = ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                      slice=SliceSettings(resolution=64, extent=10.0))
    win = MainWindow(state, synchronous=True, settings=settings)
    qtbot.addWidget(win)
    return win


def _type_spec(qtbot, win, text):
    edit = win.atom_bar.source_fields.spec_edit
    edit.selectAll()
    qtbot.keyClicks(edit, text)
    qtbot.keyClick(edit, Qt.Key.Key_Return)


def _table_column(win, column):
    return [win.table.item(r, column).text().rstrip(" *") for r in range(win.table.rowCount())]


def test_typing_a_spec_updates_table_and_curves(qtbot, window):
    _type_spec(qtbot, window, "Fe3+")
    assert window.model.state.left.spec == "Fe3+"
    assert _table_column(window, 0) == ["1s", "2s", "2p", "3s", "3p", "3d"]
    curves = window.radial_trio.views[0].curve_data()
    assert any(label.startswith("3d") for label in curves)
    x, y = curves["total"]
    assert trapezoid(y, x) == pytest.approx(23, rel=1e-3)


def test_invalid_spec_shows_the_reason_and_keeps_the_state(qtbot, window):
    before = window.radial_trio.views[0].curve_data()
    _type_spec(qtbot, window, "C 2p7")
    assert window.atom_bar.source_fields.error_text() == "2p7: a p subshell holds at most 6 electrons"
    assert window.model.state.left.spec == "Na"
    after = window.radial_trio.views[0].curve_data()
    assert before.keys() == after.keys()
    for label in before:
        np.testing.assert_array_equal(before[label][1], after[label][1])


def test_switching_the_model_changes_zeta_and_curves(window):
    zeta_before = _table_column(window, 2)
    curve_before = window.radial_trio.views[0].curve_data()["total"][1]
    window.model.update(left=Source("Na", "clementi"))
    assert _table_column(window, 2) != zeta_before
    assert not np.allclose(window.radial_trio.views[0].curve_data()["total"][1], curve_before)


def test_selecting_a_table_row_selects_the_orbital(window):
    window.table.selectRow(2)
    assert window.model.state.orbital.subshell == "2p"


def test_difference_view_equals_right_minus_left(window):
    window.model.update(view="slice", compare=CompareSettings(True, Source("Na", "hydrogenic"), True))
    left, right, diff = (v.image_data() for v in window.slice_trio.views)
    np.testing.assert_allclose(diff, right - left, rtol=0, atol=1e-12 * np.abs(right).max())


def test_radial_comparison_difference(window):
    window.model.update(compare=CompareSettings(True, Source("Na", "hydrogenic"), True))
    left, right, diff = (v.curve_data() for v in window.radial_trio.views)
    np.testing.assert_allclose(diff["total"][1], right["total"][1] - left["total"][1])


def test_closing_a_comparison_fits_the_value_axis_to_the_left_curves(window):
    # Xe's radial distribution peaks far higher than Na's; once the comparison is off,
    # the hidden right-hand view must not keep the left one's value axis stretched.
    window.model.update(compare=CompareSettings(True, Source("Xe", "slater"), False, same_atom=False))
    window.model.update(compare=CompareSettings(False, Source("Xe", "slater"), False, same_atom=False))
    left = window.radial_trio.views[0]
    top = max(float(np.nanmax(y)) for _, y in left.curve_data().values())
    _, y_high = left._plot.getViewBox().viewRange()[1]
    assert top < y_high < 1.2 * top


@pytest.mark.parametrize("suffix", [".png", ".svg", ".pdf"])
def test_figure_export_writes_valid_files(window, tmp_path, suffix, warnings):
    path = tmp_path / f"figure{suffix}"
    assert window.export_figure(path, "single", 100)
    head = path.read_bytes()[:8]
    expected = {".png": b"\x89PNG", ".svg": b"<", ".pdf": b"%PDF"}[suffix]
    assert head.lstrip().startswith(expected) or (suffix == ".svg" and b"<svg" in path.read_bytes())
    assert not warnings


def test_data_export_holds_what_is_shown(window, tmp_path):
    window.model.update(view="slice")
    path = tmp_path / "slice.npz"
    window.export_data(path)
    with np.load(path) as data:
        # image is stored only where it is not values (a log scale)
        image = data["image"] if "image" in data.files else data["values"]
        np.testing.assert_array_equal(image, window.slice_trio.views[0].image_data())
    window.model.update(view="radial")
    csv = tmp_path / "curves.csv"
    window.export_data(csv)
    assert csv.read_text().splitlines()[1].startswith("# Zeffir radial data")


def test_export_to_an_unwritable_place_warns_and_writes_nothing(window, tmp_path, warnings):
    window.export_figure(tmp_path / "missing" / "f.png", "single", 100)
    assert warnings and "missing" in warnings[0]
    assert not (tmp_path / "missing").exists()


def test_session_round_trip_restores_the_state(qtbot, window, tmp_path):
    window.model.update(left=Source("Fe", "clementi"), orbital=OrbitalChoice("3d", "real", -2),
                        view="slice")
    path = tmp_path / "iron.zeffir"
    assert window.save_session_as(path)
    other = MainWindow(ViewState(), synchronous=True,
                       settings=QSettings(str(tmp_path / "o.ini"), QSettings.Format.IniFormat))
    qtbot.addWidget(other)
    assert other.open_session(path)
    assert other.model.state == window.model.state
    np.testing.assert_array_equal(other.slice_trio.views[0].image_data(),
                                  window.slice_trio.views[0].image_data())
    assert str(path) in other.sessions.recent()


@pytest.mark.parametrize("content", ["{not json", json.dumps({"kind": "other"}),
                                     json.dumps({"kind": "zeffir-session", "version": 99, "state": {}})])
def test_bad_session_is_rejected_and_nothing_changes(window, tmp_path, warnings, content):
    before = window.model.state
    path = tmp_path / "bad.zeffir"
    path.write_text(content)
    assert not window.open_session(path)
    assert warnings
    assert window.model.state == before


def test_worker_thread_delivers_only_the_newest_request(qtbot, tmp_path):
    settings = QSettings(str(tmp_path / "s.ini"), QSettings.Format.IniFormat)
    win = MainWindow(ViewState(left=Source("Ne")), synchronous=False, settings=settings)
    qtbot.addWidget(win)
    for spec in ("Ar", "Kr", "Xe"):
        win.model.update(left=Source(spec))
    def settled() -> None:
        assert not win.progress.isVisible()
        labels = win.radial_trio.views[0].curve_data()
        assert any(label.startswith("5p") for label in labels)
    qtbot.waitUntil(settled, timeout=10000)
    win.worker.shutdown()


def test_demo_session_opens(qtbot, tmp_path):
    from zeffir.ui._app import demo_state

    state = demo_state()
    win = MainWindow(state, synchronous=True,
                     settings=QSettings(str(tmp_path / "d.ini"), QSettings.Format.IniFormat))
    qtbot.addWidget(win)
    assert win.model.state.left.spec == "Na"
    assert len(win.radial_trio.views[0].curve_data()) > 0


def test_table_copies_as_tab_separated_text(window):
    text = window.table.as_text().splitlines()
    assert text[0].split("\t")[0] == "Subshell" and len(text) == 5
    assert text[4].split("\t")[:2] == ["3s", "1"]
    window.table.copy_to_clipboard()
    from PySide6.QtGui import QGuiApplication

    assert QGuiApplication.clipboard().text() == window.table.as_text()


def test_slice_readout_maps_plane_coordinates_to_xyz(window):
    window.model.update(view="slice", slice=SliceSettings(plane="xz", offset=0.5, resolution=64))
    view = window.slice_trio.views[0]
    assert view._point_of is not None
    assert view._point_of(1.0, 2.0) == pytest.approx((1.0, 0.5, 2.0))  # the xz plane at y = 0.5


def test_cancel_hides_the_progress_indicator(window, qtbot):
    window._on_busy(True)
    assert window.progress.isHidden()  # not for work that ends within a frame or two
    qtbot.waitUntil(lambda: not window.progress.isHidden(), timeout=2000)
    assert not window.cancel_button.isHidden()
    window.cancel_button.click()
    assert window.progress.isHidden() and window.cancel_button.isHidden()


def test_quick_work_never_shows_the_busy_indicator(window, qtbot):
    window._on_busy(True)
    window._on_busy(False)
    qtbot.wait(250)  # past the delay
    assert window.progress.isHidden() and window.cancel_button.isHidden()


def test_pair_view_shows_densities_and_hole_and_click_moves_the_reference(window):
    window.model.update(left=Source("Ne"), view="pair",
                        slice=SliceSettings(extent=3.0, resolution=64))
    views = window.pair_trio.views
    images = [v.image_data() for v in views]
    assert all(image.shape == (64, 64) for image in images)
    # The hole is a deficit: its panel draws the depth −h ≥ 0, the scene keeps h ≤ 0.
    assert images[2].min() >= 0.0 < images[2].max() and images[0].max() > 0
    assert views[2]._scene.values.max() <= 0.0
    assert "∫ = -1.000" in views[2]._title.text()
    window._place_reference(0.5, -0.25)  # what a click at (u, v) on the xz plane does
    assert window.model.state.pair.reference == pytest.approx((0.5, 0.0, -0.25))
    assert views[0].marker_position() == pytest.approx((0.5, -0.25))


def test_invalid_determinant_is_refused_and_nothing_changes(window):
    window.model.update(left=Source("N"), view="pair", slice=SliceSettings(resolution=32))
    before = window.model.state
    window.controls.determinant.setText("2p: 1u 1u 0u")
    window.controls._emit_pair()
    assert "1u" in window.controls.determinant_message.text()
    assert window.model.state == before


def test_two_electron_view_shows_singlet_triplet_and_difference(window):
    window.model.update(left=Source("Li+ 1s1 2s1", "hydrogenic"), view="two-electron")
    singlet, triplet, difference = (v.image_data() for v in window.two_trio.views)
    np.testing.assert_allclose(difference, triplet - singlet)
    assert window.tabs.currentIndex() == 3


def test_cancel_stops_a_long_model_build_in_the_worker(qtbot, tmp_path):
    import time

    from zeffir.core import ModelError, build
    from zeffir.ui._worker import SceneWorker

    worker = SceneWorker()
    results = []
    outcome: list[str] = []
    worker.finished.connect(lambda key, result: results.append(result))

    def job():
        try:
            build("Xe", "variational")  # about 15 s when not cancelled
        except ModelError as error:
            outcome.append(str(error))
            raise
        outcome.append("finished")

    start = time.perf_counter()
    worker.request("model", job)
    qtbot.wait(200)
    worker.cancel()
    worker.shutdown()  # waits for the running job: it must stop at its next check
    assert time.perf_counter() - start < 3.0
    assert len(outcome) == 1 and "cancelled" in outcome[0]
    assert results == []


def test_energy_line_shows_the_correlation_energy_for_hartree_fock(window):
    window.model.update(left=Source("Ne", "hartree-fock"))
    text = window.energy_line.text()
    # E_exact (Chakravorty et al. 1993) − E_HF (≈ −128.547098) ≈ −0.3905 Eh.
    assert "-128.547098" in text and "correlation energy -0.3905" in text
    assert "−V/T = 2.00000000" in text
    window.model.update(left=Source("Ne", "clementi"))
    assert "no total energy" in window.energy_line.text()
    # The average model: an energy, but not one state's, so no correlation energy.
    window.model.update(left=Source("Ne 1s2 2s2 2p5 3s1", "hartree-fock-average"))
    text = window.energy_line.text()
    assert "not one state" in text and "correlation" in text and "exact non-relativistic" not in text

"""The Trends view in the window: drawn values, the side panel, clicks, gaps, export, failures."""

from __future__ import annotations

import math

import numpy as np
import pytest

from zeffir.core.trends import evaluate_trend, parse_rule
from zeffir.state import Source, TrendSettings, ViewState


def _state(**trends):
    settings = TrendSettings(**{"rule": "Z=1-10", "models": "slater,hartree-fock", **trends})
    return ViewState(left=Source("Na", "slater"), view="trends", trends=settings)


def test_the_lines_are_the_trend_values(make_window):
    window = make_window(_state())
    assert window.tabs.currentWidget() is window.trend_view and window.problem() is None
    lines = window.trend_view.line_data()
    expected = evaluate_trend(parse_rule("Z=1-10"), ["slater", "hartree-fock"], "z_eff")
    for series, name in zip(expected.series, ["Slater's rules", "restricted Hartree–Fock"], strict=True):
        x, y = lines[name]
        assert list(x) == list(range(1, 11))
        np.testing.assert_allclose(y, [p.value for p in series.points], rtol=0, atol=0)
    assert window.drawn("trends").trends == window.state.trends
    assert window.controls.trends_box.isVisibleTo(window.controls)
    assert not window.controls.radial_box.isVisibleTo(window.controls)


def test_ionization_energies_come_with_nist_and_the_difference_panel(make_window):
    window = make_window(_state(quantity="ionization_energy", methods="koopmans,delta-scf",
                                models="hartree-fock"))
    lines = window.trend_view.line_data()
    assert set(lines) == {"restricted Hartree–Fock, Koopmans", "restricted Hartree–Fock, ΔSCF",
                          "NIST (measured)"}
    assert window.trend_view.difference.scene() is not None  # the second panel is shown
    # He: 24.587389 eV (NIST ASD, the shipped first_ionization_energies.csv) over the
    # CODATA 2018 hartree, 27.211386245981 eV (scipy.constants).
    assert lines["NIST (measured)"][1][1] == pytest.approx(24.587389 / 27.211386245981, rel=1e-6)
    text = window.trend_view.readout_at(10.2)
    assert text.startswith("Ne (valence subshell 2p)") and "NIST (measured): " in text
    # Back to a quantity without a reference: the difference panel leaves the layout.
    window.apply(window.state.with_changes(trends=TrendSettings(rule="Z=1-10", models="slater")))
    assert window.trend_view.difference.scene() is None


def test_gaps_say_why_under_the_pointer(make_window):
    window = make_window(_state(quantity="energy", subshell="3d", rule="Z=19-22", models="hartree-fock"))
    y = window.trend_view.line_data()["restricted Hartree–Fock"][1]
    assert math.isnan(y[0]) and math.isnan(y[1]) and y[2] < 0
    text = window.trend_view.readout_at(19.0)
    assert text.startswith("K — ") and "gap — 3d is not occupied" in text


def test_a_bad_rule_in_the_side_panel_keeps_the_trend(make_window, qtbot):
    window = make_window(_state())
    before = window.state
    box = window.controls.trends_box
    box.rule.setEditText("Z=40-3")
    box.rule.lineEdit().returnPressed.emit()
    assert "runs backwards" in box.message.text()
    assert window.state == before and window.problem() is None
    box.rule.setEditText("Z=3-6")
    box.rule.lineEdit().returnPressed.emit()
    assert box.message.text() == "" and window.state.trends.rule == "Z=3-6"
    assert list(window.trend_view.line_data()["Slater's rules"][0]) == [3.0, 4.0, 5.0, 6.0]


def test_models_and_quantity_from_the_side_panel(make_window):
    window = make_window(_state())
    box = window.controls.trends_box
    box.models["clementi"].setChecked(True)
    assert window.state.trends.model_list() == ("slater", "clementi", "hartree-fock")
    for name in ("slater", "clementi", "hartree-fock"):
        box.models[name].setChecked(False)
    assert "tick at least one model" in box.message.text()
    assert window.state.trends.model_list() == ("hartree-fock",)  # the last good choice
    box.models["slater"].setChecked(True)
    index = box.quantity.findData("r_mean")
    box.quantity.setCurrentIndex(index)
    box.quantity.activated.emit(index)
    assert window.state.trends.quantity == "r_mean"
    assert not box.methods_label.isVisibleTo(box)


def test_clicking_a_point_opens_it_in_the_other_views(make_window):
    window = make_window(_state())
    window.trend_view.click_point(5, 4.0)  # Z = 6, near the Hartree–Fock value
    assert window.state.left.spec == "C" and window.state.view == "radial"
    assert window.state.left.model in ("slater", "hartree-fock")
    assert window.drawn("radial").left.spec == "C"


def test_a_refused_configuration_is_a_gap_in_the_window(make_window):
    window = make_window(_state(rule="Be-,Li", models="hartree-fock", quantity="total_energy"))
    y = window.trend_view.line_data()["restricted Hartree–Fock"][1]
    assert math.isnan(y[0]) and not math.isnan(y[1])
    assert "refused: Be-" in window.trend_view.readout_at(1.0)


def test_the_trends_view_exports_figures_and_csv(make_window, tmp_path, monkeypatch):
    from PySide6.QtWidgets import QMessageBox

    shown: list[str] = []
    monkeypatch.setattr(QMessageBox, "warning", lambda _parent, _title, text, *a: shown.append(text))
    window = make_window(_state(quantity="ionization_energy"))
    for suffix in (".png", ".svg", ".csv"):
        path = tmp_path / f"trend{suffix}"
        assert window.export_figure(path) is True
        assert path.stat().st_size > 200
    assert "series_1" in (tmp_path / "trend.csv").read_text().splitlines()[0]
    window.export_figure(tmp_path / "trend.npz")  # refused, with a message
    assert not (tmp_path / "trend.npz").exists()
    assert shown and "a trend is written as" in shown[-1]


def test_a_cancelled_trend_keeps_the_last_one_and_says_so(make_window, qtbot, tmp_path, monkeypatch):
    monkeypatch.setenv("ZEFFIR_CACHE_DIR", str(tmp_path / "cold-cache"))  # nothing cached yet
    window = make_window(_state(rule="Z=1-3", models="slater"), synchronous=False)
    qtbot.waitUntil(lambda: window.drawn("trends") is not None, timeout=30000)
    shown = window.trend_view.line_data()
    window.apply(window.state.with_changes(trends=TrendSettings(rule="Z=30-80", models="hartree-fock")))
    window.cancel()
    assert "cancelled" in (window.problem() or "")
    assert window.drawn("trends").trends.rule == "Z=1-3"
    assert set(window.trend_view.line_data()) == set(shown)
    window.worker.shutdown()


def test_the_line_profile_dock_steps_aside_for_trends(make_window):
    from zeffir.state import SliceSettings

    window = make_window(ViewState(left=Source("Ne", "slater"), view="slice",
                                   slice=SliceSettings(resolution=32, fit_extent=False)))
    window.slice_trio.views[0].profile_requested.emit(-2.0, 0.0, 2.0, 0.0)
    assert not window.profile_dock.isHidden()
    window.apply(window.state.with_changes(view="trends", trends=TrendSettings(rule="Z=1-3",
                                                                               models="slater")))
    assert window.profile_dock.isHidden()
    window.apply(window.state.with_changes(view="slice"))
    assert not window.profile_dock.isHidden()

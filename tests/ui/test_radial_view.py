"""The radial view draws exactly the scene's curves and markers, and reads values under a cursor."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from PySide6.QtCore import QPointF
from PySide6.QtTest import QTest

from zeffir.scene import QUANTITIES, RadialScene, radial_scene
from zeffir.state import RadialSettings, Source
from zeffir.ui._plot_style import TOTAL_COLOUR
from zeffir.ui._radial_view import DEFAULT_EMPTY_MESSAGE, MARKER_TEXT, RadialView


@pytest.fixture(scope="module")
def sodium() -> RadialScene:
    """Na under the Slater rules: D(r), occupancy-weighted, 3s highlighted (r = 0 included)."""
    return radial_scene(Source("Na", "slater"), RadialSettings(), "bohr", "3s")


@pytest.fixture(scope="module")
def with_nodes() -> RadialScene:
    """Hydrogenic Na with 3s highlighted: its markers include two radial nodes."""
    return radial_scene(Source("Na", "hydrogenic"), RadialSettings(quantity="R"), "bohr", "3s")


@pytest.fixture
def view(qtbot) -> RadialView:
    widget = RadialView()
    qtbot.addWidget(widget)
    widget.resize(800, 600)
    widget.show()
    qtbot.waitExposed(widget)
    return widget


def test_curves_hold_exactly_the_scene_arrays(view, sodium):
    view.set_scene(sodium)
    data = view.curve_data()
    assert list(data) == [c.label for c in sodium.curves]
    for curve in sodium.curves:
        x, y = data[curve.label]
        np.testing.assert_array_equal(x, curve.x)
        np.testing.assert_array_equal(y, curve.y)


def test_highlighted_subshell_is_thicker_and_total_is_black(view, sodium):
    view.set_scene(sodium)
    styles = view.curve_styles()
    width_3s, width_2p = styles["3s, 1 electron"][1], styles["2p, 6 electrons"][1]
    assert width_3s > width_2p
    assert styles["total"][0] == TOTAL_COLOUR
    assert styles["total"][1] > width_2p

    view.set_scene(replace(sodium, highlight="2p"))
    styles = view.curve_styles()
    assert styles["2p, 6 electrons"][1] == width_3s
    assert styles["3s, 1 electron"][1] == width_2p


def test_subshell_keeps_its_colour_across_atoms(view, sodium):
    view.set_scene(sodium)
    colour_in_na = view.curve_styles()["2p, 6 electrons"][0]
    view.set_scene(radial_scene(Source("Ne", "slater"), RadialSettings(), "bohr", "2p"))
    assert view.curve_styles()["2p, 6 electrons"][0] == colour_in_na


def test_log_axis_drops_the_zero_radius(view, sodium):
    assert sodium.curves[0].x[0] == 0.0  # the linear grid starts at the nucleus
    view.set_scene(replace(sodium, log_r=True))
    for curve in sodium.curves:
        x, y = view.curve_data()[curve.label]
        keep = curve.x > 0
        assert np.all(x > 0)
        np.testing.assert_array_equal(x, curve.x[keep])
        np.testing.assert_array_equal(y, curve.y[keep])
    assert view._plot.getAxis("bottom").logMode  # the axis itself is logarithmic


def test_markers_sit_where_the_scene_puts_them(view, with_nodes):
    view.set_scene(with_nodes)
    expected = [(m.subshell, m.kind, m.x) for m in with_nodes.markers]
    assert view.marker_positions() == expected
    assert {kind for _, kind, _ in expected} == {"r_max", "mean", "node"}
    tips = [item.toolTip() for item in view._plot.items if item.toolTip()]
    assert any("r_max: maximum of the radial distribution" in tip for tip in tips)
    assert any("⟨r⟩: mean radius" in tip for tip in tips)
    for _, definition in MARKER_TEXT.values():
        assert definition in view._legend.toolTip()


def test_axis_labels_and_tooltips_define_the_quantity(view, sodium):
    view.set_scene(sodium)
    left, bottom = view._plot.getAxis("left"), view._plot.getAxis("bottom")
    assert left.labelText == sodium.y_label
    assert bottom.labelText == sodium.x_label
    assert QUANTITIES["D"].formula in left.toolTip()
    assert "bohr⁻¹" in left.toolTip()
    assert "bohr" in bottom.toolTip()


def test_no_scene_shows_the_message(view, sodium):
    assert view.empty_message() == DEFAULT_EMPTY_MESSAGE
    view.set_scene(sodium)
    assert view.empty_message() is None
    view.set_scene(None)
    assert view.empty_message() == DEFAULT_EMPTY_MESSAGE
    assert view.curve_data() == {} and view.marker_positions() == []
    view.set_empty_message("Type an atom, e.g. Fe or C 1s2 2s1 2p3")
    assert view.empty_message() == "Type an atom, e.g. Fe or C 1s2 2s1 2p3"


def test_linked_cursor_moves_the_crosshair_and_reads_values(qtbot, view, sodium):
    view.set_scene(sodium)
    with qtbot.assertNotEmitted(view.cursor_moved):
        view.show_cursor(4.0)
    assert view.cursor_position() == pytest.approx(4.0)
    curve = next(c for c in sodium.curves if c.label == "3s, 1 electron")
    expected = float(np.interp(4.0, curve.x, curve.y))
    text = view.readout_text()
    assert "r = 4 bohr" in text
    assert f"3s, 1 electron {expected:.4g}" in text
    view.show_cursor(math.nan)
    assert view.cursor_position() is None


def test_linked_cursor_on_a_log_axis(view, sodium):
    view.set_scene(replace(sodium, log_r=True))
    view.show_cursor(0.5)
    assert view.cursor_position() == pytest.approx(0.5)
    view.show_cursor(0.0)  # not on a log axis
    assert view.cursor_position() is None


def test_pointer_motion_reports_the_radius(qtbot, view, sodium):
    view.set_scene(sodium)
    box = view._plot.getViewBox()

    def where():
        return view._plot_widget.mapFromScene(box.mapViewToScene(QPointF(3.0, 1.0)))

    # The axes settle their widths around new tick labels over a few repaints.
    previous = None
    while where() != previous:
        previous = where()
        qtbot.wait(40)
    with qtbot.waitSignal(view.cursor_moved) as blocker:
        QTest.mouseMove(view._plot_widget.viewport(), where())
    assert blocker.args[0] == pytest.approx(3.0, abs=0.05)
    assert view.cursor_position() == pytest.approx(blocker.args[0])


def test_linked_views_share_a_range_that_holds_both(qtbot, sodium):
    left, right = RadialView(), RadialView()
    for widget in (left, right):
        qtbot.addWidget(widget)
    left.link_axes(right)
    neon = radial_scene(Source("Ne", "slater"), RadialSettings(), "bohr", "2p")
    left.set_scene(sodium)
    right.set_scene(neon)
    (x0, x1), (y0, y1) = left._plot.getViewBox().viewRange()
    assert (x0, x1) == tuple(right._plot.getViewBox().viewRange()[0])
    for scene in (sodium, neon):
        for curve in scene.curves:
            assert x0 <= curve.x.min() and curve.x.max() <= x1 + 1e-9
            assert y0 <= curve.y.min() and curve.y.max() <= y1


def _drawn(view: RadialView) -> tuple[object, ...]:
    curves = {label: (x.tolist(), y.tolist()) for label, (x, y) in view.curve_data().items()}
    legend = [label.text for _, label in view._legend.items]
    return curves, sorted(view.marker_positions()), legend, view._plot.titleLabel.text


@pytest.mark.parametrize("second", [("Na", "clementi"), ("Na", "hydrogenic"), ("Mg+", "slater")])
def test_a_redrawn_scene_equals_a_fresh_drawing(qtbot, sodium, second):
    # A scene of the same layout reuses the drawn items; the picture must not differ
    # from drawing that scene in a new view (curves, markers, legend rows, title).
    other = radial_scene(Source(*second), RadialSettings(), "bohr", "3s")
    reused = RadialView()
    fresh = RadialView()
    for widget in (reused, fresh):
        qtbot.addWidget(widget)
        widget.resize(800, 600)
        widget.show()
    reused.set_scene(sodium)
    reused.set_scene(other)
    fresh.set_scene(other)
    assert _drawn(reused) == _drawn(fresh)
    reused.set_scene(sodium)  # and back
    fresh.set_scene(sodium)
    assert _drawn(reused) == _drawn(fresh)

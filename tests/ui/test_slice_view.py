"""The slice view shows exactly the scene's image, the right way up, with its colour scale and contours."""

from __future__ import annotations

import html
import math
from dataclasses import replace

import numpy as np
import pytest
from PySide6.QtCore import QPointF
from PySide6.QtTest import QTest

from zeffir.scene import QUANTITIES, SliceScene, slice_scene
from zeffir.state import ColourSettings, OrbitalChoice, SliceSettings, Source
from zeffir.ui._slice_view import DEFAULT_EMPTY_MESSAGE, SliceView

SETTINGS = SliceSettings(plane="xz", extent=3.0, resolution=64, contours=6)


@pytest.fixture(scope="module")
def p_z() -> SliceScene:
    """Ne 2pz in the xz plane: positive lobe up (+z), negative down; the zero contour is z = 0."""
    return slice_scene(Source("Ne", "slater"), OrbitalChoice("2p", "real", 0), SETTINGS)


@pytest.fixture(scope="module")
def density() -> SliceScene:
    """Total density of Ne on a log colour scale (no sign, no zero contour)."""
    return slice_scene(Source("Ne", "slater"), OrbitalChoice("2p"),
                       replace(SETTINGS, quantity="density", colour=ColourSettings(log_scale=True)))


@pytest.fixture
def view(qtbot) -> SliceView:
    widget = SliceView()
    qtbot.addWidget(widget)
    widget.resize(640, 560)
    widget.show()
    qtbot.waitExposed(widget)
    return widget


def _settled(qtbot, view) -> None:
    """Wait until the axes have settled their widths (they adjust over a few repaints)."""
    box = view._plot.getViewBox()
    previous = None
    while box.sceneBoundingRect() != previous:
        previous = box.sceneBoundingRect()
        qtbot.wait(40)


def _screen_colour(view, u, v):
    """Colour on screen at the in-plane point (u, v)."""
    picture = view._graphics.grab().toImage()
    where = view._graphics.mapFromScene(view._plot.getViewBox().mapViewToScene(QPointF(u, v)))
    return picture.pixelColor(where)


def test_image_is_the_scene_image_placed_at_its_coordinates(view, p_z):
    view.set_scene(p_z)
    assert view.image_data() is p_z.image or np.array_equal(view.image_data(), p_z.image)
    c = p_z.coordinates
    half_step = (c[1] - c[0]) / 2
    left, bottom, width, height = view.image_rect()
    assert left == pytest.approx(c[0] - half_step) and bottom == pytest.approx(c[0] - half_step)
    assert width == pytest.approx(c[-1] - c[0] + 2 * half_step) and height == pytest.approx(width)


def test_rows_run_up_the_screen(qtbot, view, p_z):
    # A transposed image would put the 2pz lobes left and right instead of up and down.
    view.set_contours_enabled(False)
    view.set_scene(p_z)
    _settled(qtbot, view)
    up, down, right = (_screen_colour(view, *p) for p in ((0.0, 0.6), (0.0, -0.6), (0.6, 0.0)))
    assert up.red() > up.blue() + 60  # positive: red end of RdBu
    assert down.blue() > down.red() + 60  # negative: blue end
    assert abs(right.red() - right.blue()) < 30  # on the nodal plane: the map's white middle


def test_colour_levels_are_the_scene_range_until_overridden(view, p_z, density):
    view.set_scene(p_z)
    assert view.colour_levels() == pytest.approx(p_z.colour_range)
    low, high = p_z.colour_range
    view.set_colour_range(low / 2, high / 2)
    assert view.colour_levels() == pytest.approx((low / 2, high / 2))
    view.set_scene(density)
    assert view.colour_levels() == pytest.approx(density.colour_range)
    with pytest.raises(ValueError, match="low < high"):
        view.set_colour_range(1.0, 1.0)


def test_psi_contours_include_the_zero_contour_on_the_nodal_plane(qtbot, view, p_z):
    with qtbot.waitSignal(view.contours_drawn, timeout=2000):
        view.set_scene(p_z)
    assert set(view.contour_levels()) == {*p_z.levels, 0.0}
    assert view.contour_count() == len(p_z.levels) + 1
    x, z = view._contour_items[2].getData()  # the zero contour
    drawn = np.isfinite(z)
    assert drawn.sum() > 10
    step = p_z.coordinates[1] - p_z.coordinates[0]
    assert np.all(np.abs(z[drawn]) < step)  # 2pz vanishes on z = 0
    assert np.ptp(x[drawn]) > 5.0  # across the whole slice


def test_density_contours_have_no_zero_contour(qtbot, view, density):
    with qtbot.waitSignal(view.contours_drawn, timeout=2000):
        view.set_scene(density)
    assert 0 < view.contour_count() <= len(density.levels)
    assert 0.0 not in view.contour_levels()


def test_contours_can_be_switched_off(qtbot, view, p_z):
    with qtbot.waitSignal(view.contours_drawn, timeout=2000):
        view.set_scene(p_z)
    view.set_contours_enabled(False)
    assert view.contour_count() == 0
    with qtbot.assertNotEmitted(view.contours_drawn, wait=100):
        view.set_scene(p_z)
    with qtbot.waitSignal(view.contours_drawn, timeout=2000):
        view.set_contours_enabled(True)
    assert view.contour_count() == len(p_z.levels) + 1


def test_labels_and_tooltips_define_the_quantity(view, p_z):
    view.set_scene(p_z)
    assert view._plot.getAxis("bottom").labelText == p_z.axis_labels[0]
    assert view._plot.getAxis("left").labelText == p_z.axis_labels[1]
    bar_axis = view._colour_bar.getAxis("right")
    assert bar_axis.labelText == p_z.value_label
    assert QUANTITIES["psi"].formula in bar_axis.toolTip()
    title = view._title.text()
    assert html.escape(p_z.title) in title and p_z.plane_text in title


def test_no_scene_shows_the_message(view, p_z):
    assert view.empty_message() == DEFAULT_EMPTY_MESSAGE
    view.set_scene(p_z)
    assert view.empty_message() is None
    view.set_scene(None)
    assert view.empty_message() == DEFAULT_EMPTY_MESSAGE
    assert view.image_data().size == 0 and view.contour_count() == 0
    view.set_empty_message("Choose an orbital")
    assert view.empty_message() == "Choose an orbital"


def test_linked_cursor_moves_the_crosshair_and_reads_the_value(qtbot, view, p_z):
    view.set_scene(p_z)
    view.set_point_of(lambda u, v: (u, 0.0, v))
    with qtbot.assertNotEmitted(view.hovered):
        view.show_cursor(0.5, 1.0)
    assert view.cursor_position() == pytest.approx((0.5, 1.0))
    c = p_z.coordinates
    i, j = np.argmin(np.abs(c - 0.5)), np.argmin(np.abs(c - 1.0))
    text = view.readout_text()
    assert "x = 0.5, z = 1 bohr" in text
    assert "(x, y, z) = (0.5, 0, 1) bohr" in text
    assert f"ψ = {p_z.values[j, i]:.4g}" in text
    view.show_cursor(math.nan, math.nan)
    assert view.cursor_position() is None


def test_pointer_motion_reports_the_plane_point(qtbot, view, p_z):
    view.set_scene(p_z)
    _settled(qtbot, view)
    where = view._graphics.mapFromScene(view._plot.getViewBox().mapViewToScene(QPointF(1.0, -0.5)))
    with qtbot.waitSignal(view.hovered) as blocker:
        QTest.mouseMove(view._graphics.viewport(), where)
    step = p_z.coordinates[1] - p_z.coordinates[0]
    assert blocker.args == pytest.approx([1.0, -0.5], abs=step)


def test_linked_views_pan_together(qtbot, p_z):
    left, right = SliceView(), SliceView()
    for widget in (left, right):
        qtbot.addWidget(widget)
        widget.set_scene(p_z)
    left.link_axes(right)
    right._plot.getViewBox().setRange(xRange=(0.0, 1.0), yRange=(0.0, 1.0), padding=0.0)
    np.testing.assert_allclose(left._plot.getViewBox().viewRange(), right._plot.getViewBox().viewRange())

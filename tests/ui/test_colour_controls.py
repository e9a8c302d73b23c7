"""The Colour group: limits, log scale and map of the image views reach what is drawn."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtGui import QWheelEvent
from PySide6.QtWidgets import QApplication

from zeffir.core import ANGSTROM_PER_BOHR
from zeffir.scene import DIVERGING_MAPS, SEQUENTIAL_MAPS
from zeffir.state import (
    DIVERGING_MAP_NAMES,
    SEQUENTIAL_MAP_NAMES,
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    SliceSettings,
    Source,
    ViewState,
)

# Showing a main window offscreen makes the platform plugin say it cannot pass on size hints.
pytestmark = pytest.mark.qt_log_ignore("This plugin does not support propagateSizeHints")

DENSITY = SliceSettings(plane="xz", extent=3.0, resolution=49, quantity="density", contours=0,
                        fit_extent=False)


@pytest.fixture
def window(make_window, qtbot):
    win = make_window(ViewState(left=Source("Ne", "slater"), orbital=OrbitalChoice("2p"),
                                view="slice", slice=DENSITY))
    win.resize(1280, 800)
    win.show()
    qtbot.waitExposed(win)
    return win


def _choose(box, key) -> None:
    """Pick the item whose data is ``key`` as a user would (the activated signal)."""
    index = box.findData(key)
    assert index >= 0, key
    box.setCurrentIndex(index)
    box.activated.emit(index)


def _left(window):
    return window.slice_trio.views[0]


def test_the_colour_group_shows_for_the_image_views_only(window):
    group = window.controls.colour_box
    for view, shown in (("slice", True), ("pair", True), ("two-electron", True), ("radial", False),
                        ("terms", False)):
        left = "Li+ 1s1 2s1" if view == "two-electron" else "Ne"
        assert window.apply(window.state.with_changes(view=view, left=Source(left, "slater")))
        assert group.isVisibleTo(window.controls) is shown, view


def test_low_and_high_are_for_manual_only_and_named_by_their_labels(window):
    group = window.controls.colour_box
    assert not group.colour_low.isEnabled() and not group.colour_high.isEnabled()
    _choose(group.limits, "manual")
    assert window.state.slice.colour.limits == "manual"
    assert group.colour_low.isEnabled() and group.colour_high.isEnabled()
    assert (group.colour_low.accessibleName(), group.colour_high.accessibleName()) == ("Low", "High")
    assert group.limits.accessibleName() == "Limits" and group.colour_map.accessibleName() == "Colour map"
    # ψ keeps a symmetric scale: High alone sets it.
    assert window.apply(window.state.with_changes(slice=replace(window.state.slice, quantity="psi")))
    assert group.colour_high.isEnabled() and not group.colour_low.isEnabled()
    assert group.colour_low.value() == pytest.approx(-group.colour_high.value())
    assert not group.log_scale.isEnabled()


def test_choosing_manual_starts_from_the_picture_on_screen(window):
    before = _left(window).colour_levels()
    _choose(window.controls.colour_box.limits, "manual")
    colour = window.state.slice.colour
    assert colour.limits == "manual"
    assert (colour.low, colour.high) == pytest.approx(before, rel=1e-9)
    assert _left(window).colour_levels() == pytest.approx(before, rel=1e-9)


def test_manual_limits_typed_in_angstrom_reach_the_drawn_levels(qtbot, window):
    assert window.apply(window.state.with_changes(length_unit="angstrom"))
    group = window.controls.colour_box
    assert group.colour_high.suffix() == " Å⁻³"
    _choose(group.limits, "manual")
    group.colour_low.setValue(0.2)  # Å⁻³
    group.colour_high.setValue(30.0)
    qtbot.waitUntil(lambda: window.state.slice.colour.high != pytest.approx(0.0), timeout=2000)
    qtbot.waitUntil(lambda: _left(window).colour_levels() == pytest.approx((0.2, 30.0)), timeout=2000)
    per_bohr3 = ANGSTROM_PER_BOHR**3  # Å⁻³ → bohr⁻³
    colour = window.state.slice.colour
    assert (colour.low, colour.high) == pytest.approx((0.2 * per_bohr3, 30.0 * per_bohr3))
    assert window.apply(window.state.with_changes(length_unit="bohr"))
    assert group.colour_high.suffix() == " bohr⁻³"
    assert group.colour_high.value() == pytest.approx(30.0 * per_bohr3)
    assert _left(window).colour_levels() == pytest.approx((0.2 * per_bohr3, 30.0 * per_bohr3))


def test_manual_limits_on_a_log_scale_are_values(qtbot, window):
    group = window.controls.colour_box
    group.log_scale.setChecked(True)
    assert window.state.slice.colour.log_scale
    _choose(group.limits, "manual")
    group.colour_low.setValue(1e-3)
    group.colour_high.setValue(10.0)
    qtbot.waitUntil(lambda: _left(window).colour_levels() == pytest.approx((-3.0, 1.0)), timeout=2000)


def test_an_invalid_range_is_refused_with_a_message_and_the_picture_stays(qtbot, window):
    group = window.controls.colour_box
    _choose(group.limits, "manual")
    group.colour_low.setValue(0.0)
    group.colour_high.setValue(0.5)
    qtbot.waitUntil(lambda: _left(window).colour_levels() == pytest.approx((0.0, 0.5)), timeout=2000)
    good = window.state
    group.colour_low.setValue(0.8)  # above High
    qtbot.waitUntil(lambda: bool(group.message()), timeout=2000)
    assert "Low must be below High" in group.message()
    assert window.state == good and _left(window).colour_levels() == pytest.approx((0.0, 0.5))
    group.colour_low.setValue(0.1)  # fixed: the message goes, the picture follows
    qtbot.waitUntil(lambda: _left(window).colour_levels() == pytest.approx((0.1, 0.5)), timeout=2000)
    assert group.message() == ""
    # A state from elsewhere (a script, a session) with a non-finite limit is refused by name.
    drawn = _left(window).colour_levels()
    bad = good.with_changes(slice=replace(good.slice, colour=replace(good.slice.colour, high=math.inf)))
    assert not window.apply(bad)
    assert "slice.colour.high" in window.statusBar().currentMessage()
    assert _left(window).colour_levels() == drawn and window.state.slice.colour.high == 0.5


def test_the_box_takes_e_notation_and_refuses_words(window):
    box = window.controls.colour_box.colour_high
    from PySide6.QtGui import QValidator

    assert box.validate("2.5e-3 bohr⁻³", 0)[0] == QValidator.State.Acceptable
    assert box.validate("2.5e", 0)[0] == QValidator.State.Intermediate
    assert box.validate("lots", 0)[0] == QValidator.State.Invalid
    assert box.valueFromText("2.5e-3 bohr⁻³") == pytest.approx(2.5e-3)


def test_the_colour_boxes_ignore_the_wheel_unless_focused(window):
    group = window.controls.colour_box
    _choose(group.limits, "manual")
    for widget in (group.limits, group.colour_high, group.colour_map):
        assert widget.focusPolicy() == Qt.FocusPolicy.StrongFocus
    before = group.colour_high.value()
    centre = QPointF(group.colour_high.rect().center())
    event = QWheelEvent(centre, group.colour_high.mapToGlobal(centre), QPoint(0, 0), QPoint(0, 120),
                        Qt.MouseButton.NoButton, Qt.KeyboardModifier.NoModifier,
                        Qt.ScrollPhase.NoScrollPhase, False)
    QApplication.sendEvent(group.colour_high, event)
    assert group.colour_high.value() == before


def test_the_map_chooser_lists_the_maps_that_suit_the_quantity(window):
    box = window.controls.colour_box.colour_map
    assert tuple(box.itemData(i) for i in range(box.count())) == SEQUENTIAL_MAP_NAMES
    assert window.apply(window.state.with_changes(slice=replace(window.state.slice, quantity="psi")))
    assert tuple(box.itemData(i) for i in range(box.count())) == DIVERGING_MAP_NAMES
    assert not window.controls.colour_box.difference_map.isVisibleTo(window.controls)
    density_comparison = window.state.with_changes(
        slice=replace(window.state.slice, quantity="density"),
        compare=CompareSettings(True, Source("Ne", "hydrogenic"), True))
    assert window.apply(density_comparison)
    assert window.controls.colour_box.difference_map.isVisibleTo(window.controls)


def _screen_colour(view, u, v) -> str:
    picture = view._graphics.grab().toImage()
    where = view._graphics.mapFromScene(view._plot.getViewBox().mapViewToScene(QPointF(u, v)))
    return picture.pixelColor(where).name()


def _close(a: str, b: str, tolerance: int = 3) -> bool:
    ra, rb = (np.array([int(c[i:i + 2], 16) for i in (1, 3, 5)]) for c in (a, b))
    return bool(np.all(np.abs(ra - rb) <= tolerance))


@pytest.mark.parametrize("name", ["magma", "cividis"])
def test_the_chosen_map_is_on_the_colour_bar_and_the_image(qtbot, window, name):
    group = window.controls.colour_box
    _choose(group.colour_map, name)
    assert window.state.slice.colour.sequential_map == name
    _choose(group.limits, "manual")
    group.colour_low.setValue(0.05)
    group.colour_high.setValue(1.0)
    view = _left(window)
    qtbot.waitUntil(lambda: view.colour_levels() == pytest.approx((0.05, 1.0)), timeout=2000)
    bottom, top = SEQUENTIAL_MAPS[name][0], SEQUENTIAL_MAPS[name][-1]
    assert view.colour_bar_ends() == (bottom, top)
    scene = view.current_scene()
    assert scene.values[24, 24] > 1.0 and scene.values[0, 0] < 0.05  # nucleus and corner
    corner = float(scene.coordinates[1])
    assert _close(_screen_colour(view, 0.0, 0.0), top)
    assert _close(_screen_colour(view, -3.0 + 0.5 * (corner + 3.0), -3.0 + 0.5 * (corner + 3.0)), bottom)


def test_a_signed_map_names_its_colours_in_the_tooltip(window):
    group = window.controls.colour_box
    assert window.apply(window.state.with_changes(slice=replace(window.state.slice, quantity="psi")))
    _choose(group.colour_map, "PuOr")
    assert window.state.slice.colour.diverging_map == "PuOr"
    view = _left(window)
    assert view.colour_bar_ends() == (DIVERGING_MAPS["PuOr"][0], DIVERGING_MAPS["PuOr"][-1])
    assert "Orange positive, purple negative" in view._colour_bar.axis.toolTip()


def test_the_pair_view_keeps_its_own_colour_settings(make_window, qtbot):
    state = ViewState(left=Source("Ne", "slater"), view="pair", slice=replace(DENSITY, resolution=32),
                      pair=PairSettings(reference=(0.0, 0.0, 0.5)))
    window = make_window(state)
    group = window.controls.colour_box
    group.log_scale.setChecked(True)
    _choose(group.colour_map, "plasma")
    assert window.state.pair.colour.log_scale and window.state.pair.colour.sequential_map == "plasma"
    assert window.state.slice.colour == ColourSettings()
    panel = window.pair_trio.views[0]
    assert panel.current_scene().log_scale
    assert panel.colour_bar_ends() == (SEQUENTIAL_MAPS["plasma"][0], SEQUENTIAL_MAPS["plasma"][-1])
    # Moving the reference electron keeps the colour settings.
    window.controls.reference[2].setValue(0.7)
    assert window.state.pair.reference[2] == pytest.approx(0.7)
    assert window.state.pair.colour.sequential_map == "plasma"
    assert window.apply(window.state.with_changes(view="slice"))
    assert not group.log_scale.isChecked()


# -- images fill their panel ------------------------------------------------------------------
#
# Criterion: at 1600 × 1000 with three slice panels in a row, for each panel
#   (a) the image covers at least 90 % of the plot area's width and of its height (the plot
#       area is fitted to the image; before, a ±14 bohr image sat in a ±40 bohr tall range,
#       covering 35 % of the height);
#   (b) its side is at least 70 % of the smaller side of the panel's drawing area (the room
#       is used: a bar beside the image in a narrow panel leaves about 55 %);
#   (c) a square bohr stays square on screen (sides within 2 px).


def _check_fills(view) -> None:
    _, _, width, height = view.image_on_screen()
    _, _, area_w, area_h = view.plot_area_on_screen()
    panel_w, panel_h = view.drawing_area_size()
    assert width >= 0.9 * area_w and height >= 0.9 * area_h, (width, height, area_w, area_h)
    assert min(width, height) >= 0.7 * min(panel_w, panel_h), (width, height, panel_w, panel_h)
    assert abs(width - height) <= 2.0


@pytest.mark.parametrize("size", [(1600, 1000), (1280, 720)])
def test_three_slice_panels_fill_their_room_with_true_proportions(make_window, qtbot, size):
    state = ViewState(left=Source("Na", "hydrogenic"), orbital=OrbitalChoice("3s"), view="slice",
                      slice=SliceSettings(plane="xy", extent=14.0, fit_extent=False, resolution=64),
                      compare=CompareSettings(True, Source("Na", "clementi"), True))
    window = make_window(state)
    window.resize(*size)
    window.show()
    qtbot.waitExposed(window)
    views = window.slice_trio.views
    qtbot.waitUntil(lambda: all(v.colour_bar_orientation() == "horizontal" for v in views), timeout=2000)
    for view in views:
        _check_fills(view)
    # The three show one range of x and y.
    ranges = [v._plot.getViewBox().viewRange() for v in views]
    np.testing.assert_allclose(ranges[1], ranges[0], rtol=1e-9)
    np.testing.assert_allclose(ranges[2], ranges[0], rtol=1e-9)


def test_a_single_wide_panel_puts_the_bar_beside_the_image(make_window, qtbot):
    window = make_window(ViewState(left=Source("Ne", "slater"), view="slice", slice=DENSITY))
    window.resize(1600, 1000)
    window.show()
    qtbot.waitExposed(window)
    view = _left(window)
    qtbot.waitUntil(lambda: view.colour_bar_orientation() == "vertical", timeout=2000)
    _check_fills(view)


def test_a_zoom_survives_a_new_colour_scale(qtbot, window):
    view = _left(window)
    box = view._plot.getViewBox()
    box.scaleBy((0.5, 0.5))
    box.sigRangeChangedManually.emit(box.state["mouseEnabled"])
    zoomed = box.viewRange()
    _choose(window.controls.colour_box.limits, "extremes")
    window.resize(1300, 820)
    qtbot.wait(50)
    np.testing.assert_allclose(box.viewRange(), zoomed, rtol=1e-6)

"""Line profiles on screen: Shift + drag on a slice asks for one, the profile view plots it."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtTest import QTest
from PySide6.QtWidgets import QApplication

from zeffir.export._profile_data import PROFILE_SKIPROWS
from zeffir.scene import SliceScene, slice_scene
from zeffir.scene._profile import line_profile
from zeffir.state import ColourSettings, OrbitalChoice, SliceSettings, Source
from zeffir.ui._profile_view import EMPTY_PROFILE_MESSAGE, ProfileView
from zeffir.ui._slice_view import PROFILE_HINT, SliceView

SETTINGS = SliceSettings(plane="xz", extent=3.0, resolution=64, contours=6)


@pytest.fixture(scope="module")
def p_z() -> SliceScene:
    """Ne 2pz in the xz plane: positive lobe up (+z)."""
    return slice_scene(Source("Ne", "slater"), OrbitalChoice("2p", "real", 0), SETTINGS)


@pytest.fixture(scope="module")
def log_density() -> SliceScene:
    """Ne's total density on a log colour scale."""
    return slice_scene(Source("Ne", "slater"), OrbitalChoice("2p"),
                       replace(SETTINGS, quantity="density", colour=ColourSettings(log_scale=True)))


@pytest.fixture
def view(qtbot, p_z) -> SliceView:
    widget = SliceView()
    qtbot.addWidget(widget)
    widget.resize(640, 560)
    widget.show()
    qtbot.waitExposed(widget)
    widget.set_contours_enabled(False)
    widget.set_scene(p_z)
    box = widget._plot.getViewBox()
    previous = None
    while box.sceneBoundingRect() != previous:  # the axes settle their widths over a few repaints
        previous = box.sceneBoundingRect()
        qtbot.wait(40)
    return widget


@pytest.fixture
def profile_view(qtbot) -> ProfileView:
    widget = ProfileView()
    qtbot.addWidget(widget)
    widget.resize(520, 320)
    widget.show()
    qtbot.waitExposed(widget)
    return widget


def _pixel(view: SliceView, u: float, v: float) -> QPoint:
    """Viewport pixel of the plane point (u, v)."""
    scene_point = view._plot.getViewBox().mapViewToScene(QPointF(u, v))
    return view._graphics.mapFromScene(scene_point)


def _pixel_size(view: SliceView) -> float:
    """Plane length of one screen pixel (equal on both axes: the aspect is locked)."""
    (left, right), _ = view._plot.getViewBox().viewRange()
    return (right - left) / view._plot.getViewBox().sceneBoundingRect().width()


def _drag(view: SliceView, start: QPoint, end: QPoint, modifier: Qt.KeyboardModifier) -> None:
    viewport = view._graphics.viewport()
    QTest.mousePress(viewport, Qt.MouseButton.LeftButton, modifier, start)
    for f in (0.25, 0.5, 0.75, 1.0):
        QTest.mouseMove(viewport, start + (end - start) * f)
    QTest.mouseRelease(viewport, Qt.MouseButton.LeftButton, modifier, end)


# -- drawing a segment on the slice ---------------------------------------------------------


def test_shift_drag_asks_for_a_profile_in_plane_coordinates(qtbot, view):
    start, end = (-1.6, -1.1), (2.1, 1.4)
    with qtbot.waitSignal(view.profile_requested, timeout=2000) as blocker:
        _drag(view, _pixel(view, *start), _pixel(view, *end), Qt.KeyboardModifier.ShiftModifier)
    # The pointer lands on whole pixels: the ends agree to within one pixel.
    np.testing.assert_allclose(blocker.args, [*start, *end], rtol=0, atol=_pixel_size(view))
    u0, v0, u1, v1 = blocker.args
    assert view.profile_segment() == ((u0, v0), (u1, v1))
    us, vs = view.segment_data()
    np.testing.assert_array_equal(us, [u0, u1])
    np.testing.assert_array_equal(vs, [v0, v1])
    assert "length" in view.readout_text()
    assert f"{math.hypot(u1 - u0, v1 - v0):.4g}" in view.readout_text()


def test_plain_drag_pans_and_asks_for_nothing(qtbot, view):
    asked: list[tuple[float, ...]] = []
    view.profile_requested.connect(lambda *args: asked.append(args))
    before = view._plot.getViewBox().viewRange()
    _drag(view, _pixel(view, -1.0, -1.0), _pixel(view, 1.0, 0.5), Qt.KeyboardModifier.NoModifier)
    qtbot.wait(50)
    assert asked == [] and view.profile_segment() is None
    assert view.segment_data()[0].size == 0
    assert view._plot.getViewBox().viewRange() != before  # pyqtgraph still got the drag


def test_a_shift_click_draws_no_segment_and_keeps_the_old_one(qtbot, view):
    view.set_profile_segment(-1.0, 0.0, 1.0, 0.0)
    asked: list[tuple[float, ...]] = []
    clicked: list[tuple[float, float]] = []
    view.profile_requested.connect(lambda *args: asked.append(args))
    view.clicked.connect(lambda u, v: clicked.append((u, v)))
    here = _pixel(view, 0.5, 0.5)
    _drag(view, here, here + QPoint(1, 1), Qt.KeyboardModifier.ShiftModifier)
    qtbot.wait(50)
    assert asked == [] and clicked == []
    assert view.profile_segment() == ((-1.0, 0.0), (1.0, 0.0))
    np.testing.assert_array_equal(view.segment_data()[0], [-1.0, 1.0])


def test_internal_handler_emits_and_draws(qtbot, view):
    with qtbot.waitSignal(view.profile_requested) as blocker:
        view._finish_segment((0.25, -2.5), (-0.75, 2.0))
    assert blocker.args == [0.25, -2.5, -0.75, 2.0]
    np.testing.assert_array_equal(view.segment_data()[1], [-2.5, 2.0])


def test_segment_set_from_elsewhere_is_drawn_without_a_request_and_cleared(qtbot, view, log_density):
    asked: list[tuple[float, ...]] = []
    view.profile_requested.connect(lambda *args: asked.append(args))
    view.set_profile_segment(-2.0, 1.0, 2.5, -0.5)
    assert asked == []
    np.testing.assert_array_equal(view.segment_data()[0], [-2.0, 2.5])
    view.set_scene(log_density)  # a new scene keeps the segment until it is cleared
    assert view.profile_segment() == ((-2.0, 1.0), (2.5, -0.5))
    view.clear_profile()
    assert view.profile_segment() is None and view.segment_data()[0].size == 0
    with pytest.raises(ValueError, match="finite"):
        view.set_profile_segment(0.0, math.nan, 1.0, 1.0)


def test_the_gesture_is_explained_on_the_image(view):
    assert "Shift" in view._image.toolTip() and PROFILE_HINT in view._image.toolTip()
    view._hide_cursor()
    assert "Shift + drag" in view.readout_text()


# -- the profile view ------------------------------------------------------------------------------


def test_profile_view_plots_the_profile_with_its_labels(profile_view, p_z):
    profile = line_profile(p_z, (-0.4, -2.8), (0.6, 2.9), points=300)
    profile_view.show_profile(profile)
    assert profile_view.profile() is profile and profile_view.empty_message() is None
    s, y = profile_view.curve_data()
    np.testing.assert_array_equal(s, profile.s)
    np.testing.assert_array_equal(y, profile.values)
    bottom, left = profile_view.axis_labels()
    assert bottom == "distance along the segment / bohr" and left == "ψ / bohr⁻³ᐟ²"
    assert "Ne" in profile_view.title_text() and "2pz" in profile_view.title_text()
    assert profile_view._zero_line.isVisible()  # ψ has a sign: nodes read as crossings
    assert not profile_view.log_scale() and not profile_view._log_box.isEnabled()


def test_a_log_slice_gives_a_log_profile_of_the_values(profile_view, log_density):
    profile = line_profile(log_density, (-2.9, 0.1), (2.9, 0.3))
    profile_view.show_profile(profile)
    assert profile_view.log_scale()
    _, y = profile_view.curve_data()
    np.testing.assert_array_equal(y, profile.values)  # the values, not log10 of them
    assert profile_view.axis_labels()[1] == "ρ / bohr⁻³"
    profile_view.set_log_scale(False)
    assert not profile_view._plot.getViewBox().state["logMode"][1]


def test_zeros_are_left_out_on_a_log_axis(profile_view, log_density):
    values = log_density.values.copy()
    values[:, : values.shape[1] // 2] = 0.0  # left half exactly zero
    scene = replace(log_density, values=values)
    profile = line_profile(scene, (-2.9, 0.0), (2.9, 0.0), points=101)
    profile_view.show_profile(profile)
    _, y = profile_view.curve_data()
    assert np.all(np.isnan(y[profile.values == 0.0])) and np.all(y[profile.values > 0] > 0)


def test_empty_and_off_slice_profiles_show_messages(profile_view, p_z):
    assert profile_view.empty_message() == EMPTY_PROFILE_MESSAGE
    profile_view.show_profile(line_profile(p_z, (4.0, 4.0), (5.0, 6.0)))
    assert "outside the slice" in profile_view.empty_message()
    assert profile_view.curve_data()[0].size == 0


def test_clear_empties_the_view_and_tells_the_owner(qtbot, profile_view, p_z):
    profile_view.show_profile(line_profile(p_z, (-1.0, -1.0), (1.0, 1.0)))
    with qtbot.waitSignal(profile_view.cleared):
        profile_view._clear_button.click()
    assert profile_view.profile() is None and profile_view.empty_message() == EMPTY_PROFILE_MESSAGE


def test_copy_puts_the_tab_separated_numbers_on_the_clipboard(profile_view, p_z):
    profile = line_profile(p_z, (-1.0, -2.0), (1.0, 2.0), points=50)
    profile_view.show_profile(profile)
    profile_view._copy_button.click()
    text = QApplication.clipboard().text()
    lines = text.splitlines()
    # The names (with units) first, then the '#' notes, then the numbers.
    assert lines[0] == "s_bohr\tu_bohr\tv_bohr\tvalue_per_bohr3_2"
    numbers = [line for line in lines[1:] if not line.startswith("#")]
    assert len(numbers) == 50 and PROFILE_SKIPROWS == 1
    first = [float(x) for x in numbers[0].split("\t")]
    assert first == [0.0, -1.0, -2.0, float(profile.values[0])]


def test_save_as_csv_writes_what_is_shown(qtbot, profile_view, p_z, tmp_path, monkeypatch):
    profile = line_profile(p_z, (-2.0, 0.5), (2.0, -0.5), points=120)
    profile_view.show_profile(profile)
    chosen = tmp_path / "ne-profile"  # no suffix: .csv is added
    monkeypatch.setattr("zeffir.ui._profile_view.QFileDialog.getSaveFileName",
                        lambda *args, **kwargs: (str(chosen), "CSV files (*.csv)"))
    with qtbot.waitSignal(profile_view.saved) as blocker:
        profile_view._save_button.click()
    written = tmp_path / "ne-profile.csv"
    assert blocker.args == [str(written)]
    table = np.loadtxt(written, delimiter=",", skiprows=PROFILE_SKIPROWS)
    np.testing.assert_array_equal(table[:, 0], profile.s)
    np.testing.assert_array_equal(table[:, 3], profile.values)


def test_a_failed_save_is_reported_and_writes_nothing(profile_view, p_z, tmp_path, monkeypatch):
    profile_view.show_profile(line_profile(p_z, (-2.0, 0.5), (2.0, -0.5)))
    target = tmp_path / "no such folder" / "profile.csv"
    warnings: list[str] = []
    monkeypatch.setattr("zeffir.ui._profile_view.QFileDialog.getSaveFileName",
                        lambda *args, **kwargs: (str(target), ""))
    monkeypatch.setattr("zeffir.ui._profile_view.QMessageBox.warning",
                        lambda _parent, _title, text: warnings.append(text))
    profile_view._save_button.click()
    assert len(warnings) == 1 and "cannot write" in warnings[0] and str(target) in warnings[0]
    assert list(tmp_path.iterdir()) == []


# -- the two together ------------------------------------------------------------------------------


def test_drawn_segment_becomes_the_plotted_profile(qtbot, view, profile_view, p_z):
    def show(u0: float, v0: float, u1: float, v1: float) -> None:
        scene = view.current_scene()
        assert scene is not None
        profile_view.show_profile(line_profile(scene, (u0, v0), (u1, v1)))

    view.profile_requested.connect(show)
    with qtbot.waitSignal(view.profile_requested):
        _drag(view, _pixel(view, 0.0, -2.5), _pixel(view, 0.0, 2.5), Qt.KeyboardModifier.ShiftModifier)
    s, y = profile_view.curve_data()
    assert s.size == 400 and s[-1] == pytest.approx(5.0, abs=2 * _pixel_size(view))
    # Up the z axis through a 2pz: negative lobe first, a node at the middle, positive lobe last.
    assert y[np.argmin(np.abs(s - 1.5))] < 0 < y[np.argmin(np.abs(s - 3.5))]
    assert profile_view.profile().start == view.profile_segment()[0]

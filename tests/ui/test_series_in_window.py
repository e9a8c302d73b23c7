"""The window compares several series: panels, overlay, table rows per series, failures."""

from __future__ import annotations

import pytest
from PySide6.QtCore import Qt
from PySide6.QtWidgets import QToolButton

from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui._plot_style import series_pen_style
from zeffir.ui._subshell_table import SERIES_COLUMN

FOUR = CompareSettings(True, Source("Na", "clementi"), True, True,
                       more=(Source("", "hydrogenic"), Source("Mg+", "slater")))


def _title(view) -> str:
    return view._plot.titleLabel.text


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                                 slice=SliceSettings(resolution=40, extent=8.0, fit_extent=False),
                                 compare=FOUR))


def test_four_series_get_four_radial_panels_titled_by_their_series(window):
    views = window.radial_trio.views
    assert len(views) == 4 and all(v.isVisibleTo(window) for v in views)
    titles = [_title(v) for v in views]
    assert "Slater" in titles[0] and "Clementi" in titles[1] and "hydrogenic" in titles[2]
    assert "Mg+" in titles[3]
    assert not window.radial_trio.difference_view.isVisibleTo(window)  # only for two series
    assert window.problem() is None
    # Equal legends (Mg+ is [Ne] 3s1 like Na) are shown once in a grid of small panels.
    assert views[0].legend_visible() and not any(v.legend_visible() for v in views[1:])
    window.apply(window.state.with_changes(compare=CompareSettings(
        **{**FOUR.__dict__, "more": (Source("", "hydrogenic"), Source("K", "slater"))})))
    assert window.radial_trio.views[3].legend_visible()  # K has a 4s curve: its own legend


def test_the_table_and_energy_lines_report_every_series(window):
    table = window.table
    assert not table.isColumnHidden(SERIES_COLUMN)
    series = {table.item(r, SERIES_COLUMN).text() for r in range(table.rowCount())}
    assert series == {"Na, Slater", "Na, Clementi–Raimondi", "Na, hydrogenic", "Mg+, Slater"}
    rows_3s = [r for r in range(table.rowCount()) if table.item(r, 0).text().rstrip(" *") == "3s"]
    assert len(rows_3s) == 4  # Mg+ is [Ne] 3s1 too
    zetas = {table.item(r, 2).text() for r in rows_3s}
    assert len(zetas) >= 3  # hydrogenic, Slater and Clementi–Raimondi differ
    lines = window.energy_line.text().splitlines()
    assert len(lines) == 4 and lines[3].startswith("Mg+")
    assert "Series" in table.as_text().splitlines()[0].split("\t")[1]


def test_the_overlay_draws_every_series_on_one_axes_in_its_own_style(window):
    window.apply(window.state.with_changes(compare=CompareSettings(**{**FOUR.__dict__, "overlay": True})))
    views = window.radial_trio.views
    assert len(views) == 1
    view = views[0]
    pens = {label: item.opts["pen"].style() for label, (item, *_rest) in view._curves.items()}
    assert pens["total · Na, Slater"] == series_pen_style(0)
    assert pens["total · Mg+, Slater"] == series_pen_style(3)
    assert series_pen_style(0) != series_pen_style(3)
    legend = [label.text for _, label in view._legend.items]
    assert {"Na, Slater", "Na, hydrogenic", "Mg+, Slater"} <= set(legend)


def test_slices_of_four_series_share_a_colour_scale(window):
    window.apply(window.state.with_changes(view="slice"))
    views = window.slice_trio.views
    assert len(views) == 4
    assert len({v.colour_levels() for v in views}) == 1


def test_series_are_added_and_removed_from_the_side_panel(make_window, qtbot):
    window = make_window(ViewState(left=Source("Na", "slater"),
                                   compare=CompareSettings(True, Source("Na", "clementi"))))
    series_list = window.controls.series_list
    assert window.controls.show_difference.isEnabled()
    qtbot.mouseClick(series_list.add_button, Qt.MouseButton.LeftButton)
    assert len(window.state.compare.more) == 1 and window.state.compare.more[0].spec == ""
    assert len(window.radial_trio.views) == 3 and not window.controls.show_difference.isEnabled()
    row_fields = series_list._rows[0][1]
    assert row_fields.spec_edit.accessibleName() == "Series 3"  # its visible label
    assert row_fields.model_box.accessibleName() == "Model"
    row_fields.spec_edit.setText("Qq")
    row_fields.spec_edit.textEdited.emit("Qq")
    row_fields.spec_edit.returnPressed.emit()
    assert "Qq" in row_fields.error_text() and window.state.compare.more[0].spec == ""
    row_fields.spec_edit.setText("K")
    row_fields.spec_edit.returnPressed.emit()
    assert window.state.compare.more[0].spec == "K"
    assert "K" in _title(window.radial_trio.views[2])
    remove = series_list._rows[0][0].findChild(QToolButton)
    assert remove.accessibleName() == "Remove series 3"
    qtbot.mouseClick(remove, Qt.MouseButton.LeftButton)
    assert window.state.compare.more == ()
    assert len(window.radial_trio.views) == 3  # two series and their difference again


def test_a_failing_series_leaves_a_standing_message_and_blocks_export(window, tmp_path):
    drawn = window.drawn("radial")
    failing = CompareSettings(**{**FOUR.__dict__, "more": (Source("Be-", "hartree-fock"),)})
    window.apply(window.state.with_changes(compare=failing))
    assert window.drawn("radial") == drawn  # the old picture stays, and says so
    message = window.problem()
    assert message is not None and "failed" in message and "Be-" in message
    assert window.banner.isVisibleTo(window)
    assert window.export_figure(tmp_path / "x.png") is False
    assert not (tmp_path / "x.png").exists()
    assert "Be-" in window.energy_line.text() and "failed" in window.energy_line.text()


@pytest.mark.qt_log_ignore("This plugin does not support propagateSizeHints")
def test_the_grid_shape_follows_the_room_and_panels_keep_a_common_range(make_window, qtbot):
    window = make_window(ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d", "real", -2),
                                   view="slice", slice=SliceSettings(resolution=40, fit_extent=True)))
    window.resize(1280, 720)
    window.show()
    qtbot.waitExposed(window)
    four = CompareSettings(True, Source("Fe", "clementi"), True, True,
                           more=(Source("", "hydrogenic"), Source("Co", "slater")))
    window.apply(window.state.with_changes(view="radial", compare=four))
    qtbot.wait(50)
    assert window.radial_trio.columns() == 4  # a wide, low area: one row beats 2 × 2
    ranges = {tuple(round(v, 9) for v in view._plot.getViewBox().viewRange()[1])
              for view in window.radial_trio.views}
    assert len(ranges) == 1  # every series panel on one value axis
    low, high = ranges.pop()
    tallest = max(float(c.y.max()) for view in window.radial_trio.views
                  for c in view._scene.curves)
    assert low <= 0.0 and high >= tallest  # and no panel's curve is cut off
    window.apply(window.state.with_changes(view="slice"))
    qtbot.wait(50)
    for view in window.slice_trio.views:  # each image lies inside its own panel
        box = view._plot.getViewBox()
        assert box.width() <= view.width() and box.height() <= view.height()
        assert box.width() > 0.5 * view.width()
    window.resize(1280, 1000)
    qtbot.wait(50)
    assert window.slice_trio.columns() == 2  # a taller area: two rows of two

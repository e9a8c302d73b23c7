"""Room to work: the window fits 1280 px, the side panel follows the view, layout is kept."""

from __future__ import annotations

import pytest
from PySide6.QtCore import QSettings, Qt
from PySide6.QtGui import QKeySequence

from zeffir.state import OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui import MainWindow


@pytest.fixture
def settings(tmp_path):
    return QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)


@pytest.fixture
def window(qtbot, settings):
    state = ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                      slice=SliceSettings(resolution=48))
    win = MainWindow(state, synchronous=True, settings=settings)
    qtbot.addWidget(win)
    return win


def test_the_window_fits_a_1280_pixel_screen(window):
    assert window.minimumSizeHint().width() <= 1280
    assert window.minimumSizeHint().height() <= 720


@pytest.mark.parametrize(("view", "shown", "hidden"), [
    ("radial", {"radial_box", "compare_box"}, {"slice_box", "pair_box", "two_electron_box"}),
    ("slice", {"slice_box", "compare_box"}, {"radial_box", "pair_box", "two_electron_box"}),
    ("pair", {"slice_box", "pair_box"}, {"radial_box", "compare_box", "two_electron_box"}),
    ("two-electron", {"two_electron_box"}, {"radial_box", "slice_box", "pair_box", "compare_box"}),
])
def test_the_side_panel_shows_only_the_current_views_settings(window, view, shown, hidden):
    window.apply(window.state.with_changes(view=view))
    for name in shown:
        assert getattr(window.controls, name).isVisibleTo(window.controls), name
    for name in hidden:
        assert not getattr(window.controls, name).isVisibleTo(window.controls), name


def test_every_view_has_a_shortcut(window):
    actions = {action.shortcut().toString(): action for menu in window.menuBar().findChildren(
        type(window.menuBar().actions()[0].menu())) for action in menu.actions()}
    for index, view in enumerate(("radial", "slice", "pair", "two-electron", "terms")):
        actions[QKeySequence(f"Ctrl+{index + 1}").toString()].trigger()
        assert window.state.view == view
    assert QKeySequence(Qt.Key.Key_F1).toString() in actions


def test_geometry_and_splitters_are_restored(qtbot, settings):
    first = MainWindow(ViewState(), synchronous=True, settings=settings)
    qtbot.addWidget(first)
    first.resize(1300, 760)
    first.body_splitter.setSizes([300, 1000])
    sizes = first.body_splitter.sizes()
    first.close()
    second = MainWindow(ViewState(), synchronous=True, settings=settings)
    qtbot.addWidget(second)
    second.restore_layout()
    assert second.body_splitter.saveState() == first.body_splitter.saveState()
    assert second.body_splitter.sizes() == sizes

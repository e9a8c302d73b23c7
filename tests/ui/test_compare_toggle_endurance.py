"""Side by side switched on and off 300 times on every view: no freeze, and what is drawn is asked.

Each toggle is the user's own path (the check box in the controls), with the events
processed after it as the event loop would. After every toggle the panels on screen
are counted against the state, each series panel must show its own source, and the
window must report no gap between what it draws and what its fields ask. A watchdog
dumps every thread's stack and ends the run if one view's toggles take longer than
:data:`WATCHDOG_SECONDS`, so a freeze fails loudly instead of hanging the suite.
"""

from __future__ import annotations

import faulthandler
import sys

import pytest
from PySide6.QtWidgets import QApplication

from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui._main_window import _VIEWS, _panel_counts

TOGGLES = 300
WATCHDOG_SECONDS = 240.0  # a view's 300 toggles take 1-15 s offscreen on two cores

#: A second series on another atom, so a panel showing the wrong one cannot pass.
COMPARE = CompareSettings(enabled=True, right=Source("Mg+", "clementi"), show_difference=True,
                          same_atom=False)


@pytest.fixture
def window(make_window, qtbot, view):
    # The two-electron view needs a two-electron configuration; the others take any atom.
    spec, subshell = ("Li+ 1s1 2s1", "2s") if view == "two-electron" else ("Na", "3s")
    state = ViewState(left=Source(spec, "slater"), orbital=OrbitalChoice(subshell),
                      slice=SliceSettings(resolution=32, extent=8.0, fit_extent=False, contours=4),
                      compare=COMPARE)
    win = make_window(state)
    win.resize(1280, 720)  # the smallest screen the window is laid out for
    win.show()
    qtbot.waitExposed(win)
    return win


def _shown_sources(win, view: str) -> list[tuple[str, str]]:
    """(spec, model) of each series panel of ``view`` as drawn."""
    grid = win._trios[view]
    count, _difference = _panel_counts(win.state)
    scenes = [panel.current_scene() if view == "slice" else panel._scene
              for panel in grid.views[:count]]
    return [(scene.spec, scene.model) for scene in scenes if scene is not None]


def _check_drawn(win, view: str) -> None:
    state = win.state
    assert win.problem() is None, win.problem()
    if view not in win._trios:
        return
    series, difference = _panel_counts(state)
    grid = win._trios[view]
    assert len(grid.views) == series + int(difference)
    assert all(panel.isVisibleTo(win) for panel in grid.views)
    if view in ("radial", "slice"):
        asked = [(source.spec, source.model) for source in state.series()]
        assert _shown_sources(win, view) == asked


@pytest.mark.qt_log_ignore("This plugin does not support propagateSizeHints")
@pytest.mark.parametrize("view", _VIEWS)
def test_three_hundred_toggles_leave_the_view_drawing_what_is_asked(window, view):
    app = QApplication.instance()
    window.tabs.setCurrentIndex(_VIEWS.index(view))
    app.processEvents()
    start = window.state
    box = window.controls.compare_on
    faulthandler.dump_traceback_later(WATCHDOG_SECONDS, exit=True, file=sys.stderr)
    try:
        for step in range(TOGGLES):
            box.click()
            app.processEvents()
            assert window.state.compare.enabled == (step % 2 == 1)  # it starts on
            assert box.isChecked() == window.state.compare.enabled
            _check_drawn(window, view)
    finally:
        faulthandler.cancel_dump_traceback_later()
    assert window.state == start

"""Both plot views compose one frame: the empty message, the read-out and the plot page."""

from __future__ import annotations

import pytest

from zeffir.ui._radial_view import RadialView
from zeffir.ui._slice_view import SliceView
from zeffir.ui._view_frame import ViewFrame


@pytest.mark.parametrize("kind", [RadialView, SliceView])
def test_each_view_shows_its_message_through_the_shared_frame(qtbot, kind):
    view = kind()
    qtbot.addWidget(view)
    frames = [value for value in vars(view).values() if isinstance(value, ViewFrame)]
    assert len(frames) == 1
    frame = frames[0]
    view.set_empty_message("Nothing here: the build failed.")
    assert view.empty_message() == "Nothing here: the build failed." == frame.shown_message()
    frame.readout.setText("<b>r</b> = 1 bohr")
    assert view.readout_text() == "r = 1 bohr"
    frame.show_plot()
    assert view.empty_message() is None

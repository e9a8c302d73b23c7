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


def test_a_long_title_is_shrunk_then_shortened_but_kept_whole_in_the_tip(qtbot):
    from zeffir.scene import slice_scene
    from zeffir.state import OrbitalChoice, SliceSettings, Source
    from zeffir.ui._view_frame import fitted_line

    text, size = fitted_line("Fe — Clementi–Raimondi: 3dz2", 10_000.0, (11.0, 10.0, 9.0))
    assert (text, size) == ("Fe — Clementi–Raimondi: 3dz2", 11.0)
    text, size = fitted_line("Fe — Clementi–Raimondi: 3dz2", 60.0, (11.0, 10.0, 9.0))
    assert size == 9.0 and text.endswith("…") and len(text) < 28
    view = SliceView()
    qtbot.addWidget(view)
    view.resize(900, 600)
    view.show()
    scene = slice_scene(Source("Fe", "clementi"), OrbitalChoice("3d"),
                        SliceSettings(plane="custom", normal=(1.0, 2.0, 3.0), offset=0.25, resolution=24))
    view.set_scene(scene)
    assert scene.title in view.title_text()
    assert "font-size:11pt" in view._title.text()
    view.resize(205, 400)
    qtbot.wait(20)
    assert "font-size:11pt" not in view._title.text()  # smaller, to fit the narrow panel
    from PySide6.QtGui import QFont, QFontMetricsF

    font = QFont()
    font.setPointSizeF(8.0)
    for line in view.title_text().splitlines():  # every line fits the panel as shown
        assert QFontMetricsF(font).horizontalAdvance(line) <= view._title.width()
    assert scene.title in view._title.toolTip() and scene.plane_text in view._title.toolTip()

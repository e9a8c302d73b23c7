"""Start the window: ``zeffir`` with no arguments, or ``python -m zeffir``."""

from __future__ import annotations

import os
import sys
from collections.abc import Sequence

__all__ = ["MIN_COLOUR_DEPTH", "colour_depth_problem", "demo_state", "run_window"]

#: Bits per pixel below which Qt cannot paint the window: on an 8-bit (palette) X
#: display its raster painter gets no paint engine and the process crashes.
MIN_COLOUR_DEPTH = 15


def colour_depth_problem(depth: int | None) -> str | None:
    """The one-line refusal for a display with too few colours, or None if it will do.

    Parameters
    ----------
    depth : int or None
        The primary screen's bits per pixel (None: no screen reported, left to Qt).
    """
    if depth is None or depth >= MIN_COLOUR_DEPTH:
        return None
    return (f"zeffir: the display has {depth}-bit colour and the window needs at least "
            f"{MIN_COLOUR_DEPTH}-bit (24-bit is usual; for Xvfb: -screen 0 1600x1000x24); "
            "'zeffir table' and 'zeffir figure' work without a window")


def demo_state() -> object:
    """The built-in demo session (resources/demo/sodium-valence.zeffir)."""
    from zeffir.core import resource_path
    from zeffir.export import load_session

    with __import__("importlib").resources.as_file(
        resource_path("demo", "sodium-valence.zeffir")
    ) as path:
        return load_session(path)


def run_window(argv: Sequence[str] | None = None, session: str | None = None) -> int:
    """Create the application, open ``session`` (or the demo) and run the event loop."""
    import pyqtgraph as pg
    from PySide6.QtWidgets import QApplication

    from zeffir.ui._main_window import MainWindow

    pg.setConfigOptions(imageAxisOrder="row-major", antialias=True)
    app = QApplication.instance() or QApplication(list(argv or sys.argv[:1]))
    screen = app.primaryScreen()
    problem = colour_depth_problem(screen.depth() if screen is not None else None)
    if problem is not None:
        print(problem, file=sys.stderr)
        return 2
    app.setApplicationName("Zeffir")
    app.setOrganizationName("Zeffir")
    window = MainWindow(demo_state())  # type: ignore[arg-type]
    if session:
        window.open_session(session)
    room = screen.availableGeometry() if screen is not None else None
    if room is not None:  # 1600×1000 where it fits; on a small screen, what there is
        window.resize(min(1600, room.width()), min(1000, room.height()))
    else:
        window.resize(1600, 1000)
    window.restore_layout()
    window.show()
    if os.environ.get("ZEFFIR_EXIT_AFTER_SHOW"):  # used by the cold-start benchmark
        from PySide6.QtCore import QTimer

        def shown() -> None:
            print("window-shown", flush=True)
            window.close()

        QTimer.singleShot(0, shown)
    return int(app.exec())

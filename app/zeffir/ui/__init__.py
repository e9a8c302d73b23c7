"""The desktop window (PySide6 + pyqtgraph). It draws scenes; it never computes physics."""

from typing import Any

from zeffir.ui._app import demo_state, run_window

__all__ = ["MainWindow", "demo_state", "run_window"]


def __getattr__(name: str) -> Any:
    # The window module pulls in pyqtgraph and the views: loaded when first asked for.
    if name == "MainWindow":
        from zeffir.ui._main_window import MainWindow

        return MainWindow
    raise AttributeError(f"module 'zeffir.ui' has no attribute {name!r}")

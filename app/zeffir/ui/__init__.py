"""The desktop window (PySide6 + pyqtgraph). It draws scenes; it never computes physics."""

from zeffir.ui._app import demo_state, run_window

__all__ = ["demo_state", "run_window"]

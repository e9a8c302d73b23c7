"""The desktop window (PySide6 + pyqtgraph). It draws scenes; it never computes physics."""

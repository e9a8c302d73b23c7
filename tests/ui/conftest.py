"""Settings for the window tests: no display, and pyqtgraph's row-major images."""

import os

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")  # before anything imports Qt

import pyqtgraph as pg  # after the platform choice above

# Scene arrays are values[j, i] with j along the vertical axis (the widgets set it too).
pg.setConfigOptions(imageAxisOrder="row-major")

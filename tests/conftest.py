"""Test-wide settings: no display is needed anywhere."""

import os

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

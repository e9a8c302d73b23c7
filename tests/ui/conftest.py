"""Settings for the window tests: no display, and pyqtgraph's row-major images."""

import os

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")  # before anything imports Qt

import pyqtgraph as pg  # after the platform choice above

# Scene arrays are values[j, i] with j along the vertical axis (the widgets set it too).
pg.setConfigOptions(imageAxisOrder="row-major")

import pytest  # noqa: E402 - after the platform choice above


@pytest.fixture
def make_window(qtbot, tmp_path):
    """A factory of synchronous windows on a state, with settings in a temporary file."""
    from PySide6.QtCore import QSettings

    from zeffir.ui import MainWindow

    def make(state, synchronous=True):
        settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
        window = MainWindow(state, synchronous=synchronous, settings=settings)
        qtbot.addWidget(window)
        return window

    return make


@pytest.fixture(autouse=True)
def _destroy_closed_widgets_after_each_test(qapp):
    """Destroy the widgets pytest-qt closed, while the application still runs.

    pytest-qt closes each test's widgets and schedules their deletion, but processing
    events does not carry out a scheduled deletion. Left to the interpreter's exit,
    thousands of plot widgets and their signal links are then torn down by the
    garbage collector one weak reference at a time, which takes minutes. (This
    teardown runs after pytest-qt has closed the widgets.)
    """
    yield
    from PySide6.QtCore import QCoreApplication, QEvent

    QCoreApplication.sendPostedEvents(None, QEvent.Type.DeferredDelete)

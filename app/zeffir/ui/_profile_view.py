"""The line profile view: a slice's value along a drawn segment, as a curve."""

from __future__ import annotations

import html
import re
from pathlib import Path
from typing import Final

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt, Signal
from PySide6.QtWidgets import (
    QApplication,
    QCheckBox,
    QFileDialog,
    QHBoxLayout,
    QLabel,
    QMessageBox,
    QPushButton,
    QSizePolicy,
    QStackedLayout,
    QVBoxLayout,
    QWidget,
)

from zeffir.export import ExportError, profile_csv_text, write_profile_csv
from zeffir.scene import LineProfile
from zeffir.ui._plot_style import (
    AXIS_COLOUR,
    MUTED_TEXT,
    PALETTE,
    framed_axes,
    label_style,
    make_pen,
    split_label,
    style_plot,
)

__all__ = ["EMPTY_PROFILE_MESSAGE", "ProfileView"]

EMPTY_PROFILE_MESSAGE: Final = ("No line profile yet: on a slice, hold Shift and drag with the left "
                                "button to draw a segment.")
_CURVE_WIDTH: Final = 2.0
_ZERO_COLOUR: Final = "#7f7f7f"


class ProfileView(QWidget):
    """A :class:`~zeffir.scene.LineProfile` as a curve: value against distance along the segment.

    The x axis is the distance s from the segment's start (the dark dot on the
    slice) in the slice's length unit, the y axis the slice's value with its unit.
    Signed quantities get a zero line, so nodes read as crossings. A log scale is
    offered for values that are nowhere negative and follows the slice's colour
    scale when a profile arrives. Samples beyond the slice are NaN and leave a gap.

    Signals
    -------
    cleared()
        The user pressed Clear: the owner removes the segment from the slices.
    saved(str)
        A CSV file was written (its path).
    """

    cleared = Signal()
    saved = Signal(str)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._profile: LineProfile | None = None
        self._shown_y = np.empty(0)

        self._title = QLabel()
        self._title.setTextFormat(Qt.TextFormat.RichText)
        self._title.setAlignment(Qt.AlignmentFlag.AlignCenter)
        self._title.setWordWrap(True)
        self._title.setSizePolicy(QSizePolicy.Policy.Ignored, QSizePolicy.Policy.Preferred)
        self._title.setStyleSheet("QLabel { background: white; }")
        self._title.setContentsMargins(4, 4, 4, 0)

        self._plot_widget = pg.PlotWidget(background="w", axisItems=framed_axes())
        self._plot: pg.PlotItem = self._plot_widget.getPlotItem()
        style_plot(self._plot, grid=True)
        self._zero_line = pg.InfiniteLine(pos=0.0, angle=0, movable=False,
                                          pen=make_pen(_ZERO_COLOUR, 1.0, Qt.PenStyle.DashLine))
        self._zero_line.setZValue(-10)
        self._plot.addItem(self._zero_line, ignoreBounds=True)
        # connect="finite": the parts of a segment outside the slice (NaN) stay gaps.
        self._curve = pg.PlotDataItem(pen=make_pen(PALETTE[0], _CURVE_WIDTH), connect="finite",
                                      antialias=True)
        self._plot.addItem(self._curve)

        self._copy_button = QPushButton("Copy")
        self._copy_button.setToolTip("Copy the numbers (s, u, v, value; tab-separated, with the "
                                     "'#' notes) for pasting into a spreadsheet")
        self._copy_button.clicked.connect(self.copy_to_clipboard)
        self._save_button = QPushButton("Save as CSV…")
        self._save_button.setToolTip("Write s, u, v and the value as CSV, with notes on the atom, "
                                     "model, plane, segment and units")
        self._save_button.clicked.connect(self._ask_and_save)
        self._log_box = QCheckBox("Log scale")
        self._log_box.setToolTip("Logarithmic value axis (for values that are nowhere negative); "
                                 "zeros are left out")
        self._log_box.toggled.connect(self._on_log_toggled)
        self._clear_button = QPushButton("Clear")
        self._clear_button.setToolTip("Remove the profile and its segment on the slices")
        self._clear_button.clicked.connect(self._on_clear)
        bar = QHBoxLayout()
        bar.setContentsMargins(6, 2, 6, 2)
        bar.addWidget(self._log_box)
        bar.addStretch(1)
        for button in (self._copy_button, self._save_button, self._clear_button):
            bar.addWidget(button)

        page = QWidget()
        column = QVBoxLayout(page)
        column.setContentsMargins(0, 0, 0, 0)
        column.setSpacing(0)
        column.addWidget(self._title)
        column.addWidget(self._plot_widget, 1)
        column.addLayout(bar)
        self._message = QLabel(EMPTY_PROFILE_MESSAGE)
        self._message.setTextFormat(Qt.TextFormat.PlainText)
        self._message.setAlignment(Qt.AlignmentFlag.AlignCenter)
        self._message.setWordWrap(True)
        self._message.setStyleSheet(f"QLabel {{ background: white; color: {MUTED_TEXT}; padding: 16px; }}")
        self._stack = QStackedLayout(self)
        self._stack.addWidget(page)
        self._stack.addWidget(self._message)
        self.setMinimumSize(260, 180)
        self.show_profile(None)

    # -- drawing -------------------------------------------------------------------------

    def show_profile(self, profile: LineProfile | None) -> None:
        """Plot ``profile``; ``None`` clears the view and shows how to draw one.

        Parameters
        ----------
        profile : LineProfile or None
            The samples, labels and title to show.
        """
        self._profile = profile
        if profile is None:
            self._curve.setData([], [])
            self._shown_y = np.empty(0)
            self._title.setText("")
            self._message.setText(EMPTY_PROFILE_MESSAGE)
            self._stack.setCurrentIndex(1)
            return
        if not np.any(np.isfinite(profile.values)):
            self._curve.setData([], [])
            self._shown_y = np.empty(0)
            self._message.setText(f"The segment {profile.segment_text} lies outside the slice: "
                                  "nothing to plot. Draw it across the image.")
            self._stack.setCurrentIndex(1)
            return
        self._stack.setCurrentIndex(0)
        self._title.setText(
            f'<span style="font-size:10pt; color:{AXIS_COLOUR}">{html.escape(profile.title)}</span><br>'
            f'<span style="font-size:9pt; color:{MUTED_TEXT}">{html.escape(profile.plane_text)}</span>')
        self._title.setToolTip(f"{profile.spec} under the {profile.model} model; {profile.plane_text}; "
                               f"length {profile.length:.6g} {profile.length_symbol}")
        self._plot.setLabel("bottom", html.escape(profile.distance_label), **label_style())
        self._plot.setLabel("left", html.escape(profile.value_label), **label_style())
        symbol, unit = split_label(profile.value_label)
        self._plot.getAxis("left").setToolTip(f"{symbol} along the segment\nUnits: {unit}")
        self._plot.getAxis("bottom").setToolTip(
            f"s: distance from the segment's start (the dark dot on the slice)\n"
            f"Units: {profile.length_symbol}")
        self._zero_line.setVisible(profile.signed)
        loggable = self._loggable(profile)
        self._log_box.setEnabled(loggable)
        self._log_box.blockSignals(True)  # the state set here is the profile's, not a user edit
        self._log_box.setChecked(loggable and profile.log_scale)
        self._log_box.blockSignals(False)
        self._draw()

    @staticmethod
    def _loggable(profile: LineProfile) -> bool:
        finite = profile.values[np.isfinite(profile.values)]
        return bool(finite.size and finite.min() >= 0 and finite.max() > 0)

    def _draw(self) -> None:
        profile = self._profile
        assert profile is not None
        log = self._log_box.isChecked()
        y = np.asarray(profile.values, dtype=float)
        if log:
            # pyqtgraph takes log10 itself; zeros (beyond a table's range) would be −∞.
            y = np.where(y > 0, y, np.nan)
        self._plot.setLogMode(x=False, y=log)
        self._shown_y = y
        self._curve.setData(profile.s, y)
        self._plot.enableAutoRange()

    def _on_log_toggled(self, _checked: bool) -> None:
        if self._profile is not None:
            self._draw()

    def _on_clear(self) -> None:
        self.show_profile(None)
        self.cleared.emit()

    # -- copy and save -------------------------------------------------------------------

    def copy_to_clipboard(self) -> str:
        """Put the profile on the clipboard, tab-separated with its notes; return the text.

        Returns
        -------
        str
            What was copied; empty when no profile is shown.
        """
        if self._profile is None:
            return ""
        text = profile_csv_text(self._profile, delimiter="\t")
        QApplication.clipboard().setText(text)
        return text

    def save_csv(self, path: str | Path) -> Path:
        """Write the profile shown to ``path`` as CSV (atomically).

        Raises
        ------
        ExportError
            No profile is shown, or the file cannot be written (nothing is written).
        """
        if self._profile is None:
            raise ExportError(f"{path}: no line profile to save; draw one on a slice first")
        written = write_profile_csv(self._profile, path)
        self.saved.emit(str(written))
        return written

    def suggested_file_name(self) -> str:
        """A file name naming the atom and model, e.g. ``'H_2p1-hydrogenic-profile.csv'``."""
        if self._profile is None:
            return "profile.csv"
        stem = re.sub(r"[^\w+-]+", "_", f"{self._profile.spec}-{self._profile.model}").strip("_")
        return f"{stem}-profile.csv"

    def _ask_and_save(self) -> None:
        if self._profile is None:
            return
        name, _ = QFileDialog.getSaveFileName(self, "Save line profile", self.suggested_file_name(),
                                              "CSV files (*.csv)")
        if not name:
            return
        path = Path(name)
        if path.suffix.lower() != ".csv":
            path = path.with_name(path.name + ".csv")
        try:
            self.save_csv(path)
        except ExportError as error:
            QMessageBox.warning(self, "Nothing saved", str(error))

    # -- read-back (tests) ---------------------------------------------------------------

    def profile(self) -> LineProfile | None:
        """The profile shown, or None."""
        return self._profile

    def curve_data(self) -> tuple[np.ndarray, np.ndarray]:
        """(s, value) as handed to the curve (on a log axis, values ≤ 0 are NaN)."""
        if self._profile is None or not self._shown_y.size:
            return np.empty(0), np.empty(0)
        x, y = self._curve.getOriginalDataset()
        return np.asarray(x, dtype=float), np.asarray(y, dtype=float)

    def axis_labels(self) -> tuple[str, str]:
        """The (bottom, left) axis label texts."""
        return (self._plot.getAxis("bottom").labelText, self._plot.getAxis("left").labelText)

    def title_text(self) -> str:
        """The title as rich text."""
        return self._title.text()

    def log_scale(self) -> bool:
        """True when the value axis is logarithmic."""
        return self._log_box.isChecked()

    def set_log_scale(self, log: bool) -> None:
        """Switch the value axis between linear and log (log only where the values allow)."""
        self._log_box.setChecked(bool(log) and self._log_box.isEnabled())

    def empty_message(self) -> str | None:
        """The message shown instead of a curve, or None when a curve is drawn."""
        return self._message.text() if self._stack.currentIndex() == 1 else None

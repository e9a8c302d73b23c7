"""The frame every plot view shares: title, plot, two-line read-out, and the empty message.

:class:`~zeffir.ui.RadialView` and :class:`~zeffir.ui.SliceView` compose a
:class:`ViewFrame` instead of each building these widgets: a plot page (optional
title above the plot, the read-out below) stacked with a message page shown
while there is nothing to draw.
"""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QTextDocument
from PySide6.QtWidgets import QLabel, QSizePolicy, QStackedLayout, QVBoxLayout, QWidget

from zeffir.ui._plot_style import AXIS_COLOUR, MUTED_TEXT

__all__ = ["ViewFrame"]


class ViewFrame:
    """Build and run the shared parts of a plot view inside ``owner``.

    Parameters
    ----------
    owner : QWidget
        The view; the frame's stacked layout becomes its layout.
    plot : QWidget
        The plot widget, stretched between the title and the read-out.
    title : QLabel, optional
        A title label above the plot (slices: changing it never re-lays out the plot).
    wrap_readout : bool
        Let the read-out wrap (True), or leave line breaking to the view (False).
    """

    def __init__(self, owner: QWidget, plot: QWidget, title: QLabel | None = None,
                 wrap_readout: bool = True) -> None:
        self.readout = QLabel()
        self.readout.setTextFormat(Qt.TextFormat.RichText)
        self.readout.setWordWrap(wrap_readout)
        # Its text must never hold the view wide: the text is fitted to the width instead.
        self.readout.setSizePolicy(QSizePolicy.Policy.Ignored, QSizePolicy.Policy.Fixed)
        self.readout.setAlignment(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop)
        self.readout.setContentsMargins(8, 2, 8, 4)
        self.readout.setStyleSheet(f"QLabel {{ background: white; color: {AXIS_COLOUR}; }}")
        # Two lines always, so the plot does not jump when the read-out changes.
        self.readout.setFixedHeight(2 * self.readout.fontMetrics().lineSpacing() + 8)

        self.message = QLabel()
        self.message.setAlignment(Qt.AlignmentFlag.AlignCenter)
        self.message.setWordWrap(True)
        self.message.setStyleSheet(f"QLabel {{ background: white; color: {MUTED_TEXT}; padding: 24px; }}")

        page = QWidget()
        column = QVBoxLayout(page)
        column.setContentsMargins(0, 0, 0, 0)
        column.setSpacing(0)
        if title is not None:
            column.addWidget(title)
        column.addWidget(plot, 1)
        column.addWidget(self.readout)
        self._stack = QStackedLayout(owner)
        self._stack.addWidget(page)
        self._stack.addWidget(self.message)

    def show_plot(self) -> None:
        """Show the plot page."""
        self._stack.setCurrentIndex(0)

    def show_message(self, text: str) -> None:
        """Show ``text`` instead of the plot."""
        self.message.setText(text)
        self._stack.setCurrentIndex(1)

    def shown_message(self) -> str | None:
        """The message shown instead of a plot, or None while the plot is shown."""
        return self.message.text() if self._stack.currentIndex() == 1 else None

    def readout_text(self) -> str:
        """The read-out as plain text."""
        document = QTextDocument()
        document.setHtml(self.readout.text())
        return document.toPlainText()


def fitted_line(text: str, width: float, sizes: tuple[float, ...]) -> tuple[str, float]:
    """``text`` at the largest point size in ``sizes`` that fits ``width`` pixels.

    When none fits, the text is shortened with an ellipsis at the smallest size (the
    whole text belongs in the widget's tooltip). Returns the text and the size.
    """
    from PySide6.QtGui import QFont, QFontMetricsF

    font = QFont()
    for size in sizes:
        font.setPointSizeF(size)
        if QFontMetricsF(font).horizontalAdvance(text) <= width:
            return text, size
    metrics = QFontMetricsF(font)
    return metrics.elidedText(text, Qt.TextElideMode.ElideRight, max(width, 20.0)), sizes[-1]

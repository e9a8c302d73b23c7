"""The terms view: LS terms, J levels and ground levels of one configuration.

It only displays a :class:`~zeffir.scene._terms.TermsSummary` (or an error), which
``terms_summary`` computes without Qt, so the window runs it in its worker thread;
:meth:`TermsView.show_configuration` does both steps on the calling thread.

Measured with ``configuration_terms`` (fresh process, cold caches): Gd (4f7 5d1 6s2,
1118 terms) 6 ms, Ce [Xe] 4f2 5d2 (187 terms) 6 ms; the largest configurations below
the core's limit of 200 000 terms (e.g. Gd3- [Xe] 4f7 5d3 6p3, 183 022 terms, 100
distinct) take about 60 ms including the counting of repeats.
"""

from __future__ import annotations

from typing import Final

from PySide6.QtCore import Qt
from PySide6.QtGui import QAction, QFont, QGuiApplication, QKeySequence, QPalette
from PySide6.QtWidgets import (
    QAbstractItemView,
    QHeaderView,
    QLabel,
    QTableWidget,
    QTableWidgetItem,
    QVBoxLayout,
    QWidget,
)

from zeffir.core import ZeffirError
from zeffir.core.terms import MULTIPLICITY_NAMES, quantum_number_text
from zeffir.scene import (
    TermNote,
    TermRow,
    TermsSummary,
    level_symbol,
    term_symbol,
    terms_summary,
)

__all__ = [
    "COLUMNS",
    "ERROR_COLOUR",
    "WARNING_COLOUR",
    "TermNote",
    "TermRow",
    "TermsSummary",
    "TermsView",
    "level_symbol",
    "term_symbol",
    "terms_summary",
]

#: (header, tooltip) of each table column, in order.
COLUMNS: Final[tuple[tuple[str, str], ...]] = (
    ("Term", "LS term: multiplicity 2S + 1 as a superscript, the letter of L, ° when odd"),
    ("Count", "How many times the term occurs in the configuration"),
    ("S", "Total spin quantum number"),
    ("L", "Total orbital angular momentum quantum number"),
    ("Parity", "(−1)^Σl of the configuration, shared by all its terms"),
    ("J levels", "The term's levels J = |L − S|, …, L + S"),
    ("States", "Microstates the term accounts for: (2S + 1)(2L + 1) × count"),
    ("Ground level", "The ground level by Hund's rules, and the observed one where it is known"),
)

#: Text colour of a note saying Hund's rules miss the observed ground level.
WARNING_COLOUR: Final[str] = "#a35200"
#: Text colour of an error message (the same red as the atom field's messages).
ERROR_COLOUR: Final[str] = "#b00020"

_MUTED_COLOUR: Final[str] = "#555555"
def _label(object_name: str, style: str = "") -> QLabel:
    label = QLabel()
    label.setObjectName(object_name)
    label.setWordWrap(True)
    label.setTextFormat(Qt.TextFormat.PlainText)  # core texts are never markup
    label.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
    if style:
        label.setStyleSheet(style)
    return label


class TermsView(QWidget):
    """The terms of one configuration: a header, a table of terms, the ground levels.

    The view holds no physics state of its own: it shows the last
    :class:`TermsSummary` (or error) it was given and forgets everything else.
    """

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.header_label = _label("termsHeader")
        bold = self.header_label.font()
        bold.setBold(True)
        self.header_label.setFont(bold)
        self.details_label = _label("termsDetails")
        self.origin_label = _label("termsOrigin", f"color: {_MUTED_COLOUR};")
        self.error_label = _label("termsError", f"color: {ERROR_COLOUR};")

        self.table = QTableWidget(0, len(COLUMNS))
        self.table.setObjectName("termsTable")
        for column, (header, tip) in enumerate(COLUMNS):
            item = QTableWidgetItem(header)
            item.setToolTip(tip)
            self.table.setHorizontalHeaderItem(column, item)
        self.table.verticalHeader().setVisible(False)
        self.table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        columns = self.table.horizontalHeader()
        columns.setSectionResizeMode(QHeaderView.ResizeMode.ResizeToContents)
        columns.setStretchLastSection(True)
        # Ctrl+C while the table has focus copies all of it (a row selection is
        # only a reading aid here); the same action sits in the context menu.
        self.copy_action = QAction("Copy table", self.table)
        self.copy_action.setShortcut(QKeySequence.StandardKey.Copy)
        self.copy_action.setShortcutContext(Qt.ShortcutContext.WidgetWithChildrenShortcut)
        self.copy_action.triggered.connect(self.copy_to_clipboard)
        self.table.addAction(self.copy_action)
        self.table.setContextMenuPolicy(Qt.ContextMenuPolicy.ActionsContextMenu)

        self.ground_label = _label("termsHundGround")
        self.observed_label = _label("termsObservedGround")
        self._notes_box = QVBoxLayout()
        self._notes_box.setContentsMargins(0, 0, 0, 0)
        self.note_labels: list[QLabel] = []

        layout = QVBoxLayout(self)
        for widget in (self.header_label, self.details_label, self.origin_label, self.error_label):
            layout.addWidget(widget)
        layout.addWidget(self.table, stretch=1)
        layout.addWidget(self.ground_label)
        layout.addWidget(self.observed_label)
        layout.addLayout(self._notes_box)

        self._spec: str | None = None
        self._summary: TermsSummary | None = None
        self._error: str | None = None
        self._clear()
        self.header_label.setText("Type a configuration to list its terms.")

    # -- what the window calls -------------------------------------------------

    def show_configuration(self, spec: str) -> None:
        """Compute the terms of ``spec`` on this thread and show them (or the error).

        Parameters
        ----------
        spec : str
            Any specification the atom field accepts.
        """
        try:
            summary = terms_summary(spec)
        except ZeffirError as error:
            self.show_error(spec, str(error))
            return
        self.show_summary(summary)

    def show_summary(self, summary: TermsSummary) -> None:
        """Show a summary computed elsewhere (e.g. by the window's worker thread)."""
        self._clear()
        self._spec, self._summary = summary.spec, summary
        self.header_label.setText(summary.title)
        self.details_label.setText(summary.details)
        self.origin_label.setText(summary.origin_note)
        self._fill_table(summary.rows)
        self.ground_label.setText(summary.ground_text)
        self.observed_label.setText(summary.observed_text)
        self.observed_label.setVisible(bool(summary.observed_text))
        for note in summary.notes:
            self._add_note(note)

    def show_error(self, spec: str, message: str) -> None:
        """Show why the terms of ``spec`` could not be listed, and nothing else."""
        self._clear()
        self._spec, self._error = spec, message
        self.header_label.setText(f"Cannot list the terms of “{spec}”")
        self.error_label.setText(message)
        self.error_label.setVisible(True)

    def current_spec(self) -> str | None:
        """The spec shown (its terms, or why they failed); None before the first one."""
        return self._spec

    def summary(self) -> TermsSummary | None:
        """The summary on display; None when an error or nothing is shown."""
        return self._summary

    def error_message(self) -> str | None:
        """The error on display, if any."""
        return self._error

    def as_text(self) -> str:
        """The table as tab-separated text: the header row, then one line per term."""
        lines = ["\t".join(header for header, _ in COLUMNS)]
        for r in range(self.table.rowCount()):
            cells = []
            for c in range(self.table.columnCount()):
                item = self.table.item(r, c)
                cells.append(item.text() if item is not None else "")
            lines.append("\t".join(cells))
        return "\n".join(lines)

    def copy_to_clipboard(self) -> None:
        """Put :meth:`as_text` on the clipboard."""
        QGuiApplication.clipboard().setText(self.as_text())

    # -- drawing ---------------------------------------------------------------

    def _clear(self) -> None:
        # Everything goes, so a failed spec never leaves the previous terms behind.
        self._spec = self._summary = self._error = None
        for label in (self.header_label, self.details_label, self.origin_label,
                      self.error_label, self.ground_label, self.observed_label):
            label.clear()
        self.error_label.setVisible(False)
        self.table.setRowCount(0)
        for label in self.note_labels:
            self._notes_box.removeWidget(label)
            label.deleteLater()
        self.note_labels = []

    def _fill_table(self, rows: tuple[TermRow, ...]) -> None:
        palette = self.table.palette()
        # Shade alternate multiplicity groups, so the doublets, quartets, ... read as blocks.
        shades = (palette.color(QPalette.ColorRole.Base),
                  palette.color(QPalette.ColorRole.AlternateBase))
        group, shade = None, 1
        self.table.setRowCount(len(rows))
        for r, row in enumerate(rows):
            if row.term.multiplicity != group:
                group, shade = row.term.multiplicity, 1 - shade
            name = (MULTIPLICITY_NAMES[group - 1] if group <= len(MULTIPLICITY_NAMES)
                    else f"multiplicity {group}")
            tip = f"{name}, S = {quantum_number_text(row.term.S)}, L = {row.term.L} ({row.term.display})"
            for c, text in enumerate(row.cells()):
                item = QTableWidgetItem(text)
                numeric = COLUMNS[c][0] in ("Count", "S", "L", "States")
                align = Qt.AlignmentFlag.AlignRight if numeric else Qt.AlignmentFlag.AlignLeft
                item.setTextAlignment(align | Qt.AlignmentFlag.AlignVCenter)
                item.setBackground(shades[shade])
                item.setToolTip(tip)
                if row.is_hund or row.is_observed:
                    font = QFont(item.font())
                    font.setBold(row.is_hund)
                    # Italic marks the observed ground term when it is not Hund's.
                    font.setItalic(row.is_observed and not row.is_hund)
                    item.setFont(font)
                self.table.setItem(r, c, item)

    def _add_note(self, note: TermNote) -> None:
        colour = WARNING_COLOUR if note.warning else _MUTED_COLOUR
        label = _label("termsHundMiss" if note.warning else "termsNote", f"color: {colour};")
        label.setText(f"• {note.text}")
        self._notes_box.addWidget(label)
        self.note_labels.append(label)

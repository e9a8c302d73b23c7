"""The terms view: LS terms, J levels and ground levels of one configuration.

Two layers. :func:`terms_summary` asks the core for everything the view shows and
returns it as a frozen :class:`TermsSummary`; it touches no Qt object, so the window
can run it in its worker thread. :class:`TermsView` only displays a summary (or an
error) and computes nothing itself, apart from the convenience
:meth:`TermsView.show_configuration`, which does both steps on the calling thread.

Measured with ``configuration_terms`` (fresh process, cold caches): Gd (4f7 5d1 6s2,
1118 terms) 6 ms, Ce [Xe] 4f2 5d2 (187 terms) 6 ms; the largest configurations below
the core's limit of 200 000 terms (e.g. Gd3- [Xe] 4f7 5d3 6p3, 183 022 terms, 100
distinct) take about 60 ms including the counting of repeats here. The synchronous
path is therefore fine for typing, and the worker path is there for the window.
"""

from __future__ import annotations

from collections import Counter
from dataclasses import dataclass
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

from zeffir.core import ZeffirError, parse_spec
from zeffir.core.terms import (
    Level,
    ObservedLevel,
    Parity,
    Term,
    configuration_parity,
    configuration_terms,
    ground_level,
    ground_notes,
    microstate_count,
    observed_level,
    term_label,
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
_SUPERSCRIPT: Final = str.maketrans("0123456789", "⁰¹²³⁴⁵⁶⁷⁸⁹")
_SUBSCRIPT: Final = str.maketrans("0123456789", "₀₁₂₃₄₅₆₇₈₉")
_MULTIPLICITY_NAMES: Final[tuple[str, ...]] = (
    "singlet", "doublet", "triplet", "quartet", "quintet", "sextet", "septet", "octet", "nonet")


def _half(value: float) -> str:
    """A whole or half-whole number as the trade writes it: ``'2'``, ``'3/2'``."""
    twice = round(2 * value)
    return str(twice // 2) if twice % 2 == 0 else f"{twice}/2"


def _letter(S: float, L: int) -> str:
    # The core's own label ('3P', '2[L=17]') minus its multiplicity, so the letters
    # beyond L = 16 follow the core's rule rather than a copy of it.
    multiplicity = str(round(2 * S) + 1)
    return term_label(S, L)[len(multiplicity):]


def term_symbol(term: Term) -> str:
    """The term in Unicode: superscript multiplicity, L letter, ``°`` when odd.

    Parameters
    ----------
    term : Term

    Returns
    -------
    str
        E.g. ``'³P'``, ``'⁴S°'``.

    Examples
    --------
    >>> term_symbol(Term(S=1.5, L=0, parity="odd"))
    '⁴S°'
    """
    odd = "°" if term.parity == "odd" else ""
    return f"{str(term.multiplicity).translate(_SUPERSCRIPT)}{_letter(term.S, term.L)}{odd}"


def level_symbol(level: Level) -> str:
    """The level in Unicode: the term symbol with J as a subscript.

    Parameters
    ----------
    level : Level

    Returns
    -------
    str
        E.g. ``'³P₀'``, ``'⁴I°₉/₂'`` (there is no subscript slash in Unicode; the
        digits alone are lowered).

    Examples
    --------
    >>> level_symbol(Level(S=1, L=1, J=0, parity="even"))
    '³P₀'
    """
    return term_symbol(level.term) + _half(level.J).translate(_SUBSCRIPT)


@dataclass(frozen=True, slots=True)
class TermRow:
    """One distinct term of a configuration, as a table row.

    Attributes
    ----------
    term : Term
    count : int
        How many times the term occurs.
    is_hund : bool
        The term of the ground level by Hund's rules.
    is_observed : bool
        The term of the observed ground level (known and named in LS coupling).
    ground_mark : str
        What the "Ground level" column says: empty, or which ground level(s) lie
        in this term.
    """

    term: Term
    count: int
    is_hund: bool
    is_observed: bool
    ground_mark: str

    @property
    def symbol(self) -> str:
        """Unicode term symbol, e.g. ``'³P'``."""
        return term_symbol(self.term)

    @property
    def levels_text(self) -> str:
        """The J levels, lowest first, e.g. ``'0, 1, 2'``."""
        return ", ".join(_half(j) for j in self.term.J)

    @property
    def states(self) -> int:
        """Microstates of all occurrences of the term, (2S + 1)(2L + 1) × count."""
        return self.term.states * self.count

    def cells(self) -> tuple[str, ...]:
        """The row's texts in the order of :data:`COLUMNS`."""
        return (self.symbol, str(self.count), _half(self.term.S), str(self.term.L),
                self.term.parity, self.levels_text, str(self.states), self.ground_mark)


@dataclass(frozen=True, slots=True)
class TermNote:
    """A note shown under the ground levels; ``warning`` when Hund's rules miss."""

    text: str
    warning: bool


@dataclass(frozen=True, slots=True)
class TermsSummary:
    """Everything the terms view shows for one configuration (no Qt).

    Attributes
    ----------
    spec : str
        The specification as it was asked for (what ``current_spec`` returns).
    normalized_spec : str
        The core's normalised specification.
    atom : str
        Element name, Z and charge, e.g. ``'Europium (Z = 63, charge +3)'``.
    short_text, configuration : str
        The configuration with its noble-gas core in brackets, and in full.
    open_subshells : str
        The open subshells with their electrons, e.g. ``'4f1 5d2'``; empty when
        every subshell is closed.
    parity : {"even", "odd"}
    microstates : int
    term_count : int
        Number of terms, repeats included.
    rows : tuple of TermRow
        One per distinct term, in the core's order: S descending, then L descending.
    ground : Level
        The ground level by Hund's rules.
    observed : ObservedLevel or None
        The observed ground level, where known.
    hund_miss : bool
        True when the observed ground level is known to differ from Hund's.
    origin_note : str
        Where the configuration comes from.
    notes : tuple of TermNote
        The core's notes on the ground level.
    """

    spec: str
    normalized_spec: str
    atom: str
    short_text: str
    configuration: str
    open_subshells: str
    parity: Parity
    microstates: int
    term_count: int
    rows: tuple[TermRow, ...]
    ground: Level
    observed: ObservedLevel | None
    hund_miss: bool
    origin_note: str
    notes: tuple[TermNote, ...]

    @property
    def title(self) -> str:
        """First header line: atom and configuration, short and in full."""
        full = "" if self.configuration == self.short_text else f"  ({self.configuration})"
        return f"{self.atom}: {self.short_text}{full}"

    @property
    def details(self) -> str:
        """Second header line: open subshells, parity, microstates and term count."""
        shells = self.open_subshells or "none (closed shells)"
        count = f"{self.term_count} term{'s' if self.term_count != 1 else ''}"
        if len(self.rows) != self.term_count:
            count += f" ({len(self.rows)} distinct)"
        states = f"{self.microstates} microstate{'s' if self.microstates != 1 else ''}"
        mark = " (° marks odd terms)" if self.parity == "odd" else ""
        return f"Open subshells: {shells} · parity {self.parity}{mark} · {states} · {count}"

    @property
    def ground_text(self) -> str:
        """The Hund ground level with its quantum numbers."""
        g = self.ground
        return (f"Ground level by Hund's rules: {level_symbol(g)}  "
                f"(S = {_half(g.S)}, L = {g.L}, J = {_half(g.J)})")

    @property
    def observed_text(self) -> str:
        """The observed ground level and its source; empty when it is not known."""
        seen = self.observed
        if seen is None:
            return ""
        if seen.level is not None:
            agreement = ("differs from Hund's rules" if self.hund_miss
                         else "agrees with Hund's rules")
            return f"Observed ground level: {level_symbol(seen.level)}  ({seen.source}) — {agreement}"
        # NIST names this level in another coupling: only J can be compared.
        agreement = "differs from" if self.hund_miss else "agrees with"
        return (f"Observed ground level: {seen.text}, J = {_half(seen.J)}  ({seen.source}) — "
                f"J {agreement} Hund's rules")


def _atom_text(name: str, Z: int, charge: int) -> str:
    return f"{name} (Z = {Z}{f', charge {charge:+d}' if charge else ''})"


def _ground_mark(hund: Level | None, observed: Level | None) -> str:
    if hund is not None and hund == observed:
        return f"{level_symbol(hund)} by Hund's rules and observed"
    parts = []
    if hund is not None:
        parts.append(f"{level_symbol(hund)} by Hund's rules")
    if observed is not None:
        parts.append(f"{level_symbol(observed)} observed")
    return "; ".join(parts)


def terms_summary(spec: str) -> TermsSummary:
    """Compute what the terms view shows for a configuration.

    Parameters
    ----------
    spec : str
        Any specification the atom field accepts (``'C'``, ``'Eu3+'``,
        ``'Ce [Xe] 4f2 5d2'``).

    Returns
    -------
    TermsSummary
        Terms grouped by repeats, the Hund and observed ground levels, and notes.

    Raises
    ------
    ZeffirError
        SpecError for an invalid specification, TermError when the configuration
        has too many terms to list.

    Notes
    -----
    Pure and Qt-free, so it may run on a worker thread. All numbers come from
    ``zeffir.core.terms``; nothing here is physics beyond counting repeats.

    Examples
    --------
    >>> [row.symbol for row in terms_summary("C").rows]
    ['³P', '¹D', '¹S']
    """
    configuration = parse_spec(spec)
    terms = configuration_terms(configuration)
    ground = ground_level(configuration)
    observed = observed_level(configuration)
    seen = None if observed is None else observed.level
    if observed is None:
        hund_miss = False
    elif seen is not None:
        hund_miss = seen != ground
    else:
        hund_miss = observed.J != ground.J
    repeats = Counter(terms)  # keeps first-seen order: the core's S, then L, descending
    rows = []
    for term, count in repeats.items():
        hund_here = ground if ground.term == term else None
        seen_here = seen if seen is not None and seen.term == term else None
        rows.append(TermRow(term, count, hund_here is not None, seen_here is not None,
                            _ground_mark(hund_here, seen_here)))
    notes = tuple(
        # The miss note is the one naming the observed level while the two differ.
        TermNote(note, hund_miss and observed is not None and observed.text in note)
        for note in ground_notes(configuration)
    )
    open_text = " ".join(f"{sub.label}{configuration.occupancy(sub)}"
                         for sub in configuration.open_subshells)
    return TermsSummary(
        spec=spec,
        normalized_spec=configuration.spec,
        atom=_atom_text(configuration.element.name, configuration.Z, configuration.charge),
        short_text=configuration.short_text,
        configuration=configuration.text,
        open_subshells=open_text,
        parity=configuration_parity(configuration),
        microstates=microstate_count(configuration),
        term_count=len(terms),
        rows=tuple(rows),
        ground=ground,
        observed=observed,
        hund_miss=hund_miss,
        origin_note=configuration.origin_note,
        notes=notes,
    )


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
            name = (_MULTIPLICITY_NAMES[group - 1] if group <= len(_MULTIPLICITY_NAMES)
                    else f"multiplicity {group}")
            tip = f"{name}, S = {_half(row.term.S)}, L = {row.term.L} ({row.term.display})"
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

"""A periodic-table chooser: click an element to put its symbol into an atom field.

The 118 elements sit in the 18-column long form: periods 1–7 in the main table, and
the two series La–Lu and Ac–Lr in two rows of their own below it, after a small gap.
Their places in group 3 of periods 6 and 7 hold a short text marker (``57–71``,
``89–103``). Lu and Lr close their series rows (the fifteenth place, under group 17),
so each row holds the whole range its marker names.

Each button is tinted by block: the l of the subshell the element's last electron
enters when the subshells are filled in Madelung order (``madelung_order``). By that
rule He is an s element, La–Yb and Ac–No are f elements, and Lu and Lr (whose last
electron enters 5d and 6d) are d elements, although they sit in the series rows.
The tooltip gives the observed ground configuration (NIST Atomic Spectra Database,
the element table Zeffir ships).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache
from typing import Final

from PySide6.QtCore import Qt, Signal
from PySide6.QtGui import QFont
from PySide6.QtWidgets import (
    QDialog,
    QGridLayout,
    QHBoxLayout,
    QLabel,
    QPushButton,
    QVBoxLayout,
    QWidget,
)

from zeffir.core import parse_spec
from zeffir.core.config import L_LETTERS, MAX_Z, element, elements, madelung_order

__all__ = ["ElementChooser", "element_block", "table_position"]

#: Grid rows: periods 1–7 in rows 0–6, an empty spacer row, then the two series rows.
_GAP_ROW: Final[int] = 7
_SERIES_ROWS: Final[dict[int, int]] = {6: 8, 7: 9}
#: The series start under group 3 (column 2), where their marker stands in the main table.
_SERIES_COLUMN: Final[int] = 2
BUTTON_SIZE: Final[int] = 34

#: Pale block tints (s, p, d, f) with dark text; chosen to stay readable and distinct
#: without drawing the eye away from the symbols.
BLOCK_COLOURS: Final[dict[str, str]] = {
    "s": "#f3dada",
    "p": "#f2e8c9",
    "d": "#d8e4f2",
    "f": "#d9ecd6",
}
_TEXT_COLOUR: Final[str] = "#1b1b1b"
_MUTED_COLOUR: Final[str] = "#555555"


@dataclass(frozen=True, slots=True)
class _Place:
    """Where the Madelung filling puts electron Z: its period, subshell l and count."""

    period: int
    l: int
    count: int  # electrons in that subshell once electron Z is in (1 = first)


@cache
def _madelung_places() -> tuple[_Place, ...]:
    """The place of the last electron of every Z = 1..118 in Madelung filling."""
    places: list[_Place] = []
    period = 0
    for sub in madelung_order():
        if sub.l == 0:
            period = sub.n  # each period opens with its s subshell
        for count in range(1, sub.capacity + 1):
            places.append(_Place(period, sub.l, count))
            if len(places) == MAX_Z:
                return tuple(places)
    raise RuntimeError("madelung_order() ends before Z = 118")  # pragma: no cover


def element_block(z: int) -> str:
    """The block letter of element ``z``: the l of the subshell its last electron enters.

    Parameters
    ----------
    z : int
        Atomic number, 1..118.

    Returns
    -------
    str
        ``'s'``, ``'p'``, ``'d'`` or ``'f'``.

    Notes
    -----
    Electrons are placed one by one in the Madelung order (increasing n + l, then n);
    the block is that of the subshell receiving electron Z. Observed ground states
    that break the order (Cr, Cu, La, ...) do not change the block.

    Examples
    --------
    >>> [element_block(z) for z in (1, 2, 5, 26, 57, 71)]
    ['s', 's', 'p', 'd', 'f', 'd']
    """
    return L_LETTERS[_madelung_places()[element(z).Z - 1].l]


def table_position(z: int) -> tuple[int, int]:
    """Row and column of element ``z`` in the chooser's grid.

    Parameters
    ----------
    z : int
        Atomic number, 1..118.

    Returns
    -------
    (int, int)
        Rows 0–6 are periods 1–7, columns 0–17 groups 1–18; rows 8 and 9 hold La–Lu
        and Ac–Lr from column 2 on (row 7 is the gap).

    Notes
    -----
    Derived from the Madelung filling: s electrons fill columns 0–1 (He moves to
    column 17, above the noble gases), d electrons columns 2–11, p electrons columns
    12–17. The f elements of periods 6 and 7, followed by the first d element of the
    same period (Lu, Lr), fill the series rows.

    Examples
    --------
    >>> table_position(1), table_position(2), table_position(26), table_position(71)
    ((0, 0), (0, 17), (3, 7), (8, 16))
    """
    place = _madelung_places()[element(z).Z - 1]
    row = place.period - 1
    if place.period in _SERIES_ROWS and place.l == 3:
        return _SERIES_ROWS[place.period], _SERIES_COLUMN + place.count - 1
    if place.period in _SERIES_ROWS and place.l == 2 and place.count == 1:
        return _SERIES_ROWS[place.period], _SERIES_COLUMN + 14
    if place.l == 0:
        return row, 17 if place.period == 1 and place.count == 2 else place.count - 1
    if place.l == 1:
        return row, 11 + place.count
    return row, 1 + place.count


def _configuration_text(symbol: str) -> str:
    """Ground configuration with its noble-gas core; a noble gas is spelled out."""
    text = parse_spec(symbol).short_text
    if text == f"[{symbol}]":  # a noble gas is its own core: show what it holds
        return element(symbol).ground_text
    return text


class _ElementButton(QPushButton):
    """A square button showing Z small above the symbol."""

    def __init__(self, z: int, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        item = element(z)
        block = element_block(z)
        self.setObjectName(f"element-{item.symbol}")
        self.setProperty("block", block)
        self.setFixedSize(BUTTON_SIZE, BUTTON_SIZE)
        self.setAutoDefault(False)
        self.setToolTip(f"{item.name} (Z = {item.Z}, {block} block)\n"
                        f"ground configuration: {_configuration_text(item.symbol)}")
        self.setAccessibleName(f"{item.name}, {item.symbol}, Z = {item.Z}")
        number = QLabel(str(item.Z))
        number.setObjectName("elementNumber")
        number_font = QFont(self.font())
        number_font.setPointSizeF(max(self.font().pointSizeF() - 2.5, 6.0))
        number.setFont(number_font)
        number.setAlignment(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop)
        symbol = QLabel(item.symbol)
        symbol.setObjectName("elementSymbol")
        symbol_font = QFont(self.font())
        symbol_font.setPointSizeF(self.font().pointSizeF() + 1.5)
        symbol_font.setBold(True)
        symbol.setFont(symbol_font)
        symbol.setAlignment(Qt.AlignmentFlag.AlignHCenter | Qt.AlignmentFlag.AlignBottom)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(3, 2, 2, 2)
        layout.setSpacing(0)
        for label in (number, symbol):
            # The labels only draw: clicks and hovering belong to the button.
            label.setAttribute(Qt.WidgetAttribute.WA_TransparentForMouseEvents)
            layout.addWidget(label)
        self.symbol = item.symbol


def _style_sheet() -> str:
    tints = "\n".join(f'QPushButton[block="{b}"] {{ background-color: {c}; }}'
                      for b, c in BLOCK_COLOURS.items())
    return f"""
QPushButton[block] {{ border: 1px solid #b4b4b4; border-radius: 3px; padding: 0; }}
{tints}
QPushButton[block]:hover {{ border: 1px solid #404040; }}
QPushButton[block]:pressed {{ background-color: #bfbfbf; }}
QPushButton[block]:focus {{ border: 2px solid #2c5d96; }}
QPushButton[block] QLabel {{ color: {_TEXT_COLOUR}; background: transparent; }}
QLabel#seriesMarker, QLabel#chooserHint {{ color: {_MUTED_COLOUR}; }}
"""


class ElementChooser(QDialog):
    """A dialog holding the periodic table as 118 buttons.

    Clicking an element emits its symbol and closes the dialog (accepted); Esc closes
    it without choosing (rejected). Open it with ``open()`` or ``show()``.

    Signals
    -------
    chosen(str)
        The symbol of the element clicked, e.g. ``'Fe'``.
    """

    chosen = Signal(str)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setWindowTitle("Choose an element")
        self.setObjectName("elementChooser")
        self.setStyleSheet(_style_sheet())
        self._buttons: dict[str, QPushButton] = {}
        self._positions: dict[str, tuple[int, int]] = {}
        self.grid = QGridLayout()
        self.grid.setSpacing(2)
        for item in elements():
            button = _ElementButton(item.Z)
            row, column = table_position(item.Z)
            self.grid.addWidget(button, row, column)
            self._buttons[item.symbol] = button
            self._positions[item.symbol] = (row, column)
            button.clicked.connect(lambda _checked=False, s=item.symbol: self._choose(s))
        for period, series_row in _SERIES_ROWS.items():
            members = [e.Z for e in elements() if table_position(e.Z)[0] == series_row]
            marker = QLabel(f"{min(members)}–\n{max(members)}")
            marker.setObjectName("seriesMarker")
            marker.setAlignment(Qt.AlignmentFlag.AlignCenter)
            marker.setToolTip(f"Elements {min(members)}–{max(members)}: the row below the table")
            marker_font = QFont(marker.font())
            marker_font.setPointSizeF(max(marker.font().pointSizeF() - 2.0, 6.0))
            marker.setFont(marker_font)
            marker.setFixedSize(BUTTON_SIZE, BUTTON_SIZE)
            self.grid.addWidget(marker, period - 1, _SERIES_COLUMN)
        self.grid.setRowMinimumHeight(_GAP_ROW, 8)
        # The empty top of groups 3–12 holds the key to the tints and a line of help.
        self.grid.addWidget(self._key(), 0, 2, 2, 10)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(10, 10, 10, 10)
        layout.addLayout(self.grid)
        self.setFixedSize(self.sizeHint())

    def _key(self) -> QWidget:
        key = QWidget()
        column = QVBoxLayout(key)
        column.setContentsMargins(6, 0, 6, 0)
        column.setSpacing(4)
        swatches = QHBoxLayout()
        swatches.setSpacing(6)
        caption = QLabel("Tint by block:")
        caption.setObjectName("chooserHint")
        swatches.addWidget(caption)
        for block, colour in BLOCK_COLOURS.items():
            swatch = QLabel(f"{block} block")
            swatch.setObjectName(f"blockKey-{block}")
            swatch.setAlignment(Qt.AlignmentFlag.AlignCenter)
            swatch.setStyleSheet(f"QLabel {{ background-color: {colour}; color: {_TEXT_COLOUR}; "
                                 "padding: 1px 6px; }")
            swatch.setToolTip("Tint: the subshell the last electron enters in Madelung order")
            swatches.addWidget(swatch)
        swatches.addStretch(1)
        hint = QLabel("Click an element to use it; hover for its ground configuration. Esc closes.")
        hint.setObjectName("chooserHint")
        hint.setWordWrap(True)
        column.addStretch(1)
        column.addLayout(swatches)
        column.addWidget(hint)
        column.addStretch(1)
        return key

    def button(self, symbol: str) -> QPushButton:
        """The button of the element ``symbol`` (any letter case)."""
        return self._buttons[element(symbol).symbol]

    def position(self, symbol: str) -> tuple[int, int]:
        """The (row, column) of the element ``symbol`` in the grid; see :func:`table_position`."""
        return self._positions[element(symbol).symbol]

    def focus_element(self, symbol: str) -> None:
        """Give the keyboard focus to the element ``symbol`` (Space then chooses it)."""
        self.button(symbol).setFocus(Qt.FocusReason.OtherFocusReason)

    def _choose(self, symbol: str) -> None:
        self.chosen.emit(symbol)
        self.accept()

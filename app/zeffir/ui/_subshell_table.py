"""The subshell table: one row per occupied subshell with its numbers."""

from __future__ import annotations

import math

from PySide6.QtCore import Qt, Signal
from PySide6.QtGui import QAction, QGuiApplication, QKeySequence
from PySide6.QtWidgets import QAbstractItemView, QHeaderView, QTableWidget, QTableWidgetItem, QWidget

import zeffir.core
from zeffir.core import SubshellSummary
from zeffir.core.properties import occupancy_text

__all__ = ["COLUMNS", "SubshellTable"]

#: (header, tooltip) of each column; lengths and energies follow the chosen units.
COLUMNS: tuple[tuple[str, str], ...] = (
    ("Subshell", "n and l of the subshell"),
    ("Electrons", "Occupancy of the subshell"),
    ("ζ", "Orbital exponent ζ (length⁻¹): Z/n for hydrogenic, Z_eff/n* for Slater-type functions"),
    ("Z_eff", "Effective nuclear charge felt by an electron of this subshell"),
    ("n*", "Effective principal quantum number (Slater-type functions)"),
    ("⟨r⟩", "Mean radius ⟨r⟩ = ∫ r · r²R² dr"),
    ("r_max", "Radius of the highest maximum of the radial distribution r²R²"),
    ("ε", "Orbital energy, where the model defines one"),
    ("⟨r²⟩", "⟨r²⟩ = ∫ r² · r²R² dr (diamagnetic susceptibility, size)"),
    ("⟨1/r⟩", "⟨1/r⟩ = ∫ r⁻¹ · r²R² dr (nuclear attraction, electron density at the nucleus scale)"),
    ("⟨r⁻³⟩", "⟨r⁻³⟩ = ∫ r⁻³ · r²R² dr (spin–orbit and hyperfine integrals; infinite for s)"),
    ("Series", "Which atom and model the row belongs to (when several are compared)"),
)
#: The series column: last in the model, shown second (after Subshell) when there are several.
SERIES_COLUMN: int = 11
#: Columns 8–10 (the further radial moments) are shown on request.
MOMENT_COLUMNS: tuple[int, ...] = (8, 9, 10)


class SubshellTable(QTableWidget):
    """Shows a subshell table; selecting a row selects that subshell.

    Signals
    -------
    subshell_selected(str)
        The label of the row the user selected.
    """

    subshell_selected = Signal(str)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(0, len(COLUMNS), parent)
        for column, (header, tip) in enumerate(COLUMNS):
            item = QTableWidgetItem(header)
            item.setToolTip(tip)
            self.setHorizontalHeaderItem(column, item)
        self.verticalHeader().setVisible(False)
        self.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        self.setSelectionMode(QAbstractItemView.SelectionMode.SingleSelection)
        self.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.setAlternatingRowColors(True)
        self.horizontalHeader().setSectionResizeMode(QHeaderView.ResizeMode.Stretch)
        self.moments_action = QAction("Show ⟨r²⟩, ⟨1/r⟩ and ⟨r⁻³⟩", self)
        self.moments_action.setCheckable(True)
        self.moments_action.toggled.connect(self.set_moment_columns)
        self.addAction(self.moments_action)
        self.set_moment_columns(False)
        copy = QAction("Copy table", self)
        copy.setShortcut(QKeySequence.StandardKey.Copy)
        copy.triggered.connect(self.copy_to_clipboard)
        self.addAction(copy)
        self.setContextMenuPolicy(Qt.ContextMenuPolicy.ActionsContextMenu)
        self._rows: list[SubshellSummary] = []
        self._series: list[str] = []
        self.horizontalHeader().moveSection(SERIES_COLUMN, 1)
        self.setColumnHidden(SERIES_COLUMN, True)
        self._units = ("bohr", "Eh")
        self.itemSelectionChanged.connect(self._on_selection)

    def show_rows(self, rows: list[SubshellSummary], selected: str, length_unit: str) -> None:
        """Fill the table with one series (atomic units converted for display); select ``selected``."""
        self.show_series([("", rows)], selected, length_unit)

    def show_series(self, series: list[tuple[str, list[SubshellSummary]]], selected: str,
                    length_unit: str) -> None:
        """Fill the table with several series: rows grouped by subshell, one per series.

        Parameters
        ----------
        series : list of (name, rows)
            Each series' name (shown in the Series column when there are two or more)
            and its subshell rows.
        selected : str
            Subshell whose (first) row is selected.
        length_unit : {"bohr", "angstrom"}
            Display units (Å and eV, or bohr and hartree).
        """
        # Grouped by subshell nl, so a series' j levels (2p1/2, 2p3/2) sit beside
        # another series' 2p.
        order = list(dict.fromkeys(row.subshell for _, rows in series for row in rows))
        placed = [(name, row) for subshell in order for name, rows in series
                  for row in rows if row.subshell == subshell]
        rows = [row for _, row in placed]
        self._series = [name for name, _ in placed]
        self.setColumnHidden(SERIES_COLUMN, len(series) < 2)
        self._rows = rows
        angstrom = length_unit == "angstrom"
        length = zeffir.core.ANGSTROM_PER_BOHR if angstrom else 1.0
        energy = zeffir.core.EV_PER_HARTREE if angstrom else 1.0
        self._units = ("Å", "eV") if angstrom else ("bohr", "Eh")
        lu, eu = self._units
        headers = ["Subshell", "Electrons", f"ζ / {lu}⁻¹", "Z_eff", "n*", f"⟨r⟩ / {lu}",
                   f"r_max / {lu}", f"ε / {eu}", f"⟨r²⟩ / {lu}²", f"⟨1/r⟩ / {lu}⁻¹",
                   f"⟨r⁻³⟩ / {lu}⁻³", "Series"]
        for column, text in enumerate(headers):
            header = self.horizontalHeaderItem(column)
            if header is not None:
                header.setText(text)
        self.blockSignals(True)
        self.setRowCount(len(rows))
        for i, row in enumerate(rows):
            cells = [row.label, occupancy_text(row.occupancy), _num(row.zeta / length), _num(row.z_eff),
                     _num(row.n_star, 1), _num(row.r_mean * length), _num(row.r_max * length),
                     _num(None if row.energy is None else row.energy * energy),
                     _num(_moment(row, 2) * length**2), _num(_moment(row, -1) / length),
                     _num(_moment(row, -3) / length**3), self._series[i]]
            for column, text in enumerate(cells):
                item = QTableWidgetItem(text)
                align = Qt.AlignmentFlag.AlignLeft if column == 0 else Qt.AlignmentFlag.AlignRight
                item.setTextAlignment(align | Qt.AlignmentFlag.AlignVCenter)
                if column == 0 and row.notes:
                    item.setToolTip("\n".join(row.notes))
                    item.setText(f"{text} *")
                if column == 7 and (row.energy_up is not None or row.energy_down is not None):
                    item.setToolTip("Kohn–Sham eigenvalue per spin: "
                                    f"ε↓ (majority) {_num(_scaled(row.energy_down, energy))}, "
                                    f"ε↑ {_num(_scaled(row.energy_up, energy))} {eu}")
                self.setItem(i, column, item)
            if row.subshell == selected and (i == 0 or rows[i - 1].subshell != selected):
                self.selectRow(i)
        self.blockSignals(False)

    def set_moment_columns(self, visible: bool) -> None:
        """Show or hide the ⟨r²⟩, ⟨1/r⟩ and ⟨r⁻³⟩ columns (also in the table's context menu)."""
        for column in MOMENT_COLUMNS:
            self.setColumnHidden(column, not visible)
        if self.moments_action.isChecked() != visible:
            self.moments_action.setChecked(visible)

    def select_subshell(self, label: str) -> None:
        """Select the row of ``label`` (if shown) without emitting ``subshell_selected``."""
        for i, row in enumerate(self._rows):
            if row.subshell == label:
                if self.currentRow() != i or not self.selectedIndexes():
                    self.blockSignals(True)
                    self.selectRow(i)
                    self.blockSignals(False)
                return

    def as_text(self) -> str:
        """The table as tab-separated text with a header row (what Copy puts on the clipboard)."""
        headers = [self.horizontalHeaderItem(c).text() for c in range(self.columnCount())]
        header = self.horizontalHeader()
        shown = [header.logicalIndex(v) for v in range(self.columnCount())
                 if not self.isColumnHidden(header.logicalIndex(v))]
        lines = ["\t".join(headers[c] for c in shown)]
        for r in range(self.rowCount()):
            cells = []
            for c in shown:
                item = self.item(r, c)
                cells.append(item.text().rstrip(" *") if item is not None else "")
            lines.append("\t".join(cells))
        return "\n".join(lines)

    def copy_to_clipboard(self) -> None:
        """Put :meth:`as_text` on the clipboard."""
        QGuiApplication.clipboard().setText(self.as_text())

    def _on_selection(self) -> None:
        rows = {index.row() for index in self.selectedIndexes()}
        if len(rows) == 1:
            row = rows.pop()
            if 0 <= row < len(self._rows):
                self.subshell_selected.emit(self._rows[row].subshell)


def _scaled(value: float | None, factor: float) -> float | None:
    return None if value is None else value * factor


def _num(value: float | None, digits: int = 4) -> str:
    return "—" if value is None or not math.isfinite(value) else f"{value:.{digits}f}"


def _moment(row: SubshellSummary, k: int) -> float:
    """⟨r^k⟩ of a row in atomic units; NaN where it is not finite (⟨r⁻³⟩ of s, shown as —)."""
    value = row.moments.get(k)
    return math.nan if value is None or not math.isfinite(value) else float(value)

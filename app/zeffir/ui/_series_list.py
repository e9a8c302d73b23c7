"""The further series of a comparison: up to four more atoms or models, each removable."""

from __future__ import annotations

from PySide6.QtCore import Signal
from PySide6.QtWidgets import QComboBox, QHBoxLayout, QPushButton, QToolButton, QVBoxLayout, QWidget

from zeffir.core import DEFAULT_MODEL, model_names
from zeffir.state import MAX_SERIES, Source
from zeffir.ui._atom_bar import SourceFields

__all__ = ["SeriesList"]

#: Further series after the main atom and the second series.
MAX_FURTHER = MAX_SERIES - 2


class SeriesList(QWidget):
    """Rows of (atom, model) for the series after the second; an empty atom follows the main one.

    Signals
    -------
    edited(tuple)
        The further series as :class:`~zeffir.state.Source` objects (spec ``""`` = the
        main atom), after a row was added, removed or changed. A row whose atom does
        not parse shows the parser's message and keeps its last valid value.
    """

    edited = Signal(object)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._sources: tuple[Source, ...] = ()
        self._rows: list[tuple[QWidget, SourceFields]] = []
        self._column = QVBoxLayout(self)
        self._column.setContentsMargins(0, 0, 0, 0)
        self._column.setSpacing(4)
        self.add_button = QPushButton("Add a series")
        self.add_button.setToolTip(f"Compare up to {MAX_SERIES} series in all (any mix of atoms and "
                                   "models); leave a series' atom empty to follow the Atom field")
        self.add_button.clicked.connect(self._add)
        self._column.addWidget(self.add_button)

    def sources(self) -> tuple[Source, ...]:
        """The further series as the rows show them."""
        return self._sources

    def show_sources(self, sources: tuple[Source, ...]) -> None:
        """Display ``sources`` without emitting (state-to-widget update)."""
        self._sources = tuple(sources)
        while len(self._rows) > len(sources):
            row, _ = self._rows.pop()
            self._column.removeWidget(row)
            row.hide()  # at once: deleteLater waits for the event loop
            row.setParent(None)
            row.deleteLater()
        while len(self._rows) < len(sources):
            self._append_row()
        for (_, fields), source in zip(self._rows, sources, strict=True):
            fields.show_source(source)
        self.add_button.setEnabled(len(sources) < MAX_FURTHER)

    def _append_row(self) -> None:
        number = len(self._rows) + 3  # the main atom is series 1, the Versus one series 2
        row = QWidget()
        layout = QHBoxLayout(row)
        layout.setContentsMargins(0, 0, 0, 0)
        fields = SourceFields(f"Series {number}", stacked=True, allow_empty=True)
        fields.spec_edit.setPlaceholderText("main atom")
        fields.spec_edit.setMinimumWidth(80)
        fields.message.setWordWrap(True)
        # The side panel is narrow: the model chooser may be narrower than its longest item.
        fields.model_box.setSizeAdjustPolicy(QComboBox.SizeAdjustPolicy.AdjustToMinimumContentsLengthWithIcon)
        fields.model_box.setMinimumContentsLength(10)
        remove = QToolButton()
        remove.setText("✕")
        remove.setToolTip(f"Remove series {number}")
        remove.setAccessibleName(f"Remove series {number}")
        layout.addWidget(fields, 1)
        layout.addWidget(remove)
        index = len(self._rows)
        fields.source_edited.connect(lambda source, i=index: self._changed(i, source))
        remove.clicked.connect(lambda _c=False, i=index: self._remove(i))
        self._rows.append((row, fields))
        self._column.insertWidget(self._column.count() - 1, row)

    def _add(self) -> None:
        if len(self._sources) >= MAX_FURTHER:
            return
        used = {s.model for s in self._sources}
        model = next((m for m in model_names() if m not in used), DEFAULT_MODEL)
        self._emit((*self._sources, Source("", model)))

    def _remove(self, index: int) -> None:
        if 0 <= index < len(self._sources):
            self._emit(self._sources[:index] + self._sources[index + 1:])

    def _changed(self, index: int, source: Source) -> None:
        if 0 <= index < len(self._sources):
            self._emit((*self._sources[:index], source, *self._sources[index + 1:]))

    def _emit(self, sources: tuple[Source, ...]) -> None:
        self.show_sources(sources)
        self.edited.emit(sources)

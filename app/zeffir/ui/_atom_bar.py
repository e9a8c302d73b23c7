"""The strip at the top of the window: atom field, model chooser and orbital chooser."""

from __future__ import annotations

from PySide6.QtCore import Qt, QTimer, Signal
from PySide6.QtWidgets import (
    QComboBox,
    QGridLayout,
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QToolButton,
    QWidget,
)

from zeffir.core import ZeffirError, get_model, model_names, parse_spec
from zeffir.core.orbitals import real_labels
from zeffir.state import OrbitalChoice, Source
from zeffir.ui._element_chooser import ElementChooser

__all__ = ["AtomBar", "SourceFields"]

SPEC_TIP = (
    "Atom or ion, optionally with a configuration in trade notation:\n"
    "Fe · 26 · Fe3+ · O2- · C 1s2 2s1 2p3 · Na [Ne] 4d1 · He+ 2p1\n"
    "An explicit configuration replaces the ground one; occupancy 1 may be omitted."
)


class SourceFields(QWidget):
    """An atom field validated as the user types, and a model chooser.

    Signals
    -------
    source_edited(Source)
        A valid spec or a new model was entered (typing is debounced by 250 ms;
        Return commits at once). An invalid spec shows the parser's message beside
        the field and emits nothing, so the last valid state stays on screen.
    resubmitted(Source)
        Return was pressed on the spec already in the state (a request to retry).

    With ``element_chooser``, a small button beside the field opens the periodic table
    (:class:`ElementChooser`); the element clicked is entered as if typed and followed
    by Return. It is offered on the main atom strip only: the side panel's rows are too
    narrow for a third control beside the field.
    """

    source_edited = Signal(object)
    resubmitted = Signal(object)

    def __init__(self, caption: str, parent: QWidget | None = None, stacked: bool = False,
                 allow_empty: bool = False, element_chooser: bool = False) -> None:
        super().__init__(parent)
        # Made on the first click: the window's start-up does not pay for 118 buttons.
        self.chooser: ElementChooser | None = None
        self.chooser_button: QToolButton | None = None
        if element_chooser:
            self.chooser_button = QToolButton()
            self.chooser_button.setObjectName("elementChooserButton")
            self.chooser_button.setText("Table…")
            self.chooser_button.setToolTip("Choose an element from the periodic table")
            self.chooser_button.setAccessibleName("Choose an element from the periodic table")
            self.chooser_button.clicked.connect(self.open_chooser)
        self._source = Source()
        # An empty field is a valid choice where it means "the main atom" (further series).
        self._allow_empty = allow_empty
        self.spec_edit = QLineEdit()
        self.spec_edit.setPlaceholderText("e.g. Fe3+ or C 1s2 2s1 2p3")
        self.spec_edit.setToolTip(SPEC_TIP)
        self.spec_edit.setMinimumWidth(220)
        self.spec_edit.setClearButtonEnabled(True)
        self.model_box = QComboBox()
        for name in model_names():
            self.model_box.addItem(get_model(name).title, name)
            index = self.model_box.count() - 1
            self.model_box.setItemData(index, f"{name}: {get_model(name).reference}",
                                       Qt.ItemDataRole.ToolTipRole)
        self.model_box.setToolTip("Model that turns the configuration into orbitals")
        self.message = QLabel()
        self.message.setObjectName("specMessage")
        self.message.setStyleSheet("color: #b00020;")
        self.message.setWordWrap(False)
        self._debounce = QTimer(self)
        self._debounce.setSingleShot(True)
        self._debounce.setInterval(250)
        self._debounce.timeout.connect(self._commit)
        label = QLabel(caption)
        label.setBuddy(self.spec_edit)
        model_label = QLabel("Model")
        model_label.setBuddy(self.model_box)
        # Named here, not only by the window's pass over its labels: rows made later
        # (further series) are named too.
        self.spec_edit.setAccessibleName(caption)
        self.model_box.setAccessibleName("Model")
        if stacked:
            # For narrow places (the side panel): the model chooser gets its own row, so
            # long model names stay readable.
            grid = QGridLayout(self)
            grid.setContentsMargins(0, 0, 0, 0)
            grid.addWidget(label, 0, 0)
            grid.addWidget(self.spec_edit, 0, 1)
            if self.chooser_button is not None:
                grid.addWidget(self.chooser_button, 0, 2)
            grid.addWidget(model_label, 1, 0)
            grid.addWidget(self.model_box, 1, 1, 1, 2)
            grid.addWidget(self.message, 2, 0, 1, 3)
            grid.setColumnStretch(1, 1)
        else:
            layout = QHBoxLayout(self)
            layout.setContentsMargins(0, 0, 0, 0)
            layout.addWidget(label)
            layout.addWidget(self.spec_edit, 2)
            if self.chooser_button is not None:
                layout.addWidget(self.chooser_button)
            layout.addWidget(model_label)
            layout.addWidget(self.model_box)
            layout.addWidget(self.message, 3)
        self.spec_edit.textEdited.connect(self._on_text)
        self.spec_edit.returnPressed.connect(self._on_return)
        self.model_box.activated.connect(lambda _index: self._commit())

    def show_source(self, source: Source) -> None:
        """Display ``source`` without emitting (model-to-widget update)."""
        self._source = source
        for widget in (self.spec_edit, self.model_box):
            widget.blockSignals(True)
        if self.spec_edit.text().strip() != source.spec or not self.message.text():
            if self.spec_edit.text().strip() != source.spec:
                self.spec_edit.setText(source.spec)
        index = self.model_box.findData(source.model)
        if index >= 0:
            self.model_box.setCurrentIndex(index)
        for widget in (self.spec_edit, self.model_box):
            widget.blockSignals(False)

    def open_chooser(self) -> ElementChooser:
        """Open the periodic table (made on first use), focused on the current element."""
        if self.chooser is None:
            self.chooser = ElementChooser(self)
            self.chooser.chosen.connect(self._on_element_chosen)
        try:
            self.chooser.focus_element(parse_spec(self.spec_edit.text()).element.symbol)
        except ZeffirError:
            pass  # an empty or invalid field: no element to start from
        # open(), not exec(): window-modal without a nested event loop.
        self.chooser.open()
        return self.chooser

    def _on_element_chosen(self, symbol: str) -> None:
        self.spec_edit.setText(symbol)
        self.spec_edit.setFocus(Qt.FocusReason.OtherFocusReason)
        self._on_return()  # exactly what Return in the field does

    def error_text(self) -> str:
        """The parser's message currently shown, or '' when the field is valid."""
        return self.message.text()

    def _on_text(self, text: str) -> None:
        if self._validate(text):
            self._debounce.start()
        else:
            self._debounce.stop()

    def _validate(self, text: str) -> bool:
        if self._allow_empty and not text.strip():
            self.message.clear()
            self.message.setToolTip("")
            return True
        try:
            parse_spec(text)
        except ZeffirError as error:
            self.message.setText(str(error))
            self.message.setToolTip(f"{error}\nThe view keeps showing the last valid atom.")
            return False
        self.message.clear()
        self.message.setToolTip("")
        return True

    def _on_return(self) -> None:
        if not self._commit():
            source = Source(self.spec_edit.text().strip(), str(self.model_box.currentData()))
            if source == self._source:
                self.resubmitted.emit(source)

    def _commit(self) -> bool:
        """Emit the typed source if it is valid and new; True when it was emitted."""
        self._debounce.stop()
        text = self.spec_edit.text().strip()
        if not self._validate(text):
            return False
        source = Source(text, str(self.model_box.currentData()))
        if source != self._source:
            self._source = source
            self.source_edited.emit(source)
            return True
        return False


class AtomBar(QWidget):
    """Atom field and model chooser, followed by the orbital chooser.

    Signals
    -------
    source_edited(Source), resubmitted(Source)
        See :class:`SourceFields`.
    orbital_edited(OrbitalChoice)
        The user picked another subshell or orbital.
    """

    source_edited = Signal(object)
    resubmitted = Signal(object)
    orbital_edited = Signal(object)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.source_fields = SourceFields("Atom", element_chooser=True)
        self.subshell_box = QComboBox()
        self.subshell_box.setToolTip("Subshell shown in the slice and highlighted in the radial view")
        self.orbital_box = QComboBox()
        self.orbital_box.setToolTip(
            "Real orbitals (px, dxy, ... : cos/sin combinations) or complex ones with a definite m "
            "(Condon–Shortley phase)"
        )
        self.orbital_box.setMinimumContentsLength(10)
        layout = QHBoxLayout(self)
        layout.setContentsMargins(6, 4, 6, 4)
        layout.addWidget(self.source_fields, 5)
        layout.addSpacing(12)
        layout.addWidget(QLabel("Orbital"))
        layout.addWidget(self.subshell_box)
        layout.addWidget(self.orbital_box)
        self.source_fields.source_edited.connect(self.source_edited)
        self.source_fields.resubmitted.connect(self.resubmitted)
        self.subshell_box.activated.connect(lambda _i: self._emit_orbital(reset_m=True))
        self.orbital_box.activated.connect(lambda _i: self._emit_orbital(reset_m=False))

    def show_state(self, source: Source, orbital: OrbitalChoice) -> None:
        """Display a source and orbital choice without emitting."""
        self.source_fields.show_source(source)
        if (source.spec, orbital) == getattr(self, "_shown", None):
            return
        self._shown = (source.spec, orbital)
        configuration = parse_spec(source.spec)
        for box in (self.subshell_box, self.orbital_box):
            box.blockSignals(True)
        self.subshell_box.clear()
        for sub, occ in configuration.occupations:
            self.subshell_box.addItem(f"{sub.label}  ({occ})", sub.label)
        self.subshell_box.setCurrentIndex(max(self.subshell_box.findData(orbital.subshell), 0))
        l = "spdfghi".index(orbital.subshell[-1])
        self.orbital_box.clear()
        for label, m in real_labels(l):
            self.orbital_box.addItem(f"{orbital.subshell[:-1]}{label}", f"real:{m}")
        if l > 0:
            for m in range(-l, l + 1):
                self.orbital_box.addItem(f"m = {m:+d}" if m else "m = 0", f"complex:{m}")
        index = self.orbital_box.findData(f"{orbital.kind}:{orbital.m}")
        self.orbital_box.setCurrentIndex(max(index, 0))
        for box in (self.subshell_box, self.orbital_box):
            box.blockSignals(False)

    def _emit_orbital(self, reset_m: bool) -> None:
        subshell = str(self.subshell_box.currentData())
        kind, _, m = str(self.orbital_box.currentData() or "real:0").partition(":")
        if reset_m:
            kind, m = "real", 0
        self.orbital_edited.emit(OrbitalChoice(subshell, kind, int(m)))

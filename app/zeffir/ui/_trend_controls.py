"""The side panel's Trends group: quantity, subshell, which configurations, models, methods."""

from __future__ import annotations

from dataclasses import replace

from PySide6.QtCore import Signal
from PySide6.QtWidgets import (
    QCheckBox,
    QComboBox,
    QFormLayout,
    QGridLayout,
    QGroupBox,
    QLabel,
    QLineEdit,
    QWidget,
)

from zeffir.core import ZeffirError, get_model, model_names
from zeffir.core.trends import ATOM_QUANTITIES, SUBSHELL_QUANTITIES, parse_rule
from zeffir.state import StateError, TrendSettings

__all__ = ["RULE_EXAMPLES", "TrendControls"]

#: Rules offered in the rule box's list (any other may be typed).
RULE_EXAMPLES: tuple[tuple[str, str], ...] = (
    ("Z=1-36", "H … Kr"),
    ("Z=1-54", "H … Xe"),
    ("Z=1-86", "H … Rn"),
    ("Z=1-118", "H … Og"),
    ("Z=21-30", "the 3d row, Sc … Zn"),
    ("Z=57-71", "the lanthanides"),
    ("isoelectronic=2:Z=1-10", "two electrons, H⁻ … Ne⁸⁺"),
    ("isoelectronic=10:Z=10-20", "ten electrons, Ne … Ca¹⁰⁺"),
    ("family=[Ar] 3dn 4s2:n=1-10", "[Ar] 3dⁿ 4s², Sc … Zn"),
    ("Li,Na,K,Rb,Cs", "the alkali metals"),
)
_METHODS = (("koopmans", "Koopmans (−ε of the outermost subshell)"),
            ("delta-scf", "ΔSCF (E(ion) − E(atom))"))


class TrendControls(QGroupBox):
    """Edits :class:`~zeffir.state.TrendSettings`.

    A rule or subshell that does not parse shows its message under the box and emits
    nothing, so the trend on screen stays.

    Signals
    -------
    trends_edited(TrendSettings)
    """

    trends_edited = Signal(object)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__("Trends", parent)
        self._settings = TrendSettings()
        form = QFormLayout(self)
        self.quantity = QComboBox()
        for name, kind in (*SUBSHELL_QUANTITIES.items(), *ATOM_QUANTITIES.items()):
            if name == "<r^0>":
                continue  # identically 1
            self.quantity.addItem(f"{name} — {kind.title}", name)
        self.quantity.setToolTip("The quantity plotted against Z or along the list")
        form.addRow("Quantity", self.quantity)
        self.subshell = QLineEdit()
        self.subshell.setPlaceholderText("valence, or e.g. 3d")
        self.subshell.setToolTip("Per-subshell quantities: a subshell such as 3d, or 'valence', the "
                                 "outermost occupied one (largest n, then l)")
        form.addRow("Subshell", self.subshell)
        self.rule = QComboBox()
        self.rule.setEditable(True)
        for rule, words in RULE_EXAMPLES:
            self.rule.addItem(rule)
            self.rule.setItemData(self.rule.count() - 1, words)
        self.rule.setToolTip("Which configurations: Z=a-b (neutral atoms), isoelectronic=N:Z=a-b, "
                             "family=[Ar] 3dn 4s2:n=1-10, or specs separated by commas; Return applies")
        form.addRow("Over", self.rule)
        self.message = QLabel()
        self.message.setWordWrap(True)
        self.message.setStyleSheet("color: #b00020;")
        form.addRow(self.message)
        models = QWidget()
        grid = QGridLayout(models)
        grid.setContentsMargins(0, 0, 0, 0)
        self.models: dict[str, QCheckBox] = {}
        for index, name in enumerate(model_names()):
            box = QCheckBox(name)
            box.setToolTip(get_model(name).title)
            grid.addWidget(box, index // 2, index % 2)
            self.models[name] = box
            box.toggled.connect(lambda _on: self._emit())
        form.addRow("Models", models)
        self.methods: dict[str, QCheckBox] = {}
        methods = QWidget()
        column = QGridLayout(methods)
        column.setContentsMargins(0, 0, 0, 0)
        for row, (name, words) in enumerate(_METHODS):
            box = QCheckBox(words)
            column.addWidget(box, row, 0)
            self.methods[name] = box
            box.toggled.connect(lambda _on: self._emit())
        self.methods_label = QLabel("Ionization")
        form.addRow(self.methods_label, methods)
        self._methods_row = methods
        self.quantity.activated.connect(lambda _i: self._emit())
        self.subshell.returnPressed.connect(self._emit)
        self.subshell.editingFinished.connect(self._emit)
        self.rule.lineEdit().returnPressed.connect(self._emit)
        self.rule.activated.connect(lambda _i: self._emit())

    def show_settings(self, settings: TrendSettings) -> None:
        """Display ``settings`` without emitting."""
        self._settings = settings
        widgets = [self.quantity, self.subshell, self.rule, *self.models.values(), *self.methods.values()]
        for widget in widgets:
            widget.blockSignals(True)
        self.quantity.setCurrentIndex(max(0, self.quantity.findData(settings.quantity)))
        if not self.message.text():
            self.subshell.setText(settings.subshell)
            self.rule.setEditText(settings.rule)
        chosen = set(settings.model_list())
        for name, box in self.models.items():
            box.setChecked(name in chosen)
        methods = set(settings.method_list())
        for name, box in self.methods.items():
            box.setChecked(name in methods)
        self._show_relevant(settings.quantity)
        for widget in widgets:
            widget.blockSignals(False)

    def _show_relevant(self, quantity: str) -> None:
        ionization = quantity == "ionization_energy"
        self.methods_label.setVisible(ionization)
        self._methods_row.setVisible(ionization)
        self.subshell.setEnabled(quantity in SUBSHELL_QUANTITIES or ionization)

    def _emit(self) -> None:
        quantity = str(self.quantity.currentData())
        self._show_relevant(quantity)
        rule = self.rule.currentText().strip()
        try:
            parse_rule(rule)
        except ZeffirError as error:
            self.message.setText(f"Over: {error}")
            return
        models = ",".join(name for name, box in self.models.items() if box.isChecked())
        methods = ",".join(name for name, box in self.methods.items() if box.isChecked())
        if not models:
            self.message.setText("Models: tick at least one model")
            return
        if not methods and quantity == "ionization_energy":
            self.message.setText("Ionization: tick Koopmans, ΔSCF or both")
            return
        settings = replace(self._settings, quantity=quantity, rule=rule,
                           subshell=self.subshell.text().strip() or "valence",
                           models=models, methods=methods or self._settings.methods)
        try:
            settings.check()
        except StateError as error:
            self.message.setText(str(error))
            return
        self.message.clear()
        if settings != self._settings:
            self._settings = settings
            self.trends_edited.emit(settings)

"""The Colour group of the side panel: limits, log scale and colour maps of the image views.

The slice, pair and two-electron views each keep their own
:class:`~zeffir.state.ColourSettings`; this group edits the one of the view shown
(:func:`zeffir.scene.colour_subject` says which, and what the quantity is).
"""

from __future__ import annotations

import math
import re
from dataclasses import replace
from typing import Final

from PySide6.QtCore import QTimer, Signal
from PySide6.QtGui import QValidator
from PySide6.QtWidgets import (
    QCheckBox,
    QComboBox,
    QDoubleSpinBox,
    QFormLayout,
    QGroupBox,
    QLabel,
    QWidget,
)

from zeffir.scene import MAP_TITLES, ColourSubject, SliceScene, colour_subject, length_factor, unit_text
from zeffir.state import DIVERGING_MAP_NAMES, SEQUENTIAL_MAP_NAMES, ViewState

__all__ = ["ColourControls", "ValueBox"]

_LIMIT_CHOICES: Final = (
    ("robust", "Robust (99.5th percentile)",
     "The scale ends at the 99.5th percentile of |value|, so a nuclear cusp does not wash out "
     "the outer region; saturated pixels show the end colour"),
    ("extremes", "Extremes (full range)", "The scale spans the smallest to the largest value"),
    ("manual", "Manual (Low to High)",
     "The scale spans the values typed under Low and High, in the units shown"),
)
#: What the boxes may hold, in display units (the state stores atomic units).
_VALUE_LIMIT: Final = 1e30
_NUMBER: Final = re.compile(r"^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$")
_PARTIAL: Final = re.compile(r"^[+-]?(\d*\.?\d*)([eE][+-]?\d*)?$")


class ValueBox(QDoubleSpinBox):
    """A spin box for values over many decades: four significant digits, ``1e-3`` accepted.

    The value keeps full precision (the box rounds to 300 decimals, not to what it
    shows); the arrows step by a tenth of the value's magnitude.
    """

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setDecimals(300)
        self.setRange(-_VALUE_LIMIT, _VALUE_LIMIT)
        self.setKeyboardTracking(False)

    def textFromValue(self, value: float) -> str:  # Qt override
        """Four significant digits (e-notation for very small or large values)."""
        return f"{value:.4g}"

    def _number_text(self, text: str) -> str:
        return text.removeprefix(self.prefix()).removesuffix(self.suffix()).strip().replace("−", "-")

    def valueFromText(self, text: str) -> float:  # Qt override
        """The number typed (the unit suffix left out)."""
        try:
            return float(self._number_text(text))
        except ValueError:
            return self.value()

    def validate(self, text: str, pos: int) -> object:  # Qt override
        """Accept plain and e-notation numbers inside the range; partial ones while typing."""
        number = self._number_text(text)
        if _NUMBER.match(number):
            value = float(number)
            if math.isfinite(value) and abs(value) <= _VALUE_LIMIT:
                return QValidator.State.Acceptable, text, pos
            return QValidator.State.Invalid, text, pos
        if _PARTIAL.match(number):
            return QValidator.State.Intermediate, text, pos
        return QValidator.State.Invalid, text, pos

    def fixup(self, text: str) -> str:  # Qt override
        """An unfinished entry goes back to the value shown before."""
        return self.textFromValue(self.value()) + self.suffix()

    def stepBy(self, steps: int) -> None:  # Qt override
        """Step by a tenth of the value's magnitude (0.1 from zero)."""
        value = self.value()
        self.setValue(value + 0.1 * steps * (abs(value) if value else 1.0))


class ColourControls(QGroupBox):
    """Limits (robust, extremes, manual), log scale and colour map of the current image view.

    Low and High are values of the quantity shown, in the chosen length unit
    (bohr⁻³, Å⁻³, bohr⁻³ᐟ²...); the state keeps atomic units. Outside Manual they
    show, disabled, the limits the picture was drawn with (see :meth:`show_drawn`),
    so choosing Manual starts from the picture on screen. For a signed quantity the
    scale stays symmetric: Low follows High (−High). A Low that is not below High is
    refused with a message next to the boxes, and nothing is emitted.

    Signals
    -------
    colour_edited(str, ColourSettings)
        The state field (``"slice"``, ``"pair"`` or ``"two_electron"``) and its new
        colour settings.
    """

    colour_edited = Signal(str, object)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__("Colour", parent)
        self._state = ViewState()
        self._subject: ColourSubject | None = None
        # (field, quantity, signed, log) → (low, high) drawn, atomic units
        self._drawn: dict[tuple[str, str, bool, bool], tuple[float, float]] = {}
        form = QFormLayout(self)
        self.limits = QComboBox()
        for key, text, tip in _LIMIT_CHOICES:
            self.limits.addItem(text, key)
            self.limits.setItemData(self.limits.count() - 1, tip, 3)  # 3: Qt.ToolTipRole
        self.limits.setToolTip("Where the colour scale ends")
        self.colour_low = ValueBox()
        self.colour_high = ValueBox()
        self.colour_low.setToolTip(
            "Bottom of the colour scale, a value of the quantity shown (Manual only).\n"
            "On a logarithmic scale a Low at or below zero means: Decades below High.")
        self.colour_high.setToolTip("Top of the colour scale, a value of the quantity shown "
                                    "(Manual only); a signed quantity spans −High to High")
        self.colour_message = QLabel()
        self.colour_message.setWordWrap(True)
        self.colour_message.setStyleSheet("color: #b00020;")
        self.colour_message.hide()
        self.log_scale = QCheckBox("Logarithmic colour scale")
        self.log_scale.setToolTip("For quantities without a sign: colours show log₁₀ of the value")
        self.log_decades = QDoubleSpinBox()
        self.log_decades.setRange(1.0, 16.0)
        self.log_decades.setSingleStep(1.0)
        self.log_decades.setDecimals(1)
        self.log_decades.setSuffix(" decades")
        self.log_decades.setKeyboardTracking(False)
        self.log_decades.setToolTip("How many decades below the top a logarithmic colour scale shows")
        self.colour_map = QComboBox()
        self.colour_map.setToolTip("Standard scientific colour maps: perceptually uniform ones for "
                                   "densities, diverging ones (symmetric about zero) for signed values")
        self.difference_map = QComboBox()
        self.difference_map.setToolTip("The diverging map of the difference panel (signed)")
        self._difference_label = QLabel("Difference map")
        form.addRow("Limits", self.limits)
        form.addRow("Low", self.colour_low)
        form.addRow("High", self.colour_high)
        form.addRow(self.colour_message)
        form.addRow(self.log_scale)
        form.addRow("Decades", self.log_decades)
        form.addRow("Colour map", self.colour_map)
        form.addRow(self._difference_label, self.difference_map)
        for widget, name in ((self.limits, "Limits"), (self.colour_low, "Low"),
                             (self.colour_high, "High"), (self.log_decades, "Decades"),
                             (self.colour_map, "Colour map"), (self.difference_map, "Difference map")):
            widget.setAccessibleName(name)
        self._timer = QTimer(self)
        self._timer.setSingleShot(True)
        self._timer.setInterval(60)
        self._timer.timeout.connect(self._emit)
        self.limits.activated.connect(lambda _i: self._emit())
        self.log_scale.toggled.connect(lambda _b: self._emit())
        self.colour_map.activated.connect(lambda _i: self._emit())
        self.difference_map.activated.connect(lambda _i: self._emit())
        for box in (self.colour_low, self.colour_high, self.log_decades):
            box.valueChanged.connect(lambda _v: self._timer.start())

    def _widgets(self) -> tuple[QWidget, ...]:
        return (self.limits, self.colour_low, self.colour_high, self.log_scale, self.log_decades,
                self.colour_map, self.difference_map)

    # -- state → widgets --------------------------------------------------------------
    def show_state(self, state: ViewState) -> None:
        """Show the colour settings of ``state``'s current view (signals blocked); hide otherwise."""
        self._state = state
        subject = colour_subject(state)
        if subject != self._subject:
            self._set_message("")
        self._subject = subject
        if subject is None:
            return
        c = subject.colour
        widgets = self._widgets()
        for widget in widgets:
            widget.blockSignals(True)
        self.limits.setCurrentIndex(self.limits.findData(c.limits))
        manual = c.limits == "manual"
        suffix = f" {unit_text(state.length_unit, subject.length_power)}"
        for box in (self.colour_low, self.colour_high):
            box.setSuffix(suffix)
        self._show_limits()
        self.colour_low.setEnabled(manual and not subject.signed)
        self.colour_high.setEnabled(manual)
        self.log_scale.setChecked(c.log_scale)
        self.log_scale.setEnabled(not subject.signed)
        self.log_decades.setValue(c.log_decades)
        self.log_decades.setEnabled(c.log_scale and not subject.signed)
        names = DIVERGING_MAP_NAMES if subject.signed else SEQUENTIAL_MAP_NAMES
        _fill(self.colour_map, names, c.diverging_map if subject.signed else c.sequential_map)
        difference = subject.difference and not subject.signed
        _fill(self.difference_map, DIVERGING_MAP_NAMES, c.diverging_map)
        self.difference_map.setVisible(difference)
        self._difference_label.setVisible(difference)
        for widget in widgets:
            widget.blockSignals(False)

    def _show_limits(self) -> None:
        """Low and High: the manual limits, or (disabled) those the picture was drawn with."""
        subject = self._subject
        if subject is None:
            return
        c = subject.colour
        factor = length_factor(self._state.length_unit, subject.length_power)
        low, high = (c.low, c.high) if c.limits == "manual" else self._drawn.get(
            _drawn_key(subject), (c.low, c.high))
        if subject.signed:
            low = -high
        for box, value in ((self.colour_low, low), (self.colour_high, high)):
            was = box.signalsBlocked()
            box.blockSignals(True)
            box.setValue(value * factor)
            box.blockSignals(was)

    def show_drawn(self, view: str, scene: SliceScene) -> None:
        """Remember the limits ``view``'s picture was drawn with (shown outside Manual).

        Parameters
        ----------
        view : {"slice", "pair", "two-electron"}
        scene : SliceScene
            The view's first panel (its :attr:`~zeffir.scene.SliceScene.value_limits`).
        """
        limits = scene.value_limits
        if not all(math.isfinite(v) for v in limits):
            return
        key = (view.replace("-", "_"), scene.quantity, scene.signed, scene.log_scale)
        self._drawn[key] = (float(limits[0]), float(limits[1]))
        subject = self._subject
        if subject is not None and _drawn_key(subject) == key and subject.colour.limits != "manual":
            self._show_limits()

    def message(self) -> str:
        """The message about the typed limits ('' when they are fine)."""
        return self.colour_message.text()

    def _set_message(self, text: str) -> None:
        self.colour_message.setText(text)
        self.colour_message.setVisible(bool(text))

    # -- widgets → state --------------------------------------------------------------
    def _emit(self) -> None:
        self._timer.stop()
        subject = self._subject
        if subject is None:
            return
        c = subject.colour
        limits = str(self.limits.currentData())
        low, high = c.low, c.high
        if limits == "manual":
            factor = length_factor(self._state.length_unit, subject.length_power)
            high = _typed(self.colour_high, c.high, factor)
            low = -high if subject.signed else _typed(self.colour_low, c.low, factor)
            if not high > 0:
                self._set_message("High must be above zero.")
                return
            if not low < high:
                self._set_message(f"Low must be below High (Low {self.colour_low.text()}, "
                                  f"High {self.colour_high.text()}); the picture keeps its last scale.")
                return
        self._set_message("")
        chosen = str(self.colour_map.currentData() or "")
        diverging = chosen if subject.signed else str(self.difference_map.currentData() or c.diverging_map)
        sequential = c.sequential_map if subject.signed else chosen
        new = replace(c, limits=limits, low=low, high=high,  # type: ignore[arg-type]
                      log_scale=self.log_scale.isChecked() if not subject.signed else c.log_scale,
                      log_decades=self.log_decades.value(),
                      sequential_map=sequential or c.sequential_map,
                      diverging_map=diverging or c.diverging_map)
        if new != c:
            self.colour_edited.emit(subject.field, new)


def _drawn_key(subject: ColourSubject) -> tuple[str, str, bool, bool]:
    return (subject.field, subject.quantity, subject.signed,
            subject.colour.log_scale and not subject.signed)


def _typed(box: ValueBox, stored: float, factor: float) -> float:
    """The box's value in atomic units; the stored value itself if the box still shows it."""
    shown = stored * factor
    if abs(box.value() - shown) <= 1e-12 * max(abs(shown), 1e-300):
        return stored
    return box.value() / factor


def _fill(box: QComboBox, names: tuple[str, ...], current: str) -> None:
    """List ``names`` (with their descriptions) and select ``current``."""
    if tuple(box.itemData(i) for i in range(box.count())) != names:
        box.clear()
        for name in names:
            box.addItem(MAP_TITLES.get(name, name), name)
    box.setCurrentIndex(max(box.findData(current), 0))

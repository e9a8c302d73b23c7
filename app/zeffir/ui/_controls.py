"""Side-panel controls: radial settings, slice settings, units and the comparison."""

from __future__ import annotations

from dataclasses import replace

from PySide6.QtCore import QTimer, Signal
from PySide6.QtWidgets import (
    QCheckBox,
    QComboBox,
    QDoubleSpinBox,
    QFormLayout,
    QGroupBox,
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QSpinBox,
    QVBoxLayout,
    QWidget,
)

import zeffir.core
from zeffir.core import ZeffirError, parse_spec
from zeffir.scene import QUANTITIES, SliceScene
from zeffir.state import MAX_VIEW_RESOLUTION, ColourSettings, CompareSettings, ViewState
from zeffir.ui._atom_bar import SourceFields
from zeffir.ui._colour_controls import ColourControls
from zeffir.ui._series_list import SeriesList
from zeffir.ui._trend_controls import TrendControls
from zeffir.ui._wheel_guard import guard_wheel

__all__ = ["ViewControls"]

_RADIAL_CHOICES = (("D", "Radial distribution r²R²"), ("R", "Radial function R(r)"),
                   ("P", "P(r) = rR(r)"), ("Q", "Cumulative charge Q(r)"))
_SLICE_CHOICES = (("psi", "Orbital ψ (signed)"), ("psi2", "Orbital density |ψ|²"),
                  ("density", "Total density ρ"))


# Ranges of the length boxes, in bohr (shown converted when the unit is Å).
_OFFSET_RANGE = (-100.0, 100.0)
_EXTENT_RANGE = (0.05, 200.0)
_REFERENCE_RANGE = (-200.0, 200.0)


def _shrinkable(box: QComboBox, characters: int = 14) -> QComboBox:
    """Let a combo box be narrower than its longest item (the panel has a fixed width)."""
    box.setSizeAdjustPolicy(QComboBox.SizeAdjustPolicy.AdjustToMinimumContentsLengthWithIcon)
    box.setMinimumContentsLength(characters)
    return box


def _combo(choices: tuple[tuple[str, str], ...]) -> QComboBox:
    box = _shrinkable(QComboBox())
    for key, text in choices:
        box.addItem(text, key)
        box.setItemData(box.count() - 1, QUANTITIES[key].formula if key in QUANTITIES else text, 3)
    return box


def _spin(low: float, high: float, step: float, decimals: int, suffix: str) -> QDoubleSpinBox:
    spin = QDoubleSpinBox()
    spin.setRange(low, high)
    spin.setSingleStep(step)
    spin.setDecimals(decimals)
    spin.setSuffix(suffix)
    spin.setKeyboardTracking(False)
    return spin


class ViewControls(QWidget):
    """Edits the radial, slice, unit and comparison parts of the state.

    Spin-box bursts are coalesced (60 ms) before anything is emitted.

    Signals
    -------
    radial_edited(RadialSettings), slice_edited(SliceSettings), units_edited(str),
    compare_edited(CompareSettings)
        The edited part, to be written back into the state.
    """

    radial_edited = Signal(object)
    slice_edited = Signal(object)
    units_edited = Signal(str)
    compare_edited = Signal(object)
    pair_edited = Signal(object)
    two_electron_edited = Signal(object)
    trends_edited = Signal(object)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._state = ViewState()
        self._length_scale = 1.0
        layout = QVBoxLayout(self)
        layout.setContentsMargins(4, 4, 4, 4)
        layout.addWidget(self._build_units())
        self.radial_box = self._build_radial()
        self.slice_box = self._build_slice()
        self.compare_box = self._build_compare()
        self.pair_box = self._build_pair()
        self.two_electron_box = self._build_two_electron()
        self.trends_box = TrendControls()
        self.trends_box.trends_edited.connect(self.trends_edited)
        # Limits, log scale and colour map of the slice, pair and two-electron views.
        self.colour_box = ColourControls()
        self.colour_box.colour_edited.connect(self._emit_colour)
        self.log_scale = self.colour_box.log_scale
        self.log_decades = self.colour_box.log_decades
        for box in (self.radial_box, self.slice_box, self.compare_box, self.pair_box,
                    self.two_electron_box, self.trends_box, self.colour_box):
            layout.addWidget(box)
        layout.addStretch(1)
        self._slice_timer = QTimer(self)
        self._slice_timer.setSingleShot(True)
        self._slice_timer.setInterval(60)
        self._slice_timer.timeout.connect(self._emit_slice)
        guard_wheel(self)

    # -- construction ---------------------------------------------------------------
    def _build_units(self) -> QGroupBox:
        box = QGroupBox("Units")
        row = QHBoxLayout(box)
        self.units = _shrinkable(QComboBox())
        self.units.addItem("bohr and hartree (atomic units)", "bohr")
        self.units.addItem("angstrom and eV", "angstrom")
        self.units.setToolTip("Display units; all computation is in atomic units")
        row.addWidget(self.units)
        self.units.activated.connect(lambda _i: self.units_edited.emit(str(self.units.currentData())))
        return box

    def _build_radial(self) -> QGroupBox:
        box = QGroupBox("Radial curves")
        form = QFormLayout(box)
        self.radial_quantity = _combo(_RADIAL_CHOICES)
        self.weighted = QCheckBox("Weight by occupancy")
        self.weighted.setToolTip("Multiply D(r) and Q(r) by the electrons in each subshell")
        self.show_subshells = QCheckBox("Each subshell")
        self.show_total = QCheckBox("Whole atom")
        self.show_markers = QCheckBox("Mark r_max, ⟨r⟩ and nodes")
        self.log_r = QCheckBox("Logarithmic r")
        form.addRow("Show", self.radial_quantity)
        for widget in (self.weighted, self.show_subshells, self.show_total, self.show_markers,
                       self.log_r):
            form.addRow(widget)
            widget.toggled.connect(self._emit_radial)
        self.radial_quantity.activated.connect(lambda _i: self._emit_radial())
        return box

    def _build_slice(self) -> QGroupBox:
        box = QGroupBox("Slice")
        form = QFormLayout(box)
        self.slice_quantity = _combo(_SLICE_CHOICES)
        self.plane = _shrinkable(QComboBox())
        for key, text in (("xy", "xy (z = offset)"), ("xz", "xz (y = offset)"),
                          ("yz", "yz (x = offset)"), ("custom", "normal vector…")):
            self.plane.addItem(text, key)
        self.normal = [_spin(-1.0, 1.0, 0.1, 3, "") for _ in range(3)]
        normal_row = QWidget()
        normal_layout = QHBoxLayout(normal_row)
        normal_layout.setContentsMargins(0, 0, 0, 0)
        for spin in self.normal:
            spin.setMinimumWidth(56)
            normal_layout.addWidget(spin)
        self.offset = _spin(*_OFFSET_RANGE, 0.1, 3, " bohr")
        self.offset.setToolTip("Signed distance of the plane from the nucleus along its normal")
        self.extent = _spin(*_EXTENT_RANGE, 0.5, 2, " bohr")
        self.extent.setToolTip("Half-width of the square window")
        self.fit_extent = QCheckBox("Fit to the orbital (99.9 % of its charge)")
        self.fit_extent.setToolTip("The half-width follows the chosen orbital (the outermost "
                                   "subshell for densities); untick to set it yourself")
        self.resolution = QSpinBox()
        self.resolution.setRange(16, MAX_VIEW_RESOLUTION)
        self.resolution.setSingleStep(64)
        self.resolution.setSuffix(" px")
        self.resolution.setKeyboardTracking(False)
        self.resolution.setToolTip(f"Points per side (up to {MAX_VIEW_RESOLUTION})")
        self.contours = QSpinBox()
        self.contours.setRange(0, 40)
        self.contours.setToolTip("Number of contour lines (nodal lines of ψ are always drawn)")
        form.addRow("Show", self.slice_quantity)
        form.addRow("Plane", self.plane)
        form.addRow("Normal", normal_row)
        form.addRow("Offset", self.offset)
        form.addRow("Half-width", self.extent)
        form.addRow(self.fit_extent)
        form.addRow("Resolution", self.resolution)
        form.addRow("Contours", self.contours)
        self.slice_quantity.activated.connect(lambda _i: self._emit_slice())
        self.plane.activated.connect(lambda _i: self._emit_slice())
        self.fit_extent.toggled.connect(lambda _b: self._emit_slice())
        for spin in (*self.normal, self.offset, self.extent, self.resolution, self.contours):
            spin.valueChanged.connect(lambda _v: self._slice_timer.start())
        return box

    def _build_compare(self) -> QGroupBox:
        box = QGroupBox("Side by side")
        layout = QVBoxLayout(box)
        self.compare_on = QCheckBox("Compare with a second model or atom")
        self.same_atom = QCheckBox("Same atom as the Atom field")
        self.same_atom.setToolTip("The comparison follows the main atom; untick to compare "
                                  "with another atom or ion (shown in every title)")
        self.compare_source = SourceFields("Versus", stacked=True)
        self.compare_source.spec_edit.setMinimumWidth(80)
        _shrinkable(self.compare_source.model_box, 10)
        self.compare_source.message.setWordWrap(True)
        self.show_difference = QCheckBox("Show the difference (right − left)")
        self.show_difference.setToolTip("Second series − first, panel by panel (only when exactly "
                                        "two series are compared)")
        self.series_list = SeriesList()
        self.overlay = QCheckBox("Radial curves on one set of axes")
        self.overlay.setToolTip("Overlay every series' radial curves (one line style per series, "
                                "one colour per subshell) instead of a panel each")
        layout.addWidget(self.compare_on)
        layout.addWidget(self.same_atom)
        layout.addWidget(self.compare_source)
        layout.addWidget(self.series_list)
        layout.addWidget(self.overlay)
        layout.addWidget(self.show_difference)
        self.series_list.edited.connect(lambda _s: self._emit_compare())
        self.overlay.toggled.connect(lambda _b: self._emit_compare())
        self.compare_on.toggled.connect(lambda _b: self._emit_compare())
        self.show_difference.toggled.connect(lambda _b: self._emit_compare())
        self.same_atom.toggled.connect(lambda _b: self._emit_compare())
        self.compare_source.source_edited.connect(lambda _s: self._emit_compare())
        return box

    def _build_pair(self) -> QGroupBox:
        box = QGroupBox("Pair view")
        form = QFormLayout(box)
        hint = QLabel("Click a panel to place the reference electron on the plane.")
        hint.setWordWrap(True)
        hint.setStyleSheet("color: #555;")
        self.reference = [_spin(*_REFERENCE_RANGE, 0.1, 3, "") for _ in range(3)]
        reference_row = QWidget()
        reference_layout = QHBoxLayout(reference_row)
        reference_layout.setContentsMargins(0, 0, 0, 0)
        for spin, axis in zip(self.reference, "xyz", strict=True):
            spin.setToolTip(f"{axis} of the reference electron r₁")
            spin.setMinimumWidth(62)  # three in a row (the unit is in the row's label)
            reference_layout.addWidget(spin)
        self.spin_box = QComboBox()
        self.spin_box.addItem("↑ (spin up, α)", "up")
        self.spin_box.addItem("↓ (spin down, β)", "down")
        self.determinant = QLineEdit()
        self.determinant.setPlaceholderText("Hund's rules, e.g. 2p: 1u 0u -1d")
        self.determinant.setToolTip(
            "Spin-orbitals of open subshells: '<subshell>: <m><u|d> ...', several separated by ';'.\n"
            "u = spin up (α), d = spin down (β); m is the magnetic quantum number (complex orbitals).\n"
            "Subshells left out follow Hund's rules (maximum S, then maximum M_L)."
        )
        self.determinant_message = QLabel()
        self.determinant_message.setWordWrap(True)
        self.determinant_message.setStyleSheet("color: #b00020;")
        form.addRow(hint)
        self.reference_label = QLabel("r₁ / bohr")
        self.reference_label.setBuddy(self.reference[0])
        form.addRow(self.reference_label, reference_row)
        form.addRow("Spin", self.spin_box)
        form.addRow("Determinant", self.determinant)
        form.addRow(self.determinant_message)
        for spin in self.reference:
            spin.valueChanged.connect(lambda _v: self._emit_pair())
        self.spin_box.activated.connect(lambda _i: self._emit_pair())
        self.determinant.returnPressed.connect(self._emit_pair)
        self.determinant.editingFinished.connect(self._emit_pair)
        return box

    def _build_two_electron(self) -> QGroupBox:
        box = QGroupBox("Two-electron view")
        form = QFormLayout(box)
        self.two_map = _shrinkable(QComboBox())
        self.two_map.addItem("radial pair distribution P(r₁, r₂)", "radial")
        self.two_map.addItem("ψ with both electrons on the z axis", "collinear")
        self.two_map.setToolTip(
            "P(r₁, r₂) = r₁²r₂² ∫∫|ψ|² dΩ₁dΩ₂ (angles integrated), or ψ(s₁ẑ, s₂ẑ):\n"
            "the triplet vanishes where both electrons meet (s₁ = s₂)."
        )
        form.addRow("Map", self.two_map)
        self.two_map.activated.connect(lambda _i: self.two_electron_edited.emit(
            replace(self._state.two_electron, map=str(self.two_map.currentData()))))
        return box

    # -- state → widgets ------------------------------------------------------------
    def show_state(self, state: ViewState) -> None:
        """Display ``state`` with every widget's signals blocked (no echo)."""
        self._state = state
        self.show_groups_for(state.view)
        widgets: list[QWidget] = [
            self.units, self.radial_quantity, self.weighted, self.show_subshells, self.show_total,
            self.show_markers, self.log_r, self.slice_quantity, self.plane, *self.normal,
            self.offset, self.extent, self.resolution, self.contours, self.fit_extent,
            self.compare_on, self.show_difference, self.same_atom, self.overlay,
        ]
        for widget in widgets:
            widget.blockSignals(True)
        self.units.setCurrentIndex(self.units.findData(state.length_unit))
        r = state.radial
        self.radial_quantity.setCurrentIndex(self.radial_quantity.findData(r.quantity))
        self.weighted.setChecked(r.weighted)
        self.weighted.setEnabled(r.quantity in ("D", "Q"))
        self.show_subshells.setChecked(r.show_subshells)
        self.show_total.setChecked(r.show_total)
        self.show_markers.setChecked(r.show_markers)
        self.log_r.setChecked(r.log_r)
        s = state.slice
        self.slice_quantity.setCurrentIndex(self.slice_quantity.findData(s.quantity))
        self.plane.setCurrentIndex(self.plane.findData(s.plane))
        for spin, value in zip(self.normal, s.normal, strict=True):
            spin.setValue(value)
            spin.setEnabled(s.plane == "custom")
        self._show_length_unit(state.length_unit)
        self.offset.setValue(s.offset * self._length_scale)
        self.extent.setValue(s.extent * self._length_scale)
        self.fit_extent.setChecked(s.fit_extent)
        self.extent.setEnabled(not s.fit_extent)
        self.resolution.setValue(s.resolution)
        self.contours.setValue(s.contours)
        self.colour_box.show_state(state)
        c = state.compare
        self.compare_on.setChecked(c.enabled)
        self.show_difference.setChecked(c.show_difference)
        self.same_atom.setChecked(c.same_atom)
        self.same_atom.setEnabled(c.enabled)
        self.compare_source.show_source(c.right)
        self.compare_source.setEnabled(c.enabled)
        self.compare_source.spec_edit.setEnabled(c.enabled and not c.same_atom)
        self.show_difference.setEnabled(c.enabled and not c.more)
        self.series_list.show_sources(c.more)
        self.series_list.setEnabled(c.enabled)
        self.overlay.setChecked(c.overlay)
        self.overlay.setEnabled(c.enabled)
        self.spin_box.blockSignals(True)
        self.spin_box.setCurrentIndex(self.spin_box.findData(state.pair.spin))
        self.spin_box.blockSignals(False)
        for spin, value in zip(self.reference, state.pair.reference, strict=True):
            spin.blockSignals(True)
            spin.setValue(value * self._length_scale)
            spin.blockSignals(False)
        if not self.determinant_message.text():
            self.determinant.setText(state.pair.determinant)
        self.two_map.blockSignals(True)
        self.two_map.setCurrentIndex(self.two_map.findData(state.two_electron.map))
        self.two_map.blockSignals(False)
        self.trends_box.show_settings(state.trends)
        for widget in widgets:
            widget.blockSignals(False)

    def _show_length_unit(self, unit: str) -> None:
        """Lengths in the chosen unit: the state keeps bohr, the boxes show bohr or Å."""
        scale = zeffir.core.ANGSTROM_PER_BOHR if unit == "angstrom" else 1.0
        suffix = " Å" if unit == "angstrom" else " bohr"
        self._length_scale = scale
        for spin, (low, high) in ((self.offset, _OFFSET_RANGE), (self.extent, _EXTENT_RANGE),
                                  *((box, _REFERENCE_RANGE) for box in self.reference)):
            was = spin.signalsBlocked()
            spin.blockSignals(True)
            spin.setRange(low * scale, high * scale)
            # Three r₁ boxes share a row: their unit goes in the row's label instead.
            spin.setSuffix("" if spin in self.reference else suffix)
            spin.blockSignals(was)
        self.reference_label.setText(f"r₁ /{suffix}")

    def _bohr(self, spin: QDoubleSpinBox, current: float) -> float:
        """The box's value in bohr; the stored value itself while the user left it alone.

        Rounding to the box's decimals in Å must not move a value the user did not edit.
        """
        shown = round(current * self._length_scale, spin.decimals())
        if abs(spin.value() - shown) < 0.5 * 10.0 ** -spin.decimals():
            return current
        return spin.value() / self._length_scale

    def _extent_bohr(self) -> float:
        """The half-width to store: unchanged while fitting; the fitted one when fitting stops."""
        current = self._state.slice.extent
        if self.fit_extent.isChecked():
            return current
        if self._state.slice.fit_extent:  # just unticked: keep what is on screen
            return self.extent.value() / self._length_scale
        return self._bohr(self.extent, current)

    def show_fitted_extent(self, bohr: float) -> None:
        """Show the half-width the view fitted (the box is disabled while fitting)."""
        self.extent.blockSignals(True)
        self.extent.setValue(bohr * self._length_scale)
        self.extent.blockSignals(False)

    def show_groups_for(self, view: str) -> None:
        """Show only the settings the view uses (the slice plane serves the pair view too)."""
        self.radial_box.setVisible(view == "radial")
        self.slice_box.setVisible(view in ("slice", "pair"))
        self.compare_box.setVisible(view in ("radial", "slice"))
        self.pair_box.setVisible(view == "pair")
        self.two_electron_box.setVisible(view == "two-electron")
        self.trends_box.setVisible(view == "trends")
        self.colour_box.setVisible(view in ("slice", "pair", "two-electron"))

    def show_drawn_colour(self, view: str, scene: SliceScene) -> None:
        """Let the Colour group show the limits ``view``'s picture was drawn with.

        Parameters
        ----------
        view : {"slice", "pair", "two-electron"}
        scene : SliceScene
            The first panel on screen (the others share its scale, the difference aside).
        """
        self.colour_box.show_drawn(view, scene)

    # -- widgets → state ------------------------------------------------------------
    def _emit_radial(self) -> None:
        self.radial_edited.emit(replace(
            self._state.radial,
            quantity=str(self.radial_quantity.currentData()),
            weighted=self.weighted.isChecked(),
            show_subshells=self.show_subshells.isChecked(),
            show_total=self.show_total.isChecked(),
            show_markers=self.show_markers.isChecked(),
            log_r=self.log_r.isChecked(),
        ))

    def _emit_slice(self) -> None:
        self._slice_timer.stop()
        normal = tuple(spin.value() for spin in self.normal)
        if not any(abs(c) > 0 for c in normal):
            normal = self._state.slice.normal
        self.slice_edited.emit(replace(
            self._state.slice,
            quantity=str(self.slice_quantity.currentData()),
            plane=str(self.plane.currentData()),
            normal=normal,
            offset=self._bohr(self.offset, self._state.slice.offset),
            extent=self._extent_bohr(),
            resolution=self.resolution.value(),
            contours=self.contours.value(),
            fit_extent=self.fit_extent.isChecked(),
        ))

    def _emit_colour(self, where: str, colour: ColourSettings) -> None:
        """Write a view's new colour settings back into its part of the state."""
        if where == "slice":
            self.slice_edited.emit(replace(self._state.slice, colour=colour))
        elif where == "pair":
            self.pair_edited.emit(replace(self._state.pair, colour=colour))
        else:
            self.two_electron_edited.emit(replace(self._state.two_electron, colour=colour))

    def _emit_pair(self) -> None:
        text = self.determinant.text().strip()
        if text:
            from zeffir.core.pairs import parse_determinant

            try:
                parse_determinant(parse_spec(self._state.left.spec), text)
            except ZeffirError as error:
                self.determinant_message.setText(str(error))
                return
        self.determinant_message.clear()
        self.pair_edited.emit(replace(
            self._state.pair,  # its colour settings are the Colour group's
            reference=tuple(self._bohr(spin, value) for spin, value in  # type: ignore[arg-type]
                            zip(self.reference, self._state.pair.reference, strict=True)),
            spin=str(self.spin_box.currentData()),  # type: ignore[arg-type]
            determinant=text,
        ))

    def _emit_compare(self) -> None:
        right = replace(self._state.compare.right,
                        model=str(self.compare_source.model_box.currentData()))
        text = self.compare_source.spec_edit.text().strip()
        same_atom = self.same_atom.isChecked()
        if same_atom:
            right = replace(right, spec=self._state.left.spec)
        elif not self.compare_source.error_text() and text:
            right = replace(right, spec=text)
        self.compare_edited.emit(CompareSettings(
            enabled=self.compare_on.isChecked(),
            right=right,
            show_difference=self.show_difference.isChecked(),
            same_atom=same_atom,
            more=self.series_list.sources(),
            overlay=self.overlay.isChecked(),
        ))

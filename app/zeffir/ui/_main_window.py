"""The main window: atom strip, subshell table and controls beside radial and slice views."""

from __future__ import annotations

from dataclasses import replace
from pathlib import Path
from typing import Any

from PySide6.QtCore import QSettings, Qt, QTimer, Slot
from PySide6.QtGui import QAction, QActionGroup, QCloseEvent, QKeySequence
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QFormLayout,
    QHBoxLayout,
    QLabel,
    QMainWindow,
    QMessageBox,
    QProgressBar,
    QPushButton,
    QScrollArea,
    QSpinBox,
    QSplitter,
    QTabWidget,
    QVBoxLayout,
    QWidget,
)

from zeffir.core import subshell_table
from zeffir.scene import (
    compare_radial,
    compare_slices,
    length_factor,
    orbitals_for,
    pair_scenes,
    plane_of,
    radial_scene,
    slice_scene,
    two_electron_scenes,
)
from zeffir.state import OrbitalChoice, Source, ViewState
from zeffir.ui._about import show_about
from zeffir.ui._atom_bar import AtomBar
from zeffir.ui._controls import ViewControls
from zeffir.ui._radial_view import RadialView
from zeffir.ui._slice_view import SliceView
from zeffir.ui._state_model import StateModel
from zeffir.ui._subshell_table import SubshellTable
from zeffir.ui._worker import SceneWorker

__all__ = ["MainWindow"]

SESSION_FILTER = "Zeffir sessions (*.zeffir)"
MAX_RECENT = 8
#: Contour lines are traced this long after a new slice image (so the image paints first).
CONTOUR_DELAY_MS = 25


def _radial_job(state: ViewState) -> Any:
    if state.compare.enabled:
        return compare_radial(state)
    return radial_scene(state.left, state.radial, state.length_unit, state.orbital.subshell)


def _slice_job(state: ViewState) -> Any:
    if state.compare.enabled:
        return compare_slices(state)
    return slice_scene(state.left, state.orbital, state.slice, state.length_unit)


def _pair_job(state: ViewState) -> Any:
    return pair_scenes(state)


def _two_electron_job(state: ViewState) -> Any:
    return two_electron_scenes(state)


_VIEWS = ("radial", "slice", "pair", "two-electron")
_JOBS = {"radial": _radial_job, "slice": _slice_job, "pair": _pair_job,
         "two-electron": _two_electron_job}


def _contour_job(scenes: list[Any]) -> Any:
    # Traced in the worker after the image is on screen; the views only draw the lines.
    return [scene.with_contours() for scene in scenes]


def _table_job(source: Source) -> Any:
    orbitals = orbitals_for(source)
    return subshell_table(orbitals), _energy_summary(source, orbitals)


def _energy_summary(source: Source, orbitals: Any) -> str:
    """One line under the table: total energy, and E_corr for Hartree–Fock where published."""
    from zeffir.core.energy import exact_energy

    configuration = orbitals.configuration
    where = ("" if configuration.origin == "typed"
             else f" = {configuration.short_text} ({configuration.origin})")
    total = orbitals.total_energy
    if total is None:
        return f"{configuration.spec}{where}: the {source.model} model defines no total energy"
    text = f"{configuration.spec}{where} ({source.model}): total energy {total:.6f} Eh"
    if orbitals.virial_ratio is not None:
        text += f" (−V/T = {orbitals.virial_ratio:.8f})"
    if source.model == "hartree-fock":
        found = exact_energy(orbitals.configuration)
        if found is None:
            text += "; no published exact energy for this configuration"
        else:
            text += (f"; exact non-relativistic {found[0]:.6f} Eh ({found[1]}); "
                     f"correlation energy {found[0] - total:.5f} Eh")
    elif source.model == "hartree-fock-average":
        text += "; the average over the configuration's terms, not one state (no correlation energy)"
    return text


class _Trio(QWidget):
    """Left, right and difference views in a row; only the left one outside comparisons.

    Each view titles itself from its scene (spec, model; "right − left" for the
    difference), so the row needs no captions of its own.
    """

    def __init__(self, factory: type[RadialView] | type[SliceView]) -> None:
        super().__init__()
        self.views = [factory(), factory(), factory()]
        layout = QHBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(2)
        for view in self.views:
            layout.addWidget(view, 1)
        self.views[1].link_axes(self.views[0])  # type: ignore[arg-type]
        if factory is SliceView:
            self.views[2].link_axes(self.views[0])  # type: ignore[arg-type]
        else:  # radial differences are small: share r only, not the value axis
            self.views[2].link_axes(self.views[0], y=False)  # type: ignore[call-arg]

    def set_columns(self, count: int) -> None:
        for i, view in enumerate(self.views):
            view.setVisible(i < count)
        for view in self.views[:count]:
            if isinstance(view, RadialView):
                view.refit()


class ExportOptions(QDialog):
    """Figure width and resolution for an export."""

    def __init__(self, parent: QWidget, width: str, dpi: int) -> None:
        super().__init__(parent)
        self.setWindowTitle("Figure options")
        self.width_box = QComboBox()
        self.width_box.addItem("single column (85 mm)", "single")
        self.width_box.addItem("double column (178 mm)", "double")
        self.width_box.setCurrentIndex(max(self.width_box.findData(width), 0))
        self.dpi = QSpinBox()
        self.dpi.setRange(72, 1200)
        self.dpi.setValue(dpi)
        self.dpi.setSuffix(" dpi")
        self.dpi.setToolTip("Resolution of PNG files (SVG and PDF are vector)")
        form = QFormLayout(self)
        form.addRow("Width", self.width_box)
        form.addRow("Resolution", self.dpi)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                   | QDialogButtonBox.StandardButton.Cancel)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        form.addRow(buttons)


class MainWindow(QMainWindow):
    """Zeffir's window. All it shows comes from one :class:`StateModel`.

    Parameters
    ----------
    state : ViewState, optional
        Initial state (the demo session when started from the command line).
    synchronous : bool
        Compute scenes on the GUI thread (tests); the default uses a worker thread.
    """

    def __init__(self, state: ViewState | None = None, synchronous: bool = False,
                 settings: QSettings | None = None) -> None:
        super().__init__()
        self.setWindowTitle("Zeffir")
        self.settings = settings or QSettings("Zeffir", "Zeffir")
        self.model = StateModel(state)
        self.worker = SceneWorker(self, synchronous=synchronous)
        self.session_path: Path | None = None
        self.last_export: Path | None = None
        self._build_widgets()
        self._build_menus()
        self.model.changed.connect(self._on_state_changed)
        self.model.rejected.connect(lambda message: self.statusBar().showMessage(message, 8000))
        self.worker.finished.connect(self._on_result)
        self.worker.failed.connect(self._on_failure)
        self.worker.busy.connect(self._on_busy)
        self.worker.progress.connect(lambda message: self.statusBar().showMessage(message, 4000))
        self._show_state(self.model.state)
        self._request_all()

    # -- construction ---------------------------------------------------------------
    def _build_widgets(self) -> None:
        self.atom_bar = AtomBar()
        self.table = SubshellTable()
        self.table.setMinimumHeight(110)
        self.controls = ViewControls()
        scroll = QScrollArea()
        scroll.setWidget(self.controls)
        scroll.setWidgetResizable(True)
        scroll.setHorizontalScrollBarPolicy(Qt.ScrollBarPolicy.ScrollBarAlwaysOff)
        panel_width = self.controls.minimumSizeHint().width() + 24  # room for the scroll bar
        scroll.setMinimumWidth(panel_width)
        scroll.setMaximumWidth(panel_width + 60)
        self.radial_trio = _Trio(RadialView)
        self.slice_trio = _Trio(SliceView)
        for view in self.slice_trio.views:
            view.use_external_contours(True)
        self.tabs = QTabWidget()
        self.tabs.addTab(self.radial_trio, "Radial")
        self.tabs.addTab(self.slice_trio, "Slice")
        self.pair_trio = _Trio(SliceView)
        self.two_trio = _Trio(SliceView)
        for view in (*self.pair_trio.views, *self.two_trio.views):
            view.use_external_contours(True)
        self.tabs.addTab(self.pair_trio, "Pair")
        self.tabs.addTab(self.two_trio, "Two electrons")
        self.tabs.setTabToolTip(0, "Radial functions, distributions and cumulative charge")
        self.tabs.setTabToolTip(1, "Orbitals and densities on a plane through the atom")
        self.tabs.setTabToolTip(2, "For a reference electron at r₁: the other same-spin electrons, the "
                                   "opposite-spin electrons and the exchange (Fermi) hole")
        self.tabs.setTabToolTip(3, "Singlet and triplet of a two-electron configuration "
                                   "(e.g. Li+ 1s1 2s1) and their difference")
        self._trios = {"radial": self.radial_trio, "slice": self.slice_trio,
                       "pair": self.pair_trio, "two-electron": self.two_trio}
        self.energy_line = QLabel()
        self.energy_line.setToolTip("Total energy where the model defines one; for Hartree–Fock the "
                                    "correlation energy E_exact − E_HF where an exact energy is published")
        self.energy_line.setContentsMargins(6, 2, 6, 2)
        table_box = QWidget()
        table_layout = QVBoxLayout(table_box)
        table_layout.setContentsMargins(0, 0, 0, 0)
        table_layout.setSpacing(0)
        table_layout.addWidget(self.table, 1)
        table_layout.addWidget(self.energy_line)
        views_and_table = QSplitter(Qt.Orientation.Vertical)
        views_and_table.addWidget(self.tabs)
        views_and_table.addWidget(table_box)
        views_and_table.setStretchFactor(0, 1)
        views_and_table.setSizes([760, 170])
        body = QSplitter(Qt.Orientation.Horizontal)
        body.addWidget(scroll)
        body.addWidget(views_and_table)
        body.setStretchFactor(1, 1)
        body.setSizes([panel_width, 1600 - panel_width])
        central = QWidget()
        layout = QVBoxLayout(central)
        layout.setContentsMargins(4, 4, 4, 4)
        layout.addWidget(self.atom_bar)
        layout.addWidget(body, 1)
        self.setCentralWidget(central)
        self.progress = QProgressBar()
        self.progress.setRange(0, 0)
        self.progress.setMaximumWidth(160)
        self.progress.setVisible(False)
        self.cancel_button = QPushButton("Cancel")
        self.cancel_button.setVisible(False)
        self.cancel_button.clicked.connect(self.worker.cancel)
        self.statusBar().addPermanentWidget(self.progress)
        self.statusBar().addPermanentWidget(self.cancel_button)
        self.atom_bar.source_edited.connect(lambda s: self.model.update(left=s))
        self.atom_bar.orbital_edited.connect(lambda o: self.model.update(orbital=o))
        self.table.subshell_selected.connect(self._select_subshell)
        self.controls.radial_edited.connect(lambda r: self.model.update(radial=r))
        self.controls.slice_edited.connect(lambda s: self.model.update(slice=s))
        self.controls.units_edited.connect(lambda u: self.model.update(length_unit=u))
        self.controls.compare_edited.connect(lambda c: self.model.update(compare=c))
        self.controls.pair_edited.connect(lambda p: self.model.update(pair=p))
        self.controls.two_electron_edited.connect(lambda t: self.model.update(two_electron=t))
        self.tabs.currentChanged.connect(lambda i: self.model.update(view=_VIEWS[i]))
        for view in self.pair_trio.views:
            view.clicked.connect(self._place_reference)
        for trio in (self.radial_trio, self.slice_trio, self.pair_trio, self.two_trio):
            self._link_cursors(trio)

    def _place_reference(self, u: float, v: float) -> None:
        """Put the pair view's reference electron where the user clicked (on the slice plane)."""
        state = self.model.state
        scale = length_factor(state.length_unit, 1.0)
        x, y, z = _point_mapper(state)(u, v)
        reference = (round(x / scale, 4), round(y / scale, 4), round(z / scale, 4))
        self.model.update(pair=replace(state.pair, reference=reference))

    def _link_cursors(self, trio: _Trio) -> None:
        signal = "cursor_moved" if isinstance(trio.views[0], RadialView) else "hovered"
        for source in trio.views:
            for target in trio.views:
                if target is not source:
                    getattr(source, signal).connect(target.show_cursor)

    def _build_menus(self) -> None:
        file_menu = self.menuBar().addMenu("&File")
        self._add(file_menu, "&Open session…", self.open_session, QKeySequence.StandardKey.Open)
        self.recent_menu = file_menu.addMenu("Recent sessions")
        self._add(file_menu, "&Save session", self.save_session, QKeySequence.StandardKey.Save)
        self._add(file_menu, "Save session &as…", self.save_session_as,
                  QKeySequence.StandardKey.SaveAs)
        file_menu.addSeparator()
        self._add(file_menu, "Export &figure…", self.export_figure, QKeySequence("Ctrl+E"))
        self._add(file_menu, "Export &data…", self.export_data, QKeySequence("Ctrl+Shift+E"))
        file_menu.addSeparator()
        self._add(file_menu, "&Quit", self.close, QKeySequence.StandardKey.Quit)
        view_menu = self.menuBar().addMenu("&View")
        self._add(view_menu, "&Radial curves", lambda: self.tabs.setCurrentIndex(0),
                  QKeySequence("Ctrl+1"))
        self._add(view_menu, "&Slice", lambda: self.tabs.setCurrentIndex(1), QKeySequence("Ctrl+2"))
        self.compare_action = self._add(view_menu, "Side by &side", self._toggle_compare,
                                        QKeySequence("Ctrl+D"))
        self.compare_action.setCheckable(True)
        units = view_menu.addMenu("Units")
        group = QActionGroup(self)
        self.unit_actions = {}
        for key, text in (("bohr", "Atomic (bohr, hartree)"), ("angstrom", "Å and eV")):
            action = units.addAction(text)
            action.setCheckable(True)
            group.addAction(action)
            action.triggered.connect(lambda _c=False, k=key: self.model.update(length_unit=k))
            self.unit_actions[key] = action
        help_menu = self.menuBar().addMenu("&Help")
        self._add(help_menu, "&About Zeffir and model limits", lambda: show_about(self))
        self._refresh_recent()

    def _add(self, menu: Any, text: str, slot: Any, shortcut: Any = None) -> QAction:
        action = menu.addAction(text)
        action.triggered.connect(lambda _checked=False: slot())
        if shortcut is not None:
            action.setShortcut(shortcut)
        return action

    # -- state → widgets ------------------------------------------------------------
    @Slot(object, object)
    def _on_state_changed(self, new: ViewState, old: ViewState) -> None:
        self._show_state(new)
        if new.left != old.left:
            self.worker.request("table", lambda s=new.left: _table_job(s))
        if new.view != old.view or _view_inputs(new) != _view_inputs(old):
            self._request_view(new)
        if new.length_unit != old.length_unit:
            self.worker.request("table", lambda s=new.left: _table_job(s))

    def _show_state(self, state: ViewState) -> None:
        self.atom_bar.show_state(state.left, state.orbital)
        self.controls.show_state(state)
        self.tabs.blockSignals(True)
        self.tabs.setCurrentIndex(_VIEWS.index(state.view))
        self.tabs.blockSignals(False)
        self.compare_action.setChecked(state.compare.enabled)
        self.unit_actions[state.length_unit].setChecked(True)
        columns = (3 if state.compare.show_difference else 2) if state.compare.enabled else 1
        self.radial_trio.set_columns(columns)
        self.slice_trio.set_columns(columns)
        self.pair_trio.set_columns(3)
        self.two_trio.set_columns(3)
        name = self.session_path.name if self.session_path else "untitled"
        self.setWindowTitle(f"Zeffir — {state.left.spec} ({name})")

    def _request_all(self) -> None:
        state = self.model.state
        self.worker.request("table", lambda s=state.left: _table_job(s))
        self._request_view(state)

    def _request_view(self, state: ViewState) -> None:
        job = _JOBS[state.view]
        self.worker.request(state.view, lambda s=state: job(s))

    @Slot(str, object)
    def _on_result(self, key: str, result: Any) -> None:
        state = self.model.state
        if key == "table":
            rows, summary = result
            self.table.show_rows(rows, state.orbital.subshell, state.length_unit)
            self.energy_line.setText(summary)
            return
        if key == "export":
            self.last_export = result
            self.statusBar().showMessage(f"Exported {result}", 8000)
            return
        parts = ([result.left, result.right, result.difference]
                 if hasattr(result, "difference") else [result])
        if key.endswith("-contours"):
            for view, scene in zip(self._trios[key.removesuffix("-contours")].views, result, strict=False):
                view.show_contours(scene)
            return
        trio = self._trios[key]
        for view, scene in zip(trio.views, parts, strict=False):
            view.set_scene(scene)
        if key != "radial":
            if key in ("slice", "pair"):
                point_of = _point_mapper(state)
                for view in trio.views:
                    view.set_point_of(point_of)
            # Trace after the image has been painted, so the two never compete.
            QTimer.singleShot(CONTOUR_DELAY_MS, lambda p=parts, k=key: self.worker.request(
                f"{k}-contours", lambda: _contour_job(p)))
        self.statusBar().clearMessage()

    @Slot(str, str)
    def _on_failure(self, key: str, message: str) -> None:
        if key == "export":
            self.statusBar().clearMessage()
            QMessageBox.warning(self, "Nothing exported", message)
            return
        self.statusBar().showMessage(f"Could not compute the {key} view: {message}", 10000)

    @Slot(bool)
    def _on_busy(self, active: bool) -> None:
        self.progress.setVisible(active)
        self.cancel_button.setVisible(active)

    def _select_subshell(self, label: str) -> None:
        current = self.model.state.orbital
        if label != current.subshell:
            self.model.update(orbital=OrbitalChoice(label, "real", 0))

    def _toggle_compare(self) -> None:
        compare = self.model.state.compare
        self.model.update(compare=replace(compare, enabled=not compare.enabled))

    # -- sessions -------------------------------------------------------------------
    def open_session(self, path: str | Path | None = None) -> bool:
        """Open a session file (asks for one if ``path`` is None); on error nothing changes."""
        from zeffir.export import SessionError, load_session

        if path is None:
            chosen, _ = QFileDialog.getOpenFileName(self, "Open session", self._last_dir(),
                                                    SESSION_FILTER)
            if not chosen:
                return False
            path = chosen
        try:
            state = load_session(Path(path))
        except SessionError as error:
            QMessageBox.warning(self, "Session not opened", str(error))
            return False
        self.session_path = Path(path)
        self.model.set_state(state)
        self._show_state(self.model.state)
        self._remember(Path(path))
        return True

    def save_session(self) -> bool:
        """Save to the current session file, or ask for one."""
        if self.session_path is None:
            return self.save_session_as()
        return self._write_session(self.session_path)

    def save_session_as(self, path: str | Path | None = None) -> bool:
        """Save the session under a new name."""
        if path is None:
            chosen, _ = QFileDialog.getSaveFileName(self, "Save session", self._last_dir(),
                                                    SESSION_FILTER)
            if not chosen:
                return False
            path = chosen if chosen.endswith(".zeffir") else f"{chosen}.zeffir"
        return self._write_session(Path(path))

    def _write_session(self, path: Path) -> bool:
        from zeffir.core import ZeffirError
        from zeffir.export import save_session

        try:
            save_session(path, self.model.state)
        except ZeffirError as error:
            QMessageBox.warning(self, "Session not saved", str(error))
            return False
        self.session_path = path
        self._remember(path)
        self._show_state(self.model.state)
        self.statusBar().showMessage(f"Saved {path}", 5000)
        return True

    def _remember(self, path: Path) -> None:
        recent = [p for p in self._recent() if p != str(path)]
        recent.insert(0, str(path))
        self.settings.setValue("recent_sessions", recent[:MAX_RECENT])
        self.settings.setValue("last_dir", str(path.parent))
        self._refresh_recent()

    def _recent(self) -> list[str]:
        value = self.settings.value("recent_sessions", [])
        if isinstance(value, str):
            return [value]
        return [str(v) for v in value] if isinstance(value, list) else []

    def _refresh_recent(self) -> None:
        self.recent_menu.clear()
        recent = self._recent()
        for item in recent:
            action = self.recent_menu.addAction(item)
            action.triggered.connect(lambda _c=False, p=item: self.open_session(p))
        self.recent_menu.setEnabled(bool(recent))

    def _last_dir(self) -> str:
        return str(self.settings.value("last_dir", str(Path.home())))

    # -- export ---------------------------------------------------------------------
    def export_figure(self, path: str | Path | None = None, width: str | None = None,
                      dpi: int | None = None) -> bool:
        """Export the current view as PNG, SVG or PDF (asks for a file and options if not given)."""
        if path is None:
            chosen, _ = QFileDialog.getSaveFileName(
                self, "Export figure", self._last_dir(),
                "PNG image (*.png);;SVG drawing (*.svg);;PDF document (*.pdf)")
            if not chosen:
                return False
            options = ExportOptions(self, str(self.settings.value("export_width", "single")),
                                    int(self.settings.value("export_dpi", 300)))
            if options.exec() != QDialog.DialogCode.Accepted:
                return False
            width, dpi = str(options.width_box.currentData()), options.dpi.value()
            self.settings.setValue("export_width", width)
            self.settings.setValue("export_dpi", dpi)
            path = chosen
        return self._export(Path(path), width, dpi or 300)

    def export_data(self, path: str | Path | None = None) -> bool:
        """Export the plotted data: CSV for radial curves, NPZ for slices."""
        if path is None:
            radial = self.model.state.view == "radial"
            chosen, _ = QFileDialog.getSaveFileName(
                self, "Export data", self._last_dir(),
                "Comma-separated values (*.csv)" if radial else "NumPy archive (*.npz)")
            if not chosen:
                return False
            path = chosen
        return self._export(Path(path), None, 300)

    def _export(self, path: Path, width: str | None, dpi: int) -> bool:
        # Rendering a figure takes about a second (matplotlib): it runs in the worker.
        def job(state: ViewState = self.model.state) -> Path:
            from zeffir.export import export_view

            export_view(state, path, width=width, dpi=dpi)
            return path

        self.settings.setValue("last_dir", str(path.parent))
        self.statusBar().showMessage(f"Exporting {path.name}…")
        self.worker.request("export", job)
        return True

    # -- Qt overrides ---------------------------------------------------------------
    def closeEvent(self, event: QCloseEvent) -> None:
        self.settings.setValue("geometry", self.saveGeometry())
        self.worker.shutdown()
        super().closeEvent(event)


def _point_mapper(state: ViewState) -> Any:
    """(u, v) in display units → (x, y, z) in display units, for the slice read-out."""
    normal, e1, e2 = plane_of(state.slice).basis()
    offset = state.slice.offset * length_factor(state.length_unit, 1.0)
    origin = offset * normal

    def point_of(u: float, v: float) -> tuple[float, float, float]:
        x, y, z = origin + u * e1 + v * e2
        return float(x), float(y), float(z)

    return point_of


def _view_inputs(state: ViewState) -> tuple[object, ...]:
    """The parts of the state the current view depends on (a change there recomputes it)."""
    common = (state.left, state.length_unit)
    if state.view == "radial":
        return (*common, state.radial, state.orbital.subshell, state.compare)
    if state.view == "slice":
        return (*common, state.slice, state.orbital, state.compare)
    if state.view == "pair":
        return (*common, state.slice, state.pair)
    return (*common, state.two_electron, state.slice.contours)

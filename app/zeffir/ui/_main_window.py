"""The main window: atom strip, subshell table and controls beside radial and slice views."""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import replace
from pathlib import Path
from typing import Any

from PySide6.QtCore import QSettings, Qt, QTimer, Slot
from PySide6.QtGui import QAction, QActionGroup, QCloseEvent, QKeySequence, QResizeEvent
from PySide6.QtWidgets import (
    QAbstractButton,
    QDockWidget,
    QFormLayout,
    QFrame,
    QGridLayout,
    QHBoxLayout,
    QLabel,
    QMainWindow,
    QMessageBox,
    QProgressBar,
    QPushButton,
    QScrollArea,
    QSplitter,
    QTabWidget,
    QVBoxLayout,
    QWidget,
)

from zeffir.core import get_model, subshell_table
from zeffir.scene import (
    VIEW_RECIPES,
    forget_failure,
    length_factor,
    line_profile,
    orbitals_for,
    panels_of,
    plane_of,
    view_inputs,
)
from zeffir.state import MAX_SERIES, OrbitalChoice, Source, ViewState
from zeffir.ui._about import show_about, show_help
from zeffir.ui._atom_bar import AtomBar
from zeffir.ui._controls import ViewControls
from zeffir.ui._figure_export import FigureExport
from zeffir.ui._jobs import JobKey
from zeffir.ui._profile_view import ProfileView
from zeffir.ui._radial_view import RadialView
from zeffir.ui._session_files import SessionFiles
from zeffir.ui._slice_view import PROFILE_HINT, SliceView
from zeffir.ui._state_model import StateModel
from zeffir.ui._subshell_table import SubshellTable
from zeffir.ui._terms_view import TermsView
from zeffir.ui._trend_view import TrendView
from zeffir.ui._wheel_guard import guard_wheel
from zeffir.ui._worker import SceneWorker

__all__ = ["MainWindow"]

#: Contour lines are traced this long after a new slice image (so the image paints first).
CONTOUR_DELAY_MS = 25
#: Work that lasts longer than this (ms) shows the busy indicator and the Cancel button.
BUSY_DELAY_MS = 150
#: Pixels a panel's frame takes across and down (axes, colour bar; title, read-out).
PANEL_FRAME: tuple[float, float] = (110.0, 130.0)
#: A view still computing says so on its picture after this long (quick redraws stay quiet).
BUSY_BANNER_DELAY_MS = 400


_VIEWS = ("radial", "slice", "pair", "two-electron", "terms", "trends")


def _contour_job(scenes: list[Any]) -> Any:
    # Traced in the worker after the image is on screen; the views only draw the lines.
    return [scene.with_contours() for scene in scenes]


def _table_job(source: Source, versus: tuple[Source, ...] = (), unit: str = "bohr") -> Any:
    """Rows, energy lines and notes of the main source and of every compared series.

    Returns ``(source, series, summary, notes)``: ``series`` is a list of (name, rows),
    one per series that could be built; a series that fails adds a line saying so.
    """
    from zeffir.core import ZeffirError
    from zeffir.scene import series_names

    orbitals = orbitals_for(source)
    rows = subshell_table(orbitals)
    others = [s for s in dict.fromkeys(versus) if s != source]
    names = series_names([source, *others]) if others else ("",)
    series = [(names[0], rows)]
    # Each line names its spec and model, so the series need no further label here.
    lines = [_energy_summary(source, orbitals, unit)]
    notes = _notes_of(orbitals, rows)
    for name, other_source in zip(names[1:], others, strict=True):
        try:
            other = orbitals_for(other_source)
        except ZeffirError as error:
            lines.append(f"{name}: {_source_text(other_source)} failed: {error}")
            continue
        other_rows = subshell_table(other)
        series.append((name, other_rows))
        lines.append(_energy_summary(other_source, other, unit))
        same_atom = other.configuration.occupations == orbitals.configuration.occupations
        notes += [f"{name} ({other_source.spec}, {other_source.model}): {note}"
                  for note in _notes_of(other, other_rows)
                  if not (same_atom and note == other.configuration.origin_note)]
    return source, series, "\n".join(lines), list(dict.fromkeys(notes))


def _notes_of(orbitals: Any, rows: Any) -> list[str]:
    """Set-wide notes first (where the configuration comes from, the model's), then per row."""
    notes = [orbitals.configuration.origin_note, *orbitals.notes]
    notes += [note if note.startswith(f"{row.label}:") else f"{row.label}: {note}"
              for row in rows for note in row.notes]
    return list(dict.fromkeys(notes))


def describe(state: ViewState) -> str:
    """'Fe — Slater's rules', with the comparison's side when one is shown."""
    if state.view in ("radial", "slice"):
        return " vs ".join(_source_text(source) for source in state.series())
    if state.view == "trends":
        t = state.trends
        return f"{t.quantity} over {t.rule} ({', '.join(t.model_list())})"
    return _source_text(state.left)


def _source_text(source: Source) -> str:
    try:
        title = get_model(source.model).title
    except Exception:  # an unknown model is reported elsewhere; name it as given
        title = source.model
    return f"{source.spec} — {title}"


def _energy_summary(source: Source, orbitals: Any, unit: str = "bohr") -> str:
    """One line under the table: total energy, and E_corr for Hartree–Fock where published.

    Energies in hartree, or in eV when the display unit is Å (and eV).
    """
    from zeffir.core import EV_PER_HARTREE
    from zeffir.core.properties import energy_summary

    scale, name, digits = (EV_PER_HARTREE, "eV", 4) if unit == "angstrom" else (1.0, "Eh", 6)

    configuration = orbitals.configuration
    where = ("" if configuration.origin == "typed"
             else f" = {configuration.short_text} ({configuration.origin})")
    total = orbitals.total_energy
    if total is None:
        return f"{configuration.spec}{where}: the {source.model} model defines no total energy"
    text = (f"{configuration.spec}{where} ({source.model}): total energy "
            f"{total * scale:.{digits}f} {name}")
    if orbitals.virial_ratio is not None:
        text += f" (−V/T = {orbitals.virial_ratio:.8f})"
    summary = energy_summary(orbitals, source.model)
    if summary.correlation is not None and summary.exact is not None:
        text += (f"; exact non-relativistic {summary.exact * scale:.{digits}f} {name} "
                 f"({summary.exact_source}); correlation energy "
                 f"{summary.correlation * scale:.{digits - 1}f} {name}")
    elif summary.remark is not None:
        text += f"; correlation energy {summary.remark}"
    return text


class _PanelGrid(QWidget):
    """The panels of one view: up to :data:`MAX_SERIES` series panels and a difference panel.

    One row holds up to three panels; four or more go on two rows. Each panel titles
    itself from its scene, so the grid needs no captions of its own. Series panels
    share both axes; a radial difference panel shares r only (its values are small).
    """

    def __init__(self, factory: type[RadialView] | type[SliceView],
                 setup: Callable[[Any], None] | None = None) -> None:
        super().__init__()
        self._factory = factory
        self._setup = setup
        # No panel yet: panels are made when the grid is first shown with a state
        # (set_panels), further series and the difference panel when a comparison
        # first asks for them. Each panel costs tens of milliseconds to build, which
        # the window's first paint should not pay for views off screen.
        self.series_views: list[Any] = []
        self._difference: Any = None
        self._layout = QGridLayout(self)
        self._layout.setContentsMargins(0, 0, 0, 0)
        self._layout.setSpacing(2)
        self._shown: list[RadialView | SliceView] = []
        self._columns = 0

    @property
    def difference_view(self) -> Any:
        """The difference panel, made on first use (it shares its axes with the first series)."""
        if self._difference is None:
            self._ensure_series(1)
            view = self._factory()
            first = self.series_views[0]
            if self._factory is SliceView:
                view.link_axes(first)
            else:  # radial differences are small: share r only, not the value axis
                view.link_axes(first, y=False)
            self._difference = view
            if self._setup is not None:
                self._setup(view)
        return self._difference

    @property
    def all_views(self) -> list[Any]:
        """Every panel made so far (shown or not)."""
        return [*self.series_views, *([self._difference] if self._difference is not None else [])]

    def set_setup(self, setup: Callable[[Any], None]) -> None:
        """Call ``setup(view)`` for every panel made so far and for each one made later."""
        self._setup = setup
        for view in self.all_views:
            setup(view)

    def _ensure_series(self, count: int) -> None:
        while len(self.series_views) < min(count, MAX_SERIES):
            view = self._factory()
            if self.series_views:
                view.link_axes(self.series_views[0])  # type: ignore[arg-type]
            self.series_views.append(view)
            if self._setup is not None:
                self._setup(view)

    @property
    def views(self) -> list[RadialView | SliceView]:
        """The panels on screen, in drawing order (series first, then the difference)."""
        return list(self._shown)

    def set_panels(self, series: int, difference: bool) -> None:
        """Show ``series`` series panels and, if asked, the difference panel after them."""
        self._ensure_series(series)
        shown = [*self.series_views[:series], *([self.difference_view] if difference else [])]
        if shown == self._shown:
            return
        self._shown = shown
        self._columns = 0
        self._arrange()

    def columns(self) -> int:
        """Panels per row as laid out now."""
        return self._columns

    def _best_columns(self) -> int:
        """Panels per row that give each panel's plot the largest square, with no empty row.

        Each panel loses about :data:`PANEL_FRAME` pixels across (axis, colour bar) and
        down (title, axis, read-out) to its frame; in a wide, low area (a 1280×720
        window) four panels in one row beat a 2 × 2 grid.
        """
        count = len(self._shown)
        width, height = max(self.width(), 1), max(self.height(), 1)
        best: tuple[float, int] | None = None
        for rows in range(1, count + 1):
            columns = -(-count // rows)
            if columns * (rows - 1) >= count:
                continue  # a row would stay empty
            side = min(width / columns - PANEL_FRAME[0], height / rows - PANEL_FRAME[1])
            if best is None or side > best[0] + 1.0:
                best = (side, columns)
        return best[1] if best is not None else 1

    def _arrange(self) -> None:
        columns = self._best_columns()
        if columns == self._columns:
            return
        self._columns = columns
        for view in self.all_views:
            self._layout.removeWidget(view)
            view.setVisible(False)
        for index, view in enumerate(self._shown):
            self._layout.addWidget(view, index // columns, index % columns)
            view.setVisible(True)
        for column in range(MAX_SERIES + 1):
            self._layout.setColumnStretch(column, 1 if column < columns else 0)
        for view in self._shown:
            if isinstance(view, RadialView):
                view.refit()

    def resizeEvent(self, event: QResizeEvent) -> None:  # Qt override
        super().resizeEvent(event)
        if self._shown:
            self._arrange()


def _panel_counts(state: ViewState) -> tuple[int, bool]:
    """Series panels and whether the difference panel shows, for the state's view."""
    if state.view in ("pair", "two-electron"):
        return 2, True  # same/opposite spin and the hole; singlet/triplet and their difference
    series = len(state.series())
    if state.view == "radial" and state.compare.overlay and series > 1:
        series = 1
    return series, state.compare.has_difference()


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
        self.last_export: Path | None = None
        # What each view was last asked to show, what its picture was computed from,
        # and why the two differ (a failure or a cancel) when they do.
        self._asked: dict[str, ViewState] = {}
        self._drawn: dict[str, ViewState] = {}
        self._trouble: dict[str, str] = {}
        self._table_asked: Source | None = None
        self._table_drawn: Source | None = None
        self._build_widgets()
        self.sessions = SessionFiles(self, self.model, self.settings, self.statusBar(),
                                     lambda: self._show_state(self.model.state))
        self.exports = FigureExport(self, self.model, self.worker, self.settings, self.statusBar(),
                                    self.problem, self.sessions.last_dir)
        self._build_menus()
        self.model.changed.connect(self._on_state_changed)
        self.model.rejected.connect(lambda message: self.statusBar().showMessage(message, 8000))
        self.worker.finished.connect(self._on_result)
        self.worker.failed.connect(self._on_failure)
        self.worker.busy.connect(self._on_busy)
        self._banner_timer = QTimer(self)
        self._banner_timer.setSingleShot(True)
        self._banner_timer.setInterval(BUSY_BANNER_DELAY_MS)
        self._banner_timer.timeout.connect(self._refresh_banner)
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
        self.radial_trio = _PanelGrid(RadialView)
        self.slice_trio = _PanelGrid(SliceView)
        self.tabs = QTabWidget()
        self.tabs.addTab(self.radial_trio, "Radial")
        self.tabs.addTab(self.slice_trio, "Slice")
        self.pair_trio = _PanelGrid(SliceView)
        self.two_trio = _PanelGrid(SliceView)
        self.tabs.addTab(self.pair_trio, "Pair")
        self.tabs.addTab(self.two_trio, "Two electrons")
        self.terms_view = TermsView()
        self.tabs.addTab(self.terms_view, "Terms")
        self.trend_view = TrendView()
        self.tabs.addTab(self.trend_view, "Trends")
        self.trend_view.configuration_clicked.connect(self._open_configuration)
        self.tabs.setTabToolTip(0, "Radial functions, distributions and cumulative charge")
        self.tabs.setTabToolTip(1, "Orbitals and densities on a plane through the atom")
        self.tabs.setTabToolTip(2, "For a reference electron at r₁: the other same-spin electrons, the "
                                   "opposite-spin electrons and the exchange (Fermi) hole")
        self.tabs.setTabToolTip(3, "Singlet and triplet of a two-electron configuration "
                                   "(e.g. Li+ 1s1 2s1) and their difference")
        self.tabs.setTabToolTip(4, "LS terms, J levels and the ground level of the configuration "
                                   "(Hund's rules, and the observed level where known)")
        self._trios = {"radial": self.radial_trio, "slice": self.slice_trio,
                       "pair": self.pair_trio, "two-electron": self.two_trio}
        self.energy_line = QLabel()
        self.energy_line.setToolTip("Total energy where the model defines one; for Hartree–Fock the "
                                    "correlation energy E_exact − E_HF where an exact energy is published")
        self.energy_line.setContentsMargins(6, 2, 6, 2)
        self.energy_line.setWordWrap(True)
        self.energy_line.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        table_box = QWidget()
        table_layout = QVBoxLayout(table_box)
        table_layout.setContentsMargins(0, 0, 0, 0)
        table_layout.setSpacing(0)
        table_layout.addWidget(self.table, 1)
        self.notes_area = QLabel()
        self.notes_area.setObjectName("notesArea")
        self.notes_area.setWordWrap(True)
        self.notes_area.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.notes_area.setStyleSheet("color: #444;")
        self.notes_area.setContentsMargins(6, 0, 6, 2)
        self.notes_area.setToolTip("Where the configuration comes from, and what the model notes "
                                   "about it (fallbacks, the term solved, extensions of its rules)")
        # Energy lines (one per series) and notes scroll together in a strip of fixed
        # height, so that a comparison of many series leaves the views their room.
        numbers = QWidget()
        numbers_layout = QVBoxLayout(numbers)
        numbers_layout.setContentsMargins(0, 0, 0, 0)
        numbers_layout.setSpacing(2)
        numbers_layout.addWidget(self.energy_line)
        numbers_layout.addWidget(self.notes_area)
        numbers_layout.addStretch(1)
        notes_scroll = QScrollArea()
        notes_scroll.setWidget(numbers)
        notes_scroll.setWidgetResizable(True)
        notes_scroll.setFrameShape(QFrame.Shape.NoFrame)
        notes_scroll.setHorizontalScrollBarPolicy(Qt.ScrollBarPolicy.ScrollBarAlwaysOff)
        line = self.energy_line.fontMetrics().lineSpacing()
        notes_scroll.setFixedHeight(4 * line + 8)
        table_layout.addWidget(notes_scroll)
        self.banner = QFrame()
        self.banner.setObjectName("staleBanner")
        self.banner.setStyleSheet("#staleBanner { background: #fff3cd; border: 1px solid #d9a400; }")
        self.banner_text = QLabel()
        self.banner_text.setWordWrap(True)
        self.banner_text.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.retry_button = QPushButton("Retry")
        self.retry_button.setToolTip("Compute what the controls ask for again (also: Return in "
                                     "the Atom field)")
        self.retry_button.clicked.connect(self.retry)
        banner_layout = QHBoxLayout(self.banner)
        banner_layout.setContentsMargins(8, 4, 8, 4)
        banner_layout.addWidget(self.banner_text, 1)
        banner_layout.addWidget(self.retry_button)
        self.banner.setVisible(False)
        views_box = QWidget()
        views_layout = QVBoxLayout(views_box)
        views_layout.setContentsMargins(0, 0, 0, 0)
        views_layout.setSpacing(2)
        views_layout.addWidget(self.banner)
        views_layout.addWidget(self.tabs, 1)
        self.views_and_table = views_and_table = QSplitter(Qt.Orientation.Vertical)
        views_and_table.addWidget(views_box)
        views_and_table.addWidget(table_box)
        views_and_table.setStretchFactor(0, 1)
        views_and_table.setSizes([760, 170])
        self.body_splitter = body = QSplitter(Qt.Orientation.Horizontal)
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
        self._busy_timer = QTimer(self)
        self._busy_timer.setSingleShot(True)
        self._busy_timer.setInterval(BUSY_DELAY_MS)
        self._busy_timer.timeout.connect(lambda: self._show_busy(True))
        self.progress = QProgressBar()
        self.progress.setRange(0, 0)
        self.progress.setMaximumWidth(160)
        self.progress.setVisible(False)
        self.cancel_button = QPushButton("Cancel")
        self.cancel_button.setVisible(False)
        self.cancel_button.clicked.connect(self.cancel)
        self.statusBar().addPermanentWidget(self.progress)
        self.statusBar().addPermanentWidget(self.cancel_button)
        self.atom_bar.source_edited.connect(lambda s: self.model.update(left=s))
        self.atom_bar.resubmitted.connect(lambda _s: self.retry())
        self.atom_bar.orbital_edited.connect(lambda o: self.model.update(orbital=o))
        self.table.subshell_selected.connect(self._select_subshell)
        self.controls.radial_edited.connect(lambda r: self.model.update(radial=r))
        self.controls.slice_edited.connect(lambda s: self.model.update(slice=s))
        self.controls.units_edited.connect(lambda u: self.model.update(length_unit=u))
        self.controls.compare_edited.connect(lambda c: self.model.update(compare=c))
        self.controls.pair_edited.connect(lambda p: self.model.update(pair=p))
        self.controls.two_electron_edited.connect(lambda t: self.model.update(two_electron=t))
        self.controls.trends_edited.connect(lambda t: self.model.update(trends=t))
        self.tabs.currentChanged.connect(lambda i: self.model.update(view=_VIEWS[i]))
        self.profile_view = ProfileView()
        self.profile_dock = QDockWidget("Line profile", self)
        self.profile_dock.setObjectName("lineProfileDock")
        self.profile_dock.setToolTip(PROFILE_HINT)
        self.profile_dock.setWidget(self.profile_view)
        self.addDockWidget(Qt.DockWidgetArea.BottomDockWidgetArea, self.profile_dock)
        self.profile_dock.hide()  # appears with the first profile
        self._profile_segment: tuple[str, int, tuple[float, float], tuple[float, float]] | None = None
        self._profile_dock_parked = False  # hidden while the Trends view is shown
        for key, grid in self._trios.items():
            grid.set_setup(lambda view, k=key, g=grid: self._setup_panel(k, g, view))
        self.profile_view.cleared.connect(self._clear_profile)
        self.profile_view.saved.connect(
            lambda path: self.statusBar().showMessage(f"Saved {path}", 8000))
        guard_wheel(self.atom_bar)
        _name_inputs_by_label(self)

    def _place_reference(self, u: float, v: float) -> None:
        """Put the pair view's reference electron where the user clicked (on the slice plane)."""
        state = self.model.state
        scale = length_factor(state.length_unit, 1.0)
        x, y, z = _point_mapper(state)(u, v)
        reference = (round(x / scale, 4), round(y / scale, 4), round(z / scale, 4))
        self.model.update(pair=replace(state.pair, reference=reference))

    def _setup_panel(self, key: str, grid: _PanelGrid, view: Any) -> None:
        """Wire a new panel of ``grid``: linked cursors, contours, profiles, the reference click."""
        signal = "cursor_moved" if isinstance(view, RadialView) else "hovered"
        for other in grid.all_views:
            if other is not view and getattr(other, "_wired", False):
                getattr(view, signal).connect(other.show_cursor)
                getattr(other, signal).connect(view.show_cursor)
        view._wired = True
        if isinstance(view, SliceView):
            view.use_external_contours(True)
            view.profile_requested.connect(
                lambda u0, v0, u1, v1, k=key, w=view: self._request_profile(k, w, (u0, v0), (u1, v1)))
        if key == "pair":
            view.clicked.connect(self._place_reference)

    def _build_menus(self) -> None:
        file_menu = self.menuBar().addMenu("&File")
        self._add(file_menu, "&Open session…", self.open_session, QKeySequence.StandardKey.Open)
        self.recent_menu = file_menu.addMenu("Recent sessions")
        self.sessions.recent_menu = self.recent_menu
        self._add(file_menu, "&Save session", self.save_session, QKeySequence.StandardKey.Save)
        self._add(file_menu, "Save session &as…", self.save_session_as,
                  QKeySequence.StandardKey.SaveAs)
        file_menu.addSeparator()
        self._add(file_menu, "Export &figure…", self.export_figure, QKeySequence("Ctrl+E"))
        self._add(file_menu, "Export &data…", self.export_data, QKeySequence("Ctrl+Shift+E"))
        file_menu.addSeparator()
        self._add(file_menu, "&Quit", self.close, QKeySequence.StandardKey.Quit)
        view_menu = self.menuBar().addMenu("&View")
        for index, text in enumerate(("&Radial curves", "&Slice", "&Pair densities",
                                      "&Two electrons", "T&erms")):
            self._add(view_menu, text, lambda i=index: self.tabs.setCurrentIndex(i),
                      QKeySequence(f"Ctrl+{index + 1}"))
        view_menu.addSeparator()
        self.compare_action = self._add(view_menu, "Side by &side", self._toggle_compare,
                                        QKeySequence("Ctrl+D"))
        self.compare_action.setCheckable(True)
        units = view_menu.addMenu("Units")
        group = QActionGroup(self)
        self.unit_actions = {}
        for key, text in (("bohr", "&bohr and hartree (atomic units)"), ("angstrom", "&angstrom and eV")):
            action = units.addAction(text)
            action.setCheckable(True)
            group.addAction(action)
            action.triggered.connect(lambda _c=False, k=key: self.model.update(length_unit=k))
            self.unit_actions[key] = action
        help_menu = self.menuBar().addMenu("&Help")
        self._add(help_menu, "&Help", lambda: show_help(self), QKeySequence(Qt.Key.Key_F1))
        self._add(help_menu, "&About Zeffir and model limits", lambda: show_about(self))
        self.sessions.refresh_recent()

    def _add(self, menu: Any, text: str, slot: Any, shortcut: Any = None) -> QAction:
        action = menu.addAction(text)
        action.triggered.connect(lambda _checked=False: slot())
        if shortcut is not None:
            action.setShortcut(shortcut)
        return action

    # -- state → widgets ------------------------------------------------------------
    @Slot(object, object)
    def _on_state_changed(self, new: ViewState, old: ViewState) -> None:
        # The picture is asked for first, so the worker computes it while this thread
        # brings the controls up to date; the panels it goes to exist before it is asked.
        if new.view in self._trios:
            self._trios[new.view].set_panels(*_panel_counts(new))
        if new.length_unit != old.length_unit:  # the segment of a profile, before its result
            self._rescale_profile(old.length_unit, new.length_unit)
        drawn = self._drawn.get(new.view)
        if new.view != old.view or view_inputs(new) != view_inputs(old):
            if drawn is None or view_inputs(drawn) != view_inputs(new):
                self._request_view(new)
            else:  # back to what the picture already shows: nothing to compute
                self._asked[new.view] = new
                self._trouble.pop(new.view, None)
        self._show_state(new)
        if (new.left, new.length_unit, _table_versus(new)) != (
                old.left, old.length_unit, _table_versus(old)):
            self._request_table(new.left)
        self._refresh_banner()

    def _show_state(self, state: ViewState) -> None:
        self.atom_bar.show_state(state.left, state.orbital)
        self.controls.show_state(state)
        self.table.select_subshell(state.orbital.subshell)
        self.tabs.blockSignals(True)
        self.tabs.setCurrentIndex(_VIEWS.index(state.view))
        self.tabs.blockSignals(False)
        # Line profiles belong to the plane views: their dock steps aside for the Trends
        # view (which needs the height) and comes back after it.
        if state.view == "trends" and not self.profile_dock.isHidden():
            self._profile_dock_parked = True
            self.profile_dock.hide()
        elif state.view != "trends" and self._profile_dock_parked:
            self._profile_dock_parked = False
            self.profile_dock.show()
        self.compare_action.setChecked(state.compare.enabled)
        self.unit_actions[state.length_unit].setChecked(True)
        # Only the view on screen gets its panels now; a grid off screen is set when its
        # tab is chosen (that is a state change too), so the window never builds panels
        # nobody sees.
        if state.view in self._trios:
            self._trios[state.view].set_panels(*_panel_counts(state))
        name = self.session_path.name if self.session_path else "untitled"
        self.setWindowTitle(f"Zeffir — {state.left.spec} ({name})")

    def _request_all(self) -> None:
        state = self.model.state
        self._request_table(state.left)
        self._request_view(state)

    def _request_table(self, source: Source) -> None:
        self._table_asked = source
        self._trouble.pop(JobKey.TABLE, None)
        state = self.model.state
        versus, unit = _table_versus(state), state.length_unit
        self.worker.request(JobKey.TABLE, lambda: _table_job(source, versus, unit))

    def _request_view(self, state: ViewState) -> None:
        recipe = VIEW_RECIPES[state.view]
        self._asked[state.view] = state
        self._trouble.pop(state.view, None)
        self._banner_timer.start()
        self.worker.request(JobKey.of_view(state.view), lambda s=state: (s, recipe.build(s)))

    # -- what is drawn against what was asked -----------------------------------------
    @property
    def state(self) -> ViewState:
        """The state the controls show (what the user asked for)."""
        return self.model.state

    def apply(self, state: ViewState) -> bool:
        """Adopt ``state`` as if the user had made those edits; False if it is invalid."""
        accepted = self.model.set_state(state)
        self._show_state(self.model.state)
        return accepted

    def drawn(self, view: str) -> ViewState | None:
        """The state the named view's current picture was computed from, or None.

        Views: ``radial``, ``slice``, ``pair``, ``two-electron`` and ``terms``.
        """
        return self._drawn.get(view)

    def problem(self) -> str | None:
        """None when the current view shows what the controls ask; else the standing message."""
        state = self.model.state
        view = state.view
        drawn = self._drawn.get(view)
        parts: list[str] = []
        if drawn is None or view_inputs(drawn) != view_inputs(state):
            showing = "nothing yet" if drawn is None else describe(drawn)
            reason = self._trouble.get(view, "computing…")
            parts.append(f"showing: {showing}; asked: {describe(state)} — {reason}")
        table_trouble = self._trouble.get(JobKey.TABLE)
        if table_trouble and self._table_drawn != state.left and view not in self._trouble:
            shown = "nothing" if self._table_drawn is None else _source_text(self._table_drawn)
            parts.append(f"table shows {shown}; asked: {_source_text(state.left)} — "
                         f"{table_trouble}")
        return " · ".join(parts) or None

    def retry(self) -> None:
        """Compute what the controls ask for again, forgetting remembered failures."""
        state = self.model.state
        for source in state.series():
            forget_failure(source)
        self._request_table(state.left)
        self._request_view(state)
        self._refresh_banner()

    def cancel(self) -> None:
        """Stop every running or waiting computation; the views say what they still show."""
        self.worker.cancel()
        for key in (*self._asked, JobKey.TABLE):
            if key == JobKey.TABLE:
                if self._table_asked is not None and self._table_asked != self._table_drawn:
                    self._trouble[JobKey.TABLE] = "cancelled"
                continue
            drawn = self._drawn.get(key)
            if drawn is None or view_inputs(drawn, key) != view_inputs(self._asked[key], key):
                self._trouble[key] = "cancelled"
        self._refresh_banner()

    def _refresh_banner(self) -> None:
        text = self.problem()
        computing = text is not None and all(
            part.endswith("computing…") for part in text.split(" · "))
        if computing and self._banner_timer.isActive():
            return  # still within the quiet delay
        self.banner_text.setText(text or "")
        self.banner.setVisible(text is not None)
        self.retry_button.setVisible(text is not None and not computing)

    @Slot(str, object)
    def _on_result(self, name: str, result: Any) -> None:
        key = JobKey(name)
        state = self.model.state
        if key == JobKey.TABLE:
            source, series, summary, notes = result
            self._table_drawn = source
            self._trouble.pop(JobKey.TABLE, None)
            self.table.show_series(series, state.orbital.subshell, state.length_unit)
            self.energy_line.setText(summary)
            self.notes_area.setText("\n".join(f"• {note}" for note in notes))
            self._refresh_banner()
            return
        if key == JobKey.PROFILE:
            self.profile_view.show_profile(result)
            if self.profile_dock.isHidden():
                self.profile_dock.show()
                # A strip under the views, not half the window: the slices keep their room.
                height = max(160, min(240, self.height() // 4))
                self.resizeDocks([self.profile_dock], [height], Qt.Orientation.Vertical)
            return
        if key == JobKey.EXPORT:
            self.last_export = result
            self.statusBar().showMessage(f"Exported {result}", 8000)
            return
        if key.traced_view is not None:
            for view, scene in zip(self._trios[key.traced_view].views, result, strict=False):
                view.show_contours(scene)
            return
        drawn_state, result = result
        self._drawn[key] = drawn_state
        self._trouble.pop(key, None)
        if key == JobKey.TERMS:
            self.terms_view.show_summary(result)
            self.statusBar().clearMessage()
            self._refresh_banner()
            return
        if key == JobKey.TRENDS:
            self.trend_view.show_scene(result)
            self.statusBar().clearMessage()
            self._refresh_banner()
            return
        parts = list(panels_of(result))
        trio = self._trios[key]
        for view, scene in zip(trio.views, parts, strict=False):
            view.set_scene(scene)
        if key == JobKey.RADIAL:
            for view in trio.views:  # every panel has its new curves: fit them together
                view.refit()  # type: ignore[union-attr]
            # Four or more panels are small: a legend equal to the first panel's is left out.
            # Subshell colours are the same in every panel, so the first legend serves all.
            subshells = [[c.subshell for c in p.curves] for p in parts]
            for index, view in enumerate(trio.views[:len(parts)]):
                repeated = index > 0 and subshells[index] == subshells[0] and len(parts) > 3
                view.set_legend_visible(not repeated)  # type: ignore[union-attr]
        if self._profile_segment is not None and self._profile_segment[0] == key:
            # The profile follows a new orbital, model or plane under the same segment.
            _, index, start, end = self._profile_segment
            shown = parts[min(index, len(parts) - 1)]
            self.worker.request(JobKey.PROFILE, lambda s=shown, a=start, b=end: line_profile(s, a, b))
        if key in (JobKey.SLICE, JobKey.PAIR) and drawn_state.slice.fit_extent:
            scale = length_factor(drawn_state.length_unit, 1.0)
            half = float(abs(parts[0].coordinates).max()) / scale
            self.controls.show_fitted_extent(half)
        if key in (JobKey.SLICE, JobKey.PAIR, JobKey.TWO_ELECTRON) and parts:
            self.controls.show_drawn_colour(key, parts[0])  # the limits drawn, for Manual to start from
        if key != JobKey.RADIAL:
            if key in (JobKey.SLICE, JobKey.PAIR):
                point_of = _point_mapper(state)
                for view in trio.views:
                    view.set_point_of(point_of)
            # Trace after the image has been painted, so the two never compete.
            # The window is the timer's context: a closed window's timer never fires.
            QTimer.singleShot(CONTOUR_DELAY_MS, self, lambda p=parts, k=key: self.worker.request(
                JobKey.contours_of(k), lambda: _contour_job(p)))
        self.statusBar().clearMessage()
        self._refresh_banner()

    @Slot(str, str)
    def _on_failure(self, name: str, message: str) -> None:
        key = JobKey(name)
        if key == JobKey.PROFILE:
            self.statusBar().showMessage(f"No line profile: {message}", 8000)
            return
        if key == JobKey.EXPORT:
            self.statusBar().clearMessage()
            QMessageBox.warning(self, "Nothing exported", message)
            return
        if key.traced_view is not None:
            self.statusBar().showMessage(f"Contour lines not drawn: {message}", 8000)
            return
        self._trouble[key] = f"failed: {message}"
        if key == JobKey.TERMS:
            self.terms_view.show_error(self.model.state.left.spec, message)
        self.statusBar().clearMessage()  # the last progress line would read as current
        self._banner_timer.stop()
        self._refresh_banner()

    @Slot(bool)
    def _on_busy(self, active: bool) -> None:
        # The indicator and Cancel appear only for work that lasts (BUSY_DELAY_MS): a
        # picture redrawn within a frame neither flickers them nor relays out the status
        # bar twice per change.
        if active:
            if self.progress.isHidden() and not self._busy_timer.isActive():
                self._busy_timer.start()
            return
        self._busy_timer.stop()
        self._show_busy(False)

    def _show_busy(self, active: bool) -> None:
        self.progress.setVisible(active)
        self.cancel_button.setVisible(active)

    def _request_profile(self, key: str, panel: Any, start: tuple[float, float],
                         end: tuple[float, float]) -> None:
        """Sample the panel the segment was drawn on; show the segment on its row's panels."""
        for other_key in ("slice", "pair", "two-electron"):
            for view in self._trios[other_key].all_views:
                if other_key == key:
                    view.set_profile_segment(*start, *end)
                else:
                    view.clear_profile()
        shown = self._trios[key].views
        index = shown.index(panel) if panel in shown else 0
        scene = shown[index].current_scene()
        if scene is None:
            return
        self._profile_segment = (key, index, start, end)
        self.worker.request(JobKey.PROFILE, lambda s=scene, a=start, b=end: line_profile(s, a, b))

    def _rescale_profile(self, old_unit: str, new_unit: str) -> None:
        """Keep the line profile's segment where it was on the atom after a change of units.

        The segment is held in display units; it is converted, drawn again, and the
        profile is sampled anew when the view's pictures in the new unit arrive.
        """
        if self._profile_segment is None:
            return
        key, index, start, end = self._profile_segment
        factor = length_factor(new_unit, 1.0) / length_factor(old_unit, 1.0)
        start = (start[0] * factor, start[1] * factor)
        end = (end[0] * factor, end[1] * factor)
        self._profile_segment = (key, index, start, end)
        for view in self._trios[key].all_views:
            view.set_profile_segment(*start, *end)
        self.profile_view.show_profile(None)  # until the profile in the new unit is sampled

    def _clear_profile(self) -> None:
        self._profile_segment = None
        for trio in (self.slice_trio, self.pair_trio, self.two_trio):
            for view in trio.all_views:
                view.clear_profile()

    def _open_configuration(self, spec: str, model: str) -> None:
        """A trend point was clicked: show that configuration under that model in the Radial view."""
        source = Source(spec, model or self.model.state.left.model)
        self.model.update(left=source, view="radial")

    def _select_subshell(self, label: str) -> None:
        current = self.model.state.orbital
        if label != current.subshell:
            self.model.update(orbital=OrbitalChoice(label, "real", 0))

    def _toggle_compare(self) -> None:
        compare = self.model.state.compare
        self.model.update(compare=replace(compare, enabled=not compare.enabled))

    # -- sessions and export (see _session_files and _figure_export) --------------------
    @property
    def session_path(self) -> Path | None:
        """The session file open in the window, if any."""
        return self.sessions.path

    def open_session(self, path: str | Path | None = None) -> bool:
        """Open a session file (asks for one if ``path`` is None); on error nothing changes."""
        return self.sessions.open(path)

    def save_session(self) -> bool:
        """Save to the current session file, or ask for one."""
        return self.sessions.save()

    def save_session_as(self, path: str | Path | None = None) -> bool:
        """Save the session under a new name."""
        return self.sessions.save_as(path)

    def export_figure(self, path: str | Path | None = None, width: str | None = None,
                      dpi: int | None = None) -> bool:
        """Export the current view as PNG, SVG or PDF; False when refused (nothing written)."""
        return self.exports.figure(path, width, dpi)

    def export_data(self, path: str | Path | None = None) -> bool:
        """Export the plotted data (CSV for radial curves, NPZ for slices); False when refused."""
        return self.exports.data(path)

    # -- Qt overrides ---------------------------------------------------------------
    def restore_layout(self) -> None:
        """Restore the window geometry and splitter positions saved when it last closed."""
        for key, restore in (("geometry", self.restoreGeometry),
                             ("splitter_body", self.body_splitter.restoreState),
                             ("splitter_views", self.views_and_table.restoreState)):
            value = self.settings.value(key)
            if value is not None:
                restore(value)

    def closeEvent(self, event: QCloseEvent) -> None:
        self.settings.setValue("geometry", self.saveGeometry())
        self.settings.setValue("splitter_body", self.body_splitter.saveState())
        self.settings.setValue("splitter_views", self.views_and_table.saveState())
        self.worker.shutdown()
        super().closeEvent(event)


def _table_versus(state: ViewState) -> tuple[Source, ...]:
    """The compared series after the main one, which the table reports too."""
    return state.series()[1:]


def _name_inputs_by_label(root: QWidget) -> None:
    """Give every input control the text of its visible label as its accessible name."""
    for label in root.findChildren(QLabel):
        buddy = label.buddy()
        text = label.text().replace("&", "").strip().rstrip(":")
        if buddy is not None and text and not buddy.accessibleName():
            buddy.setAccessibleName(text)
    for layout in root.findChildren(QFormLayout):
        for row in range(layout.rowCount()):
            label_item = layout.itemAt(row, QFormLayout.ItemRole.LabelRole)
            field_item = layout.itemAt(row, QFormLayout.ItemRole.FieldRole)
            if label_item is None or field_item is None:
                continue
            label, field = label_item.widget(), field_item.widget()
            if isinstance(label, QLabel) and field is not None and not field.accessibleName():
                field.setAccessibleName(label.text().replace("&", "").strip().rstrip(":"))
    for button in root.findChildren(QAbstractButton):
        if not button.accessibleName() and button.text():
            button.setAccessibleName(button.text().replace("&", ""))


def _point_mapper(state: ViewState) -> Any:
    """(u, v) in display units → (x, y, z) in display units, for the slice read-out."""
    normal, e1, e2 = plane_of(state.slice).basis()
    offset = state.slice.offset * length_factor(state.length_unit, 1.0)
    origin = offset * normal

    def point_of(u: float, v: float) -> tuple[float, float, float]:
        x, y, z = origin + u * e1 + v * e2
        return float(x), float(y), float(z)

    return point_of

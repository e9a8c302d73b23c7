"""Export from the window: the figure options dialog and the export commands.

The file is written by :func:`zeffir.export.export_view` from the state the controls
show, in the worker thread; an export is refused (no file written) while the view
does not show what the controls ask, or for the Terms table.
"""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path

from PySide6.QtCore import QSettings
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QFormLayout,
    QSpinBox,
    QStatusBar,
    QWidget,
)

from zeffir.state import ViewState
from zeffir.ui._jobs import JobKey
from zeffir.ui._state_model import StateModel
from zeffir.ui._worker import SceneWorker

__all__ = ["ExportOptions", "FigureExport"]


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


class FigureExport:
    """The window's Export figure and Export data commands.

    Parameters
    ----------
    parent : QWidget
        Owner of the dialogs.
    model : StateModel
        The state exported.
    worker : SceneWorker
        Runs the export (rendering takes about a second).
    settings : QSettings
        Remembers the folder, width and resolution.
    status : QStatusBar
        Where a refusal or progress is reported.
    problem : callable
        ``problem()`` → None, or why the view does not show what the controls ask.
    last_dir : callable
        ``last_dir()`` → the folder the file dialogs start in.
    """

    def __init__(self, parent: QWidget, model: StateModel, worker: SceneWorker, settings: QSettings,
                 status: QStatusBar, problem: Callable[[], str | None],
                 last_dir: Callable[[], str]) -> None:
        self._parent = parent
        self._model = model
        self._worker = worker
        self._settings = settings
        self._status = status
        self._problem = problem
        self._last_dir = last_dir

    def figure(self, path: str | Path | None = None, width: str | None = None,
               dpi: int | None = None) -> bool:
        """Export the current view as PNG, SVG or PDF (asks for a file and options if not given)."""
        if path is None:
            chosen, _ = QFileDialog.getSaveFileName(
                self._parent, "Export figure", self._last_dir(),
                "PNG image (*.png);;SVG drawing (*.svg);;PDF document (*.pdf)")
            if not chosen:
                return False
            options = ExportOptions(self._parent, str(self._settings.value("export_width", "single")),
                                    int(self._settings.value("export_dpi", 300)))
            if options.exec() != QDialog.DialogCode.Accepted:
                return False
            width, dpi = str(options.width_box.currentData()), options.dpi.value()
            self._settings.setValue("export_width", width)
            self._settings.setValue("export_dpi", dpi)
            path = chosen
        return self._export(Path(path), width, dpi or 300)

    def data(self, path: str | Path | None = None) -> bool:
        """Export the plotted data: CSV for radial curves and trends, NPZ for slices."""
        if path is None:
            radial = self._model.state.view in ("radial", "trends")
            chosen, _ = QFileDialog.getSaveFileName(
                self._parent, "Export data", self._last_dir(),
                "Comma-separated values (*.csv)" if radial else "NumPy archive (*.npz)")
            if not chosen:
                return False
            path = chosen
        return self._export(Path(path), None, 300)

    def _export(self, path: Path, width: str | None, dpi: int) -> bool:
        path = path.resolve()  # the worker writes later; the folder kept must be absolute
        if self._model.state.view == "terms":
            self._status.showMessage(
                "Not exported: the Terms view is a table; copy it with Ctrl+C, or use "
                "'zeffir terms SPEC --json'", 10000)
            return False
        problem = self._problem()
        if problem is not None:
            self._status.showMessage(
                f"Not exported: the view does not show what the controls ask ({problem})", 10000)
            return False

        def job(state: ViewState = self._model.state) -> Path:
            from zeffir.export import export_view

            export_view(state, path, width=width, dpi=dpi)
            return path

        self._settings.setValue("last_dir", str(path.parent))
        self._status.showMessage(f"Exporting {path.name}…")
        self._worker.request(JobKey.EXPORT, job)
        return True

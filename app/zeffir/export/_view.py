"""Export what the window shows: one entry point for the window and the command line."""

from __future__ import annotations

import os
from pathlib import Path
from typing import Final

from zeffir.export._data import DATA_FORMATS, write_data
from zeffir.export._errors import ExportError
from zeffir.export._figures import FIGURE_FORMATS, Target, check_figure_options, write_figure
from zeffir.scene import FIGURE_VIEWS, view_scene
from zeffir.state import ViewState

__all__ = ["EXPORT_FORMATS", "export_view", "view_target"]

#: Every suffix :func:`export_view` accepts.
EXPORT_FORMATS: Final[tuple[str, ...]] = (*FIGURE_FORMATS, *DATA_FORMATS)


def view_target(state: ViewState) -> Target:
    """The scenes the current view of ``state`` draws (:func:`zeffir.scene.view_scene`).

    Parameters
    ----------
    state : ViewState
        Validated view state; ``state.view`` picks the view, ``state.compare`` the series.

    Returns
    -------
    RadialScene, SliceScene, RadialComparison, SliceComparison, PairScenes or TwoElectronScenes
    """
    if state.view not in FIGURE_VIEWS:
        raise ExportError(f"the {state.view} view draws no figure of this kind")
    return view_scene(state)  # type: ignore[no-any-return]


def export_view(state: ViewState, path: str | os.PathLike[str], *, width: str | None = None,
                dpi: int = 300) -> Path:
    """Write the current view of ``state`` as a figure or a data file, chosen by the suffix.

    Parameters
    ----------
    state : ViewState
        What is on screen. It is validated first.
    path : str or path-like
        ``.png``, ``.svg``, ``.pdf`` (figure), ``.csv`` (radial data) or ``.npz`` (slice data).
    width : {"single", "double"}, optional
        Figure width (journal column); default double for comparisons, single otherwise.
    dpi : int
        Resolution of PNG figures.

    Returns
    -------
    Path
        The file written. It appears complete or not at all.

    Raises
    ------
    ExportError
        Unknown suffix (the message lists the accepted ones), a data format that does
        not suit the view, or a file that cannot be written.
    StateError
        ``state`` is invalid (the message names the field).
    """
    target_path = Path(path)
    if state.view == "terms":
        raise ExportError(f"{target_path}: the Terms view is a table, not a figure; "
                          "use 'zeffir terms SPEC --json' or copy the table")
    suffix = target_path.suffix.lower()
    if state.view == "trends":
        return _export_trend(state, target_path, width, dpi)
    if suffix not in EXPORT_FORMATS:
        raise ExportError(
            f"{target_path}: unknown file type {suffix or '(no suffix)'}; "
            f"use one of {', '.join(EXPORT_FORMATS)}"
        )
    if suffix == ".csv" and state.view != "radial":
        raise ExportError(f"{target_path}: .csv holds radial curves; save the {state.view} view "
                          "as .npz")
    if suffix == ".npz" and state.view == "radial":
        raise ExportError(f"{target_path}: .npz holds slice images; save the radial view as .csv")
    directory = target_path.parent
    if not directory.is_dir():
        # Fail before the (possibly long) evaluation; the writer would refuse anyway.
        raise ExportError(f"{target_path}: cannot write (No such file or directory)")
    if suffix in FIGURE_FORMATS:
        check_figure_options(width, dpi)
    state = state.validated()
    target = view_target(state)
    if suffix in DATA_FORMATS:
        return write_data(target, target_path)
    return write_figure(target, target_path, width=width, dpi=dpi)


def _export_trend(state: ViewState, path: Path, width: str | None, dpi: int) -> Path:
    """The Trends view as a figure or CSV (:func:`~zeffir.export.write_trend`)."""
    from zeffir.export._trend_files import TREND_FORMATS, write_trend

    suffix = path.suffix.lower()
    if suffix not in TREND_FORMATS:
        raise ExportError(f"{path}: a trend is written as {', '.join(TREND_FORMATS)}")
    if not path.parent.is_dir():
        raise ExportError(f"{path}: cannot write (No such file or directory)")
    if suffix in FIGURE_FORMATS:
        check_figure_options(width, dpi)
    state = state.validated()
    return write_trend(view_scene(state), path, width=width, dpi=dpi)

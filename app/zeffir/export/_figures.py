"""Publication figures (PNG, SVG, PDF) drawn from the scenes the window shows.

matplotlib is imported inside the functions, so importing :mod:`zeffir.export`
stays cheap and the window opens fast. Figures are built on
:class:`matplotlib.figure.Figure` directly, never through ``pyplot``: no backend
is selected and a running Qt application is left alone.
"""

from __future__ import annotations

import os
import textwrap
from collections.abc import Sequence
from dataclasses import replace
from pathlib import Path
from typing import TYPE_CHECKING, Any, Final, cast

import numpy as np

from zeffir import __version__
from zeffir.export._atomic import atomic_file
from zeffir.export._errors import ExportError
from zeffir.export._style import (
    COLUMN_WIDTHS,
    LINE_WIDTH,
    TICK_SIZE,
    rc_parameters,
    subshell_line_style,
)
from zeffir.scene import (
    PairScenes,
    RadialComparison,
    RadialScene,
    SliceComparison,
    SliceScene,
    TwoElectronScenes,
    colour_stops,
)

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.colors import Colormap
    from matplotlib.figure import Figure
    from matplotlib.image import AxesImage

__all__ = ["DPI_RANGE", "FIGURE_FORMATS", "Target", "check_figure_options", "write_figure"]

#: Figure formats, by file suffix.
FIGURE_FORMATS: Final[tuple[str, ...]] = (".png", ".svg", ".pdf")
#: Accepted resolutions of raster figures, dots per inch.
DPI_RANGE: Final[tuple[int, int]] = (50, 1200)

Target = RadialScene | SliceScene | RadialComparison | SliceComparison | PairScenes | TwoElectronScenes

_PANEL_LETTERS: Final = "abcdefgh"
#: matplotlib dash patterns of the series sharing one set of axes (the window's order).
_SERIES_DASHES: Final[tuple[Any, ...]] = ("-", (0, (5.0, 2.0)), (0, (1.0, 1.3)), (0, (5.0, 1.5, 1.0, 1.5)),
                                          (0, (8.0, 2.0)), (0, (2.5, 1.5)))
_TOTAL_WIDTH: Final = 1.3
_EMPHASIS_WIDTH: Final = 1.5
_MARKER_WIDTH: Final = 0.6
_MARKER_DASHES: Final[dict[str, Any]] = {"r_max": (0, (4.0, 2.0)), "mean": (0, (1.0, 1.5))}
_MARKER_NAMES: Final[dict[str, str]] = {"r_max": r"$r_\mathrm{max}$", "mean": "⟨r⟩", "node": "node"}
_GUIDE_GREY: Final = "#555555"
_NODE_TICK: Final = 2  # matplotlib's TICKUP marker
_CONTOUR_GREY: Final = "#6e6e6e"


def write_figure(target: Target, path: str | os.PathLike[str], *, width: str | None = None,
                 dpi: int = 300, difference: bool | None = None) -> Path:
    """Draw a scene or a comparison as a publication figure; the format follows the suffix.

    Parameters
    ----------
    target : RadialScene, SliceScene, RadialComparison, SliceComparison, PairScenes or TwoElectronScenes
        What the view shows (from :mod:`zeffir.scene`): every panel it holds is drawn.
    path : str or path-like
        Output file: ``.png`` (raster at ``dpi``), ``.svg`` or ``.pdf`` (vector; the
        slice image is embedded at its own resolution).
    width : {"single", "double"}, optional
        Journal column width: 3.35 in (85 mm) or 7.0 in (178 mm). Default: double for
        comparisons, single otherwise.
    dpi : int
        Dots per inch of the PNG (and of the rasterised parts of vector files),
        between 50 and 1200. A single-column PNG is ``round(3.35 * dpi)`` pixels wide.
    difference : bool, optional
        For two-series comparisons: ``False`` leaves out the difference panel the
        comparison holds (the pair and two-electron views always keep their three).

    Returns
    -------
    Path
        The file written (atomically: on failure nothing is left behind).

    Raises
    ------
    ExportError
        Unknown suffix, width or resolution; or the file cannot be written.
    """
    target_path = Path(path)
    suffix = target_path.suffix.lower()
    if suffix not in FIGURE_FORMATS:
        raise ExportError(
            f"{target_path}: a figure is written as {', '.join(FIGURE_FORMATS)} "
            f"(not {suffix or 'a name without suffix'})"
        )
    check_figure_options(width, dpi)
    if not isinstance(target, Target):
        raise ExportError(f"{target_path}: cannot draw a {type(target).__name__}")
    if difference is False and isinstance(target, RadialComparison | SliceComparison):
        target = replace(target, difference=None)
    # Comparisons and the three-panel views need the double column (an overlay too: its
    # legend lists every series).
    width = width or ("single" if isinstance(target, RadialScene | SliceScene) else "double")

    import matplotlib

    with matplotlib.rc_context(cast(Any, rc_parameters())):
        figure = _draw(target, COLUMN_WIDTHS[width])
        metadata = _metadata(suffix)
        with atomic_file(target_path) as stream:
            figure.savefig(stream, format=suffix[1:], dpi=int(dpi), metadata=metadata)
    return target_path


def check_figure_options(width: str | None, dpi: int) -> None:
    """Raise :class:`ExportError` unless ``width`` is a column name (or None) and ``dpi`` in range."""
    if width is not None and width not in COLUMN_WIDTHS:
        raise ExportError(f"width: {width!r} is not one of {', '.join(COLUMN_WIDTHS)}")
    if isinstance(dpi, bool) or not isinstance(dpi, int | np.integer) or not (
            DPI_RANGE[0] <= dpi <= DPI_RANGE[1]):
        raise ExportError(f"dpi: {dpi!r} is not a whole number between {DPI_RANGE[0]} and {DPI_RANGE[1]}")


def _metadata(suffix: str) -> dict[str, Any]:
    creator = f"zeffir {__version__}"
    if suffix == ".png":
        return {"Software": creator}
    if suffix == ".pdf":
        # No creation date: the same view exports to the same bytes.
        return {"Creator": creator, "Producer": creator, "CreationDate": None}
    # SVG: no date either; the rc salt fixes the generated ids (see _style.rc_parameters).
    return {"Creator": creator, "Date": None}


def _draw(target: Target, width: float) -> Figure:
    if isinstance(target, RadialScene):
        return _radial_figure([target], width, None)
    if isinstance(target, RadialComparison):
        if target.overlay is not None:
            return _radial_figure([target.overlay], width, target.difference)
        return _radial_figure(list(target.series), width, target.difference)
    if isinstance(target, SliceScene):
        return _slice_figure(target, width)
    if isinstance(target, PairScenes | TwoElectronScenes):
        # The first two panels share a colour scale; the third (exchange hole,
        # triplet − singlet) has its own.
        return _slice_panels_figure(list(target.panels), 2, width)
    return _slice_panels_figure(list(target.panels), len(target.series), width)


def _grid(count: int, side_by_side: bool) -> tuple[int, int]:
    """(rows, columns) of ``count`` panels: one row up to three, else two rows; stacked in a column."""
    if not side_by_side:
        return count, 1
    if count <= 3:
        return 1, count
    return 2, (count + 1) // 2


def _new_figure(width: float, height: float, images: bool = False) -> Figure:
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    # "compressed" closes the gaps equal-aspect images would leave between panels.
    figure = Figure(figsize=(width, height), layout="compressed" if images else "constrained")
    FigureCanvasAgg(figure)
    return figure


# --- radial -----------------------------------------------------------------------------------

Styles = dict[str | None, dict[str, Any]]


def _curve_styles(scenes: Sequence[RadialScene]) -> Styles:
    """Colour and dash of every curve, by subshell as in the window; the total in black."""
    styles: Styles = {None: {"color": "black", "linestyle": "-"}}
    for scene in scenes:
        for index, curve in enumerate(scene.curves):
            if curve.subshell is not None and curve.subshell not in styles:
                colour, dash = subshell_line_style(curve.subshell, index)
                styles[curve.subshell] = {"color": colour, "linestyle": dash}
    return styles


def _radial_figure(scenes: list[RadialScene], width: float, delta: RadialScene | None) -> Figure:
    styles = _curve_styles(scenes)
    if len(scenes) == 1 and delta is None:
        scene = scenes[0]
        figure = _new_figure(width, width * (0.74 if width < 5 else 0.5))
        ax = figure.subplots()
        _draw_radial(ax, scene, styles)
        _bottom_at_zero([ax], [scene])
        ax.set_title(scene.title, loc="left", pad=3.0)
        handles, labels = _legend_entries(scenes, styles, by_label=not scene.series_names)
        if len(handles) > 8:
            ax.legend(handles, labels, loc="upper left", bbox_to_anchor=(1.02, 1.0), borderaxespad=0.0)
        else:
            ax.legend(handles, labels, loc="best", ncols=2 if len(handles) > 5 else 1)
        return figure
    panels = [*scenes, *([delta] if delta is not None else [])]
    side_by_side = width >= 5
    rows, columns = _grid(len(panels), side_by_side)
    if side_by_side:
        row_height = min(0.36 * width, 3.0) if columns == 3 else 0.42 * width
        figure = _new_figure(width, row_height * rows)
    else:
        # A single column has no room for panels side by side: stack them, sharing r.
        figure = _new_figure(width, 1.75 * len(panels) + 0.5)
    grid = figure.subplots(rows, columns, sharex=True, squeeze=False)
    axes = [ax for row in grid for ax in row]
    for spare in axes[len(panels):]:
        spare.set_visible(False)
    axes = axes[:len(panels)]
    for ax, scene in zip(axes, scenes, strict=False):
        _draw_radial(ax, scene, styles)
    # The series share one y scale, so equal heights mean equal values.
    series_axes = axes[:len(scenes)]
    for ax in series_axes[1:]:
        ax.sharey(series_axes[0])
    series_axes[0].autoscale()
    _bottom_at_zero(series_axes, scenes)
    if delta is not None:
        _draw_radial(axes[-1], delta, styles, zero_line=True)
    if side_by_side:
        for index, ax in enumerate(series_axes):
            if index % columns:
                ax.set_ylabel("")
                ax.tick_params(labelleft=False)
        for ax in axes[:len(axes) - columns]:
            ax.set_xlabel("")
    else:
        for ax in axes[:-1]:
            ax.set_xlabel("")
            ax.tick_params(labelbottom=False)
        for ax in axes:
            # Stacked panels are short: the weighting goes on a second line.
            ax.set_ylabel(ax.get_ylabel().replace(", ", ",\n", 1))
    for index, (ax, scene) in enumerate(zip(axes, panels, strict=True)):
        ax.set_title(f"({_PANEL_LETTERS[index]}) {scene.title}", loc="left", pad=3.0)
    # One legend above the panels, so that no panel's curves hide behind it. Subshells keep
    # their colour in every panel; entries name subshells when the two sides' labels differ
    # (another spec, other occupancies).
    same = (all([c.label for c in s.curves] == [c.label for c in scenes[0].curves] for s in scenes)
            and not scenes[0].series_names)
    handles, labels = _legend_entries(scenes, styles, by_label=same)
    columns = min(len(handles), 10 if side_by_side else 4)
    figure.legend(handles, labels, loc="outside upper center", ncols=columns)
    return figure


def _bottom_at_zero(axes: Sequence[Axes], scenes: Sequence[RadialScene]) -> None:
    """D(r) and Q(r) are never negative: start their axis at zero (shared axes together)."""
    if any(s.quantity not in ("D", "Q") for s in scenes):
        return
    if all(float(np.nanmin(c.y)) >= 0.0 for s in scenes for c in s.curves if c.y.size):
        for ax in axes:
            ax.set_ylim(bottom=0.0)


def _draw_radial(ax: Axes, scene: RadialScene, styles: Styles, zero_line: bool = False) -> None:
    emphasise = scene.highlight is not None and len(scene.curves) > 1
    for order, curve in enumerate(scene.curves):
        style = dict(styles.get(curve.subshell, styles[None]))
        if scene.series_names:  # several series on these axes: the dash names the series
            style["linestyle"] = _SERIES_DASHES[curve.series % len(_SERIES_DASHES)]
        if curve.subshell is None:
            style.update(linewidth=_TOTAL_WIDTH, zorder=3.0)
        elif emphasise and curve.subshell == scene.highlight:
            style.update(linewidth=_EMPHASIS_WIDTH, zorder=4.0)
        else:
            style.update(linewidth=LINE_WIDTH, zorder=2.0 + order * 1e-3)
        ax.plot(curve.x, curve.y, label=curve.label, **style)
    if scene.log_r:
        ax.set_xscale("log")
    xs = [c.x for c in scene.curves if c.x.size]
    if xs:
        ax.set_xlim(min(float(x[0]) for x in xs), max(float(x[-1]) for x in xs))
    if zero_line or scene.quantity in ("R", "P"):
        ax.axhline(0.0, color=_GUIDE_GREY, linewidth=0.4, zorder=1.0)
    _draw_markers(ax, scene, styles)
    ax.set_xlabel(scene.x_label)
    ax.set_ylabel(scene.y_label)
    ax.tick_params(which="both", direction="in", top=True, right=True)
    ax.minorticks_on()
    formatter = ax.yaxis.get_major_formatter()
    if hasattr(formatter, "set_useMathText"):
        formatter.set_useMathText(True)


def _draw_markers(ax: Axes, scene: RadialScene, styles: Styles) -> None:
    for marker in scene.markers:
        colour = styles.get(marker.subshell, styles[None])["color"]
        if scene.series_names and marker.kind == "mean":
            continue  # several series: r_max and nodes only, as in the window
        if scene.series_names and marker.kind != "node":
            # Several series: each series' markers in its own line style, not the kind's.
            ax.axvline(marker.x, color=colour, linewidth=_MARKER_WIDTH, zorder=1.5,
                       linestyle=_SERIES_DASHES[marker.series % len(_SERIES_DASHES)])
            continue
        if marker.kind == "node":
            # A short tick rising from the bottom frame at the node's radius.
            ax.plot([marker.x], [0.0], transform=ax.get_xaxis_transform(), linestyle="none",
                    marker=_NODE_TICK, markersize=6.0, markeredgewidth=1.0, color=colour,
                    clip_on=False, zorder=5.0)
        else:
            ax.axvline(marker.x, color=colour, linewidth=_MARKER_WIDTH,
                       linestyle=_MARKER_DASHES.get(marker.kind, "-"), zorder=1.5)


def _legend_entries(scenes: Sequence[RadialScene], styles: Styles,
                    by_label: bool) -> tuple[list[Any], list[str]]:
    """Legend handles: one per curve (or per subshell), then the marker kinds drawn, in grey."""
    from matplotlib.lines import Line2D

    handles: list[Any] = []
    labels: list[str] = []
    seen: set[str | None] = set()
    emphasised = {s.highlight for s in scenes if s.highlight is not None and len(s.curves) > 1}
    for scene in scenes:
        for curve in scene.curves:
            if curve.subshell in seen:
                continue
            seen.add(curve.subshell)
            width = (_TOTAL_WIDTH if curve.subshell is None
                     else _EMPHASIS_WIDTH if curve.subshell in emphasised else LINE_WIDTH)
            style = dict(styles.get(curve.subshell, styles[None]))
            if scene.series_names:
                style["linestyle"] = "-"  # colour names the subshell; the series rows follow
            handles.append(Line2D([], [], linewidth=width, **style))
            labels.append(curve.label if by_label else (curve.subshell or "total"))
    for scene in scenes:
        for index, name in enumerate(scene.series_names):
            handles.append(Line2D([], [], color="black", linewidth=LINE_WIDTH,
                                  linestyle=_SERIES_DASHES[index % len(_SERIES_DASHES)]))
            labels.append(name)
    several = any(s.series_names for s in scenes)
    kinds = [k for k in ("r_max", "mean", "node") if any(m.kind == k for s in scenes for m in s.markers)
             and not (several and k == "mean")]
    for kind in kinds:
        if several and kind == "r_max":
            handles.append(Line2D([], [], color=_GUIDE_GREY, linewidth=_MARKER_WIDTH, linestyle="-"))
        elif kind == "node":
            handles.append(Line2D([], [], linestyle="none", marker="|", markersize=6.0,
                                  markeredgewidth=1.0, color=_GUIDE_GREY))
        else:
            handles.append(Line2D([], [], color=_GUIDE_GREY, linewidth=_MARKER_WIDTH,
                                  linestyle=_MARKER_DASHES[kind]))
        labels.append(_MARKER_NAMES[kind])
    return handles, labels


# --- slices -----------------------------------------------------------------------------------


def _colour_map(signed: bool, name: str | None = None) -> Colormap:
    """The window's map ``name`` (its stops from :func:`zeffir.scene.colour_stops`) for matplotlib."""
    from matplotlib.colors import LinearSegmentedColormap

    positions, colours = colour_stops(signed, name)
    label = f"zeffir-{name or ('diverging' if signed else 'sequential')}"
    return LinearSegmentedColormap.from_list(label, list(zip(positions, colours, strict=True)), N=256)


def _extent(coordinates: np.ndarray) -> tuple[float, float, float, float]:
    """Image edges: the grid coordinates are pixel centres."""
    half = 0.5 * float(coordinates[1] - coordinates[0]) if coordinates.size > 1 else 0.5
    low, high = float(coordinates[0]) - half, float(coordinates[-1]) + half
    return low, high, low, high


def _draw_slice(ax: Axes, scene: SliceScene) -> AxesImage:
    low, high = scene.colour_range
    image = ax.imshow(scene.image, origin="lower", extent=_extent(scene.coordinates), aspect="equal",
                      cmap=_colour_map(scene.signed, scene.colour_map), vmin=low, vmax=high,
                      interpolation="nearest")
    u = scene.coordinates
    finite = scene.image[np.isfinite(scene.image)]
    if scene.levels and finite.size:
        inside = [v for v in scene.levels if finite.min() < v < finite.max()]
        if inside:
            if scene.signed:
                # Negative values dashed: the sign stays readable in greyscale print.
                ax.contour(u, u, scene.image, levels=inside, colors=_CONTOUR_GREY, linewidths=0.4,
                           linestyles=["dashed" if v < 0 else "solid" for v in inside])
            else:
                # Light lines read on the dark end of the sequential map.
                ax.contour(u, u, scene.image, levels=inside, colors="white", alpha=0.55,
                           linewidths=0.4, linestyles="solid")
    if scene.zero_contour and finite.size and finite.min() < 0.0 < finite.max():
        ax.contour(u, u, scene.zero_contour_field(), levels=[0.0], colors="black", linewidths=0.7,
                   linestyles="solid")
    if scene.marker is not None:  # the reference electron of the pair view
        ax.plot(*scene.marker, marker="+", markersize=7, markeredgewidth=1.2, color="#e6007e")
        ax.plot(*scene.marker, marker="o", markersize=7, markerfacecolor="none",
                markeredgewidth=0.8, color="#e6007e")
    ax.set_xlabel(scene.axis_labels[0])
    ax.set_ylabel(scene.axis_labels[1])
    # A full frame; ticks outside, where the image cannot hide them.
    ax.tick_params(which="both", direction="out", top=False, right=False)
    return image


def _colour_bar(figure: Figure, image: AxesImage, beside: Axes, label: str) -> None:
    """A colour bar exactly as tall as the image beside it.

    The bar is a child of the image's axes, so it follows the equal-aspect box and the
    layout makes room for it.
    """
    from matplotlib.ticker import MaxNLocator

    holder = beside.inset_axes((1.04, 0.0, 0.055, 1.0))
    bar = figure.colorbar(image, cax=holder)
    bar.set_label(label)
    bar.outline.set_linewidth(0.6)
    bar.locator = MaxNLocator(nbins=8, steps=[1, 2, 2.5, 5, 10])
    bar.update_ticks()
    holder.tick_params(labelsize=TICK_SIZE, width=0.6, length=2.5, direction="out")
    formatter = holder.yaxis.get_major_formatter()
    if hasattr(formatter, "set_useMathText"):
        formatter.set_useMathText(True)


def _trim_height(figure: Figure) -> None:
    """Remove the empty bands equal-aspect images leave above and below at a fixed width.

    The width is the journal's column, so only the height gives: lay out (the
    "compressed" layout gathers the panels), measure the height the drawing uses,
    shrink the figure to it, and repeat until it fits.
    """
    pad = 0.04
    for _ in range(4):
        figure.draw_without_rendering()  # runs the layout, draws no pixels
        width, height = figure.get_size_inches()
        used = figure.get_tightbbox().height
        if height - used < 2.5 * pad:
            return
        figure.set_size_inches(width, used + 2.0 * pad)


def _title_lines(*parts: str, limit: int = 46) -> str:
    """The parts on one line if they fit in ``limit`` characters, else each on its own (wrapped)."""
    joined = "; ".join(parts)
    if len(joined) <= limit:
        return joined
    return "\n".join(textwrap.fill(part, limit, break_long_words=False) for part in parts)


def _slice_figure(scene: SliceScene, width: float) -> Figure:
    figure = _new_figure(width, width * (0.9 if width < 5 else 0.72), images=True)
    ax = figure.subplots()
    image = _draw_slice(ax, scene)
    _colour_bar(figure, image, ax, scene.value_label)
    ax.set_title(_title_lines(scene.title, scene.plane_text), loc="left", pad=3.0)
    _trim_height(figure)
    return figure


def _slice_panels_figure(scenes: list[SliceScene], shared: int, width: float) -> Figure:
    """Several slice panels: the first ``shared`` on one colour scale, the rest on their own."""
    panels = len(scenes)
    side_by_side = width >= 5
    rows, columns = _grid(panels, side_by_side)
    if side_by_side:
        figure = _new_figure(width, width * (0.38 if columns >= 3 else 0.5) * rows, images=True)
    else:
        # A single column: stack the panels, sharing x.
        figure = _new_figure(width, 0.85 * width * panels, images=True)
    grid = figure.subplots(rows, columns, sharex=True, sharey=True, squeeze=False)
    axes = [ax for row in grid for ax in row]
    for spare in axes[panels:]:
        spare.set_visible(False)
    axes = axes[:panels]
    images = [_draw_slice(ax, scene) for ax, scene in zip(axes, scenes, strict=True)]
    for index, ax in enumerate(axes):
        if index % columns:
            ax.set_ylabel("")
            ax.tick_params(labelleft=False)
        if index < panels - columns:
            ax.set_xlabel("")
            ax.tick_params(labelbottom=False)
    # Panels on one colour scale carry one bar at the end of each row they fill; a panel
    # with its own scale (a difference, the exchange hole) has its own bar. Stacked in a
    # single column, every panel carries a bar.
    for index, (ax, image, scene) in enumerate(zip(axes, images, scenes, strict=True)):
        own = index >= shared
        row_end = index % columns == columns - 1 or index == shared - 1
        if own or not side_by_side or row_end:
            _colour_bar(figure, image, ax, scene.value_label)
    for index, (ax, scene) in enumerate(zip(axes, scenes, strict=True)):
        ax.set_title(f"({_PANEL_LETTERS[index]}) {scene.title}", loc="left", pad=3.0)
    figure.suptitle(scenes[0].plane_text, fontsize=TICK_SIZE, x=0.01, ha="left")
    _trim_height(figure)
    return figure

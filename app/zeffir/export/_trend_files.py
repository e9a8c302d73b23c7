"""Trend figures (PNG, SVG, PDF) and data (CSV), drawn from a :class:`~zeffir.scene.TrendScene`.

The figure has one line per model (colour) and method (line style) with a marker at
each point, gaps where a model refused, NIST's values as open black circles where
they apply, the periodic-table blocks shaded along a Z axis and, with a reference, a
second panel of each series' difference from it.
"""

from __future__ import annotations

import math
import os
from pathlib import Path
from typing import Any, Final, cast

import zeffir.core
from zeffir.export._atomic import atomic_file, write_atomic
from zeffir.export._data import CAUTION, version_note
from zeffir.export._errors import ExportError
from zeffir.export._figures import FIGURE_FORMATS, _metadata, _new_figure, check_figure_options
from zeffir.export._style import COLUMN_WIDTHS, rc_parameters
from zeffir.scene import TrendLine, TrendScene, line_colours

__all__ = ["TREND_FORMATS", "trend_csv_text", "write_trend"]

#: What a trend is written as, by suffix.
TREND_FORMATS: Final[tuple[str, ...]] = (*FIGURE_FORMATS, ".csv")
_METHOD_STYLES: Final[dict[str | None, Any]] = {None: "-", "koopmans": "-", "delta-scf": (0, (4.0, 1.6))}
_MARKERS: Final = "osD^vP*Xh"
_BLOCK_SHADES: Final[dict[str, str]] = {"s": "#f1f1f1", "p": "#ffffff", "d": "#e8eef6", "f": "#f6efe6"}


def write_trend(scene: TrendScene, path: str | os.PathLike[str], *, width: str | None = None,
                dpi: int = 300) -> Path:
    """Write a trend as a figure (``.png``, ``.svg``, ``.pdf``) or its numbers (``.csv``).

    Parameters
    ----------
    scene : TrendScene
    path : str or path-like
        The suffix chooses the format. The CSV has one row per configuration: ``spec``,
        ``Z``, ``charge``, ``x``, then one column per series and, with a reference,
        ``reference`` and one ``difference`` column per series; ``#`` lines name the
        series, the unit and the source.
    width : {"single", "double"}, optional
        Journal column width (default single).
    dpi : int
        Resolution of a PNG.

    Returns
    -------
    Path
        The file written, atomically.

    Raises
    ------
    ExportError
        An unknown suffix, width or resolution, or a file that cannot be written.
    """
    target = Path(path)
    suffix = target.suffix.lower()
    if suffix not in TREND_FORMATS:
        raise ExportError(f"{target}: a trend is written as {', '.join(TREND_FORMATS)} "
                          f"(not {suffix or 'a name without suffix'})")
    if suffix == ".csv":
        return write_atomic(target, trend_csv_text(scene))
    check_figure_options(width, dpi)
    import matplotlib

    with matplotlib.rc_context(cast(Any, rc_parameters())):
        figure = _trend_figure(scene, COLUMN_WIDTHS[width or "single"])
        with atomic_file(target) as stream:
            figure.savefig(stream, format=suffix[1:], dpi=int(dpi), metadata=_metadata(suffix))
    return target


_MODEL_STYLES: Final[tuple[Any, ...]] = ("-", (0, (4.0, 1.6)), (0, (1.0, 1.3)), (0, (5.0, 1.5, 1.0, 1.5)))


def _draw_lines(ax: Any, lines: tuple[TrendLine, ...], styles: list[tuple[str, int]]) -> None:
    for index, line in enumerate(lines):
        empty = all(math.isnan(v) for v in line.y)  # the model defines no such number
        colour, rank = styles[index]
        dash = _METHOD_STYLES.get(line.method, "-")
        if line.subshell is not None and rank:  # several subshells: the model sets the style
            dash = _MODEL_STYLES[rank % len(_MODEL_STYLES)]
        ax.plot(line.x, line.y, color=colour, linestyle=dash,
                marker=_MARKERS[index % len(_MARKERS)], markersize=2.6, linewidth=0.9,
                label=f"{line.name} (no values)" if empty else line.name)


def _shade_blocks(ax: Any, scene: TrendScene) -> None:
    for start, stop, letter in scene.blocks:
        ax.axvspan(start, stop, color=_BLOCK_SHADES.get(letter, "#ffffff"), zorder=0, linewidth=0)
        if stop - start >= 2:
            ax.text((start + stop) / 2, 1.0, letter, transform=ax.get_xaxis_transform(), ha="center",
                    va="bottom", fontsize=6, color="#666666")


def _trend_figure(scene: TrendScene, width: float) -> Any:
    panels = 2 if scene.reference is not None else 1
    figure = _new_figure(width, width * (0.62 if panels == 1 else 0.95))
    axes = figure.subplots(panels, 1, sharex=True, squeeze=False, height_ratios=[2, 1][:panels])
    main = axes[0][0]
    colours = line_colours(scene)
    _shade_blocks(main, scene)
    _draw_lines(main, scene.lines, colours)
    if scene.reference is not None:
        main.plot(scene.reference.x, scene.reference.y, linestyle="none", marker="o", markersize=3.2,
                  markerfacecolor="none", markeredgecolor="#000000", markeredgewidth=0.7,
                  label=scene.reference.name)
    main.set_ylabel(scene.y_label)
    main.set_title(scene.title, loc="left", pad=8.0 if scene.blocks else 3.0)
    main.legend(loc="best", fontsize=6)
    bottom = main
    if scene.reference is not None:
        bottom = axes[1][0]
        _shade_blocks(bottom, scene)
        _draw_lines(bottom, scene.differences, colours)
        bottom.axhline(0.0, color="#555555", linewidth=0.6)
        unit = f" / {scene.unit}" if scene.unit else ""
        bottom.set_ylabel(f"computed − NIST{unit}")
    if not scene.by_z:
        bottom.set_xticks([x for x, _ in scene.x_ticks], [text for _, text in scene.x_ticks],
                          rotation=45, ha="right")
    bottom.set_xlabel(scene.x_label)
    return figure


def _number(value: float) -> str:
    return "" if math.isnan(value) else repr(float(value))


def trend_csv_text(scene: TrendScene) -> str:
    """The CSV text of a trend (see :func:`write_trend`)."""
    unit = scene.unit or "1"
    first = scene.lines[0] if scene.lines else None
    if first is None:
        raise ExportError("trend data: there is no series to write")
    names = ["spec", "Z", "charge", "x", *(f"series_{i + 1}" for i in range(len(scene.lines)))]
    reference = {}
    if scene.reference is not None:
        reference = dict(zip(scene.reference.specs, scene.reference.y, strict=True))
        names += ["reference", *(f"difference_{i + 1}" for i in range(len(scene.differences)))]
    notes = [
        "Zeffir trend data: the line above names the columns, these '#' lines describe them, "
        "one row per configuration follows",
        version_note(),
        f"quantity: {scene.quantity}; values in {unit}; "
        f"x is {'Z' if scene.by_z else 'the position in the list'}",
        *(f"series_{i + 1}: {line.name}" for i, line in enumerate(scene.lines)),
        "an empty value is a gap: the model refused that configuration or defines no such number "
        "(the window's tooltips and zeffir trend --json give the reason)",
    ]
    if scene.reference is not None:
        notes.append(f"reference: {scene.reference.notes[0][0] if scene.reference.notes else 'NIST'}")
        notes.append("difference_k: series_k − reference")
    notes += [f"constants: {zeffir.core.CODATA_EDITION} (via scipy.constants)", f"caution: {CAUTION}"]
    rows = []
    by_spec = [dict(zip(line.specs, line.y, strict=True)) for line in scene.lines]
    differences = [dict(zip(line.specs, line.y, strict=True)) for line in scene.differences]
    for index, spec in enumerate(first.specs):
        cells = [spec, str(scene.zs[index]), str(scene.charges[index]), repr(first.x[index]),
                 *(_number(values.get(spec, math.nan)) for values in by_spec)]
        if scene.reference is not None:
            cells += [_number(reference.get(spec, math.nan)),
                      *(_number(values.get(spec, math.nan)) for values in differences)]
        rows.append(",".join(_quoted(cell) for cell in cells))
    lines = [",".join(names), *(f"# {note}" for note in notes), *rows]
    return "\n".join(lines) + "\n"


def _quoted(cell: str) -> str:
    return f'"{cell}"' if ("," in cell or " " in cell) else cell

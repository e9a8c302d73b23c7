"""Data files of a view: CSV for radial curves, NPZ for slices, both with their metadata.

The arrays written are the scene's own arrays, unrounded (CSV uses the shortest text
that reads back to the same double), so what is exported is exactly what is shown.
"""

from __future__ import annotations

import json
import os
from pathlib import Path
from typing import Any, Final

import numpy as np

from zeffir import __version__
from zeffir.core import CODATA_EDITION
from zeffir.export._atomic import atomic_file, write_atomic
from zeffir.export._errors import ExportError
from zeffir.scene import (
    QUANTITIES,
    PairScenes,
    RadialComparison,
    RadialScene,
    SliceComparison,
    SliceScene,
    TwoElectronScenes,
    unit_text,
)

__all__ = ["CAUTION", "DATA_FORMATS", "write_data"]

#: Data formats, by file suffix.
DATA_FORMATS: Final[tuple[str, ...]] = (".csv", ".npz")

#: The caution every data file carries.
CAUTION: Final[str] = (
    "model estimate: non-relativistic, no electron correlation except where stated, point nucleus; "
    "for insight and figures, not a substitute for validated production calculations"
)


#: What a slice-type view computes (one or several image panels).
SliceTarget = SliceScene | SliceComparison | PairScenes | TwoElectronScenes


def write_data(target: RadialScene | RadialComparison | SliceTarget,
               path: str | os.PathLike[str]) -> Path:
    """Write the numbers of a view: ``.csv`` for radial scenes, ``.npz`` for slices.

    Parameters
    ----------
    target : RadialScene, RadialComparison, SliceScene, SliceComparison, PairScenes or TwoElectronScenes
        What the view shows.
    path : str or path-like
        ``.csv`` (radial): ``#`` header lines (spec, model, quantity, units, Zeffir
        version, CODATA edition, caution), one row of column names, then r and one
        column per curve; the columns of a two-series comparison are prefixed
        ``left:``, ``right:`` and ``difference:``, those of more series
        ``series 1:``, ``series 2:``….
        ``.npz`` (slice): arrays ``values`` (the quantity in display units, ``[j, i]`` at
        (u_i, v_j)), ``image`` (what is mapped to colours), ``u`` (grid coordinates; v = u),
        ``nodal_u``, ``nodal_v`` (the nodal lines drawn, ψ = 0 of a signed quantity:
        polylines in the plane's coordinates and the file's length unit, NaN between
        pieces; empty when none is drawn) and ``metadata`` (a JSON string); a
        comparison adds ``left_values``, ``right_values``, ``difference``
        (= right − left), ``right_image``, ``difference_image`` and the nodal lines
        of each panel (``left_nodal_u``, ``right_nodal_u``, ``difference_nodal_u``
        and their ``_v``), while ``values``, ``image`` and ``nodal_u``/``nodal_v``
        are the left panel's. Every panel of a view with several is also written
        under its panel name: ``{name}_values``, ``{name}_image``,
        ``{name}_nodal_u``/``_v`` with names ``series_1``, ``series_2``…,
        ``difference`` (comparisons), ``same_spin``, ``opposite_spin``,
        ``exchange_hole`` (pair view) or ``singlet``, ``triplet``, ``difference``
        (two-electron view); the metadata's ``panels`` lists them in drawing order.

    Returns
    -------
    Path
        The file written (atomically).

    Raises
    ------
    ExportError
        A suffix that does not suit the target (curves go to CSV, slices to NPZ), or
        the file cannot be written.
    """
    target_path = Path(path)
    suffix = target_path.suffix.lower()
    radial = isinstance(target, RadialScene | RadialComparison)
    sliced = isinstance(target, SliceTarget)
    if suffix not in DATA_FORMATS:
        raise ExportError(f"{target_path}: data are written as {', '.join(DATA_FORMATS)} "
                          f"(not {suffix or 'a name without suffix'})")
    if radial and suffix == ".npz":
        raise ExportError(f"{target_path}: radial curves are written as .csv, not .npz "
                          "(.npz holds slice images)")
    if sliced and suffix == ".csv":
        raise ExportError(f"{target_path}: a slice is written as .npz, not .csv "
                          "(.csv holds radial curves)")
    if isinstance(target, RadialScene | RadialComparison):
        return write_atomic(target_path, _radial_csv(target))
    if isinstance(target, SliceTarget):
        arrays = _slice_arrays(target)
        with atomic_file(target_path) as stream:
            np.savez_compressed(stream, **arrays)
        return target_path
    raise ExportError(f"{target_path}: cannot write data of a {type(target).__name__}")


# --- radial: CSV -----------------------------------------------------------------------------


def _number(value: float) -> str:
    # repr is the shortest text that reads back to the same double; "nan"/"inf" stay readable.
    return repr(float(value))


def _radial_csv(target: RadialScene | RadialComparison) -> str:
    if isinstance(target, RadialScene):
        panels = [("", target)]
        head = target
    else:
        names = (("left:", "right:") if len(target.series) == 2
                 else tuple(f"series {i + 1}:" for i in range(len(target.series))))
        panels = list(zip(names, target.series, strict=True))
        if target.difference is not None:
            panels.append(("difference:", target.difference))
        head = target.left
    x = _shared_x(panels)
    names = ["r"]
    columns: list[np.ndarray] = [x]
    for prefix, scene in panels:
        for curve in scene.curves:
            names.append(f"{prefix}{curve.label}")
            columns.append(curve.y)
    quantity = QUANTITIES[head.quantity]
    lines = ["# Zeffir radial data"]
    if isinstance(target, RadialComparison):
        lines += [f"# {prefix} spec {scene.spec}; model {scene.model}"
                  for prefix, scene in panels if prefix != "difference:"]
        if target.difference is not None:
            lines.append("# difference: right − left, curve by curve")
    else:
        lines += [f"# spec: {head.spec}", f"# model: {head.model}"]
    y_unit = head.y_label.split(" / ", 1)[1] if " / " in head.y_label else head.y_label
    lines += [
        f"# quantity: {quantity.key}, {quantity.name}; {quantity.formula}",
        f"# units: r in {head.x_label.split(' / ', 1)[-1]}; every other column in {y_unit}",
        f"# written by zeffir {__version__}; constants {CODATA_EDITION} (via scipy.constants)",
        f"# caution: {CAUTION}",
        ",".join(_csv_field(name) for name in names),
    ]
    table = np.column_stack(columns)
    body = "\n".join(",".join(_number(v) for v in row) for row in table.tolist())
    return "\n".join(lines) + "\n" + body + "\n"


def _csv_field(text: str) -> str:
    if any(ch in text for ch in ',"\n'):
        return '"' + text.replace('"', '""') + '"'
    return text


def _shared_x(panels: list[tuple[str, RadialScene]]) -> np.ndarray:
    curves = [c for _, scene in panels for c in scene.curves]
    if not curves:
        raise ExportError("radial data: the view has no curves to write")
    x = curves[0].x
    if any(c.x.shape != x.shape or not np.array_equal(c.x, x) for c in curves[1:]):
        raise ExportError("radial data: the curves do not share one r grid")
    return x


# --- slices: NPZ -----------------------------------------------------------------------------


def _slice_metadata(scene: SliceScene) -> dict[str, Any]:
    length = "bohr" if scene.length_unit == "bohr" else "Å"
    quantity = QUANTITIES.get(scene.quantity)
    if quantity is not None:
        name, formula = quantity.name, quantity.formula
        value_unit = unit_text(scene.length_unit, quantity.length_power)
    else:
        # The two-electron maps are not slice quantities: their colour bar label
        # ("symbol / unit") and plane text are what names them on screen.
        symbol, _, value_unit = scene.value_label.rpartition(" / ")
        name, formula = f"two-electron map: {scene.plane_text}", symbol
    return {
        "title": scene.title,
        "spec": scene.spec,
        "model": scene.model,
        "orbital": scene.orbital,
        "quantity": scene.quantity,
        "quantity_name": name,
        "formula": formula,
        "plane_text": scene.plane_text,
        "axis_labels": list(scene.axis_labels),
        "value_label": scene.value_label,
        "units": {
            "u": length,
            "values": value_unit,
            "image": f"log10 of {value_unit}" if scene.log_scale else value_unit,
        },
        "signed": scene.signed,
        "log_scale": scene.log_scale,
        "colour_range": [float(v) for v in scene.colour_range],
        "colour_map": scene.colour_map,
        "contour_levels": [float(v) for v in scene.levels],
    }


def _slice_arrays(target: SliceScene | SliceComparison) -> dict[str, Any]:
    common = {
        "zeffir_version": __version__,
        "constants": f"{CODATA_EDITION} (via scipy.constants)",
        "caution": CAUTION,
        "layout": "values[j, i] is at (u[i], v[j]); v = u",
        "nodal_lines": "nodal_u, nodal_v: the nodal lines drawn (zero contour of a signed quantity) "
                       "as (u, v) points in the unit of u; a NaN in both separates polylines; "
                       "empty when none is drawn",
    }
    if isinstance(target, SliceScene):
        metadata = {"kind": "zeffir-slice", **common, **_slice_metadata(target)}
        arrays = {"values": target.values, "image": target.image, **_nodal_arrays("", target)}
        coordinates = target.coordinates
    else:
        panels = list(zip((n.replace(" ", "_") for n in target.panel_names), target.panels,
                          strict=True))
        first = panels[0][1]
        metadata = {
            "kind": _SLICE_KINDS[type(target)],
            **common,
            "arrays": "values, image, nodal_u, nodal_v: the first panel; {name}_values, "
                      "{name}_image, {name}_nodal_u, {name}_nodal_v: each panel by name",
            "panels": [name for name, _ in panels],
            **{name: _slice_metadata(scene) for name, scene in panels},
        }
        arrays = {"values": first.values, "image": first.image, **_nodal_arrays("", first)}
        for name, scene in panels:
            arrays |= {f"{name}_values": scene.values, f"{name}_image": scene.image,
                       **_nodal_arrays(f"{name}_", scene)}
        if isinstance(target, SliceComparison) and len(target.series) == 2:
            # The names of two-series files from before several series existed.
            metadata["arrays"] += ("; left_*, right_*: the two series; difference = "
                                   "right_values − left_values")
            metadata |= {"left": _slice_metadata(target.left), "right": _slice_metadata(target.right)}
            arrays |= {"left_values": target.left.values, "right_values": target.right.values,
                       "right_image": target.right.image,
                       **_nodal_arrays("left_", target.left), **_nodal_arrays("right_", target.right)}
            if target.difference is not None:
                arrays["difference"] = target.difference.values
        coordinates = first.coordinates
    text = json.dumps(metadata, ensure_ascii=False, indent=1)
    return {**{k: np.asarray(v) for k, v in arrays.items()}, "u": np.asarray(coordinates),
            "metadata": np.asarray(text)}


_SLICE_KINDS: Final[dict[type, str]] = {
    SliceComparison: "zeffir-slice-comparison",
    PairScenes: "zeffir-pair-densities",
    TwoElectronScenes: "zeffir-two-electron-maps",
}


def _nodal_arrays(prefix: str, scene: SliceScene) -> dict[str, np.ndarray]:
    """``{prefix}nodal_u`` and ``{prefix}nodal_v``: the panel's nodal lines as drawn."""
    # The very polylines the view draws (traced once, reused), so a script sees the
    # nodes on screen; a scene exported before its contours were traced traces them here.
    lines = scene.nodal_lines()
    return {f"{prefix}nodal_u": np.ascontiguousarray(lines[:, 0]),
            f"{prefix}nodal_v": np.ascontiguousarray(lines[:, 1])}

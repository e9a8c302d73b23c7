"""Data files of a view: CSV for radial curves, NPZ for slices, both with their metadata.

The arrays written are the scene's own arrays, unrounded (CSV uses the shortest text
that reads back to the same double), so what is exported is exactly what is shown.

Format version 2 (this layout; files without a ``format_version`` are version 1):

- CSV: the row of column names comes first and every name carries its unit in
  ASCII (``r_bohr``, ``D_3s_per_bohr``; see :func:`unit_token`), so
  ``numpy.genfromtxt(path, delimiter=",", names=True, comments="#")`` and
  ``pandas.read_csv(path, comment="#")`` both read the file and keep the names
  exactly as written. The ``#`` note lines follow it (genfromtxt takes the first
  line for the names even when it is a ``#`` line, so the notes cannot come
  first). Version 1 had the notes first and legend text as names
  (``"left:1s, 2 electrons"``). Series prefixes are now the panel names
  (``series_1_``, ``series_2_``, ``difference_``) for two series as for more
  (version 1: ``left:``, ``right:``, ``difference:``, ``series 1:``…).
- NPZ: every panel is stored once, under its panel name; the left/right copies
  and the first panel's unprefixed copy of version 1 are gone; ``image`` is
  stored only where it is not ``values`` itself; the plane's geometry is
  stored as numbers (``origin``, ``axis_u``, ``axis_v``, ``normal``, ``offset``).
- Both name ``zeffir_version`` and ``format_version``.
"""

from __future__ import annotations

import json
import os
from pathlib import Path
from typing import Any, Final

import numpy as np

import zeffir.core
from zeffir import __version__
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
    length_factor,
    length_symbol,
    unit_text,
    values_label,
)

__all__ = ["CAUTION", "DATA_FORMATS", "FORMAT_VERSION", "UNIT_TOKENS_NOTE", "unit_token",
           "unit_token_of_text", "version_note", "write_data"]

#: Data formats, by file suffix.
DATA_FORMATS: Final[tuple[str, ...]] = (".csv", ".npz")

#: Layout version of the CSV and NPZ files written (version 1: before it was stated).
FORMAT_VERSION: Final[int] = 2

#: The caution every data file carries.
CAUTION: Final[str] = (
    "model estimate: non-relativistic, no electron correlation except where stated, point nucleus; "
    "for insight and figures, not a substitute for validated production calculations"
)

#: What a slice-type view computes (one or several image panels).
SliceTarget = SliceScene | SliceComparison | PairScenes | TwoElectronScenes

# Powers of length a written quantity can carry, and their ASCII spelling in column names.
_POWER_SPELLING: Final[dict[float, str]] = {
    1.0: "{L}", 0.0: "electrons", -0.5: "per_{L}1_2", -1.0: "per_{L}", -1.5: "per_{L}3_2",
    -2.0: "per_{L}2", -3.0: "per_{L}3",
}
_LENGTH_NAMES: Final[dict[str, str]] = {"bohr": "bohr", "angstrom": "angstrom"}

#: The unit spellings of column names, as a note line for the files.
UNIT_TOKENS_NOTE: Final[str] = (
    "units in column names: bohr, angstrom (Å); per_bohr = bohr⁻¹, per_bohr1_2 = bohr⁻¹ᐟ², "
    "per_bohr3_2 = bohr⁻³ᐟ², per_bohr2 = bohr⁻², per_bohr3 = bohr⁻³ (per_angstrom… likewise "
    "in Å); electrons = a number of electrons"
)


def unit_token(length_unit: str, power: float) -> str:
    """ASCII spelling of length^power in a column name: letters, digits and ``_`` only.

    Such names pass ``numpy.genfromtxt(..., names=True)`` unchanged (it turns spaces
    into ``_`` and drops ``/ - ^ ( ) : .``, which would merge ``bohr⁻¹`` and ``bohr``).

    Parameters
    ----------
    length_unit : {"bohr", "angstrom"}
    power : float
        One of 1, 0, −1/2, −1, −3/2, −2, −3.

    Returns
    -------
    str

    Examples
    --------
    >>> unit_token("bohr", -1.5), unit_token("angstrom", -1.0), unit_token("bohr", 0.0)
    ('per_bohr3_2', 'per_angstrom', 'electrons')
    """
    if length_unit not in _LENGTH_NAMES or power not in _POWER_SPELLING:
        raise ExportError(f"no column unit for length^{power:g} in {length_unit!r}")
    return _POWER_SPELLING[power].format(L=_LENGTH_NAMES[length_unit])


#: unit_text (as on screen, e.g. "bohr⁻³ᐟ²") → the column-name spelling.
_TOKEN_OF_TEXT: Final[dict[str, str]] = {
    unit_text(unit, power): unit_token(unit, power)
    for unit in _LENGTH_NAMES for power in _POWER_SPELLING
}


def unit_token_of_text(text: str) -> str | None:
    """The column-name spelling of a unit as shown on screen (``'Å⁻³'`` → ``'per_angstrom3'``).

    None when ``text`` is not a power of bohr or Å that the files spell.
    """
    return _TOKEN_OF_TEXT.get(text.strip())


def write_data(target: RadialScene | RadialComparison | SliceTarget,
               path: str | os.PathLike[str]) -> Path:
    """Write the numbers of a view: ``.csv`` for radial scenes, ``.npz`` for slices.

    Parameters
    ----------
    target : RadialScene, RadialComparison, SliceScene, SliceComparison, PairScenes or TwoElectronScenes
        What the view shows.
    path : str or path-like
        **.csv** (radial curves). Line 1: the column names, each ending in its unit
        (``r_bohr``; ``{Q}_{subshell}_{unit}`` and ``{Q}_total_{unit}`` with Q one of
        R, P, D, Q; units spelled as in :func:`unit_token`: ``per_bohr3_2`` is
        bohr⁻³ᐟ²). A comparison prefixes each curve with its panel name:
        ``series_1_``, ``series_2_``… and ``difference_`` (= series 2 − series 1,
        matched by subshell); an overlay writes the same columns as its series.
        Then ``#`` note lines (format and Zeffir version, spec and model of each
        series, quantity, units, constants, caution), then one row per r.
        Read with ``numpy.genfromtxt(path, delimiter=",", names=True, comments="#")``
        or ``pandas.read_csv(path, comment="#")``; both keep the names as written.

        **.npz** (slice-type views). A single slice holds ``values`` (the quantity in
        the units of ``metadata["units"]["values"]``, ``values[j, i]`` at
        (u[i], v[j])), ``u`` (grid coordinates, v = u, in the file's length unit),
        ``nodal_u``, ``nodal_v`` (the nodal lines drawn: (u, v) polylines, NaN
        between pieces, empty when none is drawn), ``image`` only when the colours
        are not ``values`` themselves (a log scale: ``image`` is log10 of values,
        floored; so image is values unless ``metadata["log_scale"]``), the plane
        ``origin``, ``axis_u``, ``axis_v``, ``normal`` (3-vectors; origin in the
        length unit, the axes unit vectors) and ``offset`` (scalar, length unit), so
        grid point (i, j) is at ``origin + u[i]·axis_u + u[j]·axis_v``, and
        ``metadata`` (a JSON string: ``kind``, ``format_version``,
        ``zeffir_version``, units, spec, model, colour scale…).

        A view of several panels stores each panel once, under its name, with the
        same arrays prefixed: ``{name}_values``, ``{name}_image`` (only where it
        differs from ``{name}_values``: a log scale, or the exchange hole, whose
        colours are its depth −h), ``{name}_nodal_u``, ``{name}_nodal_v``. Names:
        ``series_1``, ``series_2``…, ``difference`` (= series_2 − series_1) for
        comparisons; ``same_spin``, ``opposite_spin``, ``exchange_hole`` (pair
        view, with the reference electron in the metadata); ``singlet``,
        ``triplet``, ``difference`` (= triplet − singlet, two-electron view). The
        metadata's ``panels`` lists the names in drawing order, ``values_panel``
        names the main one (what a single slice calls ``values``), and each name
        keys that panel's own metadata (``description``, ``image``, units…).
        The two-electron maps are not on a plane: their files have no plane
        arrays, and ``metadata["plane"]`` says what u and v are instead.

    Returns
    -------
    Path
        The file written (atomically).

    Raises
    ------
    ExportError
        A suffix that does not suit the target (curves go to CSV, slices to NPZ), or
        the file cannot be written.

    Notes
    -----
    Format version 2 (see the module docstring for what changed from version 1).
    A script reads any slice-type file with::

        meta = json.loads(str(data["metadata"]))
        for name in meta.get("panels", [""]):
            key = f"{name}_" if name else ""
            values = data[key + "values"]
            image = data.get(key + "image", values)
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


def version_note() -> str:
    """The note line naming both versions (shared by every CSV Zeffir writes)."""
    return f"format_version: {FORMAT_VERSION}; zeffir_version: {__version__}"


# --- radial: CSV -----------------------------------------------------------------------------


def _number(value: float) -> str:
    # repr is the shortest text that reads back to the same double; "nan"/"inf" stay readable.
    return repr(float(value))


def _radial_panels(target: RadialScene | RadialComparison) -> list[tuple[str, RadialScene]]:
    """(prefix, scene) of each set of columns; the overlay repeats its series, so it is not one."""
    if isinstance(target, RadialScene):
        return [("", target)]
    panels = [(f"series_{i + 1}_", scene) for i, scene in enumerate(target.series)]
    if target.difference is not None:
        panels.append(("difference_", target.difference))
    return panels


def _radial_csv(target: RadialScene | RadialComparison) -> str:
    panels = _radial_panels(target)
    head = panels[0][1]
    x = _shared_x(panels)
    quantity = QUANTITIES[head.quantity]
    unit = head.length_unit
    y_token = unit_token(unit, quantity.length_power)
    names = [f"r_{unit_token(unit, 1.0)}"]
    columns: list[np.ndarray] = [x]
    for prefix, scene in panels:
        for curve in scene.curves:
            names.append(f"{prefix}{quantity.key}_{curve.subshell or 'total'}_{y_token}")
            columns.append(curve.y)
    if len(set(names)) != len(names):
        raise ExportError("radial data: two curves would share one column name")
    y_unit = head.y_label.split(" / ", 1)[1] if " / " in head.y_label else head.y_label
    notes = [
        "Zeffir radial data: the line above names the columns, these '#' lines describe them, "
        "one row per r follows",
        version_note(),
    ]
    for prefix, scene in panels:
        curves = "; ".join(c.label for c in scene.curves)
        if prefix == "difference_":
            notes.append(f"difference: series_2 − series_1, curve by curve (matched by subshell): {curves}")
        elif prefix:
            notes.append(f"{prefix[:-1]}: spec {scene.spec}; model {scene.model}; curves: {curves}")
        else:
            notes += [f"spec: {scene.spec}", f"model: {scene.model}", f"curves: {curves}"]
    notes += [
        f"quantity: {quantity.key}, {quantity.name}; {quantity.formula}",
        f"units: r in {length_symbol(unit)}; every other column in {y_unit}",
        UNIT_TOKENS_NOTE,
        f"constants: {zeffir.core.CODATA_EDITION} (via scipy.constants)",
        f"caution: {CAUTION}",
        "read with numpy.genfromtxt(path, delimiter=',', names=True, comments='#') "
        "or pandas.read_csv(path, comment='#')",
    ]
    lines = [",".join(names), *(f"# {_one_line(note)}" for note in notes)]
    table = np.column_stack(columns)
    body = "\n".join(",".join(_number(v) for v in row) for row in table.tolist())
    return "\n".join(lines) + "\n" + body + "\n"


def _one_line(text: str) -> str:
    # A note must stay one '#' line; a comma or quote in it is harmless (readers skip the line).
    return " ".join(str(text).split())


def _shared_x(panels: list[tuple[str, RadialScene]]) -> np.ndarray:
    curves = [c for _, scene in panels for c in scene.curves]
    if not curves:
        raise ExportError("radial data: the view has no curves to write")
    x = curves[0].x
    if any(c.x.shape != x.shape or not np.array_equal(c.x, x) for c in curves[1:]):
        raise ExportError("radial data: the curves do not share one r grid")
    return x


# --- slices: NPZ -----------------------------------------------------------------------------


def _image_note(scene: SliceScene, stored: bool) -> str:
    if not stored:
        return "values (not stored apart)"
    if scene.log_scale:
        return "log10 of values, floored a decade below the colour scale (stored apart)"
    if np.array_equal(scene.image, -scene.values, equal_nan=True):
        return "−values, the depth of the exchange hole (stored apart)"
    return "the colour image (stored apart)"


def _panel_metadata(scene: SliceScene, stored_image: bool, name: str = "",
                    description: str | None = None) -> dict[str, Any]:
    length = length_symbol(scene.length_unit)
    symbol, _, value_unit = values_label(scene).rpartition(" / ")
    quantity = QUANTITIES.get(scene.quantity)
    key = scene.quantity
    if description is None and quantity is not None:
        what, formula = quantity.name, quantity.formula
        value_unit = unit_text(scene.length_unit, quantity.length_power)
    else:
        # Pair and two-electron panels are named by what they hold, not by the
        # slice quantity their grid was set up with.
        what, formula = description or scene.plane_text, symbol
        key = name or key
    image_unit = f"log10 of {value_unit}" if scene.log_scale else value_unit
    return {
        "title": scene.title,
        "spec": scene.spec,
        "model": scene.model,
        "orbital": scene.orbital,
        "quantity": key,
        "quantity_name": what,
        "formula": formula,
        "plane_text": scene.plane_text,
        "axis_labels": list(scene.axis_labels),
        "value_label": scene.value_label,
        "units": {"u": length, "values": value_unit, "image": image_unit},
        "image": _image_note(scene, stored_image),
        "signed": scene.signed,
        "log_scale": scene.log_scale,
        "colour_range": [float(v) for v in scene.colour_range],
        "colour_map": scene.colour_map,
        "contour_levels": [float(v) for v in scene.levels],
    }


def _descriptions(target: SliceTarget, names: list[str]) -> dict[str, str | None]:
    """What each panel holds, in its own words (None: the slice quantity says it)."""
    if isinstance(target, PairScenes):
        arrow = "↑" if target.spin == "up" else "↓"
        other = "↓" if target.spin == "up" else "↑"
        return {
            "same_spin": f"density of the other {arrow} electrons at r₂, given the reference "
                         f"electron {arrow} at r₁: ρ₂{arrow}{arrow}(r₁, r₂)/ρ{arrow}(r₁)",
            "opposite_spin": f"density of the {other} electrons at r₂, given the reference "
                             f"electron {arrow} at r₁: ρ₂{arrow}{other}(r₁, r₂)/ρ{arrow}(r₁)",
            "exchange_hole": f"exchange hole hₓ{arrow}(r₁; r₂) of the reference electron (≤ 0; "
                             f"integrates to −1 over all r₂)",
        }
    if isinstance(target, TwoElectronScenes):
        what = ("radial pair distribution P(r₁, r₂), angles integrated" if target.map_kind == "radial"
                else "two-electron wavefunction ψ(s₁ẑ, s₂ẑ), both electrons on the z axis")
        return {"singlet": f"singlet (S = 0): {what}", "triplet": f"triplet (S = 1): {what}",
                "difference": f"triplet − singlet: {what}"}
    descriptions: dict[str, str | None] = dict.fromkeys(names)
    if isinstance(target, SliceComparison) and target.difference is not None:
        quantity = QUANTITIES.get(target.difference.quantity)
        what = quantity.name if quantity is not None else target.difference.quantity
        descriptions["difference"] = f"series_2 − series_1 of the {what} (physical values, not logs)"
    return descriptions


def _plane_arrays(scenes: list[SliceScene]) -> dict[str, np.ndarray]:
    """origin, axis_u, axis_v, normal and offset of the panels' common plane (none if off-plane)."""
    planes = {scene.plane for scene in scenes}
    if planes == {None}:
        return {}
    if len(planes) != 1:
        raise ExportError("slice data: the panels do not lie on one plane")
    plane = scenes[0].plane
    assert plane is not None
    scale = length_factor(scenes[0].length_unit, 1.0)
    normal, e1, e2 = plane.basis()
    return {
        "origin": plane.offset * scale * normal,
        "axis_u": e1,
        "axis_v": e2,
        "normal": normal,
        "offset": np.asarray(plane.offset * scale),
    }


def _image_differs(scene: SliceScene) -> bool:
    return scene.image is not scene.values and not np.array_equal(scene.image, scene.values,
                                                                  equal_nan=True)


def _slice_arrays(target: SliceTarget) -> dict[str, Any]:
    if isinstance(target, SliceScene):
        panels = [("", target)]
    else:
        panels = [(name.replace(" ", "_"), scene)
                  for name, scene in zip(target.panel_names, target.panels, strict=True)]
    scenes = [scene for _, scene in panels]
    first = scenes[0]
    if any(not np.array_equal(s.coordinates, first.coordinates) for s in scenes[1:]):
        raise ExportError("slice data: the panels do not share one grid")
    length = length_symbol(first.length_unit)
    geometry = _plane_arrays(scenes)
    metadata: dict[str, Any] = {
        "kind": _SLICE_KINDS[type(target)],
        "format_version": FORMAT_VERSION,
        "zeffir_version": __version__,
        "constants": f"{zeffir.core.CODATA_EDITION} (via scipy.constants)",
        "caution": CAUTION,
        "length_unit": length,
        "layout": "values[j, i] is at (u[i], v[j]); v = u; "
                  "an image array is stored only where it is not values itself",
        "nodal_lines": "nodal_u, nodal_v: the nodal lines drawn (zero contour of a signed quantity) "
                       "as (u, v) points in the unit of u; a NaN in both separates polylines; "
                       "empty when none is drawn",
    }
    if geometry:
        metadata["plane"] = (f"grid point (i, j) is at origin + u[i]·axis_u + u[j]·axis_v; origin "
                             f"and offset in {length}, axis_u, axis_v and normal unit vectors; "
                             f"origin = offset·normal")
    else:
        metadata["plane"] = (f"none: the two-electron maps are not on a plane, so no plane arrays; "
                             f"u is {first.axis_labels[0]}, v is {first.axis_labels[1]}")
    arrays: dict[str, np.ndarray] = {}
    descriptions = _descriptions(target, [name for name, _ in panels])
    for name, scene in panels:
        prefix = f"{name}_" if name else ""
        stored = _image_differs(scene)
        arrays[f"{prefix}values"] = np.asarray(scene.values)
        if stored:
            arrays[f"{prefix}image"] = np.asarray(scene.image)
        arrays |= _nodal_arrays(prefix, scene)
        panel = _panel_metadata(scene, stored, name, descriptions.get(name))
        if name:
            metadata[name] = panel
        else:
            metadata |= panel
    if not isinstance(target, SliceScene):
        metadata["panels"] = [name for name, _ in panels]
        metadata["values_panel"] = panels[0][0]
        metadata["arrays"] = ("{name}_values, {name}_nodal_u, {name}_nodal_v for each name in "
                              "panels; {name}_image only where it differs from {name}_values "
                              "(see each panel's 'image'); u and the plane arrays are shared")
    if isinstance(target, SliceComparison):
        metadata["series"] = [{"panel": f"series_{i + 1}", "spec": s.spec, "model": s.model}
                              for i, s in enumerate(target.series)]
    if isinstance(target, PairScenes):
        scale = length_factor(first.length_unit, 1.0)
        metadata["reference_electron"] = {
            "position": [c * scale for c in target.reference],
            "position_unit": length,
            "spin": target.spin,
            "determinant": target.determinant,
            "hole_integral": target.hole_integral,
            "hole_depth": target.hole_depth,
            "hole_depth_unit": unit_text(first.length_unit, -3.0),
        }
    if isinstance(target, TwoElectronScenes):
        metadata["map_kind"] = target.map_kind
    text = json.dumps(metadata, ensure_ascii=False, indent=1)
    return {**arrays, "u": np.asarray(first.coordinates), **geometry, "metadata": np.asarray(text)}


_SLICE_KINDS: Final[dict[type, str]] = {
    SliceScene: "zeffir-slice",
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

"""The slice view's content: a 2D array in display units with its colour scale."""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from zeffir.core import Plane, density_on_plane, orbital_density_on_plane, orbital_on_plane
from zeffir.core.orbitals import FloatArray, real_label
from zeffir.scene._build import orbitals_for, short_model_name
from zeffir.scene._contours import ContourPaths, stray_zeros, trace_contours
from zeffir.scene._quantities import QUANTITIES, length_factor, length_symbol, unit_text
from zeffir.state import OrbitalChoice, SliceSettings, Source

__all__ = ["LOG_DECADES", "SliceScene", "orbital_name", "plane_of", "slice_scene"]

#: Decades shown below the maximum on a logarithmic colour scale.
LOG_DECADES = 6.0


@dataclass(frozen=True)
class SliceScene:
    """Everything the slice view draws (and a slice export writes).

    Attributes
    ----------
    values : ndarray
        The quantity in display units, ``values[j, i]`` at (u_i, v_j).
    image : ndarray
        What is mapped to colours: ``values``, or log10 of it on a log scale.
    coordinates : ndarray
        u (= v) of the grid in display length units.
    signed : bool
        True for ψ: a diverging scale symmetric about zero.
    colour_range : (float, float)
        Limits of the colour scale in ``image`` units.
    levels : tuple of float
        Contour levels in ``image`` units (the zero level, for ψ, is drawn apart).
    """

    title: str
    spec: str
    model: str
    orbital: str
    quantity: str
    plane_text: str
    axis_labels: tuple[str, str]
    value_label: str
    length_unit: str
    values: FloatArray
    image: FloatArray
    coordinates: FloatArray
    signed: bool
    log_scale: bool
    colour_range: tuple[float, float]
    levels: tuple[float, ...]
    zero_contour: bool
    contours: ContourPaths | None = None
    marker: tuple[float, float] | None = None  # (u, v) of a point to mark, display units

    def with_contours(self) -> SliceScene:
        """This scene with its contour lines traced (see :func:`trace_contours`)."""
        paths = trace_contours(self.image, self.coordinates, self.levels, self.signed,
                               self.zero_contour_field() if self.zero_contour else None)
        return replace(self, contours=paths)

    def zero_contour_field(self) -> FloatArray:
        """``image`` with the exact zeros that are not on a node masked (NaN).

        Beyond a radial function's tabulated range, or where an exponential
        underflows, ψ is exactly 0; contouring level 0 there would draw lines that
        are not nodes. A node can also pass exactly through grid points (a nodal
        plane at an odd resolution, s₁ = s₂ of a triplet); those zeros have both
        signs around them and are kept, or the node would vanish (see
        :func:`~zeffir.scene._contours.stray_zeros`).
        """
        return np.where(stray_zeros(self.values), np.nan, self.image)

    def nodal_lines(self) -> FloatArray:
        """The nodal lines as drawn: (u, v) rows in display units, NaN rows between pieces.

        The traced ``contours.zero`` when the scene has them, else the zero level
        traced the same way; shape (0, 2) for a quantity without a sign.
        """
        if not self.zero_contour:
            return np.empty((0, 2))
        if self.contours is not None:
            return self.contours.zero
        return trace_contours(self.image, self.coordinates, (), self.signed,
                              self.zero_contour_field()).zero


def plane_of(settings: SliceSettings) -> Plane:
    """The core's Plane for the slice settings (all lengths in bohr)."""
    if settings.plane == "custom":
        return Plane(settings.normal, settings.offset, settings.extent, settings.resolution)
    return Plane.named(settings.plane, settings.offset, settings.extent, settings.resolution)


def _axis_names(settings: SliceSettings) -> tuple[str, str]:
    if settings.plane in ("xy", "xz", "yz"):
        return settings.plane[0], settings.plane[1]
    return "u", "v"


def orbital_name(choice: OrbitalChoice, l: int) -> str:
    """``'3px'``, ``'4fxyz'`` for real orbitals; ``'3p, m = -1'`` for complex ones."""
    n = choice.subshell[:-1]
    if choice.kind == "real":
        return f"{n}{real_label(l, choice.m)}"
    return f"{choice.subshell}, m = {choice.m:+d}" if choice.m else f"{choice.subshell}, m = 0"


#: Share of pixels allowed to saturate on a robust colour scale.
ROBUST_SATURATION = 0.005


def colour_scale(image: FloatArray, signed: bool, log_scale: bool,
                 robust: bool = False, decades: float = LOG_DECADES) -> tuple[float, float]:
    """Default colour limits: symmetric about 0 for signed data; the top ``decades`` for log.

    With ``robust``, a linear scale ends at the 99.5th percentile of |value| (taken
    on every 4th pixel each way) rather than at the maximum, so that a nuclear cusp
    does not wash out the valence region; at most about 0.5 % of pixels saturate.
    """
    # Two reductions, no temporary arrays: this runs on every re-render.
    high, low = float(np.nanmax(image)), float(np.nanmin(image))
    if not (np.isfinite(high) and np.isfinite(low)):
        finite = image[np.isfinite(image)]
        if finite.size == 0:
            return (0.0, 1.0)
        high, low = float(finite.max()), float(finite.min())
    top = max(high, -low) if signed else high
    if robust and not log_scale:
        sample = np.abs(image[::4, ::4]) if signed else image[::4, ::4]
        sample = sample[np.isfinite(sample)]
        if sample.size:
            clipped = float(np.quantile(sample, 1.0 - ROBUST_SATURATION))
            top = clipped if clipped > 0 else top
    if signed:
        top = top or 1.0
        return (-top, top)
    if log_scale:
        return (top - decades, top)
    return (0.0, top or 1.0)


def contour_levels(low: float, high: float, count: int, signed: bool) -> tuple[float, ...]:
    """``count`` evenly spaced levels inside (low, high), zero excluded for signed data."""
    if count <= 0 or not high > low:
        return ()
    if signed:
        half = max(count // 2, 1)
        steps = np.linspace(0.0, high, half + 2)[1:-1]
        return tuple(float(x) for x in np.concatenate((-steps[::-1], steps)))
    return tuple(float(x) for x in np.linspace(low, high, count + 2)[1:-1])


def slice_scene(source: Source, orbital: OrbitalChoice, settings: SliceSettings,
                length_unit: str = "bohr") -> SliceScene:
    """Evaluate the slice view of ``source``.

    Parameters
    ----------
    source : Source
    orbital : OrbitalChoice
        Used for ψ and |ψ|²; ignored for the total density.
    settings : SliceSettings
    length_unit : {"bohr", "angstrom"}
    """
    orbitals = orbitals_for(source)
    plane = plane_of(settings)
    quantity = QUANTITIES[settings.quantity]
    chosen = orbitals.orbital(orbital.subshell)
    if settings.quantity == "psi":
        raw = orbital_on_plane(chosen, plane, orbital.m, orbital.kind)
        values = raw.real if np.iscomplexobj(raw) else raw
        what = orbital_name(orbital, chosen.l) + (" (real part)" if np.iscomplexobj(raw) else "")
    elif settings.quantity == "psi2":
        values = orbital_density_on_plane(chosen, plane, orbital.m, orbital.kind)
        what = orbital_name(orbital, chosen.l)
    else:
        values = density_on_plane(orbitals, plane)
        what = "all electrons"
    factor = length_factor(length_unit, quantity.length_power)
    if factor != 1.0:
        values = values * factor
    if settings.quantity != "density" and not np.any(values):
        what += " — zero everywhere on this plane (a nodal plane)"
    signed = settings.quantity == "psi"
    log_scale = settings.log_scale and not signed
    if log_scale:
        decades = settings.log_decades
        floor = float(np.max(values)) * 10.0 ** (-decades - 1) if np.max(values) > 0 else 1e-300
        image = np.log10(np.maximum(values, floor))
    else:
        image = values
    low, high = colour_scale(image, signed, log_scale, robust=not settings.full_range,
                             decades=settings.log_decades)
    unit = length_symbol(length_unit)
    scale = length_factor(length_unit, 1.0)
    plane_text = _plane_text(settings, unit, scale)
    axes = _axis_names(settings)
    value_unit = unit_text(length_unit, quantity.length_power)
    label = f"{'log₁₀ ' if log_scale else ''}{quantity.symbol} / {value_unit}"
    return SliceScene(
        title=f"{orbitals.configuration.spec} — {short_model_name(source.model)}: {what}",
        spec=orbitals.configuration.spec,
        model=source.model,
        orbital=what,
        quantity=settings.quantity,
        plane_text=plane_text,
        axis_labels=(f"{axes[0]} / {unit}", f"{axes[1]} / {unit}"),
        value_label=label,
        length_unit=length_unit,
        values=values,
        image=image,
        coordinates=plane.coordinates() * scale,
        signed=signed,
        log_scale=log_scale,
        colour_range=(low, high),
        levels=contour_levels(low, high, settings.contours, signed),
        zero_contour=signed,
    )


def _plane_text(settings: SliceSettings, unit: str, scale: float) -> str:
    offset = settings.offset * scale
    if settings.plane in ("xy", "xz", "yz"):
        normal_axis = ({"x", "y", "z"} - set(settings.plane)).pop()
        where = f"{normal_axis} = {offset:g} {unit}"
        return f"{settings.plane} plane, {where}"
    n = settings.normal
    return f"plane ⟂ ({n[0]:g}, {n[1]:g}, {n[2]:g}), offset {offset:g} {unit}"

"""The slice view's content: a 2D array in display units with its colour scale."""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from zeffir.core import Plane, ZeffirError, density_on_plane, orbital_density_on_plane, orbital_on_plane
from zeffir.core.orbitals import FloatArray, real_label
from zeffir.scene._build import orbitals_for, short_model_name
from zeffir.scene._contours import ContourPaths, stray_zeros, trace_contours
from zeffir.scene._quantities import QUANTITIES, length_factor, length_symbol, unit_text
from zeffir.state import (
    DEFAULT_DIVERGING_MAP,
    DEFAULT_SEQUENTIAL_MAP,
    ColourSettings,
    OrbitalChoice,
    SliceSettings,
    Source,
    ViewState,
)

__all__ = ["LOG_DECADES", "ColourSubject", "SliceScene", "colour_range", "colour_subject", "log_image",
           "manual_range", "orbital_name", "plane_of", "slice_scene"]

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
    sequential_map, diverging_map : str
        The view's colour maps (names in :mod:`zeffir.scene._colours`); which one
        draws this scene follows ``signed`` (see :attr:`colour_map`).
    value_factor : float
        Display units per atomic unit of the quantity (``values`` = atomic × factor).
    plane : Plane or None
        The plane the grid lies on (lengths in bohr): grid point (i, j) is
        ``offset·n̂ + u_i ê₁ + v_j ê₂`` of :meth:`Plane.basis`, with u, v in bohr.
        None for maps that are not on a plane (the two-electron maps).
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
    sequential_map: str = DEFAULT_SEQUENTIAL_MAP
    diverging_map: str = DEFAULT_DIVERGING_MAP
    value_factor: float = 1.0
    plane: Plane | None = None

    @property
    def colour_map(self) -> str:
        """The map that draws this scene: the diverging one when signed, else the sequential one."""
        return self.diverging_map if self.signed else self.sequential_map

    @property
    def value_limits(self) -> tuple[float, float]:
        """The colour scale's ends as values of the quantity, in atomic units.

        What :class:`~zeffir.state.ColourSettings` ``low`` and ``high`` must be for a
        manual scale to draw this very picture (10** of the range on a log scale).
        """
        low, high = self.colour_range
        if self.log_scale:
            low, high = 10.0**low, 10.0**high
        return low / self.value_factor, high / self.value_factor

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


def manual_range(colour: ColourSettings, signed: bool, log_scale: bool,
                 factor: float = 1.0) -> tuple[float, float]:
    """The colour limits typed by the user, in ``image`` units.

    Parameters
    ----------
    colour : ColourSettings
        ``low`` and ``high`` are values of the quantity in atomic units.
    signed : bool
        A signed quantity keeps a symmetric scale: −high to high (``low`` unused).
    log_scale : bool
        The image holds log10 of the values: the limits are mapped through log10;
        ``low`` ≤ 0 stands for ``log_decades`` below ``high``.
    factor : float
        Display units per atomic unit of the quantity (see :func:`length_factor`).

    Raises
    ------
    ZeffirError
        ``high`` is not a positive finite number, or ``low`` is not below it
        (:meth:`ColourSettings.check` refuses such a state first).

    Examples
    --------
    >>> manual_range(ColourSettings("manual", 1e-4, 1.0, log_scale=True), False, True)
    (-4.0, 0.0)
    """
    low, high = colour.low * factor, colour.high * factor
    if not (math.isfinite(high) and high > 0 and math.isfinite(low) and low < high):
        raise ZeffirError(f"colour limits: low {colour.low:g} and high {colour.high:g} must be finite "
                          "with low < high and high > 0")
    if signed:
        return (-high, high)
    if log_scale:
        top = math.log10(high)
        return (math.log10(low) if low > 0 else top - colour.log_decades, top)
    return (low, high)


def colour_range(image: FloatArray, signed: bool, log_scale: bool, colour: ColourSettings,
                 factor: float = 1.0) -> tuple[float, float]:
    """Colour limits in ``image`` units as ``colour.limits`` asks.

    ``"robust"`` and ``"extremes"``: :func:`colour_scale` with ``robust`` on or off;
    ``"manual"``: :func:`manual_range` (``factor`` converts its atomic units to the
    display units of ``image``).
    """
    if colour.limits == "manual":
        return manual_range(colour, signed, log_scale, factor)
    return colour_scale(image, signed, log_scale, robust=colour.limits != "extremes",
                        decades=colour.log_decades)


def log_image(values: FloatArray, colour: ColourSettings, factor: float = 1.0) -> FloatArray:
    """log10 of non-negative ``values``, floored a decade below what the scale shows.

    The floor is 10^−(decades + 1) of the maximum, or a tenth of a manual low limit
    when that is lower, so every pixel below the scale takes its bottom colour.
    """
    peak = float(np.max(values)) if values.size else 0.0
    floor = peak * 10.0 ** (-colour.log_decades - 1) if peak > 0 else 1e-300
    if colour.limits == "manual" and colour.low > 0:
        floor = min(floor, 0.1 * colour.low * factor)
    return np.log10(np.maximum(values, floor))


@dataclass(frozen=True)
class ColourSubject:
    """What a view's colour controls act on.

    Attributes
    ----------
    colour : ColourSettings
        The view's own settings (``slice.colour``, ``pair.colour`` or ``two_electron.colour``).
    field : str
        Where they live in the state: ``"slice"``, ``"pair"`` or ``"two_electron"``.
    quantity : str
        The ``quantity`` of the scenes drawn (``"psi"``, ``"density"``, ``"two-electron"``...).
    length_power : float
        The quantity coloured carries length^power (for the units of manual limits).
    signed : bool
        The quantity has a sign: a symmetric diverging scale, no log scale.
    difference : bool
        A signed difference panel is drawn beside it (it uses the diverging map).
    """

    colour: ColourSettings
    field: str
    quantity: str
    length_power: float
    signed: bool
    difference: bool


def colour_subject(state: ViewState) -> ColourSubject | None:
    """The colour settings the current view of ``state`` draws with; None for radial and terms."""
    if state.view == "slice":
        quantity = QUANTITIES[state.slice.quantity]
        return ColourSubject(state.slice.colour, "slice", state.slice.quantity, quantity.length_power,
                             state.slice.quantity == "psi", state.compare.has_difference())
    if state.view == "pair":
        # The same- and opposite-spin densities; the exchange hole is one-sided too.
        return ColourSubject(state.pair.colour, "pair", "density", -3.0, False, False)
    if state.view == "two-electron":
        radial = state.two_electron.map == "radial"
        return ColourSubject(state.two_electron.colour, "two_electron", "two-electron",
                             -2.0 if radial else -3.0, not radial, True)
    return None


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
    if not np.any(values):
        # Every angular node of a real orbital is a plane or cone through the nucleus, so a
        # plane off the nucleus that is zero throughout lies beyond the electrons' reach
        # (the total density has no nodal plane at all).
        if settings.quantity != "density" and plane.offset == 0.0:
            what += " — zero everywhere on this plane (a nodal plane)"
        else:
            what += " — zero everywhere on this plane (beyond the electrons' reach)"
    signed = settings.quantity == "psi"
    colour = settings.colour
    log_scale = colour.log_scale and not signed
    image = log_image(values, colour, factor) if log_scale else values
    low, high = colour_range(image, signed, log_scale, colour, factor)
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
        sequential_map=colour.sequential_map,
        diverging_map=colour.diverging_map,
        value_factor=factor,
        plane=plane,
    )


def _plane_text(settings: SliceSettings, unit: str, scale: float) -> str:
    offset = settings.offset * scale
    if settings.plane in ("xy", "xz", "yz"):
        normal_axis = ({"x", "y", "z"} - set(settings.plane)).pop()
        where = f"{normal_axis} = {offset:g} {unit}"
        return f"{settings.plane} plane, {where}"
    n = settings.normal
    return f"plane ⟂ ({n[0]:g}, {n[1]:g}, {n[2]:g}), offset {offset:g} {unit}"

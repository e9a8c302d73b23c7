"""The pair view and the two-electron view: what they draw, built from the core.

The pair view shows, for a reference electron of spin σ at r1 and r2 on the slice
plane: the density of the other same-spin electrons, the density of the
opposite-spin electrons, and the exchange (Fermi) hole h_x^σ(r1; r2). The
two-electron view shows singlet and triplet maps of a two-electron configuration
and their difference. Both are returned as three slice scenes, so the window's
slice views and the figure exporter draw them unchanged.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from typing import TYPE_CHECKING, ClassVar

import numpy as np

from zeffir.core import OrbitalSet, ZeffirError
from zeffir.core.orbitals import FloatArray
from zeffir.scene._build import orbitals_for
from zeffir.scene._quantities import length_factor, length_symbol, unit_text
from zeffir.scene._slice import (
    ROBUST_SATURATION,
    SliceScene,
    colour_range,
    contour_levels,
    log_image,
    plane_of,
)
from zeffir.state import ColourSettings, ViewState

_ROBUST = ColourSettings()  # robust and linear: what the panels drew before they had settings

if TYPE_CHECKING:  # the pairs package is imported when a pair view is first computed
    from zeffir.core.pairs import Determinant

UP = 1  # spin up (α), as zeffir.core.pairs.UP

__all__ = ["PairScenes", "TwoElectronScenes", "determinant_for", "pair_scenes",
           "two_electron_scenes"]


@dataclass(frozen=True)
class PairScenes:
    """Same-spin and opposite-spin densities (shared colour scale) and the exchange hole.

    Attributes
    ----------
    same_spin, opposite_spin : SliceScene
        ρ₂^{σσ}(r1, r2)/ρ^σ(r1) and ρ₂^{σσ'}(r1, r2)/ρ^σ(r1) on the plane.
    exchange_hole : SliceScene
        h_x^σ(r1; r2) (values ≤ 0; its image is the depth −h on a one-sided scale).
    reference : (float, float, float)
        r1 in bohr.
    spin : str
        ``"up"`` or ``"down"``.
    hole_integral : float
        ∫ h_x^σ(r1; r2) d³r2 by quadrature over all space (−1 for any r1).
    hole_depth : float
        h_x^σ(r1; r1) = −ρ^σ(r1), in the display unit of density.
    determinant : str
        The determinant used, in the determinant syntax.
    """

    same_spin: SliceScene
    opposite_spin: SliceScene
    exchange_hole: SliceScene
    reference: tuple[float, float, float] = (0.0, 0.0, 0.0)
    spin: str = "up"
    hole_integral: float = float("nan")
    hole_depth: float = float("nan")
    determinant: str = ""

    #: Panel names, in drawing order.
    panel_names: ClassVar[tuple[str, ...]] = ("same_spin", "opposite_spin", "exchange_hole")

    @property
    def panels(self) -> tuple[SliceScene, ...]:
        """The three panels in drawing order."""
        return self.same_spin, self.opposite_spin, self.exchange_hole


@dataclass(frozen=True)
class TwoElectronScenes:
    """Singlet and triplet maps (shared colour scale) and triplet − singlet."""

    singlet: SliceScene
    triplet: SliceScene
    difference: SliceScene
    map_kind: str = "radial"

    #: Panel names, in drawing order.
    panel_names: ClassVar[tuple[str, ...]] = ("singlet", "triplet", "difference")

    @property
    def panels(self) -> tuple[SliceScene, ...]:
        """The three panels in drawing order."""
        return self.singlet, self.triplet, self.difference


def determinant_for(orbitals: OrbitalSet, text: str) -> Determinant:
    """The Hund determinant, or the one ``text`` chooses (determinant syntax)."""
    from zeffir.core.pairs import hund_determinant, parse_determinant

    configuration = orbitals.configuration
    return parse_determinant(configuration, text) if text.strip() else hund_determinant(configuration)


def _image_scene(base: SliceScene, values: FloatArray, title: str, label: str,
                 signed: bool, contours: int, *, colour: ColourSettings = _ROBUST,
                 factor: float = 1.0) -> SliceScene:
    """A panel of ``values`` (display units; ``factor`` per atomic unit) on ``colour``'s scale."""
    log_scale = colour.log_scale and not signed
    image = values
    if log_scale:
        image = log_image(values, colour, factor)
        label = f"log₁₀ {label}"
    low, high = colour_range(image, signed, log_scale, colour, factor)
    return replace(
        base, title=title, orbital="", values=values, image=image, signed=signed,
        log_scale=log_scale, colour_range=(low, high),
        levels=contour_levels(low, high, contours, signed),
        zero_contour=signed, value_label=label, contours=None,
        sequential_map=colour.sequential_map, diverging_map=colour.diverging_map,
        value_factor=factor,
    )


def _shared_range(panels: tuple[SliceScene, SliceScene], colour: ColourSettings) -> tuple[float, float]:
    """One colour scale for two panels that compare directly.

    Manual limits are the same for both already. Otherwise the range covering both;
    a log scale keeps its span of decades below the higher top.
    """
    if colour.limits == "manual":
        return panels[0].colour_range
    low = min(p.colour_range[0] for p in panels)
    high = max(p.colour_range[1] for p in panels)
    if panels[0].log_scale:
        low = high - colour.log_decades
    return low, high


def _difference_colour(colour: ColourSettings) -> ColourSettings:
    """A difference panel's own symmetric scale: robust, or extremes if the view asks for them.

    Manual limits are values of the quantity, not of a difference (often far smaller),
    so under manual limits a difference panel keeps the robust scale.
    """
    return replace(colour, limits="extremes" if colour.limits == "extremes" else "robust",
                   log_scale=False)


def _hole_scene(base: SliceScene, hole: FloatArray, title: str, label: str, contours: int,
                robust: bool) -> SliceScene:
    """The exchange hole is ≤ 0 everywhere: a one-sided scale from zero to its depth.

    With ``robust`` the scale ends at the 99.5th percentile of the depth, like the
    densities', so the hole near a nucleus does not wash out the rest.
    """
    deepest = float(-np.min(hole))
    if not np.isfinite(deepest):  # a non-finite sample (rare): the depth of the finite ones
        finite = hole[np.isfinite(hole)]
        deepest = float(-np.min(finite)) if finite.size else 1.0
    sample = -hole[::4, ::4]
    sample = sample[np.isfinite(sample)]
    if robust and sample.size:
        clipped = float(np.quantile(sample, 1.0 - ROBUST_SATURATION))
        deepest = clipped if clipped > 0 else deepest
    # Colours show the depth −h (0 dark, the deepest part bright, as in the density panels);
    # ``values`` keep h itself for the read-out and the data files.
    top = deepest or 1.0
    return replace(
        base, title=title, orbital="", values=hole, image=-hole, signed=False, log_scale=False,
        colour_range=(0.0, top), levels=contour_levels(0.0, top, contours, False),
        zero_contour=False, value_label=f"depth −{label}", contours=None,
    )


def pair_scenes(state: ViewState) -> PairScenes:
    """The pair view of ``state``: reference electron ``state.pair``, plane ``state.slice``."""
    from zeffir.core.pairs import (
        DOWN,
        hole_integral,
        reference_panels_on_plane,
        spin_density,
    )

    orbitals = orbitals_for(state.left)
    configuration = orbitals.configuration
    determinant = determinant_for(orbitals, state.pair.determinant)
    spin = UP if state.pair.spin == "up" else DOWN
    r1 = np.asarray(state.pair.reference, dtype=float)
    rho = float(spin_density(orbitals, r1[None, :], spin, determinant)[0])
    arrow = "↑" if spin == UP else "↓"
    if not rho > 0:
        raise ZeffirError(
            f"no {state.pair.spin}-spin electron density at the reference point "
            f"{tuple(state.pair.reference)} bohr (it lies on a node, or no electron of that spin is "
            f"occupied): move the reference electron or change its spin"
        )
    plane = plane_of(state.slice)
    unit = state.length_unit
    density = length_factor(unit, -3.0)
    panels = reference_panels_on_plane(orbitals, plane, r1, spin, determinant)
    same, other, hole = panels.same_spin, panels.opposite_spin, panels.exchange_hole
    if density != 1.0:  # the arrays are this call's own: scaled in place
        for values in (same, other, hole):
            values *= density
    scale = length_factor(unit, 1.0)
    where = ", ".join(f"{c * scale:g}" for c in state.pair.reference)
    symbol = length_symbol(unit)
    density_unit = unit_text(unit, -3.0)
    base = SliceScene(
        title="", spec=configuration.spec, model=state.left.model, orbital="", quantity="density",
        plane_text=f"{_plane_words(state)}; reference electron {arrow} at ({where}) {symbol}",
        axis_labels=_axes(state, symbol), value_label="", length_unit=unit, values=same, image=same,
        coordinates=plane.coordinates() * scale, signed=False, log_scale=False, colour_range=(0.0, 1.0),
        levels=(), zero_contour=False, sequential_map=state.pair.colour.sequential_map,
        diverging_map=state.pair.colour.diverging_map, value_factor=density, plane=plane,
    )
    contours = state.slice.contours
    colour = state.pair.colour
    # The exchange hole keeps its own one-sided scale: robust unless extremes are asked for.
    robust = colour.limits != "extremes"
    left = _image_scene(base, same, f"{configuration.spec}: other {arrow} electrons",
                        f"ρ₂{arrow}{arrow}(r₁, r₂)/ρ{arrow}(r₁) / {density_unit}", False, contours,
                        colour=colour, factor=density)
    opposite = "↓" if spin == UP else "↑"
    right = _image_scene(base, other, f"{configuration.spec}: {opposite} electrons",
                         f"ρ₂{arrow}{opposite}(r₁, r₂)/ρ{arrow}(r₁) / {density_unit}", False, contours,
                         colour=colour, factor=density)
    # One colour scale for both densities, so the two panels compare directly.
    bottom, top = _shared_range((left, right), colour)
    levels = contour_levels(bottom, top, contours, False)
    left = replace(left, colour_range=(bottom, top), levels=levels)
    right = replace(right, colour_range=(bottom, top), levels=levels)
    integral = hole_integral(orbitals, r1, spin, determinant)
    depth = -rho * density
    difference = _hole_scene(
        base, hole,
        f"exchange hole: ∫ = {integral:.4f}, at r₁ {depth:.3g}",
        f"hₓ{arrow}(r₁; r₂) / {density_unit}", contours, robust,
    )
    from zeffir.core.pairs import format_determinant

    marker = _marker_of(state, r1)
    left, right, difference = (replace(s, marker=marker) for s in (left, right, difference))
    return PairScenes(same_spin=left, opposite_spin=right, exchange_hole=difference,
                      reference=tuple(float(c) for c in r1),  # type: ignore[arg-type]
                      spin=state.pair.spin, hole_integral=integral, hole_depth=depth,
                      determinant=format_determinant(determinant))


def two_electron_scenes(state: ViewState) -> TwoElectronScenes:
    """Singlet and triplet maps of a two-electron configuration (``state.left``)."""
    from zeffir.core.pairs import TwoElectronState

    orbitals = orbitals_for(state.left)
    configuration = orbitals.configuration
    settings = state.two_electron
    if configuration.n_electrons != 2:
        raise ZeffirError(f"{configuration.spec}: the two-electron view needs exactly two electrons "
                          f"(this has {configuration.n_electrons}); e.g. Li+ 1s1 2s1 or He 1s1 2p1")
    if len(configuration.occupations) == 1:
        sub = configuration.occupations[0][0]
        raise ZeffirError(f"{configuration.spec}: both electrons share {sub.label}, so only the singlet "
                          "exists; choose an excited configuration such as He 1s1 2s1")
    singlet = TwoElectronState(orbitals, "singlet")
    triplet = TwoElectronState(orbitals, "triplet")
    top = settings.r_limit or 2.5 * max(o.radial.expectation(1) for o in orbitals.orbitals)
    unit = state.length_unit
    scale = length_factor(unit, 1.0)
    symbol = length_symbol(unit)
    k = settings.resolution
    if settings.map == "radial":
        r = np.linspace(0.0, top, k)
        maps = [s.radial_map(r, r).T for s in (singlet, triplet)]  # [j, i] = (r2 = r[j], r1 = r[i])
        factor = length_factor(unit, -2.0)
        maps = [m * factor for m in maps]
        coordinates = r * scale
        label = f"P(r₁, r₂) / {unit_text(unit, -2.0)}"
        axes = (f"r₁ / {symbol}", f"r₂ / {symbol}")
        signed = False
        words = "radial pair distribution (angles integrated)"
    else:
        # One grid for both axes puts s₁ = s₂ on grid points, where the triplet is
        # exactly 0 with opposite signs either side; the nodal tracing keeps such
        # zeros (see SliceScene.zero_contour_field), so that line is drawn too.
        s = np.linspace(-top, top, k)
        factor = length_factor(unit, -3.0)
        maps = [np.real(st.collinear_map(s, s)).T * factor for st in (singlet, triplet)]
        coordinates = s * scale
        label = f"ψ(s₁ẑ, s₂ẑ) / {unit_text(unit, -3.0)}"
        axes = (f"s₁ / {symbol} (along z)", f"s₂ / {symbol} (along z)")
        signed = True
        words = "both electrons on the z axis"
    subs = " ".join(sub.label for sub in singlet.subshells)
    base = SliceScene(
        title="", spec=configuration.spec, model=state.left.model, orbital=subs,
        quantity="two-electron", plane_text=words, axis_labels=axes, value_label=label,
        length_unit=unit, values=maps[0], image=maps[0], coordinates=coordinates, signed=signed,
        log_scale=False, colour_range=(0.0, 1.0), levels=(), zero_contour=signed,
    )
    contours = state.slice.contours
    colour = settings.colour
    one = _image_scene(base, maps[0], f"{configuration.spec}: singlet (S = 0)", label, signed, contours,
                       colour=colour, factor=factor)
    three = _image_scene(base, maps[1], f"{configuration.spec}: triplet (S = 1)", label, signed, contours,
                         colour=colour, factor=factor)
    low, high = _shared_range((one, three), colour)
    levels = contour_levels(low, high, contours, signed)
    one = replace(one, colour_range=(low, high), levels=levels)
    three = replace(three, colour_range=(low, high), levels=levels)
    delta = maps[1] - maps[0]
    # Triplet − singlet on its own symmetric scale (see _difference_colour).
    diff = _image_scene(base, delta, "triplet − singlet", f"Δ{label}", True, contours,
                        colour=_difference_colour(colour), factor=factor)
    return TwoElectronScenes(singlet=one, triplet=three, difference=diff, map_kind=settings.map)


def _marker_of(state: ViewState, r1: FloatArray) -> tuple[float, float] | None:
    """(u, v) of the reference electron in display units if it lies on the plane (within 1e-6 bohr)."""
    normal, e1, e2 = plane_of(state.slice).basis()
    if abs(float(r1 @ normal) - state.slice.offset) > 1e-6:
        return None
    scale = length_factor(state.length_unit, 1.0)
    return float(r1 @ e1) * scale, float(r1 @ e2) * scale


def _plane_words(state: ViewState) -> str:
    """The plane in words, its offset in the display unit (as the slice view says it)."""
    from zeffir.scene._slice import _plane_text

    unit = state.length_unit
    return _plane_text(state.slice, length_symbol(unit), length_factor(unit, 1.0))


def _axes(state: ViewState, symbol: str) -> tuple[str, str]:
    plane = state.slice.plane
    names = (plane[0], plane[1]) if plane in ("xy", "xz", "yz") else ("u", "v")
    return f"{names[0]} / {symbol}", f"{names[1]} / {symbol}"

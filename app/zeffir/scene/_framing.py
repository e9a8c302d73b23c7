"""The half-width of a slice fitted to what it shows, unless the user chose one."""

from __future__ import annotations

from dataclasses import replace
from functools import lru_cache

from zeffir.core import enclosing_radius
from zeffir.scene._build import orbitals_for
from zeffir.state import Source, ViewState

__all__ = ["FIT_FRACTION", "fitted_extent", "with_fitted_extent"]

#: Fraction of an orbital's charge inside the fitted half-width.
FIT_FRACTION = 0.999
_LIMITS = (0.05, 200.0)  # bohr, the range of the half-width control


def fitted_extent(state: ViewState) -> float:
    """Half-width in bohr that holds 99.9 % of the charge of what the view shows.

    The chosen orbital for ψ and |ψ|²; the outermost subshell (the largest radius)
    for the density and the pair view; the larger of the two sides in a comparison.
    Rounded up to 0.01 bohr, the control's step.
    """
    sources = [state.left]
    if state.compare.enabled and state.view in ("radial", "slice"):
        sources.append(state.compare.right)
    whole_atom = state.view == "pair" or state.slice.quantity == "density"
    radius = 0.0
    for source in sources:
        orbitals = orbitals_for(source)
        labels = {o.label for o in orbitals.orbitals}
        subshell = state.orbital.subshell
        chosen = (subshell,) if not whole_atom and subshell in labels else tuple(sorted(labels))
        radius = max(radius, *(_radius(source.spec.strip(), source.model, label)
                               for label in chosen))
    return min(max(round(radius + 0.005, 2), _LIMITS[0]), _LIMITS[1])


@lru_cache(maxsize=512)
def _radius(spec: str, model: str, label: str) -> float:
    # Orbital sets are immutable and cached per (spec, model): so is this radius, which
    # takes a bisection on a tabulated cumulative charge (≈ 10 ms per subshell).
    orbital = orbitals_for(Source(spec, model)).orbital(label)
    return enclosing_radius(orbital.radial, FIT_FRACTION)


def with_fitted_extent(state: ViewState) -> ViewState:
    """``state`` with ``slice.extent`` fitted when ``slice.fit_extent`` is on (else unchanged)."""
    if not state.slice.fit_extent:
        return state
    return replace(state, slice=replace(state.slice, extent=fitted_extent(state)))

"""Side-by-side comparison: two scenes on shared axes and colour scale, and their difference."""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from zeffir.scene._build import orbitals_for, short_model_name
from zeffir.scene._radial import Curve, RadialScene, radial_range, radial_scene
from zeffir.scene._slice import SliceScene, colour_scale, contour_levels, slice_scene
from zeffir.state import ViewState

__all__ = ["RadialComparison", "SliceComparison", "compare_radial", "compare_slices", "difference_title"]


def difference_title(left_spec: str, left_model: str, right_spec: str, right_model: str) -> str:
    """Title of a right − left panel, naming only what differs, with the models' display names.

    Examples
    --------
    >>> difference_title("Ne", "slater", "Ar", "slater")
    'Ar − Ne (Slater)'
    """
    left_model, right_model = short_model_name(left_model), short_model_name(right_model)
    if left_spec == right_spec:
        return f"{left_spec}: {right_model} − {left_model}"
    if left_model == right_model:
        return f"{right_spec} − {left_spec} ({left_model})"
    return f"({right_spec}, {right_model}) − ({left_spec}, {left_model})"


@dataclass(frozen=True)
class RadialComparison:
    """Left and right radial scenes on one r grid, and right − left for matching curves."""

    left: RadialScene
    right: RadialScene
    difference: RadialScene


@dataclass(frozen=True)
class SliceComparison:
    """Left and right slices on one colour scale, and right − left on its own diverging scale."""

    left: SliceScene
    right: SliceScene
    difference: SliceScene


def compare_radial(state: ViewState) -> RadialComparison:
    """Evaluate both sources of ``state`` for the radial view on a shared radial range."""
    sources = (state.left, state.compare.right)
    spans = [radial_range(orbitals_for(s), state.radial) for s in sources]
    span = (min(a for a, _ in spans), max(b for _, b in spans))
    highlight = state.orbital.subshell
    left, right = (radial_scene(s, state.radial, state.length_unit, highlight, span) for s in sources)
    # Match curves by subshell (None is the whole atom): labels carry occupancies,
    # which differ between two atoms.
    right_curves = {c.subshell: c for c in right.curves}
    diff = tuple(
        Curve(c.subshell or c.label, c.subshell, c.x, right_curves[c.subshell].y - c.y)
        for c in left.curves if c.subshell in right_curves
    )
    difference = replace(
        left,
        title=difference_title(left.spec, left.model, right.spec, right.model),
        y_label=f"Δ{left.y_label}",
        curves=diff,
        markers=(),
    )
    return RadialComparison(left, right, difference)


def compare_slices(state: ViewState) -> SliceComparison:
    """Evaluate both sources for the slice view with one colour scale, plus the difference.

    The difference is taken of the physical values (not of log values), so it is
    always drawn on a linear diverging scale symmetric about zero.
    """
    left = slice_scene(state.left, state.orbital, state.slice, state.length_unit)
    right_source = state.compare.right
    from zeffir.state import reconcile_orbital

    right_orbital = reconcile_orbital(right_source.spec, state.orbital)
    right = slice_scene(right_source, right_orbital, state.slice, state.length_unit)
    low = min(left.colour_range[0], right.colour_range[0])
    high = max(left.colour_range[1], right.colour_range[1])
    levels = contour_levels(low, high, state.slice.contours, left.signed)
    left = replace(left, colour_range=(low, high), levels=levels)
    right = replace(right, colour_range=(low, high), levels=levels)
    delta = right.values - left.values
    d_range = colour_scale(delta, signed=True, log_scale=False, robust=not state.slice.full_range)
    difference = replace(
        left,
        title=difference_title(left.spec, left.model, right.spec, right.model),
        orbital=left.orbital,
        value_label=f"Δ{left.value_label.removeprefix('log₁₀ ')}",
        values=delta,
        image=delta,
        signed=True,
        log_scale=False,
        colour_range=d_range,
        levels=contour_levels(*d_range, state.slice.contours, True),
        zero_contour=True,
    )
    assert np.shares_memory(difference.values, delta)
    return SliceComparison(left, right, difference)

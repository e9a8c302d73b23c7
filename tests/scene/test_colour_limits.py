"""Colour limits of the image views: robust, extremes and manual, per view, in display units."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest

from zeffir.core import ANGSTROM_PER_BOHR, ZeffirError
from zeffir.scene import (
    DIVERGING_MAPS,
    SEQUENTIAL_MAPS,
    colour_subject,
    compare_slices,
    manual_range,
    pair_scenes,
    slice_scene,
    two_electron_scenes,
)
from zeffir.state import (
    DIVERGING_MAP_NAMES,
    SEQUENTIAL_MAP_NAMES,
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    SliceSettings,
    Source,
    TwoElectronSettings,
    ViewState,
)

NE = Source("Ne", "slater")
P_Z = OrbitalChoice("2p", "real", 0)
DENSITY = SliceSettings(plane="xz", extent=3.0, resolution=65, quantity="density", fit_extent=False)


def test_extremes_and_robust_differ_on_a_cusp_density():
    robust = slice_scene(NE, P_Z, DENSITY)
    extremes = slice_scene(NE, P_Z, replace(DENSITY, colour=ColourSettings(limits="extremes")))
    peak = float(np.max(robust.values))  # at the nucleus, a grid point at this odd resolution
    assert extremes.colour_range == (0.0, pytest.approx(peak, rel=1e-12))
    # The robust top is the 99.5th percentile of a 4× subsample: far below the cusp.
    sample = robust.values[::4, ::4]
    assert robust.colour_range[1] == pytest.approx(float(np.quantile(sample, 0.995)), rel=1e-12)
    assert robust.colour_range[1] < 0.2 * peak


def test_manual_limits_are_the_colour_range_in_display_units():
    colour = ColourSettings(limits="manual", low=0.01, high=2.5)
    bohr = slice_scene(NE, P_Z, replace(DENSITY, colour=colour))
    assert bohr.colour_range == (0.01, 2.5)
    angstrom = slice_scene(NE, P_Z, replace(DENSITY, colour=colour), "angstrom")
    factor = ANGSTROM_PER_BOHR**-3.0  # bohr⁻³ → Å⁻³
    assert angstrom.colour_range == pytest.approx((0.01 * factor, 2.5 * factor), rel=1e-12)
    assert angstrom.value_limits == pytest.approx((0.01, 2.5), rel=1e-12)  # back in atomic units
    # Contours follow the scale they are drawn on.
    assert min(bohr.levels) > 0.01 and max(bohr.levels) < 2.5


def test_a_signed_quantity_keeps_a_symmetric_manual_scale():
    psi = replace(DENSITY, quantity="psi", colour=ColourSettings(limits="manual", low=0.0, high=0.3))
    scene = slice_scene(NE, P_Z, psi)
    assert scene.signed and scene.colour_range == (-0.3, 0.3)


def test_manual_limits_on_a_log_scale_are_values_mapped_through_log10():
    colour = ColourSettings(limits="manual", low=1e-3, high=10.0, log_scale=True)
    scene = slice_scene(NE, P_Z, replace(DENSITY, colour=colour))
    assert scene.log_scale and scene.colour_range == pytest.approx((-3.0, 1.0), abs=1e-12)
    # Every pixel below the scale still takes the bottom colour: the floor lies under it.
    assert float(scene.image.min()) <= -3.0
    # Low at or below zero: the chosen number of decades below High.
    open_low = replace(colour, low=0.0, log_decades=4.0)
    scene = slice_scene(NE, P_Z, replace(DENSITY, colour=open_low))
    assert scene.colour_range == pytest.approx((-3.0, 1.0), abs=1e-12)


def test_manual_range_refuses_what_it_cannot_draw():
    with pytest.raises(ZeffirError, match="low < high"):
        manual_range(ColourSettings("manual", 2.0, 1.0), False, False)
    with pytest.raises(ZeffirError, match="high > 0"):
        manual_range(ColourSettings("manual", -2.0, -1.0), False, True)
    with pytest.raises(ZeffirError):
        manual_range(ColourSettings("manual", 0.0, math.inf), True, False)


def test_a_manual_scale_from_the_drawn_limits_draws_the_same_picture():
    for colour in (ColourSettings(), ColourSettings(log_scale=True, log_decades=5.0)):
        drawn = slice_scene(NE, P_Z, replace(DENSITY, colour=colour), "angstrom")
        low, high = drawn.value_limits
        manual = replace(colour, limits="manual", low=low, high=high)
        again = slice_scene(NE, P_Z, replace(DENSITY, colour=manual), "angstrom")
        assert again.colour_range == pytest.approx(drawn.colour_range, rel=1e-12, abs=1e-12)


def test_the_comparison_shares_manual_limits_and_its_difference_keeps_its_own_scale():
    colour = ColourSettings(limits="manual", low=0.0, high=0.05)
    state = ViewState(left=NE, orbital=P_Z, view="slice", slice=replace(DENSITY, colour=colour),
                      compare=CompareSettings(True, Source("Ne", "hydrogenic"), True)).validated()
    comparison = compare_slices(state)
    assert comparison.left.colour_range == comparison.right.colour_range == (0.0, 0.05)
    difference = comparison.difference
    delta = difference.values
    robust = float(np.quantile(np.abs(delta[::4, ::4]), 0.995))
    assert difference.signed and difference.colour_range == pytest.approx((-robust, robust))
    assert difference.colour_map == colour.diverging_map  # signed: the view's diverging map


def _pair_state(colour: ColourSettings) -> ViewState:
    return ViewState(left=NE, view="pair", slice=replace(DENSITY, resolution=48),
                     pair=PairSettings(reference=(0.0, 0.0, 0.5), colour=colour)).validated()


def test_pair_view_manual_limits_reach_both_densities_and_the_hole_keeps_its_scale():
    colour = ColourSettings(limits="manual", low=0.0, high=0.8, sequential_map="magma")
    scenes = pair_scenes(_pair_state(colour))
    assert scenes.same_spin.colour_range == scenes.opposite_spin.colour_range == (0.0, 0.8)
    hole = scenes.exchange_hole
    depth = -hole.values[::4, ::4]
    assert hole.colour_range[1] == pytest.approx(float(np.quantile(depth[np.isfinite(depth)], 0.995)))
    assert {s.colour_map for s in (scenes.same_spin, scenes.opposite_spin, hole)} == {"magma"}


def test_pair_view_has_its_own_log_scale_not_the_slice_one():
    state = _pair_state(ColourSettings(log_scale=True, log_decades=3.0))
    assert not state.slice.colour.log_scale
    scenes = pair_scenes(state)
    low, high = scenes.same_spin.colour_range
    assert scenes.same_spin.log_scale and high - low == pytest.approx(3.0)
    linear = pair_scenes(replace(state, pair=replace(state.pair, colour=ColourSettings())))
    assert not linear.same_spin.log_scale


def test_two_electron_view_follows_its_own_colour_settings():
    base = ViewState(left=Source("Li+ 1s1 2s1", "hydrogenic"), view="two-electron",
                     two_electron=TwoElectronSettings(resolution=48))
    manual = ColourSettings(limits="manual", low=0.0, high=0.2, diverging_map="coolwarm")
    scenes = two_electron_scenes(replace(base, two_electron=replace(base.two_electron, colour=manual)))
    assert scenes.singlet.colour_range == scenes.triplet.colour_range == (0.0, 0.2)
    delta = scenes.difference.values
    robust = float(np.quantile(np.abs(delta[::4, ::4]), 0.995))
    assert scenes.difference.colour_range == pytest.approx((-robust, robust))
    assert scenes.difference.colour_map == "coolwarm" and scenes.singlet.colour_map == "viridis"
    collinear = replace(base.two_electron, map="collinear", colour=manual)
    signed = two_electron_scenes(replace(base, two_electron=collinear))
    assert signed.singlet.signed and signed.singlet.colour_range == (-0.2, 0.2)
    logged = replace(base.two_electron, colour=ColourSettings(log_scale=True, log_decades=2.0))
    scenes = two_electron_scenes(replace(base, two_electron=logged))
    low, high = scenes.singlet.colour_range
    assert scenes.singlet.log_scale and high - low == pytest.approx(2.0)
    assert not scenes.difference.log_scale


def test_colour_subject_names_the_view_the_quantity_and_its_units():
    state = ViewState(view="slice", slice=SliceSettings(quantity="psi"))
    subject = colour_subject(state)
    assert (subject.field, subject.signed, subject.length_power) == ("slice", True, -1.5)
    subject = colour_subject(state.with_changes(view="pair"))
    assert (subject.field, subject.signed, subject.length_power) == ("pair", False, -3.0)
    two = state.with_changes(view="two-electron", two_electron=TwoElectronSettings(map="collinear"))
    assert (colour_subject(two).signed, colour_subject(two).length_power) == (True, -3.0)
    assert colour_subject(state.with_changes(view="radial")) is None


def test_every_map_the_state_allows_has_colours():
    assert tuple(SEQUENTIAL_MAPS) == SEQUENTIAL_MAP_NAMES
    assert tuple(DIVERGING_MAPS) == DIVERGING_MAP_NAMES

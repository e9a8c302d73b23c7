"""Pair and two-electron scenes: the panels are the core's quantities, with their sum rules."""

from dataclasses import replace

import numpy as np
import pytest
from scipy.integrate import trapezoid

from zeffir.core import build
from zeffir.core.pairs import DOWN, UP, hund_determinant, spin_density_on_plane
from zeffir.scene import pair_scenes, plane_of, two_electron_scenes
from zeffir.state import ColourSettings, PairSettings, SliceSettings, Source, TwoElectronSettings, ViewState


def _pair_state(spec, reference, spin="up", determinant=""):
    return ViewState(left=Source(spec), view="pair", slice=SliceSettings(extent=3.0, resolution=64),
                     pair=PairSettings(reference, spin, determinant)).validated()


@pytest.mark.parametrize(("spec", "reference", "spin"),
                         [("Ne", (0.0, 0.0, 0.5), "up"), ("N", (0.3, 0.0, 1.1), "up"),
                          ("O", (0.0, 0.0, 0.8), "down")])
def test_panels_are_densities_and_hole_of_the_determinant(spec, reference, spin):
    state = _pair_state(spec, reference, spin)
    scenes = pair_scenes(state)
    orbitals = build(spec)
    sigma = UP if spin == "up" else DOWN
    plane = plane_of(state.slice)
    det = hund_determinant(orbitals.configuration)
    same = spin_density_on_plane(orbitals, plane, sigma, det)
    other = spin_density_on_plane(orbitals, plane, -sigma, det)
    # Same-spin conditional density = ρσ(r2) + h_x(r1; r2); opposite spin is uncorrelated
    # in a single determinant: ρ2^{σ,-σ}(r1, r2)/ρσ(r1) = ρ^{-σ}(r2) (Parr & Yang 1989, §2.4).
    np.testing.assert_allclose(scenes.same_spin.values - scenes.exchange_hole.values, same,
                               rtol=0, atol=1e-9 * same.max())
    np.testing.assert_allclose(scenes.opposite_spin.values, other, rtol=0,
                               atol=1e-9 * max(other.max(), 1e-300))
    # Sum rule ∫ h_x d³r2 = −1 (quadrature described in zeffir.core.pairs.hole_integral).
    assert scenes.hole_integral == pytest.approx(-1.0, abs=1e-3)
    assert scenes.hole_depth < 0
    assert scenes.same_spin.colour_range == scenes.opposite_spin.colour_range


def test_reference_electron_on_a_node_is_refused_with_a_reason():
    # ρ↓ of N (all three 2p electrons up) is spherical 1s²2s² and never zero, but no ↓
    # electron occupies the reference spin-orbitals of a fully polarised H atom.
    with pytest.raises(Exception, match="no down-spin electron density"):
        pair_scenes(_pair_state("H", (0.0, 0.0, 1.0), "down"))


def test_marker_sits_at_the_reference_on_its_plane():
    scenes = pair_scenes(_pair_state("Ne", (0.4, 0.0, -0.7)))  # xz plane, y = 0
    assert scenes.same_spin.marker == pytest.approx((0.4, -0.7))


@pytest.mark.parametrize("spec", ["Li+ 1s1 2s1", "He 1s1 2p1"])
def test_two_electron_maps(spec):
    state = ViewState(left=Source(spec, "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("radial", 30.0, 400)).validated()
    scenes = two_electron_scenes(state)
    r = scenes.singlet.coordinates
    for panel in (scenes.singlet, scenes.triplet):
        # ∫∫ P(r1, r2) dr1 dr2 = 1 (trapezoid rule on the displayed grid).
        assert trapezoid(trapezoid(panel.values, r), r) == pytest.approx(1.0, abs=2e-3)
    np.testing.assert_allclose(scenes.difference.values, scenes.triplet.values - scenes.singlet.values)
    if spec.startswith("Li+"):
        # Both s: the exchange term survives the angular integration, so the triplet
        # radial map vanishes on r1 = r2.
        assert np.abs(np.diag(scenes.triplet.values)).max() < 1e-12 * scenes.triplet.values.max()


def test_collinear_triplet_vanishes_where_the_electrons_meet():
    state = ViewState(left=Source("He 1s1 2p1", "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("collinear", 10.0, 101)).validated()
    scenes = two_electron_scenes(state)
    np.testing.assert_array_equal(np.diag(scenes.triplet.values), 0.0)
    np.testing.assert_allclose(scenes.triplet.values, -scenes.triplet.values.T, atol=1e-15)


def test_two_electrons_in_one_orbital_are_refused_with_a_reason():
    state = ViewState(left=Source("He", "hydrogenic"), view="two-electron").validated()
    with pytest.raises(Exception, match="only the singlet exists"):
        two_electron_scenes(state)


def _nodal_points(scene):
    lines = scene.with_contours().contours.zero
    return lines[np.isfinite(lines[:, 0])]


@pytest.mark.parametrize("resolution", [255, 256])
@pytest.mark.parametrize("spec", ["He 1s1 2p1", "Li+ 1s1 2s1"])
def test_collinear_triplet_draws_its_nodal_line_where_the_electrons_meet(spec, resolution):
    state = ViewState(left=Source(spec, "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("collinear", 10.0, resolution)).validated()
    scenes = two_electron_scenes(state)
    s = scenes.triplet.coordinates
    pixel = float(s[1] - s[0])  # up to CONTOUR_POINTS per side, lines are traced on this grid
    points = _nodal_points(scenes.triplet)
    # ψ− is exactly 0 on every grid point of s1 = s2; the line runs through them.
    on_diagonal = np.sort(points[np.abs(points[:, 0] - points[:, 1]) <= 1e-9 * s[-1], 0])
    assert on_diagonal.size, "the triplet's s1 = s2 line vanished"
    ends = np.concatenate(([s[0]], on_diagonal, [s[-1]]))
    assert np.diff(ends).max() <= pixel * (1 + 1e-9)


@pytest.mark.parametrize("resolution", [255, 256])
def test_collinear_singlet_and_difference_of_1s_2p_draw_their_nodal_lines(resolution):
    # 1s and 2pz (odd in s) are orthogonal, so ψ+ ∝ a(s1)b(s2) + b(s1)a(s2) vanishes on
    # s1 = −s2, and ψ− − ψ+ ∝ −b(s1)a(s2) on s1 = 0 (the 2pz node).
    state = ViewState(left=Source("He 1s1 2p1", "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("collinear", 10.0, resolution)).validated()
    scenes = two_electron_scenes(state)
    s = scenes.singlet.coordinates
    pixel = float(s[1] - s[0])
    singlet = _nodal_points(scenes.singlet)
    difference = _nodal_points(scenes.difference)
    assert singlet.size and difference.size
    np.testing.assert_allclose(singlet[:, 0], -singlet[:, 1], rtol=0, atol=0.5 * pixel)
    np.testing.assert_allclose(difference[:, 0], 0.0, rtol=0, atol=1e-9 * s[-1])
    for along in (singlet[:, 0], difference[:, 1]):
        ends = np.concatenate(([s[0]], np.sort(along), [s[-1]]))
        assert np.diff(ends).max() <= pixel * (1 + 1e-9)


def test_the_exchange_hole_has_a_one_sided_scale():
    scenes = pair_scenes(_pair_state("Ne", (0.0, 0.0, 0.5)))
    hole = scenes.exchange_hole
    assert not hole.signed and hole.colour_range[0] == 0.0 and hole.colour_range[1] > 0
    assert np.nanmax(hole.values) <= 1e-12  # the hole is nowhere positive
    np.testing.assert_array_equal(hole.image, -hole.values)  # colours show the depth
    assert hole.value_label.startswith("depth −hₓ")
    assert all(level > 0 for level in hole.levels)


def test_pair_densities_are_not_saturated_by_the_nuclear_cusp():
    state = _pair_state("Ne", (0.0, 0.0, 0.5))
    scenes = pair_scenes(state)
    # Robust scale: the top of the colour range lies below the cusp's peak value.
    assert scenes.opposite_spin.colour_range[1] < float(np.max(scenes.opposite_spin.values))
    full = pair_scenes(state.with_changes(pair=replace(
        state.pair, colour=ColourSettings(limits="extremes"))).validated())
    assert full.opposite_spin.colour_range[1] == pytest.approx(
        max(np.max(full.same_spin.values), np.max(full.opposite_spin.values)))


def test_pair_densities_follow_the_log_setting():
    state = _pair_state("Ne", (0.0, 0.0, 0.5))
    logged = pair_scenes(state.with_changes(pair=replace(
        state.pair, colour=ColourSettings(log_scale=True))).validated())
    for panel in (logged.same_spin, logged.opposite_spin):
        assert panel.log_scale and panel.value_label.startswith("log₁₀")
        np.testing.assert_allclose(10.0 ** panel.image[panel.values > 0],
                                   np.maximum(panel.values, 10.0 ** panel.image.min())[panel.values > 0],
                                   rtol=1e-12)
    low, high = logged.same_spin.colour_range
    assert high - low == pytest.approx(6.0)
    assert logged.same_spin.colour_range == logged.opposite_spin.colour_range


def test_the_log_scale_spans_the_chosen_number_of_decades():
    from zeffir.scene import slice_scene

    colour = ColourSettings(log_scale=True, log_decades=3.0)
    settings = SliceSettings(extent=3.0, resolution=64, quantity="density", colour=colour)
    state = _pair_state("Ne", (0.0, 0.0, 0.5))
    pair = pair_scenes(state.with_changes(slice=settings, pair=replace(state.pair, colour=colour))
                       .validated())
    low, high = pair.same_spin.colour_range
    assert high - low == pytest.approx(3.0)
    from zeffir.state import OrbitalChoice

    scene = slice_scene(Source("Ne"), OrbitalChoice("2p"), settings)
    low, high = scene.colour_range
    assert high - low == pytest.approx(3.0)


def test_the_pair_views_plane_line_follows_the_length_unit():
    from zeffir.core import ANGSTROM_PER_BOHR

    state = ViewState(left=Source("N", "slater"), view="pair", length_unit="angstrom",
                      slice=SliceSettings(offset=0.5, resolution=24, extent=3.0, fit_extent=False),
                      pair=PairSettings(reference=(0.0, 0.5, 1.0))).validated()
    text = pair_scenes(state).same_spin.plane_text
    assert f"y = {0.5 * ANGSTROM_PER_BOHR:g} Å" in text and "bohr" not in text

"""Plane slices: the fast evaluator against the direct one, and sum rules."""

import numpy as np
import pytest
from scipy.integrate import trapezoid

from zeffir.core import Plane, build, orbital_on_plane, real_labels
from zeffir.core.density import (
    cumulative_charge,
    density_on_plane,
    density_on_plane_direct,
    orbital_density_on_plane,
    orbital_on_plane_direct,
    radial_grid,
    spherical_density,
    total_distribution,
)

PLANES = [
    Plane.named("xy", extent=6.0, resolution=64),
    Plane.named("xz", extent=6.0, resolution=65),
    Plane.named("yz", offset=0.7, extent=4.0, resolution=48),
    Plane((1.0, 2.0, -0.5), offset=-0.3, extent=5.0, resolution=33),
]


@pytest.mark.parametrize("plane", PLANES, ids=["xy", "xz-odd", "yz-offset", "oblique"])
@pytest.mark.parametrize("model", ["hydrogenic", "slater", "clementi"])
def test_fast_orbital_slice_equals_direct_evaluation(plane, model):
    orbitals = build("Gd", model)
    with np.errstate(all="raise"):
        for label in ("1s", "2p", "3d", "4f"):
            orbital = orbitals.orbital(label)
            for _, m in real_labels(orbital.l):
                fast = orbital_on_plane(orbital, plane, m)
                direct = orbital_on_plane_direct(orbital, plane, m)
                scale = max(np.abs(direct).max(), 1e-300)
                np.testing.assert_allclose(fast, direct, rtol=0, atol=1e-12 * scale)


def test_complex_orbital_density_equals_the_real_pair_average():
    # |Y_l^m|² = (S_lm² + S_l,-m²)/2 for m ≠ 0.
    orbital = build("Fe", "slater").orbital("3d")
    plane = Plane((0.3, 0.2, 1.0), extent=3.0, resolution=40)
    for m in (1, 2, -2):
        complex_density = orbital_density_on_plane(orbital, plane, m, "complex")
        pair = 0.5 * (orbital_on_plane(orbital, plane, abs(m)) ** 2
                      + orbital_on_plane(orbital, plane, -abs(m)) ** 2)
        np.testing.assert_allclose(complex_density, pair, atol=1e-14 * pair.max())


def test_density_slice_equals_direct_and_is_symmetric():
    orbitals = build("Xe", "clementi")
    plane = Plane.named("xz", extent=5.0, resolution=101)
    fast = density_on_plane(orbitals, plane)
    np.testing.assert_allclose(fast, density_on_plane_direct(orbitals, plane), rtol=1e-13)
    np.testing.assert_array_equal(fast, fast[::-1, ::-1])


def test_closed_subshell_density_equals_sum_of_its_orbitals():
    # Unsöld's theorem: Σ_m ψ_m² of a closed subshell is spherical, (2l+1) R²/4π.
    orbitals = build("Ne", "slater")
    plane = Plane((1.0, 1.0, 1.0), offset=0.2, extent=2.0, resolution=41)
    total = sum(2 * orbital_on_plane(o, plane, m) ** 2
                for o in orbitals.orbitals for _, m in real_labels(o.l))
    np.testing.assert_allclose(density_on_plane(orbitals, plane), total, rtol=1e-12)


@pytest.mark.parametrize("spec", ["Ne", "Fe3+", "Na [Ne] 4d1", "Xe"])
def test_radial_sum_rules(spec):
    orbitals = build(spec, "slater")
    n = orbitals.configuration.n_electrons
    r = radial_grid(orbitals, points=20001, r_max=200.0)
    assert trapezoid(total_distribution(orbitals, r), r) == pytest.approx(n, rel=1e-6)
    assert trapezoid(4 * np.pi * r**2 * spherical_density(orbitals, r), r) == pytest.approx(n, rel=1e-6)
    assert cumulative_charge(orbitals, np.array([1e3]))[0] == pytest.approx(n, rel=1e-10)


def _peak(orbital):
    """Largest |ψ| of an orbital anywhere: max |R| times the largest |Y_lm| bound √((2l+1)/4π)."""
    r = orbital.radial.quadrature_grid(20001)
    return np.abs(orbital.radial(r)).max() * np.sqrt((2 * orbital.l + 1) / (4 * np.pi))


@pytest.mark.parametrize("resolution", [128, 129])
@pytest.mark.parametrize(("spec", "model"), [("Gd", "slater"), ("Xe", "clementi"), ("U", "hydrogenic")])
def test_compiled_kernels_match_direct_evaluation(resolution, spec, model):
    from zeffir.core.density import density_on_plane_numpy, orbital_on_plane_numpy
    from zeffir.core.density._kernels import kernels_available

    assert kernels_available()  # numba is a declared dependency
    plane = Plane((0.2, -1.0, 0.4), offset=0.5, extent=7.0, resolution=resolution)
    orbitals = build(spec, model)
    for orbital in orbitals.orbitals:
        # The compiled path interpolates R/r^l from a table uniform in √r (cubic, 8192
        # points); its error stays below 1e-9 of the orbital's peak in every case we
        # measured, so 2e-9 is the bound. The numpy path is exact to rounding.
        peak = _peak(orbital)
        for _, m in real_labels(orbital.l):
            compiled = orbital_on_plane(orbital, plane, m)
            direct = orbital_on_plane_direct(orbital, plane, m)
            np.testing.assert_allclose(compiled, direct, rtol=0, atol=2e-9 * peak)
            np.testing.assert_allclose(orbital_on_plane_numpy(orbital, plane, m), direct,
                                       rtol=0, atol=1e-12 * peak)
    direct = density_on_plane_direct(orbitals, plane)
    np.testing.assert_allclose(density_on_plane(orbitals, plane), direct, rtol=0, atol=1e-8 * direct.max())
    np.testing.assert_allclose(density_on_plane_numpy(orbitals, plane), direct, rtol=1e-12)


def test_numpy_path_is_used_without_numba(monkeypatch):
    from zeffir.core.density import _kernels

    monkeypatch.setattr(_kernels, "_kernels", lambda: None)
    orbital = build("Ne").orbital("2p")
    plane = Plane.named("xy", extent=3.0, resolution=256)
    np.testing.assert_allclose(orbital_on_plane(orbital, plane, 1),
                               orbital_on_plane_direct(orbital, plane, 1), rtol=0, atol=1e-13)


@pytest.mark.parametrize(("name", "axis"), [("xy", 2), ("xz", 1), ("yz", 0)])
def test_named_planes_sit_at_the_offset_along_their_missing_axis(name, axis):
    plane = Plane.named(name, offset=0.75, extent=2.0, resolution=5)
    points = plane.points()
    np.testing.assert_allclose(points[axis], 0.75)

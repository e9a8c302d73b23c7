"""One-matrix, spin densities, pair densities and holes: identities and cross-implementation checks."""

import numpy as np
import pytest
from scipy import integrate, linalg, special

from zeffir.core import (
    HydrogenicRadial,
    Plane,
    QuantumNumberError,
    SlaterRadial,
    build,
    complex_harmonic,
    parse_spec,
    spherical_density,
)
from zeffir.core.pairs import (
    DOWN,
    UP,
    DeterminantError,
    _kernels,
    complex_solid_harmonic,
    conditional_density,
    conditional_density_on_plane,
    exchange_hole,
    exchange_hole_on_plane,
    hund_determinant,
    one_matrix,
    pair_density,
    pair_density_on_plane,
    parse_determinant,
    radial_overlap,
    solid_legendre,
    spin_density,
    spin_density_on_plane,
)

# (spec, model, determinant text or "" for Hund): closed shells, Hund open shells, a
# chosen determinant whose open blocks are complex, and a d shell.
CASES = [
    ("Ne", "hydrogenic", ""),
    ("Ne", "slater", ""),
    ("N", "clementi", ""),
    ("O", "slater", ""),
    ("O", "slater", "2p: 1u 0u 1d -1d"),
    ("Fe", "slater", "3d: 2u 0u -1u -2u 1d 0d"),
]
IDS = [f"{spec}-{model}-{text or 'hund'}" for spec, model, text in CASES]


def _setup(spec, model, text):
    orbitals = build(spec, model)
    configuration = orbitals.configuration
    determinant = parse_determinant(configuration, text) if text else hund_determinant(configuration)
    return orbitals, determinant


def _points(count, seed=0, scale=1.5):
    """A seeded cloud of points that always contains the nucleus and a far point (bohr)."""
    rng = np.random.default_rng(seed)
    cloud = rng.normal(scale=scale, size=(count, 3))
    return np.vstack([np.zeros(3), [0.0, 0.0, 12.0], [1e-7, 0.0, 0.0], cloud])


@pytest.mark.parametrize(("spec", "model", "text"), [*CASES, ("Ar", "slater", ""), ("Yb", "slater", "")],
                         ids=[*IDS, "Ar", "Yb-4f14"])
def test_addition_theorem_equals_explicit_sum_over_m(spec, model, text):
    # Σ_m Y_l^m*(1) Y_l^m(2) = (2l+1)/(4π) P_l(cos γ) (Unsöld 1927; the addition theorem):
    # the closed-block path must reproduce the explicit sum over the 2l+1 spin-orbitals.
    orbitals, determinant = _setup(spec, model, text)
    r2 = _points(200)
    with np.errstate(all="raise", under="ignore"):
        for r1 in ([0.0, 0.0, 0.0], [0.3, -0.2, 0.4], [1.0, 2.0, -0.5]):
            for spin in (UP, DOWN):
                fast = one_matrix(orbitals, r1, r2, spin, determinant)
                explicit = one_matrix(orbitals, r1, r2, spin, determinant, addition_theorem=False)
                scale = np.abs(explicit).max()
                np.testing.assert_allclose(fast, explicit, rtol=0, atol=1e-13 * scale)


@pytest.mark.parametrize("spec", ["Ne", "Ar", "Zn"])
def test_closed_shell_density_equals_spherical_density(spec):
    # Bare-nucleus hydrogenic orbitals are orthonormal, so the determinant's density is
    # Σ occ R²/4π, what zeffir.core.spherical_density returns (Unsöld's theorem).
    orbitals = build(spec, "hydrogenic")
    points = _points(300)
    r = np.linalg.norm(points, axis=-1)
    expected = spherical_density(orbitals, r)
    np.testing.assert_allclose(spin_density(orbitals, points), expected, rtol=1e-12, atol=0)
    np.testing.assert_allclose(spin_density(orbitals, points, UP), 0.5 * expected, rtol=1e-12, atol=0)


def test_nonorthogonal_radials_give_the_density_of_the_orthonormalised_orbitals():
    # Slater-type 1s, 2s, 3s overlap. The determinant is unchanged by mixing its orbitals,
    # so its density is that of any orthonormalised set (Löwdin 1955). Independent route:
    # overlaps by adaptive quadrature, symmetric orthonormalisation C = S^(-1/2), and
    # ρ = Σ_spin Σ_l (2l+1)/(4π) Σ_k (Σ_n C_nk R_n)².
    orbitals = build("Ar", "slater")
    points = _points(100)
    r = np.linalg.norm(points, axis=-1)
    expected = np.zeros_like(r)
    for l in (0, 1):
        radials = [o.radial for o in orbitals.orbitals if o.l == l]
        s = np.array([[integrate.quad(lambda x, a=a, b=b: a(np.array([x]))[0] * b(np.array([x]))[0] * x * x,
                                      0, np.inf, epsabs=1e-14, epsrel=1e-13)[0] for b in radials]
                      for a in radials])
        c = linalg.inv(linalg.sqrtm(s).real)
        values = np.array([rf(r) for rf in radials])
        mixed = c.T @ values
        expected += 2 * (2 * l + 1) / (4 * np.pi) * np.sum(mixed**2, axis=0)
    np.testing.assert_allclose(spin_density(orbitals, points), expected, rtol=1e-9)
    # ... and it is not the naive Σ occ R²/4π, which ignores the overlap.
    naive = spherical_density(orbitals, r)
    assert np.max(np.abs(naive - expected) / expected) > 1e-3


@pytest.mark.parametrize(("spec", "model", "text"), CASES, ids=IDS)
def test_one_matrix_is_hermitian_and_its_diagonal_is_the_density(spec, model, text):
    # γ(r2, r1) = γ(r1, r2)* and γ(r, r) = ρ^σ(r) (McWeeny 1989, §5.5); the density comes
    # from a separate evaluator (Σ_m |Y|² × the radial quadratic form).
    orbitals, determinant = _setup(spec, model, text)
    a, b = _points(60, seed=1), _points(60, seed=2)
    for spin in (UP, DOWN):
        forward = one_matrix(orbitals, a, b, spin, determinant)
        backward = one_matrix(orbitals, b, a, spin, determinant)
        np.testing.assert_allclose(backward, np.conj(forward), rtol=0, atol=1e-14 * np.abs(forward).max())
        diagonal = one_matrix(orbitals, a, a, spin, determinant)
        rho = spin_density(orbitals, a, spin, determinant)
        np.testing.assert_allclose(diagonal.real, rho, rtol=1e-12, atol=1e-300)
        np.testing.assert_allclose(diagonal.imag, 0.0, atol=1e-14 * rho.max())


@pytest.mark.parametrize(("spec", "model", "text"), CASES, ids=IDS)
def test_same_spin_pair_density_vanishes_at_coincidence(spec, model, text):
    # ρ2^{σσ}(r, r) = ρ^σ(r)² − |γ^σ(r, r)|² = 0: two electrons of the same spin are never
    # at one point (Pauli; Parr & Yang 1989, §2.4). Only rounding remains.
    orbitals, determinant = _setup(spec, model, text)
    points = _points(200, seed=3)
    for spin in (UP, DOWN):
        same = pair_density(orbitals, points, points, (spin, spin), determinant)
        rho = spin_density(orbitals, points, spin, determinant)
        np.testing.assert_allclose(same, 0.0, atol=1e-12 * np.max(rho) ** 2)
    # Opposite spins are uncorrelated in one determinant: ρ2^{↑↓}(r, r) = ρ↑(r) ρ↓(r).
    opposite = pair_density(orbitals, points, points, (UP, DOWN), determinant)
    product = (spin_density(orbitals, points, UP, determinant)
               * spin_density(orbitals, points, DOWN, determinant))
    np.testing.assert_allclose(opposite, product, rtol=1e-14, atol=0)


@pytest.mark.parametrize(("spec", "model", "text"), CASES, ids=IDS)
def test_hole_at_the_reference_point_is_minus_the_density(spec, model, text):
    # h_x^σ(r1; r1) = −ρ^σ(r1) (Parr & Yang 1989, eq. 2.4.11 at r2 = r1), and the conditional
    # density there holds only the other spin.
    orbitals, determinant = _setup(spec, model, text)
    for r1 in ([0.1, 0.05, 0.02], [0.4, -0.3, 0.6], [1.5, 0.5, -1.0]):
        for spin in (UP, DOWN):
            rho = spin_density(orbitals, r1, spin, determinant)
            assert exchange_hole(orbitals, r1, r1, spin, determinant) == pytest.approx(-rho, rel=1e-12)
            other = spin_density(orbitals, r1, -spin, determinant)
            assert conditional_density(orbitals, r1, r1, spin, determinant) == pytest.approx(
                other, rel=1e-9, abs=1e-12 * rho)


def test_pair_density_is_symmetric_under_exchange_and_sums_its_spin_parts():
    # ρ2^{σσ'}(r1, r2) = ρ2^{σ'σ}(r2, r1) (electrons are indistinguishable); the spin-summed
    # pair density is the sum of the four parts.
    orbitals, determinant = _setup("O", "slater", "2p: 1u 0u 1d -1d")
    a, b = _points(50, seed=4), _points(50, seed=5)
    total = np.zeros(a.shape[0])
    for s1 in (UP, DOWN):
        for s2 in (UP, DOWN):
            part = pair_density(orbitals, a, b, (s1, s2), determinant)
            swapped = pair_density(orbitals, b, a, (s2, s1), determinant)
            np.testing.assert_allclose(part, swapped, rtol=1e-12, atol=1e-300)
            total += part
    np.testing.assert_allclose(pair_density(orbitals, a, b, None, determinant), total, rtol=1e-12)


PLANES = [
    Plane.named("xz", extent=3.0, resolution=64),
    Plane.named("xy", extent=2.5, resolution=33),
    Plane((1.0, 2.0, -0.5), offset=0.3, extent=2.0, resolution=40),
]


@pytest.mark.parametrize("compiled", [True, False], ids=["compiled", "numpy"])
@pytest.mark.parametrize("plane", PLANES, ids=["xz", "xy-odd", "oblique-offset"])
@pytest.mark.parametrize(("spec", "model", "text"), [CASES[1], CASES[3], CASES[4], CASES[5]],
                         ids=[IDS[1], IDS[3], IDS[4], IDS[5]])
def test_plane_evaluators_equal_the_point_evaluators(spec, model, text, plane, compiled, monkeypatch):
    # Cross-implementation: the slice path (quadrant radial factors, polynomials in (u, v),
    # compiled or numpy) against the direct evaluation at plane.points(); exact to rounding.
    if not compiled:
        monkeypatch.setattr(_kernels, "_kernels", lambda: None)
    orbitals, determinant = _setup(spec, model, text)
    x, y, z = plane.points()
    points = np.stack([x, y, z], axis=-1)
    r1 = np.array([0.35, -0.2, 0.5])

    def close(fast, direct):
        np.testing.assert_allclose(fast, direct, rtol=0, atol=1e-12 * np.abs(direct).max())

    with np.errstate(all="raise", under="ignore"):
        for spin in (UP, DOWN):
            close(exchange_hole_on_plane(orbitals, plane, r1, spin, determinant),
                  exchange_hole(orbitals, r1, points, spin, determinant))
            close(conditional_density_on_plane(orbitals, plane, r1, spin, determinant),
                  conditional_density(orbitals, r1, points, spin, determinant))
            close(spin_density_on_plane(orbitals, plane, spin, determinant),
                  spin_density(orbitals, points, spin, determinant))
            for other in (UP, DOWN):
                close(pair_density_on_plane(orbitals, plane, r1, (spin, other), determinant),
                      pair_density(orbitals, r1, points, (spin, other), determinant))


def test_slice_through_the_nucleus_is_symmetric_for_a_closed_shell_atom():
    # For a closed-shell atom and r1 on the z axis the hole is symmetric under x → −x in
    # the xz plane (a mirror plane of the problem), which the mirrored quadrants must keep.
    orbitals = build("Ne", "slater")
    plane = Plane.named("xz", extent=3.0, resolution=128)
    hole = exchange_hole_on_plane(orbitals, plane, (0.0, 0.0, 0.4))
    np.testing.assert_allclose(hole, hole[:, ::-1], rtol=0, atol=1e-14 * np.abs(hole).max())
    assert hole.min() < 0 and hole.max() <= 0


def test_errors():
    helium_ion = build("He+", "hydrogenic")  # one spin-up electron
    with pytest.raises(QuantumNumberError, match=r"no spin-down \(β\) density at r1"):
        exchange_hole(helium_ion, [0.0, 0.0, 1.0], [[0.0, 0.0, 0.5]], DOWN)
    with pytest.raises(QuantumNumberError, match="no spin-down"):
        exchange_hole_on_plane(helium_ion, Plane(resolution=8), (0.0, 0.0, 1.0), DOWN)
    neon = build("Ne", "slater")
    with pytest.raises(QuantumNumberError, match="spin = 0"):
        one_matrix(neon, [0, 0, 1], [0, 0, 1], 0)
    with pytest.raises(QuantumNumberError, match=r"shape \(\.\.\., 3\)"):
        spin_density(neon, [1.0, 2.0])
    with pytest.raises(QuantumNumberError, match="r1 must be one point"):
        exchange_hole_on_plane(neon, Plane(resolution=8), [[0, 0, 1], [0, 0, 2]])
    with pytest.raises(DeterminantError, match="the determinant places"):
        spin_density(neon, [0, 0, 1], UP, hund_determinant(parse_spec("F")))
    # Y_1^1 ∝ sin θ vanishes on the z axis: with the spin-up electron of C4+ 2p2 in m = 1,
    # no spin-up density is there (a node), so no hole around a spin-up electron there.
    carbon = build("C4+ 2p2", "hydrogenic")
    det = parse_determinant(carbon.configuration, "2p: 1u 1d")
    with pytest.raises(QuantumNumberError, match=r"no spin-up \(α\) density"):
        exchange_hole(carbon, [0.0, 0.0, 0.7], [[0.0, 0.0, 0.5]], UP, det)
    assert exchange_hole(carbon, [0.7, 0.0, 0.0], [[0.0, 0.0, 0.5]], UP, det)[0] == 0.0


def test_radial_overlap_closed_forms_match_quadrature():
    # Slater-type closed form and hydrogenic orthogonality against adaptive quadrature.
    def by_quad(a, b):
        return integrate.quad(lambda x: a(np.array([x]))[0] * b(np.array([x]))[0] * x * x,
                              0, np.inf, epsabs=1e-14, epsrel=1e-12, limit=200)[0]

    pairs = [
        (SlaterRadial(1, 0, 1.0, 9.7), SlaterRadial(2, 0, 2.0, 2.925)),
        (SlaterRadial(3, 2, 3.0, 1.2), SlaterRadial(4, 2, 3.7, 0.9)),
        (HydrogenicRadial(3, 1, 5.0), HydrogenicRadial(2, 1, 5.0)),
        (HydrogenicRadial(1, 0, 1.0), HydrogenicRadial(2, 0, 2.0)),  # different Z: quadrature path
        (HydrogenicRadial(2, 1, 3.0), SlaterRadial(2, 1, 2.0, 1.4)),  # mixed kinds: quadrature path
    ]
    for a, b in pairs:
        assert radial_overlap(a, b) == pytest.approx(by_quad(a, b), abs=1e-11)
        assert radial_overlap(b, a) == pytest.approx(radial_overlap(a, b), abs=1e-15)


def test_solid_legendre_matches_scipy():
    # Π_l(s, r²) = r^l P_l(s/r) (the recurrence) against scipy's P_l, l = 0..6.
    rng = np.random.default_rng(7)
    r = rng.uniform(0.1, 3.0, 50)
    c = np.concatenate([[-1.0, 1.0, 0.0], rng.uniform(-1.0, 1.0, 47)])
    for l in range(7):
        np.testing.assert_allclose(solid_legendre(l, c * r, r * r) / r**l, special.eval_legendre(l, c),
                                   rtol=0, atol=1e-13)


def test_complex_solid_harmonic_matches_condon_shortley_harmonics():
    # r^l Y_l^m from the real solid harmonics against scipy's Y_l^m (Condon–Shortley phase).
    rng = np.random.default_rng(8)
    theta = np.concatenate([[0.0, np.pi], rng.uniform(0, np.pi, 30)])
    phi = np.concatenate([[0.0, 2.0], rng.uniform(0, 2 * np.pi, 30)])
    unit = np.stack([np.sin(theta) * np.cos(phi), np.sin(theta) * np.sin(phi), np.cos(theta)])
    for l in range(5):
        for m in range(-l, l + 1):
            np.testing.assert_allclose(complex_solid_harmonic(l, m, *unit),
                                       complex_harmonic(l, m, theta, phi), atol=1e-13)

"""Singlet and triplet spatial functions of two electrons: symmetry, nodes, normalisation."""

import numpy as np
import pytest

from zeffir.core import QuantumNumberError, build
from zeffir.core.pairs import TwoElectronState

# Two-electron configurations: same l (1s2s: the exchange term survives the angular
# integrals), different l (1s2p: it does not), one subshell holding both (2p2 with two m),
# and nodeless Slater-type 1s, 2s that overlap (normalisation 1/√(2(1 ± S²))).
STATES = [
    ("Li+ 1s1 2s1", "hydrogenic", 0, 0, "real"),
    ("Li+ 1s1 2s1", "slater", 0, 0, "real"),
    ("He 1s1 2p1", "hydrogenic", 0, 0, "real"),
    ("He 1s1 2p1", "clementi", 0, 1, "complex"),
    ("C4+ 2p2", "hydrogenic", 1, -1, "real"),
    ("C4+ 2p2", "slater", 1, 0, "complex"),
    ("Be2+ 2s1 3d1", "hydrogenic", 0, -2, "real"),
]
IDS = [f"{spec}-{model}-{m_a}{m_b}-{kind}" for spec, model, m_a, m_b, kind in STATES]


def _pair(spec, model, m_a, m_b, kind, coupling):
    return TwoElectronState(build(spec, model), coupling, m_a, m_b, kind)


def _points(count, seed):
    rng = np.random.default_rng(seed)
    return np.vstack([np.zeros(3), [0.0, 0.0, 9.0], rng.normal(scale=1.5, size=(count, 3))])


def _radial_rule(points, scale):
    """Gauss–Legendre on (0, 1) mapped to r = s t/(1 − t): nodes and weights on [0, ∞)."""
    x, w = np.polynomial.legendre.leggauss(points)
    t, wt = 0.5 * (x + 1.0), 0.5 * w
    return scale * t / (1.0 - t), wt * scale / (1.0 - t) ** 2


@pytest.mark.parametrize("args", STATES, ids=IDS)
def test_triplet_is_antisymmetric_and_singlet_symmetric(args):
    # ψ±(r1, r2) = ±ψ±(r2, r1) by construction of [φa(1)φb(2) ± φb(1)φa(2)] (Bethe &
    # Salpeter 1957, §25); checked on seeded random pairs, the nucleus included.
    singlet = _pair(*args, "singlet")
    triplet = _pair(*args, "triplet")
    a, b = _points(100, 1), _points(100, 2)
    np.testing.assert_allclose(singlet(a, b), singlet(b, a), rtol=1e-14, atol=1e-300)
    np.testing.assert_allclose(triplet(a, b), -triplet(b, a), rtol=1e-14, atol=1e-300)
    # ... and so the triplet vanishes wherever the two electrons meet, while the singlet does not.
    assert np.all(triplet(a, a) == 0.0)
    assert np.any(singlet(a, a) != 0.0)


@pytest.mark.parametrize("args", STATES, ids=IDS)
def test_collinear_map_is_the_function_on_one_line(args):
    # Cross-implementation: the collinear map equals ψ± evaluated at (s1 n̂, s2 n̂), and the
    # triplet map is zero on its diagonal s1 = s2 (any pair of orbitals).
    direction = np.array([0.3, -0.4, 0.866])
    unit = direction / np.linalg.norm(direction)
    s = np.linspace(-6.0, 6.0, 41)
    for coupling in ("singlet", "triplet"):
        state = _pair(*args, coupling)
        grid = state.collinear_map(s, s, direction)
        direct = state((s[:, None, None] * unit), (s[None, :, None] * unit))
        np.testing.assert_allclose(grid, direct, rtol=1e-13, atol=1e-300)
        if coupling == "triplet":
            assert np.all(np.diag(grid) == 0.0)
            np.testing.assert_allclose(grid, -grid.T, rtol=0, atol=0)


def test_collinear_map_defaults_to_the_z_axis():
    state = _pair("He 1s1 2p1", "hydrogenic", 0, 0, "real", "triplet")
    s = np.linspace(0.0, 5.0, 11)
    np.testing.assert_array_equal(state.collinear_map(s, s), state.collinear_map(s, s, (0.0, 0.0, 2.0)))
    # 1s 2p_z on the z axis is not zero off the diagonal (so the check above is not vacuous).
    assert np.abs(state.collinear_map(s, s)).max() > 0


@pytest.mark.parametrize("args", STATES, ids=IDS)
def test_radial_maps_integrate_to_one(args):
    # ∫∫ P±(r1, r2) dr1 dr2 = ⟨ψ±|ψ±⟩ = 1: a product of two mapped Gauss–Legendre rules
    # (exponentially convergent for these e^{-ζr} × polynomial integrands; 200 nodes reach
    # ~1e-13 here, so 1e-10 is a safe tolerance).
    r, w = _radial_rule(200, 1.0)
    for coupling in ("singlet", "triplet"):
        state = _pair(*args, coupling)
        total = w @ state.radial_map(r, r) @ w
        assert total == pytest.approx(1.0, abs=1e-10)


@pytest.mark.parametrize("args", [STATES[1], STATES[3], STATES[5]], ids=[IDS[1], IDS[3], IDS[5]])
def test_radial_map_is_the_angular_integral_of_the_density(args):
    # Cross-implementation: r1² r2² ∫∫ |ψ±|² dΩ1 dΩ2 by product quadrature over both
    # directions (Gauss–Legendre in cos θ, uniform φ, exact for these degree <= 2 harmonics:
    # 3 × 5 nodes per electron) against the closed form, including whether the exchange term
    # survives (same l and m) or integrates to zero (different l or m).
    c, wc = np.polynomial.legendre.leggauss(3)
    phi = 2 * np.pi * np.arange(5) / 5
    s = np.sqrt(1 - c * c)
    unit = np.stack([np.outer(s, np.cos(phi)), np.outer(s, np.sin(phi)), np.outer(c, np.ones(5))], -1)
    unit = unit.reshape(-1, 3)
    weight = np.outer(wc, np.full(5, 2 * np.pi / 5)).ravel()
    radii = np.array([0.15, 0.6, 1.7, 3.2])
    for coupling in ("singlet", "triplet"):
        state = _pair(*args, coupling)
        expected = state.radial_map(radii, radii)
        for i, r1 in enumerate(radii):
            for j, r2 in enumerate(radii):
                psi = state((r1 * unit)[:, None, :], (r2 * unit)[None, :, :])
                value = r1**2 * r2**2 * weight @ (np.abs(psi) ** 2) @ weight
                assert value == pytest.approx(expected[i, j], rel=1e-12, abs=1e-15)


def test_singlet_and_triplet_radial_maps_agree_for_different_l_and_differ_for_equal_l():
    # He 1s2p: the exchange term carries |⟨Y_00|Y_1m⟩|² = 0, so singlet and triplet have one
    # radial map. Li+ 1s2s: it carries 1, and the triplet has a zero on r1 = r2.
    r = np.linspace(0.0, 6.0, 61)
    couplings = ("singlet", "triplet")
    he = [_pair("He 1s1 2p1", "hydrogenic", 0, 0, "real", c).radial_map(r, r) for c in couplings]
    np.testing.assert_allclose(he[0], he[1], rtol=1e-14, atol=0)
    li = [_pair("Li+ 1s1 2s1", "hydrogenic", 0, 0, "real", c).radial_map(r, r) for c in couplings]
    assert np.abs(li[0] - li[1]).max() > 1e-2 * li[0].max()
    np.testing.assert_allclose(np.diag(li[1]), 0.0, atol=1e-15 * li[1].max())


def test_two_electrons_in_one_orbital_have_only_the_singlet():
    # Pauli: φa = φb makes ψ− vanish identically, so no triplet exists.
    helium = build("He", "slater")  # 1s2
    with pytest.raises(QuantumNumberError, match="only the singlet exists"):
        TwoElectronState(helium, "triplet")
    singlet = TwoElectronState(helium, "singlet")
    points = _points(20, 3)
    phi = helium.orbital("1s").radial(np.linalg.norm(points, axis=-1)) / np.sqrt(4 * np.pi)
    # For a = b the singlet is φ(r1) φ(r2), normalised (S = 1 gives 2φφ/√4).
    np.testing.assert_allclose(singlet(points, points[::-1]), phi * phi[::-1], rtol=1e-14)
    with pytest.raises(QuantumNumberError, match="only the singlet"):
        TwoElectronState(build("C4+ 2p2", "slater"), "triplet", 1, 1)


def test_invalid_requests():
    with pytest.raises(QuantumNumberError, match="exactly two electrons, this configuration has 3"):
        TwoElectronState(build("Li", "slater"))
    with pytest.raises(QuantumNumberError, match=r"m_b = 2: \|m\| must be at most l = 1 for 2p"):
        TwoElectronState(build("He 1s1 2p1", "slater"), "singlet", 0, 2)
    with pytest.raises(QuantumNumberError, match="coupling"):
        TwoElectronState(build("He 1s1 2p1", "slater"), "quintet")  # type: ignore[arg-type]

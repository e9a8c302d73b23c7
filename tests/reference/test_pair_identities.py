"""Sum rules of the one-matrix, pair density and exchange hole of a single determinant.

Source of every rule: R. G. Parr and W. Yang, *Density-Functional Theory of Atoms and
Molecules* (Oxford, 1989), §2.4 (pair density normalised to N(N − 1), eq. 2.4.3; the
exchange hole of a determinant integrates to −1, eq. 2.4.11 and the text after it); and
R. McWeeny, *Methods of Molecular Quantum Mechanics*, 2nd ed. (1989), §5.5 (the
density matrices of one determinant).

Quadrature, used throughout and centred on the nucleus: Gauss–Legendre on t ∈ (0, 1)
mapped to r = t/(1 − t) bohr, times Gauss–Legendre in cos θ with l_max + 1 nodes, times
the uniform (trapezoid) rule in φ with 2 l_max + 1 nodes. For a fixed r1 every quantity
below is Σ f(r2) Y(r̂2) with harmonics of degree <= 2 l_max, which the angular part
integrates exactly; the radial rule converges exponentially for e^{-ζr} × polynomial
integrands (64 nodes reach ~1e-12 for every case here), so the tolerances below leave
two or more orders of magnitude of room and are far tighter than 1e-3.
"""

import numpy as np
import pytest

from zeffir.core import build
from zeffir.core.pairs import (
    DOWN,
    UP,
    conditional_density,
    exchange_hole,
    hund_determinant,
    pair_density,
    parse_determinant,
    spin_density,
)

# Ne (closed shells, orthonormal and overlapping radial functions), N and O (open shells,
# Hund determinant), O with a chosen determinant whose spin-down 2p block is partial.
CASES = [
    ("Ne", "hydrogenic", ""),
    ("Ne", "slater", ""),
    ("N", "slater", ""),
    ("N", "clementi", ""),
    ("O", "slater", ""),
    ("O", "clementi", "2p: 1u 0u 1d -1d"),
]
IDS = [f"{spec}-{model}-{text or 'hund'}" for spec, model, text in CASES]

# r1 inside the 1s shell, between the 1s and 2s/2p shells, at the 2p maximum and outside
# the atom (bohr), along directions that are not axes (open p blocks are not spherical).
REFERENCE_POINTS = [
    (0.03, 0.02, 0.04),
    (0.15, -0.1, 0.2),
    (0.5, 0.3, -0.4),
    (2.0, 1.5, 2.5),
]


def _rule(radial_nodes, l_max):
    x, w = np.polynomial.legendre.leggauss(radial_nodes)
    t, wt = 0.5 * (x + 1.0), 0.5 * w
    r = t / (1.0 - t)
    wr = wt / (1.0 - t) ** 2 * r * r
    c, wc = np.polynomial.legendre.leggauss(l_max + 1)
    n_phi = 2 * l_max + 1
    phi = 2.0 * np.pi * np.arange(n_phi) / n_phi
    s = np.sqrt(1.0 - c * c)
    unit = np.stack([np.outer(s, np.cos(phi)), np.outer(s, np.sin(phi)), np.outer(c, np.ones(n_phi))], -1)
    weights = np.outer(wc, np.full(n_phi, 2.0 * np.pi / n_phi)).ravel()
    points = (r[:, None, None] * unit.reshape(1, -1, 3)).reshape(-1, 3)
    return points, (wr[:, None] * weights[None, :]).ravel()


def _setup(spec, model, text):
    orbitals = build(spec, model)
    configuration = orbitals.configuration
    determinant = parse_determinant(configuration, text) if text else hund_determinant(configuration)
    l_max = max(sub.l for sub, _ in configuration.occupations)
    return orbitals, determinant, _rule(64, l_max)


@pytest.mark.parametrize(("spec", "model", "text"), CASES, ids=IDS)
def test_exchange_hole_integrates_to_minus_one(spec, model, text):
    # ∫ h_x^σ(r1; r2) d³r2 = −1 for every r1 (Parr & Yang 1989, §2.4).
    orbitals, determinant, (points, weights) = _setup(spec, model, text)
    for r1 in REFERENCE_POINTS:
        for spin in (UP, DOWN):
            hole = exchange_hole(orbitals, r1, points, spin, determinant)
            assert weights @ hole == pytest.approx(-1.0, abs=1e-9)


@pytest.mark.parametrize(("spec", "model", "text"), CASES, ids=IDS)
def test_spin_densities_hold_the_electrons_of_each_spin(spec, model, text):
    # ∫ ρ^σ = N_σ, and the conditional density holds the other N − 1 electrons.
    orbitals, determinant, (points, weights) = _setup(spec, model, text)
    for spin in (UP, DOWN):
        count = determinant.count(spin)
        assert weights @ spin_density(orbitals, points, spin, determinant) == pytest.approx(count, abs=1e-9)
    electrons = orbitals.configuration.n_electrons
    for r1 in REFERENCE_POINTS[1:3]:
        conditional = conditional_density(orbitals, r1, points, UP, determinant)
        assert weights @ conditional == pytest.approx(electrons - 1, abs=1e-9)


@pytest.mark.parametrize(("spec", "model", "text"), [CASES[1], CASES[2], CASES[5]],
                         ids=[IDS[1], IDS[2], IDS[5]])
def test_pair_density_holds_every_ordered_pair(spec, model, text):
    # ∫∫ ρ2 d³r1 d³r2 = N(N − 1), and per spin pair N_σ(N_σ' − δ_σσ') (Parr & Yang 1989,
    # eq. 2.4.3 and §2.4), by the product rule above in both electrons (a coarser radial
    # rule, 40 nodes each, keeps the six-dimensional sum small; it still reaches ~1e-10).
    orbitals, determinant, _ = _setup(spec, model, text)
    l_max = max(sub.l for sub, _ in orbitals.configuration.occupations)
    points, weights = _rule(40, l_max)
    r1, r2 = points[:, None, :], points[None, :, :]
    counts = {spin: determinant.count(spin) for spin in (UP, DOWN)}
    for s1 in (UP, DOWN):
        for s2 in (UP, DOWN):
            value = weights @ pair_density(orbitals, r1, r2, (s1, s2), determinant) @ weights
            assert value == pytest.approx(counts[s1] * (counts[s2] - (s1 == s2)), abs=1e-7)
    n = orbitals.configuration.n_electrons
    assert weights @ pair_density(orbitals, r1, r2, None, determinant) @ weights == pytest.approx(
        n * (n - 1), abs=1e-6)

"""Closed-form energies of one-Slater-function-per-subshell orbitals (the variational model)."""

import doctest

import numpy as np
import pytest
from scipy import integrate

from zeffir.core import parse_spec
from zeffir.core.energy import configuration_energy, hund_energy_expression
from zeffir.core.models import _sto_energy
from zeffir.core.models._sto_energy import StoEnergy, sto_one_electron, sto_one_electron_derivatives
from zeffir.core.models._variational import mixing_pairs, orthogonalised_radials, orthonormal_coefficients
from zeffir.core.orbitals import OrbitalSet, SlaterRadial, SubshellOrbital


def test_docstring_examples_hold():
    assert doctest.testmod(_sto_energy).failed == 0


def _p(function, r):
    return r * function(np.array([r]))[0]


def _quad(integrand, start=0.0):
    return integrate.quad(integrand, start, np.inf, epsabs=1e-14)[0]


@pytest.mark.parametrize(("l", "ns", "zetas"), [
    (0, [1, 2, 3], [5.2, 1.6, 0.7]), (1, [2, 3, 4], [3.1, 1.2, 0.9]), (2, [3, 4], [2.4, 0.8]),
])
def test_one_electron_matrices_match_quadrature(l, ns, zetas):
    # Independent: adaptive quadrature of the defining integrals, P' = P (n/r - ζ).
    S, T, V = sto_one_electron(l, ns, zetas, 7.0)
    funcs = [SlaterRadial(n, l, float(n), z) for n, z in zip(ns, zetas, strict=True)]
    for p, (fp, np_, zp) in enumerate(zip(funcs, ns, zetas, strict=True)):
        for q, (fq, nq, zq) in enumerate(zip(funcs, ns, zetas, strict=True)):
            s = _quad(lambda r, a=fp, b=fq: _p(a, r) * _p(b, r))
            v = -7.0 * _quad(lambda r, a=fp, b=fq: _p(a, r) * _p(b, r) / r)
            t = 0.5 * _quad(lambda r, a=fp, b=fq, na=np_, nb=nq, za=zp, zb=zq:
                            _p(a, r) * _p(b, r) * ((na / r - za) * (nb / r - zb) + l * (l + 1) / r**2),
                            1e-12)
            assert S[p, q] == pytest.approx(s, abs=1e-11)
            assert V[p, q] == pytest.approx(v, abs=1e-10)
            assert T[p, q] == pytest.approx(t, abs=1e-9)


def test_rk_blocks_match_the_same_n_routine():
    # With every function of one n (here three 2p-type functions), the R^k elements a
    # block evaluates are those of the Hartree–Fock basis tensor of
    # zeffir.core.models._slater_integrals (the same R^k products, arranged by another
    # route: distinct exponent sums and all four indices there, unordered pairs here).
    from zeffir.core.config import Subshell
    from zeffir.core.energy import EnergyExpression
    from zeffir.core.models._slater_integrals import rk_tensor

    subshells = (Subshell(2, 1), Subshell(3, 1), Subshell(4, 1))
    slater = {("F", 2, a, b): 1.0 for i, a in enumerate(subshells) for b in subshells[i:]}
    energy = StoEnergy(EnergyExpression(parse_spec("C"), {}, slater), subshells)
    energy.n = np.array([2.0, 2.0, 2.0])
    z = np.array([0.8, 1.9, 4.0])
    reference = rk_tensor(2, 2, z, 2, z, 2, z, 2, z)
    (block,) = energy._blocks
    p, q = energy._pair_p[block.pairs], energy._pair_q[block.pairs]
    expected = reference[p[:, None], q[:, None], p[None, :], q[None, :]]
    np.testing.assert_allclose(energy._square(block, energy._integrals(z)[0]), expected, rtol=1e-13)


def _energy_and_gradient(spec, seed):
    configuration = parse_spec(spec)
    subshells = tuple(s for s, _ in configuration.occupations)
    rng = np.random.default_rng(seed)
    zetas = configuration.Z / np.array([s.n for s in subshells]) ** 1.3
    zetas = zetas * rng.uniform(0.8, 1.2, len(subshells))
    energy = StoEnergy(hund_energy_expression(configuration), subshells)
    return energy, subshells, zetas, rng


@pytest.mark.parametrize("spec", ["Li", "Na", "Fe", "Gd"])
def test_gradient_at_fixed_coefficients_matches_central_differences(spec):
    # Cross-implementation: the closed-form ∂E/∂ζ and ∂E/∂C against five-point central
    # differences of terms_at (step 1e-3 ζ_i in ζ_i, 1e-3 along C), whose truncation
    # (h⁴/30 · E⁽⁵⁾) and rounding (~1e-16 |E| / h) errors we find at 5e-13 (Li) … 2e-10
    # (Gd) of the largest derivative; 1e-9 of it leaves room.
    energy, subshells, zetas, rng = _energy_and_gradient(spec, 7)
    mixing = {pair: float(rng.uniform(-0.2, 0.2)) for pair in mixing_pairs(parse_spec(spec))}
    coefficients = orthonormal_coefficients(subshells, tuple(zetas), mixing)
    found = energy.gradient_at(zetas, coefficients)
    assert sum(energy.terms_at(zetas, coefficients)) == pytest.approx(
        found.kinetic + found.nuclear + found.repulsion, abs=1e-10 * abs(found.kinetic))
    h = 1e-3

    def five_point(f):
        return (8 * (f(h) - f(-h)) - (f(2 * h) - f(-2 * h))) / (12 * h)

    by_zeta = np.array([five_point(lambda t, i=i: sum(energy.terms_at(
        zetas * (1 + t * np.eye(zetas.size)[i]), coefficients))) / zetas[i] for i in range(zetas.size)])
    scale = np.max(np.abs(by_zeta))
    np.testing.assert_allclose(found.zetas, by_zeta, rtol=0, atol=1e-9 * scale)
    direction = {l: rng.normal(size=c.shape) for l, c in coefficients.items()}
    along = five_point(lambda t: sum(energy.terms_at(
        zetas, {l: c + t * direction[l] for l, c in coefficients.items()})))
    analytic = float(np.sum(found.coefficients * energy._full(direction)))
    assert analytic == pytest.approx(along, abs=1e-9 * max(abs(along), scale))


@pytest.mark.parametrize(("l", "ns", "zetas"), [
    (0, [1, 2, 3], [5.2, 1.6, 0.7]), (2, [3, 4, 5], [2.4, 0.8, 0.5]),
])
def test_one_electron_derivatives_match_central_differences(l, ns, zetas):
    # ∂X_pq/∂ζ_p with ζ_q fixed: perturb one exponent and read row p (column q ≠ p),
    # against five-point differences (step 1e-4; truncation ~1e-15 relative).
    d_s, d_t, d_v = sto_one_electron_derivatives(l, ns, zetas, 7.0)
    h = 1e-4
    for p in range(len(zetas)):
        def at(t, p=p):
            z = np.array(zetas, dtype=float)
            z[p] += t
            return np.stack(sto_one_electron(l, ns, z, 7.0))

        fd = (8 * (at(h) - at(-h)) - (at(2 * h) - at(-2 * h))) / (12 * h)
        for q in range(len(zetas)):
            # On the diagonal both indices move: the total derivative is twice the partial.
            factor = 2.0 if q == p else 1.0
            np.testing.assert_allclose(factor * np.array([d_s[p, q], d_t[p, q], d_v[p, q]]), fd[:, p, q],
                                       rtol=1e-8, atol=1e-11)


@pytest.mark.parametrize(("spec", "mixing"), [("C", {(1, 0): 0.0}), ("Fe", {}), ("Na", {(1, 3): 0.05})])
def test_energy_matches_the_grid_evaluation(spec, mixing):
    # Cross-implementation: zeffir.core.energy integrates the same orbitals on its √r
    # grid (32001 points). We get agreement to 1e-9 (C) … 3e-8 Eh (Fe), the grid error.
    configuration = parse_spec(spec)
    subshells = tuple(s for s, _ in configuration.occupations)
    rng = np.random.default_rng(1)
    zetas = tuple(float(z) for z in (configuration.Z / np.array([s.n for s in subshells]) ** 1.3)
                  * rng.uniform(0.8, 1.2, len(subshells)))
    mixing = {pair: angle for pair, angle in mixing.items() if pair[0] < pair[1]}
    energy = StoEnergy(hund_energy_expression(configuration), subshells)
    kinetic, nuclear, repulsion = energy.terms_at(zetas, orthonormal_coefficients(subshells, zetas, mixing))
    radials = orthogonalised_radials(subshells, zetas, mixing)
    orbitals = OrbitalSet(configuration, "test", tuple(
        SubshellOrbital(s, w, r, 1.0, 1.0, None, None) for (s, w), r in
        zip(configuration.occupations, radials, strict=True)))
    grid = configuration_energy(orbitals, "hund", points=32001)
    assert kinetic == pytest.approx(grid.kinetic, abs=1e-7)
    assert nuclear + repulsion == pytest.approx(grid.potential, abs=1e-7)

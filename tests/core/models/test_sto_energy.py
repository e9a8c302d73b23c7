"""Closed-form energies of one-Slater-function-per-subshell orbitals (the variational model)."""

import doctest

import numpy as np
import pytest
from scipy import integrate

from zeffir.core import parse_spec
from zeffir.core.energy import configuration_energy, hund_energy_expression
from zeffir.core.models import _sto_energy
from zeffir.core.models._sto_energy import StoEnergy, sto_one_electron
from zeffir.core.models._variational import orthogonalised_radials, orthonormal_coefficients
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


def test_rk_matrix_matches_the_same_n_routine():
    # With every function of one n (here three 2p-type functions), R^k over all of
    # them is the Hartree–Fock basis tensor of zeffir.core.models._slater_integrals
    # (the same R^k products, arranged by another route: distinct exponent sums there,
    # unordered pairs here).
    from zeffir.core.config import Subshell
    from zeffir.core.energy import EnergyExpression
    from zeffir.core.models._slater_integrals import rk_tensor

    subshells = (Subshell(2, 1), Subshell(3, 1), Subshell(4, 1))
    energy = StoEnergy(EnergyExpression(parse_spec("C"), {}, {}), subshells)
    energy.n = np.array([2.0, 2.0, 2.0])
    z = np.array([0.8, 1.9, 4.0])
    reference = rk_tensor(2, 2, z, 2, z, 2, z, 2, z).reshape(9, 9)
    np.testing.assert_allclose(energy._rk(2, z), reference, rtol=1e-13)


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

"""Radial integrals on the √r grid against closed forms and sympy."""

import numpy as np
import pytest
import sympy as sp

from zeffir.core import build, parse_spec
from zeffir.core.config import Subshell
from zeffir.core.energy import configuration_energy, radial_integrals
from zeffir.core.orbitals import HydrogenicRadial, OrbitalSet, SlaterRadial, SubshellOrbital

S1, S2, P2 = Subshell(1, 0), Subshell(2, 0), Subshell(2, 1)


def _set(spec, radials):
    conf = parse_spec(spec)
    orbitals = tuple(
        SubshellOrbital(sub, occ, radial, 1.0, 1.0, None, None)
        for (sub, occ), radial in zip(conf.occupations, radials, strict=True)
    )
    return OrbitalSet(conf, "test", orbitals)


def _sympy_p(n, zeta):
    r = sp.symbols("r", positive=True)
    norm = sp.sqrt((2 * zeta) ** (2 * n + 1) / sp.factorial(2 * n))
    return r, norm * r**n * sp.exp(-zeta * r)


def _sympy_rk(k, pa, pc, pb, pd, r):
    # R^k(ab; cd) = ∫ P_a P_c(r) [r^{-k-1} ∫₀^r s^k P_b P_d ds + r^k ∫_r^∞ s^{-k-1} P_b P_d ds] dr.
    s = sp.symbols("s", positive=True)
    rho = (pb * pd).subs(r, s)
    inner = sp.integrate(s**k * rho, (s, 0, r))
    outer = sp.integrate(s ** (-k - 1) * rho, (s, r, sp.oo))
    return sp.integrate(pa * pc * (inner / r ** (k + 1) + r**k * outer), (r, 0, sp.oo))


def test_slater_integrals_match_sympy_closed_forms():
    # Cross-implementation: exact integrals of Slater-type functions (no orthogonalisation
    # here: 1s and 2p differ in l) against the cumulative-sum quadrature.
    z1, z2 = sp.Rational(27, 10), sp.Rational(6, 5)
    r, p1 = _sympy_p(1, z1)
    _, p2 = _sympy_p(2, z2)
    radials = (SlaterRadial(1, 0, 1.0, 2.7), SlaterRadial(2, 1, 2.0, 1.2))
    ints = radial_integrals(_set("Li 1s2 2p1", radials), orthonormalise=False)
    cases = [
        (ints.slater_f(0, S1, S1), _sympy_rk(0, p1, p1, p1, p1, r)),
        (ints.slater_f(0, S1, P2), _sympy_rk(0, p1, p1, p2, p2, r)),
        (ints.slater_f(2, P2, P2), _sympy_rk(2, p2, p2, p2, p2, r)),
        (ints.slater_g(1, S1, P2), _sympy_rk(1, p1, p2, p2, p1, r)),
    ]
    for got, exact in cases:
        # Simpson in √r with 4001 points: converged to ~1e-11 (see the grid test below).
        assert got == pytest.approx(float(exact), rel=1e-9, abs=1e-11)


def test_one_electron_integrals_of_hydrogenic_functions():
    # Closed forms (standard textbook result): T = Z²/(2n²), <1/r> = Z/n²; the nucleus of
    # boron (charge 5) attracts functions of hydrogenic charge Z = 3.
    Z = 3
    radials = (HydrogenicRadial(1, 0, Z), HydrogenicRadial(2, 0, Z), HydrogenicRadial(2, 1, Z))
    ints = radial_integrals(_set("B 1s2 2s2 2p1", radials))
    for sub, n in [(S1, 1), (S2, 2), (P2, 2)]:
        assert ints.kinetic(sub) == pytest.approx(Z**2 / (2 * n**2), rel=1e-9)
        assert ints.nuclear(sub) == pytest.approx(-5 * Z / n**2, rel=1e-9)
    # Hydrogenic 1s and 2s are orthogonal already: Gram–Schmidt leaves them as they are.
    assert ints.overlap(S1, S2) == pytest.approx(0.0, abs=1e-12)
    assert ints.overlap(S2, S2) == pytest.approx(1.0, abs=1e-12)


def test_gram_schmidt_makes_slater_1s_and_2s_orthonormal():
    radials = (SlaterRadial(1, 0, 1.0, 2.69), SlaterRadial(2, 0, 2.0, 0.64))
    plain = radial_integrals(_set("Li", radials), orthonormalise=False)
    assert abs(plain.overlap(S1, S2)) > 0.1
    ints = radial_integrals(_set("Li", radials))
    assert ints.overlap(S1, S2) == pytest.approx(0.0, abs=1e-13)
    assert ints.overlap(S2, S2) == pytest.approx(1.0, abs=1e-13)
    # Orthogonalised 2s has one node, as a 2s should.
    assert np.count_nonzero(np.diff(np.signbit(ints.p[1][1:]))) == 1


def test_helium_energy_of_a_screened_1s_pair():
    # E(ζ) = ζ² - 2Zζ + 5ζ/8 for 1s² with exponent ζ (standard textbook result).
    for zeta in (1.0, 1.6875, 2.0, 3.3):
        orbitals = _set("He", (SlaterRadial(1, 0, 1.0, zeta),))
        terms = configuration_energy(orbitals)
        assert terms.kinetic == pytest.approx(zeta**2, rel=1e-10)
        assert terms.nuclear == pytest.approx(-4 * zeta, rel=1e-10)
        assert terms.repulsion == pytest.approx(5 * zeta / 8, rel=1e-9)
        assert configuration_energy(orbitals, "average").total == pytest.approx(terms.total, rel=1e-12)


def test_grid_is_converged():
    orbitals = build("O", "clementi")
    coarse = configuration_energy(orbitals, points=4001).total
    fine = configuration_energy(orbitals, points=16001).total
    assert coarse == pytest.approx(fine, abs=1e-8)


def test_hund_ground_term_lies_below_the_average_for_carbon():
    # Hund's ground term lies below the configuration average (Slater 1960, ch. 21).
    carbon = build("C", "clementi")
    assert configuration_energy(carbon, "hund").total < configuration_energy(carbon, "average").total


def test_bad_grid_is_refused():
    from zeffir.core._errors import QuantumNumberError

    with pytest.raises(QuantumNumberError, match="odd"):
        radial_integrals(build("He", "slater"), points=1000)

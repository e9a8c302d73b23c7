"""The Σc·STO radial kind both Slater-type models return: extent, closed forms, nodes."""

import numpy as np
import pytest
from scipy import integrate

from zeffir.core import QuantumNumberError, build
from zeffir.core.orbitals import SlaterExpansionRadial, SlaterRadial


@pytest.fixture(scope="module")
def orbitals():
    # A self-consistent orbital (25 s functions of one n) and minimal-basis orbitals of
    # the variational model (functions of different n, coefficients above 1).
    return {
        "hartree-fock Ne 2s": build("Ne", "hartree-fock").orbital("2s").radial,
        "variational C 2s": build("C", "variational").orbital("2s").radial,
        "variational Na 1s": build("Na", "variational").orbital("1s").radial,
    }


def _tail(radial, r0):
    """∫_{r0}^∞ P² dr by adaptive quadrature, to where P² has underflowed."""
    top = r0 + 800.0 / float(np.min(radial.zetas))
    return integrate.quad(lambda x: radial.p(np.array([x]))[0] ** 2, r0, top,
                          limit=400, epsabs=0, epsrel=1e-11)[0]


@pytest.mark.parametrize("name", ["hartree-fock Ne 2s", "variational C 2s", "variational Na 1s"])
@pytest.mark.parametrize("tail", [1e-8, 1e-14])
def test_extent_is_where_the_tail_integral_reaches_the_tolerance(orbitals, name, tail):
    # The definition of RadialFunction.extent, checked against a quadrature that uses
    # neither the closed-form tail nor the bisection: at the extent the tail holds the
    # tolerance (we get agreement to 2e-11; bisection stops at 1e-12 of r, quad is good
    # to ~1e-10 here), and 1 % further in it holds more (2 % to 50 % more for these). The
    # largest extent of the terms, the former rule for the variational orbitals, leaves
    # only 0.88 (C 2s, 1e-8) down to 8e-10 (Na 1s, 1e-14) of the tolerance beyond it:
    # too wide, and the more so the smaller the coefficient of the most diffuse function.
    radial = orbitals[name]
    r = radial.extent(tail)
    assert isinstance(radial, SlaterExpansionRadial)
    assert _tail(radial, r) == pytest.approx(tail, rel=1e-6)
    assert _tail(radial, 0.99 * r) > 1.01 * tail


def test_extent_widens_beyond_the_terms_when_coefficients_cancel():
    # 20 χ(ζ = 1) - 19 χ(ζ = 1.1), normalised: the coefficients cancel near the nucleus,
    # so far out the combination carries ~110 times the tail of χ(ζ = 1) (c = 10.5) and holds
    # more than the tolerance beyond the extent of either function alone.
    unscaled = SlaterExpansionRadial(1, 0, 1, [1.0, 1.1], [20.0, -19.0])
    radial = SlaterExpansionRadial(1, 0, 1, [1.0, 1.1], unscaled.coefficients / np.sqrt(unscaled.norm()))
    assert radial.coefficients[0] > 10
    widest = max(term.extent(1e-14) for term in radial.terms)
    assert radial.extent(1e-14) > widest
    assert _tail(radial, radial.extent(1e-14)) == pytest.approx(1e-14, rel=1e-6)


@pytest.mark.parametrize("name", ["variational C 2s", "variational Na 1s"])
def test_mixed_n_closed_forms_match_quadrature(orbitals, name):
    # The variational orbitals mix Slater-type functions of n = 1, 2 (C 2s) or 1, 2, 3
    # (Na 1s): moments, cumulative charge and dP/dr in closed form against quadrature
    # and central differences.
    radial = orbitals[name]
    assert len(set(radial.n_stars)) > 1
    with np.errstate(all="raise", under="ignore"):
        for k in (-2, -1, 0, 1, 2):
            numeric = integrate.quad(lambda x, k=k: radial(np.array([x]))[0] ** 2 * x ** (2 + k), 0, 80,
                                     points=[0.05, 0.3, 1.0, 3.0], limit=400, epsabs=0, epsrel=1e-12)[0]
            assert radial.expectation(k) == pytest.approx(numeric, rel=1e-10)
        for x in (0.05, 0.3, 1.0, 4.0):
            numeric = integrate.quad(lambda y: radial.p(np.array([y]))[0] ** 2, 0, x,
                                     limit=400, epsabs=1e-15, epsrel=1e-12)[0]
            assert radial.cumulative(np.array([x]))[0] == pytest.approx(numeric, rel=1e-10, abs=1e-14)
        r = np.concatenate(([1e-3], np.random.default_rng(11).uniform(0.01, 10.0, 30)))
        step = 1e-6
        numeric = (radial.p(r + step) - radial.p(r - step)) / (2 * step)
        assert np.allclose(radial.p_derivative(r), numeric, rtol=1e-6, atol=1e-7)
    assert radial.norm() == pytest.approx(1.0, abs=1e-12)


def test_variational_orbitals_keep_n_minus_l_minus_1_nodes():
    # The Na 1s of the variational model crosses zero at 1.29 bohr, where its mixing with
    # the 2s and 3s functions exceeds its own decayed tail (1e-10 of the electron is
    # outside): a tail crossing, not a node, and dropped as for Hartree–Fock orbitals.
    sodium = build("Na", "variational")
    for orbital in sodium.orbitals:
        assert orbital.radial.nodes().size == orbital.n - orbital.l - 1
    one_s = sodium.orbital("1s").radial
    r = np.linspace(0.5, 3.0, 2001)
    assert np.any(np.signbit(one_s(r[:-1])) != np.signbit(one_s(r[1:])))


def test_one_term_is_the_slater_type_function():
    chi = SlaterRadial(3, 2, 3.0, 1.7)
    radial = SlaterExpansionRadial.from_terms(3, 2, [(chi, 1.0)])
    r = np.array([0.0, 0.1, 1.0, 5.0])
    assert np.array_equal(radial(r), chi(r))
    assert np.array_equal(radial.over_r_l(r), chi.over_r_l(r))
    for k in (-1, 1, 2):
        assert radial.expectation(k) == pytest.approx(chi.expectation(k), rel=1e-14)
    assert radial.cumulative(r) == pytest.approx(chi.cumulative(r), abs=1e-15)
    assert radial.nodes().size == 0
    assert radial.r_max() == pytest.approx(chi.r_max(), rel=1e-10)  # located numerically


def test_shape_key_follows_the_terms_not_the_labels():
    a = SlaterExpansionRadial(2, 0, 1, [1.0, 2.0], [0.6, 0.5])
    b = SlaterExpansionRadial(3, 1, [1.0, 1.0], [1.0, 2.0], [0.6, 0.5])
    c = SlaterExpansionRadial(2, 0, 1, [1.0, 2.0], [0.6, 0.4])
    assert a.shape_key() == b.shape_key() != c.shape_key()
    assert "STO(1, 2)" in repr(a)


@pytest.mark.parametrize(("n_stars", "zetas", "coefficients"), [
    (1, [1.0, 2.0], [1.0]),
    ([1, 2, 3], [1.0, 2.0], [1.0, 0.0]),
    (1, [], []),
    (0.5, [1.0], [1.0]),
    (1, [-1.0], [1.0]),
])
def test_invalid_expansions_are_refused(n_stars, zetas, coefficients):
    with pytest.raises(QuantumNumberError):
        SlaterExpansionRadial(1, 0, n_stars, zetas, coefficients)

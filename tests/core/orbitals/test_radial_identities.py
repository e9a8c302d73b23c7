"""Identities every radial function must satisfy: normalisation, orthogonality, stability."""

import numpy as np
import pytest
from numpy.polynomial.legendre import leggauss

from zeffir.core import HydrogenicRadial, SlaterRadial, TabulatedRadial
from zeffir.core.orbitals import log_grid


def _panel_quadrature(f, top, panels=400, order=20):
    """∫_0^top f(r) dr by composite Gauss–Legendre: independent of the functions' own integrals."""
    x, w = leggauss(order)
    edges = np.linspace(0.0, top, panels + 1)
    mid = 0.5 * (edges[1:] + edges[:-1])[:, None]
    half = 0.5 * np.diff(edges)[:, None]
    r = (mid + half * x[None, :]).ravel()
    return float(np.sum((half * w[None, :]).ravel() * f(r)))


@pytest.mark.parametrize("n", range(1, 21))
def test_hydrogenic_normalised_for_every_n_l(n):
    for l in range(n):
        R = HydrogenicRadial(n, l, 1.0)
        top = R.extent(1e-18)
        norm = _panel_quadrature(lambda r, R=R: (r * R(r)) ** 2, top)
        assert norm == pytest.approx(1.0, abs=1e-10)


@pytest.mark.parametrize("l", [0, 1, 2, 5])
def test_hydrogenic_same_l_functions_are_orthogonal(l):
    functions = [HydrogenicRadial(n, l, 3.0) for n in range(l + 1, l + 6)]
    top = max(f.extent(1e-18) for f in functions)
    for i, a in enumerate(functions):
        for b in functions[i + 1 :]:
            overlap = _panel_quadrature(lambda r, a=a, b=b: r * r * a(r) * b(r), top)
            assert abs(overlap) < 1e-10


def test_hydrogenic_is_finite_for_the_largest_n_and_z():
    r = np.concatenate(([0.0], np.geomspace(1e-8, 1e4, 2000)))
    with np.errstate(all="raise"):
        for n, l, Z in [(20, 0, 118.0), (20, 19, 118.0), (20, 10, 1.0), (1, 0, 118.0)]:
            R = HydrogenicRadial(n, l, Z)
            values = R(r)
            assert np.all(np.isfinite(values))
            assert np.all(np.isfinite(R.over_r_l(r)))
            assert R.expectation(1) > 0


def test_gauss_laguerre_norm_equals_one():
    for n in (1, 7, 20):
        for l in (0, n - 1):
            assert HydrogenicRadial(n, l, 54.0).norm() == pytest.approx(1.0, abs=1e-12)


@pytest.mark.parametrize(("n_star", "zeta", "l"), [(1.0, 1.7, 0), (3.7, 1.2, 2), (4.2, 0.9, 3)])
def test_slater_closed_forms_agree_with_quadrature(n_star, zeta, l):
    R = SlaterRadial(4, l, n_star, zeta)
    top = R.extent(1e-18)
    for k in (-2, -1, 0, 1, 2):
        numeric = _panel_quadrature(lambda r, k=k: R(r) ** 2 * r ** (2 + k), top)
        assert R.expectation(k) == pytest.approx(numeric, rel=1e-10)
    r = np.linspace(0.0, top, 7)
    numeric_q = [_panel_quadrature(lambda x: (x * R(x)) ** 2, x) if x else 0.0 for x in r]
    np.testing.assert_allclose(R.cumulative(r), numeric_q, atol=1e-10)


def test_slater_is_finite_at_the_nucleus_under_strict_errors():
    r = np.array([0.0, 1e-300, 1e-3, 1.0, 1e3, 1e6])
    with np.errstate(all="raise"):
        for R in (SlaterRadial(4, 3, 3.7, 2.0), SlaterRadial(1, 0, 1.0, 100.0)):
            assert np.all(np.isfinite(R(r)))
            assert np.all(np.isfinite(R.over_r_l(r)))


def test_tabulated_reproduces_the_function_it_was_built_from():
    exact = HydrogenicRadial(4, 1, 2.0)
    grid = log_grid(1e-5, exact.extent(1e-16), 1500)
    table = TabulatedRadial(4, 1, grid, exact(grid))
    r = np.linspace(1e-6, 30.0, 4001)
    np.testing.assert_allclose(table(r), exact(r), atol=1e-8 * np.abs(exact(r)).max())
    assert table.norm() == pytest.approx(1.0, abs=1e-12)
    for k in (-2, -1, 1, 2):
        assert table.expectation(k) == pytest.approx(exact.expectation(k), rel=1e-8)
    np.testing.assert_allclose(table.nodes(), exact.nodes(), atol=1e-8)
    # r_max is a zero of the interpolated derivative, whose error is O(h³) in ln r.
    assert table.r_max() == pytest.approx(exact.r_max(), rel=1e-7)


def test_generic_numerical_methods_agree_with_closed_forms():
    R = HydrogenicRadial(3, 0, 1.0)
    # RadialFunction's generic quadrature and node finder, called on the hydrogenic function.
    from zeffir.core.orbitals import RadialFunction

    assert RadialFunction.expectation(R, 1) == pytest.approx(R.expectation(1), rel=1e-9)
    np.testing.assert_allclose(RadialFunction.nodes(R), R.nodes(), rtol=1e-10)
    r = np.array([0.5, 2.0, 10.0, 60.0])
    q = RadialFunction.cumulative(R, r)
    assert q[-1] == pytest.approx(1.0, abs=1e-9)  # Simpson on 16001 points in √r
    assert np.all(np.diff(q) > 0)


def test_invalid_parameters_are_rejected():
    from zeffir.core import QuantumNumberError

    for args in [(0, 0, 1.0), (21, 0, 1.0), (2, 2, 1.0), (1, 0, 0.0), (1, 0, float("nan"))]:
        with pytest.raises(QuantumNumberError):
            HydrogenicRadial(*args)
    with pytest.raises(QuantumNumberError):
        SlaterRadial(1, 0, 0.5, 1.0)
    with pytest.raises(QuantumNumberError):
        TabulatedRadial(1, 0, [1.0, 0.5] * 5, [1.0] * 10)

"""Hydrogenic radial functions against outside sources."""

import math

import numpy as np
import pytest
import sympy
from sympy.physics import hydrogen

from zeffir.core import HydrogenicRadial


@pytest.mark.parametrize("Z", [1, 3, 26, 92])
@pytest.mark.parametrize("n", range(1, 7))
def test_matches_sympy_closed_form(n, Z):
    # Reference: sympy.physics.hydrogen.R_nl (exact closed form, same sign convention).
    # Tolerance: 1e-12 relative to the function's largest magnitude — a pointwise
    # relative test is meaningless next to the nodes, where both cross zero.
    r_sym = sympy.Symbol("r", positive=True)
    r = np.concatenate(([0.0], np.geomspace(1e-4, 60.0 / Z * n, 60)))
    for l in range(n):
        exact = sympy.lambdify(r_sym, hydrogen.R_nl(n, l, r_sym, Z), "mpmath")
        reference = np.array([float(exact(x)) for x in r])
        ours = HydrogenicRadial(n, l, float(Z))(r)
        scale = np.abs(reference).max()
        np.testing.assert_allclose(ours, reference, rtol=1e-12, atol=1e-12 * scale)


@pytest.mark.parametrize(("n", "l"), [(1, 0), (2, 0), (2, 1), (3, 2), (5, 3), (9, 4), (20, 0), (20, 19)])
@pytest.mark.parametrize("Z", [1.0, 7.0, 118.0])
def test_radial_moments_match_closed_forms(n, l, Z):
    # Bethe & Salpeter (1957), eqs. (3.24)-(3.26):
    #   <r> = (3n² - l(l+1)) / 2Z,  <r²> = n²(5n² + 1 - 3l(l+1)) / 2Z²,
    #   <1/r> = Z/n²,  <1/r²> = Z² / (n³ (l + 1/2)),  <1/r³> = Z³ / (n³ l (l + 1/2)(l + 1)).
    R = HydrogenicRadial(n, l, Z)
    rel = 1e-12  # Gauss–Laguerre is exact here; only rounding remains
    assert R.expectation(1) == pytest.approx((3 * n * n - l * (l + 1)) / (2 * Z), rel=rel)
    assert R.expectation(2) == pytest.approx(n * n * (5 * n * n + 1 - 3 * l * (l + 1)) / (2 * Z * Z), rel=rel)
    assert R.expectation(-1) == pytest.approx(Z / n**2, rel=rel)
    assert R.expectation(-2) == pytest.approx(Z * Z / (n**3 * (l + 0.5)), rel=rel)
    if l > 0:
        assert R.expectation(-3) == pytest.approx(Z**3 / (n**3 * l * (l + 0.5) * (l + 1)), rel=rel)
    else:
        assert math.isinf(R.expectation(-3))


def test_hydrogen_radial_nodes():
    # Nodes of hydrogen (Z = 1) from the Laguerre polynomials (Bethe & Salpeter 1957, §3):
    # 2s: r = 2; 3s: r = (9 ± 3√3)/2; 3p: r = 6 (bohr).
    np.testing.assert_allclose(HydrogenicRadial(2, 0, 1.0).nodes(), [2.0], rtol=1e-13)
    np.testing.assert_allclose(
        HydrogenicRadial(3, 0, 1.0).nodes(),
        [(9 - 3 * math.sqrt(3)) / 2, (9 + 3 * math.sqrt(3)) / 2], rtol=1e-13,
    )
    np.testing.assert_allclose(HydrogenicRadial(3, 1, 1.0).nodes(), [6.0], rtol=1e-13)


@pytest.mark.parametrize("n", [1, 2, 3, 4, 7])
def test_nodeless_radial_distribution_peaks_at_n_squared_over_z(n):
    # For l = n - 1, D(r) ∝ r^{2n} e^{-2Zr/n} peaks at n²/Z (Bethe & Salpeter 1957).
    assert HydrogenicRadial(n, n - 1, 2.0).r_max() == pytest.approx(n * n / 2.0, rel=1e-9)


def test_hydrogen_1s_value_at_nucleus():
    # R_10(0) = 2 Z^{3/2} (Bethe & Salpeter 1957, eq. 3.17).
    assert HydrogenicRadial(1, 0, 8.0)(np.array([0.0]))[0] == pytest.approx(2 * 8.0**1.5, rel=1e-14)

"""The whole-parameter incomplete beta function of the R^k integrals against scipy's.

For whole a, b the regularised incomplete beta function is a binomial tail
(Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, 26.5.24); the
reference here is ``scipy.special.betainc``, the general continued fraction.
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy import special

from zeffir.core.models._slater_integrals import _binomial_tail, rk_product


@pytest.mark.parametrize("a", [1, 2, 5, 11, 20, 29])
@pytest.mark.parametrize("b", [1, 2, 7, 15])
def test_binomial_tail_equals_betainc(a, b):
    rng = np.random.default_rng(a * 100 + b)
    # Exponent sums as in the basis sets: from 0.05 to 5000 per bohr, so t reaches
    # within 1e-5 of 0 and of 1.
    alpha = np.exp(rng.uniform(np.log(0.05), np.log(5000.0), 4000))
    beta = np.exp(rng.uniform(np.log(0.05), np.log(5000.0), 4000))
    t, w = beta / (alpha + beta), alpha / (alpha + beta)
    reference = special.betainc(a, b, t)
    ours = _binomial_tail(a, b, t, w)
    kept = reference > 1e-290
    np.testing.assert_allclose(ours[kept], reference[kept], rtol=5e-14, atol=0.0)


def test_the_whole_and_general_paths_of_rk_product_agree():
    # Integer powers take the binomial tail; array powers the general betainc path.
    alpha = np.geomspace(0.1, 300.0, 40)[:, None]
    beta = np.geomspace(0.07, 500.0, 50)[None, :]
    for k, p1, p2 in [(0, 2, 2), (1, 4, 6), (2, 7, 9), (3, 12, 14)]:
        whole = rk_product(k, p1, alpha, p2, beta)
        general = rk_product(k, np.array([p1]), alpha, np.array([p2]), beta)
        np.testing.assert_allclose(whole, general, rtol=5e-14, atol=0.0)

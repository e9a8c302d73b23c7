"""Wigner 3j symbols and c^k coefficients against sympy and Condon & Shortley."""

import itertools
import math
from fractions import Fraction

import pytest
import sympy
from sympy.physics.wigner import gaunt as sympy_gaunt
from sympy.physics.wigner import wigner_3j as sympy_3j

from zeffir.core.energy import ck_coefficient, wigner_3j, wigner_3j_squared


def _arguments(max_j):
    for j1, j2, j3 in itertools.product(range(max_j + 1), repeat=3):
        for m1 in range(-j1, j1 + 1):
            for m2 in range(-j2, j2 + 1):
                yield j1, j2, j3, m1, m2, -m1 - m2


def test_3j_matches_sympy_for_every_integer_argument_up_to_j_3():
    # Cross-implementation: sympy's exact symbols; only the final square root rounds.
    count = 0
    for args in _arguments(3):
        expected = float(sympy_3j(*args))
        assert wigner_3j(*args) == pytest.approx(expected, rel=1e-14, abs=1e-15), args
        count += 1
    assert count > 500


def test_3j_squared_is_exact_against_sympy():
    for args in [(3, 4, 5, 1, -2, 1), (6, 6, 6, 0, 0, 0), (2, 4, 2, -1, 0, 1), (5, 3, 4, 2, -3, 1)]:
        sign, square = wigner_3j_squared(*args)
        exact = sympy_3j(*args)
        assert Fraction(str(exact**2)) == square
        assert sign == int(sympy.sign(exact))


def test_3j_vanishes_outside_the_selection_rules():
    assert wigner_3j(1, 1, 3, 0, 0, 0) == 0.0  # triangle
    assert wigner_3j(1, 1, 1, 0, 0, 0) == 0.0  # odd j1+j2+j3 with all m = 0
    assert wigner_3j(1, 1, 2, 1, 1, 0) == 0.0  # m1+m2+m3 != 0
    assert wigner_3j(1, 1, 2, 2, -2, 0) == 0.0  # |m| > j


def test_3j_rejects_non_integers():
    with pytest.raises(ValueError, match="integers"):
        wigner_3j_squared(0.5, 0.5, 1, 0.5, -0.5, 0)


@pytest.mark.parametrize(
    ("k", "l1", "m1", "l2", "m2", "expected"),
    [
        # E. U. Condon and G. H. Shortley, The Theory of Atomic Spectra (1935), Table 1⁶
        # (pp. 178–179), c^k for p-p and s-p, written there as ±√(a/D_k) with D_2(pp) = 25
        # and D_1(sp) = 3; test_ck_matches_sympys_gaunt_coefficients checks each
        # independently:
        (0, 1, 1, 1, 1, 1.0),
        (2, 1, 1, 1, 1, -1 / 5),
        (2, 1, 0, 1, 0, 2 / 5),
        (2, 1, 1, 1, 0, math.sqrt(3) / 5),
        (2, 1, 1, 1, -1, -math.sqrt(6) / 5),
        (1, 0, 0, 1, 1, -1 / math.sqrt(3)),
        (1, 0, 0, 1, 0, 1 / math.sqrt(3)),
        # d-d (same table, D_2 = 49, D_4 = 441): c²(2 2; 2 2) = -2/7, c⁴(2 2; 2 2) = 1/21.
        (2, 2, 2, 2, 2, -2 / 7),
        (4, 2, 2, 2, 2, 1 / 21),
    ],
)
def test_ck_coefficients_match_condon_shortley(k, l1, m1, l2, m2, expected):
    assert abs(ck_coefficient(k, l1, m1, l2, m2)) == pytest.approx(abs(expected), rel=1e-14)
    # Signs depend on the phase convention; the squares (what the energy uses) do not.


def test_ck_matches_sympys_gaunt_coefficients():
    # Cross-implementation: c^k(l1 m1; l2 m2) = √(4π/(2k+1)) ∫ Y*_{l1 m1} Y_{k, m1-m2} Y_{l2 m2} dΩ,
    # and Y*_{l m} = (-1)^m Y_{l, -m}, so it is (-1)^m1 √(4π/(2k+1)) times sympy's exact
    # gaunt(l1, k, l2, -m1, m1 - m2, m2) (Condon–Shortley phase in both). Signs included.
    count = 0
    for l1, l2 in itertools.product(range(4), repeat=2):
        for k in range(l1 + l2 + 1):
            for m1, m2 in itertools.product(range(-l1, l1 + 1), range(-l2, l2 + 1)):
                if abs(m1 - m2) > k:
                    continue
                expected = (-1) ** m1 * math.sqrt(4 * math.pi / (2 * k + 1)) * float(
                    sympy_gaunt(l1, k, l2, -m1, m1 - m2, m2))
                assert ck_coefficient(k, l1, m1, l2, m2) == pytest.approx(expected, rel=1e-13, abs=1e-15)
                count += 1
    assert count > 800


def test_ck_sum_rule_over_m2():
    # 3j orthogonality (Cowan 1981, eq. 5.15): Σ_{m2} (l1 k l2; -m1 m1-m2 m2)² = 1/(2l1+1),
    # so Σ_{m2} c^k(l1 m1; l2 m2)² = (2l2+1)(l1 k l2; 0 0 0)², whatever m1.
    for l1, l2, k in [(1, 1, 2), (2, 1, 1), (2, 2, 4), (3, 2, 3)]:
        for m1 in range(-l1, l1 + 1):
            total = sum(ck_coefficient(k, l1, m1, l2, m2) ** 2 for m2 in range(-l2, l2 + 1))
            assert total == pytest.approx((2 * l2 + 1) * wigner_3j(l1, k, l2, 0, 0, 0) ** 2, rel=1e-13)

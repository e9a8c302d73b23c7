"""Energy expressions: Hund determinants and configuration averages against LS term energies."""

from fractions import Fraction

import pytest

from zeffir.core import parse_spec
from zeffir.core.config import Subshell
from zeffir.core.energy import average_energy_expression, hund_energy_expression

P2, D3 = Subshell(2, 1), Subshell(3, 2)
S1 = Subshell(1, 0)

# Standard textbook term energies (Condon & Shortley 1935, §7.7 Table 1⁷; Slater 1960,
# vol. II ch. 21), closed shells omitted, in the reduced integrals F_2 = F²/25 (p),
# F_2 = F²/49 and F_4 = F⁴/441 (d). Each entry: term -> (weight (2S+1)(2L+1), F0, F2, F4).
P2_TERMS = {"3P": (9, 1, -5, 0), "1D": (5, 1, 1, 0), "1S": (1, 1, 10, 0)}
P3_TERMS = {"4S": (4, 3, -15, 0), "2D": (10, 3, -6, 0), "2P": (6, 3, 0, 0)}
D2_TERMS = {"3F": (21, 1, -8, -9), "1D": (5, 1, -3, 36), "3P": (9, 1, 7, -84),
            "1G": (9, 1, 4, 1), "1S": (1, 1, 14, 126)}
P_SCALE = {2: 25}
D_SCALE = {2: 49, 4: 441}


def _open_shell_coefficients(expression, sub, scale):
    return {k: expression.coefficient("F", k, sub, sub) * factor for k, factor in scale.items()}


@pytest.mark.parametrize(
    ("spec", "sub", "terms", "ground", "scale"),
    [
        ("C", P2, P2_TERMS, "3P", P_SCALE),        # 2p² ³P
        ("N", P2, P3_TERMS, "4S", P_SCALE),        # 2p³ ⁴S
        ("Ti2+ [Ar] 3d2", D3, D2_TERMS, "3F", D_SCALE),  # 3d² ³F
    ],
)
def test_hund_determinant_energy_is_the_ground_term_energy(spec, sub, terms, ground, scale):
    expression = hund_energy_expression(parse_spec(spec))
    _, f0, *rest = terms[ground]
    got = _open_shell_coefficients(expression, sub, scale)
    assert expression.coefficient("F", 0, sub, sub) == pytest.approx(f0, abs=1e-13)
    for (k, value), expected in zip(got.items(), rest, strict=False):
        assert value == pytest.approx(expected, abs=1e-12), k


@pytest.mark.parametrize(
    ("spec", "sub", "terms", "scale"),
    [("C", P2, P2_TERMS, P_SCALE), ("N", P2, P3_TERMS, P_SCALE), ("Ti2+ [Ar] 3d2", D3, D2_TERMS, D_SCALE)],
)
def test_average_energy_is_the_weighted_mean_of_the_term_energies(spec, sub, terms, scale):
    total_weight = sum(w for w, *_ in terms.values())
    expected = [sum(Fraction(w * c[i]) for w, *c in terms.values()) / total_weight for i in range(3)]
    expression = average_energy_expression(parse_spec(spec))
    assert expression.coefficient("F", 0, sub, sub) == pytest.approx(float(expected[0]), abs=1e-13)
    got = list(_open_shell_coefficients(expression, sub, scale).values())
    for value, want in zip(got, expected[1:], strict=False):
        assert value == pytest.approx(float(want), abs=1e-12)


def test_s_p_configuration_average_and_triplet_exchange():
    # 1s 2p: ³P = F⁰ - G¹/3, ¹P = F⁰ + G¹/3 (Condon & Shortley 1935, §7.7; standard textbook
    # result), so E_av = (9·³P + 3·¹P)/12 = F⁰ - G¹/6.
    conf = parse_spec("He 1s1 2p1")
    hund = hund_energy_expression(conf)
    average = average_energy_expression(conf)
    assert hund.coefficient("F", 0, S1, P2) == pytest.approx(1.0, abs=1e-14)
    assert hund.coefficient("G", 1, S1, P2) == pytest.approx(-1 / 3, abs=1e-14)
    assert average.coefficient("G", 1, S1, P2) == pytest.approx((9 * -1 / 3 + 3 * 1 / 3) / 12, abs=1e-14)


@pytest.mark.parametrize("spec", ["Ne", "Mg", "Ar", "Zn", "He"])
def test_closed_shell_average_equals_its_single_determinant(spec):
    # A closed-shell configuration has one determinant, so E_av and E_Hund are one expression.
    conf = parse_spec(spec)
    hund, average = hund_energy_expression(conf), average_energy_expression(conf)
    keys = set(hund.slater) | set(average.slater)
    for key in keys:
        assert hund.slater.get(key, 0.0) == pytest.approx(average.slater.get(key, 0.0), abs=1e-12), key
    assert hund.one_electron == average.one_electron


def test_one_electron_coefficients_are_the_occupancies():
    conf = parse_spec("Fe")
    assert sum(hund_energy_expression(conf).one_electron.values()) == 26

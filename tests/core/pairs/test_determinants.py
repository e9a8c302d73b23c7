"""Spin-orbitals and determinants: Pauli and occupancy checks, Hund filling, the text syntax."""

from itertools import combinations

import pytest

from zeffir.core import SpecError, Subshell, ZeffirError, parse_spec
from zeffir.core.pairs import (
    DOWN,
    UP,
    Determinant,
    DeterminantError,
    SpinOrbital,
    format_determinant,
    hund_determinant,
    parse_determinant,
)

P2 = Subshell(2, 1)


def _all_determinants(configuration):
    """Every determinant of the configuration, by brute force over its open subshells."""
    closed = [SpinOrbital(sub, m, s) for sub, occ in configuration.occupations
              if occ == sub.capacity for m in range(-sub.l, sub.l + 1) for s in (UP, DOWN)]
    choices = [[closed]]
    for sub in configuration.open_subshells:
        pool = [SpinOrbital(sub, m, s) for m in range(-sub.l, sub.l + 1) for s in (UP, DOWN)]
        choices.append([list(c) for c in combinations(pool, configuration.occupancy(sub))])
    results = [[]]
    for options in choices:
        results = [done + option for done in results for option in options]
    return [Determinant(configuration, tuple(items)) for items in results]


@pytest.mark.parametrize("spec", ["C", "N", "O", "F", "Ti", "Fe", "Ni", "C 1s2 2s1 2p3", "Mg [Ne] 3p1 3d1"])
def test_hund_determinant_has_the_largest_ms_then_the_largest_ml(spec):
    # Hund's first two rules as stated in Condon & Shortley (1935), ch. 7: among all
    # determinants of the configuration (enumerated here independently), the Hund one
    # has the largest M_S and, among those, the largest M_L.
    configuration = parse_spec(spec)
    everything = _all_determinants(configuration)
    top_s = max(d.m_s for d in everything)
    top_l = max(d.m_l for d in everything if d.m_s == top_s)
    hund = hund_determinant(configuration)
    assert (hund.m_s, hund.m_l) == (top_s, top_l)
    # It is also the only determinant with those numbers, which is why it is a pure
    # component of the Hund term.
    assert sum(1 for d in everything if (d.m_s, d.m_l) == (top_s, top_l)) == 1


def test_hund_filling_of_known_cases():
    # Worked by hand: O 2p4 has 2p↑ m = 1, 0, -1 and 2p↓ m = 1 (³P, M_L = 1, M_S = 1);
    # Fe 3d6 is 3d↑ ×5 and 3d↓ m = 2 (⁵D: M_L = 2, M_S = 2).
    assert hund_determinant(parse_spec("O")).text == "2p: 1u 0u -1u 1d"
    fe = hund_determinant(parse_spec("Fe"))
    assert (fe.text, fe.m_l, fe.m_s) == ("3d: 2u 1u 0u -1u -2u 2d", 2, 2.0)
    # A closed-shell atom has no open subshell to write and M_L = M_S = 0.
    ne = hund_determinant(parse_spec("Ne"))
    assert (ne.text, ne.m_l, ne.m_s, len(ne)) == ("", 0, 0.0, 10)


def test_counts_per_spin():
    det = hund_determinant(parse_spec("N"))  # 1s2 2s2 2p3: five up, two down
    assert (det.count(UP), det.count(DOWN)) == (5, 2)


@pytest.mark.parametrize(
    ("spec", "text"),
    [
        ("N", "2p: 1u 0u -1d"),
        ("O", "2p: 1u 0u 1d 0d"),
        ("Fe", "3d: 2u 1u 0u -1u 2d -2d"),
        ("Mg [Ne] 3p1 3d1", "3p: -1d; 3d: 0u"),
        ("C 1s2 2s1 2p3", "2s: 0d; 2p: 1u 0u -1u"),
    ],
)
def test_parse_and_format_round_trip(spec, text):
    # Texts are written in the canonical order (spin up first, m descending), which is
    # the order format_determinant writes back.
    configuration = parse_spec(spec)
    det = parse_determinant(configuration, text)
    assert format_determinant(det) == text
    assert parse_determinant(configuration, format_determinant(det)) == det


def test_unmentioned_subshells_take_their_hund_filling():
    configuration = parse_spec("Mg [Ne] 3p1 3d1")
    det = parse_determinant(configuration, "3d: -2d")
    assert det.in_subshell(Subshell(3, 1)) == (SpinOrbital(Subshell(3, 1), 1, UP),)
    assert det.in_subshell(Subshell(3, 2)) == (SpinOrbital(Subshell(3, 2), -2, DOWN),)
    assert parse_determinant(configuration, "  ") == hund_determinant(configuration)


def test_tokens_accept_a_plus_sign_capitals_and_extra_spaces():
    configuration = parse_spec("N")
    assert parse_determinant(configuration, " 2p :  +1U 0u  -1D ; ") == parse_determinant(
        configuration, "2p: 1u 0u -1d"
    )


@pytest.mark.parametrize(
    ("spec", "text", "fragment"),
    [
        ("N", "2p 1u 0u -1u", "2p 1u 0u -1u: write a subshell, a colon"),
        ("N", "2x: 1u", "2x: not a subshell label"),
        ("N", "2d: 1u", "2d: l must be less than n"),
        ("N", "3d: 0u", "3d: not occupied in 1s2 2s2 2p3"),
        ("N", "2p: 1u 0u -1u; 2p: 1u 0u -1u", "2p: listed twice"),
        ("N", "2p: 1u 0x -1u", "0x: a spin-orbital is m followed by u (spin up, α) or d"),
        ("N", "2p: 1u 2u -1u", "2u: |m| must be at most l = 1 in 2p"),
        ("N", "2p: 1u 1u -1u", "1u: listed twice in 2p (Pauli principle"),
        ("N", "2p: 1u 0u", "2p: 2 spin-orbitals given, but 2p holds 3 electrons"),
        ("N", "2p: 1u 0u -1u 1d", "2p: 4 spin-orbitals given, but 2p holds 3 electrons"),
        ("Ne", "2p: 1u", "2p: 1 spin-orbital given, but 2p holds 6 electrons"),
    ],
)
def test_parse_errors_name_the_token_and_the_rule(spec, text, fragment):
    with pytest.raises(DeterminantError) as caught:
        parse_determinant(parse_spec(spec), text)
    assert fragment in str(caught.value)
    # The CLI and the window catch the core's error types: it must be one of them.
    assert isinstance(caught.value, SpecError) and isinstance(caught.value, ZeffirError)


def test_determinant_validation():
    configuration = parse_spec("He 1s1 2p1")
    s = SpinOrbital(Subshell(1, 0), 0, UP)
    with pytest.raises(DeterminantError, match="listed twice"):
        Determinant(configuration, (s, s))
    with pytest.raises(DeterminantError, match="3s: not occupied"):
        Determinant(configuration, (s, SpinOrbital(Subshell(3, 0), 0, UP)))
    with pytest.raises(DeterminantError, match="1s: 2 spin-orbitals, but the configuration puts 1 electron"):
        Determinant(configuration, (s, SpinOrbital(Subshell(1, 0), 0, DOWN)))
    with pytest.raises(DeterminantError, match="spin = 0"):
        SpinOrbital(P2, 0, 0)
    with pytest.raises(DeterminantError, match=r"\|m\| must be at most l = 1"):
        SpinOrbital(P2, -2, UP)


def test_order_of_spin_orbitals_does_not_matter():
    # A determinant's densities do not depend on the order of its columns (it only
    # fixes the overall sign), so two orders are the same determinant.
    configuration = parse_spec("He 1s1 2p1")
    a = SpinOrbital(Subshell(1, 0), 0, UP)
    b = SpinOrbital(P2, -1, DOWN)
    assert Determinant(configuration, (a, b)) == Determinant(configuration, (b, a))

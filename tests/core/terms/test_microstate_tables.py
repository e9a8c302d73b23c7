"""Microstate counting and term peeling: identities and a brute-force second implementation."""

import itertools
import math
from collections import Counter

import numpy as np
import pytest

from zeffir.core import parse_spec
from zeffir.core.config import L_LETTERS
from zeffir.core.terms import (
    MAX_TERMS,
    TermError,
    configuration_parity,
    configuration_terms,
    ground_level,
    microstate_count,
)
from zeffir.core.terms._microstates import subshell_table, term_table

POOL = ["1s", "2p", "3d", "4f", "5g", "3s", "4p", "5d", "6f"]


def config(*tokens: str):
    """A configuration of exactly these subshells, on the element with that many electrons."""
    electrons = sum(int(t[2:] or 1) for t in tokens)
    return parse_spec(f"{electrons} {' '.join(tokens)}")


def random_configurations(seed: int, count: int, max_microstates: int):
    rng = np.random.default_rng(seed)
    found = []
    while len(found) < count:
        chosen = rng.choice(POOL, size=rng.integers(1, 4), replace=False)
        tokens = []
        for label in chosen:
            l = L_LETTERS.index(label[1])
            tokens.append(f"{label}{rng.integers(1, 2 * (2 * l + 1) + 1)}")
        configuration = config(*tokens)
        if microstate_count(configuration) <= max_microstates:
            found.append(configuration)
    return found


def brute_force_terms(configuration):
    """Condon & Shortley's peeling done literally on enumerated microstates (small cases only)."""
    per_subshell = []
    for sub, occ in configuration.occupations:
        spin_orbitals = [(m, s) for m in range(-sub.l, sub.l + 1) for s in (1, -1)]
        per_subshell.append([
            (sum(m for m, _ in pick), sum(s for _, s in pick))
            for pick in itertools.combinations(spin_orbitals, occ)
        ])
    table = Counter(
        (sum(ml for ml, _ in combo), sum(s for _, s in combo))
        for combo in itertools.product(*per_subshell)
    )
    terms = Counter()
    while table:
        L = max(ml for ml, _ in table)
        two_s = max(s for ml, s in table if ml == L)
        terms[(two_s, L)] += 1
        for ml in range(-L, L + 1):
            for s in range(-two_s, two_s + 1, 2):
                table[(ml, s)] -= 1
                assert table[(ml, s)] >= 0
                if table[(ml, s)] == 0:
                    del table[(ml, s)]
    return terms


def as_counter(terms):
    return Counter((t.two_S, t.L) for t in terms)


@pytest.mark.parametrize(("tokens", "expected"), [
    (("3d3",), 120),  # C(10, 3)
    (("2p2",), 15),  # C(6, 2)
    (("4f7",), 3432),  # C(14, 7)
    (("4f7", "5d1"), 3432 * 10),
    (("5f3", "6d1"), 364 * 10),
    (("2s1", "2p1"), 2 * 6),
    (("1s2", "2s2", "2p6"), 1),
])
def test_microstate_count_is_the_product_of_binomials(tokens, expected):
    assert microstate_count(config(*tokens)) == expected


@pytest.mark.parametrize(("l", "k"), [(l, k) for l in range(4) for k in range(2 * (2 * l + 1) + 1)])
def test_subshell_table_sums_to_binomial_and_is_symmetric(l, k):
    table = subshell_table(l, k)
    assert table.sum() == math.comb(2 * (2 * l + 1), k)
    np.testing.assert_array_equal(table, table[::-1, ::-1])  # M_L -> -M_L, M_S -> -M_S
    assert table[0].any() and table[-1].any()  # trimmed to the largest M_L exactly


def test_states_of_all_terms_add_up_to_the_microstate_count_for_random_configurations():
    for configuration in random_configurations(seed=20240601, count=150, max_microstates=2_000_000):
        terms = configuration_terms(configuration)
        assert sum(t.states for t in terms) == microstate_count(configuration), configuration.spec


def test_peeling_matches_literal_enumeration_for_small_configurations():
    cases = [config("2p2"), config("3d3"), config("2s1", "2p1"), config("2p1", "3d1"),
             config("2p2", "3d1"), config("3s1", "3p1", "3d1"), config("4f2"),
             *random_configurations(seed=7, count=25, max_microstates=6000)]
    for configuration in cases:
        assert as_counter(configuration_terms(configuration)) == brute_force_terms(configuration), (
            configuration.spec)


@pytest.mark.parametrize("letter", "pdf")
def test_complementary_subshells_have_the_same_terms(letter):
    l = L_LETTERS.index(letter)
    n = l + 2
    capacity = 2 * (2 * l + 1)
    for k in range(capacity + 1):
        one = as_counter(configuration_terms(config(f"{n}{letter}{k}") if k else config("1s2")))
        other = (as_counter(configuration_terms(config(f"{n}{letter}{capacity - k}")))
                 if capacity - k else Counter({(0, 0): 1}))
        assert one == other, k


def test_closed_shells_give_the_single_term_1s():
    terms = configuration_terms(parse_spec("Ne"))
    assert [(t.S, t.L, t.J, t.label) for t in terms] == [(0.0, 0, (0.0,), "1S")]
    assert ground_level("Ne").label == "1S0"


def test_closed_subshells_contribute_nothing():
    bare = as_counter(configuration_terms(config("2p1", "3d1")))
    dressed = as_counter(configuration_terms(config("1s2", "2s2", "2p1", "3s2", "3p6", "3d1")))
    assert bare == dressed


def test_terms_are_sorted_by_spin_then_l_descending():
    keys = [(t.two_S, t.L) for t in configuration_terms(config("4f3"))]
    assert keys == sorted(keys, reverse=True)


@pytest.mark.parametrize(("tokens", "parity"), [
    (("2p2",), "even"), (("2p3",), "odd"), (("2s1", "2p1"), "odd"), (("2p1", "3d1"), "odd"),
    (("4f1", "5d1"), "odd"), (("4f2", "5d1"), "even"), (("2p1", "3p1"), "even"), (("1s1",), "even"),
])
def test_parity_is_minus_one_to_the_sum_of_l(tokens, parity):
    configuration = config(*tokens)
    assert configuration_parity(configuration) == parity
    assert {t.parity for t in configuration_terms(configuration)} == {parity}


def test_j_levels_run_from_l_minus_s_to_l_plus_s_and_hold_every_state():
    for configuration in random_configurations(seed=99, count=40, max_microstates=200_000):
        for term in set(configuration_terms(configuration)):
            two_j = [round(2 * j) for j in term.J]
            assert two_j == list(range(abs(2 * term.L - term.two_S), 2 * term.L + term.two_S + 1, 2))
            assert len(two_j) == min(term.two_S, 2 * term.L) + 1
            assert sum(j + 1 for j in two_j) == term.states  # Σ (2J + 1) = (2S + 1)(2L + 1)


def test_large_configurations_are_counted_without_enumerating_microstates():
    # 7i13 6h11: about 7e12 microstates, far too many to enumerate; the table is convolved.
    configuration = config("6h11", "7i13")
    shells = ((5, 11), (6, 13))
    counts = term_table(shells)
    states = sum(int(counts[L, s]) * (s + 1) * (2 * L + 1)
                 for L in range(counts.shape[0]) for s in range(counts.shape[1]))
    assert states == microstate_count(configuration) == math.comb(22, 11) * math.comb(26, 13)
    assert int(counts.sum()) > MAX_TERMS
    with pytest.raises(TermError, match=r"terms, too many to list"):
        configuration_terms(configuration)
    # Two half-filled subshells: S = 11/2 + 13/2 = 12, L = 0, J = S.
    assert ground_level(configuration).label == "25S12"


def test_absurdly_many_microstates_are_refused_with_a_reason():
    configuration = parse_spec("Og [Kr] 4d10 5s2 5p4 4f7 5g9 6h11 7i13 8i13 9i13")
    assert microstate_count(configuration) > 2**63
    with pytest.raises(TermError, match=r"microstates: too many"):
        configuration_terms(configuration)

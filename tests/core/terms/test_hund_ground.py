"""The Hund ground level: its closed form against the term list, and the J rule."""

import numpy as np
import pytest

from zeffir.core import parse_spec
from zeffir.core.config import L_LETTERS
from zeffir.core.terms import (
    configuration_terms,
    ground_level,
    ground_notes,
    microstate_count,
    observed_level,
)


def config(*tokens: str):
    electrons = sum(int(t[2:] or 1) for t in tokens)
    return parse_spec(f"{electrons} {' '.join(tokens)}")


# The 2p^k and 3d^k ions whose observed ground levels (NIST ASD, in the shipped table
# resources/data/ion_ground_states.csv) are the free-ion levels of those subshells: the
# closed 1s, 2s (and [Ar]) shells below them change nothing.
P_SUBSHELL_IONS = {1: "C+", 2: "N+", 3: "O+", 4: "F+", 5: "Ne+", 6: "Na+"}
D_SUBSHELL_IONS = {1: "Ti3+", 2: "V3+", 3: "Cr3+", 4: "Mn3+", 5: "Fe3+", 6: "Fe2+", 7: "Co2+",
                   8: "Ni2+", 9: "Cu2+"}


@pytest.mark.parametrize(("k", "label"), [
    # Hund's rules for p^k (F. Hund, Linienspektren und periodisches System der Elemente,
    # Springer, 1927), checked against NIST's ground levels of C II ... Na II.
    (1, "2P1/2"), (2, "3P0"), (3, "4S3/2"), (4, "3P2"), (5, "2P3/2"), (6, "1S0"),
])
def test_p_subshell_follows_hunds_three_rules(k, label):
    level = ground_level(config(f"2p{k}"))
    assert level.label == label
    ion = P_SUBSHELL_IONS[k]
    assert parse_spec(ion).short_text == ("[Ne]" if k == 6 else f"[He] 2s2 2p{k}")
    assert level.display == observed_level(ion).text


@pytest.mark.parametrize(("k", "label"), [
    # d^k ground levels from Hund's rules (Hund 1927), checked against NIST's ground levels
    # of the 3d^k ions Ti IV ... Cu III.
    (1, "2D3/2"), (2, "3F2"), (3, "4F3/2"), (4, "5D0"), (5, "6S5/2"),
    (6, "5D4"), (7, "4F9/2"), (8, "3F4"), (9, "2D5/2"),
])
def test_d_subshell_follows_hunds_three_rules(k, label):
    assert ground_level(config(f"3d{k}")).label == label
    ion = D_SUBSHELL_IONS[k]
    assert parse_spec(ion).short_text == f"[Ar] 3d{k}"
    assert label == observed_level(ion).text


def test_hund_term_is_the_first_listed_term_for_random_configurations():
    # ground_level adds the subshells' own Hund terms; the term list is peeled from the
    # convolved microstate table. Largest S, then largest L, must agree.
    rng = np.random.default_rng(314)
    pool = ["2p", "3d", "4f", "4s", "5p", "5d", "5g"]
    checked = 0
    while checked < 80:
        tokens = []
        for label in rng.choice(pool, size=rng.integers(1, 4), replace=False):
            capacity = 2 * (2 * L_LETTERS.index(label[1]) + 1)
            tokens.append(f"{label}{rng.integers(1, capacity + 1)}")
        configuration = config(*tokens)
        if microstate_count(configuration) > 3_000_000:
            continue
        first = configuration_terms(configuration)[0]
        level = ground_level(configuration)
        assert (level.S, level.L, level.parity) == (first.S, first.L, first.parity), tokens
        checked += 1


def test_j_rule_uses_the_combined_filling_of_all_open_subshells():
    # 3d4 4s1: 5 of 12 electrons, at most half -> J = |L - S|: 6D1/2.
    assert ground_level(config("3d4", "4s1")).label == "6D1/2"
    # 3d7 4s1: 8 of 12, more than half -> J = L + S: 5F5.
    assert ground_level(config("3d7", "4s1")).label == "5F5"
    # 3d5 4s1: exactly half -> J = |L - S| (L = 0 anyway): 7S3.
    assert ground_level(config("3d5", "4s1")).label == "7S3"


def test_several_open_subshells_bring_a_rule_of_thumb_note():
    assert ground_notes(config("2p2")) == ()
    (note,) = ground_notes(config("3d7", "4s1"))
    assert "rule of thumb" in note

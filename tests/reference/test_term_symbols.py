"""Term symbols and ground levels against published tables.

Sources:
- Terms of equivalent and non-equivalent electrons: the tables of allowed LS terms in
  E. U. Condon and G. H. Shortley, The Theory of Atomic Spectra (Cambridge, 1935), and
  R. D. Cowan, The Theory of Atomic Structure and Spectra (University of California Press,
  1981); numbers of terms of d^k and f^k: C. W. Nielson and G. F. Koster, Spectroscopic
  Coefficients for the p^n, d^n and f^n Configurations (MIT Press, 1963). These lists follow
  from a theorem, so each is also checked here against an independent count: every
  microstate of the configuration enumerated, the terms read off the (M_L, M_S) table
  (Condon & Shortley's method), with no use of Zeffir's term code.
- Ground levels of the neutral atoms: NIST Atomic Spectra Database, "Ground States and
  Ionization Energies" (A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team), in the copy
  tests/reference/data/nist_neutral_ground_levels.csv, whose header names the digitisation.

All comparisons are exact: term symbols are integers and half-integers.
"""

import itertools
import math
from collections import Counter

import pytest
from reference_data import rows

from zeffir.cli import main
from zeffir.core import parse_spec
from zeffir.core.config import L_LETTERS
from zeffir.core.terms import (
    Level,
    configuration_parity,
    configuration_terms,
    ground_level,
    ground_notes,
    known_hund_miss,
)

LETTERS = "SPDFGHIKLMNOQRTUV"


def config(*tokens: str):
    electrons = sum(int(t[2:] or 1) for t in tokens)
    return parse_spec(f"{electrons} {' '.join(tokens)}")


def labels(configuration):
    return Counter(t.label for t in configuration_terms(configuration))


def table(*items: str) -> Counter:
    """'2Dx2' means the term occurs twice."""
    found = Counter()
    for item in items:
        label, _, times = item.partition("x")
        found[label] += int(times or 1)
    return found


def states(label_counts: Counter) -> int:
    return sum(times * int(label[:-1]) * (2 * LETTERS.index(label[-1]) + 1)
               for label, times in label_counts.items())


def counted_terms(*tokens: str) -> Counter:
    """LS terms of a configuration by brute force, independent of zeffir.core.terms.

    Every Pauli-allowed microstate (a set of distinct (m_l, m_s) per subshell) is listed and
    counted by (M_L, 2 M_S); the number of terms with L and S is then
    N(L, S) - N(L+1, S) - N(L, S+1) + N(L+1, S+1).
    """
    per_subshell = []
    for token in tokens:
        l, k = L_LETTERS.index(token[1]), int(token[2:] or 1)
        spin_orbitals = [(m, s) for m in range(-l, l + 1) for s in (-1, 1)]
        per_subshell.append([(sum(m for m, _ in c), sum(s for _, s in c))
                             for c in itertools.combinations(spin_orbitals, k)])
    n = Counter()
    for parts in itertools.product(*per_subshell):
        n[(sum(p[0] for p in parts), sum(p[1] for p in parts))] += 1
    terms = Counter()
    for (ml, ms2) in list(n):
        if ml >= 0 and ms2 >= 0:
            count = n[(ml, ms2)] - n[(ml + 1, ms2)] - n[(ml, ms2 + 2)] + n[(ml + 1, ms2 + 2)]
            if count:
                terms[f"{ms2 + 1}{LETTERS[ml]}"] += count
    return terms


STANDARD_TERMS = {
    # Equivalent electrons (Condon & Shortley 1935; Cowan 1981).
    ("2p1",): table("2P"),
    ("2p2",): table("3P", "1D", "1S"),
    ("2p3",): table("4S", "2D", "2P"),
    ("3d1",): table("2D"),
    ("3d2",): table("3F", "3P", "1G", "1D", "1S"),
    ("3d3",): table("4F", "4P", "2H", "2G", "2F", "2Dx2", "2P"),
    ("3d4",): table("5D", "3H", "3G", "3Fx2", "3D", "3Px2", "1I", "1Gx2", "1F", "1Dx2", "1Sx2"),
    ("3d5",): table("6S", "4G", "4F", "4D", "4P", "2I", "2H", "2Gx2", "2Fx2", "2Dx3", "2P", "2S"),
    ("4f2",): table("3H", "3F", "3P", "1I", "1G", "1D", "1S"),
    ("4f3",): table("4I", "4G", "4F", "4D", "4S", "2L", "2K", "2I", "2Hx2", "2Gx2", "2Fx2",
                    "2Dx2", "2P"),
    # Non-equivalent electrons: L from |l1 - l2| to l1 + l2, S = 0 and 1 (the vector model;
    # Condon & Shortley 1935, Cowan 1981).
    ("2s1", "2p1"): table("3P", "1P"),
    ("2p1", "3p1"): table("3D", "3P", "3S", "1D", "1P", "1S"),
    ("2p1", "3d1"): table("3F", "3D", "3P", "1F", "1D", "1P"),
    ("4f1", "5d1"): table("3H", "3G", "3F", "3D", "3P", "1H", "1G", "1F", "1D", "1P"),
}


@pytest.mark.parametrize(("tokens", "expected"), STANDARD_TERMS.items(), ids=" ".join)
def test_terms_match_the_standard_tables(tokens, expected):
    configuration = config(*tokens)
    assert labels(configuration) == expected
    # The table itself: the independent microstate count gives it term by term, and it
    # accounts for every microstate (guards against a mistyped table).
    assert counted_terms(*tokens) == expected
    assert states(expected) == math.prod(
        math.comb(2 * (2 * sub.l + 1), occ) for sub, occ in configuration.occupations
    )


@pytest.mark.parametrize(("tokens", "twin"), [
    # A subshell with k holes has the terms of the one with k electrons (Condon & Shortley
    # 1935; Cowan 1981); the microstate count shows it independently.
    (("2p4",), ("2p2",)), (("2p5",), ("2p1",)), (("3d8",), ("3d2",)), (("3d7",), ("3d3",)),
    (("3d6",), ("3d4",)), (("4f12",), ("4f2",)), (("4f11",), ("4f3",)),
])
def test_complementary_subshells_match_the_standard_tables(tokens, twin):
    assert labels(config(*tokens)) == STANDARD_TERMS[twin]
    assert counted_terms(*tokens) == STANDARD_TERMS[twin]


@pytest.mark.parametrize(("k", "count"), [
    # Numbers of LS terms, repeated terms counted each time (Nielson & Koster 1963), each
    # also counted here from the microstates.
    ("3d1", 1), ("3d2", 5), ("3d3", 8), ("3d4", 16), ("3d5", 16),
    ("4f1", 1), ("4f2", 7), ("4f3", 17), ("4f4", 47), ("4f5", 73), ("4f6", 119), ("4f7", 119),
])
def test_number_of_terms_of_d_and_f_subshells(k, count):
    assert len(configuration_terms(config(k))) == count
    assert sum(counted_terms(k).values()) == count


def test_d5_ground_term_is_6s():
    # Hund's first rule: five parallel spins. NIST lists the 3d5 ions Mn III (Mn2+) and
    # Fe IV (Fe3+) with the ground level 6S5/2 (tests/reference/data/nist_ion_ground_levels.csv).
    nist = {row["spec"]: row["level"] for row in rows("nist_ion_ground_levels.csv")}
    assert nist["Mn2+"] == nist["Fe3+"] == "6S5/2"
    assert configuration_terms(config("3d5"))[0].label == "6S"
    assert ground_level(config("3d5")).label == "6S5/2"


# Ground levels of the neutral atoms, Z = 1..103 (NIST ASD). The element's ground
# configuration is the one shipped in resources/data/elements.csv (itself checked against
# the same table in test_ground_configurations.py).
NIST_NEUTRAL = rows("nist_neutral_ground_levels.csv")
CERIUM = next(row for row in NIST_NEUTRAL if row["symbol"] == "Ce")
LS_NAMED = [row for row in NIST_NEUTRAL if not row["level"].startswith("(") and row is not CERIUM]
JJ_NAMED = [row for row in NIST_NEUTRAL if row["level"].startswith("(")]


def test_every_neutral_atom_is_compared():
    assert len(LS_NAMED) + len(JJ_NAMED) + 1 == len(NIST_NEUTRAL) == 103
    assert [row["symbol"] for row in JJ_NAMED] == ["Pb"]


@pytest.mark.parametrize("row", LS_NAMED, ids=lambda row: row["symbol"])
def test_hund_ground_level_matches_nist(row):
    level = ground_level(row["symbol"])
    assert (level.display, level.parity) == (row["level"], row["parity"])
    assert known_hund_miss(row["symbol"]) is None


@pytest.mark.parametrize("row", JJ_NAMED, ids=lambda row: row["symbol"])
def test_levels_nist_names_in_jj_coupling_are_compared_by_j_and_parity(row):
    # Pb I: NIST (1/2,1/2)0, the 6p1/2^2 level; Hund's rules name it 3P0 in LS coupling.
    level = ground_level(row["symbol"])
    assert level.label == "3P0"
    assert (level.J, level.parity) == (float(row["J"]), row["parity"])
    assert known_hund_miss(row["symbol"]) is None


# Ce I, [Xe] 4f 5d 6s2: NIST ground level 1G°4 (the row above). Hund's rules applied to the
# two open subshells give 3H°4 (largest S = 1, largest L = 3 + 2 = 5, fewer than half filled
# so J = L - S = 4): they miss.
CERIUM_OBSERVED = Level(S=0, L=4, J=4, parity="odd")


def test_cerium_is_a_case_where_hunds_rules_miss_and_zeffir_says_so(capsys):
    assert (CERIUM_OBSERVED.display, CERIUM_OBSERVED.parity) == (CERIUM["level"], CERIUM["parity"])
    hund = ground_level("Ce")
    assert hund.label == "3H4" and hund.parity == "odd"
    assert hund != CERIUM_OBSERVED
    assert known_hund_miss("Ce") == CERIUM_OBSERVED
    assert any("miss" in note and "1G°4" in note for note in ground_notes("Ce"))
    # The observed level is one of the configuration's levels, so the miss is in the rules,
    # not in the term list.
    assert CERIUM_OBSERVED in {lvl for t in configuration_terms("Ce") for lvl in t.levels()}
    assert configuration_parity("Ce") == "odd"
    assert main(["terms", "Ce"]) == 0
    out = capsys.readouterr().out
    assert "3H°4" in out and "note: Hund's rules miss here" in out and "1G°4" in out


def test_the_miss_is_tied_to_cerium_in_that_configuration():
    # An excited cerium configuration or another element with 4f 5d 6s2 carries no such note.
    assert known_hund_miss("Ce [Xe] 4f2 6s2") is None
    assert known_hund_miss("Gd") is None

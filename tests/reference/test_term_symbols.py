"""Term symbols and ground levels against published tables.

Sources:
- Terms of equivalent and non-equivalent electrons: the standard tables of atomic-structure
  texts (E. U. Condon and G. H. Shortley, The Theory of Atomic Spectra, 1935; R. D. Cowan,
  The Theory of Atomic Structure and Spectra, 1981). Written down from memory, not copied
  from a file; each is also an exact count, so Σ (2S+1)(2L+1) is checked against C(n, k).
- Numbers of terms of f^k: C. W. Nielson and G. F. Koster, Spectroscopic Coefficients for
  the p^n, d^n and f^n Configurations (MIT Press, 1963); from memory.
- Ground levels: A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
  Database, "Ground Levels and Ionization Energies for the Neutral Atoms"; from memory.

All comparisons are exact: term symbols are integers and half-integers.
"""

import math
from collections import Counter

import pytest

from zeffir.cli import main
from zeffir.core import parse_spec
from zeffir.core.terms import (
    Level,
    configuration_parity,
    configuration_terms,
    ground_level,
    ground_notes,
    known_hund_miss,
)


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
    letters = "SPDFGHIKLMNOQRTUV"
    return sum(times * int(label[:-1]) * (2 * letters.index(label[-1]) + 1)
               for label, times in label_counts.items())


STANDARD_TERMS = {
    # Equivalent electrons (from memory; Condon & Shortley 1935, Cowan 1981).
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
    # Non-equivalent electrons: L from |l1 - l2| to l1 + l2, S = 0 and 1 (from memory).
    ("2s1", "2p1"): table("3P", "1P"),
    ("2p1", "3p1"): table("3D", "3P", "3S", "1D", "1P", "1S"),
    ("2p1", "3d1"): table("3F", "3D", "3P", "1F", "1D", "1P"),
    ("4f1", "5d1"): table("3H", "3G", "3F", "3D", "3P", "1H", "1G", "1F", "1D", "1P"),
}


@pytest.mark.parametrize(("tokens", "expected"), STANDARD_TERMS.items(), ids=" ".join)
def test_terms_match_the_standard_tables(tokens, expected):
    configuration = config(*tokens)
    assert labels(configuration) == expected
    # The table itself accounts for every microstate (guards against a mistyped table).
    assert states(expected) == math.prod(
        math.comb(2 * (2 * sub.l + 1), occ) for sub, occ in configuration.occupations
    )


@pytest.mark.parametrize(("tokens", "twin"), [
    # Complementary subshells share their terms (from memory; Condon & Shortley 1935).
    (("2p4",), ("2p2",)), (("2p5",), ("2p1",)), (("3d8",), ("3d2",)), (("3d7",), ("3d3",)),
    (("3d6",), ("3d4",)), (("4f12",), ("4f2",)), (("4f11",), ("4f3",)),
])
def test_complementary_subshells_match_the_standard_tables(tokens, twin):
    assert labels(config(*tokens)) == STANDARD_TERMS[twin]


@pytest.mark.parametrize(("k", "count"), [
    # Numbers of terms of d^k and f^k (from memory; Nielson & Koster 1963).
    ("3d1", 1), ("3d2", 5), ("3d3", 8), ("3d4", 16), ("3d5", 16),
    ("4f1", 1), ("4f2", 7), ("4f3", 17), ("4f4", 47), ("4f5", 73), ("4f6", 119), ("4f7", 119),
])
def test_number_of_terms_of_d_and_f_subshells(k, count):
    assert len(configuration_terms(config(k))) == count


def test_d5_ground_term_is_6s():
    # Hund's first rule: five parallel spins (from memory; e.g. Mn, Fe3+ 6S5/2 in NIST ASD).
    assert configuration_terms(config("3d5"))[0].label == "6S"
    assert ground_level(config("3d5")).label == "6S5/2"


# Ground levels of neutral atoms, NIST ASD (from memory): label and parity. The element's
# ground configuration is the one shipped in resources/data/elements.csv (itself checked in
# test_ground_configurations.py).
NIST_GROUND_LEVELS = {
    "H": ("2S1/2", "even"), "He": ("1S0", "even"), "Li": ("2S1/2", "even"),
    "B": ("2P1/2", "odd"), "C": ("3P0", "even"), "N": ("4S3/2", "odd"), "O": ("3P2", "even"),
    "F": ("2P3/2", "odd"), "Ne": ("1S0", "even"), "Al": ("2P1/2", "odd"), "Si": ("3P0", "even"),
    "P": ("4S3/2", "odd"), "S": ("3P2", "even"), "Cl": ("2P3/2", "odd"),
    "Sc": ("2D3/2", "even"), "Ti": ("3F2", "even"), "V": ("4F3/2", "even"), "Cr": ("7S3", "even"),
    "Mn": ("6S5/2", "even"), "Fe": ("5D4", "even"), "Co": ("4F9/2", "even"), "Ni": ("3F4", "even"),
    "Cu": ("2S1/2", "even"), "Zn": ("1S0", "even"), "Ga": ("2P1/2", "odd"), "Ge": ("3P0", "even"),
    "As": ("4S3/2", "odd"), "Se": ("3P2", "even"), "Br": ("2P3/2", "odd"),
    "Y": ("2D3/2", "even"), "Zr": ("3F2", "even"), "Nb": ("6D1/2", "even"), "Mo": ("7S3", "even"),
    "Tc": ("6S5/2", "even"), "Ru": ("5F5", "even"), "Rh": ("4F9/2", "even"), "Pd": ("1S0", "even"),
    "Ag": ("2S1/2", "even"), "Sn": ("3P0", "even"), "I": ("2P3/2", "odd"),
    "La": ("2D3/2", "even"), "Pr": ("4I9/2", "odd"), "Nd": ("5I4", "even"), "Pm": ("6H5/2", "odd"),
    "Sm": ("7F0", "even"), "Eu": ("8S7/2", "odd"), "Gd": ("9D2", "odd"), "Tb": ("6H15/2", "odd"),
    "Dy": ("5I8", "even"), "Ho": ("4I15/2", "odd"), "Er": ("3H6", "even"), "Tm": ("2F7/2", "odd"),
    "Yb": ("1S0", "even"), "Lu": ("2D3/2", "even"),
    "Hf": ("3F2", "even"), "Ta": ("4F3/2", "even"), "W": ("5D0", "even"), "Re": ("6S5/2", "even"),
    "Os": ("5D4", "even"), "Ir": ("4F9/2", "even"), "Pt": ("3D3", "even"), "Au": ("2S1/2", "even"),
    "Hg": ("1S0", "even"), "Tl": ("2P1/2", "odd"), "Pb": ("3P0", "even"), "Bi": ("4S3/2", "odd"),
    "Ac": ("2D3/2", "even"), "Th": ("3F2", "even"),
    "Pa": ("4K11/2", "even"),  # 5f2 6d 7s2: Σl = 8, even
    "U": ("5L6", "odd"),
    "Np": ("6L11/2", "even"),  # 5f4 6d 7s2: Σl = 14, even
    "Pu": ("7F0", "even"), "Am": ("8S7/2", "odd"), "Cm": ("9D2", "odd"), "Bk": ("6H15/2", "odd"),
    "Cf": ("5I8", "even"), "Lr": ("2P1/2", "odd"),
}


@pytest.mark.parametrize(("symbol", "nist"), sorted(NIST_GROUND_LEVELS.items()))
def test_hund_ground_level_matches_nist(symbol, nist):
    label, parity = nist
    level = ground_level(symbol)
    assert (level.label, level.parity) == (label, parity)
    assert known_hund_miss(symbol) is None


# Ce I, [Xe] 4f 5d 6s2: NIST ASD ground level 1G°4 (from memory). Hund's rules applied to
# the two open subshells give 3H°4 (largest S = 1, largest L = 3 + 2 = 5, fewer than half
# filled so J = L - S = 4): they miss.
CERIUM_OBSERVED = Level(S=0, L=4, J=4, parity="odd")


def test_cerium_is_a_case_where_hunds_rules_miss_and_zeffir_says_so(capsys):
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

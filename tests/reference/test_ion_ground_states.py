"""Ground configurations and levels of ions against the NIST Atomic Spectra Database.

Source of every expected value below: A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD
Team, NIST Atomic Spectra Database, "Ground States and Ionization Energies" (ground
shells and ground level of each spectrum). The 55 ions checked spectrum by spectrum are in
tests/reference/data/nist_ion_ground_levels.csv: typed independently of the shipped table
(resources/data/ion_ground_states.csv), then checked row by row against the digitised copy
of the listing in the mendeleev package (version 1.3.0, table 'ionizationenergies'), from
which the shipped table is generated.
"""

from __future__ import annotations

import json

import pytest
from reference_data import rows

from zeffir.cli import main, table_json, terms_json
from zeffir.core import parse_spec
from zeffir.core.config import (
    NOBLE_GAS_CORES,
    derived_ion_ground,
    element,
    format_with_core,
    observed_ion,
    observed_ions,
    removal_order,
)
from zeffir.core.terms import ground_level, ground_notes, known_hund_miss, observed_level

# spec: (NIST ground configuration, NIST ground level).
NIST_IONS = {row["spec"]: (row["configuration"], row["level"])
             for row in rows("nist_ion_ground_levels.csv")}

# Beyond the shipped charges: NIST lists U VII (U6+) as [Hg] 6p6 1S0, i.e. [Rn], and Fe VIII
# (Fe7+) as [Ar] 3d 2D3/2 (both checked against mendeleev 1.3.0's copy of the listing).
DERIVED_BEYOND_TABLE = {"U6+": "[Rn]", "Fe7+": "[Ar] 3d1"}

# Every shipped ion whose observed ground configuration the removal rule does not give
# (found by Zeffir's rule against the shipped NIST table, not a published list).
RULE_MISSES = {
    ("V", 1), ("Co", 1), ("Ni", 1), ("Y", 1), ("La", 1), ("Ce", 1), ("Ce", 2), ("Lu", 1),
    ("Lu", 2), ("Hf", 1), ("Ac", 1), ("Ac", 2), ("Th", 1), ("Th", 2), ("Th", 3), ("Pa", 1),
    ("U", 1), ("U", 2), ("Np", 2), ("Cm", 1), ("Cm", 2),
}


def test_at_least_forty_ions_across_the_d_and_f_blocks_are_checked():
    blocks = {parse_spec(spec).short_text.split()[-1][-2] for spec in NIST_IONS
              if len(parse_spec(spec).short_text.split()) > 1}
    assert len(NIST_IONS) >= 40 and {"d", "f"} <= blocks


def test_each_row_of_the_ion_table_names_its_spectrum():
    # NIST numbers a spectrum from I for the neutral atom: X IV is X3+.
    numerals = {"I": 1, "II": 2, "III": 3, "IV": 4, "V": 5}
    for row in rows("nist_ion_ground_levels.csv"):
        symbol, numeral = row["spectrum"].split()
        conf = parse_spec(row["spec"])
        assert (element(conf.Z).symbol, conf.charge + 1) == (symbol, numerals[numeral]), row


@pytest.mark.parametrize(("spec", "expected"), sorted(NIST_IONS.items()))
def test_ion_ground_configuration_matches_nist(spec, expected):
    configuration, _ = expected
    conf = parse_spec(spec)
    assert conf.short_text == configuration
    assert conf.origin == "observed"
    assert conf.text == parse_spec(f"{spec} {configuration}").text


@pytest.mark.parametrize(("spec", "expected"), sorted(NIST_IONS.items()))
def test_ion_ground_level_matches_nist(spec, expected):
    _, level = expected
    assert observed_level(spec).text == level
    assert terms_json(spec)["observed_ground_level"]["designation"] == level


@pytest.mark.parametrize("spec", ["Eu3+", "Gd3+", "Nd3+", "Fe2+", "Co2+", "U4+", "Yb3+", "Ce3+"])
def test_hund_ground_level_of_the_observed_configuration_is_the_observed_level(spec):
    assert ground_level(spec).display == NIST_IONS[spec][1]
    assert known_hund_miss(spec) is None
    data = terms_json(spec)
    assert data["ground"]["label"] == data["observed_ground"]["label"]


def test_hund_misses_among_the_ions_are_said():
    # Ce II: NIST 4f(2F°)5d2(3F) 4H°7/2; Hund's rules give 4I°9/2. Pa III: NIST 4I11/2, Hund
    # 4K11/2 (NIST levels checked against mendeleev 1.3.0's copy of the listing).
    assert known_hund_miss("Ce+").display == "4H°7/2"
    assert ground_level("Ce+").display == "4I°9/2"
    assert any("miss" in note and "4H°7/2" in note for note in ground_notes("Ce+"))
    assert known_hund_miss("Pa2+").display == "4I11/2"
    misses = {(element(ion.Z).symbol, ion.charge) for ion in observed_ions()
              if known_hund_miss(f"{element(ion.Z).symbol}{ion.charge}+") is not None}
    assert misses == {("Ce", 1), ("Pa", 2)}


def test_levels_nist_names_in_another_coupling_are_compared_by_j():
    # Pr II: NIST 4f3(4I°9/2)6s (9/2,1/2)°4 in J1 j coupling; Hund's rules 5I°4 (the same J
    # and parity).
    observed = observed_level("Pr+")
    assert observed.text == "(9/2,1/2)°4" and observed.level is None
    assert observed.J == ground_level("Pr+").J and observed.parity == "odd"
    assert any("another coupling" in note for note in ground_notes("Pr+"))


@pytest.mark.parametrize(("spec", "expected"), sorted(DERIVED_BEYOND_TABLE.items()))
def test_ions_beyond_the_table_are_derived_by_the_rule(spec, expected):
    conf = parse_spec(spec)
    assert conf.origin == "derived" and conf.short_text == expected
    assert "derived" in conf.origin_note


def test_the_rule_gives_every_observed_configuration_but_the_listed_exceptions():
    misses = set()
    for ion in observed_ions():
        atom = element(ion.Z)
        if derived_ion_ground(atom, ion.charge) != ion.occupations:
            misses.add((atom.symbol, ion.charge))
    assert misses == RULE_MISSES
    assert len(observed_ions()) > 400  # spectra II-V, Z <= 103


def test_the_rule_no_longer_opens_the_5p_shell_of_lanthanide_ions():
    # The former highest-n-first rule gave Eu3+ ... 4f7 5s2 5p5 and U4+ ... 5f3 6s2 6p5.
    assert format_with_core(derived_ion_ground(element("Eu"), 3)) == "[Xe] 4f6"
    assert format_with_core(derived_ion_ground(element("U"), 4)) == "[Rn] 5f2"
    assert format_with_core(derived_ion_ground(element("Tb"), 3)) == "[Xe] 4f8"


def _smaller_cores(z: int) -> list[set]:
    return [{sub for sub, _ in element(name).ground}
            for name, zc in NOBLE_GAS_CORES.items() if zc < z]


@pytest.mark.parametrize("z", range(3, 119))
def test_no_derived_cation_opens_a_closed_core_while_a_higher_subshell_holds_electrons(z):
    atom = element(z)
    occupation = dict(atom.ground)
    cores = [core for core in _smaller_cores(z)
             if all(occupation.get(sub) == 2 * (2 * sub.l + 1) for sub in core)]
    for step, subshell in enumerate(removal_order(atom.ground), start=1):
        for core in cores:
            if subshell in core:
                outside = [sub for sub, occ in occupation.items() if sub not in core and occ > 0]
                assert not outside, (f"{atom.symbol}{step}+ takes from {subshell.label} inside a "
                                     f"closed core while {[s.label for s in outside]} hold electrons")
        occupation[subshell] -= 1
        if occupation[subshell] == 0:
            del occupation[subshell]
    assert not occupation


def test_table_prints_the_observed_configuration_and_says_so(capsys):
    for spec in NIST_IONS:
        data = table_json(spec, "slater")
        assert data["configuration"] == parse_spec(spec).text
        assert data["configuration_origin"] == "observed"
        assert data["notes"][-1].startswith(f"observed ground configuration of {spec}")
    assert main(["table", "Eu3+"]) == 0
    out = capsys.readouterr().out
    assert "configuration: [Xe] 4f6 (observed)" in out
    assert "note: observed ground configuration of Eu3+ (NIST" in out


def test_table_names_the_rule_where_an_observed_configuration_differs_from_it(capsys):
    assert main(["table", "V+", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert "the removal rule would give [Ar] 3d3 4s1" in data["notes"][-1]


def test_typed_configurations_are_never_replaced():
    conf = parse_spec("Eu3+ [Xe] 4f5 5d1")
    assert conf.origin == "typed" and conf.short_text == "[Xe] 4f5 5d1"
    assert observed_level(conf) is None


def test_observed_table_rows_match_their_elements():
    for ion in observed_ions():
        assert sum(occ for _, occ in ion.occupations) == ion.Z - ion.charge
        odd = sum(sub.l * occ for sub, occ in ion.occupations) % 2 == 1
        assert ion.parity == ("odd" if odd else "even")
        assert ("°" in ion.level) == odd
    assert observed_ion(63, 3).level == "7F0" and observed_ion(63, 5) is None

"""Ground configurations and levels of ions against the NIST Atomic Spectra Database.

Source of every expected value below: A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD
Team, NIST Atomic Spectra Database, "Ground States and Ionization Energies" (ground
shells and ground level of each spectrum; the spectrum is named beside each row: Eu IV
is Eu3+). The values were checked against the digitised copy of that listing in the
mendeleev package (version 1.3.0, table 'ionizationenergies'), from which the shipped
table is generated; they are typed here independently of the shipped file.
"""

from __future__ import annotations

import json

import pytest

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

# spec: (NIST ground configuration, NIST ground level), spectrum in the comment.
NIST_IONS = {
    # 3d block
    "Sc+": ("[Ar] 3d1 4s1", "3D1"),  # Sc II
    "Ti2+": ("[Ar] 3d2", "3F2"),  # Ti III
    "V+": ("[Ar] 3d4", "5D0"),  # V II (the removal rule gives 3d3 4s1)
    "V3+": ("[Ar] 3d2", "3F2"),  # V IV
    "Cr3+": ("[Ar] 3d3", "4F3/2"),  # Cr IV
    "Mn2+": ("[Ar] 3d5", "6S5/2"),  # Mn III
    "Fe+": ("[Ar] 3d6 4s1", "6D9/2"),  # Fe II
    "Fe2+": ("[Ar] 3d6", "5D4"),  # Fe III
    "Fe3+": ("[Ar] 3d5", "6S5/2"),  # Fe IV
    "Co+": ("[Ar] 3d8", "3F4"),  # Co II (rule: 3d7 4s1)
    "Co2+": ("[Ar] 3d7", "4F9/2"),  # Co III
    "Ni+": ("[Ar] 3d9", "2D5/2"),  # Ni II (rule: 3d8 4s1)
    "Ni2+": ("[Ar] 3d8", "3F4"),  # Ni III
    "Cu+": ("[Ar] 3d10", "1S0"),  # Cu II
    "Cu2+": ("[Ar] 3d9", "2D5/2"),  # Cu III
    "Zn2+": ("[Ar] 3d10", "1S0"),  # Zn III
    # 4d block
    "Y+": ("[Kr] 5s2", "1S0"),  # Y II (rule: 4d1 5s1)
    "Zr4+": ("[Kr]", "1S0"),  # Zr V
    "Mo3+": ("[Kr] 4d3", "4F3/2"),  # Mo IV
    "Ru3+": ("[Kr] 4d5", "6S5/2"),  # Ru IV
    "Pd2+": ("[Kr] 4d8", "3F4"),  # Pd III
    "Ag+": ("[Kr] 4d10", "1S0"),  # Ag II
    "Cd2+": ("[Kr] 4d10", "1S0"),  # Cd III
    # 5d block
    "Hf4+": ("[Xe] 4f14", "1S0"),  # Hf V
    "W+": ("[Xe] 4f14 5d4 6s1", "6D1/2"),  # W II
    "Ir3+": ("[Xe] 4f14 5d6", "5D4"),  # Ir IV
    "Pt2+": ("[Xe] 4f14 5d8", "3F4"),  # Pt III
    "Au+": ("[Xe] 4f14 5d10", "1S0"),  # Au II
    "Au3+": ("[Xe] 4f14 5d8", "3F4"),  # Au IV
    "Hg2+": ("[Xe] 4f14 5d10", "1S0"),  # Hg III
    # 4f block
    "La+": ("[Xe] 5d2", "3F2"),  # La II (rule: 5d1 6s1)
    "La3+": ("[Xe]", "1S0"),  # La IV
    "Ce2+": ("[Xe] 4f2", "3H4"),  # Ce III (rule: 4f1 5d1)
    "Ce3+": ("[Xe] 4f1", "2F°5/2"),  # Ce IV
    "Pr3+": ("[Xe] 4f2", "3H4"),  # Pr IV
    "Nd3+": ("[Xe] 4f3", "4I°9/2"),  # Nd IV
    "Sm3+": ("[Xe] 4f5", "6H°5/2"),  # Sm IV
    "Eu2+": ("[Xe] 4f7", "8S°7/2"),  # Eu III
    "Eu3+": ("[Xe] 4f6", "7F0"),  # Eu IV
    "Gd3+": ("[Xe] 4f7", "8S°7/2"),  # Gd IV
    "Tb3+": ("[Xe] 4f8", "7F6"),  # Tb IV
    "Dy3+": ("[Xe] 4f9", "6H°15/2"),  # Dy IV
    "Er3+": ("[Xe] 4f11", "4I°15/2"),  # Er IV
    "Yb2+": ("[Xe] 4f14", "1S0"),  # Yb III
    "Yb3+": ("[Xe] 4f13", "2F°7/2"),  # Yb IV
    "Lu+": ("[Xe] 4f14 6s2", "1S0"),  # Lu II (rule: 4f14 5d1 6s1)
    "Lu3+": ("[Xe] 4f14", "1S0"),  # Lu IV
    # 5f block
    "Th3+": ("[Rn] 5f1", "2F°5/2"),  # Th IV (rule: 6d1)
    "Th4+": ("[Rn]", "1S0"),  # Th V
    "U3+": ("[Rn] 5f3", "4I°9/2"),  # U IV
    "U4+": ("[Rn] 5f2", "3H4"),  # U V
    "Np3+": ("[Rn] 5f4", "5I4"),  # Np IV
    "Pu3+": ("[Rn] 5f5", "6H°5/2"),  # Pu IV
    "Am3+": ("[Rn] 5f6", "7F0"),  # Am IV
    "Cm3+": ("[Rn] 5f7", "8S°7/2"),  # Cm IV
}

# U6+ (U VII) lies beyond the shipped charges; NIST lists its ground as 6p6 1S0, i.e. [Rn].
DERIVED_BEYOND_TABLE = {"U6+": "[Rn]", "Fe7+": "[Ar] 3d1"}  # Fe VIII: 3p6 3d 2D3/2

# Every shipped ion whose observed ground configuration the removal rule does not give.
RULE_MISSES = {
    ("V", 1), ("Co", 1), ("Ni", 1), ("Y", 1), ("La", 1), ("Ce", 1), ("Ce", 2), ("Lu", 1),
    ("Lu", 2), ("Hf", 1), ("Ac", 1), ("Ac", 2), ("Th", 1), ("Th", 2), ("Th", 3), ("Pa", 1),
    ("U", 1), ("U", 2), ("Np", 2), ("Cm", 1), ("Cm", 2),
}


def test_at_least_forty_ions_across_the_d_and_f_blocks_are_checked():
    blocks = {parse_spec(spec).short_text.split()[-1][-2] for spec in NIST_IONS
              if len(parse_spec(spec).short_text.split()) > 1}
    assert len(NIST_IONS) >= 40 and {"d", "f"} <= blocks


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
    # Ce II: NIST 4f(2F°)5d2(3F) 4H°7/2; Hund's rules give 4I°9/2. Pa III: NIST 4I11/2, Hund 4K11/2.
    assert known_hund_miss("Ce+").display == "4H°7/2"
    assert ground_level("Ce+").display == "4I°9/2"
    assert any("miss" in note and "4H°7/2" in note for note in ground_notes("Ce+"))
    assert known_hund_miss("Pa2+").display == "4I11/2"
    misses = {(element(ion.Z).symbol, ion.charge) for ion in observed_ions()
              if known_hund_miss(f"{element(ion.Z).symbol}{ion.charge}+") is not None}
    assert misses == {("Ce", 1), ("Pa", 2)}


def test_levels_nist_names_in_another_coupling_are_compared_by_j():
    # Pr II: NIST (9/2,1/2)°4 in J1 j coupling; Hund's rules 5I°4 (the same J and parity).
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

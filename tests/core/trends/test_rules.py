"""The rules that name a trend's configurations, and the messages for wrong ones."""

from __future__ import annotations

import pytest

from zeffir.core import parse_spec
from zeffir.core.trends import (
    TrendRuleError,
    configuration_family,
    ion_spec,
    isoelectronic_sequence,
    parse_rule,
)


def test_a_z_range_names_the_neutral_atoms():
    specs = parse_rule("Z=1-36")
    assert len(specs) == 36 and specs[0] == "H" and specs[25] == "Fe" and specs[-1] == "Kr"
    assert parse_rule(" z = 26 ") == ["Fe"]


def test_an_isoelectronic_sequence_holds_its_electron_count():
    specs = parse_rule("isoelectronic=10:Z=8-20")
    assert specs[:4] == ["O2-", "F-", "Ne", "Na+"] and specs[-1] == "Ca10+"
    assert all(parse_spec(s).n_electrons == 10 for s in specs)
    assert [parse_spec(s).Z for s in specs] == list(range(8, 21))


def test_a_family_runs_one_occupancy_over_neutral_atoms():
    specs = parse_rule("family=[Ar] 3dn 4s2:n=1-10")
    assert specs[0] == "Sc [Ar] 3d1 4s2" and specs[-1] == "Zn [Ar] 3d10 4s2"
    assert all(parse_spec(s).charge == 0 for s in specs)
    assert configuration_family("[Ar] 3d{n} 4s2", 0, 0) == ["Ca [Ar] 4s2"]  # n = 0: the subshell drops out
    assert configuration_family("[Xe] 4fⁿ 6s2", 1, 1) == ["La [Xe] 4f1 6s2"]


def test_a_list_of_specs_is_kept_as_written():
    assert parse_rule("Li, Na,K ,Rb") == ["Li", "Na", "K", "Rb"]
    assert parse_rule("Fe, Fe+, Fe2+") == ["Fe", "Fe+", "Fe2+"]


@pytest.mark.parametrize(("rule", "words"), [
    ("", "empty rule"),
    ("Z=0-5", "between 1 and 118"),
    ("Z=9-3", "runs backwards"),
    ("Z=a-b", "write a range"),
    ("isoelectronic=10", "isoelectronic=N:Z=a-b"),
    ("isoelectronic=ten:Z=10-20", "not a whole number"),
    ("isoelectronic=30:Z=1-5", "cannot bind 30 electrons"),
    ("family=[Ar] 3d 4s2:n=1-3", "mark exactly one occupancy"),
    ("family=[Zz] 3dn:n=1-2", "[Zz] is not a noble-gas core"),
    ("family=[Ar] 3dn 4s2", "family=CONFIGURATION:n=a-b"),
    ("colour=red", "unknown rule"),
    ("Li,,Na", "entry 2 of the list is empty"),
    ("Li, Qq", "Qq: "),
])
def test_wrong_rules_are_refused_naming_the_part(rule, words):
    with pytest.raises(TrendRuleError) as caught:
        parse_rule(rule)
    assert words in str(caught.value)


def test_ion_specs_read_back_as_the_same_ion():
    for z, charge in [(1, 0), (1, -1), (26, 1), (26, 3), (8, -2), (92, 4)]:
        spec = ion_spec(z, charge)
        assert (parse_spec(spec).Z, parse_spec(spec).charge) == (z, charge)
    assert isoelectronic_sequence(2, 1, 3) == ["H-", "He", "Li+"]

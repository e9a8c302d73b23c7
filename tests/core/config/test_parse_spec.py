"""The atom-spec parser: the forms it accepts and the messages it gives."""

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from zeffir.core import SpecError, parse_spec
from zeffir.core.config import Subshell


@pytest.mark.parametrize(
    ("text", "Z", "charge", "configuration"),
    [
        ("Fe", 26, 0, "1s2 2s2 2p6 3s2 3p6 3d6 4s2"),
        ("26", 26, 0, "1s2 2s2 2p6 3s2 3p6 3d6 4s2"),
        ("fe", 26, 0, "1s2 2s2 2p6 3s2 3p6 3d6 4s2"),
        ("Fe3+", 26, 3, "1s2 2s2 2p6 3s2 3p6 3d5"),
        ("Fe+3", 26, 3, "1s2 2s2 2p6 3s2 3p6 3d5"),
        ("Fe 3+", 26, 3, "1s2 2s2 2p6 3s2 3p6 3d5"),
        ("O2-", 8, -2, "1s2 2s2 2p6"),
        ("Cl-", 17, -1, "1s2 2s2 2p6 3s2 3p6"),
        ("C 1s2 2s1 2p3", 6, 0, "1s2 2s1 2p3"),
        ("Na [Ne] 4d1", 11, 0, "1s2 2s2 2p6 4d1"),
        ("He+ 2p1", 2, 1, "2p1"),
        ("He 1s 2s", 2, 0, "1s1 2s1"),
        ("Li+ 1s1.2s1", 3, 1, "1s1 2s1"),
        ("Cu+", 29, 1, "1s2 2s2 2p6 3s2 3p6 3d10"),
        ("H-", 1, -1, "1s2"),
    ],
)
def test_accepted_specs(text, Z, charge, configuration):
    parsed = parse_spec(text)
    assert (parsed.Z, parsed.charge, parsed.text) == (Z, charge, configuration)
    assert parsed.n_electrons == Z - charge


def test_explicit_configuration_replaces_ground_state():
    assert parse_spec("C 1s2 2s1 2p3").explicit
    assert not parse_spec("C").explicit


def test_high_n_and_l_are_accepted():
    parsed = parse_spec("H 20i1")
    assert parsed.occupations == ((Subshell(20, 6), 1),)


@pytest.mark.parametrize(
    ("text", "message"),
    [
        ("C 2p7", "2p7: a p subshell holds at most 6 electrons"),
        ("Sc 3f1", "3f: l must be less than n"),
        ("C 1s2 2s2 2p3", "C 1s2 2s2 2p3: 7 electrons, but neutral C has 6"),
        ("Xx", "Xx: unknown element"),
        ("119", "119: Z must be between 1 and 118"),
        ("H+", "H+: no electrons left"),
        ("He2+", "He2+: no electrons left"),
        ("Fe3+ [Ar] 3d6", "Fe3+ [Ar] 3d6: 24 electrons, but Fe3+ has 23"),
        ("Na [Ne] 2p1", "2p1: [Ne] already fills 2p"),
        ("C 1s2 1s2 2p2", "1s2: 1s is listed twice"),
        ("Na [Zz] 3s1", "[Zz]: unknown core"),
        ("H 21s1", "21s1: n must be between 1 and 20"),
        ("H 1k1", "1k1: unknown subshell letter 'k'"),
        ("1s2 2s2", "1s2: the spec must start with an element symbol or atomic number"),
        ("", "empty spec"),
        ("Na 3s1 Cl", "Cl: only one element per spec"),
    ],
)
def test_rejected_specs_name_the_token_and_rule(text, message):
    with pytest.raises(SpecError) as caught:
        parse_spec(text)
    assert str(caught.value).startswith(message)


@settings(max_examples=400, deadline=None)
@given(st.text(max_size=40))
def test_random_text_raises_nothing_but_spec_error(text):
    try:
        parsed = parse_spec(text)
    except SpecError:
        return
    assert parsed.n_electrons == parsed.Z - parsed.charge


@settings(max_examples=300, deadline=None)
@given(st.lists(st.sampled_from(["Fe", "3+", "1s2", "2p", "[Ne]", "3d10", "4f7", "-", "+",
                                 "O", "2-", "26", "5g", "7i3", "[Og]", ".", " ", "x"]),
                max_size=8))
def test_random_token_soup_raises_nothing_but_spec_error(tokens):
    try:
        parse_spec(" ".join(tokens))
    except SpecError:
        pass


@pytest.mark.parametrize(("spec", "part"), [
    ("Fe0+", "0+:"), ("Fe+0", "+0:"), ("Fe 02+", "02+:"), ("Fe +02", "+02:"),
    ("Na [[Ne]] 3s1", "[[Ne]]"), ("Na [Ne]] 3s1", "[Ne]]"),
    ("Na [Ne] 3s\u0661", "3s\u0661"),          # an Arabic-Indic digit one
    ("\u0662\u0666", "\u0662\u0666"),              # Arabic-Indic 26
    ("Fe 3d\u00b2", "3d\u00b2"),                   # a superscript two
])
def test_the_parser_is_strict_where_the_notation_is(spec, part):
    # Only ASCII digits, charges without a zero, a core in exactly one pair of brackets:
    # each refusal names the part typed.
    with pytest.raises(SpecError) as caught:
        parse_spec(spec)
    assert part in str(caught.value)

"""Term and level labels, the Term and Level records, and their validation."""

import pytest

from zeffir.core import QuantumNumberError, SpecError, ZeffirError, parse_spec
from zeffir.core.terms import (
    L_SYMBOLS,
    Level,
    Term,
    configuration_terms,
    ground_level,
    microstate_count,
    term_label,
)


def test_letters_follow_the_spectroscopic_sequence_with_k_after_i():
    # Common practice: S P D F G H I, then alphabetical skipping J (and P, S already used).
    assert L_SYMBOLS == "SPDFGHIKLMNOQRTUV"
    assert [term_label(0, L) for L in (6, 7, 8)] == ["1I", "1K", "1L"]
    assert term_label(0.5, 16) == "2V"
    assert term_label(0.5, 17) == "2[L=17]"


@pytest.mark.parametrize(("args", "kwargs", "label"), [
    ((1, 1), {}, "3P"),
    ((1, 1, 0), {}, "3P0"),
    ((1.5, 0, 1.5), {}, "4S3/2"),
    ((1.5, 0, 1.5), {"parity": "odd"}, "4S°3/2"),
    ((1, 5, 4), {"parity": "odd"}, "3H°4"),
    ((2.5, 8, 5.5), {"parity": "even"}, "6L11/2"),
    ((0, 0, 0), {}, "1S0"),
])
def test_labels(args, kwargs, label):
    assert term_label(*args, **kwargs) == label


@pytest.mark.parametrize(("args", "kwargs", "message"), [
    ((-0.5, 1), {}, "S = -0.5: must not be negative"),
    ((0.25, 1), {}, "S = 0.25: must be a whole or half-whole number"),
    ((1, -1), {}, "L = -1: must be a whole number >= 0"),
    ((1, 1.5), {}, "L = 1.5: must be a whole number >= 0"),
    ((1, 1, 3), {}, "J = 3: with S = 1 and L = 1, J must be one of 0 … 2"),
    ((1, 1, 0.5), {}, "J = 1/2: with S = 1 and L = 1"),
    ((0.5, 1, 1), {}, "J = 1: with S = 1/2 and L = 1"),
    ((1, 1), {"parity": "+"}, "parity = '+': must be 'even' or 'odd'"),
    ((float("nan"), 1), {}, "S = nan: must be a whole or half-whole number"),
])
def test_bad_quantum_numbers_are_refused_with_the_rule(args, kwargs, message):
    with pytest.raises(QuantumNumberError) as caught:
        term_label(*args, **kwargs)
    assert message in str(caught.value)


def test_term_record_holds_integer_exact_halves():
    term = Term(S=1.5, L=2, parity="even")
    assert (term.two_S, term.multiplicity, term.label, term.display) == (3, 4, "4D", "4D")
    assert term.J == (0.5, 1.5, 2.5, 3.5)
    assert term.states == 20
    assert [level.label for level in term.levels()] == ["4D1/2", "4D3/2", "4D5/2", "4D7/2"]
    assert Term(S=1, L=1, parity="even") == Term(S=1.0, L=1, parity="even")
    assert isinstance(Term(S=1, L=1, parity="even").S, float)


def test_level_record_validates_j_and_knows_its_term():
    level = Level(S=1, L=5, J=4, parity="odd")
    assert (level.label, level.display, level.J) == ("3H4", "3H°4", 4.0)
    assert level.term == Term(1, 5, "odd")
    with pytest.raises(QuantumNumberError, match="J = 7"):
        Level(S=1, L=5, J=7, parity="odd")
    with pytest.raises(QuantumNumberError, match="parity"):
        Term(S=0, L=0, parity="none")


def test_functions_accept_spec_text_and_refuse_other_objects():
    assert microstate_count("C") == microstate_count(parse_spec("C")) == 15
    with pytest.raises(SpecError, match="expected a Configuration"):
        configuration_terms(6)
    with pytest.raises(SpecError, match="2p7: a p subshell holds at most 6"):
        ground_level("N 1s2 2p7")


def test_hand_built_configuration_with_impossible_occupancy_is_refused():
    from dataclasses import replace

    from zeffir.core import Subshell

    bad = replace(parse_spec("C"), occupations=((Subshell(2, 1), 7),))
    with pytest.raises(SpecError, match="2p7: a p subshell holds 1 to 6 electrons"):
        configuration_terms(bad)
    assert issubclass(SpecError, ZeffirError)


def test_numpy_numbers_are_accepted_and_stored_as_python_numbers():
    import numpy as np

    term = Term(S=np.float64(0.5), L=np.int64(2), parity="even")
    assert term.label == "2D" and type(term.L) is int and type(term.S) is float
    level = Level(S=np.int64(1), L=np.int64(1), J=np.int64(2), parity="even")
    assert level.label == "3P2" and type(level.J) is float

"""The element table: complete, consistent, and parseable by the spec parser."""

import pytest

from zeffir.core import element, elements, parse_spec
from zeffir.core.config import madelung_order


def test_table_lists_z_1_to_118():
    assert [e.Z for e in elements()] == list(range(1, 119))


@pytest.mark.parametrize("atom", elements(), ids=lambda e: e.symbol)
def test_every_element_parses_with_z_electrons(atom):
    parsed = parse_spec(atom.symbol)
    assert parsed.n_electrons == atom.Z
    assert all(occ <= sub.capacity for sub, occ in parsed.occupations)
    assert parse_spec(str(atom.Z)).text == parsed.text


def test_lookup_by_symbol_and_number_agree():
    assert element("Og").Z == 118 and element(118).symbol == "Og"


def test_madelung_order_starts_as_expected():
    assert [s.label for s in madelung_order()[:10]] == [
        "1s", "2s", "2p", "3s", "3p", "4s", "3d", "4p", "5s", "4d"
    ]

"""One set of unit names: the window's chooser, the session file and ``--units`` agree."""

from __future__ import annotations

import json

import pytest

from zeffir.cli import _parser, figure_state, table_json
from zeffir.state import LENGTH_UNITS


@pytest.mark.parametrize(("name", "stored"), [("bohr", "bohr"), ("angstrom", "angstrom"),
                                              ("atomic", "bohr"), ("angstrom-ev", "angstrom")])
def test_units_take_the_session_names_and_the_older_ones(name, stored):
    args = _parser().parse_args(["figure", "Na", "--units", name, "--offset", "1", "--out", "x.png"])
    state = figure_state(args)
    assert state.length_unit == stored
    if stored == "angstrom":
        assert state.slice.offset == pytest.approx(1.0 / 0.529177210544, rel=1e-9)  # CODATA 2022 a₀


def test_every_session_unit_name_is_a_command_line_choice():
    parser = _parser()
    for name in LENGTH_UNITS:  # "bohr", "angstrom": what a session's length_unit holds
        parser.parse_args(["table", "Ne", "--units", name])


def test_the_table_in_angstrom_matches_the_json_in_bohr(capsys):
    from zeffir.cli import main

    assert main(["table", "Ne", "--units", "angstrom"]) == 0
    text = capsys.readouterr().out
    assert "Å" in text and "eV" in text
    data = table_json("Ne", "slater")
    assert json.dumps(data)  # the JSON stays atomic whatever the text's units

"""`zeffir figure --versus` repeated: several series, the overlay, and their input errors."""

from __future__ import annotations

import pytest

from zeffir.cli import _InputError, _parser, figure_state
from zeffir.state import Source


def _state(*argv: str):
    return figure_state(_parser().parse_args(["figure", *argv, "--out", "x.png"]))


def test_repeated_versus_builds_every_series_in_order():
    state = _state("Fe", "--versus", "clementi", "--versus", "hydrogenic", "--versus", "Co", "--overlay")
    assert state.series() == (Source("Fe", "slater"), Source("Fe", "clementi"),
                              Source("Fe", "hydrogenic"), Source("Co", "slater"))
    assert state.compare.overlay and not state.compare.has_difference()


def test_one_versus_keeps_the_difference_and_overlay_needs_a_versus():
    assert _state("Ne", "--versus", "hartree-fock").compare.has_difference()
    with pytest.raises(_InputError, match="--overlay"):
        _state("Ne", "--overlay")


def test_a_bad_further_series_is_reported_against_versus():
    with pytest.raises(_InputError, match=r"^--versus: .*Qq"):
        _state("Fe", "--versus", "clementi", "--versus", "Qq")
    with pytest.raises(_InputError, match="at most"):
        _state("Fe", *[a for m in ("clementi", "hydrogenic", "variational", "Co", "Ni", "Cu")
                      for a in ("--versus", m)])

"""``zeffir figure --limits --colour-map``: the colour options reach the shown view's settings."""

from __future__ import annotations

import pytest

from zeffir.cli import _parser, figure_state, main
from zeffir.core import ANGSTROM_PER_BOHR
from zeffir.state import ColourSettings


def _state(*argv):
    return figure_state(_parser().parse_args(["figure", *argv, "--out", "x.png"]))


def test_manual_limits_are_typed_in_display_units_and_stored_in_atomic_units():
    state = _state("Ne", "--view", "slice", "--quantity", "density", "--limits=0.1,20",
                   "--units", "angstrom-ev", "--colour-map", "magma")
    colour = state.slice.colour
    per_bohr3 = ANGSTROM_PER_BOHR**3  # Å⁻³ → bohr⁻³
    assert colour.limits == "manual" and colour.sequential_map == "magma"
    assert (colour.low, colour.high) == pytest.approx((0.1 * per_bohr3, 20.0 * per_bohr3))


def test_a_signed_quantity_spans_minus_high_to_high():
    colour = _state("Ne", "--view", "slice", "--quantity", "psi", "--limits=0,0.3",
                    "--colour-map", "coolwarm").slice.colour
    assert (colour.low, colour.high, colour.diverging_map) == (-0.3, 0.3, "coolwarm")


def test_the_pair_and_two_electron_views_get_their_own_settings():
    pair = _state("N", "--view", "pair", "--limits", "extremes", "--log", "--colour-map", "cividis")
    assert pair.pair.colour == ColourSettings(limits="extremes", log_scale=True, sequential_map="cividis")
    assert pair.slice.colour == ColourSettings()
    two = _state("Li+", "1s1", "2s1", "--view", "two-electron", "--colour-map", "PuOr")
    assert two.two_electron.colour.diverging_map == "PuOr"


@pytest.mark.parametrize(("argv", "reason"), [
    (("--limits=0.5,0.1",), "--limits 0.5,0.1: HIGH must be above zero and LOW below HIGH"),
    (("--limits", "wide"), "--limits wide: use robust, extremes or LOW,HIGH"),
    (("--limits=0,inf",), "use robust, extremes or LOW,HIGH"),
    (("--view", "radial", "--limits", "extremes"), "the radial view has no colour scale"),
])
def test_bad_colour_options_exit_2_with_the_reason(tmp_path, capsys, argv, reason):
    out = tmp_path / "f.png"
    args = ["figure", "Ne", "--out", str(out)]
    if "--view" not in argv:
        args += ["--view", "slice", "--quantity", "density"]
    assert main([*args, *argv]) == 2
    assert reason in capsys.readouterr().err
    assert not out.exists()

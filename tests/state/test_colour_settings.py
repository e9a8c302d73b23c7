"""Colour settings in the state: defaults, validation naming the field, sessions written before."""

from __future__ import annotations

import json
import math
from dataclasses import replace

import pytest

from zeffir.core._resources import resource_path
from zeffir.state import ColourSettings, PairSettings, SliceSettings, StateError, ViewState

# A session's state as written before colour settings had their own object (version 1):
# the colour scale lived flat in ``slice`` and the pair view drew with it.
OLD_STATE = {
    "left": {"spec": "Ne", "model": "slater"},
    "orbital": {"subshell": "2p", "kind": "real", "m": 0},
    "view": "pair",
    "length_unit": "bohr",
    "slice": {"plane": "xz", "normal": [0.0, 0.0, 1.0], "offset": 0.0, "extent": 3.0,
              "resolution": 64, "quantity": "density", "log_scale": True, "contours": 4,
              "full_range": True, "fit_extent": False, "log_decades": 4.0},
    "pair": {"reference": [0.0, 0.0, 0.5], "spin": "up", "determinant": ""},
    "two_electron": {"map": "radial", "r_limit": None, "resolution": 256},
}


def test_defaults_are_the_scale_the_views_always_drew():
    colour = ColourSettings()
    assert (colour.limits, colour.log_scale, colour.log_decades) == ("robust", False, 6.0)
    assert (colour.sequential_map, colour.diverging_map) == ("viridis", "RdBu")
    state = ViewState()
    assert state.slice.colour == state.pair.colour == state.two_electron.colour == colour


def test_an_old_session_moves_its_flat_colour_keys_into_the_views_that_used_them():
    state = ViewState.from_dict(json.loads(json.dumps(OLD_STATE)))
    for colour in (state.slice.colour, state.pair.colour):  # the pair view drew with the slice's
        assert (colour.limits, colour.log_scale, colour.log_decades) == ("extremes", True, 4.0)
    assert state.two_electron.colour == ColourSettings()  # it was always robust and linear
    assert state.slice.full_range and state.slice.log_scale and state.slice.log_decades == 4.0
    robust = {**OLD_STATE, "slice": {**OLD_STATE["slice"], "full_range": False}}
    assert ViewState.from_dict(robust).slice.colour.limits == "robust"


def test_an_old_session_without_a_pair_part_still_gives_the_pair_view_its_scale():
    old = {key: value for key, value in OLD_STATE.items() if key != "pair"}
    state = ViewState.from_dict(old)
    assert state.pair.colour.log_scale and state.pair.colour.limits == "extremes"
    assert state.pair == PairSettings(colour=state.pair.colour)


def test_an_old_flat_full_range_of_the_wrong_type_is_named():
    bad = {**OLD_STATE, "slice": {**OLD_STATE["slice"], "full_range": "yes"}}
    with pytest.raises(StateError, match=r"^slice\.full_range: expected true or false"):
        ViewState.from_dict(bad)


def test_the_demo_session_still_loads_with_the_default_scale():
    session = json.loads(resource_path("demo", "sodium-valence.zeffir").read_text())
    state = ViewState.from_dict(session["state"])
    assert state.slice.colour == state.pair.colour == ColourSettings()


def test_new_keys_win_over_flat_ones_and_round_trip():
    colour = ColourSettings("manual", 1e-4, 0.5, True, 5.0, "cividis", "PuOr")
    state = ViewState(slice=SliceSettings(colour=colour), pair=PairSettings(colour=replace(colour, high=2.0)))
    data = json.loads(json.dumps(state.to_dict()))
    assert "log_scale" not in data["slice"] and data["slice"]["colour"]["limits"] == "manual"
    data["slice"]["full_range"] = True  # a stray flat key does not override the object
    again = ViewState.from_dict(data)
    assert again.slice.colour == colour and again.pair.colour.high == 2.0


@pytest.mark.parametrize(("where", "colour", "message"), [
    ("slice", ColourSettings(limits="manual", low=1.0, high=1.0), r"slice\.colour\.low: must be below high"),
    ("slice", ColourSettings(low=2.0, high=1.0), r"slice\.colour\.low: must be below high"),
    ("slice", ColourSettings(high=math.inf), r"slice\.colour\.high: must be a positive finite"),
    ("slice", ColourSettings(low=-math.inf), r"slice\.colour\.low: must be a finite number"),
    ("slice", ColourSettings(low=math.nan), r"slice\.colour\.low: must be a finite number"),
    ("pair", ColourSettings(low=-2.0, high=-1.0), r"pair\.colour\.high: must be a positive"),
    ("pair", ColourSettings(limits="loose"), r"pair\.colour\.limits: 'loose' is not one of"),
    ("two_electron", ColourSettings(sequential_map="jet"), r"two_electron\.colour\.sequential_map"),
    ("two_electron", ColourSettings(diverging_map="viridis"), r"two_electron\.colour\.diverging_map"),
    ("slice", ColourSettings(log_decades=0.5), r"slice\.colour\.log_decades"),
])
def test_invalid_colour_settings_are_refused_naming_the_field(where, colour, message):
    state = ViewState()
    part = replace(getattr(state, where), colour=colour)
    with pytest.raises(StateError, match=f"^{message}"):
        state.with_changes(**{where: part}).validated()


def test_a_session_with_non_numeric_limits_names_the_field():
    data = ViewState().to_dict()
    data["two_electron"]["colour"]["high"] = "a lot"
    with pytest.raises(StateError, match=r"^two_electron\.colour\.high: expected a number"):
        ViewState.from_dict(data)

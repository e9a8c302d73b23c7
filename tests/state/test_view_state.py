"""The view state: validation names the field, round trips are exact, orbitals reconcile."""

import pytest

from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    SliceSettings,
    Source,
    StateError,
    ViewState,
    reconcile_orbital,
)


def test_default_state_is_valid_and_round_trips():
    state = ViewState().validated()
    assert ViewState.from_dict(state.to_dict()) == state


def test_round_trip_keeps_every_field():
    state = ViewState(
        left=Source("Fe3+", "clementi"),
        orbital=OrbitalChoice("3d", "complex", -2),
        view="slice",
        length_unit="angstrom",
        slice=SliceSettings(plane="custom", normal=(1.0, 1.0, 0.0), offset=0.3, extent=4.0,
                            resolution=300, quantity="psi2", colour=ColourSettings(log_scale=True),
                            contours=5),
        compare=CompareSettings(True, Source("Fe3+", "hydrogenic"), False, same_atom=False),
    ).validated()
    assert ViewState.from_dict(state.to_dict()) == state


@pytest.mark.parametrize(
    ("patch", "message"),
    [
        ({"left": {"spec": "Xx"}}, "spec: Xx: unknown element"),
        ({"left": {"model": "nope"}}, "model: nope: unknown model"),
        ({"slice": {"resolution": 4096}}, "slice.resolution"),
        ({"slice": {"resolution": "high"}}, "slice.resolution: expected a whole number"),
        ({"slice": {"extent": -1}}, "slice.extent"),
        ({"slice": {"normal": [0, 0, 0]}}, "slice.normal"),
        ({"view": "cube"}, "view: 'cube' is not one of"),
        ({"radial": {"quantity": "X"}}, "radial.quantity"),
        ({"radial": "D"}, "radial: expected an object"),
        ({"compare": {"enabled": True, "same_atom": False, "right": {"spec": "C 2p7"}}},
         "compare.right.spec: 2p7"),
    ],
)
def test_invalid_fields_are_named(patch, message):
    data = ViewState().to_dict()
    for key, value in patch.items():
        merge = isinstance(value, dict) and isinstance(data[key], dict)
        data[key] = {**data[key], **value} if merge else value
    with pytest.raises(StateError) as caught:
        ViewState.from_dict(data)
    assert message in str(caught.value)


def test_unknown_keys_are_ignored_and_missing_ones_default():
    state = ViewState.from_dict({"left": {"spec": "Li+"}, "future_option": 3})
    assert state.left == Source("Li+", "slater")
    assert state.orbital.subshell == "1s"  # the default 3s is not occupied in Li+


def test_orbital_choice_follows_the_spec():
    assert reconcile_orbital("Fe", OrbitalChoice("3d", "real", -2)).subshell == "3d"
    assert reconcile_orbital("Ne", OrbitalChoice("3d", "real", 2)) == OrbitalChoice("2p", "real", 0)
    assert reconcile_orbital("Ne", OrbitalChoice("2p", "real", 2)).m == 0


@pytest.mark.parametrize("decades", [0.5, 17.0, float("inf")])
def test_log_decades_out_of_range_are_refused_naming_the_field(decades):
    with pytest.raises(StateError, match=r"slice\.colour\.log_decades"):
        ViewState(slice=SliceSettings(colour=ColourSettings(log_decades=decades))).validated()

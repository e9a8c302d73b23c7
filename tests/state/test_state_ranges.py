"""Every field of a state has a type and a sane range, checked by validated() and from_dict().

validated() is what the window and the command line call, so a state built in code
is held to the same ranges as one read from a session file.
"""

from __future__ import annotations

import math
from dataclasses import replace

import pytest

from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    RadialSettings,
    SliceSettings,
    Source,
    StateError,
    TwoElectronSettings,
    ViewState,
)

BASE = ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d", "real", 0))


@pytest.mark.parametrize(
    ("changes", "message"),
    [
        ({"radial": RadialSettings(r_limit=1e17)}, "radial.r_limit: must be a positive number of bohr"),
        ({"radial": RadialSettings(r_limit=0.0)}, "radial.r_limit: must be a positive number of bohr"),
        ({"radial": RadialSettings(r_limit=math.nan)}, "radial.r_limit: must be a positive number"),
        ({"radial": RadialSettings(r_limit=10**400)}, "radial.r_limit: must be a positive number"),
        ({"slice": SliceSettings(extent=1e17)}, "slice.extent: must be a positive number of bohr"),
        ({"slice": SliceSettings(extent=10**17)}, "slice.extent: must be a positive number of bohr"),
        ({"slice": SliceSettings(extent=1e-9)}, "slice.extent: must be a positive number of bohr"),
        ({"slice": SliceSettings(extent=math.inf)}, "slice.extent: must be a positive number of bohr"),
        ({"slice": SliceSettings(offset=-math.inf)}, "slice.offset: must be a number of bohr between"),
        ({"slice": SliceSettings(offset=math.nan)}, "slice.offset: must be a number of bohr between"),
        ({"slice": SliceSettings(resolution=10**5000)}, "slice.resolution: must be between 16 and 1024"),
        ({"slice": SliceSettings(contours=-1)}, "slice.contours: between 0 and 40 levels"),
        ({"slice": SliceSettings(normal=(math.nan, 0.0, 1.0))}, "slice.normal: three numbers, not all"),
        ({"slice": SliceSettings(normal=(1e300, 0.0, 1.0))}, "slice.normal: three numbers, not all"),
        ({"slice": SliceSettings(normal=(1e-300, 0.0, 0.0))}, "slice.normal: three numbers, not all"),
        ({"slice": SliceSettings(normal=(0.0, 0.0))}, "slice.normal: expected a list of 3 numbers"),
        ({"slice": SliceSettings(colour=ColourSettings(high=1e31))}, "slice.colour.high: must be a "
                                                                     "positive finite number"),
        ({"slice": SliceSettings(colour=ColourSettings(low=-10**400))}, "slice.colour.low: must be a "
                                                                        "finite number"),
        ({"slice": SliceSettings(colour=ColourSettings(log_decades=math.nan))},
         "slice.colour.log_decades: between 1 and 16"),
        ({"pair": PairSettings(reference=(0.0, math.inf, 0.0))}, "pair.reference: three coordinates"),
        ({"pair": PairSettings(reference=(0.0, 2e4, 0.0))}, "pair.reference: three coordinates"),
        ({"pair": PairSettings(determinant="x" * 257)}, "pair.determinant: at most 256 characters"),
        ({"pair": PairSettings(colour=ColourSettings(limits="auto"))},  # type: ignore[arg-type]
         "pair.colour.limits: 'auto' is not one of"),
        ({"two_electron": TwoElectronSettings(resolution=8)}, "two_electron.resolution: must be "
                                                              "between 16 and 1024"),
        ({"two_electron": TwoElectronSettings(r_limit=-1.0)}, "two_electron.r_limit: must be a "
                                                              "positive number"),
        ({"orbital": OrbitalChoice("3d", "real", 3)}, "orbital.m: must be between -2 and 2 for 3d"),
        ({"orbital": OrbitalChoice("3d", "complex", 10**400)}, "orbital.m: must be between -2 and 2"),
        ({"orbital": OrbitalChoice("zz", "real", 9)}, "orbital.m: must be between -6 and 6"),
        ({"orbital": OrbitalChoice("3d", "real", True)}, "orbital.m: expected a whole number"),
        ({"orbital": OrbitalChoice("3d" * 10)}, "orbital.subshell: at most 8 characters"),
        ({"left": Source("Na" * 200)}, "spec: at most 256 characters, got 400"),
        ({"left": Source("Na", "nope")}, "model: nope: unknown model"),
        ({"left": Source("Na", "n" * 10_000)}, "model: 'nnnn"),
        ({"view": "cube"}, "view: 'cube' is not one of"),
        ({"length_unit": "v" * 10**6}, "length_unit: 'vvvv"),
        ({"compare": CompareSettings(right=Source("Na", "nope"))}, "compare.right.model: nope"),
        ({"compare": CompareSettings(True, more=(Source("", "slater"),) * 5)},
         "compare.more: at most 4 further series (6 in all)"),
        ({"compare": CompareSettings(True, more=(Source("", "nope"),))}, "compare.more[0].model: nope"),
        ({"compare": CompareSettings(True, more=(Source(" " * 300),))},
         "compare.more[0].spec: at most 256 characters"),
        ({"compare": CompareSettings(True, Source("C 2p7"), same_atom=False)}, "compare.right.spec: 2p7"),
        ({"compare": CompareSettings(enabled="yes")}, "compare.enabled: expected true or false"),
        ({"radial": RadialSettings(weighted=1)}, "radial.weighted: expected true or false"),
        ({"slice": SliceSettings(resolution=256.0)}, "slice.resolution: expected a whole number"),
        ({"slice": SliceSettings(extent="8")}, "slice.extent: expected a number"),
        ({"slice": SliceSettings(extent=True)}, "slice.extent: expected a number"),
        ({"slice": "xz"}, "slice: expected an object"),
        ({"compare": CompareSettings(more=[Source()])}, "compare.more: expected a list of objects"),
        ({"compare": CompareSettings(more=({"spec": "Na"},))}, "compare.more: expected a list of"),
        ({"pair": PairSettings(determinant=3)}, "pair.determinant: expected text"),
        ({"left": Source("Na\x00")}, "spec: contains control characters or unpaired surrogates"),
        ({"left": Source("Na\ud800")}, "spec: contains control characters or unpaired surrogates"),
    ],
)
def test_a_field_out_of_range_or_of_the_wrong_type_is_named(changes, message):
    state = replace(BASE, **changes)
    with pytest.raises(StateError) as caught:
        state.validated()
    assert str(caught.value).startswith(message)
    assert len(str(caught.value)) < 300


@pytest.mark.parametrize(
    "changes",
    [
        {"slice": SliceSettings(extent=1e4, offset=-1e4, resolution=1024, contours=40)},
        {"slice": SliceSettings(extent=1e-3, normal=(1e6, 0.0, 0.0), resolution=16, contours=0)},
        {"radial": RadialSettings(r_limit=1e-3)},
        {"pair": PairSettings(reference=(1e4, -1e4, 0.0), determinant="x" * 256)},
        {"two_electron": TwoElectronSettings(r_limit=1e4, resolution=16)},
        {"slice": SliceSettings(colour=ColourSettings("manual", low=-1e30, high=1e30))},
        {"orbital": OrbitalChoice("3d", "complex", -2)},
        {"compare": CompareSettings(True, more=(Source("", "hydrogenic"),) * 4)},
        {"left": Source("Fe" + " " * 254)},  # 256 characters
        # The longest explicit configuration there is fits well within the limit.
        {"left": Source("Og 1s2 2s2 2p6 3s2 3p6 3d10 4s2 4p6 4d10 4f14 5s2 5p6 5d10 5f14 6s2 6p6 "
                        "6d10 7s2 7p6")},
    ],
)
def test_values_at_the_ends_of_each_range_are_accepted(changes):
    state = replace(BASE, **changes).validated()
    assert state.validated() == state


def test_a_comparison_that_is_off_does_not_parse_its_spec_but_checks_its_text():
    off = CompareSettings(False, Source("C 2p7", "slater"), same_atom=False)
    assert replace(BASE, compare=off).validated().compare.right.spec == "C 2p7"
    long = CompareSettings(False, Source("C" * 300, "slater"), same_atom=False)
    with pytest.raises(StateError, match=r"^compare\.right\.spec: at most 256"):
        replace(BASE, compare=long).validated()


@pytest.mark.parametrize(
    ("data", "message"),
    [
        ({"slice": {"extent": 10**400}}, "slice.extent: expected a finite number, got a whole number "
                                         "of about 401 digits"),
        ({"slice": {"normal": [10**400, 0, 0]}}, "slice.normal: expected 3 finite numbers"),
        ({"slice": {"offset": math.nan}}, "slice.offset: expected a finite number, got nan"),
        ({"radial": {"r_limit": -math.inf}}, "radial.r_limit: expected a finite number, got -inf"),
        ({"slice": {"resolution": 10**5000}}, "slice.resolution: must be between 16 and 1024"),
        ({"compare": {"more": [{}] * 10**5}}, "compare.more: at most 4 further series"),
        ({"compare": {"more": [{"spec": []}]}}, "compare.more[0].spec: expected text"),
        ({"pair": {"reference": [0, 0]}}, "pair.reference: expected a list of 3 numbers"),
        ({"orbital": {"m": 1.0}}, "orbital.m: expected a whole number"),
    ],
)
def test_from_dict_refuses_bad_types_and_overflowing_numbers(data, message):
    with pytest.raises(StateError) as caught:
        ViewState.from_dict(data)
    assert str(caught.value).startswith(message)


def test_from_dict_turns_whole_numbers_into_floats_where_floats_are_kept():
    state = ViewState.from_dict({"slice": {"extent": 5, "normal": [0, 1, 0], "fit_extent": False}})
    assert state.slice.extent == 5.0 and isinstance(state.slice.extent, float)
    assert state.slice.normal == (0.0, 1.0, 0.0) and all(isinstance(c, float) for c in state.slice.normal)

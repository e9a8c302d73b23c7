"""Comparisons of several series: shared axes and scales, overlays, and the difference of two."""

from __future__ import annotations

import numpy as np
import pytest

from zeffir.scene import (
    compare_radial,
    compare_slices,
    radial_scene,
    series_names,
    slice_scene,
    view_inputs,
)
from zeffir.state import (
    MAX_SERIES,
    CompareSettings,
    OrbitalChoice,
    SliceSettings,
    Source,
    StateError,
    ViewState,
)

FOUR = CompareSettings(True, Source("Fe", "clementi"), True, True,
                       more=(Source("", "hydrogenic"), Source("Co", "slater")))


def _state(compare: CompareSettings = FOUR, **changes) -> ViewState:
    return ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d"), compare=compare,
                     slice=SliceSettings(resolution=48, extent=6.0, fit_extent=False),
                     **changes).validated()


def test_further_series_with_an_empty_atom_follow_the_main_atom():
    state = _state().with_changes(left=Source("Ni", "slater")).validated()
    assert state.series() == (Source("Ni", "slater"), Source("Ni", "clementi"),
                              Source("Ni", "hydrogenic"), Source("Co", "slater"))
    assert not state.compare.has_difference()  # the difference is for exactly two


def test_series_round_trip_through_a_session_dict_and_old_sessions_have_none():
    state = _state()
    assert ViewState.from_dict(state.to_dict()) == state
    old = state.to_dict()
    del old["compare"]["more"], old["compare"]["overlay"]
    assert ViewState.from_dict(old).series() == (Source("Fe", "slater"), Source("Fe", "clementi"))


def test_bad_further_series_name_their_field():
    with pytest.raises(StateError, match=r"compare\.more\[1\]\.spec"):
        _state(CompareSettings(True, Source("Fe", "clementi"),
                               more=(Source("", "hydrogenic"), Source("Qq", "slater"))))
    with pytest.raises(StateError, match=r"compare\.more: at most"):
        _state(CompareSettings(True, more=tuple(Source("", "slater") for _ in range(MAX_SERIES - 1))))
    with pytest.raises(StateError, match=r"compare\.more\[0\]: expected an object|expected a list"):
        ViewState.from_dict({"compare": {"more": ["Fe"]}})


def test_radial_series_share_one_r_grid_and_match_their_single_scenes():
    comparison = compare_radial(_state())
    assert len(comparison.series) == 4 and comparison.difference is None
    assert comparison.panel_names == ("series 1", "series 2", "series 3", "series 4")
    grids = {c.x.tobytes() for scene in comparison.series for c in scene.curves}
    assert len(grids) == 1
    # The Co panel is Co's own radial scene on the shared grid.
    co = comparison.series[3]
    alone = radial_scene(Source("Co", "slater"), _state().radial, "bohr", "3d")
    total = next(c for c in co.curves if c.subshell is None)
    alone_total = next(c for c in alone.curves if c.subshell is None)
    assert np.interp(1.0, total.x, total.y) == pytest.approx(
        np.interp(1.0, alone_total.x, alone_total.y), rel=2e-3)


def test_an_overlay_holds_every_series_curves_tagged_by_series():
    state = _state(FOUR.__class__(**{**FOUR.__dict__, "overlay": True}))
    comparison = compare_radial(state)
    overlay = comparison.overlay
    assert overlay is not None and comparison.panels == (overlay,)
    assert overlay.series_names == ("Fe, Slater", "Fe, Clementi–Raimondi", "Fe, hydrogenic",
                                    "Co, Slater")
    assert sorted({c.series for c in overlay.curves}) == [0, 1, 2, 3]
    assert len(overlay.curves) == sum(len(s.curves) for s in comparison.series)
    assert len({c.label for c in overlay.curves}) == len(overlay.curves)  # labels stay unique


def test_two_series_keep_the_difference_and_more_drop_it():
    two = _state(CompareSettings(True, Source("Fe", "clementi")))
    assert compare_radial(two).difference is not None
    assert compare_slices(two).difference is not None
    assert compare_slices(_state()).difference is None


def test_slice_series_share_one_colour_scale():
    comparison = compare_slices(_state())
    ranges = {scene.colour_range for scene in comparison.series}
    assert len(ranges) == 1
    low, high = ranges.pop()
    state = _state()
    own = [slice_scene(source, state.orbital, state.slice).colour_range[1] for source in state.series()]
    assert high == pytest.approx(max(own)) and low == -high  # the widest of the series' own scales


def test_series_names_use_the_model_alone_for_one_atom():
    assert series_names([Source("Ne", "slater"), Source("Ne", "hartree-fock")]) == ("Slater", "HF")


def test_a_hidden_setting_of_the_comparison_does_not_recompute_the_slice():
    state = _state()
    overlaid = state.with_changes(compare=CompareSettings(**{**FOUR.__dict__, "overlay": True}))
    assert view_inputs(state, "slice") == view_inputs(overlaid, "slice")
    assert view_inputs(state, "radial") != view_inputs(overlaid, "radial")

"""The exported figure draws with the window's colour map, and the stops are the published maps."""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pytest
from matplotlib import colormaps
from matplotlib.colors import to_hex, to_rgb

from zeffir.export._figures import _draw
from zeffir.export._view import view_target
from zeffir.scene import DIVERGING_MAPS, SEQUENTIAL_MAPS, colour_stops
from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    SliceSettings,
    Source,
    ViewState,
)

SMALL = SliceSettings(plane="xz", extent=3.0, resolution=32, contours=0, fit_extent=False)
# Matplotlib's own names of our maps (ours are oriented with the warm end positive).
_MATPLOTLIB = {"RdBu": "RdBu_r", "PuOr": "PuOr_r", "BrBG": "BrBG_r", "coolwarm": "coolwarm"}


def _image_maps(state: ViewState) -> list:
    figure = _draw(view_target(state.validated()), 7.0)
    return [image.get_cmap() for ax in figure.axes for image in ax.get_images()]


def _ends(cmap) -> tuple[str, str]:
    return to_hex(cmap(0.0)), to_hex(cmap(1.0))


@pytest.mark.parametrize("name", list(SEQUENTIAL_MAPS))
def test_a_density_figure_uses_the_chosen_sequential_map(name):
    state = ViewState(left=Source("Ne", "slater"), view="slice",
                      slice=replace(SMALL, quantity="density", colour=ColourSettings(sequential_map=name)))
    (cmap,) = _image_maps(state)
    colours = colour_stops(False, name)[1]
    assert _ends(cmap) == (colours[0], colours[-1])


def test_a_comparison_figure_draws_psi_and_its_difference_with_the_chosen_diverging_map():
    colour = ColourSettings(diverging_map="PuOr")
    state = ViewState(left=Source("Ne", "slater"), orbital=OrbitalChoice("2p"), view="slice",
                      slice=replace(SMALL, quantity="psi", colour=colour),
                      compare=CompareSettings(True, Source("Ne", "hydrogenic"), True))
    maps = _image_maps(state)
    assert len(maps) == 3
    purple, orange = DIVERGING_MAPS["PuOr"][0], DIVERGING_MAPS["PuOr"][-1]
    assert all(_ends(cmap) == (purple, orange) for cmap in maps)  # negative purple, positive orange


def test_a_density_comparison_draws_its_difference_with_the_diverging_map():
    colour = ColourSettings(sequential_map="inferno", diverging_map="BrBG")
    state = ViewState(left=Source("Ne", "slater"), view="slice",
                      slice=replace(SMALL, quantity="density", colour=colour),
                      compare=CompareSettings(True, Source("Ne", "hydrogenic"), True))
    ends = [_ends(cmap) for cmap in _image_maps(state)]
    inferno = (SEQUENTIAL_MAPS["inferno"][0], SEQUENTIAL_MAPS["inferno"][-1])
    assert ends == [inferno, inferno, (DIVERGING_MAPS["BrBG"][0], DIVERGING_MAPS["BrBG"][-1])]


def test_the_pair_figure_draws_every_panel_with_the_pair_views_map():
    pair = PairSettings(reference=(0.0, 0.0, 0.5), colour=ColourSettings(sequential_map="cividis"))
    state = ViewState(left=Source("Ne", "slater"), view="pair", slice=SMALL, pair=pair)
    cividis = (SEQUENTIAL_MAPS["cividis"][0], SEQUENTIAL_MAPS["cividis"][-1])
    assert [_ends(cmap) for cmap in _image_maps(state)] == [cividis] * 3


@pytest.mark.parametrize("name", [*SEQUENTIAL_MAPS, *DIVERGING_MAPS])
def test_the_stops_reproduce_the_published_map(name):
    """Interpolating our stops gives matplotlib's table within 4/255 per channel (6/255 for cividis)."""
    signed = name in DIVERGING_MAPS
    positions, colours = colour_stops(signed, name)
    reference = colormaps[_MATPLOTLIB.get(name, name)]
    x = np.linspace(0.0, 1.0, reference.N)
    table = reference(x)[:, :3]
    rgb = np.array([to_rgb(c) for c in colours])
    ours = np.stack([np.interp(x, positions, rgb[:, k]) for k in range(3)], axis=1)
    tolerance = (6.0 if name == "cividis" else 4.0) / 255.0
    assert np.max(np.abs(ours - table)) < tolerance
    assert to_hex(table[0]) == colours[0] and to_hex(table[-1]) == colours[-1]

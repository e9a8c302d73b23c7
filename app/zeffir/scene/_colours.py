"""Colour maps shared by the window and the exported figures.

All are standard, openly published scientific maps, kept here as sampled stops so that
the screen and the exported figure draw with the very same colours and neither imports
matplotlib (the numbers were read once from matplotlib's tables by
``tools/colour_stops.py``):

- sequential, for densities (perceptually uniform): viridis, magma, inferno and plasma
  (van der Walt & Smith 2015) and cividis (Nuñez, Anderton & Renslow 2018), each sampled
  at 33 evenly spaced entries of its 256-entry table; linear interpolation between the
  stops stays within 4/255 of the table in every channel (6/255 for cividis, whose
  table is itself slightly irregular; ``tests/export/test_colour_maps.py`` checks it).
- diverging, for signed quantities: ColorBrewer 2.0's 11-class RdBu, PuOr and BrBG
  (exact: the schemes are defined by these 11 colours), and Moreland's "coolwarm"
  (his 33 control points). All are oriented with the warm end positive, so RdBu is
  Brewer's scheme reversed (red positive), as the window has always shown it.

The line colours of the radial curves are kept here too.

References
----------
S. van der Walt and N. Smith, "A better default colormap for matplotlib", SciPy 2015
(viridis, magma, inferno, plasma); J. R. Nuñez, C. R. Anderton and R. S. Renslow,
"Optimizing colormaps with consideration for color vision deficiency to enable accurate
interpretation of scientific data", PLoS ONE 13, e0199239 (2018) (cividis);
C. A. Brewer, ColorBrewer 2.0 (colorbrewer2.org), schemes RdBu, PuOr, BrBG;
K. Moreland, "Diverging color maps for scientific visualization", Advances in Visual
Computing, LNCS 5876, 92–103 (2009) (coolwarm).
"""

from __future__ import annotations

from typing import Final

from zeffir.state import DEFAULT_DIVERGING_MAP, DEFAULT_SEQUENTIAL_MAP

__all__ = [
    "DIVERGING",
    "DIVERGING_MAPS",
    "LINE_COLOURS",
    "MAP_TITLES",
    "SEQUENTIAL",
    "SEQUENTIAL_MAPS",
    "colour_stops",
    "sign_colours",
    "subshell_colour",
]

#: Sequential maps, from the low end (dark) to the high end (light).
SEQUENTIAL_MAPS: Final[dict[str, tuple[str, ...]]] = {
    "viridis": (
        "#440154", "#470d60", "#48186a", "#482374", "#472d7b", "#453781", "#424086", "#3e4989",
        "#3b528b", "#375b8d", "#33638d", "#2f6b8e", "#2c728e", "#297a8e", "#26828e", "#23898e",
        "#21918c", "#1f978b", "#1f9f88", "#21a685", "#27ad81", "#31b57b", "#3dbc74", "#4cc26c",
        "#5cc863", "#6ece58", "#81d34d", "#95d840", "#aadc32", "#c0df25", "#d5e21a", "#eae51a",
        "#fde725",
    ),
    "cividis": (
        "#00224e", "#00285b", "#002e6a", "#053371", "#1a386f", "#273e6e", "#32436d", "#3b496c",
        "#434e6c", "#4b546c", "#535a6d", "#5a5f6e", "#61656f", "#686a71", "#6f7073", "#767676",
        "#7d7c78", "#838179", "#8b8778", "#928d78", "#9a9376", "#a29975", "#aaa073", "#b3a670",
        "#bbad6d", "#c3b369", "#ccba64", "#d4c15f", "#ddc858", "#e6d051", "#efd748", "#f8df3c",
        "#fee838",
    ),
    "magma": (
        "#000004", "#030312", "#0a0822", "#130d34", "#1d1147", "#29115a", "#36106b", "#440f76",
        "#51127c", "#5d177f", "#6a1c81", "#762181", "#832681", "#902a81", "#9c2e7f", "#aa337d",
        "#b73779", "#c23b75", "#cf4070", "#db476a", "#e55064", "#ee5b5e", "#f4695c", "#f9785d",
        "#fb8761", "#fd9668", "#fea571", "#feb47b", "#fec287", "#fed194", "#fde0a1", "#fceeb0",
        "#fcfdbf",
    ),
    "inferno": (
        "#000004", "#040312", "#0b0724", "#150b37", "#210c4a", "#2f0a5b", "#3d0965", "#4a0c6b",
        "#57106e", "#64156e", "#71196e", "#7d1e6d", "#8a226a", "#972766", "#a32c61", "#b0315b",
        "#bc3754", "#c63d4d", "#d04545", "#da4e3c", "#e35933", "#eb6429", "#f1711f", "#f67e14",
        "#f98c0a", "#fb9b06", "#fcaa0f", "#fbba1f", "#f9c932", "#f5d949", "#f2e865", "#f3f586",
        "#fcffa4",
    ),
    "plasma": (
        "#0d0887", "#220690", "#310597", "#3f049c", "#4c02a1", "#5901a5", "#6600a7", "#7201a8",
        "#7e03a8", "#8a09a5", "#9511a1", "#a01a9c", "#aa2395", "#b32c8e", "#bc3587", "#c43e7f",
        "#cc4778", "#d24f71", "#d9586a", "#df6263", "#e56b5d", "#eb7556", "#f07f4f", "#f48948",
        "#f89441", "#fb9f3a", "#fdab33", "#feb72d", "#fdc328", "#fcd025", "#f9dd25", "#f5eb27",
        "#f0f921",
    ),
}

#: Diverging maps, from the most negative value to the most positive one.
DIVERGING_MAPS: Final[dict[str, tuple[str, ...]]] = {
    "RdBu": (
        "#053061", "#2166ac", "#4393c3", "#92c5de", "#d1e5f0", "#f7f7f7", "#fddbc7", "#f4a582",
        "#d6604d", "#b2182b", "#67001f",
    ),
    "PuOr": (
        "#2d004b", "#542788", "#8073ac", "#b2abd2", "#d8daeb", "#f7f7f7", "#fee0b6", "#fdb863",
        "#e08214", "#b35806", "#7f3b08",
    ),
    "BrBG": (
        "#003c30", "#01665e", "#35978f", "#80cdc1", "#c7eae5", "#f5f5f5", "#f6e8c3", "#dfc27d",
        "#bf812d", "#8c510a", "#543005",
    ),
    "coolwarm": (
        "#3b4cc0", "#445acc", "#4d68d7", "#5775e1", "#6282ea", "#6c8ef1", "#779af7", "#82a5fb",
        "#8db0fe", "#98b9ff", "#a3c2ff", "#aec9fd", "#b8d0f9", "#c2d5f4", "#ccd9ee", "#d5dbe6",
        "#dddddd", "#e5d8d1", "#ecd3c5", "#f1ccb9", "#f5c4ad", "#f7bba0", "#f7b194", "#f7a687",
        "#f49a7b", "#f18d6f", "#ec7f63", "#e57058", "#de604d", "#d55042", "#cb3e38", "#c0282f",
        "#b40426",
    ),
}

#: The default maps: RdBu (red positive) for signed quantities, viridis for densities.
DIVERGING: Final[tuple[str, ...]] = DIVERGING_MAPS[DEFAULT_DIVERGING_MAP]
SEQUENTIAL: Final[tuple[str, ...]] = SEQUENTIAL_MAPS[DEFAULT_SEQUENTIAL_MAP]

#: What the choosers show for each map.
MAP_TITLES: Final[dict[str, str]] = {
    "viridis": "viridis (blue–green–yellow)",
    "cividis": "cividis (blue–yellow, for colour-vision deficiency)",
    "magma": "magma (black–purple–cream)",
    "inferno": "inferno (black–red–yellow)",
    "plasma": "plasma (blue–purple–yellow)",
    "RdBu": "RdBu (red positive, blue negative)",
    "PuOr": "PuOr (orange positive, purple negative)",
    "BrBG": "BrBG (brown positive, blue-green negative)",
    "coolwarm": "coolwarm (red positive, blue negative)",
}

_SIGN_COLOURS: Final[dict[str, tuple[str, str]]] = {
    "RdBu": ("red", "blue"), "PuOr": ("orange", "purple"), "BrBG": ("brown", "blue-green"),
    "coolwarm": ("red", "blue"),
}


def sign_colours(name: str) -> tuple[str, str]:
    """Words for the positive and the negative end of a diverging map: ``("red", "blue")``."""
    return _SIGN_COLOURS.get(name, _SIGN_COLOURS[DEFAULT_DIVERGING_MAP])


def colour_stops(signed: bool, name: str | None = None) -> tuple[tuple[float, ...], tuple[str, ...]]:
    """Positions in [0, 1] and hex colours of a map.

    Parameters
    ----------
    signed : bool
        True for a diverging map (signed data), False for a sequential one.
    name : str, optional
        A key of :data:`DIVERGING_MAPS` (signed) or :data:`SEQUENTIAL_MAPS`; the default
        map (RdBu or viridis) when omitted or when the name does not suit ``signed``.

    Examples
    --------
    >>> positions, colours = colour_stops(False, "magma")
    >>> positions[0], positions[-1], colours[0], colours[-1]
    (0.0, 1.0, '#000004', '#fcfdbf')
    """
    maps = DIVERGING_MAPS if signed else SEQUENTIAL_MAPS
    colours = maps.get(name or "", DIVERGING if signed else SEQUENTIAL)
    n = len(colours) - 1
    return tuple(i / n for i in range(n + 1)), colours


#: Paul Tol's colour-blind-safe "muted" qualitative scheme (its nine line colours, the pale
#: grey left out) for subshell curves; the total is black. Nine colours keep every
#: subshell of an atom up to krypton apart by colour alone (1s to 5s in filling order);
#: beyond, the dash style separates them. P. Tol, "Colour Schemes", SRON technical
#: note SRON/EPS/TN/09-002 (2021), Fig. 5.
LINE_COLOURS: Final[tuple[str, ...]] = (
    "#332288", "#CC6677", "#117733", "#882255", "#44AA99", "#999933", "#AA4499", "#88CCEE",
    "#DDCC77",
)

_L_LETTERS: Final = "spdfghik"
#: Subshells in filling order (n + l, then n): a subshell keeps its colour in every atom,
#: on screen and in the figure.
_FILLING_ORDER: Final[tuple[tuple[int, int], ...]] = tuple(
    sorted(((n, l) for n in range(1, 9) for l in range(n)), key=lambda nl: (nl[0] + nl[1], nl[0]))
)


def subshell_colour(subshell: str | None, fallback: int = 0) -> tuple[str, int]:
    """Colour of a subshell's curve and its dash index (0 solid, 1 dashed, 2 dash-dot).

    The total (``None``) is black and solid. Beyond the palette's nine colours the
    colours repeat with the next dash style, so up to 27 subshells stay distinct.
    Both the window and the exported figures use this rule.
    """
    if subshell is None:
        return "#000000", 0
    index = fallback
    text = subshell.strip()
    digits = "".join(ch for ch in text if ch.isdigit())
    letter = text[len(digits):len(digits) + 1]
    if digits and letter and letter in _L_LETTERS:
        nl = (int(digits), _L_LETTERS.index(letter))
        if nl in _FILLING_ORDER:
            index = _FILLING_ORDER.index(nl)
    return LINE_COLOURS[index % len(LINE_COLOURS)], (index // len(LINE_COLOURS)) % 3

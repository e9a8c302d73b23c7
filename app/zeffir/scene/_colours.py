"""Colour maps shared by the window and the exported figures.

Both are standard scientific maps: ColorBrewer's 11-class RdBu (diverging, for
signed quantities, reversed so that positive is red) and viridis (perceptually
uniform, for densities). The control colours are kept here so the screen and
the exported figure use the very same map.

References
----------
C. A. Brewer, ColorBrewer 2.0 (colorbrewer2.org), scheme RdBu;
S. van der Walt and N. Smith, the viridis colour map (2015).
"""

from __future__ import annotations

from typing import Final

__all__ = ["DIVERGING", "SEQUENTIAL", "colour_stops"]

#: ColorBrewer RdBu, 11 classes, from negative (blue) to positive (red).
DIVERGING: Final[tuple[str, ...]] = (
    "#053061", "#2166ac", "#4393c3", "#92c5de", "#d1e5f0", "#f7f7f7",
    "#fddbc7", "#f4a582", "#d6604d", "#b2182b", "#67001f",
)

#: viridis sampled at 11 points (from its published table).
SEQUENTIAL: Final[tuple[str, ...]] = (
    "#440154", "#482475", "#414487", "#355f8d", "#2a788e", "#21918c",
    "#22a884", "#44bf70", "#7ad151", "#bddf26", "#fde725",
)


def colour_stops(signed: bool) -> tuple[tuple[float, ...], tuple[str, ...]]:
    """Positions in [0, 1] and hex colours of the map for signed or non-negative data."""
    colours = DIVERGING if signed else SEQUENTIAL
    n = len(colours) - 1
    return tuple(i / n for i in range(n + 1)), colours

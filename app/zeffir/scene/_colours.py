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

__all__ = ["DIVERGING", "LINE_COLOURS", "SEQUENTIAL", "colour_stops", "subshell_colour"]

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

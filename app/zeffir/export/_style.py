"""The publication style of exported figures: journal column widths, fonts, lines, colours.

Kept as plain data so that nothing here imports matplotlib; the figure module
applies it inside :func:`matplotlib.rc_context` and never touches the global
defaults of a running application.
"""

from __future__ import annotations

from typing import Any, Final

from zeffir.scene import LINE_COLOURS, subshell_colour

__all__ = [
    "COLUMN_WIDTHS",
    "FONT_FAMILY",
    "LABEL_SIZE",
    "LINE_COLOURS",
    "LINE_STYLES",
    "LINE_WIDTH",
    "TICK_SIZE",
    "rc_parameters",
    "subshell_line_style",
]

#: Figure widths in inches: one journal column (85 mm) and the full page width (178 mm).
COLUMN_WIDTHS: Final[dict[str, float]] = {"single": 3.35, "double": 7.0}

#: Font sizes in points: axis labels, and tick labels / legends / panel titles.
LABEL_SIZE: Final[float] = 8.0
TICK_SIZE: Final[float] = 7.0

#: Line width of curves, in points (the atom's total and the emphasised subshell are drawn thicker).
LINE_WIDTH: Final[float] = 0.8

#: DejaVu Sans ships with matplotlib and covers the labels' superscripts (⁻³ᐟ²) and Greek;
#: STIXGeneral (also shipped) fills the few symbols it lacks, such as ⟂.
FONT_FAMILY: Final[tuple[str, ...]] = ("DejaVu Sans", "STIXGeneral")

#: Subshell curves take zeffir.scene.LINE_COLOURS (Paul Tol's colour-blind-safe "muted"
#: scheme, SRON/EPS/TN/09-002, 2021): the same colours in the same order as the window.

#: Cycled after the colours, so that more subshells than colours stay distinct.
LINE_STYLES: Final[tuple[str, ...]] = ("-", "--", "-.")

def subshell_line_style(subshell: str | None, fallback: int = 0) -> tuple[str, str]:
    """Colour and matplotlib line style of a subshell's curve (rule in :func:`subshell_colour`)."""
    colour, dash = subshell_colour(subshell, fallback)
    return colour, LINE_STYLES[dash]


def rc_parameters() -> dict[str, Any]:
    """matplotlib settings of the publication style (applied with ``rc_context``)."""
    return {
        "font.family": list(FONT_FAMILY),
        "font.size": LABEL_SIZE,
        "axes.labelsize": LABEL_SIZE,
        "axes.titlesize": TICK_SIZE,
        "axes.linewidth": 0.6,
        "axes.labelpad": 2.5,
        "axes.unicode_minus": True,
        "mathtext.fontset": "dejavusans",
        "xtick.labelsize": TICK_SIZE,
        "ytick.labelsize": TICK_SIZE,
        "xtick.major.width": 0.6,
        "ytick.major.width": 0.6,
        "xtick.minor.width": 0.4,
        "ytick.minor.width": 0.4,
        "xtick.major.size": 3.0,
        "ytick.major.size": 3.0,
        "xtick.minor.size": 1.6,
        "ytick.minor.size": 1.6,
        "xtick.major.pad": 2.5,
        "ytick.major.pad": 2.5,
        "legend.fontsize": TICK_SIZE,
        "legend.frameon": False,
        "legend.handlelength": 1.8,
        "legend.handletextpad": 0.5,
        "legend.labelspacing": 0.25,
        "legend.borderaxespad": 0.4,
        "legend.columnspacing": 1.0,
        "lines.linewidth": LINE_WIDTH,
        "lines.solid_capstyle": "butt",
        "contour.linewidth": 0.4,
        "contour.negative_linestyle": "dashed",
        "image.interpolation": "nearest",
        "savefig.facecolor": "white",
        "figure.facecolor": "white",
        "figure.constrained_layout.h_pad": 0.03,
        "figure.constrained_layout.w_pad": 0.03,
        "figure.constrained_layout.hspace": 0.02,
        "figure.constrained_layout.wspace": 0.02,
        # TrueType (not Type 3) fonts in PDF: editable text, as journals ask for.
        "pdf.fonttype": 42,
        # Text stays text in SVG (<text> elements naming the font), so it can be edited,
        # searched and restyled; a viewer without DejaVu Sans falls back to its sans-serif.
        "svg.fonttype": "none",
        # A fixed salt for the ids matplotlib derives from hashes: the same view exports
        # to the same bytes (with no date in the metadata, see _figures._metadata).
        "svg.hashsalt": "zeffir",
    }

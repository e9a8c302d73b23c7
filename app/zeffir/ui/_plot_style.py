"""Shared look of the plot views: palette, pens, axis styling, tooltips and number text.

The look is meant for reading numbers and for figures: white ground, dark axes
framing the plot on four sides, a faint grid, and line colours from Paul Tol's
"muted" scheme, which stays distinguishable under the common forms of colour
blindness. Colour maps for slices come from :func:`zeffir.scene.colour_stops` only.

Importing this module sets pyqtgraph's ``imageAxisOrder`` to ``"row-major"``:
scene arrays are ``values[j, i]`` with ``j`` along the vertical axis.

References
----------
P. Tol, "Colour Schemes", SRON technical note SRON/EPS/TN/09-002 (2021).
"""

from __future__ import annotations

import math
from typing import Final

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtGui import QColor, QFont, QPen

from zeffir.scene import LINE_COLOURS, QUANTITIES, colour_stops, subshell_colour

__all__ = [
    "AXIS_COLOUR",
    "CROSSHAIR_COLOUR",
    "HIGHLIGHT_WIDTH",
    "MUTED_TEXT",
    "PALETTE",
    "SUBSHELL_WIDTH",
    "TOTAL_COLOUR",
    "TOTAL_WIDTH",
    "GridAxis",
    "colour_map",
    "format_number",
    "framed_axes",
    "label_style",
    "make_pen",
    "quantity_tooltip",
    "split_label",
    "style_plot",
    "subshell_style",
    "tick_font",
]

pg.setConfigOptions(imageAxisOrder="row-major")

#: Subshell curve colours (Tol's "muted" scheme, see zeffir.scene.LINE_COLOURS).
PALETTE: Final[tuple[str, ...]] = LINE_COLOURS
TOTAL_COLOUR: Final = "#000000"
AXIS_COLOUR: Final = "#262626"
MUTED_TEXT: Final = "#5a5a5a"
CROSSHAIR_COLOUR: Final = "#7f7f7f"

#: Pen widths in screen pixels.
SUBSHELL_WIDTH: Final = 1.6
HIGHLIGHT_WIDTH: Final = 3.4
TOTAL_WIDTH: Final = 2.6

#: Beyond the palette's nine colours, curves repeat them with these dash styles.
_DASHES: Final = (Qt.PenStyle.SolidLine, Qt.PenStyle.DashLine, Qt.PenStyle.DashDotLine)
#: Line styles of the series sharing one set of axes, in order (as in exported figures).
SERIES_DASHES: Final = (Qt.PenStyle.SolidLine, Qt.PenStyle.DashLine, Qt.PenStyle.DotLine,
                        Qt.PenStyle.DashDotLine, Qt.PenStyle.DashDotDotLine, Qt.PenStyle.CustomDashLine)


def series_pen_style(series: int) -> Qt.PenStyle:
    """Line style of the ``series``-th series on shared axes (the colour names the subshell)."""
    return SERIES_DASHES[series % (len(SERIES_DASHES) - 1)]

def subshell_style(subshell: str | None, fallback: int = 0) -> tuple[str, Qt.PenStyle]:
    """Colour and dash style of a subshell's curve (rule in :func:`zeffir.scene.subshell_colour`)."""
    colour, dash = subshell_colour(subshell, fallback)
    return colour, _DASHES[dash]


def make_pen(colour: str, width: float, style: Qt.PenStyle = Qt.PenStyle.SolidLine) -> QPen:
    """A cosmetic pen (width in screen pixels) with round caps."""
    pen = pg.mkPen(colour, width=width, style=style)
    pen.setCosmetic(True)
    pen.setCapStyle(Qt.PenCapStyle.RoundCap)
    pen.setJoinStyle(Qt.PenJoinStyle.RoundJoin)
    return pen


def tick_font(points: float = 9.0) -> QFont:
    """The font of tick labels."""
    font = QFont()  # the application's font: it follows the platform
    font.setPointSizeF(points)
    return font


#: The plots' ground, over which grid colours are mixed in advance.
_GROUND: Final = (255, 255, 255)


class GridAxis(pg.AxisItem):
    """An axis whose grid lines are drawn in opaque colours that look translucent.

    pyqtgraph draws grid lines in the tick colour with a small alpha. Qt's raster
    engine blends translucent lines pixel by pixel, about fifteen times slower than
    opaque ones (40 plot-high lines: 23 ms against 1.4 ms, measured here), which made
    the grid the most expensive part of a redrawn plot. The grid lies under every
    curve, on the white ground, so the colour that alpha blending would produce there
    is computed once and drawn opaque: the picture is the same.
    """

    def __init__(self, *args: object, **kwargs: object) -> None:
        super().__init__(*args, **kwargs)
        self._opaque: dict[tuple[int, int, int, int, float], QPen] = {}

    def generateDrawSpecs(self, p: object) -> object:
        specs = super().generateDrawSpecs(p)
        if specs is None or self.grid is False:
            return specs
        axis_spec, tick_specs, text_specs = specs
        return axis_spec, [(self._opaque_pen(pen), start, stop)
                           for pen, start, stop in tick_specs], text_specs

    def _opaque_pen(self, pen: QPen) -> QPen:
        colour = pen.color()
        alpha = colour.alpha()
        if alpha == 255 or pen.brush().style() != Qt.BrushStyle.SolidPattern:
            return pen
        key = (colour.red(), colour.green(), colour.blue(), alpha, pen.widthF())
        opaque = self._opaque.get(key)
        if opaque is None:
            weight = alpha / 255.0
            mixed = [round(weight * c + (1.0 - weight) * g)
                     for c, g in zip(key[:3], _GROUND, strict=True)]
            opaque = QPen(pen)
            opaque.setColor(QColor(*mixed))
            self._opaque[key] = opaque
        return opaque


def framed_axes(**special: pg.AxisItem) -> dict[str, pg.AxisItem]:
    """The four axes of a plot (``axisItems`` of a PlotWidget), grid-capable; ``special``
    replaces the axis of a side (e.g. ``bottom=`` a subclass of :class:`GridAxis`)."""
    return {side: special.get(side) or GridAxis(orientation=side)
            for side in ("left", "bottom", "top", "right")}


def style_plot(plot: pg.PlotItem, grid: bool = True) -> None:
    """Dark axes on all four sides (values on the left and bottom only) and a faint grid."""
    for side in ("left", "bottom", "top", "right"):
        plot.showAxis(side)
        axis = plot.getAxis(side)
        axis.setPen(make_pen(AXIS_COLOUR, 1.0))
        axis.setTextPen(AXIS_COLOUR)
        # Inward ticks, one level of minor ticks (the second level only crowds the grid),
        # and the end labels (often "0") kept even where they reach past the axis.
        # Minor ticks are labelled only where they leave room (not the crowded minor
        # labels of a log axis).
        axis.setStyle(tickFont=tick_font(), tickLength=-6, tickTextOffset=4, maxTickLevel=1,
                      hideOverlappingLabels=12,
                      textFillLimits=[(0, 0.8), (2, 0.25), (4, 0.15), (6, 0.1)])
        axis.enableAutoSIPrefix(False)  # never rescale values behind a "(x0.001)" note
        if side in ("top", "right"):
            axis.setStyle(showValues=False)
            if side == "top":
                axis.setHeight(4)
            else:
                axis.setWidth(4)
    if grid:
        # The left and bottom axes draw the grid (the top and right ones would only
        # draw the same lines again); the top and right are plain frame lines.
        plot.getAxis("left").setGrid(int(0.13 * 255))
        plot.getAxis("bottom").setGrid(int(0.13 * 255))
        for side in ("top", "right"):
            # Frame lines only: no ticks to place (fixed empty ticks skip the tick search).
            plot.getAxis(side).setStyle(tickLength=0)
            plot.getAxis(side).setTicks([[], []])
        # The axes draw the grid; put them behind the view box so the grid runs under
        # the curves and the legend instead of over them.
        for side in ("left", "bottom", "top", "right"):
            plot.getAxis(side).setZValue(-200)
    # The plot's own options menu (FFT, log axes, averaging...) would change the
    # drawing behind the state's back; the view box menu (view all, export) stays.
    plot.setMenuEnabled(enableMenu=False, enableViewBoxMenu=True)
    plot.hideButtons()


def label_style(points: float = 10.0) -> dict[str, str]:
    """Keyword style for ``PlotItem.setLabel`` / ``AxisItem.setLabel``."""
    return {"color": AXIS_COLOUR, "font-size": f"{points:g}pt"}


def colour_map(signed: bool, name: str | None = None) -> pg.ColorMap:
    """The pyqtgraph colour map ``name`` (default RdBu for signed data, viridis otherwise).

    The stops are :func:`zeffir.scene.colour_stops`, which the exported figures use too.
    """
    positions, colours = colour_stops(signed, name)
    return pg.ColorMap(np.asarray(positions), [pg.mkColor(c) for c in colours], name=name or "")


def split_label(label: str) -> tuple[str, str]:
    """``"D(r) / bohr⁻¹, per electron"`` → ``("D(r)", "bohr⁻¹")``; no unit gives ``(label, "")``."""
    head, sep, unit = label.partition(" / ")
    if not sep:
        return label.strip(), ""
    return head.strip(), unit.split(",")[0].strip()


def quantity_tooltip(key: str, label: str) -> str:
    """Tooltip defining a quantity: its name, formula and the units on screen.

    Parameters
    ----------
    key : str
        A key of :data:`zeffir.scene.QUANTITIES` (``"D"``, ``"psi"``...).
    label : str
        The axis or colour bar label, ``"symbol / unit"``.
    """
    quantity = QUANTITIES.get(key)
    _, unit = split_label(label.removeprefix("log₁₀ "))
    lines = []
    if quantity is not None:
        lines += [f"{quantity.symbol}: {quantity.name}", quantity.formula]
    else:
        lines.append(label)
    if label.startswith("log₁₀ "):
        lines.append("Colours show log₁₀ of the value.")
    if unit:
        lines.append(f"Units: {unit}")
    return "\n".join(lines)


def format_number(value: float, digits: int = 4) -> str:
    """``value`` with ``digits`` significant digits and a true minus sign."""
    if not math.isfinite(value):
        return "–"
    return f"{value:.{digits}g}".replace("-", "−")

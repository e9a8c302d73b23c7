"""The radial view: draws a :class:`~zeffir.scene.RadialScene` and reads values under the pointer."""

from __future__ import annotations

import html
import math
import weakref
from typing import Final

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QEvent, QObject, QPointF, QRectF, Qt, Signal, Slot
from PySide6.QtWidgets import QSizePolicy, QWidget

from zeffir.scene import RadialScene, model_title
from zeffir.ui._plot_style import (
    AXIS_COLOUR,
    CROSSHAIR_COLOUR,
    HIGHLIGHT_WIDTH,
    MUTED_TEXT,
    SUBSHELL_WIDTH,
    TOTAL_WIDTH,
    GridAxis,
    format_number,
    framed_axes,
    label_style,
    make_pen,
    quantity_tooltip,
    series_pen_style,
    split_label,
    style_plot,
    subshell_style,
)
from zeffir.ui._polyline import drawn_subset
from zeffir.ui._view_frame import ViewFrame, fitted_line

__all__ = ["RadialView"]

DEFAULT_EMPTY_MESSAGE: Final = "Nothing to show yet: type an atom or a configuration."

#: Short legend text (rich text) and full definition of each marker kind.
MARKER_TEXT: Final[dict[str, tuple[str, str]]] = {
    "r_max": ("r<sub>max</sub>", "r_max: maximum of the radial distribution"),
    "mean": ("⟨r⟩", "⟨r⟩: mean radius"),
    "node": ("node", "node: R(r) = 0"),
}
_MARKER_SYMBOL: Final = {"r_max": "r_max", "mean": "⟨r⟩", "node": "node"}
_MARKER_DASH: Final = {"r_max": Qt.PenStyle.DashLine, "mean": Qt.PenStyle.DotLine}
_MARKER_WIDTH: Final = 1.5
_NODE_SIZE: Final = 9
_LEGEND_SAMPLE_COLOUR: Final = "#404040"
#: Grid on which the legend's placement measures how much of the curves it would hide.
_COVER_COLUMNS: Final = 48
_COVER_ROWS: Final = 32
#: Largest log10(r) the pointer is converted from (keeps 10**x finite when zoomed far out).
_LOG_LIMIT: Final = 300.0


class _RadiusAxis(GridAxis):
    """The r axis. On a log scale only decades are labelled (1, 2, 5 within each decade
    when under two decades show); pyqtgraph would otherwise label every minor tick."""

    def logTickStrings(self, values: list[float], scale: float, spacing: float) -> list[str]:  # override
        low, high = self.range
        keep = (1,) if high - low > 2.0 else (1, 2, 5)
        strings = []
        for value in values:
            r = 10.0 ** float(value) * scale
            mantissa = r / 10.0 ** math.floor(math.log10(r) + 1e-9)
            named = any(abs(mantissa - k) < 1e-6 * k for k in keep)
            strings.append(f"{r:g}" if named else "")
        return strings


class RadialView(QWidget):
    """Radial curves (R, P, D or Q) of one scene, with r_max, ⟨r⟩ and node markers.

    The view draws whatever scene it is given and nothing else; it holds no
    physics state. Subshell curves take colour-blind-safe colours that stay the same
    for a subshell in every atom; the total is black and thicker; the
    highlighted subshell is drawn thickest. Moving the pointer shows a
    crosshair and, below the plot, r and every curve's value at that r.

    Signals
    -------
    cursor_moved(float)
        The pointer moved over the plot: r in the scene's length unit. NaN when
        the pointer leaves the plot. Only user movement emits it, not
        :meth:`show_cursor`, so two views can drive each other without echo.

    Examples
    --------
    Linked cursors between two views::

        left.cursor_moved.connect(right.show_cursor)
        right.cursor_moved.connect(left.show_cursor)
    """

    cursor_moved = Signal(float)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._scene: RadialScene | None = None
        # Drawn curves: label -> (item, colour, x, y) in data units (x > 0 on a log axis).
        self._curves: dict[str, tuple[pg.PlotDataItem, str, np.ndarray, np.ndarray]] = {}
        self._marker_items: list[pg.GraphicsObject] = []
        self._markers: list[tuple[str, str, float]] = []
        self._legend_samples: list[pg.GraphicsObject] = []
        # Linked views: (view, x linked, y linked).
        self._peers: list[tuple[weakref.ref[RadialView], bool, bool]] = []
        self._bounds: tuple[float, float, float, float] | None = None
        self._copying = False  # taking a linked view's range (see _copy_range)
        self._cursor_shown = False
        self._empty_message = DEFAULT_EMPTY_MESSAGE

        self._plot_widget = pg.PlotWidget(background="w",
                                          axisItems=framed_axes(bottom=_RadiusAxis(orientation="bottom")))
        self._plot_widget.setSizePolicy(QSizePolicy.Policy.Expanding, QSizePolicy.Policy.Expanding)
        self._plot: pg.PlotItem = self._plot_widget.getPlotItem()
        style_plot(self._plot)

        self._legend = pg.LegendItem(
            offset=None, labelTextColor=AXIS_COLOUR, labelTextSize="9pt",
            brush=pg.mkBrush(255, 255, 255, 225), pen=make_pen("#c8c8c8", 1.0),
            verSpacing=-4,
        )
        self._legend.setParentItem(self._plot.getViewBox())
        self._legend.setZValue(30)

        self._zero_line = pg.InfiniteLine(pos=0.0, angle=0, movable=False, pen=make_pen("#b0b0b0", 1.0))
        # Solid and grey, so the cursor is not mistaken for a (dashed, coloured) marker.
        self._v_line = pg.InfiniteLine(angle=90, movable=False, pen=make_pen(CROSSHAIR_COLOUR, 1.0))
        self._h_line = pg.InfiniteLine(angle=0, movable=False, pen=make_pen(CROSSHAIR_COLOUR, 1.0))
        self._dots = pg.ScatterPlotItem(size=8, pen=make_pen("#ffffff", 1.2))
        for z, item in ((-5, self._zero_line), (20, self._v_line), (20, self._h_line), (21, self._dots)):
            item.setZValue(z)
            item.hide()
            self._plot.addItem(item, ignoreBounds=True)

        self._frame = ViewFrame(self, self._plot_widget, wrap_readout=False)  # lines: _fit_readout
        self._readout = self._frame.readout

        self._plot_widget.scene().sigMouseMoved.connect(self._on_mouse_moved)
        self._plot.getViewBox().sigResized.connect(self._on_resized)
        # The curves draw a subset of their samples chosen for the current pixel scale.
        self._subset_scale: tuple[float, float] | None = None
        self._bounds_cache: tuple[tuple[int, int], tuple[float, float, float, float] | None] | None = None
        self._plot.getViewBox().sigRangeChanged.connect(self._draw_subsets)
        self._plot.getViewBox().sigResized.connect(self._draw_subsets)
        self._plot_widget.viewport().installEventFilter(self)
        self.setMinimumSize(200, 170)  # two rows of panels fit 720 px
        self._show_message()

    # -- drawing -------------------------------------------------------------------------

    def set_scene(self, scene: RadialScene | None) -> None:
        """Draw ``scene``; ``None`` clears the plot and shows the empty message.

        Parameters
        ----------
        scene : RadialScene or None
            Curves, markers, labels and the highlighted subshell to draw.

        Notes
        -----
        The range is refitted only when the extent of the data changes, so a
        zoom survives a change of highlight or of markers.
        """
        if scene is None:
            self._show_message()
            return
        if self._same_layout(scene):
            self._update_curves(scene)
            return
        self._clear_drawing()
        self._scene = scene
        self._frame.show_plot()
        self._plot.setLogMode(x=scene.log_r, y=False)
        self._shown_title: tuple[str, float] | None = None
        self._fit_title()
        self._plot.setLabel("bottom", html.escape(scene.x_label), **label_style())
        self._y_label_short: bool | None = None  # forces the label to be set
        self._fit_y_label()
        self._set_tooltips(scene)

        negative = False
        several = bool(scene.series_names)
        legend_subshells: set[str | None] = set()
        for index, curve in enumerate(scene.curves):
            x = np.asarray(curve.x, dtype=float)
            y = np.asarray(curve.y, dtype=float)
            if scene.log_r:  # a log axis cannot show r <= 0
                keep = x > 0
                x, y = x[keep], y[keep]
            colour, dash = subshell_style(curve.subshell, index)
            if curve.subshell is None:
                width, z = TOTAL_WIDTH, 2
            elif curve.subshell == scene.highlight:
                # Solid even past the palette's length: its width already sets it apart.
                width, z, dash = HIGHLIGHT_WIDTH, 3, Qt.PenStyle.SolidLine
            else:
                width, z = SUBSHELL_WIDTH, 1
            if several:  # several series on these axes: the line style names the series
                dash = series_pen_style(curve.series)
            item = pg.PlotDataItem(x, y, pen=make_pen(colour, width, dash), antialias=True)
            item.setZValue(z)
            self._plot.addItem(item)
            if not several:
                self._add_legend_row(item, html.escape(curve.label))
            elif curve.subshell not in legend_subshells:
                # One row per subshell (its colour) and, below, one per series (its style).
                legend_subshells.add(curve.subshell)
                sample = pg.PlotDataItem(pen=make_pen(colour, width))
                self._legend_samples.append(sample)
                self._add_legend_row(sample, html.escape(curve.subshell or "total"))
            self._curves[curve.label] = (item, colour, x, y)
            negative = negative or bool(y.size and np.nanmin(y) < 0)
        self._zero_line.setVisible(negative)
        for number, name in enumerate(scene.series_names):
            sample = pg.PlotDataItem(pen=make_pen(_LEGEND_SAMPLE_COLOUR, SUBSHELL_WIDTH,
                                                  series_pen_style(number)))
            self._legend_samples.append(sample)
            self._add_legend_row(sample, html.escape(name))
        self._draw_markers(scene)
        self._fit_legend_size()
        self._subset_scale = None
        self._bounds_cache = None
        self._fit_range()
        self._draw_subsets()
        self._place_legend()
        self._hide_cursor()

    @staticmethod
    def _layout_of(scene: RadialScene) -> tuple[object, ...]:
        """What decides the plot's items and legend rows (not the numbers they show)."""
        several = bool(scene.series_names)
        kinds = sorted({m.kind for m in scene.markers
                        if not (scene.log_r and m.x <= 0) and not (several and m.kind == "mean")})
        return (scene.log_r, scene.highlight, scene.series_names, tuple(kinds),
                tuple((c.label, c.subshell, c.series) for c in scene.curves))

    def _same_layout(self, scene: RadialScene) -> bool:
        """True when ``scene`` differs from the one drawn only in its numbers and texts."""
        return (self._scene is not None and len(self._curves) == len(scene.curves)
                and self._layout_of(self._scene) == self._layout_of(scene))

    def _update_curves(self, scene: RadialScene) -> None:
        """Redraw a scene of the same layout: new data on the same items, the legend kept.

        A model switch on the same atom keeps every curve and legend row, and rebuilding
        them costs more than the picture's frame budget; only the data, the markers,
        the titles and the range change.
        """
        self._scene = scene
        self._shown_title = None
        self._fit_title()
        self._plot.setLabel("bottom", html.escape(scene.x_label), **label_style())
        self._y_label_short = None
        self._fit_y_label()
        self._set_tooltips(scene)
        negative = False
        for curve in scene.curves:
            x = np.asarray(curve.x, dtype=float)
            y = np.asarray(curve.y, dtype=float)
            if scene.log_r:
                keep = x > 0
                x, y = x[keep], y[keep]
            item, colour, *_ = self._curves[curve.label]
            self._curves[curve.label] = (item, colour, x, y)
            negative = negative or bool(y.size and np.nanmin(y) < 0)
        self._zero_line.setVisible(negative)
        for marker in self._marker_items:
            self._plot.removeItem(marker)
        self._marker_items.clear()
        self._markers.clear()
        self._draw_markers(scene, legend=False)
        self._subset_scale = None  # new data: the drawn subsets are out of date
        self._bounds_cache = None
        self._fit_range()
        self._draw_subsets()
        self._place_legend()
        self._hide_cursor()

    def set_legend_visible(self, visible: bool) -> None:
        """Show or hide the legend (a grid of panels with equal curves needs it once)."""
        self._legend.setVisible(visible)

    def legend_visible(self) -> bool:
        """True when the legend is shown."""
        return self._legend.isVisible()

    def legend_columns(self) -> int:
        """Columns the legend's rows are set in (more than one in a short panel)."""
        return int(self._legend.columnCount)

    def legend_fits(self) -> bool:
        """True when the legend is no taller than the plot area."""
        return self._legend.boundingRect().height() <= self._plot.getViewBox().height() + 1.0

    def set_empty_message(self, text: str) -> None:
        """Clear the plot and show ``text`` instead.

        Parameters
        ----------
        text : str
            E.g. a start-up hint; later ``set_scene(None)`` shows it again.
        """
        self._empty_message = text
        self._show_message()

    def _show_message(self) -> None:
        self._clear_drawing()
        self._scene = None
        self._bounds = None
        self._frame.show_message(self._empty_message)

    def _clear_drawing(self) -> None:
        self._bounds_cache = None
        for item, *_ in self._curves.values():
            self._plot.removeItem(item)
        for marker in self._marker_items:
            self._plot.removeItem(marker)
        self._curves.clear()
        self._marker_items.clear()
        self._markers.clear()
        self._legend_samples.clear()
        self._legend.clear()
        self._zero_line.hide()
        self._hide_cursor()

    def _draw_markers(self, scene: RadialScene, legend: bool = True) -> None:
        unit = split_label(scene.x_label)[1]
        nodes: dict[str, list[tuple[float, str]]] = {}
        kinds: list[str] = []
        several = bool(scene.series_names)
        for marker in scene.markers:
            if scene.log_r and marker.x <= 0:
                continue
            if several and marker.kind == "mean":
                continue  # several series: r_max and nodes only, or the lines crowd the plot
            colour, _ = subshell_style(marker.subshell)
            definition = MARKER_TEXT.get(marker.kind, (marker.kind, marker.kind))[1]
            whose = f" ({scene.series_names[marker.series]})" if several else ""
            tip = (f"{marker.subshell}{whose} {_MARKER_SYMBOL.get(marker.kind, marker.kind)} at r = "
                   f"{format_number(marker.x)} {unit}\n{definition}")
            if marker.kind == "node":
                nodes.setdefault(colour, []).append((marker.x, tip))
            else:
                dash = (series_pen_style(marker.series) if several
                        else _MARKER_DASH.get(marker.kind, Qt.PenStyle.DashLine))
                line = pg.InfiniteLine(
                    pos=self._view_x(marker.x), angle=90, movable=False,
                    pen=make_pen(colour, _MARKER_WIDTH, dash),
                )
                line.setToolTip(tip)
                line.setZValue(5)
                self._plot.addItem(line, ignoreBounds=True)
                self._marker_items.append(line)
            self._markers.append((marker.subshell, marker.kind, float(marker.x)))
            if marker.kind not in kinds:
                kinds.append(marker.kind)
        for colour, spots in nodes.items():
            scatter = pg.ScatterPlotItem(
                x=[self._view_x(x) for x, _ in spots], y=[0.0] * len(spots), data=[t for _, t in spots],
                symbol="o", size=_NODE_SIZE, pen=make_pen(colour, 1.8), brush=pg.mkBrush("#ffffff"),
                hoverable=True, tip=_node_tip,
            )
            scatter.setZValue(6)
            self._plot.addItem(scatter, ignoreBounds=True)
            self._marker_items.append(scatter)
        if not legend:  # the rows of these marker kinds are in the legend already
            return
        self._legend.setToolTip("\n".join(MARKER_TEXT[k][1] for k in MARKER_TEXT if k in kinds)
                                + ("\nMarkers take the colour of their subshell." if kinds else ""))
        for kind in sorted(kinds, key=list(MARKER_TEXT).index):
            if kind == "node":
                sample = pg.ScatterPlotItem(symbol="o", size=_NODE_SIZE - 1,
                                            pen=make_pen(_LEGEND_SAMPLE_COLOUR, 1.6), brush="#ffffff")
            else:
                # Several series: marker lines take the series' style; the sample is plain.
                pen = make_pen(_LEGEND_SAMPLE_COLOUR, _MARKER_WIDTH,
                               Qt.PenStyle.SolidLine if several else _MARKER_DASH[kind])
                sample = pg.PlotDataItem(pen=pen)
            self._legend_samples.append(sample)
            self._add_legend_row(sample, MARKER_TEXT[kind][0])

    def _add_legend_row(self, item: pg.GraphicsObject, text: str) -> None:
        self._legend.addItem(item, text)
        sample, label = self._legend.items[-1]
        for cell in (sample, label):  # rows are as tall as the sample; centre the text on it
            self._legend.layout.setAlignment(cell, Qt.AlignmentFlag.AlignVCenter)

    def _fit_legend_size(self) -> None:
        # The legend sizes itself row by row from its rows' current, possibly stretched,
        # heights; size it from the layout's own preferred size instead. In a short panel
        # (a grid of series) the rows go into as many columns as it takes to fit.
        box_height = self._plot.getViewBox().height() or 400.0
        for columns in (1, 2, 3):
            if self._legend.columnCount != columns:
                self._legend.setColumnCount(columns)
            hint = self._legend.layout.effectiveSizeHint(Qt.SizeHint.PreferredSize)
            if hint.height() <= 0.92 * box_height:
                break
        self._legend.setGeometry(QRectF(0.0, 0.0, hint.width(), hint.height()))

    def _place_legend(self) -> None:
        """Put the legend where it hides the least of the curves (top right when all are equal)."""
        box = self._plot.getViewBox()
        (x0, x1), (y0, y1) = box.viewRange()
        size = self._legend.boundingRect()
        # Legend size, with its margin, as a fraction of the plot.
        w = min((size.width() + 12) / (box.width() or 600.0), 1.0)
        h = min((size.height() + 10) / (box.height() or 400.0), 1.0)
        occupied = np.zeros((_COVER_ROWS, _COVER_COLUMNS), dtype=bool)
        u = np.linspace(0.0, 1.0, 4 * _COVER_COLUMNS * _COVER_ROWS)
        for _, _, x, y in self._curves.values():
            vx = self._view_x_array(x)
            if vx.size < 2:
                continue
            # Resample evenly and finely across the plot, so every stretch counts by the
            # cells it crosses on screen, not by how densely the scene sampled it.
            v = (np.interp(x0 + u * (x1 - x0), vx, y, left=np.nan, right=np.nan) - y0) / (y1 - y0)
            ok = np.isfinite(v) & (v >= 0) & (v <= 1)
            rows = np.minimum((v[ok] * _COVER_ROWS).astype(int), _COVER_ROWS - 1)
            columns = np.minimum((u[ok] * _COVER_COLUMNS).astype(int), _COVER_COLUMNS - 1)
            occupied[rows, columns] = True
        # Candidate places: (fraction across, fraction down) of both plot and legend corner.
        # Right edge first (top to bottom), then the left edge, then the top centre.
        downs = [i / 8 for i in range(9)]
        places = [(1.0, d) for d in downs] + [(0.0, d) for d in downs] + [(0.5, 0.0)]

        def covered(place: tuple[float, float]) -> int:
            left = place[0] * (1 - w)
            bottom = (1 - place[1]) * (1 - h)  # normalised v grows upwards
            c0, c1 = int(left * _COVER_COLUMNS), int(np.ceil((left + w) * _COVER_COLUMNS))
            r0, r1 = int(bottom * _COVER_ROWS), int(np.ceil((bottom + h) * _COVER_ROWS))
            return int(np.count_nonzero(occupied[r0:r1, c0:c1]))

        fx, fy = min(places, key=covered)  # the first listed wins a tie
        offset = (-10 if fx == 1.0 else 10 if fx == 0.0 else 0, 8 - 16 * fy)
        self._legend.anchor(itemPos=(fx, fy), parentPos=(fx, fy), offset=offset)

    def _fit_title(self) -> None:
        """The title at a size that fits the panel (shortened with … as a last resort)."""
        if self._scene is None:
            return
        room = max(float(self._plot_widget.width()) - 16.0, 40.0)
        shown = fitted_line(self._scene.title, room, (11.0, 10.0, 9.0))
        if shown != getattr(self, "_shown_title", None):
            self._shown_title = shown
            self._plot.setTitle(html.escape(shown[0]), color=AXIS_COLOUR, size=f"{shown[1]:g}pt")

    def title_text(self) -> str:
        """The title as shown (shortened with … when the panel is narrow)."""
        return self._shown_title[0] if getattr(self, "_shown_title", None) else ""

    def _fit_y_label(self) -> None:
        """The value axis label; in a short panel without its weighting phrase (kept in the tip)."""
        if self._scene is None:
            return
        text = self._scene.y_label
        metrics = self._readout.fontMetrics()
        short = ", " in text and metrics.horizontalAdvance(text) * 1.1 > self._plot.getViewBox().height()
        if short == getattr(self, "_y_label_short", None):
            return
        self._y_label_short = short
        shown = text.split(", ", 1)[0] if short else text
        self._plot.setLabel("left", html.escape(shown), **label_style())

    def _on_resized(self) -> None:
        if self._scene is not None:
            self._fit_y_label()
            self._fit_title()
        if self._curves:
            self._fit_legend_size()
            self._place_legend()

    def _set_tooltips(self, scene: RadialScene) -> None:
        y_tip = quantity_tooltip(scene.quantity, scene.y_label)
        if "," in scene.y_label:
            y_tip += "\n" + scene.y_label.split(",", 1)[1].strip().capitalize()
        unit = split_label(scene.x_label)[1]
        x_tip = f"r: distance from the nucleus\nUnits: {unit}" + ("\nLogarithmic axis" if scene.log_r else "")
        for side, tip in (("left", y_tip), ("bottom", x_tip)):
            axis = self._plot.getAxis(side)
            axis.setToolTip(tip)
            axis.label.setToolTip(tip)
        self._plot.titleLabel.setToolTip(f"{scene.title}\n{scene.spec} under {model_title(scene.model)}")
        self._readout.setToolTip(y_tip)

    # -- range and linking ---------------------------------------------------------------

    def link_axes(self, other: RadialView, x: bool = True, y: bool = True) -> None:
        """Share the r axis and, optionally, the value axis with ``other``.

        Parameters
        ----------
        other : RadialView
            The view to follow and be followed by.
        x, y : bool
            Link the r axis, the value axis. A difference view is best linked
            with ``y=False``: its values are far smaller than the curves'.

        Notes
        -----
        Linked views are fitted together: each linked axis spans the union of
        the curves of every view linked on it, so no view's curve is cut off.
        """
        if other is self:
            return
        # A plain copy of the range both ways; pyqtgraph's own links line views up by
        # their position on screen, which shifts the range of panels in another row.
        for source, target in ((self, other), (other, self)):
            box = source._plot.getViewBox()
            ref = weakref.ref(target)
            if x:
                box.sigXRangeChanged.connect(lambda _box, span, t=ref: _copy_range(t, 0, span))
            if y:
                box.sigYRangeChanged.connect(lambda _box, span, t=ref: _copy_range(t, 1, span))
        self._peers.append((weakref.ref(other), x, y))
        other._peers.append((weakref.ref(self), x, y))
        self._bounds = None
        self._fit_range()

    def _linked(self, axis: int) -> list[RadialView]:
        """This view and every view reachable through links on ``axis`` (1: x, 2: y)."""
        found: list[RadialView] = [self]
        index = 0
        while index < len(found):
            for ref, *flags in found[index]._peers:
                peer = ref()
                # A hidden peer (the right-hand view outside comparisons) keeps its last
                # curves; they must not stretch the range of the views on screen.
                if (peer is not None and flags[axis - 1] and not _hidden_on_purpose(peer)
                        and all(peer is not f for f in found)):
                    found.append(peer)
            index += 1
        return found

    def _data_bounds(self) -> tuple[float, float, float, float] | None:
        """(x0, x1, y0, y1) of the drawn curves, x in view coordinates (log10 r on a log axis).

        Kept until the curves change (linked views ask for each other's several times a
        redraw).
        """
        key = (id(self._scene), len(self._curves))
        if self._bounds_cache is not None and self._bounds_cache[0] == key:
            return self._bounds_cache[1]
        bounds = self._measure_bounds()
        self._bounds_cache = (key, bounds)
        return bounds

    def _measure_bounds(self) -> tuple[float, float, float, float] | None:
        boxes = []
        for _, _, x, y in self._curves.values():
            ok = np.isfinite(x) & np.isfinite(y)
            if np.any(ok):
                boxes.append((x[ok].min(), x[ok].max(), y[ok].min(), y[ok].max()))
        if not boxes:
            return None
        x0, x1 = min(b[0] for b in boxes), max(b[1] for b in boxes)
        return (self._view_x(x0), self._view_x(x1), min(min(b[2] for b in boxes), 0.0),
                max(max(b[3] for b in boxes), 0.0))

    def refit(self) -> None:
        """Fit the range again (after linked views were shown or hidden)."""
        self._bounds = None
        self._fit_range()

    def _fit_range(self) -> None:
        own = self._data_bounds()
        if own is None:
            return
        x_boxes = [b for v in self._linked(1) if (b := v._data_bounds()) is not None]
        y_boxes = [b for v in self._linked(2) if (b := v._data_bounds()) is not None]
        bounds = (min(b[0] for b in x_boxes), max(b[1] for b in x_boxes),
                  min(b[2] for b in y_boxes), max(b[3] for b in y_boxes))
        if bounds == self._bounds:
            return
        self._bounds = bounds
        x0, x1, y0, y1 = bounds
        if x1 <= x0:
            x0, x1 = x0 - 0.5, x1 + 0.5
        # A small margin at the start keeps the "0" tick labels, which pyqtgraph drops
        # when they would reach past the plot's edge.
        x_span = x1 - x0
        y_span = (y1 - y0) or 1.0
        x_range = (x0 - 0.012 * x_span, x1)
        y_range = (y0 - 0.025 * y_span, y1 + 0.06 * y_span)
        shown = self._plot.getViewBox().viewRange()
        if np.allclose(shown, (x_range, y_range), rtol=1e-12, atol=0.0):
            return  # already showing exactly this (a refit after the same data)
        self._plot.setRange(xRange=x_range, yRange=y_range, padding=0)

    def _draw_subsets(self, *_args: object) -> None:
        """Give each curve item the samples that matter at the current pixel scale.

        The full samples stay in ``_curves`` for readouts, bounds and exports; the items
        draw :func:`~zeffir.ui._polyline.drawn_subset` of them (about 5 % of a radial
        curve's points, within 0.1 px of it), chosen again when the scale changes
        (a zoom or a resize, not a pan).
        """
        box = self._plot.getViewBox()
        (x0, x1), (y0, y1) = box.viewRange()
        width, height = box.width(), box.height()
        if width < 2 or height < 2 or x1 <= x0 or y1 <= y0:
            scale = None  # not laid out yet: draw every sample
        else:
            scale = (width / (x1 - x0), height / (y1 - y0))
        if scale is not None and scale == self._subset_scale:
            return
        self._subset_scale = scale
        curves = list(self._curves.values())
        if not curves:
            return
        if scale is None:
            for item, _colour, x, y in curves:
                item.setData(x, y)
            return
        # All curves in one pass: joined end to end with a gap (NaN) between them, which
        # keeps each one's ends, then split again.
        gap = np.array([np.nan])
        with np.errstate(invalid="ignore"):
            px = np.concatenate([part for _, _, x, _ in curves
                                 for part in (self._view_x_array(x) * scale[0], gap)])
            py = np.concatenate([part for _, _, _, y in curves for part in (y * scale[1], gap)])
        chosen = drawn_subset(px, py)
        start = 0
        for item, _colour, x, y in curves:
            stop = start + x.size
            mine = chosen[(chosen >= start) & (chosen < stop)] - start
            item.setData(x[mine], y[mine])
            start = stop + 1

    def _view_x_array(self, x: np.ndarray) -> np.ndarray:
        if self._scene is not None and self._scene.log_r:
            with np.errstate(divide="ignore", invalid="ignore"):
                return np.log10(x)
        return x

    def _view_x(self, x: float) -> float:
        """View coordinate of radius ``x`` (log10 on a log axis)."""
        if self._scene is not None and self._scene.log_r:
            return math.log10(x) if x > 0 else -math.inf
        return x

    # -- cursor --------------------------------------------------------------------------

    @Slot(float)
    def show_cursor(self, x: float) -> None:
        """Show a cursor driven from elsewhere (e.g. another view's :attr:`cursor_moved`).

        Parameters
        ----------
        x : float
            Radius in the scene's length unit; NaN (or r <= 0 on a log axis) hides the cursor.

        Notes
        -----
        Draws the vertical line, a dot on every curve and the read-out, but
        emits nothing.
        """
        if self._scene is None or not math.isfinite(x) or (self._scene.log_r and x <= 0):
            self._hide_cursor()
            return
        self._draw_cursor(x, None)

    def _on_mouse_moved(self, position: QPointF) -> None:
        if self._scene is None:
            return
        box = self._plot.getViewBox()
        if not box.sceneBoundingRect().contains(position):
            self._leave()
            return
        point = box.mapSceneToView(position)
        x = 10.0 ** min(point.x(), _LOG_LIMIT) if self._scene.log_r else point.x()
        self._draw_cursor(x, point.y())
        self.cursor_moved.emit(x)

    def _leave(self) -> None:
        if self._cursor_shown:
            self._hide_cursor()
            self.cursor_moved.emit(math.nan)

    def eventFilter(self, watched: QObject, event: QEvent) -> bool:  # Qt override
        """Hide the cursor when the pointer leaves the plot."""
        if event.type() == QEvent.Type.Leave:
            self._leave()
        return super().eventFilter(watched, event)

    def _draw_cursor(self, x: float, y: float | None) -> None:
        assert self._scene is not None
        vx = self._view_x(x)
        self._v_line.setPos(vx)
        self._v_line.show()
        if y is None:
            self._h_line.hide()
        else:
            self._h_line.setPos(y)
            self._h_line.show()
        spots = []
        entries = []
        # The highlighted subshell and the total come first: a long read-out is cut at two lines.
        subshells = {c.label: c.subshell for c in self._scene.curves}
        highlight = self._scene.highlight

        def rank(label: str) -> int:
            subshell = subshells.get(label)
            return 0 if subshell is not None and subshell == highlight else 1 if subshell is None else 2

        for label in sorted(self._curves, key=rank):
            _, colour, cx, cy = self._curves[label]
            value = float(np.interp(x, cx, cy)) if cx.size and cx[0] <= x <= cx[-1] else math.nan
            if math.isfinite(value):
                spots.append({"pos": (vx, value), "brush": pg.mkBrush(colour)})
            plain = f"■ {label} {format_number(value)}"
            entries.append((f'<span style="color:{colour}">■</span>&nbsp;{html.escape(label)}'
                            f'&nbsp;{format_number(value)}', plain))
        self._dots.setData(spots)
        self._dots.show()
        self._cursor_shown = True
        x_name, x_unit = split_label(self._scene.x_label)
        y_name, y_unit = split_label(self._scene.y_label)
        x_symbol = x_name.split()[0]
        head = (f"<b>{html.escape(x_symbol)} = {format_number(x)}</b> {html.escape(x_unit)}"
                f"&nbsp;&nbsp;&nbsp;{html.escape(y_name)} / {html.escape(y_unit)}:")
        plain_head = f"{x_symbol} = {format_number(x)} {x_unit}   {y_name} / {y_unit}:"
        self._readout.setText(self._fit_readout((head, plain_head), entries))

    def _fit_readout(self, head: tuple[str, str], entries: list[tuple[str, str]]) -> str:
        """Lay the (rich, plain) read-out pieces on at most two lines; what does not fit ends in "…"."""
        metrics = self._readout.fontMetrics()
        available = max(self._readout.contentsRect().width() - 8, 120)
        gap = metrics.horizontalAdvance("\u00a0" * 4)
        lines: list[list[str]] = [[head[0]]]
        used = 1.1 * metrics.horizontalAdvance(head[1])  # the bold part is a little wider
        for rich, plain in entries:
            width = metrics.horizontalAdvance(plain)
            if used + gap + width <= available:
                used += gap + width
                lines[-1].append(rich)
            elif len(lines) < 2:
                lines.append([rich])
                used = width
            else:
                lines[-1].append("…")
                break
        return "<br>".join("&nbsp;&nbsp;&nbsp;&nbsp;".join(line) for line in lines)

    def _hide_cursor(self) -> None:
        self._v_line.hide()
        self._h_line.hide()
        self._dots.hide()
        self._cursor_shown = False
        hint = "Point at the plot to read r and the value of each curve." if self._scene is not None else ""
        self._readout.setText(f'<span style="color:{MUTED_TEXT}">{hint}</span>')

    # -- read-back (tests, exports of what is on screen) ----------------------------------

    def curve_data(self) -> dict[str, tuple[np.ndarray, np.ndarray]]:
        """The samples of each curve, by curve label, in data units (r, not log r).

        These are every sample of the scene's curve (what readouts and exports use); the
        item on screen draws the subset :meth:`drawn_data` gives.
        """
        return {label: (x, y) for label, (_item, _colour, x, y) in self._curves.items()}

    def drawn_data(self) -> dict[str, tuple[np.ndarray, np.ndarray]]:
        """The x and y each curve item draws, by curve label, in data units."""
        result = {}
        for label, (item, *_) in self._curves.items():
            x, y = item.getOriginalDataset()
            result[label] = (np.asarray(x), np.asarray(y))
        return result

    def curve_styles(self) -> dict[str, tuple[str, float]]:
        """Colour (``"#rrggbb"``) and pen width in pixels of each curve, by label."""
        result = {}
        for label, (item, *_) in self._curves.items():
            pen = item.opts["pen"]
            result[label] = (pen.color().name(), pen.widthF())
        return result

    def marker_positions(self) -> list[tuple[str, str, float]]:
        """(subshell, kind, r) of every drawn marker, r in data units."""
        return list(self._markers)

    def cursor_position(self) -> float | None:
        """r of the shown cursor (data units), or ``None`` when it is hidden."""
        if not self._cursor_shown:
            return None
        vx = float(self._v_line.value())
        return 10.0**vx if self._scene is not None and self._scene.log_r else vx

    def readout_text(self) -> str:
        """The read-out line below the plot, as plain text."""
        return self._frame.readout_text()

    def empty_message(self) -> str | None:
        """The message shown instead of a plot, or ``None`` when a scene is drawn."""
        return self._frame.shown_message()


def _copy_range(target: weakref.ref[RadialView], axis: int, span: tuple[float, float]) -> None:
    """Give a linked view the range another view just took (once: no echo back)."""
    view = target()
    if view is None or view._copying:
        return
    box = view._plot.getViewBox()
    if tuple(box.viewRange()[axis]) == tuple(span):
        return
    view._copying = True
    try:
        if axis == 0:
            box.setXRange(*span, padding=0.0)
        else:
            box.setYRange(*span, padding=0.0)
    finally:
        view._copying = False


def _node_tip(x: float, y: float, data: object) -> str:
    return str(data)


def _hidden_on_purpose(widget: QWidget) -> bool:
    """True for a widget hidden by setVisible(False), not for one merely never shown."""
    return widget.isHidden() and widget.testAttribute(Qt.WidgetAttribute.WA_WState_ExplicitShowHide)

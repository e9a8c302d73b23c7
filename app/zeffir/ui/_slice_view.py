"""The slice view: draws a :class:`~zeffir.scene.SliceScene` as an image with contours."""

from __future__ import annotations

import html
import math
from collections.abc import Callable
from typing import Any, Final

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QEvent, QObject, QPoint, QPointF, QRectF, Qt, QTimer, Signal, Slot
from PySide6.QtGui import QImage, QMouseEvent, QResizeEvent, QShowEvent, QTextDocument
from PySide6.QtWidgets import (
    QApplication,
    QGraphicsRectItem,
    QLabel,
    QSizePolicy,
    QWidget,
)

from zeffir.scene import SliceScene, model_title, sign_colours
from zeffir.ui._plot_style import (
    AXIS_COLOUR,
    MUTED_TEXT,
    colour_map,
    format_number,
    label_style,
    make_pen,
    quantity_tooltip,
    split_label,
    style_plot,
    tick_font,
)
from zeffir.ui._view_frame import ViewFrame, fitted_line

__all__ = ["PROFILE_HINT", "PointOf", "SliceView"]

#: Maps in-plane (u, v) to Cartesian (x, y, z), all in the scene's length unit.
PointOf = Callable[[float, float], tuple[float, float, float]]

DEFAULT_EMPTY_MESSAGE: Final = "Nothing to show yet: type an atom or a configuration."
#: Contours are traced on at most this many points per side (the image keeps its resolution).
CONTOUR_POINTS: Final = 256
#: If no repaint comes (a hidden view), contours are still drawn after this many ms.
_CONTOUR_FALLBACK_MS: Final = 60
_LEVEL_COLOUR_SIGNED: Final = "#505050"
_LEVEL_COLOUR_DENSITY: Final = "#c8c8c8"
_LEVEL_WIDTH: Final = 0.9
_BAR_WIDTH: Final = 16  # px, the colour bar's thickness
_BAR_GAP: Final = 8  # px between the image's axis and its colour bar
_EDGE: Final = 6.0  # px, the least margin around the plot
#: A side for the colour bar must win this many pixels of image before the bar moves.
_SIDE_HYSTERESIS: Final = 6.0
_ZERO_WIDTH: Final = 1.6
_CROSSHAIR_COLOUR: Final = "#1a1a1a"
_OUTSIDE_COLOUR: Final = "#e4e4e4"
# The profile segment: a dark line on a white halo reads on both colour maps.
_SEGMENT_COLOUR: Final = "#111111"
_SEGMENT_HALO: Final = "#ffffff"
_SEGMENT_WIDTH: Final = 1.8
_SEGMENT_HALO_WIDTH: Final = 4.2
#: How a line profile is drawn, shown as the image's tooltip and in the read-out hint.
PROFILE_HINT: Final = ("Shift + drag with the left button: draw a line profile (the value along the "
                       "segment, plotted against the distance from its start, the dark dot).")
_NAVIGATION_HINT: Final = "Drag: pan · wheel or right-drag: zoom."


_MOUSE_EVENTS: Final = frozenset({QEvent.Type.MouseButtonPress, QEvent.Type.MouseMove,
                                   QEvent.Type.MouseButtonRelease})


class _TrueColourImage(pg.ImageItem):
    """An image item that hands the painter 32-bit colour instead of an 8-bit palette.

    pyqtgraph turns a float image and a 256-entry lookup table into an indexed 8-bit
    QImage. Drawn scaled and smoothed, Qt converts such an image to 32-bit colour on
    every paint: 5.0 ms for a 512² slice drawn at 1.3×, against 0.6 ms for the same
    image in 32-bit colour, which costs 0.2 ms to convert once (measured here). The
    conversion is done once per new picture, after pyqtgraph's own rendering.
    """

    def render(self) -> None:
        super().render()
        image = self.qimage
        if image is not None and image.format() == QImage.Format.Format_Indexed8:
            target = (QImage.Format.Format_ARGB32_Premultiplied if image.hasAlphaChannel()
                      else QImage.Format.Format_RGB32)
            self.qimage = image.convertToFormat(target)


class _LinkGroup:
    """Slice views showing one range of u and v (see :meth:`SliceView.link_axes`)."""

    def __init__(self, view: SliceView) -> None:
        self.views = [view]
        self.sharing = False


class SliceView(QWidget):
    """A 2D slice through the atom: colour image, colour bar, contours and a read-out.

    The image is placed at the scene's coordinates (u across, v up) with equal
    scales on both axes, and the panel is laid out so that the plot area has the
    image's square shape and the image fills it: the colour bar sits beside the
    image in a wide panel and under it in a tall one (see ``_fit_frame``). Signed ψ
    uses the scene's diverging map symmetric about zero, densities its sequential
    one (``scene.colour_map``; the exported figure uses the same). Contour levels are thin grey (dashed where
    negative), the zero contour (nodes of ψ) black. Contours are traced right
    after the image is on screen, on a grid of at most
    ``CONTOUR_POINTS``² points, so a new image is never held back by them.

    Signals
    -------
    hovered(float, float)
        The pointer moved over the image: (u, v) in the scene's length unit;
        (NaN, NaN) when it leaves. :meth:`show_cursor` does not emit it.
    contours_drawn()
        The contours of the current scene are on screen (or were cleared).
    clicked(float, float)
        (u, v) of a left click on the image, in the scene's length unit.
    profile_requested(float, float, float, float)
        The user drew a segment for a line profile (Shift + left drag):
        (start_u, start_v, end_u, end_v) in the scene's length unit. The view draws
        the segment itself (until :meth:`clear_profile` or another segment);
        :meth:`set_profile_segment` draws one without emitting.

    Notes
    -----
    Shift + left drag draws the segment, so that a plain drag still pans, the
    wheel zooms and a click (the pair view's reference electron) still clicks.
    A drag shorter than the platform's drag distance draws nothing.
    """

    hovered = Signal(float, float)
    contours_drawn = Signal()
    clicked = Signal(float, float)
    profile_requested = Signal(float, float, float, float)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._scene: SliceScene | None = None
        self._point_of: PointOf | None = None
        self._contours_enabled = True
        self._external_contours = False
        self._contour_levels: tuple[float, ...] = ()
        self._extent: tuple[float, float, int] | None = None
        self._map_key: tuple[bool, str] | None = None
        # The image frame fitted to the panel (see _fit_frame): extra margins, the bar's
        # side, the room each bar takes, and whether the user has zoomed or panned.
        self._margins = (0.0, 0.0)
        self._fitting = False
        self._user_range = False
        self._labels: tuple[str, ...] = ()
        self._cursor_shown = False
        self._empty_message = DEFAULT_EMPTY_MESSAGE
        self._segment: tuple[tuple[float, float], tuple[float, float]] | None = None
        # A segment being dragged: its start in plane coordinates and the press pixel.
        self._drag_start: tuple[float, float] | None = None
        self._drag_pixel = QPoint()

        self._graphics = pg.GraphicsLayoutWidget()
        self._graphics.setBackground("w")
        self._graphics.setSizePolicy(QSizePolicy.Policy.Expanding, QSizePolicy.Policy.Expanding)
        self._plot: pg.PlotItem = self._graphics.addPlot(row=0, col=0)
        style_plot(self._plot, grid=False)
        box = self._plot.getViewBox()
        box.setAspectLocked(True, ratio=1.0)
        box.setDefaultPadding(0.0)

        self._image = _TrueColourImage(axisOrder="row-major")
        self._plot.addItem(self._image)
        # Outside the slice is not "zero": a neutral grey keeps it apart from the map's white.
        box.setBackgroundColor(_OUTSIDE_COLOUR)
        self._frame = QGraphicsRectItem()
        self._frame.setPen(make_pen(AXIS_COLOUR, 1.0))
        self._frame.setZValue(6)
        self._plot.addItem(self._frame, ignoreBounds=True)
        # A marked point (the pair view's reference electron).
        self._marker = pg.ScatterPlotItem(size=13, symbol="o", pen=make_pen("#e6007e", 1.6),
                                          brush=None)
        self._marker.setZValue(15)
        self._marker.hide()  # shown with a scene's marker
        self._plot.addItem(self._marker, ignoreBounds=True)
        # Two colour bars, one shown: beside the image when the panel is wide, under it
        # when the panel is tall (see _fit_frame). Both are in the plot's own layout, so
        # a bar spans exactly the image's height or width.
        self._bars = {
            side: pg.ColorBarItem(values=(0.0, 1.0), colorMap=colour_map(True), width=_BAR_WIDTH,
                                  interactive=False, colorMapMenu=False, orientation=side)
            for side in ("vertical", "horizontal")
        }
        for bar in self._bars.values():
            bar.setImageItem(self._image)
            self._style_colour_bar(bar)
        self._orientation = "vertical"
        self._colour_bar = self._bars["vertical"]
        self._place_bar("vertical")
        self._bar_room = {"vertical": 90.0, "horizontal": 64.0}  # estimates until measured
        self._group = _LinkGroup(self)
        box.sigResized.connect(self._fit_frame)
        box.sigRangeChangedManually.connect(self._on_user_range)
        box.sigRangeChanged.connect(self._share_range)

        # Positive (or all, for densities) levels, negative levels, zero: one path each,
        # lines split by NaN.
        self._contour_items = [pg.PlotCurveItem(connect="finite", antialias=True) for _ in range(3)]
        self._contour_items[2].setPen(make_pen("#000000", _ZERO_WIDTH))
        for item in self._contour_items:
            item.setZValue(5)
            self._plot.addItem(item, ignoreBounds=True)
        # The line profile's segment: halo, line, and its ends (start dark, end white).
        self._segment_halo = pg.PlotCurveItem(pen=make_pen(_SEGMENT_HALO, _SEGMENT_HALO_WIDTH),
                                              antialias=True)
        self._segment_line = pg.PlotCurveItem(pen=make_pen(_SEGMENT_COLOUR, _SEGMENT_WIDTH),
                                              antialias=True)
        self._segment_ends = pg.ScatterPlotItem(size=9, pen=make_pen(_SEGMENT_COLOUR, 1.4))
        for z, item in enumerate((self._segment_halo, self._segment_line, self._segment_ends)):
            item.setZValue(16 + z)
            item.hide()  # shown with a segment (_show_segment)
            self._plot.addItem(item, ignoreBounds=True)
        self._image.setToolTip(f"{PROFILE_HINT}\n{_NAVIGATION_HINT}")
        crosshair = make_pen(_CROSSHAIR_COLOUR, 1.0, Qt.PenStyle.DashLine)
        self._v_line = pg.InfiniteLine(angle=90, movable=False, pen=crosshair)
        self._h_line = pg.InfiniteLine(angle=0, movable=False, pen=crosshair)
        for line in (self._v_line, self._h_line):
            line.setZValue(20)
            line.hide()
            self._plot.addItem(line, ignoreBounds=True)

        # The title is a plain label above the plot: changing its text (every new plane
        # offset, orbital or model) then never re-lays out the plot and its axes.
        self._title = QLabel()
        self._title.setTextFormat(Qt.TextFormat.RichText)
        self._title.setAlignment(Qt.AlignmentFlag.AlignCenter)
        self._title.setSizePolicy(QSizePolicy.Policy.Ignored, QSizePolicy.Policy.Fixed)
        self._title.setStyleSheet("QLabel { background: white; }")
        self._title.setContentsMargins(4, 4, 4, 0)

        self._view_frame = ViewFrame(self, self._graphics, title=self._title)
        self._readout = self._view_frame.readout

        # A panel moved to another grid (or shown after being hidden) lays its frame out
        # afresh once its new size is known: margins from the old size would not fit.
        self._refit_timer = QTimer(self)
        self._refit_timer.setSingleShot(True)
        self._refit_timer.setInterval(0)
        self._refit_timer.timeout.connect(self._refit_frame)
        self._contour_timer = QTimer(self)
        self._contour_timer.setSingleShot(True)
        self._contour_timer.timeout.connect(self._draw_contours)
        self._contours_pending = False

        self._graphics.scene().sigMouseMoved.connect(self._on_mouse_moved)
        self._graphics.scene().sigMouseClicked.connect(self._on_mouse_clicked)
        self._graphics.viewport().installEventFilter(self)
        self.setMinimumSize(200, 170)  # two rows of panels fit 720 px
        self._show_message()

    @staticmethod
    def _style_colour_bar(bar: pg.ColorBarItem) -> None:
        for side in ("left", "right", "top", "bottom"):
            axis = bar.getAxis(side)
            axis.setPen(make_pen(AXIS_COLOUR, 1.0))
            axis.setTextPen(AXIS_COLOUR)
        values = bar.axis  # the right axis of a vertical bar, the bottom one of a horizontal bar
        values.setStyle(tickFont=tick_font(), tickLength=4, maxTickLevel=1)
        values.enableAutoSIPrefix(False)
        if bar.horizontal:
            values.setHeight(None)  # tall enough for the tick values and the label under them
            bar.getAxis("top").setHeight(2)
        else:
            values.setWidth(None)  # wide enough for the tick values and the label beside them
            bar.getAxis("left").setWidth(2)

    # -- framing: the image fills its panel ----------------------------------------------

    def _place_bar(self, orientation: str) -> None:
        """Put the colour bar of ``orientation`` into the plot's layout and take the other out."""
        layout = self._plot.layout
        for side, bar in self._bars.items():
            if side != orientation and bar.parentItem() is not None:
                layout.removeItem(bar)
                bar.setParentItem(None)
                bar.hide()
        bar = self._bars[orientation]
        if orientation == "vertical":
            layout.addItem(bar, 2, 5)  # after the right-hand axis, as tall as the image
            layout.setColumnFixedWidth(4, _BAR_GAP)
            layout.setRowFixedHeight(4, 0)
        else:
            layout.addItem(bar, 5, 1)  # under the bottom axis, as wide as the image
            layout.setRowFixedHeight(4, _BAR_GAP)
            layout.setColumnFixedWidth(4, 0)
        bar.show()
        self._orientation = orientation
        self._colour_bar = bar

    def _fit_frame(self) -> None:
        """Lay the panel out so the plot area has the image's (square) shape, and fill it.

        The plot area takes what the axes, title and colour bar leave; white margins
        around the plot take up any difference between its width and height, so the
        image keeps true proportions with no grey padding beside it. The colour bar
        goes under the image when that leaves a larger square than beside it (a panel
        taller than wide, such as one of three in a row), else to its right.
        """
        if self._fitting:
            return
        self._fitting = True
        try:
            for _ in range(3):  # a change of side moves the axes once more; then it is stable
                if not self._fit_once():
                    break
                self._plot.layout.activate()
                self._graphics.ci.layout.activate()
            if not self._user_range and not self._frame.rect().isEmpty():
                # Settle the range on the image again: while the layout moved, the locked
                # aspect (and the views linked to this one) may have widened it.
                self._plot.getViewBox().setRange(self._frame.rect(), padding=0.0)
        finally:
            self._fitting = False

    def _fit_once(self) -> bool:
        """One step of :meth:`_fit_frame`; True if it changed the layout."""
        box = self._plot.getViewBox().geometry()
        if box.width() < 8 or box.height() < 8:
            return False
        bar = self._bars[self._orientation].geometry()
        if self._orientation == "vertical":
            self._bar_room["vertical"] = bar.width() + _BAR_GAP
        else:
            self._bar_room["horizontal"] = bar.height() + _BAR_GAP
        mx, my = self._margins
        width, height = box.width() + 2 * mx, box.height() + 2 * my  # without the margins
        if self._orientation == "vertical":
            other = (width + self._bar_room["vertical"], height - self._bar_room["horizontal"])
        else:
            other = (width - self._bar_room["vertical"], height + self._bar_room["horizontal"])
        if min(other) > min(width, height) + _SIDE_HYSTERESIS:
            self._place_bar("horizontal" if self._orientation == "vertical" else "vertical")
            self._set_margins(0.0, 0.0)
            return True
        side = min(width, height)
        new = (0.5 * (width - side), 0.5 * (height - side))
        if max(abs(new[0] - mx), abs(new[1] - my)) < 0.5:
            return False
        self._set_margins(*new)
        return True

    def resizeEvent(self, event: QResizeEvent) -> None:  # Qt override
        super().resizeEvent(event)
        self._refit_timer.start()
        self._fit_title()

    def showEvent(self, event: QShowEvent) -> None:  # Qt override
        super().showEvent(event)
        self._refit_timer.start()

    def _refit_frame(self) -> None:
        """Fit the frame from zero margins to the panel's current size."""
        if self._fitting or not self.isVisible():
            return
        self._set_margins(0.0, 0.0)
        # The central item kept the width the old margins forced on it: give it the
        # view's size again (pyqtgraph sets it only on the view's own resize).
        self._graphics.ci.setGeometry(QRectF(self._graphics.rect()))
        self._graphics.ci.layout.activate()
        self._fit_frame()

    def _set_margins(self, mx: float, my: float) -> None:
        self._margins = (mx, my)
        self._graphics.ci.setContentsMargins(_EDGE + mx, _EDGE + my, _EDGE + mx, _EDGE + my)

    def _on_user_range(self, *_args: object) -> None:
        for view in self._group.views:  # a zoom in one panel is a zoom in all linked ones
            view._user_range = True

    def _share_range(self, *_args: object) -> None:
        """Give the linked views this view's range (see :meth:`link_axes`)."""
        group = self._group
        if group.sharing or len(group.views) == 1:
            return
        group.sharing = True
        try:
            rect = self._plot.getViewBox().viewRect()
            for view in group.views:
                if view is not self:
                    view._plot.getViewBox().setRange(rect, padding=0.0)
        finally:
            group.sharing = False

    # -- drawing -------------------------------------------------------------------------

    def set_scene(self, scene: SliceScene | None) -> None:
        """Draw ``scene`` (image first, contours right after); ``None`` shows the empty message.

        Parameters
        ----------
        scene : SliceScene or None
            Image, coordinates, colour scale, contour levels and labels to draw.

        Notes
        -----
        The view is refitted only when the extent or resolution changes, so a
        zoom survives a change of orbital, quantity or colour scale. A colour
        range set with :meth:`set_colour_range` lasts until the next scene.
        """
        if scene is None:
            self._show_message()
            return
        self._scene = scene
        self._view_frame.show_plot()
        coordinates = np.asarray(scene.coordinates, dtype=float)
        n = coordinates.size
        step = (coordinates[-1] - coordinates[0]) / (n - 1) if n > 1 else 1.0
        low, high = scene.colour_range
        self._image.setImage(scene.image, autoLevels=False, levels=(low, high))
        start = coordinates[0] - step / 2
        rect = QRectF(start, start, n * step, n * step)
        self._image.setRect(rect)
        self._frame.setRect(rect)
        key = (scene.signed, scene.colour_map)
        if self._map_key != key:
            cmap = colour_map(scene.signed, scene.colour_map)
            for bar in self._bars.values():
                bar.setColorMap(cmap)
            if self._map_key is None or self._map_key[0] != scene.signed:
                # Dark grey reads on the light middle of a diverging map, light grey on the
                # dark low end of the sequential ones.
                colour = _LEVEL_COLOUR_SIGNED if scene.signed else _LEVEL_COLOUR_DENSITY
                self._contour_items[0].setPen(make_pen(colour, _LEVEL_WIDTH))
                self._contour_items[1].setPen(make_pen(colour, _LEVEL_WIDTH, Qt.PenStyle.DashLine))
            self._map_key = key
        for bar in self._bars.values():
            bar.setLevels((low, high))
        extent = (float(coordinates[0]), float(coordinates[-1]), n)
        if extent != self._extent:
            self._extent = extent
            self._user_range = False
            self._plot.getViewBox().setRange(rect, padding=0.0)
        self._set_labels(scene)
        if scene.marker is not None:
            self._marker.setData([scene.marker[0]], [scene.marker[1]])
        else:
            self._marker.setData([], [])
        # An empty item still costs a paint call: hidden unless it has something to draw.
        self._marker.setVisible(scene.marker is not None)
        if self._external_contours and scene.contours is None:
            self._contour_timer.stop()
            self._contours_pending = False
            self._clear_contours()  # the owner traces them off the GUI thread: show_contours
        else:
            self._schedule_contours()
        if self._cursor_shown:
            self._draw_cursor(self._v_line.value(), self._h_line.value())

    def _fit_title(self) -> None:
        """Title and plane lines sized (or shortened, the full text in the tip) to the panel."""
        scene = self._scene
        if scene is None:
            return
        room = max(float(self._title.width()) - 12.0, 40.0)
        title, title_size = fitted_line(scene.title, room, (11.0, 10.0, 9.0))
        plane, plane_size = fitted_line(scene.plane_text, room, (9.0, 8.0))
        text = (
            f'<span style="font-size:{title_size:g}pt; color:{AXIS_COLOUR}">{html.escape(title)}</span><br>'
            f'<span style="font-size:{plane_size:g}pt; color:{MUTED_TEXT}">{html.escape(plane)}</span>'
        )
        if text != self._title.text():
            self._title.setText(text)
            self._title.setToolTip(f"{scene.title}\n{scene.spec} under {model_title(scene.model)}; "
                                   f"{scene.plane_text}")

    def title_text(self) -> str:
        """The title as shown (plain text; shortened with … when the panel is narrow)."""
        document = QTextDocument()
        document.setHtml(self._title.text())
        return document.toPlainText()

    def _set_labels(self, scene: SliceScene) -> None:
        self._fit_title()
        labels = (*scene.axis_labels, scene.value_label, scene.quantity, scene.colour_map)
        if labels == self._labels:  # text layout is the slow part of a redraw; skip when unchanged
            return
        self._labels = labels
        self._plot.setLabel("bottom", html.escape(scene.axis_labels[0]), **label_style())
        self._plot.setLabel("left", html.escape(scene.axis_labels[1]), **label_style())
        value_tip = quantity_tooltip(scene.quantity, scene.value_label)
        if scene.signed:
            positive, negative = sign_colours(scene.colour_map)
            value_tip += f"\n{positive.capitalize()} positive, {negative} negative; black line: ψ = 0 (node)"
        for bar in self._bars.values():
            bar.axis.setLabel(html.escape(scene.value_label), **label_style())
            for item in (bar.axis, bar.axis.label, bar):
                item.setToolTip(value_tip)
        self._readout.setToolTip(value_tip)
        for side, name in (("bottom", scene.axis_labels[0]), ("left", scene.axis_labels[1])):
            symbol, unit = split_label(name)
            tip = f"{symbol}: coordinate in the slice plane (see the line under the title)\nUnits: {unit}"
            axis = self._plot.getAxis(side)
            axis.setToolTip(tip)
            axis.label.setToolTip(tip)

    def set_empty_message(self, text: str) -> None:
        """Clear the view and show ``text`` instead.

        Parameters
        ----------
        text : str
            E.g. a start-up hint; later ``set_scene(None)`` shows it again.
        """
        self._empty_message = text
        self._show_message()

    def _show_message(self) -> None:
        self._scene = None
        self._contour_timer.stop()
        self._contours_pending = False
        self._clear_contours()
        self._image.clear()
        self._frame.setRect(QRectF())
        self._hide_cursor()
        self._view_frame.show_message(self._empty_message)

    def set_colour_range(self, low: float, high: float) -> None:
        """Map the colours over [low, high] until the next scene.

        Parameters
        ----------
        low, high : float
            Limits in ``scene.image`` units (log10 units on a log scale).

        Raises
        ------
        ValueError
            Unless both are finite and ``low < high``.
        """
        if not (math.isfinite(low) and math.isfinite(high) and high > low):
            raise ValueError(f"colour range: need finite low < high, got ({low}, {high})")
        for bar in self._bars.values():
            bar.setLevels((float(low), float(high)))

    def set_point_of(self, point_of: PointOf | None) -> None:
        """Let the read-out show Cartesian coordinates too.

        Parameters
        ----------
        point_of : callable (u, v) -> (x, y, z), or None
            Maps in-plane coordinates to x, y, z, all in the scene's length unit.
            ``None`` shows u and v only.
        """
        self._point_of = point_of

    # -- contours ------------------------------------------------------------------------

    def use_external_contours(self, external: bool) -> None:
        """Let the owner trace contours (off the GUI thread) and hand them to :meth:`show_contours`.

        Scenes without traced contours then show none until ``show_contours`` is called.
        """
        self._external_contours = bool(external)

    def show_contours(self, scene: SliceScene) -> None:
        """Draw the traced contours of ``scene`` if it is the scene on screen (same image)."""
        current = self._scene
        if current is None or scene.contours is None or scene.image is not current.image:
            return
        if not self._contours_enabled:
            return
        self._scene = scene
        self._draw_contours()

    def set_contours_enabled(self, enabled: bool) -> None:
        """Draw contour lines or skip them entirely.

        Parameters
        ----------
        enabled : bool
            True (the default) traces them after each new image; False clears them.
        """
        self._contours_enabled = bool(enabled)
        if self._contours_enabled:
            self._schedule_contours()
        else:
            self._contour_timer.stop()
            self._contours_pending = False
            self._clear_contours()

    def _schedule_contours(self) -> None:
        if not self._contours_enabled or self._scene is None:
            return
        # Traced once the image has been painted (see eventFilter); the fallback
        # covers a view that is not on screen. A newer scene restarts the wait.
        self._contours_pending = True
        self._contour_timer.start(_CONTOUR_FALLBACK_MS)

    def eventFilter(self, watched: QObject, event: QEvent) -> bool:  # Qt override
        """Start the contours after a paint; hide the cursor on leave; take Shift + drags."""
        kind = event.type()
        if kind == QEvent.Type.Paint and self._contours_pending:
            self._contour_timer.start(0)
        elif kind == QEvent.Type.Leave:
            self._leave()
        elif kind in _MOUSE_EVENTS and isinstance(event, QMouseEvent) and self._segment_mouse(event):
            return True  # a profile segment: pyqtgraph must not also pan or click
        return super().eventFilter(watched, event)

    def _draw_contours(self) -> None:
        self._contours_pending = False
        scene = self._scene
        if scene is None or not self._contours_enabled:
            return
        if scene.contours is not None:  # traced with the scene, off the GUI thread
            paths = scene.contours
            for item, points in zip(self._contour_items,
                                    (paths.positive, paths.negative, paths.zero), strict=True):
                item.setData(points[:, 0], points[:, 1]) if len(points) else item.setData([], [])
            self._contour_levels = paths.levels
            self.contours_drawn.emit()
            return
        import contourpy  # lazily: only needed once a slice is shown

        step = max(1, math.ceil(scene.image.shape[0] / CONTOUR_POINTS))
        image = np.asarray(scene.image[::step, ::step], dtype=float)
        if not np.all(np.isfinite(image)):
            image = np.ma.masked_invalid(image)  # contourpy leaves masked points out
        coordinates = np.asarray(scene.coordinates, dtype=float)[::step]
        generator = contourpy.contour_generator(coordinates, coordinates, image,
                                                line_type=contourpy.LineType.ChunkCombinedNan)
        groups: list[list[np.ndarray]] = [[], [], []]
        drawn: list[float] = []
        levels = [float(x) for x in scene.levels if x != 0.0]
        if scene.zero_contour:
            levels.append(0.0)
        nodal = None
        if scene.zero_contour:
            # Nodal lines from the field with exact zeros masked (see zero_contour_field).
            field = np.ma.masked_invalid(scene.zero_contour_field()[::step, ::step])
            nodal = contourpy.contour_generator(coordinates, coordinates, field,
                                                line_type=contourpy.LineType.ChunkCombinedNan)
        for level in levels:
            source = nodal if level == 0.0 and nodal is not None else generator
            lines = [chunk for chunk in source.lines(level)[0] if chunk is not None and len(chunk)]
            if not lines:
                continue
            drawn.append(level)
            # Negative levels of a signed quantity are dashed (a log density's are not "negative").
            group = groups[2] if level == 0.0 else groups[1] if level < 0 and scene.signed else groups[0]
            for chunk in lines:
                group.append(chunk)
                group.append(np.full((1, 2), np.nan))
        for item, group in zip(self._contour_items, groups, strict=True):
            if group:
                points = np.concatenate(group)
                item.setData(points[:, 0], points[:, 1])
            else:
                item.setData([], [])
        self._contour_levels = tuple(drawn)
        self.contours_drawn.emit()

    def _clear_contours(self) -> None:
        for item in self._contour_items:
            item.setData([], [])
        self._contour_levels = ()

    # -- line profile --------------------------------------------------------------------

    def _segment_mouse(self, event: QMouseEvent) -> bool:
        """Draw a segment from a Shift + left press to the release; True if the event was used."""
        kind = event.type()
        pixel = event.position().toPoint()
        if kind == QEvent.Type.MouseButtonPress:
            shifted = bool(event.modifiers() & Qt.KeyboardModifier.ShiftModifier)
            if (self._scene is None or event.button() != Qt.MouseButton.LeftButton or not shifted):
                return False
            point = self._plane_point(pixel)
            if point is None:
                return False  # on an axis or the colour bar: leave it to pyqtgraph
            self._drag_start, self._drag_pixel = point, pixel
            self._graphics.viewport().setCursor(Qt.CursorShape.CrossCursor)
            self._leave()  # the crosshair would sit at the start and hide the segment's end
            return True
        if self._drag_start is None:
            return False
        if self._scene is None:  # the scene went away mid-drag (e.g. a failed recompute)
            self.clear_profile()
            return True
        # Once started, the drag is ours whatever the modifiers: letting go of Shift
        # half-way should not turn the rest of it into a pan.
        end = self._view_point(pixel)
        if kind == QEvent.Type.MouseMove:
            if self._long_enough(pixel):
                self._show_segment((self._drag_start, end))
                self._show_segment_readout(self._drag_start, end)
            return True
        if kind == QEvent.Type.MouseButtonRelease and event.button() == Qt.MouseButton.LeftButton:
            start = self._drag_start
            self._drag_start = None
            self._graphics.viewport().unsetCursor()
            if self._long_enough(pixel):
                self._finish_segment(start, end)
            else:  # too short to be a segment: keep showing the one kept before, if any
                self._show_segment(self._segment)
                self._hide_cursor()
            return True
        return True  # other buttons while drawing: ignored, not a pan

    def _long_enough(self, pixel: QPoint) -> bool:
        return (pixel - self._drag_pixel).manhattanLength() >= QApplication.startDragDistance()

    def _view_point(self, pixel: QPoint) -> tuple[float, float]:
        """Plane coordinates (u, v) under a viewport pixel."""
        point = self._plot.getViewBox().mapSceneToView(self._graphics.mapToScene(pixel))
        return float(point.x()), float(point.y())

    def _plane_point(self, pixel: QPoint) -> tuple[float, float] | None:
        """(u, v) under a viewport pixel inside the plot area, or None outside it."""
        box = self._plot.getViewBox()
        if not box.sceneBoundingRect().contains(self._graphics.mapToScene(pixel)):
            return None
        return self._view_point(pixel)

    def _finish_segment(self, start: tuple[float, float], end: tuple[float, float]) -> None:
        """Keep and draw the drawn segment, then emit :attr:`profile_requested`."""
        self._segment = (start, end)
        self._show_segment(self._segment)
        self._show_segment_readout(start, end)
        self.profile_requested.emit(start[0], start[1], end[0], end[1])

    def _show_segment(self, segment: tuple[tuple[float, float], tuple[float, float]] | None) -> None:
        for item in (self._segment_halo, self._segment_line, self._segment_ends):
            item.setVisible(segment is not None)  # an empty item still costs a paint call
        if segment is None:
            for item in (self._segment_halo, self._segment_line, self._segment_ends):
                item.setData([], [])
            return
        start, end = segment
        us, vs = [start[0], end[0]], [start[1], end[1]]
        self._segment_halo.setData(us, vs)
        self._segment_line.setData(us, vs)
        self._segment_ends.setData(us, vs, brush=[pg.mkBrush(_SEGMENT_COLOUR), pg.mkBrush(_SEGMENT_HALO)])

    def _show_segment_readout(self, start: tuple[float, float], end: tuple[float, float]) -> None:
        assert self._scene is not None
        (u_name, unit), (v_name, _) = (split_label(a) for a in self._scene.axis_labels)
        length = math.hypot(end[0] - start[0], end[1] - start[1])
        self._readout.setText(
            f"Profile from ({html.escape(u_name)}, {html.escape(v_name)}) = "
            f"({format_number(start[0])}, {format_number(start[1])}) to "
            f"({format_number(end[0])}, {format_number(end[1])}) {html.escape(unit)}, "
            f"<b>length {format_number(length)} {html.escape(unit)}</b>")

    @Slot(float, float, float, float)
    def set_profile_segment(self, start_u: float, start_v: float, end_u: float, end_v: float) -> None:
        """Draw a profile segment given from elsewhere (e.g. another panel's); emits nothing.

        Parameters
        ----------
        start_u, start_v, end_u, end_v : float
            The ends in the scene's length unit; the start gets the dark dot.

        Raises
        ------
        ValueError
            If an end is not finite.
        """
        ends = (float(start_u), float(start_v), float(end_u), float(end_v))
        if not all(math.isfinite(x) for x in ends):
            raise ValueError(f"profile segment: the ends must be finite, got {ends}")
        self._segment = ((ends[0], ends[1]), (ends[2], ends[3]))
        self._show_segment(self._segment)

    @Slot()
    def clear_profile(self) -> None:
        """Remove the profile segment (and stop a segment being dragged)."""
        self._segment = None
        if self._drag_start is not None:
            self._drag_start = None
            self._graphics.viewport().unsetCursor()
        self._show_segment(None)

    def profile_segment(self) -> tuple[tuple[float, float], tuple[float, float]] | None:
        """((start_u, start_v), (end_u, end_v)) of the segment kept, or None."""
        return self._segment

    def segment_data(self) -> tuple[np.ndarray, np.ndarray]:
        """(u, v) arrays of the segment line as drawn (empty when none)."""
        xs, ys = self._segment_line.getData()
        if xs is None or ys is None:
            return np.empty(0), np.empty(0)
        return np.asarray(xs, dtype=float), np.asarray(ys, dtype=float)

    def current_scene(self) -> SliceScene | None:
        """The scene on screen (what a line profile samples), or None."""
        return self._scene

    # -- linking and cursor --------------------------------------------------------------

    def link_axes(self, other: SliceView) -> None:
        """Share both in-plane axes (pan and zoom) with ``other``.

        Parameters
        ----------
        other : SliceView
            The view to follow and be followed by (and every view linked to it).

        Notes
        -----
        Linked views show the same range of u and v. pyqtgraph's own axis links line
        views up by screen pixel, which shifts the range of panels side by side whose
        plot areas differ by a pixel; the range is copied instead.
        """
        if other is self or other._group is self._group:
            return
        group = self._group
        for view in other._group.views:
            view._group = group
            group.views.append(view)
        self._share_range()

    @Slot(float, float)
    def show_cursor(self, u: float, v: float) -> None:
        """Show a cursor driven from elsewhere (e.g. another view's :attr:`hovered`).

        Parameters
        ----------
        u, v : float
            In-plane point in the scene's length unit; NaN hides the cursor.

        Notes
        -----
        Draws the crosshair and the read-out, but emits nothing.
        """
        if self._scene is None or not (math.isfinite(u) and math.isfinite(v)):
            self._hide_cursor()
            return
        self._draw_cursor(u, v)

    def _on_mouse_clicked(self, event: Any) -> None:
        if self._scene is None or event.button() != Qt.MouseButton.LeftButton:
            return
        box = self._plot.getViewBox()
        position = event.scenePos()
        point = box.mapSceneToView(position)
        if box.sceneBoundingRect().contains(position) and self._pixel(point.x(), point.y()) is not None:
            self.clicked.emit(point.x(), point.y())

    def marker_position(self) -> tuple[float, float] | None:
        """(u, v) of the marked point on screen, or None."""
        xs, ys = self._marker.getData()
        return (float(xs[0]), float(ys[0])) if len(xs) else None

    def _on_mouse_moved(self, position: QPointF) -> None:
        if self._scene is None:
            return
        box = self._plot.getViewBox()
        point = box.mapSceneToView(position)
        u, v = point.x(), point.y()
        if not box.sceneBoundingRect().contains(position) or self._pixel(u, v) is None:
            self._leave()
            return
        self._draw_cursor(u, v)
        self.hovered.emit(u, v)

    def _leave(self) -> None:
        if self._cursor_shown:
            self._hide_cursor()
            self.hovered.emit(math.nan, math.nan)

    def _pixel(self, u: float, v: float) -> tuple[int, int] | None:
        """(j, i) of the grid point nearest to (u, v), or None off the image."""
        assert self._scene is not None
        c = self._scene.coordinates
        n = c.size
        step = (c[-1] - c[0]) / (n - 1) if n > 1 else 1.0
        i = round(float((u - c[0]) / step))
        j = round(float((v - c[0]) / step))
        if 0 <= i < n and 0 <= j < n:
            return j, i
        return None

    def _draw_cursor(self, u: float, v: float) -> None:
        assert self._scene is not None
        scene = self._scene
        self._v_line.setPos(u)
        self._h_line.setPos(v)
        self._v_line.show()
        self._h_line.show()
        self._cursor_shown = True
        (u_name, unit), (v_name, _) = (split_label(a) for a in scene.axis_labels)
        text = (f"<b>{html.escape(u_name)} = {format_number(u)}</b>, "
                f"<b>{html.escape(v_name)} = {format_number(v)}</b> {html.escape(unit)}")
        if self._point_of is not None:
            x, y, z = self._point_of(u, v)
            text += (f"&nbsp;&nbsp;(x, y, z) = ({format_number(x)}, {format_number(y)}, "
                     f"{format_number(z)}) {html.escape(unit)}")
        pixel = self._pixel(u, v)
        symbol, value_unit = split_label(scene.value_label.removeprefix("log₁₀ "))
        value = float(scene.values[pixel]) if pixel is not None else math.nan
        text += (f"&nbsp;&nbsp;&nbsp;<b>{html.escape(symbol)} = {format_number(value)}</b> "
                 f"{html.escape(value_unit)}")
        self._readout.setText(text)

    def _hide_cursor(self) -> None:
        self._v_line.hide()
        self._h_line.hide()
        self._cursor_shown = False
        hint = ("Point at the image to read coordinates and the value; Shift + drag for a line profile."
                if self._scene is not None else "")
        self._readout.setText(f'<span style="color:{MUTED_TEXT}">{hint}</span>')

    # -- read-back (tests, exports of what is on screen) ----------------------------------

    def image_data(self) -> np.ndarray:
        """The array the image item shows (``scene.image`` units, ``[j, i]`` with j along v)."""
        data = self._image.image
        return np.empty((0, 0)) if data is None else np.asarray(data)

    def image_rect(self) -> tuple[float, float, float, float]:
        """(left, bottom, width, height) of the image in the scene's length unit."""
        rect = self._image.mapRectToParent(self._image.boundingRect())
        return rect.left(), rect.top(), rect.width(), rect.height()

    def colour_levels(self) -> tuple[float, float]:
        """The (low, high) image values mapped to the ends of the colour map."""
        levels = self._image.getLevels()
        return float(levels[0]), float(levels[1])

    def colour_bar_ends(self) -> tuple[str, str]:
        """Hex colours ``('#rrggbb', ...)`` of the low and the high end of the colour bar as drawn."""
        picture = self._colour_bar.bar.pixmap().toImage()
        low = picture.pixelColor(0, 0)
        high = picture.pixelColor(picture.width() - 1, picture.height() - 1)
        return low.name(), high.name()

    def colour_bar_orientation(self) -> str:
        """``"vertical"`` (bar beside the image) or ``"horizontal"`` (under it)."""
        return self._orientation

    def _on_screen(self, rect: QRectF) -> tuple[float, float, float, float]:
        area = self._graphics.mapFromScene(rect).boundingRect()
        return float(area.x()), float(area.y()), float(area.width()), float(area.height())

    def image_on_screen(self) -> tuple[float, float, float, float]:
        """(x, y, width, height) in pixels of the drawing area: the part of the image in view."""
        box = self._plot.getViewBox()
        image = self._image.mapRectToScene(self._image.boundingRect())
        return self._on_screen(image.intersected(box.sceneBoundingRect()))

    def plot_area_on_screen(self) -> tuple[float, float, float, float]:
        """(x, y, width, height) in pixels of the drawing area: the framed plot area."""
        return self._on_screen(self._plot.getViewBox().sceneBoundingRect())

    def drawing_area_size(self) -> tuple[int, int]:
        """(width, height) in pixels of the drawing area (the panel less its title and read-out)."""
        return self._graphics.width(), self._graphics.height()

    def contour_count(self) -> int:
        """How many contour levels are drawn (the zero contour included)."""
        return len(self._contour_levels)

    def contour_levels(self) -> tuple[float, ...]:
        """The drawn contour levels in ``scene.image`` units (0.0 for the zero contour)."""
        return self._contour_levels

    def cursor_position(self) -> tuple[float, float] | None:
        """(u, v) of the shown cursor, or ``None`` when hidden."""
        if not self._cursor_shown:
            return None
        return float(self._v_line.value()), float(self._h_line.value())

    def readout_text(self) -> str:
        """The read-out line below the image, as plain text."""
        return self._view_frame.readout_text()

    def empty_message(self) -> str | None:
        """The message shown instead of an image, or ``None`` when a scene is drawn."""
        return self._view_frame.shown_message()

"""The Trends view: one line per model against Z (or along a list), NIST's values beside them.

Each series is a line with a marker at every point; a gap is left where a model
refused or defines no such number, and the read-out under the plot says why. The
periodic-table blocks are shaded along a Z axis. With a reference (first ionization
energies) a second panel shows each series minus the measured values. Clicking a point
opens that configuration, under that series' model, in the other views.
"""

from __future__ import annotations

import html
import math
from typing import Any

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPointF, Qt, Signal
from PySide6.QtWidgets import QLabel, QVBoxLayout, QWidget

from zeffir.scene import TrendScene, line_colours
from zeffir.ui._plot_style import (
    AXIS_COLOUR,
    MUTED_TEXT,
    format_number,
    framed_axes,
    label_style,
    make_pen,
    style_plot,
)

__all__ = ["TrendView"]

_METHOD_DASH = {None: Qt.PenStyle.SolidLine, "koopmans": Qt.PenStyle.SolidLine,
                "delta-scf": Qt.PenStyle.DashLine}
_SYMBOLS = ("o", "s", "d", "t", "t1", "p", "h", "star")
_MODEL_DASH = (Qt.PenStyle.SolidLine, Qt.PenStyle.DashLine, Qt.PenStyle.DotLine, Qt.PenStyle.DashDotLine)
_BLOCK_BRUSH = {"s": (238, 238, 238), "p": (255, 255, 255), "d": (230, 237, 246), "f": (246, 239, 230)}
_EMPTY = ("Choose a quantity, the configurations and the models in the Trends group; "
          "one line per model appears here.")


class TrendView(QWidget):
    """Draws a :class:`~zeffir.scene.TrendScene`.

    Signals
    -------
    configuration_clicked(str, str)
        A point was clicked: its spec and the model of its series ("" for NIST's).
    """

    configuration_clicked = Signal(str, str)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._scene: TrendScene | None = None
        self.title = QLabel()
        self.title.setTextFormat(Qt.TextFormat.RichText)
        self.title.setAlignment(Qt.AlignmentFlag.AlignHCenter)
        self.graphics = pg.GraphicsLayoutWidget()
        self.graphics.setBackground("w")
        # The legend is a row of its own above the plots, so it never hides a point.
        self.legend = pg.LegendItem(labelTextColor=AXIS_COLOUR, labelTextSize="8pt", colCount=3,
                                    brush=pg.mkBrush(255, 255, 255, 0), pen=pg.mkPen(None))
        self.graphics.addItem(self.legend, row=0, col=0)
        self.main = self.graphics.addPlot(row=1, col=0, axisItems=framed_axes())
        self.difference = pg.PlotItem(axisItems=framed_axes())
        for plot in (self.main, self.difference):
            style_plot(plot)
        self.difference.setXLink(self.main)
        self.graphics.ci.layout.setRowStretchFactor(1, 2)
        # A short window still shows the plots; the widget's own minimum stays small, since a
        # tab's minimum is every tab's (1280×720 must fit with the line-profile dock open).
        self.main.setMinimumHeight(100)
        self.difference.setMinimumHeight(50)
        self.graphics.setMinimumHeight(150)
        self.readout = QLabel(_EMPTY)
        self.readout.setWordWrap(True)
        self.readout.setStyleSheet(f"color: {MUTED_TEXT};")
        layout = QVBoxLayout(self)
        layout.setContentsMargins(4, 4, 4, 4)
        layout.addWidget(self.title)
        layout.addWidget(self.graphics, 1)
        layout.addWidget(self.readout)
        self._items: list[Any] = []
        self._lines: dict[str, tuple[np.ndarray, np.ndarray]] = {}
        self.graphics.scene().sigMouseMoved.connect(self._on_moved)
        self.graphics.scene().sigMouseClicked.connect(self._on_clicked)
        self.main.getViewBox().sigRangeChanged.connect(self._place_letters)

    # -- drawing ---------------------------------------------------------------------
    def show_scene(self, scene: TrendScene) -> None:
        """Draw ``scene`` (replacing what is drawn)."""
        self._scene = scene
        for plot in (self.main, self.difference):
            plot.clear()
        self.legend.clear()
        self._items.clear()
        self._lines.clear()
        self.title.setText(f'<span style="font-size:11pt; color:{AXIS_COLOUR}">{html.escape(scene.title)}'
                           "</span>")
        styles = line_colours(scene)
        self._shade(self.main, scene, letters=True)
        for index, line in enumerate(scene.lines):
            item = self._line(self.main, line, styles[index], index)
            empty = all(math.isnan(v) for v in line.y)
            self.legend.addItem(item, html.escape(f"{line.name}{' (no values)' if empty else ''}"))
            self._lines[line.name] = (np.asarray(line.x), np.asarray(line.y))
        if scene.reference is not None:
            ref = pg.ScatterPlotItem(list(scene.reference.x), list(scene.reference.y), symbol="o", size=8,
                                     pen=make_pen("#000000", 1.4), brush=None)
            ref.setZValue(5)
            self.main.addItem(ref)
            self.legend.addItem(ref, html.escape(scene.reference.name))
            self._lines[scene.reference.name] = (np.asarray(scene.reference.x), np.asarray(scene.reference.y))
            self._shade(self.difference, scene, letters=False)
            for index, line in enumerate(scene.differences):
                self._line(self.difference, line, styles[index], index)
            zero = pg.InfiniteLine(pos=0.0, angle=0, pen=make_pen("#606060", 1.0))
            self.difference.addItem(zero)
            unit = f" / {scene.unit}" if scene.unit else ""
            self.difference.setLabel("left", f"computed −<br>NIST{html.escape(unit)}", **label_style(8))
            self.difference.setLabel("bottom", html.escape(scene.x_label), **label_style())
            if self.difference.scene() is None:  # a row of its own only while it has content
                self.graphics.addItem(self.difference, row=2, col=0)
                self.graphics.ci.layout.setRowStretchFactor(2, 1)
            self.main.setLabel("bottom", "")
        else:
            if self.difference.scene() is not None:
                self.graphics.removeItem(self.difference)
            self.main.setLabel("bottom", html.escape(scene.x_label), **label_style())
        self.main.setLabel("left", html.escape(scene.y_label), **label_style())
        bottom = self.difference if scene.reference is not None else self.main
        axis = bottom.getAxis("bottom")
        axis.setTicks(None if scene.by_z else [[(x, text) for x, text in scene.x_ticks]])
        self.main.getAxis("bottom").setStyle(showValues=scene.reference is None)
        self.main.autoRange()
        if scene.reference is not None:
            self.difference.autoRange()
        self._place_letters()
        self.readout.setText(self._summary(scene))

    def _line(self, plot: pg.PlotItem, line: Any, style: tuple[str, int], index: int) -> pg.PlotDataItem:
        colour, rank = style
        dash = _METHOD_DASH.get(line.method, Qt.PenStyle.SolidLine)
        if line.subshell is not None and rank:  # several subshells: the model sets the style
            dash = _MODEL_DASH[rank % len(_MODEL_DASH)]
        pen = make_pen(colour, 1.6, dash)
        item = pg.PlotDataItem(list(line.x), list(line.y), pen=pen, connect="finite",
                               symbol=_SYMBOLS[index % len(_SYMBOLS)], symbolSize=6,
                               symbolPen=make_pen(colour, 1.0), symbolBrush=pg.mkBrush(colour),
                               antialias=True)
        item.setZValue(3)
        plot.addItem(item)
        return item

    def _shade(self, plot: pg.PlotItem, scene: TrendScene, letters: bool) -> None:
        for start, stop, letter in scene.blocks:
            if letter == "p":
                continue  # the white ground
            region = pg.LinearRegionItem(values=(start, stop), movable=False,
                                         brush=pg.mkBrush(*_BLOCK_BRUSH.get(letter, (255, 255, 255))),
                                         pen=pg.mkPen(None))
            region.setZValue(-20)
            plot.addItem(region, ignoreBounds=True)
        if not letters:
            return
        for start, stop, letter in scene.blocks:
            if stop - start < 2:
                continue
            text = pg.TextItem(f"{letter} block", color=MUTED_TEXT, anchor=(0.5, 0.0))
            text.setZValue(-10)
            plot.addItem(text, ignoreBounds=True)
            self._items.append((text, (start + stop) / 2))

    def _place_letters(self, *_args: object) -> None:
        top = self.main.getViewBox().viewRange()[1][1]
        for text, x in self._items:
            text.setPos(x, top)

    @staticmethod
    def _summary(scene: TrendScene) -> str:
        gaps = sum(math.isnan(v) for line in scene.lines for v in line.y)
        points = sum(len(line.y) for line in scene.lines)
        tail = f"; {gaps} of {points} points are gaps (point at them for the reason)" if gaps else ""
        return f"Point at a configuration to read every series there; click a point to open it{tail}."

    # -- reading ---------------------------------------------------------------------
    def _x_at(self, position: QPointF) -> float | None:
        for plot in (self.main, self.difference):
            box = plot.getViewBox()
            if plot.scene() is not None and box.sceneBoundingRect().contains(position):
                return float(box.mapSceneToView(position).x())
        return None

    def _nearest_index(self, x: float) -> int | None:
        if self._scene is None or not self._scene.lines:
            return None
        xs = np.asarray(self._scene.lines[0].x)
        if xs.size == 0:
            return None
        index = int(np.argmin(np.abs(xs - x)))
        return index if abs(xs[index] - x) <= 0.5 else None

    def readout_at(self, x: float) -> str:
        """The read-out for the configuration nearest ``x`` (every series there, gaps with why)."""
        scene = self._scene
        index = self._nearest_index(x)
        if scene is None or index is None:
            return ""
        first = scene.lines[0]
        parts = []
        unit = f" {scene.unit}" if scene.unit else ""
        for line in scene.lines:
            value = line.y[index]
            notes = [n for n in line.notes[index] if not n.startswith("valence subshell")]
            if math.isnan(value):
                parts.append(f"{line.name}: gap — {'; '.join(notes) or 'no value'}")
            else:
                parts.append(f"{line.name}: {format_number(value)}{unit}")
        if scene.reference is not None and first.specs[index] in scene.reference.specs:
            where = scene.reference.specs.index(first.specs[index])
            parts.append(f"{scene.reference.name}: {format_number(scene.reference.y[where])}{unit}")
        valence = next((n for n in first.notes[index] if n.startswith("valence subshell")), "")
        head = first.specs[index] + (f" ({valence})" if valence else "")
        return f"{head} — " + " · ".join(parts)

    def _on_moved(self, position: QPointF) -> None:
        x = self._x_at(position)
        if x is None:
            return
        text = self.readout_at(x)
        if text:
            self.readout.setText(text)

    def _on_clicked(self, event: Any) -> None:
        x = self._x_at(event.scenePos())
        if x is None or self._scene is None:
            return
        index = self._nearest_index(x)
        if index is None:
            return
        y = float(self.main.getViewBox().mapSceneToView(event.scenePos()).y())
        self.click_point(index, y)

    def click_point(self, index: int, y: float | None = None) -> None:
        """Open configuration ``index`` under the model of the series nearest ``y`` there."""
        scene = self._scene
        if scene is None or not scene.lines:
            return
        spec = scene.lines[0].specs[index]
        drawn = [(abs(line.y[index] - y) if y is not None else 0.0, line.model or "")
                 for line in scene.lines if not math.isnan(line.y[index])]
        model = min(drawn)[1] if drawn else (scene.lines[0].model or "")
        self.configuration_clicked.emit(spec, model)

    def line_data(self) -> dict[str, tuple[np.ndarray, np.ndarray]]:
        """x and y of every drawn series (and the reference), by name."""
        return dict(self._lines)

    def current_scene(self) -> TrendScene | None:
        """The scene on screen."""
        return self._scene

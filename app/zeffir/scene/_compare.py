"""Comparisons: several series on shared axes and colour scale, and the difference of two.

A series is one atom under one model (a :class:`~zeffir.state.Source`). The first
series is the main atom; the comparison settings add the others
(:meth:`~zeffir.state.CompareSettings.sources`). With exactly two series a
difference panel (second − first) can be drawn.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from typing import Any

import numpy as np

from zeffir.scene._build import orbitals_for, short_model_name
from zeffir.scene._radial import Curve, RadialScene, radial_range, radial_scene
from zeffir.scene._slice import SliceScene, colour_scale, contour_levels, slice_scene
from zeffir.state import Source, ViewState, reconcile_orbital

__all__ = ["RadialComparison", "SliceComparison", "compare_radial", "compare_slices",
           "difference_title", "series_names"]


def difference_title(left_spec: str, left_model: str, right_spec: str, right_model: str) -> str:
    """Title of a right − left panel, naming only what differs, with the models' display names.

    Examples
    --------
    >>> difference_title("Ne", "slater", "Ar", "slater")
    'Ar − Ne (Slater)'
    """
    left_model, right_model = short_model_name(left_model), short_model_name(right_model)
    if left_spec == right_spec:
        return f"{left_spec}: {right_model} − {left_model}"
    if left_model == right_model:
        return f"{right_spec} − {left_spec} ({left_model})"
    return f"({right_spec}, {right_model}) − ({left_spec}, {left_model})"


def series_names(sources: tuple[Source, ...] | list[Source]) -> tuple[str, ...]:
    """Legend names of several series: the model alone when every series is one atom.

    Examples
    --------
    >>> series_names([Source("Na", "slater"), Source("Na", "clementi")])
    ('Slater', 'Clementi–Raimondi')
    """
    one_atom = len({s.spec for s in sources}) == 1
    return tuple(short_model_name(s.model) if one_atom else f"{s.spec}, {short_model_name(s.model)}"
                 for s in sources)


class _SeriesPanels:
    """What both comparisons share: the first two series by name, and the panels in order."""

    series: tuple[Any, ...]
    difference: Any

    @property
    def left(self) -> Any:
        """The first series (the main atom)."""
        return self.series[0]

    @property
    def right(self) -> Any:
        """The second series."""
        return self.series[1]

    def _shown(self) -> tuple[tuple[str, object], ...]:
        return tuple((f"series {i + 1}", scene) for i, scene in enumerate(self.series))

    @property
    def panels(self) -> tuple[Any, ...]:
        """What is drawn, in order: the series (or their overlay), then the difference."""
        return tuple(scene for _, scene in self._named())

    @property
    def panel_names(self) -> tuple[str, ...]:
        """A name per panel: ``series 1``… (or ``overlay``), then ``difference``."""
        return tuple(name for name, _ in self._named())

    def _named(self) -> tuple[tuple[str, object], ...]:
        extra = (("difference", self.difference),) if self.difference is not None else ()
        return (*self._shown(), *extra)


@dataclass(frozen=True)
class RadialComparison(_SeriesPanels):
    """Radial scenes of several series on one r grid.

    Attributes
    ----------
    series : tuple of RadialScene
        One scene per series, the main atom first.
    difference : RadialScene or None
        Second − first, curve by curve (matched by subshell); only for two series.
    overlay : RadialScene or None
        Every series' curves on one set of axes (when the settings ask for it).
    """

    series: tuple[RadialScene, ...]
    difference: RadialScene | None = None
    overlay: RadialScene | None = None

    def _shown(self) -> tuple[tuple[str, object], ...]:
        return (("overlay", self.overlay),) if self.overlay is not None else super()._shown()


@dataclass(frozen=True)
class SliceComparison(_SeriesPanels):
    """Slices of several series on one colour scale, and second − first for two series."""

    series: tuple[SliceScene, ...]
    difference: SliceScene | None = None


def compare_radial(state: ViewState) -> RadialComparison:
    """Evaluate every series of ``state`` for the radial view on a shared radial range.

    With two series the difference (second − first) is computed unless the settings
    leave it out; with ``compare.overlay`` the curves are also gathered on one set of
    axes, each series in its own line style.
    """
    sources = state.series()
    spans = [radial_range(orbitals_for(s), state.radial) for s in sources]
    span = (min(a for a, _ in spans), max(b for _, b in spans))
    highlight = state.orbital.subshell
    scenes = tuple(radial_scene(s, state.radial, state.length_unit, highlight, span) for s in sources)
    difference = None
    if len(scenes) == 2 and state.compare.show_difference:
        left, right = scenes
        # Match curves by subshell (None is the whole atom): labels carry occupancies,
        # which differ between two atoms.
        right_curves = {c.subshell: c for c in right.curves}
        diff = tuple(
            Curve(c.subshell or c.label, c.subshell, c.x, right_curves[c.subshell].y - c.y)
            for c in left.curves if c.subshell in right_curves
        )
        difference = replace(
            left,
            title=difference_title(left.spec, left.model, right.spec, right.model),
            y_label=f"Δ{left.y_label}",
            curves=diff,
            markers=(),
        )
    overlay = _overlay(scenes, sources) if state.compare.overlay and len(scenes) > 1 else None
    return RadialComparison(scenes, difference, overlay)


def _overlay(scenes: tuple[RadialScene, ...], sources: tuple[Source, ...]) -> RadialScene:
    """Every series' curves on one set of axes; curve and marker carry their series index."""
    names = series_names(sources)
    curves = tuple(replace(c, label=f"{c.label} · {names[i]}", series=i)
                   for i, scene in enumerate(scenes) for c in scene.curves)
    markers = tuple(replace(m, series=i) for i, scene in enumerate(scenes) for m in scene.markers)
    first = scenes[0]
    specs = dict.fromkeys(s.spec for s in scenes)
    # The legend names each series; the title stays short enough for a journal column.
    title = (f"{first.spec}: " + " · ".join(names) if len(specs) == 1
             else f"{', '.join(specs)}: {len(scenes)} series")
    return replace(first, title=title, curves=curves, markers=markers, series_names=names)


def compare_slices(state: ViewState) -> SliceComparison:
    """Evaluate every series for the slice view with one colour scale, plus the difference.

    The difference (two series only) is taken of the physical values (not of log
    values), so it is always drawn on a linear diverging scale symmetric about zero.
    """
    scenes = [slice_scene(source, reconcile_orbital(source.spec, state.orbital), state.slice,
                          state.length_unit) for source in state.series()]
    low = min(s.colour_range[0] for s in scenes)
    high = max(s.colour_range[1] for s in scenes)
    levels = contour_levels(low, high, state.slice.contours, scenes[0].signed)
    shared = tuple(replace(s, colour_range=(low, high), levels=levels) for s in scenes)
    difference = None
    if len(shared) == 2 and state.compare.show_difference:
        left, right = shared
        delta = right.values - left.values
        d_range = colour_scale(delta, signed=True, log_scale=False, robust=not state.slice.full_range)
        difference = replace(
            left,
            title=difference_title(left.spec, left.model, right.spec, right.model),
            orbital=left.orbital,
            value_label=f"Δ{left.value_label.removeprefix('log₁₀ ')}",
            values=delta,
            image=delta,
            signed=True,
            log_scale=False,
            colour_range=d_range,
            levels=contour_levels(*d_range, state.slice.contours, True),
            zero_contour=True,
        )
        assert np.shares_memory(difference.values, delta)
    return SliceComparison(shared, difference)


"""Which scene each view draws and which parts of the state it depends on: one place.

The window computes a view with :func:`view_scene` and recomputes it only when
:func:`view_inputs` changes; the exporters write :func:`view_scene` of the same
state. Every result has ``panels`` (the scenes drawn, in order) and
``panel_names``.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from typing import Any, Final

from zeffir.scene._compare import RadialComparison, SliceComparison, compare_radial, compare_slices
from zeffir.scene._framing import with_fitted_extent
from zeffir.scene._pairs import PairScenes, TwoElectronScenes, pair_scenes, two_electron_scenes
from zeffir.scene._radial import RadialScene, radial_scene
from zeffir.scene._slice import SliceScene, slice_scene
from zeffir.state import ViewState

__all__ = ["FIGURE_VIEWS", "VIEW_RECIPES", "ViewRecipe", "ViewScenes", "panels_of", "view_inputs",
           "view_scene"]

#: What a figure view computes (the Trends view's TrendScene is written by its own writer).
ViewScenes = (RadialScene | SliceScene | RadialComparison | SliceComparison | PairScenes
              | TwoElectronScenes)


@dataclass(frozen=True)
class ViewRecipe:
    """How one view is computed.

    Attributes
    ----------
    name : str
        The view's name in :class:`~zeffir.state.ViewState` (``state.view``).
    inputs : callable
        ``inputs(state)`` → the parts of the state the picture depends on; equal
        inputs mean an equal picture.
    build : callable
        ``build(state)`` → what the view draws (scenes with ``panels``), or for the
        Terms view its table.
    """

    name: str
    inputs: Callable[[ViewState], tuple[object, ...]]
    build: Callable[[ViewState], Any]


def _radial(state: ViewState) -> RadialScene | RadialComparison:
    if state.compare.enabled:
        return compare_radial(state)
    return radial_scene(state.left, state.radial, state.length_unit, state.orbital.subshell)


def _slice(state: ViewState) -> SliceScene | SliceComparison:
    state = with_fitted_extent(state)
    if state.compare.enabled:
        return compare_slices(state)
    return slice_scene(state.left, state.orbital, state.slice, state.length_unit)


def _terms(state: ViewState) -> Any:
    from zeffir.scene._terms import terms_summary

    return terms_summary(state.left.spec)


def _trends(state: ViewState) -> Any:
    from zeffir.scene._trends import trends_view

    return trends_view(state.trends, state.length_unit)


def _compare_inputs(state: ViewState) -> tuple[object, ...]:
    """The comparison as drawn: its series and layout (not the settings of a hidden one)."""
    compare = state.compare
    if not compare.enabled:
        return (False,)
    return (state.series(), compare.has_difference(), compare.overlay)


VIEW_RECIPES: Final[dict[str, ViewRecipe]] = {
    recipe.name: recipe for recipe in (
        ViewRecipe("radial", lambda s: (s.left, s.length_unit, s.radial, s.orbital.subshell,
                                        _compare_inputs(s)), _radial),
        ViewRecipe("slice", lambda s: (s.left, s.length_unit, s.slice, s.orbital,
                                       _compare_inputs(s)[:2]), _slice),
        ViewRecipe("pair", lambda s: (s.left, s.length_unit, s.slice, s.pair),
                   lambda s: pair_scenes(with_fitted_extent(s))),
        ViewRecipe("two-electron", lambda s: (s.left, s.length_unit, s.two_electron, s.slice.contours),
                   two_electron_scenes),
        ViewRecipe("terms", lambda s: (s.left.spec,), _terms),
        ViewRecipe("trends", lambda s: (s.trends, s.length_unit), _trends),
    )
}
#: The views that draw figures of scenes (every view but the Terms table and the Trends
#: view, which :func:`zeffir.export.write_trend` draws).
FIGURE_VIEWS: Final[tuple[str, ...]] = tuple(name for name in VIEW_RECIPES if name not in ("terms", "trends"))


def view_inputs(state: ViewState, view: str | None = None) -> tuple[object, ...]:
    """The parts of ``state`` the named view (default: the current one) depends on."""
    return VIEW_RECIPES[view or state.view].inputs(state)


def view_scene(state: ViewState, view: str | None = None) -> Any:
    """What the named view (default: the current one) of a validated ``state`` draws."""
    return VIEW_RECIPES[view or state.view].build(state)


def panels_of(result: Any) -> tuple[Any, ...]:
    """The scenes a view result draws, in order (a single scene is one panel)."""
    panels = getattr(result, "panels", None)
    return tuple(panels) if panels is not None else (result,)

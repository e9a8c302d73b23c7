"""What the views show, computed from the view state by the core (no Qt, no plotting).

The window draws these scenes and the exporters write them, so an exported figure
or data file holds exactly what is on screen.
"""

from zeffir.scene._build import forget_failure, model_title, orbitals_for, short_model_name
from zeffir.scene._colours import (
    DIVERGING,
    DIVERGING_MAPS,
    LINE_COLOURS,
    MAP_TITLES,
    SEQUENTIAL,
    SEQUENTIAL_MAPS,
    colour_stops,
    sign_colours,
    subshell_colour,
)
from zeffir.scene._compare import (
    RadialComparison,
    SliceComparison,
    compare_radial,
    compare_slices,
    series_names,
)
from zeffir.scene._contours import CONTOUR_POINTS, ContourPaths, trace_contours
from zeffir.scene._framing import fitted_extent, with_fitted_extent
from zeffir.scene._pairs import (
    PairScenes,
    TwoElectronScenes,
    determinant_for,
    pair_scenes,
    two_electron_scenes,
)
from zeffir.scene._profile import PROFILE_POINTS, LineProfile, line_profile, values_label
from zeffir.scene._quantities import QUANTITIES, Quantity, length_factor, length_symbol, unit_text
from zeffir.scene._radial import Curve, Marker, RadialScene, radial_range, radial_scene
from zeffir.scene._slice import (
    LOG_DECADES,
    ColourSubject,
    SliceScene,
    colour_range,
    colour_scale,
    colour_subject,
    contour_levels,
    manual_range,
    orbital_name,
    plane_of,
    slice_scene,
)
from zeffir.scene._terms import (
    TermNote,
    TermRow,
    TermsSummary,
    level_symbol,
    term_symbol,
    terms_summary,
)
from zeffir.scene._trends import TrendLine, TrendScene, element_blocks, trend_scene, trends_view
from zeffir.scene._views import (
    FIGURE_VIEWS,
    VIEW_RECIPES,
    ViewRecipe,
    ViewScenes,
    panels_of,
    view_inputs,
    view_scene,
)

__all__ = [
    "CONTOUR_POINTS",
    "DIVERGING",
    "DIVERGING_MAPS",
    "FIGURE_VIEWS",
    "LINE_COLOURS",
    "LOG_DECADES",
    "MAP_TITLES",
    "PROFILE_POINTS",
    "QUANTITIES",
    "SEQUENTIAL",
    "SEQUENTIAL_MAPS",
    "VIEW_RECIPES",
    "ColourSubject",
    "ContourPaths",
    "Curve",
    "LineProfile",
    "Marker",
    "PairScenes",
    "Quantity",
    "RadialComparison",
    "RadialScene",
    "SliceComparison",
    "SliceScene",
    "TermNote",
    "TermRow",
    "TermsSummary",
    "TrendLine",
    "TrendScene",
    "TwoElectronScenes",
    "ViewRecipe",
    "ViewScenes",
    "colour_range",
    "colour_scale",
    "colour_stops",
    "colour_subject",
    "compare_radial",
    "compare_slices",
    "contour_levels",
    "determinant_for",
    "element_blocks",
    "fitted_extent",
    "forget_failure",
    "length_factor",
    "length_symbol",
    "level_symbol",
    "line_profile",
    "manual_range",
    "model_title",
    "orbital_name",
    "orbitals_for",
    "pair_scenes",
    "panels_of",
    "plane_of",
    "radial_range",
    "radial_scene",
    "series_names",
    "short_model_name",
    "sign_colours",
    "slice_scene",
    "subshell_colour",
    "term_symbol",
    "terms_summary",
    "trace_contours",
    "trend_scene",
    "trends_view",
    "two_electron_scenes",
    "unit_text",
    "values_label",
    "view_inputs",
    "view_scene",
    "with_fitted_extent",
]

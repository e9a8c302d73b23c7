"""What the views show, computed from the view state by the core (no Qt, no plotting).

The window draws these scenes and the exporters write them, so an exported figure
or data file holds exactly what is on screen.
"""

from zeffir.scene._build import forget_failure, model_title, orbitals_for, short_model_name
from zeffir.scene._colours import DIVERGING, LINE_COLOURS, SEQUENTIAL, colour_stops, subshell_colour
from zeffir.scene._compare import RadialComparison, SliceComparison, compare_radial, compare_slices
from zeffir.scene._contours import CONTOUR_POINTS, ContourPaths, trace_contours
from zeffir.scene._framing import fitted_extent, with_fitted_extent
from zeffir.scene._pairs import (
    PairScenes,
    TwoElectronScenes,
    determinant_for,
    hole_integral,
    pair_scenes,
    two_electron_scenes,
)
from zeffir.scene._profile import PROFILE_POINTS, LineProfile, line_profile
from zeffir.scene._quantities import QUANTITIES, Quantity, length_factor, length_symbol, unit_text
from zeffir.scene._radial import Curve, Marker, RadialScene, radial_range, radial_scene
from zeffir.scene._slice import (
    LOG_DECADES,
    SliceScene,
    colour_scale,
    contour_levels,
    orbital_name,
    plane_of,
    slice_scene,
)

__all__ = [
    "CONTOUR_POINTS",
    "DIVERGING",
    "LINE_COLOURS",
    "LOG_DECADES",
    "PROFILE_POINTS",
    "QUANTITIES",
    "SEQUENTIAL",
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
    "TwoElectronScenes",
    "colour_scale",
    "colour_stops",
    "compare_radial",
    "compare_slices",
    "contour_levels",
    "determinant_for",
    "fitted_extent",
    "forget_failure",
    "hole_integral",
    "length_factor",
    "length_symbol",
    "line_profile",
    "model_title",
    "orbital_name",
    "orbitals_for",
    "pair_scenes",
    "plane_of",
    "radial_range",
    "radial_scene",
    "short_model_name",
    "slice_scene",
    "subshell_colour",
    "trace_contours",
    "two_electron_scenes",
    "unit_text",
    "with_fitted_extent",
]

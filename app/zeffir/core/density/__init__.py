"""Densities: radial curves, cumulative charge and plane slices."""

from zeffir.core.density._plane import MAX_RESOLUTION, NAMED_PLANES, Plane
from zeffir.core.density._plane_grid import (
    fill_mirrored,
    mirror_blocks,
    multiply_mirrored,
    polynomial_on_grid,
    polynomial_product,
    quadrant_radii,
)
from zeffir.core.density._radial_curves import (
    cumulative_charge,
    enclosing_radius,
    radial_grid,
    spherical_density,
    subshell_distributions,
    total_distribution,
)
from zeffir.core.density._slices import (
    density_on_plane,
    density_on_plane_direct,
    density_on_plane_numpy,
    orbital_density_on_plane,
    orbital_on_plane,
    orbital_on_plane_direct,
    orbital_on_plane_numpy,
    plane_polynomial,
)

__all__ = [
    "MAX_RESOLUTION",
    "NAMED_PLANES",
    "Plane",
    "cumulative_charge",
    "density_on_plane",
    "density_on_plane_direct",
    "density_on_plane_numpy",
    "enclosing_radius",
    "fill_mirrored",
    "mirror_blocks",
    "multiply_mirrored",
    "orbital_density_on_plane",
    "orbital_on_plane",
    "orbital_on_plane_direct",
    "orbital_on_plane_numpy",
    "plane_polynomial",
    "polynomial_on_grid",
    "polynomial_product",
    "quadrant_radii",
    "radial_grid",
    "spherical_density",
    "subshell_distributions",
    "total_distribution",
]

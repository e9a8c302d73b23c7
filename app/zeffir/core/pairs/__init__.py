"""Two-electron pictures: spin-orbitals, Slater determinants, pair densities and holes.

    from zeffir.core import build, Plane
    from zeffir.core.pairs import hund_determinant, exchange_hole_on_plane
    neon = build("Ne")
    hole = exchange_hole_on_plane(neon, Plane.named("xz", extent=3.0), r1=(0.0, 0.0, 0.5))
"""

from zeffir.core.pairs._determinant import (
    DOWN,
    UP,
    Determinant,
    DeterminantError,
    SpinOrbital,
    format_determinant,
    hund_determinant,
    parse_determinant,
)
from zeffir.core.pairs._hole_sum import hole_integral
from zeffir.core.pairs._on_plane import (
    ReferencePanels,
    conditional_density_on_plane,
    exchange_hole_on_plane,
    pair_density_on_plane,
    reference_panels_on_plane,
    spin_density_on_plane,
)
from zeffir.core.pairs._one_matrix import (
    ComplexArray,
    complex_solid_harmonic,
    conditional_density,
    exchange_hole,
    one_matrix,
    pair_density,
    radial_overlap,
    solid_legendre,
    spin_density,
)
from zeffir.core.pairs._two_electron import Coupling, TwoElectronState

__all__ = [
    "DOWN",
    "UP",
    "ComplexArray",
    "Coupling",
    "Determinant",
    "DeterminantError",
    "ReferencePanels",
    "SpinOrbital",
    "TwoElectronState",
    "complex_solid_harmonic",
    "conditional_density",
    "conditional_density_on_plane",
    "exchange_hole",
    "exchange_hole_on_plane",
    "format_determinant",
    "hole_integral",
    "hund_determinant",
    "one_matrix",
    "pair_density",
    "pair_density_on_plane",
    "parse_determinant",
    "radial_overlap",
    "reference_panels_on_plane",
    "solid_legendre",
    "spin_density",
    "spin_density_on_plane",
]

"""The Zeffir computation core: numpy and scipy only, no Qt, no plotting.

Everything a script or notebook needs::

    from zeffir.core import parse_spec, build, Plane, orbital_on_plane
    orbitals = build("Na", model="clementi")
    orbitals.orbital("3s").z_eff          # 2.5074
"""

from zeffir.core._acceleration import (
    compiled_kernels_enabled,
    compiled_solvers_enabled,
    set_compiled_kernels,
    set_compiled_solvers,
)
from zeffir.core._cancel import cancellation, progress_reporting
from zeffir.core._errors import (
    ComputationCancelled,
    ModelError,
    QuantumNumberError,
    SpecError,
    ZeffirError,
)
from zeffir.core._resources import resource_path
from zeffir.core._units import bohr_to_angstrom, hartree_to_ev
from zeffir.core.config import (
    Configuration,
    Element,
    Subshell,
    element,
    elements,
    madelung_order,
    parse_spec,
)
from zeffir.core.density import (
    Plane,
    cumulative_charge,
    density_on_plane,
    enclosing_radius,
    orbital_density_on_plane,
    orbital_on_plane,
    radial_grid,
    spherical_density,
    subshell_distributions,
    total_distribution,
)
from zeffir.core.models import DEFAULT_MODEL, build, get_model, model_names
from zeffir.core.orbitals import (
    HydrogenicRadial,
    OrbitalSet,
    RadialFunction,
    SlaterRadial,
    SubshellOrbital,
    TabulatedRadial,
    complex_harmonic,
    real_harmonic,
    real_labels,
    solid_harmonic,
)
from zeffir.core.properties import SubshellSummary, moments, subshell_table

__all__ = [
    "ANGSTROM_PER_BOHR",
    "CODATA_EDITION",
    "DEFAULT_MODEL",
    "EV_PER_HARTREE",
    "ComputationCancelled",
    "Configuration",
    "Element",
    "HydrogenicRadial",
    "ModelError",
    "OrbitalSet",
    "Plane",
    "QuantumNumberError",
    "RadialFunction",
    "SlaterRadial",
    "SpecError",
    "Subshell",
    "SubshellOrbital",
    "SubshellSummary",
    "TabulatedRadial",
    "ZeffirError",
    "bohr_to_angstrom",
    "build",
    "cancellation",
    "compiled_kernels_enabled",
    "compiled_solvers_enabled",
    "complex_harmonic",
    "cumulative_charge",
    "density_on_plane",
    "element",
    "elements",
    "enclosing_radius",
    "get_model",
    "hartree_to_ev",
    "madelung_order",
    "model_names",
    "moments",
    "orbital_density_on_plane",
    "orbital_on_plane",
    "parse_spec",
    "progress_reporting",
    "radial_grid",
    "real_harmonic",
    "real_labels",
    "resource_path",
    "set_compiled_kernels",
    "set_compiled_solvers",
    "solid_harmonic",
    "spherical_density",
    "subshell_distributions",
    "subshell_table",
    "total_distribution",
]

#: CODATA constants, read from scipy.constants on first use (see ``zeffir.core._units``).
ANGSTROM_PER_BOHR: float
EV_PER_HARTREE: float
CODATA_EDITION: str


def __getattr__(name: str) -> object:
    """The CODATA constants, read from scipy.constants on first use (PEP 562)."""
    if name in ("ANGSTROM_PER_BOHR", "EV_PER_HARTREE", "CODATA_EDITION"):
        from zeffir.core import _units

        value = getattr(_units, name)
        globals()[name] = value
        return value
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")

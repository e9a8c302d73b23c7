"""Total energies of configurations: Slater integrals, angular coefficients, E_av and the Hund determinant.

    from zeffir.core import build
    from zeffir.core.energy import configuration_energy
    configuration_energy(build("C", "clementi")).total      # hartree, Hund determinant (³P)
    configuration_energy(build("C", "clementi"), "average")  # average of the configuration
"""

from zeffir.core.energy._energy import (
    EnergyKind,
    EnergyTerms,
    average_energy,
    configuration_energy,
    evaluate_expression,
    hund_energy,
    orbital_energies,
)
from zeffir.core.energy._exact import correlation_energy, exact_energy
from zeffir.core.energy._expressions import (
    EnergyExpression,
    SlaterKey,
    average_energy_expression,
    hund_energy_expression,
)
from zeffir.core.energy._integrals import DEFAULT_POINTS, RadialIntegrals, radial_integrals
from zeffir.core.energy._wigner import ck_coefficient, wigner_3j, wigner_3j_squared

__all__ = [
    "DEFAULT_POINTS",
    "EnergyExpression",
    "EnergyKind",
    "EnergyTerms",
    "RadialIntegrals",
    "SlaterKey",
    "average_energy",
    "average_energy_expression",
    "ck_coefficient",
    "configuration_energy",
    "correlation_energy",
    "evaluate_expression",
    "exact_energy",
    "hund_energy",
    "hund_energy_expression",
    "orbital_energies",
    "radial_integrals",
    "wigner_3j",
    "wigner_3j_squared",
]

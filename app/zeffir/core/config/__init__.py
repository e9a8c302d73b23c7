"""Elements, subshells and the atom-specification parser."""

from zeffir.core.config._configuration import (
    Configuration,
    Origin,
    derived_ion_ground,
    format_configuration,
    format_with_core,
    parse_spec,
    removal_order,
)
from zeffir.core.config._elements import MAX_Z, Element, element, elements
from zeffir.core.config._ions import ION_SOURCE, IonGround, observed_ion, observed_ions
from zeffir.core.config._subshell import L_LETTERS, MAX_L, MAX_N, Subshell, madelung_order
from zeffir.core.config._tokens import NOBLE_GAS_CORES, parse_subshell_token

__all__ = [
    "ION_SOURCE",
    "L_LETTERS",
    "MAX_L",
    "MAX_N",
    "MAX_Z",
    "NOBLE_GAS_CORES",
    "Configuration",
    "Element",
    "IonGround",
    "Origin",
    "Subshell",
    "derived_ion_ground",
    "element",
    "elements",
    "format_configuration",
    "format_with_core",
    "madelung_order",
    "observed_ion",
    "observed_ions",
    "parse_spec",
    "parse_subshell_token",
    "removal_order",
]

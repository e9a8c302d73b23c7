"""Elements, subshells and the atom-specification parser."""

from zeffir.core.config._configuration import Configuration, format_configuration, parse_spec
from zeffir.core.config._elements import MAX_Z, Element, element, elements
from zeffir.core.config._subshell import L_LETTERS, MAX_L, MAX_N, Subshell, madelung_order
from zeffir.core.config._tokens import NOBLE_GAS_CORES, parse_subshell_token

__all__ = [
    "L_LETTERS",
    "MAX_L",
    "MAX_N",
    "MAX_Z",
    "NOBLE_GAS_CORES",
    "Configuration",
    "Element",
    "Subshell",
    "element",
    "elements",
    "format_configuration",
    "madelung_order",
    "parse_spec",
    "parse_subshell_token",
]

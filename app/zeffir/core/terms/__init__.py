"""Term symbols of a configuration: LS terms, J levels, parity and the Hund ground level.

    from zeffir.core.terms import configuration_terms, ground_level
    [t.label for t in configuration_terms("C")]    # ['3P', '1D', '1S']
    ground_level("Fe").label                       # '5D4'
"""

from zeffir.core.terms._labels import (
    L_SYMBOLS,
    MULTIPLICITY_NAMES,
    Parity,
    half_integer_text,
    quantum_number_text,
    term_label,
)
from zeffir.core.terms._microstates import MAX_TERMS, TermError
from zeffir.core.terms._notes import (
    OBSERVED_SOURCE,
    ObservedLevel,
    ground_notes,
    known_hund_miss,
    observed_level,
)
from zeffir.core.terms._terms import (
    Level,
    Term,
    configuration_parity,
    configuration_terms,
    ground_level,
    microstate_count,
    open_shells,
)

__all__ = [
    "L_SYMBOLS",
    "MAX_TERMS",
    "MULTIPLICITY_NAMES",
    "OBSERVED_SOURCE",
    "Level",
    "ObservedLevel",
    "Parity",
    "Term",
    "TermError",
    "configuration_parity",
    "configuration_terms",
    "ground_level",
    "ground_notes",
    "half_integer_text",
    "known_hund_miss",
    "microstate_count",
    "observed_level",
    "open_shells",
    "quantum_number_text",
    "term_label",
]

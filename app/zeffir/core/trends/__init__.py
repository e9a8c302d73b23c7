"""Trends: one quantity over many atoms or ions, under several models at once.

    from zeffir.core.trends import evaluate_trend, parse_rule
    trend = evaluate_trend(parse_rule("Z=1-36"), ["slater", "hartree-fock"], "z_eff")
    trend.series[1].points[25].value          # Z_eff of Fe's 4s under Hartree–Fock

Rules (``Z=1-36``, ``isoelectronic=10:Z=10-20``, ``family=[Ar] 3dn 4s2:n=1-10``, or
specs separated by commas) are in :mod:`._rules`; quantities in :mod:`._quantities`;
NIST's first ionization energies in :mod:`._reference`.
"""

from zeffir.core.trends._evaluate import (
    IONIZATION_METHODS,
    ReferencePoint,
    ReferenceSeries,
    Trend,
    TrendPoint,
    TrendSeries,
    evaluate_trend,
)
from zeffir.core.trends._quantities import (
    ATOM_QUANTITIES,
    SUBSHELL_QUANTITIES,
    TrendQuantity,
    TrendQuantityError,
    quantity,
    quantity_names,
    valence_subshell,
)
from zeffir.core.trends._reference import IONIZATION_SOURCE, MeasuredIonization, measured_first_ionization
from zeffir.core.trends._rules import (
    TrendRuleError,
    configuration_family,
    ion_spec,
    isoelectronic_sequence,
    parse_rule,
    z_range,
)

__all__ = [
    "ATOM_QUANTITIES",
    "IONIZATION_METHODS",
    "IONIZATION_SOURCE",
    "SUBSHELL_QUANTITIES",
    "MeasuredIonization",
    "ReferencePoint",
    "ReferenceSeries",
    "Trend",
    "TrendPoint",
    "TrendQuantity",
    "TrendQuantityError",
    "TrendRuleError",
    "TrendSeries",
    "configuration_family",
    "evaluate_trend",
    "ion_spec",
    "isoelectronic_sequence",
    "measured_first_ionization",
    "parse_rule",
    "quantity",
    "quantity_names",
    "valence_subshell",
    "z_range",
]

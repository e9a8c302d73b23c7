"""Derived numbers: radial moments, maxima, nodes, the subshell table and the energies."""

from zeffir.core.properties._energies import EnergySummary, energy_summary
from zeffir.core.properties._summary import (
    MOMENT_POWERS,
    SubshellSummary,
    moments,
    occupancy_text,
    subshell_table,
    summarise,
)

__all__ = ["MOMENT_POWERS", "EnergySummary", "SubshellSummary", "energy_summary", "moments",
           "occupancy_text", "subshell_table", "summarise"]

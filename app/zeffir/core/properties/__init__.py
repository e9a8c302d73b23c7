"""Derived numbers: radial moments, maxima, nodes and the subshell table."""

from zeffir.core.properties._summary import (
    MOMENT_POWERS,
    SubshellSummary,
    moments,
    subshell_table,
    summarise,
)

__all__ = ["MOMENT_POWERS", "SubshellSummary", "moments", "subshell_table", "summarise"]

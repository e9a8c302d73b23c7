"""The view state: plain data describing what the window shows (no Qt, no physics)."""

from zeffir.state._view_state import (
    LENGTH_UNITS,
    MAX_VIEW_RESOLUTION,
    PLANE_NAMES,
    RADIAL_QUANTITIES,
    SLICE_QUANTITIES,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    RadialSettings,
    SliceSettings,
    Source,
    StateError,
    TwoElectronSettings,
    ViewState,
    reconcile_orbital,
)

__all__ = [
    "LENGTH_UNITS",
    "MAX_VIEW_RESOLUTION",
    "PLANE_NAMES",
    "RADIAL_QUANTITIES",
    "SLICE_QUANTITIES",
    "CompareSettings",
    "OrbitalChoice",
    "PairSettings",
    "RadialSettings",
    "SliceSettings",
    "Source",
    "StateError",
    "TwoElectronSettings",
    "ViewState",
    "reconcile_orbital",
]

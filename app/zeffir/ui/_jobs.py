"""The keys of the window's worker jobs: one per view, plus the table, contours, profile, export.

A newer request under a key supersedes an older one (see :class:`SceneWorker`), so
the keys say which results replace which.
"""

from __future__ import annotations

from enum import StrEnum

__all__ = ["JobKey"]


class JobKey(StrEnum):
    """A worker job's key; the views' keys are their names in the view state."""

    RADIAL = "radial"
    SLICE = "slice"
    PAIR = "pair"
    TWO_ELECTRON = "two-electron"
    TERMS = "terms"
    TRENDS = "trends"
    TABLE = "table"
    PROFILE = "profile"
    EXPORT = "export"
    SLICE_CONTOURS = "slice-contours"
    PAIR_CONTOURS = "pair-contours"
    TWO_ELECTRON_CONTOURS = "two-electron-contours"

    @classmethod
    def of_view(cls, view: str) -> JobKey:
        """The key of a view's picture (``"slice"`` → SLICE)."""
        return cls(view)

    @classmethod
    def contours_of(cls, view: str) -> JobKey:
        """The key of a view's contour tracing (``"slice"`` → SLICE_CONTOURS)."""
        return cls(f"{view}-contours")

    @property
    def is_view(self) -> bool:
        """True for the keys of the six views."""
        return self in _VIEWS

    @property
    def traced_view(self) -> str | None:
        """The view whose contours this key traces, or None."""
        return self.value.removesuffix("-contours") if self.value.endswith("-contours") else None


_VIEWS = frozenset({JobKey.RADIAL, JobKey.SLICE, JobKey.PAIR, JobKey.TWO_ELECTRON, JobKey.TERMS,
                    JobKey.TRENDS})

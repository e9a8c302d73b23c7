"""Orbital sets for the views, built once per (spec, model) and reused."""

from __future__ import annotations

from functools import lru_cache

from zeffir.core import OrbitalSet, build
from zeffir.state import Source

__all__ = ["orbitals_for"]


@lru_cache(maxsize=64)
def _cached(spec: str, model: str) -> OrbitalSet:
    return build(spec, model)


def orbitals_for(source: Source) -> OrbitalSet:
    """The orbital set of a source (cached: sets are immutable, and their tables stay warm)."""
    return _cached(source.spec.strip(), source.model)

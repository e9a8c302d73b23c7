"""Many configurations at once: parallel builds and a disk cache of their orbitals.

    from zeffir.core.sweep import build_many, neutral_atoms
    points = build_many(neutral_atoms(), "hartree-fock")   # H–Og, on every core
    points[25].orbitals.total_energy                       # Fe

A second call with the same specs and model is served from the user's cache
directory (see :class:`DiskCache`).
"""

from zeffir.core.sweep._disk_cache import CacheEntry, DiskCache, default_cache_directory
from zeffir.core.sweep._parallel import SweepCancelled, SweepPoint, build_many, neutral_atoms

__all__ = [
    "CacheEntry",
    "DiskCache",
    "SweepCancelled",
    "SweepPoint",
    "build_many",
    "default_cache_directory",
    "neutral_atoms",
]

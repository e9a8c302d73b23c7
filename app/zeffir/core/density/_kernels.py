"""Compiled slice kernels (numba), used when numba is importable.

Multi-threaded kernels do the work of a slice through any plane:
``fill_quadrant`` interpolates a tabulated radial profile at every point of the
non-negative quadrant of the (exactly symmetric) grid, computing the upper
triangle only (the quadrant is symmetric under u <-> v);
``polynomial_times_mirrored`` evaluates the solid harmonic r^l Y_lm — a
polynomial in (u, v) — row by row with Horner's rule and multiplies it by the
radial quadrant read forwards and backwards. ``mirror`` fills a full grid from a
quadrant. numba is imported on first use, so importing the core stays fast, and
compiled code is cached on disk. The plain-numpy equivalents live in
``_slices.py``; the tests compare both.
"""

from __future__ import annotations

from functools import cache
from types import SimpleNamespace

import numpy as np

from zeffir.core._acceleration import compiled_kernels_enabled
from zeffir.core.density._radial_table import RadialTable
from zeffir.core.orbitals import FloatArray

__all__ = ["compiled_density", "compiled_orbital", "kernels_available"]


def _kernels() -> SimpleNamespace | None:
    """The compiled kernels, or None when they are switched off or numba is missing."""
    return _loaded_kernels() if compiled_kernels_enabled() else None


@cache
def _loaded_kernels() -> SimpleNamespace | None:
    try:
        from zeffir.core.density import _compiled
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None
    return SimpleNamespace(
        fill_quadrant=_compiled.fill_quadrant,
        polynomial_times_mirrored=_compiled.polynomial_times_mirrored,
        mirror=_compiled.mirror,
    )


def kernels_available() -> bool:
    """True when the compiled kernels are used (switched on and numba importable)."""
    return _kernels() is not None


def _quadrant(k: SimpleNamespace, coords: FloatArray, offset: float, table: RadialTable) -> FloatArray:
    n_half = coords.size - coords.size // 2
    quad = np.empty((n_half, n_half))
    k.fill_quadrant(coords, offset * offset, table.step, table.values, quad)
    return quad


def compiled_orbital(coords: FloatArray, offset: float, coeffs: FloatArray,
                     table: RadialTable) -> FloatArray | None:
    """Σ_ab coeffs[a,b] u^a v^b · g(r) on the grid, g from ``table``; None without numba."""
    k = _kernels()
    if k is None:
        return None
    quad = _quadrant(k, coords, offset, table)
    out = np.empty((coords.size, coords.size))
    k.polynomial_times_mirrored(coords, np.ascontiguousarray(coeffs), quad, out)
    return out


def compiled_density(coords: FloatArray, offset: float, table: RadialTable) -> FloatArray | None:
    """ρ(r) on the grid, ρ from ``table``; None without numba."""
    k = _kernels()
    if k is None:
        return None
    quad = _quadrant(k, coords, offset, table)
    out = np.empty((coords.size, coords.size))
    k.mirror(quad, out)
    return out

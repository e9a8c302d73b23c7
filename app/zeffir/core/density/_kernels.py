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

import os
from functools import cache
from types import SimpleNamespace
from typing import Any

import numpy as np

from zeffir.core.density._radial_table import RadialTable
from zeffir.core.orbitals import FloatArray

__all__ = ["compiled_density", "compiled_orbital", "kernels_available"]


def _build(nb: Any) -> SimpleNamespace:
    @nb.njit(fastmath=True, cache=True)
    def fill_row(coords, half, a, base, inv, table, row):  # type: ignore[no-untyped-def]
        # Entries b >= a of one quadrant row. Two passes: the square roots vectorise
        # on their own, and the interpolation loop (with gathers) has no branch.
        n_half = row.size
        last = table.size - 3
        xs = np.empty(n_half - a)
        for b in range(a, n_half):
            vb = coords[half + b]
            xs[b - a] = np.sqrt(np.sqrt(base + vb * vb)) * inv
        for b in range(a, n_half):
            x_raw = xs[b - a]
            x = min(x_raw, last - 1.0)
            k = int(x)
            f = x - k
            w0 = -f * (f - 1.0) * (f - 2.0) * (1.0 / 6.0)
            w1 = (f + 1.0) * (f - 1.0) * (f - 2.0) * 0.5
            w2 = -(f + 1.0) * f * (f - 2.0) * 0.5
            w3 = (f + 1.0) * f * (f - 1.0) * (1.0 / 6.0)
            value = w0 * table[k] + w1 * table[k + 1] + w2 * table[k + 2] + w3 * table[k + 3]
            row[b] = value if x_raw < last else 0.0

    @nb.njit(parallel=True, fastmath=True, cache=True)
    def fill_quadrant(coords, offset2, step, table, quad):  # type: ignore[no-untyped-def]
        # The quadrant is symmetric under u <-> v: interpolate its upper triangle, with
        # rows paired (short with long) so both threads get equal work, then copy.
        size = coords.size
        half = size // 2
        n_half = size - half
        inv = 1.0 / step
        for p in nb.prange((n_half + 1) // 2):
            ua = coords[half + p]
            fill_row(coords, half, p, offset2 + ua * ua, inv, table, quad[p])
            partner = n_half - 1 - p
            if partner != p:
                ub = coords[half + partner]
                fill_row(coords, half, partner, offset2 + ub * ub, inv, table, quad[partner])
        for a in nb.prange(n_half):
            row = quad[a]
            for b in range(a):
                row[b] = quad[b, a]

    @nb.njit(parallel=True, fastmath=True, cache=True)
    def polynomial_times_mirrored(coords, coeffs, quad, out):  # type: ignore[no-untyped-def]
        size = coords.size
        half = size // 2
        order = coeffs.shape[0]
        for j in nb.prange(size):
            v = coords[j]
            qj = j - half if j >= half else size - 1 - j - half
            row_coeffs = np.empty(order)
            for a in range(order):
                total = 0.0
                power = 1.0
                for b in range(order):
                    total += coeffs[a, b] * power
                    power *= v
                row_coeffs[a] = total
            row = out[j]
            top = row_coeffs[order - 1]
            for i in range(size):
                row[i] = top
            for a in range(order - 2, -1, -1):
                c = row_coeffs[a]
                for i in range(size):
                    row[i] = row[i] * coords[i] + c
            radial = quad[qj]
            for i in range(half, size):
                row[i] *= radial[i - half]
            for i in range(half):
                row[i] *= radial[size - 1 - i - half]

    @nb.njit(parallel=True, fastmath=True, cache=True)
    def mirror(quad, out):  # type: ignore[no-untyped-def]
        size = out.shape[0]
        half = size // 2
        for j in nb.prange(size):
            qj = j - half if j >= half else size - 1 - j - half
            radial = quad[qj]
            row = out[j]
            for i in range(half, size):
                row[i] = radial[i - half]
            for i in range(half):
                row[i] = radial[size - 1 - i - half]

    return SimpleNamespace(
        fill_quadrant=fill_quadrant, polynomial_times_mirrored=polynomial_times_mirrored,
        mirror=mirror,
    )


@cache
def _kernels() -> SimpleNamespace | None:
    if os.environ.get("ZEFFIR_NO_NUMBA"):
        return None
    try:
        import numba
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None
    return _build(numba)


def kernels_available() -> bool:
    """True when the compiled kernels can be used (numba importable and not disabled)."""
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

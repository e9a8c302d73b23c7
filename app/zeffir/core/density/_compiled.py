"""The numba kernels of :mod:`zeffir.core.density._kernels` (imported only when used).

Module-level functions, so that numba's on-disk cache is reused across runs.
"""

# mypy: ignore-errors
from __future__ import annotations

import numba
import numpy as np

__all__ = ["fill_quadrant", "fill_row", "mirror", "polynomial_times_mirrored"]


@numba.njit(fastmath=True, cache=True)
def fill_row(coords, half, a, base, inv, table, row):
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

@numba.njit(parallel=True, fastmath=True, cache=True)
def fill_quadrant(coords, offset2, step, table, quad):
    # The quadrant is symmetric under u <-> v: interpolate its upper triangle, with
    # rows paired (short with long) so both threads get equal work, then copy.
    size = coords.size
    half = size // 2
    n_half = size - half
    inv = 1.0 / step
    for p in numba.prange((n_half + 1) // 2):
        ua = coords[half + p]
        fill_row(coords, half, p, offset2 + ua * ua, inv, table, quad[p])
        partner = n_half - 1 - p
        if partner != p:
            ub = coords[half + partner]
            fill_row(coords, half, partner, offset2 + ub * ub, inv, table, quad[partner])
    for a in numba.prange(n_half):
        row = quad[a]
        for b in range(a):
            row[b] = quad[b, a]

@numba.njit(parallel=True, fastmath=True, cache=True)
def polynomial_times_mirrored(coords, coeffs, quad, out):
    size = coords.size
    half = size // 2
    order = coeffs.shape[0]
    for j in numba.prange(size):
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

@numba.njit(parallel=True, fastmath=True, cache=True)
def mirror(quad, out):
    size = out.shape[0]
    half = size // 2
    for j in numba.prange(size):
        qj = j - half if j >= half else size - 1 - j - half
        radial = quad[qj]
        row = out[j]
        for i in range(half, size):
            row[i] = radial[i - half]
        for i in range(half):
            row[i] = radial[size - 1 - i - half]

"""Compiled kernel for the slice product (numba), with the plain-numpy path beside it.

The kernel fuses the two factors of an orbital on a symmetric plane grid —
the polynomial r^l Y_lm in (u, v) evaluated by Horner's rule, and the radial
factor read from one mirrored quadrant — into a single multi-threaded pass over
the output. numba is imported on first use, so importing the core stays fast;
compiled code is cached on disk. Without numba the numpy path is used.
"""

from __future__ import annotations

import os
from collections.abc import Callable
from functools import cache
from typing import Any

import numpy as np

from zeffir.core.orbitals import FloatArray

__all__ = ["fused_product", "kernels_available"]


def _source(nb: Any) -> Callable[..., None]:
    @nb.njit(parallel=True, fastmath=True, cache=True)
    def product(coords, coeffs, quadrant, out):  # type: ignore[no-untyped-def]
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
            radial = quadrant[qj]
            # Right half reads the quadrant forwards, left half backwards: no branch inside.
            for i in range(half, size):
                u = coords[i]
                value = row_coeffs[order - 1]
                for a in range(order - 2, -1, -1):
                    value = value * u + row_coeffs[a]
                out[j, i] = value * radial[i - half]
            for i in range(half):
                u = coords[i]
                value = row_coeffs[order - 1]
                for a in range(order - 2, -1, -1):
                    value = value * u + row_coeffs[a]
                out[j, i] = value * radial[size - 1 - i - half]

    return product  # type: ignore[no-any-return]


@cache
def _compiled() -> Callable[..., None] | None:
    if os.environ.get("ZEFFIR_NO_NUMBA"):
        return None
    try:
        import numba
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None
    return _source(numba)


def kernels_available() -> bool:
    """True when the compiled kernel can be used (numba importable, not disabled)."""
    return _compiled() is not None


def fused_product(coords: FloatArray, coeffs: FloatArray, quadrant: FloatArray) -> FloatArray | None:
    """out[j, i] = Σ_ab coeffs[a, b] u_i^a v_j^b · radial(|u_i|, |v_j|), or None without numba.

    Parameters
    ----------
    coords : ndarray, shape (k,)
        Grid coordinates, symmetric about 0 (u and v share them).
    coeffs : ndarray, shape (l+1, l+1)
        Polynomial coefficients, see :func:`plane_polynomial`.
    quadrant : ndarray, shape (k - k//2, k - k//2)
        Radial factor on the non-negative quadrant.
    """
    kernel = _compiled()
    if kernel is None:
        return None
    out = np.empty((coords.size, coords.size))
    kernel(np.ascontiguousarray(coords), np.ascontiguousarray(coeffs),
           np.ascontiguousarray(quadrant), out)
    return out

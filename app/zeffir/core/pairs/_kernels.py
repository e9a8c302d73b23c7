"""Compiled kernel (numba, in ``_compiled.py``) for one-matrix slices, used when numba is importable.

``modulus_squared`` evaluates, at every point of the exactly symmetric grid,

    out[j, i] = α |Σ_t P_t(u_i, v_j) g_t(r)|² + β d(r),

where each term t has a complex polynomial P_t of degree <= 6 in (u, v) (an angular
factor of the one-matrix) and a radial factor g_t, and d is a radial density. The
radial factors are given on the non-negative quadrant only: the grid is symmetric
under u → −u and v → −v for anything that depends on r only. Chunks of rows run
in parallel; along each row every polynomial is evaluated by Horner's rule, the
quadrant row is read forwards and backwards, and each point is written once, so
the exchange hole of a closed-shell atom costs about one pass over the grid.
numba is imported on first use and its compiled code is cached on disk;
``ZEFFIR_NO_NUMBA=1`` forces the plain-numpy path of ``_on_plane.py``, which the
tests compare with this one.
"""

from __future__ import annotations

import importlib
from functools import cache
from types import ModuleType
from typing import Any

import numpy as np

from zeffir.core._acceleration import compiled_kernels_enabled
from zeffir.core.orbitals import FloatArray

__all__ = ["compiled_modulus_squared"]

#: Row chunks handed to the threads: more than there are threads, so that a thread the
#: operating system holds up for a moment does not hold up the whole slice.
_CHUNKS = 64


def _kernels() -> ModuleType | None:
    """The compiled kernels, or None when they are switched off or numba is missing."""
    return _loaded_kernels() if compiled_kernels_enabled() else None


@cache
def _loaded_kernels() -> ModuleType | None:
    try:
        return importlib.import_module("zeffir.core.pairs._compiled")
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None


def compiled_modulus_squared(
    coords: FloatArray,
    radial: FloatArray,
    coefficients: np.ndarray[Any, np.dtype[np.complex128]],
    degrees: np.ndarray[Any, np.dtype[np.int64]],
    alpha: float,
    density: FloatArray | None,
    beta: float,
) -> FloatArray | None:
    """α |Σ_t P_t g_t|² + β d on the grid (see the module notes); None without numba.

    Parameters
    ----------
    coords : (k,) grid coordinates, exactly symmetric about 0.
    radial : (terms, n, n) radial factors g_t on the non-negative quadrant, n = k - k//2.
    coefficients : (terms, L+1, L+1) complex C_t[a, b] of u^a v^b.
    degrees : (terms,) polynomial degree of each term.
    alpha, beta : weights of |γ|² and of the density.
    density : (n, n) radial density on the quadrant, or None (then β is ignored).
    """
    k = _kernels()
    if k is None:
        return None
    out = np.empty((coords.size, coords.size))
    chunks = min(coords.size, _CHUNKS)
    k.modulus_squared(
        np.ascontiguousarray(coords), np.ascontiguousarray(radial),
        np.ascontiguousarray(coefficients.real), np.ascontiguousarray(coefficients.imag),
        np.ascontiguousarray(degrees, dtype=np.int64), bool(np.any(coefficients.imag)),
        float(alpha), np.ascontiguousarray(density if density is not None else radial[0]),
        float(beta) if density is not None else 0.0, chunks, out,
    )
    return out

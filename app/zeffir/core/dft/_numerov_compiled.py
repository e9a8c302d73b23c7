"""Numerov's recurrences compiled by numba (imported on first use; cached on disk).

The same recurrences as the plain-Python loops of ``_radial_solver``: outward from
the nucleus, inward from the decayed end. The tests compare both paths.
"""

from __future__ import annotations

import numpy as np
from numba import njit


@njit(cache=True)
def numerov_out(f: np.ndarray, phi0: float, phi1: float, stop: int) -> np.ndarray:  # pragma: no cover
    phi = np.zeros(stop + 1)
    phi[0] = phi0
    phi[1] = phi1
    for i in range(1, stop):
        phi[i + 1] = ((12.0 - 10.0 * f[i]) * phi[i] - f[i - 1] * phi[i - 1]) / f[i + 1]
    return phi


@njit(cache=True)
def numerov_in(f: np.ndarray, start: int, stop: int, last: float) -> np.ndarray:  # pragma: no cover
    phi = np.zeros(start + 2)
    phi[start] = last
    for i in range(start, stop, -1):
        phi[i - 1] = ((12.0 - 10.0 * f[i]) * phi[i] - f[i + 1] * phi[i + 1]) / f[i - 1]
    return phi

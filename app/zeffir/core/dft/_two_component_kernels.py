"""Adams–Moulton integration of a linear two-component radial system, dy/dx = A(x) y.

On the uniform grid of x = ln r both relativistic radial equations (Dirac's, and the
scalar-relativistic one of Koelling and Harmon) take this form for y = (P, Q). The
fifth-order implicit Adams–Moulton formula

y_{i+1} = y_i + h/720 · (251 f_{i+1} + 646 f_i − 264 f_{i−1} + 106 f_{i−2} − 19 f_{i−3})

is solved exactly for y_{i+1} because f = A y is linear (a 2 × 2 system per step), so
the implicit step costs no iteration. The same functions run as plain Python and, in
``_two_component_compiled``, compiled by numba; the tests compare both.

References
----------
W. R. Johnson, *Atomic Structure Theory* (Springer, 2007), §2.2 and §2.4 (Adams–
Moulton integration of the radial Schrödinger and Dirac equations);
D. D. Koelling and B. N. Harmon, J. Phys. C 10, 3107 (1977).
"""

from __future__ import annotations

import numpy as np

_B0 = 251.0 / 720.0
_B1 = 646.0 / 720.0
_B2 = -264.0 / 720.0
_B3 = 106.0 / 720.0
_B4 = -19.0 / 720.0


def integrate_out(a11: np.ndarray, a12: np.ndarray, a21: np.ndarray, a22: np.ndarray,
                  p: np.ndarray, q: np.ndarray, h: float, stop: int) -> int:
    """Fill p, q from index 4 to ``stop`` (p, q[0:4] hold the start); return P's sign changes."""
    fp = np.empty(stop + 1)
    fq = np.empty(stop + 1)
    for i in range(4):
        fp[i] = a11[i] * p[i] + a12[i] * q[i]
        fq[i] = a21[i] * p[i] + a22[i] * q[i]
    k = h * _B0
    for i in range(3, stop):
        bp = p[i] + h * (_B1 * fp[i] + _B2 * fp[i - 1] + _B3 * fp[i - 2] + _B4 * fp[i - 3])
        bq = q[i] + h * (_B1 * fq[i] + _B2 * fq[i - 1] + _B3 * fq[i - 2] + _B4 * fq[i - 3])
        j = i + 1
        m11 = 1.0 - k * a11[j]
        m12 = -k * a12[j]
        m21 = -k * a21[j]
        m22 = 1.0 - k * a22[j]
        det = m11 * m22 - m12 * m21
        p[j] = (m22 * bp - m12 * bq) / det
        q[j] = (m11 * bq - m21 * bp) / det
        fp[j] = a11[j] * p[j] + a12[j] * q[j]
        fq[j] = a21[j] * p[j] + a22[j] * q[j]
    nodes = 0
    for i in range(stop):
        if p[i] * p[i + 1] < 0.0:
            nodes += 1
    return nodes


def integrate_in(a11: np.ndarray, a12: np.ndarray, a21: np.ndarray, a22: np.ndarray,
                 p: np.ndarray, q: np.ndarray, h: float, start: int, stop: int) -> None:
    """Fill p, q from index start − 4 down to ``stop`` (p, q[start−3:start+1] hold the start)."""
    fp = np.empty(start + 1)
    fq = np.empty(start + 1)
    for i in range(start - 3, start + 1):
        fp[i] = a11[i] * p[i] + a12[i] * q[i]
        fq[i] = a21[i] * p[i] + a22[i] * q[i]
    k = -h * _B0
    for i in range(start - 3, stop, -1):
        bp = p[i] - h * (_B1 * fp[i] + _B2 * fp[i + 1] + _B3 * fp[i + 2] + _B4 * fp[i + 3])
        bq = q[i] - h * (_B1 * fq[i] + _B2 * fq[i + 1] + _B3 * fq[i + 2] + _B4 * fq[i + 3])
        j = i - 1
        m11 = 1.0 - k * a11[j]
        m12 = -k * a12[j]
        m21 = -k * a21[j]
        m22 = 1.0 - k * a22[j]
        det = m11 * m22 - m12 * m21
        p[j] = (m22 * bp - m12 * bq) / det
        q[j] = (m11 * bq - m21 * bp) / det
        fp[j] = a11[j] * p[j] + a12[j] * q[j]
        fq[j] = a21[j] * p[j] + a22[j] * q[j]

"""The exchange hole's sum rule, checked by quadrature over all space."""

from __future__ import annotations

from functools import lru_cache
from typing import TYPE_CHECKING

import numpy as np
from numpy.polynomial.legendre import leggauss

from zeffir.core.orbitals import FloatArray, OrbitalSet
from zeffir.core.pairs._one_matrix import exchange_hole

if TYPE_CHECKING:
    from zeffir.core.pairs._determinant import Determinant

__all__ = ["hole_integral"]


@lru_cache(maxsize=8)
def _gauss_legendre(points: int) -> tuple[FloatArray, FloatArray]:
    """Gauss–Legendre nodes and weights on (−1, 1), kept (leggauss solves an eigenproblem)."""
    nodes, weights = leggauss(points)
    nodes.setflags(write=False)
    weights.setflags(write=False)
    return nodes, weights


def hole_integral(orbitals: OrbitalSet, r1: FloatArray, spin: int, determinant: Determinant,
                  radial_points: int = 96, polar_points: int | None = None) -> float:
    """∫ h_x^σ(r1; r2) d³r2 by a product quadrature centred on the nucleus.

    Notes
    -----
    r = s·x/(1 − x) with x from Gauss–Legendre on (0, 1) (s the largest ⟨r⟩ of the
    occupied subshells), Gauss–Legendre in cos θ and the trapezoid rule in φ
    (2·``polar_points`` nodes). The angular rules are exact: on a sphere |γ(r1, r2)|²
    is a polynomial of degree ≤ 2·l_max in the direction of r2, so after the φ sum
    (exact for |m − m'| < 2·``polar_points``) a polynomial of degree ≤ 2·l_max in
    cos θ remains, which Gauss–Legendre integrates exactly with l_max + 1 nodes. The
    default takes l_max + 3 polar nodes (32 directions for a p shell instead of the
    2048 of a fixed rule), so only the radial rule approximates. The sum rule
    ∫ h_x = −1 holds for every r1 (Parr & Yang 1989, §2.4), so the value shown is a
    check of the numbers on screen.

    References
    ----------
    R. G. Parr and W. Yang, *Density-Functional Theory of Atoms and Molecules*
    (Oxford, 1989), §2.4.

    Examples
    --------
    The exchange hole of the spin-down electrons of oxygen's Hund determinant
    (closed 1s, 2s and one 2p electron) removes exactly one electron:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> from zeffir.core.pairs import DOWN, hund_determinant
    >>> oxygen = build("O", "slater")
    >>> determinant = hund_determinant(oxygen.configuration)
    >>> total = hole_integral(oxygen, np.array([0.3, 0.0, 0.4]), DOWN, determinant)
    >>> bool(abs(total + 1.0) < 1e-9)
    True
    """
    scale = max(o.radial.expectation(1) for o in orbitals.orbitals)
    x, wx = _gauss_legendre(radial_points)
    x = 0.5 * (x + 1.0)
    wx = 0.5 * wx
    r = scale * x / (1.0 - x)
    wr = scale * wx / (1.0 - x) ** 2 * r * r
    if polar_points is None:
        polar_points = max(o.l for o in orbitals.orbitals) + 3
    t, wt = _gauss_legendre(polar_points)
    phi = np.linspace(0.0, 2.0 * np.pi, 2 * polar_points, endpoint=False)
    wphi = 2.0 * np.pi / phi.size
    sin_t = np.sqrt(1.0 - t * t)
    directions = np.stack(
        [np.outer(sin_t, np.cos(phi)), np.outer(sin_t, np.sin(phi)), np.repeat(t[:, None], phi.size, 1)],
        axis=-1,
    ).reshape(-1, 3)
    wdir = np.repeat(wt, phi.size) * wphi
    points = (r[:, None, None] * directions[None, :, :]).reshape(-1, 3)
    values = exchange_hole(orbitals, r1, points, spin, determinant).reshape(r.size, -1)
    return float(np.sum(wr[:, None] * wdir[None, :] * values))

"""The logarithmic radial grid of the density-functional solvers, and its quadrature.

Points r_i = r_min·e^{ih}, i = 0 … N − 1: dense at the nucleus, where the orbitals
of a heavy atom vary on a scale of 1/Z, and sparse far out. Integrals over r become
integrals over x = ln r with dr = r dx, taken by Simpson's rule on the uniform x grid.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from zeffir.core.orbitals import FloatArray

__all__ = ["LogGrid"]


@dataclass(frozen=True)
class LogGrid:
    """r_i = r_min·exp(i·h) for i = 0 … points − 1 (bohr).

    Attributes
    ----------
    r_min : float
        Innermost point (bohr).
    r_max : float
        Outermost point (bohr), reached to within one step.
    h : float
        Step in x = ln r.

    Examples
    --------
    >>> grid = LogGrid.for_charge(26.0)
    >>> bool(grid.r[0] * 26 < 1e-5 and grid.r[-1] >= 60.0)
    True
    >>> round(grid.integrate(np.exp(-grid.r) * grid.r**2), 12)  # ∫ r² e^{-r} dr = 2
    2.0
    """

    r_min: float
    r_max: float
    h: float
    r: FloatArray = field(init=False, repr=False, compare=False)

    def __post_init__(self) -> None:
        if not (0 < self.r_min < self.r_max and self.h > 0):
            raise ValueError("LogGrid: need 0 < r_min < r_max and h > 0")
        count = math.ceil(math.log(self.r_max / self.r_min) / self.h) + 1
        count += count % 2 == 0  # an odd count, for Simpson's rule
        r = self.r_min * np.exp(self.h * np.arange(count))
        r.setflags(write=False)
        object.__setattr__(self, "r", r)

    @classmethod
    def for_charge(cls, z: float, r_max: float = 60.0, h: float = 0.003) -> LogGrid:
        """A grid for nuclear charge ``z``: from 1e-6/Z bohr to ``r_max``."""
        return cls(1e-6 / max(z, 1.0), r_max, h)

    @property
    def points(self) -> int:
        """Number of points (odd)."""
        return int(self.r.size)

    def integrate(self, values: FloatArray) -> float:
        """∫ values dr from r_min to r_max (Simpson's rule in x, dr = r dx)."""
        f = np.asarray(values, dtype=float) * self.r
        return float(self.h / 3.0 * (f[0] + f[-1] + 4.0 * f[1:-1:2].sum() + 2.0 * f[2:-1:2].sum()))

    def cumulative(self, values: FloatArray) -> FloatArray:
        """∫ values dr from r_min to each r_i, fourth order in h at every point.

        Each step takes ∫_{x_i}^{x_{i+1}} f dx = h(−f_{i−1} + 13f_i + 13f_{i+1} − f_{i+2})/24,
        the integral of the cubic through four neighbours (the end steps use the cubic
        through the first or last four points).
        """
        f = np.asarray(values, dtype=float) * self.r
        h = self.h
        steps = np.empty(f.size - 1)
        steps[1:-1] = h / 24.0 * (-f[:-3] + 13.0 * f[1:-2] + 13.0 * f[2:-1] - f[3:])
        steps[0] = h / 24.0 * (9.0 * f[0] + 19.0 * f[1] - 5.0 * f[2] + f[3])
        steps[-1] = h / 24.0 * (9.0 * f[-1] + 19.0 * f[-2] - 5.0 * f[-3] + f[-4])
        out = np.zeros_like(f)
        out[1:] = np.cumsum(steps)
        return out

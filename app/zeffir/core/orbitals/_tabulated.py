"""Numerical radial functions tabulated on a logarithmic grid."""

from __future__ import annotations

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core.orbitals._radial import FloatArray, RadialFunction

__all__ = ["TabulatedRadial", "TabulatedSpinorRadial", "log_grid"]


def log_grid(r_min: float = 1e-6, r_max: float = 200.0, points: int = 2001) -> FloatArray:
    """A logarithmic radial grid r_i = r_min · exp(i h), the usual grid of numerical atomic codes.

    Examples
    --------
    >>> g = log_grid(1e-4, 10.0, 11)
    >>> bool(abs(g[1] / g[0] - g[2] / g[1]) < 1e-12)
    True
    """
    if not 0 < r_min < r_max or points < 8:
        raise QuantumNumberError("log_grid needs 0 < r_min < r_max and at least 8 points")
    return np.geomspace(r_min, r_max, points)


class TabulatedRadial(RadialFunction):
    """A radial function known at the points of a logarithmic grid.

    Parameters
    ----------
    n, l : int
        The subshell it stands for.
    r : array_like
        Strictly increasing, logarithmically spaced radii (bohr).
    values : array_like
        R(r) at those radii. It is renormalised unless ``normalise=False``.
    normalise : bool
        Rescale so that ∫R²r²dr = 1 on the grid.

    Notes
    -----
    Between grid points the smooth factor f = R/r^l is interpolated with a cubic
    spline in x = ln r (error O(h⁴) in the grid step h of x); below the first point
    R = f(r₀) r^l (the regular behaviour at the nucleus) and beyond the last it is 0.
    Integrals use Simpson's rule in x, where dr = r dx.

    References
    ----------
    C. Froese Fischer, *The Hartree–Fock Method for Atoms* (Wiley, 1977), ch. 6 —
    the logarithmic grid of numerical atomic structure codes.

    Examples
    --------
    An unnormalised hydrogen 1s, 3e^(−r), is rescaled to R_10 = 2e^(−r) (Bethe &
    Salpeter 1957, eq. 3.17), with ⟨r⟩ = 3/2 and the maximum of D(r) at r = 1:

    >>> import numpy as np
    >>> r = log_grid(1e-5, 40.0, 801)
    >>> s = TabulatedRadial(1, 0, r, 3.0 * np.exp(-r))
    >>> bool(np.isclose(s(np.array([1.0]))[0], 2 * np.exp(-1.0), rtol=1e-9))
    True
    >>> round(s.norm(), 9), round(s.expectation(1), 9), round(s.r_max(), 6)
    (1.0, 1.5, 1.0)
    """

    kind = "tabulated"

    def __init__(
        self, n: int, l: int, r: npt.ArrayLike, values: npt.ArrayLike, normalise: bool = True
    ) -> None:
        from scipy import integrate, interpolate  # lazily: keeps importing the core fast

        grid = np.asarray(r, dtype=float)
        vals = np.asarray(values, dtype=float)
        if grid.ndim != 1 or grid.shape != vals.shape or grid.size < 8:
            raise QuantumNumberError("r and values must be 1-D arrays of equal length >= 8")
        if grid[0] <= 0 or np.any(np.diff(grid) <= 0) or not np.all(np.isfinite(vals)):
            raise QuantumNumberError("r must be positive and increasing, values finite")
        self.n, self.l = int(n), int(l)
        self._x = np.log(grid)
        self._r = grid
        if normalise:
            total = integrate.simpson(vals**2 * grid**3, x=self._x)
            if not total > 0:
                raise QuantumNumberError("a tabulated radial function cannot be zero everywhere")
            vals = vals / np.sqrt(total)
        self._values = vals
        self._spline = interpolate.CubicSpline(self._x, vals / grid**self.l)

    def __repr__(self) -> str:
        return f"TabulatedRadial(n={self.n}, l={self.l}, points={self._r.size})"

    @property
    def grid(self) -> FloatArray:
        """The radii of the table (bohr)."""
        return self._r

    @property
    def values(self) -> FloatArray:
        """R at the radii of the table."""
        return self._values

    def over_r_l(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        x = np.log(np.clip(rr, self._r[0], self._r[-1]))
        out = np.asarray(self._spline(x), dtype=float)
        return np.where(rr <= self._r[-1], out, 0.0)

    def __call__(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(self.over_r_l(rr) * rr**self.l, dtype=float)

    def extent(self, tail: float = 1e-14) -> float:
        from scipy import integrate

        d = self._values**2 * self._r**3
        q = integrate.cumulative_simpson(d, x=self._x, initial=0.0)
        outside = q[-1] - q
        beyond = np.nonzero(outside > tail * q[-1])[0]
        return float(self._r[min(beyond[-1] + 1, self._r.size - 1)] if beyond.size else self._r[-1])

    def expectation(self, k: int) -> float:
        if k <= -2 * self.l - 3:
            return float("inf")
        from scipy import integrate

        return float(integrate.simpson(self._values**2 * self._r ** (3 + k), x=self._x))

    def quadrature_grid(self, points: int = 4001) -> FloatArray:
        return np.concatenate(([0.0], np.geomspace(self._r[0], self.extent(), points - 1)))


class TabulatedSpinorRadial(TabulatedRadial):
    """A tabulated radial function whose density is given separately from its amplitude.

    For orbitals with more than one radial part — the large and small components of a
    Dirac spinor, or a subshell whose spins or j levels have their own radial
    functions — no single signed R(r) has the right density everywhere. This one
    shows an amplitude (``values``: e.g. the large component, or the population-
    weighted mean of the parts), while the radial distribution, ⟨r^k⟩, the norm and
    the cumulative charge use the exact density ``distribution_values`` = r²ρ₁(r) per
    electron (e.g. P² + Q², or Σ f_i P_i²/f).

    Parameters
    ----------
    n, l : int
    r : array_like
        The logarithmic grid (bohr).
    values : array_like
        The amplitude R(r) (not renormalised).
    distribution_values : array_like
        D(r) at the radii, normalised by the caller (∫D dr = 1).

    Examples
    --------
    A large component with a tenth of the weight in a small one: the amplitude
    integrates to 0.9, the distribution to 1:

    >>> import numpy as np
    >>> r = log_grid(1e-5, 40.0, 801)
    >>> big = np.sqrt(0.9) * 2 * np.exp(-r)
    >>> f = TabulatedSpinorRadial(1, 0, r, big, (big * r) ** 2 / 0.9)
    >>> round(f.norm(), 9), round(float(np.sum(f.distribution(r[::100]) > 0)), 0)
    (1.0, 9.0)
    """

    kind = "tabulated-spinor"

    def __init__(self, n: int, l: int, r: npt.ArrayLike, values: npt.ArrayLike,
                 distribution_values: npt.ArrayLike) -> None:
        from scipy import interpolate

        super().__init__(n, l, r, values, normalise=False)
        d = np.asarray(distribution_values, dtype=float)
        if d.shape != self._r.shape or not np.all(np.isfinite(d)) or np.any(d < 0):
            raise QuantumNumberError("the distribution must be finite, non-negative and on the grid")
        self._distribution = d
        # D/r^{2l+2} is smooth at the nucleus (up to the relativistic r^{2γ−2} factor).
        self._d_spline = interpolate.CubicSpline(self._x, d / self._r ** (2 * self.l + 2))

    @property
    def distribution_values(self) -> FloatArray:
        """D(r) at the radii of the table."""
        return self._distribution

    def distribution(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        x = np.log(np.clip(rr, self._r[0], self._r[-1]))
        out = np.asarray(self._d_spline(x), dtype=float) * rr ** (2 * self.l + 2)
        return np.where(rr <= self._r[-1], np.maximum(out, 0.0), 0.0)

    def extent(self, tail: float = 1e-14) -> float:
        from scipy import integrate

        q = integrate.cumulative_simpson(self._distribution * self._r, x=self._x, initial=0.0)
        outside = q[-1] - q
        beyond = np.nonzero(outside > tail * q[-1])[0]
        return float(self._r[min(beyond[-1] + 1, self._r.size - 1)] if beyond.size else self._r[-1])

    def expectation(self, k: int) -> float:
        if k <= -2 * self.l - 3:
            return float("inf")
        from scipy import integrate

        return float(integrate.simpson(self._distribution * self._r ** (1 + k), x=self._x))

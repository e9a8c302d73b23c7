"""Radial integrals of an orbital set on a grid uniform in √r: I(a), F^k, G^k."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from zeffir.core._errors import QuantumNumberError
from zeffir.core.config import Subshell
from zeffir.core.orbitals import FloatArray, OrbitalSet, RadialFunction, SlaterRadial

__all__ = ["DEFAULT_POINTS", "RadialIntegrals", "radial_integrals"]

#: Grid points in t = √r: total energies of first-row atoms within ~5e-9 hartree of 16001 points.
DEFAULT_POINTS = 4001


def _p_and_derivative(radial: RadialFunction, r: FloatArray) -> tuple[FloatArray, FloatArray]:
    """P(r) = rR(r) and dP/dr: closed form for Slater-type functions, else central differences."""
    p = radial.p(r)
    if isinstance(radial, SlaterRadial):
        # P = N r^{n*} e^{-ζr}, so P' = P (n*/r - ζ); at r = 0 only n* = 1 leaves P' ≠ 0.
        with np.errstate(divide="ignore", invalid="ignore"):
            dp = np.where(r > 0, p * (radial.n_star / r - radial.zeta), 0.0)
        if radial.n_star == 1.0:
            dp[r == 0] = radial(np.zeros(1))[0]  # R(0) = N when n* = 1
        return p, np.asarray(dp, dtype=float)
    derivative = getattr(radial, "p_derivative", None)
    if callable(derivative):
        return p, np.asarray(derivative(r), dtype=float)
    step = 1e-5 * np.maximum(r, 1e-3)
    dp = (radial.p(r + step) - radial.p(np.maximum(r - step, 0.0))) / (r + step - np.maximum(r - step, 0.0))
    return p, np.asarray(dp, dtype=float)


def _simpson_weights(points: int, h: float) -> FloatArray:
    w = np.full(points, 2.0)
    w[1::2] = 4.0
    w[0] = w[-1] = 1.0
    return np.asarray(w * h / 3.0, dtype=float)


def _cumulative(f: FloatArray, h: float) -> FloatArray:
    """∫₀^{t_i} f dt at every grid point (scipy's cumulative Simpson rule)."""
    from scipy import integrate

    return np.asarray(integrate.cumulative_simpson(f, dx=h, initial=0.0), dtype=float)


@dataclass
class RadialIntegrals:
    """The radial integrals of one orbital set, orthonormalised within each l.

    Create with :func:`radial_integrals`. Values are in hartree.

    Attributes
    ----------
    subshells : tuple of Subshell
        The subshells, in the order of the orbital set.
    Z : int
        Nuclear charge.
    r : ndarray
        The grid (bohr), r = t², t uniform.
    p : ndarray
        P(r) of each subshell (rows), after orthonormalisation.
    dp : ndarray
        dP/dr of each subshell.

    Examples
    --------
    He⁺ 1s: T = Z²/2 and −Z⟨1/r⟩ = −Z² (Bethe & Salpeter 1957, §3); the Slater-type
    1s and 2s of neon come out orthonormal after Gram–Schmidt:

    >>> from zeffir.core import build
    >>> from zeffir.core.config import Subshell
    >>> s1, s2 = Subshell(1, 0), Subshell(2, 0)
    >>> ion = radial_integrals(build("He+", "hydrogenic"))
    >>> round(ion.kinetic(s1), 9), round(ion.nuclear(s1), 9)
    (2.0, -4.0)
    >>> neon = radial_integrals(build("Ne", "slater"))
    >>> abs(neon.overlap(s1, s2)) < 1e-12, round(neon.overlap(s2, s2), 12)
    (True, 1.0)
    """

    subshells: tuple[Subshell, ...]
    Z: int
    r: FloatArray
    p: FloatArray
    dp: FloatArray
    _t: FloatArray
    _h: float
    _cache: dict[tuple[str, int, Subshell, Subshell], float]

    def _row(self, a: Subshell) -> int:
        try:
            return self.subshells.index(a)
        except ValueError:
            raise QuantumNumberError(f"{a.label}: not in this orbital set") from None

    def _integrate(self, f_of_r: FloatArray) -> float:
        # ∫ f dr = ∫ f(t²) 2t dt.
        return float(np.dot(_simpson_weights(self._t.size, self._h), f_of_r * 2.0 * self._t))

    def overlap(self, a: Subshell, b: Subshell) -> float:
        """∫ P_a P_b dr."""
        return self._integrate(self.p[self._row(a)] * self.p[self._row(b)])

    def kinetic(self, a: Subshell) -> float:
        """T_a = ½ ∫ [P'² + l(l+1) P²/r²] dr = -½ ∫ P (d²/dr² - l(l+1)/r²) P dr."""
        i = self._row(a)
        p, dp = self.p[i], self.dp[i]
        centrifugal = 0.0 * p
        if a.l:
            with np.errstate(divide="ignore", invalid="ignore"):
                centrifugal = np.where(self.r > 0, a.l * (a.l + 1) * p * p / (self.r * self.r), 0.0)
        return 0.5 * self._integrate(dp * dp + centrifugal)

    def nuclear(self, a: Subshell) -> float:
        """Nuclear attraction -Z ⟨1/r⟩ = -Z ∫ P²/r dr."""
        p = self.p[self._row(a)]
        with np.errstate(divide="ignore", invalid="ignore"):
            over_r = np.where(self.r > 0, p * p / self.r, 0.0)
        return -self.Z * self._integrate(over_r)

    def rk(self, k: int, a: Subshell, b: Subshell, c: Subshell, d: Subshell) -> float:
        """R^k(ab; cd) = ∫∫ P_a(1)P_c(1) r<^k/r>^{k+1} P_b(2)P_d(2) dr1 dr2.

        Notes
        -----
        With ρ(s) = P_b P_d, Y^k(r)/r = r^{-k-1} ∫₀^r s^k ρ ds + r^k ∫_r^∞ s^{-k-1} ρ ds,
        both accumulated by cumulative Simpson sums in t = √s; then R^k = ∫ P_a P_c Y^k/r dr.

        References
        ----------
        Slater 1960, vol. I, ch. 13 and App. 20; Cowan 1981, §6-2.
        """
        r, t = self.r, self._t
        rho = self.p[self._row(b)] * self.p[self._row(d)] * 2.0 * t
        with np.errstate(divide="ignore", invalid="ignore", under="ignore"):
            inner = _cumulative(rho * r**k, self._h)
            outer_integrand = np.where(r > 0, rho / r ** (k + 1), 0.0)
            outer = _cumulative(outer_integrand, self._h)
            outer = outer[-1] - outer
            y_over_r = np.where(r > 0, inner / r ** (k + 1), 0.0) + r**k * outer
        return self._integrate(self.p[self._row(a)] * self.p[self._row(c)] * y_over_r)

    def slater_f(self, k: int, a: Subshell, b: Subshell) -> float:
        """F^k(a, b) = R^k(ab; ab)."""
        lo, hi = sorted((a, b), key=lambda s: (s.n, s.l))
        key = ("F", k, lo, hi)
        if key not in self._cache:
            self._cache[key] = self.rk(k, a, b, a, b)
        return self._cache[key]

    def slater_g(self, k: int, a: Subshell, b: Subshell) -> float:
        """G^k(a, b) = R^k(ab; ba)."""
        lo, hi = sorted((a, b), key=lambda s: (s.n, s.l))
        key = ("G", k, lo, hi)
        if key not in self._cache:
            self._cache[key] = self.rk(k, a, b, b, a)
        return self._cache[key]


def radial_integrals(orbitals: OrbitalSet, points: int = DEFAULT_POINTS,
                     orthonormalise: bool = True, r_max: float | None = None) -> RadialIntegrals:
    """Tabulate an orbital set's P(r) and P'(r) for its radial integrals.

    Parameters
    ----------
    orbitals : OrbitalSet
        Normalised radial functions of any kind.
    points : int
        Odd number of grid points, uniform in t = √r from 0 to √r_max, r_max the
        largest :meth:`RadialFunction.extent` (tail 1e-14).
    orthonormalise : bool
        Gram–Schmidt within each l in order of increasing n (on the grid). The
        determinant energy formulas assume orthonormal orbitals; with closed lower
        subshells a determinant is unchanged by this, so the energy is that of the
        original, non-orthogonal functions.
    r_max : float, optional
        Outer end of the grid (bohr). A fixed value keeps the discretisation the same
        while exponents vary (an optimiser's finite differences need that).

    Returns
    -------
    RadialIntegrals

    Notes
    -----
    In t the integrands are smooth polynomials times exponentials near the nucleus
    (P ~ r^{l+1} = t^{2l+2}), so Simpson's rule converges as h⁴.

    References
    ----------
    Slater 1960, vol. I, §13-3; Cowan 1981, §6-2.

    Examples
    --------
    >>> from zeffir.core import build
    >>> ints = radial_integrals(build("He", "hydrogenic"))
    >>> from zeffir.core.config import Subshell
    >>> abs(ints.slater_f(0, Subshell(1, 0), Subshell(1, 0)) - 5 * 2 / 8) < 1e-9  # 5ζ/8, ζ = 2
    True
    """
    if points < 101 or points % 2 == 0:
        raise QuantumNumberError(f"points = {points}: use an odd number >= 101")
    subshells = tuple(o.subshell for o in orbitals.orbitals)
    if r_max is None:
        r_max = max(o.radial.extent() for o in orbitals.orbitals)
    elif not r_max > 0:
        raise QuantumNumberError(f"r_max = {r_max}: must be positive")
    t = np.linspace(0.0, np.sqrt(r_max), points)
    h = float(t[1] - t[0])
    r = t * t
    rows = [_p_and_derivative(o.radial, r) for o in orbitals.orbitals]
    p = np.array([row[0] for row in rows])
    dp = np.array([row[1] for row in rows])
    weights = _simpson_weights(points, h) * 2.0 * t
    if orthonormalise:
        by_l: dict[int, list[int]] = {}
        for i, sub in enumerate(subshells):
            by_l.setdefault(sub.l, []).append(i)
        for rows_l in by_l.values():
            done: list[int] = []
            for i in sorted(rows_l, key=lambda j: subshells[j].n):
                for j in done:
                    s = float(np.dot(weights, p[i] * p[j]))
                    p[i] -= s * p[j]
                    dp[i] -= s * dp[j]
                norm = float(np.sqrt(np.dot(weights, p[i] * p[i])))
                if not norm > 1e-8:
                    raise QuantumNumberError(f"{subshells[i].label}: linearly dependent on a lower subshell")
                p[i] /= norm
                dp[i] /= norm
                done.append(i)
    return RadialIntegrals(subshells, orbitals.configuration.Z, r, p, dp, t, h, {})

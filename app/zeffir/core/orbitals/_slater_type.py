"""Slater-type radial functions R(r) = N r^{n*-1} e^{-ζ r}."""

from __future__ import annotations

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core._scipy import special
from zeffir.core.orbitals._radial import FloatArray, RadialFunction

__all__ = ["SlaterRadial"]


class SlaterRadial(RadialFunction):
    """A nodeless Slater-type radial function.

    Parameters
    ----------
    n, l : int
        The subshell it stands for (labels; l sets the angular part).
    n_star : float
        Effective principal quantum number n* >= 1 (Slater's 1, 2, 3, 3.7, 4.0, 4.2,
        or the integer n of the Clementi–Raimondi functions).
    zeta : float
        Orbital exponent ζ > 0 (bohr⁻¹).

    Notes
    -----
    R(r) = N r^{n*-1} e^{-ζr}, N = (2ζ)^{n*+1/2} / √Γ(2n*+1), so ∫R²r²dr = 1.
    <r^k> = Γ(2n*+1+k) / (Γ(2n*+1) (2ζ)^k); the radial distribution peaks at
    r = n*/ζ; Q(r) = P(2n*+1, 2ζr) (regularised incomplete gamma function).

    References
    ----------
    J. C. Slater, Phys. Rev. 36, 57 (1930).

    Examples
    --------
    >>> R = SlaterRadial(2, 1, 2.0, 1.5)
    >>> abs(R.r_max() - 2.0 / 1.5) < 1e-15
    True
    """

    kind = "slater-type"

    def __init__(self, n: int, l: int, n_star: float, zeta: float) -> None:
        if not n_star >= 1.0 or not np.isfinite(n_star):
            raise QuantumNumberError(f"n* must be at least 1, got {n_star}")
        if not zeta > 0 or not np.isfinite(zeta):
            raise QuantumNumberError(f"zeta must be a positive number, got {zeta}")
        self.n, self.l = int(n), int(l)
        self.n_star, self.zeta = float(n_star), float(zeta)
        self._log_norm = (self.n_star + 0.5) * np.log(2 * self.zeta) - 0.5 * special.gammaln(
            2 * self.n_star + 1
        )

    def __repr__(self) -> str:
        return f"SlaterRadial(n={self.n}, l={self.l}, n_star={self.n_star:g}, zeta={self.zeta:g})"

    def shape_key(self) -> object:
        # R depends on n* and ζ only; l merely labels the angular part.
        return ("slater-type", self.n_star, self.zeta)

    def _power_exp(self, r: npt.ArrayLike, power: float) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        exponent = self._log_norm - self.zeta * rr
        if not power:
            with np.errstate(under="ignore"):
                return np.asarray(np.exp(exponent), dtype=float)
        log_r = np.log(rr, where=rr > 0, out=np.zeros_like(rr))
        with np.errstate(under="ignore"):
            out = np.exp(exponent + power * log_r)
        # r^power vanishes at the nucleus for power > 0; for power < 0 (n* - 1 < l) the
        # factor is singular there but always multiplies r^l Y_lm, which vanishes faster.
        return np.where(rr > 0, out, 0.0)

    def __call__(self, r: npt.ArrayLike) -> FloatArray:
        return self._power_exp(r, self.n_star - 1.0)

    def over_r_l(self, r: npt.ArrayLike) -> FloatArray:
        return self._power_exp(r, self.n_star - 1.0 - self.l)

    def extent(self, tail: float = 1e-14) -> float:
        x = 2 * self.n_star + 10.0
        while special.gammaincc(2 * self.n_star + 1, x) > tail:
            x *= 1.2
        return x / (2 * self.zeta)

    def expectation(self, k: int) -> float:
        if 2 * self.n_star + 1 + k <= 0:
            return float("inf")
        log_value = (
            special.gammaln(2 * self.n_star + 1 + k)
            - special.gammaln(2 * self.n_star + 1)
            - k * np.log(2 * self.zeta)
        )
        return float(np.exp(log_value))

    def nodes(self) -> FloatArray:
        return np.empty(0)

    def r_max(self) -> float:
        return self.n_star / self.zeta

    def cumulative(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(special.gammainc(2 * self.n_star + 1, 2 * self.zeta * rr), dtype=float)

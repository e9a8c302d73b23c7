"""Hydrogenic radial functions R_nl(r; Z) for a bare point nucleus."""

from __future__ import annotations

from functools import cached_property

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core._scipy import special
from zeffir.core.config import MAX_N
from zeffir.core.orbitals._radial import FloatArray, RadialFunction

__all__ = ["HydrogenicRadial", "laguerre"]


def laguerre(k: int, alpha: float, x: FloatArray) -> FloatArray:
    """Generalised Laguerre polynomial L_k^alpha(x) by the stable forward recurrence.

    Notes
    -----
    (j + 1) L_{j+1} = (2j + 1 + alpha - x) L_j - (j + alpha) L_{j-1}, with L_0 = 1 and
    L_1 = 1 + alpha - x (Abramowitz & Stegun 1964, eq. 22.7.12).

    Examples
    --------
    >>> import numpy as np
    >>> float(laguerre(2, 1.0, np.array([0.0]))[0])  # binomial(3, 2)
    3.0
    """
    x = np.asarray(x, dtype=float)
    previous = np.ones_like(x)
    if k == 0:
        return previous
    current = 1.0 + alpha - x
    for j in range(1, k):
        previous, current = current, ((2 * j + 1 + alpha - x) * current - (j + alpha) * previous) / (j + 1)
    return current


class HydrogenicRadial(RadialFunction):
    """R_nl(r) of a one-electron atom with nuclear charge Z (bare point nucleus).

    Parameters
    ----------
    n, l : int
        Quantum numbers, 1 <= n <= 20, 0 <= l < n.
    Z : float
        Nuclear charge (a screened charge may be passed for a screened hydrogenic
        orbital), Z > 0.

    Notes
    -----
    R_nl(r) = N ρ^l e^{-ρ/2} L_{n-l-1}^{2l+1}(ρ), ρ = 2Zr/n, with
    N² = (2Z/n)³ (n-l-1)! / (2n (n+l)!). The normalisation is built from log-gamma
    so that n = 20 and Z = 118 neither overflow nor lose precision. The sign is
    positive near the nucleus, as in sympy's ``R_nl``.

    References
    ----------
    H. A. Bethe and E. E. Salpeter, *Quantum Mechanics of One- and Two-Electron
    Atoms* (Springer, 1957), §3.

    Examples
    --------
    >>> import numpy as np
    >>> R = HydrogenicRadial(1, 0, 1.0)
    >>> bool(np.isclose(R(np.array([0.0]))[0], 2.0))  # R_10(0) = 2 Z^{3/2}
    True
    """

    kind = "hydrogenic"

    def __init__(self, n: int, l: int, Z: float) -> None:
        if not 1 <= n <= MAX_N:
            raise QuantumNumberError(f"n must be between 1 and {MAX_N}, got {n}")
        if not 0 <= l < n:
            raise QuantumNumberError(f"l must be between 0 and n - 1 = {n - 1}, got {l}")
        if not Z > 0 or not np.isfinite(Z):
            raise QuantumNumberError(f"Z must be a positive number, got {Z}")
        self.n, self.l, self.Z = int(n), int(l), float(Z)
        self._scale = 2.0 * self.Z / self.n  # ρ = scale · r
        self._log_norm = 1.5 * np.log(self._scale) + 0.5 * (
            special.gammaln(n - l) - np.log(2.0 * n) - special.gammaln(n + l + 1)
        )

    def __repr__(self) -> str:
        return f"HydrogenicRadial(n={self.n}, l={self.l}, Z={self.Z:g})"

    def shape_key(self) -> object:
        return ("hydrogenic", self.n, self.l, self.Z)

    def _evaluate(self, r: npt.ArrayLike, power: int) -> FloatArray:
        """N ρ^power e^{-ρ/2} L(ρ) scaled so power = l gives R and power = 0 gives R/r^l·scale^-l."""
        rho = self._scale * np.asarray(r, dtype=float)
        poly = laguerre(self.n - self.l - 1, 2 * self.l + 1, rho)
        exponent = self._log_norm - 0.5 * rho
        if power:
            log_rho = np.log(rho, where=rho > 0, out=np.full_like(rho, -np.inf))
            exponent = exponent + power * log_rho
        with np.errstate(under="ignore"):
            return np.asarray(np.exp(exponent) * poly, dtype=float)

    def __call__(self, r: npt.ArrayLike) -> FloatArray:
        return self._evaluate(r, self.l)

    def over_r_l(self, r: npt.ArrayLike) -> FloatArray:
        # R / r^l = N scale^l e^{-ρ/2} L(ρ): finite at the nucleus.
        return self._evaluate(r, 0) * self._scale**self.l

    def extent(self, tail: float = 1e-14) -> float:
        # Beyond the last node the tail decays as ρ^{2n} e^{-ρ}; step out until it is negligible.
        rho = 2.0 * self.n + 10.0
        while special.gammaincc(2 * self.n + 1, rho) > tail:
            rho *= 1.2
        return rho / self._scale

    @cached_property
    def _gauss(self) -> int:
        return self.n - self.l + 2

    def expectation(self, k: int) -> float:
        """<r^k> by generalised Gauss–Laguerre quadrature, exact for this polynomial integrand.

        Notes
        -----
        <r^k> = N² (n/2Z)^{3+k} ∫ ρ^{2l+2+k} [L(ρ)]² e^{-ρ} dρ; with weight ρ^α e^{-ρ},
        α = 2l + 2 + k, a rule of n - l + 2 points integrates the degree-2(n-l-1)
        polynomial exactly. Diverges (returns inf) when α <= -1.

        Examples
        --------
        The closed forms of Bethe & Salpeter (1957), eqs. (3.24)–(3.26), here for 4f
        with Z = 3: ⟨r⟩ = (3n² − l(l+1))/2Z, ⟨r²⟩ = n²(5n² + 1 − 3l(l+1))/2Z²,
        ⟨1/r⟩ = Z/n²:

        >>> import numpy as np
        >>> n, l, Z = 4, 3, 3.0
        >>> R = HydrogenicRadial(n, l, Z)
        >>> bool(np.allclose([R.expectation(1), R.expectation(2), R.expectation(-1)],
        ...                  [(3 * n * n - l * (l + 1)) / (2 * Z),
        ...                   n * n * (5 * n * n + 1 - 3 * l * (l + 1)) / (2 * Z * Z), Z / n**2],
        ...                  rtol=1e-13))
        True
        """
        alpha = 2 * self.l + 2 + k
        if alpha <= -1:
            return float("inf")
        x, w = special.roots_genlaguerre(self._gauss, alpha)
        poly = laguerre(self.n - self.l - 1, 2 * self.l + 1, x)
        total = float(np.sum(w * poly * poly))
        return float(np.exp(2 * self._log_norm) * total / self._scale ** (3 + k))

    def nodes(self) -> FloatArray:
        """Node radii: the zeros of L_{n-l-1}^{2l+1}(ρ), ρ = 2Zr/n.

        Examples
        --------
        Hydrogen 3s has its nodes at r = (9 ± 3√3)/2 bohr (Bethe & Salpeter 1957, §3),
        and n − l − 1 nodes in general:

        >>> import numpy as np
        >>> bool(np.allclose(HydrogenicRadial(3, 0, 1.0).nodes(), [(9 - 3 * np.sqrt(3)) / 2,
        ...                                                        (9 + 3 * np.sqrt(3)) / 2]))
        True
        >>> [HydrogenicRadial(5, l, 2.0).nodes().size for l in range(5)]
        [4, 3, 2, 1, 0]
        """
        if self.n - self.l - 1 == 0:
            return np.empty(0)
        x, _ = special.roots_genlaguerre(self.n - self.l - 1, 2 * self.l + 1)
        return np.sort(x) / self._scale

"""Radial functions that are linear combinations of normalised Slater-type functions."""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core._scipy import special
from zeffir.core.orbitals._radial import FloatArray, RadialFunction
from zeffir.core.orbitals._slater_type import SlaterRadial

__all__ = ["SlaterExpansionRadial"]

#: Sign changes with less than this fraction of the electron outside are not nodes
#: (see :meth:`SlaterExpansionRadial.nodes`).
_TAIL_CROSSING = 1e-4
#: Most expansions of the self-consistent and minimal-basis orbitals print in full.
_REPR_TERMS = 6


class SlaterExpansionRadial(RadialFunction):
    """A radial function Σ_p c_p χ_p over normalised Slater-type functions χ_p.

    Parameters
    ----------
    n, l : int
        The subshell it stands for (labels; l sets the angular part).
    n_stars : float or array_like
        Principal quantum number n*_p of each function (one value for all, as in the
        Roothaan basis n* = l + 1, or one per function, as in a minimal basis).
    zetas : array_like
        Exponents ζ_p > 0 (bohr⁻¹).
    coefficients : array_like
        Coefficients c_p of the normalised functions; the combination must be normalised.

    Notes
    -----
    R(r) = Σ_p c_p N_p r^{n*_p - 1} e^{-ζ_p r}, N_p = (2ζ_p)^{n*_p + 1/2}/√Γ(2n*_p + 1).
    With a_pq = n*_p + n*_q + 1 and s_pq = ζ_p + ζ_q, moments and the cumulative charge
    are finite sums over pairs:

    <r^k> = Σ_pq c_p c_q N_p N_q Γ(a_pq + k)/s_pq^{a_pq + k},
    Q(r) = Σ_pq c_p c_q N_p N_q Γ(a_pq)/s_pq^{a_pq} P(a_pq, s_pq r),

    P the regularised lower incomplete gamma function; the tail 1 - Q(r) is the same
    sum with the upper function Γ(a, x)/Γ(a), so it is formed without cancellation
    against 1. :meth:`extent` is the radius where that tail falls to the tolerance.
    R/r^l and dP/dr = Σ_p c_p P_p (n*_p/r - ζ_p) are in closed form as well.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951) (orbitals as combinations of basis
    functions); E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963)
    (minimal Slater-type bases); E. Clementi and C. Roetti, At. Data Nucl. Data
    Tables 14, 177 (1974) (self-consistent orbitals as sums of Slater-type functions);
    M. Abramowitz and I. A. Stegun, *Handbook of Mathematical Functions* (1964), 6.5
    (incomplete gamma functions).

    Examples
    --------
    Hydrogen 1s (one term): <r> = 3/2 and, at the extent, the tail holds the tolerance.

    >>> R = SlaterExpansionRadial(1, 0, 1, [1.0], [1.0])
    >>> bool(abs(R.expectation(1) - 1.5) < 1e-14)
    True
    >>> bool(abs((1.0 - R.cumulative(np.array([R.extent(1e-8)]))[0]) - 1e-8) < 1e-14)
    True

    A 2s orthogonalised to a 1s (Gram–Schmidt on χ_1s = 2e^{-r}, χ_2s of ζ = 1/2):
    normalised, with one node.

    >>> s12 = 2.0 / np.sqrt(24.0) * 6.0 / 1.5**4  # ⟨χ_1s|χ_2s⟩ = N_1 N_2 3!/(ζ_1 + ζ_2)⁴
    >>> two_s = SlaterExpansionRadial(2, 0, [1, 2], [1.0, 0.5],
    ...                               [-s12 / np.sqrt(1 - s12**2), 1 / np.sqrt(1 - s12**2)])
    >>> bool(abs(two_s.norm() - 1.0) < 1e-12), two_s.nodes().size
    (True, 1)
    """

    kind = "slater-type expansion"

    def __init__(self, n: int, l: int, n_stars: float | npt.ArrayLike, zetas: npt.ArrayLike,
                 coefficients: npt.ArrayLike) -> None:
        self.n, self.l = int(n), int(l)
        self.zetas = np.asarray(zetas, dtype=float).copy()
        self.coefficients = np.asarray(coefficients, dtype=float).copy()
        if self.zetas.shape != self.coefficients.shape or self.zetas.ndim != 1 or self.zetas.size == 0:
            raise QuantumNumberError("zetas and coefficients must be 1-D arrays of equal, nonzero length")
        try:
            self.n_stars = np.broadcast_to(np.asarray(n_stars, dtype=float), self.zetas.shape).copy()
        except ValueError:
            raise QuantumNumberError("n_stars must be one value or one per function") from None
        # SlaterRadial checks n* >= 1 and ζ > 0.
        self.terms = tuple(SlaterRadial(self.n, self.l, float(m), float(z))
                           for m, z in zip(self.n_stars, self.zetas, strict=True))

    @classmethod
    def from_terms(cls, n: int, l: int, terms: Sequence[tuple[SlaterRadial, float]]) -> SlaterExpansionRadial:
        """The expansion Σ c·χ of ``(χ, c)`` pairs of Slater-type functions.

        Examples
        --------
        >>> chi = SlaterRadial(1, 0, 1.0, 2.0)
        >>> R = SlaterExpansionRadial.from_terms(1, 0, [(chi, 1.0)])
        >>> bool(abs(R.expectation(-1) - chi.expectation(-1)) < 1e-14)  # <1/r> = ζ/n*
        True
        """
        return cls(n, l, [s.n_star for s, _ in terms], [s.zeta for s, _ in terms], [c for _, c in terms])

    def __repr__(self) -> str:
        if self.zetas.size > _REPR_TERMS:
            return f"SlaterExpansionRadial(n={self.n}, l={self.l}, terms={self.zetas.size})"
        parts = ", ".join(f"{c:+.6g}·STO({m:g}, {z:.6g})"
                          for m, z, c in zip(self.n_stars, self.zetas, self.coefficients, strict=True))
        return f"SlaterExpansionRadial(n={self.n}, l={self.l}, {parts})"

    def shape_key(self) -> object:
        # R depends on the terms only; n and l label the subshell.
        return ("slater-expansion", tuple(self.n_stars), tuple(self.zetas), tuple(self.coefficients))

    def __call__(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(sum(c * s(rr) for s, c in zip(self.terms, self.coefficients, strict=True)),
                          dtype=float)

    def over_r_l(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(sum(c * s.over_r_l(rr) for s, c in zip(self.terms, self.coefficients, strict=True)),
                          dtype=float)

    def p_derivative(self, r: npt.ArrayLike) -> FloatArray:
        """dP/dr in closed form: Σ_p c_p P_p (n*_p/r - ζ_p), P = rR (used by the radial integrals)."""
        rr = np.asarray(r, dtype=float)
        out = np.zeros_like(rr)
        for s, c in zip(self.terms, self.coefficients, strict=True):
            with np.errstate(divide="ignore", invalid="ignore"):
                dp = np.where(rr > 0, s.p(rr) * (s.n_star / rr - s.zeta), 0.0)
            if s.n_star == 1.0:
                dp = np.where(rr == 0, s(np.zeros(1))[0], dp)  # P'(0) = R(0) = N for n* = 1
            out += c * dp
        return out

    def extent(self, tail: float = 1e-14) -> float:
        """Radius (bohr) beyond which ∫ P² dr, from the closed-form tail, is below ``tail``.

        The bisection starts from the largest extent of the terms, widened until the
        combination's tail is below ``tail`` there: coefficients above 1 (those of a
        Gram–Schmidt orbital, or of cancelling diffuse functions) leave more than
        ``tail`` beyond it, while a bound set by the most diffuse function alone would
        be too wide when its coefficient is small.
        """
        hi = max(t.extent(tail) for t in self.terms)
        for _ in range(200):
            if float(self._outside(hi)) <= tail:
                break
            hi *= 1.25
        lo = 0.0
        for _ in range(100):
            mid = 0.5 * (lo + hi)
            lo, hi = (mid, hi) if float(self._outside(mid)) > tail else (lo, mid)
            if hi - lo < 1e-12 * hi:
                break
        return hi

    def nodes(self) -> FloatArray:
        """Radial nodes, leaving out sign changes in the far tail.

        Far out, where less than ~1e-7 of the electron remains, an expansion can cross
        zero: there the orbital has decayed below what the variational solution fixes
        (the admixture of other orbitals left by a ~1e-9 residual, or a diffuse basis
        function with a small negative coefficient; the Hartree–Fock 3s of He 1s1 3s1
        crosses at 49 and 64 bohr with 1.7e-8 of the electron outside). Every node of a
        bound orbital lies inside its outer maximum, with most of the electron beyond it
        (0.91 for that 3s's outer node at 5.2 bohr), so dropping the crossings with less
        than 1e-4 of the electron outside loses no true node.
        """
        roots = super().nodes()
        return roots[self._outside(roots) > _TAIL_CROSSING]

    def _pair_moment(self, power: int) -> tuple[FloatArray, FloatArray, FloatArray]:
        """c_p c_q N_p N_q Γ(a_pq + power)/s_pq^{a_pq + power}, with s_pq and a_pq + power."""
        m = self.n_stars
        ln = (m + 0.5) * np.log(2 * self.zetas) - 0.5 * special.gammaln(2 * m + 1)
        s = self.zetas[:, None] + self.zetas[None, :]
        a = m[:, None] + m[None, :] + 1 + power
        weights = self.coefficients[:, None] * self.coefficients[None, :]
        return weights * np.exp(ln[:, None] + ln[None, :] + special.gammaln(a) - a * np.log(s)), s, a

    def _outside(self, r: npt.ArrayLike) -> FloatArray:
        """1 - Q(r), summed from the complementary incomplete gamma functions (no cancellation)."""
        rr = np.asarray(r, dtype=float)
        moments, s, a = self._pair_moment(0)
        tails = special.gammaincc(a, rr[..., None, None] * s)
        return np.asarray(np.tensordot(tails, moments, axes=([-2, -1], [0, 1])), dtype=float)

    def expectation(self, k: int) -> float:
        if float(np.min(self.n_stars)) * 2 + 1 + k <= 0:
            return float("inf")
        moments, _, _ = self._pair_moment(k)
        return float(np.sum(moments))

    def cumulative(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        moments, s, a = self._pair_moment(0)
        out = np.tensordot(special.gammainc(a, rr[..., None, None] * s), moments, axes=([-2, -1], [0, 1]))
        return np.asarray(out, dtype=float)

"""Wigner 3j symbols for integer arguments (Racah's formula, exact rational arithmetic)."""

from __future__ import annotations

import math
from fractions import Fraction
from functools import cache

__all__ = ["ck_coefficient", "wigner_3j", "wigner_3j_squared"]


@cache
def wigner_3j_squared(j1: int, j2: int, j3: int, m1: int, m2: int, m3: int) -> tuple[int, Fraction]:
    """Sign and exact square of the 3j symbol (j1 j2 j3; m1 m2 m3) for integer arguments.

    Parameters
    ----------
    j1, j2, j3 : int
        Angular momenta (>= 0).
    m1, m2, m3 : int
        Their projections.

    Returns
    -------
    (int, Fraction)
        The sign (-1, 0 or +1) and the square of the symbol, exactly.

    Notes
    -----
    Racah's formula,

    (j1 j2 j3; m1 m2 m3) = (-1)^(j1-j2-m3) √[Δ(j1 j2 j3) Π_i (j_i+m_i)!(j_i-m_i)!]
        Σ_t (-1)^t / [t! (j3-j2+t+m1)! (j3-j1+t-m2)! (j1+j2-j3-t)! (j1-t-m1)! (j2-t+m2)!],

    Δ = (j1+j2-j3)!(j1-j2+j3)!(-j1+j2+j3)! / (j1+j2+j3+1)!. The sum is an exact
    rational; the factorials under the root are exact integers, so the square is
    exact and only the final square root (in :func:`wigner_3j`) rounds.

    References
    ----------
    G. Racah, Phys. Rev. 62, 438 (1942); R. D. Cowan, *The Theory of Atomic Structure
    and Spectra* (University of California Press, 1981), §5-1.

    Examples
    --------
    >>> wigner_3j_squared(1, 1, 0, 0, 0, 0)
    (-1, Fraction(1, 3))

    Orthogonality, Σ_{m1 m2} (j1 j2 j3; m1 m2 m3)² = 1/(2j3 + 1) (Cowan 1981, §5-1),
    exactly:

    >>> from fractions import Fraction
    >>> sum((wigner_3j_squared(2, 3, 4, m1, m2, -1)[1] for m1 in range(-2, 3) for m2 in range(-3, 4)),
    ...     Fraction(0))
    Fraction(1, 9)
    """
    args = (j1, j2, j3, m1, m2, m3)
    if any(int(a) != a for a in args):
        raise ValueError(f"wigner_3j_squared takes integers, got {args}")
    if m1 + m2 + m3 != 0 or min(j1, j2, j3) < 0:
        return 0, Fraction(0)
    if abs(m1) > j1 or abs(m2) > j2 or abs(m3) > j3:
        return 0, Fraction(0)
    if j3 > j1 + j2 or j3 < abs(j1 - j2):
        return 0, Fraction(0)
    f = math.factorial
    delta = Fraction(f(j1 + j2 - j3) * f(j1 - j2 + j3) * f(-j1 + j2 + j3), f(j1 + j2 + j3 + 1))
    under_root = delta * (f(j1 + m1) * f(j1 - m1) * f(j2 + m2) * f(j2 - m2) * f(j3 + m3) * f(j3 - m3))
    t_min = max(0, j2 - j3 - m1, j1 - j3 + m2)
    t_max = min(j1 + j2 - j3, j1 - m1, j2 + m2)
    total = Fraction(0)
    for t in range(t_min, t_max + 1):
        denominator = (f(t) * f(j3 - j2 + t + m1) * f(j3 - j1 + t - m2) * f(j1 + j2 - j3 - t)
                       * f(j1 - t - m1) * f(j2 - t + m2))
        total += Fraction((-1) ** t, denominator)
    if total == 0:
        return 0, Fraction(0)
    sign = (-1) ** ((j1 - j2 - m3) % 2) * (1 if total > 0 else -1)
    return sign, total * total * under_root


def wigner_3j(j1: int, j2: int, j3: int, m1: int, m2: int, m3: int) -> float:
    """The Wigner 3j symbol (j1 j2 j3; m1 m2 m3) for integer arguments.

    Parameters
    ----------
    j1, j2, j3, m1, m2, m3 : int
        Angular momenta and projections; the symbol is 0 unless m1+m2+m3 = 0,
        |m_i| <= j_i and the triangle condition holds.

    Returns
    -------
    float
        The symbol, correct to rounding (see :func:`wigner_3j_squared`).

    References
    ----------
    Racah 1942; Cowan 1981, eq. (5.3).

    Examples
    --------
    >>> abs(wigner_3j(1, 1, 2, 0, 0, 0) - (2 / 15) ** 0.5) < 1e-15
    True
    """
    sign, square = wigner_3j_squared(j1, j2, j3, m1, m2, m3)
    return sign * math.sqrt(square.numerator / square.denominator) if sign else 0.0


@cache
def ck_coefficient(k: int, l1: int, m1: int, l2: int, m2: int) -> float:
    """The Gaunt-type coefficient c^k(l1 m1; l2 m2).

    Parameters
    ----------
    k : int
        Multipole order.
    l1, m1, l2, m2 : int
        Orbital quantum numbers of the two one-electron states.

    Returns
    -------
    float
        c^k(l1 m1; l2 m2) = √[4π/(2k+1)] ∫ Y*_{l1 m1} Y_{k, m1-m2} Y_{l2 m2} dΩ.

    Notes
    -----
    c^k(l1 m1; l2 m2) = (-1)^m1 √[(2l1+1)(2l2+1)] (l1 k l2; 0 0 0) (l1 k l2; -m1 m1-m2 m2),
    Condon–Shortley phase. It vanishes unless l1+k+l2 is even and the triangle holds.
    The Coulomb matrix element between two spin-orbitals in the same pair of
    states is Σ_k c^k(l_a m_a; l_a m_a) c^k(l_b m_b; l_b m_b) F^k(a, b) (direct) and
    Σ_k [c^k(l_a m_a; l_b m_b)]² G^k(a, b) (exchange).

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (Cambridge, 1935),
    §6.8 and Table 1⁶; J. C. Slater, *Quantum Theory of Atomic Structure* (McGraw-Hill,
    1960), vol. I, ch. 13; Cowan 1981, eq. (6.21).

    Examples
    --------
    >>> round(ck_coefficient(2, 1, 1, 1, 1), 15)  # Condon & Shortley: c²(1 1; 1 1) = -1/5
    -0.2

    The sum rule Σ_{m2} c^k(l1 m1; l2 m2)² = (2l2 + 1)(l1 k l2; 0 0 0)², the same for
    every m1 (from the orthogonality of the 3j symbols), here for p and d with k = 1:

    >>> sums = [sum(ck_coefficient(1, 1, m1, 2, m2) ** 2 for m2 in range(-2, 3)) for m1 in (-1, 0, 1)]
    >>> all(abs(s - 5 * wigner_3j(1, 1, 2, 0, 0, 0) ** 2) < 1e-15 for s in sums)
    True
    """
    phase = -1 if m1 % 2 else 1
    return phase * math.sqrt((2 * l1 + 1) * (2 * l2 + 1)) * wigner_3j(l1, k, l2, 0, 0, 0) * wigner_3j(
        l1, k, l2, -m1, m1 - m2, m2
    )

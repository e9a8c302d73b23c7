"""Microstate tables of open subshells, and the terms peeled off them.

A microstate of a configuration is one Slater determinant: a choice of spin-orbitals
(m_l, m_s) in each subshell obeying the Pauli principle. Only the counts of
microstates per (M_L, M_S) matter for the terms, so each open subshell's table is
built once by counting, and subshells are combined by convolving their tables; the
product of all subshells' microstates is never enumerated.
"""

from __future__ import annotations

from functools import cache, lru_cache
from math import comb, prod
from typing import Final

import numpy as np
from numpy.typing import NDArray

from zeffir.core._errors import ZeffirError

__all__ = [
    "MAX_TERMS",
    "OpenShells",
    "TermError",
    "hund_subshell",
    "microstate_table",
    "microstates",
    "subshell_table",
    "term_table",
]

#: Most terms ``configuration_terms`` lists; beyond this a list is of no use to anyone
#: and would take hundreds of megabytes.
MAX_TERMS: Final[int] = 200_000

#: Open subshells as (l, electrons) pairs, sorted.
OpenShells = tuple[tuple[int, int], ...]

# Every count stays below the total number of microstates; int64 holds it below this.
_INT64_LIMIT: Final[int] = 2**62


class TermError(ZeffirError, ValueError):
    """The terms of a configuration cannot be listed (there are far too many).

    Examples
    --------
    Four half-filled or nearly half-filled subshells of high l have
    Π C(2(2l + 1), k) ≈ 1.2e21 microstates: the count is still exact, the terms are
    not listed:

    >>> from math import comb
    >>> from zeffir.core.terms import configuration_terms, microstate_count
    >>> spec = "Zr 4f7 5g9 6h11 7i13"
    >>> microstate_count(spec) == comb(14, 7) * comb(18, 9) * comb(22, 11) * comb(26, 13)
    True
    >>> try:
    ...     configuration_terms(spec)
    ... except TermError as error:
    ...     print(error)
    Zr 4f7 5g9 6h11 7i13: 1.224e+21 microstates: too many to count the terms
    """


def microstates(shells: OpenShells) -> int:
    """Number of microstates: the product of C(2(2l + 1), k) over the subshells."""
    return prod(comb(2 * (2 * l + 1), k) for l, k in shells)


def hund_subshell(l: int, k: int) -> tuple[int, int]:
    """2S and L of the lowest term of l^k by Hund's first two rules.

    Parameters
    ----------
    l : int
        Orbital angular momentum of the subshell.
    k : int
        Electrons, 0 <= k <= 2(2l + 1).

    Returns
    -------
    (int, int)
        Twice the largest S, and the largest L that occurs with that S.

    Notes
    -----
    The largest M_S puts as many electrons as possible spin-up: q = k unpaired
    electrons up to half filling, q = 2(2l + 1) - k beyond it. The largest M_L at
    that M_S fills m_l = l, l - 1, ... with the q electrons beyond the half-filled
    core (which has M_L = 0): L = q l - q (q - 1) / 2.

    References
    ----------
    F. Hund, Z. Phys. 33, 345 (1925); Condon & Shortley (1935), on the lowest term
    of equivalent electrons.

    Examples
    --------
    >>> hund_subshell(2, 6)  # d6: 5D
    (4, 2)
    """
    half = 2 * l + 1
    two_s = k if k <= half else 2 * half - k
    q = k if k <= half else k - half
    return two_s, q * l - q * (q - 1) // 2


def _max_ml(l: int, k: int) -> int:
    # Largest M_L whatever M_S: two electrons in each of m_l = l, l - 1, ...
    values = sorted((m for m in range(-l, l + 1) for _ in range(2)), reverse=True)
    return sum(values[:k])


@cache
def subshell_table(l: int, k: int) -> NDArray[np.int64]:
    """Microstate counts of l^k by (M_L, 2 M_S).

    Parameters
    ----------
    l : int
        Orbital angular momentum of the subshell, 0 <= l.
    k : int
        Electrons, 0 <= k <= 2(2l + 1).

    Returns
    -------
    ndarray of int64, shape (2 M + 1, 2 k + 1), read-only
        ``table[M_L + M, 2 M_S + k]``, with M the largest M_L of l^k. Entries with
        2 M_S of the wrong parity are zero.

    Notes
    -----
    Counted spin-orbital by spin-orbital: after adding the spin-orbital (m_l, m_s),
    the count of j electrons at (M_L, M_S) gains the count of j - 1 electrons at
    (M_L - m_l, M_S - m_s). The sum of the table is C(2(2l + 1), k).

    Examples
    --------
    >>> int(subshell_table(1, 2).sum())  # p2: C(6, 2)
    15
    """
    bound = l * (l + 1)  # no partial filling reaches beyond the sum of the positive m_l, twice
    counts = np.zeros((k + 1, 2 * bound + 1, 2 * k + 1), dtype=np.int64)
    counts[0, bound, k] = 1
    width, depth = 2 * bound + 1, 2 * k + 1
    for m in range(-l, l + 1) if k else ():
        for two_ms in (1, -1):
            added = np.zeros_like(counts)
            rows = slice(max(m, 0), width + min(m, 0))
            rows_from = slice(max(-m, 0), width - max(m, 0))
            cols = slice(max(two_ms, 0), depth + min(two_ms, 0))
            cols_from = slice(max(-two_ms, 0), depth - max(two_ms, 0))
            added[1:, rows, cols] = counts[:-1, rows_from, cols_from]
            counts += added
    top = _max_ml(l, k)
    table = counts[k, bound - top: bound + top + 1, :].copy()
    assert int(table.sum()) == comb(2 * (2 * l + 1), k)
    table.setflags(write=False)
    return table


def _convolve(a: NDArray[np.int64], b: NDArray[np.int64]) -> NDArray[np.int64]:
    """Full 2-D convolution in exact integer arithmetic."""
    if np.count_nonzero(a) > np.count_nonzero(b):
        a, b = b, a
    out = np.zeros((a.shape[0] + b.shape[0] - 1, a.shape[1] + b.shape[1] - 1), dtype=np.int64)
    for i, j in zip(*np.nonzero(a), strict=True):
        out[i: i + b.shape[0], j: j + b.shape[1]] += a[i, j] * b
    return out


def microstate_table(shells: OpenShells) -> NDArray[np.int64]:
    """Microstate counts of several open subshells by (M_L, 2 M_S).

    Parameters
    ----------
    shells : tuple of (l, k)
        The open subshells. Closed subshells add nothing and may be left out.

    Returns
    -------
    ndarray of int64, shape (2 M + 1, 2 K + 1)
        ``table[M_L + M, 2 M_S + K]`` with K the number of electrons and M the
        largest M_L.

    Raises
    ------
    TermError
        When the microstates are too many to count in 64-bit integers.

    Notes
    -----
    M_L and M_S add over subshells, so the table of the configuration is the 2-D
    convolution of the subshells' tables.
    """
    total = microstates(shells)
    if total >= _INT64_LIMIT:
        raise TermError(f"{total:.3e} microstates: too many to count the terms")
    table = np.ones((1, 1), dtype=np.int64)
    for l, k in shells:
        table = _convolve(table, subshell_table(l, k))
    return table


@lru_cache(maxsize=256)
def term_table(shells: OpenShells) -> NDArray[np.int64]:
    """How many times each term occurs: ``counts[L, 2S]``.

    Parameters
    ----------
    shells : tuple of (l, k)
        The open subshells, sorted.

    Returns
    -------
    ndarray of int64, shape (M + 1, K + 1), read-only
        The number of terms with orbital momentum L and spin S.

    Notes
    -----
    Condon & Shortley's method: a term (L, S) contributes one microstate to every
    (M_L, M_S) with |M_L| <= L and |M_S| <= S. Peeling terms off from the highest
    (M_L, M_S) down therefore leaves, for M_L, M_S >= 0,

        N(L, S) = n(L, S) - n(L + 1, S) - n(L, S + 1) + n(L + 1, S + 1),

    where n(M_L, M_S) is the number of microstates.

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (1935), the
    determination of the terms of a configuration from its microstates;
    R. D. Cowan, *The Theory of Atomic Structure and Spectra* (1981), the same method.
    """
    table = microstate_table(shells)
    top_ml, electrons = (table.shape[0] - 1) // 2, (table.shape[1] - 1) // 2
    quadrant = table[top_ml:, electrons:]
    padded = np.zeros((quadrant.shape[0] + 1, quadrant.shape[1] + 2), dtype=np.int64)
    padded[:-1, :-2] = quadrant
    counts = padded[:-1, :-2] - padded[1:, :-2] - padded[:-1, 2:] + padded[1:, 2:]
    if (counts < 0).any():  # pragma: no cover - impossible for a table of microstates
        raise AssertionError("negative term count: the microstate table is inconsistent")
    counts.setflags(write=False)
    return counts

"""Subshells (n, l) and their trade labels."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Final

from zeffir.core._errors import QuantumNumberError

__all__ = ["L_LETTERS", "MAX_L", "MAX_N", "Subshell", "madelung_order"]

#: Spectroscopic letters for l = 0..6, the trade's own notation.
L_LETTERS: Final[str] = "spdfghi"
#: Largest principal quantum number Zeffir accepts.
MAX_N: Final[int] = 20
#: Largest orbital angular momentum Zeffir accepts (i subshells).
MAX_L: Final[int] = 6


@dataclass(frozen=True, order=True, slots=True)
class Subshell:
    """A subshell nl, ordered by n and then l.

    Parameters
    ----------
    n : int
        Principal quantum number, 1 <= n <= 20.
    l : int
        Orbital angular momentum quantum number, 0 <= l < n and l <= 6.

    Examples
    --------
    >>> Subshell(3, 2).label, Subshell(3, 2).capacity
    ('3d', 10)

    The subshells of shell n hold Σ_l 2(2l + 1) = 2n² electrons:

    >>> all(sum(Subshell(n, l).capacity for l in range(min(n, 7))) == 2 * n * n
    ...     for n in range(1, 8))
    True
    """

    n: int
    l: int

    def __post_init__(self) -> None:
        if not 1 <= self.n <= MAX_N:
            raise QuantumNumberError(f"n must be between 1 and {MAX_N}, got {self.n}")
        if not 0 <= self.l <= MAX_L:
            raise QuantumNumberError(f"l must be between 0 and {MAX_L}, got {self.l}")
        if self.l >= self.n:
            raise QuantumNumberError(f"{self.n}{L_LETTERS[self.l]}: l must be less than n")

    @property
    def letter(self) -> str:
        """The spectroscopic letter of l (s, p, d, f, g, h, i)."""
        return L_LETTERS[self.l]

    @property
    def label(self) -> str:
        """The trade label, e.g. ``'4f'``."""
        return f"{self.n}{self.letter}"

    @property
    def capacity(self) -> int:
        """Most electrons the subshell holds, 2(2l + 1)."""
        return 2 * (2 * self.l + 1)

    @classmethod
    def from_label(cls, label: str) -> Subshell:
        """Build a subshell from a label such as ``'3d'``."""
        letter = label[-1:].lower()
        if len(label) < 2 or not label[:-1].isdigit() or letter not in L_LETTERS:
            raise QuantumNumberError(f"{label}: not a subshell label (e.g. 3d)")
        return cls(int(label[:-1]), L_LETTERS.index(letter))

    def __str__(self) -> str:
        return self.label


def madelung_order(max_n_plus_l: int = 9) -> list[Subshell]:
    """Subshells in the order of increasing n + l, then n (the Madelung rule).

    Parameters
    ----------
    max_n_plus_l : int
        Largest n + l listed; 9 reaches 8s, beyond every known ground state.

    Returns
    -------
    list of Subshell
        1s, 2s, 2p, 3s, 3p, 4s, 3d, 4p, 5s, ...

    Notes
    -----
    The Madelung (aufbau) ordering is an empirical rule of thumb (common practice);
    the observed ground states of about twenty elements break it, which is why the
    element table stores the observed configurations.

    Examples
    --------
    Filling subshells in this order closes each p subshell at the electron count of
    a noble gas (Ne, Ar, Kr, Xe, Rn, Og):

    >>> from itertools import accumulate
    >>> order = madelung_order()
    >>> [sub.label for sub in order[:9]]
    ['1s', '2s', '2p', '3s', '3p', '4s', '3d', '4p', '5s']
    >>> filled = accumulate(sub.capacity for sub in order)
    >>> [total for sub, total in zip(order, filled) if sub.l == 1][:6]
    [10, 18, 36, 54, 86, 118]
    """
    order = [
        Subshell(n, l)
        for s in range(1, max_n_plus_l + 1)
        for n in range(1, s + 1)
        for l in [s - n]
        if l < n and l <= MAX_L and n <= MAX_N
    ]
    return sorted(order, key=lambda sub: (sub.n + sub.l, sub.n))

"""Reading subshell tokens such as ``3d5`` or ``2p`` (occupancy 1 may be omitted)."""

from __future__ import annotations

import re
from typing import Final

from zeffir.core._errors import SpecError
from zeffir.core.config._subshell import L_LETTERS, MAX_L, MAX_N, Subshell

__all__ = ["NOBLE_GAS_CORES", "parse_subshell_token"]

#: Noble-gas core symbols accepted in brackets, with their atomic numbers.
NOBLE_GAS_CORES: Final[dict[str, int]] = {
    "He": 2, "Ne": 10, "Ar": 18, "Kr": 36, "Xe": 54, "Rn": 86, "Og": 118,
}

_TOKEN: Final = re.compile(r"^(\d+)([a-zA-Z])(\d*)$", re.ASCII)  # 0–9 only


def parse_subshell_token(token: str) -> tuple[Subshell, int]:
    """Read one subshell token of trade notation.

    Parameters
    ----------
    token : str
        ``nlk`` with n a positive integer, l a letter of ``spdfghi`` and k the
        occupancy (omitted means 1, trade usage), e.g. ``3d5``, ``2p``.

    Returns
    -------
    (Subshell, int)
        The subshell and its occupancy.

    Raises
    ------
    SpecError
        With a message naming the token and the rule it breaks.

    Examples
    --------
    >>> parse_subshell_token("4f14")[0].label, parse_subshell_token("4f14")[1]
    ('4f', 14)
    """
    match = _TOKEN.match(token)
    if match is None:
        raise SpecError(f"{token}: not a subshell (write n, a letter of spdfghi, electrons: 3d5)")
    n_text, letter, occ_text = match.groups()
    n = int(n_text)
    if letter not in L_LETTERS:
        raise SpecError(f"{token}: unknown subshell letter '{letter}' (use {' '.join(L_LETTERS)})")
    l = L_LETTERS.index(letter)
    if not 1 <= n <= MAX_N:
        raise SpecError(f"{token}: n must be between 1 and {MAX_N}")
    if l >= n:
        raise SpecError(f"{n}{letter}: l must be less than n")
    if l > MAX_L:  # pragma: no cover - letters stop at i (l = 6)
        raise SpecError(f"{token}: l must be at most {MAX_L}")
    occupancy = int(occ_text) if occ_text else 1
    subshell = Subshell(n, l)
    if occupancy > subshell.capacity:
        raise SpecError(
            f"{token}: a {letter} subshell holds at most {subshell.capacity} electrons"
        )
    return subshell, occupancy

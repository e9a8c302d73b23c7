"""The periodic table: symbols, names and observed ground-state configurations.

The configurations are those of the NIST Atomic Spectra Database ground-levels
table, stored in ``resources/data/elements.csv`` (its header names the source).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache
from typing import Final

from zeffir.core._errors import SpecError
from zeffir.core._resources import read_table
from zeffir.core.config._subshell import Subshell
from zeffir.core.config._tokens import NOBLE_GAS_CORES, parse_subshell_token

__all__ = ["MAX_Z", "Element", "element", "elements"]

#: Heaviest element in the table (oganesson).
MAX_Z: Final[int] = 118


@dataclass(frozen=True, slots=True)
class Element:
    """One element of the table.

    Attributes
    ----------
    Z : int
        Atomic number.
    symbol, name : str
        Chemical symbol and English name.
    ground_text : str
        Ground configuration as written in the table, e.g. ``'[Ar] 3d5 4s1'``.
    ground : tuple of (Subshell, int)
        The same, expanded and ordered by (n, l).

    Examples
    --------
    Chromium's observed ground configuration breaks the Madelung order (NIST ASD
    ground levels); expanded, it holds Z electrons:

    >>> cr = element("Cr")
    >>> cr.ground_text, sum(occ for _, occ in cr.ground) == cr.Z
    ('[Ar] 3d5 4s1', True)
    """

    Z: int
    symbol: str
    name: str
    ground_text: str
    ground: tuple[tuple[Subshell, int], ...]


def _expand(text: str, known: dict[str, Element]) -> tuple[tuple[Subshell, int], ...]:
    occupation: dict[Subshell, int] = {}
    for token in text.split():
        if token.startswith("["):
            core = known[token.strip("[]")]
            occupation.update(core.ground)
        else:
            subshell, occ = parse_subshell_token(token)
            occupation[subshell] = occ
    return tuple(sorted(occupation.items()))


@cache
def elements() -> tuple[Element, ...]:
    """All elements Z = 1..118, read once from the shipped table.

    Returns
    -------
    tuple of Element
        Index ``Z - 1`` holds element Z.

    Examples
    --------
    Every neutral atom's ground configuration holds Z electrons:

    >>> table = elements()
    >>> len(table), all(e.Z == i + 1 for i, e in enumerate(table))
    (118, True)
    >>> all(sum(occ for _, occ in e.ground) == e.Z for e in table)
    True
    """
    known: dict[str, Element] = {}
    table: list[Element] = []
    for row in read_table("data", "elements.csv"):
        text = row["configuration"].strip()
        item = Element(
            Z=int(row["Z"]),
            symbol=row["symbol"],
            name=row["name"],
            ground_text=text,
            ground=_expand(text, known),
        )
        known[item.symbol] = item
        table.append(item)
    if [e.Z for e in table] != list(range(1, MAX_Z + 1)):
        raise RuntimeError("resources/data/elements.csv must list Z = 1..118 in order")
    assert set(NOBLE_GAS_CORES) <= set(known)
    return tuple(table)


@cache
def _by_symbol() -> dict[str, Element]:
    return {e.symbol.lower(): e for e in elements()}


def element(key: str | int) -> Element:
    """Look an element up by symbol (any letter case) or atomic number.

    Parameters
    ----------
    key : str or int
        ``'Fe'``, ``'fe'``, ``26`` or ``'26'``.

    Returns
    -------
    Element

    Raises
    ------
    SpecError
        ``Xx: unknown element`` or ``119: Z must be between 1 and 118``.

    Examples
    --------
    >>> element("Fe").Z, element(26).symbol
    (26, 'Fe')
    """
    text = str(key).strip()
    if text.isdigit():
        z = int(text)
        if not 1 <= z <= MAX_Z:
            raise SpecError(f"{text}: Z must be between 1 and {MAX_Z}")
        return elements()[z - 1]
    found = _by_symbol().get(text.lower())
    if found is None:
        raise SpecError(f"{text}: unknown element")
    return found

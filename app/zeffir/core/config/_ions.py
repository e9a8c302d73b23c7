"""Observed ground configurations and levels of ions (charges +1 to +4).

The table ``resources/data/ion_ground_states.csv`` is NIST's listing of the ground
shells and ground level of every spectrum II to V up to lawrencium, digitised by the
``mendeleev`` package; its header names the source and how it was generated.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from functools import cache

from zeffir.core._resources import read_table
from zeffir.core.config._elements import element
from zeffir.core.config._subshell import Subshell
from zeffir.core.config._tokens import parse_subshell_token

__all__ = ["ION_SOURCE", "IonGround", "observed_ion", "observed_ions"]

#: Where the observed ion ground states come from, as notes and exports name it.
ION_SOURCE = "NIST Atomic Spectra Database, ground states of the ions"


@dataclass(frozen=True, slots=True)
class IonGround:
    """One ion's observed ground state.

    Attributes
    ----------
    Z, charge : int
        Atomic number and net charge (+1 to +4).
    configuration_text : str
        As written in the table, e.g. ``'[Xe] 4f6'``.
    occupations : tuple of (Subshell, int)
        The same, expanded and ordered by (n, l).
    level : str
        NIST's designation, ``°`` for odd parity: ``'7F0'``, ``'4H°7/2'``, ``'(9/2,1/2)°4'``
        (J1 j coupling) or ``'J = 3/2'`` (J only).
    multiplicity, L : int or None
        2S + 1 and L of the level when NIST names it in LS coupling.
    J : Fraction
        Total angular momentum of the level.
    parity : str
        ``'even'`` or ``'odd'``.

    Examples
    --------
    Fe³⁺ (NIST ASD: [Ar] 3d⁵ ⁶S₅/₂) holds Z − charge electrons, and with L = 0 its
    J equals S = (2S + 1 − 1)/2:

    >>> fe3 = observed_ion(26, 3)
    >>> fe3.configuration_text, fe3.level
    ('[Ar] 3d5', '6S5/2')
    >>> sum(occ for _, occ in fe3.occupations) == fe3.Z - fe3.charge
    True
    >>> fe3.L == 0 and fe3.J == (fe3.multiplicity - 1) / 2
    True
    """

    Z: int
    charge: int
    configuration_text: str
    occupations: tuple[tuple[Subshell, int], ...]
    level: str
    multiplicity: int | None
    L: int | None
    J: Fraction
    parity: str


def _expand(text: str) -> tuple[tuple[Subshell, int], ...]:
    occupation: dict[Subshell, int] = {}
    for token in text.split():
        if token.startswith("["):
            occupation.update(element(token.strip("[]")).ground)
        else:
            subshell, occ = parse_subshell_token(token)
            occupation[subshell] = occ
    return tuple(sorted(occupation.items()))


@cache
def _table() -> dict[tuple[int, int], IonGround]:
    table: dict[tuple[int, int], IonGround] = {}
    for row in read_table("data", "ion_ground_states.csv"):
        text = row["configuration"].strip()
        item = IonGround(
            Z=int(row["Z"]),
            charge=int(row["charge"]),
            configuration_text=text,
            occupations=_expand(text),
            level=row["level"],
            multiplicity=int(row["multiplicity"]) if row["multiplicity"] else None,
            L=int(row["L"]) if row["L"] else None,
            J=Fraction(row["J"]),
            parity=row["parity"],
        )
        if sum(occ for _, occ in item.occupations) != item.Z - item.charge:
            raise RuntimeError(f"ion_ground_states.csv: Z = {item.Z}, charge {item.charge}: "
                               "electron count does not match")
        table[(item.Z, item.charge)] = item
    return table


def observed_ion(Z: int, charge: int) -> IonGround | None:
    """The observed ground state of an ion, if the shipped table lists it.

    Parameters
    ----------
    Z : int
        Atomic number.
    charge : int
        Net charge; the table covers +1 to +4 for Z <= 103.

    Returns
    -------
    IonGround or None

    References
    ----------
    A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
    Database, ground states and ionization energies (spectra II to V).

    Examples
    --------
    >>> found = observed_ion(63, 3)
    >>> found.configuration_text, found.level
    ('[Xe] 4f6', '7F0')
    >>> observed_ion(26, 7) is None
    True
    """
    return _table().get((Z, charge))


def observed_ions() -> tuple[IonGround, ...]:
    """Every ion of the shipped table, ordered by Z and then charge.

    Examples
    --------
    Each ion holds Z − charge electrons, and every level NIST names in LS coupling
    obeys the triangle rule |L − S| <= J <= L + S:

    >>> ions = observed_ions()
    >>> all(sum(occ for _, occ in i.occupations) == i.Z - i.charge for i in ions)
    True
    >>> ls = [(i.L, (i.multiplicity - 1) / 2, i.J) for i in ions if i.L is not None]
    >>> all(abs(L - S) <= J <= L + S for L, S, J in ls)
    True
    """
    return tuple(_table()[key] for key in sorted(_table()))

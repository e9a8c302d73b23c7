"""Measured first ionization energies: NIST's table, shipped as a CSV file.

``resources/data/first_ionization_energies.csv`` holds the first ionization energy of
every neutral atom Z = 1 … 104 in eV as published, with NIST's uncertainty and
whether the value is measured or calculated; it is read once and converted to hartree
with the CODATA value of :mod:`scipy.constants`.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

from zeffir.core import _units
from zeffir.core._resources import read_table

__all__ = ["IONIZATION_SOURCE", "MeasuredIonization", "measured_first_ionization"]

#: The source line of the shipped table, for legends and exported files.
IONIZATION_SOURCE = ("NIST Atomic Spectra Database, Ground States and Ionization Energies "
                     "(Kramida, Ralchenko, Reader and NIST ASD Team)")


@dataclass(frozen=True, slots=True)
class MeasuredIonization:
    """NIST's first ionization energy of one neutral atom.

    Attributes
    ----------
    Z : int
    symbol : str
    energy : float
        In hartree (converted from NIST's eV with CODATA).
    energy_ev : float
        As published.
    uncertainty_ev : float or None
    kind : str
        ``measured``, ``theoretical`` or ``semi-empirical`` (NIST's flags).
    """

    Z: int
    symbol: str
    energy: float
    energy_ev: float
    uncertainty_ev: float | None
    kind: str


@lru_cache(maxsize=1)
def _table() -> dict[int, MeasuredIonization]:
    per_hartree = _units.EV_PER_HARTREE
    out = {}
    for row in read_table("data", "first_ionization_energies.csv"):
        z = int(row["Z"])
        ev = float(row["energy_eV"])
        spread = float(row["uncertainty_eV"]) if row["uncertainty_eV"] else None
        out[z] = MeasuredIonization(z, row["symbol"], ev / per_hartree, ev, spread, row["kind"])
    return out


def measured_first_ionization(z: int) -> MeasuredIonization | None:
    """NIST's first ionization energy of neutral element ``z``, or None beyond the table.

    Examples
    --------
    Helium's is the largest of all, 24.587 eV (0.9036 hartree):

    >>> he = measured_first_ionization(2)
    >>> round(he.energy_ev, 3), round(he.energy, 4), he.kind
    (24.587, 0.9036, 'measured')
    >>> measured_first_ionization(110) is None
    True
    """
    return _table().get(z)

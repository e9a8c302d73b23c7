"""Conversions between atomic units and the units shown at the edges.

Everything inside Zeffir is in atomic units (bohr, hartree). Ångström and
electronvolt appear only in tables and exports, converted with the CODATA values
that :mod:`scipy.constants` carries.
"""

from __future__ import annotations

import re
from typing import Final

import numpy as np
import numpy.typing as npt
from scipy import constants as _c

__all__ = [
    "ANGSTROM_PER_BOHR",
    "CODATA_EDITION",
    "EV_PER_HARTREE",
    "bohr_to_angstrom",
    "hartree_to_ev",
]

#: Bohr radius a0 in ångström (CODATA, via scipy.constants).
ANGSTROM_PER_BOHR: Final[float] = _c.physical_constants["Bohr radius"][0] / _c.angstrom
#: Hartree energy in electronvolt (CODATA, via scipy.constants).
EV_PER_HARTREE: Final[float] = _c.physical_constants["Hartree energy in eV"][0]


def _codata_edition() -> str:
    """Name the CODATA edition scipy.constants carries, read from SciPy itself."""
    doc = str(getattr(_c, "_codata", None).__doc__ or "")
    match = re.search(r"CODATA Recommended Values.*?(\d{4})", doc, flags=re.S)
    return f"CODATA {match.group(1)}" if match else "CODATA (edition of the installed SciPy)"


#: The CODATA edition of the installed SciPy, for headers of exported files.
CODATA_EDITION: Final[str] = _codata_edition()


def bohr_to_angstrom(value: float | npt.ArrayLike) -> float | npt.NDArray[np.float64]:
    """Convert a length from bohr to ångström.

    Parameters
    ----------
    value : float or array_like
        Length(s) in bohr.

    Returns
    -------
    float or ndarray
        Length(s) in ångström.

    References
    ----------
    CODATA recommended values as carried by :mod:`scipy.constants`.

    Examples
    --------
    >>> bool(abs(bohr_to_angstrom(1.0) - 0.529177) < 1e-6)
    True
    """
    return np.multiply(value, ANGSTROM_PER_BOHR)


def hartree_to_ev(value: float | npt.ArrayLike) -> float | npt.NDArray[np.float64]:
    """Convert an energy from hartree to electronvolt.

    Parameters
    ----------
    value : float or array_like
        Energy (energies) in hartree.

    Returns
    -------
    float or ndarray
        Energy (energies) in eV.

    References
    ----------
    CODATA recommended values as carried by :mod:`scipy.constants`.

    Examples
    --------
    >>> bool(abs(hartree_to_ev(0.5) - 13.6057) < 1e-4)
    True
    """
    return np.multiply(value, EV_PER_HARTREE)

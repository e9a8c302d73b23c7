"""Conversions between atomic units and the units shown at the edges.

Everything inside Zeffir is in atomic units (bohr, hartree). Ångström and
electronvolt appear only in tables and exports, converted with the CODATA values
that :mod:`scipy.constants` carries.

The constants are read from SciPy when first used (a module ``__getattr__``, PEP 562):
importing :mod:`scipy.constants` costs about 0.2 s, which ``zeffir --version``, ``--help``
and the window's first paint should not pay.
"""

from __future__ import annotations

import re
from collections.abc import Callable
from typing import Any

import numpy as np
import numpy.typing as npt

__all__ = [
    "ANGSTROM_PER_BOHR",
    "CODATA_EDITION",
    "EV_PER_HARTREE",
    "bohr_to_angstrom",
    "hartree_to_ev",
]

#: Bohr radius a0 in ångström (CODATA, via scipy.constants).
ANGSTROM_PER_BOHR: float
#: Hartree energy in electronvolt (CODATA, via scipy.constants).
EV_PER_HARTREE: float
#: The CODATA edition of the installed SciPy, for headers of exported files.
CODATA_EDITION: str


def _angstrom_per_bohr() -> float:
    from scipy import constants

    return float(constants.physical_constants["Bohr radius"][0] / constants.angstrom)


def _ev_per_hartree() -> float:
    from scipy import constants

    return float(constants.physical_constants["Hartree energy in eV"][0])


def _codata_edition() -> str:
    """Name the CODATA edition scipy.constants carries, read from SciPy itself."""
    from scipy import constants

    doc = str(getattr(constants, "_codata", None).__doc__ or "")
    match = re.search(r"CODATA Recommended Values.*?(\d{4})", doc, flags=re.S)
    return f"CODATA {match.group(1)}" if match else "CODATA (edition of the installed SciPy)"


_LAZY: dict[str, Callable[[], Any]] = {
    "ANGSTROM_PER_BOHR": _angstrom_per_bohr,
    "EV_PER_HARTREE": _ev_per_hartree,
    "CODATA_EDITION": _codata_edition,
}


def __getattr__(name: str) -> Any:
    """Read a constant from scipy.constants on first use, then keep it."""
    if name in _LAZY:
        value = _LAZY[name]()
        globals()[name] = value
        return value
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")


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
    factor: float = __getattr__("ANGSTROM_PER_BOHR")
    return np.multiply(value, factor)


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
    factor: float = __getattr__("EV_PER_HARTREE")
    return np.multiply(value, factor)

"""What a trend plots: per-subshell and per-atom quantities, in atomic units.

Every value is read as the subshell table reads it (the orbital's fields, its radial
function's ``expectation`` and ``r_max``, as :func:`~zeffir.core.properties.summarise`
does, and :func:`~zeffir.core.properties.energy_summary`), so a trend point and
``zeffir table`` never disagree.
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable
from dataclasses import dataclass

from zeffir.core._errors import ZeffirError
from zeffir.core.orbitals import OrbitalSet, SubshellOrbital
from zeffir.core.properties import energy_summary

__all__ = [
    "ATOM_QUANTITIES",
    "SUBSHELL_QUANTITIES",
    "TrendQuantity",
    "TrendQuantityError",
    "quantity",
    "quantity_names",
    "valence_subshell",
]


class TrendQuantityError(ZeffirError):
    """A quantity or subshell a trend cannot take."""


@dataclass(frozen=True, slots=True)
class TrendQuantity:
    """One quantity a trend can run over.

    Attributes
    ----------
    name : str
        Its name on the command line and in JSON (``z_eff``, ``<r^-3>``...).
    title : str
        Words for axis labels and legends.
    unit : str
        Atomic unit of the values (``hartree``, ``bohr``, ``bohr^-3``, ``1``...).
    per_subshell : bool
        True when it belongs to one subshell (then a subshell or ``valence`` is chosen).
    power : int or None
        k of a radial moment ⟨r^k⟩, else None.
    """

    name: str
    title: str
    unit: str
    per_subshell: bool
    power: int | None = None


SUBSHELL_QUANTITIES: dict[str, TrendQuantity] = {
    "zeta": TrendQuantity("zeta", "orbital exponent ζ", "bohr^-1", True),
    "z_eff": TrendQuantity("z_eff", "effective nuclear charge Z_eff", "1", True),
    "n_star": TrendQuantity("n_star", "effective principal quantum number n*", "1", True),
    "r_mean": TrendQuantity("r_mean", "mean radius ⟨r⟩", "bohr", True, 1),
    "r_max": TrendQuantity("r_max", "radius of the largest maximum of D(r)", "bohr", True),
    "energy": TrendQuantity("energy", "orbital energy ε", "hartree", True),
    **{f"<r^{k}>": TrendQuantity(f"<r^{k}>", f"⟨r^{k}⟩", "1" if k == 0 else f"bohr^{k}", True, k)
       for k in range(-3, 3)},
}
ATOM_QUANTITIES: dict[str, TrendQuantity] = {
    "total_energy": TrendQuantity("total_energy", "total energy", "hartree", False),
    "correlation_energy": TrendQuantity("correlation_energy", "correlation energy E_corr", "hartree",
                                        False),
    "virial_ratio": TrendQuantity("virial_ratio", "virial ratio −V/T", "1", False),
    "ionization_energy": TrendQuantity("ionization_energy", "first ionization energy", "hartree", False),
}


def quantity_names() -> tuple[str, ...]:
    """Every quantity name, per subshell first."""
    return (*SUBSHELL_QUANTITIES, *ATOM_QUANTITIES)


def quantity(name: str) -> TrendQuantity:
    """The quantity called ``name`` (``<r^k>`` may also be written ``r^k``).

    Examples
    --------
    >>> quantity("r^-3").unit, quantity("z_eff").per_subshell
    ('bohr^-3', True)
    """
    key = name.strip()
    moment = re.fullmatch(r"<?r\^?\(?([+-]?\d+)\)?>?", key)
    if moment:
        key = f"<r^{int(moment[1])}>"
    found = SUBSHELL_QUANTITIES.get(key) or ATOM_QUANTITIES.get(key)
    if found is None:
        raise TrendQuantityError(f"{name}: unknown quantity (choose from {', '.join(quantity_names())})")
    return found


def valence_subshell(orbitals: OrbitalSet) -> SubshellOrbital:
    """The outermost occupied subshell: largest n, then largest l (4s of Fe, 4d of Pd).

    Examples
    --------
    >>> from zeffir.core import build
    >>> valence_subshell(build("Fe", "slater")).label, valence_subshell(build("Pd", "slater")).label
    ('4s', '4d')
    """
    return max(orbitals.orbitals, key=lambda o: (o.n, o.l))


_GETTERS: dict[str, Callable[[SubshellOrbital], float | None]] = {
    "zeta": lambda o: o.zeta,
    "z_eff": lambda o: o.z_eff,
    "n_star": lambda o: o.n_star,
    "energy": lambda o: o.energy,
    "r_max": lambda o: o.radial.r_max(),
}


def subshell_value(kind: TrendQuantity, orbital: SubshellOrbital) -> tuple[float | None, str | None]:
    """The value of a per-subshell quantity, or None and why."""
    if kind.power is not None:
        if kind.power == 0:
            return 1.0, None
        # The same calls the subshell table makes (summarise), without its other columns.
        moment = orbital.radial.expectation(kind.power)
        if not math.isfinite(moment):
            return None, f"⟨r^{kind.power}⟩ diverges for an s orbital"
        return float(moment), None
    value = _GETTERS[kind.name](orbital)
    if value is None:
        return None, f"the model defines no {kind.title} for {orbital.label}"
    return float(value), None


def atom_value(kind: TrendQuantity, orbitals: OrbitalSet) -> tuple[float | None, str | None]:
    """The value of a per-atom quantity other than the ionization energy, or None and why."""
    summary = energy_summary(orbitals, orbitals.model)
    if kind.name == "total_energy":
        if summary.total is None:
            return None, "the model defines no total energy"
        return summary.total, None
    if kind.name == "virial_ratio":
        if summary.virial_ratio is None:
            return None, "the model gives no virial ratio"
        return summary.virial_ratio, None
    if kind.name == "correlation_energy":
        if summary.correlation is None:
            return None, (f"correlation energy {summary.remark}" if summary.remark
                          else "correlation energy given for restricted Hartree–Fock only")
        return summary.correlation, None
    raise TrendQuantityError(f"{kind.name}: not an atom quantity of this kind")

"""Slater-type orbitals with the optimised exponents of Clementi, Raimondi and Reinhardt."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache

from zeffir.core._resources import read_table
from zeffir.core.config import Configuration, Subshell
from zeffir.core.models._slater_rules import slater_orbital
from zeffir.core.orbitals import OrbitalSet, SlaterRadial, SubshellOrbital

__all__ = ["ClementiModel", "clementi_z_eff"]


@cache
def _table() -> dict[tuple[int, int, int], tuple[float, str]]:
    return {
        (int(row["Z"]), int(row["n"]), int(row["l"])): (float(row["z_eff"]), row["source"])
        for row in read_table("data", "clementi_exponents.csv")
    }


def clementi_z_eff(Z: int, subshell: Subshell) -> tuple[float, str] | None:
    """Published Z_eff of a subshell of neutral atom Z and its source tag, or None.

    References
    ----------
    E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963) (Z = 2–36);
    E. Clementi, D. L. Raimondi and W. P. Reinhardt, J. Chem. Phys. 47, 1300 (1967)
    (Z = 37–86).
    """
    return _table().get((Z, subshell.n, subshell.l))


@dataclass(frozen=True)
class ClementiModel:
    """Slater-type orbitals with integer n and optimised exponents ζ = Z_eff/n.

    Notes
    -----
    The exponents were optimised for the ground states of the neutral atoms. For
    ions and excited configurations the neutral atom's value is used and flagged;
    subshells with no published value (Z > 86, or not in the table) fall back to
    Slater's rules and say so.

    References
    ----------
    Clementi & Raimondi 1963; Clementi, Raimondi & Reinhardt 1967.
    """

    name: str = "clementi"
    title: str = "optimised exponents (Clementi–Raimondi)"
    reference: str = "Clementi & Raimondi 1963; Clementi, Raimondi & Reinhardt 1967"

    def build(self, configuration: Configuration) -> OrbitalSet:
        neutral_ground = configuration.charge == 0 and not configuration.explicit
        set_notes = () if neutral_ground else (
            "tabulated exponents belong to the neutral ground-state atom",
        )
        orbitals: list[SubshellOrbital] = []
        for sub, occ in configuration.occupations:
            found = clementi_z_eff(configuration.Z, sub)
            if found is None:
                orbitals.append(slater_orbital(
                    configuration, sub, occ,
                    (f"{sub.label}: no published exponent; Slater's rules used",),
                ))
                continue
            z_eff, _source = found
            zeta = z_eff / sub.n
            orbitals.append(SubshellOrbital(
                subshell=sub,
                occupancy=occ,
                radial=SlaterRadial(sub.n, sub.l, float(sub.n), zeta),
                zeta=zeta,
                z_eff=z_eff,
                n_star=float(sub.n),
                energy=None,
            ))
        return OrbitalSet(configuration, self.name, tuple(orbitals), total_energy=None,
                          notes=set_notes)

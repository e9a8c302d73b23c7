"""Published exact non-relativistic energies, for correlation energies E_corr = E_exact − E_HF."""

from __future__ import annotations

from functools import cache

from zeffir.core._resources import read_table
from zeffir.core.config import Configuration, element

__all__ = ["correlation_energy", "exact_energy"]


@cache
def _table() -> dict[int, tuple[float, str]]:
    return {
        int(row["Z"]): (float(row["energy_hartree"]), row["source"])
        for row in read_table("data", "exact_nonrelativistic_energies.csv")
    }


def exact_energy(configuration: Configuration) -> tuple[float, str] | None:
    """Published exact non-relativistic energy (hartree) and its source, or None.

    Values exist for the ground states of the neutral atoms He–Ar only (see
    ``resources/data/exact_nonrelativistic_energies.csv``); ions and excited
    configurations have no entry.

    References
    ----------
    S. J. Chakravorty et al., Phys. Rev. A 47, 3649 (1993); C. L. Pekeris,
    Phys. Rev. 115, 1216 (1959).
    """
    ground = element(configuration.Z).ground
    if configuration.charge != 0 or configuration.occupations != ground:
        return None
    return _table().get(configuration.Z)


def correlation_energy(configuration: Configuration, hartree_fock_energy: float) -> float | None:
    """E_corr = E_exact − E_HF (hartree) where an exact energy is published, else None."""
    found = exact_energy(configuration)
    return None if found is None else found[0] - hartree_fock_energy

"""The bare-nucleus model: every electron sees the full nuclear charge."""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core.config import Configuration
from zeffir.core.orbitals import HydrogenicRadial, OrbitalSet, SubshellOrbital

__all__ = ["HydrogenicModel"]


@dataclass(frozen=True)
class HydrogenicModel:
    """Hydrogenic orbitals of the bare nucleus (electron repulsion ignored).

    Notes
    -----
    ζ = Z/n, Z_eff = Z, ε_n = -Z²/(2n²) hartree. The total energy is the sum of
    occupied orbital energies, the exact energy of non-interacting electrons.

    References
    ----------
    H. A. Bethe and E. E. Salpeter, *Quantum Mechanics of One- and Two-Electron
    Atoms* (Springer, 1957).
    """

    name: str = "hydrogenic"
    title: str = "bare nucleus (hydrogenic)"
    reference: str = "Bethe & Salpeter 1957"

    def build(self, configuration: Configuration) -> OrbitalSet:
        z = float(configuration.Z)
        orbitals = tuple(
            SubshellOrbital(
                subshell=sub,
                occupancy=occ,
                radial=HydrogenicRadial(sub.n, sub.l, z),
                zeta=z / sub.n,
                z_eff=z,
                n_star=None,
                energy=-(z**2) / (2 * sub.n**2),
            )
            for sub, occ in configuration.occupations
        )
        total = sum(o.occupancy * o.energy for o in orbitals if o.energy is not None)
        return OrbitalSet(configuration, self.name, orbitals, total_energy=total,
                          notes=("electron repulsion ignored",))

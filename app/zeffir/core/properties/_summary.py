"""Per-subshell numbers: <r^k>, r_max, nodes, and the subshell table."""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core.orbitals import OrbitalSet, RadialFunction, SubshellOrbital

__all__ = ["MOMENT_POWERS", "SubshellSummary", "moments", "subshell_table"]

#: Powers k of the radial moments <r^k> reported for every subshell.
MOMENT_POWERS: tuple[int, ...] = (-3, -2, -1, 1, 2)


def moments(radial: RadialFunction, powers: tuple[int, ...] = MOMENT_POWERS) -> dict[int, float]:
    """<r^k> (bohr^k) of a radial function for each k; ``inf`` where it diverges (s, k = -3)."""
    return {k: radial.expectation(k) for k in powers}


@dataclass(frozen=True, slots=True)
class SubshellSummary:
    """One row of the subshell table, atomic units throughout."""

    label: str
    n: int
    l: int
    occupancy: int
    zeta: float
    z_eff: float
    n_star: float | None
    r_mean: float
    r_max: float
    energy: float | None
    nodes: tuple[float, ...]
    moments: dict[int, float]
    notes: tuple[str, ...]


def summarise(orbital: SubshellOrbital) -> SubshellSummary:
    """Numbers of one subshell (see :class:`SubshellSummary`)."""
    values = moments(orbital.radial)
    return SubshellSummary(
        label=orbital.label,
        n=orbital.n,
        l=orbital.l,
        occupancy=orbital.occupancy,
        zeta=orbital.zeta,
        z_eff=orbital.z_eff,
        n_star=orbital.n_star,
        r_mean=values[1],
        r_max=orbital.radial.r_max(),
        energy=orbital.energy,
        nodes=tuple(float(x) for x in orbital.radial.nodes()),
        moments=values,
        notes=orbital.notes,
    )


def subshell_table(orbitals: OrbitalSet) -> list[SubshellSummary]:
    """The subshell table of an orbital set, one row per occupied subshell."""
    return [summarise(o) for o in orbitals.orbitals]

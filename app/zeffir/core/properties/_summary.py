"""Per-subshell numbers: <r^k>, r_max, nodes, and the subshell table."""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core.orbitals import OrbitalComponent, OrbitalSet, RadialFunction, SubshellOrbital

__all__ = ["MOMENT_POWERS", "SubshellSummary", "moments", "occupancy_text", "subshell_table"]

#: Powers k of the radial moments <r^k> reported for every subshell.
MOMENT_POWERS: tuple[int, ...] = (-3, -2, -1, 1, 2)


def moments(radial: RadialFunction, powers: tuple[int, ...] = MOMENT_POWERS) -> dict[int, float]:
    """<r^k> (bohr^k) of a radial function for each k; ``inf`` where it diverges (s, k = -3).

    References
    ----------
    H. A. Bethe and E. E. Salpeter, *Quantum Mechanics of One- and Two-Electron
    Atoms* (Springer, 1957), eqs. (3.24)–(3.26) (the hydrogenic closed forms).

    Examples
    --------
    Hydrogenic 3d with Z = 2 against the closed forms: ⟨r^-3⟩ = Z³/(n³l(l+½)(l+1)),
    ⟨r^-2⟩ = Z²/(n³(l+½)), ⟨r^-1⟩ = Z/n², ⟨r⟩ = (3n² − l(l+1))/2Z,
    ⟨r²⟩ = n²(5n² + 1 − 3l(l+1))/2Z²:

    >>> import numpy as np
    >>> from zeffir.core.orbitals import HydrogenicRadial
    >>> n, l, Z = 3, 2, 2.0
    >>> closed = [Z**3 / (n**3 * l * (l + 0.5) * (l + 1)), Z**2 / (n**3 * (l + 0.5)), Z / n**2,
    ...           (3 * n * n - l * (l + 1)) / (2 * Z),
    ...           n * n * (5 * n * n + 1 - 3 * l * (l + 1)) / (2 * Z * Z)]
    >>> found = moments(HydrogenicRadial(n, l, Z))
    >>> sorted(found) == [-3, -2, -1, 1, 2], bool(np.allclose([found[k] for k in sorted(found)], closed))
    (True, True)
    >>> moments(HydrogenicRadial(1, 0, 1.0))[-3]  # ⟨r^-3⟩ diverges for s
    inf
    """
    return {k: radial.expectation(k) for k in powers}


@dataclass(frozen=True, slots=True)
class SubshellSummary:
    """One row of the subshell table, atomic units throughout.

    Examples
    --------
    A row repeats its orbital's ⟨r⟩ as ``r_mean``; for hydrogen 3s, ⟨r⟩ = 27/2, the
    nodes lie at (9 ± 3√3)/2 bohr and ε = −1/18 hartree (Bethe & Salpeter 1957, §3):

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> row = summarise(build("H 3s1", "hydrogenic").orbital("3s"))
    >>> row.r_mean == row.moments[1], round(row.r_mean, 9), round(row.energy, 12) == round(-1 / 18, 12)
    (True, 13.5, True)
    >>> bool(np.allclose(row.nodes, [(9 - 3 * np.sqrt(3)) / 2, (9 + 3 * np.sqrt(3)) / 2]))
    True
    """

    label: str
    n: int
    l: int
    occupancy: int | float
    zeta: float
    z_eff: float
    n_star: float | None
    r_mean: float
    r_max: float
    energy: float | None
    nodes: tuple[float, ...]
    moments: dict[int, float]
    notes: tuple[str, ...]
    j: float | None = None
    energy_up: float | None = None
    energy_down: float | None = None

    @property
    def subshell(self) -> str:
        """The row's subshell nl (``'2p'`` also for a ``'2p3/2'`` row)."""
        return f"{self.n}{'spdfghik'[self.l]}"


def summarise(orbital: SubshellOrbital) -> SubshellSummary:
    """Numbers of one subshell (see :class:`SubshellSummary`).

    Examples
    --------
    He⁺ 2p (n = 2, l = 1, Z = 2): D(r) ∝ r⁴ e^(−2r) peaks at n²/Z = 2 bohr, ⟨r⟩ =
    (3n² − l(l+1))/2Z = 5/2, no nodes, ε = −Z²/2n² = −1/2 hartree (Bethe & Salpeter
    1957, §3):

    >>> from zeffir.core import build
    >>> row = summarise(build("He+ 2p1", "hydrogenic").orbital("2p"))
    >>> round(row.r_max, 6), round(row.r_mean, 9), row.nodes, row.energy
    (2.0, 2.5, (), -0.5)
    """
    values = moments(orbital.radial)
    spins = {c.spin: c.energy for c in orbital.components if c.spin is not None}
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
        energy_up=spins.get("up"),
        energy_down=spins.get("down"),
    )


def _summarise_level(orbital: SubshellOrbital, level: OrbitalComponent) -> SubshellSummary:
    """The row of one j level of a subshell (ζ and Z_eff from its own ⟨1/r⟩)."""
    values = moments(level.radial)
    z_eff = orbital.n**2 * values[-1]
    return SubshellSummary(
        label=level.label, n=orbital.n, l=orbital.l, occupancy=level.occupancy,
        zeta=z_eff / orbital.n, z_eff=z_eff, n_star=None, r_mean=values[1],
        r_max=level.radial.r_max(), energy=level.energy,
        nodes=tuple(float(x) for x in level.radial.nodes()), moments=values,
        notes=orbital.notes, j=level.j)


def subshell_table(orbitals: OrbitalSet) -> list[SubshellSummary]:
    """The subshell table of an orbital set, one row per occupied subshell.

    Examples
    --------
    A subshell split into j levels (``relativistic-lda``) gives one row per level,
    labelled e.g. ``2p1/2``. The rows hold all the electrons; with hydrogenic orbitals (Z = 10) every length
    is hydrogen's divided by Z: ⟨r⟩_1s = 3/2Z and the 2s node at 2/Z:

    >>> from zeffir.core import build
    >>> table = subshell_table(build("Ne", "hydrogenic"))
    >>> [row.label for row in table], sum(row.occupancy for row in table)
    (['1s', '2s', '2p'], 10)
    >>> round(table[0].r_mean, 12), [round(x, 12) for x in table[1].nodes]
    (0.15, [0.2])
    """
    rows: list[SubshellSummary] = []
    for o in orbitals.orbitals:
        levels = [c for c in o.components if c.j is not None]
        rows += [_summarise_level(o, c) for c in levels] if levels else [summarise(o)]
    return rows


def occupancy_text(value: float) -> str:
    """An occupancy as a table shows it: ``2``, or ``0.667`` for a shared j population.

    Examples
    --------
    >>> occupancy_text(2), occupancy_text(4 / 3), occupancy_text(6.0)
    ('2', '1.333', '6')
    """
    return str(round(value)) if abs(value - round(value)) < 1e-9 else f"{value:.3f}"

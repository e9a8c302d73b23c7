"""Slater's screening rules: Z_eff = Z - σ, ζ = Z_eff / n*."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Final

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.orbitals import OrbitalSet, SlaterRadial, SubshellOrbital

__all__ = ["SLATER_N_STAR", "SlaterRulesModel", "slater_n_star", "slater_screening"]

#: Slater's effective principal quantum numbers for n = 1..6 (Slater 1930).
SLATER_N_STAR: Final[dict[int, float]] = {1: 1.0, 2: 2.0, 3: 3.0, 4: 3.7, 5: 4.0, 6: 4.2}


def _group(sub: Subshell) -> tuple[int, int]:
    """Slater's grouping: (1s) (2s,2p) (3s,3p) (3d) (4s,4p) (4d) (4f) (5s,5p) ..."""
    return (sub.n, 0 if sub.l <= 1 else sub.l - 1)


def slater_n_star(n: int) -> tuple[float, str | None]:
    """n* for principal quantum number n, and a note when it is extrapolated beyond n = 6."""
    if n in SLATER_N_STAR:
        return SLATER_N_STAR[n], None
    return SLATER_N_STAR[6], f"n* = 4.2 assumed for n = {n} (Slater gives values up to n = 6)"


def slater_screening(configuration: Configuration, target: Subshell) -> float:
    """Screening constant σ of an electron in ``target`` by Slater's rules.

    Parameters
    ----------
    configuration : Configuration
        The occupied subshells (the target must be one of them).
    target : Subshell
        The subshell whose electron is screened.

    Returns
    -------
    float
        σ, so that Z_eff = Z - σ.

    Notes
    -----
    Groups are ordered (1s)(2s,2p)(3s,3p)(3d)(4s,4p)(4d)(4f)(5s,5p)(5d)...; electrons
    in groups to the right do not screen. Same group: 0.35 each (0.30 within 1s).
    For an s or p electron: 0.85 for each electron of shell n-1, 1.00 for each of
    shell n-2 or lower. For d and f electrons (and, by extension, g, h, i): 1.00 for
    every electron in a group to the left.

    References
    ----------
    J. C. Slater, "Atomic shielding constants", Phys. Rev. 36, 57 (1930).

    Examples
    --------
    >>> from zeffir.core.config import parse_spec
    >>> round(7 - slater_screening(parse_spec("N"), Subshell(2, 1)), 2)
    3.9
    """
    mine = _group(target)
    sigma = 0.0
    for sub, occ in configuration.occupations:
        group = _group(sub)
        count = occ - (1 if sub == target else 0)
        if count == 0 or group > mine:
            continue
        if group == mine:
            sigma += count * (0.30 if target.n == 1 else 0.35)
        elif target.l <= 1:
            sigma += count * (0.85 if sub.n == target.n - 1 else 1.00 if sub.n < target.n else 0.0)
        else:
            sigma += count * 1.00
    return sigma


@dataclass(frozen=True)
class SlaterRulesModel:
    """Slater-type orbitals with exponents from Slater's rules.

    Notes
    -----
    R = N r^{n*-1} e^{-ζr}, ζ = Z_eff/n*, n* = 1, 2, 3, 3.7, 4.0, 4.2 for n = 1..6.
    Orbital energy ε = -½ (Z_eff/n*)² hartree and the total energy Σ occ·ε, the
    estimates given with the rules (Slater 1930).

    References
    ----------
    J. C. Slater, Phys. Rev. 36, 57 (1930).
    """

    name: str = "slater"
    title: str = "Slater's rules"
    reference: str = "Slater 1930"

    def build(self, configuration: Configuration) -> OrbitalSet:
        orbitals = tuple(slater_orbital(configuration, sub, occ) for sub, occ in configuration.occupations)
        total = sum(o.occupancy * o.energy for o in orbitals if o.energy is not None)
        return OrbitalSet(configuration, self.name, orbitals, total_energy=total)


def slater_orbital(configuration: Configuration, sub: Subshell, occ: int,
                   extra_notes: tuple[str, ...] = ()) -> SubshellOrbital:
    """One subshell's Slater-type orbital by Slater's rules (shared with models that fall back)."""
    z_eff = configuration.Z - slater_screening(configuration, sub)
    if z_eff <= 0:
        raise ModelError(
            f"{sub.label}: Slater's rules give Z_eff = {z_eff:.2f} <= 0 in {configuration.spec}"
        )
    n_star, note = slater_n_star(sub.n)
    notes = (*extra_notes, *((note,) if note else ()))
    if sub.l > 3:
        notes = (*notes, f"{sub.label}: rules for d and f applied to l = {sub.l}")
    zeta = z_eff / n_star
    return SubshellOrbital(
        subshell=sub,
        occupancy=occ,
        radial=SlaterRadial(sub.n, sub.l, n_star, zeta),
        zeta=zeta,
        z_eff=z_eff,
        n_star=n_star,
        energy=-0.5 * zeta**2,
        notes=notes,
    )

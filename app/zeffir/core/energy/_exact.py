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

    Examples
    --------
    Helium, −2.903724 hartree (C. L. Pekeris, Phys. Rev. 115, 1216 (1959)); lithium,
    −7.47806 hartree (S. J. Chakravorty et al., Phys. Rev. A 47, 3649 (1993)); ions
    have no entry:

    >>> from zeffir.core import build, parse_spec
    >>> energy, source = exact_energy(parse_spec("He"))
    >>> round(energy, 6), source
    (-2.903724, 'Pekeris 1959; Drake')
    >>> exact_energy(parse_spec("Li"))[0], exact_energy(parse_spec("He+")) is None
    (-7.47806, True)

    The variational principle puts the exact energy below that of any determinant:

    >>> from zeffir.core.energy import hund_energy
    >>> carbon = build("C", "slater")
    >>> exact_energy(carbon.configuration)[0] < hund_energy(carbon)
    True
    """
    ground = element(configuration.Z).ground
    if configuration.charge != 0 or configuration.occupations != ground:
        return None
    return _table().get(configuration.Z)


def correlation_energy(configuration: Configuration, hartree_fock_energy: float) -> float | None:
    """E_corr = E_exact − E_HF (hartree) where an exact energy is published, else None.

    References
    ----------
    P.-O. Löwdin, Adv. Chem. Phys. 2, 207 (1959) (the definition).

    Examples
    --------
    Helium: E_exact = −2.903724 (Pekeris 1959) and the Hartree–Fock limit −2.861680
    hartree (E. Clementi and C. Roetti, At. Data Nucl. Data Tables 14, 177 (1974))
    give E_corr = −0.042044 hartree; excited configurations have none:

    >>> from zeffir.core import parse_spec
    >>> round(correlation_energy(parse_spec("He"), -2.861680), 6)
    -0.042044
    >>> correlation_energy(parse_spec("He 1s1 2s1"), -2.17) is None
    True
    """
    found = exact_energy(configuration)
    return None if found is None else found[0] - hartree_fock_energy

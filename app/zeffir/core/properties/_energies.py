"""The energies a model gives for an orbital set, and what is known beside them.

The command line's table and the window's energy lines both read
:func:`energy_summary`, so the two never disagree about the correlation energy or
about when none can be given.
"""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core.energy import correlation_energy, exact_energy
from zeffir.core.orbitals import OrbitalSet

__all__ = ["EnergySummary", "energy_summary"]


@dataclass(frozen=True, slots=True)
class EnergySummary:
    """Total energy, virial ratio and, for Hartree–Fock, the exact energy and E_corr (hartree).

    Attributes
    ----------
    total : float or None
        The model's total energy; None where the model defines none.
    virial_ratio : float or None
        −V/T where the model gives it (2 for a variationally optimal set).
    exact : float or None
        The published exact non-relativistic energy of the configuration, for the
        ``hartree-fock`` model only.
    exact_source : str or None
        Where ``exact`` is published.
    correlation : float or None
        E_corr = E_exact − E_HF (Löwdin's definition), for ``hartree-fock`` only.
    remark : str or None
        Why no correlation energy is given under a Hartree–Fock model ("not given: …"),
        else None.

    Examples
    --------
    Helium under Hartree–Fock: the energy reaches the Hartree–Fock limit −2.861680
    hartree (E. Clementi and C. Roetti, At. Data Nucl. Data Tables 14, 177 (1974)) at
    virial ratio 2, and E_corr = −0.042044 hartree against Pekeris's exact energy:

    >>> from zeffir.core import build
    >>> s = energy_summary(build("He", "hartree-fock"), "hartree-fock")
    >>> round(s.total, 6), round(s.virial_ratio, 6), round(s.correlation, 6)
    (-2.86168, 2.0, -0.042044)
    """

    total: float | None
    virial_ratio: float | None
    exact: float | None = None
    exact_source: str | None = None
    correlation: float | None = None
    remark: str | None = None


def energy_summary(orbitals: OrbitalSet, model: str) -> EnergySummary:
    """The energies of ``orbitals`` built by ``model``.

    The correlation energy E_corr = E_exact − E_HF (P.-O. Löwdin, Adv. Chem. Phys. 2,
    207 (1959)) is given for the single-term Hartree–Fock model where an exact
    non-relativistic energy is published (see :func:`zeffir.core.energy.exact_energy`);
    the configuration-average Hartree–Fock energy belongs to no single state, so none
    is given for it.

    Examples
    --------
    >>> from zeffir.core import build
    >>> s = energy_summary(build("He", "hartree-fock"), "hartree-fock")
    >>> abs(s.correlation - (s.exact - s.total)) < 1e-15 and s.correlation < 0
    True
    """
    total, virial = orbitals.total_energy, orbitals.virial_ratio
    if model == "hartree-fock" and total is not None:
        found = exact_energy(orbitals.configuration)
        if found is None:
            return EnergySummary(total, virial,
                                 remark="not given: no published exact energy for this configuration")
        return EnergySummary(total, virial, found[0], found[1],
                             correlation_energy(orbitals.configuration, total))
    if model == "hartree-fock-average":
        return EnergySummary(total, virial, remark="not given: the energy is the average over the "
                             "configuration's terms, not one state's")
    return EnergySummary(total, virial)

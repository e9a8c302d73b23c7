"""The model adapter: Hartree–Fock results as the OrbitalSet every model returns."""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core.config import Configuration
from zeffir.core.models.hartree_fock._dispatch import _lower_subshells_empty, solve
from zeffir.core.orbitals import OrbitalSet, SlaterExpansionRadial, SubshellOrbital

__all__ = ["HartreeFockModel"]


@dataclass(frozen=True)
class HartreeFockModel:
    """Restricted Hartree–Fock orbitals of atoms and ions (Roothaan method).

    Attributes
    ----------
    name, title, reference : str
    average : bool
        Minimise the average energy of the configuration (the ``hartree-fock-average``
        model) instead of the energy of its Hund term (``hartree-fock``).

    Notes
    -----
    :func:`~zeffir.core.models.hartree_fock.solve` picks the solver. For the Hund term:
    ``solve_closed_shell`` for closed shells, ``solve_open_shell`` for closed shells
    plus one open s, p, d or f subshell, and ``solve_hund`` for several open subshells
    (Cr 3d5 4s1 ⁷S, Gd 4f7 5d1 6s2 ⁹D) or excited configurations with an empty lower
    subshell (Na [Ne] 4s1); with ``average``, ``solve_average`` for every
    configuration; all in the ``default_basis``. Each orbital is a
    :class:`~zeffir.core.orbitals.SlaterExpansionRadial`; its energy is the diagonal element of
    its subshell's Fock operator (the canonical orbital energy ε for closed shells,
    hartree) and the set's total energy the Hartree–Fock energy. ζ and Z_eff are
    effective values from ⟨1/r⟩ (a hydrogenic orbital of charge Z_eff has
    ⟨1/r⟩ = Z_eff/n²): Z_eff = n²⟨1/r⟩, ζ = Z_eff/n; n* is not defined (None).

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); 32, 179 (1960); C. C. J. Roothaan
    and P. S. Bagus, Methods Comput. Phys. 2, 47 (1963); E. Clementi and
    C. Roetti, At. Data Nucl. Data Tables 14, 177 (1974); T. Koga et al., Int. J. Quantum
    Chem. 71, 491 (1999) (the energies it reproduces); J. C. Slater, *Quantum Theory of
    Atomic Structure* (1960), vol. II (average of configuration).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> neon = HartreeFockModel().build(parse_spec("Ne"))
    >>> neon.labels, all(abs(o.radial.norm() - 1.0) < 1e-12 for o in neon.orbitals)
    (('1s', '2s', '2p'), True)
    >>> round(neon.total_energy, 8)  # regression value (computed by Zeffir, not published)
    -128.54709811
    """

    name: str = "hartree-fock"
    title: str = "restricted Hartree–Fock"
    reference: str = "Roothaan 1951, 1960 (method); Koga et al. 1999 (energies)"
    average: bool = False

    def build(self, configuration: Configuration) -> OrbitalSet:
        """Solve the Roothaan equations for ``configuration`` and return its orbitals."""
        result = solve(configuration, average=self.average)
        orbitals = []
        for sub, occ in configuration.occupations:
            if occ == 0:
                continue
            radial = SlaterExpansionRadial(sub.n, sub.l, sub.l + 1, result.basis.zetas(sub.l),
                                           result.coefficients[sub.l][:, sub.n - sub.l - 1])
            z_eff = sub.n**2 * radial.expectation(-1)
            orbitals.append(SubshellOrbital(
                sub, occ, radial, z_eff / sub.n, z_eff, None, result.orbital_energies[sub],
                (f"{sub.label}: ζ and Z_eff are effective values from <1/r> (Z_eff = n²<1/r>)",)))
        sizes = ", ".join(f"{count} {'spdfghik'[l]}"
                          for l, (_, _, count) in sorted(result.basis.sets.items()))
        open_subshells = [s for s, w in configuration.occupations if 0 < w < 2 * (2 * s.l + 1)]
        if self.average:
            kind = "average energy of the configuration"
        elif not open_subshells:
            kind = "closed shells, ¹S"
        else:
            kind = f"energy of the Hund term {_hund_term_label(configuration)}, one determinant"
        notes = [f"restricted Hartree–Fock ({kind}), even-tempered Slater-type basis "
                 f"({sizes}); virial ratio -V/T = {result.virial_ratio:.9f}"]
        if _lower_subshells_empty(configuration):
            notes.append("excited configuration: each orbital keeps n - l - 1 radial nodes, the empty "
                         "lower subshells of its l being virtual orbitals below it")
        return OrbitalSet(configuration, self.name, tuple(orbitals), total_energy=result.energy,
                          notes=tuple(notes), virial_ratio=result.virial_ratio)


def _hund_term_label(configuration: Configuration) -> str:
    """The term of the Hund determinant (highest M_S, then M_L), e.g. '7S' for Cr 3d5 4s1."""
    from zeffir.core.pairs import hund_determinant
    from zeffir.core.terms import term_label

    spin_orbitals = tuple(hund_determinant(configuration))
    two_s = sum(p.spin for p in spin_orbitals)
    return term_label(two_s / 2, sum(p.m for p in spin_orbitals))

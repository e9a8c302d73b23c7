"""The density-functional models: self-consistent Kohn–Sham orbitals in four local approximations.

``lda`` (spin-unpolarised, non-relativistic), ``lsda`` (spin-polarised),
``scalar-relativistic-lda`` (Koelling–Harmon) and ``relativistic-lda`` (Dirac), each as
the matching column of NIST's atomic reference data (Kotochigova et al. 1997) defines
it: point nucleus, spherically averaged density with the configuration's
occupations; the solver and its choices are described in
:mod:`zeffir.core.dft._kohn_sham`. The orbitals are tabulated on the solver's
logarithmic grid, so every view and export takes them as it takes any other radial
function.

Where a model splits a subshell — into j = l ± ½ levels (``relativistic-lda``) or into
spin orbitals (``lsda``) — the parts are kept as the subshell's ``components`` (the
table lists each j level, and each spin's eigenvalue), and the subshell's own radial
function carries the population-weighted density of its parts, so densities, radial
distributions and ⟨r^k⟩ are exact. Its signed amplitude (R(r), P(r) and the 2D slices)
is the population-weighted large component.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from zeffir.core.config import Configuration, Subshell
from zeffir.core.orbitals import (
    OrbitalComponent,
    OrbitalSet,
    SubshellOrbital,
    TabulatedRadial,
    TabulatedSpinorRadial,
)

if TYPE_CHECKING:
    from zeffir.core.dft import KohnShamOrbital

__all__ = ["KohnShamModel", "LDAModel", "kohn_sham_models"]

_EFFECTS = {
    "lda": "spin-unpolarised, non-relativistic",
    "lsda": "spin-polarised (Hund's-rule spin populations, majority spin 'down'), non-relativistic",
    "scalar-relativistic-lda": ("scalar-relativistic (Koelling–Harmon: mass–velocity and Darwin terms, "
                                "no spin–orbit; MacDonald–Vosko relativistic exchange)"),
    "relativistic-lda": ("relativistic (Dirac equation, j-split subshells with j-averaged populations; "
                         "MacDonald–Vosko relativistic exchange)"),
}


@dataclass(frozen=True)
class KohnShamModel:
    """Kohn–Sham orbitals in one local-density approximation.

    Attributes
    ----------
    name, title, reference : str
    approximation : str
        One of :data:`zeffir.core.dft._kohn_sham.APPROXIMATIONS`.

    Notes
    -----
    ε of each subshell is its Kohn–Sham eigenvalue: only the highest occupied one has
    a meaning as an ionization energy, and then only for the exact functional (LDA
    eigenvalues lie several eV above −IE). ζ and Z_eff are effective values from
    ⟨1/r⟩ (Z_eff = n²⟨1/r⟩), as for Hartree–Fock. Under ``relativistic-lda`` a
    subshell's ε is the population-weighted mean of its j levels; under ``lsda`` it is
    the majority ("down") spin's eigenvalue.

    Examples
    --------
    >>> from zeffir.core import build
    >>> ne = build("Ne", "lda")
    >>> round(ne.total_energy, 5), round(ne.orbital("2p").energy, 5)
    (-128.23348, -0.49803)
    """

    name: str = "lda"
    title: str = "Kohn–Sham LDA (Slater exchange + VWN correlation)"
    reference: str = ("Kohn & Sham 1965; Vosko, Wilk & Nusair 1980; NIST SRD 141 "
                      "(Kotochigova et al. 1997)")
    approximation: str = "lda"

    def build(self, configuration: Configuration) -> OrbitalSet:
        """Solve the Kohn–Sham equations for ``configuration`` and tabulate its orbitals."""
        from zeffir.core.dft import SHORT_NAMES, solve_kohn_sham

        result = solve_kohn_sham(configuration, self.approximation)
        r = result.grid.r
        orbitals = []
        for sub, occ in configuration.occupations:
            if occ == 0:
                continue
            parts = [o for o in result.orbitals if (o.n, o.l) == (sub.n, sub.l)]
            orbitals.append(self._subshell(sub, occ, parts, r))
        short, effects = SHORT_NAMES[self.approximation], _EFFECTS[self.approximation]
        notes: tuple[str, ...] = (f"Kohn–Sham {short}, {effects} "
                 f"({result.iterations} iterations on {result.grid.points} grid points); energy parts: "
                 f"kinetic {result.kinetic:.6f}, nuclear {result.nuclear:.6f}, "
                 f"Hartree {result.hartree:.6f}, exchange-correlation {result.xc:.6f} hartree",)
        if result.c is not None:
            notes += (f"speed of light c = {result.c} (hartree atomic units, NIST's value)",)
        energy_parts = (("kinetic", result.kinetic), ("nuclear", result.nuclear),
                        ("hartree", result.hartree), ("xc", result.xc))
        # −V/T: 2 for exchange alone (it scales like the Coulomb terms); LDA correlation
        # does not, and moves the ratio by a few 10⁻³ (Levy & Perdew, Phys. Rev. A 32,
        # 2010 (1985)). Without a non-relativistic kinetic energy there is no such ratio.
        virial = (None if result.c is not None
                  else -(result.nuclear + result.hartree + result.xc) / result.kinetic)
        return OrbitalSet(configuration, self.name, tuple(orbitals),
                          total_energy=float(result.total_energy), notes=notes,
                          energy_components=energy_parts, virial_ratio=virial)

    def _subshell(self, sub: Subshell, occ: int, parts: list[KohnShamOrbital],
                  r: np.ndarray) -> SubshellOrbital:
        n, l, label = sub.n, sub.l, sub.label
        remark = (f"{label}: ζ and Z_eff are effective values from <1/r> (Z_eff = n²<1/r>); "
                  "ε is the Kohn–Sham eigenvalue")
        if len(parts) == 1 and parts[0].q is None:
            part = parts[0]
            radial = TabulatedRadial(n, l, r, part.p / r)
            energy = part.energy
            components: tuple[OrbitalComponent, ...] = ()
        else:
            filled = [p for p in parts if p.occupation > 0]
            weight = sum(p.occupation for p in filled)
            amplitude = np.sum([p.occupation * p.p for p in filled], axis=0) / weight
            density = np.sum([p.occupation * p.density for p in filled], axis=0) / weight
            density = density / _integral(r, density)
            radial = TabulatedSpinorRadial(n, l, r, amplitude / r, density)
            # An empty spin orbital that the potential does not bind has no eigenvalue
            # and no radial function, so it is left out.
            components = tuple(self._component(p, r) for p in parts if p.energy is not None)
            if parts[0].j is not None:
                energy = sum(p.occupation * p.energy for p in filled if p.energy is not None) / weight
                if len(parts) > 1:
                    remark += "; ε of the subshell is the population-weighted mean of its j levels"
            else:
                energy = next(p.energy for p in parts if p.spin == "down")
                remark += "; ε of the subshell is the majority-spin ('down') eigenvalue"
        z_eff = n**2 * radial.expectation(-1)
        return SubshellOrbital(sub, occ, radial, z_eff / n, z_eff, None,
                               None if energy is None else float(energy), (remark,), components)

    @staticmethod
    def _component(part: KohnShamOrbital, r: np.ndarray) -> OrbitalComponent:
        radial: TabulatedRadial
        if part.q is not None:
            radial = TabulatedSpinorRadial(part.n, part.l, r, part.p / r, part.density)
        else:
            radial = TabulatedRadial(part.n, part.l, r, part.p / r)
        energy = None if part.energy is None else float(part.energy)
        return OrbitalComponent(part.label, part.j, part.spin, float(part.occupation), energy, radial)


def _integral(r: np.ndarray, values: np.ndarray) -> float:
    from scipy import integrate

    return float(integrate.simpson(values * r, x=np.log(r)))


LDAModel = KohnShamModel


def kohn_sham_models() -> tuple[KohnShamModel, ...]:
    """The four density-functional models, in the order they are registered."""
    cite = "NIST SRD 141 (Kotochigova et al. 1997)"
    return (
        KohnShamModel(),
        KohnShamModel("lsda", "Kohn–Sham LSD (spin-polarised; Slater exchange + VWN correlation)",
                      f"Kohn & Sham 1965; Vosko, Wilk & Nusair 1980; {cite}", "lsda"),
        KohnShamModel("scalar-relativistic-lda", "Kohn–Sham scalar-relativistic LDA (Koelling–Harmon)",
                      f"Koelling & Harmon 1977; MacDonald & Vosko 1979; {cite}",
                      "scalar-relativistic-lda"),
        KohnShamModel("relativistic-lda", "Kohn–Sham relativistic LDA (Dirac equation, j-split)",
                      f"Dirac 1928; MacDonald & Vosko 1979; {cite}", "relativistic-lda"),
    )

"""Published sources and model cautions, shown in the About box (and kept in step with README)."""

from __future__ import annotations

from typing import Final

__all__ = ["CAUTIONS", "REFERENCES"]

CAUTIONS: Final[tuple[str, ...]] = (
    "All models but relativistic-lda and scalar-relativistic-lda are non-relativistic: for "
    "heavy elements the contraction of s and p orbitals and spin–orbit splitting are missing. "
    "scalar-relativistic-lda has the contraction but no spin–orbit; relativistic-lda (Dirac) "
    "has both, without the Breit interaction, QED or a finite nucleus.",
    "No electron correlation unless a model states otherwise; the density-functional models "
    "have the local (uniform-gas) correlation of VWN, not the atom's own.",
    "Kohn–Sham eigenvalues are not ionization energies, except the highest occupied one under "
    "the exact functional; in the local-density approximations it lies several eV too high.",
    "Point nucleus.",
    "Densities of open subshells are spherically averaged.",
    "Results are model estimates for insight and figures, not a substitute for validated "
    "production calculations.",
)

REFERENCES: Final[tuple[str, ...]] = (
    "J. C. Slater, Phys. Rev. 36, 57 (1930) — screening rules and n*.",
    "E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963) — optimised exponents, Z = 2–36.",
    "E. Clementi, D. L. Raimondi and W. P. Reinhardt, J. Chem. Phys. 47, 1300 (1967) — Z = 37–86.",
    "A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra Database — "
    "ground levels and configurations of the neutral atoms and of the ions (spectra II to V).",
    "H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and Two-Electron Atoms (1957).",
    "M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions (1964).",
    "E. U. Condon and G. H. Shortley, The Theory of Atomic Spectra (1935) — phase convention.",
    "T. Helgaker, P. Jørgensen and J. Olsen, Molecular Electronic-Structure Theory (2000) — "
    "real solid harmonics.",
    "A. Unsöld, Ann. Phys. 387, 355 (1927) — closed subshells are spherical.",
    "C. Froese Fischer, The Hartree–Fock Method for Atoms (1977) — logarithmic radial grids; "
    "term energies and orbitals of excited configurations.",
    "J. C. Slater, Quantum Theory of Atomic Structure (1960); R. D. Cowan, The Theory of Atomic "
    "Structure and Spectra (1981) — configuration energies, Slater integrals.",
    "G. Racah, Phys. Rev. 62, 438 (1942) — 3j symbols.",
    "C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); 32, 179 (1960) — Hartree–Fock in a basis, "
    "open shells.",
    "T. Koga et al., Int. J. Quantum Chem. 71, 491 (1999); C. F. Bunge et al., Phys. Rev. A 46, "
    "3691 (1992) — Hartree–Fock reference energies.",
    "P.-O. Löwdin, J. Chem. Phys. 18, 365 (1950) — symmetric orthogonalisation.",
    "S. J. Chakravorty et al., Phys. Rev. A 47, 3649 (1993); C. L. Pekeris, Phys. Rev. 115, 1216 "
    "(1959) — exact non-relativistic energies (correlation energies).",
    "R. G. Parr and W. Yang, Density-Functional Theory of Atoms and Molecules (1989); R. McWeeny, "
    "Methods of Molecular Quantum Mechanics (1989) — pair densities and exchange holes.",
    "F. Hund, Linienspektren (1927); Condon & Shortley (1935) — term symbols, Hund's rules.",
    "W. Kohn and L. J. Sham, Phys. Rev. 140, A1133 (1965); S. H. Vosko, L. Wilk and M. Nusair, "
    "Can. J. Phys. 58, 1200 (1980) — Kohn–Sham LDA and LSD.",
    "D. D. Koelling and B. N. Harmon, J. Phys. C 10, 3107 (1977) — scalar-relativistic equation; "
    "A. H. MacDonald and S. H. Vosko, J. Phys. C 12, 2977 (1979) — relativistic exchange.",
    "S. Kotochigova, Z. H. Levine, E. L. Shirley, M. D. Stiles and C. W. Clark, Phys. Rev. A 55, "
    "191 (1997); NIST SRD 141 — density-functional reference energies.",
    "CODATA recommended values, via scipy.constants.",
    "C. A. Brewer, ColorBrewer (RdBu); S. van der Walt and N. Smith, viridis — colour maps.",
)

"""Published sources and model cautions, shown in the About box (and kept in step with README)."""

from __future__ import annotations

from typing import Final

__all__ = ["CAUTIONS", "REFERENCES"]

CAUTIONS: Final[tuple[str, ...]] = (
    "Non-relativistic models: for heavy elements the contraction of s and p orbitals "
    "and spin–orbit splitting are missing.",
    "No electron correlation unless a model states otherwise.",
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
    "ground levels and configurations.",
    "H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and Two-Electron Atoms (1957).",
    "M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions (1964).",
    "E. U. Condon and G. H. Shortley, The Theory of Atomic Spectra (1935) — phase convention.",
    "T. Helgaker, P. Jørgensen and J. Olsen, Molecular Electronic-Structure Theory (2000) — "
    "real solid harmonics.",
    "A. Unsöld, Ann. Phys. 387, 355 (1927) — closed subshells are spherical.",
    "C. Froese Fischer, The Hartree–Fock Method for Atoms (1977) — logarithmic radial grids.",
    "CODATA recommended values, via scipy.constants.",
    "C. A. Brewer, ColorBrewer (RdBu); S. van der Walt and N. Smith, viridis — colour maps.",
)

"""Numerical radial solvers for density-functional orbitals: the grid, the eigenstates, the atoms.

``LogGrid`` is the logarithmic radial grid with its quadrature; ``solve_radial`` finds
a bound state nl of a spherical potential on it by Numerov integration, node counting
and Hartree's energy correction; ``solve_dirac`` and ``solve_scalar_relativistic`` do
the same for the Dirac and Koelling–Harmon equations (Adams–Moulton integration);
``solve_kohn_sham`` iterates the Kohn–Sham atom to self-consistency in the LDA, LSD,
scalar-relativistic and Dirac approximations (the ``lda``, ``lsda``,
``scalar-relativistic-lda`` and ``relativistic-lda`` models); ``solve_lda`` is its
``lda`` case.
"""

from zeffir.core.dft._kohn_sham import (
    APPROXIMATIONS,
    SHORT_NAMES,
    KohnShamError,
    KohnShamOrbital,
    KohnShamResult,
    solve_kohn_sham,
)
from zeffir.core.dft._lda_atom import LDA_TOLERANCE, LDAError, LDAResult, solve_lda
from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.dft._radial_solver import RadialEigenError, RadialSolution, solve_radial
from zeffir.core.dft._relativistic_solver import (
    SPEED_OF_LIGHT,
    RelativisticSolution,
    kappa_of,
    solve_dirac,
    solve_scalar_relativistic,
)
from zeffir.core.dft._xc import lda_xc
from zeffir.core.dft._xc_relativistic import relativistic_exchange_factors, rlda_xc
from zeffir.core.dft._xc_spin import lsda_xc

__all__ = [
    "APPROXIMATIONS",
    "LDA_TOLERANCE",
    "SHORT_NAMES",
    "SPEED_OF_LIGHT",
    "KohnShamError",
    "KohnShamOrbital",
    "KohnShamResult",
    "LDAError",
    "LDAResult",
    "LogGrid",
    "RadialEigenError",
    "RadialSolution",
    "RelativisticSolution",
    "kappa_of",
    "lda_xc",
    "lsda_xc",
    "relativistic_exchange_factors",
    "rlda_xc",
    "solve_dirac",
    "solve_kohn_sham",
    "solve_lda",
    "solve_radial",
    "solve_scalar_relativistic",
]

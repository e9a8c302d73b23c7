"""Numerical radial solvers for density-functional orbitals: the grid and the eigenstates.

``LogGrid`` is the logarithmic radial grid with its quadrature; ``solve_radial`` finds
a bound state nl of a spherical potential on it by Numerov integration, node counting
and Hartree's energy correction; ``solve_lda`` iterates the spin-unpolarised Kohn–Sham
LDA atom to self-consistency on them (the ``lda`` model).
"""

from zeffir.core.dft._lda_atom import LDA_TOLERANCE, LDAError, LDAResult, solve_lda
from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.dft._radial_solver import RadialEigenError, RadialSolution, solve_radial
from zeffir.core.dft._xc import lda_xc

__all__ = [
    "LDA_TOLERANCE",
    "LDAError",
    "LDAResult",
    "LogGrid",
    "RadialEigenError",
    "RadialSolution",
    "lda_xc",
    "solve_lda",
    "solve_radial",
]

"""Numerical radial solvers for density-functional orbitals: the grid and the eigenstates.

``LogGrid`` is the logarithmic radial grid with its quadrature; ``solve_radial`` finds
a bound state nl of a spherical potential on it by Numerov integration, node counting
and Hartree's energy correction. The self-consistent Kohn–Sham models build on these.
"""

from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.dft._radial_solver import RadialEigenError, RadialSolution, solve_radial

__all__ = ["LogGrid", "RadialEigenError", "RadialSolution", "solve_radial"]

"""Zeffir: orbitals, densities and figures for many-electron atoms.

The computation core lives in :mod:`zeffir.core` and needs only numpy and scipy.
"""

__all__ = ["__version__"]

__version__ = "0.1.0"

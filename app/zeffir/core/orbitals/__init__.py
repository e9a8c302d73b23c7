"""Radial functions, spherical harmonics and the orbital sets models produce."""

from zeffir.core.orbitals._angular import (
    Monomials,
    complex_from_real,
    complex_harmonic,
    real_harmonic,
    real_label,
    real_labels,
    real_m_from_label,
    solid_harmonic,
    solid_harmonic_monomials,
)
from zeffir.core.orbitals._hydrogenic import HydrogenicRadial, laguerre
from zeffir.core.orbitals._orbital_set import OrbitalComponent, OrbitalSet, SubshellOrbital
from zeffir.core.orbitals._radial import FloatArray, RadialFunction
from zeffir.core.orbitals._slater_expansion import SlaterExpansionRadial
from zeffir.core.orbitals._slater_type import SlaterRadial
from zeffir.core.orbitals._tabulated import TabulatedRadial, TabulatedSpinorRadial, log_grid

__all__ = [
    "FloatArray",
    "HydrogenicRadial",
    "Monomials",
    "OrbitalComponent",
    "OrbitalSet",
    "RadialFunction",
    "SlaterExpansionRadial",
    "SlaterRadial",
    "SubshellOrbital",
    "TabulatedRadial",
    "TabulatedSpinorRadial",
    "complex_from_real",
    "complex_harmonic",
    "laguerre",
    "log_grid",
    "real_harmonic",
    "real_label",
    "real_labels",
    "real_m_from_label",
    "solid_harmonic",
    "solid_harmonic_monomials",
]

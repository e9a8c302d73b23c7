"""Shared helpers for the Hartree–Fock tests."""

import numpy as np
import pytest

from zeffir.core.orbitals import OrbitalSet, SlaterExpansionRadial, SubshellOrbital


def orbital_set(result, rotate=None):
    """A solver result's occupied orbitals as an OrbitalSet (for the grid energy evaluation).

    ``rotate`` = (l, i, j, angle) first rotates columns i and j of l's coefficients.
    """
    coefficients = {l: c.copy() for l, c in result.coefficients.items()}
    if rotate is not None:
        l, i, j, angle = rotate
        ci, cj = coefficients[l][:, i].copy(), coefficients[l][:, j].copy()
        coefficients[l][:, i] = np.cos(angle) * ci + np.sin(angle) * cj
        coefficients[l][:, j] = -np.sin(angle) * ci + np.cos(angle) * cj
    orbitals = []
    for sub, occ in result.configuration.occupations:
        radial = SlaterExpansionRadial(sub.n, sub.l, sub.l + 1, result.basis.zetas(sub.l),
                                       coefficients[sub.l][:, sub.n - sub.l - 1])
        orbitals.append(SubshellOrbital(sub, occ, radial, 1.0, 1.0, None, None, ()))
    return OrbitalSet(result.configuration, "test", tuple(orbitals))


@pytest.fixture
def as_orbital_set():
    """:func:`orbital_set`, for tests."""
    return orbital_set

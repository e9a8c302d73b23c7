"""Unit conversions against scipy.constants (CODATA)."""

import pytest
from scipy import constants

from zeffir.core import (
    ANGSTROM_PER_BOHR,
    CODATA_EDITION,
    EV_PER_HARTREE,
    bohr_to_angstrom,
    hartree_to_ev,
)


def test_conversions_use_scipy_constants():
    # SciPy 1.15+ carries CODATA 2022; earlier releases CODATA 2018. Either way the
    # conversions must be exactly the scipy.constants values.
    assert CODATA_EDITION.startswith("CODATA")
    assert bohr_to_angstrom(1.0) == pytest.approx(
        constants.physical_constants["Bohr radius"][0] / constants.angstrom, rel=1e-15)
    assert hartree_to_ev(1.0) == constants.physical_constants["Hartree energy in eV"][0]


def test_conversions_agree_with_codata_values():
    # CODATA 2018 and 2022 (Tiesinga et al. 2021; Mohr et al. 2025): a0 = 0.529177210 Å
    # (2018: 0.529177210903, 2022: 0.529177210544) and Eh = 27.211386246 eV; the
    # tolerance covers both editions.
    assert ANGSTROM_PER_BOHR == pytest.approx(0.5291772107, abs=5e-10)
    assert EV_PER_HARTREE == pytest.approx(27.211386246, abs=5e-9)
    # Derived check: Eh = ħ²/(m_e a0²) expressed in eV.
    hbar, me, a0, e = (constants.hbar, constants.m_e,
                       constants.physical_constants["Bohr radius"][0], constants.e)
    assert EV_PER_HARTREE == pytest.approx(hbar**2 / (me * a0**2) / e, rel=1e-9)

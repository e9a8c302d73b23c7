"""Ground configurations against the NIST Atomic Spectra Database.

Source: A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
Database, "Ground Levels and Ionization Energies for the Neutral Atoms". The values
below were written down from memory of that table (not copied from the shipped file)
so that they check it independently.
"""

import pytest

from zeffir.core import parse_spec

NIST_FROM_MEMORY = {
    "Cr": "[Ar] 3d5 4s1",
    "Cu": "[Ar] 3d10 4s1",
    "Fe": "[Ar] 3d6 4s2",
    "Nb": "[Kr] 4d4 5s1",
    "Mo": "[Kr] 4d5 5s1",
    "Ru": "[Kr] 4d7 5s1",
    "Rh": "[Kr] 4d8 5s1",
    "Pd": "[Kr] 4d10",
    "Ag": "[Kr] 4d10 5s1",
    "La": "[Xe] 5d1 6s2",
    "Ce": "[Xe] 4f1 5d1 6s2",
    "Nd": "[Xe] 4f4 6s2",
    "Gd": "[Xe] 4f7 5d1 6s2",
    "Pt": "[Xe] 4f14 5d9 6s1",
    "Au": "[Xe] 4f14 5d10 6s1",
    "Ac": "[Rn] 6d1 7s2",
    "Th": "[Rn] 6d2 7s2",
    "Pa": "[Rn] 5f2 6d1 7s2",
    "U": "[Rn] 5f3 6d1 7s2",
    "Np": "[Rn] 5f4 6d1 7s2",
    "Cm": "[Rn] 5f7 6d1 7s2",
    "Lr": "[Rn] 5f14 7s2 7p1",
    "Hg": "[Xe] 4f14 5d10 6s2",
}


@pytest.mark.parametrize(("symbol", "nist"), sorted(NIST_FROM_MEMORY.items()))
def test_ground_configuration_matches_nist(symbol, nist):
    assert parse_spec(symbol).text == parse_spec(f"{symbol} {nist}").text

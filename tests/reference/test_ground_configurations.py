"""Ground configurations of the neutral atoms against the NIST Atomic Spectra Database.

Source: A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
Database, "Ground States and Ionization Energies" (spectra I), as digitised in the mendeleev
package, version 1.3.0, table 'ionizationenergies': tests/reference/data/
nist_neutral_ground_levels.csv (its header says how it was extracted). The shipped
configurations (resources/data/elements.csv) come from mendeleev's separate 'elements'
table, so this compares two tables of the same digitised source, Z = 1..103.
"""

import pytest
from reference_data import rows

from zeffir.core import parse_spec

NIST_NEUTRAL = rows("nist_neutral_ground_levels.csv")

# The ground configurations that do not follow the Madelung (n + l) order, as NIST lists them;
# each must be in the table above with exactly this configuration.
NON_MADELUNG = {
    "Cr": "[Ar] 3d5 4s1", "Cu": "[Ar] 3d10 4s1", "Nb": "[Kr] 4d4 5s1", "Mo": "[Kr] 4d5 5s1",
    "Ru": "[Kr] 4d7 5s1", "Rh": "[Kr] 4d8 5s1", "Pd": "[Kr] 4d10", "Ag": "[Kr] 4d10 5s1",
    "La": "[Xe] 5d1 6s2", "Ce": "[Xe] 4f1 5d1 6s2", "Gd": "[Xe] 4f7 5d1 6s2",
    "Pt": "[Xe] 4f14 5d9 6s1", "Au": "[Xe] 4f14 5d10 6s1", "Ac": "[Rn] 6d1 7s2",
    "Th": "[Rn] 6d2 7s2", "Pa": "[Rn] 5f2 6d1 7s2", "U": "[Rn] 5f3 6d1 7s2",
    "Np": "[Rn] 5f4 6d1 7s2", "Cm": "[Rn] 5f7 6d1 7s2", "Lr": "[Rn] 5f14 7s2 7p1",
}


@pytest.mark.parametrize("row", NIST_NEUTRAL, ids=lambda row: row["symbol"])
def test_ground_configuration_matches_nist(row):
    symbol = row["symbol"]
    assert parse_spec(symbol).Z == int(row["Z"])
    assert parse_spec(symbol).text == parse_spec(f"{symbol} {row['configuration']}").text


def _madelung(electrons: int) -> dict[tuple[int, int], int]:
    """Occupations filled in (n + l, n) order, each subshell to 2(2l + 1)."""
    order = sorted(((n, l) for n in range(1, 8) for l in range(min(n, 4))),
                   key=lambda nl: (nl[0] + nl[1], nl[0]))
    filled = {}
    for n, l in order:
        if electrons == 0:
            break
        filled[(n, l)] = min(electrons, 2 * (2 * l + 1))
        electrons -= filled[(n, l)]
    return filled


def test_the_non_madelung_configurations_are_those_nist_lists():
    listed = {row["symbol"]: row["configuration"] for row in NIST_NEUTRAL}
    assert {symbol: listed[symbol] for symbol in NON_MADELUNG} == NON_MADELUNG
    # And no others: every other neutral ground configuration NIST lists is the Madelung one.
    differ = set()
    for row in NIST_NEUTRAL:
        conf = parse_spec(f"{row['symbol']} {row['configuration']}")
        occupations = {(sub.n, sub.l): occ for sub, occ in conf.occupations}
        if occupations != _madelung(int(row["Z"])):
            differ.add(row["symbol"])
    assert differ == set(NON_MADELUNG)

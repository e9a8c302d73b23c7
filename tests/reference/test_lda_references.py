"""LDA total energies of the neutral atoms Z = 1–92 against NIST's atomic reference data.

Source: S. Kotochigova, Z. H. Levine, E. L. Shirley, M. D. Stiles and C. W. Clark,
Phys. Rev. A 55, 191 (1997); NIST Standard Reference Database 141 (LDA column, Etot),
copied with its header into data/lda-total-energies.csv. The table gives six decimals
and states an accuracy of 1 µEh; the check allows 2 µEh.
"""

from __future__ import annotations

import pytest
from reference_data import rows

from zeffir.core import build

_TABLE = [(int(r["Z"]), r["symbol"], float(r["lda_total_energy_hartree"]))
          for r in rows("lda-total-energies.csv")]


def test_the_table_covers_z_1_to_92():
    assert [z for z, _, _ in _TABLE] == list(range(1, 93))


@pytest.mark.parametrize(("z", "symbol", "energy"), _TABLE, ids=[s for _, s, _ in _TABLE])
def test_lda_total_energy_matches_nist(z, symbol, energy):
    assert build(symbol, "lda").total_energy == pytest.approx(energy, abs=2e-6)

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


# NIST SRD 141, magnesium table (physics.nist.gov/PhysRefData/DFTdata/Tables/12Mg.html),
# LDA column: Etot, Ekin, Ecoul (Hartree), Eenuc, Exc, then the eigenvalues, hartree.
_MAGNESIUM = {
    "Mg": ((-199.139406, 198.541505, 95.673290, -477.899149, -15.455051),
           {"1s": -45.973167, "2s": -2.903746, "2p": -1.718970, "3s": -0.175427}),
    "Mg+": ((-198.843406, 198.263199, 91.895741, -473.740438, -15.261908),
            {"1s": -46.312649, "2s": -3.238150, "2p": -2.052878, "3s": -0.422702}),
}


@pytest.mark.parametrize("spec", sorted(_MAGNESIUM))
def test_magnesium_energy_parts_and_eigenvalues_match_nist(spec):
    from zeffir.core import parse_spec
    from zeffir.core.dft._lda_atom import solve_lda

    (total, kinetic, hartree, nuclear, xc), eigenvalues = _MAGNESIUM[spec]
    result = solve_lda(parse_spec(spec))
    parts = (result.total_energy, result.kinetic, result.hartree, result.nuclear, result.xc)
    assert parts == pytest.approx((total, kinetic, hartree, nuclear, xc), abs=2e-6)
    orbitals = build(spec, "lda")
    for label, value in eigenvalues.items():
        assert orbitals.orbital(label).energy == pytest.approx(value, abs=2e-6)


def test_the_table_json_carries_the_energy_parts():
    from zeffir.cli import table_json

    (total, kinetic, hartree, nuclear, xc), _eigenvalues = _MAGNESIUM["Mg"]
    data = table_json("Mg", "lda")
    assert data["total_energy_hartree"] == pytest.approx(total, abs=2e-6)
    parts = data["energy_components_hartree"]
    assert set(parts) == {"kinetic", "nuclear", "hartree", "xc"}
    assert (parts["kinetic"], parts["nuclear"], parts["hartree"], parts["xc"]) == pytest.approx(
        (kinetic, nuclear, hartree, xc), abs=2e-6)
    assert sum(parts.values()) == pytest.approx(data["total_energy_hartree"], abs=1e-9)
    assert table_json("Mg", "slater")["energy_components_hartree"] is None

"""Regression values: total energies pinned to 1e-9 Eh so that a restructuring of the models
(the Hartree–Fock package, the Slater-type integrals) cannot change a number unnoticed.

These are regression values — what this code computed when they were pinned (December
2026) — not published ones; the published comparisons live in ``tests/reference``
(e.g. the Hartree–Fock limits of Bunge, Barrientos and Bunge, At. Data Nucl. Data
Tables 53, 113 (1993)). A deliberate change of a model updates the value here with
the reason in the commit.
"""

from __future__ import annotations

import pytest

from zeffir.core import build

PINNED = [
    ("He", "hartree-fock", -2.861679995574133),
    ("Be", "hartree-fock", -14.573023167710023),
    ("C", "hartree-fock", -37.68861896126228),
    ("Ne", "hartree-fock", -128.54709810749665),
    ("Na", "hartree-fock", -161.85891160960682),
    ("Ar", "hartree-fock", -526.8175122540665),
    ("O", "hartree-fock-average", -74.76920131803124),
    ("C", "variational", -37.62238861473851),
    ("N", "variational", -54.268899575945134),
    ("Ne", "slater", -128.3125),
    ("Fe", "slater", -1248.6549874198522),
    ("Na", "hydrogenic", -248.72222222222223),
    ("Li+ 1s1 2s1", "hydrogenic", -5.625),
]


@pytest.mark.parametrize(("spec", "model", "energy"), PINNED, ids=[f"{s}-{m}" for s, m, _ in PINNED])
def test_total_energy_is_unchanged(spec, model, energy):
    assert build(spec, model).total_energy == pytest.approx(energy, abs=1e-9, rel=0)


def test_the_hydrogenic_pins_are_the_closed_form():
    # E = −Σ occ·Z²/(2n²) for bare-nucleus orbitals (a handbook formula, e.g. Bethe and
    # Salpeter 1957, §2): Na has Z = 11, 2 + 8 electrons in n ≤ 2 and one 3s electron.
    z = 11
    assert PINNED[-2][2] == pytest.approx(-(2 * z**2 / 2 + 8 * z**2 / 8 + z**2 / 18), abs=1e-12)
    assert PINNED[-1][2] == pytest.approx(-(9 / 2 + 9 / 8), abs=1e-12)  # Li⁺ 1s 2s, Z = 3

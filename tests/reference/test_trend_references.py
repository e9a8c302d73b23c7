"""Trend values against published Hartree–Fock energies and NIST's ionization energies."""

from __future__ import annotations

import pytest
from reference_data import rows

from zeffir.core import EV_PER_HARTREE
from zeffir.core.trends import evaluate_trend


def _values(trend, series=0):
    return [p.value for p in trend.series[series].points]


def test_hartree_fock_koopmans_ionization_of_the_noble_gases():
    # −ε of the outermost orbital (T. Koopmans, Physica 1, 104 (1934)). Ne: 2p ε =
    # −0.8504095 Eh, T. Koga et al., Int. J. Quantum Chem. 71, 491 (1999) (our reference
    # file koga_rhf_energies.csv). He 1s −0.91796 and Ar 3p −0.59102 Eh: E. Clementi and
    # C. Roetti, At. Data Nucl. Data Tables 14, 177 (1974) — from memory, not traced to
    # the page.
    ne = next(float(r["value_hartree"]) for r in rows("koga_rhf_energies.csv")
              if r["symbol"] == "Ne" and r["quantity"] == "2p")
    trend = evaluate_trend(["He", "Ne", "Ar"], ["hartree-fock"], "ionization_energy",
                           methods=["koopmans"], processes=1, cache=False)
    he, neon, ar = _values(trend)
    assert neon == pytest.approx(-ne, abs=2e-6)
    assert he == pytest.approx(0.91796, abs=2e-5)
    assert ar == pytest.approx(0.59102, abs=2e-5)
    assert trend.series[0].points[1].notes == ("valence subshell 2p", "Koopmans: −ε(2p)")
    # The NIST values stand beside them (24.587, 21.565, 15.760 eV).
    measured = {p.Z: p.value * EV_PER_HARTREE for p in trend.reference.points}
    assert measured == pytest.approx({2: 24.587389, 10: 21.564541, 18: 15.759612}, abs=1e-5)


def test_delta_scf_against_a_published_hartree_fock_ion_energy():
    # H⁻: E_HF = −0.487929734 Eh (Koga et al. 1999, our koga_rhf_energies.csv) and E(H) =
    # −1/2 exactly, so ΔSCF for the extra electron is E(H) − E(H⁻) = −0.0121 Eh: the
    # Hartree–Fock H⁻ is not bound, a known failure of the model without correlation.
    published = next(float(r["value_hartree"]) for r in rows("koga_rhf_energies.csv")
                     if r["symbol"] == "H-" and r["quantity"] == "E")
    trend = evaluate_trend(["H-", "He"], ["hartree-fock"], "ionization_energy",
                           methods=["delta-scf"], processes=1, cache=False)
    h_minus, helium = trend.series[0].points
    assert h_minus.value == pytest.approx(-0.5 - published, abs=2e-6)
    assert h_minus.value < 0
    # He: E(He⁺) = −2 exactly (one electron) and E_HF(He) = −2.861679996 (Koga 1999).
    he = next(float(r["value_hartree"]) for r in rows("koga_rhf_energies.csv")
              if r["symbol"] == "He" and r["quantity"] == "E")
    assert helium.value == pytest.approx(-2.0 - he, abs=2e-6)
    assert helium.notes[0].startswith("ΔSCF: ion He+")
    assert trend.reference is not None and [p.Z for p in trend.reference.points] == [2]  # H⁻ is an ion

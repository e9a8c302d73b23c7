"""Correlation energies E_exact − E_HF against values published beside the exact energies."""

import pytest

from zeffir.core import build, parse_spec
from zeffir.core.energy import correlation_energy, exact_energy


@pytest.mark.parametrize(("symbol", "expected"), [
    # E_exact − E_HF: He −0.042044 (Pekeris 1959 energy; E_HF −2.861680, Koga et al. 1999
    # −2.861679996), Ne −0.390502 (Chakravorty et al. 1993 energy −128.9376; E_HF −128.547098,
    # Koga et al. 1999 −128.547098079; both in tests/reference/data/koga_rhf_energies.csv),
    # Ar −0.722487 (−527.540 vs E_HF −526.817513, Zeffir's own Hartree–Fock energy: a
    # regression value, computed by Zeffir, not published). Tolerance 2e-6 Eh: Zeffir's HF
    # energies of He and Ne lie within 1e-7 of Koga's, and the expected values round to 6
    # decimals.
    ("He", -0.042044), ("Ne", -0.390502), ("Ar", -0.722487),
])
def test_correlation_energy_of_closed_shell_atoms(symbol, expected):
    orbitals = build(symbol, "hartree-fock")
    assert correlation_energy(orbitals.configuration, orbitals.total_energy) == pytest.approx(
        expected, abs=2e-6)


def test_only_neutral_ground_states_he_to_ar_have_exact_energies():
    assert exact_energy(parse_spec("Ne"))[1] == "Chakravorty et al. 1993"
    assert exact_energy(parse_spec("Ne+")) is None
    assert exact_energy(parse_spec("He 1s1 2s1")) is None
    assert exact_energy(parse_spec("Kr")) is None


def test_correlation_energy_of_open_shell_carbon():
    # E_exact −37.8450 (Chakravorty et al. 1993) − E_HF(³P) −37.688619 (Koga et al. 1999
    # −37.688618960, tests/reference/data/koga_rhf_energies.csv) = −0.156381 Eh.
    orbitals = build("C", "hartree-fock")
    assert correlation_energy(orbitals.configuration, orbitals.total_energy) == pytest.approx(
        -0.156381, abs=2e-6)

"""The command line: the table command's JSON contract, exit codes, and the demo."""

import json
import subprocess
import sys

import pytest

from zeffir.cli import main

REQUIRED_TOP = {"spec", "Z", "charge", "model", "configuration", "total_energy_hartree", "subshells"}
REQUIRED_ROW = {"label", "n", "l", "occupancy", "zeta", "z_eff", "n_star", "r_mean_bohr",
                "r_max_bohr", "energy_hartree"}


def _json(capsys, *argv):
    assert main(["table", *argv, "--json"]) == 0
    out = capsys.readouterr().out
    assert out.count("\n") == 1  # exactly one JSON object on one line
    return json.loads(out)


def test_table_json_fields_and_types(capsys):
    data = _json(capsys, "Na")
    assert REQUIRED_TOP <= set(data)
    assert data["spec"] == "Na" and data["Z"] == 11 and data["charge"] == 0
    assert data["model"] == "slater"
    assert data["configuration"] == "1s2 2s2 2p6 3s1"
    row = data["subshells"][-1]
    assert REQUIRED_ROW <= set(row)
    assert (row["label"], row["n"], row["l"], row["occupancy"]) == ("3s", 3, 0, 1)
    assert isinstance(row["zeta"], float) and isinstance(row["n_star"], float)


def test_hydrogenic_energies_are_minus_z_squared_over_2n_squared(capsys):
    data = _json(capsys, "C", "--model", "hydrogenic")
    for row in data["subshells"]:
        assert row["energy_hartree"] == pytest.approx(-(6**2) / (2 * row["n"] ** 2), rel=1e-15)
        assert row["n_star"] is None
    assert data["total_energy_hartree"] == pytest.approx(2 * -18 + 4 * -4.5)


def test_clementi_has_no_energies(capsys):
    data = _json(capsys, "Ar", "--model", "clementi")
    assert data["total_energy_hartree"] is None
    assert all(row["energy_hartree"] is None for row in data["subshells"])


def test_multi_word_spec_and_ion(capsys):
    data = _json(capsys, "He+", "2p1")
    assert data["charge"] == 1 and data["configuration"] == "2p1"


def test_json_is_in_atomic_units_whatever_units_are_asked(capsys):
    atomic = _json(capsys, "K")
    assert main(["table", "K", "--json", "--units", "angstrom-ev"]) == 0
    assert json.loads(capsys.readouterr().out) == atomic


def test_text_table_converts_units(capsys):
    assert main(["table", "H", "--model", "hydrogenic", "--units", "angstrom-ev"]) == 0
    out = capsys.readouterr().out
    assert "-13.6057" in out  # hydrogen 1s, -½ Eh in eV (CODATA)
    assert "Å" in out


@pytest.mark.parametrize("spec", ["Xx", "C 2p7", "H+", "C 1s2 2s2 2p3", "Sc 3f1"])
def test_bad_spec_exits_2_with_reason_and_no_traceback(spec):
    result = subprocess.run([sys.executable, "-m", "zeffir", "table", *spec.split()],
                            capture_output=True, text=True, check=False)
    assert result.returncode == 2
    assert "Traceback" not in result.stderr
    assert result.stderr.startswith("zeffir: ")
    assert result.stdout == ""


def test_unknown_model_exits_2():
    result = subprocess.run([sys.executable, "-m", "zeffir", "table", "Fe", "--model", "nope"],
                            capture_output=True, text=True, check=False)
    assert result.returncode == 2 and "Traceback" not in result.stderr


def test_demo_runs_and_compares_three_models(capsys):
    assert main(["demo"]) == 0
    out = capsys.readouterr().out
    for model in ("hydrogenic", "slater", "clementi"):
        assert f"model: {model}" in out
    assert "non-relativistic" in out


def test_table_json_for_both_hartree_fock_models(capsys):
    # The Hund-term model fills the energy and the orbital energies; the average model
    # too, with a higher energy for C 2p² (the average lies above the ³P term) and no
    # correlation energy (the average is not one state's energy).
    hund = _json(capsys, "C", "--model", "hartree-fock")
    average = _json(capsys, "C", "--model", "hartree-fock-average")
    assert hund["total_energy_hartree"] == pytest.approx(-37.688619, abs=1e-6)  # as in the references
    assert average["total_energy_hartree"] > hund["total_energy_hartree"] + 0.02
    assert all(row["energy_hartree"] < 0 for row in hund["subshells"] + average["subshells"])
    assert hund["correlation_energy_hartree"] is not None
    assert average["correlation_energy_hartree"] is None
    assert "Hund term 3P" in hund["notes"][0]
    assert hund["virial_ratio"] == pytest.approx(2.0, abs=1e-6)
    assert _json(capsys, "C")["virial_ratio"] is None  # Slater's rules minimise nothing


def test_table_text_for_an_excited_configuration(capsys):
    assert main(["table", "He 1s1 3s1", "--model", "hartree-fock"]) == 0
    out = capsys.readouterr().out
    assert "Hund term 3S" in out and "excited configuration" in out

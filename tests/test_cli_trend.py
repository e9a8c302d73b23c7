"""``zeffir trend``: its JSON contract, the text table, figure and CSV files, bad input."""

from __future__ import annotations

import json

import numpy as np
import pytest

from zeffir.cli import EXIT_BAD_INPUT, EXIT_OK, main


def _trend_json(capsys, *argv):
    assert main(["trend", *argv, "--json", "--quiet", "--processes", "1"]) == EXIT_OK
    out = capsys.readouterr().out
    assert out.count("\n") == 1
    return json.loads(out)


def test_the_json_object_has_the_documented_fields(capsys):
    data = _trend_json(capsys, "ionization_energy", "--over", "He,Ne", "--model", "hartree-fock,slater",
                       "--method", "koopmans,delta-scf")
    assert {"quantity", "unit", "subshell", "series", "reference"} <= set(data)
    assert (data["quantity"], data["unit"], data["subshell"]) == ("ionization_energy", "hartree", "valence")
    assert [(s["model"], s["method"]) for s in data["series"]] == [
        ("hartree-fock", "koopmans"), ("hartree-fock", "delta-scf"),
        ("slater", "koopmans"), ("slater", "delta-scf")]
    point = data["series"][0]["points"][1]
    assert set(point) == {"spec", "Z", "charge", "value", "notes"}
    assert (point["spec"], point["Z"], point["charge"]) == ("Ne", 10, 0)
    assert isinstance(point["value"], float) and all(isinstance(n, str) for n in point["notes"])
    reference = data["reference"]
    assert "NIST" in reference["source"]
    assert [set(p) for p in reference["points"]] == [{"Z", "charge", "value"}] * 2


def test_several_subshells_are_series_of_their_own(capsys):
    data = _trend_json(capsys, "energy", "--over", "Z=21-22", "--subshell", "3d,4s",
                       "--model", "hartree-fock")
    assert data["subshell"] == "3d,4s"
    assert [(s["model"], s["subshell"]) for s in data["series"]] == [("hartree-fock", "3d"),
                                                                     ("hartree-fock", "4s")]


def test_gaps_are_null_with_their_reason(capsys):
    data = _trend_json(capsys, "energy", "--over", "Z=19-21", "--subshell", "3d", "--model", "hartree-fock")
    values = [p["value"] for p in data["series"][0]["points"]]
    assert values[:2] == [None, None] and values[2] < 0
    assert "not occupied" in data["series"][0]["points"][0]["notes"][0]
    assert data["reference"] is None and data["subshell"] == "3d"


def test_the_text_table_names_series_and_gaps(capsys):
    assert main(["trend", "z_eff", "--over", "Z=1-3", "--model", "slater,clementi", "--quiet",
                 "--processes", "1"]) == EXIT_OK
    out = capsys.readouterr().out
    assert "slater" in out and "clementi" in out and "Li" in out
    assert main(["trend", "ionization_energy", "--over", "Ne", "--model", "clementi", "--quiet",
                 "--processes", "1"]) == EXIT_OK
    out = capsys.readouterr().out
    assert "gap: optimised exponents (Clementi–Raimondi), Koopmans, Ne: " in out and "NIST" in out


@pytest.mark.parametrize("suffix", [".png", ".svg", ".pdf"])
def test_figures_are_written(tmp_path, capsys, suffix):
    out = tmp_path / f"ie{suffix}"
    assert main(["trend", "ionization_energy", "--over", "Z=1-10", "--model", "hartree-fock",
                 "--method", "koopmans,delta-scf", "--out", str(out), "--quiet",
                 "--processes", "1"]) == EXIT_OK
    assert out.stat().st_size > 5000
    assert list(tmp_path.iterdir()) == [out]  # nothing left beside it


def test_the_csv_holds_the_values_and_the_reference(tmp_path, capsys):
    out = tmp_path / "ie.csv"
    assert main(["trend", "ionization_energy", "--over", "He,Li,Be", "--model", "hartree-fock",
                 "--units", "angstrom", "--out", str(out), "--quiet", "--processes", "1"]) == EXIT_OK
    data = np.genfromtxt(out, delimiter=",", names=True, comments="#", dtype=None, encoding="utf-8")
    assert list(data.dtype.names) == ["spec", "Z", "charge", "x", "series_1", "reference", "difference_1"]
    assert list(data["Z"]) == [2, 3, 4]
    # eV with --units angstrom; the difference is series − reference.
    np.testing.assert_allclose(data["difference_1"], data["series_1"] - data["reference"], atol=1e-9)
    # He: 24.587389 eV, NIST ASD (the shipped first_ionization_energies.csv).
    assert data["reference"][0] == pytest.approx(24.587389, abs=1e-6)
    text = out.read_text()
    assert "# series_1: restricted Hartree–Fock, Koopmans" in text and "NIST" in text


@pytest.mark.parametrize(("argv", "words"), [
    (["colour", "--over", "Z=1-3"], "unknown quantity"),
    (["z_eff", "--over", "Z=3-1"], "runs backwards"),
    (["z_eff", "--over", "Z=1-3", "--model", "slater,nosuch"], "--model nosuch: unknown model"),
    (["z_eff", "--over", "Z=1-3", "--method", "koopmans"], "ionization_energy only"),
    (["z_eff", "--over", "Z=1-3", "--out", "x.txt"], "a trend is written as"),
    (["z_eff", "--over", "Z=1-3", "--out", "/no/such/folder/x.png"], "does not exist"),
    (["z_eff", "--over", "Z=1-3", "--processes", "0"], "--processes"),
])
def test_bad_input_exits_2_naming_the_part(capsys, argv, words):
    assert main(["trend", *argv, "--quiet"]) == EXIT_BAD_INPUT
    err = capsys.readouterr().err
    assert words in err and err.count("\n") == 1

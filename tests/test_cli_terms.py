"""The terms command: the JSON contract, the text output, and exit codes."""

import json
import subprocess
import sys

import pytest

from zeffir.cli import main

TOP_FIELDS = {"spec", "configuration", "terms", "ground"}
TERM_FIELDS = {"S", "L", "parity", "J", "label"}
GROUND_FIELDS = {"S", "L", "J", "parity", "label"}


def _json(capsys, *argv):
    assert main(["terms", *argv, "--json"]) == 0
    out = capsys.readouterr().out
    assert out.count("\n") == 1  # exactly one JSON object on one line
    return json.loads(out)


def test_json_contract_fields_and_types(capsys):
    data = _json(capsys, "C")
    assert TOP_FIELDS <= set(data)
    assert data["spec"] == "C" and data["configuration"] == "1s2 2s2 2p2"
    for term in data["terms"]:
        assert set(term) >= TERM_FIELDS
        assert isinstance(term["S"], float) and isinstance(term["L"], int)
        assert term["parity"] in ("even", "odd")
        assert all(isinstance(j, float) for j in term["J"])
    assert [t["label"] for t in data["terms"]] == ["3P", "1D", "1S"]
    assert data["terms"][0]["J"] == [0.0, 1.0, 2.0]
    ground = data["ground"]
    assert set(ground) >= GROUND_FIELDS
    assert {k: ground[k] for k in GROUND_FIELDS} == {
        "S": 1.0, "L": 1, "J": 0.0, "parity": "even", "label": "3P0"}
    assert isinstance(ground["S"], float) and isinstance(ground["J"], float)


def test_json_labels_are_plain_and_parity_is_a_field(capsys):
    data = _json(capsys, "N")
    assert [t["label"] for t in data["terms"]] == ["4S", "2D", "2P"]
    assert {t["parity"] for t in data["terms"]} == {"odd"}
    assert data["ground"]["label"] == "4S3/2" and data["ground"]["J"] == 1.5


def test_repeated_term_is_listed_each_time(capsys):
    data = _json(capsys, "V", "[Ar]", "3d3", "4s2")  # SPEC given as several words
    assert [t["label"] for t in data["terms"]].count("2D") == 2
    assert len(data["terms"]) == 8


def test_closed_shell_gives_single_1s_term(capsys):
    data = _json(capsys, "Ar")
    assert data["terms"] == [{"S": 0.0, "L": 0, "parity": "even", "J": [0.0], "label": "1S"}]
    assert data["ground"]["label"] == "1S0" and data["notes"] == []


def test_json_states_where_hunds_rules_miss(capsys):
    data = _json(capsys, "Ce")
    assert data["ground"]["label"] == "3H4" and data["ground"]["parity"] == "odd"
    # Ce I: NIST ASD ground level 1G°4 (tests/reference/data/nist_neutral_ground_levels.csv).
    assert data["observed_ground"]["label"] == "1G4"
    assert any("miss" in note for note in data["notes"])


def test_json_matches_an_ion_and_a_typed_configuration(capsys):
    assert _json(capsys, "Fe3+")["ground"]["label"] == "6S5/2"
    assert _json(capsys, "C", "1s2", "2s1", "2p3")["ground"]["label"] == "5S2"  # 2s 2p3: S = 2


def test_text_output_groups_terms_by_multiplicity(capsys):
    assert main(["terms", "Fe"]) == 0
    out = capsys.readouterr().out
    assert "16 terms (11 distinct)" in out
    assert out.index("quintets (S = 2)") < out.index("triplets (S = 1)") < out.index("singlets")
    assert "3F ×2   J = 2, 3, 4" in out
    assert "ground level by Hund's rules: 5D4" in out


def test_text_output_marks_odd_terms(capsys):
    assert main(["terms", "N"]) == 0
    out = capsys.readouterr().out
    assert "parity odd" in out and "4S°   J = 3/2" in out and "4S°3/2" in out


@pytest.mark.parametrize("spec", ["Xx", "Og [Kr] 4d10 5s2 5p4 4f7 5g9 6h11 7i13 8i13 9i13"])
def test_bad_spec_exits_2_with_reason_and_no_traceback(spec):
    result = subprocess.run([sys.executable, "-m", "zeffir", "terms", *spec.split()],
                            capture_output=True, text=True, check=False)
    assert result.returncode == 2
    assert "Traceback" not in result.stderr
    assert result.stderr.startswith("zeffir: ")
    assert result.stdout == ""


@pytest.mark.parametrize(("spec", "reason"), [
    ("C 2p7", "2p7: a p subshell holds at most 6 electrons"),
    ("H+", "no electrons left"),
    ("C 1s2 2s2 2p3", "7 electrons, but neutral C has 6"),
])
def test_bad_spec_reason_names_the_token_and_rule(capsys, spec, reason):
    assert main(["terms", *spec.split(), "--json"]) == 2
    captured = capsys.readouterr()
    assert captured.out == "" and captured.err.startswith("zeffir: ") and reason in captured.err


def test_too_many_terms_exits_2_naming_the_count(capsys):
    assert main(["terms", "24", "6h11", "7i13"]) == 2
    captured = capsys.readouterr()
    assert "too many to list" in captured.err and captured.out == ""


def test_terms_command_runs_as_a_program():
    result = subprocess.run([sys.executable, "-m", "zeffir", "terms", "O", "--json"],
                            capture_output=True, text=True, check=False)
    assert result.returncode == 0, result.stderr
    assert json.loads(result.stdout)["ground"]["label"] == "3P2"

"""The figure command: options to view state, files written, and exit status 2 on bad input."""

import json
import struct
import subprocess
import sys

import numpy as np
import pytest

from zeffir.cli import _parser, figure_state, main, parse_orbital
from zeffir.core import (
    ANGSTROM_PER_BOHR,
    QuantumNumberError,
    compiled_kernels_enabled,
    set_compiled_kernels,
)
from zeffir.state import OrbitalChoice


def _run(*argv):
    return subprocess.run([sys.executable, "-m", "zeffir", "figure", *argv],
                          capture_output=True, text=True, check=False)


def _state(*argv):
    return figure_state(_parser().parse_args(["figure", *argv, "--out", "x.png"]))


def test_png_end_to_end(tmp_path):
    out = tmp_path / "na.png"
    result = _run("Na", "--view", "radial", "--orbital", "3s", "--dpi", "100", "--out", str(out))
    assert result.returncode == 0, result.stderr
    assert result.stdout.strip() == f"wrote {out}"
    data = out.read_bytes()
    assert data[:8] == b"\x89PNG\r\n\x1a\n"
    assert struct.unpack(">II", data[16:24])[0] == 335  # single column, 3.35 in at 100 dpi


def test_npz_end_to_end(tmp_path):
    out = tmp_path / "cl.npz"
    result = _run("Cl", "--view", "slice", "--orbital", "3p:1", "--plane", "xy", "--resolution", "32",
                  "--extent", "3", "--units", "angstrom-ev", "--out", str(out))
    assert result.returncode == 0, result.stderr
    with np.load(out, allow_pickle=False) as data:
        assert data["values"].shape == (32, 32)
        assert data["u"][-1] == pytest.approx(3.0, rel=1e-12)  # the extent is read in Å, shown in Å
        metadata = json.loads(str(data["metadata"]))
    assert metadata["spec"] == "Cl" and metadata["orbital"].startswith("3p, m = +1")
    assert metadata["units"]["u"] == "Å"


def test_unknown_extension_exits_2_with_the_accepted_ones(tmp_path):
    result = _run("Na", "--out", str(tmp_path / "na.bmp"))
    assert result.returncode == 2
    assert result.stderr.startswith("zeffir: ") and ".png, .svg, .pdf, .csv, .npz" in result.stderr
    assert "Traceback" not in result.stderr and list(tmp_path.iterdir()) == []


@pytest.mark.parametrize("where", ["missing/na.png", "plain-file/na.png"])
def test_unwritable_path_exits_2_without_traceback_or_partial_file(tmp_path, where):
    (tmp_path / "plain-file").write_text("not a directory")
    result = _run("Na", "--out", str(tmp_path / where))
    assert result.returncode == 2
    assert result.stderr.startswith(f"zeffir: {tmp_path / where}: cannot write (")
    assert "Traceback" not in result.stderr
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plain-file"]


def test_versus_a_model_compares_models_on_the_same_spec(tmp_path, capsys):
    out = tmp_path / "c.csv"
    assert main(["figure", "Na", "--model", "slater", "--versus", "clementi", "--out", str(out)]) == 0
    text = out.read_text(encoding="utf-8")
    assert "# series_1: spec Na; model slater;" in text and "# series_2: spec Na; model clementi;" in text


def test_versus_a_spec_compares_specs_under_the_same_model(tmp_path, capsys):
    out = tmp_path / "c.csv"
    assert main(["figure", "Na", "--model", "clementi", "--versus", "Na+", "--out", str(out)]) == 0
    assert "# series_2: spec Na+; model clementi;" in out.read_text(encoding="utf-8")


@pytest.mark.parametrize(
    ("argv", "reason"),
    [
        (["Xx"], "Xx: unknown element"),
        (["Na", "--orbital", "4d"], "--orbital 4d: Na has no 4d electrons (occupied: 1s 2s 2p 3s)"),
        (["Na", "--orbital", "2pq"], "--orbital 2pq: not a real orbital of l = 1"),
        (["Na", "--orbital", "2p:2"], "--orbital 2p:2: |m| must be at most l = 1"),
        (["Na", "--versus", "Qq"], "--versus: Qq: unknown element"),
        (["Na", "--view", "slice", "--quantity", "D"], "--quantity D: not shown by the slice view"),
        (["Na", "--view", "slice", "--resolution", "4"], "--resolution: must be between 16 and"),
        (["Na", "--view", "slice", "--log"], "--log: ψ is signed"),
        (["Na", "--plane", "xy", "--normal", "0", "0", "1"], "--plane and --normal"),
        (["Na", "--dpi", "5"], "--dpi 5: must be between 50 and 1200"),
    ],
)
def test_bad_input_exits_2_with_the_reason(tmp_path, capsys, argv, reason):
    assert main(["figure", *argv, "--out", str(tmp_path / "f.png")]) == 2
    err = capsys.readouterr().err
    assert err.startswith("zeffir: ") and reason in err
    assert list(tmp_path.iterdir()) == []


@pytest.mark.parametrize(
    ("label", "choice"),
    [
        ("3s", OrbitalChoice("3s", "real", 0)),
        ("2px", OrbitalChoice("2p", "real", 1)),
        ("2p", OrbitalChoice("2p", "real", 0)),
        ("3dxy", OrbitalChoice("3d", "real", -2)),
        ("4fxyz", OrbitalChoice("4f", "real", -2)),
        ("3p:-1", OrbitalChoice("3p", "complex", -1)),
    ],
)
def test_orbital_labels(label, choice):
    assert parse_orbital(label) == choice


@pytest.mark.parametrize("label", ["", "s", "3", "3q", "2d", "3p:x", "3px:1", "3dxx"])
def test_bad_orbital_labels_name_the_label(label):
    with pytest.raises(QuantumNumberError, match=label.replace("+", r"\+") or ":"):
        parse_orbital(label)


def test_options_build_the_expected_state():
    state = _state("C", "1s2", "2s1", "2p3", "--view", "slice", "--quantity", "density", "--log",
                   "--normal", "1", "1", "0", "--offset", "0.5", "--extent", "2", "--contours", "0",
                   "--units", "angstrom-ev", "--versus", "hydrogenic", "--no-difference")
    assert state.left.spec == "C 1s2 2s1 2p3" and state.compare.right.model == "hydrogenic"
    assert state.compare.enabled and not state.compare.show_difference
    assert state.orbital.subshell == "2p"  # the outermost subshell by default
    s = state.slice
    assert (s.plane, s.normal, s.quantity, s.log_scale, s.contours) == (
        "custom", (1.0, 1.0, 0.0), "density", True, 0)
    assert s.extent == 2.0 / ANGSTROM_PER_BOHR and s.offset == 0.5 / ANGSTROM_PER_BOHR
    assert state.length_unit == "angstrom"
    radial = _state("Na", "--quantity", "Q", "--per-electron", "--log", "--r-max", "20",
                    "--no-markers", "--no-total").radial
    assert (radial.quantity, radial.weighted, radial.log_r, radial.r_limit) == ("Q", False, True, 20.0)
    assert not radial.show_markers and not radial.show_total and radial.show_subshells


@pytest.mark.parametrize("before", [True, False])
def test_a_figure_run_in_process_gives_the_kernel_choice_back(tmp_path, capsys, before):
    # zeffir figure takes the plain kernels for its one picture; a script (or a test) that
    # calls main() keeps the choice it had, whether the figure was written or refused.
    previous = set_compiled_kernels(before)
    try:
        assert main(["figure", "Na", "--view", "slice", "--resolution", "24",
                     "--out", str(tmp_path / "s.npz")]) == 0
        assert compiled_kernels_enabled() is before
        assert main(["figure", "Na", "--dpi", "5", "--out", str(tmp_path / "s.png")]) == 2
        assert compiled_kernels_enabled() is before
    finally:
        set_compiled_kernels(previous)
    capsys.readouterr()

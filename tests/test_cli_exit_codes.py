"""The command line's contract: no traceback for any input, documented exit codes, progress."""

from __future__ import annotations

import json
import os
import signal
import subprocess
import sys

import pytest

from zeffir.cli import (
    EXIT_BAD_INPUT,
    EXIT_CANNOT_COMPUTE,
    EXIT_INTERRUPTED,
    _parser,
    main,
    split_specs,
)

VIEWS = {"radial": "Ne", "slice": "Ne", "pair": "N", "two-electron": "Li+ 1s1 2s1"}
#: The data format each view writes; the other data format is refused with a reason.
DATA = {"radial": ".csv", "slice": ".npz", "pair": ".npz", "two-electron": ".npz"}


@pytest.mark.parametrize("view", list(VIEWS))
@pytest.mark.parametrize("suffix", [".png", ".svg", ".pdf", ".csv", ".npz"])
def test_every_view_in_every_format_writes_or_refuses_in_one_line(view, suffix, tmp_path, capsys):
    out = tmp_path / f"out{suffix}"
    status = main(["figure", VIEWS[view], "--view", view, "--resolution", "24", "--dpi", "60",
                   "--quiet", "--out", str(out)])
    captured = capsys.readouterr()
    assert "Traceback" not in captured.err
    if suffix in (".png", ".svg", ".pdf") or suffix == DATA[view]:
        assert status == 0 and out.stat().st_size > 0, captured.err
    else:
        assert status == EXIT_BAD_INPUT and not out.exists()
        assert len(captured.err.strip().splitlines()) == 1 and "zeffir:" in captured.err


def test_a_model_that_cannot_compute_exits_3_with_its_reason(tmp_path, capsys):
    # Be⁻ under Hartree–Fock: the extra electron is unbound in the basis (the model says so).
    assert main(["table", "Be-", "--model", "hartree-fock", "--quiet"]) == EXIT_CANNOT_COMPUTE
    err = capsys.readouterr().err.strip()
    assert err.startswith("zeffir: Be-:") and len(err.splitlines()) == 1
    out = tmp_path / "be.png"
    assert main(["figure", "Be-", "--model", "hartree-fock", "--quiet", "--out", str(out)]) == 3
    assert not out.exists()


def test_bad_input_exits_2(capsys):
    assert main(["table", "Qq"]) == EXIT_BAD_INPUT
    assert capsys.readouterr().err.strip() == "zeffir: Qq: unknown element"
    with pytest.raises(SystemExit) as stop:  # argparse: usage errors are status 2 as well
        main(["table", "Ne", "--model", "nonsense"])
    assert stop.value.code == EXIT_BAD_INPUT


def test_progress_goes_to_stderr_on_request_and_quiet_silences_it(capsys):
    assert main(["table", "Ne", "--model", "hartree-fock", "--progress"]) == 0
    captured = capsys.readouterr()
    lines = captured.err.splitlines()
    assert lines and all(line.startswith("zeffir: Ne: Hartree–Fock iteration") for line in lines)
    assert "residual" in lines[-1] and "Eh" in lines[-1]
    assert "Neon" in captured.out and "iteration" not in captured.out  # the table alone on stdout
    assert main(["table", "Ne", "--model", "hartree-fock", "--progress", "--quiet"]) == 0
    assert capsys.readouterr().err == ""


def test_table_takes_several_specs(capsys):
    assert split_specs(["Fe", "Fe3+", "C", "1s2", "2s1", "2p3", "Na [Ne] 4d1", "O2-"]) == [
        "Fe", "Fe3+", "C 1s2 2s1 2p3", "Na [Ne] 4d1", "O2-"]
    assert main(["table", "Ne", "Ar", "C", "1s2", "2s1", "2p3", "--json", "--quiet"]) == 0
    objects = [json.loads(line) for line in capsys.readouterr().out.splitlines()]
    assert [o["spec"] for o in objects] == ["Ne", "Ar", "C 1s2 2s1 2p3"]
    assert all(o["zeffir_version"] and o["format_version"] == 1 for o in objects)
    assert main(["table", "Ne", "Ar", "--quiet"]) == 0
    text = capsys.readouterr().out
    assert text.index("Neon") < text.index("Argon")


def test_help_lists_every_view_groups_options_and_ends_with_examples():
    text = _parser().format_help()  # top level
    assert "exit status" in text and "130" in text
    commands = _parser()._subparsers._group_actions[0].choices  # type: ignore[union-attr]
    figure = commands["figure"].format_help()
    for view in VIEWS:
        assert view in figure
    for group in ("comparison", "radial view", "slice view", "pair view", "two-electron view",
                  "colour", "output"):
        assert f"{group}" in figure
    # The examples come last, then the exit codes.
    assert figure.index("examples:") > figure.index("output:") and figure.index("examples:") < figure.index(
        "exit status:")
    assert figure.rstrip().splitlines()[-1].startswith("  130")
    assert "examples:" in figure and "examples:" in commands["table"].format_help()
    assert "examples:" in commands["terms"].format_help()


def _default_interrupt() -> None:
    """In the child before it starts: SIGINT back to its default action.

    A suite started in the background by a shell without job control inherits SIGINT
    ignored, and Python then keeps it ignored (as it should for a user's process): the
    child would never see the Ctrl-C this test sends.
    """
    signal.signal(signal.SIGINT, signal.SIG_DFL)


def test_ctrl_c_prints_one_line_exits_130_and_leaves_no_file(tmp_path):
    out = tmp_path / "kr.png"
    # A build that is sure to be long, interrupted after its first progress line: the
    # scalar-relativistic Kr on the plain-Python solver takes some 18 s in all (the
    # variational Kr, used before, now finishes in well under a second and could end
    # before the signal arrived).
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen", "ZEFFIR_NO_NUMBA": "1"}
    child = subprocess.Popen([sys.executable, "-m", "zeffir", "figure", "Kr", "--model",
                              "scalar-relativistic-lda", "--progress", "--out", str(out)],
                             stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True, env=env,
                             cwd=tmp_path, preexec_fn=_default_interrupt)
    assert child.stderr is not None
    first = child.stderr.readline()  # the first progress line: the model is at work
    assert "ScRLDA iteration 1" in first
    child.send_signal(signal.SIGINT)
    _out, err = child.communicate(timeout=60)
    assert child.returncode == EXIT_INTERRUPTED
    rest = [line for line in err.splitlines() if not line.startswith("zeffir: Kr ScRLDA iteration")]
    assert rest == ["zeffir: interrupted"]
    assert not out.exists() and list(tmp_path.iterdir()) == []


def test_the_table_and_the_window_take_the_correlation_energy_from_one_place(capsys):
    from zeffir.cli import table_json
    from zeffir.core import build
    from zeffir.core.properties import energy_summary

    data = table_json("Ne", "hartree-fock")
    summary = energy_summary(build("Ne", "hartree-fock"), "hartree-fock")
    assert data["correlation_energy_hartree"] == summary.correlation
    assert data["exact_energy_hartree"] == summary.exact
    # Chakravorty et al. 1993 (via the shipped table): Ne E_exact = -128.9376 Eh, so E_corr
    # against the Hartree–Fock limit (-128.5471 Eh, Bunge et al. 1993) is about -0.390 Eh.
    assert summary.correlation == pytest.approx(-0.3905, abs=2e-3)
    assert table_json("Ne", "hartree-fock-average")["correlation_energy_hartree"] is None


def test_a_bad_out_is_refused_before_the_figure_is_computed(tmp_path, capsys):
    fifo = tmp_path / "pipe.png"
    os.mkfifo(fifo)
    for out, reason in ((fifo, "not a regular file"), (tmp_path / ("x" * 300 + ".png"), "bytes long")):
        status = main(["figure", "Ne", "--quiet", "--out", str(out)])
        err = capsys.readouterr().err
        assert status == EXIT_BAD_INPUT and reason in err and "Traceback" not in err
    assert fifo.exists() and not fifo.is_file()


def test_negative_numbers_in_exponent_notation_are_values(tmp_path, capsys):
    out = tmp_path / "offset.npz"
    status = main(["figure", "Ne", "--view", "slice", "--resolution", "16", "--offset", "-1e-1",
                   "--normal", "-1e0", "0", "1", "--quiet", "--out", str(out)])
    assert status == 0 and out.exists(), capsys.readouterr().err


def test_refusals_name_the_option_typed(tmp_path, capsys):
    status = main(["figure", "N", "--view", "pair", "--ref", "1e300", "0", "0", "--quiet",
                   "--out", str(tmp_path / "p.png")])
    err = capsys.readouterr().err
    assert status == EXIT_BAD_INPUT and err.startswith("zeffir: --ref:") and "pair.reference" not in err


def test_a_refused_session_is_a_message_not_a_modal_box(tmp_path, capsys):
    # Checked before any window exists, so a scripted or headless start never waits on a
    # dialog no one can dismiss.
    bad = tmp_path / "bad.zeffir"
    bad.write_text('{"kind": "other"}', encoding="utf-8")
    status = main(["--session", str(bad)])
    err = capsys.readouterr().err
    assert status == EXIT_BAD_INPUT and err.startswith("zeffir: --session ") and "not a Zeffir session" in err

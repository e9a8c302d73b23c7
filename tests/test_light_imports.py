"""The start path stays light: nothing imports SciPy, numba, matplotlib or Qt before it is needed.

``zeffir --version`` and ``--help`` answer without importing SciPy; importing the core
does not import SciPy either (its constants and special functions load on first use).
Each check runs in a fresh interpreter, so modules loaded by other tests cannot hide a
regression. Timings are in the benchmark (``cli_version_wall``), not here.
"""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

HEAVY = ("scipy", "numba", "matplotlib", "PySide6", "pyqtgraph")


def _loaded_after(code: str) -> set[str]:
    probe = (f"import sys, json\n{code}\n"
             f"print(json.dumps(sorted({{m.split('.')[0] for m in sys.modules}} & set({list(HEAVY)!r}))))")
    result = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True, check=False,
                            timeout=120, env={"QT_QPA_PLATFORM": "offscreen", "PATH": "/usr/bin:/bin"})
    assert result.returncode == 0, result.stderr
    return set(json.loads(result.stdout.strip().splitlines()[-1]))


@pytest.mark.parametrize("argv", [["--version"], ["--help"], ["figure", "--help"], ["table", "--help"]])
def test_version_and_help_load_nothing_heavy(argv):
    code = ("from zeffir.cli import main\nimport contextlib, io\n"
            "with contextlib.redirect_stdout(io.StringIO()):\n"
            f"    try:\n        main({argv!r})\n    except SystemExit:\n        pass")
    assert _loaded_after(code) == set()


def test_importing_the_core_loads_no_scipy():
    assert _loaded_after("import zeffir.core, zeffir.state, zeffir.scene, zeffir.export") == set()


def test_constants_still_come_from_scipy_on_first_use():
    code = ("import zeffir.core\nfrom scipy import constants\n"
            "a = zeffir.core.ANGSTROM_PER_BOHR\n"
            "assert a == constants.physical_constants['Bohr radius'][0] / constants.angstrom, a\n"
            "assert zeffir.core.EV_PER_HARTREE == constants.physical_constants['Hartree energy in eV'][0]\n"
            "assert zeffir.core.CODATA_EDITION.startswith('CODATA')")
    assert "scipy" in _loaded_after(code)


def test_a_one_shot_figure_does_not_load_the_compiler(tmp_path):
    # One picture is faster on the plain-numpy kernels than numba takes to load.
    out = tmp_path / "xe.npz"
    argv = ["figure", "Xe", "--view", "slice", "--resolution", "64", "--out", str(out)]
    code = f"from zeffir.cli import main\nassert main({argv!r}) == 0"
    assert "numba" not in _loaded_after(code)
    assert out.exists()


def test_compiled_option_loads_the_compiler_and_gives_the_same_values(tmp_path):
    import numpy as np

    plain, compiled = tmp_path / "plain.npz", tmp_path / "compiled.npz"
    common = ["figure", "Fe", "--view", "slice", "--orbital", "3dxy", "--resolution", "256"]
    code = ("from zeffir.cli import main\n"
            f"assert main({[*common, '--out', str(compiled), '--compiled']!r}) == 0")
    assert "numba" in _loaded_after(code)
    code = f"from zeffir.cli import main\nassert main({[*common, '--out', str(plain)]!r}) == 0"
    assert "numba" not in _loaded_after(code)
    with np.load(plain) as a, np.load(compiled) as b:
        assert np.allclose(a["values"], b["values"], rtol=1e-9, atol=1e-12 * np.abs(a["values"]).max())

"""Static checks that are part of the suite: ruff on the code, mypy --strict on the core."""

import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def _run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", *args], cwd=ROOT, capture_output=True, text=True,
                          check=False)


def test_ruff_is_clean():
    result = _run("ruff", "check", "app", "tests", "resources")
    assert result.returncode == 0, result.stdout + result.stderr


def test_mypy_strict_on_core_is_clean():
    result = _run("mypy")  # configuration in pyproject.toml: strict, files = app/zeffir/core
    assert result.returncode == 0, result.stdout + result.stderr

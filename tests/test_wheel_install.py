"""The sdist and the wheel built from it work outside the repository.

One module-scoped fixture builds the sdist from the source tree and the wheel from the
unpacked sdist (as ``python -m build`` does), with the setuptools that
``[build-system] requires`` names. It installs the wheel, not in editable mode, into a
fresh virtual environment, with its dependencies resolved from the package index (pip's
cache makes repeated runs cheap). The tests then run the installed ``zeffir`` command
from a temporary directory, so nothing from the repository can be imported by accident.

If the package index cannot be reached, the fixture skips and says so. Any other
failure to build or install is a test failure.
"""

from __future__ import annotations

import json
import os
import re
import subprocess
import sys
import tarfile
import time
import tomllib
import zipfile
from dataclasses import dataclass
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
PYPROJECT = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
VERSION = PYPROJECT["project"]["version"]
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"
# How warnings.showwarning prints a category: "file.py:12: SetuptoolsDeprecationWarning: ...".
_PYTHON_WARNING = re.compile(r":\d+: \w*Warning: ")

# pip's messages when the index cannot be reached at all (as opposed to a bad requirement).
_OFFLINE = re.compile(r"NewConnectionError|Network is unreachable|Temporary failure in name resolution"
                      r"|Name or service not known|ConnectTimeoutError|Max retries exceeded|ProxyError")


@dataclass(frozen=True)
class Installed:
    """What the fixture built and where it installed it."""

    sdist: Path
    wheel: Path
    bin: Path
    workdir: Path
    seconds: dict[str, float]


def _clean_env() -> dict[str, str]:
    """The environment without anything that could point Python back at the repository."""
    env = {k: v for k, v in os.environ.items() if k not in ("PYTHONPATH", "PYTHONHOME", "VIRTUAL_ENV")}
    env["QT_QPA_PLATFORM"] = "offscreen"
    env["PIP_DISABLE_PIP_VERSION_CHECK"] = "1"
    return env


def _run(args: list[str | Path], cwd: Path, timeout: float = 600) -> subprocess.CompletedProcess[str]:
    return subprocess.run([str(a) for a in args], cwd=cwd, env=_clean_env(), capture_output=True,
                          text=True, timeout=timeout, check=False)


def _pip(python: Path, *args: str, cwd: Path) -> None:
    result = _run([python, "-m", "pip", *args], cwd)
    output = result.stdout + result.stderr
    if result.returncode != 0 and _OFFLINE.search(output):
        pytest.skip("the package index cannot be reached, so the wheel cannot be installed: "
                    + output.strip().splitlines()[-1])
    assert result.returncode == 0, output


def _backend(python: Path, hook: str, out: Path, cwd: Path) -> Path:
    """Call a setuptools PEP 517 hook (``build_sdist`` or ``build_wheel``); return the file built."""
    code = f"from setuptools import build_meta; print(build_meta.{hook}({str(out)!r}))"
    result = _run([python, "-c", code], cwd)
    assert result.returncode == 0, result.stdout + result.stderr
    # Python warnings from setuptools (deprecated license fields, data outside the listed
    # packages) must be fixed, not left to a future setuptools; distutils' lower-case
    # "warning:" log lines (e.g. an exclude pattern that matched nothing) are information.
    assert not _PYTHON_WARNING.search(result.stderr), result.stderr
    return out / result.stdout.strip().splitlines()[-1]


@pytest.fixture(scope="module")
def installed(tmp_path_factory: pytest.TempPathFactory) -> Installed:
    base = tmp_path_factory.mktemp("wheel-install")
    seconds: dict[str, float] = {}
    start = time.perf_counter()
    venv = base / "venv"
    result = _run([sys.executable, "-m", "venv", venv], base)
    assert result.returncode == 0, result.stderr
    python = venv / "bin" / "python"
    _pip(python, "install", "--quiet", *PYPROJECT["build-system"]["requires"], cwd=base)
    seconds["venv"] = time.perf_counter() - start

    start = time.perf_counter()
    dist = base / "dist"
    dist.mkdir()
    sdist = _backend(python, "build_sdist", dist, ROOT)
    with tarfile.open(sdist) as archive:
        # The "data" filter (Python >= 3.11.4) refuses links and paths outside the target.
        kwargs = {"filter": "data"} if hasattr(tarfile, "data_filter") else {}
        archive.extractall(base / "src", **kwargs)
    wheel = _backend(python, "build_wheel", dist, base / "src" / sdist.name.removesuffix(".tar.gz"))
    seconds["build"] = time.perf_counter() - start

    start = time.perf_counter()
    _pip(python, "install", "--quiet", wheel, cwd=base)
    seconds["install"] = time.perf_counter() - start
    workdir = base / "work"
    workdir.mkdir()
    return Installed(sdist, wheel, venv / "bin", workdir, seconds)


def test_sdist_holds_the_tests_license_and_data(installed: Installed) -> None:
    top = installed.sdist.name.removesuffix(".tar.gz")
    with tarfile.open(installed.sdist) as archive:
        names = {name.removeprefix(f"{top}/") for name in archive.getnames()}
    expected = {"pyproject.toml", "README.md", "LICENSE", "CHANGELOG.md", "CITATION.cff", "MANIFEST.in",
                "app/zeffir/py.typed", "resources/data/elements.csv", "tests/conftest.py",
                "tests/test_wheel_install.py", "tools/check_lower_bounds.py"}
    assert expected <= names, expected - names
    repo_tests = {str(p.relative_to(ROOT)) for p in (ROOT / "tests").rglob("test_*.py")}
    assert repo_tests <= names, repo_tests - names
    assert not [n for n in names if "__pycache__" in n or n.endswith((".pyc", ".nbi", ".nbc"))]


def test_wheel_holds_the_package_and_no_tests(installed: Installed) -> None:
    with zipfile.ZipFile(installed.wheel) as archive:
        names = set(archive.namelist())
        metadata = archive.read(f"zeffir-{VERSION}.dist-info/METADATA").decode("utf-8")
    expected = {"zeffir/py.typed", "zeffir/__main__.py", "zeffir/core/__init__.py",
                "zeffir/resources/data/elements.csv", "zeffir/resources/demo/sodium-valence.zeffir",
                f"zeffir-{VERSION}.dist-info/licenses/LICENSE"}
    assert expected <= names, expected - names
    assert not [n for n in names if n.startswith(("tests/", "tools/")) or n.endswith(".pyc")]
    assert "License-Expression: MIT" in metadata.splitlines()
    assert f"Version: {VERSION}" in metadata.splitlines()
    assert not [line for line in metadata.splitlines() if line.startswith("Classifier: License ::")]


def test_installed_package_is_the_wheel_not_the_source_tree(installed: Installed) -> None:
    code = "import zeffir, zeffir.core; print(zeffir.__version__); print(zeffir.__file__)"
    result = _run([installed.bin / "python", "-c", code], installed.workdir)
    assert result.returncode == 0, result.stderr
    version, location = result.stdout.split()
    assert version == VERSION
    assert Path(location).is_relative_to(installed.bin.parent)


def test_installed_table_command_prints_iron(installed: Installed) -> None:
    result = _run([installed.bin / "zeffir", "table", "Fe", "--json"], installed.workdir, timeout=120)
    assert result.returncode == 0, result.stderr
    table = json.loads(result.stdout)
    assert table["Z"] == 26
    assert table["zeffir_version"] == VERSION
    assert sum(row["occupancy"] for row in table["subshells"]) == 26


def test_installed_figure_command_writes_a_png(installed: Installed) -> None:
    out = installed.workdir / "na.png"
    result = _run([installed.bin / "zeffir", "figure", "Na", "--out", out], installed.workdir, timeout=300)
    assert result.returncode == 0, result.stderr
    assert out.read_bytes()[:8] == PNG_SIGNATURE
    assert out.stat().st_size > 10_000  # a drawn figure, not an empty canvas
    print(f"wheel {installed.wheel.stat().st_size / 1024:.0f} KiB;",
          "; ".join(f"{k} {v:.1f} s" for k, v in installed.seconds.items()))

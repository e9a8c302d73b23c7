"""Test-wide settings: no display is needed anywhere.

The check against the oldest allowed dependency releases (tools/check_lower_bounds.py)
builds its own environment and runs the core tests there. It is started in the
background as soon as the tests are collected, if tests/test_lower_bounds_env.py is
among them, so it runs on the core the rest of the suite leaves idle; that test waits
for its result.
"""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
import tempfile
from dataclasses import dataclass
from pathlib import Path

import pytest

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
# Sweeps and trends keep results in a disk cache: the suite's go to a folder of its own,
# never to the user's cache directory.
os.environ.setdefault("ZEFFIR_CACHE_DIR", tempfile.mkdtemp(prefix="zeffir-test-cache-"))

ROOT = Path(__file__).resolve().parents[1]
LOWER_BOUNDS_TEST = "test_lower_bounds_env.py"


@dataclass
class BackgroundRun:
    """A command running beside the suite, its output going to ``log``."""

    process: subprocess.Popen[bytes]
    log: Path
    scratch: Path


background_runs = pytest.StashKey[BackgroundRun]()


def _lower_priority() -> None:  # pragma: no cover - runs in the child process
    os.nice(5)


def pytest_collection_finish(session: pytest.Session) -> None:
    if os.environ.get("PYTEST_XDIST_WORKER") or session.config.option.collectonly:
        return
    if not any(item.path.name == LOWER_BOUNDS_TEST for item in session.items):
        return
    scratch = Path(tempfile.mkdtemp(prefix="zeffir-lower-bounds-"))
    log = scratch / "run.log"
    env = {k: v for k, v in os.environ.items() if k not in ("PYTHONPATH", "VIRTUAL_ENV")}
    env["PIP_DISABLE_PIP_VERSION_CHECK"] = "1"
    with log.open("wb") as out:
        process = subprocess.Popen(
            [sys.executable, str(ROOT / "tools" / "check_lower_bounds.py"), "--keep", str(scratch / "env")],
            cwd=scratch, env=env, stdout=out, stderr=subprocess.STDOUT, preexec_fn=_lower_priority)
    session.config.stash[background_runs] = BackgroundRun(process, log, scratch)


@pytest.fixture
def lower_bounds_run(request: pytest.FixtureRequest) -> BackgroundRun:
    """The background run of tools/check_lower_bounds.py started after collection."""
    run = request.config.stash.get(background_runs, None)
    assert run is not None, "tests/conftest.py did not start the lower-bounds run"
    return run


def pytest_unconfigure(config: pytest.Config) -> None:
    run = config.stash.get(background_runs, None)
    if run is None:
        return
    if run.process.poll() is None:  # the suite stopped early (-x, Ctrl-C): no orphan left behind
        run.process.kill()
        run.process.wait()
    shutil.rmtree(run.scratch, ignore_errors=True)

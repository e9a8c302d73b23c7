"""The oldest dependency releases pyproject.toml allows really work.

tests/conftest.py starts tools/check_lower_bounds.py in the background once the tests
are collected: it installs every runtime dependency at exactly its lower bound into a
fresh environment, installs Zeffir's wheel there without dependencies and runs the core
and reference tests against it. This test waits for that run and checks its outcome.
If the package index cannot be reached, it skips and says so.
"""

from __future__ import annotations

import re
import subprocess
import time
import tomllib
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
#: Install (about 70 s from an empty pip cache) and the core tests (about 100 s on one core).
WAIT_SECONDS = 900
_OFFLINE = re.compile(r"NewConnectionError|Network is unreachable|Temporary failure in name resolution"
                      r"|Name or service not known|ConnectTimeoutError|Max retries exceeded|ProxyError")


def _pins() -> list[str]:
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    return [dependency.split(">=")[0].strip() + "==" + dependency.split(">=")[1].split(",")[0].strip()
            for dependency in project["dependencies"]]


def test_core_tests_pass_on_the_lower_bounds(lower_bounds_run) -> None:
    run = lower_bounds_run
    start = time.perf_counter()
    try:
        status = run.process.wait(timeout=WAIT_SECONDS)
    except subprocess.TimeoutExpired as error:
        pytest.fail(f"the lower-bounds run did not finish within {WAIT_SECONDS} s ({error})\n"
                    + run.log.read_text(encoding="utf-8", errors="replace")[-4000:])
    output = run.log.read_text(encoding="utf-8", errors="replace")
    if status != 0 and _OFFLINE.search(output):
        pytest.skip("the package index cannot be reached, so the lower bounds cannot be installed")
    assert status == 0, output[-6000:]
    # Every dependency was installed at its bound (the tool also refuses otherwise).
    for pin in _pins():
        name, _, version = pin.partition("==")
        assert re.search(rf"^installed: {re.escape(name)}=={re.escape(version)}(\.0)*$", output, re.M), \
            f"{pin} not installed:\n{output[-3000:]}"
    summary = output.strip().splitlines()[-1]
    assert re.search(r"\d+ passed", summary) and "failed" not in summary and "error" not in summary, summary
    ready = re.search(r"environment ready in (\d+) s", output)
    print(f"lower bounds: {summary}; environment {ready.group(1) if ready else '?'} s;"
          f" waited {time.perf_counter() - start:.0f} s at the end of the suite")

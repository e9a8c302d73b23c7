"""Install the oldest dependency releases pyproject.toml allows, then run tests against them.

Usage::

    python tools/check_lower_bounds.py            # tests/core and tests/reference
    python tools/check_lower_bounds.py --all      # the whole suite
    python tools/check_lower_bounds.py --keep DIR # reuse or keep the environment in DIR

For every runtime dependency ``name>=X`` the script installs ``name==X`` (and the test
tools) into a fresh virtual environment. It builds Zeffir's wheel and installs that
wheel without its dependencies, so pip cannot raise any pin, and it runs pytest from a
temporary directory with the repository's pytest settings. The exit status is pytest's.

``python -m pytest`` runs it as one test (tests/test_lower_bounds_env.py): tests/conftest.py
starts it in the background as soon as the tests are collected, on the core the suite
leaves idle, and the test waits for its result. Run it by hand when you change a
dependency bound (DEVELOPERS.md).
"""

from __future__ import annotations

import argparse
import os
import re
import subprocess
import sys
import tempfile
import time
import tomllib
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
#: The tests run against the lower bounds by default: the Qt-free core and the references.
CORE_TESTS = ("tests/core", "tests/reference")

_REQUIREMENT = re.compile(r"^\s*([A-Za-z0-9][A-Za-z0-9._-]*)\s*(.*)$")


def lower_bound_pins(dependencies: list[str]) -> list[str]:
    """Turn each ``name>=X[,...]`` requirement into ``name==X``.

    Parameters
    ----------
    dependencies : list of str
        The ``[project] dependencies`` of pyproject.toml.

    Returns
    -------
    list of str
        One exact pin per dependency, in the same order.

    Raises
    ------
    ValueError
        If a requirement has no ``>=`` bound, or excludes its own lower bound: an
        unbounded dependency cannot be checked, and the bound must be installable.
    """
    pins = []
    for requirement in dependencies:
        match = _REQUIREMENT.match(requirement.split(";")[0])
        if match is None:
            raise ValueError(f"cannot read the requirement {requirement!r}")
        name, spec = match.groups()
        clauses = [c.strip() for c in spec.split(",") if c.strip()]
        lows = [c[2:].strip() for c in clauses if c.startswith(">=")]
        if len(lows) != 1:
            raise ValueError(f"{requirement!r} needs exactly one '>=' lower bound")
        if f"!={lows[0]}" in clauses:
            raise ValueError(f"{requirement!r} excludes its own lower bound")
        pins.append(f"{name}=={lows[0]}")
    return pins


def _run(args: list[str | Path], cwd: Path) -> None:
    print("$", " ".join(str(a) for a in args), flush=True)
    subprocess.run([str(a) for a in args], cwd=cwd, check=True)


def _unpinned(python: Path, pins: list[str], cwd: Path) -> list[str]:
    """The pins the environment does not honour, as ``name: installed X, pinned Y``.

    Prints one ``installed: name==version`` line per pinned distribution.
    """
    listing = subprocess.run([str(python), "-m", "pip", "list", "--format=freeze"], cwd=cwd,
                             capture_output=True, text=True, check=True).stdout
    installed = {}
    for line in listing.splitlines():
        name, _, version = line.partition("==")
        installed[name.lower().replace("_", "-")] = version
    wrong = []
    for pin in pins:
        name, _, wanted = pin.partition("==")
        have = installed.get(name.lower().replace("_", "-"))
        print(f"installed: {name}=={have}", flush=True)
        # "1.26" pins 1.26.0: compare release numbers padded with zeros.
        if have is None or _release(have) != _release(wanted):
            wrong.append(f"{name}: installed {have}, pinned {wanted}")
    return wrong


def _release(version: str) -> tuple[int, ...]:
    numbers = [int(part) for part in re.findall(r"\d+", version.split("+")[0])[:4]]
    return tuple(numbers + [0] * (4 - len(numbers)))


def main(argv: list[str] | None = None) -> int:
    """Build the environment of lower bounds, run the tests there and return pytest's status."""
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--all", action="store_true", help="run the whole suite, not only core and reference")
    parser.add_argument("--keep", type=Path, metavar="DIR",
                        help="build the environment in DIR and keep it (reused if it exists)")
    args = parser.parse_args(argv)

    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
    pins = lower_bound_pins(project["project"]["dependencies"])
    # The test extra as declared: the tools' newest releases are fine, they are not checked here.
    test_tools = project["project"]["optional-dependencies"]["test"]
    print("lower bounds:", " ".join(pins), flush=True)

    with tempfile.TemporaryDirectory(prefix="zeffir-lower-bounds-") as scratch:
        base = args.keep.resolve() if args.keep else Path(scratch)
        venv = base / "venv"
        python = venv / "bin" / "python"
        start = time.perf_counter()
        if not python.exists():
            _run([sys.executable, "-m", "venv", venv], ROOT)
        _run([python, "-m", "pip", "install", "--quiet", *pins, *test_tools], base)
        wheels = base / "wheels"
        _run([python, "-m", "pip", "wheel", "--quiet", "--no-deps", "-w", wheels, ROOT], base)
        wheel = max(wheels.glob("zeffir-*.whl"), key=lambda p: p.stat().st_mtime)
        _run([python, "-m", "pip", "install", "--quiet", "--no-deps", "--force-reinstall", wheel], base)
        _run([python, "-m", "pip", "check"], base)
        wrong = _unpinned(python, pins, base)
        if wrong:
            print("not installed at the lower bound:", ", ".join(wrong), flush=True)
            return 1
        print(f"environment ready in {time.perf_counter() - start:.0f} s", flush=True)

        tests = [ROOT / "tests"] if args.all else [ROOT / t for t in CORE_TESTS]
        env = {k: v for k, v in os.environ.items() if k != "PYTHONPATH"}
        env.setdefault("QT_QPA_PLATFORM", "offscreen")
        # Run from outside the repository so that only the installed wheel can be imported.
        work = base / "work"
        work.mkdir(exist_ok=True)
        command = [str(python), "-m", "pytest", "-q", "-p", "no:cacheprovider",
                   "-c", str(ROOT / "pyproject.toml"), "--rootdir", str(ROOT), *map(str, tests)]
        print("$", " ".join(command), flush=True)
        return subprocess.run(command, cwd=work, env=env, check=False).returncode


if __name__ == "__main__":
    sys.exit(main())

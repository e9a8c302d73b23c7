"""What the commands share: exit statuses, unit names, input errors, spec splitting."""

from __future__ import annotations

import argparse
import math
from collections.abc import Sequence

#: Exit statuses (also in ``zeffir --help`` and the README).
EXIT_OK = 0

EXIT_BAD_INPUT = 2

EXIT_CANNOT_COMPUTE = 3

EXIT_INTERRUPTED = 130

#: The layout version of the JSON objects ``table --json`` and ``terms --json`` print.
JSON_FORMAT_VERSION = 1

_EXIT_CODES_TEXT = (
    "exit status:\n"
    "  0    success\n"
    "  2    bad input or usage (the reason on one line)\n"
    "  3    the model cannot compute this configuration (the reason on one line)\n"
    "  130  interrupted (Ctrl-C): one line, no partial file"
)

#: The window's and session files' unit names, and the older command-line ones.
_UNIT_NAMES = {"bohr": "atomic", "atomic": "atomic", "angstrom": "angstrom-ev", "angstrom-ev": "angstrom-ev"}

#: What ``--units`` accepts: the session's names first.
UNIT_CHOICES = ("bohr", "angstrom", "atomic", "angstrom-ev")

class _UnitsAction(argparse.Action):
    """Store ``--units`` as the unit system it names (bohr → atomic, angstrom → angstrom-ev)."""

    def __call__(self, parser: argparse.ArgumentParser, namespace: argparse.Namespace,
                 values: object, option_string: str | None = None) -> None:
        setattr(namespace, self.dest, _UNIT_NAMES[str(values)])


class _InputError(Exception):
    """A command-line option is wrong; the message names the option."""


def _finite_or_none(value: float | None) -> float | None:
    return None if value is None or not math.isfinite(value) else float(value)


def _length_in_bohr(value: float | None, units: str, option: str) -> float | None:
    from zeffir.core import ANGSTROM_PER_BOHR

    if value is None:
        return None
    if not math.isfinite(value):
        raise _InputError(f"{option}: {value} is not a finite number")
    return value if units == "atomic" else value / ANGSTROM_PER_BOHR


def _angstrom_per_bohr() -> float:
    from zeffir.core import ANGSTROM_PER_BOHR

    return float(ANGSTROM_PER_BOHR)


def split_specs(tokens: Sequence[str]) -> list[str]:
    """Group command-line words into specs: a configuration word continues the atom before it.

    Examples
    --------
    >>> split_specs(["Fe", "Fe3+", "C", "1s2", "2s1", "2p3", "Na [Ne] 4d1"])
    ['Fe', 'Fe3+', 'C 1s2 2s1 2p3', 'Na [Ne] 4d1']
    """
    import re

    continuation = re.compile(r"^(\[[A-Z][a-z]?\]|\d+[spdfghik]\d*)$")
    specs: list[list[str]] = []
    for token in tokens:
        word = token.strip()
        if not word:
            continue
        if specs and " " not in word and continuation.match(word):
            specs[-1].append(word)
        else:
            specs.append([word])
    return [" ".join(words) for words in specs]

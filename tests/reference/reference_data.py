"""Reading the reference tables in tests/reference/data/.

Each table is a CSV file whose leading ``#`` lines name its source (the publication, and the
copy its digits were checked against), in the style of resources/data/*.csv; the first line
that does not start with ``#`` holds the column names.
"""

from __future__ import annotations

import csv
from pathlib import Path

DATA = Path(__file__).resolve().parent / "data"


def header(name: str) -> list[str]:
    """The leading comment lines of a data file, without their ``#``."""
    lines = []
    for line in (DATA / name).read_text(encoding="utf-8").splitlines():
        if not line.startswith("#"):
            break
        lines.append(line[1:].strip())
    return lines


def rows(name: str) -> list[dict[str, str]]:
    """The rows of a data file, keyed by column name; the comment lines are skipped."""
    text = (DATA / name).read_text(encoding="utf-8").splitlines()
    body = [line for line in text if not line.startswith("#")]
    return list(csv.DictReader(body))

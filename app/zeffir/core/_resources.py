"""Locate the data files shipped in ``resources/`` (installed as ``zeffir.resources``)."""

from __future__ import annotations

import csv
import io
from importlib import resources
from importlib.abc import Traversable

__all__ = ["read_table", "resource_path"]


def resource_path(*parts: str) -> Traversable:
    """Return a handle to a shipped resource, e.g. ``resource_path("data", "elements.csv")``."""
    node: Traversable = resources.files("zeffir.resources")
    for part in parts:
        node = node / part
    return node


def read_table(*parts: str) -> list[dict[str, str]]:
    """Read a shipped CSV table, skipping the ``#`` header lines that name its source.

    Parameters
    ----------
    *parts : str
        Path components below ``resources/``.

    Returns
    -------
    list of dict
        One mapping per data row, keyed by the column names.
    """
    text = resource_path(*parts).read_text(encoding="utf-8")
    body = "\n".join(line for line in text.splitlines() if not line.startswith("#"))
    return list(csv.DictReader(io.StringIO(body)))

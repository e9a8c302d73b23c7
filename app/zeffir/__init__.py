"""Zeffir: orbitals, densities and figures for many-electron atoms.

The computation core lives in :mod:`zeffir.core` and needs only numpy and scipy.

The version is written once, in ``pyproject.toml``; ``__version__`` reads it from the
installed package's metadata. A source tree that was never installed reads the same
``pyproject.toml`` instead, and anything else reports ``0+unknown``.
"""

from __future__ import annotations

import tomllib
from importlib import metadata
from pathlib import Path

__all__ = ["__version__"]

#: Reported when neither installed metadata nor the source tree's pyproject.toml is found.
UNKNOWN_VERSION = "0+unknown"


def _source_tree_version(pyproject: Path) -> str:
    """Return the version in ``pyproject`` if it is Zeffir's, else :data:`UNKNOWN_VERSION`.

    Parameters
    ----------
    pyproject : Path
        Where the source tree's ``pyproject.toml`` would be.

    Returns
    -------
    str
        The static ``[project] version``, or :data:`UNKNOWN_VERSION` when the file is
        missing, unreadable or describes another project.
    """
    try:
        project = tomllib.loads(pyproject.read_text(encoding="utf-8")).get("project", {})
    except (OSError, tomllib.TOMLDecodeError):
        return UNKNOWN_VERSION
    version = project.get("version")
    if project.get("name") != "zeffir" or not isinstance(version, str):
        return UNKNOWN_VERSION
    return version


def _find_version() -> str:
    """Return the installed distribution's version, or the source tree's (see the module notes)."""
    try:
        return metadata.version("zeffir")
    except metadata.PackageNotFoundError:
        # app/zeffir/__init__.py -> the repository root holds pyproject.toml.
        return _source_tree_version(Path(__file__).resolve().parents[2] / "pyproject.toml")


__version__: str = _find_version()

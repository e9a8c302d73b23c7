"""A disk cache of computed orbital sets, keyed by configuration, model and Zeffir version.

Self-consistent and variational models take seconds per heavy atom; a sweep over the
periodic table is worth keeping. Each entry is one file named by the SHA-256 of its
key (Z, charge, the full configuration, the model name), in a directory per Zeffir
version, so a new release never reads what an older one computed. An entry holds the
pickled :class:`~zeffir.core.orbitals.OrbitalSet`, or the reason the model refused
the configuration (a refusal is as deterministic as a result). Files are written
atomically (a temporary file beside the entry, then a rename); an entry that cannot
be read is treated as missing and computed again.

The cache lives in the user's cache directory: ``$ZEFFIR_CACHE_DIR`` if set, else
``$XDG_CACHE_HOME/zeffir`` or ``~/.cache/zeffir`` (Linux and other Unix),
``~/Library/Caches/zeffir`` (macOS) or ``%LOCALAPPDATA%\\zeffir\\Cache`` (Windows).
Pickle files are only ever read from this directory, which only the user writes.
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import pickle
import sys
import tempfile
from dataclasses import dataclass
from pathlib import Path

from zeffir import __version__
from zeffir.core.config import Configuration
from zeffir.core.orbitals import OrbitalSet

__all__ = ["CacheEntry", "DiskCache", "default_cache_directory"]

#: Bumped when the layout of an entry changes.
_ENTRY_FORMAT = 3  # 2: orbital sets carry energy_components; 3: subshells carry components


def default_cache_directory() -> Path:
    """The user's cache directory for Zeffir (see the module notes).

    Returns
    -------
    Path
        Not created until something is stored.

    Examples
    --------
    >>> import os
    >>> before = os.environ.get("ZEFFIR_CACHE_DIR")
    >>> os.environ["ZEFFIR_CACHE_DIR"] = "/tmp/zeffir-cache-example"
    >>> str(default_cache_directory())
    '/tmp/zeffir-cache-example'
    >>> if before is None:
    ...     del os.environ["ZEFFIR_CACHE_DIR"]
    ... else:
    ...     os.environ["ZEFFIR_CACHE_DIR"] = before
    """
    override = os.environ.get("ZEFFIR_CACHE_DIR")
    if override:
        return Path(override).expanduser().absolute()
    if sys.platform == "win32":
        base = Path(os.environ.get("LOCALAPPDATA") or Path.home() / "AppData" / "Local")
        return base / "zeffir" / "Cache"
    if sys.platform == "darwin":
        return Path.home() / "Library" / "Caches" / "zeffir"
    xdg = os.environ.get("XDG_CACHE_HOME")
    return (Path(xdg) if xdg and Path(xdg).is_absolute() else Path.home() / ".cache") / "zeffir"


@dataclass(frozen=True)
class CacheEntry:
    """What the cache holds for one configuration under one model.

    Attributes
    ----------
    orbitals : OrbitalSet or None
        The result, or None when the model refused.
    refusal : str or None
        The model's reason when it refused.
    """

    orbitals: OrbitalSet | None
    refusal: str | None = None


class DiskCache:
    """Orbital sets on disk, one file per (configuration, model), per Zeffir version.

    Parameters
    ----------
    directory : path, optional
        Root directory; :func:`default_cache_directory` when omitted.

    Examples
    --------
    A stored result comes back equal, and a refusal comes back as the reason:

    >>> import tempfile
    >>> from zeffir.core import build, parse_spec
    >>> cache = DiskCache(tempfile.mkdtemp())
    >>> neon = parse_spec("Ne")
    >>> cache.get(neon, "slater") is None
    True
    >>> cache.put(neon, "slater", CacheEntry(build(neon, "slater")))
    >>> cache.get(neon, "slater").orbitals.orbital("2p").z_eff
    5.85
    """

    def __init__(self, directory: str | os.PathLike[str] | None = None) -> None:
        root = Path(directory) if directory is not None else default_cache_directory()
        self.directory = root.expanduser().absolute() / f"v{__version__}"

    @staticmethod
    def key(configuration: Configuration, model: str) -> str:
        """Hex SHA-256 of what identifies an entry (Z, charge, configuration, model)."""
        text = f"{_ENTRY_FORMAT}|{configuration.Z}|{configuration.charge}|{configuration.text}|{model}"
        return hashlib.sha256(text.encode("utf-8")).hexdigest()

    def _path(self, configuration: Configuration, model: str) -> Path:
        return self.directory / f"{self.key(configuration, model)}.pickle"

    def get(self, configuration: Configuration, model: str) -> CacheEntry | None:
        """The stored entry, or None when there is none or it cannot be read."""
        path = self._path(configuration, model)
        try:
            with path.open("rb") as handle:
                stored = pickle.load(handle)
        except FileNotFoundError:
            return None
        except Exception:  # a damaged or foreign file: compute again, and replace it then
            return None
        if not isinstance(stored, dict) or stored.get("key") != path.stem:
            return None
        entry = stored.get("entry")
        return entry if isinstance(entry, CacheEntry) else None

    def put(self, configuration: Configuration, model: str, entry: CacheEntry) -> None:
        """Store ``entry`` atomically; a cache that cannot be written is skipped silently."""
        path = self._path(configuration, model)
        try:
            path.parent.mkdir(parents=True, exist_ok=True)
            with tempfile.NamedTemporaryFile("wb", dir=path.parent, prefix=".tmp-", suffix=".pickle",
                                             delete=False) as handle:
                pickle.dump({"key": path.stem, "entry": entry}, handle, protocol=pickle.HIGHEST_PROTOCOL)
                temporary = Path(handle.name)
            os.replace(temporary, path)
        except OSError:  # read-only or full disk: the result is still returned, just not kept
            with contextlib.suppress(OSError, UnboundLocalError):
                temporary.unlink()

    def clear(self) -> int:
        """Remove every entry of this version; return how many were removed."""
        removed = 0
        for path in self.directory.glob("*.pickle"):
            with contextlib.suppress(OSError):
                path.unlink()
                removed += 1
        return removed

"""Write files atomically: a reader sees the old file or the complete new one, never a part.

Data go to a temporary file in the target's directory (so the final rename stays on
one file system), are flushed and synced to disk, and the temporary file then
replaces the target with :func:`os.replace`. On any failure the temporary file is
removed and the target is left as it was.

A path that is a symbolic link is written through: the file the link points to is
replaced (its temporary file beside it) and the link stays a link. A dangling link
creates its target when the target's folder exists.
"""

from __future__ import annotations

import contextlib
import os
import secrets
import zlib
from collections.abc import Iterator
from pathlib import Path
from typing import BinaryIO

from zeffir.export._errors import ExportError

__all__ = ["MAX_NAME_BYTES", "atomic_file", "atomic_path", "cannot_write", "check_target", "resolve_link",
           "write_atomic"]

_ATTEMPTS = 16
#: Links followed before a chain is taken for a loop (Linux's own limit is 40).
_MAX_LINKS = 40


def cannot_write(path: str | os.PathLike[str], error: OSError) -> ExportError:
    """The error to raise when ``path`` cannot be written: ``'<path>: cannot write (<reason>)'``."""
    reason = error.strerror or str(error) or type(error).__name__
    return ExportError(f"{os.fspath(path)}: cannot write ({reason})")


#: Longest file name (bytes) the common file systems take (ext4, APFS, NTFS: 255).
MAX_NAME_BYTES = 255


def _check_target(path: Path) -> None:
    if path.name in ("", ".", ".."):
        raise ExportError(f"{path}: cannot write (not a file name)")
    size = len(os.fsencode(path.name))
    if size > MAX_NAME_BYTES:  # first: asking the file system about such a name fails
        raise ExportError(f"{path}: cannot write (the file name is {size} bytes long; at most "
                          f"{MAX_NAME_BYTES})")
    if path.is_dir():
        raise ExportError(f"{path}: cannot write (Is a directory)")
    if path.exists() and not path.is_file():
        # A FIFO, a device or a socket: replacing it with a regular file would destroy it,
        # and writing into it could block forever.
        raise ExportError(f"{path}: cannot write (not a regular file)")


def check_target(path: str | os.PathLike[str]) -> None:
    """Refuse early a path :func:`atomic_path` would refuse (name, folder, special file).

    Callers that compute for a while before writing (a figure, a trend) call it first,
    so a bad ``--out`` is reported before the work, not after.

    Raises
    ------
    ExportError
        With the reason, e.g. ``'<path>: cannot write (not a regular file)'``.
    """
    requested = Path(path)
    _check_target(requested)
    target = resolve_link(requested)
    if target != requested:
        _check_target(target)
    folder = target.parent if str(target.parent) else Path(".")
    if not folder.is_dir():
        raise ExportError(f"{requested}: cannot write (the folder {folder} does not exist)")


def resolve_link(path: Path) -> Path:
    """The file that writing ``path`` must replace: ``path`` itself, or where its link points.

    Only the last component is followed (a linked folder is an ordinary folder here),
    link by link, so a relative link is taken relative to the folder holding it.

    Parameters
    ----------
    path : Path
        The path asked for.

    Returns
    -------
    Path
        ``path`` when it is not a symbolic link, else the end of its chain of links
        (which need not exist yet).

    Raises
    ------
    ExportError
        A loop of links, or a dangling link whose target's folder does not exist.
    """
    current = path
    for _ in range(_MAX_LINKS):
        if not current.is_symlink():
            break
        try:
            link = Path(os.readlink(current))
        except OSError as error:
            raise cannot_write(path, error) from error
        current = link if link.is_absolute() else current.parent / link
    else:
        raise ExportError(f"{path}: cannot write (a loop of symbolic links)")
    if current != path and not current.exists() and not current.parent.is_dir():
        raise ExportError(f"{path}: cannot write (it is a symbolic link to {current}, "
                          f"whose folder {current.parent} does not exist)")
    return current


def _open_temporary(path: Path, requested: Path) -> tuple[Path, int]:
    """Create a new, empty temporary file beside ``path``; return it and its descriptor.

    ``os.open`` with mode 0o666 lets the user's umask decide the permissions, as for
    any ordinary new file (``tempfile.mkstemp`` would make it private, 0o600).
    """
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    for _ in range(_ATTEMPTS):
        # Keep the requested suffix last, for writers that pick a format from it.
        # The stem is shortened where the temporary name would pass the file-name limit.
        room = MAX_NAME_BYTES - len(os.fsencode(f"..{'0' * 8}.tmp{requested.suffix}"))
        stem = os.fsdecode(os.fsencode(path.stem)[:max(room, 1)]).rstrip("\ufffd") or "z"
        temporary = path.with_name(f".{stem}.{secrets.token_hex(4)}.tmp{requested.suffix}")
        try:
            return temporary, os.open(temporary, flags, 0o666)
        except FileExistsError:
            continue
        except OSError as error:
            raise cannot_write(requested, error) from error
    raise ExportError(f"{requested}: cannot write (no free temporary name in {path.parent})")


def _sync_file(temporary: Path) -> None:
    # Writers that take a path closed the file already; reopen it to sync its data.
    fd = os.open(temporary, os.O_RDWR | getattr(os, "O_BINARY", 0))
    try:
        os.fsync(fd)
    finally:
        os.close(fd)


def _sync_directory(directory: Path) -> None:
    """Make the rename itself durable where the platform allows it (POSIX)."""
    try:
        fd = os.open(directory, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _discard(temporary: Path) -> None:
    with contextlib.suppress(FileNotFoundError):
        temporary.unlink()


def _commit(temporary: Path, path: Path, requested: Path) -> None:
    try:
        os.replace(temporary, path)
    except OSError as error:
        raise cannot_write(requested, error) from error
    _sync_directory(path.parent if str(path.parent) else Path("."))


@contextlib.contextmanager
def atomic_path(path: str | os.PathLike[str]) -> Iterator[Path]:
    """Give a writer a temporary path that replaces ``path`` when the block succeeds.

    For writers that want a file name rather than a file object. The temporary
    name ends with the target's suffix. When ``path`` is a symbolic link, the file it
    points to is replaced and the link is kept (see :func:`resolve_link`).

    Parameters
    ----------
    path : str or path-like
        The file to create or replace.

    Yields
    ------
    Path
        An empty temporary file in the same directory; write it, closing it before
        the block ends.

    Raises
    ------
    ExportError
        ``'<path>: cannot write (<reason>)'`` if the file system refuses; the target
        is then untouched and no temporary file is left behind. Any other exception
        raised inside the block also removes the temporary file and propagates.
    """
    requested = Path(path)
    _check_target(requested)
    target = resolve_link(requested)
    if target != requested:
        _check_target(target)
    temporary, fd = _open_temporary(target, requested)
    os.close(fd)
    try:
        yield temporary
        _sync_file(temporary)
        _commit(temporary, target, requested)
    except OSError as error:
        _discard(temporary)
        if isinstance(error, ExportError):
            raise
        raise cannot_write(requested, error) from error
    except zlib.error as error:
        # Compressing writers (PDF, PNG, NPZ) report a failed write, e.g. a full disk,
        # as a zlib error rather than an OSError.
        _discard(temporary)
        if _out_of_space(target.parent):
            reason = f"no space left on the device; the compressor stopped: {error}"
        else:
            reason = f"the compressed data could not be written out: {error}; is the disk full?"
        raise ExportError(f"{requested}: cannot write ({reason})") from error
    except BaseException:
        _discard(temporary)
        raise


def _out_of_space(folder: Path, room: int = 1 << 20) -> bool:
    """True if the file system holding ``folder`` has less than ``room`` bytes free for us."""
    try:
        stats = os.statvfs(folder)
    except (OSError, AttributeError):  # no statvfs (Windows) or the folder is gone
        return False
    return stats.f_bavail * stats.f_frsize < room


@contextlib.contextmanager
def atomic_file(path: str | os.PathLike[str]) -> Iterator[BinaryIO]:
    """Give a writer a binary file object whose content replaces ``path`` when the block succeeds.

    Parameters
    ----------
    path : str or path-like
        The file to create or replace.

    Yields
    ------
    BinaryIO
        A temporary file in the same directory, opened for binary writing. It is
        flushed, synced and closed when the block ends.

    Raises
    ------
    ExportError
        As for :func:`atomic_path`.
    """
    # The stream is closed before atomic_path syncs and commits the temporary file.
    with atomic_path(path) as temporary, open(temporary, "wb") as stream:
        yield stream


def write_atomic(path: str | os.PathLike[str], data: bytes | str) -> Path:
    """Write ``data`` to ``path`` atomically (text is encoded as UTF-8).

    Parameters
    ----------
    path : str or path-like
        The file to create or replace.
    data : bytes or str
        The complete content.

    Returns
    -------
    Path
        The path written.

    Raises
    ------
    ExportError
        ``'<path>: cannot write (<reason>)'``; nothing is left half-written.

    Examples
    --------
    >>> import tempfile, pathlib
    >>> folder = pathlib.Path(tempfile.mkdtemp())
    >>> write_atomic(folder / "a.txt", "r / bohr").read_text(encoding="utf-8")
    'r / bohr'
    >>> sorted(p.name for p in folder.iterdir())
    ['a.txt']
    """
    payload = data.encode("utf-8") if isinstance(data, str) else bytes(data)
    target = Path(path)
    with atomic_file(target) as stream:
        stream.write(payload)
    return target

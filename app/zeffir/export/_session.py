"""Session files: the view state saved as JSON under our own suffix, ``.zeffir``.

A session file is one JSON object::

    {"kind": "zeffir-session", "version": 1, "saved_by": "zeffir 0.1.0", "state": {...}}

where ``state`` is :meth:`ViewState.to_dict`. Reading checks every layer and
raises :class:`SessionError` naming the problem; the caller's state is never
touched, because a new state is returned only when everything is valid.
"""

from __future__ import annotations

import json
import os
from pathlib import Path
from typing import Any, Final

from zeffir import __version__
from zeffir.export._atomic import write_atomic
from zeffir.export._errors import ExportError, SessionError
from zeffir.state import StateError, ViewState

__all__ = ["SESSION_KIND", "SESSION_SUFFIX", "SESSION_VERSION", "load_session", "save_session"]

#: File suffix of session files.
SESSION_SUFFIX: Final[str] = ".zeffir"
#: Format version written, and the newest one this Zeffir reads.
SESSION_VERSION: Final[int] = 1
#: The ``kind`` field that marks a file as a Zeffir session.
SESSION_KIND: Final[str] = "zeffir-session"
#: A session holds a few kilobytes; anything far larger is not one (and is not read whole).
MAX_SESSION_BYTES: Final[int] = 1 << 20


def save_session(path: str | os.PathLike[str], state: ViewState) -> Path:
    """Save ``state`` as a session file, atomically.

    Parameters
    ----------
    path : str or path-like
        Where to write; the suffix is not changed (the window offers ``.zeffir``).
    state : ViewState
        Must be valid, so that the file can be read back.

    Returns
    -------
    Path
        The file written.

    Raises
    ------
    SessionError
        The state is invalid (naming the field) or the file cannot be written; an
        existing file is then left as it was.
    """
    target = Path(path)
    try:
        state.validated()
    except StateError as error:
        raise SessionError(f"{target}: cannot save an invalid state: {error}") from None
    document = {
        "kind": SESSION_KIND,
        "version": SESSION_VERSION,
        "saved_by": f"zeffir {__version__}",
        "state": state.to_dict(),
    }
    text = json.dumps(document, indent=2, ensure_ascii=False, allow_nan=False) + "\n"
    try:
        return write_atomic(target, text)
    except ExportError as error:
        raise SessionError(str(error)) from None


def load_session(path: str | os.PathLike[str]) -> ViewState:
    """Read a session file and return the validated state it holds.

    Parameters
    ----------
    path : str or path-like
        A file written by :func:`save_session`.

    Returns
    -------
    ViewState
        A new, validated state (the subshell choice reconciled with the spec).

    Raises
    ------
    SessionError
        With a message that starts with the path and says what is wrong: the file
        cannot be read; it is not a Zeffir session (not JSON, or JSON of another
        kind); it was made by a newer Zeffir; or its state is invalid (naming the
        field, e.g. ``slice.resolution``).
    """
    source = Path(path)
    document = _read_document(source)
    kind = document.get("kind")
    if kind != SESSION_KIND:
        found = "no 'kind' field" if kind is None else f"its kind is {kind!r}"
        raise SessionError(f"{source}: not a Zeffir session ({found}; expected {SESSION_KIND!r})")
    version = document.get("version")
    if isinstance(version, bool) or not isinstance(version, int) or version < 1:
        raise SessionError(f"{source}: not a Zeffir session (version {version!r} is not a whole "
                           "number from 1)")
    if version > SESSION_VERSION:
        raise SessionError(f"{source}: made by a newer Zeffir (version {version}); "
                           f"this one reads up to {SESSION_VERSION}")
    if "state" not in document:
        raise SessionError(f"{source}: invalid session: no 'state' field")
    try:
        return ViewState.from_dict(document["state"])
    except StateError as error:
        raise SessionError(f"{source}: invalid session: {error}") from None


def _read_document(source: Path) -> dict[str, Any]:
    try:
        with source.open("rb") as stream:
            raw = stream.read(MAX_SESSION_BYTES + 1)
    except OSError as error:
        reason = error.strerror or str(error)
        raise SessionError(f"{source}: cannot read ({reason})") from None
    if len(raw) > MAX_SESSION_BYTES:
        raise SessionError(f"{source}: not a Zeffir session (larger than {MAX_SESSION_BYTES // 1024} KiB)")
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        raise SessionError(f"{source}: not a Zeffir session (not UTF-8 text)") from None
    try:
        document = json.loads(text)
    except json.JSONDecodeError as error:
        raise SessionError(f"{source}: not a Zeffir session: invalid JSON at line {error.lineno}, "
                           f"column {error.colno} ({error.msg})") from None
    except RecursionError:
        raise SessionError(f"{source}: not a Zeffir session: JSON nested too deeply") from None
    if not isinstance(document, dict):
        raise SessionError(f"{source}: not a Zeffir session (expected a JSON object, "
                           f"found {type(document).__name__})")
    return document

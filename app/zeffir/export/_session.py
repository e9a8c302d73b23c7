"""Session files: the view state saved as JSON under our own suffix, ``.zeffir``.

A session file is one JSON object::

    {"kind": "zeffir-session", "version": 1, "saved_by": "zeffir 0.1.0", "state": {...}}

where ``state`` is :meth:`ViewState.to_dict`. Reading checks every layer and
raises :class:`SessionError` naming the problem; the caller's state is never
touched, because a new state is returned only when everything is valid.

What a file may hold: at most :data:`MAX_SESSION_BYTES` (2 MiB; refused before it
is parsed), UTF-8 without a byte-order mark, one JSON object with no key twice in
any object and nested at most :data:`MAX_NESTING` deep. Every field of ``state`` is
then checked for its type (:meth:`ViewState.from_dict`) and its range
(:meth:`ViewState.validated`); ``NaN``/``Infinity`` are read but refused wherever a
number is used, and an integer literal of more than :data:`_MAX_DIGITS` digits is
read as ±10**100 so that the field's range check names it (converting it exactly
would be quadratic, and Python refuses past 4300 digits anyway).
"""

from __future__ import annotations

import json
import math
import os
from pathlib import Path
from typing import Any, Final

from zeffir import __version__
from zeffir.export._atomic import write_atomic
from zeffir.export._errors import ExportError, SessionError
from zeffir.state import StateError, ViewState

__all__ = [
    "MAX_NESTING",
    "MAX_SESSION_BYTES",
    "SESSION_KIND",
    "SESSION_SUFFIX",
    "SESSION_VERSION",
    "load_session",
    "save_session",
]

#: File suffix of session files.
SESSION_SUFFIX: Final[str] = ".zeffir"
#: Format version written, and the newest one this Zeffir reads.
SESSION_VERSION: Final[int] = 1
#: The ``kind`` field that marks a file as a Zeffir session.
SESSION_KIND: Final[str] = "zeffir-session"
#: A session holds a few kilobytes; a file larger than this (2 MiB) is refused before parsing.
MAX_SESSION_BYTES: Final[int] = 2 << 20
#: Deepest nesting of arrays and objects a session file may have (a state needs 4).
MAX_NESTING: Final[int] = 32
#: Integer literals longer than this are read as ±10**100 (out of every field's range).
_MAX_DIGITS: Final[int] = 100


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
        found = "no 'kind' field" if "kind" not in document else f"its kind is {_shown(kind)}"
        raise SessionError(f"{source}: not a Zeffir session ({found}; expected {SESSION_KIND!r})")
    version = document.get("version")
    if isinstance(version, bool) or not isinstance(version, int) or not 1 <= version <= 10**6:
        raise SessionError(f"{source}: not a Zeffir session (version {_shown(version)} is not a "
                           "whole number from 1)")
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
    """The file's top-level JSON object, or :class:`SessionError` for any file-level problem."""
    if source.exists() and not source.is_file():
        # A FIFO or a device: opening it could block forever, and it holds no session.
        raise SessionError(f"{source}: cannot read (not a regular file)")
    try:
        with source.open("rb") as stream:
            raw = stream.read(MAX_SESSION_BYTES + 1)
    except OSError as error:
        reason = error.strerror or str(error)
        raise SessionError(f"{source}: cannot read ({reason})") from None
    if len(raw) > MAX_SESSION_BYTES:
        raise SessionError(f"{source}: not a Zeffir session (larger than "
                           f"{MAX_SESSION_BYTES // (1 << 20)} MiB)")
    if not raw.strip():
        raise SessionError(f"{source}: not a Zeffir session (the file is empty)")
    if raw.startswith(b"\xef\xbb\xbf"):
        raw = raw[3:]  # a UTF-8 byte-order mark, as some editors write: harmless
    if raw.startswith((b"\xff\xfe", b"\xfe\xff")):
        raise SessionError(f"{source}: not a Zeffir session (it starts with a UTF-16 byte-order "
                           "mark; session files are UTF-8)")
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as error:
        raise SessionError(f"{source}: not a Zeffir session (not UTF-8 text: byte {error.start} "
                           "is invalid)") from None
    try:
        document = json.loads(text, object_pairs_hook=_unique_keys, parse_int=_bounded_int,
                              parse_float=_float_as_written)
    except json.JSONDecodeError as error:
        raise SessionError(f"{source}: not a Zeffir session: invalid JSON at line {error.lineno}, "
                           f"column {error.colno} ({error.msg})") from None
    except _DuplicateKeyError as error:
        raise SessionError(f"{source}: not a Zeffir session: the key {_shown(error.args[0])} "
                           "appears twice in one object") from None
    except RecursionError:
        raise SessionError(f"{source}: not a Zeffir session: JSON nested too deeply") from None
    if not isinstance(document, dict):
        raise SessionError(f"{source}: not a Zeffir session (expected a JSON object, "
                           f"found {_json_type(document)})")
    if _nesting(document) > MAX_NESTING:
        raise SessionError(f"{source}: not a Zeffir session: JSON nested deeper than "
                           f"{MAX_NESTING} levels")
    return document


class _DuplicateKeyError(Exception):
    """A key appears twice in one JSON object (json would keep the last silently)."""


def _unique_keys(pairs: list[tuple[str, Any]]) -> dict[str, Any]:
    document: dict[str, Any] = {}
    for key, value in pairs:
        if key in document:
            raise _DuplicateKeyError(key)
        document[key] = value
    return document


class _OverflowedFloat(float):
    """A number literal too large for a float (read as ±inf), keeping its text for messages."""

    typed_text: str


def _float_as_written(text: str) -> float:
    """A float literal; one that overflows (``1e400``) remembers how it was written."""
    value = float(text)
    if math.isinf(value):
        overflowed = _OverflowedFloat(value)
        overflowed.typed_text = text if len(text) <= 40 else f"{text[:40]}…"
        return overflowed
    return value


def _bounded_int(digits: str) -> int:
    """An integer literal; past :data:`_MAX_DIGITS` digits, ±10**100 without converting it."""
    if len(digits.lstrip("-")) > _MAX_DIGITS:
        return -(10**100) if digits.startswith("-") else 10**100
    return int(digits)


def _nesting(document: Any) -> int:
    """How deeply arrays and objects nest in ``document`` (1 for a flat object), without recursion."""
    deepest, stack = 0, [(document, 1)]
    while stack:
        value, depth = stack.pop()
        deepest = max(deepest, depth)
        if deepest > MAX_NESTING:
            break
        children = value.values() if isinstance(value, dict) else value
        stack.extend((child, depth + 1) for child in children if isinstance(child, dict | list))
    return deepest


def _json_type(value: Any) -> str:
    names = {list: "an array", str: "a string", bool: "true or false", type(None): "null"}
    return names.get(type(value), "a number")


def _shown(value: Any) -> str:
    """A short rendering of a value read from a file, for a message (never huge, never failing)."""
    if isinstance(value, str):
        return repr(value) if len(value) <= 40 else f"{value[:40]!r}… ({len(value)} characters)"
    if isinstance(value, int) and not isinstance(value, bool) and abs(value) >= 10**18:
        return "a very large number"
    if isinstance(value, bool | int | float) or value is None:
        return repr(value)
    return _json_type(value)

"""Exception types of the exporters and of session files."""

from __future__ import annotations

from zeffir.core import ZeffirError

__all__ = ["ExportError", "SessionError"]


class ExportError(ZeffirError, OSError):
    """A figure or data file could not be written; the message names the file and the reason.

    It is also an :class:`OSError`, because most failures are the file system's
    (missing directory, no permission, full disk), so code that already handles
    ``OSError`` around file writes catches it too.
    """


class SessionError(ZeffirError):
    """A session file cannot be read or saved; the message names the file and the problem."""

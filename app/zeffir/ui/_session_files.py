"""Session files in the window: open, save, save as, and the recent-sessions menu.

A session file stores the view state (:mod:`zeffir.export` reads and writes it,
atomically); this module holds the dialogs, the remembered folder and the recent list.
Every path kept (the open file, the recent list, the last folder) is absolute and
resolved when it is stored, so a relative path typed in one working directory still
names the same file after the program moves to another.
"""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path
from typing import Final

from PySide6.QtCore import QSettings
from PySide6.QtWidgets import QFileDialog, QMenu, QMessageBox, QStatusBar, QWidget

from zeffir.state import ViewState
from zeffir.ui._state_model import StateModel

__all__ = ["SESSION_FILTER", "SessionFiles"]

SESSION_FILTER: Final = "Zeffir sessions (*.zeffir)"
MAX_RECENT: Final = 8


class SessionFiles:
    """The window's session commands.

    Parameters
    ----------
    parent : QWidget
        Owner of the dialogs and message boxes.
    model : StateModel
        The state a session is read into and written from.
    settings : QSettings
        Where the recent list and the last folder are kept.
    status : QStatusBar
        Where "Saved …" is reported.
    changed : callable
        Called after a session was opened or saved (the window retitles itself).
    """

    def __init__(self, parent: QWidget, model: StateModel, settings: QSettings, status: QStatusBar,
                 changed: Callable[[], None]) -> None:
        self._parent = parent
        self._model = model
        self._settings = settings
        self._status = status
        self._changed = changed
        self.path: Path | None = None
        self.recent_menu: QMenu | None = None

    def open(self, path: str | Path | None = None) -> bool:
        """Open a session file (asks for one if ``path`` is None); on error nothing changes."""
        from zeffir.export import SessionError, load_session

        if path is None:
            chosen, _ = QFileDialog.getOpenFileName(self._parent, "Open session", self.last_dir(),
                                                    SESSION_FILTER)
            if not chosen:
                return False
            path = chosen
        target = _absolute(path)
        try:
            state = load_session(target)
        except SessionError as error:
            QMessageBox.warning(self._parent, "Session not opened", str(error))
            return False
        if not self._model.set_state(state):  # it was validated; never adopt half a session
            return False
        self.path = target
        self._remember(target)
        self._changed()
        return True

    def save(self) -> bool:
        """Save to the current session file, or ask for one."""
        if self.path is None:
            return self.save_as()
        return self._write(self.path)

    def save_as(self, path: str | Path | None = None) -> bool:
        """Save the session under a new name."""
        if path is None:
            chosen, _ = QFileDialog.getSaveFileName(self._parent, "Save session", self.last_dir(),
                                                    SESSION_FILTER)
            if not chosen:
                return False
            path = chosen if chosen.endswith(".zeffir") else f"{chosen}.zeffir"
        return self._write(_absolute(path))

    def _write(self, path: Path) -> bool:
        from zeffir.core import ZeffirError
        from zeffir.export import save_session

        state: ViewState = self._model.state
        try:
            save_session(path, state)
        except ZeffirError as error:
            QMessageBox.warning(self._parent, "Session not saved", str(error))
            return False
        self.path = path
        self._remember(path)
        self._changed()
        self._status.showMessage(f"Saved {path}", 5000)
        return True

    def _remember(self, path: Path) -> None:
        path = _absolute(path)
        recent = [p for p in self.recent() if p != str(path)]
        recent.insert(0, str(path))
        self._settings.setValue("recent_sessions", recent[:MAX_RECENT])
        self.remember_folder(path)
        self.refresh_recent()

    def remember_folder(self, path: str | Path) -> None:
        """Keep the folder of ``path`` (absolute, resolved) as the one dialogs start in."""
        self._settings.setValue("last_dir", str(_absolute(path).parent))

    def recent(self) -> list[str]:
        """The recently opened or saved session files, newest first."""
        value = self._settings.value("recent_sessions", [])
        if isinstance(value, str):
            return [value]
        return [str(v) for v in value] if isinstance(value, list) else []

    def refresh_recent(self) -> None:
        """Rebuild the recent-sessions menu (disabled when empty)."""
        menu = self.recent_menu
        if menu is None:
            return
        menu.clear()
        recent = self.recent()
        for item in recent:
            action = menu.addAction(item)
            action.triggered.connect(lambda _c=False, p=item: self.open(p))
        menu.setEnabled(bool(recent))

    def last_dir(self) -> str:
        """The folder last used for a session or an export (absolute); the home folder at first.

        A value that is not an absolute path (kept by an older version, or edited by
        hand) is not guessed at: the home folder is offered instead.
        """
        value = self._settings.value("last_dir", "")
        if isinstance(value, str) and value and Path(value).is_absolute():
            return value
        return str(Path.home())


def _absolute(path: str | Path) -> Path:
    """``path`` made absolute against the current folder, with links and ``..`` resolved."""
    return Path(path).expanduser().resolve()

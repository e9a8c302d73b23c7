"""The Qt side of the view state: a thin adapter that announces changes."""

from __future__ import annotations

from PySide6.QtCore import QObject, Signal

from zeffir.state import StateError, ViewState

__all__ = ["StateModel"]


class StateModel(QObject):
    """Holds the current :class:`~zeffir.state.ViewState` and emits when it changes.

    Views and controls never keep state of their own: they read it from here and
    write user edits back through :meth:`set_state` or :meth:`update`.

    Signals
    -------
    changed(new: ViewState, old: ViewState)
        Emitted after every accepted change.
    rejected(message: str)
        Emitted when a proposed state is invalid; the current state is kept.
    """

    changed = Signal(object, object)
    rejected = Signal(str)

    def __init__(self, state: ViewState | None = None, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self._state = (state or ViewState()).validated()

    @property
    def state(self) -> ViewState:
        """The current state (immutable)."""
        return self._state

    def set_state(self, state: ViewState) -> bool:
        """Validate and adopt ``state``; returns False (and emits ``rejected``) if invalid."""
        try:
            new = state.validated()
        except StateError as error:
            self.rejected.emit(str(error))
            return False
        if new == self._state:
            return True
        old, self._state = self._state, new
        self.changed.emit(new, old)
        return True

    def update(self, **changes: object) -> bool:
        """Replace top-level fields of the current state (see :meth:`ViewState.with_changes`)."""
        return self.set_state(self._state.with_changes(**changes))

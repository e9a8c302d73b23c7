"""Mouse-wheel guard: scrolling a panel never edits a value the user has not clicked into."""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, Qt
from PySide6.QtWidgets import QAbstractSpinBox, QComboBox, QWidget

__all__ = ["guard_wheel"]


class _WheelGuard(QObject):
    """Passes wheel events of unfocused spin and combo boxes on to their scroll area."""

    def eventFilter(self, watched: QObject, event: QEvent) -> bool:
        if event.type() == QEvent.Type.Wheel and isinstance(watched, QWidget) \
                and not watched.hasFocus():
            event.ignore()  # the parent (the scrolling side panel) takes it
            return True
        return super().eventFilter(watched, event)


def guard_wheel(root: QWidget) -> None:
    """Make every spin box and combo box under ``root`` ignore the wheel unless focused.

    They take focus by click or Tab only (not by the wheel), so scrolling the side
    panel past them leaves their values alone.
    """
    guard = _WheelGuard(root)
    for widget in (*root.findChildren(QAbstractSpinBox), *root.findChildren(QComboBox)):
        widget.setFocusPolicy(Qt.FocusPolicy.StrongFocus)
        widget.installEventFilter(guard)

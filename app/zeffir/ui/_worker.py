"""Work off the GUI thread: the newest request wins, results come back as signals.

The window captures immutable parameters (a ViewState) on the GUI thread and
asks for a scene; a single worker thread computes it with a pure function and
the result is delivered back on the GUI thread through a queued signal. A newer
request supersedes an older one: a request still waiting is dropped, and the
result of one that was already running is discarded on arrival. ``synchronous``
mode runs requests at once on the calling thread, for tests and headless use.
"""

from __future__ import annotations

import sys
import threading
import traceback
from collections.abc import Callable
from typing import Any

from PySide6.QtCore import QObject, QThread, Signal, Slot

__all__ = ["Cancelled", "SceneWorker"]

#: Longest time (s) one thread runs Python before the other may take the lock.
_SWITCH_INTERVAL = 0.001


class Cancelled(Exception):
    """Raised inside a job when its request was cancelled or superseded."""


class _Runner(QObject):
    done = Signal(int, str, object)
    failed = Signal(int, str, str)
    progress = Signal(str)

    def __init__(self, owner: SceneWorker) -> None:
        super().__init__()
        self._owner = owner

    @Slot()
    def run_pending(self) -> None:
        job = self._owner._take()
        if job is None:
            return
        ident, key, function = job
        from zeffir.core import cancellation, progress_reporting

        try:
            # Long core loops poll this: a superseded or cancelled request stops early,
            # and their progress messages reach the window through a queued signal.
            with cancellation(lambda: not self._owner.is_current(key, ident)), \
                    progress_reporting(self.progress.emit):
                result = function()
        except Cancelled:
            return
        except Exception as error:  # reported to the window, never raised into Qt
            from zeffir.core import ZeffirError

            if not self._owner.is_current(key, ident):
                return  # stopped because it was cancelled or superseded: nothing to report
            detail = str(error) if isinstance(error, ZeffirError) else "".join(
                traceback.format_exception_only(type(error), error)).strip()
            self.failed.emit(ident, key, detail)
            return
        self.done.emit(ident, key, result)


class SceneWorker(QObject):
    """One background thread computing the newest requested job.

    Signals
    -------
    finished(key: str, result: object)
        A job's result, on the GUI thread; only for the newest request of its key.
    failed(key: str, message: str)
        A job raised; the message says why.
    busy(active: bool)
        True while any request is waiting or running.
    """

    finished = Signal(str, object)
    failed = Signal(str, str)
    busy = Signal(bool)
    #: A progress message from a long computation (e.g. an SCF iteration).
    progress = Signal(str)
    _wake = Signal()

    def __init__(self, parent: QObject | None = None, synchronous: bool = False) -> None:
        super().__init__(parent)
        self._lock = threading.Lock()
        self._pending: dict[str, tuple[int, Callable[[], Any]]] = {}
        self._latest: dict[str, int] = {}
        self._running = 0
        self._counter = 0
        self._synchronous = synchronous
        self._thread: QThread | None = None
        self._runner = _Runner(self)
        self._runner.done.connect(self._on_done)
        self._runner.progress.connect(self.progress)
        self._runner.failed.connect(self._on_failed)
        if not synchronous:
            # The two threads share the interpreter lock. At Python's default switch
            # interval (5 ms) a job handed over while the GUI thread runs Python (the
            # controls taking the new state) waits up to a whole interval to start, and
            # its result waits again to be shown; 1 ms keeps a hand-off within a frame.
            sys.setswitchinterval(min(sys.getswitchinterval(), _SWITCH_INTERVAL))
            self._thread = QThread()
            self._thread.setObjectName("zeffir-worker")
            self._runner.moveToThread(self._thread)
            self._wake.connect(self._runner.run_pending)
            self._thread.start()

    def request(self, key: str, function: Callable[[], Any]) -> int:
        """Queue ``function`` under ``key``, superseding any older request of that key."""
        with self._lock:
            self._counter += 1
            ident = self._counter
            self._pending[key] = (ident, function)
            self._latest[key] = ident
        self.busy.emit(True)
        if self._synchronous:
            self._runner.run_pending()
        else:
            self._wake.emit()
        return ident

    def cancel(self) -> None:
        """Drop every waiting request and ignore results of running ones."""
        with self._lock:
            self._pending.clear()
            for key in self._latest:
                self._latest[key] = -1
        self.busy.emit(False)

    def is_current(self, key: str, ident: int) -> bool:
        """True while ``ident`` is the newest request of ``key`` (jobs may poll this)."""
        with self._lock:
            return self._latest.get(key) == ident

    def _take(self) -> tuple[int, str, Callable[[], Any]] | None:
        with self._lock:
            if not self._pending:
                return None
            key = next(iter(self._pending))
            ident, function = self._pending.pop(key)
            return ident, key, function

    def _idle(self) -> bool:
        with self._lock:
            return not self._pending

    @Slot(int, str, object)
    def _on_done(self, ident: int, key: str, result: object) -> None:
        if self.is_current(key, ident):
            self.finished.emit(key, result)
        if self._idle():
            self.busy.emit(False)

    @Slot(int, str, str)
    def _on_failed(self, ident: int, key: str, message: str) -> None:
        if self.is_current(key, ident):
            self.failed.emit(key, message)
        if self._idle():
            self.busy.emit(False)

    def shutdown(self) -> None:
        """Stop the thread (waits for a running job to finish)."""
        self.cancel()
        if self._thread is not None:
            self._thread.quit()
            self._thread.wait()
            self._thread = None

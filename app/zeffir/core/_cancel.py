"""Cooperative cancellation and progress of long computations (self-consistent, variational).

A caller that runs core work in a background thread installs a check with
:func:`cancellation`; long loops in the core call :func:`should_stop` between
steps and stop with their own cancellation error when it returns True. Plain
scripts install nothing, and nothing is ever cancelled.
"""

from __future__ import annotations

from collections.abc import Callable, Iterator
from contextlib import contextmanager
from contextvars import ContextVar

__all__ = ["cancellation", "progress_reporting", "report_progress", "should_stop"]

_CHECK: ContextVar[Callable[[], bool] | None] = ContextVar("zeffir_should_stop", default=None)
_REPORT: ContextVar[Callable[[str], None] | None] = ContextVar("zeffir_progress", default=None)


def report_progress(message: str) -> None:
    """Tell whoever runs this computation how it is going (a no-op when nobody listens)."""
    report = _REPORT.get()
    if report is not None:
        report(message)


@contextmanager
def progress_reporting(report: Callable[[str], None]) -> Iterator[None]:
    """Within the block, :func:`report_progress` messages go to ``report``."""
    token = _REPORT.set(report)
    try:
        yield
    finally:
        _REPORT.reset(token)


def should_stop() -> bool:
    """True when the code running this computation has asked it to stop."""
    check = _CHECK.get()
    return bool(check()) if check is not None else False


@contextmanager
def cancellation(check: Callable[[], bool]) -> Iterator[None]:
    """Within the block, :func:`should_stop` answers with ``check()``."""
    token = _CHECK.set(check)
    try:
        yield
    finally:
        _CHECK.reset(token)

"""Cooperative cancellation of long computations (self-consistent and variational models).

A caller that runs core work in a background thread installs a check with
:func:`cancellation`; long loops in the core call :func:`should_stop` between
steps and stop with their own cancellation error when it returns True. Plain
scripts install nothing, and nothing is ever cancelled.
"""

from __future__ import annotations

from collections.abc import Callable, Iterator
from contextlib import contextmanager
from contextvars import ContextVar

__all__ = ["cancellation", "should_stop"]

_CHECK: ContextVar[Callable[[], bool] | None] = ContextVar("zeffir_should_stop", default=None)


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

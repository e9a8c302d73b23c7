"""``zeffir`` and ``zeffir demo``: the window, or the demo's tables without a display."""

from __future__ import annotations

import os
import sys

from zeffir.cli._table import _format_table


def _demo() -> int:
    from zeffir._demo import load_demo

    demo = load_demo()
    print(demo.title)
    print("=" * len(demo.title))
    for model in demo.models:
        print()
        print(_format_table(demo.spec, model, "atomic"))
    print()
    print("Model estimates: non-relativistic, no electron correlation, point nucleus.")
    return 0


def _has_display() -> bool:
    """False on a Linux machine with no display server and no Qt platform chosen."""
    if not sys.platform.startswith("linux") or os.environ.get("QT_QPA_PLATFORM"):
        return True
    return bool(os.environ.get("DISPLAY") or os.environ.get("WAYLAND_DISPLAY"))


def _window(session: str | None) -> int:
    if session is not None:
        # Read the session before any window exists: a refused file is a one-line message
        # and exit 2, not a modal box that a headless or scripted start cannot dismiss.
        from zeffir.export import SessionError, load_session

        try:
            load_session(session)
        except SessionError as error:
            from zeffir.cli._common import EXIT_BAD_INPUT

            print(f"zeffir: --session {error}", file=sys.stderr)
            return EXIT_BAD_INPUT
    if not _has_display():
        print("zeffir: no display found, so the window cannot open; showing the demo as text "
              "(use 'zeffir table' and 'zeffir figure' without a display).", file=sys.stderr)
        return _demo()
    from zeffir._display_check import check_platform

    # Qt aborts the process (exit 134) when its platform plugin cannot load; say why first.
    problem = check_platform()
    if problem is not None:
        print(problem.message(), file=sys.stderr)
        return _demo()
    from zeffir.ui import run_window

    return run_window(session=session)

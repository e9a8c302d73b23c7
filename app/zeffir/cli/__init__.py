"""The ``zeffir`` command line.

``zeffir`` with no arguments shows the built-in demo; ``zeffir table SPEC`` prints
a subshell table (``--json`` for one machine-readable object in atomic units);
``zeffir terms SPEC`` lists the term symbols, J levels and Hund ground level of a
configuration (``--json`` for one object); ``zeffir figure SPEC --out FILE`` writes a
figure or data file of the radial or slice view (the format follows the suffix),
optionally comparing two models or two specs; ``zeffir trend QUANTITY --over RULE``
evaluates one quantity over many configurations and models. Bad input prints the reason on stderr
and exits with status 2, never a traceback, and leaves no partial file.

The package: ``_parser`` (options), ``_table``, ``_terms``, ``_figure``, ``_trend``, ``_window``
(one module per command) and ``_common`` (exit statuses, unit names, errors).
"""

from __future__ import annotations

import argparse
import json
import sys
from collections.abc import Sequence

from zeffir.cli._common import (
    EXIT_BAD_INPUT,
    EXIT_CANNOT_COMPUTE,
    EXIT_INTERRUPTED,
    EXIT_OK,
    _InputError,
    split_specs,
)
from zeffir.cli._figure import _figure, figure_state, parse_orbital
from zeffir.cli._parser import _parser
from zeffir.cli._table import _format_table, table_json
from zeffir.cli._terms import _format_terms, terms_json
from zeffir.cli._trend import _trend, trend_json
from zeffir.cli._window import _demo, _window

# ``_InputError`` and ``_parser`` are imported by the tests from here as well.
__all__ = [
    "EXIT_BAD_INPUT",
    "EXIT_CANNOT_COMPUTE",
    "EXIT_INTERRUPTED",
    "EXIT_OK",
    "_InputError",
    "_parser",
    "figure_state",
    "main",
    "parse_orbital",
    "split_specs",
    "table_json",
    "terms_json",
    "trend_json",
]


def _wants_progress(args: argparse.Namespace) -> bool:
    if getattr(args, "quiet", False):
        return False
    return bool(getattr(args, "progress", False)) or sys.stderr.isatty()


def _progress_line(message: str) -> None:
    print(f"zeffir: {message}", file=sys.stderr, flush=True)


def _run(args: argparse.Namespace) -> int:
    if args.command is None:
        return _window(args.session)
    if args.command == "demo":
        return _demo()
    if args.command == "table":
        for index, spec in enumerate(split_specs(args.spec)):
            if args.json:
                print(json.dumps(table_json(spec, args.model)), flush=True)
            else:
                print(("\n" if index else "") + _format_table(spec, args.model, args.units), flush=True)
        return EXIT_OK
    if args.command == "terms":
        spec = " ".join(args.spec)
        print(json.dumps(terms_json(spec)) if args.json else _format_terms(spec))
        return EXIT_OK
    if args.command == "figure":
        return _figure(args)
    if args.command == "trend":
        return _trend(args)
    return EXIT_OK  # pragma: no cover - argparse rejects unknown commands


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line; returns the exit status (see ``zeffir --help``)."""
    from contextlib import nullcontext

    try:
        # Before the core is imported: --version and --help answer in a blink.
        args = _parser().parse_args(argv)
    except KeyboardInterrupt:
        print("zeffir: interrupted", file=sys.stderr)
        return EXIT_INTERRUPTED

    from zeffir.core import ModelError, ZeffirError, progress_reporting

    try:
        reporting = progress_reporting(_progress_line) if _wants_progress(args) else nullcontext()
        with reporting:
            return _run(args)
    except KeyboardInterrupt:
        # Files are written atomically, so an interrupted export leaves nothing behind.
        print("zeffir: interrupted", file=sys.stderr)
        return EXIT_INTERRUPTED
    except ModelError as error:
        print(f"zeffir: {error}", file=sys.stderr)
        return EXIT_CANNOT_COMPUTE
    except (ZeffirError, _InputError) as error:
        print(f"zeffir: {error}", file=sys.stderr)
        return EXIT_BAD_INPUT
    except BrokenPipeError:  # output piped into a reader that closed early (e.g. head)
        sys.stderr.close()
        return EXIT_OK

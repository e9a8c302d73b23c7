"""The argument parser of every command (``zeffir COMMAND --help``)."""

from __future__ import annotations

import argparse
import re

from zeffir import __version__
from zeffir.cli._common import _EXIT_CODES_TEXT, UNIT_CHOICES, _UnitsAction
from zeffir.cli._figure import _add_figure_parser
from zeffir.cli._trend import _add_trend_parser

#: A negative number as a value, in any notation float() reads: -3, -.5, -1e4, -2.5E-3.
_NEGATIVE_NUMBER = re.compile(r"^-(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$")


class _Parser(argparse.ArgumentParser):
    """argparse, except that ``--offset -1e4`` reads -1e4 as the value, not as an option.

    argparse takes a token for a negative number only when it looks like ``-3`` or
    ``-0.5``; its check is the ``_negative_number_matcher`` attribute, widened here to
    exponent notation. Subcommand parsers are made by the same class.
    """

    def __init__(self, *args: object, **kwargs: object) -> None:
        super().__init__(*args, **kwargs)  # type: ignore[arg-type]
        self._negative_number_matcher = _NEGATIVE_NUMBER


def _parser() -> argparse.ArgumentParser:
    from zeffir.core import DEFAULT_MODEL, model_names

    parser = _Parser(
        prog="zeffir",
        description="Orbitals, densities and figures for many-electron atoms. "
        "With no command, opens the window on the built-in demo (or on --session FILE).",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="commands: table, terms, figure, trend (zeffir COMMAND --help for each), demo\n\n"
        + _EXIT_CODES_TEXT,
    )
    chatter = _Parser(add_help=False)
    talk = chatter.add_argument_group("progress")
    talk.add_argument("--progress", action="store_true",
                      help="report each step of a long computation on stderr (what, iteration, "
                      "energy, residual); on by default when stderr is a terminal")
    talk.add_argument("--quiet", action="store_true", help="no progress lines, even on a terminal")
    parser.add_argument("--version", action="version", version=f"zeffir {__version__}")
    parser.add_argument("--session", metavar="FILE",
                        help="open this session file (.zeffir) in the window")
    commands = parser.add_subparsers(dest="command", metavar="COMMAND")
    commands.add_parser(
        "demo", help="print the demo's subshell tables as text (no window)",
        description="Print the built-in demo's tables: sodium under three models.",
    )
    table = commands.add_parser(
        "table", parents=[chatter],
        help="per-subshell table: occupancy, ζ, Z_eff, n*, <r>, r_max, energy",
        description="Print the subshell table of one or more atoms or ions under a model "
        "(one table after another; with --json one JSON object per line).",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="examples:\n"
        "  zeffir table Fe\n"
        "  zeffir table Fe Fe2+ Fe3+ --model clementi\n"
        "  zeffir table 'C 1s2 2s1 2p3' --units angstrom\n"
        "  zeffir table Ne Ar Kr --model hartree-fock --json > noble.jsonl\n\n"
        + _EXIT_CODES_TEXT,
    )
    table.add_argument(
        "spec", nargs="+", metavar="SPEC",
        help="atom specs, e.g. Fe, 26, Fe3+, O2-, 'C 1s2 2s1 2p3', 'Na [Ne] 4d1'; several are "
        "tabulated in turn (a configuration may follow its atom unquoted: C 1s2 2s1 2p3)",
    )
    table.add_argument("--model", default=DEFAULT_MODEL, choices=model_names(),
                       help=f"model (default {DEFAULT_MODEL})")
    table.add_argument("--units", default="atomic", choices=UNIT_CHOICES, action=_UnitsAction,
                       help="units of the text table: bohr and hartree, or angstrom and eV — the "
                       "names the window and session files use (atomic and angstrom-ev are "
                       "accepted too); JSON is always atomic")
    table.add_argument("--json", action="store_true",
                       help="print one JSON object in atomic units instead of a table")
    terms = commands.add_parser(
        "terms", parents=[chatter],
        help="term symbols, J levels and the Hund ground level of a configuration",
        description="List the LS terms of a configuration, grouped by multiplicity with their "
        "J levels (a term that occurs several times is counted), and its ground level by "
        "Hund's rules.",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="examples:\n"
        "  zeffir terms C\n"
        "  zeffir terms 'C 1s2 2s2 2p1 3p1'\n"
        "  zeffir terms Ce+ --json\n\n" + _EXIT_CODES_TEXT,
    )
    terms.add_argument(
        "spec", nargs="+", metavar="SPEC",
        help="atom spec, e.g. C, Fe, Fe3+, 'C 1s2 2s2 2p1 3p1', 'Ce [Xe] 4f1 5d1 6s2'",
    )
    terms.add_argument("--json", action="store_true", help="print one JSON object instead of text")
    _add_figure_parser(commands, DEFAULT_MODEL, model_names(), chatter)
    _add_trend_parser(commands, DEFAULT_MODEL, list(model_names()), chatter)
    return parser

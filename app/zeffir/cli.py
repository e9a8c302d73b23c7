"""The ``zeffir`` command line.

``zeffir`` with no arguments shows the built-in demo; ``zeffir table SPEC`` prints
a subshell table (``--json`` for one machine-readable object in atomic units).
Bad input prints the reason on stderr and exits with status 2, never a traceback.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from collections.abc import Sequence
from typing import Any

from zeffir import __version__

__all__ = ["main", "table_json"]

EXIT_BAD_INPUT = 2


def _parser() -> argparse.ArgumentParser:
    from zeffir.core import DEFAULT_MODEL, model_names

    parser = argparse.ArgumentParser(
        prog="zeffir",
        description="Orbitals, densities and figures for many-electron atoms. "
        "With no command, shows the built-in demo.",
    )
    parser.add_argument("--version", action="version", version=f"zeffir {__version__}")
    commands = parser.add_subparsers(dest="command", metavar="COMMAND")
    table = commands.add_parser(
        "table",
        help="per-subshell table: occupancy, ζ, Z_eff, n*, <r>, r_max, energy",
        description="Print the subshell table of an atom or ion under a model.",
    )
    table.add_argument(
        "spec", nargs="+", metavar="SPEC",
        help="atom spec, e.g. Fe, 26, Fe3+, O2-, 'C 1s2 2s1 2p3', 'Na [Ne] 4d1'",
    )
    table.add_argument("--model", default=DEFAULT_MODEL, choices=model_names(),
                       help=f"model (default {DEFAULT_MODEL})")
    table.add_argument("--units", default="atomic", choices=("atomic", "angstrom-ev"),
                       help="units of the text table (JSON is always atomic)")
    table.add_argument("--json", action="store_true",
                       help="print one JSON object in atomic units instead of a table")
    return parser


def _finite_or_none(value: float | None) -> float | None:
    return None if value is None or not math.isfinite(value) else float(value)


def table_json(spec: str, model: str) -> dict[str, Any]:
    """The ``table --json`` object (atomic units) for a spec under a model."""
    from zeffir.core import build, parse_spec, subshell_table

    configuration = parse_spec(spec)
    orbitals = build(configuration, model)
    rows = subshell_table(orbitals)
    return {
        "spec": configuration.spec,
        "Z": configuration.Z,
        "charge": configuration.charge,
        "model": model,
        "configuration": configuration.text,
        "total_energy_hartree": _finite_or_none(orbitals.total_energy),
        "subshells": [
            {
                "label": row.label,
                "n": row.n,
                "l": row.l,
                "occupancy": row.occupancy,
                "zeta": row.zeta,
                "z_eff": row.z_eff,
                "n_star": _finite_or_none(row.n_star),
                "r_mean_bohr": row.r_mean,
                "r_max_bohr": row.r_max,
                "energy_hartree": _finite_or_none(row.energy),
                "notes": list(row.notes),
            }
            for row in rows
        ],
        "notes": list(orbitals.notes),
    }


def _format_table(spec: str, model: str, units: str) -> str:
    from zeffir.core import (
        ANGSTROM_PER_BOHR,
        EV_PER_HARTREE,
        build,
        get_model,
        parse_spec,
        subshell_table,
    )

    configuration = parse_spec(spec)
    orbitals = build(configuration, model)
    rows = subshell_table(orbitals)
    length, energy = (1.0, 1.0) if units == "atomic" else (ANGSTROM_PER_BOHR, EV_PER_HARTREE)
    lu, eu = ("bohr", "Eh") if units == "atomic" else ("Å", "eV")

    def num(value: float | None, scale: float = 1.0, digits: int = 4) -> str:
        return "—" if value is None or not math.isfinite(value) else f"{value * scale:.{digits}f}"

    charge = f", charge {configuration.charge:+d}" if configuration.charge else ""
    lines = [
        f"{configuration.element.name} (Z = {configuration.Z}{charge}): {configuration.text}",
        f"model: {model} — {get_model(model).title}",
        "",
        f"{'subshell':>8} {'occ':>4} {'ζ/' + lu + '⁻¹':>11} {'Z_eff':>8} {'n*':>5} "
        f"{'<r>/' + lu:>11} {'r_max/' + lu:>11} {'ε/' + eu:>12}",
    ]
    for row in rows:
        lines.append(
            f"{row.label:>8} {row.occupancy:>4} {num(row.zeta, 1 / length):>11} "
            f"{num(row.z_eff):>8} {num(row.n_star, digits=1):>5} {num(row.r_mean, length):>11} "
            f"{num(row.r_max, length):>11} {num(row.energy, energy):>12}"
        )
    lines.append("")
    lines.append(f"electrons: {configuration.n_electrons}   "
                 f"total energy: {num(orbitals.total_energy, energy)} {eu}")
    notes = [*orbitals.notes, *(note for row in rows for note in row.notes)]
    lines.extend(f"note: {note}" for note in dict.fromkeys(notes))
    return "\n".join(lines)


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


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line; returns the exit status."""
    from zeffir.core import ZeffirError

    args = _parser().parse_args(argv)
    try:
        if args.command is None:
            return _demo()
        if args.command == "table":
            spec = " ".join(args.spec)
            if args.json:
                print(json.dumps(table_json(spec, args.model)))
            else:
                print(_format_table(spec, args.model, args.units))
            return 0
    except ZeffirError as error:
        print(f"zeffir: {error}", file=sys.stderr)
        return EXIT_BAD_INPUT
    except BrokenPipeError:  # output piped into a reader that closed early (e.g. head)
        sys.stderr.close()
        return 0
    return 0  # pragma: no cover - argparse rejects unknown commands

"""``zeffir trend``: one quantity over many atoms or ions, as text, JSON, a figure or CSV."""

from __future__ import annotations

import argparse
import json
import math
from typing import Any

from zeffir import __version__
from zeffir.cli._common import _EXIT_CODES_TEXT, EXIT_OK, JSON_FORMAT_VERSION, UNIT_CHOICES, _UnitsAction


def _add_trend_parser(commands: Any, default_model: str, models: list[str],
                      chatter: argparse.ArgumentParser) -> None:
    trend = commands.add_parser(
        "trend", parents=[chatter],
        help="a quantity against Z or along an isoelectronic sequence, several models at once",
        description="Evaluate one quantity over many configurations under one or more models "
        "(worker processes, reusing the disk cache) and print it, or write it as a figure or CSV.",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="rules (--over):\n"
        "  Z=1-36                         the neutral atoms H … Kr\n"
        "  isoelectronic=10:Z=10-20       ten electrons on Z = 10 … 20 (Ne, Na+, …)\n"
        "  family=[Ar] 3dn 4s2:n=1-10     one occupancy running over n (Sc … Zn)\n"
        "  Li,Na,K,Rb                     specs separated by commas\n\n"
        "quantities: per subshell zeta, z_eff, n_star, r_mean, r_max, <r^k> (k = -3 … 2), energy;\n"
        "per atom total_energy, correlation_energy, virial_ratio, ionization_energy\n\n"
        "examples:\n"
        "  zeffir trend z_eff --over Z=1-36 --model slater,clementi,hartree-fock\n"
        "  zeffir trend energy --over Z=21-30 --subshell 3d --model hartree-fock --json\n"
        "  zeffir trend ionization_energy --over Z=1-54 --model hartree-fock --method delta-scf "
        "--out ie.pdf\n\n" + _EXIT_CODES_TEXT,
    )
    trend.add_argument("quantity", metavar="QUANTITY", help="what to evaluate (see below)")
    trend.add_argument("--over", required=True, metavar="RULE",
                       help="the configurations: Z=a-b, isoelectronic=N:Z=a-b, family=CONF:n=a-b "
                       "or specs separated by commas")
    trend.add_argument("--model", default=default_model, metavar="A[,B,…]",
                       help=f"models separated by commas, from {', '.join(models)} "
                       f"(default {default_model})")
    trend.add_argument("--subshell", metavar="LABEL|valence",
                       help="for per-subshell quantities (and Koopmans ionization energies): a "
                       "subshell such as 3d, or valence, the outermost occupied one (default)")
    trend.add_argument("--method", metavar="koopmans|delta-scf",
                       help="ionization energy as −ε of the outermost subshell (koopmans, the "
                       "default) or E(ion) − E(atom) (delta-scf); both: koopmans,delta-scf")
    trend.add_argument("--json", action="store_true",
                       help="print one JSON object in atomic units instead of a table")
    trend.add_argument("--out", metavar="FILE",
                       help="write a figure (.png, .svg, .pdf) or the numbers (.csv) instead")
    trend.add_argument("--units", default="atomic", choices=UNIT_CHOICES, action=_UnitsAction,
                       help="units of the text table, figure and CSV: bohr and hartree, or angstrom "
                       "and eV; JSON is always atomic")
    trend.add_argument("--width", choices=["single", "double"], help="figure width (journal column)")
    trend.add_argument("--dpi", type=int, default=300, help="resolution of a PNG (default 300)")
    trend.add_argument("--processes", type=int, metavar="N",
                       help="worker processes (default: the available cores)")


def trend_json(trend: Any) -> dict[str, Any]:
    """The ``trend --json`` object: the trend's fields plus the versions."""
    return {"zeffir_version": __version__, "format_version": JSON_FORMAT_VERSION, **trend.as_json()}


def _trend(args: argparse.Namespace) -> int:
    from zeffir.cli._common import _InputError
    from zeffir.core import model_names
    from zeffir.core.trends import evaluate_trend, parse_rule

    models = [m.strip() for m in str(args.model).split(",") if m.strip()]
    if not models:
        raise _InputError("--model: name at least one model")
    unknown = [m for m in models if m not in model_names()]
    if unknown:
        raise _InputError(f"--model {unknown[0]}: unknown model (choose from {', '.join(model_names())})")
    methods = None if args.method is None else [m.strip() for m in args.method.split(",") if m.strip()]
    if args.processes is not None and args.processes < 1:
        raise _InputError(f"--processes: {args.processes} is not a positive number of processes")
    specs = parse_rule(args.over)
    if args.out is not None:  # a wrong path or suffix is refused before the work
        _check_out(args.out)
    trend = evaluate_trend(specs, models, args.quantity, subshell=args.subshell, methods=methods,
                           processes=args.processes)
    if args.json:
        print(json.dumps(trend_json(trend), ensure_ascii=False))
        return EXIT_OK
    from zeffir.scene import trend_scene

    scene = trend_scene(trend, "bohr" if args.units == "atomic" else "angstrom")
    if args.out is not None:
        from zeffir.export import write_trend

        written = write_trend(scene, args.out, width=args.width, dpi=args.dpi)
        print(f"wrote {written}")
        return EXIT_OK
    print(_format_trend(scene, trend))
    return EXIT_OK


def _check_out(path: str) -> None:
    from pathlib import Path

    from zeffir.cli._common import _InputError
    from zeffir.export import TREND_FORMATS

    target = Path(path)
    if target.suffix.lower() not in TREND_FORMATS:
        raise _InputError(f"--out {path}: a trend is written as {', '.join(TREND_FORMATS)}")
    if not target.parent.is_dir():
        raise _InputError(f"--out {path}: the folder {target.parent} does not exist")
    from zeffir.export import check_target

    check_target(target)  # not a special file, a name the file system takes


def _format_trend(scene: Any, trend: Any) -> str:
    """A text table: one row per configuration, one column per series (display units)."""
    names = [line.model if line.method is None else f"{line.model} {line.method}" for line in scene.lines]
    width = max(12, *(len(name) for name in names))
    head = f"{'spec':<18} {'Z':>3} " + " ".join(f"{name:>{width}}" for name in names)
    if scene.reference is not None:
        head += f" {'NIST':>{width}}"
    lines = [scene.title, f"{scene.y_label}", "", head]
    reference = dict(zip(scene.reference.specs, scene.reference.y, strict=True)) if scene.reference else {}
    for index, spec in enumerate(scene.lines[0].specs):
        cells = [_cell(line.y[index], width) for line in scene.lines]
        row = f"{spec:<18} {trend.series[0].points[index].Z:>3} " + " ".join(cells)
        if scene.reference is not None:
            row += " " + _cell(reference.get(spec, math.nan), width)
        lines.append(row)
    gaps = [(line.name, spec, "; ".join(notes)) for line in scene.lines
            for spec, value, notes in zip(line.specs, line.y, line.notes, strict=True) if math.isnan(value)]
    lines.extend(f"gap: {name}, {spec}: {why}" for name, spec, why in gaps)
    if scene.reference is not None and scene.reference.notes:
        lines.append(f"reference: {scene.reference.notes[0][0]}")
    return "\n".join(lines)


def _cell(value: float, width: int) -> str:
    return f"{'—':>{width}}" if math.isnan(value) else f"{value:>{width}.6f}"

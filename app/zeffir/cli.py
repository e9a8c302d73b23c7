"""The ``zeffir`` command line.

``zeffir`` with no arguments shows the built-in demo; ``zeffir table SPEC`` prints
a subshell table (``--json`` for one machine-readable object in atomic units);
``zeffir terms SPEC`` lists the term symbols, J levels and Hund ground level of a
configuration (``--json`` for one object); ``zeffir figure SPEC --out FILE`` writes a
figure or data file of the radial or slice view (the format follows the suffix),
optionally comparing two models or two specs. Bad input prints the reason on stderr
and exits with status 2, never a traceback, and leaves no partial file.
"""

from __future__ import annotations

import argparse
import json
import math
import os
import sys
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

from zeffir import __version__

if TYPE_CHECKING:
    from zeffir.core import Configuration
    from zeffir.core.terms import Level
    from zeffir.state import OrbitalChoice, ViewState

__all__ = ["figure_state", "main", "parse_orbital", "table_json", "terms_json"]

EXIT_BAD_INPUT = 2


#: The window's and session files' unit names, and the older command-line ones.
_UNIT_NAMES = {"bohr": "atomic", "atomic": "atomic", "angstrom": "angstrom-ev", "angstrom-ev": "angstrom-ev"}


#: What ``--units`` accepts: the session's names first.
UNIT_CHOICES = ("bohr", "angstrom", "atomic", "angstrom-ev")


class _UnitsAction(argparse.Action):
    """Store ``--units`` as the unit system it names (bohr → atomic, angstrom → angstrom-ev)."""

    def __call__(self, parser: argparse.ArgumentParser, namespace: argparse.Namespace,
                 values: object, option_string: str | None = None) -> None:
        setattr(namespace, self.dest, _UNIT_NAMES[str(values)])


def _parser() -> argparse.ArgumentParser:
    from zeffir.core import DEFAULT_MODEL, model_names

    parser = argparse.ArgumentParser(
        prog="zeffir",
        description="Orbitals, densities and figures for many-electron atoms. "
        "With no command, opens the window on the built-in demo (or on --session FILE).",
    )
    parser.add_argument("--version", action="version", version=f"zeffir {__version__}")
    parser.add_argument("--session", metavar="FILE",
                        help="open this session file (.zeffir) in the window")
    commands = parser.add_subparsers(dest="command", metavar="COMMAND")
    commands.add_parser(
        "demo", help="print the demo's subshell tables as text (no window)",
        description="Print the built-in demo's tables: sodium under three models.",
    )
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
    table.add_argument("--units", default="atomic", choices=UNIT_CHOICES, action=_UnitsAction,
                       help="units of the text table: bohr and hartree, or angstrom and eV — the "
                       "names the window and session files use (atomic and angstrom-ev are "
                       "accepted too); JSON is always atomic")
    table.add_argument("--json", action="store_true",
                       help="print one JSON object in atomic units instead of a table")
    terms = commands.add_parser(
        "terms",
        help="term symbols, J levels and the Hund ground level of a configuration",
        description="List the LS terms of a configuration, grouped by multiplicity with their "
        "J levels (a term that occurs several times is counted), and its ground level by "
        "Hund's rules.",
    )
    terms.add_argument(
        "spec", nargs="+", metavar="SPEC",
        help="atom spec, e.g. C, Fe, Fe3+, 'C 1s2 2s2 2p1 3p1', 'Ce [Xe] 4f1 5d1 6s2'",
    )
    terms.add_argument("--json", action="store_true", help="print one JSON object instead of text")
    _add_figure_parser(commands, DEFAULT_MODEL, model_names())
    return parser


def _add_figure_parser(commands: Any, default_model: str, models: Sequence[str]) -> None:
    from zeffir.export import COLUMN_WIDTHS, DPI_RANGE, EXPORT_FORMATS
    from zeffir.state import DIVERGING_MAP_NAMES, RADIAL_QUANTITIES, SEQUENTIAL_MAP_NAMES, SLICE_QUANTITIES

    figure = commands.add_parser(
        "figure",
        help="write a figure (.png .svg .pdf) or the data (.csv .npz) of a view",
        description="Write the radial or slice view of an atom or ion as a publication figure "
        f"or a data file; the format follows the suffix of --out ({' '.join(EXPORT_FORMATS)}). "
        "Radial data go to .csv, slice data to .npz.",
    )
    figure.add_argument("spec", nargs="+", metavar="SPEC",
                        help="atom spec, e.g. Fe, 26, Fe3+, O2-, 'C 1s2 2s1 2p3', 'Na [Ne] 4d1'")
    figure.add_argument("--out", required=True, metavar="FILE",
                        help="output file: .png .svg .pdf (figure), .csv (radial data), .npz (slice data)")
    figure.add_argument("--view", default="radial", choices=("radial", "slice", "pair", "two-electron"),
                        help="radial curves, a 2D slice, the pair view (densities of the other "
                        "electrons and the exchange hole for a reference electron) or the "
                        "two-electron view (singlet, triplet, difference); default radial")
    figure.add_argument("--ref", type=float, nargs=3, metavar=("X", "Y", "Z"),
                        help="pair: position of the reference electron, in the --units length "
                        "(default 0 0 1 bohr)")
    figure.add_argument("--spin", choices=("up", "down"), default="up",
                        help="pair: spin of the reference electron (default up)")
    figure.add_argument("--determinant", metavar="TEXT", default="",
                        help="pair: spin-orbitals of open subshells, e.g. '2p: 1u 0u -1d' "
                        "(default Hund's rules)")
    figure.add_argument("--map", choices=("radial", "collinear"), default="radial",
                        help="two-electron: radial pair distribution P(r1, r2), or ψ with both "
                        "electrons on the z axis (default radial)")
    figure.add_argument("--model", default=default_model, choices=models,
                        help=f"model (default {default_model})")
    figure.add_argument("--versus", metavar="B", action="append",
                        help="compare side by side, with the difference: a model name compares "
                        "models on the same spec; anything else is a second spec under --model. "
                        "Repeat it for more series (up to five; the difference needs exactly one)")
    figure.add_argument("--no-difference", action="store_true",
                        help="with --versus: leave out the difference panel")
    figure.add_argument("--overlay", action="store_true",
                        help="with --versus, radial view: every series' curves on one set of axes "
                        "(one line style per series)")
    figure.add_argument("--orbital", metavar="LABEL",
                        help="orbital shown: 3s, 2px, 3dxy, 4fxyz (real), or 3p:-1 (complex, m = -1); "
                        "default the outermost subshell. The radial view emphasises its subshell")
    figure.add_argument("--quantity", choices=(*RADIAL_QUANTITIES, *SLICE_QUANTITIES),
                        help="radial: R, P, D (default), Q; slice: psi (default), psi2, density")
    figure.add_argument("--per-electron", action="store_true",
                        help="radial D and Q per electron instead of weighted by occupancy")
    figure.add_argument("--log", action="store_true",
                        help="radial: logarithmic r axis; slice (psi2, density), pair, two-electron "
                        "(radial map): logarithmic colour scale")
    figure.add_argument("--limits", metavar="MODE", default="robust",
                        help="slice, pair, two-electron: colour limits: robust (default: the 99.5th "
                        "percentile), extremes, or LOW,HIGH in the units of the quantity shown "
                        "(--units; a signed quantity spans -HIGH to HIGH; write --limits=-1,1 for "
                        "a negative LOW)")
    figure.add_argument("--colour-map", metavar="NAME",
                        choices=(*SEQUENTIAL_MAP_NAMES, *DIVERGING_MAP_NAMES),
                        help="slice, pair, two-electron: colour map; for densities "
                        f"{', '.join(SEQUENTIAL_MAP_NAMES)} (default viridis), for signed values "
                        f"and differences {', '.join(DIVERGING_MAP_NAMES)} (default RdBu)")
    figure.add_argument("--r-max", type=float, metavar="R",
                        help="radial: outer end of the r axis, in the --units length (default automatic)")
    figure.add_argument("--no-subshells", action="store_true",
                        help="radial: draw only the total and the chosen orbital's subshell")
    figure.add_argument("--no-total", action="store_true", help="radial: leave out the total")
    figure.add_argument("--no-markers", action="store_true",
                        help="radial: leave out the r_max, <r> and node markers")
    figure.add_argument("--plane", choices=("xy", "xz", "yz"),
                        help="slice: coordinate plane (default xz)")
    figure.add_argument("--normal", type=float, nargs=3, metavar=("NX", "NY", "NZ"),
                        help="slice: any plane, by its normal vector (instead of --plane)")
    figure.add_argument("--offset", type=float, metavar="D",
                        help="slice: distance of the plane from the nucleus, in the --units length "
                        "(default 0)")
    figure.add_argument("--extent", type=float, metavar="L",
                        help="slice: half-width of the square shown, in the --units length "
                        "(default: fitted to hold 99.9 %% of the orbital's charge)")
    figure.add_argument("--resolution", type=int, metavar="N",
                        help="slice: grid points along each side (default 256)")
    figure.add_argument("--contours", type=int, metavar="K",
                        help="slice: number of contour lines, 0 for none (default 8)")
    figure.add_argument("--units", default="atomic", choices=UNIT_CHOICES, action=_UnitsAction,
                        help="lengths in bohr (with hartree) or angstrom (with eV), the names the "
                        "window and session files use (atomic and angstrom-ev are accepted too); "
                        "also the unit of --r-max, --offset, --extent, --ref and --limits")
    figure.add_argument("--width", choices=tuple(COLUMN_WIDTHS),
                        help="journal column: single (3.35 in) or double (7.0 in); "
                        "default double for comparisons, single otherwise")
    figure.add_argument("--dpi", type=int, default=300,
                        help=f"PNG resolution, {DPI_RANGE[0]} to {DPI_RANGE[1]} (default 300)")


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
        "configuration_origin": configuration.origin,
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
        "notes": [*orbitals.notes, configuration.origin_note],
        "virial_ratio": _finite_or_none(orbitals.virial_ratio),
        **_correlation_fields(configuration, model, orbitals.total_energy),
    }


def _correlation_fields(configuration: Any, model: str, total: float | None) -> dict[str, Any]:
    """Exact energy and E_corr = E_exact − E_HF for the hartree-fock model (null elsewhere)."""
    from zeffir.core.energy import exact_energy

    found = exact_energy(configuration) if model == "hartree-fock" and total is not None else None
    if found is None:
        return {"exact_energy_hartree": None, "correlation_energy_hartree": None}
    value, source = found
    return {"exact_energy_hartree": value, "exact_energy_source": source,
            "correlation_energy_hartree": value - float(total)}  # type: ignore[arg-type]


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
        f"configuration: {configuration.short_text} ({configuration.origin})",
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
    virial = ("" if orbitals.virial_ratio is None
              else f"   virial ratio −V/T: {orbitals.virial_ratio:.9f}")
    lines.append(f"electrons: {configuration.n_electrons}   "
                 f"total energy: {num(orbitals.total_energy, energy)} {eu}{virial}")
    extra = _correlation_fields(configuration, model, orbitals.total_energy)
    if extra.get("exact_energy_hartree") is not None:
        lines.append(
            f"exact non-relativistic energy: {num(extra['exact_energy_hartree'], energy)} {eu} "
            f"({extra['exact_energy_source']});   correlation energy E_exact − E_HF: "
            f"{num(extra['correlation_energy_hartree'], energy, 5)} {eu}"
        )
    elif model == "hartree-fock":
        lines.append("correlation energy: no published exact energy for this configuration")
    elif model == "hartree-fock-average":
        lines.append("correlation energy: not given for the average of a configuration (not one state)")
    notes = [configuration.origin_note, *orbitals.notes,
             *(note for row in rows for note in row.notes)]
    lines.extend(f"note: {note}" for note in dict.fromkeys(notes))
    return "\n".join(lines)


def _level_json(level: Level) -> dict[str, Any]:
    return {"S": level.S, "L": level.L, "J": level.J, "parity": level.parity, "label": level.label}


def terms_json(spec: str) -> dict[str, Any]:
    """The ``terms --json`` object: every term (repeats listed), the Hund ground level, notes."""
    from zeffir.core import parse_spec
    from zeffir.core.terms import (
        configuration_parity,
        configuration_terms,
        ground_level,
        ground_notes,
        microstate_count,
        observed_level,
    )

    configuration = parse_spec(spec)
    observed = observed_level(configuration)
    return {
        "spec": configuration.spec,
        "configuration": configuration.text,
        "open_subshells": _open_text(configuration),
        "parity": configuration_parity(configuration),
        "microstates": microstate_count(configuration),
        "terms": [
            {"S": term.S, "L": term.L, "parity": term.parity, "J": list(term.J), "label": term.label}
            for term in configuration_terms(configuration)
        ],
        "ground": _level_json(ground_level(configuration)),
        "observed_ground": (None if observed is None or observed.level is None
                            else _level_json(observed.level)),
        "observed_ground_level": None if observed is None else {
            "designation": observed.text, "J": observed.J, "parity": observed.parity,
            "source": observed.source},
        "configuration_origin": configuration.origin,
        "notes": list(ground_notes(configuration)),
    }


def _open_text(configuration: Configuration) -> str:
    return " ".join(f"{sub.label}{configuration.occupancy(sub)}" for sub in configuration.open_subshells)


_MULTIPLICITY_NAMES = ("singlets", "doublets", "triplets", "quartets", "quintets", "sextets",
                       "septets", "octets", "nonets")


def _half(value: float) -> str:
    return f"{value:g}" if value == int(value) else f"{round(2 * value)}/2"


def _format_terms(spec: str) -> str:
    from collections import Counter

    from zeffir.core import parse_spec
    from zeffir.core.terms import (
        configuration_parity,
        configuration_terms,
        ground_level,
        ground_notes,
        microstate_count,
        observed_level,
    )

    configuration = parse_spec(spec)
    terms = configuration_terms(configuration)
    parity = configuration_parity(configuration)
    count = microstate_count(configuration)
    charge = f", charge {configuration.charge:+d}" if configuration.charge else ""
    open_text = _open_text(configuration) or "none (closed shells)"
    mark = " (° marks odd terms)" if parity == "odd" else ""
    lines = [
        f"{configuration.element.name} (Z = {configuration.Z}{charge}): {configuration.text}",
        f"open subshells: {open_text} — {count} microstate{'s' if count != 1 else ''}, "
        f"parity {parity}{mark}",
        "",
    ]
    repeats = Counter(terms)
    distinct = list(repeats)  # first-seen order: S, then L, descending
    names = {term: term.display + (f" ×{repeats[term]}" if repeats[term] > 1 else "")
             for term in distinct}
    width = max(len(name) for name in names.values())
    lines.append(f"{len(terms)} term{'s' if len(terms) != 1 else ''}"
                 + (f" ({len(distinct)} distinct)" if len(distinct) != len(terms) else ""))
    group = None
    for term in distinct:
        if term.multiplicity != group:
            group = term.multiplicity
            title = (_MULTIPLICITY_NAMES[group - 1] if group <= len(_MULTIPLICITY_NAMES)
                     else f"multiplicity {group}")
            lines.append(f"  {title} (S = {_half(term.S)})")
        levels = ", ".join(_half(j) for j in term.J)
        lines.append(f"    {names[term]:<{width}}   J = {levels}")
    lines.append("")
    ground = ground_level(configuration)
    lines.append(f"ground level by Hund's rules: {ground.display}  "
                 f"(S = {_half(ground.S)}, L = {ground.L}, J = {_half(ground.J)})")
    observed = observed_level(configuration)
    if observed is not None:
        lines.append(f"observed ground level: {observed.text}  ({observed.source})")
    lines.append(f"note: {configuration.origin_note}")
    lines.extend(f"note: {note}" for note in ground_notes(configuration))
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


def _has_display() -> bool:
    """False on a Linux machine with no display server and no Qt platform chosen."""
    if not sys.platform.startswith("linux") or os.environ.get("QT_QPA_PLATFORM"):
        return True
    return bool(os.environ.get("DISPLAY") or os.environ.get("WAYLAND_DISPLAY"))


def _window(session: str | None) -> int:
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


class _InputError(Exception):
    """A command-line option is wrong; the message names the option."""


def parse_orbital(label: str) -> OrbitalChoice:
    """Read an orbital option: ``3s``, ``2px``, ``3dxy``, ``4fxyz`` (real) or ``3p:-1`` (complex m).

    A bare subshell (``3p``) means its real m = 0 orbital (pz, dz2, ...).

    Raises
    ------
    QuantumNumberError
        Naming the label and the rule it breaks.
    """
    from zeffir.core import QuantumNumberError, Subshell
    from zeffir.core.config import L_LETTERS
    from zeffir.core.orbitals import real_m_from_label
    from zeffir.state import OrbitalChoice

    text = label.strip()
    head, colon, m_text = text.partition(":")
    digits = len(head) - len(head.lstrip("0123456789"))
    if digits == 0 or digits == len(head) or head[digits].lower() not in L_LETTERS:
        raise QuantumNumberError(f"{label}: not an orbital label (e.g. 3s, 2px, 3dxy, 3p:-1)")
    subshell = Subshell.from_label(head[: digits + 1].lower())
    rest = head[digits + 1:]
    if colon:
        if rest:
            raise QuantumNumberError(f"{label}: give either a real label (2px) or a complex m (2p:1)")
        try:
            m = int(m_text)
        except ValueError:
            raise QuantumNumberError(f"{label}: m must be a whole number, e.g. {subshell.label}:-1") from None
        if abs(m) > subshell.l:
            raise QuantumNumberError(f"{label}: |m| must be at most l = {subshell.l}")
        return OrbitalChoice(subshell.label, "complex", m)
    if not rest:
        return OrbitalChoice(subshell.label, "real", 0)
    try:
        m = real_m_from_label(subshell.l, subshell.letter + rest)
    except QuantumNumberError as error:
        reason = str(error).partition(": ")[2]
        raise QuantumNumberError(f"{label}: {reason}") from None
    return OrbitalChoice(subshell.label, "real", m)


def _length_in_bohr(value: float | None, units: str, option: str) -> float | None:
    from zeffir.core import ANGSTROM_PER_BOHR

    if value is None:
        return None
    if not math.isfinite(value):
        raise _InputError(f"{option}: {value} is not a finite number")
    return value if units == "atomic" else value / ANGSTROM_PER_BOHR


# The state names its fields; the command line names its options.
_STATE_FIELD_OPTIONS = {
    "compare.right.spec": "--versus",
    "compare.right.model": "--versus",
    "radial.r_limit": "--r-max",
    "slice.normal": "--normal",
    "slice.offset": "--offset",
    "slice.extent": "--extent",
    "slice.resolution": "--resolution",
    "slice.contours": "--contours",
    **{f"{part}.colour.{name}": "--limits" for part in ("slice", "pair", "two_electron")
       for name in ("low", "high")},
}


def figure_state(args: argparse.Namespace) -> ViewState:
    """Build the view state that ``zeffir figure`` exports from its parsed options."""
    from dataclasses import replace

    from zeffir.core import ZeffirError, model_names, parse_spec
    from zeffir.state import (
        MAX_SERIES,
        RADIAL_QUANTITIES,
        SLICE_QUANTITIES,
        CompareSettings,
        OrbitalChoice,
        PairSettings,
        RadialSettings,
        SliceSettings,
        Source,
        StateError,
        TwoElectronSettings,
        ViewState,
    )

    spec = " ".join(args.spec)
    configuration = parse_spec(spec)
    view = args.view
    if args.quantity is not None and view in ("pair", "two-electron"):
        raise _InputError(f"--quantity: the {view} view has its own panels; leave --quantity out")
    if args.quantity is not None:
        allowed = RADIAL_QUANTITIES if view == "radial" else SLICE_QUANTITIES
        if args.quantity not in allowed:
            raise _InputError(f"--quantity {args.quantity}: not shown by the {view} view "
                              f"(use one of {', '.join(allowed)})")
    if args.orbital is not None:
        try:
            orbital = parse_orbital(args.orbital)
        except ZeffirError as error:
            raise _InputError(f"--orbital {error}") from None
        occupied = [sub.label for sub, _ in configuration.occupations]
        if orbital.subshell not in occupied:
            raise _InputError(f"--orbital {args.orbital}: {configuration.spec} has no "
                              f"{orbital.subshell} electrons (occupied: {' '.join(occupied)})")
    else:
        orbital = OrbitalChoice("", "real", 0)  # reconciled below to the outermost subshell
    if args.plane is not None and args.normal is not None:
        raise _InputError("--plane and --normal: give one or the other")
    if args.normal is not None and not all(math.isfinite(c) for c in args.normal):
        raise _InputError("--normal: three finite numbers, not all zero")
    radial = RadialSettings(
        quantity=args.quantity if view == "radial" and args.quantity else "D",
        weighted=not args.per_electron,
        show_subshells=not args.no_subshells,
        show_total=not args.no_total,
        show_markers=not args.no_markers,
        log_r=bool(args.log) and view == "radial",
        r_limit=_length_in_bohr(args.r_max, args.units, "--r-max"),
    )
    slice_quantity: Any = args.quantity if view == "slice" and args.quantity else "psi"
    if view == "slice" and args.log and slice_quantity == "psi":
        raise _InputError("--log: ψ is signed and has no logarithmic scale; use --quantity psi2 or density")
    defaults = SliceSettings()
    offset = _length_in_bohr(args.offset, args.units, "--offset")
    extent = _length_in_bohr(args.extent, args.units, "--extent")
    slice_settings = replace(
        defaults,
        plane="custom" if args.normal is not None else (args.plane or defaults.plane),
        normal=tuple(args.normal) if args.normal is not None else defaults.normal,
        offset=defaults.offset if offset is None else offset,
        extent=defaults.extent if extent is None else extent,
        fit_extent=extent is None,
        resolution=defaults.resolution if args.resolution is None else args.resolution,
        contours=defaults.contours if args.contours is None else args.contours,
        quantity=slice_quantity,
    )
    compare = CompareSettings(enabled=False, right=Source(spec, args.model),
                              show_difference=not args.no_difference)
    if args.versus:
        if len(args.versus) > MAX_SERIES - 1:
            raise _InputError(f"--versus: at most {MAX_SERIES - 1} series besides the main one")
        series = [Source(spec, v.strip()) if v.strip() in model_names() else Source(v.strip(), args.model)
                  for v in args.versus]
        same_atom = args.versus[0].strip() in model_names()
        compare = replace(compare, enabled=True, right=series[0], same_atom=same_atom,
                          more=tuple(series[1:]), overlay=bool(args.overlay))
    elif args.overlay:
        raise _InputError("--overlay: needs --versus (the series to overlay)")
    if view in ("pair", "two-electron") and args.versus:
        raise _InputError(f"--versus: the {view} view compares its own panels; leave --versus out")
    reference = (0.0, 0.0, 1.0)
    if args.ref is not None:
        scale = 1.0 if args.units == "atomic" else 1.0 / _angstrom_per_bohr()
        if not all(math.isfinite(c) for c in args.ref):
            raise _InputError("--ref: three finite coordinates")
        reference = tuple(float(c) * scale for c in args.ref)
    if view == "two-electron" and configuration.n_electrons != 2:
        raise _InputError(f"--view two-electron: {configuration.spec} has {configuration.n_electrons} "
                          "electrons; the singlet and triplet maps need exactly two (e.g. 'Li+ 1s1 2s1')")
    state = ViewState(
        left=Source(spec, args.model),
        orbital=orbital,
        view=view,
        length_unit="bohr" if args.units == "atomic" else "angstrom",
        radial=radial,
        slice=slice_settings,
        compare=compare,
        pair=PairSettings(reference=reference, spin=args.spin, determinant=args.determinant),  # type: ignore[arg-type]
        two_electron=TwoElectronSettings(map=args.map, r_limit=radial.r_limit,
                                         resolution=slice_settings.resolution),
    )
    state = _with_colour_options(state, args)
    try:
        return state.validated()
    except StateError as error:
        message = str(error)
        field, _, reason = message.partition(": ")
        option = _STATE_FIELD_OPTIONS.get(field)
        if option is None and field.startswith(("compare.right.", "compare.more")):
            option = "--versus"
        raise _InputError(f"{option}: {reason}" if option else message) from None
    except ZeffirError as error:  # pragma: no cover - validation raises StateError
        raise _InputError(str(error)) from None


def _with_colour_options(state: ViewState, args: argparse.Namespace) -> ViewState:
    """``state`` with ``--log``, ``--limits`` and ``--colour-map`` in the shown view's colour settings.

    Manual limits are typed in the units of the quantity shown (``--units``) and stored
    in atomic units; a signed quantity spans −HIGH to HIGH.
    """
    from dataclasses import replace

    from zeffir.scene import colour_subject, length_factor
    from zeffir.state import DIVERGING_MAP_NAMES

    limits = str(args.limits).strip().lower()
    subject = colour_subject(state)
    if subject is None:
        if limits != "robust" or args.colour_map is not None:
            raise _InputError(f"--limits, --colour-map: the {state.view} view has no colour scale")
        return state
    colour = subject.colour
    if args.log and state.view != "slice":  # the slice view refused ψ with --log already
        if subject.signed:
            raise _InputError("--log: the collinear map ψ is signed and has no logarithmic scale")
        colour = replace(colour, log_scale=True)
    elif args.log:
        colour = replace(colour, log_scale=True)
    if args.colour_map is not None:
        field = "diverging_map" if args.colour_map in DIVERGING_MAP_NAMES else "sequential_map"
        colour = replace(colour, **{field: args.colour_map})
    if limits in ("robust", "extremes"):
        colour = replace(colour, limits=limits)
    else:
        low_text, comma, high_text = limits.partition(",")
        try:
            low, high = float(low_text), float(high_text)
        except ValueError:
            low = high = math.nan
        if not comma or not (math.isfinite(low) and math.isfinite(high)):
            raise _InputError(f"--limits {args.limits}: use robust, extremes or LOW,HIGH "
                              "(e.g. --limits=0,0.05)")
        if not high > 0 or not (subject.signed or low < high):
            raise _InputError(f"--limits {args.limits}: HIGH must be above zero and LOW below HIGH")
        factor = length_factor(state.length_unit, subject.length_power)
        high /= factor
        low = -high if subject.signed else low / factor
        colour = replace(colour, limits="manual", low=low, high=high)
    part = getattr(state, subject.field)
    return replace(state, **{subject.field: replace(part, colour=colour)})


def _angstrom_per_bohr() -> float:
    from zeffir.core import ANGSTROM_PER_BOHR

    return float(ANGSTROM_PER_BOHR)


def _figure(args: argparse.Namespace) -> int:
    from zeffir.export import DPI_RANGE, export_view

    if not DPI_RANGE[0] <= args.dpi <= DPI_RANGE[1]:
        raise _InputError(f"--dpi {args.dpi}: must be between {DPI_RANGE[0]} and {DPI_RANGE[1]}")
    state = figure_state(args)
    written = export_view(state, args.out, width=args.width, dpi=args.dpi)
    print(f"wrote {written}")
    return 0


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line; returns the exit status."""
    from zeffir.core import ZeffirError

    args = _parser().parse_args(argv)
    try:
        if args.command is None:
            return _window(args.session)
        if args.command == "demo":
            return _demo()
        if args.command == "table":
            spec = " ".join(args.spec)
            if args.json:
                print(json.dumps(table_json(spec, args.model)))
            else:
                print(_format_table(spec, args.model, args.units))
            return 0
        if args.command == "terms":
            spec = " ".join(args.spec)
            print(json.dumps(terms_json(spec)) if args.json else _format_terms(spec))
            return 0
        if args.command == "figure":
            return _figure(args)
    except (ZeffirError, _InputError) as error:
        print(f"zeffir: {error}", file=sys.stderr)
        return EXIT_BAD_INPUT
    except BrokenPipeError:  # output piped into a reader that closed early (e.g. head)
        sys.stderr.close()
        return 0
    return 0  # pragma: no cover - argparse rejects unknown commands

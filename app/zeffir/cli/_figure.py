"""``zeffir figure``: its options, the view state they build, and the export."""

from __future__ import annotations

import argparse
import math
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from zeffir.state import OrbitalChoice, ViewState
from zeffir.cli._common import (
    _EXIT_CODES_TEXT,
    UNIT_CHOICES,
    _angstrom_per_bohr,
    _InputError,
    _length_in_bohr,
    _UnitsAction,
)


def _add_figure_parser(commands: Any, default_model: str, models: Sequence[str],
                       chatter: argparse.ArgumentParser) -> None:
    from zeffir.export import COLUMN_WIDTHS, DPI_RANGE, EXPORT_FORMATS
    from zeffir.state import DIVERGING_MAP_NAMES, RADIAL_QUANTITIES, SEQUENTIAL_MAP_NAMES, SLICE_QUANTITIES

    figure = commands.add_parser(
        "figure", parents=[chatter],
        help="write a figure (.png .svg .pdf) or the data (.csv .npz) of a view",
        description="Write one of the views — radial (curves), slice (a plane through the "
        "atom), pair (densities of the other electrons and the exchange hole for a reference "
        "electron) or two-electron (singlet, triplet and their difference) — as a publication "
        f"figure or a data file; the format follows the suffix of --out ({' '.join(EXPORT_FORMATS)}). "
        "Radial data go to .csv, the other views' data to .npz.",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="examples:\n"
        "  zeffir figure Na --versus clementi --out na-3s.pdf\n"
        "  zeffir figure Fe --versus clementi --versus hydrogenic --versus Co --overlay --out fe.svg\n"
        "  zeffir figure Fe --view slice --orbital 3dxy --plane xy --out fe-3dxy.png\n"
        "  zeffir figure N --view pair --ref 0 0 1 --log --out n-pair.npz\n"
        "  zeffir figure 'Li+ 1s1 2s1' --view two-electron --map collinear --out li.pdf\n"
        "  zeffir figure Ne --model hartree-fock --units angstrom --out ne.csv\n\n"
        + _EXIT_CODES_TEXT,
    )
    what = figure.add_argument_group("what to draw")
    compare = figure.add_argument_group("comparison (radial and slice views)")
    radial = figure.add_argument_group("radial view")
    plane = figure.add_argument_group("slice view (the plane is also the pair view's)")
    pair = figure.add_argument_group("pair view")
    two = figure.add_argument_group("two-electron view")
    colour = figure.add_argument_group("colour (slice, pair and two-electron views)")
    output = figure.add_argument_group("output")
    what.add_argument("spec", nargs="+", metavar="SPEC",
                        help="atom spec, e.g. Fe, 26, Fe3+, O2-, 'C 1s2 2s1 2p3', 'Na [Ne] 4d1'")
    output.add_argument("--out", required=True, metavar="FILE",
                        help="output file: .png .svg .pdf (figure), .csv (radial data), .npz (slice, pair "
                        "and two-electron data)")
    what.add_argument("--view", default="radial", choices=("radial", "slice", "pair", "two-electron"),
                        help="radial curves, a 2D slice, the pair view (densities of the other "
                        "electrons and the exchange hole for a reference electron) or the "
                        "two-electron view (singlet, triplet, difference); default radial")
    pair.add_argument("--ref", type=float, nargs=3, metavar=("X", "Y", "Z"),
                        help="pair: position of the reference electron, in the --units length "
                        "(default 0 0 1 bohr)")
    pair.add_argument("--spin", choices=("up", "down"), default="up",
                        help="pair: spin of the reference electron (default up)")
    pair.add_argument("--determinant", metavar="TEXT", default="",
                        help="pair: spin-orbitals of open subshells, e.g. '2p: 1u 0u -1d' "
                        "(default Hund's rules)")
    two.add_argument("--map", choices=("radial", "collinear"), default="radial",
                        help="two-electron: radial pair distribution P(r1, r2), or ψ with both "
                        "electrons on the z axis (default radial)")
    what.add_argument("--model", default=default_model, choices=models,
                        help=f"model (default {default_model})")
    compare.add_argument("--versus", metavar="B", action="append",
                        help="compare side by side, with the difference: a model name compares "
                        "models on the same spec; anything else is a second spec under --model. "
                        "Repeat it for more series (up to five; the difference needs exactly one)")
    compare.add_argument("--no-difference", action="store_true",
                        help="with --versus: leave out the difference panel")
    compare.add_argument("--overlay", action="store_true",
                        help="with --versus, radial view: every series' curves on one set of axes "
                        "(one line style per series)")
    what.add_argument("--orbital", metavar="LABEL",
                        help="orbital shown: 3s, 2px, 3dxy, 4fxyz (real), or 3p:-1 (complex, m = -1); "
                        "default the outermost subshell. The radial view emphasises its subshell")
    what.add_argument("--quantity", choices=(*RADIAL_QUANTITIES, *SLICE_QUANTITIES),
                        help="radial: R, P, D (default), Q; slice: psi (default), psi2, density")
    radial.add_argument("--per-electron", action="store_true",
                        help="radial D and Q per electron instead of weighted by occupancy")
    colour.add_argument("--log", action="store_true",
                        help="radial: logarithmic r axis; slice (psi2, density), pair, two-electron "
                        "(radial map): logarithmic colour scale")
    colour.add_argument("--limits", metavar="MODE", default="robust",
                        help="slice, pair, two-electron: colour limits: robust (default: the 99.5th "
                        "percentile), extremes, or LOW,HIGH in the units of the quantity shown "
                        "(--units; a signed quantity spans -HIGH to HIGH; write --limits=-1,1 for "
                        "a negative LOW)")
    colour.add_argument("--colour-map", metavar="NAME",
                        choices=(*SEQUENTIAL_MAP_NAMES, *DIVERGING_MAP_NAMES),
                        help="slice, pair, two-electron: colour map; for densities "
                        f"{', '.join(SEQUENTIAL_MAP_NAMES)} (default viridis), for signed values "
                        f"and differences {', '.join(DIVERGING_MAP_NAMES)} (default RdBu)")
    radial.add_argument("--r-max", type=float, metavar="R",
                        help="radial: outer end of the r axis, in the --units length (default automatic)")
    radial.add_argument("--no-subshells", action="store_true",
                        help="radial: draw only the total and the chosen orbital's subshell")
    radial.add_argument("--no-total", action="store_true", help="radial: leave out the total")
    radial.add_argument("--no-markers", action="store_true",
                        help="radial: leave out the r_max, <r> and node markers")
    plane.add_argument("--plane", choices=("xy", "xz", "yz"),
                        help="slice: coordinate plane (default xz)")
    plane.add_argument("--normal", type=float, nargs=3, metavar=("NX", "NY", "NZ"),
                        help="slice: any plane, by its normal vector (instead of --plane)")
    plane.add_argument("--offset", type=float, metavar="D",
                        help="slice: distance of the plane from the nucleus, in the --units length "
                        "(default 0)")
    plane.add_argument("--extent", type=float, metavar="L",
                        help="slice: half-width of the square shown, in the --units length "
                        "(default: fitted to hold 99.9 %% of the orbital's charge)")
    plane.add_argument("--resolution", type=int, metavar="N",
                        help="slice: grid points along each side (default 256)")
    plane.add_argument("--contours", type=int, metavar="K",
                        help="slice: number of contour lines, 0 for none (default 8)")
    output.add_argument("--units", default="atomic", choices=UNIT_CHOICES, action=_UnitsAction,
                        help="lengths in bohr (with hartree) or angstrom (with eV), the names the "
                        "window and session files use (atomic and angstrom-ev are accepted too); "
                        "also the unit of --r-max, --offset, --extent, --ref and --limits")
    output.add_argument("--width", choices=tuple(COLUMN_WIDTHS),
                        help="journal column: single (3.35 in) or double (7.0 in); "
                        "default double for comparisons, single otherwise")
    output.add_argument("--dpi", type=int, default=300,
                        help=f"PNG resolution, {DPI_RANGE[0]} to {DPI_RANGE[1]} (default 300)")
    output.add_argument("--compiled", action="store_true",
                        help="use the numba-compiled grid kernels; loading them costs 1-2 s, so a "
                        "single figure is faster without (the default); the values are the same")


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


#: The state fields the figure options set, by the option's name (for messages).
_OPTION_OF_FIELD = {
    "pair.reference": "--ref", "slice.offset": "--offset", "slice.normal": "--normal",
    "slice.extent": "--extent", "slice.resolution": "--resolution", "slice.contours": "--contours",
    "radial.r_limit": "--r-max", "slice.plane": "--plane",
}


def _in_option_names(error: Exception) -> Exception:
    """The same refusal, naming the option typed instead of the state field it sets."""
    text = str(error)
    for field, option in _OPTION_OF_FIELD.items():
        if text.startswith(f"{field}:"):
            return _InputError(option + text[len(field):])
    return error


def _figure(args: argparse.Namespace) -> int:
    from zeffir.core import set_compiled_kernels

    # One picture: the plain-numpy kernels finish before numba would have loaded. The
    # choice is the process's, so a caller running several commands in one process
    # (a script, the test suite) gets its own choice back afterwards.
    previous = set_compiled_kernels(bool(args.compiled))
    try:
        return _write_figure(args)
    finally:
        set_compiled_kernels(previous)


def _write_figure(args: argparse.Namespace) -> int:
    from zeffir.core import ZeffirError
    from zeffir.export import DPI_RANGE, check_target, export_view

    if not DPI_RANGE[0] <= args.dpi <= DPI_RANGE[1]:
        raise _InputError(f"--dpi {args.dpi}: must be between {DPI_RANGE[0]} and {DPI_RANGE[1]}")
    check_target(args.out)  # a bad --out is refused before the figure is computed
    try:
        state = figure_state(args)
    except (ZeffirError, _InputError) as error:
        raise _in_option_names(error) from None
    written = export_view(state, args.out, width=args.width, dpi=args.dpi)
    print(f"wrote {written}")
    return 0

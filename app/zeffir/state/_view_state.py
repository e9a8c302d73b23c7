"""What is on screen, as plain data: the single source of truth for views and sessions.

The window edits these objects; views redraw from them; a session file stores
them. Nothing here imports Qt or does physics.
"""

from __future__ import annotations

import math
import re
import unicodedata
from dataclasses import dataclass, field, fields, replace
from functools import lru_cache
from typing import Any, Final, Literal, get_args

from zeffir.core import DEFAULT_MODEL, ZeffirError, model_names, parse_spec
from zeffir.core.config import L_LETTERS, MAX_L
from zeffir.core.density import MAX_RESOLUTION

__all__ = [
    "COLOUR_LIMITS",
    "COLOUR_VALUE_LIMIT",
    "DEFAULT_DIVERGING_MAP",
    "DEFAULT_SEQUENTIAL_MAP",
    "DIVERGING_MAP_NAMES",
    "LENGTH_LIMIT",
    "LENGTH_UNITS",
    "MAX_SERIES",
    "MAX_SPEC_LENGTH",
    "MIN_LENGTH",
    "RADIAL_QUANTITIES",
    "SEQUENTIAL_MAP_NAMES",
    "SLICE_QUANTITIES",
    "ColourSettings",
    "CompareSettings",
    "OrbitalChoice",
    "PairSettings",
    "RadialSettings",
    "SliceSettings",
    "Source",
    "StateError",
    "TrendSettings",
    "TwoElectronSettings",
    "ViewState",
]

LengthUnit = Literal["bohr", "angstrom"]
RadialQuantity = Literal["R", "P", "D", "Q"]
SliceQuantity = Literal["psi", "psi2", "density"]
PlaneName = Literal["xy", "xz", "yz", "custom"]
ViewName = Literal["radial", "slice", "pair", "two-electron", "terms", "trends"]
SpinName = Literal["up", "down"]
TwoElectronMap = Literal["radial", "collinear"]
ColourLimits = Literal["robust", "extremes", "manual"]

LENGTH_UNITS: Final = get_args(LengthUnit)
RADIAL_QUANTITIES: Final = get_args(RadialQuantity)
SLICE_QUANTITIES: Final = get_args(SliceQuantity)
PLANE_NAMES: Final = get_args(PlaneName)
VIEW_NAMES: Final = get_args(ViewName)
COLOUR_LIMITS: Final = get_args(ColourLimits)
#: Colour maps a view may choose (their colours are in ``zeffir.scene._colours``):
#: perceptually uniform sequential maps for densities, diverging maps for signed values.
SEQUENTIAL_MAP_NAMES: Final[tuple[str, ...]] = ("viridis", "cividis", "magma", "inferno", "plasma")
DIVERGING_MAP_NAMES: Final[tuple[str, ...]] = ("RdBu", "PuOr", "BrBG", "coolwarm")
DEFAULT_SEQUENTIAL_MAP: Final = "viridis"
DEFAULT_DIVERGING_MAP: Final = "RdBu"
#: Largest slice resolution offered in the window (the core accepts more).
MAX_VIEW_RESOLUTION: Final[int] = min(1024, MAX_RESOLUTION)
#: Largest length a state holds, in bohr (half-widths, offsets, r₁, radial limits): far
#: beyond any atom, yet small enough that squares and grids stay finite.
LENGTH_LIMIT: Final[float] = 1e4
#: Smallest half-width or radial limit, in bohr (a tenth of the 1s radius of the heaviest atoms).
MIN_LENGTH: Final[float] = 1e-3
#: Largest magnitude of a manual colour limit (atomic units), as in the window's boxes.
COLOUR_VALUE_LIMIT: Final[float] = 1e30
#: Longest spec or determinant text (a full explicit configuration of element 118 is ~90).
MAX_SPEC_LENGTH: Final[int] = 256
#: Longest subshell label (``"20i"`` is the longest valid one).
_MAX_SUBSHELL_LENGTH: Final[int] = 8
#: Normal vectors: components up to this magnitude, the largest at least its inverse.
_NORMAL_LIMIT: Final[float] = 1e6


class StateError(ZeffirError, ValueError):
    """A state (typed or read from a session file) is invalid; the message names the field."""


@dataclass(frozen=True)
class Source:
    """One atom under one model: what a view evaluates."""

    spec: str = "Na"
    model: str = DEFAULT_MODEL

    def validated(self) -> Source:
        """Return self after checking the spec parses and the model exists."""
        _check_source("", self, parse=True)
        return self


@dataclass(frozen=True)
class OrbitalChoice:
    """Which orbital the slice and the radial highlight show.

    ``kind="real"`` uses real harmonics (m > 0 cos, m < 0 sin: px, dxy, ...);
    ``kind="complex"`` uses Y_l^m with the Condon–Shortley phase.
    """

    subshell: str = "3s"
    kind: Literal["real", "complex"] = "real"
    m: int = 0


@dataclass(frozen=True)
class RadialSettings:
    """How the radial view draws its curves."""

    quantity: RadialQuantity = "D"
    weighted: bool = True
    show_subshells: bool = True
    show_total: bool = True
    show_markers: bool = True
    log_r: bool = False
    r_limit: float | None = None  # bohr; None = automatic


@dataclass(frozen=True)
class ColourSettings:
    """How a slice-type view (slice, pair, two-electron) maps its values to colours.

    Each of those views keeps its own. The defaults are the scale the views have
    always drawn: robust limits, linear, viridis and RdBu.

    Attributes
    ----------
    limits : {"robust", "extremes", "manual"}
        ``"robust"``: a linear scale ends at the 99.5th percentile of |value|, so a
        nuclear cusp does not wash out the rest; ``"extremes"``: the full range of
        values; ``"manual"``: ``low`` to ``high``.
    low, high : float
        Manual limits as values of the quantity shown, in atomic units (bohr⁻³ for a
        density, bohr⁻³ᐟ² for ψ, ...). A signed quantity keeps a symmetric scale,
        −high to high. On a logarithmic scale the limits are values too (mapped
        through log10); a low limit at or below zero then means "``log_decades``
        below high".
    log_scale : bool
        Logarithmic colours for quantities without a sign.
    log_decades : float
        Decades below the top a logarithmic scale spans (robust and extremes).
    sequential_map, diverging_map : str
        The maps for quantities without a sign and for signed ones (the difference
        panels, which are signed, use ``diverging_map``).
    """

    limits: ColourLimits = "robust"
    low: float = 0.0
    high: float = 1.0
    log_scale: bool = False
    log_decades: float = 6.0
    sequential_map: str = DEFAULT_SEQUENTIAL_MAP
    diverging_map: str = DEFAULT_DIVERGING_MAP

    def check(self, where: str) -> None:
        """Raise :class:`StateError` naming the first bad field as ``{where}.{field}``."""
        _check_choice(f"{where}.limits", self.limits, COLOUR_LIMITS)
        low, high = _number(self.low), _number(self.high)
        limit = f"{COLOUR_VALUE_LIMIT:.0e}"
        if low is None or abs(low) > COLOUR_VALUE_LIMIT:
            raise StateError(f"{where}.low: must be a finite number (magnitude at most {limit})")
        if high is None or not 0 < high <= COLOUR_VALUE_LIMIT:
            raise StateError(f"{where}.high: must be a positive finite number (at most {limit})")
        if not low < high:
            raise StateError(f"{where}.low: must be below high ({high:g}), got {low:g}")
        decades = _number(self.log_decades)
        if decades is None or not 1.0 <= decades <= 16.0:
            raise StateError(f"{where}.log_decades: between 1 and 16 decades")
        _check_choice(f"{where}.sequential_map", self.sequential_map, SEQUENTIAL_MAP_NAMES)
        _check_choice(f"{where}.diverging_map", self.diverging_map, DIVERGING_MAP_NAMES)


@dataclass(frozen=True)
class SliceSettings:
    """Where and what the slice view shows, and its colour scale (``colour``)."""

    plane: PlaneName = "xz"
    normal: tuple[float, float, float] = (0.0, 0.0, 1.0)
    offset: float = 0.0  # bohr
    extent: float = 8.0  # bohr, half-width
    resolution: int = 256
    quantity: SliceQuantity = "psi"
    contours: int = 8
    # Half-width fitted to what is shown (99.9 % of the orbital's charge) instead of ``extent``.
    fit_extent: bool = True
    colour: ColourSettings = field(default_factory=ColourSettings)

    # Read-only names of the colour settings that once lived here (sessions written
    # before store them flat; ``ViewState.from_dict`` moves them into ``colour``).
    @property
    def log_scale(self) -> bool:
        """``colour.log_scale``."""
        return self.colour.log_scale

    @property
    def log_decades(self) -> float:
        """``colour.log_decades``."""
        return self.colour.log_decades

    @property
    def full_range(self) -> bool:
        """True when the colour scale spans the extreme values (``colour.limits``)."""
        return self.colour.limits == "extremes"


@dataclass(frozen=True)
class PairSettings:
    """The pair view: a reference electron, its spin, and which determinant.

    The plane, half-width and resolution are the slice view's.
    """

    reference: tuple[float, float, float] = (0.0, 0.0, 1.0)  # bohr
    spin: SpinName = "up"
    determinant: str = ""  # open-subshell choice in the determinant syntax; "" = Hund's rules
    colour: ColourSettings = field(default_factory=ColourSettings)


@dataclass(frozen=True)
class TwoElectronSettings:
    """The two-electron view: which pair of subshells and which map."""

    map: TwoElectronMap = "radial"
    r_limit: float | None = None  # bohr; None = automatic
    resolution: int = 256
    colour: ColourSettings = field(default_factory=ColourSettings)


#: Most series a comparison holds (the main atom, the second series and the further ones).
MAX_SERIES: Final[int] = 6


@dataclass(frozen=True)
class TrendSettings:
    """The Trends view: one quantity over many configurations, one line per model.

    Attributes
    ----------
    quantity : str
        A name of :func:`zeffir.core.trends.quantity_names` (``z_eff``, ``energy``,
        ``ionization_energy``...).
    rule : str
        Which configurations, as ``zeffir trend --over`` takes it (``Z=1-36``,
        ``isoelectronic=10:Z=10-20``, ``family=[Ar] 3dn 4s2:n=1-10``, or specs
        separated by commas).
    models : str
        Models separated by commas, one line each (at most six).
    subshell : str
        For per-subshell quantities: a label such as ``3d``, or ``valence``; several
        separated by commas (``3d,4s``), one line each.
    methods : str
        For ionization energies: ``koopmans``, ``delta-scf`` or both, separated by commas.
    """

    quantity: str = "z_eff"
    rule: str = "Z=1-36"
    models: str = "slater,clementi,hartree-fock"
    subshell: str = "valence"
    methods: str = "koopmans"

    def model_list(self) -> tuple[str, ...]:
        """The models, in order."""
        return tuple(m.strip() for m in self.models.split(",") if m.strip())

    def method_list(self) -> tuple[str, ...]:
        """The ionization methods, in order."""
        return tuple(m.strip() for m in self.methods.split(",") if m.strip())

    def check(self) -> None:
        """Raise :class:`StateError` naming the first wrong setting (remembered per settings:
        every state change validates the whole state, and a rule may list many specs)."""
        _check_trend_settings(self)

    def _check(self) -> None:
        from zeffir.core.trends import IONIZATION_METHODS, TrendRuleError, parse_rule, quantity

        _check_text("trends.rule", self.rule, 4 * MAX_SPEC_LENGTH)
        try:
            quantity(self.quantity)
        except ZeffirError as error:
            raise StateError(f"trends.quantity: {error}") from None
        try:
            parse_rule(self.rule)
        except TrendRuleError as error:
            raise StateError(f"trends.rule: {error}") from None
        models = self.model_list()
        if not models or len(models) > MAX_SERIES:
            raise StateError(f"trends.models: name from 1 to {MAX_SERIES} models separated by commas")
        for name in models:
            if name not in model_names():
                raise StateError(f"trends.models: {_shown(name)} is not one of {', '.join(model_names())}")
        methods = self.method_list()
        if not methods or any(m not in IONIZATION_METHODS for m in methods):
            raise StateError(f"trends.methods: choose {' and/or '.join(IONIZATION_METHODS)}")
        for label in (part.strip() for part in self.subshell.split(",")):
            if label != "valence" and not re.fullmatch(r"\d{1,2}[spdfghik]", label):
                raise StateError(f"trends.subshell: {_shown(label)} is not a subshell label (e.g. 3d) "
                                 "or 'valence'")


@lru_cache(maxsize=64)
def _check_trend_settings(settings: TrendSettings) -> None:
    settings._check()


@dataclass(frozen=True)
class CompareSettings:
    """The comparison: the second series, any further ones, and how they are laid out.

    With ``same_atom`` (the default) the second series follows the main atom and only
    its model is its own; a different atom there is a deliberate, saved choice.
    ``more`` holds the further series (up to :data:`MAX_SERIES` in all); a further
    series whose spec is empty follows the main atom. ``overlay`` draws the radial
    curves of every series on one set of axes (one line style per series) instead of
    side by side. The difference panel exists only for exactly two series.
    """

    enabled: bool = False
    right: Source = field(default_factory=lambda: Source("Na", "clementi"))
    show_difference: bool = True
    same_atom: bool = True
    more: tuple[Source, ...] = field(default=(), metadata={"items": Source, "max_items": MAX_SERIES - 2})
    overlay: bool = False

    def sources(self, main: Source) -> tuple[Source, ...]:
        """Every series in order, the main source first (just it when the comparison is off)."""
        if not self.enabled:
            return (main,)
        right = replace(self.right, spec=main.spec) if self.same_atom else self.right
        further = tuple(replace(s, spec=main.spec) if not s.spec.strip() else s for s in self.more)
        return (main, right, *further)

    def has_difference(self) -> bool:
        """True when a difference panel is drawn: exactly two series and the setting on."""
        return self.enabled and self.show_difference and not self.more


@dataclass(frozen=True)
class ViewState:
    """Everything that defines what the window shows."""

    left: Source = field(default_factory=Source)
    orbital: OrbitalChoice = field(default_factory=OrbitalChoice)
    view: ViewName = "radial"
    length_unit: LengthUnit = "bohr"
    radial: RadialSettings = field(default_factory=RadialSettings)
    slice: SliceSettings = field(default_factory=SliceSettings)
    compare: CompareSettings = field(default_factory=CompareSettings)
    pair: PairSettings = field(default_factory=PairSettings)
    two_electron: TwoElectronSettings = field(default_factory=TwoElectronSettings)
    trends: TrendSettings = field(default_factory=TrendSettings)

    def with_changes(self, **changes: Any) -> ViewState:
        """A copy with top-level fields replaced (nested objects are replaced whole)."""
        return replace(self, **changes)

    def validated(self) -> ViewState:
        """Check every field; return the state with the orbital choice reconciled.

        Every field is checked for its type first (so a state built in code with a
        wrong type fails as one read from a file does), then for its range.

        Raises
        ------
        StateError
            Naming the first offending field, e.g. ``slice.resolution: ...``.
        """
        _check_types(self, "")
        self.left.validated()
        state = self
        if self.compare.same_atom and self.compare.right.spec != self.left.spec:
            right = replace(self.compare.right, spec=self.left.spec)
            state = replace(self, compare=replace(self.compare, right=right))
        return state._validated()

    def series(self) -> tuple[Source, ...]:
        """The sources the radial and slice views show: the main one, then the comparison's."""
        return self.compare.sources(self.left)

    def _validated(self) -> ViewState:
        compare = self.compare
        if len(compare.more) > MAX_SERIES - 2:
            raise StateError(_too_many_series("compare.more"))
        # The comparison's sources are parsed only when it is on (they are not used
        # otherwise), but their text and model are always checked.
        _check_source("compare.right.", compare.right, parse=compare.enabled)
        for index, extra in enumerate(compare.more):
            _check_text(f"compare.more[{index}].spec", extra.spec, MAX_SPEC_LENGTH)
            extra = replace(extra, spec=extra.spec.strip() or self.left.spec)
            _check_source(f"compare.more[{index}].", extra, parse=compare.enabled)
        _check_choice("view", self.view, VIEW_NAMES)
        _check_choice("length_unit", self.length_unit, LENGTH_UNITS)
        _check_choice("radial.quantity", self.radial.quantity, RADIAL_QUANTITIES)
        _check_optional_length("radial.r_limit", self.radial.r_limit)
        s = self.slice
        _check_choice("slice.plane", s.plane, PLANE_NAMES)
        _check_choice("slice.quantity", s.quantity, SLICE_QUANTITIES)
        _check_normal("slice.normal", s.normal)
        if not MIN_LENGTH <= s.extent <= LENGTH_LIMIT:
            raise StateError(f"slice.extent: must be a positive number of bohr (from {MIN_LENGTH:g} "
                             f"to {LENGTH_LIMIT:g})")
        if not -LENGTH_LIMIT <= s.offset <= LENGTH_LIMIT:
            raise StateError(f"slice.offset: must be a number of bohr between {-LENGTH_LIMIT:g} and "
                             f"{LENGTH_LIMIT:g}")
        if not 16 <= s.resolution <= MAX_VIEW_RESOLUTION:
            raise StateError(f"slice.resolution: must be between 16 and {MAX_VIEW_RESOLUTION}")
        s.colour.check("slice.colour")
        if not 0 <= s.contours <= 40:
            raise StateError("slice.contours: between 0 and 40 levels")
        _check_orbital(self.orbital)
        _check_choice("pair.spin", self.pair.spin, ("up", "down"))
        if not all(abs(c) <= LENGTH_LIMIT for c in self.pair.reference):
            raise StateError(f"pair.reference: three coordinates in bohr (each between "
                             f"{-LENGTH_LIMIT:g} and {LENGTH_LIMIT:g})")
        _check_text("pair.determinant", self.pair.determinant, MAX_SPEC_LENGTH)
        _check_choice("two_electron.map", self.two_electron.map, ("radial", "collinear"))
        if not 16 <= self.two_electron.resolution <= MAX_VIEW_RESOLUTION:
            raise StateError(f"two_electron.resolution: must be between 16 and {MAX_VIEW_RESOLUTION}")
        _check_optional_length("two_electron.r_limit", self.two_electron.r_limit)
        self.pair.colour.check("pair.colour")
        self.two_electron.colour.check("two_electron.colour")
        self.trends.check()
        return replace(self, orbital=reconcile_orbital(self.left.spec, self.orbital))

    def to_dict(self) -> dict[str, Any]:
        """Plain JSON-ready data."""
        return _as_dict(self)

    @classmethod
    def from_dict(cls, data: Any) -> ViewState:
        """Rebuild and validate a state from :meth:`to_dict` output.

        Unknown keys are ignored (forward-compatible reading within a version);
        missing keys take their defaults; wrong types raise :class:`StateError`.
        """
        if not isinstance(data, dict):
            raise StateError("state: expected an object")
        plane = data.get("slice")
        if isinstance(plane, dict) and "fit_extent" not in plane:
            # Sessions written before the setting existed keep the half-width they saved.
            data = {**data, "slice": {**plane, "fit_extent": False}}
        data = _colour_from_flat_keys(data)
        compare = data.get("compare")
        if isinstance(compare, dict) and "same_atom" not in compare:
            # Sessions written before the setting existed: a right-hand atom that differs
            # from the main one was chosen on purpose.
            right, left = compare.get("right"), data.get("left")
            same = (isinstance(right, dict) and isinstance(left, dict)
                    and right.get("spec", Source().spec) == left.get("spec", Source().spec))
            data = {**data, "compare": {**compare, "same_atom": same}}
        return _from_dict(cls, data, "").validated()


def _colour_from_flat_keys(data: dict[str, Any]) -> dict[str, Any]:
    """Sessions written before colour settings had their own object: move them there.

    Those kept ``log_scale``, ``log_decades`` and ``full_range`` flat in ``slice``, and
    the pair view drew with them too; the two-electron view always drew robust and
    linear (the defaults). So ``slice.colour`` and ``pair.colour`` are made from the
    flat keys (``full_range: true`` is ``limits: "extremes"``) unless they are there.
    """
    plane = data.get("slice")
    if not isinstance(plane, dict):
        return data
    legacy: dict[str, Any] = {key: plane[key] for key in ("log_scale", "log_decades") if key in plane}
    if "full_range" in plane:
        if not isinstance(plane["full_range"], bool):
            raise StateError("slice.full_range: expected true or false")
        legacy["limits"] = "extremes" if plane["full_range"] else "robust"
    if not legacy:
        return data
    if "colour" not in plane:
        data = {**data, "slice": {**plane, "colour": legacy}}
    pair = data.get("pair", {})
    if isinstance(pair, dict) and "colour" not in pair:
        data = {**data, "pair": {**pair, "colour": legacy}}
    return data


def _number(value: object) -> float | None:
    """``value`` as a finite float, or None when it is not a number (bools are not) or not finite.

    Never raises: an integer too large for a float (``float(10**400)`` overflows) is None.
    """
    if isinstance(value, bool) or not isinstance(value, int | float):
        return None
    try:
        number = float(value)
    except OverflowError:
        return None
    return number if math.isfinite(number) else None


def _shown(value: object) -> str:
    """A short, safe rendering of a bad value for a message.

    Long text is cut, a huge integer is described by its size (``str`` of one over
    4300 digits raises), and containers are named by their type (their ``repr``
    could be huge or nested too deeply).
    """
    if isinstance(value, str):
        return repr(value) if len(value) <= 40 else f"{value[:40]!r}… ({len(value)} characters)"
    typed = getattr(value, "typed_text", None)  # a number a session file wrote too large
    if isinstance(value, float) and isinstance(typed, str):
        return f"{typed} (too large for a floating-point number)"
    if isinstance(value, bool) or value is None or isinstance(value, float):
        return repr(value)
    if isinstance(value, int):
        if value.bit_length() <= 64:
            return repr(value)
        return f"a whole number of about {int(value.bit_length() * math.log10(2)) + 1} digits"
    return f"a {type(value).__name__}"


def _check_choice(name: str, value: object, allowed: tuple[object, ...]) -> None:
    if not isinstance(value, str) or value not in allowed:
        raise StateError(f"{name}: {_shown(value)} is not one of {', '.join(map(str, allowed))}")


def _check_text(where: str, value: object, limit: int) -> None:
    """Text of at most ``limit`` characters, without control characters or lone surrogates."""
    if not isinstance(value, str):
        raise StateError(f"{where}: expected text")
    if len(value) > limit:
        raise StateError(f"{where}: at most {limit} characters, got {len(value)}")
    # A lone surrogate cannot be written as UTF-8 (a later save would fail); control
    # characters have no place in a spec or a label (a tab is whitespace, as typed).
    if any(c != "\t" and unicodedata.category(c) in ("Cc", "Cs") for c in value):
        raise StateError(f"{where}: contains control characters or unpaired surrogates")


def _check_source(where: str, source: Source, *, parse: bool) -> None:
    """Check a source's text and model; parse its spec only when ``parse``."""
    _check_text(f"{where}spec", source.spec, MAX_SPEC_LENGTH)
    if not isinstance(source.model, str) or source.model not in model_names():
        plain = isinstance(source.model, str) and len(source.model) <= 40 and source.model.isprintable()
        shown = source.model if plain else _shown(source.model)
        raise StateError(f"{where}model: {shown}: unknown model "
                         f"(use one of {', '.join(model_names())})")
    if parse:
        try:
            parse_spec(source.spec)
        except ZeffirError as error:
            raise StateError(f"{where}spec: {error}") from None


def _check_optional_length(where: str, value: float | None) -> None:
    if value is not None and not MIN_LENGTH <= value <= LENGTH_LIMIT:
        raise StateError(f"{where}: must be a positive number of bohr (from {MIN_LENGTH:g} to "
                         f"{LENGTH_LIMIT:g}) or empty")


def _check_normal(where: str, normal: tuple[float, ...]) -> None:
    components = [_number(c) for c in normal]
    largest = max((abs(c) for c in components if c is not None), default=0.0)
    # Components far apart in size would square to zero or infinity when normalised.
    if None in components or not 1 / _NORMAL_LIMIT <= largest <= _NORMAL_LIMIT:
        raise StateError(f"{where}: three numbers, not all zero (the largest in magnitude "
                         f"between {1 / _NORMAL_LIMIT:g} and {_NORMAL_LIMIT:g})")


_SUBSHELL_LABEL: Final = re.compile(rf"[1-9][0-9]?[{L_LETTERS}]")


def _check_orbital(orbital: OrbitalChoice) -> None:
    """The label's text, the kind, and m within ±l of the label (±MAX_L for a label that is none).

    A label that names no occupied subshell is not an error: the state takes the
    outermost subshell instead (:func:`reconcile_orbital`).
    """
    _check_text("orbital.subshell", orbital.subshell, _MAX_SUBSHELL_LENGTH)
    _check_choice("orbital.kind", orbital.kind, ("real", "complex"))
    label = orbital.subshell
    l = L_LETTERS.index(label[-1]) if _SUBSHELL_LABEL.fullmatch(label) else MAX_L
    if not -l <= orbital.m <= l:
        owner = f" for {label}" if _SUBSHELL_LABEL.fullmatch(label) else ""
        raise StateError(f"orbital.m: must be between {-l} and {l}{owner}")


def _too_many_series(where: str) -> str:
    return f"{where}: at most {MAX_SERIES - 2} further series ({MAX_SERIES} in all)"


def _expected(current: object, f: Any) -> str:
    """What a field holds, for the message when it holds something else."""
    if hasattr(current, "__dataclass_fields__"):
        return "expected an object"
    if "items" in f.metadata:
        return "expected a list of objects"
    if isinstance(current, tuple):
        return f"expected a list of {len(current)} numbers"
    if isinstance(current, bool):
        return "expected true or false"
    if isinstance(current, int):
        return "expected a whole number"
    if current is None:
        return "expected a number or null"
    if isinstance(current, float):
        return "expected a number"
    return "expected text"


def _is_number(value: object) -> bool:
    return isinstance(value, int | float) and not isinstance(value, bool)


def _check_types(obj: Any, path: str) -> None:
    """Raise :class:`StateError` for the first field of ``obj`` whose type is not its default's.

    Ints count as floats, bools are not numbers; whether a number is finite and in
    range is the range checks' business. A list of objects (``CompareSettings.more``)
    must not exceed its ``max_items``.
    """
    default = type(obj)()
    for f in fields(obj):
        value, current, where = getattr(obj, f.name), getattr(default, f.name), f"{path}{f.name}"
        if hasattr(current, "__dataclass_fields__"):
            ok = type(value) is type(current)
        elif "items" in f.metadata:
            if isinstance(value, tuple) and len(value) > f.metadata.get("max_items", len(value)):
                raise StateError(_too_many_series(where))
            ok = isinstance(value, tuple) and all(type(v) is f.metadata["items"] for v in value)
        elif isinstance(current, tuple):
            ok = (isinstance(value, tuple) and len(value) == len(current)
                  and all(_is_number(v) for v in value))
        elif isinstance(current, bool):
            ok = isinstance(value, bool)
        elif isinstance(current, int):
            ok = isinstance(value, int) and not isinstance(value, bool)
        elif current is None or isinstance(current, float):
            ok = (value is None and current is None) or _is_number(value)
        else:
            ok = isinstance(value, str)
        if not ok:
            raise StateError(f"{where}: {_expected(current, f)}")
        if hasattr(current, "__dataclass_fields__"):
            _check_types(value, f"{where}.")
        elif "items" in f.metadata:
            for index, item in enumerate(value):
                _check_types(item, f"{where}[{index}].")


def reconcile_orbital(spec: str, choice: OrbitalChoice) -> OrbitalChoice:
    """Keep the choice if its subshell is occupied in ``spec``; else take the outermost subshell.

    The outermost subshell is the one with the highest n, then the highest l.
    """
    try:
        configuration = parse_spec(spec)
    except ZeffirError as error:
        raise StateError(f"spec: {error}") from None
    occupied = {sub.label: sub for sub, _ in configuration.occupations}
    if choice.subshell in occupied:
        sub = occupied[choice.subshell]
        if abs(choice.m) <= sub.l:
            return choice
        return replace(choice, m=0)
    outer = max(occupied.values(), key=lambda s: (s.n, s.l))
    return OrbitalChoice(outer.label, choice.kind, 0)


def _as_dict(obj: Any) -> Any:
    if hasattr(obj, "__dataclass_fields__"):
        return {f.name: _as_dict(getattr(obj, f.name)) for f in fields(obj)}
    if isinstance(obj, tuple):
        return [_as_dict(v) for v in obj]
    return obj


def _from_dict(cls: Any, data: dict[str, Any], path: str) -> Any:
    """Build ``cls`` from plain data, checking each field's type (ranges are :meth:`validated`'s).

    Numbers must be finite and, for a float field, convertible to a float (an integer
    of 400 digits is refused here, not overflowed); lists must have their length.
    """
    default = cls()
    values: dict[str, Any] = {}
    for f in fields(cls):
        if f.name not in data:
            continue
        raw = data[f.name]
        where = f"{path}{f.name}"
        current = getattr(default, f.name)
        wrong = StateError(f"{where}: {_expected(current, f)}")
        if hasattr(current, "__dataclass_fields__"):
            if not isinstance(raw, dict):
                raise wrong
            values[f.name] = _from_dict(type(current), raw, f"{where}.")
        elif "items" in f.metadata:
            if not isinstance(raw, list):
                raise wrong
            if len(raw) > f.metadata.get("max_items", len(raw)):
                raise StateError(_too_many_series(where))
            if not all(isinstance(v, dict) for v in raw):
                raise wrong
            values[f.name] = tuple(_from_dict(f.metadata["items"], v, f"{where}[{i}].")
                                   for i, v in enumerate(raw))
        elif isinstance(current, tuple):
            if not (isinstance(raw, list) and len(raw) == len(current) and all(map(_is_number, raw))):
                raise wrong
            numbers = [_number(v) for v in raw]
            if None in numbers:
                raise StateError(f"{where}: expected {len(current)} finite numbers")
            values[f.name] = tuple(numbers)
        elif isinstance(current, bool):
            if not isinstance(raw, bool):
                raise wrong
            values[f.name] = raw
        elif isinstance(current, int):
            if isinstance(raw, bool) or not isinstance(raw, int):
                raise wrong
            values[f.name] = raw  # any size: the range check compares it exactly
        elif current is None or isinstance(current, float):
            if raw is None and current is None:
                values[f.name] = None
            elif not _is_number(raw):
                raise wrong
            elif (number := _number(raw)) is None:
                raise StateError(f"{where}: expected a finite number, got {_shown(raw)}")
            else:
                values[f.name] = number
        else:
            if not isinstance(raw, str):
                raise wrong
            values[f.name] = raw
    return cls(**values)

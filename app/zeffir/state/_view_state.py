"""What is on screen, as plain data: the single source of truth for views and sessions.

The window edits these objects; views redraw from them; a session file stores
them. Nothing here imports Qt or does physics.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, fields, replace
from typing import Any, Final, Literal, get_args

from zeffir.core import DEFAULT_MODEL, ZeffirError, model_names, parse_spec
from zeffir.core.density import MAX_RESOLUTION

__all__ = [
    "COLOUR_LIMITS",
    "DEFAULT_DIVERGING_MAP",
    "DEFAULT_SEQUENTIAL_MAP",
    "DIVERGING_MAP_NAMES",
    "LENGTH_UNITS",
    "MAX_SERIES",
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
    "TwoElectronSettings",
    "ViewState",
]

LengthUnit = Literal["bohr", "angstrom"]
RadialQuantity = Literal["R", "P", "D", "Q"]
SliceQuantity = Literal["psi", "psi2", "density"]
PlaneName = Literal["xy", "xz", "yz", "custom"]
ViewName = Literal["radial", "slice", "pair", "two-electron", "terms"]
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


class StateError(ZeffirError, ValueError):
    """A state (typed or read from a session file) is invalid; the message names the field."""


@dataclass(frozen=True)
class Source:
    """One atom under one model: what a view evaluates."""

    spec: str = "Na"
    model: str = DEFAULT_MODEL

    def validated(self) -> Source:
        """Return self after checking the spec parses and the model exists."""
        try:
            parse_spec(self.spec)
        except ZeffirError as error:
            raise StateError(f"spec: {error}") from None
        if self.model not in model_names():
            raise StateError(f"model: {self.model}: unknown model (use one of {', '.join(model_names())})")
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
        if not _finite(self.low):
            raise StateError(f"{where}.low: must be a finite number")
        if not (_finite(self.high) and self.high > 0):
            raise StateError(f"{where}.high: must be a positive finite number")
        if not self.low < self.high:
            raise StateError(f"{where}.low: must be below high ({self.high:g}), got {self.low:g}")
        if not (1.0 <= self.log_decades <= 16.0):
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
    more: tuple[Source, ...] = field(default=(), metadata={"items": Source})
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

    def with_changes(self, **changes: Any) -> ViewState:
        """A copy with top-level fields replaced (nested objects are replaced whole)."""
        return replace(self, **changes)

    def validated(self) -> ViewState:
        """Check every field; return the state with the orbital choice reconciled.

        Raises
        ------
        StateError
            Naming the first offending field, e.g. ``slice.resolution: ...``.
        """
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
        if len(self.compare.more) > MAX_SERIES - 2:
            raise StateError(f"compare.more: at most {MAX_SERIES - 2} further series "
                             f"({MAX_SERIES} in all)")
        if self.compare.enabled:
            try:
                self.compare.right.validated()
            except StateError as error:
                raise StateError(f"compare.right.{error}") from None
            for index, extra in enumerate(self.compare.more):
                try:
                    replace(extra, spec=extra.spec.strip() or self.left.spec).validated()
                except StateError as error:
                    raise StateError(f"compare.more[{index}].{error}") from None
        _check_choice("view", self.view, VIEW_NAMES)
        _check_choice("length_unit", self.length_unit, LENGTH_UNITS)
        _check_choice("radial.quantity", self.radial.quantity, RADIAL_QUANTITIES)
        if self.radial.r_limit is not None and not (self.radial.r_limit > 0):
            raise StateError("radial.r_limit: must be a positive number of bohr or empty")
        s = self.slice
        _check_choice("slice.plane", s.plane, PLANE_NAMES)
        _check_choice("slice.quantity", s.quantity, SLICE_QUANTITIES)
        if len(s.normal) != 3 or not any(abs(c) > 0 for c in s.normal):
            raise StateError("slice.normal: three numbers, not all zero")
        if not (s.extent > 0 and s.extent < 1e4):
            raise StateError("slice.extent: must be a positive number of bohr (below 10000)")
        if not (-1e4 < s.offset < 1e4):
            raise StateError("slice.offset: must be a number of bohr between -10000 and 10000")
        if not (16 <= s.resolution <= MAX_VIEW_RESOLUTION):
            raise StateError(f"slice.resolution: must be between 16 and {MAX_VIEW_RESOLUTION}")
        s.colour.check("slice.colour")
        if not (0 <= s.contours <= 40):
            raise StateError("slice.contours: between 0 and 40 levels")
        _check_choice("orbital.kind", self.orbital.kind, ("real", "complex"))
        _check_choice("pair.spin", self.pair.spin, ("up", "down"))
        if len(self.pair.reference) != 3 or not all(abs(c) < 1e4 for c in self.pair.reference):
            raise StateError("pair.reference: three coordinates in bohr (each below 10000)")
        _check_choice("two_electron.map", self.two_electron.map, ("radial", "collinear"))
        if not (16 <= self.two_electron.resolution <= MAX_VIEW_RESOLUTION):
            raise StateError(f"two_electron.resolution: must be between 16 and {MAX_VIEW_RESOLUTION}")
        if self.two_electron.r_limit is not None and not (self.two_electron.r_limit > 0):
            raise StateError("two_electron.r_limit: must be a positive number of bohr or empty")
        self.pair.colour.check("pair.colour")
        self.two_electron.colour.check("two_electron.colour")
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


def _finite(value: float) -> bool:
    return isinstance(value, int | float) and math.isfinite(value)


def _check_choice(name: str, value: object, allowed: tuple[object, ...]) -> None:
    if value not in allowed:
        raise StateError(f"{name}: {value!r} is not one of {', '.join(map(str, allowed))}")


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
    default = cls()
    values: dict[str, Any] = {}
    for f in fields(cls):
        if f.name not in data:
            continue
        raw = data[f.name]
        where = f"{path}{f.name}"
        current = getattr(default, f.name)
        if hasattr(current, "__dataclass_fields__"):
            if not isinstance(raw, dict):
                raise StateError(f"{where}: expected an object")
            values[f.name] = _from_dict(type(current), raw, f"{where}.")
        elif "items" in f.metadata:
            if not isinstance(raw, list) or not all(isinstance(v, dict) for v in raw):
                raise StateError(f"{where}: expected a list of objects")
            values[f.name] = tuple(_from_dict(f.metadata["items"], v, f"{where}[{i}].")
                                   for i, v in enumerate(raw))
        elif isinstance(current, tuple):
            if not isinstance(raw, list) or not all(_is_number(v) for v in raw):
                raise StateError(f"{where}: expected a list of numbers")
            values[f.name] = tuple(float(v) for v in raw)
        elif isinstance(current, bool):
            if not isinstance(raw, bool):
                raise StateError(f"{where}: expected true or false")
            values[f.name] = raw
        elif isinstance(current, int):
            if isinstance(raw, bool) or not isinstance(raw, int):
                raise StateError(f"{where}: expected a whole number")
            values[f.name] = raw
        elif current is None or isinstance(current, float):
            if raw is None and current is None:
                values[f.name] = None
            elif not _is_number(raw):
                raise StateError(f"{where}: expected a number")
            else:
                values[f.name] = float(raw)
        else:
            if not isinstance(raw, str):
                raise StateError(f"{where}: expected text")
            values[f.name] = raw
    return cls(**values)


def _is_number(value: object) -> bool:
    return isinstance(value, int | float) and not isinstance(value, bool) and value == value

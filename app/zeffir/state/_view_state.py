"""What is on screen, as plain data: the single source of truth for views and sessions.

The window edits these objects; views redraw from them; a session file stores
them. Nothing here imports Qt or does physics.
"""

from __future__ import annotations

from dataclasses import dataclass, field, fields, replace
from typing import Any, Final, Literal, get_args

from zeffir.core import DEFAULT_MODEL, ZeffirError, model_names, parse_spec
from zeffir.core.density import MAX_RESOLUTION

__all__ = [
    "LENGTH_UNITS",
    "RADIAL_QUANTITIES",
    "SLICE_QUANTITIES",
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

LENGTH_UNITS: Final = get_args(LengthUnit)
RADIAL_QUANTITIES: Final = get_args(RadialQuantity)
SLICE_QUANTITIES: Final = get_args(SliceQuantity)
PLANE_NAMES: Final = get_args(PlaneName)
VIEW_NAMES: Final = get_args(ViewName)
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
class SliceSettings:
    """Where and what the slice view shows."""

    plane: PlaneName = "xz"
    normal: tuple[float, float, float] = (0.0, 0.0, 1.0)
    offset: float = 0.0  # bohr
    extent: float = 8.0  # bohr, half-width
    resolution: int = 256
    quantity: SliceQuantity = "psi"
    log_scale: bool = False
    contours: int = 8
    full_range: bool = False  # colour scale to the extreme values (else robust, see scene)
    # Half-width fitted to what is shown (99.9 % of the orbital's charge) instead of ``extent``.
    fit_extent: bool = True
    log_decades: float = 6.0  # decades below the maximum a logarithmic colour scale spans


@dataclass(frozen=True)
class PairSettings:
    """The pair view: a reference electron, its spin, and which determinant.

    The plane, half-width and resolution are the slice view's.
    """

    reference: tuple[float, float, float] = (0.0, 0.0, 1.0)  # bohr
    spin: SpinName = "up"
    determinant: str = ""  # open-subshell choice in the determinant syntax; "" = Hund's rules


@dataclass(frozen=True)
class TwoElectronSettings:
    """The two-electron view: which pair of subshells and which map."""

    map: TwoElectronMap = "radial"
    r_limit: float | None = None  # bohr; None = automatic
    resolution: int = 256


@dataclass(frozen=True)
class CompareSettings:
    """The side-by-side comparison: the right-hand source and whether it is on.

    With ``same_atom`` (the default) the right-hand side follows the main atom and only
    its model is its own; a different atom there is a deliberate, saved choice.
    """

    enabled: bool = False
    right: Source = field(default_factory=lambda: Source("Na", "clementi"))
    show_difference: bool = True
    same_atom: bool = True


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

    def _validated(self) -> ViewState:
        if self.compare.enabled:
            try:
                self.compare.right.validated()
            except StateError as error:
                raise StateError(f"compare.right.{error}") from None
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
        if not (1.0 <= s.log_decades <= 16.0):
            raise StateError("slice.log_decades: between 1 and 16 decades")
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
        compare = data.get("compare")
        if isinstance(compare, dict) and "same_atom" not in compare:
            # Sessions written before the setting existed: a right-hand atom that differs
            # from the main one was chosen on purpose.
            right, left = compare.get("right"), data.get("left")
            same = (isinstance(right, dict) and isinstance(left, dict)
                    and right.get("spec", Source().spec) == left.get("spec", Source().spec))
            data = {**data, "compare": {**compare, "same_atom": same}}
        return _from_dict(cls, data, "").validated()


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

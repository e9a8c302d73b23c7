"""What a trend view shows: one line per model (and method), the measured values beside them.

A :class:`TrendScene` is a core :class:`~zeffir.core.trends.Trend` in the units on
screen, with labels, the x positions (Z, or the order of a list of specs that repeats
a Z), gaps where a model refused, the periodic-table blocks along Z and, where a
reference exists, each series' difference from it.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING, Any

import zeffir.core
from zeffir.core.config import madelung_order
from zeffir.scene._build import model_title
from zeffir.scene._quantities import length_factor, length_symbol

if TYPE_CHECKING:  # the trends package (and its process pool) loads when a trend is made
    from zeffir.core.trends import Trend, TrendQuantity

__all__ = ["TrendLine", "TrendScene", "element_blocks", "line_colours", "trend_scene", "trends_view"]

_METHOD_NAMES = {"koopmans": "Koopmans", "delta-scf": "ΔSCF"}


@dataclass(frozen=True, slots=True)
class TrendLine:
    """One series on screen: x positions, values (NaN = gap) and each point's words."""

    name: str
    model: str | None
    method: str | None
    x: tuple[float, ...]
    y: tuple[float, ...]
    specs: tuple[str, ...]
    notes: tuple[tuple[str, ...], ...]
    #: The subshell of this line when a trend shows several (then it takes its colour).
    subshell: str | None = None


@dataclass(frozen=True, slots=True)
class TrendScene:
    """A trend in display units.

    Attributes
    ----------
    title, x_label, y_label : str
    unit : str
        The unit of the values on screen (``bohr``, ``Å``, ``hartree``, ``eV``, ``""``).
    by_z : bool
        True when x is Z; else x is the position in the list and ``x_ticks`` names it.
    x_ticks : tuple of (float, str)
    lines : tuple of TrendLine
    reference : TrendLine or None
        The published values (NIST's first ionization energies).
    differences : tuple of TrendLine
        Each series minus the reference where both exist (same order as ``lines``).
    blocks : tuple of (float, float, str)
        (first Z − ½, last Z + ½, block letter) along a Z axis.
    quantity : str
        The core quantity name.
    length_unit : str
        ``bohr`` or ``angstrom`` (energies in hartree or eV with them).
    zs, charges : tuple of int
        Z and charge of each configuration, in the order of the lines' points.
    """

    title: str
    x_label: str
    y_label: str
    unit: str
    by_z: bool
    x_ticks: tuple[tuple[float, str], ...]
    lines: tuple[TrendLine, ...]
    reference: TrendLine | None
    differences: tuple[TrendLine, ...]
    blocks: tuple[tuple[float, float, str], ...]
    quantity: str
    length_unit: str
    #: Z and charge of each configuration, in the order of the lines' points.
    zs: tuple[int, ...] = ()
    charges: tuple[int, ...] = ()


def _display(kind: TrendQuantity, length_unit: str) -> tuple[float, str]:
    """Factor from atomic units to the display unit, and that unit's symbol."""
    unit = kind.unit
    if unit == "hartree":
        return (1.0, "hartree") if length_unit == "bohr" else (float(zeffir.core.EV_PER_HARTREE), "eV")
    if unit == "1":
        return 1.0, ""
    if unit.startswith("bohr"):
        power = 1 if unit == "bohr" else int(unit.split("^")[1])
        symbol = length_symbol(length_unit)
        return length_factor(length_unit, power), symbol if power == 1 else f"{symbol}^{power}"
    return 1.0, unit


@lru_cache(maxsize=1)
def _block_of() -> dict[int, str]:
    """Block (s, p, d, f) of each Z: the subshell its last electron enters in Madelung order."""
    letters = "spdfghik"
    out: dict[int, str] = {}
    z = 0
    for subshell in madelung_order():
        for _ in range(subshell.capacity):
            z += 1
            if z > 118:
                return out
            out[z] = "s" if z == 2 else letters[subshell.l]  # helium sits with the s block
    return out


def element_blocks(first: int, last: int) -> tuple[tuple[float, float, str], ...]:
    """Runs of one periodic-table block over Z = first … last, as (start, stop, letter).

    Examples
    --------
    >>> element_blocks(1, 10)
    ((0.5, 4.5, 's'), (4.5, 10.5, 'p'))
    """
    blocks: list[tuple[float, float, str]] = []
    table = _block_of()
    for z in range(first, last + 1):
        letter = table.get(z, "")
        if blocks and blocks[-1][2] == letter:
            blocks[-1] = (blocks[-1][0], z + 0.5, letter)
        else:
            blocks.append((z - 0.5, z + 0.5, letter))
    return tuple(blocks)


def trend_scene(trend: Trend, length_unit: str = "bohr") -> TrendScene:
    """The scene of ``trend`` in ``length_unit`` (energies in hartree or eV with it)."""
    kind = trend.quantity
    factor, unit = _display(kind, length_unit)
    first = trend.series[0].points if trend.series else ()
    zs = [p.Z for p in first]
    by_z = len(set(zs)) == len(zs) and zs == sorted(zs)
    xs = [float(z) for z in zs] if by_z else [float(i + 1) for i in range(len(zs))]
    ticks = () if by_z else tuple((x, p.spec) for x, p in zip(xs, first, strict=True))
    where = {p.spec: x for x, p in zip(xs, first, strict=True)}
    lines = []
    for series in trend.series:
        title = model_title(series.model)
        if series.subshell is not None:
            title = f"{title}, {series.subshell}"
        name = title if series.method is None else (
            f"{title}, {_METHOD_NAMES.get(series.method, series.method)}")
        lines.append(TrendLine(
            name, series.model, series.method, tuple(where[p.spec] for p in series.points),
            tuple(math.nan if p.value is None else p.value * factor for p in series.points),
            tuple(p.spec for p in series.points), tuple(p.notes for p in series.points),
            series.subshell))
    reference = None
    differences: list[TrendLine] = []
    if trend.reference is not None:
        measured = {(p.Z, p.charge): p.value * factor for p in trend.reference.points}
        keyed = [(x, p) for x, p in zip(xs, first, strict=True) if (p.Z, p.charge) in measured]
        reference = TrendLine("NIST (measured)", None, None, tuple(x for x, _ in keyed),
                              tuple(measured[(p.Z, p.charge)] for _, p in keyed),
                              tuple(p.spec for _, p in keyed),
                              tuple((trend.reference.source,) for _ in keyed))
        for line, series in zip(lines, trend.series, strict=True):
            values = [measured.get((p.Z, p.charge)) for p in series.points]
            differences.append(TrendLine(
                f"{line.name} − NIST", line.model, line.method, line.x,
                tuple(math.nan if (v is None or math.isnan(y)) else y - v
                      for y, v in zip(line.y, values, strict=True)),
                line.specs, line.notes, line.subshell))
    subject = kind.title
    label = trend.subshell or "valence"
    if "," in label:  # several subshells, one line each
        subject = f"{kind.title}: {label.replace(',', ' and ')}"
    elif kind.per_subshell or (kind.name == "ionization_energy" and label != "valence"):
        subject = f"{kind.title} of the {'valence subshell' if label == 'valence' else label}"
    y_label = f"{subject} / {unit}" if unit else subject
    span = f"{first[0].spec} … {first[-1].spec}" if len(first) > 1 else (first[0].spec if first else "")
    blocks = element_blocks(min(zs), max(zs)) if by_z and zs else ()
    return TrendScene(
        title=f"{kind.title[0].upper()}{kind.title[1:]}: {span}", x_label="Z" if by_z else "configuration",
        y_label=y_label, unit=unit, by_z=by_z, x_ticks=ticks, lines=tuple(lines), reference=reference,
        differences=tuple(differences), blocks=blocks, quantity=kind.name, length_unit=length_unit,
        zs=tuple(zs), charges=tuple(p.charge for p in first))


def trends_view(settings: Any, length_unit: str = "bohr") -> TrendScene:
    """The Trends view of a :class:`~zeffir.state.TrendSettings` (parallel, disk-cached)."""
    from zeffir.core.trends import evaluate_trend, parse_rule, quantity

    kind = quantity(settings.quantity)
    ionization = kind.name == "ionization_energy"
    trend = evaluate_trend(
        parse_rule(settings.rule), settings.model_list(), settings.quantity,
        subshell=settings.subshell if (kind.per_subshell or ionization) else None,
        methods=settings.method_list() if ionization else None)
    return trend_scene(trend, length_unit)


def line_colours(scene: TrendScene) -> list[tuple[str, int]]:
    """(colour, style index) of each line: one colour per model, or per subshell when the
    trend shows several subshells (the colours of the radial view), the model then
    setting the style."""
    from zeffir.scene._colours import LINE_COLOURS, subshell_colour

    models = list(dict.fromkeys(line.model for line in scene.lines))
    out = []
    for line in scene.lines:
        rank = models.index(line.model)
        if line.subshell is not None:
            out.append((subshell_colour(line.subshell)[0], rank))
        else:
            out.append((LINE_COLOURS[rank % len(LINE_COLOURS)], 0))
    return out

"""The radial view's content: curves and markers in display units."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from zeffir.core import OrbitalSet, cumulative_charge
from zeffir.core.orbitals import FloatArray
from zeffir.scene._build import orbitals_for, short_model_name
from zeffir.scene._quantities import QUANTITIES, length_factor, length_symbol, unit_text
from zeffir.state import RadialSettings, Source

__all__ = ["Curve", "Marker", "RadialScene", "radial_range", "radial_scene"]

POINTS = 1500


@dataclass(frozen=True)
class Curve:
    """One curve: a subshell (``subshell`` set) or the whole atom (``subshell is None``)."""

    label: str
    subshell: str | None
    x: FloatArray
    y: FloatArray
    series: int = 0  # index into RadialScene.series_names when several series share the axes


@dataclass(frozen=True)
class Marker:
    """A vertical marker at radius ``x``: kind is ``'r_max'``, ``'mean'`` or ``'node'``."""

    subshell: str
    kind: str
    x: float
    series: int = 0


@dataclass(frozen=True)
class RadialScene:
    """Everything the radial view draws (and a radial export writes)."""

    title: str
    spec: str
    model: str
    quantity: str
    x_label: str
    y_label: str
    length_unit: str
    log_r: bool
    curves: tuple[Curve, ...]
    markers: tuple[Marker, ...]
    highlight: str | None
    #: Names of the series whose curves share these axes (empty: one series). A curve's
    #: line style follows its series; its colour, its subshell.
    series_names: tuple[str, ...] = ()


def radial_range(orbitals: OrbitalSet, settings: RadialSettings) -> tuple[float, float]:
    """(innermost, outermost) radius in bohr the radial view spans for these orbitals."""
    top = settings.r_limit or max(
        max(o.radial.r_max(), o.radial.expectation(1)) * 3.0 for o in orbitals.orbitals
    )
    inner = max(min(o.radial.r_max() for o in orbitals.orbitals) / 50.0, 1e-6)
    return inner, top


def _r_grid(span: tuple[float, float], log_r: bool) -> FloatArray:
    inner, top = span
    if log_r:
        return np.geomspace(inner, top, POINTS)
    t = np.linspace(0.0, np.sqrt(top), POINTS)
    return t * t


def radial_scene(source: Source, settings: RadialSettings, length_unit: str = "bohr",
                 highlight: str | None = None,
                 span: tuple[float, float] | None = None) -> RadialScene:
    """Evaluate the radial view of ``source``.

    Parameters
    ----------
    source : Source
        Spec and model.
    settings : RadialSettings
        Quantity (R, P, D, Q), weighting, which curves and markers.
    length_unit : {"bohr", "angstrom"}
        Display unit of r; y values are converted consistently.
    highlight : str, optional
        Subshell label drawn emphasised.
    span : (float, float), optional
        Radial range in bohr (default :func:`radial_range`); comparisons pass a shared one.
    """
    orbitals = orbitals_for(source)
    r = _r_grid(span or radial_range(orbitals, settings), settings.log_r)
    quantity = QUANTITIES[settings.quantity]
    x_scale = length_factor(length_unit, 1.0)
    y_scale = length_factor(length_unit, quantity.length_power)
    curves: list[Curve] = []
    total = np.zeros_like(r)
    for o in orbitals.orbitals:
        weight = o.occupancy if settings.weighted else 1.0
        if settings.quantity == "R":
            y = o.radial(r)
        elif settings.quantity == "P":
            y = o.radial.p(r)
        elif settings.quantity == "D":
            y = weight * o.radial.distribution(r)
        else:
            y = weight * o.radial.cumulative(r)
        if settings.quantity in ("D", "Q"):
            total += y if settings.weighted else o.occupancy * y
        if settings.show_subshells or o.label == highlight:
            curves.append(Curve(_electrons(o.label, o.occupancy) if settings.weighted else o.label,
                                o.label, r * x_scale, y * y_scale))
    if settings.show_total and settings.quantity in ("D", "Q"):
        if settings.quantity == "Q":
            total = cumulative_charge(orbitals, r)
        curves.append(Curve("total", None, r * x_scale, total * y_scale))
    markers: list[Marker] = []
    if settings.show_markers:
        for o in orbitals.orbitals:
            if highlight is not None and o.label != highlight:
                continue
            markers.append(Marker(o.label, "r_max", o.radial.r_max() * x_scale))
            markers.append(Marker(o.label, "mean", o.radial.expectation(1) * x_scale))
            markers.extend(Marker(o.label, "node", float(x) * x_scale) for x in o.radial.nodes())
    unit = length_symbol(length_unit)
    weighting = "" if settings.quantity in ("R", "P") else (
        ", occupancy-weighted" if settings.weighted else ", per electron")
    return RadialScene(
        title=f"{orbitals.configuration.spec} — {short_model_name(source.model)}",
        spec=orbitals.configuration.spec,
        model=source.model,
        quantity=settings.quantity,
        x_label=f"r / {unit}",
        y_label=f"{quantity.symbol} / {unit_text(length_unit, quantity.length_power)}{weighting}",
        length_unit=length_unit,
        log_r=settings.log_r,
        curves=tuple(curves),
        markers=tuple(markers),
        highlight=highlight,
    )


def _electrons(label: str, occupancy: int) -> str:
    """Legend text of a weighted subshell curve: '3s, 1 electron', '2p, 6 electrons'."""
    return f"{label}, {occupancy} electron{'' if occupancy == 1 else 's'}"

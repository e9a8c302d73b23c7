"""Evaluate a quantity over many configurations under several models.

The configurations are built by :func:`~zeffir.core.sweep.build_many` (worker
processes, the disk cache, progress and cancellation); each value is read with the
functions the subshell table uses. A configuration a model cannot treat is a gap
(value None) whose notes say why; it never stops the trend.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from zeffir.core._errors import ZeffirError
from zeffir.core.config import parse_spec
from zeffir.core.models import get_model
from zeffir.core.orbitals import OrbitalSet
from zeffir.core.trends._quantities import (
    TrendQuantity,
    TrendQuantityError,
    atom_value,
    quantity,
    subshell_value,
    valence_subshell,
)
from zeffir.core.trends._reference import IONIZATION_SOURCE, measured_first_ionization
from zeffir.core.trends._rules import TrendRuleError, ion_spec

if TYPE_CHECKING:  # the sweep (multiprocessing) loads when a trend is evaluated
    from zeffir.core.sweep import DiskCache, SweepPoint

__all__ = [
    "IONIZATION_METHODS",
    "ReferencePoint",
    "ReferenceSeries",
    "Trend",
    "TrendPoint",
    "TrendSeries",
    "evaluate_trend",
]

#: Ways to compute an ionization energy: −ε of the outermost subshell (Koopmans 1934),
#: or E(ion) − E(atom) with both self-consistent under the same model (ΔSCF).
IONIZATION_METHODS = ("koopmans", "delta-scf")


@dataclass(frozen=True, slots=True)
class TrendPoint:
    """One configuration's value (atomic units), or None with the reason in ``notes``."""

    spec: str
    Z: int
    charge: int
    value: float | None
    notes: tuple[str, ...] = ()


@dataclass(frozen=True, slots=True)
class TrendSeries:
    """One model's points (and, for ionization energies, the method; with several
    subshells, the subshell)."""

    model: str
    method: str | None
    points: tuple[TrendPoint, ...]
    subshell: str | None = None


@dataclass(frozen=True, slots=True)
class ReferencePoint:
    """A published value (atomic units) for a neutral atom or ion."""

    Z: int
    charge: int
    value: float


@dataclass(frozen=True, slots=True)
class ReferenceSeries:
    """Published values beside the computed series, with their source."""

    source: str
    points: tuple[ReferencePoint, ...]


@dataclass(frozen=True, slots=True)
class Trend:
    """A quantity over configurations: one series per model (and method), a reference."""

    quantity: TrendQuantity
    subshell: str | None
    series: tuple[TrendSeries, ...]
    reference: ReferenceSeries | None

    def as_json(self) -> dict[str, Any]:
        """The trend as the JSON object of ``zeffir trend --json`` (atomic units)."""
        return {
            "quantity": self.quantity.name,
            "unit": self.quantity.unit,
            "subshell": self.subshell,
            "series": [{"model": s.model, "method": s.method, "subshell": s.subshell,
                        "points": [{"spec": p.spec, "Z": p.Z, "charge": p.charge, "value": p.value,
                                    "notes": list(p.notes)} for p in s.points]}
                       for s in self.series],
            "reference": None if self.reference is None else {
                "source": self.reference.source,
                "points": [{"Z": p.Z, "charge": p.charge, "value": p.value}
                           for p in self.reference.points]},
        }


def evaluate_trend(
    specs: Iterable[str],
    models: Sequence[str],
    quantity_name: str,
    *,
    subshell: str | None = None,
    methods: Sequence[str] | None = None,
    processes: int | None = None,
    cache: DiskCache | bool = True,
    progress: Callable[[str], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
) -> Trend:
    """``quantity_name`` for every spec under every model.

    Parameters
    ----------
    specs : iterable of str
        Configurations (e.g. from :func:`~zeffir.core.trends.parse_rule`).
    models : sequence of str
        Registered model names; one series each (per method for ionization energies).
    quantity_name : str
        A name of :func:`~zeffir.core.trends.quantity_names`.
    subshell : str, optional
        For per-subshell quantities (and Koopmans ionization energies): a label such
        as ``"3d"``, or ``"valence"`` (the default), the outermost occupied subshell;
        several separated by commas (``"3d,4s"``) give one series each per model.
    methods : sequence of str, optional
        For ``ionization_energy``: ``koopmans`` and/or ``delta-scf`` (default
        ``koopmans``).
    processes, cache, progress, should_stop
        As for :func:`~zeffir.core.sweep.build_many`.

    Returns
    -------
    Trend

    Raises
    ------
    TrendQuantityError, TrendRuleError, ModelError
        An unknown quantity, subshell, method, spec or model (before any work).
    SweepCancelled
        Asked to stop.

    Notes
    -----
    Koopmans' theorem (T. Koopmans, Physica 1, 104 (1934)) takes the ionization
    energy as −ε of the orbital emptied; ΔSCF as E(ion) − E(atom), the ion in its
    ground configuration as ``parse_spec`` derives it (observed, or by the removal
    rule). Koopmans neglects the relaxation of the other orbitals, ΔSCF includes it;
    neither includes correlation.

    Examples
    --------
    The valence Z_eff of the alkali metals under Slater's rules, in this process:

    >>> trend = evaluate_trend(["Li", "Na", "K"], ["slater"], "z_eff", processes=1, cache=False)
    >>> [round(p.value, 12) for p in trend.series[0].points]
    [1.3, 2.2, 2.2]
    """
    from zeffir.core.sweep import build_many

    kind = quantity(quantity_name)
    spec_list = list(specs)
    if not spec_list:
        raise TrendRuleError("no configurations to run the trend over")
    parsed = {}
    for spec in spec_list:
        try:
            parsed[spec] = parse_spec(spec)
        except ZeffirError as error:
            raise TrendRuleError(f"{spec}: {error}") from error
    for name in models:
        get_model(name)  # an unknown model is refused before any work
    if not models:
        raise TrendQuantityError("name at least one model")
    chosen = _methods(kind, methods)
    label = _subshell_choice(kind, subshell)
    labels = (None,) if label is None else tuple(part.strip() for part in label.split(","))
    ions = {spec: _ion_of(parsed[spec].Z, parsed[spec].charge) for spec in spec_list} \
        if "delta-scf" in chosen else {}
    wanted = list(dict.fromkeys([*spec_list, *(i for i in ions.values() if i is not None)]))
    series = []
    for model in models:
        built = {p.spec: p for p in build_many(wanted, model, processes=processes, cache=cache,
                                               progress=progress, should_stop=should_stop)}
        for method in chosen:
            # ΔSCF belongs to the whole atom: one series whatever the subshells.
            for one in (labels if method != "delta-scf" else labels[:1]):
                points = tuple(_point(spec, parsed[spec].Z, parsed[spec].charge, built[spec], kind, one,
                                      method, built.get(ions.get(spec) or ""), ions.get(spec))
                               for spec in spec_list)
                mine = one if len(labels) > 1 and method != "delta-scf" else None
                series.append(TrendSeries(model, method, points, mine))
    reference = None
    if kind.name == "ionization_energy":
        measured = [ReferencePoint(z, 0, m.energy) for z in dict.fromkeys(
            parsed[s].Z for s in spec_list if parsed[s].charge == 0)
            if (m := measured_first_ionization(z)) is not None]
        if measured:
            reference = ReferenceSeries(IONIZATION_SOURCE, tuple(measured))
    return Trend(kind, label, tuple(series), reference)


def _methods(kind: TrendQuantity, methods: Sequence[str] | None) -> tuple[str | None, ...]:
    if kind.name != "ionization_energy":
        if methods:
            raise TrendQuantityError(f"--method applies to ionization_energy only, not {kind.name}")
        return (None,)
    chosen = tuple(methods or ("koopmans",))
    for method in chosen:
        if method not in IONIZATION_METHODS:
            raise TrendQuantityError(f"{method}: unknown method (choose {' or '.join(IONIZATION_METHODS)})")
    return chosen


def _subshell_choice(kind: TrendQuantity, subshell: str | None) -> str | None:
    takes = kind.per_subshell or kind.name == "ionization_energy"
    if not takes:
        if subshell not in (None, ""):
            raise TrendQuantityError(f"{kind.name} belongs to the whole atom: leave out the subshell")
        return None
    text = (subshell or "valence").strip()
    parts = [part.strip() for part in text.split(",")]
    if any(not part for part in parts):
        raise TrendQuantityError(f"{text}: an empty subshell in the list")
    for part in parts:
        if part == "valence":
            continue
        from zeffir.core.config import parse_subshell_token

        try:
            parse_subshell_token(part)
        except ZeffirError as error:
            raise TrendQuantityError(f"{part}: not a subshell label (e.g. 3d) or 'valence'") from error
    return ",".join(dict.fromkeys(parts))


def _ion_of(z: int, charge: int) -> str | None:
    """The spec of the ion one electron short; None for a one-electron system (a bare nucleus)."""
    if z - charge - 1 <= 0:
        return None
    return ion_spec(z, charge + 1)


def _chosen_orbital(orbitals: OrbitalSet, label: str | None) -> tuple[Any, str | None]:
    if label in (None, "valence"):
        return valence_subshell(orbitals), None
    for orbital in orbitals.orbitals:
        if orbital.label == label:
            return orbital, None
    return None, f"{label} is not occupied in {orbitals.configuration.short_text}"


def _point(spec: str, z: int, charge: int, built: SweepPoint, kind: TrendQuantity, label: str | None,
           method: str | None, ion: SweepPoint | None, ion_text: str | None) -> TrendPoint:
    if not built.ok or built.orbitals is None:
        return TrendPoint(spec, z, charge, None, (f"refused: {built.refusal}",))
    orbitals = built.orbitals
    notes: list[str] = []
    if kind.per_subshell or (kind.name == "ionization_energy" and method == "koopmans"):
        orbital, missing = _chosen_orbital(orbitals, label)
        if orbital is None:
            return TrendPoint(spec, z, charge, None, (missing or "",))
        if label == "valence":
            notes.append(f"valence subshell {orbital.label}")
        if kind.name == "ionization_energy":
            if orbital.energy is None:
                return TrendPoint(spec, z, charge, None, (*notes, "the model defines no orbital energies"))
            return TrendPoint(spec, z, charge, -orbital.energy, (*notes, f"Koopmans: −ε({orbital.label})"))
        value, why = subshell_value(kind, orbital)
        return TrendPoint(spec, z, charge, value, (*notes, *(() if why is None else (why,))))
    if kind.name == "ionization_energy":
        return _delta_scf(spec, z, charge, orbitals, ion, ion_text)
    value, why = atom_value(kind, orbitals)
    return TrendPoint(spec, z, charge, value, () if why is None else (why,))


def _delta_scf(spec: str, z: int, charge: int, orbitals: OrbitalSet, ion: SweepPoint | None,
               ion_text: str | None) -> TrendPoint:
    if orbitals.total_energy is None:
        return TrendPoint(spec, z, charge, None, ("the model defines no total energy",))
    if ion_text is None:  # one electron: the ion is a bare nucleus, E = 0
        return TrendPoint(spec, z, charge, -orbitals.total_energy,
                          ("ΔSCF: the ion is a bare nucleus (E = 0)",))
    if ion is None or not ion.ok or ion.orbitals is None:
        reason = "not built" if ion is None else ion.refusal
        return TrendPoint(spec, z, charge, None, (f"ΔSCF: the ion {ion_text} was refused: {reason}",))
    if ion.orbitals.total_energy is None:
        return TrendPoint(spec, z, charge, None, ("the model defines no total energy",))
    return TrendPoint(spec, z, charge, ion.orbitals.total_energy - orbitals.total_energy,
                      (f"ΔSCF: ion {ion_text} {ion.orbitals.configuration.short_text}",))

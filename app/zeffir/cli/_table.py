"""``zeffir table``: the subshell table of a spec under a model, as text or JSON."""

from __future__ import annotations

import math
from typing import Any

from zeffir import __version__
from zeffir.cli._common import JSON_FORMAT_VERSION, _finite_or_none
from zeffir.core.properties import occupancy_text


def table_json(spec: str, model: str) -> dict[str, Any]:
    """The ``table --json`` object (atomic units) for a spec under a model."""
    from zeffir.core import build, parse_spec, subshell_table

    configuration = parse_spec(spec)
    orbitals = build(configuration, model)
    rows = subshell_table(orbitals)
    return {
        "zeffir_version": __version__,
        "format_version": JSON_FORMAT_VERSION,
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
                "j": row.j,
                "energy_up_hartree": _finite_or_none(row.energy_up),
                "energy_down_hartree": _finite_or_none(row.energy_down),
                "notes": list(row.notes),
            }
            for row in rows
        ],
        "notes": [*orbitals.notes, configuration.origin_note],
        "virial_ratio": _finite_or_none(orbitals.virial_ratio),
        "energy_components_hartree": (None if orbitals.energy_components is None
                                      else {name: value for name, value in orbitals.energy_components}),
        **_correlation_fields(orbitals, model),
    }


def _correlation_fields(orbitals: Any, model: str) -> dict[str, Any]:
    """Exact energy and E_corr = E_exact − E_HF for the hartree-fock model (null elsewhere)."""
    from zeffir.core.properties import energy_summary

    summary = energy_summary(orbitals, model)
    if summary.correlation is None:
        return {"exact_energy_hartree": None, "correlation_energy_hartree": None}
    return {"exact_energy_hartree": summary.exact, "exact_energy_source": summary.exact_source,
            "correlation_energy_hartree": summary.correlation}


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
    spin_resolved = any(row.energy_up is not None or row.energy_down is not None for row in rows)
    if spin_resolved:
        lines[-1] += f" {'ε↓/' + eu:>12} {'ε↑/' + eu:>12}"
    for row in rows:
        line = (f"{row.label:>8} {occupancy_text(row.occupancy):>4} {num(row.zeta, 1 / length):>11} "
                f"{num(row.z_eff):>8} {num(row.n_star, digits=1):>5} {num(row.r_mean, length):>11} "
                f"{num(row.r_max, length):>11} {num(row.energy, energy):>12}")
        if spin_resolved:
            line += f" {num(row.energy_down, energy):>12} {num(row.energy_up, energy):>12}"
        lines.append(line)
    lines.append("")
    virial = ("" if orbitals.virial_ratio is None
              else f"   virial ratio −V/T: {orbitals.virial_ratio:.9f}")
    lines.append(f"electrons: {configuration.n_electrons}   "
                 f"total energy: {num(orbitals.total_energy, energy)} {eu}{virial}")
    from zeffir.core.properties import energy_summary

    summary = energy_summary(orbitals, model)
    if summary.correlation is not None:
        lines.append(
            f"exact non-relativistic energy: {num(summary.exact, energy)} {eu} "
            f"({summary.exact_source});   correlation energy E_exact − E_HF: "
            f"{num(summary.correlation, energy, 5)} {eu}"
        )
    elif summary.remark is not None:
        lines.append(f"correlation energy {summary.remark}")
    notes = [configuration.origin_note, *orbitals.notes,
             *(note for row in rows for note in row.notes)]
    lines.extend(f"note: {note}" for note in dict.fromkeys(notes))
    return "\n".join(lines)

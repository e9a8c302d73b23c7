"""``zeffir terms``: the LS terms, J levels and ground level of a configuration."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from zeffir import __version__

if TYPE_CHECKING:
    from zeffir.core import Configuration
    from zeffir.core.terms import Level
from zeffir.cli._common import JSON_FORMAT_VERSION


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
        "zeffir_version": __version__,
        "format_version": JSON_FORMAT_VERSION,
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


def _format_terms(spec: str) -> str:
    from collections import Counter

    from zeffir.core import parse_spec
    from zeffir.core.terms import (
        MULTIPLICITY_NAMES,
        configuration_parity,
        configuration_terms,
        ground_level,
        ground_notes,
        microstate_count,
        observed_level,
    )
    from zeffir.core.terms import quantum_number_text as _half

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
            title = (MULTIPLICITY_NAMES[group - 1] + "s" if group <= len(MULTIPLICITY_NAMES)
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

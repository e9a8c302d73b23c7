"""What the Terms view shows, computed without Qt: terms, J levels and ground levels.

:func:`terms_summary` asks the core for everything the view displays and returns a
frozen :class:`TermsSummary`, so the window can compute it in its worker thread and
``zeffir.ui.TermsView`` only draws it.
"""

from __future__ import annotations

from collections import Counter
from dataclasses import dataclass
from typing import Final

from zeffir.core import parse_spec
from zeffir.core.terms import (
    Level,
    ObservedLevel,
    Parity,
    Term,
    configuration_parity,
    configuration_terms,
    ground_level,
    ground_notes,
    microstate_count,
    observed_level,
    quantum_number_text,
    term_label,
)

__all__ = [
    "TermNote",
    "TermRow",
    "TermsSummary",
    "level_symbol",
    "term_symbol",
    "terms_summary",
]

_SUPERSCRIPT: Final = str.maketrans("0123456789", "⁰¹²³⁴⁵⁶⁷⁸⁹")
_SUBSCRIPT: Final = str.maketrans("0123456789", "₀₁₂₃₄₅₆₇₈₉")
_half = quantum_number_text


def _letter(S: float, L: int) -> str:
    # The core's own label ('3P', '2[L=17]') minus its multiplicity, so the letters
    # beyond L = 16 follow the core's rule rather than a copy of it.
    multiplicity = str(round(2 * S) + 1)
    return term_label(S, L)[len(multiplicity):]


def term_symbol(term: Term) -> str:
    """The term in Unicode: superscript multiplicity, L letter, ``°`` when odd.

    Parameters
    ----------
    term : Term

    Returns
    -------
    str
        E.g. ``'³P'``, ``'⁴S°'``.

    Examples
    --------
    >>> term_symbol(Term(S=1.5, L=0, parity="odd"))
    '⁴S°'
    """
    odd = "°" if term.parity == "odd" else ""
    return f"{str(term.multiplicity).translate(_SUPERSCRIPT)}{_letter(term.S, term.L)}{odd}"


def level_symbol(level: Level) -> str:
    """The level in Unicode: the term symbol with J as a subscript.

    Parameters
    ----------
    level : Level

    Returns
    -------
    str
        E.g. ``'³P₀'``, ``'⁴I°₉/₂'`` (there is no subscript slash in Unicode; the
        digits alone are lowered).

    Examples
    --------
    >>> level_symbol(Level(S=1, L=1, J=0, parity="even"))
    '³P₀'
    """
    return term_symbol(level.term) + _half(level.J).translate(_SUBSCRIPT)


@dataclass(frozen=True, slots=True)
class TermRow:
    """One distinct term of a configuration, as a table row.

    Attributes
    ----------
    term : Term
    count : int
        How many times the term occurs.
    is_hund : bool
        The term of the ground level by Hund's rules.
    is_observed : bool
        The term of the observed ground level (known and named in LS coupling).
    ground_mark : str
        What the "Ground level" column says: empty, or which ground level(s) lie
        in this term.
    """

    term: Term
    count: int
    is_hund: bool
    is_observed: bool
    ground_mark: str

    @property
    def symbol(self) -> str:
        """Unicode term symbol, e.g. ``'³P'``."""
        return term_symbol(self.term)

    @property
    def levels_text(self) -> str:
        """The J levels, lowest first, e.g. ``'0, 1, 2'``."""
        return ", ".join(_half(j) for j in self.term.J)

    @property
    def states(self) -> int:
        """Microstates of all occurrences of the term, (2S + 1)(2L + 1) × count."""
        return self.term.states * self.count

    def cells(self) -> tuple[str, ...]:
        """The row's texts in the order of :data:`COLUMNS`."""
        return (self.symbol, str(self.count), _half(self.term.S), str(self.term.L),
                self.term.parity, self.levels_text, str(self.states), self.ground_mark)


@dataclass(frozen=True, slots=True)
class TermNote:
    """A note shown under the ground levels; ``warning`` when Hund's rules miss."""

    text: str
    warning: bool


@dataclass(frozen=True, slots=True)
class TermsSummary:
    """Everything the terms view shows for one configuration (no Qt).

    Attributes
    ----------
    spec : str
        The specification as it was asked for (what ``current_spec`` returns).
    normalized_spec : str
        The core's normalised specification.
    atom : str
        Element name, Z and charge, e.g. ``'Europium (Z = 63, charge +3)'``.
    short_text, configuration : str
        The configuration with its noble-gas core in brackets, and in full.
    open_subshells : str
        The open subshells with their electrons, e.g. ``'4f1 5d2'``; empty when
        every subshell is closed.
    parity : {"even", "odd"}
    microstates : int
    term_count : int
        Number of terms, repeats included.
    rows : tuple of TermRow
        One per distinct term, in the core's order: S descending, then L descending.
    ground : Level
        The ground level by Hund's rules.
    observed : ObservedLevel or None
        The observed ground level, where known.
    hund_miss : bool
        True when the observed ground level is known to differ from Hund's.
    origin_note : str
        Where the configuration comes from.
    notes : tuple of TermNote
        The core's notes on the ground level.
    """

    spec: str
    normalized_spec: str
    atom: str
    short_text: str
    configuration: str
    open_subshells: str
    parity: Parity
    microstates: int
    term_count: int
    rows: tuple[TermRow, ...]
    ground: Level
    observed: ObservedLevel | None
    hund_miss: bool
    origin_note: str
    notes: tuple[TermNote, ...]

    @property
    def title(self) -> str:
        """First header line: atom and configuration, short and in full."""
        full = "" if self.configuration == self.short_text else f"  ({self.configuration})"
        return f"{self.atom}: {self.short_text}{full}"

    @property
    def details(self) -> str:
        """Second header line: open subshells, parity, microstates and term count."""
        shells = self.open_subshells or "none (closed shells)"
        count = f"{self.term_count} term{'s' if self.term_count != 1 else ''}"
        if len(self.rows) != self.term_count:
            count += f" ({len(self.rows)} distinct)"
        states = f"{self.microstates} microstate{'s' if self.microstates != 1 else ''}"
        mark = " (° marks odd terms)" if self.parity == "odd" else ""
        return f"Open subshells: {shells} · parity {self.parity}{mark} · {states} · {count}"

    @property
    def ground_text(self) -> str:
        """The Hund ground level with its quantum numbers."""
        g = self.ground
        return (f"Ground level by Hund's rules: {level_symbol(g)}  "
                f"(S = {_half(g.S)}, L = {g.L}, J = {_half(g.J)})")

    @property
    def observed_text(self) -> str:
        """The observed ground level and its source; empty when it is not known."""
        seen = self.observed
        if seen is None:
            return ""
        if seen.level is not None:
            agreement = ("differs from Hund's rules" if self.hund_miss
                         else "agrees with Hund's rules")
            return f"Observed ground level: {level_symbol(seen.level)}  ({seen.source}) — {agreement}"
        # NIST names this level in another coupling: only J can be compared.
        agreement = "differs from" if self.hund_miss else "agrees with"
        return (f"Observed ground level: {seen.text}, J = {_half(seen.J)}  ({seen.source}) — "
                f"J {agreement} Hund's rules")


def _atom_text(name: str, Z: int, charge: int) -> str:
    return f"{name} (Z = {Z}{f', charge {charge:+d}' if charge else ''})"


def _ground_mark(hund: Level | None, observed: Level | None) -> str:
    if hund is not None and hund == observed:
        return f"{level_symbol(hund)} by Hund's rules and observed"
    parts = []
    if hund is not None:
        parts.append(f"{level_symbol(hund)} by Hund's rules")
    if observed is not None:
        parts.append(f"{level_symbol(observed)} observed")
    return "; ".join(parts)


def terms_summary(spec: str) -> TermsSummary:
    """Compute what the terms view shows for a configuration.

    Parameters
    ----------
    spec : str
        Any specification the atom field accepts (``'C'``, ``'Eu3+'``,
        ``'Ce [Xe] 4f2 5d2'``).

    Returns
    -------
    TermsSummary
        Terms grouped by repeats, the Hund and observed ground levels, and notes.

    Raises
    ------
    ZeffirError
        SpecError for an invalid specification, TermError when the configuration
        has too many terms to list.

    Notes
    -----
    Pure and Qt-free, so it may run on a worker thread. All numbers come from
    ``zeffir.core.terms``; nothing here is physics beyond counting repeats.

    Examples
    --------
    >>> [row.symbol for row in terms_summary("C").rows]
    ['³P', '¹D', '¹S']
    """
    configuration = parse_spec(spec)
    terms = configuration_terms(configuration)
    ground = ground_level(configuration)
    observed = observed_level(configuration)
    seen = None if observed is None else observed.level
    if observed is None:
        hund_miss = False
    elif seen is not None:
        hund_miss = seen != ground
    else:
        hund_miss = observed.J != ground.J
    repeats = Counter(terms)  # keeps first-seen order: the core's S, then L, descending
    rows = []
    for term, count in repeats.items():
        hund_here = ground if ground.term == term else None
        seen_here = seen if seen is not None and seen.term == term else None
        rows.append(TermRow(term, count, hund_here is not None, seen_here is not None,
                            _ground_mark(hund_here, seen_here)))
    notes = tuple(
        # The miss note is the one naming the observed level while the two differ.
        TermNote(note, hund_miss and observed is not None and observed.text in note)
        for note in ground_notes(configuration)
    )
    open_text = " ".join(f"{sub.label}{configuration.occupancy(sub)}"
                         for sub in configuration.open_subshells)
    return TermsSummary(
        spec=spec,
        normalized_spec=configuration.spec,
        atom=_atom_text(configuration.element.name, configuration.Z, configuration.charge),
        short_text=configuration.short_text,
        configuration=configuration.text,
        open_subshells=open_text,
        parity=configuration_parity(configuration),
        microstates=microstate_count(configuration),
        term_count=len(terms),
        rows=tuple(rows),
        ground=ground,
        observed=observed,
        hund_miss=hund_miss,
        origin_note=configuration.origin_note,
        notes=notes,
    )

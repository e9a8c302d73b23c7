"""Where Hund's rules are known to miss the observed ground level, and notes to show."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache
from typing import Final

from zeffir.core.config import ION_SOURCE, Configuration, observed_ion, parse_spec
from zeffir.core.terms._labels import Parity, quantum_number_text
from zeffir.core.terms._terms import Level, as_configuration, ground_level, open_shells

__all__ = ["OBSERVED_SOURCE", "ObservedLevel", "ground_notes", "known_hund_miss",
           "observed_level"]

OBSERVED_SOURCE: Final[str] = "NIST Atomic Spectra Database"


@dataclass(frozen=True, slots=True)
class ObservedLevel:
    """An observed ground level.

    Attributes
    ----------
    text : str
        NIST's designation, ``°`` for odd: ``'7F0'``, ``'(9/2,1/2)°4'`` (J1 j coupling)
        or ``'J = 3/2'`` (J alone).
    J : float
    parity : {"even", "odd"}
    level : Level or None
        The LS level, when NIST names the level in LS coupling.
    source : str

    Examples
    --------
    Eu³⁺ 4f⁶ (NIST ASD: ⁷F₀): the level's J and parity are the observed ones, the
    parity is the configuration's (−1)^Σl, and J = |L − S| as Hund's third rule
    gives for a shell less than half full:

    >>> from zeffir.core.terms import configuration_parity
    >>> eu = observed_level("Eu3+")
    >>> eu.text, eu.level.J == eu.J == abs(eu.level.L - eu.level.S)
    ('7F0', True)
    >>> eu.parity == configuration_parity("Eu3+")
    True
    """

    text: str
    J: float
    parity: Parity
    level: Level | None
    source: str

# Observed ground levels of configurations for which Hund's rules (as applied by
# ground_level) give another level. Only cases checked against the NIST ASD
# ground-levels table belong here; the list is not exhaustive.
_MISSES: Final[tuple[tuple[str, Level], ...]] = (
    # Ce I, [Xe] 4f 5d 6s2: NIST ASD ground level 1G°4 (spectrum Ce I in the digitised copy
    # of the ASD listing in mendeleev 1.3.0, as tests/reference/data/nist_neutral_ground_levels.csv
    # has it); Hund gives 3H°4.
    ("Ce [Xe] 4f1 5d1 6s2", Level(S=0, L=4, J=4, parity="odd")),
)


@cache
def _misses() -> dict[tuple[int, int, tuple[tuple[int, int, int], ...]], Level]:
    table = {}
    for spec, level in _MISSES:
        conf = parse_spec(spec)
        table[_key(conf)] = level
    return table


def _key(conf: Configuration) -> tuple[int, int, tuple[tuple[int, int, int], ...]]:
    return conf.Z, conf.charge, tuple((sub.n, sub.l, occ) for sub, occ in conf.occupations)


def observed_level(configuration: Configuration | str) -> ObservedLevel | None:
    """The observed ground level of this atom or ion in this configuration, where known.

    Known are the ions of charge +1 to +4 in the shipped NIST table (when the
    configuration is the observed ground one) and the neutral atoms whose ground level
    Hund's rules miss.

    Examples
    --------
    >>> observed_level("Eu3+").text, observed_level("Pr+").text
    ('7F0', '(9/2,1/2)°4')
    >>> observed_level("Eu3+ [Xe] 4f5 5d1") is None
    True
    """
    conf = as_configuration(configuration)
    ion = observed_ion(conf.Z, conf.charge) if conf.charge > 0 else None
    if ion is not None and ion.occupations == conf.occupations:
        parity: Parity = "odd" if ion.parity == "odd" else "even"
        level = None
        if ion.multiplicity is not None and ion.L is not None:
            level = Level(S=(ion.multiplicity - 1) / 2, L=ion.L, J=float(ion.J), parity=parity)
        return ObservedLevel(ion.level, float(ion.J), parity, level, ION_SOURCE)
    missed = _misses().get(_key(conf))
    if missed is not None:
        return ObservedLevel(missed.display, missed.J, missed.parity, missed, OBSERVED_SOURCE)
    return None


def known_hund_miss(configuration: Configuration | str) -> Level | None:
    """The observed ground level, for configurations where Hund's rules are known to miss it.

    Parameters
    ----------
    configuration : Configuration or str

    Returns
    -------
    Level or None
        The observed ground level (NIST ASD) when it differs from ``ground_level``
        for this atom or ion in this configuration; None otherwise. None does not
        mean the rules are right: only checked cases are recorded.

    References
    ----------
    A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
    Database, ground levels of the neutral atoms.

    Examples
    --------
    >>> known_hund_miss("Ce").display, known_hund_miss("C") is None
    ('1G°4', True)
    >>> known_hund_miss("Ce+").display, known_hund_miss("Eu3+") is None
    ('4H°7/2', True)
    """
    observed = observed_level(configuration)
    if observed is None or observed.level is None:
        return None
    return None if observed.level == ground_level(configuration) else observed.level


def ground_notes(configuration: Configuration | str) -> tuple[str, ...]:
    """Notes to show beside the Hund ground level of a configuration.

    Returns
    -------
    tuple of str
        One note when several subshells are open (the rules are then a rule of
        thumb), and one when the observed ground level is known to differ (in L, S
        or J, or in J where NIST names the level in another coupling).

    Examples
    --------
    >>> ground_notes("C")
    ()
    """
    conf = as_configuration(configuration)
    notes: list[str] = []
    if len(open_shells(conf)) > 1:
        notes.append("several open subshells: Hund's rules were found for one open subshell; "
                     "applied to several (the J rule counting all their electrons together) "
                     "they are a rule of thumb")
    observed = observed_level(conf)
    if observed is None:
        return tuple(notes)
    hund = ground_level(conf)
    if observed.level is not None and observed.level != hund:
        notes.append(f"Hund's rules miss here: the observed ground level is {observed.text} "
                     f"({observed.source})")
    elif observed.level is None and observed.J != hund.J:
        notes.append(f"Hund's rules miss here: the observed ground level is {observed.text} "
                     f"({observed.source}), J = {quantum_number_text(observed.J)} against "
                     f"{quantum_number_text(hund.J)}")
    elif observed.level is None:
        notes.append(f"NIST names the observed ground level {observed.text} in another "
                     f"coupling; its J ({quantum_number_text(observed.J)}) agrees with Hund's rules")
    return tuple(notes)

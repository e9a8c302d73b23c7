"""Where Hund's rules are known to miss the observed ground level, and notes to show."""

from __future__ import annotations

from functools import cache
from typing import Final

from zeffir.core.config import Configuration, parse_spec
from zeffir.core.terms._terms import Level, as_configuration, open_shells

__all__ = ["OBSERVED_SOURCE", "ground_notes", "known_hund_miss"]

OBSERVED_SOURCE: Final[str] = "NIST Atomic Spectra Database"

# Observed ground levels of configurations for which Hund's rules (as applied by
# ground_level) give another level. Only cases checked against the NIST ASD
# ground-levels table belong here; the list is not exhaustive.
_MISSES: Final[tuple[tuple[str, Level], ...]] = (
    # Ce I, [Xe] 4f 5d 6s2: NIST ASD ground level 1G°4 (from memory); Hund gives 3H°4.
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
    """
    return _misses().get(_key(as_configuration(configuration)))


def ground_notes(configuration: Configuration | str) -> tuple[str, ...]:
    """Notes to show beside the Hund ground level of a configuration.

    Returns
    -------
    tuple of str
        One note when several subshells are open (the rules are then a rule of
        thumb), and one when the observed ground level is known to differ.

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
    observed = known_hund_miss(conf)
    if observed is not None:
        notes.append(f"Hund's rules miss here: the observed ground level is {observed.display} "
                     f"({OBSERVED_SOURCE})")
    return tuple(notes)

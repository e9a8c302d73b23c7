"""Atom specifications: an element or ion with its electron configuration.

A specification is the text a user types: ``Fe``, ``26``, ``Fe3+``, ``O2-``,
``C 1s2 2s1 2p3``, ``Na [Ne] 4d1``, ``He+ 2p1``. An explicit configuration
replaces the ground one.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from typing import Final

from zeffir.core._errors import SpecError
from zeffir.core.config._elements import Element, element
from zeffir.core.config._subshell import Subshell, madelung_order
from zeffir.core.config._tokens import NOBLE_GAS_CORES, parse_subshell_token

__all__ = ["Configuration", "format_configuration", "parse_spec"]

_ELEMENT: Final = re.compile(r"^([A-Za-z]{1,3}|\d{1,3})(?:(\d*)([+-])|([+-])(\d+))?$")
_CHARGE: Final = re.compile(r"^(?:(\d*)([+-])|([+-])(\d+))$")
_LOOKS_LIKE_SUBSHELL: Final = re.compile(r"^\d+[a-zA-Z]\d*$")
_SEPARATORS: Final = re.compile(r"[\s.,;]+")
_MAX_SPEC_LENGTH: Final[int] = 500


@dataclass(frozen=True, slots=True)
class Configuration:
    """An atom or ion with its occupied subshells.

    Attributes
    ----------
    element : Element
        The nucleus (Z, symbol, name).
    charge : int
        Net charge; electrons = Z - charge.
    occupations : tuple of (Subshell, int)
        Occupied subshells ordered by (n, l); no zero occupancies.
    spec : str
        The normalised specification text, e.g. ``'Fe3+'`` or ``'C 1s2 2s1 2p3'``.
    explicit : bool
        True when the configuration was typed rather than taken as the ground state.
    """

    element: Element
    charge: int
    occupations: tuple[tuple[Subshell, int], ...]
    spec: str
    explicit: bool

    @property
    def Z(self) -> int:
        """Atomic number."""
        return self.element.Z

    @property
    def n_electrons(self) -> int:
        """Number of electrons."""
        return sum(occ for _, occ in self.occupations)

    @property
    def text(self) -> str:
        """Configuration in full trade notation, e.g. ``'1s2 2s2 2p6 3s1'``."""
        return format_configuration(self.occupations)

    @property
    def open_subshells(self) -> tuple[Subshell, ...]:
        """Subshells that are partly filled."""
        return tuple(sub for sub, occ in self.occupations if occ < sub.capacity)

    def occupancy(self, subshell: Subshell) -> int:
        """Electrons in ``subshell`` (0 if it is empty)."""
        return dict(self.occupations).get(subshell, 0)


def format_configuration(occupations: tuple[tuple[Subshell, int], ...]) -> str:
    """Write occupations in trade notation with every occupancy spelled out.

    Examples
    --------
    >>> format_configuration(((Subshell(1, 0), 2), (Subshell(2, 0), 1)))
    '1s2 2s1'
    """
    return " ".join(f"{sub.label}{occ}" for sub, occ in occupations)


def _charge_value(sign: str, digits: str) -> int:
    size = int(digits) if digits else 1
    return size if sign == "+" else -size


def _ion_ground(atom: Element, charge: int) -> tuple[tuple[Subshell, int], ...]:
    """Ground configuration of an ion from the neutral atom's observed one.

    Cations lose electrons from the highest n first, then the highest l (so Fe3+
    is [Ar] 3d5); anions gain them in Madelung order. Both are rules of thumb
    (common practice): a few ions have other observed ground configurations.
    """
    occupation = dict(atom.ground)
    if charge > 0:
        for _ in range(charge):
            outer = max(occupation, key=lambda sub: (sub.n, sub.l))
            occupation[outer] -= 1
            if occupation[outer] == 0:
                del occupation[outer]
    else:
        order = madelung_order()
        for _ in range(-charge):
            target = next(
                (sub for sub in order if occupation.get(sub, 0) < sub.capacity), None
            )
            if target is None:  # pragma: no cover - far beyond any real anion
                raise SpecError(f"charge {charge}: too many electrons for the subshell table")
            occupation[target] = occupation.get(target, 0) + 1
    return tuple(sorted(occupation.items()))


def parse_spec(text: str) -> Configuration:
    """Parse an atom specification.

    Parameters
    ----------
    text : str
        Element symbol or atomic number with an optional charge (``Fe3+``,
        ``O2-``, ``Na+``, ``26``), optionally followed by a configuration in
        trade notation: noble-gas cores ``[He]`` … ``[Og]`` and subshell tokens
        ``nl`` + electrons (``1s2 2s1 2p3``; an omitted occupancy means 1).
        Tokens may be separated by spaces or dots.

    Returns
    -------
    Configuration
        The explicit configuration if one was typed, otherwise the observed
        ground configuration of the neutral atom (NIST ASD) or, for an ion,
        the one derived from it (see Notes).

    Raises
    ------
    SpecError
        For any invalid input; the message names the offending token and rule.

    Notes
    -----
    Cations lose their outermost electrons first (highest n, then highest l);
    anions fill in Madelung order. This is common practice and matches the
    observed ground configuration of most ions, not all.

    Examples
    --------
    >>> parse_spec("Fe3+").text
    '1s2 2s2 2p6 3s2 3p6 3d5'
    >>> parse_spec("He+ 2p1").n_electrons
    1
    """
    if not isinstance(text, str):
        raise SpecError(f"{text!r}: a spec must be text")
    stripped = text.strip()
    if len(stripped) > _MAX_SPEC_LENGTH:
        raise SpecError(f"spec too long: at most {_MAX_SPEC_LENGTH} characters")
    tokens = [tok for tok in _SEPARATORS.split(stripped) if tok]
    if not tokens:
        raise SpecError("empty spec: type an element symbol or atomic number, e.g. Fe or 26")
    head = tokens.pop(0)
    match = _ELEMENT.match(head)
    if match is None:
        if _LOOKS_LIKE_SUBSHELL.match(head):
            raise SpecError(f"{head}: the spec must start with an element symbol or atomic number")
        raise SpecError(f"{head}: unknown element")
    symbol, digits, sign, sign2, digits2 = match.groups()
    atom = element(symbol)
    charge = 0
    if sign:
        charge = _charge_value(sign, digits)
    elif sign2:
        charge = _charge_value(sign2, digits2)
    if tokens and _CHARGE.match(tokens[0]):
        if sign or sign2:
            raise SpecError(f"{tokens[0]}: the charge is already given in {head}")
        charge_token = tokens.pop(0)
        charge_match = _CHARGE.match(charge_token)
        assert charge_match is not None
        d1, s1, s2, d2 = charge_match.groups()
        charge = _charge_value(s1, d1) if s1 else _charge_value(s2, d2)
    ion = f"{atom.symbol}{_charge_suffix(charge)}"
    electrons = atom.Z - charge
    if electrons <= 0:
        raise SpecError(f"{ion}: no electrons left (charge {charge:+d} with Z = {atom.Z})")
    if not tokens:
        return Configuration(atom, charge, _ion_ground(atom, charge), ion, explicit=False)
    occupations = _read_configuration(tokens)
    count = sum(occ for _, occ in occupations)
    if count != electrons:
        typed = " ".join(tokens)
        who = f"neutral {atom.symbol}" if charge == 0 else ion
        raise SpecError(
            f"{ion} {typed}: {count} electron{'s' if count != 1 else ''}, "
            f"but {who} has {electrons}"
        )
    spec = f"{ion} {format_configuration(occupations)}"
    return Configuration(atom, charge, occupations, spec, explicit=True)


def _charge_suffix(charge: int) -> str:
    if charge == 0:
        return ""
    size = "" if abs(charge) == 1 else str(abs(charge))
    return f"{size}{'+' if charge > 0 else '-'}"


def _read_configuration(tokens: list[str]) -> tuple[tuple[Subshell, int], ...]:
    occupation: dict[Subshell, int] = {}
    source: dict[Subshell, str] = {}
    for token in tokens:
        if token.startswith("[") or token.endswith("]"):
            name = token.strip("[]")
            if not (token.startswith("[") and token.endswith("]")) or name not in NOBLE_GAS_CORES:
                cores = " ".join(f"[{c}]" for c in NOBLE_GAS_CORES)
                raise SpecError(f"{token}: unknown core (use one of {cores})")
            if occupation:
                raise SpecError(f"{token}: a core must come before the subshells")
            for subshell, occ in element(name).ground:
                occupation[subshell] = occ
                source[subshell] = token
            continue
        if _ELEMENT.match(token) and not token[0].isdigit():
            raise SpecError(f"{token}: only one element per spec")
        subshell, occ = parse_subshell_token(token)
        if subshell in occupation:
            where = source[subshell]
            if where.startswith("["):
                raise SpecError(f"{token}: {where} already fills {subshell.label}")
            raise SpecError(f"{token}: {subshell.label} is listed twice")
        occupation[subshell] = occ
        source[subshell] = token
    return tuple(sorted((sub, occ) for sub, occ in occupation.items() if occ > 0))

"""Atom specifications: an element or ion with its electron configuration.

A specification is the text a user types: ``Fe``, ``26``, ``Fe3+``, ``O2-``,
``C 1s2 2s1 2p3``, ``Na [Ne] 4d1``, ``He+ 2p1``. An explicit configuration
replaces the ground one.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from typing import Final, Literal

from zeffir.core._errors import SpecError
from zeffir.core.config._elements import Element, element
from zeffir.core.config._ions import ION_SOURCE, observed_ion
from zeffir.core.config._subshell import Subshell, madelung_order
from zeffir.core.config._tokens import NOBLE_GAS_CORES, parse_subshell_token

__all__ = [
    "Configuration",
    "Origin",
    "derived_ion_ground",
    "format_configuration",
    "format_with_core",
    "parse_spec",
    "removal_order",
]

#: Where a configuration comes from: typed by the user, the observed ground state
#: (NIST ASD: every neutral atom, the ions of the shipped table) or derived by rule.
Origin = Literal["typed", "observed", "derived"]

# re.ASCII: only the digits 0–9 count (Python's \d also takes Arabic-Indic and other digits).
_ELEMENT: Final = re.compile(r"^([A-Za-z]{1,3}|\d{1,3})(?:(\d*)([+-])|([+-])(\d+))?$", re.ASCII)
_CHARGE: Final = re.compile(r"^(?:(\d*)([+-])|([+-])(\d+))$", re.ASCII)
_LOOKS_LIKE_SUBSHELL: Final = re.compile(r"^\d+[a-zA-Z]\d*$", re.ASCII)
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
    origin : {'typed', 'observed', 'derived'}
        Typed by the user; the observed ground configuration (NIST ASD: every neutral
        atom, and the ions of charge +1 to +4 the shipped table lists); or derived from
        the neutral atom's by the rules of ``derived_ion_ground``.

    Examples
    --------
    The occupied subshells hold the electrons the charge leaves, Z − charge, whether
    the configuration is the ground one or typed:

    >>> fe3 = parse_spec("Fe3+")
    >>> fe3.n_electrons == fe3.Z - fe3.charge == 23
    True
    >>> excited = parse_spec("O2- [He] 2s2 2p5 3s1")
    >>> excited.n_electrons == excited.Z - excited.charge, excited.explicit
    (True, True)
    """

    element: Element
    charge: int
    occupations: tuple[tuple[Subshell, int], ...]
    spec: str
    explicit: bool
    origin: Origin = "typed"

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
    def short_text(self) -> str:
        """Configuration with its largest full noble-gas core in brackets, e.g. ``'[Xe] 4f6'``."""
        return format_with_core(self.occupations)

    @property
    def open_subshells(self) -> tuple[Subshell, ...]:
        """Subshells that are partly filled."""
        return tuple(sub for sub, occ in self.occupations if occ < sub.capacity)

    def occupancy(self, subshell: Subshell) -> int:
        """Electrons in ``subshell`` (0 if it is empty)."""
        return dict(self.occupations).get(subshell, 0)

    @property
    def origin_note(self) -> str:
        """One line saying where the configuration comes from, for tables and exports."""
        ion = self.spec.split()[0]
        if self.origin == "typed":
            return f"configuration as typed ({ion})"
        if self.origin == "observed" and self.charge == 0:
            return f"observed ground configuration of {ion} (NIST Atomic Spectra Database)"
        if self.origin == "observed":
            rule = derived_ion_ground(self.element, self.charge)
            differs = "" if rule == self.occupations else (
                f"; the removal rule would give {format_with_core(rule)}")
            return f"observed ground configuration of {ion} ({ION_SOURCE}){differs}"
        how = ("electrons removed from the outermost s and p, then (n−1)d, then (n−2)f"
               if self.charge > 0 else "electrons added in Madelung order")
        return (f"ground configuration of {ion} derived from the neutral atom's ({how}); "
                "no observed ground state is shipped for this ion")


def format_configuration(occupations: tuple[tuple[Subshell, int], ...]) -> str:
    """Write occupations in trade notation with every occupancy spelled out.

    Examples
    --------
    >>> format_configuration(((Subshell(1, 0), 2), (Subshell(2, 0), 1)))
    '1s2 2s1'
    """
    return " ".join(f"{sub.label}{occ}" for sub, occ in occupations)


def format_with_core(occupations: tuple[tuple[Subshell, int], ...]) -> str:
    """Write occupations with the largest full noble-gas core in brackets.

    Examples
    --------
    >>> format_with_core(element("Fe").ground)
    '[Ar] 3d6 4s2'
    >>> format_with_core(element("Ar").ground)
    '[Ar]'
    """
    occupation = dict(occupations)
    for name, _ in sorted(NOBLE_GAS_CORES.items(), key=lambda item: -item[1]):
        core = element(name).ground
        if all(occupation.get(sub) == occ for sub, occ in core):
            inside = {sub for sub, _ in core}
            rest = format_configuration(tuple(item for item in occupations if item[0] not in inside))
            return f"[{name}] {rest}".rstrip()
    return format_configuration(occupations)


def _charge_value(sign: str, digits: str, sign_first: bool = False) -> int:
    size = int(digits) if digits else 1
    if size == 0 or digits.startswith("0"):
        typed = f"{sign}{digits}" if sign_first else f"{digits}{sign}"
        raise SpecError(f"{typed}: write a charge as +, 2+, 3- …, without a zero "
                        "(a neutral atom has no charge sign)")
    return size if sign == "+" else -size


def _valence_rank(subshell: Subshell) -> tuple[int, int]:
    """Removal priority: outermost s and p first, then (n-1)d, then (n-2)f (then g...)."""
    shell = subshell.n + max(subshell.l - 1, 0)
    within = {0: 2, 1: 3}.get(subshell.l, 2 - subshell.l)
    return shell, within


def _core_of(occupation: dict[Subshell, int]) -> set[Subshell]:
    """Subshells of the largest noble-gas core that is full and smaller than the ion."""
    electrons = sum(occupation.values())
    for name, z_core in sorted(NOBLE_GAS_CORES.items(), key=lambda item: -item[1]):
        if z_core >= electrons:
            continue
        core = element(name).ground
        if all(occupation.get(sub, 0) == occ for sub, occ in core):
            return {sub for sub, _ in core}
    return set()


def removal_order(
    occupations: tuple[tuple[Subshell, int], ...], count: int | None = None
) -> tuple[Subshell, ...]:
    """The subshell that loses the next electron first, for each electron of a cation.

    Parameters
    ----------
    occupations : tuple of (Subshell, int)
        A configuration (usually a neutral atom's observed one).
    count : int, optional
        Stop after this many electrons (default: all of them).

    Returns
    -------
    tuple of Subshell
        One entry per electron, in the order the electrons are removed, until none is left.

    Notes
    -----
    Only subshells outside the largest full noble-gas core lose electrons while any
    remain there: the outermost s and p first (p before s), then the (n−1)d, then the
    (n−2)f. When they are empty the core's own outer subshells follow by the same rule
    (for the [Xe] core: 5p, 5s, then 4d). This is common practice in the chemistry of
    the d and f blocks; NIST's observed ground states of the ions show where it fails
    (see ``derived_ion_ground``).

    Examples
    --------
    >>> order = removal_order(element("Eu").ground)
    >>> [sub.label for sub in order[:4]]
    ['6s', '6s', '4f', '4f']
    """
    occupation = dict(occupations)
    order: list[Subshell] = []
    limit = sum(occupation.values()) if count is None else count
    while occupation and len(order) < limit:
        core = _core_of(occupation)
        valence = [sub for sub in occupation if sub not in core]
        outer = max(valence, key=_valence_rank)
        order.append(outer)
        occupation[outer] -= 1
        if occupation[outer] == 0:
            del occupation[outer]
    return tuple(order)


def derived_ion_ground(atom: Element, charge: int) -> tuple[tuple[Subshell, int], ...]:
    """Ground configuration of an ion derived by rule from the neutral atom's observed one.

    Parameters
    ----------
    atom : Element
    charge : int
        Net charge; positive removes electrons, negative adds them.

    Returns
    -------
    tuple of (Subshell, int)
        Ordered by (n, l).

    Notes
    -----
    Cations lose valence electrons in the order of ``removal_order`` (outermost s and p,
    then (n−1)d, then (n−2)f; never a closed noble-gas core while valence electrons
    remain), so Eu³⁺ is [Xe] 4f⁶ and Fe³⁺ [Ar] 3d⁵. Anions gain electrons in Madelung
    order. Both are common practice; ``parse_spec`` prefers NIST's observed ground
    configuration where the shipped table has one (V⁺ 3d⁴, La⁺ 5d², Ce²⁺ 4f², …).

    References
    ----------
    A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team, NIST Atomic Spectra
    Database, ground states of the ions (which the rule is checked against).

    Examples
    --------
    >>> format_with_core(derived_ion_ground(element("U"), 4))
    '[Rn] 5f2'
    >>> format_with_core(derived_ion_ground(element("V"), 1))
    '[Ar] 3d3 4s1'

    Whatever the charge, the ion holds Z − charge electrons:

    >>> all(sum(occ for _, occ in derived_ion_ground(element("Eu"), q)) == 63 - q
    ...     for q in (-2, -1, 1, 2, 3, 4, 10))
    True
    """
    occupation = dict(atom.ground)
    if charge > 0:
        if charge > atom.Z:
            raise SpecError(f"charge {charge}: more than the {atom.Z} electrons of {atom.symbol}")
        for outer in removal_order(atom.ground, charge):
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


def _ion_ground(atom: Element, charge: int) -> tuple[tuple[tuple[Subshell, int], ...], Origin]:
    """The ground configuration of an atom or ion and where it comes from."""
    if charge == 0:
        return atom.ground, "observed"
    found = observed_ion(atom.Z, charge)
    if found is not None:
        return found.occupations, "observed"
    return derived_ion_ground(atom, charge), "derived"


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
        ground configuration (NIST ASD) of the neutral atom or of the ion where the
        shipped table lists it, else one derived from the neutral atom's (see Notes).

    Raises
    ------
    SpecError
        For any invalid input; the message names the offending token and rule.

    Notes
    -----
    Ions of charge +1 to +4 up to lawrencium take NIST's observed ground
    configuration. Other cations lose valence electrons first (outermost s and p,
    then (n−1)d, then (n−2)f; see ``removal_order``); anions fill in Madelung order.
    ``Configuration.origin`` says which applied.

    Examples
    --------
    >>> parse_spec("Fe3+").text
    '1s2 2s2 2p6 3s2 3p6 3d5'
    >>> parse_spec("Eu3+").short_text, parse_spec("Eu3+").origin
    ('[Xe] 4f6', 'observed')
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
        charge = _charge_value(sign2, digits2, sign_first=True)
    if tokens and _CHARGE.match(tokens[0]):
        if sign or sign2:
            raise SpecError(f"{tokens[0]}: the charge is already given in {head}")
        charge_token = tokens.pop(0)
        charge_match = _CHARGE.match(charge_token)
        assert charge_match is not None
        d1, s1, s2, d2 = charge_match.groups()
        charge = _charge_value(s1, d1) if s1 else _charge_value(s2, d2, sign_first=True)
    ion = f"{atom.symbol}{_charge_suffix(charge)}"
    electrons = atom.Z - charge
    if electrons <= 0:
        raise SpecError(f"{ion}: no electrons left (charge {charge:+d} with Z = {atom.Z})")
    if not tokens:
        occupations, origin = _ion_ground(atom, charge)
        return Configuration(atom, charge, occupations, ion, explicit=False, origin=origin)
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
    return Configuration(atom, charge, occupations, spec, explicit=True, origin="typed")


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
            name = token[1:-1] if token.startswith("[") and token.endswith("]") else ""
            if name not in NOBLE_GAS_CORES:
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

"""Which configurations a trend runs over: Z ranges, isoelectronic sequences, families.

A rule is written as text on the command line and in sessions:

- ``Z=1-36``: the neutral atoms H … Kr in their observed ground configurations;
- ``isoelectronic=10:Z=10-20``: ten electrons on Z = 10 … 20 (Ne, Na⁺, …, Ca¹⁰⁺),
  each ion in its ground configuration as the subshell table derives it;
- ``family=[Ar] 3dn 4s2:n=1-10``: a configuration with one subshell's occupancy
  running over n (written ``3dn``, ``3d{n}`` or ``3dⁿ``), each on the neutral atom
  with that many electrons (Sc … Zn here);
- anything else: specs separated by commas (``Li, Na, K, Rb``).
"""

from __future__ import annotations

import re
from dataclasses import dataclass

from zeffir.core._errors import ZeffirError
from zeffir.core.config import NOBLE_GAS_CORES, element, parse_spec, parse_subshell_token

__all__ = [
    "TrendRuleError",
    "configuration_family",
    "ion_spec",
    "isoelectronic_sequence",
    "parse_rule",
    "z_range",
]

#: Atomic numbers the element table holds.
_Z_MIN, _Z_MAX = 1, 118


class TrendRuleError(ZeffirError):
    """A rule that names no configurations, or names them wrongly."""


@dataclass(frozen=True, slots=True)
class _Span:
    first: int
    last: int


def _span(text: str, what: str, low: int, high: int) -> _Span:
    """``a-b`` or ``a`` as an inclusive range inside [low, high]."""
    match = re.fullmatch(r"\s*(\d+)\s*(?:[-–]\s*(\d+)\s*)?", text)
    if not match:
        raise TrendRuleError(f"{what}={text.strip()}: write a range such as {what}=1-36 or one value")
    first = int(match[1])
    last = int(match[2]) if match[2] else first
    if first > last:
        raise TrendRuleError(f"{what}={text.strip()}: the range runs backwards (write {last}-{first})")
    if first < low or last > high:
        raise TrendRuleError(f"{what}={text.strip()}: {what} must lie between {low} and {high}")
    return _Span(first, last)


def ion_spec(z: int, charge: int) -> str:
    """The spec of element ``z`` with ``charge`` (``Fe``, ``Fe+``, ``Fe3+``, ``O2-``).

    Examples
    --------
    >>> ion_spec(26, 0), ion_spec(26, 1), ion_spec(26, 3), ion_spec(8, -2)
    ('Fe', 'Fe+', 'Fe3+', 'O2-')
    """
    symbol = element(z).symbol
    if charge == 0:
        return symbol
    size = "" if abs(charge) == 1 else str(abs(charge))
    return f"{symbol}{size}{'+' if charge > 0 else '-'}"


def z_range(first: int, last: int) -> list[str]:
    """The neutral atoms Z = first … last (observed ground configurations)."""
    return [ion_spec(z, 0) for z in range(first, last + 1)]


def isoelectronic_sequence(electrons: int, first: int, last: int) -> list[str]:
    """``electrons`` electrons on Z = first … last: the neutral atom, its cations and anions.

    Examples
    --------
    >>> isoelectronic_sequence(10, 8, 12)
    ['O2-', 'F-', 'Ne', 'Na+', 'Mg2+']
    """
    if electrons < 1:
        raise TrendRuleError(f"isoelectronic={electrons}: a sequence needs at least one electron")
    specs = []
    for z in range(first, last + 1):
        if electrons > 2 * z + 2:
            raise TrendRuleError(f"isoelectronic={electrons}: Z = {z} cannot bind {electrons} electrons "
                                 f"(an ion of charge {z - electrons}); start the range higher")
        specs.append(ion_spec(z, z - electrons))
    return specs


_PLACEHOLDER = re.compile(r"(\d[spdfghik])(?:\{n\}|n|ⁿ)(?=\s|$)")


def configuration_family(template: str, first: int, last: int) -> list[str]:
    """A configuration whose one marked occupancy runs over n = first … last, on neutral atoms.

    Parameters
    ----------
    template : str
        A configuration in trade notation with one occupancy written ``n`` (``3dn``,
        ``3d{n}`` or ``3dⁿ``), e.g. ``"[Ar] 3dn 4s2"``.
    first, last : int
        The range of n.

    Returns
    -------
    list of str
        One spec per n, on the neutral atom with that many electrons.

    Examples
    --------
    >>> configuration_family("[Ar] 3dn 4s2", 1, 3)
    ['Sc [Ar] 3d1 4s2', 'Ti [Ar] 3d2 4s2', 'V [Ar] 3d3 4s2']
    """
    marks = _PLACEHOLDER.findall(template)
    if len(marks) != 1:
        raise TrendRuleError(f"family={template.strip()}: mark exactly one occupancy with n "
                             f"(e.g. family=[Ar] 3dn 4s2:n=1-10)")
    specs = []
    for n in range(first, last + 1):
        text = _PLACEHOLDER.sub(rf"\g<1>{n}", template).strip()
        # A subshell with no electrons (n = 0) drops out.
        text = " ".join(t for t in text.split() if not re.fullmatch(r"\d+[spdfghik]0", t))
        electrons = _electrons(text, template)
        if not _Z_MIN <= electrons <= _Z_MAX:
            raise TrendRuleError(f"family={template.strip()}: n = {n} gives {electrons} electrons, "
                                 f"no neutral atom has that many")
        spec = f"{element(electrons).symbol} {text}"
        try:
            parse_spec(spec)
        except ZeffirError as error:
            raise TrendRuleError(f"family={template.strip()}: n = {n}: {error}") from error
        specs.append(spec)
    return specs


def _electrons(text: str, template: str) -> int:
    """Electrons of a configuration in trade notation (a bracketed core counts its own)."""
    total = 0
    for token in text.split():
        if token.startswith("[") and token.endswith("]"):
            core = token[1:-1]
            if core not in NOBLE_GAS_CORES:
                raise TrendRuleError(f"family={template.strip()}: {token} is not a noble-gas core")
            total += NOBLE_GAS_CORES[core]
            continue
        try:
            total += parse_subshell_token(token)[1]
        except ZeffirError as error:
            raise TrendRuleError(f"family={template.strip()}: {error}") from error
    return total


def parse_rule(text: str) -> list[str]:
    """The specs a rule names (see the module notes for the forms).

    Raises
    ------
    TrendRuleError
        The rule is malformed; the message names the offending part.

    Examples
    --------
    >>> parse_rule("Z=3-5"), parse_rule("isoelectronic=2:Z=1-3")
    (['Li', 'Be', 'B'], ['H-', 'He', 'Li+'])
    >>> parse_rule("Li, Na,K")
    ['Li', 'Na', 'K']
    """
    rule = text.strip()
    if not rule:
        raise TrendRuleError("empty rule: write Z=1-36, isoelectronic=10:Z=10-20, "
                             "family=[Ar] 3dn 4s2:n=1-10 or specs separated by commas")
    head, equals, body = rule.partition("=")
    key = head.strip().lower()
    if equals and key == "z":
        span = _span(body, "Z", _Z_MIN, _Z_MAX)
        return z_range(span.first, span.last)
    if equals and key == "isoelectronic":
        count, colon, rest = body.partition(":")
        z_key, z_equals, z_text = rest.partition("=")
        if not colon or z_key.strip().lower() != "z" or not z_equals:
            raise TrendRuleError(f"{rule}: write isoelectronic=N:Z=a-b, e.g. isoelectronic=10:Z=10-20")
        if not count.strip().isdigit():
            raise TrendRuleError(f"{rule}: the number of electrons ({count.strip()!r}) is not a whole number")
        span = _span(z_text, "Z", _Z_MIN, _Z_MAX)
        return isoelectronic_sequence(int(count), span.first, span.last)
    if equals and key == "family":
        template, colon, rest = body.rpartition(":")
        n_key, n_equals, n_text = rest.partition("=")
        if not colon or n_key.strip().lower() != "n" or not n_equals:
            raise TrendRuleError(f"{rule}: write family=CONFIGURATION:n=a-b, e.g. family=[Ar] 3dn 4s2:n=1-10")
        span = _span(n_text, "n", 0, 14)
        return configuration_family(template, span.first, span.last)
    if equals and key not in ("z", "isoelectronic", "family") and "," not in rule:
        raise TrendRuleError(f"{head.strip()}=: unknown rule (choose Z=, isoelectronic= or family=, "
                             f"or list specs separated by commas)")
    specs = [part.strip() for part in rule.split(",")]
    empty = [i + 1 for i, part in enumerate(specs) if not part]
    if empty:
        raise TrendRuleError(f"{rule}: entry {empty[0]} of the list is empty")
    for spec in specs:
        try:
            parse_spec(spec)
        except ZeffirError as error:
            raise TrendRuleError(f"{spec}: {error}") from error
    return specs

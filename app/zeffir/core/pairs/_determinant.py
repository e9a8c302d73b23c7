"""Spin-orbitals and single Slater determinants of a configuration, with a text syntax.

A determinant says which spin-orbitals (n, l, m, spin) are occupied. Closed
subshells hold all of theirs; an open subshell can be filled in many ways, and the
choice changes the pair density. Spin-orbitals use complex harmonics Y_l^m with the
Condon–Shortley phase, so m is the magnetic quantum number m_l.

Text syntax for the open subshells, one group per subshell separated by ``;``::

    2p: 1u 0u -1d
    3d: 2u 1u 0u -1u -2u; 4s: 0d

Each token is m followed by ``u`` (spin up, α, m_s = +1/2) or ``d`` (spin down, β,
m_s = -1/2). Subshells not mentioned take their Hund filling.
"""

from __future__ import annotations

import re
from collections import Counter
from collections.abc import Iterator
from dataclasses import dataclass
from typing import Final

from zeffir.core._errors import SpecError
from zeffir.core.config import Configuration, Subshell

__all__ = [
    "DOWN",
    "UP",
    "Determinant",
    "DeterminantError",
    "SpinOrbital",
    "format_determinant",
    "hund_determinant",
    "parse_determinant",
]

#: Spin up (α, m_s = +1/2).
UP: Final[int] = 1
#: Spin down (β, m_s = -1/2).
DOWN: Final[int] = -1

_SPIN_LETTER: Final[dict[int, str]] = {UP: "u", DOWN: "d"}
_TOKEN: Final = re.compile(r"^([+-]?\d{1,2})([udUD])$")
_LABEL: Final = re.compile(r"^(\d{1,2})([a-zA-Z])$")
_MAX_TEXT_LENGTH: Final[int] = 2000


class DeterminantError(SpecError):
    """A determinant (typed or built) breaks a rule: Pauli, subshell, m range or electron count.

    The message names the offending token or spin-orbital and the rule.

    Examples
    --------
    The Pauli principle: one spin-orbital cannot hold two electrons.

    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.config import Subshell
    >>> up = SpinOrbital(Subshell(1, 0), 0, UP)
    >>> try:
    ...     Determinant(parse_spec("He"), (up, up))
    ... except DeterminantError as error:
    ...     print(error)
    1s 0u: listed twice (Pauli principle: a spin-orbital holds one electron)
    """


@dataclass(frozen=True, order=True, slots=True)
class SpinOrbital:
    """One spin-orbital φ_{nlm}(r) χ_σ: a subshell, a magnetic quantum number and a spin.

    Parameters
    ----------
    subshell : Subshell
        n and l.
    m : int
        Magnetic quantum number, |m| <= l; the spatial part is R_nl(r) Y_l^m(θ, φ)
        with the complex harmonic of Condon–Shortley phase.
    spin : int
        +1 for spin up (α, m_s = +1/2), -1 for spin down (β, m_s = -1/2).

    Examples
    --------
    >>> from zeffir.core.config import Subshell
    >>> str(SpinOrbital(Subshell(2, 1), -1, DOWN))
    '2p -1d'
    """

    subshell: Subshell
    m: int
    spin: int

    def __post_init__(self) -> None:
        if self.spin not in (UP, DOWN):
            raise DeterminantError(f"spin = {self.spin}: use +1 (up, α) or -1 (down, β)")
        if abs(self.m) > self.subshell.l:
            raise DeterminantError(
                f"{self.subshell.label} m = {self.m}: |m| must be at most l = {self.subshell.l}"
            )

    @property
    def token(self) -> str:
        """The token of the text syntax, e.g. ``'-1d'``."""
        return f"{self.m}{_SPIN_LETTER[self.spin]}"

    def __str__(self) -> str:
        return f"{self.subshell.label} {self.token}"


def _canonical_key(item: SpinOrbital) -> tuple[int, int, int, int]:
    # Subshells in (n, l) order; within one, spin up first, then m from +l down.
    return (item.subshell.n, item.subshell.l, -item.spin, -item.m)


@dataclass(frozen=True, slots=True)
class Determinant:
    """A single Slater determinant of a configuration: which spin-orbitals are occupied.

    Parameters
    ----------
    configuration : Configuration
        The configuration whose electrons the determinant places.
    spin_orbitals : tuple of SpinOrbital
        One per electron. They are stored in a canonical order (by subshell, spin up
        first, m descending); the order only fixes the overall sign of the
        wavefunction, never a density.

    Raises
    ------
    DeterminantError
        If a spin-orbital appears twice (Pauli principle), lies in a subshell that is
        not occupied, or a subshell holds a different number of electrons than the
        configuration says.

    Notes
    -----
    Φ = (N!)^{-1/2} det[φ_i(x_j)], x = (r, σ) (Slater 1929). M_L = Σ m and
    M_S = Σ m_s are good quantum numbers of every determinant built from complex
    harmonics.

    References
    ----------
    J. C. Slater, Phys. Rev. 34, 1293 (1929).

    Examples
    --------
    Placing carbon's two 2p electrons in every ordered pair of the six 2p
    spin-orbitals gives C(6, 2) = 15 distinct determinants, the microstates of p²
    (the order only fixes a sign; a repeated spin-orbital is refused). By M_S they
    split 3 + 9 + 3, as the terms ³P, ¹D and ¹S require (3 + 5 + 1 at M_S = 0):

    >>> from collections import Counter
    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.config import Subshell
    >>> carbon = parse_spec("C")
    >>> closed = [SpinOrbital(Subshell(n, 0), 0, spin) for n in (1, 2) for spin in (UP, DOWN)]
    >>> p = [SpinOrbital(Subshell(2, 1), m, spin) for m in (-1, 0, 1) for spin in (UP, DOWN)]
    >>> found = set()
    >>> for a in p:
    ...     for b in p:
    ...         try:
    ...             found.add(Determinant(carbon, (*closed, a, b)))
    ...         except DeterminantError:
    ...             pass
    >>> len(found), sorted(Counter(d.m_s for d in found).items())
    (15, [(-1.0, 3), (0.0, 9), (1.0, 3)])
    """

    configuration: Configuration
    spin_orbitals: tuple[SpinOrbital, ...]

    def __post_init__(self) -> None:
        items = tuple(self.spin_orbitals)
        for item in items:
            if not isinstance(item, SpinOrbital):
                raise DeterminantError(f"{item!r}: not a spin-orbital")
        repeated = [item for item, count in Counter(items).items() if count > 1]
        if repeated:
            raise DeterminantError(
                f"{repeated[0]}: listed twice (Pauli principle: a spin-orbital holds one electron)"
            )
        counts = Counter(item.subshell for item in items)
        occupied = dict(self.configuration.occupations)
        for subshell in counts:
            if subshell not in occupied:
                raise DeterminantError(
                    f"{subshell.label}: not occupied in {self.configuration.text}"
                )
        for subshell, occupancy in occupied.items():
            if counts.get(subshell, 0) != occupancy:
                raise DeterminantError(
                    f"{subshell.label}: {counts.get(subshell, 0)} spin-orbitals, but the "
                    f"configuration puts {occupancy} electron{'s' if occupancy != 1 else ''} there"
                )
        object.__setattr__(self, "spin_orbitals", tuple(sorted(items, key=_canonical_key)))

    def __len__(self) -> int:
        return len(self.spin_orbitals)

    def __iter__(self) -> Iterator[SpinOrbital]:
        return iter(self.spin_orbitals)

    @property
    def m_l(self) -> int:
        """M_L = Σ m over the occupied spin-orbitals."""
        return sum(item.m for item in self.spin_orbitals)

    @property
    def m_s(self) -> float:
        """M_S = Σ m_s = (N_up - N_down)/2."""
        return 0.5 * sum(item.spin for item in self.spin_orbitals)

    def count(self, spin: int) -> int:
        """Number of electrons of one spin (+1 up, -1 down)."""
        return sum(1 for item in self.spin_orbitals if item.spin == spin)

    def in_subshell(self, subshell: Subshell) -> tuple[SpinOrbital, ...]:
        """The occupied spin-orbitals of one subshell, in canonical order."""
        return tuple(item for item in self.spin_orbitals if item.subshell == subshell)

    @property
    def text(self) -> str:
        """The open subshells in the text syntax (see :func:`format_determinant`)."""
        return format_determinant(self)


def _hund_subshell(subshell: Subshell, electrons: int) -> list[SpinOrbital]:
    l = subshell.l
    orbitals_per_spin = 2 * l + 1
    ms = list(range(l, -l - 1, -1))
    up = min(electrons, orbitals_per_spin)
    down = electrons - up
    return [SpinOrbital(subshell, m, UP) for m in ms[:up]] + [
        SpinOrbital(subshell, m, DOWN) for m in ms[:down]
    ]


def hund_determinant(configuration: Configuration) -> Determinant:
    """The determinant of highest M_S and then highest M_L (Hund's first two rules).

    Parameters
    ----------
    configuration : Configuration

    Returns
    -------
    Determinant
        Closed subshells full; in each open subshell of l holding q electrons, spin
        up in m = l, l-1, …, then (for q > 2l + 1) spin down from m = l downwards.

    Notes
    -----
    Filling one spin first maximises M_S = S of the Hund term; taking the largest m
    first then maximises M_L = L. The determinant is therefore the component
    M_L = L, M_S = S of the Hund ground term (a single determinant, since no other
    determinant of the configuration has those M_L, M_S). Hund's rules hold for the
    ground configuration of most atoms; they are a rule of thumb for excited ones.

    References
    ----------
    F. Hund, Z. Phys. 33, 345 (1925); E. U. Condon and G. H. Shortley, *The Theory
    of Atomic Spectra* (Cambridge, 1935), ch. 7.

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> det = hund_determinant(parse_spec("O"))
    >>> det.m_s, det.m_l, det.text
    (1.0, 1, '2p: 1u 0u -1u 1d')

    Its M_S and M_L are S and L of the Hund term, for open d and f shells too:

    >>> from zeffir.core.terms import ground_level
    >>> all((hund_determinant(parse_spec(s)).m_s, hund_determinant(parse_spec(s)).m_l)
    ...     == (ground_level(s).S, ground_level(s).L) for s in ("O", "Fe", "Gd3+", "Ho"))
    True
    """
    items: list[SpinOrbital] = []
    for subshell, electrons in configuration.occupations:
        items.extend(_hund_subshell(subshell, electrons))
    return Determinant(configuration, tuple(items))


def _read_label(text: str) -> Subshell:
    match = _LABEL.match(text)
    if match is None:
        raise DeterminantError(f"{text}: not a subshell label (e.g. 2p)")
    try:
        return Subshell.from_label(f"{int(match.group(1))}{match.group(2).lower()}")
    except ValueError as error:  # QuantumNumberError: unknown letter, l >= n
        raise DeterminantError(str(error)) from None


def parse_determinant(configuration: Configuration, text: str) -> Determinant:
    """Read a determinant of ``configuration`` from the text syntax.

    Parameters
    ----------
    configuration : Configuration
        The configuration (from :func:`~zeffir.core.parse_spec`).
    text : str
        Groups ``<subshell>: <m><u|d> ...`` separated by ``;``, e.g.
        ``"2p: 1u 0u -1d"`` or ``"3d: 2u 1u 0u -1u -2u; 4s: 0d"``. ``u`` is spin up
        (α), ``d`` spin down (β); m may carry a sign (``+1u``). Empty text gives the
        Hund determinant.

    Returns
    -------
    Determinant
        The listed subshells as typed; every subshell not mentioned (closed ones in
        particular) takes its Hund filling (:func:`hund_determinant`).

    Raises
    ------
    DeterminantError
        Naming the offending token and the rule: a malformed token, a subshell that
        is not in the configuration or listed twice, |m| > l, a spin-orbital listed
        twice (Pauli), or a count that differs from the subshell's electrons.

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> det = parse_determinant(parse_spec("N"), "2p: 1u 0u -1d")
    >>> det.m_s, det.m_l
    (0.5, 0)
    """
    if not isinstance(text, str):
        raise DeterminantError(f"{text!r}: a determinant must be text")
    if len(text) > _MAX_TEXT_LENGTH:
        raise DeterminantError(f"determinant text too long: at most {_MAX_TEXT_LENGTH} characters")
    occupied = dict(configuration.occupations)
    chosen: dict[Subshell, list[SpinOrbital]] = {}
    for raw_group in text.split(";"):
        group = " ".join(raw_group.split())
        if not group:
            continue
        head, colon, body = group.partition(":")
        if not colon:
            raise DeterminantError(
                f"{group}: write a subshell, a colon and its spin-orbitals, e.g. 2p: 1u 0u -1d"
            )
        subshell = _read_label(head.strip())
        if subshell not in occupied:
            raise DeterminantError(
                f"{subshell.label}: not occupied in {configuration.text}"
            )
        if subshell in chosen:
            raise DeterminantError(f"{subshell.label}: listed twice")
        items: list[SpinOrbital] = []
        for token in body.split():
            match = _TOKEN.match(token)
            if match is None:
                raise DeterminantError(
                    f"{token}: a spin-orbital is m followed by u (spin up, α) or d "
                    f"(spin down, β), e.g. -1d"
                )
            m = int(match.group(1))
            spin = UP if match.group(2).lower() == "u" else DOWN
            if abs(m) > subshell.l:
                raise DeterminantError(
                    f"{token}: |m| must be at most l = {subshell.l} in {subshell.label}"
                )
            item = SpinOrbital(subshell, m, spin)
            if item in items:
                raise DeterminantError(
                    f"{token}: listed twice in {subshell.label} "
                    f"(Pauli principle: a spin-orbital holds one electron)"
                )
            items.append(item)
        electrons = occupied[subshell]
        if len(items) != electrons:
            raise DeterminantError(
                f"{subshell.label}: {len(items)} spin-orbital{'s' if len(items) != 1 else ''} "
                f"given, but {subshell.label} holds {electrons} electron"
                f"{'s' if electrons != 1 else ''} in {configuration.text}"
            )
        chosen[subshell] = items
    spin_orbitals: list[SpinOrbital] = []
    for subshell, electrons in configuration.occupations:
        spin_orbitals.extend(chosen[subshell] if subshell in chosen
                             else _hund_subshell(subshell, electrons))
    return Determinant(configuration, tuple(spin_orbitals))


def format_determinant(determinant: Determinant) -> str:
    """Write the open subshells of a determinant in the text syntax.

    Closed subshells are left out (they can only be full); the result reads back
    with :func:`parse_determinant` to the same determinant.

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> format_determinant(hund_determinant(parse_spec("Fe")))
    '3d: 2u 1u 0u -1u -2u 2d'
    >>> nitrogen = parse_determinant(parse_spec("N"), "2p: 1u 0u -1d")
    >>> parse_determinant(nitrogen.configuration, format_determinant(nitrogen)) == nitrogen
    True
    """
    groups = []
    for subshell in determinant.configuration.open_subshells:
        tokens = " ".join(item.token for item in determinant.in_subshell(subshell))
        groups.append(f"{subshell.label}: {tokens}")
    return "; ".join(groups)

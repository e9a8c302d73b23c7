"""Terms and J levels of a configuration in Russell–Saunders (LS) coupling."""

from __future__ import annotations

from dataclasses import dataclass

from zeffir.core._errors import SpecError
from zeffir.core.config import Configuration, parse_spec
from zeffir.core.terms._labels import Parity, check_two_j, term_label, two_times
from zeffir.core.terms._microstates import (
    MAX_TERMS,
    OpenShells,
    TermError,
    hund_subshell,
    microstates,
    term_table,
)

__all__ = [
    "Level",
    "Term",
    "as_configuration",
    "configuration_parity",
    "configuration_terms",
    "ground_level",
    "microstate_count",
    "open_shells",
]


@dataclass(frozen=True, slots=True)
class Term:
    """One LS term: total spin S, total orbital momentum L and parity.

    Attributes
    ----------
    S : float
        Total spin, a multiple of 1/2 (stored as a float; halves are exact).
    L : int
        Total orbital angular momentum.
    parity : {"even", "odd"}
        (-1)^(Σ l) of the configuration the term belongs to.

    Raises
    ------
    QuantumNumberError
        If S is negative or not a multiple of 1/2, L is not a whole number >= 0,
        or the parity is not "even" or "odd".

    Examples
    --------
    >>> term = Term(S=1, L=1, parity="even")
    >>> term.label, term.multiplicity, term.J
    ('3P', 3, (0.0, 1.0, 2.0))
    >>> Term(S=1, L=5, parity="odd").display
    '3H°'

    Its J levels share out its states, Σ_J (2J + 1) = (2S + 1)(2L + 1):

    >>> all(sum(two_j + 1 for two_j in t.two_J) == t.states
    ...     for t in (Term(S / 2, L, "even") for S in range(7) for L in range(7)))
    True
    """

    S: float
    L: int
    parity: Parity

    def __post_init__(self) -> None:
        term_label(self.S, self.L, parity=self.parity)  # validates
        object.__setattr__(self, "S", two_times(self.S, "S") / 2)
        object.__setattr__(self, "L", int(self.L))

    @property
    def two_S(self) -> int:
        """2S, an integer."""
        return round(2 * self.S)

    @property
    def multiplicity(self) -> int:
        """2S + 1."""
        return self.two_S + 1

    @property
    def two_J(self) -> tuple[int, ...]:
        """2J for each J level, |2L - 2S| ... 2L + 2S in steps of 2."""
        return tuple(range(abs(2 * self.L - self.two_S), 2 * self.L + self.two_S + 1, 2))

    @property
    def J(self) -> tuple[float, ...]:
        """The J levels of the term, |L - S|, ..., L + S."""
        return tuple(two_j / 2 for two_j in self.two_J)

    @property
    def label(self) -> str:
        """Plain label without parity mark, e.g. ``'3P'``."""
        return term_label(self.S, self.L)

    @property
    def display(self) -> str:
        """Label with ``°`` after the letter when the term is odd, e.g. ``'3P°'``."""
        return term_label(self.S, self.L, parity=self.parity)

    @property
    def states(self) -> int:
        """Number of microstates the term accounts for, (2S + 1)(2L + 1)."""
        return self.multiplicity * (2 * self.L + 1)

    def levels(self) -> tuple[Level, ...]:
        """The term's J levels, lowest J first."""
        return tuple(Level(self.S, self.L, two_j / 2, self.parity) for two_j in self.two_J)


@dataclass(frozen=True, slots=True)
class Level:
    """One J level of an LS term.

    Attributes
    ----------
    S : float
        Total spin.
    L : int
        Total orbital angular momentum.
    J : float
        Total angular momentum, one of |L - S|, ..., L + S.
    parity : {"even", "odd"}

    Raises
    ------
    QuantumNumberError
        If the numbers are out of range or J is not allowed for S and L.

    Examples
    --------
    >>> Level(S=1.5, L=0, J=1.5, parity="odd").label
    '4S3/2'
    >>> Level(S=1.5, L=0, J=1.5, parity="odd").display
    '4S°3/2'
    """

    S: float
    L: int
    J: float
    parity: Parity

    def __post_init__(self) -> None:
        term_label(self.S, self.L, self.J, parity=self.parity)  # validates
        object.__setattr__(self, "S", two_times(self.S, "S") / 2)
        object.__setattr__(self, "J", two_times(self.J, "J") / 2)
        object.__setattr__(self, "L", int(self.L))

    @property
    def term(self) -> Term:
        """The term the level belongs to."""
        return Term(self.S, self.L, self.parity)

    @property
    def label(self) -> str:
        """Plain label without parity mark, e.g. ``'3P2'`` or ``'4S3/2'``."""
        return term_label(self.S, self.L, self.J)

    @property
    def display(self) -> str:
        """Label with ``°`` when odd, e.g. ``'3H°4'``."""
        return term_label(self.S, self.L, self.J, parity=self.parity)


def as_configuration(configuration: Configuration | str) -> Configuration:
    """Parse a spec text, or check a Configuration's occupancies; raise SpecError if invalid."""
    if isinstance(configuration, str):
        return parse_spec(configuration)
    if not isinstance(configuration, Configuration):
        raise SpecError(f"{configuration!r}: expected a Configuration or a spec text such as 'Fe'")
    for sub, occ in configuration.occupations:
        if not 1 <= occ <= sub.capacity:
            raise SpecError(f"{sub.label}{occ}: a {sub.letter} subshell holds 1 to {sub.capacity} "
                            "electrons")
    return configuration


def open_shells(configuration: Configuration | str) -> OpenShells:
    """The open subshells as sorted (l, electrons) pairs; closed ones are left out.

    Examples
    --------
    Only open subshells carry microstates, Π C(2(2l + 1), k) over these pairs
    (Condon & Shortley 1935), and the terms account for every one of them:

    >>> from math import comb, prod
    >>> spec = "C 1s2 2s2 2p1 3d1"
    >>> shells = open_shells(spec)
    >>> shells
    ((1, 1), (2, 1))
    >>> count = prod(comb(2 * (2 * l + 1), k) for l, k in shells)
    >>> count == microstate_count(spec) == sum(t.states for t in configuration_terms(spec)) == 60
    True
    >>> open_shells("Ne")
    ()
    """
    conf = as_configuration(configuration)
    return tuple(sorted((sub.l, occ) for sub, occ in conf.occupations if occ < sub.capacity))


def configuration_parity(configuration: Configuration | str) -> Parity:
    """Parity (-1)^(Σ l) over all electrons of the configuration.

    Examples
    --------
    >>> configuration_parity("C 1s2 2s2 2p1 3d1")
    'odd'
    """
    conf = as_configuration(configuration)
    return "odd" if sum(sub.l * occ for sub, occ in conf.occupations) % 2 else "even"


def microstate_count(configuration: Configuration | str) -> int:
    """Number of microstates (Slater determinants) of a configuration.

    Parameters
    ----------
    configuration : Configuration or str
        A configuration or a spec text (``'Fe'``, ``'C 1s2 2s2 2p1 3p1'``).

    Returns
    -------
    int
        Π C(2(2l + 1), k) over the subshells; 1 for closed shells.

    Notes
    -----
    Each subshell's k electrons occupy k of its 2(2l + 1) spin-orbitals (Pauli
    principle); subshells are independent.

    References
    ----------
    Condon & Shortley (1935), the counting of the states of a configuration.

    Examples
    --------
    >>> microstate_count("V [Ar] 3d3 4s2")  # d3: C(10, 3)
    120
    """
    return microstates(open_shells(configuration))


def configuration_terms(configuration: Configuration | str) -> list[Term]:
    """All LS terms of a configuration, each as often as it occurs.

    Parameters
    ----------
    configuration : Configuration or str
        Any configuration; several open subshells are allowed, closed subshells
        contribute nothing.

    Returns
    -------
    list of Term
        Sorted by S, then L, both descending (so the Hund term comes first). A
        term that occurs n times is listed n times. A closed-shell configuration
        gives the single term 1S.

    Raises
    ------
    SpecError
        If the input is not a valid configuration.
    TermError
        If the configuration has more than ``MAX_TERMS`` terms.

    Notes
    -----
    The microstate counts n(M_L, M_S) of each open subshell come from counting its
    spin-orbital choices; the subshells are combined by convolution (M_L and M_S
    add); the terms are peeled off from the highest (M_L, M_S) (Condon & Shortley).
    Σ (2S + 1)(2L + 1) over the terms equals ``microstate_count``. All terms share
    the configuration's parity (-1)^(Σ l).

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (Cambridge
    University Press, 1935); R. D. Cowan, *The Theory of Atomic Structure and
    Spectra* (University of California Press, 1981), terms of a configuration.

    Examples
    --------
    >>> [t.label for t in configuration_terms("C")]
    ['3P', '1D', '1S']
    >>> sum(t.states for t in configuration_terms("Fe")) == microstate_count("Fe")
    True
    """
    conf = as_configuration(configuration)
    shells = open_shells(conf)
    parity = configuration_parity(conf)
    try:
        counts = term_table(shells)
    except TermError as error:
        raise TermError(f"{conf.spec}: {error}") from None
    total = int(counts.sum())
    if total > MAX_TERMS:
        raise TermError(f"{conf.spec}: {total:,} terms, too many to list (at most {MAX_TERMS:,})")
    terms: list[Term] = []
    for two_s in range(counts.shape[1] - 1, -1, -1):
        for L in range(counts.shape[0] - 1, -1, -1):
            if counts[L, two_s]:
                terms.extend([Term(two_s / 2, L, parity)] * int(counts[L, two_s]))
    return terms


def ground_level(configuration: Configuration | str) -> Level:
    """The lowest level of a configuration according to Hund's rules.

    Parameters
    ----------
    configuration : Configuration or str
        Any configuration.

    Returns
    -------
    Level
        Largest S; then the largest L among the terms with that S; then
        J = |L - S| if the open subshells hold at most half their combined
        capacity, J = L + S otherwise. Closed shells give 1S0.

    Notes
    -----
    The largest M_S is reached only with every open subshell at its own largest
    M_S, so S and L of the Hund term add over subshells: 2S = Σ 2S_i and
    L = Σ L_i, each subshell's (S_i, L_i) being its own Hund term. This agrees
    with picking the term from ``configuration_terms``, without listing them.

    For one open subshell these are Hund's three rules, well established for the
    ground terms of atoms in LS coupling. For several open subshells, applying
    them to the whole configuration (and the J rule to the electrons of all open
    subshells together) is a rule of thumb (common practice), not a theorem; it
    misses some observed ground levels (see ``known_hund_miss``). Heavy atoms
    depart from LS coupling; the label then names the dominant component only.

    References
    ----------
    F. Hund, Z. Phys. 33, 345 (1925); F. Hund, *Linienspektren und periodisches
    System der Elemente* (Springer, 1927); Condon & Shortley (1935); Cowan (1981).

    Examples
    --------
    >>> ground_level("C").label, ground_level("O").label, ground_level("N").display
    ('3P0', '3P2', '4S°3/2')

    These are the observed ground levels (NIST ASD). The level's term is the first
    of :func:`configuration_terms` (largest S, then L), with several open subshells
    too:

    >>> all(ground_level(s).term == configuration_terms(s)[0]
    ...     for s in ("C", "Fe", "Gd3+", "C 1s2 2s2 2p1 3d1", "Ne"))
    True
    """
    conf = as_configuration(configuration)
    shells = open_shells(conf)
    parity = configuration_parity(conf)
    two_s = L = 0
    for l, k in shells:
        sub_two_s, sub_l = hund_subshell(l, k)
        two_s += sub_two_s
        L += sub_l
    electrons = sum(k for _, k in shells)
    capacity = sum(2 * (2 * l + 1) for l, _ in shells)
    two_j = abs(2 * L - two_s) if 2 * electrons <= capacity else 2 * L + two_s
    check_two_j(two_s, L, two_j)
    return Level(two_s / 2, L, two_j / 2, parity)

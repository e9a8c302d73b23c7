"""Which solver treats a configuration: solve, and the expression-based solve_average and solve_hund."""

from __future__ import annotations

from collections.abc import Callable

from zeffir.core.config import Configuration
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis
from zeffir.core.models.hartree_fock._closed_shell import solve_closed_shell
from zeffir.core.models.hartree_fock._expression import solve_expression
from zeffir.core.models.hartree_fock._open_shell import solve_open_shell
from zeffir.core.models.hartree_fock._result import HartreeFockResult, SCFState
from zeffir.core.models.hartree_fock._scf import MAX_ITERATIONS

__all__ = ["solve", "solve_average", "solve_hund"]


def solve(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
    *,
    average: bool = False,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for any configuration, by the solver it needs.

    Parameters
    ----------
    configuration : Configuration
    basis, progress, should_stop, max_iterations
        As for :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`.
    average : bool
        Minimise the average energy of the configuration (:func:`solve_average`)
        instead of the energy of its Hund term.

    Returns
    -------
    HartreeFockResult

    Raises
    ------
    ModelError
        A basis too small for the configuration.
    HartreeFockError
        No convergence, divergence, or a solution refused by the checks; the message
        gives the reason.

    Notes
    -----
    With ``average``, :func:`solve_average`. Otherwise the Hund term (for closed shells
    the ¹S state): :func:`~zeffir.core.models.hartree_fock.solve_closed_shell` for closed
    shells; :func:`~zeffir.core.models.hartree_fock.solve_open_shell` for one open s, p,
    d or f subshell, the highest of its l; :func:`solve_hund` for several open
    subshells, an open subshell below a closed one of its l, or an excited
    configuration with an empty lower subshell (He 1s1 2s1 is both). The solvers agree
    where their domains overlap (the Hund expression of one open subshell through
    :func:`solve_hund` gives :func:`~zeffir.core.models.hartree_fock.solve_open_shell`'s
    energy to 1e-9 Eh).

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951) (closed shells); 32, 179 (1960)
    (open shells); C. Froese Fischer, *The Hartree–Fock Method for Atoms* (Wiley,
    1977) (energies of terms and averages).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> he = solve(parse_spec("He"))  # closed shell, ¹S
    >>> round(he.energy, 9)  # regression value (computed by Zeffir, not published)
    -2.861679996
    >>> triplet = solve(parse_spec("He 1s1 2s1"))  # two open s subshells: ³S, by solve_hund
    >>> bool(abs(triplet.virial_ratio - 2.0) < 1e-6) and triplet.energy > he.energy
    True
    """
    if average:
        return solve_average(configuration, basis, progress, should_stop, max_iterations)
    if _lower_subshells_empty(configuration):
        return solve_hund(configuration, basis, progress, should_stop, max_iterations)
    partial = [s for s, w in configuration.occupations if w != 2 * (2 * s.l + 1)]
    if not partial:
        return solve_closed_shell(configuration, basis, progress, should_stop, max_iterations)
    if len(partial) == 1 and partial[0].l <= 3 and partial[0].n == max(
            s.n for s, _ in configuration.occupations if s.l == partial[0].l):
        return solve_open_shell(configuration, basis, progress, should_stop, max_iterations)
    return solve_hund(configuration, basis, progress, should_stop, max_iterations)


def _lower_subshells_empty(configuration: Configuration) -> bool:
    """True when an occupied subshell has an empty one of the same l below it (He 1s1 3s1)."""
    ns: dict[int, list[int]] = {}
    for sub, w in configuration.occupations:
        if w > 0:
            ns.setdefault(sub.l, []).append(sub.n)
    return any(sorted(v) != list(range(l + 1, l + 1 + len(v))) for l, v in ns.items())


def solve_average(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for the average energy of a configuration (any open subshells).

    Parameters
    ----------
    configuration : Configuration
        Any configuration, e.g. ``He 1s1 2s1``, ``Li 1s2 2p1``, ``Ne 1s2 2s2 2p5 3s1`` or
        ``Na [Ne] 4s1`` (a lower subshell of an l may be empty).
    basis, progress, should_stop, max_iterations
        As for :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`.

    Returns
    -------
    HartreeFockResult
        The energy is the average over all determinants of the configuration; each
        orbital energy is the diagonal element of its subshell's Fock operator.

    Raises
    ------
    HartreeFockError
        No convergence within ``max_iterations``, divergence, or a refused solution.

    Notes
    -----
    :func:`~zeffir.core.models.hartree_fock.solve_expression` with the
    average-of-configuration expression
    (:func:`zeffir.core.energy.average_energy_expression`): every determinant of the
    configuration weighted equally, the weighted mean of the energies of its terms.

    References
    ----------
    J. C. Slater, *Quantum Theory of Atomic Structure* (1960), vol. II, ch. 21 (average
    of configuration).

    Examples
    --------
    One open s electron has a single term, so the average is the Hund-term energy of
    the one-open-shell solver; with two terms (He 1s 2s ¹S and ³S) the average lies
    above the lower one:

    >>> from zeffir.core import parse_spec
    >>> li = solve_average(parse_spec("Li"))
    >>> bool(abs(li.energy - solve_open_shell(parse_spec("Li")).energy) < 1e-8)
    True
    >>> he = parse_spec("He 1s1 2s1")
    >>> solve_average(he).energy > solve_hund(he).energy
    True
    """
    from zeffir.core.energy import average_energy_expression

    return solve_expression(average_energy_expression(configuration), basis, progress, should_stop,
                            max_iterations, symbol="E_av")


def solve_hund(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for the Hund term of any configuration (its single determinant).

    Parameters
    ----------
    configuration : Configuration
        Any configuration: several open subshells (Cr 3d5 4s1 ⁷S, Gd 4f7 5d1 6s2 ⁹D,
        He 1s1 2s1 ³S) or a lower subshell of an l left empty (Na [Ne] 4s1).
    basis, progress, should_stop, max_iterations
        As for :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`.

    Returns
    -------
    HartreeFockResult
        The energy of the determinant of highest M_S, then highest M_L.

    Raises
    ------
    HartreeFockError
        No convergence within ``max_iterations``, divergence, or a refused solution.

    Notes
    -----
    :func:`~zeffir.core.models.hartree_fock.solve_expression` with
    :func:`zeffir.core.energy.hund_energy_expression`.
    Maximal M_S puts every open subshell at its own maximal M_S, and maximal M_L then
    fixes each subshell's determinant, so that determinant is the only one with its
    M_S = S and M_L = L: its energy is that of the LS term of highest S, then highest
    L (Hund's rules; the lowest term for the ground configurations of nearly all
    atoms). With one radial function per subshell the same for both spins this is the
    restricted Hartree–Fock energy of that term.

    References
    ----------
    C. Froese Fischer, *The Hartree–Fock Method for Atoms* (Wiley, 1977), ch. 3 (single
    configuration, one radial function per subshell, energy of a term); Condon and
    Shortley 1935, §7.6 (diagonal sums).

    Examples
    --------
    Two code paths for one energy functional (Li ²S), and the variational bound: the
    restricted Hartree–Fock energy of He 1s 2s ³S lies above the exact non-relativistic
    one, -2.17522937824 Eh (C. L. Pekeris, Phys. Rev. 115, 1216 (1959)), by its
    correlation energy (~1e-3 Eh):

    >>> from zeffir.core import parse_spec
    >>> li = solve_hund(parse_spec("Li"))
    >>> bool(abs(li.energy - solve_open_shell(parse_spec("Li")).energy) < 1e-8)
    True
    >>> triplet = solve_hund(parse_spec("He 1s1 2s1"))
    >>> bool(-2.17522938 < triplet.energy < -2.17522938 + 1.5e-3)
    True
    """
    from zeffir.core.energy import hund_energy_expression

    return solve_expression(hund_energy_expression(configuration), basis, progress, should_stop,
                            max_iterations, symbol="E")

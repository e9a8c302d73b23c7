"""Single-zeta Slater-type orbitals with exponents optimised for the Hund-determinant energy."""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from zeffir.core._cancel import report_progress as ambient_report
from zeffir.core._cancel import should_stop as ambient_should_stop
from zeffir.core._errors import ComputationCancelled, ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.models._slater_rules import slater_screening
from zeffir.core.orbitals import (
    FloatArray,
    OrbitalSet,
    RadialFunction,
    SlaterExpansionRadial,
    SlaterRadial,
    SubshellOrbital,
)

if TYPE_CHECKING:
    from zeffir.core.models._sto_energy import StoEnergy

__all__ = [
    "OptimisationCancelled",
    "OptimisationError",
    "OptimisationState",
    "VariationalModel",
    "VariationalResult",
    "coefficient_derivatives",
    "energy_and_gradient",
    "guard_subshells",
    "mixing_pairs",
    "optimise_exponents",
    "orthogonalised_radials",
]

#: Largest |∂E/∂ln ζ| (hartree) accepted as a stationary point. Below it -V/T - 2 < ~1e-7.
GRADIENT_TOLERANCE = 2e-7
#: Step in ln ζ and θ of the central differences of the (analytic) gradient that give
#: the Hessian of the Newton polish; its O(h²) error changes the step, not the point
#: the gradient converges to.
_HESSIAN_STEP = 1e-3
#: Exponents are kept in [ZETA_MIN, ZETA_MAX_PER_Z · Z]; an optimum on a bound is a failure.
ZETA_MIN = 1e-3
ZETA_MAX_PER_Z = 10.0
#: Largest orbital mixing angle searched (radians); reaching it is a failure.
MAX_MIXING = 1.0


def mixing_pairs(configuration: Configuration) -> tuple[tuple[int, int], ...]:
    """Pairs (i, j) of same-l subshells, at least one open, whose mixing changes the energy.

    Rotating two orthonormal orbitals of one l into each other leaves a determinant
    unchanged when both subshells are full; otherwise the minimal-basis orbitals are
    combinations of both Slater-type functions, with the mixing fixed by the energy.
    """
    occupations = configuration.occupations
    out = []
    for i, (a, wa) in enumerate(occupations):
        for j in range(i + 1, len(occupations)):
            b, wb = occupations[j]
            if a.l == b.l and (wa < 2 * (2 * a.l + 1) or wb < 2 * (2 * b.l + 1)):
                out.append((i, j))
    return tuple(out)


def orthogonalised_radials(subshells: tuple[Subshell, ...], zetas: tuple[float, ...],
                           mixing: dict[tuple[int, int], float] | None = None,
                           ) -> tuple[RadialFunction, ...]:
    """Slater-type functions (n* = n) orthonormalised within each l, n upwards, then mixed.

    Parameters
    ----------
    subshells : tuple of Subshell
    zetas : tuple of float
        One exponent per subshell (bohr⁻¹).
    mixing : dict, optional
        Rotation angle (radians) between orthonormal orbitals i and j of one l
        (see :func:`mixing_pairs`); absent pairs are not rotated.

    Returns
    -------
    tuple of RadialFunction
        A :class:`SlaterRadial` where a subshell is its own function alone,
        otherwise a :class:`zeffir.core.orbitals.SlaterExpansionRadial` over the
        functions of its l: the term of its own subshell has the exponent the model
        reports, the others make it orthogonal to the other subshells of its l and,
        for open shells, carry the optimised mixing.

    Notes
    -----
    Gram–Schmidt in order is C = L⁻¹ with S = L Lᵀ (Cholesky), S the analytic
    overlap matrix of the functions of one l; each angle θ then applies the
    rotation φ_i → cos θ φ_i + sin θ φ_j, φ_j → cos θ φ_j - sin θ φ_i.

    References
    ----------
    E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963) (orbitals expanded
    in a minimal basis of Slater-type functions).
    """
    stos = [SlaterRadial(s.n, s.l, float(s.n), z) for s, z in zip(subshells, zetas, strict=True)]
    out: list[RadialFunction] = list(stos)
    for l, coefficients in orthonormal_coefficients(subshells, zetas, mixing).items():
        rows = _rows_of(subshells, l)
        for a, i in enumerate(rows):
            terms = tuple((stos[rows[b]], float(coefficients[a, b])) for b in range(len(rows))
                          if coefficients[a, b] != 0.0)
            if len(terms) > 1:
                out[i] = SlaterExpansionRadial.from_terms(subshells[i].n, l, terms)
    return tuple(out)


def _rows_of(subshells: tuple[Subshell, ...], l: int) -> list[int]:
    """Indices of the subshells of l, in order of n."""
    return sorted((i for i, s in enumerate(subshells) if s.l == l), key=lambda i: subshells[i].n)


def orthonormal_coefficients(subshells: tuple[Subshell, ...], zetas: tuple[float, ...],
                             mixing: dict[tuple[int, int], float] | None = None,
                             ) -> dict[int, FloatArray]:
    """``{l: C}``: orbital a of l is Σ_b C[a, b] χ_b over the Slater-type functions of l.

    Rows and columns follow the subshells of l in order of n; see
    :func:`orthogonalised_radials` (Gram–Schmidt C = L⁻¹ with S = L Lᵀ, then the
    mixing rotations).
    """
    from zeffir.core.models._sto_energy import sto_one_electron

    angles = mixing or {}
    out: dict[int, FloatArray] = {}
    for l in sorted({s.l for s in subshells}):
        rows = _rows_of(subshells, l)
        if len(rows) < 2:
            out[l] = np.ones((1, 1))
            continue
        overlap, _, _ = sto_one_electron(l, [subshells[i].n for i in rows], [zetas[i] for i in rows], 0.0)
        try:
            lower = np.linalg.cholesky(overlap)
        except np.linalg.LinAlgError:
            raise ModelError(f"l = {l}: Slater-type functions linearly dependent at ζ = {zetas}") from None
        coefficients = np.linalg.inv(lower)
        for (i, j), theta in sorted(angles.items()):
            if i in rows and j in rows:
                a, b = rows.index(i), rows.index(j)
                row_a, row_b = coefficients[a].copy(), coefficients[b].copy()
                coefficients[a] = math.cos(theta) * row_a + math.sin(theta) * row_b
                coefficients[b] = math.cos(theta) * row_b - math.sin(theta) * row_a
        out[l] = coefficients
    return out


def _rotation(size: int, a: int, b: int, theta: float, derivative: bool = False) -> FloatArray:
    """The row operation of one mixing angle (see :func:`orthonormal_coefficients`), or its θ-derivative."""
    out = np.zeros((size, size)) if derivative else np.eye(size)
    c, s = (-math.sin(theta), math.cos(theta)) if derivative else (math.cos(theta), math.sin(theta))
    out[a, a], out[a, b], out[b, a], out[b, b] = c, s, -s, c
    return out


def coefficient_derivatives(subshells: tuple[Subshell, ...], zetas: tuple[float, ...],
                            mixing: dict[tuple[int, int], float],
                            ) -> dict[int, tuple[FloatArray, FloatArray, dict[tuple[int, int], FloatArray]]]:
    """``{l: (C, dC/dζ, {pair: dC/dθ})}`` of :func:`orthonormal_coefficients`.

    Parameters
    ----------
    subshells, zetas, mixing
        As for :func:`orthonormal_coefficients`; ``mixing`` names every angle to
        differentiate with respect to.

    Returns
    -------
    dict
        C as :func:`orthonormal_coefficients` gives it; dC/dζ of shape (m, m, m), its
        first index the ζ of the group's m subshells in order of n; one dC/dθ per
        mixing pair within the group.

    Notes
    -----
    With S = L Lᵀ and C₀ = L⁻¹, a change dS gives dL = L Φ(C₀ dS C₀ᵀ), Φ the lower
    triangle with the diagonal halved, so dC₀ = -Φ(C₀ dS C₀ᵀ) C₀; the rotations
    G_K ⋯ G_1 that follow are linear in C₀, and ∂C/∂θ_j replaces G_j by its
    derivative.

    References
    ----------
    S. P. Smith, J. Comput. Graph. Stat. 4, 134 (1995) (differentiation of the
    Cholesky factorisation).
    """
    from zeffir.core.models._sto_energy import sto_one_electron, sto_one_electron_derivatives

    out: dict[int, tuple[FloatArray, FloatArray, dict[tuple[int, int], FloatArray]]] = {}
    for l in sorted({s.l for s in subshells}):
        rows = _rows_of(subshells, l)
        size = len(rows)
        if size < 2:
            out[l] = (np.ones((1, 1)), np.zeros((1, 1, 1)), {})
            continue
        ns, zs = [subshells[i].n for i in rows], [zetas[i] for i in rows]
        overlap, _, _ = sto_one_electron(l, ns, zs, 0.0)
        d_overlap, _, _ = sto_one_electron_derivatives(l, ns, zs, 0.0)
        try:
            lower = np.linalg.cholesky(overlap)
        except np.linalg.LinAlgError:
            raise ModelError(f"l = {l}: Slater-type functions linearly dependent at ζ = {zetas}") from None
        start = np.linalg.inv(lower)
        steps = [((i, j), rows.index(i), rows.index(j), theta) for (i, j), theta in sorted(mixing.items())
                 if i in rows and j in rows]
        rotations = [_rotation(size, a, b, theta) for _, a, b, theta in steps]
        turn = np.eye(size)
        for rotation in rotations:
            turn = rotation @ turn
        coefficients = turn @ start
        d_zeta = np.empty((size, size, size))
        for a in range(size):
            d_s = np.zeros((size, size))
            d_s[a, :] += d_overlap[a, :]
            d_s[:, a] += d_overlap[a, :]
            inner = start @ d_s @ start.T
            phi = np.tril(inner) - 0.5 * np.diag(np.diag(inner))
            d_zeta[a] = -turn @ phi @ start
        d_theta: dict[tuple[int, int], FloatArray] = {}
        for position, (pair, a, b, theta) in enumerate(steps):
            before, after = np.eye(size), np.eye(size)
            for rotation in rotations[:position]:
                before = rotation @ before
            for rotation in rotations[position + 1:]:
                after = rotation @ after
            d_theta[pair] = after @ _rotation(size, a, b, theta, derivative=True) @ before @ start
        out[l] = (coefficients, d_zeta, d_theta)
    return out


def energy_and_gradient(energy: StoEnergy, pairs: tuple[tuple[int, int], ...], x: FloatArray,
                        ) -> tuple[float, float, FloatArray]:
    """T, V and ∂E/∂x at x = (ln ζ per subshell, then θ per mixing pair), in closed form.

    Parameters
    ----------
    energy : StoEnergy
        The closed-form energy of the configuration's expression.
    pairs : tuple
        The mixing pairs (:func:`mixing_pairs`), in the order of their angles in x.
    x : ndarray

    Returns
    -------
    kinetic, potential : float
        T and V (hartree).
    gradient : ndarray
        ∂E/∂ln ζ_i = ζ_i (∂E/∂ζ_i at fixed C + Σ ∂E/∂C · ∂C/∂ζ_i), then
        ∂E/∂θ_j = Σ ∂E/∂C · ∂C/∂θ_j (hartree): the chain rule through
        :func:`coefficient_derivatives`.
    """
    subshells = energy.subshells
    m = len(subshells)
    zetas = tuple(float(z) for z in np.exp(x[:m]))
    mixing = dict(zip(pairs, map(float, x[m:]), strict=True))
    derivatives = coefficient_derivatives(subshells, zetas, mixing)
    found = energy.gradient_at(zetas, {l: d[0] for l, d in derivatives.items()})
    by_zeta = found.zetas.copy()
    by_angle = np.zeros(len(pairs))
    for l, (_, d_zeta, d_theta) in derivatives.items():
        rows = _rows_of(subshells, l)
        block = found.coefficients[np.ix_(rows, rows)]
        by_zeta[rows] += np.einsum("ipq,pq->i", d_zeta, block)
        for pair, d in d_theta.items():
            by_angle[pairs.index(pair)] += float(np.sum(d * block))
    return (found.kinetic, found.nuclear + found.repulsion,
            np.concatenate([by_zeta * np.asarray(zetas), by_angle]))


@dataclass(frozen=True, slots=True)
class OptimisationState:
    """Where an exponent optimisation stands.

    Attributes
    ----------
    iteration : int
        Completed iterations.
    evaluations : int
        Energy evaluations so far.
    zetas : tuple of float
        Current exponents (bohr⁻¹), in the order of the configuration's subshells.
    energy : float
        Hund-determinant energy at those exponents (hartree).
    """

    iteration: int
    evaluations: int
    zetas: tuple[float, ...]
    energy: float


class OptimisationError(ModelError):
    """The exponent optimisation failed; ``state`` holds the last point reached."""

    def __init__(self, message: str, state: OptimisationState | None) -> None:
        super().__init__(message)
        self.state = state


class OptimisationCancelled(OptimisationError, ComputationCancelled):
    """``should_stop`` asked the optimisation to stop; ``state`` holds the last point."""


@dataclass(frozen=True, slots=True)
class VariationalResult:
    """Optimised exponents and the energy they give.

    Attributes
    ----------
    configuration : Configuration
    zetas : tuple of float
        Optimised ζ per subshell (bohr⁻¹).
    mixing : dict
        Optimised mixing angle (radians) of each pair from :func:`mixing_pairs`.
    radials : tuple of RadialFunction
        The orthonormalised radial functions built from them.
    kinetic, potential : float
        T and V at the optimum (hartree).
    gradient : tuple of float
        ∂E/∂ln ζ, then ∂E/∂θ, at the optimum (hartree), each below :data:`GRADIENT_TOLERANCE`.
    state : OptimisationState
        The final state (iterations, evaluations, energy).
    guards : tuple of Subshell
        Empty subshells below an occupied one of the same l (see :func:`guard_subshells`);
        their fixed Slater-type functions keep the occupied orbitals orthogonal to them.
    guard_zetas : tuple of float
        Their exponents (Slater's rules, n* = n).
    """

    configuration: Configuration
    zetas: tuple[float, ...]
    mixing: dict[tuple[int, int], float]
    radials: tuple[RadialFunction, ...]
    kinetic: float
    potential: float
    gradient: tuple[float, ...]
    state: OptimisationState
    guards: tuple[Subshell, ...] = ()
    guard_zetas: tuple[float, ...] = ()

    @property
    def basis(self) -> tuple[tuple[Subshell, ...], tuple[float, ...]]:
        """The Slater-type functions behind the orbitals: occupied subshells, then guards."""
        occupied = tuple(s for s, _ in self.configuration.occupations)
        return occupied + self.guards, self.zetas + self.guard_zetas

    @property
    def energy(self) -> float:
        """Total energy E = T + V (hartree)."""
        return self.kinetic + self.potential

    @property
    def virial_ratio(self) -> float:
        """-V/T; 2 at an optimum, since every ζ scaled together is one of the variations."""
        return -self.potential / self.kinetic


def guard_subshells(configuration: Configuration) -> tuple[tuple[Subshell, ...], tuple[float, ...]]:
    """The empty subshells n'l below an occupied nl, with their Slater's-rules exponents.

    An excited configuration such as He 1s¹ 3s¹ leaves 2s empty. A nodeless 3s function
    orthogonalised only against 1s can take the 2s's place, and the energy then falls
    below that of the state asked for (even below the exact energy). Each such empty
    subshell gets a fixed Slater-type function r^{n'−1}e^{−ζr}, ζ = (Z − σ)/n' with σ
    the screening an electron there would feel (Slater's rules, n* = n), which enters
    the Gram–Schmidt orthonormalisation of its l but carries no electron: the occupied
    orbital above it then has a node for it, as the orbital of the state asked for does
    (the node-counting choice of numerical Hartree–Fock, C. Froese Fischer, *The
    Hartree–Fock Method for Atoms*, 1977, §6.3, made here within the minimal basis).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> subshells, zetas = guard_subshells(parse_spec("He 1s1 3s1"))
    >>> [s.label for s in subshells], [round(z, 3) for z in zetas]
    (['2s'], [0.575])
    >>> guard_subshells(parse_spec("Ne"))
    ((), ())
    """
    occupied = {s for s, occ in configuration.occupations if occ > 0}
    guards = sorted({Subshell(n, sub.l) for sub in occupied for n in range(sub.l + 1, sub.n)} - occupied,
                    key=lambda s: (s.n, s.l))
    zetas = tuple(max(configuration.Z - slater_screening(configuration, g), 0.1 * configuration.Z) / g.n
                  for g in guards)
    return tuple(guards), zetas


def _starting_zetas(configuration: Configuration) -> tuple[float, ...]:
    # Slater's rules with n* = n, kept positive for loosely bound anions.
    return tuple(max(configuration.Z - slater_screening(configuration, s), 0.1 * configuration.Z) / s.n
                 for s, _ in configuration.occupations)


def optimise_exponents(
    configuration: Configuration,
    progress: Callable[[OptimisationState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
) -> VariationalResult:
    """Minimise the Hund-determinant energy over one Slater exponent per subshell.

    Parameters
    ----------
    configuration : Configuration
    progress : callable, optional
        Called with an :class:`OptimisationState` after every iteration.
    should_stop : callable, optional
        Polled before every energy evaluation; when it returns True the run stops
        with :class:`OptimisationCancelled`.

    Returns
    -------
    VariationalResult

    Raises
    ------
    OptimisationError
        No stationary point (all |∂E/∂ln ζ|, |∂E/∂θ| <= GRADIENT_TOLERANCE) was
        reached, or an exponent or angle ran to its bound (an electron not bound in this model). A subclass of
        :class:`zeffir.core.ModelError`; its ``state`` is the last point reached.

    Notes
    -----
    χ_a = N r^{n-1} e^{-ζ_a r} (n* = n, the Clementi–Raimondi form), one per subshell,
    and one with a fixed exponent per empty subshell below an occupied one of its l
    (:func:`guard_subshells`; no electron, no free exponent).
    The orbitals of one l are the χ of that l Gram–Schmidt orthonormalised in order
    of n, then rotated into each other by an angle θ for every pair of which one
    subshell is open (:func:`mixing_pairs`). Together with the exponents this spans
    the minimal-basis orbitals of Clementi & Raimondi (orbitals expanded in the
    same-l χ); for pairs of closed subshells a rotation leaves the determinant, and
    so the energy, unchanged and is omitted. L-BFGS-B minimises E over (ln ζ, θ) from
    Slater's rules (with n* = n) and θ = 0 with the analytic gradient: the energy and
    its derivatives at fixed orbital coefficients are closed forms
    (:meth:`zeffir.core.models._sto_energy.StoEnergy.gradient_at`), and the
    coefficients' dependence on ζ and θ (Gram–Schmidt through the Cholesky factor of
    the overlap, then the rotations) is differentiated by
    :func:`coefficient_derivatives`. Newton steps (Hessian from central differences
    of that gradient) then polish the optimum until every derivative is below
    :data:`GRADIENT_TOLERANCE`. At the optimum -V/T = 2 (virial theorem: scaling all
    ζ together is one of the variations).

    The energy has other stationary points in which functions of one l exchange
    roles, a higher-n function taking the inner orbital's exponent (Kr: ζ_3s = 2.21,
    ζ_4s = 9.02 gives E = -2744.6034 Eh, below the -2744.5197 Eh of ζ_3s = 7.01,
    ζ_4s = 2.83; computed by Zeffir). Such a point is a different basis, not the
    subshell-by-subshell exponents of Clementi & Raimondi; the start from Slater's
    rules, with each exponent near its own subshell's, reaches theirs (Table I within
    0.15 % for Z = 2–36, Cr and Cu taken as 3d⁴ 4s² and 3d⁹ 4s², except As 4p,
    1.6 % off; from their own exponents the optimisation returns to this point).

    References
    ----------
    E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963); J. C. Slater,
    *Quantum Theory of Atomic Structure* (1960), vol. I, §6 (virial theorem).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> result = optimise_exponents(parse_spec("He"))
    >>> abs(result.zetas[0] - (2 - 5 / 16)) < 1e-6  # standard textbook result
    True
    """
    from scipy import optimize

    from zeffir.core.energy import hund_energy_expression
    from zeffir.core.models._sto_energy import StoEnergy

    occupied = tuple(s for s, _ in configuration.occupations)
    guards, guard_zetas = guard_subshells(configuration)
    subshells = occupied + guards
    fixed = np.log(np.asarray(guard_zetas, dtype=float))
    pairs = mixing_pairs(configuration)
    m = len(occupied)
    closed_form = StoEnergy(hund_energy_expression(configuration), subshells)
    lower, upper = math.log(ZETA_MIN), math.log(ZETA_MAX_PER_Z * configuration.Z)
    bounds = [(lower, upper)] * m + [(-MAX_MIXING, MAX_MIXING)] * len(pairs)
    evaluations = 0
    iteration = 0
    last: OptimisationState | None = None

    def split(x: FloatArray) -> tuple[tuple[float, ...], dict[tuple[int, int], float]]:
        return tuple(float(z) for z in np.exp(x[:m])), dict(zip(pairs, map(float, x[m:]), strict=True))

    def evaluate(x: FloatArray) -> tuple[float, float, FloatArray]:
        nonlocal evaluations
        if (should_stop is not None and should_stop()) or ambient_should_stop():
            raise OptimisationCancelled("exponent optimisation cancelled", last)
        evaluations += 1
        # The guards' exponents are fixed: they sit between the free exponents and the angles.
        kinetic, potential, grad = energy_and_gradient(closed_form, pairs,
                                                       np.concatenate([x[:m], fixed, x[m:]]))
        return kinetic, potential, np.concatenate([grad[:m], grad[m + fixed.size:]])

    def fun(y: FloatArray) -> tuple[float, FloatArray]:
        nonlocal last
        kinetic, potential, grad = evaluate(y)
        last = OptimisationState(iteration, evaluations, split(y)[0], kinetic + potential)
        return kinetic + potential, grad

    def callback(_xk: FloatArray) -> None:
        nonlocal iteration
        iteration += 1
        if progress is not None and last is not None:
            progress(OptimisationState(iteration, evaluations, last.zetas, last.energy))
        if last is not None:
            ambient_report(f"{configuration.spec}: optimising exponents, step {iteration}, "
                           f"E = {last.energy:.8f} Eh")

    x = np.concatenate([np.log(np.asarray(_starting_zetas(configuration))), np.zeros(len(pairs))])
    found = optimize.minimize(
        fun, x, jac=True, method="L-BFGS-B", bounds=bounds, callback=callback,
        options={"maxiter": 1000, "ftol": 1e-15, "gtol": GRADIENT_TOLERANCE / 4, "maxcor": 20},
    )
    x, message = np.asarray(found.x, dtype=float), str(found.message)
    # Near the optimum the energy changes by less than its rounding, which can stop
    # L-BFGS-B's line search short of the gradient tolerance; the gradient is still
    # accurate there, so polish with steps that use it alone.
    kinetic, potential, grad = evaluate(x)
    low, high = np.array([lo for lo, _ in bounds]), np.array([hi for _, hi in bounds])

    def step_to(y: FloatArray) -> tuple[FloatArray, FloatArray]:
        nonlocal kinetic, potential, iteration, last
        kinetic, potential, g = evaluate(y)
        iteration += 1
        last = OptimisationState(iteration, evaluations, split(y)[0], kinetic + potential)
        if progress is not None:
            progress(last)
        return y, g

    # Newton steps, the Hessian from central differences of the gradient.
    for _newton in range(8):
        if np.all(np.abs(grad) <= GRADIENT_TOLERANCE):
            break
        hessian = np.empty((x.size, x.size))
        for j in range(x.size):
            step = np.zeros_like(x)
            step[j] = _HESSIAN_STEP
            hessian[:, j] = (evaluate(x + step)[2] - evaluate(x - step)[2]) / (2 * _HESSIAN_STEP)
        hessian = 0.5 * (hessian + hessian.T)
        if np.any(np.linalg.eigvalsh(hessian) <= 0):
            break
        x, grad = step_to(np.clip(x - np.linalg.solve(hessian, grad), low, high))
    zetas, mixing = split(x)
    state = OptimisationState(iteration, evaluations, zetas, kinetic + potential)
    at_bound = np.array([min(abs(v - lo), abs(v - hi)) < 1e-6 for v, (lo, hi) in zip(x, bounds, strict=True)])
    if np.any(at_bound[:m]):
        names = ", ".join(s.label for s, hit in zip(subshells, at_bound[:m], strict=True) if hit)
        raise OptimisationError(f"{configuration.spec}: exponent of {names} ran to its bound "
                                "(the electron is not bound with these functions)", state)
    if np.any(at_bound[m:]):
        raise OptimisationError(f"{configuration.spec}: an orbital mixing angle ran to its bound", state)
    if not np.all(np.abs(grad) <= GRADIENT_TOLERANCE):
        raise OptimisationError(
            f"{configuration.spec}: no stationary point after {iteration} iterations "
            f"(largest |dE/dx| = {np.max(np.abs(grad)):.2e} Eh; {message})", state)
    radials = orthogonalised_radials(subshells, zetas + guard_zetas, mixing)[:m]
    return VariationalResult(configuration, zetas, mixing, radials, kinetic, potential,
                             tuple(float(g) for g in grad), state, guards, guard_zetas)


@dataclass(frozen=True)
class VariationalModel:
    """Slater-type orbitals (n* = n) with exponents minimising the Hund-determinant energy.

    Notes
    -----
    One exponent per subshell, optimised for the configuration typed (ion or excited
    configurations included) by :func:`optimise_exponents`. An empty subshell below an
    occupied one of the same l gets a fixed Slater's-rules function that the orbitals
    above are orthogonalised against (:func:`guard_subshells`), so an excited orbital
    keeps its node there and the energy stays above the exact one (He 1s 3s ³S
    −2.067226 Eh against the exact −2.068689, Accad, Pekeris & Schiff 1971); a single
    electron gets its exact hydrogen-like orbital. With guard functions the exponents
    cannot all be scaled together, so −V/T is not 2 there (He 1s 3s: 1.9955). Orbitals of equal l are
    orthonormal combinations of the Slater-type functions of that l (a minimal basis,
    as Clementi & Raimondi's); the reported ζ is each subshell's own exponent and
    Z_eff = ζn. The total energy is that of the Hund determinant (the M_L = L,
    M_S = S component of the Hund term). Energy, gradient and orbital energies are
    closed forms (milliseconds per evaluation): an optimisation takes a few
    hundredths of a second for light atoms and one to two seconds for the heaviest
    (Xe about 0.4 s, U about 1.5 s).

    Each orbital energy is ⟨φ|F|φ⟩ of its subshell's Fock operator for that energy
    (:func:`zeffir.core.energy.orbital_energies`; He: ε = ζ²/2 - Zζ + 5ζ/8). For a
    closed subshell it is exactly minus the energy of removing one electron with all
    orbitals frozen (the identity behind Koopmans' theorem, Koopmans 1934), which is
    how it should be read. It is *positive* for some d and f subshells: among the
    neutral ground states Z = 1–54 the 3d of Cr, Cu and Zn and the 4d of Y, Zr and Pd
    (Cu 3d +0.51 Eh, where the Hartree–Fock value is -0.4912 Eh, Koga et al. 1999),
    the 4f or 5d of every lanthanide (and the 4f of Hf and Ta) and the 5f or 6d of
    most actinides. This is the model, not the definition: with one exponent a d or
    f function cannot have both the inner part that fixes its nuclear attraction and
    the outer tail of the Hartree–Fock orbital, so it comes out too compact outside
    (Zn 3d: ⟨r⁻¹⟩ 1.542 against 1.531 bohr⁻¹, ⟨r⟩ 0.757 against 0.875 bohr with
    Zeffir's Hartree–Fock model) and repels the other electrons too strongly
    (F⁰(3d, 3d) 1.194 against 1.07 Eh). Every d electron then costs about 0.9 Eh too
    much: the model puts Zn⁺ 3d⁹ 4s² 0.37 Eh *below* Zn and Cu 3d⁹ 4s² 0.90 Eh below
    3d¹⁰ 4s¹, where Hartree–Fock has them 0.56 Eh and 0.014 Eh above (these energies
    computed by Zeffir). Clementi & Raimondi's Table I exponents for Cr and Cu are
    indeed those of the 3d⁴ 4s² and 3d⁹ 4s² configurations (this model reproduces
    them within 0.15 % there, and misses them by 15–21 % for 3d⁵ 4s¹ and 3d¹⁰ 4s¹).
    Total energies and exponents are what the model is for; its d and f orbital
    energies are not estimates of ionisation energies.

    References
    ----------
    E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963), Table I; J. C.
    Slater, *Quantum Theory of Atomic Structure* (McGraw-Hill, 1960); T. Koopmans,
    Physica 1, 104 (1934); T. Koga, K. Kanayama, S. Watanabe and A. J. Thakkar, Int. J.
    Quantum Chem. 71, 491 (1999) (Hartree–Fock orbital energies).
    """

    name: str = "variational"
    title: str = "variational single-zeta exponents"
    reference: str = "Clementi & Raimondi 1963 (method); Slater 1960"

    def build(self, configuration: Configuration) -> OrbitalSet:
        from zeffir.core.energy import hund_energy_expression
        from zeffir.core.models._sto_energy import StoEnergy

        if configuration.n_electrons == 1:
            return self._one_electron(configuration)
        result = optimise_exponents(configuration)
        subshells, zetas = result.basis
        epsilon = StoEnergy(hund_energy_expression(configuration), subshells).orbital_energies(
            zetas, orthonormal_coefficients(subshells, zetas, result.mixing))
        orbitals = []
        for (sub, occ), radial, zeta, eps in zip(configuration.occupations, result.radials, result.zetas,
                                                 epsilon[:len(result.zetas)], strict=True):
            notes: tuple[str, ...] = ()
            if isinstance(radial, SlaterExpansionRadial):
                notes = (f"{sub.label}: a combination of this configuration's {sub.label[-1]}-type "
                         "Slater functions (orthonormalised); ζ is the exponent of its own one",)
            orbitals.append(SubshellOrbital(sub, occ, radial, zeta, zeta * sub.n, float(sub.n),
                                            float(eps) if occ > 0 else None, notes))
        notes = ("total energy: Hund determinant, single-zeta Slater-type functions",)
        for guard, zeta in zip(result.guards, result.guard_zetas, strict=True):
            above = ", ".join(s.label for s, _ in configuration.occupations
                              if s.l == guard.l and s.n > guard.n)
            notes += (f"{guard.label} is empty: {above} kept orthogonal to a fixed Slater-type {guard.label} "
                      f"function (ζ = {zeta:.4f} bohr⁻¹ from Slater's rules), so that it keeps its node "
                      f"there instead of falling into the empty subshell",)
        return OrbitalSet(configuration, self.name, tuple(orbitals), total_energy=result.energy,
                          notes=notes, virial_ratio=-result.potential / result.kinetic)

    def _one_electron(self, configuration: Configuration) -> OrbitalSet:
        """A single electron: the optimum is the hydrogen-like orbital itself.

        r^l L(r) e^{−ζr} with its n − l − 1 nodes is a single-zeta function; orthogonal to
        the lower levels and optimised over ζ it is the exact orbital, ζ = Z/n and
        ε = −Z²/2n² (Bethe & Salpeter 1957, §3), with −V/T = 2.
        """
        from zeffir.core.orbitals import HydrogenicRadial

        z = float(configuration.Z)
        (sub, occ), = configuration.occupations
        energy = -(z**2) / (2 * sub.n**2)
        orbital = SubshellOrbital(sub, occ, HydrogenicRadial(sub.n, sub.l, z), z / sub.n, z, float(sub.n),
                                  energy, (f"{sub.label}: one electron — the hydrogen-like orbital, "
                                           "which is the single-zeta optimum with its radial nodes",))
        return OrbitalSet(configuration, self.name, (orbital,), total_energy=energy,
                          notes=("total energy: one electron in the field of the nucleus, exact",),
                          virial_ratio=2.0)

"""Single-zeta Slater-type orbitals with exponents optimised for the Hund-determinant energy."""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass

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

__all__ = [
    "OptimisationCancelled",
    "OptimisationError",
    "OptimisationState",
    "VariationalModel",
    "VariationalResult",
    "mixing_pairs",
    "optimise_exponents",
    "orthogonalised_radials",
]

#: Largest |∂E/∂ln ζ| (hartree) accepted as a stationary point. Below it -V/T - 2 < ~1e-7.
GRADIENT_TOLERANCE = 2e-7
#: Step in ln ζ of the five-point central differences of the gradient. The closed-form
#: energy scatters by ~1e-11 Eh (Kr) from rounding in the incomplete beta functions;
#: with h = 1e-3 the rounding error of the derivative is ~1e-8 Eh and the truncation
#: error (h⁴/30 · E⁽⁵⁾) below 1e-9 Eh. A two-point difference with h = 1e-5 left Kr's
#: gradient at 4e-7 Eh, above GRADIENT_TOLERANCE.
_STEP = 1e-3
#: Step in ln ζ of the finite-difference Hessian used to polish the optimum.
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
    """

    configuration: Configuration
    zetas: tuple[float, ...]
    mixing: dict[tuple[int, int], float]
    radials: tuple[RadialFunction, ...]
    kinetic: float
    potential: float
    gradient: tuple[float, ...]
    state: OptimisationState

    @property
    def energy(self) -> float:
        """Total energy E = T + V (hartree)."""
        return self.kinetic + self.potential

    @property
    def virial_ratio(self) -> float:
        """-V/T; 2 at an optimum, since every ζ scaled together is one of the variations."""
        return -self.potential / self.kinetic


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
    χ_a = N r^{n-1} e^{-ζ_a r} (n* = n, the Clementi–Raimondi form), one per subshell.
    The orbitals of one l are the χ of that l Gram–Schmidt orthonormalised in order
    of n, then rotated into each other by an angle θ for every pair of which one
    subshell is open (:func:`mixing_pairs`). Together with the exponents this spans
    the minimal-basis orbitals of Clementi & Raimondi (orbitals expanded in the
    same-l χ); for pairs of closed subshells a rotation leaves the determinant, and
    so the energy, unchanged and is omitted. L-BFGS-B minimises E over (ln ζ, θ) from
    Slater's rules (with n* = n) and θ = 0, with five-point central-difference
    gradients (step 1e-3) of the closed-form energy
    (:class:`zeffir.core.models._sto_energy.StoEnergy`), then Newton steps polish the
    optimum until every derivative is below :data:`GRADIENT_TOLERANCE`. At the optimum -V/T = 2 (virial
    theorem: scaling all ζ together is one of the variations).

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

    subshells = tuple(s for s, _ in configuration.occupations)
    pairs = mixing_pairs(configuration)
    m = len(subshells)
    expression = hund_energy_expression(configuration)
    closed_form = StoEnergy(expression, subshells)
    lower, upper = math.log(ZETA_MIN), math.log(ZETA_MAX_PER_Z * configuration.Z)
    bounds = [(lower, upper)] * m + [(-MAX_MIXING, MAX_MIXING)] * len(pairs)
    evaluations = 0
    iteration = 0
    last: OptimisationState | None = None

    def split(x: FloatArray) -> tuple[tuple[float, ...], dict[tuple[int, int], float]]:
        return tuple(float(z) for z in np.exp(x[:m])), dict(zip(pairs, map(float, x[m:]), strict=True))

    def radials_at(x: FloatArray) -> tuple[RadialFunction, ...]:
        zetas, mixing = split(x)
        return orthogonalised_radials(subshells, zetas, mixing)

    def energy_terms(x: FloatArray) -> tuple[float, float]:
        nonlocal evaluations
        if (should_stop is not None and should_stop()) or ambient_should_stop():
            raise OptimisationCancelled("exponent optimisation cancelled", last)
        zetas, mixing = split(x)
        kinetic, nuclear, repulsion = closed_form.terms_at(
            zetas, orthonormal_coefficients(subshells, zetas, mixing))
        evaluations += 1
        return kinetic, nuclear + repulsion

    def gradient(x: FloatArray) -> FloatArray:
        out = np.empty_like(x)
        for i in range(x.size):
            step = np.zeros_like(x)
            step[i] = _STEP
            out[i] = (8 * (sum(energy_terms(x + step)) - sum(energy_terms(x - step)))
                      - (sum(energy_terms(x + 2 * step)) - sum(energy_terms(x - 2 * step)))) / (12 * _STEP)
        return out

    def rough_gradient(x: FloatArray) -> FloatArray:
        """Two-point differences: enough for the Hessian of the Newton polish (its errors
        change the step, not the point the accurate gradient converges to)."""
        out = np.empty_like(x)
        for i in range(x.size):
            step = np.zeros_like(x)
            step[i] = _STEP
            out[i] = (sum(energy_terms(x + step)) - sum(energy_terms(x - step))) / (2 * _STEP)
        return out

    x = np.concatenate([np.log(np.asarray(_starting_zetas(configuration))), np.zeros(len(pairs))])

    def fun(y: FloatArray) -> tuple[float, FloatArray]:
        nonlocal last
        energy = sum(energy_terms(y))
        last = OptimisationState(iteration, evaluations, split(y)[0], energy)
        return energy, gradient(y)

    def callback(_xk: FloatArray) -> None:
        nonlocal iteration
        iteration += 1
        if progress is not None and last is not None:
            progress(OptimisationState(iteration, evaluations, last.zetas, last.energy))
        if last is not None:
            ambient_report(f"{configuration.spec}: optimising exponents, step {iteration}, "
                           f"E = {last.energy:.8f} Eh")

    found = optimize.minimize(
        fun, x, jac=True, method="L-BFGS-B", bounds=bounds, callback=callback,
        options={"maxiter": 500, "ftol": 1e-14, "gtol": GRADIENT_TOLERANCE / 2, "maxcor": 20},
    )
    x, message = np.asarray(found.x, dtype=float), str(found.message)
    # Polish with Newton steps (finite-difference Hessian): L-BFGS-B may stop on a flat
    # energy slightly short of the gradient tolerance.
    grad = gradient(x)
    for _newton in range(6):
        if np.all(np.abs(grad) <= GRADIENT_TOLERANCE):
            break
        hessian = np.empty((x.size, x.size))
        for j in range(x.size):
            step = np.zeros_like(x)
            step[j] = _HESSIAN_STEP
            hessian[:, j] = (rough_gradient(x + step) - rough_gradient(x - step)) / (2 * _HESSIAN_STEP)
        hessian = 0.5 * (hessian + hessian.T)
        if np.any(np.linalg.eigvalsh(hessian) <= 0):
            break
        x = np.clip(x - np.linalg.solve(hessian, grad), [lo for lo, _ in bounds], [hi for _, hi in bounds])
        grad = gradient(x)
        iteration += 1
        if progress is not None:
            progress(OptimisationState(iteration, evaluations, split(x)[0], sum(energy_terms(x))))
    zetas, mixing = split(x)
    kinetic, potential = energy_terms(x)
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
    return VariationalResult(configuration, zetas, mixing, radials_at(x), kinetic, potential,
                             tuple(float(g) for g in grad), state)


@dataclass(frozen=True)
class VariationalModel:
    """Slater-type orbitals (n* = n) with exponents minimising the Hund-determinant energy.

    Notes
    -----
    One exponent per subshell, optimised for the configuration typed (ion or excited
    configurations included) by :func:`optimise_exponents`. Orbitals of equal l are
    orthonormal combinations of the Slater-type functions of that l (a minimal basis,
    as Clementi & Raimondi's); the reported ζ is each subshell's own exponent and
    Z_eff = ζn. The total energy is that of the Hund determinant (the M_L = L,
    M_S = S component of the Hund term); each orbital energy is ⟨φ|F|φ⟩ of its
    subshell's Fock operator for that energy (:func:`zeffir.core.energy.orbital_energies`),
    the estimate a minimal basis gives (He: ε = ζ²/2 - Zζ + 5ζ/8). The energy is in
    closed form (milliseconds per evaluation); an optimisation takes well under a
    second for light atoms and seconds for heavy ones (Kr about 5 s, Xe about 15 s,
    the finite-difference gradients needing 4 evaluations per exponent).

    References
    ----------
    E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963); J. C. Slater,
    *Quantum Theory of Atomic Structure* (McGraw-Hill, 1960).
    """

    name: str = "variational"
    title: str = "variational single-zeta exponents"
    reference: str = "Clementi & Raimondi 1963 (method); Slater 1960"

    def build(self, configuration: Configuration) -> OrbitalSet:
        from zeffir.core.energy import hund_energy_expression, orbital_energies, radial_integrals

        result = optimise_exponents(configuration)
        provisional = OrbitalSet(configuration, self.name, tuple(
            SubshellOrbital(sub, occ, radial, zeta, zeta * sub.n, float(sub.n), None, ())
            for (sub, occ), radial, zeta in zip(configuration.occupations, result.radials, result.zetas,
                                                strict=True)))
        epsilon = orbital_energies(hund_energy_expression(configuration), radial_integrals(provisional))
        orbitals = []
        for (sub, occ), radial, zeta in zip(configuration.occupations, result.radials, result.zetas,
                                            strict=True):
            notes: tuple[str, ...] = ()
            if isinstance(radial, SlaterExpansionRadial):
                notes = (f"{sub.label}: a combination of this configuration's {sub.label[-1]}-type "
                         "Slater functions (orthonormalised); ζ is the exponent of its own one",)
            orbitals.append(SubshellOrbital(sub, occ, radial, zeta, zeta * sub.n, float(sub.n),
                                            epsilon.get(sub), notes))
        return OrbitalSet(configuration, self.name, tuple(orbitals), total_energy=result.energy,
                          notes=("total energy: Hund determinant, single-zeta Slater-type functions",),
                          virial_ratio=-result.potential / result.kinetic)

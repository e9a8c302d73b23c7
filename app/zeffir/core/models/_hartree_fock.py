"""Restricted Hartree–Fock for atoms with closed shells and at most one open s, p or d subshell.

The Roothaan method in a Slater-type basis.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

import numpy as np
import numpy.typing as npt

from zeffir.core._cancel import report_progress as ambient_report
from zeffir.core._cancel import should_stop as ambient_should_stop
from zeffir.core._errors import ComputationCancelled, ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.orbitals import FloatArray, OrbitalSet, RadialFunction, SlaterRadial, SubshellOrbital

if TYPE_CHECKING:
    from zeffir.core.energy import EnergyExpression

__all__ = [
    "EvenTemperedBasis",
    "HartreeFockCancelled",
    "HartreeFockError",
    "HartreeFockModel",
    "HartreeFockResult",
    "SCFState",
    "SlaterExpansionRadial",
    "default_basis",
    "solve",
    "solve_average",
    "solve_closed_shell",
    "solve_expression",
    "solve_hund",
    "solve_open_shell",
]

#: Converged when the largest |FDS - SDF| element (orthogonal basis) is below this (hartree)...
COMMUTATOR_TOLERANCE = 1e-9
#: ... and the energy changed by less than this (hartree) in the last iteration, or by
#: less than :data:`ENERGY_NOISE` of |E| for heavy atoms.
ENERGY_TOLERANCE = 1e-11
#: Relative rounding floor of the total energy: summing integrals over ~25⁴ basis
#: quadruples, the energy of a fixed density scatters by ~1e-13 of |E| (±1e-9 Eh for
#: Eu at -10423.5 Eh once the gradient is below 1e-10), so the energy test cannot be
#: tighter than this.
ENERGY_NOISE = 1e-12
#: For the heaviest atoms the orbital gradient itself stalls at a rounding floor above
#: :data:`COMMUTATOR_TOLERANCE` (Og: 3e-9 to 3e-8, the energy scattering by ±1e-7 Eh
#: of -46324 Eh). A run whose gradient stays below this and whose energy changes by
#: less than :data:`FLOOR_ENERGY_NOISE` of |E| for :data:`FLOOR_ITERATIONS`
#: consecutive iterations has converged as far as double precision allows.
FLOOR_RESIDUAL = 1e-7
FLOOR_ENERGY_NOISE = 1e-11
FLOOR_ITERATIONS = 8
#: Overlap eigenvalues below this (relative to the largest) are dropped as linear dependence.
LINEAR_DEPENDENCE = 1e-11
#: The iteration starts in the basis without the combinations whose overlap eigenvalue is
#: below this (relative), and switches to the full basis once the orbital gradient is
#: below :data:`START_RESIDUAL`: far from self-consistency, near-null combinations with
#: strongly cancelling coefficients can turn rounding into wild Fock matrices (Sr, Cs
#: and Ba diverged from the bare-nucleus start without it). Only for atoms with d
#: electrons and for anions (Na⁻); lighter neutral atoms and cations iterate in the
#: full basis from the start.
START_LINEAR_DEPENDENCE = 1e-8
START_RESIDUAL = 1e-2
MAX_ITERATIONS = 200
#: Smallest exponent of an l set holding a Rydberg-like orbital, in units of q/n (see
#: :func:`default_basis`).
RYDBERG_TAIL = 0.3
#: A converged solution with |-V/T - 2| above this is refused: the virial theorem holds
#: for the exact Hartree–Fock orbitals, and the default bases reach |-V/T - 2| <= 5e-8
#: for every atom tested, so a larger deviation means the basis cannot represent an
#: orbital (He 1s1 4s1 with the ground-state basis: 5e-3, energy 7.7e-4 Eh too high).
VIRIAL_TOLERANCE = 1e-5
#: Number of previous Fock matrices DIIS extrapolates from.
DIIS_SIZE = 8
#: Largest Σ_p |C_p| of an occupied orbital accepted, times (n - l)². Rounding
#: errors of the integrals (~1e-16 relative) enter the energy multiplied by about
#: (Σ|C|)⁴; ground-state orbitals in the default bases have Σ|C| < 16 up to Kr (about
#: 42 for the 5s of Xe); larger cancellations there signal a numerically linearly
#: dependent basis. Rydberg-like orbitals with n - l lobes are sums of strongly
#: cancelling diffuse functions (Σ|C| ≈ 160 for the 4s of He 1s1 4s1 and the 5s of Na
#: [Ne] 5s1) whose integrals are small; their energies agree to 1e-8 Eh between bases
#: starting at ζ = 0.1 and 0.05, so the limit grows with the number of lobes n - l.
MAX_COEFFICIENT_SUM = 100.0


class SlaterExpansionRadial(RadialFunction):
    """A radial function expanded in normalised Slater-type functions of one n.

    Parameters
    ----------
    n, l : int
        The subshell it stands for (labels).
    basis_n : int
        Principal quantum number of every basis function (l + 1 for the Roothaan basis).
    zetas, coefficients : array_like
        Exponents (bohr⁻¹) and coefficients of the normalised functions; the
        combination must be normalised.

    Notes
    -----
    R(r) = Σ_p c_p N_p r^{m-1} e^{-ζ_p r}, m = ``basis_n``. Moments, the cumulative
    charge and R/r^l are in closed form:
    <r^k> = Σ_pq c_p c_q N_p N_q Γ(2m+1+k)/(ζ_p+ζ_q)^{2m+1+k},
    Q(r) = Σ_pq c_p c_q N_p N_q Γ(2m+1)/(ζ_p+ζ_q)^{2m+1} P(2m+1, (ζ_p+ζ_q) r).

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); E. Clementi and C. Roetti, At. Data
    Nucl. Data Tables 14, 177 (1974) (orbitals as sums of Slater-type functions).

    Examples
    --------
    >>> R = SlaterExpansionRadial(1, 0, 1, [1.0], [1.0])
    >>> bool(abs(R.expectation(1) - 1.5) < 1e-14)  # hydrogen 1s: <r> = 3/2
    True
    """

    kind = "slater-type expansion"

    def __init__(self, n: int, l: int, basis_n: int, zetas: npt.ArrayLike,
                 coefficients: npt.ArrayLike) -> None:
        self.n, self.l = int(n), int(l)
        self.basis_n = int(basis_n)
        self.zetas = np.asarray(zetas, dtype=float).copy()
        self.coefficients = np.asarray(coefficients, dtype=float).copy()
        if self.zetas.shape != self.coefficients.shape or self.zetas.ndim != 1:
            raise ModelError("zetas and coefficients must be 1-D arrays of equal length")
        self.terms = tuple(SlaterRadial(self.n, self.l, float(self.basis_n), float(z)) for z in self.zetas)

    def __repr__(self) -> str:
        return f"SlaterExpansionRadial(n={self.n}, l={self.l}, terms={self.zetas.size})"

    def shape_key(self) -> object:
        return ("slater-expansion", self.basis_n, tuple(self.zetas), tuple(self.coefficients))

    def __call__(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(sum(c * s(rr) for s, c in zip(self.terms, self.coefficients, strict=True)),
                          dtype=float)

    def over_r_l(self, r: npt.ArrayLike) -> FloatArray:
        rr = np.asarray(r, dtype=float)
        return np.asarray(sum(c * s.over_r_l(rr) for s, c in zip(self.terms, self.coefficients, strict=True)),
                          dtype=float)

    def p_derivative(self, r: npt.ArrayLike) -> FloatArray:
        """dP/dr in closed form: Σ_p c_p P_p (m/r - ζ_p), P = rR (used by the radial integrals)."""
        rr = np.asarray(r, dtype=float)
        out = np.zeros_like(rr)
        for s, c in zip(self.terms, self.coefficients, strict=True):
            with np.errstate(divide="ignore", invalid="ignore"):
                dp = np.where(rr > 0, s.p(rr) * (self.basis_n / rr - s.zeta), 0.0)
            if self.basis_n == 1:
                dp = np.where(rr == 0, s(np.zeros(1))[0], dp)
            out += c * dp
        return out

    def extent(self, tail: float = 1e-14) -> float:
        # Bisection on the closed-form tail 1 - Q(r): a bound from the terms alone would
        # be set by the most diffuse basis function, however small its coefficient.
        lo, hi = 0.0, max(t.extent(tail) for t in self.terms)
        for _ in range(100):
            mid = 0.5 * (lo + hi)
            lo, hi = (mid, hi) if float(self._outside(mid)) > tail else (lo, mid)
            if hi - lo < 1e-12 * hi:
                break
        return hi

    def nodes(self) -> FloatArray:
        """Radial nodes, leaving out sign changes in the far tail.

        Far out, where less than ~1e-7 of the electron remains, the expansion can cross
        zero: there the orbital has decayed below what the variational solution fixes
        (the admixture of other orbitals left by a ~1e-9 residual, or a diffuse basis
        function with a small negative coefficient; the 3s of He 1s1 3s1 crosses at 49
        and 64 bohr with 1.7e-8 of the electron outside). Every node of a bound orbital
        lies inside its outer maximum, with most of the electron beyond it (0.91 for that
        3s's outer node at 5.2 bohr), so dropping the crossings with less than 1e-4 of the
        electron outside loses no true node.
        """
        roots = super().nodes()
        return roots[self._outside(roots) > 1e-4]

    def _outside(self, r: npt.ArrayLike) -> FloatArray:
        """1 - Q(r), summed from the complementary incomplete gamma functions (no cancellation)."""
        from scipy import special

        rr = np.asarray(r, dtype=float)
        moments, s = self._pair_moment(0)
        tails = special.gammaincc(2 * self.basis_n + 1, rr[..., None, None] * s)
        return np.asarray(np.tensordot(tails, moments, axes=([-2, -1], [0, 1])), dtype=float)

    def _pair_moment(self, power: int) -> tuple[FloatArray, FloatArray]:
        from scipy import special

        m = self.basis_n
        ln = (m + 0.5) * np.log(2 * self.zetas) - 0.5 * special.gammaln(2 * m + 1)
        s = self.zetas[:, None] + self.zetas[None, :]
        a = 2 * m + 1 + power
        weights = self.coefficients[:, None] * self.coefficients[None, :]
        return weights * np.exp(ln[:, None] + ln[None, :] + special.gammaln(a) - a * np.log(s)), s

    def expectation(self, k: int) -> float:
        if 2 * self.basis_n + 1 + k <= 0:
            return float("inf")
        moments, _ = self._pair_moment(k)
        return float(np.sum(moments))

    def cumulative(self, r: npt.ArrayLike) -> FloatArray:
        from scipy import special

        rr = np.asarray(r, dtype=float)
        moments, s = self._pair_moment(0)
        a = 2 * self.basis_n + 1
        out = np.tensordot(special.gammainc(a, rr[..., None, None] * s), moments, axes=([-2, -1], [0, 1]))
        return np.asarray(out, dtype=float)


@dataclass(frozen=True, slots=True)
class EvenTemperedBasis:
    """Slater-type functions ζ_k = α β^k (k = 0 .. count-1) of n = l + 1, one set per l.

    Attributes
    ----------
    sets : dict
        ``{l: (alpha, beta, count)}``.

    References
    ----------
    K. Ruedenberg, R. C. Raffenetti and R. D. Bardo, in *Energy, Structure and
    Reactivity* (Wiley, 1973) — even-tempered bases; Koga et al., Int. J. Quantum Chem.
    71, 491 (1999) for the Slater-type Roothaan–Hartree–Fock energies they approach.
    """

    sets: dict[int, tuple[float, float, int]]

    def zetas(self, l: int) -> FloatArray:
        """The exponents of angular momentum l (bohr⁻¹)."""
        alpha, beta, count = self.sets[l]
        return np.asarray(alpha * beta ** np.arange(count), dtype=float)


def default_basis(configuration: Configuration) -> EvenTemperedBasis:
    """An even-tempered basis reaching from the valence tail to the nuclear cusp.

    Parameters
    ----------
    configuration : Configuration

    Returns
    -------
    EvenTemperedBasis

    Notes
    -----
    s functions: ζ from 0.25 to 8Z with ratio β = 1.35; p functions: from 0.25 to 3Z
    with β = 1.4, or β = 1.3 when d subshells are occupied; d (and higher) functions:
    from 0.25 to Z with β = 1.3. The smallest exponent lies below the decay constant
    √(2|ε|) of any valence orbital of a neutral atom, the largest s exponent well beyond
    the 1s cusp (ζ ≈ Z); the innermost d orbital (3d, ζ ≲ Z/3) needs no functions beyond
    Z, and stopping there keeps the d set small enough to be dense. The dense p and d
    sets matter from Kr on: with β = 1.4 for both (d up to 3Z), Kr lies 6e-6 Eh and Xe
    6e-5 Eh above the Hartree–Fock limit, with these sets within 1e-6 Eh; He–Ar land
    within 1e-6 Eh with the β = 1.4 p set, which keeps them fast (Ne in about half the
    time it takes with β = 1.3) (tests/reference/test_hartree_fock_references.py). Sizes:
    15–26 s, 16–26 p and 20–22 d functions. The smallest overlap eigenvalue stays above
    1e-10, so canonical orthogonalisation drops nothing. Denser or wider sets are not
    automatically better: d functions up to 3Z with β = 1.3 bring Kr's smallest d
    overlap eigenvalue to ~4e-9, and from the bare-nucleus start its iteration diverged
    (rounding, amplified by strongly cancelling coefficients, drove orbitals into the
    near-null space; see :data:`START_LINEAR_DEPENDENCE`). Starting lower
    does not help anions: with ζ = 0.1 the H⁻ iteration oscillates between the compact
    orbital and an almost free one, while from 0.25 (or 0.15) it converges to the same
    energy to 1e-12 Eh.

    An excited configuration whose outermost subshell of some l lies above an empty one
    of that l (He 1s1 4s1, Na [Ne] 4d1) has a Rydberg-like orbital decaying as
    e^{-qr/n} (q the charge seen far out): its l set starts at
    ζ = min(0.25, :data:`RYDBERG_TAIL` q/n), with β = 1.25. From 0.25 the He 1s1 4s1
    energy is 7.7e-4 Eh too high (virial ratio off by 5e-3); with these sets the He
    1s1 ns energies (n ≤ 4) change by less than 3e-7 Eh when the tail or β is varied
    (tests/core/models/test_hartree_fock_hund.py). From n - l ≈ 5 on the nodeless
    Slater-type functions cancel too strongly: He 1s1 5s1 and Na [Ne] 6s1 do not
    converge (the Rydberg orbital trades places with the virtual orbital below it), and
    higher ones are refused by :data:`MAX_COEFFICIENT_SUM` or :data:`VIRIAL_TOLERANCE`;
    either way the run ends with a :class:`HartreeFockError` naming the reason.

    References
    ----------
    Ruedenberg, Raffenetti and Bardo 1973 (even-tempered bases).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> default_basis(parse_spec("Ne")).sets[1][2]
    16
    >>> default_basis(parse_spec("Kr")).sets[1][1:], default_basis(parse_spec("Kr")).sets[2][1:]
    ((1.3, 25), (1.3, 20))
    """
    Z = configuration.Z
    sets: dict[int, tuple[float, float, int]] = {}
    occupied = [s for s, w in configuration.occupations if w > 0]
    ls = sorted({s.l for s in occupied})
    # Atoms with d electrons need denser p and d sets (see Notes); lighter ones keep the
    # cheaper β = 1.4 p set, which already reaches 1e-6 Eh.
    with_d = max(ls) >= 2
    # Charge felt by an outer electron far out (1 for a neutral atom).
    outer_charge = max(1, Z - configuration.n_electrons + 1)
    for l in ls:
        ns = sorted(s.n for s in occupied if s.l == l)
        if l == 0:
            top, beta = 8.0 * Z, 1.35
        elif l == 1:
            top, beta = 3.0 * Z, (1.3 if with_d else 1.4)
        elif max(ls) >= 3:
            # With f electrons (Z > 57) the d set reaches 2Z, denser: Rn's energy drops
            # by 1.2e-5 Eh from the Z, β = 1.3 set, and is then stable to 3e-7 Eh.
            top, beta = 2.0 * Z, 1.25
        else:
            top, beta = 1.0 * Z, 1.3
        alpha = 0.25
        if ns != list(range(l + 1, l + 1 + len(ns))):
            # An excited (Rydberg-like) orbital above an empty subshell: reach its tail,
            # with a denser set for its nodes.
            alpha, beta = min(alpha, RYDBERG_TAIL * outer_charge / ns[-1]), min(beta, 1.25)
        count = max(4, math.ceil(math.log(top / alpha) / math.log(beta)) + 1)
        sets[l] = (alpha, beta, count)
    return EvenTemperedBasis(sets)


@dataclass(frozen=True, slots=True)
class SCFState:
    """Where a self-consistent run stands.

    Attributes
    ----------
    iteration : int
    energy : float
        Total energy (hartree) of the density that built the current Fock matrices.
    residual : float
        Largest element of the orbital gradient FDS - SDF in the orthonormal basis.
    energy_change : float
        Energy change from the previous iteration (hartree).
    """

    iteration: int
    energy: float
    residual: float
    energy_change: float


class HartreeFockError(ModelError):
    """The self-consistent field did not converge; ``state`` holds the last iteration."""

    def __init__(self, message: str, state: SCFState | None) -> None:
        super().__init__(message)
        self.state = state


class HartreeFockCancelled(HartreeFockError, ComputationCancelled):
    """``should_stop`` asked the run to stop; ``state`` holds the last iteration."""


@dataclass(frozen=True)
class HartreeFockResult:
    """A converged Roothaan–Hartree–Fock solution (closed shells, or one open subshell).

    Attributes
    ----------
    configuration : Configuration
    basis : EvenTemperedBasis
    coefficients : dict
        ``{l: C}``, columns the occupied orbitals of l (n = l+1, l+2, ...) over the
        normalised basis functions.
    orbital_energies : dict
        ``{Subshell: ε}`` (hartree).
    kinetic, potential : float
        T and V (hartree).
    state : SCFState
        The final iteration.
    dropped : dict
        ``{l: number}`` of basis combinations dropped as linearly dependent.
    """

    configuration: Configuration
    basis: EvenTemperedBasis
    coefficients: dict[int, FloatArray]
    orbital_energies: dict[Subshell, float]
    kinetic: float
    potential: float
    state: SCFState
    dropped: dict[int, int] = field(default_factory=dict)

    @property
    def energy(self) -> float:
        """Total energy E = T + V (hartree)."""
        return self.kinetic + self.potential

    @property
    def virial_ratio(self) -> float:
        """-V/T (2 for the exact Hartree–Fock solution)."""
        return -self.potential / self.kinetic


def _closed_shell_layout(configuration: Configuration) -> dict[int, int]:
    """Occupied orbitals per l; refuses open shells and gaps within an l."""
    open_shells = [f"{s.label}{w}" for s, w in configuration.occupations if w != 2 * (2 * s.l + 1)]
    if open_shells:
        raise ModelError(f"open shells are not supported yet: {configuration.spec} has "
                         f"{' '.join(open_shells)} partly filled (restricted Hartree–Fock here "
                         "treats closed-shell configurations only)")
    layout: dict[int, int] = {}
    for l in sorted({s.l for s, _ in configuration.occupations}):
        ns = sorted(s.n for s, _ in configuration.occupations if s.l == l)
        if ns != list(range(l + 1, l + 1 + len(ns))):
            raise ModelError(f"{configuration.spec}: the occupied {'spdfghik'[l]} subshells must be "
                             f"the lowest ones (n = {l + 1}, {l + 2}, ...); excited closed shells "
                             "are not supported")
        layout[l] = len(ns)
    return layout


def _exchange_weight(l1: int, k: int, l2: int) -> float:
    from zeffir.core.energy import wigner_3j_squared

    _, square = wigner_3j_squared(l1, k, l2, 0, 0, 0)
    return square.numerator / square.denominator



def _anion_hint(configuration: Configuration) -> str:
    """Why an anion may fail: its extra electron may not be bound at this level of theory."""
    if configuration.charge <= -2:
        return ("; a free multiply charged anion is not bound at this level of theory, so its "
                "outer electrons have no self-consistent orbital to settle in")
    if configuration.charge < 0:
        return ("; for an anion this usually means the extra electron is not bound at the "
                "Hartree–Fock level (Be⁻, Mg⁻, Ne⁻), so no orbital of the basis holds it")
    return ""


def _no_convergence(configuration: Configuration, max_iterations: int,
                    state: SCFState | None) -> HartreeFockError:
    """The error for a run that ran out of iterations, with the last residual."""
    hint = _anion_hint(configuration)
    return HartreeFockError(
        f"{configuration.spec}: no self-consistency after {max_iterations} iterations "
        f"(last orbital-gradient residual {state.residual if state else math.nan:.2e}, "
        f"energy change {state.energy_change if state else math.nan:.2e} Eh){hint}", state)


class _Convergence:
    """The stop test of the SCF loops.

    Converged when the gradient is below :data:`COMMUTATOR_TOLERANCE` and the energy
    settled (:data:`ENERGY_TOLERANCE`, or :data:`ENERGY_NOISE` of |E|); or when the
    gradient is below that tolerance in two consecutive iterations, the energy then
    being stationary to second order and its scatter rounding (a Rydberg orbital built
    from strongly cancelling coefficients, He 1s1 4s1, scatters by ±1.5e-9 Eh at a
    gradient of 1e-10); or when the run sits at the rounding floor of a heavy atom for
    :data:`FLOOR_ITERATIONS` iterations (see :data:`FLOOR_RESIDUAL`).
    """

    def __init__(self) -> None:
        self.at_floor = 0
        self.last_residual = math.inf

    def done(self, residual: float, change: float, energy: float) -> bool:
        settled = abs(change) < max(ENERGY_TOLERANCE, ENERGY_NOISE * abs(energy))
        twice = self.last_residual < COMMUTATOR_TOLERANCE
        self.last_residual = residual
        if residual < COMMUTATOR_TOLERANCE and (settled or twice):
            return True
        if residual < FLOOR_RESIDUAL and abs(change) < FLOOR_ENERGY_NOISE * abs(energy):
            self.at_floor += 1
        else:
            self.at_floor = 0
        return self.at_floor >= FLOOR_ITERATIONS


def _stop_if_asked(configuration: Configuration, should_stop: Callable[[], bool] | None,
                   state: SCFState | None) -> None:
    """Raise :class:`HartreeFockCancelled` if the caller (or the worker running us) asked to stop."""
    if (should_stop is not None and should_stop()) or ambient_should_stop():
        raise HartreeFockCancelled(f"{configuration.spec}: Hartree–Fock run cancelled", state)


def _record_iteration(configuration: Configuration, iteration: int, energy: float,
                      energy_before: float, error: FloatArray,
                      progress: Callable[[SCFState], None] | None, symbol: str) -> SCFState:
    """The state of one SCF iteration: reported to the caller, and checked for divergence."""
    residual = float(np.max(np.abs(error)))
    change = energy - energy_before
    state = SCFState(iteration, energy, residual, change if math.isfinite(change) else math.inf)
    if progress is not None:
        progress(state)
    ambient_report(f"{configuration.spec}: Hartree–Fock iteration {iteration}, "
                   f"{symbol} = {energy:.8f} Eh, residual {residual:.1e}")
    if not (math.isfinite(energy) and math.isfinite(residual)):
        raise HartreeFockError(f"{configuration.spec}: the self-consistent field diverged "
                               f"at iteration {iteration}", state)
    return state

def solve_closed_shell(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for a closed-shell atom or ion by the Roothaan method.

    Parameters
    ----------
    configuration : Configuration
        Every subshell full, and the occupied subshells of each l the lowest ones.
    basis : EvenTemperedBasis, optional
        Defaults to :func:`default_basis`.
    progress : callable, optional
        Called with an :class:`SCFState` after every iteration.
    should_stop : callable, optional
        Polled before every iteration; True stops the run with :class:`HartreeFockCancelled`.
    max_iterations : int

    Returns
    -------
    HartreeFockResult

    Raises
    ------
    ModelError
        An open shell, or occupied subshells that are not the lowest of their l.
    HartreeFockError
        No convergence within ``max_iterations`` (the message gives the last residual).

    Notes
    -----
    For each l the orbitals are φ = Σ_p C_p χ_p, χ_p normalised Slater-type functions
    r^l e^{-ζ_p r} (n = l+1); D^l = C_occ C_occᵀ and w_l = 2(2l+1). For closed shells
    (Roothaan 1951, 1960) the energy is

    E = Σ_l w_l tr(D^l h^l) + ½ Σ_{l,l'} w_l w_{l'} Σ [D^l_pq D^{l'}_rs R⁰[pq|rs]
        - ½ Σ_k (l k l'; 0 0 0)² D^l_ps D^{l'}_qr R^k[pq|rs]],

    and its derivative gives the Fock matrix of symmetry λ,

    F^λ_pq = h^λ_pq + Σ_{l'} w_{l'} Σ_rs D^{l'}_rs (R⁰[pq|rs] - ½ Σ_k (λ k l'; 0 0 0)² R^k[pr|sq]),

    solved as F C = S C ε. The one-electron and R^k integrals are in closed form
    (:mod:`zeffir.core.models._hf_integrals`). The basis of each l is canonically
    orthogonalised (X = U s^{-1/2}, eigenvalues of S below 1e-11 of the largest
    dropped). The start is the bare-nucleus Hamiltonian; Pulay's DIIS extrapolates the
    Fock matrices from the orbital gradients FDS - SDF. With d electrons, the first
    iterations run in the basis without the combinations of overlap eigenvalue below
    1e-8 of the largest (gradient projected on the kept span), until the gradient is below
    :data:`START_RESIDUAL`; then the full basis takes over with a fresh DIIS history.
    Without this the early, far-from-self-consistent Fock matrices of Sr, Cs or Ba
    drive orbitals into near-null combinations whose cancelling coefficients magnify
    rounding, and the iteration diverges. Convergence: largest gradient
    element below :data:`COMMUTATOR_TOLERANCE` and energy change below
    :data:`ENERGY_TOLERANCE`.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); 32, 179 (1960); P. Pulay, Chem.
    Phys. Lett. 73, 393 (1980) (DIIS); P.-O. Löwdin, Adv. Quantum Chem. 5, 185 (1970)
    (canonical orthogonalisation).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> result = solve_closed_shell(parse_spec("He"))
    >>> abs(result.energy + 2.8616800) < 1e-6  # Koga et al. 1999
    True
    """

    layout = _closed_shell_layout(configuration)
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, weight, zetas = setup.ls, setup.weight, setup.zetas
    overlap, kinetic, core = setup.overlap, setup.kinetic, setup.core
    interaction = setup.interaction
    dropped = setup.dropped
    # Start in the reduced basis; swapped (in place, for the closures) for the full one.
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)

    def diagonalise(fock: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        coefficients, energies = {}, {}
        for l in ls:
            x = transform[l]
            eps, vectors = np.linalg.eigh(x.T @ fock[l] @ x)
            coefficients[l] = x @ vectors[:, : layout[l]]
            energies[l] = eps[: layout[l]]
        return coefficients, energies

    def fock_of(density: dict[int, FloatArray]) -> dict[int, FloatArray]:
        out = {}
        for lam in ls:
            f = core[lam].copy()
            for lp in ls:
                f += weight[lp] * np.tensordot(interaction[lam, lp], density[lp],
                                               axes=([2, 3], [0, 1]))
            out[lam] = f
        return out

    def energy_of(density: dict[int, FloatArray], fock: dict[int, FloatArray]) -> float:
        return float(sum(0.5 * weight[l] * np.sum(density[l] * (core[l] + fock[l])) for l in ls))

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        density = {l: coefficients[l] @ coefficients[l].T for l in ls}
        fock = fock_of(density)
        # The gradient in the normalised basis itself: the orthonormalised one would amplify
        # rounding by 1/s_min (up to ~1e8 for dense even-tempered sets) and stall the test.
        error = np.concatenate([_gradient(fock[l] @ density[l] @ overlap[l], kept.get(l)).ravel()
                                for l in ls])
        return energy_of(density, fock), error, (density, fock)

    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept, diagonalise(core)[0], evaluate,
        lambda _c, last: last[1], lambda matrices: diagonalise(matrices)[0],
        progress, should_stop, max_iterations, "E")
    density, fock = payload
    # Orbitals and energies of the converged Fock matrix itself (not an extrapolation).
    coefficients, energies = diagonalise(fock)
    kinetic_energy = float(sum(weight[l] * np.sum(density[l] * kinetic[l]) for l in ls))
    _check_trustworthy(configuration, coefficients, density, core, weight, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {}
    for l in ls:
        for i, n in enumerate(range(l + 1, l + 1 + layout[l])):
            orbital_energies[Subshell(n, l)] = float(energies[l][i])
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, dropped)


def _open_shell_layout(configuration: Configuration) -> tuple[dict[int, int], Subshell, int]:
    """Occupied orbitals per l, the open subshell and its occupancy; refuses what is not supported."""
    partial = [(s, w) for s, w in configuration.occupations if w != 2 * (2 * s.l + 1)]
    if not partial:
        raise ModelError(f"{configuration.spec}: no open subshell (use solve_closed_shell)")
    shown = " ".join(f"{s.label}{w}" for s, w in partial)
    if len(partial) > 1:
        raise ModelError(f"{configuration.spec}: several open subshells ({shown}) are not supported; "
                         "restricted Hartree–Fock here treats closed shells plus one open s, p or d "
                         "subshell (one radial function per subshell, Hund ground term)")
    sub, occupancy = partial[0]
    if sub.l > 3:
        raise ModelError(f"{configuration.spec}: an open {'spdfghik'[sub.l]} subshell ({shown}) is not "
                         "supported; restricted Hartree–Fock here treats closed shells plus one open "
                         "s, p or d subshell (open f shells are untested)")
    layout: dict[int, int] = {}
    for l in sorted({s.l for s, _ in configuration.occupations}):
        ns = sorted(s.n for s, _ in configuration.occupations if s.l == l)
        if ns != list(range(l + 1, l + 1 + len(ns))):
            raise ModelError(f"{configuration.spec}: the occupied {'spdfghik'[l]} subshells must be "
                             f"the lowest ones (n = {l + 1}, {l + 2}, ...); excited closed shells "
                             "are not supported")
        layout[l] = len(ns)
    if sub.n != sub.l + layout[sub.l]:
        raise ModelError(f"{configuration.spec}: the open subshell {sub.label} must be the highest "
                         f"occupied {'spdfghik'[sub.l]} subshell")
    return layout, sub, int(occupancy)


def solve_open_shell(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for closed shells plus one open s, p or d subshell (Hund term).

    Parameters
    ----------
    configuration : Configuration
        Exactly one partly filled subshell, with l = 0, 1 or 2, the highest occupied one
        of its l; the occupied subshells of each l the lowest ones (e.g. Sc 3d1 4s2, Fe
        3d6 4s2, Fe²⁺ 3d6, Y 4d1 5s2 beside the closed 3d).
    basis : EvenTemperedBasis, optional
        Defaults to :func:`default_basis`.
    progress : callable, optional
        Called with an :class:`SCFState` after every iteration.
    should_stop : callable, optional
        Polled before every iteration; True stops the run with :class:`HartreeFockCancelled`.
    max_iterations : int

    Returns
    -------
    HartreeFockResult
        The energy is that of the Hund ground term; the open subshell's orbital energy
        is the diagonal element of its own Fock operator.

    Raises
    ------
    ModelError
        No open subshell, several, an open f subshell, or occupied subshells that are
        not the lowest of their l.
    HartreeFockError
        No convergence within ``max_iterations`` (the message gives the last residual).

    Notes
    -----
    Every subshell has one radial function, the same for both spins (restricted). With
    D^l_c the density of the closed orbitals of l, D_o = φ_o φ_oᵀ that of the open
    subshell o (symmetry l_o, w_o electrons) and w_l = 2(2l+1), the energy is

    E = Σ_l w_l tr(D^l_c h^l) + ½ Σ_l w_l tr(D^l_c G^l[D_c]) + w_o tr(D_o (h + G^{l_o}[D_c]))
        + Σ_k a_k Σ D_o,pq D_o,rs R^k[pq|rs],

    G^λ[D]_pq = Σ_{l'} w_{l'} Σ_rs D^{l'}_rs (R⁰[pq|rs] - ½ Σ_k (λ k l'; 0 0 0)² R^k[pr|sq]),
    and a_k the coefficients of F^k(o, o) in the energy of the Hund determinant
    (:func:`zeffir.core.energy.hund_energy_expression`; a_0 = w_o(w_o-1)/2). For p^q and
    d^q the determinant of highest M_S, then highest M_L, is the only determinant with
    those M_S and M_L, so it is a state of the Hund term alone and its energy is that
    of the ground LS term (d² ³F: F0 - 8F2 - 9F4; d⁵ ⁶S: 10F0 - 35F2 - 315F4). A
    closed shell sees the open one as spherical, so the closed–open interaction is the
    average one. Open d shells (Sc–Ni, Fe²⁺, Y, Zr) converge with the same iteration,
    in 13–21 steps.

    Varying D_c and D_o gives one Fock operator per class (per electron),
    F_c = h + G[D_c] + w_o G_o, F_o = h + G[D_c] + (2/w_o) Σ_k a_k J^k[D_o], and the
    orbital gradient: for orbitals i, j of one l, ∂E/∂κ_ji = 2(w_i F_i - w_j F_j)_ji.
    Following Roothaan (1960), both are combined into one Hermitian operator R whose
    eigenvectors are the orbitals at self-consistency: in the basis of the current
    orbitals (closed c, open o, virtual v) its blocks are F_c everywhere except
    R_oo = F_o, R_ov = F_o and R_co = (w_c F_c - w_o F_o)/(w_c - w_o); the off-diagonal
    blocks are the orbital gradient divided by the weights, so they vanish exactly at
    the stationary point. Pulay's DIIS extrapolates R from the gradient
    Σ_classes (w_i/w_l) (F_i D_i S - S D_i F_i); orbitals are taken in order of
    eigenvalue (closed shells below the open one, aufbau). Convergence criteria,
    starting point and orthogonalisation are those of :func:`solve_closed_shell`. The
    returned orbitals are those of the last iteration (closed ones made canonical
    within each l), so E = ½ Σ_i w_i (h_ii + ε_i) holds to rounding.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 32, 179 (1960) (open shells of one symmetry);
    C. C. J. Roothaan and P. S. Bagus, Methods Comput. Phys. 2, 47 (1963) (atomic
    self-consistent fields in Slater-type bases); P. Pulay, Chem. Phys. Lett. 73, 393
    (1980) (DIIS).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> result = solve_open_shell(parse_spec("Li"))
    >>> abs(result.energy + 7.432727) < 1e-6  # Bunge et al. 1993, from memory
    True
    """
    from zeffir.core.energy import hund_energy_expression
    from zeffir.core.models._hf_integrals import rk_tensor

    layout, open_sub, w_o = _open_shell_layout(configuration)
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, weight, zetas = setup.ls, setup.weight, setup.zetas
    overlap, kinetic, core = setup.overlap, setup.kinetic, setup.core
    interaction = setup.interaction
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)
    lo = open_sub.l
    closed = {l: layout[l] - (1 if l == lo else 0) for l in ls}
    w_c = weight[lo]
    expression = hund_energy_expression(configuration)
    self_terms = {k: expression.coefficient("F", k, open_sub, open_sub) for k in range(0, 2 * lo + 1, 2)}
    za = zetas[lo]
    self_tensors = {k: rk_tensor(k, lo + 1, za, lo + 1, za, lo + 1, za, lo + 1, za)
                    for k, a in self_terms.items() if a != 0.0}

    def split(coefficients: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], FloatArray]:
        d_c = {l: coefficients[l][:, : closed[l]] @ coefficients[l][:, : closed[l]].T for l in ls}
        phi = coefficients[lo][:, closed[lo]]
        return d_c, np.outer(phi, phi)

    def fock_of(d_c: dict[int, FloatArray], d_o: FloatArray
                ) -> tuple[dict[int, FloatArray], FloatArray, float]:
        two = {}
        for lam in ls:
            g = np.zeros_like(core[lam])
            for lp in ls:
                g += weight[lp] * np.tensordot(interaction[lam, lp], d_c[lp],
                                               axes=([2, 3], [0, 1]))
            two[lam] = g
        f_c = {}
        for lam in ls:
            g_open = np.tensordot(interaction[lam, lo], d_o, axes=([2, 3], [0, 1]))
            f_c[lam] = core[lam] + two[lam] + w_o * g_open
        self_part = sum((a * np.tensordot(self_tensors[k], d_o, axes=([2, 3], [0, 1]))
                         for k, a in self_terms.items() if a != 0.0), np.zeros_like(d_o))
        f_o = core[lo] + two[lo] + (2.0 / w_o) * self_part
        energy = float(sum(weight[l] * np.sum(d_c[l] * (core[l] + 0.5 * two[l])) for l in ls)
                       + w_o * np.sum(d_o * (core[lo] + two[lo])) + np.sum(d_o * self_part))
        return f_c, f_o, energy

    def effective(coefficients: dict[int, FloatArray], f_c: dict[int, FloatArray], f_o: FloatArray
                  ) -> dict[int, FloatArray]:
        """R of every l in its orthonormal basis (see Notes)."""
        out = {}
        for l in ls:
            x = transform[l]
            fc = x.T @ f_c[l] @ x
            if l != lo:
                out[l] = fc
                continue
            fo = x.T @ f_o @ x
            fco = (w_c * fc - w_o * fo) / (w_c - w_o)
            # Orbitals in the orthonormal basis: x⁺ C = xᵀ S C.
            u = x.T @ overlap[l] @ coefficients[l]
            u_c, u_o = u[:, : closed[l]], u[:, closed[l]: closed[l] + 1]
            p_c, p_o = u_c @ u_c.T, u_o @ u_o.T
            p_v = np.eye(fc.shape[0]) - p_c - p_o
            r = p_c @ fc @ p_c + p_v @ fc @ p_v + p_c @ fc @ p_v + p_v @ fc @ p_c
            r += p_o @ fo @ p_o + p_o @ fo @ p_v + p_v @ fo @ p_o
            r += p_c @ fco @ p_o + p_o @ fco @ p_c
            out[l] = 0.5 * (r + r.T)
        return out

    def diagonalise(matrices: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        coefficients, energies = {}, {}
        for l in ls:
            eps, vectors = np.linalg.eigh(matrices[l])
            coefficients[l] = transform[l] @ vectors[:, : layout[l]]
            energies[l] = eps[: layout[l]]
        return coefficients, energies

    def canonical(coefficients: dict[int, FloatArray], f_c: dict[int, FloatArray], f_o: FloatArray
                  ) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        """Closed orbitals diagonalising F_c among themselves; ε_o = ⟨φ_o|F_o|φ_o⟩."""
        out_c, out_e = {}, {}
        for l in ls:
            c = coefficients[l].copy()
            eps, vectors = np.linalg.eigh(c[:, : closed[l]].T @ f_c[l] @ c[:, : closed[l]])
            c[:, : closed[l]] = c[:, : closed[l]] @ vectors
            if l == lo:
                phi = c[:, closed[l]]
                eps = np.append(eps, phi @ f_o @ phi)
            out_c[l], out_e[l] = c, eps
        return out_c, out_e

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        d_c, d_o = split(coefficients)
        f_c, f_o, energy = fock_of(d_c, d_o)
        gradients = []
        for l in ls:
            g = f_c[l] @ d_c[l] @ overlap[l]
            if l == lo:
                g = g + (w_o / w_c) * (f_o @ d_o @ overlap[l])
            gradients.append(_gradient(g, kept.get(l)).ravel())
        return energy, np.concatenate(gradients), (d_c, d_o, f_c, f_o)

    start = diagonalise({l: transform[l].T @ core[l] @ transform[l] for l in ls})[0]
    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept, start, evaluate,
        lambda c, last: effective(c, last[2], last[3]), lambda matrices: diagonalise(matrices)[0],
        progress, should_stop, max_iterations, "E")
    d_c, d_o, f_c, f_o = payload
    # Keep the orbitals whose energy this is: only the closed ones of each l are made
    # canonical (a rotation among them changes nothing). A final diagonalisation of R
    # would rotate closed into open orbitals by ~residual/Δε, which moves the
    # one-electron energies of core orbitals at first order (~1e-8 Eh in Na).
    coefficients, energies = canonical(coefficients, f_c, f_o)
    kinetic_energy = float(sum(weight[l] * np.sum(d_c[l] * kinetic[l]) for l in ls)
                           + w_o * np.sum(d_o * kinetic[lo]))
    _check_coefficients(configuration, coefficients, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {}
    for l in ls:
        for i, n in enumerate(range(l + 1, l + 1 + layout[l])):
            orbital_energies[Subshell(n, l)] = float(energies[l][i])
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, setup.dropped)


def solve(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
    *,
    average: bool = False,
) -> HartreeFockResult:
    """:func:`solve_closed_shell` or, with one open subshell, :func:`solve_open_shell`.

    Parameters
    ----------
    configuration : Configuration
    basis, progress, should_stop, max_iterations
        As for :func:`solve_closed_shell`.
    average : bool
        Minimise the average energy of the configuration instead (any number of open
        s, p, d ... subshells; see :func:`solve_average`).

    Returns
    -------
    HartreeFockResult

    Raises
    ------
    ModelError
        A configuration neither solver supports; the message gives the reason.
    HartreeFockError
        No convergence.

    References
    ----------
    Roothaan 1951; 1960.

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> round(solve(parse_spec("He")).energy, 5)
    -2.86168
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
        As for :func:`solve_closed_shell`.

    Returns
    -------
    HartreeFockResult
        The energy is the average over all determinants of the configuration; each
        orbital energy is the diagonal element of its subshell's Fock operator.

    Raises
    ------
    HartreeFockError
        No convergence within ``max_iterations``.

    Notes
    -----
    :func:`solve_expression` with the average-of-configuration expression
    (:func:`zeffir.core.energy.average_energy_expression`).

    References
    ----------
    J. C. Slater, *Quantum Theory of Atomic Structure* (1960), vol. II, ch. 21 (average
    of configuration).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> li = solve_average(parse_spec("Li"))  # one open s electron: the ground term
    >>> abs(li.energy - solve_open_shell(parse_spec("Li")).energy) < 1e-8
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
        As for :func:`solve_closed_shell`.

    Returns
    -------
    HartreeFockResult
        The energy of the determinant of highest M_S, then highest M_L.

    Notes
    -----
    :func:`solve_expression` with :func:`zeffir.core.energy.hund_energy_expression`.
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
    >>> from zeffir.core import parse_spec
    >>> li = solve_hund(parse_spec("Li"))
    >>> abs(li.energy - solve_open_shell(parse_spec("Li")).energy) < 1e-8
    True
    """
    from zeffir.core.energy import hund_energy_expression

    return solve_expression(hund_energy_expression(configuration), basis, progress, should_stop,
                            max_iterations, symbol="E")


def solve_expression(
    expression: EnergyExpression,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
    *,
    symbol: str = "E",
) -> HartreeFockResult:
    """Restricted Hartree–Fock for an energy given as a combination of radial integrals.

    Parameters
    ----------
    expression : EnergyExpression
        E = Σ_a w_a I(a) + Σ c^k_ab F^k(a, b) + Σ d^k_ab G^k(a, b) of a configuration
        (:mod:`zeffir.core.energy`); its subshells may leave lower ones of their l empty.
    basis, progress, should_stop, max_iterations
        As for :func:`solve_closed_shell`.
    symbol : str
        Name of the energy in progress messages.

    Returns
    -------
    HartreeFockResult
        ``coefficients[l]`` has a column per n = l+1 .. highest occupied n of l; a
        column of an empty subshell holds a virtual orbital. Each orbital energy is
        the diagonal element of its subshell's Fock operator.

    Raises
    ------
    HartreeFockError
        No convergence within ``max_iterations``.

    Notes
    -----
    One radial function per subshell a (occupancy w_a, density D_a = φ_a φ_aᵀ);
    F^k(a, b) = Σ D_a,pq D_b,rs R^k[pq|rs], G^k(a, b) = Σ φ_a,p φ_b,r φ_b,q φ_a,s R^k[pr|qs].
    The derivative of E defines one Fock operator per subshell (per electron),
    ∂E/∂φ_a = 2 w_a F_a φ_a. For the orbitals of one l, stationarity requires
    ⟨φ_j|w_i F_i - w_j F_j|φ_i⟩ = 0 and ⟨φ_v|F_i|φ_i⟩ = 0 (v virtual). As in
    :func:`solve_open_shell` (Roothaan 1960) these are the off-diagonal blocks of one
    Hermitian matrix R per l, in the basis of the current orbitals: R_ii = F_i,
    R_iv = F_i, R_vv = F of the highest occupied subshell of l, and
    R_ij = (w_i F_i - w_j F_j)/(w_i - w_j) for w_i ≠ w_j, F_i - F_j for equal open
    occupancies (the step then scales like a Newton step), ½(F_i + F_j) for two full
    subshells (their rotation leaves E unchanged). Subshell nl takes the eigenvector
    of R number n - l (in increasing order): an empty lower subshell of the same l
    (the 3s of Na [Ne] 4s1) is the virtual orbital below it, so the occupied orbital
    keeps its n - l - 1 radial nodes, the usual choice for excited configurations in
    numerical Hartree–Fock (Froese Fischer 1977). DIIS on the gradient
    Σ_i w_i (F_i D_i S - S D_i F_i)/(2(2l+1)); convergence criteria as for
    :func:`solve_closed_shell`. For closed shells, or one open subshell with the Hund
    expression, the result is that of the other solvers.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 32, 179 (1960); C. Froese Fischer, *The
    Hartree–Fock Method for Atoms* (Wiley, 1977); P. Pulay, Chem. Phys. Lett. 73, 393
    (1980).
    """
    from zeffir.core.models._hf_integrals import rk_tensor

    configuration = expression.configuration
    occ = {sub: float(w) for sub, w in configuration.occupations if w > 0}
    subs = list(occ)
    col = {sub: sub.n - sub.l - 1 for sub in subs}
    layout = {l: 1 + max(col[sub] for sub in subs if sub.l == l) for l in sorted({sub.l for sub in subs})}
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, zetas, overlap, core = setup.ls, setup.zetas, setup.overlap, setup.core
    interaction = setup.interaction
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)
    full = {sub: occ[sub] == 2 * (2 * sub.l + 1) for sub in subs}
    # The part every pair shares with closed shells goes through the closed-shell
    # Coulomb and exchange tensors at once; only the remainder (pairs of open subshells)
    # is contracted term by term.
    baseline = _spherical_pair_coefficients(occ)
    terms = []
    for key in set(expression.slater) | set(baseline):
        kind, k, a, b = key
        if a in occ and b in occ:
            delta = expression.slater.get(key, 0.0) - baseline.get(key, 0.0)
            if abs(delta) > 1e-12:
                terms.append((delta, kind, k, a, b))
    tensors: dict[tuple[str, int, int, int], FloatArray] = {}

    def tensor(kind: str, k: int, la: int, lb: int) -> FloatArray:
        """R^k arranged (p, q, r, s) with p, q of l_a and r, s of l_b, to contract with D_b."""
        key = (kind, k, la, lb)
        if key not in tensors:
            za, zb = zetas[la], zetas[lb]
            if kind == "F":
                tensors[key] = rk_tensor(k, la + 1, za, la + 1, za, lb + 1, zb, lb + 1, zb)
            else:  # R^k[p r | q s], p, s of l_a: moved to (p, s, r, q)
                t = rk_tensor(k, la + 1, za, lb + 1, zb, lb + 1, zb, la + 1, za)
                tensors[key] = t.transpose(0, 3, 1, 2)
        return tensors[key]

    def densities(c: dict[int, FloatArray]) -> dict[Subshell, FloatArray]:
        return {sub: np.outer(c[sub.l][:, col[sub]], c[sub.l][:, col[sub]]) for sub in subs}

    def fock_of(c: dict[int, FloatArray]) -> tuple[dict[Subshell, FloatArray], float]:
        dens = densities(c)
        weighted = {l: sum((occ[sub] * dens[sub] for sub in subs if sub.l == l), np.zeros_like(core[l]))
                    for l in ls}
        shared = {}
        for lam in ls:
            f = np.zeros_like(core[lam])
            for lp in ls:
                f += np.tensordot(interaction[lam, lp], weighted[lp], axes=([2, 3], [0, 1]))
            shared[lam] = f
        g = {sub: np.zeros_like(core[sub.l]) for sub in subs}
        energy = sum(occ[sub] * float(np.sum(dens[sub] * (core[sub.l] + 0.5 * shared[sub.l])))
                     for sub in subs)
        for coeff, kind, k, a, b in terms:
            on_a = np.tensordot(tensor(kind, k, a.l, b.l), dens[b], axes=([2, 3], [0, 1]))
            energy += coeff * float(np.sum(dens[a] * on_a))
            if a == b:
                g[a] += 2 * coeff * on_a
            else:
                g[a] += coeff * on_a
                g[b] += coeff * np.tensordot(tensor(kind, k, b.l, a.l), dens[a], axes=([2, 3], [0, 1]))
        return {sub: core[sub.l] + shared[sub.l] + g[sub] / occ[sub] for sub in subs}, energy

    def effective(c: dict[int, FloatArray], fock: dict[Subshell, FloatArray]) -> dict[int, FloatArray]:
        out = {}
        for l in ls:
            x = transform[l]
            mine = [sub for sub in subs if sub.l == l]
            f = {sub: x.T @ fock[sub] @ x for sub in mine}
            u = x.T @ overlap[l] @ c[l]
            p = {sub: np.outer(u[:, col[sub]], u[:, col[sub]]) for sub in mine}
            p_v = np.eye(x.shape[1]) - sum(p.values())
            r = p_v @ f[max(mine, key=lambda sub: sub.n)] @ p_v
            for i, a in enumerate(mine):
                r += p[a] @ f[a] @ p[a] + p[a] @ f[a] @ p_v + p_v @ f[a] @ p[a]
                for b in mine[i + 1:]:
                    if full[a] and full[b]:
                        block = 0.5 * (f[a] + f[b])
                    elif occ[a] != occ[b]:
                        block = (occ[a] * f[a] - occ[b] * f[b]) / (occ[a] - occ[b])
                    else:
                        block = f[a] - f[b]
                    r += p[a] @ block @ p[b] + p[b] @ block @ p[a]
            out[l] = 0.5 * (r + r.T)
        return out

    def diagonalise(matrices: dict[int, FloatArray]) -> dict[int, FloatArray]:
        return {l: transform[l] @ np.linalg.eigh(matrices[l])[1][:, : layout[l]] for l in ls}

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        fock, energy = fock_of(coefficients)
        dens = densities(coefficients)
        gradients = []
        for l in ls:
            g = sum((occ[sub] * fock[sub] @ dens[sub] for sub in subs if sub.l == l),
                    np.zeros_like(core[l])) @ overlap[l] / (2 * (2 * l + 1))
            gradients.append(_gradient(g, kept.get(l)).ravel())
        return energy, np.concatenate(gradients), (fock,)

    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept,
        diagonalise({l: transform[l].T @ core[l] @ transform[l] for l in ls}), evaluate,
        lambda c, last: effective(c, last[0]), diagonalise,
        progress, should_stop, max_iterations, symbol)
    (fock,) = payload
    dens = densities(coefficients)
    kinetic_energy = sum(occ[sub] * float(np.sum(dens[sub] * setup.kinetic[sub.l])) for sub in subs)
    _check_coefficients(configuration, coefficients, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {sub: float(np.sum(dens[sub] * fock[sub])) for sub in subs}
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, setup.dropped)


def _spherical_pair_coefficients(
        occupancy: dict[Subshell, float]) -> dict[tuple[str, int, Subshell, Subshell], float]:
    """Coefficients of ½ Σ_ab w_a w_b [F⁰(a, b) - ½ Σ_k (l_a k l_b; 0 0 0)² G^k(a, b)].

    G^k(a, a) stands for F^k(a, a).

    The interaction of every pair as if one of them were a closed shell: exact for
    closed–closed and closed–open pairs in both the average and the Hund expressions
    (a closed shell is spherical and has no net spin), and for a closed shell with
    itself (1s²: F⁰; p⁶: 15F⁰ - (6/5)F²). Keys as in
    :class:`zeffir.core.energy.EnergyExpression`.
    """
    square = _exchange_weight  # (l1 k l2; 0 0 0)²
    out: dict[tuple[str, int, Subshell, Subshell], float] = {}
    subs = sorted(occupancy, key=lambda s: (s.n, s.l))
    for i, a in enumerate(subs):
        wa = occupancy[a]
        out["F", 0, a, a] = 0.5 * wa * wa * (1.0 - 0.5 * square(a.l, 0, a.l))
        for k in range(2, 2 * a.l + 1, 2):
            out["F", k, a, a] = -0.25 * wa * wa * square(a.l, k, a.l)
        for b in subs[i + 1:]:
            wb = occupancy[b]
            out["F", 0, a, b] = wa * wb
            for k in range(abs(a.l - b.l), a.l + b.l + 1, 2):
                out["G", k, a, b] = -0.5 * wa * wb * square(a.l, k, b.l)
    return out


@dataclass(frozen=True)
class _Setup:
    """Basis-set matrices shared by the closed- and open-shell solvers."""

    ls: list[int]
    weight: dict[int, float]
    zetas: dict[int, FloatArray]
    overlap: dict[int, FloatArray]
    kinetic: dict[int, FloatArray]
    core: dict[int, FloatArray]
    #: ``{(λ, l'): J - K}``, Coulomb minus exchange, contracted with D^{l'} (see :func:`_setup`).
    interaction: dict[tuple[int, int], FloatArray]
    transform: dict[int, FloatArray]
    dropped: dict[int, int]
    #: ``{l: U_k U_kᵀ}``, the projector on the kept overlap eigenvectors, for the l with
    #: dropped combinations (the orbital gradient has no meaning outside their span).
    kept: dict[int, FloatArray]
    #: ``transform`` and ``kept`` with :data:`START_LINEAR_DEPENDENCE`, for the first iterations.
    start_transform: dict[int, FloatArray]
    start_kept: dict[int, FloatArray]


def _setup(configuration: Configuration, basis: EvenTemperedBasis, layout: dict[int, int]) -> _Setup:
    """One-electron matrices, Coulomb-minus-exchange tensors and the orthogonalisation of each l."""
    from zeffir.core.models._hf_integrals import (
        kinetic_matrix,
        nuclear_matrix,
        overlap_matrix,
        rk_tensor,
    )

    ls = sorted(layout)
    Z = configuration.Z
    weight = {l: 2.0 * (2 * l + 1) for l in ls}
    zetas = {l: basis.zetas(l) for l in ls}
    overlap = {l: overlap_matrix(l + 1, zetas[l]) for l in ls}
    kinetic = {l: kinetic_matrix(l + 1, l, zetas[l]) for l in ls}
    nuclear = {l: nuclear_matrix(l + 1, zetas[l], Z) for l in ls}
    core = {l: kinetic[l] + nuclear[l] for l in ls}
    # Coulomb J[λ, l'][p, q, r, s] = R⁰[pq|rs]; exchange K[λ, l'][p, q, r, s] = Σ_k c R^k[pr|sq]
    # arranged so that K contracts with D^{l'}_rs like J does. The solvers only need J - K.
    interaction: dict[tuple[int, int], FloatArray] = {}
    for lam in ls:
        for lp in ls:
            if (lp, lam) in interaction:
                # (J - K)[l', λ] is (J - K)[λ, l'] with the electrons swapped: R^k[pq|rs] =
                # R^k[rs|pq], and the 3j weights are symmetric.
                interaction[lam, lp] = interaction[lp, lam].transpose(2, 3, 0, 1)
                continue
            za, zb = zetas[lam], zetas[lp]
            j_minus_k = rk_tensor(0, lam + 1, za, lam + 1, za, lp + 1, zb, lp + 1, zb)
            for k in range(abs(lam - lp), lam + lp + 1, 2):
                # R^k[p r | s q]: p, r on electron 1 (λ, l'), s, q on electron 2 (l', λ).
                tensor = rk_tensor(k, lam + 1, za, lp + 1, zb, lp + 1, zb, lam + 1, za)
                j_minus_k -= 0.5 * _exchange_weight(lam, k, lp) * tensor.transpose(0, 3, 1, 2)
            interaction[lam, lp] = j_minus_k
    transform: dict[int, FloatArray] = {}
    dropped: dict[int, int] = {}
    kept: dict[int, FloatArray] = {}
    start_transform: dict[int, FloatArray] = {}
    start_kept: dict[int, FloatArray] = {}
    for l in ls:
        values, vectors = np.linalg.eigh(overlap[l])
        keep = values > LINEAR_DEPENDENCE * values[-1]
        if int(np.count_nonzero(keep)) < layout[l]:
            raise ModelError(f"{configuration.spec}: the l = {l} basis spans fewer functions "
                             "than occupied orbitals")
        transform[l] = vectors[:, keep] / np.sqrt(values[keep])
        dropped[l] = int(np.count_nonzero(~keep))
        if dropped[l]:
            kept[l] = vectors[:, keep] @ vectors[:, keep].T
        start = values > max(START_LINEAR_DEPENDENCE, LINEAR_DEPENDENCE) * values[-1]
        if int(np.count_nonzero(start)) < layout[l] or (max(ls) < 2 and configuration.charge >= 0):
            # Without d electrons the plain iteration converges (He–Ar, K, Ca tested);
            # anions start reduced too (Na⁻ diverged from the bare-nucleus start).
            start = keep
        start_transform[l] = vectors[:, start] / np.sqrt(values[start])
        if np.count_nonzero(~start):
            start_kept[l] = vectors[:, start] @ vectors[:, start].T
    return _Setup(ls, weight, zetas, overlap, kinetic, core, interaction, transform, dropped, kept,
                  start_transform, start_kept)


#: What one solver's iteration hands back to itself (densities, Fock matrices, ...).
_Iterate = tuple[Any, ...]


def _run_scf(
    configuration: Configuration,
    setup: _Setup,
    transform: dict[int, FloatArray],
    kept: dict[int, FloatArray],
    coefficients: dict[int, FloatArray],
    evaluate: Callable[[dict[int, FloatArray]], tuple[float, FloatArray, _Iterate]],
    matrices_of: Callable[[dict[int, FloatArray], _Iterate], dict[int, FloatArray]],
    diagonalise: Callable[[dict[int, FloatArray]], dict[int, FloatArray]],
    progress: Callable[[SCFState], None] | None,
    should_stop: Callable[[], bool] | None,
    max_iterations: int,
    symbol: str,
) -> tuple[dict[int, FloatArray], _Iterate, SCFState]:
    """The self-consistent-field iteration every solver shares.

    Parameters
    ----------
    configuration, setup
        What is solved, and its basis-set matrices.
    transform, kept : dict
        The orthogonalisation in use and the projectors on the kept span; the closures
        of ``matrices_of`` and ``diagonalise`` read them, and the switch from the
        reduced starting basis to the full one replaces them in place.
    coefficients : dict
        The starting orbitals.
    evaluate : callable
        Orbitals → (energy, orbital gradient, what the solver needs of this iteration).
    matrices_of : callable
        (orbitals, that iteration's data) → the matrices DIIS extrapolates and
        ``diagonalise`` turns into the next orbitals (the Fock matrices, or Roothaan's
        coupling operators).
    progress, should_stop, max_iterations, symbol
        As for the solvers; ``symbol`` names the energy in progress messages.

    Returns
    -------
    coefficients, data, state
        The orbitals of the last iteration, what ``evaluate`` returned for them, and
        the final :class:`SCFState`.

    Notes
    -----
    While the reduced starting basis is in use (:data:`START_LINEAR_DEPENDENCE`), the
    first iteration whose gradient is below :data:`START_RESIDUAL` switches to the full
    basis and starts a fresh DIIS history with that iteration's matrices. (This also
    restarts DIIS where both bases drop the same near-null combinations, which keeps
    the Rydberg configurations He 1s1 5s1 and Na [Ne] 6s1 converging.) Convergence
    is :class:`_Convergence`; running out of iterations raises with the last residual.
    """
    starting = bool(setup.start_kept)
    history: list[tuple[dict[int, FloatArray], FloatArray]] = []
    energy_before = math.inf
    state: SCFState | None = None
    convergence = _Convergence()
    for iteration in range(1, max_iterations + 1):
        _stop_if_asked(configuration, should_stop, state)
        energy, error, data = evaluate(coefficients)
        state = _record_iteration(configuration, iteration, energy, energy_before, error, progress, symbol)
        change, energy_before = energy - energy_before, energy
        if starting and state.residual < START_RESIDUAL:
            _switch_to_full_basis(setup, transform, kept, history)
            starting = False
        elif convergence.done(state.residual, change, energy):
            return coefficients, data, state
        history.append((matrices_of(coefficients, data), error))
        del history[:-DIIS_SIZE]
        coefficients = diagonalise(_diis(history, setup.ls))
    raise _no_convergence(configuration, max_iterations, state)


def _switch_to_full_basis(setup: _Setup, transform: dict[int, FloatArray], kept: dict[int, FloatArray],
                          history: list[tuple[dict[int, FloatArray], FloatArray]]) -> None:
    """Replace the starting basis by the full one, in place, and forget the DIIS history."""
    transform.clear()
    transform.update(setup.transform)
    kept.clear()
    kept.update(setup.kept)
    history.clear()


def _gradient(g: FloatArray, kept: FloatArray | None) -> FloatArray:
    """The orbital gradient g - gᵀ (g = F D S), within the span of the kept basis combinations.

    With dropped combinations the orbitals cannot move along them, so their part of the
    gradient never vanishes; Π (g - gᵀ) Π (Π the projector on the kept overlap
    eigenvectors) is X⁺ᵀ (X⁺ g X) X⁺ in the non-orthogonal representation, without the
    1/s amplification of rounding that the orthonormal form X^T g X would bring.
    """
    a = g - g.T
    return a if kept is None else kept @ a @ kept


def _check_trustworthy(configuration: Configuration, coefficients: dict[int, FloatArray],
                       density: dict[int, FloatArray], core: dict[int, FloatArray],
                       weight: dict[int, float], state: SCFState) -> None:
    """Refuse a solution that rounding, not physics, may have shaped."""
    _check_coefficients(configuration, coefficients, state)
    # For closed shells the electron repulsion energy J - K/2 summed over pairs is positive.
    one_electron = sum(weight[l] * float(np.sum(density[l] * core[l])) for l in density)
    if not state.energy - one_electron > 0:
        raise HartreeFockError(f"{configuration.spec}: negative electron repulsion energy "
                               f"({state.energy - one_electron:.3g} Eh); the integrals lost precision", state)


def _check_coefficients(configuration: Configuration, coefficients: dict[int, FloatArray],
                        state: SCFState) -> None:
    """Refuse orbitals whose coefficients cancel so much that rounding dominates.

    ``coefficients[l]`` columns are the subshells n = l+1, l+2, ... (an empty subshell's
    column, a virtual orbital, is not checked).
    """
    occupied = {(s.n, s.l) for s, w in configuration.occupations if w > 0}
    for l, c in coefficients.items():
        for column in range(c.shape[1]):
            lobes = column + 1
            if (l + lobes, l) not in occupied:
                continue
            total, limit = float(np.sum(np.abs(c[:, column]))), MAX_COEFFICIENT_SUM * lobes**2
            if total > limit:
                raise HartreeFockError(
                    f"{configuration.spec}: an occupied l = {l} orbital cancels coefficients up to "
                    f"Σ|C| = {total:.3g} (limit {limit:g}); the basis is "
                    "numerically linearly dependent for it and the energy would be dominated by "
                    f"rounding{_anion_hint(configuration)}", state)


def _check_virial(configuration: Configuration, kinetic: float, energy: float, state: SCFState) -> None:
    """Refuse a solution that breaks the virial theorem (see :data:`VIRIAL_TOLERANCE`)."""
    deviation = -(energy - kinetic) / kinetic - 2.0
    if not abs(deviation) <= VIRIAL_TOLERANCE:
        raise HartreeFockError(
            f"{configuration.spec}: the basis cannot represent the orbitals of this configuration "
            f"(virial ratio -V/T - 2 = {deviation:.1e}, limit {VIRIAL_TOLERANCE:g}); the energy "
            f"would be too high{_anion_hint(configuration)}", state)


def _positive_at_the_nucleus(coefficients: dict[int, FloatArray],
                             zetas: dict[int, FloatArray]) -> dict[int, FloatArray]:
    """The phase convention: every orbital (column) positive near the nucleus."""
    signed = {}
    for l, c in coefficients.items():
        values = np.array([_radial_values(l, zetas[l], c[:, i], 0.0) for i in range(c.shape[1])])
        signed[l] = c * np.where(values < 0, -1.0, 1.0)
    return signed


def _radial_values(l: int, zetas: FloatArray, coefficients: FloatArray, r: float) -> float:
    radial = SlaterExpansionRadial(l + 1, l, l + 1, zetas, coefficients)
    return float(radial.over_r_l(np.array([r]))[0])


def _diis(history: list[tuple[dict[int, FloatArray], FloatArray]], ls: list[int]) -> dict[int, FloatArray]:
    """Pulay's extrapolation: the Fock matrices combined to minimise the combined gradient."""
    size = len(history)
    if size < 2:
        return history[-1][0]
    b = np.zeros((size + 1, size + 1))
    for i in range(size):
        for j in range(i + 1):
            b[i, j] = b[j, i] = float(np.dot(history[i][1], history[j][1]))
    b[size, :size] = b[:size, size] = -1.0
    rhs = np.zeros(size + 1)
    rhs[size] = -1.0
    # Scale to keep the system well conditioned as the gradients shrink.
    scale = float(np.max(np.abs(np.diag(b)[:size])))
    if scale > 0:
        b[:size, :size] /= scale
    try:
        weights = np.linalg.solve(b, rhs)[:size]
    except np.linalg.LinAlgError:
        return history[-1][0]
    if not np.all(np.isfinite(weights)):
        return history[-1][0]
    return {l: sum(w * fock[l] for w, (fock, _) in zip(weights, history, strict=True)) for l in ls}


@dataclass(frozen=True)
class HartreeFockModel:
    """Restricted Hartree–Fock orbitals of atoms and ions (Roothaan method).

    Attributes
    ----------
    name, title, reference : str
    average : bool
        Minimise the average energy of the configuration (the ``hartree-fock-average``
        model) instead of the energy of its Hund term (``hartree-fock``).

    Notes
    -----
    For the Hund term, :func:`solve`: :func:`solve_closed_shell` for closed shells,
    :func:`solve_open_shell` for closed shells plus one open s, p, d or f subshell, and
    :func:`solve_hund` for several open subshells (Cr 3d5 4s1 ⁷S, Gd 4f7 5d1 6s2 ⁹D) or
    excited configurations with an empty lower subshell (Na [Ne] 4s1); with ``average``,
    :func:`solve_average` for every configuration; all in the :func:`default_basis`. Each
    orbital is a :class:`SlaterExpansionRadial`; its energy is the diagonal element of
    its subshell's Fock operator (the canonical orbital energy ε for closed shells,
    hartree) and the set's total energy the Hartree–Fock energy. ζ and Z_eff are
    effective values from ⟨1/r⟩ (a hydrogenic orbital of charge Z_eff has
    ⟨1/r⟩ = Z_eff/n²): Z_eff = n²⟨1/r⟩, ζ = Z_eff/n; n* is not defined (None).

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); 32, 179 (1960); C. C. J. Roothaan
    and P. S. Bagus, Methods Comput. Phys. 2, 47 (1963); E. Clementi and
    C. Roetti, At. Data Nucl. Data Tables 14, 177 (1974); T. Koga et al., Int. J. Quantum
    Chem. 71, 491 (1999) (the energies it reproduces); J. C. Slater, *Quantum Theory of
    Atomic Structure* (1960), vol. II (average of configuration).
    """

    name: str = "hartree-fock"
    title: str = "restricted Hartree–Fock"
    reference: str = "Roothaan 1951, 1960 (method); Koga et al. 1999 (energies)"
    average: bool = False

    def build(self, configuration: Configuration) -> OrbitalSet:
        """Solve the Roothaan equations for ``configuration`` and return its orbitals."""
        result = solve(configuration, average=self.average)
        orbitals = []
        for sub, occ in configuration.occupations:
            if occ == 0:
                continue
            radial = SlaterExpansionRadial(sub.n, sub.l, sub.l + 1, result.basis.zetas(sub.l),
                                           result.coefficients[sub.l][:, sub.n - sub.l - 1])
            z_eff = sub.n**2 * radial.expectation(-1)
            orbitals.append(SubshellOrbital(
                sub, occ, radial, z_eff / sub.n, z_eff, None, result.orbital_energies[sub],
                (f"{sub.label}: ζ and Z_eff are effective values from <1/r> (Z_eff = n²<1/r>)",)))
        sizes = ", ".join(f"{count} {'spdfghik'[l]}"
                          for l, (_, _, count) in sorted(result.basis.sets.items()))
        open_subshells = [s for s, w in configuration.occupations if 0 < w < 2 * (2 * s.l + 1)]
        if self.average:
            kind = "average energy of the configuration"
        elif not open_subshells:
            kind = "closed shells, ¹S"
        else:
            kind = f"energy of the Hund term {_hund_term_label(configuration)}, one determinant"
        notes = [f"restricted Hartree–Fock ({kind}), even-tempered Slater-type basis "
                 f"({sizes}); virial ratio -V/T = {result.virial_ratio:.9f}"]
        if _lower_subshells_empty(configuration):
            notes.append("excited configuration: each orbital keeps n - l - 1 radial nodes, the empty "
                         "lower subshells of its l being virtual orbitals below it")
        return OrbitalSet(configuration, self.name, tuple(orbitals), total_energy=result.energy,
                          notes=tuple(notes), virial_ratio=result.virial_ratio)


def _hund_term_label(configuration: Configuration) -> str:
    """The term of the Hund determinant (highest M_S, then M_L), e.g. '7S' for Cr 3d5 4s1."""
    from zeffir.core.pairs import hund_determinant
    from zeffir.core.terms import term_label

    spin_orbitals = tuple(hund_determinant(configuration))
    two_s = sum(p.spin for p in spin_orbitals)
    return term_label(two_s / 2, sum(p.m for p in spin_orbitals))

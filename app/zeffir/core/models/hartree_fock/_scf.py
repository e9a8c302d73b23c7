"""The self-consistent-field iteration every solver shares: DIIS, convergence, progress.

Each solver supplies its energy, orbital gradient and the matrices to diagonalise;
:func:`_run_scf` iterates, extrapolates by Pulay's DIIS (Chem. Phys. Lett. 73, 393
(1980)) and decides when the run has converged.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from typing import Any

import numpy as np

from zeffir.core._cancel import report_progress as ambient_report
from zeffir.core._cancel import should_stop as ambient_should_stop
from zeffir.core.config import Configuration
from zeffir.core.models.hartree_fock._checks import _anion_hint, _rydberg_hint
from zeffir.core.models.hartree_fock._matrices import _Setup
from zeffir.core.models.hartree_fock._result import HartreeFockCancelled, HartreeFockError, SCFState
from zeffir.core.orbitals import FloatArray

__all__ = [
    "COMMUTATOR_TOLERANCE",
    "DIIS_SIZE",
    "ENERGY_NOISE",
    "ENERGY_TOLERANCE",
    "FLOOR_ENERGY_NOISE",
    "FLOOR_ITERATIONS",
    "FLOOR_RESIDUAL",
    "MAX_ITERATIONS",
    "START_RESIDUAL",
]

#: Converged when the largest element of the orbital gradient (:func:`_gradient`, in the
#: normalised basis) is below this (hartree)...
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
#: The reduced starting basis (``START_LINEAR_DEPENDENCE`` in ``_matrices``) gives way to
#: the full one at the first iteration whose gradient is below this.
START_RESIDUAL = 1e-2
#: Default iteration limit of the solvers.
MAX_ITERATIONS = 200
#: Number of previous Fock matrices DIIS extrapolates from.
DIIS_SIZE = 8

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
    While the reduced starting basis is in use (``_matrices.START_LINEAR_DEPENDENCE``), the
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


def _diis(history: list[tuple[dict[int, FloatArray], FloatArray]], ls: list[int]) -> dict[int, FloatArray]:
    """Pulay's extrapolation: the Fock matrices combined to minimise the combined gradient.

    The weights c_i minimise |Σ_i c_i e_i|² subject to Σ_i c_i = 1 (e_i the gradient of
    iteration i): the linear system B c = -λ·1 with B_ij = e_i·e_j, bordered by the
    constraint (P. Pulay, Chem. Phys. Lett. 73, 393 (1980)). With fewer than two
    iterations, or a singular system, the last matrices are used as they are.
    """
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


def _no_convergence(configuration: Configuration, max_iterations: int,
                    state: SCFState | None) -> HartreeFockError:
    """The error for a run that ran out of iterations, with the last residual."""
    hint = _anion_hint(configuration) or _rydberg_hint(configuration)
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

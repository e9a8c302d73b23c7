"""What the Hartree–Fock solvers return: the iteration state, the result, the errors.

Also the phase convention of the returned orbitals (positive at the nucleus).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from zeffir.core._errors import ComputationCancelled, ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis
from zeffir.core.orbitals import FloatArray, SlaterExpansionRadial

__all__ = ["HartreeFockCancelled", "HartreeFockError", "HartreeFockResult", "SCFState"]


@dataclass(frozen=True, slots=True)
class SCFState:
    """Where a self-consistent run stands (what ``progress`` receives after each iteration).

    Attributes
    ----------
    iteration : int
    energy : float
        Total energy (hartree) of the orbitals that built the current Fock matrices.
    residual : float
        Largest element of the orbital gradient, F D S - S D F summed over the orbital
        classes of each l with their occupation weights, in the normalised basis and
        projected on the basis combinations kept (see ``_scf._gradient``).
    energy_change : float
        Energy change from the previous iteration (hartree).

    References
    ----------
    P. Pulay, Chem. Phys. Lett. 73, 393 (1980) (the gradient F D S - S D F as the
    error vector of the DIIS extrapolation).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.models.hartree_fock import solve_closed_shell
    >>> states = []
    >>> result = solve_closed_shell(parse_spec("Be"), progress=states.append)
    >>> [s.iteration for s in states] == list(range(1, result.state.iteration + 1))
    True
    >>> states[-1] == result.state and result.state.residual < 1e-9
    True
    """

    iteration: int
    energy: float
    residual: float
    energy_change: float


class HartreeFockError(ModelError):
    """A Hartree–Fock run that gave no trustworthy solution; ``state`` holds the last iteration.

    Raised when the iteration runs out of iterations or diverges, and when a converged
    solution is refused: it breaks the virial theorem beyond ``VIRIAL_TOLERANCE``, or
    an occupied orbital's coefficients cancel beyond ``MAX_COEFFICIENT_SUM`` (the
    checks of ``_checks``). The message names the reason (and, for anions, the likely
    physical one: an extra electron not bound at this level of theory).

    Examples
    --------
    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.models.hartree_fock import solve_closed_shell
    >>> try:
    ...     solve_closed_shell(parse_spec("Ne"), max_iterations=3)
    ... except HartreeFockError as error:
    ...     print(error.state.iteration, "no self-consistency" in str(error))
    3 True
    """

    def __init__(self, message: str, state: SCFState | None) -> None:
        super().__init__(message)
        self.state = state


class HartreeFockCancelled(HartreeFockError, ComputationCancelled):
    """``should_stop`` (or the worker running the solver) asked the run to stop.

    ``state`` holds the last completed iteration, None when none had run.
    """


@dataclass(frozen=True)
class HartreeFockResult:
    """A converged restricted Hartree–Fock solution, from any of the solvers.

    Attributes
    ----------
    configuration : Configuration
    basis : EvenTemperedBasis
    coefficients : dict
        ``{l: C}``: column k of C is the orbital of subshell n = l + 1 + k over the
        normalised basis functions of l, up to the highest occupied n of l; a column
        whose subshell is empty (an excited configuration, from
        :func:`~zeffir.core.models.hartree_fock.solve_expression`) holds a virtual
        orbital. Every orbital is positive near the nucleus.
    orbital_energies : dict
        ``{Subshell: ε}`` (hartree) of the occupied subshells: the canonical orbital
        energy for closed shells, otherwise the diagonal element ⟨φ|F|φ⟩ of the
        subshell's own Fock operator (per electron).
    kinetic, potential : float
        T and V (hartree).
    state : SCFState
        The final iteration.
    dropped : dict
        ``{l: number}`` of basis combinations dropped as linearly dependent.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951) (orbitals as coefficient vectors);
    J. C. Slater, *Quantum Theory of Atomic Structure* (McGraw-Hill, 1960), vol. I, §6
    (the virial theorem -V/T = 2, which the exact Hartree–Fock solution satisfies).

    Examples
    --------
    The occupied orbitals of each l are orthonormal, and -V/T = 2 to the basis error:

    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.models._slater_integrals import overlap_matrix
    >>> from zeffir.core.models.hartree_fock import solve
    >>> be = solve(parse_spec("Be"))
    >>> c, s = be.coefficients[0], overlap_matrix(1, be.basis.zetas(0))
    >>> bool(np.allclose(c.T @ s @ c, np.eye(2), rtol=0, atol=1e-12))
    True
    >>> bool(abs(be.virial_ratio - 2.0) < 1e-6) and be.energy == be.kinetic + be.potential
    True
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

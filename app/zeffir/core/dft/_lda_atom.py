"""Self-consistent Kohn–Sham LDA for a spherical atom or ion (spin-unpolarised, non-relativistic).

Each occupied subshell nl holds its electrons in one radial orbital; the density is
spherically averaged, ρ(r) = Σ f_nl u_nl(r)²/(4πr²), with the configuration's
occupations (fractional per m, as NIST's atomic reference data take them). The
potential is −Z/r + V_H + v_xc with the Hartree potential from radial Poisson
integration and v_xc of :func:`~zeffir.core.dft._xc.lda_xc`; the input potential of
each iteration is extrapolated from the previous ones (Pulay's DIIS on the residual
V_out − V_in). The total energy is

E = Σ f ε − ½∫V_H q dr − ∫v_xc q dr + ∫ε_xc q dr,    q = Σ f u²,

with its kinetic, electron–nucleus, Hartree and exchange–correlation parts.

References
----------
W. Kohn and L. J. Sham, Phys. Rev. 140, A1133 (1965); S. Kotochigova, Z. H. Levine,
E. L. Shirley, M. D. Stiles and C. W. Clark, Phys. Rev. A 55, 191 (1997) (the
reference procedure); P. Pulay, Chem. Phys. Lett. 73, 393 (1980).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from zeffir.core._cancel import report_progress, should_stop
from zeffir.core._errors import ComputationCancelled, ModelError
from zeffir.core.config import Configuration
from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.dft._radial_solver import RadialSolution, solve_radial
from zeffir.core.dft._xc import lda_xc
from zeffir.core.orbitals import FloatArray

__all__ = ["LDA_TOLERANCE", "LDAError", "LDAResult", "solve_lda"]

#: Converged when the largest r·|V_out − V_in| (hartree·bohr) is below this.
LDA_TOLERANCE = 1e-9
_HISTORY = 6
_MIX = 0.35
_MAX_ITERATIONS = 300


class LDAError(ModelError):
    """The self-consistent LDA iteration did not settle, or an electron is not bound."""


@dataclass(frozen=True)
class LDAResult:
    """A converged LDA atom: orbitals, eigenvalues and energies (hartree, bohr)."""

    configuration: Configuration
    grid: LogGrid
    orbitals: tuple[RadialSolution, ...]
    occupations: tuple[float, ...]
    total_energy: float
    kinetic: float
    nuclear: float
    hartree: float
    xc: float
    iterations: int


def _hartree(grid: LogGrid, q: FloatArray) -> FloatArray:
    """V_H(r) = Q(r)/r + ∫_r^∞ q/r' dr' for the radial charge q = 4πr²ρ."""
    inner = grid.cumulative(q)
    outer_total = grid.integrate(q / grid.r)
    outer = outer_total - grid.cumulative(q / grid.r)
    return inner / grid.r + outer


def solve_lda(configuration: Configuration, grid: LogGrid | None = None,
              tolerance: float = LDA_TOLERANCE) -> LDAResult:
    """The self-consistent spin-unpolarised LDA solution of ``configuration``.

    Examples
    --------
    Neon, against NIST's LDA total energy −128.233481 hartree (Kotochigova et al. 1997):

    >>> from zeffir.core import parse_spec
    >>> result = solve_lda(parse_spec("Ne"))
    >>> bool(abs(result.total_energy + 128.233481) < 2e-6)
    True
    """
    z = float(configuration.Z)
    grid = grid or LogGrid.for_charge(z)
    r = grid.r
    shells = [(sub.n, sub.l, float(occ)) for sub, occ in configuration.occupations if occ > 0]
    occupations = tuple(f for _, _, f in shells)
    # Start: the potential of the Slater's-rules density (screened hydrogen-like
    # orbitals), which binds every occupied subshell.
    v_in = _start_potential(configuration, grid)
    history: list[tuple[FloatArray, FloatArray]] = []
    guesses: list[float | None] = [None] * len(shells)
    solutions: list[RadialSolution] = []
    for iteration in range(1, _MAX_ITERATIONS + 1):
        if should_stop():
            raise ComputationCancelled(f"{configuration.spec}: LDA cancelled at iteration {iteration}")
        solutions = [solve_radial(grid, v_in, n, l, z, guesses[k]) for k, (n, l, _f) in enumerate(shells)]
        guesses = [s.energy for s in solutions]
        q = sum((f * s.u * s.u for (_n, _l, f), s in zip(shells, solutions, strict=True)),
                np.zeros_like(r))
        rho = q / (4.0 * math.pi * r * r)
        eps_xc, v_xc = lda_xc(rho)
        v_h = _hartree(grid, q)
        v_out = -z / r + v_h + v_xc
        residual = r * (v_out - v_in)
        error = float(np.max(np.abs(residual)))
        report_progress(f"{configuration.spec} LDA iteration {iteration}: potential residual {error:.2e}")
        if error < tolerance:
            unbound = [f"{n}{'spdfghik'[l]}" for (n, l, _f), s in zip(shells, solutions, strict=True)
                       if not s.energy < 0.0]
            if unbound:
                raise LDAError(
                    f"{configuration.spec}: the {', '.join(unbound)} electron is not bound in LDA "
                    f"(its Kohn–Sham eigenvalue is not negative; the local density approximation's "
                    f"self-interaction leaves anions such as H⁻ unbound)")
            eigen = sum(f * s.energy for (_n, _l, f), s in zip(shells, solutions, strict=True))
            hartree = 0.5 * grid.integrate(v_h * q)
            xc = grid.integrate(eps_xc * q)
            nuclear = -z * grid.integrate(q / r)
            kinetic = eigen - grid.integrate(v_in * q)
            total = kinetic + nuclear + hartree + xc
            return LDAResult(configuration, grid, tuple(solutions), occupations, float(total),
                             float(kinetic), float(nuclear), float(hartree), float(xc), iteration)
        history.append((v_in, residual))
        del history[:-_HISTORY]
        v_in = _extrapolate(history, r)
    raise LDAError(f"{configuration.spec}: the LDA iteration did not settle in {_MAX_ITERATIONS} "
                   f"iterations")


def _start_potential(configuration: Configuration, grid: LogGrid) -> FloatArray:
    from zeffir.core.models import get_model

    r = grid.r
    start = get_model("slater").build(configuration)
    q = sum((o.occupancy * (r * o.radial(r)) ** 2 for o in start.orbitals), np.zeros_like(r))
    rho = q / (4.0 * math.pi * r * r)
    _eps, v_xc = lda_xc(rho)
    return np.asarray(-configuration.Z / r + _hartree(grid, q) + v_xc, dtype=float)


def _extrapolate(history: list[tuple[FloatArray, FloatArray]], r: FloatArray) -> FloatArray:
    """Pulay's DIIS on the potential: the combination of past inputs with the least residual."""
    size = len(history)
    matrix = np.empty((size + 1, size + 1))
    matrix[-1, :] = matrix[:, -1] = -1.0
    matrix[-1, -1] = 0.0
    for i in range(size):
        for j in range(i, size):
            matrix[i, j] = matrix[j, i] = float(np.dot(history[i][1], history[j][1]))
    rhs = np.zeros(size + 1)
    rhs[-1] = -1.0
    try:
        weights = np.linalg.solve(matrix, rhs)[:size]
    except np.linalg.LinAlgError:
        weights = np.zeros(size)
        weights[-1] = 1.0
    v = sum(w * (vin + _MIX * res / r) for w, (vin, res) in zip(weights, history, strict=True))
    return np.asarray(v, dtype=float)

"""Bound states of the relativistic radial equations in a spherical potential, on a log grid.

Two equations, both for a large component P and a small component Q (hartree units,
c the speed of light, ε the energy without the rest mass):

* **Dirac** (spin–orbit included; κ = −(l+1) for j = l + ½, κ = l for j = l − ½):
  P' = −κP/r + (ε − V + 2c²)Q/c,   Q' = κQ/r − (ε − V)P/c.
* **Scalar-relativistic** (Koelling and Harmon's j-average of Dirac's equation: mass–
  velocity and Darwin terms, no spin–orbit), with M = 1 + (ε − V)/2c²:
  P' = P/r + 2McQ,   Q' = −Q/r + [l(l+1)/(2Mr²) + V − ε]P/c.

In x = ln r each is dy/dx = A(x)y, integrated by the Adams–Moulton formula of
``_two_component_kernels``: outward from the nucleus, where P ∝ r^γ with
γ = √(κ² − (Z/c)²) (Dirac) or √(l(l+1) + 1 − (Z/c)²) (scalar-relativistic), to the
classical turning point, and inward from where the state has decayed. The number of
nodes of P brackets the eigenvalue (n − l − 1 of them); the jump of Q where the two
parts meet gives the energy correction δε = cP(r_m)[Q_out − Q_in]/∫(P² + Q²)dr, the
relativistic form of Hartree's correction (from the Wronskian of two solutions).

References
----------
W. R. Johnson, *Atomic Structure Theory* (Springer, 2007), §2.2–2.4; D. D. Koelling
and B. N. Harmon, J. Phys. C 10, 3107 (1977); I. P. Grant, *Relativistic Quantum
Theory of Atoms and Molecules* (Springer, 2007), ch. 3 (the Dirac radial equations).
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass
from functools import cache
from typing import Any

import numpy as np

from zeffir.core._acceleration import compiled_solvers_enabled
from zeffir.core.dft import _two_component_kernels
from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.dft._radial_solver import DECAY, MAX_STEPS, RadialEigenError
from zeffir.core.orbitals import FloatArray

__all__ = ["SPEED_OF_LIGHT", "RelativisticSolution", "kappa_of", "solve_dirac",
           "solve_scalar_relativistic"]

#: c in hartree atomic units as NIST's atomic reference data use it: 1/α with the
#: 1986 CODATA fine-structure constant (Kotochigova et al., Phys. Rev. A 55, 191 (1997)).
SPEED_OF_LIGHT = 137.0359895

_Coefficients = tuple[FloatArray, FloatArray, FloatArray, FloatArray]


@dataclass(frozen=True)
class RelativisticSolution:
    """One bound state: energy (hartree, rest mass excluded) and P, Q on the grid.

    P and Q are normalised together, ∫(P² + Q²)dr = 1, with P > 0 near the nucleus;
    ``kappa`` is Dirac's κ, or None for a scalar-relativistic state.
    """

    n: int
    l: int
    kappa: int | None
    energy: float
    p: FloatArray
    q: FloatArray
    steps: int

    @property
    def density(self) -> FloatArray:
        """P² + Q², the radial probability density per bohr."""
        return self.p * self.p + self.q * self.q


def kappa_of(l: int, j: float) -> int:
    """Dirac's κ of (l, j): −(l + 1) for j = l + ½, l for j = l − ½.

    Examples
    --------
    >>> kappa_of(0, 0.5), kappa_of(1, 0.5), kappa_of(1, 1.5), kappa_of(3, 2.5)
    (-1, 1, -2, 3)
    """
    if math.isclose(j, l + 0.5):
        return -(l + 1)
    if l > 0 and math.isclose(j, l - 0.5):
        return l
    raise RadialEigenError(f"l = {l}, j = {j}: j must be l ± 1/2 (and positive)")


@cache
def _compiled() -> Any:
    try:
        from zeffir.core.dft import _two_component_compiled
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None
    return _two_component_compiled


def _kernels() -> Any:
    compiled = _compiled() if compiled_solvers_enabled() else None
    return compiled or _two_component_kernels


def solve_dirac(grid: LogGrid, potential: FloatArray, n: int, kappa: int, z: float,
                c: float = SPEED_OF_LIGHT, guess: float | None = None,
                tolerance: float = 1e-13) -> RelativisticSolution:
    """The bound Dirac state (n, κ) of ``potential`` (hartree, V ≈ −z/r at the nucleus).

    Examples
    --------
    The 1s of hydrogen-like uranium against the exact Dirac–Coulomb energy
    c²[(1 − (Z/c)²)^{1/2} − 1] (Bethe and Salpeter 1957, eq. 14.29):

    >>> grid = LogGrid.for_charge(92.0)
    >>> state = solve_dirac(grid, -92.0 / grid.r, 1, -1, 92.0)
    >>> exact = SPEED_OF_LIGHT**2 * (math.sqrt(1 - (92 / SPEED_OF_LIGHT) ** 2) - 1)
    >>> bool(abs(state.energy - exact) < 1e-8 * abs(exact))
    True
    """
    l = kappa if kappa > 0 else -kappa - 1
    if kappa == 0 or not 0 <= l < n:
        raise RadialEigenError(f"n = {n}, κ = {kappa}: need κ ≠ 0 and l < n")
    if not z > 0:
        raise RadialEigenError("a Dirac state needs a nuclear charge z > 0")
    r = grid.r
    v = np.asarray(potential, dtype=float)
    gamma = math.sqrt(kappa * kappa - (z / c) ** 2)
    ratio = c * (gamma + kappa) / z

    def coefficients(energy: float) -> _Coefficients:
        return (np.full(r.size, -float(kappa)), r * (energy - v + 2.0 * c * c) / c,
                -r * (energy - v) / c, np.full(r.size, float(kappa)))

    def start_out(p: FloatArray, q: FloatArray) -> None:
        p[:4] = r[:4] ** gamma
        q[:4] = ratio * p[:4]

    def start_in(p: FloatArray, q: FloatArray, end: int, decay: float, energy: float) -> None:
        sl = slice(end - 3, end + 1)
        p[sl] = 1e-30 * np.exp(-decay * (r[sl] - r[end]))
        q[sl] = -decay * c * p[sl] / (energy - v[sl] + 2.0 * c * c)

    return _search(grid, v, n, l, kappa, c, guess, tolerance, coefficients, start_out, start_in)


def solve_scalar_relativistic(grid: LogGrid, potential: FloatArray, n: int, l: int, z: float,
                              c: float = SPEED_OF_LIGHT, guess: float | None = None,
                              tolerance: float = 1e-13) -> RelativisticSolution:
    """The bound scalar-relativistic (Koelling–Harmon) state nl of ``potential``.

    Examples
    --------
    In a Coulomb field the scalar-relativistic 1s lies close to the Dirac 1s1/2
    (the two equations differ only by terms beyond the Pauli order):

    >>> grid = LogGrid.for_charge(30.0)
    >>> sr = solve_scalar_relativistic(grid, -30.0 / grid.r, 1, 0, 30.0).energy
    >>> dirac = solve_dirac(grid, -30.0 / grid.r, 1, -1, 30.0).energy
    >>> bool(abs(sr - dirac) < 1e-3 * abs(dirac))
    True
    """
    if not 0 <= l < n:
        raise RadialEigenError(f"n = {n}, l = {l}: need 0 <= l < n")
    if not z > 0:
        raise RadialEigenError("a scalar-relativistic state needs a nuclear charge z > 0")
    r = grid.r
    v = np.asarray(potential, dtype=float)
    s = math.sqrt(l * (l + 1) + 1 - (z / c) ** 2)
    ll = float(l * (l + 1))

    def coefficients(energy: float) -> _Coefficients:
        mass = 1.0 + (energy - v) / (2.0 * c * c)
        return (np.ones(r.size), 2.0 * mass * c * r, (ll / (2.0 * mass * r) + r * (v - energy)) / c,
                -np.ones(r.size))

    def start_out(p: FloatArray, q: FloatArray) -> None:
        p[:4] = r[:4] ** s
        q[:4] = (s - 1.0) * c / z * p[:4]

    def start_in(p: FloatArray, q: FloatArray, end: int, decay: float, energy: float) -> None:
        sl = slice(end - 3, end + 1)
        p[sl] = 1e-30 * np.exp(-decay * (r[sl] - r[end]))
        mass = 1.0 + (energy - v[sl]) / (2.0 * c * c)
        q[sl] = (-decay - 1.0 / r[sl]) * p[sl] / (2.0 * mass * c)

    return _search(grid, v, n, l, None, c, guess, tolerance, coefficients, start_out, start_in)


def _search(grid: LogGrid, v: FloatArray, n: int, l: int, kappa: int | None, c: float,
            guess: float | None, tolerance: float,
            coefficients: Callable[[float], _Coefficients],
            start_out: Callable[[FloatArray, FloatArray], None],
            start_in: Callable[[FloatArray, FloatArray, int, float, float], None],
            ) -> RelativisticSolution:
    """Bracket the eigenvalue by P's node count, then refine by the matching correction."""
    r = grid.r
    name = f"{n}{'spdfghik'[l]}" + ("" if kappa is None else f" (κ = {kappa})")
    nodes_wanted = n - l - 1
    effective = v + l * (l + 1) / (2.0 * r * r)
    # Below −c² no state of a potential shallower than the point nucleus's is bound.
    low, high = max(float(effective.min()), -c * c), float(max(effective[-1], v[-1]))
    if not low < high:
        raise RadialEigenError(f"{name}: the potential binds no state on this grid")
    energy = guess if guess is not None and low < guess < high else 0.5 * (low + high)
    last = r.size - 1
    kernels = _kernels()
    p = np.zeros(r.size)
    q = np.zeros(r.size)
    for step in range(1, MAX_STEPS + 1):
        inside = np.flatnonzero(effective < energy)
        if inside.size == 0:
            low = energy
            energy = 0.5 * (low + high)
            continue
        m = int(min(max(inside[-1], 8), last - 8))
        decay = math.sqrt(max(2.0 * (v[-1] - energy), 1e-12))
        end = int(min(last, max(m + 8, np.searchsorted(r, r[m] + DECAY / decay))))
        a11, a12, a21, a22 = coefficients(energy)
        p[:] = 0.0
        q[:] = 0.0
        start_out(p, q)
        # Sturm's count: integrated out past the turning point, the solution has
        # n − l − 1 nodes below the eigenvalue and one more above it.
        total = kernels.integrate_out(a11, a12, a21, a22, p, q, grid.h, end)
        nodes = int(np.count_nonzero(p[:m] * p[1:m + 1] < 0.0))
        if total > nodes_wanted:
            high = energy
        else:
            low = energy
        if nodes != nodes_wanted:
            energy = 0.5 * (low + high)
            if high - low < 1e-15 * max(1.0, abs(energy)):
                break
            continue
        p_m, q_m = float(p[m]), float(q[m])
        p_out, q_out = p[:m + 1].copy(), q[:m + 1].copy()
        p[m + 1:] = 0.0
        q[m + 1:] = 0.0
        start_in(p, q, end, decay, energy)
        kernels.integrate_in(a11, a12, a21, a22, p, q, grid.h, end, m - 1)
        scale = p_m / p[m]
        q_in = scale * q[m]
        p[m:end + 1] *= scale
        q[m:end + 1] *= scale
        p[:m + 1] = p_out
        q[:m + 1] = q_out
        norm = grid.integrate(p * p + q * q)
        correction = c * p_m * (q_m - q_in) / norm
        proposed = energy + correction
        if (abs(correction) <= tolerance * max(1.0, abs(energy))
                or high - low <= 4e-15 * max(1.0, abs(energy))):
            scale = 1.0 / math.sqrt(norm)
            return RelativisticSolution(n, l, kappa, float(proposed), p * scale, q * scale, step)
        # At the eigenvalue itself the count past the turning point may already see
        # the next node, so a proposal a hair beyond the bracket is still taken.
        slack = 1e-9 * max(1.0, abs(energy))
        energy = proposed if low - slack < proposed < high + slack else 0.5 * (low + high)
    raise RadialEigenError(f"{name}: the eigenvalue search did not settle "
                           f"(last bracket {low:.6g} … {high:.6g} hartree)")

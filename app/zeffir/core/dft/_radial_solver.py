"""Bound states of the radial Schrödinger equation in a spherical potential, on a log grid.

For u = rR the equation u'' = [l(l+1)/r² + 2(V − ε)]u becomes, with x = ln r and
u = √r·φ, the equation φ'' = g(x)φ with g = (l + ½)² + 2r²(V − ε), which has no first
derivative and is integrated by Numerov's method on the uniform x grid. For each
trial energy the solution is integrated outward from the nucleus (φ ∝ r^{l+½} there)
to the classical turning point and inward from the region where the orbital has
decayed; the number of nodes of the outward part brackets the eigenvalue (nl has
n − l − 1 nodes), and the jump in u' where the two parts meet gives the energy
correction δε = u(r_m)[u'_out − u'_in]/(2∫u²dr) (the perturbative correction of
D. R. Hartree, *The Calculation of Atomic Structures*, Wiley, 1957, §4.3). Iteration
stops at the discrete Numerov eigenvalue, whose error falls as h⁴.

References
----------
B. V. Numerov, Mon. Not. R. Astron. Soc. 84, 592 (1924); D. R. Hartree (1957);
W. R. Johnson, *Atomic Structure Theory* (Springer, 2007), §2.3 (the same scheme).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import cache
from typing import Any

import numpy as np

from zeffir.core._acceleration import compiled_solvers_enabled
from zeffir.core._errors import ModelError
from zeffir.core.dft._radial_grid import LogGrid
from zeffir.core.orbitals import FloatArray

__all__ = ["RadialEigenError", "RadialSolution", "solve_radial"]

#: Largest number of energy updates for one orbital.
MAX_STEPS = 200
#: The inward integration starts where the orbital has decayed by e^-DECAY from the
#: turning point (e^-60 ≈ 1e-26 of its size there).
DECAY = 60.0


class RadialEigenError(ModelError):
    """No bound state with the requested quantum numbers in this potential and grid."""


@dataclass(frozen=True)
class RadialSolution:
    """One bound state: its energy (hartree) and u = rR on the grid, normalised, u > 0 near 0."""

    n: int
    l: int
    energy: float
    u: FloatArray
    steps: int


@cache
def _compiled() -> Any:
    """The compiled recurrences, or None when switched off (``ZEFFIR_NO_NUMBA``) or missing."""
    try:
        from zeffir.core.dft import _numerov_compiled
    except ImportError:  # pragma: no cover - numba is a declared dependency
        return None
    return _numerov_compiled


def _recurrences() -> tuple[Any, Any, bool]:
    """(outward, inward, takes arrays): compiled when enabled, else the Python loops."""
    compiled = _compiled() if compiled_solvers_enabled() else None
    if compiled is None:
        return _numerov_out, _numerov_in, False
    return compiled.numerov_out, compiled.numerov_in, True


def _numerov_out(f: list[float], phi0: float, phi1: float, stop: int) -> list[float]:
    phi = [0.0] * (stop + 1)
    phi[0], phi[1] = phi0, phi1
    for i in range(1, stop):
        phi[i + 1] = ((12.0 - 10.0 * f[i]) * phi[i] - f[i - 1] * phi[i - 1]) / f[i + 1]
    return phi


def _numerov_in(f: list[float], start: int, stop: int, last: float) -> list[float]:
    """φ from index ``start`` (the decayed end, φ = 0 beyond) down to ``stop``."""
    phi = [0.0] * (start + 2)
    phi[start + 1] = 0.0
    phi[start] = last
    for i in range(start, stop, -1):
        phi[i - 1] = ((12.0 - 10.0 * f[i]) * phi[i] - f[i + 1] * phi[i + 1]) / f[i - 1]
    return phi


def solve_radial(grid: LogGrid, potential: FloatArray, n: int, l: int, z: float,
                 guess: float | None = None, tolerance: float = 1e-13) -> RadialSolution:
    """The bound state nl of ``potential`` (hartree, on ``grid``), ``z`` its nuclear charge.

    Parameters
    ----------
    grid : LogGrid
    potential : ndarray
        V(r_i), hartree; near the nucleus V ≈ −z/r.
    n, l : int
        Quantum numbers (the state has n − l − 1 radial nodes).
    z : float
        Nuclear charge, for the start of the outward integration.
    guess : float, optional
        A starting energy (e.g. the previous iteration's).
    tolerance : float
        Relative size of the last energy correction at which the search stops.

    Returns
    -------
    RadialSolution

    Raises
    ------
    RadialEigenError
        The potential binds no such state on this grid, or the search does not settle.

    Examples
    --------
    The 3d state of hydrogen-like iron, ε = −Z²/2n² = −37.5555… hartree:

    >>> import numpy as np
    >>> grid = LogGrid.for_charge(26.0)
    >>> state = solve_radial(grid, -26.0 / grid.r, 3, 2, 26.0)
    >>> bool(abs(state.energy + 26.0**2 / 18) < 1e-9 * 26.0**2 / 18)
    True
    """
    if not 0 <= l < n:
        raise RadialEigenError(f"n = {n}, l = {l}: need 0 <= l < n")
    r = grid.r
    v = np.asarray(potential, dtype=float)
    h2 = grid.h * grid.h / 12.0
    nodes_wanted = n - l - 1
    langer = (l + 0.5) ** 2
    effective = v + langer / (2.0 * r * r)
    low, high = float(effective.min()), float(max(effective[-1], v[-1]))
    if not low < high:
        raise RadialEigenError(f"{n}{'spdfghik'[l]}: the potential binds no state on this grid")
    energy = guess if guess is not None and low < guess < high else 0.5 * (low + high)
    last_index = r.size - 1
    outward, inward, arrays = _recurrences()
    for step in range(1, MAX_STEPS + 1):
        g = langer + 2.0 * r * r * (v - energy)
        f = 1.0 - h2 * g if arrays else (1.0 - h2 * g).tolist()
        inside = np.flatnonzero(effective < energy)
        if inside.size == 0:
            low = energy
            energy = 0.5 * (low + high)
            continue
        m = int(min(max(inside[-1], 2), last_index - 3))
        phi_out = outward(f, float(r[0] ** (l + 0.5) * (1.0 - z * r[0] / (l + 1))),
                          float(r[1] ** (l + 0.5) * (1.0 - z * r[1] / (l + 1))), m + 1)
        head = np.asarray(phi_out[:m + 1])
        nodes = int(np.count_nonzero(head[1:] * head[:-1] < 0))
        if nodes != nodes_wanted:
            if nodes > nodes_wanted:
                high = energy
            else:
                low = energy
            energy = 0.5 * (low + high)
            if high - low < 1e-15 * max(1.0, abs(energy)):
                break
            continue
        kappa = math.sqrt(max(2.0 * (v[-1] - energy), 1e-12))
        reach = r[m] + DECAY / kappa
        end = int(min(last_index - 1, max(m + 3, np.searchsorted(r, reach))))
        phi_in = inward(f, end, m - 1, 1e-30)
        scale = phi_out[m] / phi_in[m]
        d_out = (phi_out[m + 1] - phi_out[m - 1]) / (2.0 * grid.h)
        d_in = scale * (phi_in[m + 1] - phi_in[m - 1]) / (2.0 * grid.h)
        phi = np.zeros(r.size)
        phi[:m + 1] = phi_out[:m + 1]
        phi[m + 1:end + 1] = scale * np.asarray(phi_in[m + 1:end + 1])
        u = np.sqrt(r) * phi
        norm = grid.integrate(u * u)
        # u'(r) = (φ' + φ/2)/√r and u(r_m) = √r_m φ_m; both parts share φ_m, so
        # u(r_m)·Δu' = φ_m (φ'_out − φ'_in).
        correction = phi_out[m] * (d_out - d_in) / (2.0 * norm)
        if correction > 0:
            low = energy
        else:
            high = energy
        proposed = energy + correction
        energy = proposed if low < proposed < high else 0.5 * (low + high)
        if (abs(correction) <= tolerance * max(1.0, abs(energy))
                or high - low <= 4e-15 * max(1.0, abs(energy))):  # bracketed to rounding
            # Positive near the nucleus: the outward start is r^{l+½}(1 − zr/(l+1)) > 0.
            return RadialSolution(n, l, float(energy), u / math.sqrt(norm), step)
    raise RadialEigenError(f"{n}{'spdfghik'[l]}: the eigenvalue search did not settle "
                           f"(last bracket {low:.6g} … {high:.6g} hartree)")

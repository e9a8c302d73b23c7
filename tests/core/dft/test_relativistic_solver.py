"""The relativistic radial solvers against the exact Dirac–Coulomb levels and their limits.

Dirac–Coulomb energies without the rest mass, E = c²[(1 + (Z/c/(n − δ))²)^(−1/2) − 1],
δ = |κ| − √(κ² − (Z/c)²): H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and
Two-Electron Atoms (Springer, 1957), eq. (14.29); c = 137.0359895, the value of NIST's
atomic reference data (Kotochigova et al., Phys. Rev. A 55, 191 (1997)).
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from zeffir.core import set_compiled_solvers
from zeffir.core.dft import LogGrid, RadialEigenError
from zeffir.core.dft._relativistic_solver import (
    SPEED_OF_LIGHT,
    kappa_of,
    solve_dirac,
    solve_scalar_relativistic,
)

C = SPEED_OF_LIGHT


def dirac_coulomb(z: float, n: int, kappa: int, c: float = C) -> float:
    gamma = math.sqrt(kappa * kappa - (z / c) ** 2)
    delta = abs(kappa) - gamma
    return c * c * ((1 + (z / c / (n - delta)) ** 2) ** -0.5 - 1)


@pytest.mark.parametrize("z", [1.0, 30.0, 79.0, 92.0])
def test_one_electron_ions_match_the_dirac_coulomb_levels(z):
    # Every level n ≤ 6 of the hydrogen-like ion, both j of every l, to 1e-8 hartree
    # (the largest, U⁹¹⁺ 1s, is −4861.2 hartree).
    grid = LogGrid.for_charge(z, r_max=max(60.0, 300.0 / z))
    for n in range(1, 7):
        for l in range(n):
            for j in ([l + 0.5] if l == 0 else [l - 0.5, l + 0.5]):
                kappa = kappa_of(l, j)
                state = solve_dirac(grid, -z / grid.r, n, kappa, z)
                assert state.energy == pytest.approx(dirac_coulomb(z, n, kappa), abs=1e-8), (n, kappa)
                assert grid.integrate(state.density) == pytest.approx(1.0, abs=1e-12)
                big = np.abs(state.p) > 1e-8 * np.abs(state.p).max()
                signs = np.sign(state.p[big])
                assert int(np.count_nonzero(signs[1:] != signs[:-1])) == n - l - 1
                assert state.p[big][0] > 0


def test_the_fine_structure_formula_orders_the_levels():
    # Levels of equal n and j are degenerate in the Coulomb field (2s1/2 = 2p1/2);
    # 2p3/2 lies above them by the Dirac fine-structure splitting.
    grid = LogGrid.for_charge(50.0)
    s = solve_dirac(grid, -50.0 / grid.r, 2, -1, 50.0).energy
    p_half = solve_dirac(grid, -50.0 / grid.r, 2, 1, 50.0).energy
    p_three_halves = solve_dirac(grid, -50.0 / grid.r, 2, -2, 50.0).energy
    assert s == pytest.approx(p_half, abs=1e-8)
    assert p_three_halves - p_half == pytest.approx(
        dirac_coulomb(50.0, 2, -2) - dirac_coulomb(50.0, 2, 1), rel=1e-9)


def test_without_relativity_both_equations_give_the_schrodinger_levels():
    # c → ∞ (here 10⁷) leaves −Z²/2n² (Bethe & Salpeter 1957, §3).
    z = 26.0
    grid = LogGrid.for_charge(z)
    for n, l in [(1, 0), (2, 1), (3, 2), (4, 3)]:
        exact = -z * z / (2 * n * n)
        assert solve_scalar_relativistic(grid, -z / grid.r, n, l, z, c=1e7).energy == pytest.approx(
            exact, rel=1e-10)
        assert solve_dirac(grid, -z / grid.r, n, -(l + 1), z, c=1e7).energy == pytest.approx(
            exact, rel=1e-10)


def test_scalar_relativistic_s_levels_equal_dirac_s_levels_and_p_lies_between_its_j():
    # For l = 0 the Koelling–Harmon equation is Dirac's κ = −1 equation exactly; for
    # l > 0 it drops spin–orbit, so its level lies between the two j levels.
    z = 80.0
    grid = LogGrid.for_charge(z)
    v = -z / grid.r
    for n in (1, 2, 3):
        assert solve_scalar_relativistic(grid, v, n, 0, z).energy == pytest.approx(
            solve_dirac(grid, v, n, -1, z).energy, rel=1e-11)
    low = solve_dirac(grid, v, 2, 1, z).energy
    high = solve_dirac(grid, v, 2, -2, z).energy
    assert low < solve_scalar_relativistic(grid, v, 2, 1, z).energy < high


def test_compiled_and_plain_loops_agree():
    grid = LogGrid.for_charge(47.0)
    v = -47.0 / grid.r * (1 + 0.3 * np.exp(-grid.r))
    compiled = solve_dirac(grid, v, 3, 2, 47.0)
    before = set_compiled_solvers(False)
    try:
        plain = solve_dirac(grid, v, 3, 2, 47.0)
    finally:
        set_compiled_solvers(before)
    assert plain.energy == pytest.approx(compiled.energy, abs=1e-10)
    np.testing.assert_allclose(plain.p, compiled.p, atol=1e-9)


def test_bad_quantum_numbers_are_refused():
    grid = LogGrid.for_charge(10.0)
    with pytest.raises(RadialEigenError, match="j must be"):
        kappa_of(0, 1.5)
    with pytest.raises(RadialEigenError, match="l < n"):
        solve_dirac(grid, -10.0 / grid.r, 1, 1, 10.0)
    flat = LogGrid.for_charge(1.0, r_max=20.0)
    with pytest.raises(RadialEigenError, match="binds no state"):
        solve_dirac(flat, np.zeros(flat.points), 1, -1, 1.0)

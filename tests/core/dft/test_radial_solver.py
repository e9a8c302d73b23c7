"""The radial eigen-solver against the hydrogen-like atom and exact shifts of its potential.

Hydrogen-like energies ε = −Z²/2n² and mean radii ⟨r⟩ = [3n² − l(l+1)]/2Z:
H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and Two-Electron Atoms
(Springer, 1957), §3.
"""

from __future__ import annotations

import numpy as np
import pytest

from zeffir.core.dft import LogGrid, RadialEigenError, solve_radial


@pytest.mark.parametrize("z", [1.0, 26.0, 92.0])
def test_hydrogen_like_energies_and_radii(z):
    grid = LogGrid.for_charge(z, r_max=max(60.0, 300.0 / z))
    for n in range(1, 6):
        for l in range(n):
            state = solve_radial(grid, -z / grid.r, n, l, z)
            exact = -z * z / (2 * n * n)
            assert state.energy == pytest.approx(exact, rel=1e-10, abs=0.0), (n, l)
            u = state.u
            assert grid.integrate(u * u) == pytest.approx(1.0, abs=1e-12)
            mean = grid.integrate(u * u * grid.r)
            assert mean == pytest.approx((3 * n * n - l * (l + 1)) / (2 * z), rel=1e-8), (n, l)
            # n − l − 1 nodes where the orbital is not negligible, and u > 0 near the nucleus.
            big = np.abs(u) > 1e-8 * np.abs(u).max()
            signs = np.sign(u[big])
            assert int(np.count_nonzero(signs[1:] != signs[:-1])) == n - l - 1
            assert u[big][0] > 0


def test_a_constant_shift_of_the_potential_shifts_every_level():
    # V → V + c moves every eigenvalue by c exactly (the equation only sees V − ε).
    grid = LogGrid.for_charge(10.0)
    for n, l in [(1, 0), (2, 1), (3, 2)]:
        plain = solve_radial(grid, -10.0 / grid.r, n, l, 10.0).energy
        shifted = solve_radial(grid, -10.0 / grid.r - 0.75, n, l, 10.0).energy
        assert shifted - plain == pytest.approx(-0.75, abs=1e-9)


def test_a_guess_far_off_still_finds_the_state():
    grid = LogGrid.for_charge(3.0)
    for guess in (-1e4, -0.01, -4.4):
        assert solve_radial(grid, -3.0 / grid.r, 2, 0, 3.0, guess=guess).energy == pytest.approx(
            -9.0 / 8.0, rel=1e-10)


def test_no_bound_state_is_refused():
    grid = LogGrid.for_charge(1.0, r_max=20.0)
    with pytest.raises(RadialEigenError, match="binds no state"):
        solve_radial(grid, np.zeros(grid.points), 1, 0, 0.0)
    with pytest.raises(RadialEigenError, match="l < n"):
        solve_radial(grid, -1.0 / grid.r, 2, 2, 1.0)


def test_the_grid_quadrature():
    grid = LogGrid.for_charge(5.0)
    r = grid.r
    assert grid.points % 2 == 1
    assert grid.integrate(r**4 * np.exp(-2 * r)) == pytest.approx(24 / 2**5, rel=1e-12)  # 4!/2⁵
    cumulative = grid.cumulative(np.exp(-r))
    np.testing.assert_allclose(cumulative[::2], (1 - np.exp(-r[::2])) - (1 - np.exp(-r[0])),
                               rtol=0, atol=1e-10)

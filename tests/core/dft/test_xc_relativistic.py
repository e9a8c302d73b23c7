"""MacDonald–Vosko relativistic exchange: its factors, their limits and consistency."""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

from zeffir.core.dft._relativistic_solver import SPEED_OF_LIGHT
from zeffir.core.dft._xc import lda_xc
from zeffir.core.dft._xc_relativistic import relativistic_exchange_factors, rlda_xc

C = SPEED_OF_LIGHT


def density_of_beta(beta: np.ndarray, c: float = C) -> np.ndarray:
    return (beta * c) ** 3 / (3 * math.pi**2)


def beta_of(rho: np.ndarray, c: float = C) -> np.ndarray:
    return np.cbrt(3 * math.pi**2 * rho) / c


def test_speed_of_light_is_nists():
    # 1/α with the 1986 CODATA fine-structure constant, the value of NIST's tables
    # (Kotochigova et al., Phys. Rev. A 55, 191 (1997)).
    assert C == 137.0359895


def test_factors_match_the_closed_forms_in_extended_precision():
    # Φ = 1 − (3/2)[(βη − ln ξ)/β²]² (NIST, "Relativistic corrections to the
    # energy-density functional", eq. 20) and R = −1/2 + 3 ln ξ/(2βη), at 40 digits.
    # Both branches (series below β = 1e-3, closed form above) and the switch itself.
    mpmath.mp.dps = 40
    rho = density_of_beta(np.concatenate([np.geomspace(1e-7, 1e3, 121),
                                          [1e-3 * (1 - 1e-12), 1e-3, 1e-3 * (1 + 1e-12)]]))
    with np.errstate(all="raise"):
        phi, r_factor = relativistic_exchange_factors(rho, C)
    for b, p, r in zip(beta_of(rho), phi, r_factor, strict=True):
        beta = mpmath.mpf(float(b))
        eta = mpmath.sqrt(1 + beta**2)
        xi = beta + eta
        exact_phi = 1 - mpmath.mpf(3) / 2 * ((beta * eta - mpmath.log(xi)) / beta**2) ** 2
        exact_r = -mpmath.mpf(1) / 2 + 3 * mpmath.log(xi) / (2 * beta * eta)
        assert abs(p - float(exact_phi)) < 2e-15
        assert abs(r - float(exact_r)) < 2e-15


def test_potential_factor_is_the_derivative_of_the_energy_factor():
    # v_x R = d(ρ ε_x Φ)/dρ, checked by a five-point central difference in ρ (step
    # 1e-4 ρ: truncation ~1e-16, rounding ~1e-12) for β from 1e-4 to 10.
    rho = density_of_beta(np.geomspace(1e-4, 10.0, 61))

    def energy(n: np.ndarray) -> np.ndarray:
        eps_x = -0.75 * np.cbrt(3 * n / math.pi)
        return n * eps_x * relativistic_exchange_factors(n, C)[0]

    h = 1e-4 * rho
    with np.errstate(all="raise"):
        derivative = (-energy(rho + 2 * h) + 8 * energy(rho + h)
                      - 8 * energy(rho - h) + energy(rho - 2 * h)) / (12 * h)
        _, r_factor = relativistic_exchange_factors(rho, C)
    v_x = -np.cbrt(3 * rho / math.pi)
    np.testing.assert_allclose(derivative / v_x, r_factor, rtol=1e-9)


def test_small_beta_limit():
    # Derived: Φ = 1 − (2/3)β² + (2/5)β⁴ − …, R = 1 − β² + (4/5)β⁴ − … (expanding
    # arsinh β and √(1 + β²)); so (1 − Φ)/β² → 2/3 and (1 − R)/β² → 1, with relative
    # deviations (3/5)β² and (4/5)β², both sides of the series switch at β = 1e-3.
    beta = np.array([1e-4, 5e-4, 2e-3, 1e-2])
    phi, r_factor = relativistic_exchange_factors(density_of_beta(beta), C)
    b = beta_of(density_of_beta(beta))
    np.testing.assert_allclose((1 - phi) / b**2, 2 / 3 * (1 - 0.6 * b**2), rtol=1e-8)
    np.testing.assert_allclose((1 - r_factor) / b**2, 1 - 0.8 * b**2, rtol=1e-8)


def test_large_beta_limit():
    # Derived: βη − ln ξ = β² + 1/2 − ln 2β + O(β⁻² ln β), so for β → ∞
    # Φ → −1/2 + 3(ln 2β − 1/2)/β² and R → −1/2 + 3 ln(2β)/(2β²).
    beta = np.array([1e3, 1e4])
    phi, r_factor = relativistic_exchange_factors(density_of_beta(beta), C)
    b = beta_of(density_of_beta(beta))
    np.testing.assert_allclose(phi + 0.5, 3 * (np.log(2 * b) - 0.5) / b**2, rtol=1e-4)
    np.testing.assert_allclose(r_factor + 0.5, 3 * np.log(2 * b) / (2 * b**2), rtol=1e-4)


def test_coulomb_and_transverse_parts_add_up_to_the_factor():
    # NIST's eqs. 15 (Coulomb, φ_C) and 16 (transverse, φ_T) sum to eq. 20, the Φ used.
    # Written out independently here; their 1/β² and ln terms cancel, so small β is
    # left out (at β = 0.05 each term is ~1e2 and the sum keeps ~1e-13).
    beta = np.geomspace(0.05, 10.0, 31)
    phi, _ = relativistic_exchange_factors(density_of_beta(beta), C)
    b = beta_of(density_of_beta(beta))
    eta = np.sqrt(1 + b**2)
    log_xi = np.log(b + eta)
    square = ((b * eta - log_xi) / b**2) ** 2
    phi_c = (5 / 6 + 1 / (3 * b**2) + 2 * eta * log_xi / (3 * b)
             - 2 * eta**4 * np.log(eta) / (3 * b**4) - square / 2)
    phi_t = (1 / 6 - 1 / (3 * b**2) - 2 * eta * log_xi / (3 * b)
             + 2 * eta**4 * np.log(eta) / (3 * b**4) - square)
    np.testing.assert_allclose(phi_c + phi_t, phi, rtol=0, atol=1e-11)


def test_factors_fall_from_one_and_weaken_exchange():
    beta = np.geomspace(1e-6, 1e3, 400)
    phi, r_factor = relativistic_exchange_factors(density_of_beta(beta), C)
    assert np.all(np.diff(phi) < 0) and np.all(np.diff(r_factor) < 0)
    assert np.all((phi < 1) & (phi > -0.5) & (r_factor < 1) & (r_factor > -0.5))


def test_non_relativistic_limit_is_lda():
    rho = np.concatenate([[0.0], np.geomspace(1e-8, 1e8, 97)])
    with np.errstate(all="raise"):
        eps_lda, v_lda = lda_xc(rho)
        eps_inf, v_inf = rlda_xc(rho, math.inf)
        eps_big, v_big = rlda_xc(rho, 1e9)
        phi, r_factor = relativistic_exchange_factors(rho, math.inf)
    np.testing.assert_array_equal(eps_inf, eps_lda)
    np.testing.assert_array_equal(v_inf, v_lda)
    # c = 1e9: the relative corrections (2/3)β² and β² reach 2e-12 at ρ = 1e8 bohr⁻³.
    np.testing.assert_allclose(eps_big, eps_lda, rtol=3e-12)
    np.testing.assert_allclose(v_big, v_lda, rtol=3e-12)
    assert np.all(eps_big[1:] >= eps_lda[1:]) and eps_big[-1] > eps_lda[-1]
    assert np.all(phi == 1.0) and np.all(r_factor == 1.0)


def test_rlda_potential_is_the_derivative_of_its_energy_density():
    # Up to ρ = 1e8 bohr⁻³, β ≈ 10 at NIST's c; exchange and VWN correlation together.
    rho = np.geomspace(1e-6, 1e8, 29)
    h = 1e-4 * rho

    def energy(n: np.ndarray) -> np.ndarray:
        return n * rlda_xc(n)[0]

    with np.errstate(all="raise"):
        _, pot = rlda_xc(rho)
        derivative = (-energy(rho + 2 * h) + 8 * energy(rho + h)
                      - 8 * energy(rho - h) + energy(rho - 2 * h)) / (12 * h)
    np.testing.assert_allclose(pot, derivative, rtol=1e-8)
    eps, _ = rlda_xc(rho)
    exchange_only = -0.75 * np.cbrt(3 * rho / math.pi) * relativistic_exchange_factors(rho)[0]
    np.testing.assert_allclose(eps - exchange_only, lda_xc(rho)[0] + 0.75 * np.cbrt(
        3 * rho / math.pi), rtol=1e-9)  # correlation untouched


def test_empty_points_and_bad_speed_of_light():
    phi, r_factor = relativistic_exchange_factors(np.zeros(4))
    assert np.all(phi == 1.0) and np.all(r_factor == 1.0)
    eps, pot = rlda_xc(np.zeros(4))
    assert not eps.any() and not pot.any()
    for bad in (0.0, -137.0, math.nan):
        with pytest.raises(ValueError, match="speed of light"):
            relativistic_exchange_factors(np.ones(2), bad)
        with pytest.raises(ValueError, match="speed of light"):
            rlda_xc(np.ones(2), bad)

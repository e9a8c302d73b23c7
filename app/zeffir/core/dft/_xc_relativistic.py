"""MacDonald and Vosko's relativistic correction to local-density exchange (hartree).

The exchange energy of the relativistic electron gas, Coulomb ("Dirac–Fock") and
transverse (magnetic and retardation) parts together, is Dirac's times a factor of
β = k_F/c alone,

    ε_x^R = ε_x Φ(β),   Φ = 1 − (3/2)[(βη − ln ξ)/β²]²,

with k_F = (3π²ρ)^{1/3}, η = √(1 + β²) and ξ = β + η (so ln ξ = arsinh β). Because
ρ ε_x ∝ ρ^{4/3} and β ∝ ρ^{1/3}, the potential is v_x^R = d(ρ ε_x Φ)/dρ = v_x R with
R = Φ + (β/4) dΦ/dβ, which simplifies (using d(βη − ln ξ)/dβ = 2β²/η) to

    R = −1/2 + 3 ln ξ/(2βη).

For small β, Φ = 1 − (2/3)β² + (2/5)β⁴ − (48/175)β⁶ + … and
R = 1 − β² + (4/5)β⁴ − (24/35)β⁶ + …; for β → ∞ both tend to −1/2.
Correlation stays the non-relativistic VWN form, as in NIST's relativistic LDA.

References
----------
A. H. MacDonald and S. H. Vosko, J. Phys. C 12, 2977 (1979); S. Kotochigova,
Z. H. Levine, E. L. Shirley, M. D. Stiles and C. W. Clark, Phys. Rev. A 55, 191 (1997),
and NIST's "Atomic Reference Data for Electronic Structure Calculations", page
"Relativistic corrections to the energy-density functional" (eqs. 12–21: Φ is their
φ_C + φ_T, eq. 20).
"""

from __future__ import annotations

import math

import numpy as np
import numpy.typing as npt

from zeffir.core.dft._relativistic_solver import SPEED_OF_LIGHT
from zeffir.core.dft._xc import lda_xc
from zeffir.core.orbitals import FloatArray

__all__ = ["relativistic_exchange_factors", "rlda_xc"]

# Below this β the closed forms lose digits to cancellation (βη − arsinh β ≈ 2β³/3);
# the series is cut after β⁴, the first dropped terms, (48/175)β⁶ and (24/35)β⁶, being
# below 7e-19 there, far under the rounding of numbers near 1.
_SERIES_BELOW = 1e-3


def _check_c(c: float) -> None:
    if not c > 0.0:
        raise ValueError(f"the speed of light c must be positive, not {c!r}")


def relativistic_exchange_factors(density: npt.ArrayLike,
                                  c: float = SPEED_OF_LIGHT) -> tuple[FloatArray, FloatArray]:
    """MacDonald and Vosko's factors (Φ, R) on Dirac exchange at each density ρ (bohr⁻³).

    Parameters
    ----------
    density : array_like
        Electron density ρ (bohr⁻³); points with ρ ≤ 1e-300 count as empty.
    c : float
        The speed of light in atomic units; default NIST's 137.0359895 (1/α, 1986
        CODATA). ``math.inf`` gives the non-relativistic limit Φ = R = 1.

    Returns
    -------
    phi : ndarray
        Φ(β) with ε_x^R = ε_x Φ, β = (3π²ρ)^{1/3}/c; 1 where the density is empty.
    r_factor : ndarray
        R(β) with v_x^R = v_x R, R = d(ρ ε_x Φ)/dρ / v_x; 1 where the density is empty.

    Raises
    ------
    ValueError
        If c is not positive.

    Notes
    -----
    Φ = 1 − (3/2)[(βη − ln ξ)/β²]², R = −1/2 + 3 ln ξ/(2βη), η = √(1 + β²),
    ξ = β + η, evaluated with ln ξ = arsinh β; below β = 10⁻³ the power series
    Φ = 1 − (2/3)β² + (2/5)β⁴ and R = 1 − β² + (4/5)β⁴ (next terms −(48/175)β⁶ and
    −(24/35)β⁶, below rounding there).
    Φ and R fall monotonically from 1 (β = 0) towards −1/2 (β → ∞).

    References
    ----------
    A. H. MacDonald and S. H. Vosko, J. Phys. C 12, 2977 (1979); NIST, "Relativistic
    corrections to the energy-density functional", eq. 20 (Φ); Kotochigova et al.,
    Phys. Rev. A 55, 191 (1997).

    Examples
    --------
    R is the logarithmic-derivative combination Φ + (β/4)Φ', checked here at β = 1
    by a central difference:

    >>> import numpy as np
    >>> c = 137.0359895
    >>> rho = lambda beta: (beta * c) ** 3 / (3 * np.pi**2)
    >>> phi, r = relativistic_exchange_factors(np.array([rho(1.0)]), c)
    >>> h = 1e-5
    >>> plus, _ = relativistic_exchange_factors(np.array([rho(1.0 + h)]), c)
    >>> minus, _ = relativistic_exchange_factors(np.array([rho(1.0 - h)]), c)
    >>> bool(abs(phi[0] + (plus[0] - minus[0]) / (2 * h) / 4 - r[0]) < 1e-9)
    True
    """
    _check_c(c)
    rho = np.asarray(density, dtype=float)
    phi = np.ones_like(rho)
    r_factor = np.ones_like(rho)
    ok = rho > 1e-300
    beta = np.cbrt(3.0 * math.pi**2 * rho[ok]) / c
    small = beta < _SERIES_BELOW
    b2 = beta[small] ** 2
    phi_small = 1.0 + b2 * (-2.0 / 3.0 + b2 * (2.0 / 5.0))
    r_small = 1.0 + b2 * (-1.0 + b2 * (4.0 / 5.0))
    b = beta[~small]
    eta = np.sqrt(1.0 + b * b)
    log_xi = np.arcsinh(b)
    u = (b * eta - log_xi) / (b * b)
    phi_large = 1.0 - 1.5 * u * u
    r_large = -0.5 + 1.5 * log_xi / (b * eta)
    phi_ok = np.empty_like(beta)
    r_ok = np.empty_like(beta)
    phi_ok[small], phi_ok[~small] = phi_small, phi_large
    r_ok[small], r_ok[~small] = r_small, r_large
    phi[ok] = phi_ok
    r_factor[ok] = r_ok
    return phi, r_factor


def rlda_xc(density: npt.ArrayLike,
            c: float = SPEED_OF_LIGHT) -> tuple[FloatArray, FloatArray]:
    """(ε_xc, v_xc) per electron with MacDonald–Vosko relativistic exchange (hartree).

    Parameters
    ----------
    density : array_like
        Electron density ρ (bohr⁻³); zero results where ρ ≤ 1e-300, as ``lda_xc``.
    c : float
        The speed of light in atomic units; default NIST's 137.0359895.

    Returns
    -------
    eps_xc, v_xc : ndarray
        ε_xc = ε_x Φ + ε_c and v_xc = v_x R + v_c, with Dirac's ε_x = −(3/4)(3ρ/π)^{1/3},
        v_x = (4/3)ε_x and the non-relativistic VWN correlation of ``lda_xc``.

    Raises
    ------
    ValueError
        If c is not positive.

    Notes
    -----
    Evaluated as ``lda_xc`` plus ε_x(Φ − 1) and v_x(R − 1), so that c → ∞ returns
    ``lda_xc`` exactly.

    References
    ----------
    A. H. MacDonald and S. H. Vosko, J. Phys. C 12, 2977 (1979); S. H. Vosko, L. Wilk
    and M. Nusair, Can. J. Phys. 58, 1200 (1980); Kotochigova et al., Phys. Rev. A 55,
    191 (1997) (NIST's RLDA: relativistic exchange, non-relativistic correlation).

    Examples
    --------
    Without relativity the correction vanishes; with it, exchange weakens:

    >>> import math
    >>> import numpy as np
    >>> from zeffir.core.dft._xc import lda_xc
    >>> rho = np.array([1e4])
    >>> bool(np.array_equal(rlda_xc(rho, math.inf)[0], lda_xc(rho)[0]))
    True
    >>> bool(rlda_xc(rho)[0][0] > lda_xc(rho)[0][0])
    True
    """
    _check_c(c)
    rho = np.asarray(density, dtype=float)
    eps, pot = lda_xc(rho)
    phi, r_factor = relativistic_exchange_factors(rho, c)
    ok = rho > 1e-300
    third = np.cbrt(3.0 * rho[ok] / math.pi)
    eps[ok] += -0.75 * third * (phi[ok] - 1.0)
    pot[ok] += -third * (r_factor[ok] - 1.0)
    return eps, pot

"""Local-density exchange and correlation of the spin-unpolarised electron gas (hartree).

Exchange: Dirac–Slater, ε_x = −(3/4)(3ρ/π)^{1/3}, v_x = (4/3)ε_x. Correlation: the
Vosko–Wilk–Nusair fit to Ceperley and Alder's paramagnetic correlation energy (the
"VWN5" form), the functional NIST's atomic reference data use for LDA.

References
----------
P. A. M. Dirac, Proc. Cambridge Philos. Soc. 26, 376 (1930); S. H. Vosko, L. Wilk and
M. Nusair, Can. J. Phys. 58, 1200 (1980), eq. (4.4) with the paramagnetic parameters
of their Table 5; S. Kotochigova et al., Phys. Rev. A 55, 191 (1997) (the choice).
"""

from __future__ import annotations

import math

import numpy as np

from zeffir.core.orbitals import FloatArray

__all__ = ["lda_xc"]

# VWN paramagnetic parameters (A, x0, b, c) in hartree (A = 0.0621814/2 Ry → hartree).
_PARAMAGNETIC = (0.0310907, -0.10498, 3.72744, 12.9352)


def _vwn_fit(x: FloatArray, a: float, x0: float, b: float,
             c: float) -> tuple[FloatArray, FloatArray]:
    """VWN's interpolation formula G(x) and its derivative dG/dx at x = √r_s.

    G = A{ln(x²/X) + (2b/Q)atan(Q/(2x + b)) − (bx0/X(x0))[ln((x − x0)²/X)
    + (2(b + 2x0)/Q)atan(Q/(2x + b))]}, X = x² + bx + c, Q = √(4c − b²): the form
    Vosko, Wilk and Nusair (1980) fit to the paramagnetic and ferromagnetic correlation
    energies and to the spin stiffness, each with its own (A, x0, b, c).
    """
    q = math.sqrt(4.0 * c - b * b)
    x_x0 = x0 * x0 + b * x0 + c
    big_x = x * x + b * x + c
    angle = np.arctan(q / (2.0 * x + b))
    eps = a * (np.log(x * x / big_x) + 2.0 * b / q * angle
               - b * x0 / x_x0 * (np.log((x - x0) ** 2 / big_x)
                                  + 2.0 * (b + 2.0 * x0) / q * angle))
    d_angle = -4.0 / ((2.0 * x + b) ** 2 + q * q)  # d/dx of (2/Q)·atan(Q/(2x + b))
    de_dx = a * (2.0 / x - (2.0 * x + b) / big_x + b * d_angle
                 - b * x0 / x_x0 * (2.0 / (x - x0) - (2.0 * x + b) / big_x
                                    + (b + 2.0 * x0) * d_angle))
    return eps, de_dx


def lda_xc(density: FloatArray) -> tuple[FloatArray, FloatArray]:
    """(ε_xc, v_xc) per electron at each density ρ (bohr⁻³); zero where ρ = 0.

    Examples
    --------
    At r_s = 1 (ρ = 3/4π) VWN gives ε_c = −0.0600 hartree and ε_x = −0.4582 hartree
    (Vosko, Wilk and Nusair 1980; exchange −0.4582/r_s):

    >>> import numpy as np
    >>> eps, _ = lda_xc(np.array([3 / (4 * np.pi)]))
    >>> round(float(eps[0]), 4)
    -0.5182
    """
    rho = np.asarray(density, dtype=float)
    eps = np.zeros_like(rho)
    pot = np.zeros_like(rho)
    ok = rho > 1e-300
    n = rho[ok]
    third = np.cbrt(3.0 * n / math.pi)
    eps_x = -0.75 * third
    v_x = -third
    rs = np.cbrt(3.0 / (4.0 * math.pi * n))
    x = np.sqrt(rs)
    eps_c, de_dx = _vwn_fit(x, *_PARAMAGNETIC)
    v_c = eps_c - x / 6.0 * de_dx
    eps[ok] = eps_x + eps_c
    pot[ok] = v_x + v_c
    return eps, pot

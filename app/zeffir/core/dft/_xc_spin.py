"""Local-spin-density exchange and correlation of the electron gas (hartree).

Exchange: Dirac–Slater with the exact spin scaling of exchange,
E_x[ρ↑, ρ↓] = ½(E_x[2ρ↑] + E_x[2ρ↓]). Correlation: Vosko, Wilk and Nusair's
interpolation between their fits to Ceperley and Alder's paramagnetic (ζ = 0) and
ferromagnetic (ζ = 1) correlation energies, weighted by their fit to the spin
stiffness α_c (the "VWN5" functional). This is the local spin density functional of
NIST's atomic reference data.

References
----------
P. A. M. Dirac, Proc. Cambridge Philos. Soc. 26, 376 (1930); G. L. Oliver and
J. P. Perdew, Phys. Rev. A 20, 397 (1979) (spin scaling of exchange); S. H. Vosko,
L. Wilk and M. Nusair, Can. J. Phys. 58, 1200 (1980); D. M. Ceperley and B. J. Alder,
Phys. Rev. Lett. 45, 566 (1980); S. Kotochigova, Z. H. Levine, E. L. Shirley,
M. D. Stiles and C. W. Clark, Phys. Rev. A 55, 191 (1997) (the choice).
"""

from __future__ import annotations

import math

import numpy as np
import numpy.typing as npt

from zeffir.core.dft._xc import _PARAMAGNETIC, _vwn_fit
from zeffir.core.orbitals import FloatArray

__all__ = ["lsda_xc"]

# VWN's ferromagnetic and spin-stiffness fits (A, x0, b, c) in hartree: their rydberg
# values halved, A_F = A_P/2 and A_α = −1/(6π²) fixed by the high-density (RPA) limit.
# The same numbers stand in libxc (maple/vwn.mpl) and in the Molpro manual's VWN entry.
_FERROMAGNETIC = (0.01554535, -0.32500, 7.06042, 18.0578)
_SPIN_STIFFNESS = (-1.0 / (6.0 * math.pi**2), -0.0047584, 1.13107, 13.0045)

# f(ζ) = [(1+ζ)^{4/3} + (1−ζ)^{4/3} − 2]/(2^{4/3} − 2), f(1) = 1; f''(0) = 4/(9(2^{1/3} − 1)).
_F_DENOMINATOR = 2.0 ** (4.0 / 3.0) - 2.0
_F_CURVATURE = 4.0 / (9.0 * (2.0 ** (1.0 / 3.0) - 1.0))


def lsda_xc(rho_up: npt.ArrayLike,
            rho_down: npt.ArrayLike) -> tuple[FloatArray, FloatArray, FloatArray]:
    """(ε_xc, v_xc↑, v_xc↓) of the spin densities ρ↑, ρ↓ (bohr⁻³), in hartree.

    Parameters
    ----------
    rho_up, rho_down : array_like
        Spin densities, non-negative, broadcast against each other. Either may be
        zero where the other is not (a fully polarised point, ζ = ±1).

    Returns
    -------
    eps_xc : ndarray
        Exchange–correlation energy per electron of the total density ρ = ρ↑ + ρ↓,
        so that E_xc = ∫ρ ε_xc d³r; zero where ρ ≤ 1e-300 (as in ``lda_xc``).
    v_up, v_down : ndarray
        The potentials v_xcσ = ∂(ρ ε_xc)/∂ρσ; zero where ρ ≤ 1e-300.

    Raises
    ------
    ValueError
        If a spin density is negative.

    Notes
    -----
    With ζ = (ρ↑ − ρ↓)/ρ, r_s = (3/(4πρ))^{1/3} and x = √r_s:

    * exchange, ε_x = −(3/8)(3ρ/π)^{1/3}[(1+ζ)^{4/3} + (1−ζ)^{4/3}] and
      v_xσ = −(6ρσ/π)^{1/3}, the spin scaling of Dirac's ε_x = −(3/4)(3ρ/π)^{1/3};
    * correlation, ε_c = ε_P + α_c f(ζ)(1 − ζ⁴)/f''(0) + (ε_F − ε_P) f(ζ) ζ⁴ with
      f(ζ) = [(1+ζ)^{4/3} + (1−ζ)^{4/3} − 2]/(2^{4/3} − 2) and
      f''(0) = 4/(9(2^{1/3} − 1)); ε_P, ε_F and α_c each VWN's form G(x) with its
      own parameters (hartree):

      ======  ==============  ==========  ========  ========
      fit     A               x0          b         c
      ======  ==============  ==========  ========  ========
      ε_P     0.0310907       −0.10498    3.72744   12.9352
      ε_F     0.01554535      −0.32500    7.06042   18.0578
      α_c     −1/(6π²)        −0.0047584  1.13107   13.0045
      ======  ==============  ==========  ========  ========

    * the potentials, v_cσ = ε_c − (r_s/3)∂ε_c/∂r_s − (ζ − sσ)∂ε_c/∂ζ with sσ = +1
      for ↑ and −1 for ↓, and (r_s/3)∂/∂r_s = (x/6)∂/∂x; ∂ε_c/∂ζ is
      α_c[f'(1 − ζ⁴) − 4ζ³f]/f''(0) + (ε_F − ε_P)[f'ζ⁴ + 4ζ³f] with
      f'(ζ) = (4/3)[(1+ζ)^{1/3} − (1−ζ)^{1/3}]/(2^{4/3} − 2), finite at ζ = ±1.

    At ζ = 0 every spin term vanishes and the result is that of ``lda_xc``.

    References
    ----------
    S. H. Vosko, L. Wilk and M. Nusair, Can. J. Phys. 58, 1200 (1980) (the
    interpolation and the three fits); G. L. Oliver and J. P. Perdew, Phys. Rev. A 20,
    397 (1979) (spin scaling of exchange); S. Kotochigova et al., Phys. Rev. A 55, 191
    (1997). The parameters as transcribed in libxc (M. A. L. Marques, M. J. T. Oliveira
    and T. Burnus, Comput. Phys. Commun. 183, 2272 (2012)), file maple/vwn.mpl.

    Examples
    --------
    Equal spin densities give the unpolarised functional; swapping the spins swaps
    the potentials:

    >>> import numpy as np
    >>> from zeffir.core.dft._xc import lda_xc
    >>> n = np.array([3 / (4 * np.pi)])  # r_s = 1
    >>> eps, v_up, v_down = lsda_xc(n / 2, n / 2)
    >>> bool(np.allclose(eps, lda_xc(n)[0], rtol=1e-14, atol=0.0))
    True
    >>> _, a_up, a_down = lsda_xc(0.7 * n, 0.3 * n)
    >>> _, b_up, b_down = lsda_xc(0.3 * n, 0.7 * n)
    >>> bool(a_up[0] == b_down[0] and a_down[0] == b_up[0] and a_up[0] < a_down[0])
    True
    """
    up, down = np.broadcast_arrays(np.asarray(rho_up, dtype=float),
                                   np.asarray(rho_down, dtype=float))
    if np.any(up < 0.0) or np.any(down < 0.0):
        raise ValueError("spin densities must be non-negative")
    total = up + down
    eps = np.zeros_like(total)
    pot_up = np.zeros_like(total)
    pot_down = np.zeros_like(total)
    ok = total > 1e-300
    n = total[ok]
    # 1 ± ζ from the spin densities themselves, so that a minority spin far below the
    # rounding of ζ near ±1 still sets its own exchange potential.
    one_plus = 2.0 * up[ok] / n
    one_minus = 2.0 * down[ok] / n
    zeta = np.clip((up[ok] - down[ok]) / n, -1.0, 1.0)
    third = np.cbrt(3.0 * n / math.pi)
    plus = np.cbrt(one_plus)
    minus = np.cbrt(one_minus)
    plus_43 = one_plus * plus
    minus_43 = one_minus * minus

    eps_x = -0.375 * third * (plus_43 + minus_43)
    v_x_up = -third * plus
    v_x_down = -third * minus

    rs = np.cbrt(3.0 / (4.0 * math.pi * n))
    x = np.sqrt(rs)
    e_para, d_para = _vwn_fit(x, *_PARAMAGNETIC)
    e_ferro, d_ferro = _vwn_fit(x, *_FERROMAGNETIC)
    alpha, d_alpha = _vwn_fit(x, *_SPIN_STIFFNESS)
    f = (plus_43 + minus_43 - 2.0) / _F_DENOMINATOR
    df = (4.0 / 3.0) * (plus - minus) / _F_DENOMINATOR
    zeta3 = zeta**3
    zeta4 = zeta3 * zeta
    one_minus_zeta4 = one_plus * one_minus * (1.0 + zeta * zeta)  # no cancellation at ±1
    stiffness_weight = f * one_minus_zeta4 / _F_CURVATURE
    polarised_weight = f * zeta4
    eps_c = e_para + alpha * stiffness_weight + (e_ferro - e_para) * polarised_weight
    de_dx = d_para + d_alpha * stiffness_weight + (d_ferro - d_para) * polarised_weight
    de_dzeta = (alpha * (df * one_minus_zeta4 - 4.0 * zeta3 * f) / _F_CURVATURE
                + (e_ferro - e_para) * (df * zeta4 + 4.0 * zeta3 * f))
    v_c = eps_c - x / 6.0 * de_dx

    eps[ok] = eps_x + eps_c
    pot_up[ok] = v_x_up + (v_c - (zeta - 1.0) * de_dzeta)
    pot_down[ok] = v_x_down + (v_c - (zeta + 1.0) * de_dzeta)
    return eps, pot_up, pot_down

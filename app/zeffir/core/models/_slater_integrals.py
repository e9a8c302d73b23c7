"""Closed-form integrals over normalised Slater-type functions N r^{n-1} e^{-ζr}.

Overlap, kinetic-energy and nuclear-attraction matrices of functions of one n, and the
two-electron radial integrals R^k of any four functions: the Roothaan–Hartree–Fock
solvers (:mod:`zeffir.core.models.hartree_fock`, one n = l + 1 per l) and the
closed-form energy of the variational model (``_sto_energy``, mixed n) both use them.
"""

from __future__ import annotations

import math

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core._scipy import special
from zeffir.core.orbitals import FloatArray

__all__ = [
    "kinetic_matrix",
    "log_norms",
    "nuclear_matrix",
    "overlap_matrix",
    "rk_product",
    "rk_product_gradient",
    "rk_tensor",
]


def log_norms(n: int | npt.ArrayLike, zetas: npt.ArrayLike) -> FloatArray:
    """ln N of normalised Slater-type functions N r^{n-1} e^{-ζr}.

    Parameters
    ----------
    n : int or array_like
        Principal quantum number of the functions (>= 1): one for all, or one per
        exponent.
    zetas : array_like
        Exponents ζ > 0 (bohr⁻¹).

    Returns
    -------
    ndarray
        ln N = (n + 1/2) ln 2ζ - ½ ln (2n)!, so that ∫ R² r² dr = 1.

    References
    ----------
    J. C. Slater, Phys. Rev. 36, 57 (1930).

    Examples
    --------
    >>> bool(abs(np.exp(log_norms(1, [1.0]))[0] - 2.0) < 1e-15)  # 1s of hydrogen: 2 e^{-r}
    True
    >>> bool(np.allclose(np.exp(log_norms([1, 2], [1.0, 0.5])), [2.0, 1 / np.sqrt(24.0)], rtol=1e-15))
    True
    """
    nn = np.asarray(n, dtype=float)
    z = np.asarray(zetas, dtype=float)
    if np.any(~(nn >= 1)) or np.any(~(z > 0)):
        raise QuantumNumberError(f"Slater-type functions need n >= 1 and ζ > 0 (n = {n!r})")
    return np.asarray((nn + 0.5) * np.log(2 * z) - 0.5 * special.gammaln(2 * nn + 1), dtype=float)


def _moment(n: int, zetas: FloatArray, power: int) -> FloatArray:
    """N_p N_q ∫ r^{2n - power} e^{-(ζp+ζq) r} dr = N_p N_q Γ(2n-power+1) / s^{2n-power+1}."""
    ln = log_norms(n, zetas)
    s = zetas[:, None] + zetas[None, :]
    a = 2 * n - power + 1
    return np.asarray(np.exp(ln[:, None] + ln[None, :] + special.gammaln(a) - a * np.log(s)), dtype=float)


def overlap_matrix(n: int, zetas: npt.ArrayLike) -> FloatArray:
    """Overlap S_pq = ∫ P_p P_q dr of normalised Slater-type functions of one n (and l).

    Parameters
    ----------
    n : int
        Principal quantum number shared by all functions.
    zetas : array_like
        Their exponents (bohr⁻¹).

    Returns
    -------
    ndarray
        S_pq = N_p N_q (2n)! / (ζ_p + ζ_q)^{2n+1}; unit diagonal.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); E. Clementi and C. Roetti, At. Data
    Nucl. Data Tables 14, 177 (1974), introduction (the Slater-type basis).

    Examples
    --------
    >>> s = overlap_matrix(2, [1.0, 2.0])
    >>> bool(np.allclose(np.diag(s), 1.0))
    True
    """
    z = np.asarray(zetas, dtype=float)
    return _moment(n, z, 0)


def nuclear_matrix(n: int, zetas: npt.ArrayLike, Z: float) -> FloatArray:
    """Nuclear attraction -Z ∫ P_p P_q / r dr (hartree).

    Parameters
    ----------
    n : int
    zetas : array_like
    Z : float
        Nuclear charge.

    Returns
    -------
    ndarray
        -Z N_p N_q (2n-1)! / (ζ_p + ζ_q)^{2n}.

    References
    ----------
    Roothaan 1951 (as :func:`overlap_matrix`).

    Examples
    --------
    >>> bool(abs(nuclear_matrix(1, [1.0], 1.0)[0, 0] + 1.0) < 1e-15)  # hydrogen: -Z<1/r> = -1
    True
    """
    z = np.asarray(zetas, dtype=float)
    return -float(Z) * _moment(n, z, 1)


def kinetic_matrix(n: int, l: int, zetas: npt.ArrayLike) -> FloatArray:
    """Kinetic energy ½ ∫ [P_p' P_q' + l(l+1) P_p P_q / r²] dr (hartree).

    Parameters
    ----------
    n, l : int
        Principal and angular quantum numbers of the functions (n > l).
    zetas : array_like

    Returns
    -------
    ndarray

    Notes
    -----
    With P = N r^n e^{-ζr}, P' = P (n/r - ζ), so the integrand is
    P_p P_q [(n² + l(l+1))/r² - n(ζ_p+ζ_q)/r + ζ_p ζ_q], each term a moment
    N_p N_q Γ(2n-j+1)/s^{2n-j+1}. The form after integration by parts is valid since
    P_p P_q' vanishes at both ends.

    References
    ----------
    Roothaan 1951; Clementi & Roetti 1974.

    Examples
    --------
    >>> bool(abs(kinetic_matrix(1, 0, [1.0])[0, 0] - 0.5) < 1e-15)  # hydrogen 1s: T = ½
    True
    """
    if not 0 <= l < n:
        raise QuantumNumberError(f"l must be < n (n = {n}, l = {l})")
    z = np.asarray(zetas, dtype=float)
    s = z[:, None] + z[None, :]
    product = z[:, None] * z[None, :]
    out = (n * n + l * (l + 1)) * _moment(n, z, 2) - n * s * _moment(n, z, 1) + product * _moment(n, z, 0)
    return np.asarray(0.5 * out, dtype=float)


def _ordered_part(m: int | FloatArray, alpha: FloatArray, n: int | FloatArray,
                  beta: FloatArray) -> tuple[FloatArray, FloatArray]:
    """∫₀^∞ x^m e^{-αx} ∫₀^x y^n e^{-βy} dy dx as (log prefactor, regularised beta factor)."""
    log_full = (special.gammaln(m + 1) + special.gammaln(n + 1)
                - (m + 1) * np.log(alpha) - (n + 1) * np.log(beta))
    if isinstance(m, int) and isinstance(n, int):
        total = alpha + beta
        return log_full, _binomial_tail(n + 1, m + 1, beta / total, alpha / total)
    return log_full, special.betainc(n + 1, m + 1, beta / (alpha + beta))


def _binomial_tail(a: int, b: int, t: FloatArray, w: FloatArray) -> FloatArray:
    """The regularised incomplete beta function I_t(a, b) for whole a, b ≥ 1, with w = 1 − t.

    Notes
    -----
    For whole parameters I_t(a, b) is the upper tail of a binomial distribution,
    Σ_{j=a}^{N} C(N, j) t^j w^{N−j} with N = a + b − 1 (Abramowitz & Stegun 1964,
    26.5.24): b positive terms, formed by the ratio of consecutive terms, so nothing
    cancels; w is passed separately so that it keeps its digits when t is close to 1.
    The b ≤ 15 terms met here cost a few array passes, against about 140 ns per
    element for the general continued fraction of ``scipy.special.betainc`` (which
    made it the largest cost of a heavy atom's Hartree–Fock set-up).

    References
    ----------
    M. Abramowitz and I. A. Stegun, *Handbook of Mathematical Functions* (1964), 26.5.24.
    """
    top = a + b - 1
    term = math.comb(top, a) * t**a * w ** (b - 1)
    total = np.array(term, dtype=float)
    ratio = t / w
    for j in range(a, top):
        term = term * ((top - j) / (j + 1)) * ratio
        total += term
    return total


def rk_product(k: int, power1: int | npt.ArrayLike, alpha: npt.ArrayLike, power2: int | npt.ArrayLike,
               beta: npt.ArrayLike) -> FloatArray:
    """∫∫ x^{p1} e^{-αx} (r<^k / r>^{k+1}) y^{p2} e^{-βy} dx dy for broadcasting α, β.

    Parameters
    ----------
    k : int
        Multipole order (>= 0).
    power1, power2 : int or array_like of int
        Powers of r of the two products of P functions (broadcast with α and β); need
        power_i >= k + 1.
    alpha, beta : array_like
        Exponent sums of the two products (bohr⁻¹), broadcast against each other.

    Returns
    -------
    ndarray

    Notes
    -----
    Split at x = y: the part y < x is A(p1-k-1, α; p2+k, β), the part x < y is
    A(p2-k-1, β; p1+k, α), with

    A(m, α; n, β) = ∫₀^∞ x^m e^{-αx} ∫₀^x y^n e^{-βy} dy dx = m! n! / (α^{m+1} β^{n+1}) · I_t(n+1, m+1),

    t = β/(α+β), I the regularised incomplete beta function: m! n!/(α^{m+1}β^{n+1}) is the
    unrestricted double integral and I_t the probability that a Gamma(n+1, β) variable
    is below an independent Gamma(m+1, α) one. Every term is positive, so nothing
    cancels however different α and β are (the finite sums of the incomplete gamma
    function lose digits when they are); the prefactor is formed in logarithms.

    References
    ----------
    J. C. Slater, *Quantum Theory of Atomic Structure* (McGraw-Hill, 1960), vol. I,
    App. 20 (R^k integrals of Slater-type functions); M. Abramowitz and I. A. Stegun,
    *Handbook of Mathematical Functions* (1964), 6.5 and 26.5.1 (incomplete gamma and
    beta functions).

    Examples
    --------
    >>> v = rk_product(0, 2, 2.0, 2, 2.0)  # F⁰(1s,1s) of hydrogen is 5/8 after normalisation 4·4
    >>> bool(abs(16 * v - 5 / 8) < 1e-15)
    True
    """
    if k < 0 or np.any(np.asarray(power1) < k + 1) or np.any(np.asarray(power2) < k + 1):
        raise QuantumNumberError(f"rk_product needs powers >= k + 1 (k = {k}, {power1!r}, {power2!r})")
    a = np.asarray(alpha, dtype=float)
    b = np.asarray(beta, dtype=float)
    p1 = power1 if isinstance(power1, int) else np.asarray(power1, dtype=float)
    p2 = power2 if isinstance(power2, int) else np.asarray(power2, dtype=float)
    log1, beta1 = _ordered_part(p1 - k - 1, a, p2 + k, b)
    log2, beta2 = _ordered_part(p2 - k - 1, b, p1 + k, a)
    with np.errstate(under="ignore"):
        return np.asarray(np.exp(log1) * beta1 + np.exp(log2) * beta2, dtype=float)


def rk_product_gradient(k: int | npt.ArrayLike, power1: int | npt.ArrayLike, alpha: npt.ArrayLike,
                        power2: int | npt.ArrayLike, beta: npt.ArrayLike,
                        ) -> tuple[FloatArray, FloatArray, FloatArray]:
    """:func:`rk_product` with its derivatives with respect to α and β.

    Parameters
    ----------
    k : int or array_like of int
        Multipole order (>= 0), broadcast with the other arguments.
    power1, alpha, power2, beta
        As for :func:`rk_product` (power_i >= k + 1).

    Returns
    -------
    value, d_alpha, d_beta : ndarray
        The integral J (the same expression as :func:`rk_product`), ∂J/∂α and ∂J/∂β.

    Notes
    -----
    ∂J/∂α = -J(p1 + 1, α; p2, β) (differentiating under the integral sign). With the
    two ordered parts A₁ = A(p1-k-1, α; p2+k, β) and A₂ = A(p2-k-1, β; p1+k, α) of
    :func:`rk_product`, integrating by parts once in the variable of α raises its
    power and leaves a boundary term Γ(p1+p2+1)/(α (α+β)^{p1+p2+1}) with opposite
    signs in the two parts, so

    ∂J/∂α = -[(p1 - k) A₁ + (p1 + k + 1) A₂] / α,
    ∂J/∂β = -[(p2 - k) A₂ + (p2 + k + 1) A₁] / β:

    the derivatives cost no incomplete beta function beyond those of J itself.

    References
    ----------
    Slater, *Quantum Theory of Atomic Structure* (1960), vol. I, App. 20 (as
    :func:`rk_product`).

    Examples
    --------
    Against the raised-power integral and a central difference:

    >>> value, d_alpha, d_beta = rk_product_gradient(1, 4, 3.0, 3, 1.5)
    >>> bool(abs(d_alpha + rk_product(1, 5, 3.0, 3, 1.5)) < 1e-14 * abs(d_alpha))
    True
    >>> h = 1e-5
    >>> fd = (rk_product(1, 4, 3.0, 3, 1.5 + h) - rk_product(1, 4, 3.0, 3, 1.5 - h)) / (2 * h)
    >>> bool(abs(d_beta - fd) < 1e-9 * abs(fd) and value == rk_product(1, 4, 3.0, 3, 1.5))
    True
    """
    kk = np.asarray(k)
    if np.any(kk < 0) or np.any(np.asarray(power1) < kk + 1) or np.any(np.asarray(power2) < kk + 1):
        raise QuantumNumberError(f"rk_product needs powers >= k + 1 (k = {k!r}, {power1!r}, {power2!r})")
    a = np.asarray(alpha, dtype=float)
    b = np.asarray(beta, dtype=float)
    p1 = power1 if isinstance(power1, int) else np.asarray(power1, dtype=float)
    p2 = power2 if isinstance(power2, int) else np.asarray(power2, dtype=float)
    kf = k if isinstance(k, int) else np.asarray(k, dtype=float)
    log1, beta1 = _ordered_part(p1 - kf - 1, a, p2 + kf, b)
    log2, beta2 = _ordered_part(p2 - kf - 1, b, p1 + kf, a)
    with np.errstate(under="ignore"):
        part1, part2 = np.exp(log1) * beta1, np.exp(log2) * beta2
    value = np.asarray(part1 + part2, dtype=float)
    d_alpha = np.asarray(-((p1 - kf) * part1 + (p1 + kf + 1) * part2) / a, dtype=float)
    d_beta = np.asarray(-((p2 - kf) * part2 + (p2 + kf + 1) * part1) / b, dtype=float)
    return value, d_alpha, d_beta


def rk_tensor(k: int, n1: int, zetas1: npt.ArrayLike, n2: int, zetas2: npt.ArrayLike,
              n3: int, zetas3: npt.ArrayLike, n4: int, zetas4: npt.ArrayLike) -> FloatArray:
    """R^k[pq|rs] = ∫∫ P_p(1) P_q(1) r<^k/r>^{k+1} P_r(2) P_s(2) dr1 dr2 for normalised STOs.

    Parameters
    ----------
    k : int
        Multipole order.
    n1, zetas1, ..., n4, zetas4
        Principal quantum number and exponents of the functions p, q (electron 1) and
        r, s (electron 2).

    Returns
    -------
    ndarray of shape (len(zetas1), len(zetas2), len(zetas3), len(zetas4))

    Notes
    -----
    P_p P_q = N_p N_q r^{n1+n2} e^{-(ζ_p+ζ_q) r}; see :func:`rk_product`.

    References
    ----------
    Roothaan 1951; Slater, *Quantum Theory of Atomic Structure* (1960), vol. I, App. 20.

    Examples
    --------
    >>> t = rk_tensor(0, 1, [1.0], 1, [1.0], 1, [1.0], 1, [1.0])
    >>> bool(abs(t[0, 0, 0, 0] - 5 / 8) < 1e-15)  # F⁰(1s,1s) = 5ζ/8
    True
    """
    z1, z2, z3, z4 = (np.asarray(z, dtype=float) for z in (zetas1, zetas2, zetas3, zetas4))
    ln1, ln2, ln3, ln4 = log_norms(n1, z1), log_norms(n2, z2), log_norms(n3, z3), log_norms(n4, z4)
    # The integral depends on (p, q) only through α = ζ_p + ζ_q and on (r, s) through
    # β = ζ_r + ζ_s: evaluate it once per distinct pair of sums (ζ_p + ζ_q = ζ_q + ζ_p
    # exactly in floating point, so a symmetric pair is computed once), then spread.
    alpha, alpha_at = np.unique(z1[:, None] + z2[None, :], return_inverse=True)
    beta, beta_at = np.unique(z3[:, None] + z4[None, :], return_inverse=True)
    distinct = rk_product(k, n1 + n2, alpha[:, None], n3 + n4, beta[None, :])
    # Normalisation folded into the distinct values' rows and columns before spreading:
    # each pair's norm N_p N_q is one exponential of a sum of logs (no 4-index array of
    # exponentials).
    shape = (z1.size, z2.size, z3.size, z4.size)
    norm12 = np.exp(ln1[:, None] + ln2[None, :]).reshape(-1)
    norm34 = np.exp(ln3[:, None] + ln4[None, :]).reshape(-1)
    rows = np.take(distinct, alpha_at.reshape(-1), axis=0)
    values = np.take(rows, beta_at.reshape(-1), axis=1)
    values *= norm12[:, None]
    values *= norm34[None, :]
    return values.reshape(shape)

"""Spherical harmonics: complex Y_lm (Condon–Shortley phase) and real harmonics.

Real harmonics are kept as solid harmonics r^l Y_lm — polynomials in x, y, z — so
that an orbital on a grid is a radial factor of r times a polynomial, with no
trigonometry.
"""

from __future__ import annotations

import math
from functools import cache
from typing import Final

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core._scipy import special
from zeffir.core.config import L_LETTERS, MAX_L
from zeffir.core.orbitals._radial import FloatArray

__all__ = [
    "Monomials",
    "complex_from_real",
    "complex_harmonic",
    "real_harmonic",
    "real_label",
    "real_labels",
    "real_m_from_label",
    "solid_harmonic",
    "solid_harmonic_monomials",
]

#: A polynomial in x, y, z: {(a, b, c): coefficient of x^a y^b z^c}.
Monomials = dict[tuple[int, int, int], float]

_NAMED: Final[dict[int, dict[int, str]]] = {
    0: {0: "s"},
    1: {0: "pz", 1: "px", -1: "py"},
    2: {0: "dz2", 1: "dxz", -1: "dyz", 2: "dx2-y2", -2: "dxy"},
    3: {0: "fz3", 1: "fxz2", -1: "fyz2", 2: "fz(x2-y2)", -2: "fxyz",
        3: "fx(x2-3y2)", -3: "fy(3x2-y2)"},
}


def _check(l: int, m: int) -> None:
    if not 0 <= l <= MAX_L:
        raise QuantumNumberError(f"l must be between 0 and {MAX_L}, got {l}")
    if abs(m) > l:
        raise QuantumNumberError(f"|m| must be at most l = {l}, got m = {m}")


def real_label(l: int, m: int) -> str:
    """Standard label of the real harmonic (l, m): ``px``, ``dz2``, ``fxyz``; ``g+2`` beyond f.

    Notes
    -----
    m > 0 is the cos(mφ) combination and m < 0 the sin(|m|φ) one; m = 0 is Y_l0.

    Examples
    --------
    Each p label names the one Cartesian monomial of its solid harmonic (px ∝ x):

    >>> [real_label(1, m) for m in (1, -1, 0)]
    ['px', 'py', 'pz']
    >>> [[powers for powers, _ in solid_harmonic_monomials(1, m)] for m in (1, -1, 0)]
    [[(1, 0, 0)], [(0, 1, 0)], [(0, 0, 1)]]
    >>> real_label(2, -2), [powers for powers, _ in solid_harmonic_monomials(2, -2)]
    ('dxy', [(1, 1, 0)])
    """
    _check(l, m)
    if l in _NAMED:
        return _NAMED[l][m]
    return f"{L_LETTERS[l]}{m:+d}" if m else f"{L_LETTERS[l]}0"


def real_labels(l: int) -> list[tuple[str, int]]:
    """All (label, m) of a subshell, in the conventional order (m = 0, +1, -1, +2, -2, ...).

    Examples
    --------
    >>> real_labels(2)
    [('dz2', 0), ('dxz', 1), ('dyz', -1), ('dx2-y2', 2), ('dxy', -2)]

    Every subshell lists each m from −l to l once, under 2l + 1 distinct labels:

    >>> all(sorted(m for _, m in real_labels(l)) == list(range(-l, l + 1))
    ...     and len({name for name, _ in real_labels(l)}) == 2 * l + 1 for l in range(7))
    True
    """
    order = [0] + [s * k for k in range(1, l + 1) for s in (1, -1)]
    return [(real_label(l, m), m) for m in order]


def real_m_from_label(l: int, label: str) -> int:
    """The m of a real-harmonic label (``'dxy'`` → -2); raises for an unknown label.

    Examples
    --------
    The inverse of :func:`real_label` for every subshell up to i:

    >>> real_m_from_label(2, "dxy")
    -2
    >>> all(real_m_from_label(l, real_label(l, m)) == m for l in range(7) for m in range(-l, l + 1))
    True
    """
    for name, m in real_labels(l):
        if name == label or name == f"{label}":
            return m
    names = ", ".join(name for name, _ in real_labels(l))
    raise QuantumNumberError(f"{label}: not a real orbital of l = {l} (use {names})")


def complex_harmonic(l: int, m: int, theta: npt.ArrayLike, phi: npt.ArrayLike) -> npt.NDArray[np.complex128]:
    """Complex spherical harmonic Y_l^m(θ, φ) with the Condon–Shortley phase.

    Parameters
    ----------
    l, m : int
        Degree and order, |m| <= l <= 6.
    theta, phi : array_like
        Polar angle θ ∈ [0, π] from +z and azimuth φ from +x (radians).

    Notes
    -----
    Y_l^m = (-1)^m √[(2l+1)/(4π) (l-m)!/(l+m)!] P_l^m(cos θ) e^{imφ}, m >= 0
    (P_l^m without the phase), Y_l^{-m} = (-1)^m conj(Y_l^m). Computed with
    :func:`scipy.special.sph_harm_y`, which includes the phase.

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (1935);
    DLMF §14.30.

    Examples
    --------
    >>> import numpy as np
    >>> y = complex_harmonic(1, 1, np.pi / 2, 0.0)
    >>> bool(np.isclose(y.real, -np.sqrt(3 / (8 * np.pi))))
    True
    """
    _check(l, m)
    return np.asarray(special.sph_harm_y(l, m, theta, phi), dtype=complex)


def complex_from_real(m: int, cosine: npt.ArrayLike, sine: npt.ArrayLike | None = None
                      ) -> npt.NDArray[np.complex128]:
    """Combine the real harmonics of order ±|m| into the complex one of order m.

    Works on anything linear in the harmonics: values on points or on a grid, or
    coefficient arrays of the polynomials r^l Y_lm.

    Parameters
    ----------
    m : int
        Order of the complex harmonic.
    cosine : array_like
        The real harmonic of order +|m| (the cos |m|φ one).
    sine : array_like, optional
        The real harmonic of order −|m| (the sin |m|φ one); not used, and may be
        omitted, when m = 0.

    Returns
    -------
    ndarray of complex
        Y_l^m = (−1)^m (S_l|m| + i S_l,−|m|)/√2 for m > 0,
        (S_l|m| − i S_l,−|m|)/√2 for m < 0, and S_l0 for m = 0.

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (1935), the phase
    convention; DLMF §14.30 (the relation between real and complex harmonics).

    Examples
    --------
    The combination reproduces scipy's complex harmonics with the Condon–Shortley
    phase, for both signs of m:

    >>> import numpy as np
    >>> theta, phi = 0.7, 1.9
    >>> all(bool(np.isclose(complex_from_real(m, real_harmonic(2, abs(m), theta, phi),
    ...                                       real_harmonic(2, -abs(m), theta, phi)),
    ...                     complex_harmonic(2, m, theta, phi))) for m in (-2, -1, 1, 2))
    True
    """
    if m == 0:
        return np.asarray(cosine, dtype=complex)
    if sine is None:
        raise QuantumNumberError(f"m = {m}: the real harmonic of order -|m| is needed")
    re = np.asarray(cosine)
    im = np.asarray(sine)
    if m > 0:
        return np.asarray((-1) ** m * (re + 1j * im) / math.sqrt(2.0), dtype=complex)
    return np.asarray((re - 1j * im) / math.sqrt(2.0), dtype=complex)


@cache
def _pi_polys(m: int, l_max: int) -> list[Monomials]:
    """Π_l^m(z, r²) = r^{l-m} d^m P_l/dt^m (z/r) as polynomials, for l = m..l_max.

    Recurrence (l - m) Π_l = (2l - 1) z Π_{l-1} - (l + m - 1) r² Π_{l-2},
    Π_m = (2m - 1)!!, Π_{m+1} = (2m + 1) z Π_m.
    """
    start = float(math.prod(range(1, 2 * m, 2)))
    polys: list[Monomials] = [{(0, 0, 0): start}]
    if l_max > m:
        polys.append({(0, 0, 1): (2 * m + 1) * start})
    for l in range(m + 2, l_max + 1):
        new: Monomials = {}
        for (a, b, c), v in polys[-1].items():
            key = (a, b, c + 1)
            new[key] = new.get(key, 0.0) + (2 * l - 1) * v / (l - m)
        for (a, b, c), v in polys[-2].items():
            for key in ((a + 2, b, c), (a, b + 2, c), (a, b, c + 2)):
                new[key] = new.get(key, 0.0) - (l + m - 1) * v / (l - m)
        polys.append(new)
    return polys


def _xy_power(m: int) -> tuple[Monomials, Monomials]:
    """Real and imaginary parts of (x + i y)^m as polynomials."""
    re: Monomials = {}
    im: Monomials = {}
    for k in range(m + 1):
        coeff = float(math.comb(m, k))
        # i^k: 1, i, -1, -i
        if k % 4 == 0:
            re[(m - k, k, 0)] = coeff
        elif k % 4 == 1:
            im[(m - k, k, 0)] = coeff
        elif k % 4 == 2:
            re[(m - k, k, 0)] = -coeff
        else:
            im[(m - k, k, 0)] = -coeff
    return re, im


@cache
def solid_harmonic_monomials(l: int, m: int) -> tuple[tuple[tuple[int, int, int], float], ...]:
    """Coefficients of the real solid harmonic r^l Y_lm as a polynomial in x, y, z.

    Parameters
    ----------
    l, m : int
        Degree and real order (m > 0: cos mφ; m < 0: sin |m|φ).

    Returns
    -------
    tuple of ((a, b, c), coefficient)
        r^l Y_lm = Σ coefficient · x^a y^b z^c; terms with zero coefficient dropped.

    Notes
    -----
    r^l Y_lm = N_lm Π_l^{|m|}(z, r²) · Re or Im (x + iy)^{|m|} with
    N_lm = √[(2 - δ_m0)(2l+1)/(4π) (l-|m|)!/(l+|m|)!]. With this sign choice the
    real harmonic equals √2 (-1)^m Re Y_l^m (m > 0) and √2 (-1)^m Im Y_l^{|m|}
    (m < 0) of the Condon–Shortley complex harmonics, so px ∝ +x.

    References
    ----------
    T. Helgaker, P. Jørgensen and J. Olsen, *Molecular Electronic-Structure Theory*
    (Wiley, 2000), §6.4.2.

    Examples
    --------
    dz2 is √(5/16π) (2z² − x² − y²):

    >>> import numpy as np
    >>> terms, k = dict(solid_harmonic_monomials(2, 0)), np.sqrt(5 / (16 * np.pi))
    >>> sorted(terms), bool(np.allclose([terms[0, 0, 2], terms[2, 0, 0], terms[0, 2, 0]], [2 * k, -k, -k]))
    ([(0, 0, 2), (0, 2, 0), (2, 0, 0)], True)

    A solid harmonic is a harmonic polynomial, ∇²(r^l Y_lm) = 0 (here l = 4, m = 1):

    >>> from collections import Counter
    >>> laplacian = Counter()
    >>> for (a, b, c), value in solid_harmonic_monomials(4, 1):
    ...     laplacian[a - 2, b, c] += a * (a - 1) * value
    ...     laplacian[a, b - 2, c] += b * (b - 1) * value
    ...     laplacian[a, b, c - 2] += c * (c - 1) * value
    >>> max(abs(value) for value in laplacian.values()) < 1e-12
    True
    """
    _check(l, m)
    am = abs(m)
    pi_poly = _pi_polys(am, l)[l - am]
    re, im = _xy_power(am)
    xy = re if m >= 0 else im
    norm = math.sqrt((2 - (m == 0)) * (2 * l + 1) / (4 * math.pi)
                     * math.factorial(l - am) / math.factorial(l + am))
    out: Monomials = {}
    for (a1, b1, c1), v1 in pi_poly.items():
        for (a2, b2, c2), v2 in xy.items():
            key = (a1 + a2, b1 + b2, c1 + c2)
            out[key] = out.get(key, 0.0) + norm * v1 * v2
    return tuple(sorted((k, v) for k, v in out.items() if v != 0.0))


def solid_harmonic(l: int, m: int, x: npt.ArrayLike, y: npt.ArrayLike, z: npt.ArrayLike) -> FloatArray:
    """Evaluate the real solid harmonic r^l Y_lm(x, y, z) on arrays (any units of length).

    Examples
    --------
    The addition theorem (Unsöld, Ann. Phys. 387, 355 (1927)): Σ_m (r^l Y_lm)² =
    (2l+1)/4π r^{2l} at any point, for every l up to 6:

    >>> import numpy as np
    >>> x, y, z = np.random.default_rng(7).normal(size=(3, 50))
    >>> r2 = x * x + y * y + z * z
    >>> all(bool(np.allclose(sum(solid_harmonic(l, m, x, y, z) ** 2 for m in range(-l, l + 1)),
    ...                      (2 * l + 1) / (4 * np.pi) * r2**l)) for l in range(7))
    True
    """
    xx, yy, zz = (np.asarray(v, dtype=float) for v in (x, y, z))
    out = np.zeros(np.broadcast(xx, yy, zz).shape)
    for (a, b, c), coeff in solid_harmonic_monomials(l, m):
        out = out + coeff * xx**a * yy**b * zz**c
    return out


def real_harmonic(l: int, m: int, theta: npt.ArrayLike, phi: npt.ArrayLike) -> FloatArray:
    """Real spherical harmonic Y_lm(θ, φ), with the sign convention of :func:`solid_harmonic_monomials`.

    Examples
    --------
    >>> import numpy as np
    >>> bool(np.isclose(real_harmonic(1, 1, np.pi / 2, 0.0), np.sqrt(3 / (4 * np.pi))))
    True
    """
    th, ph = np.asarray(theta, dtype=float), np.asarray(phi, dtype=float)
    st = np.sin(th)
    return solid_harmonic(l, m, st * np.cos(ph), st * np.sin(ph), np.cos(th))

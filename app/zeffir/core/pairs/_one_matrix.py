"""One-matrix, spin densities, pair density and exchange hole of one Slater determinant.

For a determinant the two-electron picture follows from the one-matrix alone
(McWeeny 1989, §5.5; Parr & Yang 1989, §2.4):

    γ^σ(r1, r2) = Σ_{i∈σ} φ_i*(r1) φ_i(r2),       ρ^σ(r) = γ^σ(r, r),
    ρ2^{σσ'}(r1, r2) = ρ^σ(r1) ρ^{σ'}(r2) − δ_{σσ'} |γ^σ(r1, r2)|²,
    h_x^σ(r1; r2) = −|γ^σ(r1, r2)|² / ρ^σ(r1).

Orbitals are φ = R_nl(r) Y_l^m(r̂) (complex harmonics, Condon–Shortley phase) with
the radial functions of an :class:`~zeffir.core.OrbitalSet`. The one-matrix is
organised in blocks of one spin and one l whose occupied m all share the same set of
subshells; inside a block

    γ_block(r1, r2) = Σ_{m∈block} Y_l^m*(r̂1) Y_l^m(r̂2) · Σ_{nn'} R_nl(r1) [S⁻¹]_{nn'} R_n'l(r2),

with S_{nn'} = ∫ R_nl R_n'l r² dr. For a block holding every m the angular sum is
(2l+1)/(4π) P_l(cos γ12) (the addition theorem), so its cost does not grow with 2l+1.

Why S⁻¹: the models' radial functions need not be orthogonal (nodeless Slater-type
1s and 2s overlap). A determinant is unchanged, up to a factor, by any invertible
mixing of its orbitals of one spin, so its densities are those of the orthonormalised
set, which is what the S⁻¹ form gives (Löwdin 1955). With orthonormal orbitals
(the bare-nucleus hydrogenic model) S = 1 and ρ = Σ|φ|².
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass
from typing import Final

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import ModelError, QuantumNumberError
from zeffir.core.config import Subshell
from zeffir.core.orbitals import (
    FloatArray,
    HydrogenicRadial,
    OrbitalSet,
    RadialFunction,
    SlaterRadial,
    complex_from_real,
    solid_harmonic,
)
from zeffir.core.pairs._determinant import DOWN, UP, Determinant, DeterminantError, hund_determinant

__all__ = [
    "ComplexArray",
    "complex_solid_harmonic",
    "conditional_density",
    "exchange_hole",
    "one_matrix",
    "pair_density",
    "radial_overlap",
    "solid_legendre",
    "spin_density",
]

ComplexArray = npt.NDArray[np.complex128]

_FOUR_PI: Final[float] = 4.0 * math.pi
#: Composite Gauss–Legendre rule in t = √r for overlaps without a closed form.
_OVERLAP_PANELS: Final[int] = 64
_OVERLAP_NODES: Final[int] = 16
#: Beyond this condition number of S the orbitals of a block are taken as dependent.
_MAX_CONDITION: Final[float] = 1e10


# --- radial overlaps --------------------------------------------------------------------


def radial_overlap(a: RadialFunction, b: RadialFunction) -> float:
    """Overlap S_ab = ∫₀^∞ R_a(r) R_b(r) r² dr of two radial functions (dimensionless).

    Parameters
    ----------
    a, b : RadialFunction
        Normalised radial functions (∫R²r²dr = 1).

    Returns
    -------
    float
        1 for identical functions; 0 for hydrogenic functions of the same l and Z
        and different n (eigenfunctions of one Hamiltonian); the closed form for two
        Slater-type functions; otherwise a composite Gauss–Legendre quadrature in
        t = √r (64 panels of 16 points, accurate to rounding for smooth functions).

    Notes
    -----
    Slater-type: R = N r^{n*-1} e^{-ζr}, N = (2ζ)^{n*+1/2}/√Γ(2n*+1), so
    S = N_a N_b Γ(n*_a + n*_b + 1) / (ζ_a + ζ_b)^{n*_a + n*_b + 1}.

    References
    ----------
    J. C. Slater, Phys. Rev. 36, 57 (1930) (the functions); the integral is
    ∫₀^∞ r^k e^{-αr} dr = Γ(k+1)/α^{k+1} (DLMF 5.9.1).

    Examples
    --------
    >>> from zeffir.core.orbitals import SlaterRadial
    >>> a = SlaterRadial(1, 0, 1.0, 2.0)
    >>> round(radial_overlap(a, a), 12)
    1.0
    """
    if a is b or a.shape_key() == b.shape_key():
        return 1.0
    if isinstance(a, HydrogenicRadial) and isinstance(b, HydrogenicRadial) and a.l == b.l and a.Z == b.Z:
        return 1.0 if a.n == b.n else 0.0
    if isinstance(a, SlaterRadial) and isinstance(b, SlaterRadial):
        power = a.n_star + b.n_star + 1.0
        log_value = (
            (a.n_star + 0.5) * math.log(2 * a.zeta) + (b.n_star + 0.5) * math.log(2 * b.zeta)
            - 0.5 * (math.lgamma(2 * a.n_star + 1) + math.lgamma(2 * b.n_star + 1))
            + math.lgamma(power) - power * math.log(a.zeta + b.zeta)
        )
        return float(math.exp(log_value))
    top = math.sqrt(max(a.extent(1e-16), b.extent(1e-16)))
    nodes, weights = np.polynomial.legendre.leggauss(_OVERLAP_NODES)
    edges = np.linspace(0.0, top, _OVERLAP_PANELS + 1)
    half = 0.5 * np.diff(edges)
    t = (edges[:-1, None] + half[:, None] * (nodes[None, :] + 1.0)).ravel()
    w = (half[:, None] * weights[None, :]).ravel()
    r = t * t
    return float(np.sum(w * a(r) * b(r) * r * r * 2.0 * t))


# --- blocks of the one-matrix -----------------------------------------------------------


@dataclass(frozen=True, eq=False)
class _Block:
    """Spin-orbitals of one spin and one l whose m share the same subshells."""

    spin: int
    l: int
    ms: tuple[int, ...]
    subshells: tuple[Subshell, ...]
    radials: tuple[RadialFunction, ...]
    inverse_overlap: FloatArray

    @property
    def full(self) -> bool:
        """True when every m of l is in the block: the addition theorem applies."""
        return len(self.ms) == 2 * self.l + 1


def _check_spin(spin: int) -> None:
    if spin not in (UP, DOWN):
        raise QuantumNumberError(f"spin = {spin}: use +1 (up, α) or -1 (down, β)")


def _blocks(orbitals: OrbitalSet, determinant: Determinant | None) -> tuple[_Block, ...]:
    """The blocks of a determinant of this orbital set (cached on the set)."""
    if determinant is None:
        hund = orbitals.memo.get("pair_blocks_hund")
        if isinstance(hund, tuple):
            return hund
        blocks = _blocks(orbitals, hund_determinant(orbitals.configuration))
        orbitals.memo["pair_blocks_hund"] = blocks
        return blocks
    det = determinant
    if det.configuration.occupations != orbitals.configuration.occupations:
        raise DeterminantError(
            f"the determinant places {det.configuration.text}, but the orbitals are for "
            f"{orbitals.configuration.text}"
        )
    cache = orbitals.memo.setdefault("pair_blocks", {})
    assert isinstance(cache, dict)
    found = cache.get(det)
    if isinstance(found, tuple):
        return found
    # (spin, l, m) -> subshells holding that spin-orbital, in (n, l) order.
    holders: dict[tuple[int, int, int], list[Subshell]] = {}
    for item in det.spin_orbitals:
        holders.setdefault((item.spin, item.subshell.l, item.m), []).append(item.subshell)
    groups: dict[tuple[int, int, tuple[Subshell, ...]], list[int]] = {}
    for (spin, l, m), holding in holders.items():
        groups.setdefault((spin, l, tuple(sorted(holding))), []).append(m)
    made = []
    for (spin, l, subs), ms in sorted(groups.items(), key=lambda kv: (-kv[0][0], kv[0][1], kv[0][2])):
        radials = tuple(orbitals.orbital(sub).radial for sub in subs)
        overlap = np.array([[radial_overlap(a, b) for b in radials] for a in radials])
        if np.linalg.cond(overlap) > _MAX_CONDITION:
            labels = " ".join(sub.label for sub in subs)
            raise ModelError(f"{labels}: the radial functions are linearly dependent")
        inverse = np.linalg.inv(overlap)
        inverse = 0.5 * (inverse + inverse.T)
        inverse.flags.writeable = False
        made.append(_Block(spin, l, tuple(sorted(ms, reverse=True)), subs, radials, inverse))
    result = tuple(made)
    cache[det] = result
    return result


# --- angular pieces ---------------------------------------------------------------------


def solid_legendre(l: int, s: npt.ArrayLike, q: npt.ArrayLike) -> FloatArray:
    """Π_l(s, q) = r^l P_l(s/r) with q = r², a polynomial in s and q (no division).

    Notes
    -----
    Bonnet's recurrence l P_l = (2l-1) x P_{l-1} - (l-1) P_{l-2} multiplied by r^l:
    l Π_l = (2l-1) s Π_{l-1} - (l-1) q Π_{l-2}, Π_0 = 1, Π_1 = s (DLMF 18.9.1).
    With s = r̂1·r2 and q = r2² it is r2^l P_l(cos γ12), the factor of the addition
    theorem that multiplies R(r2)/r2^l.

    Examples
    --------
    >>> float(solid_legendre(2, 1.0, 4.0))  # r = 2, cos γ = 1/2: 4 P_2(1/2) = 4 (-1/8)
    -0.5
    """
    ss = np.asarray(s, dtype=float)
    qq = np.asarray(q, dtype=float)
    previous = np.ones(np.broadcast(ss, qq).shape)
    if l == 0:
        return previous
    current = ss * np.ones_like(previous)
    for k in range(2, l + 1):
        previous, current = current, ((2 * k - 1) * ss * current - (k - 1) * qq * previous) / k
    return current


def complex_solid_harmonic(
    l: int, m: int, x: npt.ArrayLike, y: npt.ArrayLike, z: npt.ArrayLike
) -> ComplexArray:
    """r^l Y_l^m(x, y, z), the complex solid harmonic with the Condon–Shortley phase.

    Notes
    -----
    From the real solid harmonics S_{l,±|m|} (:func:`~zeffir.core.orbitals.solid_harmonic`):
    r^l Y_l^m = (-1)^m (S_{l,m} + i S_{l,-m})/√2 for m > 0,
    (S_{l,|m|} - i S_{l,-|m|})/√2 for m < 0, and S_{l,0} for m = 0.

    References
    ----------
    E. U. Condon and G. H. Shortley, *The Theory of Atomic Spectra* (1935); DLMF §14.30.

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import complex_harmonic
    >>> x, y, z = 0.6, 0.0, 0.8  # θ = acos 0.8, φ = 0
    >>> bool(np.isclose(complex_solid_harmonic(1, 1, x, y, z), complex_harmonic(1, 1, np.arccos(z), 0.0)))
    True
    """
    if m == 0:
        return complex_from_real(0, solid_harmonic(l, 0, x, y, z))
    return complex_from_real(m, solid_harmonic(l, abs(m), x, y, z), solid_harmonic(l, -abs(m), x, y, z))


# --- point evaluators -------------------------------------------------------------------


def _as_points(points: npt.ArrayLike, name: str) -> FloatArray:
    p = np.asarray(points, dtype=float)
    if p.ndim == 0 or p.shape[-1] != 3:
        raise QuantumNumberError(f"{name} must have shape (..., 3) (x, y, z in bohr), got {p.shape}")
    return p


def _unit(p: FloatArray) -> tuple[FloatArray, FloatArray]:
    """|p| and p/|p| (the zero vector at the nucleus, where every l > 0 term vanishes)."""
    r = np.sqrt(np.sum(p * p, axis=-1))
    safe = np.where(r > 0, r, 1.0)
    return r, p / safe[..., None]


class _RadialCache:
    """Radial functions on one array of radii, each evaluated once.

    Given the set's ``radials`` (the fast slice path), functions with equal
    :meth:`~zeffir.core.RadialFunction.shape_key` have identical values (2s and 2p
    under Slater's rules): R/r^l is evaluated for the one of largest l, the others
    follow by multiplying with r^(l_max − l), and R = (R/r^l) r^l, so no power of r
    is taken through logarithms. Without ``radials`` (the point evaluators, which the
    tests hold as the reference) every function is called directly.
    """

    def __init__(self, r: FloatArray, radials: Iterable[RadialFunction] = ()) -> None:
        self.r = r
        self._top: dict[object, RadialFunction] = {}
        for radial in radials:
            key = radial.shape_key()
            if key not in self._top or radial.l > self._top[key].l:
                self._top[key] = radial
        self._over: dict[int, FloatArray] = {}
        self._values: dict[int, FloatArray] = {}
        self._powers: dict[int, FloatArray] = {}

    def _power(self, k: int) -> FloatArray:
        if k not in self._powers:
            self._powers[k] = self.r if k == 1 else self._power(k - 1) * self.r
        return self._powers[k]

    def over_r_l(self, radial: RadialFunction) -> FloatArray:
        """R(r)/r^l."""
        key = id(radial)
        if key not in self._over:
            top = self._top.get(radial.shape_key())
            if top is not None and top.l > radial.l:
                self._over[key] = self.over_r_l(top) * self._power(top.l - radial.l)
            else:
                self._over[key] = radial.over_r_l(self.r)
        return self._over[key]

    def value(self, radial: RadialFunction) -> FloatArray:
        """R(r)."""
        if radial.l == 0 and self._top:
            return self.over_r_l(radial)
        key = id(radial)
        if key not in self._values:
            self._values[key] = (self.over_r_l(radial) * self._power(radial.l) if self._top
                                 else radial(self.r))
        return self._values[key]


def _coefficients(block: _Block, at_r1: _RadialCache) -> FloatArray:
    """c_n(r1) = Σ_n' [S⁻¹]_{nn'} R_n'(r1), the r1 side of a block's radial factor; shape (k, ...)."""
    values = np.stack([at_r1.value(radial) for radial in block.radials])
    return np.tensordot(block.inverse_overlap, values, axes=1)


def one_matrix(
    orbitals: OrbitalSet,
    r1: npt.ArrayLike,
    r2: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
    addition_theorem: bool = True,
) -> ComplexArray:
    """The spin one-matrix γ^σ(r1, r2) = Σ_{i∈σ} φ_i*(r1) φ_i(r2) of a determinant (bohr⁻³).

    Parameters
    ----------
    orbitals : OrbitalSet
        Radial functions of the configuration (any model).
    r1, r2 : array_like, shape (..., 3)
        Cartesian points (bohr); the leading shapes broadcast against each other
        (typically r1 is one point of shape (3,)).
    spin : int
        +1 (up, α) or -1 (down, β).
    determinant : Determinant, optional
        Which spin-orbitals are occupied; the Hund determinant by default.
    addition_theorem : bool
        Sum a block holding every m of l with the addition theorem (default) or
        explicitly over m; both give the same numbers (the tests check it).

    Returns
    -------
    ndarray of complex, broadcast shape
        γ^σ(r1, r2); Hermitian, γ(r2, r1) = γ(r1, r2)*.

    Notes
    -----
    With non-orthogonal radial functions the orbitals of each (spin, l, m) are
    orthonormalised implicitly: γ = Σ Y*(r̂1) Y(r̂2) Σ_{nn'} R_n(r1) [S⁻¹]_{nn'} R_n'(r2)
    (Löwdin 1955). A closed block uses
    Σ_m Y_l^m*(r̂1) Y_l^m(r̂2) = (2l+1)/(4π) P_l(r̂1·r̂2) (Unsöld 1927), evaluated
    as Π_l(r̂1·r2, r2²) R/r^l so nothing is divided at the nucleus.

    References
    ----------
    R. McWeeny, *Methods of Molecular Quantum Mechanics*, 2nd ed. (Academic Press,
    1989), §5.5; P.-O. Löwdin, Phys. Rev. 97, 1474 (1955); A. Unsöld, Ann. Phys.
    387, 355 (1927).

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import build
    >>> ne = build("Ne", "hydrogenic")
    >>> p = np.array([0.1, 0.2, 0.3])
    >>> bool(np.isclose(one_matrix(ne, p, p).real, spin_density(ne, p, +1)))
    True
    """
    _check_spin(spin)
    p1 = _as_points(r1, "r1")
    p2 = _as_points(r2, "r2")
    blocks = [b for b in _blocks(orbitals, determinant) if b.spin == spin]
    shape = np.broadcast_shapes(p1.shape[:-1], p2.shape[:-1])
    out = np.zeros(shape, dtype=complex)
    if not blocks:
        return out
    rad1, unit1 = _unit(p1)
    rad2 = np.sqrt(np.sum(p2 * p2, axis=-1))
    at_r1, at_r2 = _RadialCache(rad1), _RadialCache(rad2)
    for block in blocks:
        coefficients = _coefficients(block, at_r1)
        radial = sum((c * at_r2.over_r_l(rf) for c, rf in zip(coefficients, block.radials, strict=True)),
                     np.zeros(shape))
        if block.full and addition_theorem:
            s = np.sum(unit1 * p2, axis=-1)
            angular: FloatArray | ComplexArray = (2 * block.l + 1) / _FOUR_PI * solid_legendre(
                block.l, s, rad2 * rad2
            )
        else:
            angular = np.zeros(np.broadcast_shapes(p1.shape[:-1], p2.shape[:-1]), dtype=complex)
            for m in block.ms:
                y1 = complex_solid_harmonic(block.l, m, unit1[..., 0], unit1[..., 1], unit1[..., 2])
                angular = angular + np.conj(y1) * complex_solid_harmonic(
                    block.l, m, p2[..., 0], p2[..., 1], p2[..., 2]
                )
        out += angular * radial
    return out


def spin_density(
    orbitals: OrbitalSet,
    points: npt.ArrayLike,
    spin: int | None = None,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Density ρ^σ(r) of one spin (or ρ = ρ^α + ρ^β) of a determinant (bohr⁻³).

    Parameters
    ----------
    orbitals : OrbitalSet
    points : array_like, shape (..., 3)
        Cartesian points (bohr).
    spin : int or None
        +1 (up, α), -1 (down, β) or None for both spins together.
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray, shape (...)
        ρ^σ(r) = Σ_block Σ_{m∈block} |Y_l^m(r̂)|² Σ_{nn'} R_n(r) [S⁻¹]_{nn'} R_n'(r).

    Notes
    -----
    A block holding every m contributes (2l+1)/(4π) Σ R S⁻¹ R, a spherical term
    (Unsöld's theorem); an open subshell's partial blocks are not spherical. With
    orthonormal radial functions and only closed subshells this equals
    :func:`~zeffir.core.spherical_density`. ∫ ρ^σ d³r = N_σ.

    References
    ----------
    A. Unsöld, Ann. Phys. 387, 355 (1927); P.-O. Löwdin, Phys. Rev. 97, 1474 (1955).

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import build, spherical_density
    >>> argon = build("Ar", "hydrogenic")  # orthonormal orbitals, closed shells
    >>> bool(np.isclose(spin_density(argon, (0.3, 0.1, -0.2)), spherical_density(argon, np.sqrt(0.14))))
    True
    """
    p = _as_points(points, "points")
    if spin is not None:
        _check_spin(spin)
    r, unit = _unit(p)
    cache = _RadialCache(r)
    out = np.zeros(p.shape[:-1])
    for block in _blocks(orbitals, determinant):
        if spin is not None and block.spin != spin:
            continue
        values = [cache.value(rf) for rf in block.radials]
        quadratic = sum((block.inverse_overlap[i, j] * values[i] * values[j]
                         for i in range(len(values)) for j in range(len(values))), np.zeros_like(r))
        if block.full:
            angular: FloatArray = np.full_like(r, (2 * block.l + 1) / _FOUR_PI)
        else:
            angular = np.zeros_like(r)
            for m in block.ms:
                y = complex_solid_harmonic(block.l, m, unit[..., 0], unit[..., 1], unit[..., 2])
                angular += y.real**2 + y.imag**2
        out += angular * quadratic
    return out


def _density_at_r1(orbitals: OrbitalSet, r1: FloatArray, spin: int,
                   determinant: Determinant | None) -> FloatArray:
    rho = spin_density(orbitals, r1, spin, determinant)
    if not np.all(rho > 0):
        raise _no_density(spin, r1)
    return rho


def _no_density(spin: int, r1: FloatArray) -> QuantumNumberError:
    who = "spin-up (α)" if spin == UP else "spin-down (β)"
    return QuantumNumberError(
        f"no {who} density at r1 = {np.round(r1, 6).tolist()}: the hole and the conditional "
        f"density are defined only where ρ^σ(r1) > 0"
    )


def pair_density(
    orbitals: OrbitalSet,
    r1: npt.ArrayLike,
    r2: npt.ArrayLike,
    spins: tuple[int, int] | None = None,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Pair density ρ2^{σσ'}(r1, r2) of a determinant (bohr⁻⁶).

    Parameters
    ----------
    orbitals : OrbitalSet
    r1, r2 : array_like, shape (..., 3)
        Points (bohr), broadcast against each other.
    spins : (int, int) or None
        Spin σ of the electron at r1 and σ' of the one at r2; None sums all four.
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray
        ρ2^{σσ'}(r1, r2) = ρ^σ(r1) ρ^{σ'}(r2) − δ_{σσ'} |γ^σ(r1, r2)|².

    Notes
    -----
    Normalised to the number of ordered pairs: ∫∫ ρ2^{σσ'} = N_σ (N_σ' − δ_{σσ'}),
    ∫∫ Σ ρ2 = N(N − 1). The same-spin pair density vanishes at r1 = r2 (the Fermi
    hole); a single determinant has no Coulomb correlation, so the opposite-spin one
    is a plain product.

    References
    ----------
    R. McWeeny, *Methods of Molecular Quantum Mechanics* (1989), §5.5;
    R. G. Parr and W. Yang, *Density-Functional Theory of Atoms and Molecules*
    (Oxford, 1989), §2.4.

    Examples
    --------
    >>> from zeffir.core import build
    >>> p = (0.2, -0.4, 0.3)
    >>> bool(abs(pair_density(build("O"), p, p, (-1, -1))) < 1e-14)
    True
    """
    p1 = _as_points(r1, "r1")
    p2 = _as_points(r2, "r2")
    pairs = [(UP, UP), (UP, DOWN), (DOWN, UP), (DOWN, DOWN)] if spins is None else [tuple(spins)]
    out = np.zeros(np.broadcast_shapes(p1.shape[:-1], p2.shape[:-1]))
    for s1, s2 in pairs:
        _check_spin(s1)
        _check_spin(s2)
        out = out + spin_density(orbitals, p1, s1, determinant) * spin_density(orbitals, p2, s2, determinant)
        if s1 == s2:
            gamma = one_matrix(orbitals, p1, p2, s1, determinant)
            out = out - (gamma.real**2 + gamma.imag**2)
    return out


def exchange_hole(
    orbitals: OrbitalSet,
    r1: npt.ArrayLike,
    r2: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Exchange (Fermi) hole h_x^σ(r1; r2) around an electron of spin σ at r1 (bohr⁻³).

    Parameters
    ----------
    orbitals : OrbitalSet
    r1 : array_like, shape (3,) or (..., 3)
        Reference electron (bohr); ρ^σ(r1) must be positive.
    r2 : array_like, shape (..., 3)
        Where the hole is evaluated (bohr).
    spin : int
        Spin of the reference electron, +1 (α) or -1 (β).
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray
        h_x^σ(r1; r2) = −|γ^σ(r1, r2)|² / ρ^σ(r1) <= 0.

    Notes
    -----
    ∫ h_x^σ(r1; r2) d³r2 = −1 for every r1 (the hole removes exactly one electron
    of the same spin), and h_x^σ(r1; r1) = −ρ^σ(r1).

    References
    ----------
    R. G. Parr and W. Yang, *Density-Functional Theory of Atoms and Molecules* (1989),
    §2.4, eqs. (2.4.9)–(2.4.11); J. C. Slater, Phys. Rev. 81, 385 (1951).

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import build
    >>> ne = build("Ne", "hydrogenic")
    >>> p = np.array([0.0, 0.0, 0.4])
    >>> bool(np.isclose(exchange_hole(ne, p, p), -spin_density(ne, p, +1)))
    True
    """
    _check_spin(spin)
    p1 = _as_points(r1, "r1")
    rho = _density_at_r1(orbitals, p1, spin, determinant)
    gamma = one_matrix(orbitals, p1, r2, spin, determinant)
    return np.asarray(-(gamma.real**2 + gamma.imag**2) / rho, dtype=float)


def conditional_density(
    orbitals: OrbitalSet,
    r1: npt.ArrayLike,
    r2: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Density of the other N − 1 electrons given one of spin σ at r1 (bohr⁻³).

    Parameters
    ----------
    orbitals : OrbitalSet
    r1 : array_like, shape (3,) or (..., 3)
        The electron held fixed (bohr); ρ^σ(r1) must be positive.
    r2 : array_like, shape (..., 3)
        Where the others are found (bohr).
    spin : int
        Its spin, +1 (α) or -1 (β).
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray
        Σ_σ' ρ2^{σσ'}(r1, r2) / ρ^σ(r1) = ρ(r2) + h_x^σ(r1; r2).

    Notes
    -----
    Integrates to N − 1 over r2 and never goes negative: at r2 = r1 only the
    electrons of the other spin remain.

    References
    ----------
    R. G. Parr and W. Yang (1989), §2.4; R. McWeeny (1989), §5.5.

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import build
    >>> nitrogen, p = build("N"), np.array([0.1, 0.3, -0.2])
    >>> bool(np.isclose(conditional_density(nitrogen, p, p, +1), spin_density(nitrogen, p, -1)))
    True
    """
    return spin_density(orbitals, r2, None, determinant) + exchange_hole(
        orbitals, r1, r2, spin, determinant
    )

"""Pair density, exchange hole and conditional density on a plane slice, for a fixed r1.

Structure used (as in :mod:`zeffir.core.density`): the grid coordinates are exactly
symmetric about 0, so every radial factor — it depends only on
|r2|² = offset² + u² + v² — is evaluated on one quadrant and mirrored. The angular
factors are polynomials of degree l in (u, v): a closed block contributes
(2l+1)/(4π) Π_l(r̂1·r2, r2²) (the addition theorem, Π_l from Bonnet's recurrence,
so the cost does not grow with 2l + 1) and an open one
Σ_m Y_l^m*(r̂1) r2^l Y_l^m(r̂2); either is evaluated along each grid row by Horner's
rule, with no trigonometry. l = 0 blocks are purely radial and share one term.
|γ|² is formed in one pass by the compiled kernel of ``_kernels.py``, or with plain
numpy when numba is absent or disabled (``ZEFFIR_NO_NUMBA=1``).
"""

from __future__ import annotations

import math
from functools import lru_cache
from typing import Any, Final, NamedTuple

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core.density import (
    Plane,
    fill_mirrored,
    multiply_mirrored,
    plane_polynomial,
    polynomial_on_grid,
    polynomial_product,
    quadrant_radii,
)
from zeffir.core.orbitals import FloatArray, OrbitalSet, RadialFunction, complex_from_real
from zeffir.core.pairs._determinant import UP, Determinant
from zeffir.core.pairs._kernels import compiled_modulus_squared
from zeffir.core.pairs._one_matrix import (
    ComplexArray,
    _as_points,
    _Block,
    _blocks,
    _check_spin,
    _coefficients,
    _no_density,
    _RadialCache,
    _unit,
    complex_solid_harmonic,
)

__all__ = [
    "ReferencePanels",
    "conditional_density_on_plane",
    "exchange_hole_on_plane",
    "pair_density_on_plane",
    "reference_panels_on_plane",
    "spin_density_on_plane",
]

_FOUR_PI: Final[float] = 4.0 * math.pi

#: A real or complex grid (closed blocks give real one-matrices, open ones complex).
_Grid = npt.NDArray[Any]


# --- grid helpers -----------------------------------------------------------------------


@lru_cache(maxsize=8)
def _quadrant_radii(plane: Plane) -> FloatArray:
    """|r| on the non-negative quadrant of the grid (cached per plane, read-only)."""
    radii = quadrant_radii(plane)
    radii.flags.writeable = False
    return radii


@lru_cache(maxsize=8)
def _basis(plane: Plane) -> tuple[FloatArray, FloatArray, FloatArray]:
    return plane.basis()


def _legendre_polynomial(l: int, plane: Plane, direction: FloatArray) -> FloatArray:
    """Coefficients in (u, v) of Π_l(r̂1·r2, r2²) = r2^l P_l(cos γ12) on the plane.

    r2 = offset·n̂ + u ê₁ + v ê₂, so r̂1·r2 = offset (r̂1·n̂) + u (r̂1·ê₁) + v (r̂1·ê₂)
    and r2² = offset² + u² + v²; Bonnet's recurrence
    k Π_k = (2k-1) s Π_{k-1} - (k-1) q Π_{k-2} (DLMF 18.9.1) is applied to the
    coefficient arrays, products being 2-D convolutions of them.
    """
    n, e1, e2 = _basis(plane)
    s = np.array([[plane.offset * float(direction @ n), float(direction @ e2)],
                  [float(direction @ e1), 0.0]])
    q = np.zeros((3, 3))
    q[0, 0] = plane.offset**2
    q[2, 0] = q[0, 2] = 1.0
    previous = np.ones((1, 1))
    if l == 0:
        return previous
    current = s
    for k in range(2, l + 1):
        term = (2 * k - 1) * polynomial_product(s, current)
        term -= (k - 1) * polynomial_product(q, previous)
        previous, current = current, term / k
    return np.asarray(current[: l + 1, : l + 1], dtype=float)


def _complex_plane_polynomial(l: int, m: int, plane: Plane) -> ComplexArray:
    """Coefficients in (u, v) of the complex solid harmonic r^l Y_l^m on the plane."""
    if m == 0:
        return complex_from_real(0, plane_polynomial(l, 0, plane))
    return complex_from_real(m, plane_polynomial(l, abs(m), plane), plane_polynomial(l, -abs(m), plane))


# --- one-matrix and densities on the plane ----------------------------------------------

#: One term of the one-matrix on the plane: the angular polynomial (complex
#: coefficients of u^a v^b) and its radial factor Σ_n w_n R_n/r^l, given as the
#: weights w_n of the set's radial functions (indices into ``_PlaneData.stack``).
_Term = tuple[ComplexArray, dict[int, float]]


def _one_matrix_terms(blocks: list[_Block], plane: Plane, r1: FloatArray,
                      data: _PlaneData) -> tuple[list[_Term], float]:
    """γ^σ(r1, r2) as a sum of polynomial × radial terms, and ρ^σ(r1) = γ^σ(r1, r1)."""
    rad1, unit1 = _unit(r1)
    at_r1 = _RadialCache(rad1)
    spherical: dict[int, float] = {}
    terms: list[_Term] = []
    rho1 = 0.0
    for block in blocks:
        coefficients = [float(c) for c in _coefficients(block, at_r1)]
        # ρ^σ(r1) from the same coefficients: Σ_n c_n R_n(r1) times the angular sum at r̂1.
        quadratic1 = sum(c * float(at_r1.value(rf))
                         for c, rf in zip(coefficients, block.radials, strict=True))
        if block.full:
            rho1 += (2 * block.l + 1) / _FOUR_PI * quadratic1
        else:
            rho1 += quadratic1 * sum(abs(complex(complex_solid_harmonic(block.l, m, *unit1))) ** 2
                                     for m in block.ms)
        weights = {data.index[id(rf)]: c for c, rf in zip(coefficients, block.radials, strict=True)}
        if block.l == 0:
            # Y_00* Y_00 = 1/(4π): purely radial, so every s block shares one term.
            for i, w in weights.items():
                spherical[i] = spherical.get(i, 0.0) + w
            continue
        if block.full:
            poly = np.asarray((2 * block.l + 1) / _FOUR_PI
                              * _legendre_polynomial(block.l, plane, unit1), dtype=complex)
        else:
            poly = sum((np.conj(complex_solid_harmonic(block.l, m, *unit1))
                        * _complex_plane_polynomial(block.l, m, plane) for m in block.ms),
                       np.zeros((block.l + 1, block.l + 1), dtype=complex))
        terms.append((poly, weights))
    if spherical:
        terms.append((np.full((1, 1), 1.0 / _FOUR_PI, dtype=complex), spherical))
    return terms, rho1


def _density_parts(blocks: list[_Block], at_r2: _RadialCache,
                   plane: Plane) -> tuple[FloatArray, FloatArray | None]:
    """ρ of the given blocks: its spherical part on the quadrant, and the rest on the grid."""
    spherical = np.zeros_like(at_r2.r)
    rest: FloatArray | None = None
    for block in blocks:
        size = len(block.radials)
        if block.full:
            values = [at_r2.value(rf) for rf in block.radials]
            spherical += (2 * block.l + 1) / _FOUR_PI * sum(
                (block.inverse_overlap[i, j] * values[i] * values[j]
                 for i in range(size) for j in range(size)), np.zeros_like(at_r2.r))
            continue
        over = [at_r2.over_r_l(rf) for rf in block.radials]
        quadratic = sum((block.inverse_overlap[i, j] * over[i] * over[j]
                         for i in range(size) for j in range(size)), np.zeros_like(at_r2.r))
        angular = np.zeros((plane.resolution, plane.resolution))
        for m in block.ms:
            y = polynomial_on_grid(plane, _complex_plane_polynomial(block.l, m, plane))
            angular += y.real**2 + y.imag**2
        multiply_mirrored(angular, quadratic)
        rest = angular if rest is None else rest + angular
    return spherical, rest


def _modulus_squared(plane: Plane, data: _PlaneData, terms: list[_Term], alpha: float,
                     density: FloatArray, beta: float) -> FloatArray:
    """α |Σ_t P_t g_t|² + β d on the grid: compiled when numba is there, numpy otherwise."""
    if not terms:
        return beta * fill_mirrored(plane.resolution, density)
    order = max(poly.shape[0] for poly, _ in terms)
    coefficients = np.zeros((len(terms), order, order), dtype=complex)
    radial = np.empty((len(terms), *data.stack.shape[1:]))
    for t, (poly, weights) in enumerate(terms):
        coefficients[t, : poly.shape[0], : poly.shape[1]] = poly
        _radial_factor(data, weights, radial[t])
    degrees = np.array([poly.shape[0] - 1 for poly, _ in terms], dtype=np.int64)
    compiled = compiled_modulus_squared(plane.coordinates(), radial, coefficients, degrees,
                                        alpha, density if beta else None, beta)
    if compiled is not None:
        return compiled
    return _modulus_squared_numpy(plane, terms, radial, alpha, density, beta)


def _radial_factor(data: _PlaneData, weights: dict[int, float], out: FloatArray) -> None:
    """out = Σ_n w_n R_n/r^l on the quadrant."""
    (first, w), *rest = weights.items()
    np.multiply(data.stack[first], w, out=out)
    scratch = np.empty_like(out) if rest else out
    for i, w in rest:
        np.multiply(data.stack[i], w, out=scratch)
        out += scratch


def _modulus_squared_numpy(plane: Plane, terms: list[_Term], radial: FloatArray, alpha: float,
                           density: FloatArray, beta: float) -> FloatArray:
    real = all(not np.any(poly.imag) for poly, _ in terms)
    gamma: _Grid = np.zeros((plane.resolution, plane.resolution), dtype=float if real else complex)
    for (poly, _), factor in zip(terms, radial, strict=True):
        angular = polynomial_on_grid(plane, poly.real if real else poly)
        multiply_mirrored(angular, factor)
        gamma += angular
    out = np.asarray(alpha * (gamma.real**2 + gamma.imag**2), dtype=float)
    if beta:
        out += beta * fill_mirrored(plane.resolution, density)
    return out


def _radials(orbitals: OrbitalSet) -> list[RadialFunction]:
    return [o.radial for o in orbitals.orbitals]


class _PlaneData:
    """What a plane slice needs that does not depend on r1: radial factors on the
    quadrant and the densities ρ^σ(r2). Kept on the orbital set for the last planes
    used, so moving the reference electron over one plane re-evaluates neither."""

    def __init__(self, orbitals: OrbitalSet, plane: Plane) -> None:
        radials = _radials(orbitals)
        self.radial = _RadialCache(_quadrant_radii(plane), radials)
        # R/r^l of every radial function of the set, stacked for the kernel.
        self.index = {id(rf): i for i, rf in enumerate(radials)}
        self.stack = np.stack([self.radial.over_r_l(rf) for rf in radials])
        self.stack.flags.writeable = False
        self.densities: dict[tuple[Determinant | None, int | None], tuple[FloatArray, FloatArray | None]] = {}


#: Planes whose r1-independent data an orbital set keeps.
_PLANES_KEPT: Final[int] = 2


def _plane_data(orbitals: OrbitalSet, plane: Plane) -> _PlaneData:
    cache = orbitals.memo.setdefault("pair_planes", {})
    assert isinstance(cache, dict)
    data = cache.get(plane)
    if not isinstance(data, _PlaneData):
        while len(cache) >= _PLANES_KEPT:
            cache.pop(next(iter(cache)))
        data = cache[plane] = _PlaneData(orbitals, plane)
    return data


def _density(orbitals: OrbitalSet, plane: Plane, determinant: Determinant | None,
             spin: int | None) -> tuple[FloatArray, FloatArray | None]:
    """ρ^σ(r2) (``spin=None``: both spins) as a spherical quadrant and a non-spherical rest."""
    data = _plane_data(orbitals, plane)
    key = (determinant, spin)
    if key not in data.densities:
        blocks = [b for b in _blocks(orbitals, determinant) if spin is None or b.spin == spin]
        spherical, rest = _density_parts(blocks, data.radial, plane)
        for array in (spherical, rest):
            if array is not None:
                array.flags.writeable = False
        data.densities[key] = (spherical, rest)
    return data.densities[key]


def _reference_point(r1: npt.ArrayLike) -> FloatArray:
    point = _as_points(r1, "r1")
    if point.shape != (3,):
        raise QuantumNumberError(f"r1 must be one point (x, y, z) in bohr, got shape {point.shape}")
    return point


def spin_density_on_plane(
    orbitals: OrbitalSet,
    plane: Plane,
    spin: int | None = None,
    determinant: Determinant | None = None,
) -> FloatArray:
    """ρ^σ (or ρ for ``spin=None``) of a determinant on a plane slice (bohr⁻³).

    Returns
    -------
    ndarray, shape (resolution, resolution)
        ``rho[j, i]`` at u = coordinates[i], v = coordinates[j], as
        :func:`~zeffir.core.density_on_plane`.

    Notes
    -----
    See :func:`~zeffir.core.pairs.spin_density`: closed blocks are spherical, open
    ones carry Σ_m |Y_l^m|². Unlike :func:`~zeffir.core.density_on_plane`, which
    spherically averages open subshells, this is the density of one determinant.

    References
    ----------
    A. Unsöld, Ann. Phys. 387, 355 (1927); R. McWeeny (1989), §5.5.

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import Plane, build, density_on_plane
    >>> neon, plane = build("Ne", "hydrogenic"), Plane.named("xz", extent=2.0, resolution=9)
    >>> bool(np.allclose(spin_density_on_plane(neon, plane, +1), density_on_plane(neon, plane) / 2))
    True
    """
    if spin is not None:
        _check_spin(spin)
    spherical, rest = _density(orbitals, plane, determinant, spin)
    out = fill_mirrored(plane.resolution, spherical)
    if rest is not None:
        out += rest
    return out


def _reference_terms(orbitals: OrbitalSet, plane: Plane, r1: npt.ArrayLike, spin: int,
                     determinant: Determinant | None, require_density: bool = True,
                     ) -> tuple[_PlaneData, list[_Term], float]:
    """The plane data, γ^σ(r1, ·) as terms and ρ^σ(r1) for a reference electron of ``spin``."""
    _check_spin(spin)
    point = _reference_point(r1)
    blocks = [b for b in _blocks(orbitals, determinant) if b.spin == spin]
    data = _plane_data(orbitals, plane)
    terms, rho = _one_matrix_terms(blocks, plane, point, data)
    if require_density and not rho > 0:
        raise _no_density(spin, point)
    return data, terms, rho


def exchange_hole_on_plane(
    orbitals: OrbitalSet,
    plane: Plane,
    r1: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Exchange (Fermi) hole h_x^σ(r1; r2) for r2 on a plane slice (bohr⁻³).

    Parameters
    ----------
    orbitals : OrbitalSet
    plane : Plane
        Where r2 runs.
    r1 : array_like, shape (3,)
        The reference electron (bohr), anywhere (not necessarily on the plane);
        ρ^σ(r1) must be positive.
    spin : int
        Its spin, +1 (α) or -1 (β).
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray, shape (resolution, resolution)
        −|γ^σ(r1, r2)|² / ρ^σ(r1), ``h[j, i]`` at u = coordinates[i], v = coordinates[j].

    Notes
    -----
    Same numbers as :func:`~zeffir.core.pairs.exchange_hole` at ``plane.points()``;
    the radial factors are evaluated on one quadrant and the angular ones as
    polynomials in (u, v) (see the module notes).

    References
    ----------
    R. G. Parr and W. Yang, *Density-Functional Theory of Atoms and Molecules* (1989), §2.4.

    Examples
    --------
    At the reference electron the hole is as deep as the same-spin density there:

    >>> import numpy as np
    >>> from zeffir.core import Plane, build
    >>> from zeffir.core.pairs import spin_density
    >>> oxygen = build("O")
    >>> plane = Plane.named("xz", extent=1.0, resolution=5)  # u, v in -1, -0.5, 0, 0.5, 1
    >>> hole = exchange_hole_on_plane(oxygen, plane, (0.5, 0.0, 0.5), -1)
    >>> bool(np.isclose(hole[3, 3], -spin_density(oxygen, (0.5, 0.0, 0.5), -1)))
    True
    """
    data, terms, rho = _reference_terms(orbitals, plane, r1, spin, determinant)
    return _modulus_squared(plane, data, terms, -1.0 / rho, np.zeros((1, 1)), 0.0)


def conditional_density_on_plane(
    orbitals: OrbitalSet,
    plane: Plane,
    r1: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
) -> FloatArray:
    """Density of the other electrons, given one of spin σ at r1, on a plane slice (bohr⁻³).

    Returns
    -------
    ndarray, shape (resolution, resolution)
        ρ(r2) + h_x^σ(r1; r2) = Σ_σ' ρ2^{σσ'}(r1, r2) / ρ^σ(r1).

    Notes
    -----
    See :func:`~zeffir.core.pairs.conditional_density`; integrates to N − 1 over r2.

    References
    ----------
    R. G. Parr and W. Yang (1989), §2.4.

    Examples
    --------
    At r1 itself only the electrons of the other spin remain (half the density of Ne):

    >>> import numpy as np
    >>> from zeffir.core import Plane, build, spherical_density
    >>> neon = build("Ne", "hydrogenic")  # orthonormal: the density is spherical_density
    >>> plane = Plane.named("xz", extent=1.0, resolution=5)
    >>> others = conditional_density_on_plane(neon, plane, (0.5, 0.0, 0.5))
    >>> bool(np.isclose(others[3, 3], spherical_density(neon, np.sqrt(0.5)) / 2))
    True
    """
    data, terms, rho = _reference_terms(orbitals, plane, r1, spin, determinant)
    spherical, rest = _density(orbitals, plane, determinant, None)
    out = _modulus_squared(plane, data, terms, -1.0 / rho, spherical, 1.0)
    if rest is not None:
        out += rest
    return out


def pair_density_on_plane(
    orbitals: OrbitalSet,
    plane: Plane,
    r1: npt.ArrayLike,
    spins: tuple[int, int] = (UP, UP),
    determinant: Determinant | None = None,
) -> FloatArray:
    """Pair density ρ2^{σσ'}(r1, r2) for r2 on a plane slice (bohr⁻⁶).

    Parameters
    ----------
    orbitals : OrbitalSet
    plane : Plane
    r1 : array_like, shape (3,)
        Position of the first electron (bohr).
    spins : (int, int)
        Spin σ of the electron at r1 and σ' of the one on the plane: equal for the
        same-spin pair density, opposite for the opposite-spin one.
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ndarray, shape (resolution, resolution)
        ρ^σ(r1) ρ^σ'(r2) − δ_{σσ'} |γ^σ(r1, r2)|².

    References
    ----------
    R. McWeeny (1989), §5.5; R. G. Parr and W. Yang (1989), §2.4.

    Examples
    --------
    Two electrons of one spin are never at the same point:

    >>> from zeffir.core import Plane, build
    >>> plane = Plane.named("xz", extent=1.0, resolution=5)
    >>> same = pair_density_on_plane(build("N"), plane, (0.5, 0.0, 0.5), (+1, +1))
    >>> bool(abs(same[3, 3]) < 1e-12 * same.max())
    True
    """
    s1, s2 = spins
    _check_spin(s2)
    data, terms, rho1 = _reference_terms(orbitals, plane, r1, s1, determinant, require_density=False)
    spherical, rest = _density(orbitals, plane, determinant, s2)
    if s1 != s2:
        terms = []
    out = _modulus_squared(plane, data, terms, -1.0, spherical, rho1)
    if rest is not None:
        out += rho1 * rest
    return out


class ReferencePanels(NamedTuple):
    """What the other electrons do, given one of spin σ at r1, on a plane (bohr⁻³)."""

    #: ρ2^{σσ}(r1, r2)/ρ^σ(r1) = ρ^σ(r2) + h_x^σ(r1; r2): the other electrons of spin σ.
    same_spin: FloatArray
    #: ρ2^{σ,−σ}(r1, r2)/ρ^σ(r1) = ρ^{−σ}(r2): the electrons of the other spin.
    opposite_spin: FloatArray
    #: h_x^σ(r1; r2) = −|γ^σ(r1, r2)|²/ρ^σ(r1).
    exchange_hole: FloatArray
    #: ρ^σ(r1).
    reference_density: float


def reference_panels_on_plane(
    orbitals: OrbitalSet,
    plane: Plane,
    r1: npt.ArrayLike,
    spin: int = UP,
    determinant: Determinant | None = None,
) -> ReferencePanels:
    """Both conditional pair densities and the exchange hole for one reference electron.

    Parameters
    ----------
    orbitals : OrbitalSet
    plane : Plane
        Where r2 runs.
    r1 : array_like, shape (3,)
        The reference electron (bohr); ρ^σ(r1) must be positive.
    spin : int
        Its spin σ, +1 (α) or -1 (β).
    determinant : Determinant, optional
        The Hund determinant by default.

    Returns
    -------
    ReferencePanels
        The same numbers as :func:`pair_density_on_plane` (both spin pairs) divided by
        ρ^σ(r1) and :func:`exchange_hole_on_plane`, with |γ^σ(r1, r2)|² formed once:
        for a single determinant ρ2^{σσ}(r1, r2) = ρ^σ(r1)ρ^σ(r2) − |γ^σ|² and
        ρ2^{σ,−σ} = ρ^σ(r1)ρ^{−σ}(r2).

    References
    ----------
    R. McWeeny, *Methods of Molecular Quantum Mechanics*, 2nd ed. (1989), §5.5;
    R. G. Parr and W. Yang (1989), §2.4.

    Examples
    --------
    The other same-spin electrons are the same-spin density with the hole dug out:

    >>> import numpy as np
    >>> from zeffir.core import Plane, build
    >>> nitrogen, plane = build("N"), Plane.named("xz", extent=2.0, resolution=9)
    >>> panels = reference_panels_on_plane(nitrogen, plane, (0.3, 0.0, 0.4))
    >>> rho_up = spin_density_on_plane(nitrogen, plane, +1)
    >>> bool(np.allclose(panels.same_spin, rho_up + panels.exchange_hole))
    True
    """
    data, terms, rho = _reference_terms(orbitals, plane, r1, spin, determinant)
    hole = _modulus_squared(plane, data, terms, -1.0 / rho, np.zeros((1, 1)), 0.0)
    same = spin_density_on_plane(orbitals, plane, spin, determinant)
    same += hole
    opposite = spin_density_on_plane(orbitals, plane, -spin, determinant)
    return ReferencePanels(same, opposite, hole, rho)

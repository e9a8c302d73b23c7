"""Orbitals and densities on a plane slice.

Two evaluators give the same numbers: a direct one (every point's r and solid
harmonic) kept as the reference, and the fast one used everywhere else. The fast
one uses the structure of the problem (and, from 128² up, the compiled kernels
of ``_kernels.py`` with radial profiles tabulated once, ``_radial_table.py``):
the radial factor depends only on
r² = offset² + u² + v², so on the symmetric grid it is computed on one quadrant
and mirrored; the solid harmonic r^l Y_lm is a polynomial in (u, v) of degree l,
so on the grid it is a rank-(l+1) product of two small Vandermonde matrices.
"""

from __future__ import annotations

from functools import lru_cache
from typing import Literal

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core.density._kernels import compiled_density, compiled_orbital
from zeffir.core.density._plane import Plane
from zeffir.core.density._plane_grid import (
    fill_mirrored,
    multiply_mirrored,
    polynomial_product,
    quadrant_radii,
)
from zeffir.core.density._radial_curves import spherical_density
from zeffir.core.density._radial_table import RadialTable, tabulate
from zeffir.core.orbitals import (
    FloatArray,
    OrbitalSet,
    SlaterRadial,
    SubshellOrbital,
    complex_from_real,
    solid_harmonic,
    solid_harmonic_monomials,
)

__all__ = [
    "density_on_plane",
    "density_on_plane_direct",
    "density_on_plane_numpy",
    "orbital_density_on_plane",
    "orbital_on_plane",
    "orbital_on_plane_direct",
    "orbital_on_plane_numpy",
    "plane_polynomial",
]

Kind = Literal["real", "complex"]

#: Below this resolution the numpy path is as fast as the compiled kernel.
_COMPILED_FROM = 128


def _check_m(orbital: SubshellOrbital, m: int) -> None:
    if abs(m) > orbital.l:
        raise QuantumNumberError(f"m = {m}: |m| must be at most l = {orbital.l} for {orbital.label}")


@lru_cache(maxsize=512)
def plane_polynomial(l: int, m: int, plane: Plane) -> FloatArray:
    """Coefficients C[a, b] of r^l Y_lm restricted to the plane: Σ C[a,b] u^a v^b.

    Substitutes x = offset·n_x + u e1_x + v e2_x (and likewise y, z) into the
    Cartesian monomials of :func:`solid_harmonic_monomials`. Cached per plane;
    the returned array is read-only.

    Examples
    --------
    The polynomial in (u, v) takes the values of r^l Y_lm at the plane's points,
    here for dxz on an oblique plane off the nucleus:

    >>> import numpy as np
    >>> from numpy.polynomial.polynomial import polygrid2d
    >>> plane = Plane((1.0, 2.0, 2.0), offset=0.3, extent=3.0, resolution=7)
    >>> c, (x, y, z) = plane.coordinates(), plane.points()
    >>> bool(np.allclose(polygrid2d(c, c, plane_polynomial(2, 1, plane)).T,
    ...                  solid_harmonic(2, 1, x, y, z)))
    True
    """
    n, e1, e2 = plane.basis()
    linear = [np.array([[plane.offset * n[k], e2[k]], [e1[k], 0.0]]) for k in range(3)]
    out = np.zeros((l + 1, l + 1))
    powers: list[list[FloatArray]] = []
    for k in range(3):
        table = [np.ones((1, 1))]
        for _ in range(l):
            table.append(polynomial_product(table[-1], linear[k]))
        powers.append(table)
    for (a, b, c), coeff in solid_harmonic_monomials(l, m):
        term = polynomial_product(polynomial_product(powers[0][a], powers[1][b]), powers[2][c])
        out[: term.shape[0], : term.shape[1]] += coeff * term
    out.flags.writeable = False
    return out


def _angular_grid(l: int, m: int, plane: Plane) -> FloatArray:
    coeffs = plane_polynomial(l, m, plane)
    c = plane.coordinates()
    vander = np.vander(c, l + 1, increasing=True)  # [i, a] = c_i^a
    # A[j, i] = Σ_ab C[a, b] u_i^a v_j^b
    return np.asarray(vander @ coeffs.T @ vander.T, dtype=float)


def orbital_on_plane(
    orbital: SubshellOrbital, plane: Plane, m: int = 0, kind: Kind = "real"
) -> FloatArray | npt.NDArray[np.complex128]:
    """Signed one-electron orbital ψ_nlm on a plane slice (bohr^-3/2).

    Parameters
    ----------
    orbital : SubshellOrbital
        The subshell's radial function.
    plane : Plane
        Where to evaluate.
    m : int
        Real order (``kind="real"``: m > 0 cos, m < 0 sin; see
        :func:`~zeffir.core.orbitals.real_label`) or magnetic quantum number
        (``kind="complex"``).
    kind : {"real", "complex"}
        Real orbital (a real array) or complex Y_l^m with the Condon–Shortley
        phase (a complex array).

    Returns
    -------
    ndarray, shape (resolution, resolution)
        ``psi[j, i]`` at u = coordinates[i], v = coordinates[j].

    Notes
    -----
    ψ = [R(r)/r^l] · r^l Y_lm(x, y, z). For complex m,
    Y_l^m = (-1)^m (S_l|m| + i S_l,-|m|)/√2 for m > 0 and (S_l|m| - i S_l,-|m|)/√2
    for m < 0, with S the real solid harmonics.

    Examples
    --------
    Hydrogen 2pz has the closed form ψ_210 = z e^(−r/2) / (4√(2π)) (R_21 =
    r e^(−r/2)/(2√6), Bethe & Salpeter 1957, §3; Y_10 = √(3/4π) cos θ), and the
    complex orbital of m = 1 carries half of px² + py²:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> p = build("H 2p1", "hydrogenic").orbital("2p")
    >>> plane = Plane.named("xz", extent=8.0, resolution=33)
    >>> x, y, z = plane.points()
    >>> r = np.sqrt(x * x + y * y + z * z)
    >>> bool(np.allclose(orbital_on_plane(p, plane, 0), z * np.exp(-r / 2) / (4 * np.sqrt(2 * np.pi))))
    True
    >>> px, py = orbital_on_plane(p, plane, 1), orbital_on_plane(p, plane, -1)
    >>> bool(np.allclose(abs(orbital_on_plane(p, plane, 1, "complex")) ** 2, (px**2 + py**2) / 2))
    True
    """
    _check_m(orbital, m)
    if kind == "complex":
        if m == 0:
            return orbital_on_plane(orbital, plane, 0, "real").astype(complex)
        return complex_from_real(m, orbital_on_plane(orbital, plane, abs(m), "real"),
                                 orbital_on_plane(orbital, plane, -abs(m), "real"))
    if kind != "real":
        raise QuantumNumberError(f"{kind}: kind must be 'real' or 'complex'")
    if plane.resolution >= _COMPILED_FROM:
        table = _orbital_table(orbital)
        if table is not None:
            fused = compiled_orbital(plane.coordinates(), plane.offset,
                                     plane_polynomial(orbital.l, m, plane), table)
            if fused is not None:
                return fused
    return orbital_on_plane_numpy(orbital, plane, m)


def _orbital_table(orbital: SubshellOrbital) -> RadialTable | None:
    """The cached table of R(r)/r^l, or None where that factor is singular at the nucleus."""
    radial = orbital.radial
    memo = radial.__dict__
    if "_slice_table" not in memo:
        at_nucleus = radial.over_r_l(np.zeros(1))[0]
        singular = isinstance(radial, SlaterRadial) and radial.n_star - 1 - radial.l < 0
        memo["_slice_table"] = None if singular or not np.isfinite(at_nucleus) else tabulate(
            radial.over_r_l, radial.extent(1e-16)
        )
    table = memo["_slice_table"]
    return table if isinstance(table, RadialTable) else None


def _density_table(orbitals: OrbitalSet) -> RadialTable:
    table = orbitals.memo.get("density_table")
    if not isinstance(table, RadialTable):
        top = max(o.radial.extent(1e-16) for o in orbitals.orbitals)
        table = tabulate(lambda r: spherical_density(orbitals, r), top)
        orbitals.memo["density_table"] = table
    return table


def orbital_on_plane_numpy(orbital: SubshellOrbital, plane: Plane, m: int = 0) -> FloatArray:
    """The plain-numpy fast path of :func:`orbital_on_plane` for a real orbital.

    Examples
    --------
    The mirrored, polynomial evaluation agrees with the point-by-point reference
    for every real d orbital on an oblique plane off the nucleus:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> d = build("Sc", "slater").orbital("3d")
    >>> plane = Plane((1.0, 2.0, 2.0), offset=0.3, extent=3.0, resolution=15)
    >>> all(bool(np.allclose(orbital_on_plane_numpy(d, plane, m), orbital_on_plane_direct(d, plane, m)))
    ...     for m in range(-2, 3))
    True
    """
    _check_m(orbital, m)
    out = _angular_grid(orbital.l, m, plane)
    radial = orbital.radial.over_r_l(quadrant_radii(plane))
    return multiply_mirrored(out, radial)


def orbital_on_plane_direct(
    orbital: SubshellOrbital, plane: Plane, m: int = 0
) -> FloatArray:
    """Reference evaluation of a real orbital point by point (slow; for tests).

    Examples
    --------
    Hydrogen 1s: ψ_100 = R_10 Y_00 = e^(−r)/√π (Bethe & Salpeter 1957, eq. 3.17):

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> s = build("H", "hydrogenic").orbital("1s")
    >>> plane = Plane.named("xy", extent=4.0, resolution=9)
    >>> x, y, _ = plane.points()
    >>> bool(np.allclose(orbital_on_plane_direct(s, plane), np.exp(-np.hypot(x, y)) / np.sqrt(np.pi)))
    True
    """
    _check_m(orbital, m)
    x, y, z = plane.points()
    r = np.sqrt(x * x + y * y + z * z)
    return orbital.radial.over_r_l(r) * solid_harmonic(orbital.l, m, x, y, z)


def orbital_density_on_plane(
    orbital: SubshellOrbital, plane: Plane, m: int = 0, kind: Kind = "real"
) -> FloatArray:
    """|ψ|² of one orbital on a plane slice (bohr⁻³).

    Examples
    --------
    Unsöld's theorem, Σ_m |Y_lm|² = (2l+1)/4π (Ann. Phys. 387, 355 (1927)): the
    five d orbitals together are spherical, (5/4π) R(r)², on any plane:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> d = build("Sc", "slater").orbital("3d")
    >>> plane = Plane((1.0, 2.0, 2.0), offset=0.3, extent=3.0, resolution=15)
    >>> x, y, z = plane.points()
    >>> total = sum(orbital_density_on_plane(d, plane, m, "complex") for m in range(-2, 3))
    >>> bool(np.allclose(total, 5 / (4 * np.pi) * d.radial(np.sqrt(x * x + y * y + z * z)) ** 2))
    True
    """
    psi = orbital_on_plane(orbital, plane, m, kind)
    return np.asarray(psi.real**2 + psi.imag**2 if np.iscomplexobj(psi) else psi * psi)


def density_on_plane(orbitals: OrbitalSet, plane: Plane) -> FloatArray:
    """Total electron density of the configuration on a plane slice (bohr⁻³).

    Notes
    -----
    Closed subshells are exactly spherical (Unsöld's theorem); open subshells are
    spherically averaged here, as in an average-of-configuration description.
    The radial profile is evaluated on one quadrant of the grid and mirrored.

    Examples
    --------
    A plane at distance d from the nucleus carries ∫∫ ρ du dv = 2π ∫_d^∞ ρ(r) r dr
    (polar coordinates in the plane, r² = d² + s²); for hydrogen 1s, ρ = e^(−2r)/π,
    that is e^(−2d)(1 + 2d)/2:

    >>> import numpy as np
    >>> from scipy.integrate import simpson
    >>> from zeffir.core import build
    >>> plane = Plane.named("xy", offset=1.0, extent=12.0, resolution=101)
    >>> rho, c = density_on_plane(build("H", "hydrogenic"), plane), plane.coordinates()
    >>> bool(abs(simpson(simpson(rho, x=c), x=c) - 1.5 * np.exp(-2.0)) < 1e-6)
    True
    """
    if plane.resolution >= _COMPILED_FROM:
        compiled = compiled_density(plane.coordinates(), plane.offset, _density_table(orbitals))
        if compiled is not None:
            return compiled
    return density_on_plane_numpy(orbitals, plane)


def density_on_plane_numpy(orbitals: OrbitalSet, plane: Plane) -> FloatArray:
    """The plain-numpy path of :func:`density_on_plane` (exact radial values, no table).

    Examples
    --------
    The mirrored quadrant agrees with the point-by-point reference on an oblique
    plane off the nucleus:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> neon = build("Ne", "slater")
    >>> plane = Plane((0.0, 1.0, 1.0), offset=0.4, extent=2.0, resolution=9)
    >>> bool(np.allclose(density_on_plane_numpy(neon, plane), density_on_plane_direct(neon, plane)))
    True
    """
    # The quadrant is symmetric under u <-> v: evaluate its upper triangle only.
    c = plane.coordinates()
    sq = c[plane.resolution // 2 :] ** 2
    rows, cols = np.triu_indices(sq.size)
    values = spherical_density(orbitals, np.sqrt(plane.offset**2 + sq[rows] + sq[cols]))
    quadrant = np.empty((sq.size, sq.size))
    quadrant[rows, cols] = values
    quadrant[cols, rows] = values
    return fill_mirrored(plane.resolution, quadrant)


def density_on_plane_direct(orbitals: OrbitalSet, plane: Plane) -> FloatArray:
    """Reference evaluation of :func:`density_on_plane` point by point (for tests).

    Examples
    --------
    For closed subshells the density is the sum of the occupied orbitals' |ψ|²
    (Unsöld's theorem makes it spherical); neon with hydrogenic orbitals:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> neon = build("Ne", "hydrogenic")
    >>> plane = Plane((0.0, 1.0, 1.0), offset=0.4, extent=2.0, resolution=9)
    >>> psi2 = lambda label, m=0: orbital_on_plane_direct(neon.orbital(label), plane, m) ** 2
    >>> orbitals = 2 * psi2("1s") + 2 * psi2("2s") + 2 * sum(psi2("2p", m) for m in (-1, 0, 1))
    >>> bool(np.allclose(density_on_plane_direct(neon, plane), orbitals))
    True
    """
    x, y, z = plane.points()
    return spherical_density(orbitals, np.sqrt(x * x + y * y + z * z))

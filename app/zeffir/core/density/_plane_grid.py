"""Grid helpers shared by every quantity drawn on a plane slice.

A :class:`~zeffir.core.density.Plane` samples ``resolution`` points per side at
coordinates exactly symmetric about 0, so a quantity that depends on the point only
through |r|² = offset² + u² + v² is fixed by its values on one quadrant (u, v ≥ 0) and
the other three follow by mirroring. Angular factors are polynomials in (u, v) with
coefficient arrays ``C[a, b]`` (the coefficient of u^a v^b), evaluated on the grid by
Horner's rule. The single-particle slices of :mod:`zeffir.core.density` and the pair
slices of :mod:`zeffir.core.pairs` are built from these pieces.
"""

from __future__ import annotations

from typing import Any

import numpy as np
import numpy.typing as npt

from zeffir.core.density._plane import Plane
from zeffir.core.orbitals import FloatArray

__all__ = [
    "fill_mirrored",
    "mirror_blocks",
    "multiply_mirrored",
    "polynomial_on_grid",
    "polynomial_product",
    "quadrant_radii",
]

#: A real or complex grid.
Grid = npt.NDArray[Any]


def quadrant_radii(plane: Plane) -> FloatArray:
    """|r| (bohr) at the grid points with u, v ≥ 0.

    Parameters
    ----------
    plane : Plane
        The slice; its grid is symmetric about 0.

    Returns
    -------
    ndarray, shape (h, h)
        ``out[j, i] = sqrt(offset² + u_i² + v_j²)`` over the upper half of the
        coordinates, ``h = resolution - resolution // 2``.

    Examples
    --------
    The corner of the quadrant is the corner of the slice, and the nucleus sits at the
    centre of an odd grid:

    >>> import numpy as np
    >>> from zeffir.core.density import Plane
    >>> plane = Plane(normal=(0, 0, 1), extent=3.0, resolution=5)
    >>> r = quadrant_radii(plane)
    >>> r.shape, float(r[0, 0]), bool(np.isclose(r[-1, -1], 3.0 * np.sqrt(2)))
    ((3, 3), 0.0, True)
    """
    c = plane.coordinates()
    half = c[plane.resolution // 2 :]
    sq = half * half
    return np.sqrt(plane.offset**2 + sq[:, None] + sq[None, :])


def mirror_blocks(k: int, quadrant: Grid) -> list[tuple[tuple[slice, slice], Grid]]:
    """The four mirrored copies of a quadrant and where they go in a k × k grid.

    Parameters
    ----------
    k : int
        Points per side of the full grid.
    quadrant : ndarray, shape (k - k // 2, k - k // 2)
        Values at u, v ≥ 0 (as from :func:`quadrant_radii`).

    Returns
    -------
    list of ((slice, slice), ndarray)
        Index of each block in the full grid and the block's values. For odd k the
        centre row and column come from the quadrant itself.

    Examples
    --------
    Filling a grid from the blocks reproduces an even function of u and v:

    >>> import numpy as np
    >>> c = np.linspace(-2.0, 2.0, 5)
    >>> full = c[:, None] ** 2 + c[None, :] ** 2
    >>> out = np.empty((5, 5))
    >>> for index, block in mirror_blocks(5, full[2:, 2:]):
    ...     out[index] = block
    >>> bool(np.array_equal(out, full))
    True
    """
    h = k // 2
    flipped_rows = quadrant[::-1][:h]
    return [
        ((slice(h, k), slice(h, k)), quadrant),
        ((slice(h, k), slice(0, h)), quadrant[:, ::-1][:, :h]),
        ((slice(0, h), slice(h, k)), flipped_rows),
        ((slice(0, h), slice(0, h)), flipped_rows[:, ::-1][:, :h]),
    ]


def fill_mirrored(k: int, quadrant: FloatArray) -> FloatArray:
    """A new k × k grid of an even function of u and v given on one quadrant.

    Parameters
    ----------
    k : int
        Points per side of the full grid.
    quadrant : ndarray
        Values at u, v ≥ 0.

    Returns
    -------
    ndarray, shape (k, k)
        The full grid.

    Examples
    --------
    >>> import numpy as np
    >>> grid = fill_mirrored(4, np.array([[1.0, 2.0], [3.0, 4.0]]))
    >>> bool(np.array_equal(grid, grid[::-1, ::-1])), float(grid[0, 0])
    (True, 4.0)
    """
    out = np.empty((k, k), dtype=np.result_type(quadrant, float))
    for index, block in mirror_blocks(k, quadrant):
        out[index] = block
    return out


def multiply_mirrored(out: Grid, quadrant: FloatArray) -> Grid:
    """Multiply a full grid in place by an even function given on one quadrant.

    Parameters
    ----------
    out : ndarray, shape (k, k)
        The grid to scale (real or complex).
    quadrant : ndarray
        Values at u, v ≥ 0.

    Returns
    -------
    ndarray
        ``out`` itself.

    Examples
    --------
    >>> import numpy as np
    >>> ones = np.ones((3, 3))
    >>> q = np.array([[0.0, 1.0], [1.0, 2.0]])
    >>> bool(np.array_equal(multiply_mirrored(ones, q), fill_mirrored(3, q)))
    True
    """
    for index, block in mirror_blocks(out.shape[0], quadrant):
        out[index] *= block
    return out


def polynomial_on_grid(plane: Plane, coefficients: Grid) -> Grid:
    """Σ_ab C[a, b] u_i^a v_j^b at every grid point, as ``out[j, i]``.

    Horner's rule in u along each row, so no power is formed twice.

    Parameters
    ----------
    plane : Plane
        The slice.
    coefficients : ndarray, shape (p, q)
        ``C[a, b]``, the coefficient of u^a v^b (real or complex); rows and columns
        must have the same length.

    Returns
    -------
    ndarray, shape (resolution, resolution)
        The polynomial's value, rows along v, columns along u.

    Examples
    --------
    u² − v² vanishes on the diagonals and is antisymmetric under u ↔ v:

    >>> import numpy as np
    >>> from zeffir.core.density import Plane
    >>> plane = Plane(normal=(0, 0, 1), extent=2.0, resolution=5)
    >>> c = np.zeros((3, 3)); c[2, 0] = 1.0; c[0, 2] = -1.0
    >>> grid = polynomial_on_grid(plane, c)
    >>> bool(np.allclose(np.diag(grid), 0.0)), bool(np.allclose(grid, -grid.T))
    (True, True)
    """
    c = plane.coordinates()
    order = coefficients.shape[0]
    rows = coefficients @ np.vander(c, order, increasing=True).T  # rows[a, j] = p_a(v_j)
    out = np.repeat(rows[order - 1][:, None], c.size, axis=1)
    for a in range(order - 2, -1, -1):
        out *= c[None, :]
        out += rows[a][:, None]
    return out


def polynomial_product(p: Grid, q: Grid) -> Grid:
    """Coefficients of the product of two polynomials in (u, v) (a full 2-D convolution).

    Parameters
    ----------
    p, q : ndarray
        Coefficient arrays, ``[a, b]`` multiplying u^a v^b.

    Returns
    -------
    ndarray, shape (p.shape[0] + q.shape[0] - 1, p.shape[1] + q.shape[1] - 1)
        The coefficients of p·q.

    Examples
    --------
    (u + v)(u − v) = u² − v²:

    >>> import numpy as np
    >>> s = np.array([[0.0, 1.0], [1.0, 0.0]]); d = np.array([[0.0, -1.0], [1.0, 0.0]])
    >>> polynomial_product(s, d).tolist()
    [[0.0, 0.0, -1.0], [0.0, 0.0, 0.0], [1.0, 0.0, 0.0]]
    """
    out = np.zeros((p.shape[0] + q.shape[0] - 1, p.shape[1] + q.shape[1] - 1),
                   dtype=np.result_type(p, q))
    for (a, b), value in np.ndenumerate(q):
        if value:
            out[a : a + p.shape[0], b : b + p.shape[1]] += value * p
    return out

"""Contour lines of a slice, traced once with contourpy (off the GUI thread).

The window draws these paths as they are; tracing happens when the scene is
computed, in the worker thread, so a new image is never held back by it.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Final

import numpy as np
import numpy.typing as npt

from zeffir.core.orbitals import FloatArray

__all__ = ["CONTOUR_POINTS", "ContourPaths", "stray_zeros", "trace_contours"]

BoolArray = npt.NDArray[np.bool_]

#: Contours are traced on at most this many points per side (the image is subsampled).
CONTOUR_POINTS: Final[int] = 256


@dataclass(frozen=True)
class ContourPaths:
    """Polylines (x, y columns; NaN rows separate pieces) grouped by how they are drawn.

    Attributes
    ----------
    positive : ndarray, shape (n, 2)
        Levels above zero (every level, for non-negative quantities).
    negative : ndarray, shape (n, 2)
        Levels below zero of a signed quantity (drawn dashed).
    zero : ndarray, shape (n, 2)
        Nodal lines, where ψ changes sign.
    levels : tuple of float
        The levels that produced at least one line (0.0 for the nodal lines).
    """

    positive: FloatArray
    negative: FloatArray
    zero: FloatArray
    levels: tuple[float, ...]


def stray_zeros(values: FloatArray) -> BoolArray:
    """Exact zeros of ``values`` that do not lie between opposite signs.

    Parameters
    ----------
    values : ndarray, shape (k, m)
        A signed field on a grid (ψ, a two-electron map, a difference).

    Returns
    -------
    ndarray of bool, shape (k, m)
        True where ``values`` is exactly 0 (either sign of zero) and its 3 × 3
        neighbourhood does not hold both a positive and a negative value.

    Notes
    -----
    Exact zeros arise in two ways. Where an exponential underflows, or beyond a
    tabulated radial range, ψ is 0 over a whole region; tracing level 0 there would
    draw the region's edge, which is no node. Where a nodal set passes through grid
    points (a nodal plane at an odd resolution, the line s₁ = s₂ of a triplet),
    ψ is 0 on a line of points with opposite signs either side; masking those
    points hides the node, because no cell then sees the sign change. The two
    differ locally: a zero on a node has both signs among its eight neighbours
    (the diagonal ones matter where two nodal lines cross on a grid point), a zero
    of underflow has at most one. Masking only the zeros of underflow keeps every
    node and draws no underflow edge. A kept zero stays exactly 0, so the traced line passes
    through it (contourpy counts 0 with the negative side).

    Examples
    --------
    >>> import numpy as np
    >>> z = np.array([[1.0, 1.0, 0.0], [0.0, 0.0, 0.0], [-1.0, -1.0, 0.0]])
    >>> stray_zeros(z).astype(int).tolist()
    [[0, 0, 1], [0, 0, 0], [0, 0, 1]]
    """
    field = np.asarray(values, dtype=float)
    positive = np.pad(field > 0.0, 1)
    negative = np.pad(field < 0.0, 1)
    rows, columns = field.shape
    near_positive = np.zeros(field.shape, dtype=bool)
    near_negative = np.zeros(field.shape, dtype=bool)
    # Nine shifted views (a 3 × 3 dilation) rather than a loop over the grid.
    for dj in range(3):
        for di in range(3):
            near_positive |= positive[dj:dj + rows, di:di + columns]
            near_negative |= negative[dj:dj + rows, di:di + columns]
    zero: BoolArray = field == 0.0  # -0.0 too
    return zero & ~(near_positive & near_negative)


def _join(pieces: list[FloatArray]) -> FloatArray:
    if not pieces:
        return np.empty((0, 2))
    gap = np.full((1, 2), np.nan)
    return np.concatenate([part for piece in pieces for part in (piece, gap)])


def trace_contours(image: FloatArray, coordinates: FloatArray, levels: tuple[float, ...],
                   signed: bool, zero_field: FloatArray | None = None) -> ContourPaths:
    """Trace ``levels`` of ``image`` (and level 0 of ``zero_field`` for nodal lines).

    Parameters
    ----------
    image : ndarray, shape (k, k)
        The values mapped to colours; ``image[j, i]`` at (u_i, v_j).
    coordinates : ndarray, shape (k,)
        u (= v) of the grid.
    levels : tuple of float
        Levels to trace (a 0.0 level is ignored: nodal lines come from ``zero_field``).
    signed : bool
        Negative levels go to the dashed group.
    zero_field : ndarray, optional
        Field whose level 0 gives the nodal lines, with the exact zeros that are
        not on a node masked as NaN (see :func:`stray_zeros`).
    """
    import contourpy

    step = max(1, math.ceil(image.shape[0] / CONTOUR_POINTS))
    u = np.asarray(coordinates, dtype=float)[::step]
    groups: list[list[FloatArray]] = [[], [], []]
    drawn: list[float] = []

    def trace(field: FloatArray, wanted: list[float], group_of: list[int]) -> None:
        data = np.asarray(field[::step, ::step], dtype=float)
        masked = np.ma.masked_invalid(data) if not np.all(np.isfinite(data)) else data
        generator = contourpy.contour_generator(u, u, masked,
                                                line_type=contourpy.LineType.ChunkCombinedNan)
        for level, group in zip(wanted, group_of, strict=True):
            lines = [chunk for chunk in generator.lines(level)[0] if chunk is not None and len(chunk)]
            if lines:
                drawn.append(level)
                groups[group].extend(lines)

    wanted = [float(x) for x in levels if x != 0.0]
    trace(image, wanted, [1 if (signed and x < 0) else 0 for x in wanted])
    if zero_field is not None:
        trace(zero_field, [0.0], [2])
    return ContourPaths(_join(groups[0]), _join(groups[1]), _join(groups[2]), tuple(drawn))

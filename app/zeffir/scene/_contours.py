"""Contour lines of a slice, traced once with contourpy (off the GUI thread).

The window draws these paths as they are; tracing happens when the scene is
computed, in the worker thread, so a new image is never held back by it.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Final

import numpy as np

from zeffir.core.orbitals import FloatArray

__all__ = ["CONTOUR_POINTS", "ContourPaths", "trace_contours"]

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
        Field whose level 0 gives the nodal lines (exact zeros masked as NaN).
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

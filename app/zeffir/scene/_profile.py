"""A line profile through a slice: the scene's values sampled along a straight segment."""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Final

import numpy as np
import numpy.typing as npt

from zeffir.core import ZeffirError
from zeffir.core.orbitals import FloatArray
from zeffir.scene._build import model_title
from zeffir.scene._quantities import length_symbol
from zeffir.scene._slice import SliceScene

__all__ = ["PROFILE_POINTS", "LineProfile", "line_profile", "sample_bilinear", "values_label"]

#: Default number of samples along a segment: finer than any slice resolution
#: across a typical segment, so the curve shows what the grid holds.
PROFILE_POINTS: Final[int] = 400

# Display prefixes of value labels that describe the colours, not ``values``.
_LOG_PREFIX: Final = "log₁₀ "
_DEPTH_PREFIX: Final = "depth −"


@dataclass(frozen=True)
class LineProfile:
    """The value of a slice along a segment, in the scene's display units.

    Attributes
    ----------
    s : ndarray
        Distance from ``start`` along the segment, 0 .. ``length``, in ``length_unit``.
    u, v : ndarray
        In-plane coordinates of the samples (the slice's horizontal and vertical axes).
    values : ndarray
        The scene's ``values`` at (u, v) by bilinear interpolation; NaN outside the grid.
    start, end : (float, float)
        (u, v) of the segment's ends.
    axis_names : (str, str)
        Names of u and v on screen, e.g. ``("x", "z")``.
    value_label : str
        ``"symbol / unit"`` of ``values`` (never a log: the values are sampled, not
        the colour image).
    length_unit : {"bohr", "angstrom"}
        Unit of ``s``, ``u`` and ``v``.
    title : str
        Spec, model, orbital or quantity, and the two ends.
    signed : bool
        The quantity has a sign (ψ, a difference): zero crossings are nodes.
    log_scale : bool
        The slice was shown on a logarithmic colour scale (a hint for the plot).
    """

    s: FloatArray
    u: FloatArray
    v: FloatArray
    values: FloatArray
    start: tuple[float, float]
    end: tuple[float, float]
    axis_names: tuple[str, str]
    value_label: str
    length_unit: str
    title: str
    spec: str
    model: str
    orbital: str
    quantity: str
    plane_text: str
    signed: bool
    log_scale: bool

    @property
    def length(self) -> float:
        """Length of the segment in ``length_unit``."""
        return float(self.s[-1])

    @property
    def length_symbol(self) -> str:
        """``'bohr'`` or ``'Å'``."""
        return length_symbol(self.length_unit)

    @property
    def distance_label(self) -> str:
        """Axis label of ``s``, e.g. ``'distance along the segment / bohr'``."""
        return f"distance along the segment / {self.length_symbol}"

    @property
    def segment_text(self) -> str:
        """``'from (x, z) = (−1, 0) to (2, 3) bohr'`` (four significant digits)."""
        return _segment_text(self.axis_names, self.start, self.end, self.length_unit)


def _short(value: float) -> str:
    return f"{value:.4g}".replace("-", "−")


def _segment_text(names: tuple[str, str], start: tuple[float, float], end: tuple[float, float],
                  unit: str) -> str:
    return (f"from ({', '.join(names)}) = ({_short(start[0])}, {_short(start[1])}) "
            f"to ({_short(end[0])}, {_short(end[1])}) {length_symbol(unit)}")


def _axis_name(label: str) -> str:
    # "x / bohr" → "x"; "s₁ / bohr (along z)" → "s₁"
    return label.partition(" / ")[0].strip()


def values_label(scene: SliceScene) -> str:
    """The ``"symbol / unit"`` label of ``scene.values`` (not of the colour image).

    On a log scale the colour bar reads ``log₁₀ ρ`` while ``values`` hold ρ; the
    exchange hole's bar shows the depth −h while ``values`` hold h itself.
    """
    label = scene.value_label.removeprefix(_LOG_PREFIX)
    return label.removeprefix(_DEPTH_PREFIX)


def _fractional_index(coordinates: FloatArray,
                      x: FloatArray) -> tuple[FloatArray, npt.NDArray[np.bool_]]:
    """Fractional grid index of ``x`` on an increasing grid, and whether ``x`` is on the grid."""
    n = coordinates.size
    # np.interp onto the index line gives k + (x − c_k)/(c_{k+1} − c_k): exact at the
    # nodes and right for any increasing grid, uniform or not.
    index = np.interp(x, coordinates, np.arange(n, dtype=float))
    # A sample meant to sit on the outermost node may land an ulp beyond it.
    slack = 1e-12 * float(coordinates[-1] - coordinates[0])
    inside = (x >= coordinates[0] - slack) & (x <= coordinates[-1] + slack)
    return index, inside


def sample_bilinear(values: FloatArray, coordinates: FloatArray, u: FloatArray,
                    v: FloatArray) -> FloatArray:
    """Bilinear interpolation of a grid ``values[j, i]`` at (u_i, v_j) = (c_i, c_j).

    Parameters
    ----------
    values : ndarray, shape (n, n)
        Grid values, row j along v, column i along u.
    coordinates : ndarray, shape (n,)
        Increasing grid coordinates shared by both axes.
    u, v : ndarray
        Points to sample, same shape.

    Returns
    -------
    ndarray
        Interpolated values, NaN where (u, v) lies outside the grid.

    Notes
    -----
    In the cell [c_i, c_{i+1}] × [c_j, c_{j+1}] with t = (u − c_i)/(c_{i+1} − c_i),
    w = (v − c_j)/(c_{j+1} − c_j):
    f = (1−w)[(1−t) f_{j,i} + t f_{j,i+1}] + w[(1−t) f_{j+1,i} + t f_{j+1,i+1}].
    It reproduces any field a + b u + c v + d u v exactly, and for a smooth field
    its error is at most h²/8 (max|∂²f/∂u²| + max|∂²f/∂v²|) on a grid of step h.

    Examples
    --------
    >>> import numpy as np
    >>> c = np.linspace(-1.0, 1.0, 5)
    >>> grid = 2.0 + 3.0 * c[None, :] - 0.5 * c[:, None]  # f = 2 + 3u − v/2
    >>> sample_bilinear(grid, c, np.array([0.25, 2.0]), np.array([-0.75, 0.0])).tolist()
    [3.125, nan]
    """
    grid = np.asarray(values, dtype=float)
    c = np.asarray(coordinates, dtype=float)
    n = c.size
    if grid.ndim != 2 or grid.shape != (n, n):
        raise ValueError(f"values must be an ({n}, {n}) grid matching the coordinates, got {grid.shape}")
    if n < 2 or not np.all(np.diff(c) > 0):
        raise ValueError("the grid coordinates must be at least two increasing numbers")
    fi, inside_u = _fractional_index(c, np.asarray(u, dtype=float))
    fj, inside_v = _fractional_index(c, np.asarray(v, dtype=float))
    # Clamp the cell to the last one, so that the outermost node is that cell's far corner.
    i0 = np.clip(np.floor(fi).astype(np.intp), 0, n - 2)
    j0 = np.clip(np.floor(fj).astype(np.intp), 0, n - 2)
    t = fi - i0
    w = fj - j0
    lower = (1.0 - t) * grid[j0, i0] + t * grid[j0, i0 + 1]
    upper = (1.0 - t) * grid[j0 + 1, i0] + t * grid[j0 + 1, i0 + 1]
    result = (1.0 - w) * lower + w * upper
    return np.where(inside_u & inside_v, result, np.nan)


def _profile_title(scene: SliceScene, segment: str) -> str:
    head = scene.title or scene.spec
    # Pair and two-electron panels title themselves without the model (and some
    # without the spec); a profile read away from its panel needs both.
    if scene.spec and scene.spec not in head:
        head = f"{scene.spec}: {head}"
    shown_model = model_title(scene.model)
    if scene.model and shown_model not in head:
        head = f"{head} ({shown_model})"
    if scene.orbital and scene.orbital not in head:
        head = f"{head}, {scene.orbital}"
    return f"{head} — profile {segment}"


def line_profile(scene: SliceScene, start: tuple[float, float], end: tuple[float, float],
                 points: int = PROFILE_POINTS) -> LineProfile:
    """Sample a slice along the segment from ``start`` to ``end``.

    Parameters
    ----------
    scene : SliceScene
        The slice; its ``values`` are sampled (on a log colour scale, the values
        themselves, not their logarithm).
    start, end : (float, float)
        (u, v) of the segment's ends in the scene's length unit.
    points : int
        Number of equally spaced samples, ends included (at least 2).

    Returns
    -------
    LineProfile
        s from 0 to the segment's length, the sample points, and the values.

    Raises
    ------
    ZeffirError
        The ends are not finite numbers or coincide (a segment needs a length).
    ValueError
        ``points`` is below 2.

    Notes
    -----
    Values between grid points come from bilinear interpolation on the scene's
    grid (see :func:`sample_bilinear`); samples beyond the grid are NaN, so a
    segment that leaves the slice shows a gap rather than invented numbers.

    Examples
    --------
    >>> from zeffir.scene import slice_scene
    >>> from zeffir.state import OrbitalChoice, SliceSettings, Source
    >>> scene = slice_scene(Source("H", "hydrogenic"), OrbitalChoice("1s"),
    ...                     SliceSettings(plane="xz", extent=4.0, resolution=33))
    >>> profile = line_profile(scene, (0.0, -3.0), (0.0, 4.0), points=8)
    >>> profile.s.tolist()  # one bohr apart
    [0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0]
    >>> bool(profile.values[3] == scene.values[16, 16])  # (0, 0) is a grid node
    True
    """
    if int(points) != points or points < 2:
        raise ValueError(f"points must be an integer of at least 2, got {points}")
    u0, v0 = (float(x) for x in start)
    u1, v1 = (float(x) for x in end)
    if not all(math.isfinite(x) for x in (u0, v0, u1, v1)):
        raise ZeffirError(f"line profile: the segment's ends must be finite numbers, "
                          f"got ({u0}, {v0}) and ({u1}, {v1})")
    length = math.hypot(u1 - u0, v1 - v0)
    if length == 0.0:
        raise ZeffirError(f"line profile: the segment's ends coincide at ({u0:g}, {v0:g}); "
                          "drag a segment of some length")
    count = int(points)
    # linspace puts both ends exactly where they were asked for.
    u = np.linspace(u0, u1, count)
    v = np.linspace(v0, v1, count)
    s = np.linspace(0.0, length, count)
    values = sample_bilinear(scene.values, scene.coordinates, u, v)
    names = (_axis_name(scene.axis_labels[0]), _axis_name(scene.axis_labels[1]))
    segment = _segment_text(names, (u0, v0), (u1, v1), scene.length_unit)
    return LineProfile(
        s=s, u=u, v=v, values=values, start=(u0, v0), end=(u1, v1), axis_names=names,
        value_label=values_label(scene), length_unit=scene.length_unit,
        title=_profile_title(scene, segment), spec=scene.spec, model=scene.model,
        orbital=scene.orbital, quantity=scene.quantity, plane_text=scene.plane_text,
        signed=scene.signed, log_scale=scene.log_scale,
    )

"""Planes through the atom on which slices are evaluated."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Final

import numpy as np

from zeffir.core._errors import QuantumNumberError
from zeffir.core.orbitals import FloatArray

__all__ = ["MAX_RESOLUTION", "NAMED_PLANES", "Plane"]

#: Largest slice resolution (points per side).
MAX_RESOLUTION: Final[int] = 2048

#: The coordinate planes: normal, in-plane horizontal axis, in-plane vertical axis.
NAMED_PLANES: Final[dict[str, tuple[tuple[float, ...], tuple[float, ...], tuple[float, ...]]]] = {
    "xy": ((0.0, 0.0, 1.0), (1.0, 0.0, 0.0), (0.0, 1.0, 0.0)),
    "xz": ((0.0, 1.0, 0.0), (1.0, 0.0, 0.0), (0.0, 0.0, 1.0)),  # y = offset
    "yz": ((1.0, 0.0, 0.0), (0.0, 1.0, 0.0), (0.0, 0.0, 1.0)),
}


@dataclass(frozen=True)
class Plane:
    """A square window on a plane: points offset·n̂ + u ê₁ + v ê₂, |u|, |v| <= extent.

    Parameters
    ----------
    normal : 3 floats
        Plane normal (any length but zero).
    offset : float
        Signed distance of the plane from the nucleus along the normal (bohr).
    extent : float
        Half-width of the square window (bohr).
    resolution : int
        Points per side, 2..2048.

    Notes
    -----
    ê₂ is the projection of +z onto the plane (of +y when the normal is along z),
    ê₁ = ê₂ × n̂, so "up" on screen is +z wherever possible. The coordinate planes
    ``Plane.named("xz")`` use x across and z up. Grid coordinates are exactly
    symmetric about 0, which the slice evaluators exploit.

    Examples
    --------
    (ê₁, ê₂, n̂) is a right-handed orthonormal frame, every grid point lies at the
    signed distance ``offset`` from the nucleus along n̂, and the coordinates are
    symmetric about 0:

    >>> import numpy as np
    >>> plane = Plane(normal=(1.0, 1.0, 1.0), offset=0.5, extent=2.0, resolution=5)
    >>> n, e1, e2 = plane.basis()
    >>> frame = np.array([e1, e2, n])
    >>> bool(np.allclose(frame @ frame.T, np.eye(3))), bool(np.allclose(np.cross(e1, e2), n))
    (True, True)
    >>> x, y, z = plane.points()
    >>> bool(np.allclose(n[0] * x + n[1] * y + n[2] * z, 0.5))
    True
    >>> plane.coordinates().tolist()
    [-2.0, -1.0, 0.0, 1.0, 2.0]
    """

    normal: tuple[float, float, float] = (0.0, 0.0, 1.0)
    offset: float = 0.0
    extent: float = 10.0
    resolution: int = 256
    axes: tuple[tuple[float, float, float], tuple[float, float, float]] | None = field(
        default=None, compare=True
    )

    def __post_init__(self) -> None:
        n = np.asarray(self.normal, dtype=float)
        if n.shape != (3,) or not np.all(np.isfinite(n)) or np.linalg.norm(n) == 0:
            raise QuantumNumberError("the plane normal must be three finite numbers, not all zero")
        if not (np.isfinite(self.extent) and self.extent > 0):
            raise QuantumNumberError(f"extent must be a positive number of bohr, got {self.extent}")
        if not np.isfinite(self.offset):
            raise QuantumNumberError("offset must be a finite number of bohr")
        if not 2 <= int(self.resolution) <= MAX_RESOLUTION:
            raise QuantumNumberError(f"resolution must be between 2 and {MAX_RESOLUTION}")

    @classmethod
    def named(cls, name: str, offset: float = 0.0, extent: float = 10.0, resolution: int = 256) -> Plane:
        """One of the coordinate planes ``'xy'``, ``'xz'``, ``'yz'``."""
        key = name.strip().lower()
        if key not in NAMED_PLANES:
            raise QuantumNumberError(f"{name}: unknown plane (use xy, xz, yz or a normal vector)")
        normal, e1, e2 = NAMED_PLANES[key]
        return cls(normal, offset, extent, resolution, axes=(e1, e2))  # type: ignore[arg-type]

    def basis(self) -> tuple[FloatArray, FloatArray, FloatArray]:
        """Unit vectors (n̂, ê₁, ê₂) of the plane."""
        n = np.asarray(self.normal, dtype=float)
        n = n / np.linalg.norm(n)
        if self.axes is not None:
            e1, e2 = (np.asarray(a, dtype=float) for a in self.axes)
            return n, e1 / np.linalg.norm(e1), e2 / np.linalg.norm(e2)
        up = np.array([0.0, 0.0, 1.0])
        if abs(n @ up) > 1 - 1e-12:
            up = np.array([0.0, 1.0, 0.0])
        e2 = up - (up @ n) * n
        e2 /= np.linalg.norm(e2)
        e1 = np.cross(e2, n)
        return n, e1, e2

    def coordinates(self) -> FloatArray:
        """In-plane coordinates u (= v) of the grid, exactly symmetric about 0 (bohr)."""
        k = self.resolution
        steps = 2.0 * np.arange(k) - (k - 1)
        return self.extent * steps / (k - 1)

    def points(self) -> tuple[FloatArray, FloatArray, FloatArray]:
        """Cartesian x, y, z of every grid point, arrays of shape (resolution, resolution).

        Row j runs along ê₂ (v), column i along ê₁ (u): ``x[j, i]``.
        """
        n, e1, e2 = self.basis()
        c = self.coordinates()
        u = c[None, :]
        v = c[:, None]
        x, y, z = (self.offset * n[k] + u * e1[k] + v * e2[k] for k in range(3))
        return x, y, z

"""Radial distributions, cumulative charge and the spherically averaged density."""

from __future__ import annotations

import numpy as np
import numpy.typing as npt

from zeffir.core.orbitals import FloatArray, OrbitalSet, RadialFunction

__all__ = [
    "cumulative_charge",
    "enclosing_radius",
    "radial_grid",
    "spherical_density",
    "subshell_distributions",
    "total_distribution",
]


def radial_grid(orbitals: OrbitalSet, points: int = 2000, r_max: float | None = None) -> FloatArray:
    """A grid from 0 to ``r_max`` (default: where the outermost subshell has ended), r ∝ t².

    The quadratic spacing puts points where the core subshells vary fastest.
    """
    top = r_max if r_max is not None else max(o.radial.extent(1e-8) for o in orbitals.orbitals)
    t = np.linspace(0.0, np.sqrt(top), points)
    return t * t


def subshell_distributions(
    orbitals: OrbitalSet, r: npt.ArrayLike, weighted: bool = True
) -> dict[str, FloatArray]:
    """Radial distribution of each subshell on ``r``.

    Parameters
    ----------
    orbitals : OrbitalSet
    r : array_like
        Radii (bohr).
    weighted : bool
        Multiply D(r) = r²R² by the occupancy (True) or keep it per electron.

    Returns
    -------
    dict
        ``{label: D}`` in bohr⁻¹; with weighting each integrates to the occupancy.
    """
    rr = np.asarray(r, dtype=float)
    return {
        o.label: o.radial.distribution(rr) * (o.occupancy if weighted else 1.0)
        for o in orbitals.orbitals
    }


def total_distribution(orbitals: OrbitalSet, r: npt.ArrayLike) -> FloatArray:
    """Radial distribution of the atom, Σ occ · r²R², integrating to the electron count."""
    rr = np.asarray(r, dtype=float)
    out = np.zeros_like(rr)
    for o in orbitals.orbitals:
        out += o.occupancy * o.radial.distribution(rr)
    return out


def cumulative_charge(orbitals: OrbitalSet, r: npt.ArrayLike, label: str | None = None) -> FloatArray:
    """Q(r): electrons inside radius r, for the atom or for one subshell (occupancy-weighted).

    Notes
    -----
    Q(r) = Σ occ ∫₀^r r'² R(r')² dr'; Q(∞) equals the electron count.
    """
    rr = np.asarray(r, dtype=float)
    chosen = orbitals.orbitals if label is None else (orbitals.orbital(label),)
    out = np.zeros_like(rr)
    for o in chosen:
        out += o.occupancy * o.radial.cumulative(rr)
    return out


def enclosing_radius(radial: RadialFunction, fraction: float = 0.999) -> float:
    """The radius inside which a fraction of one electron of the orbital lies.

    Parameters
    ----------
    radial : RadialFunction
        Normalised radial function (∫ R² r² dr = 1).
    fraction : float
        Between 0 and 1 (exclusive).

    Returns
    -------
    float
        r in bohr with ∫₀^r R² r'² dr' = fraction, to 1e-10 relative (bisection on
        the function's own cumulative charge).

    Examples
    --------
    Hydrogen 1s: Q(r) = 1 − e^(−2r)(1 + 2r + 2r²), so Q(enclosing_radius(R_1s, 0.999)) = 0.999.
    """
    if not 0.0 < fraction < 1.0:
        raise ValueError(f"fraction must lie between 0 and 1, got {fraction}")
    low, high = 0.0, float(radial.extent(1e-14))
    while float(radial.cumulative(np.asarray([high]))[0]) < fraction:
        high *= 2.0
    for _ in range(200):
        middle = 0.5 * (low + high)
        if float(radial.cumulative(np.asarray([middle]))[0]) < fraction:
            low = middle
        else:
            high = middle
        if high - low <= 1e-10 * high:
            break
    return 0.5 * (low + high)


def spherical_density(orbitals: OrbitalSet, r: npt.ArrayLike) -> FloatArray:
    """Spherically averaged electron density ρ(r) = Σ occ R(r)² / 4π (bohr⁻³).

    Notes
    -----
    For a closed subshell Σ_m |Y_lm|² = (2l+1)/4π (Unsöld's theorem), so the
    density is exactly spherical; for an open subshell this is its spherical
    average. ∫ ρ 4πr² dr equals the electron count.

    References
    ----------
    A. Unsöld, Ann. Phys. 387, 355 (1927).
    """
    rr = np.asarray(r, dtype=float)
    # Subshells with the same radial function (2s and 2p under Slater's rules) are
    # evaluated once, with their electrons added together.
    electrons: dict[object, float] = {}
    radial_of: dict[object, RadialFunction] = {}
    for o in orbitals.orbitals:
        key = o.radial.shape_key()
        electrons[key] = electrons.get(key, 0.0) + o.occupancy
        radial_of[key] = o.radial
    out = np.zeros_like(rr)
    for key, count in electrons.items():
        out += count * radial_of[key](rr) ** 2
    out *= 1.0 / (4.0 * np.pi)
    return out

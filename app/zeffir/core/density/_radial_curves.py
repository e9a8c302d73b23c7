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

    Examples
    --------
    √r is uniform from 0, and the grid reaches far enough out that the atom's
    radial distribution integrates on it to the electron count (the default end
    leaves a tail below 1e-8 of an electron per subshell):

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> neon = build("Ne", "slater")
    >>> r = radial_grid(neon)
    >>> float(r[0]), bool(np.allclose(np.diff(np.sqrt(r)), np.sqrt(r[-1]) / (r.size - 1)))
    (0.0, True)
    >>> from scipy.integrate import trapezoid
    >>> bool(abs(trapezoid(total_distribution(neon, r), r) - 10) < 1e-6)
    True
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

    Examples
    --------
    Each weighted distribution integrates to its subshell's occupancy (∫ R²r² dr = 1
    per electron), and together they make the atom's:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> neon = build("Ne", "slater")
    >>> r = radial_grid(neon)
    >>> parts = subshell_distributions(neon, r)
    >>> from scipy.integrate import trapezoid
    >>> {label: round(float(trapezoid(d, r)), 6) for label, d in parts.items()}
    {'1s': 2.0, '2s': 2.0, '2p': 6.0}
    >>> bool(np.allclose(sum(parts.values()), total_distribution(neon, r)))
    True
    """
    rr = np.asarray(r, dtype=float)
    return {
        o.label: o.radial.distribution(rr) * (o.occupancy if weighted else 1.0)
        for o in orbitals.orbitals
    }


def total_distribution(orbitals: OrbitalSet, r: npt.ArrayLike) -> FloatArray:
    """Radial distribution of the atom, Σ occ · r²R², integrating to the electron count.

    Examples
    --------
    Hydrogen 1s: D(r) = r² R_10² = 4r² e^(−2r) (R_10 = 2 e^(−r), Bethe & Salpeter 1957,
    eq. 3.17), largest at the Bohr radius r = 1:

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> r = np.linspace(0.0, 4.0, 401)
    >>> d = total_distribution(build("H", "hydrogenic"), r)
    >>> bool(np.allclose(d, 4 * r**2 * np.exp(-2 * r))), float(r[np.argmax(d)])
    (True, 1.0)
    """
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

    Examples
    --------
    Hydrogen 1s has the closed form Q(r) = 1 − e^(−2r)(1 + 2r + 2r²):

    >>> import numpy as np
    >>> from zeffir.core import build
    >>> r = np.array([0.5, 1.0, 2.0])
    >>> q = cumulative_charge(build("H", "hydrogenic"), r)
    >>> bool(np.allclose(q, 1 - np.exp(-2 * r) * (1 + 2 * r + 2 * r * r), atol=1e-10))
    True

    Far out, Q counts every electron of the atom, or of one subshell:

    >>> neon = build("Ne", "slater")
    >>> far = [30.0]
    >>> [round(float(cumulative_charge(neon, far, label)[0]), 8) for label in (None, "1s", "2p")]
    [10.0, 2.0, 6.0]
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
    Hydrogen 1s: Q(r) = 1 − e^(−2r)(1 + 2r + 2r²), so Q(enclosing_radius(R_1s, 0.999)) = 0.999:

    >>> import numpy as np
    >>> from zeffir.core.orbitals import HydrogenicRadial
    >>> r = enclosing_radius(HydrogenicRadial(1, 0, 1.0), 0.999)
    >>> bool(abs(1 - np.exp(-2 * r) * (1 + 2 * r + 2 * r * r) - 0.999) < 1e-9)
    True
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

    Examples
    --------
    Hydrogen 1s: ρ(0) = R_10(0)²/4π = 1/π (R_10(0) = 2, Bethe & Salpeter 1957,
    eq. 3.17); for any atom ∫ ρ 4πr² dr is the electron count:

    >>> import numpy as np
    >>> from scipy.integrate import trapezoid
    >>> from zeffir.core import build
    >>> from zeffir.core.density import radial_grid
    >>> bool(np.isclose(spherical_density(build("H", "hydrogenic"), [0.0])[0], 1 / np.pi))
    True
    >>> neon = build("Ne", "slater")
    >>> r = radial_grid(neon)
    >>> bool(abs(trapezoid(4 * np.pi * r**2 * spherical_density(neon, r), r) - 10) < 1e-6)
    True
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

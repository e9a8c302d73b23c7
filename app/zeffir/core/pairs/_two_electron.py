"""Singlet and triplet spatial functions of two electrons in two orbitals.

For a two-electron configuration (He 1s1 2p1, Li+ 1s1 2s1, He 1s2, C4+ 2p2, …) the
spin-adapted states with one electron in φa and one in φb have the spatial parts

    ψ±(r1, r2) = [φa(r1) φb(r2) ± φb(r1) φa(r2)] / √(2 (1 ± |⟨a|b⟩|²)),

ψ+ for the singlet (spin function antisymmetric) and ψ− for the triplet (spin
function symmetric), so that the whole state is antisymmetric (Pauli). ψ− changes
sign when the electrons are exchanged and vanishes wherever r1 = r2: the Fermi hole
of two same-spin electrons.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any, Literal

import numpy as np
import numpy.typing as npt

from zeffir.core._errors import QuantumNumberError
from zeffir.core.config import Subshell
from zeffir.core.orbitals import FloatArray, OrbitalSet, RadialFunction, solid_harmonic
from zeffir.core.pairs._one_matrix import ComplexArray, _as_points, complex_solid_harmonic, radial_overlap

__all__ = ["Coupling", "TwoElectronState"]

#: The two spin couplings of two electrons.
Coupling = Literal["singlet", "triplet"]
Kind = Literal["real", "complex"]


@dataclass(frozen=True)
class TwoElectronState:
    """The singlet or triplet of two electrons in orbitals a and b of a two-electron configuration.

    Parameters
    ----------
    orbitals : OrbitalSet
        The radial functions of a configuration with exactly two electrons. With two
        singly occupied subshells, a is the lower one (in (n, l) order) and b the
        other; with one subshell holding both, a and b are both in it.
    coupling : {"singlet", "triplet"}
        Total spin S = 0 (spatial function symmetric) or S = 1 (antisymmetric).
    m_a, m_b : int
        Magnetic quantum numbers of a and b (``kind="complex"``: Y_l^m with the
        Condon–Shortley phase) or real orders (``kind="real"``: m > 0 cos mφ,
        m < 0 sin |m|φ, as in :func:`~zeffir.core.real_label`).
    kind : {"real", "complex"}
        Real or complex angular functions; the radial map is the same for both.

    Raises
    ------
    QuantumNumberError
        If the configuration does not hold two electrons, an |m| exceeds l, or a
        triplet is asked for two electrons in the same orbital (a = b): then only
        the singlet exists, since ψ− would vanish identically (Pauli principle).

    Notes
    -----
    ψ± = [φa(1)φb(2) ± φb(1)φa(2)] / √(2(1 ± |S_ab|²)), S_ab = ⟨a|b⟩ =
    δ_{la lb} δ_{ma mb} ∫ R_a R_b r² dr. The models' radial functions need not be
    orthogonal (nodeless Slater-type 1s and 2s), hence the overlap in the
    normalisation; for a = b the singlet is φa(1)φa(2). Lengths in bohr; ψ in bohr⁻³.

    References
    ----------
    H. A. Bethe and E. E. Salpeter, *Quantum Mechanics of One- and Two-Electron
    Atoms* (Springer, 1957), §§ 25–28 (para- and orthohelium); R. McWeeny, *Methods
    of Molecular Quantum Mechanics* (1989), §2.6.

    Examples
    --------
    >>> import numpy as np
    >>> from zeffir.core import build
    >>> state = TwoElectronState(build("He 1s1 2p1", "hydrogenic"), "triplet")
    >>> s = np.linspace(0.0, 6.0, 7)
    >>> bool(np.all(np.diag(state.collinear_map(s, s)) == 0.0))
    True
    """

    orbitals: OrbitalSet
    coupling: Coupling = "singlet"
    m_a: int = 0
    m_b: int = 0
    kind: Kind = "real"
    subshells: tuple[Subshell, Subshell] = field(init=False)
    overlap: float = field(init=False)

    def __post_init__(self) -> None:
        configuration = self.orbitals.configuration
        if configuration.n_electrons != 2:
            raise QuantumNumberError(
                f"{configuration.spec}: singlet and triplet maps need exactly two electrons, "
                f"this configuration has {configuration.n_electrons}"
            )
        if self.coupling not in ("singlet", "triplet"):
            raise QuantumNumberError(f"{self.coupling}: coupling must be 'singlet' or 'triplet'")
        if self.kind not in ("real", "complex"):
            raise QuantumNumberError(f"{self.kind}: kind must be 'real' or 'complex'")
        subs = [sub for sub, occ in configuration.occupations for _ in range(occ)]
        a, b = subs[0], subs[1]
        for name, sub, m in (("m_a", a, self.m_a), ("m_b", b, self.m_b)):
            if abs(m) > sub.l:
                raise QuantumNumberError(f"{name} = {m}: |m| must be at most l = {sub.l} for {sub.label}")
        if a == b and self.m_a == self.m_b and self.coupling == "triplet":
            raise QuantumNumberError(
                f"{a.label}2 with m_a = m_b = {self.m_a}: both electrons share one orbital, so only "
                f"the singlet exists (the triplet spatial function vanishes by the Pauli principle)"
            )
        same_angular = a.l == b.l and self.m_a == self.m_b
        overlap = radial_overlap(self._radial(a), self._radial(b)) if same_angular else 0.0
        object.__setattr__(self, "subshells", (a, b))
        object.__setattr__(self, "overlap", float(overlap))

    def _radial(self, subshell: Subshell) -> RadialFunction:
        return self.orbitals.orbital(subshell).radial

    @property
    def exchange_term(self) -> bool:
        """True when a and b share l and m, so the exchange term survives the angular integrals."""
        (a, b) = self.subshells
        return a.l == b.l and self.m_a == self.m_b

    @property
    def sign(self) -> int:
        """+1 for the singlet, −1 for the triplet."""
        return 1 if self.coupling == "singlet" else -1

    @property
    def normalisation(self) -> float:
        """1 / √(2 (1 ± |⟨a|b⟩|²))."""
        return 1.0 / math.sqrt(2.0 * (1.0 + self.sign * self.overlap**2))

    def _solid_harmonic(self, l: int, m: int, points: FloatArray) -> FloatArray | ComplexArray:
        """r^l Y_lm at points (..., 3): real or complex as ``kind`` says."""
        x, y, z = points[..., 0], points[..., 1], points[..., 2]
        if self.kind == "complex":
            return complex_solid_harmonic(l, m, x, y, z)
        return solid_harmonic(l, m, x, y, z)

    def _orbital_values(self, points: FloatArray) -> tuple[npt.NDArray[Any], npt.NDArray[Any]]:
        r = np.sqrt(np.sum(points * points, axis=-1))
        (a, b), ms = self.subshells, (self.m_a, self.m_b)
        values: list[npt.NDArray[Any]] = []
        for sub, m in zip((a, b), ms, strict=True):
            # R/r^l · r^l Y_lm: nothing is divided at the nucleus.
            radial = self._radial(sub).over_r_l(r)
            values.append(radial * self._solid_harmonic(sub.l, m, points))
        return values[0], values[1]

    def __call__(self, r1: npt.ArrayLike, r2: npt.ArrayLike) -> FloatArray | ComplexArray:
        """ψ±(r1, r2) at points of shape (..., 3) in bohr (broadcast); bohr⁻³.

        Real for ``kind="real"``, complex for ``kind="complex"``.
        """
        a1, b1 = self._orbital_values(_as_points(r1, "r1"))
        a2, b2 = self._orbital_values(_as_points(r2, "r2"))
        return np.asarray(self.normalisation * (a1 * b2 + self.sign * (b1 * a2)))

    def radial_map(self, r1: npt.ArrayLike, r2: npt.ArrayLike) -> FloatArray:
        """Radial pair distribution P±(r1, r2) = r1² r2² ∫∫ |ψ±|² dΩ1 dΩ2 (bohr⁻²).

        Parameters
        ----------
        r1, r2 : array_like, 1-D
            Radii of electron 1 and electron 2 (bohr).

        Returns
        -------
        ndarray, shape (len(r1), len(r2))
            ``P[i, j]`` at (r1[i], r2[j]); ∫∫ P dr1 dr2 = 1.

        Notes
        -----
        With P_a = r R_a and orthonormal harmonics,
        P± = N² [P_a(r1)² P_b(r2)² + P_b(r1)² P_a(r2)²
                 ± 2 δ_{la lb} δ_{ma mb} P_a(r1) P_b(r1) P_a(r2) P_b(r2)],
        N² = 1/(2(1 ± S_ab²)). The exchange (cross) term carries
        |∫ Y_a* Y_b dΩ|² = δ_{la lb} δ_{ma mb}: for l_a ≠ l_b (1s 2p) it integrates
        to zero over the angles, and singlet and triplet have the same radial map;
        only the angular correlation differs (see :meth:`collinear_map`).
        """
        ra = np.asarray(r1, dtype=float)
        rb = np.asarray(r2, dtype=float)
        if ra.ndim != 1 or rb.ndim != 1:
            raise QuantumNumberError("r1 and r2 must be one-dimensional arrays of radii (bohr)")
        a, b = (self._radial(sub) for sub in self.subshells)
        pa1, pb1, pa2, pb2 = a.p(ra), b.p(ra), a.p(rb), b.p(rb)
        direct = np.outer(pa1**2, pb2**2) + np.outer(pb1**2, pa2**2)
        if self.exchange_term:
            direct += 2.0 * self.sign * np.outer(pa1 * pb1, pa2 * pb2)
        return np.asarray(self.normalisation**2 * direct, dtype=float)

    def collinear_map(
        self,
        s1: npt.ArrayLike,
        s2: npt.ArrayLike,
        direction: npt.ArrayLike = (0.0, 0.0, 1.0),
    ) -> FloatArray | ComplexArray:
        """ψ±(s1 n̂, s2 n̂) with both electrons on one line through the nucleus (bohr⁻³).

        Parameters
        ----------
        s1, s2 : array_like, 1-D
            Signed distances along n̂ (bohr); s >= 0 is the ray along n̂, s < 0 the
            opposite ray.
        direction : 3 floats
            n̂ (normalised here); the z axis by default.

        Returns
        -------
        ndarray, shape (len(s1), len(s2))
            ``psi[i, j]`` = ψ±(s1[i] n̂, s2[j] n̂); the triplet vanishes on s1 = s2
            for any pair of orbitals, and ψ−[i, j] = −ψ−[j, i] on a square grid.

        Notes
        -----
        An orbital whose angular function vanishes along n̂ (m ≠ 0 on the z axis)
        gives a map of zeros; pick another n̂ for it.
        """
        t1 = np.asarray(s1, dtype=float)
        t2 = np.asarray(s2, dtype=float)
        if t1.ndim != 1 or t2.ndim != 1:
            raise QuantumNumberError("s1 and s2 must be one-dimensional arrays of distances (bohr)")
        n = np.asarray(direction, dtype=float)
        if n.shape != (3,) or not np.all(np.isfinite(n)) or np.linalg.norm(n) == 0:
            raise QuantumNumberError("the direction must be three finite numbers, not all zero")
        n = n / np.linalg.norm(n)
        a1, b1 = self._orbital_values(t1[:, None] * n)
        a2, b2 = self._orbital_values(t2[:, None] * n)
        return np.asarray(self.normalisation * (np.outer(a1, b2) + self.sign * np.outer(b1, a2)))

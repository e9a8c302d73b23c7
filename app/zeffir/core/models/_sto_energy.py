"""Closed-form energies of orbitals built from one Slater-type function per subshell.

The variational model's orbitals are orthonormal combinations of the Slater-type
functions r^{n-1} e^{-ζr} of their l (one function per subshell, n* = n). Every
one-electron and Slater integral of such functions has a closed form, so the energy
of a configuration is exact to rounding and costs milliseconds, however heavy the
atom.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
import numpy.typing as npt

from zeffir.core.config import Subshell
from zeffir.core.energy import EnergyExpression
from zeffir.core.models._slater_integrals import log_norms, rk_product
from zeffir.core.orbitals import FloatArray

__all__ = ["StoEnergy", "sto_one_electron"]


def sto_one_electron(l: int, n: npt.ArrayLike, zetas: npt.ArrayLike, Z: float
                     ) -> tuple[FloatArray, FloatArray, FloatArray]:
    """Overlap, kinetic and nuclear-attraction matrices of normalised Slater-type functions of one l.

    Parameters
    ----------
    l : int
    n : array_like of int
        Principal quantum number of each function (n > l); they may differ.
    zetas : array_like
        Exponents (bohr⁻¹).
    Z : float
        Nuclear charge.

    Returns
    -------
    S, T, V : ndarray

    Notes
    -----
    P_p = N_p r^{n_p} e^{-ζ_p r}, so with N = n_p + n_q and s = ζ_p + ζ_q every integral
    is a sum of moments M_j = N_p N_q Γ(N - j + 1)/s^{N - j + 1} = ∫ P_p P_q r^{-j} dr:
    S = M_0, V = -Z M_1 and, from P' = P (n/r - ζ) (the boundary terms vanish),
    T = ½ [(n_p n_q + l(l+1)) M_2 - (n_p ζ_q + n_q ζ_p) M_1 + ζ_p ζ_q M_0].

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); J. C. Slater, *Quantum Theory of
    Atomic Structure* (1960), vol. I, App. 20.

    Examples
    --------
    >>> S, T, V = sto_one_electron(0, [1], [1.0], 1.0)  # hydrogen 1s: T = ½, V = -1
    >>> [round(float(m[0, 0]), 12) for m in (S, T, V)]
    [1.0, 0.5, -1.0]
    """
    from scipy import special

    nn = np.asarray(n, dtype=float)
    z = np.asarray(zetas, dtype=float)
    log_pair = log_norms(nn, z)[:, None] + log_norms(nn, z)[None, :]
    total = nn[:, None] + nn[None, :]
    s = z[:, None] + z[None, :]

    def moment(j: int) -> FloatArray:
        a = total - j + 1
        return np.asarray(np.exp(log_pair + special.gammaln(a) - a * np.log(s)), dtype=float)

    m0, m1, m2 = moment(0), moment(1), moment(2)
    kinetic = 0.5 * ((nn[:, None] * nn[None, :] + l * (l + 1)) * m2
                     - (nn[:, None] * z[None, :] + nn[None, :] * z[:, None]) * m1
                     + z[:, None] * z[None, :] * m0)
    return m0, np.asarray(kinetic, dtype=float), -float(Z) * m1


class StoEnergy:
    """The energy of an expression for orbitals that are combinations of one STO per subshell.

    Parameters
    ----------
    expression : EnergyExpression
        Coefficients of I(a), F^k and G^k (:mod:`zeffir.core.energy`).
    subshells : sequence of Subshell
        The configuration's subshells; subshell i has the function r^{n-1} e^{-ζ_i r}.

    Notes
    -----
    Orbital a of l is φ_a = Σ_p C_ap χ_p over the functions χ_p of the subshells of l.
    I(a) = C_aᵀ (T + V) C_a; F^k(a, b) = Σ C_ap C_aq C_br C_bs R^k[pq|rs];
    G^k(a, b) = Σ C_ap C_bq C_br C_as R^k[pq|rs]. One R^k tensor over all the
    functions serves every pair of subshells (elements that no Slater integral uses,
    where a power falls below k + 1, are set to zero), so an evaluation is one
    R^k evaluation per k (:func:`zeffir.core.models._slater_integrals.rk_product`,
    with mixed powers) and a few matrix products: F^k = D R^k Dᵀ with
    D_a = C_a ⊗ C_a, and G^k(a, b) the (ab, ba) elements of Y R^k Yᵀ with
    Y_ab = C_a ⊗ C_b.

    References
    ----------
    Roothaan 1951; Slater 1960, vol. I, App. 20; E. Clementi and D. L. Raimondi, J.
    Chem. Phys. 38, 2686 (1963) (the same energies, minimised over ζ).
    """

    def __init__(self, expression: EnergyExpression, subshells: Sequence[Subshell]) -> None:
        self.expression = expression
        self.subshells = tuple(subshells)
        self.Z = float(expression.configuration.Z)
        self.n = np.array([float(s.n) for s in self.subshells])
        self.groups: dict[int, list[int]] = {}
        for i, sub in enumerate(self.subshells):
            self.groups.setdefault(sub.l, []).append(i)
        for members in self.groups.values():
            members.sort(key=lambda i: self.subshells[i].n)
        index = {sub: i for i, sub in enumerate(self.subshells)}
        self.weights = np.array([expression.one_electron.get(sub, 0.0) for sub in self.subshells])
        self.f_terms: dict[int, list[tuple[float, int, int]]] = {}
        self.g_terms: dict[int, list[tuple[float, int, int]]] = {}
        for (kind, k, a, b), c in expression.slater.items():
            if c != 0.0 and a in index and b in index:
                table = self.f_terms if kind == "F" else self.g_terms
                table.setdefault(k, []).append((c, index[a], index[b]))

    def terms_at(self, zetas: Sequence[float],
                 coefficients: dict[int, FloatArray]) -> tuple[float, float, float]:
        """Kinetic, nuclear-attraction and repulsion energies (hartree).

        Parameters
        ----------
        zetas : sequence of float
            Exponent of each subshell's function, in the order of ``subshells``.
        coefficients : dict
            ``{l: C}``, row i of C the orbital of the group's i-th subshell (in order of
            n) over the group's functions in the same order.
        """
        z = np.asarray(zetas, dtype=float)
        size = len(self.subshells)
        full = np.zeros((size, size))  # row: orbital of subshell i; columns: all functions
        kinetic = nuclear = repulsion = 0.0
        for l, members in self.groups.items():
            c = coefficients[l]
            full[np.ix_(members, members)] = c
            _, t, v = sto_one_electron(l, self.n[members], z[members], self.Z)
            w = self.weights[members]
            kinetic += float(np.sum(w * np.einsum("ap,pq,aq->a", c, t, c)))
            nuclear += float(np.sum(w * np.einsum("ap,pq,aq->a", c, v, c)))
        for k in sorted(set(self.f_terms) | set(self.g_terms)):
            tensor = self._rk(k, z)
            if k in self.f_terms:
                d = np.einsum("ap,aq->apq", full, full).reshape(size, -1)
                f = d @ tensor @ d.T
                repulsion += float(sum(factor * f[a, b] for factor, a, b in self.f_terms[k]))
            if k in self.g_terms:
                for factor, a, b in self.g_terms[k]:
                    ab = np.outer(full[a], full[b]).ravel()
                    ba = np.outer(full[b], full[a]).ravel()
                    repulsion += factor * float(ab @ tensor @ ba)
        return kinetic, nuclear, repulsion

    def _rk(self, k: int, z: FloatArray) -> FloatArray:
        """R^k over all functions as an (M², M²) matrix; zero where a power is below k + 1.

        Evaluated once per unordered pair (p ≤ q) on each side and spread: R^k[pq|rs]
        depends on p, q only through n_p + n_q and ζ_p + ζ_q.
        """
        size = z.size
        upper_p, upper_q = np.triu_indices(size)
        slot = np.empty((size, size), dtype=int)
        slot[upper_p, upper_q] = np.arange(upper_p.size)
        slot[upper_q, upper_p] = np.arange(upper_p.size)
        sums = z[upper_p] + z[upper_q]
        powers_u = self.n[upper_p] + self.n[upper_q]
        valid = powers_u >= k + 1
        powers = np.where(valid, powers_u, k + 1.0)
        logs = log_norms(self.n, z)
        log_pairs = logs[upper_p] + logs[upper_q]
        values = rk_product(k, powers[:, None], sums[:, None], powers[None, :], sums[None, :])
        values *= np.exp(log_pairs[:, None] + log_pairs[None, :])
        values[~valid, :] = 0.0
        values[:, ~valid] = 0.0
        flat = slot.ravel()
        return np.asarray(values[np.ix_(flat, flat)], dtype=float)

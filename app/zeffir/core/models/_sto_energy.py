"""Closed-form energies of orbitals built from one Slater-type function per subshell.

The variational model's orbitals are orthonormal combinations of the Slater-type
functions r^{n-1} e^{-ζr} of their l (one function per subshell, n* = n). Every
one-electron and Slater integral of such functions has a closed form, and so have
their derivatives with respect to the exponents, so the energy of a configuration
and its gradient are exact to rounding and cost milliseconds, however heavy the
atom.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
import numpy.typing as npt

from zeffir.core.config import Subshell
from zeffir.core.energy import EnergyExpression
from zeffir.core.models._slater_integrals import log_norms, rk_product_gradient
from zeffir.core.orbitals import FloatArray

__all__ = ["StoEnergy", "StoGradient", "sto_one_electron", "sto_one_electron_derivatives"]


def _moments(n: npt.ArrayLike, zetas: npt.ArrayLike
             ) -> tuple[FloatArray, FloatArray, FloatArray, FloatArray, FloatArray, FloatArray]:
    """n, ζ and the moments M_0, M_1, M_2 (see :func:`sto_one_electron`) with their sums s."""
    from zeffir.core._scipy import special

    nn = np.asarray(n, dtype=float)
    z = np.asarray(zetas, dtype=float)
    log_pair = log_norms(nn, z)[:, None] + log_norms(nn, z)[None, :]
    total = nn[:, None] + nn[None, :]
    s = z[:, None] + z[None, :]

    def moment(j: int) -> FloatArray:
        a = total - j + 1
        return np.asarray(np.exp(log_pair + special.gammaln(a) - a * np.log(s)), dtype=float)

    return nn, z, s, moment(0), moment(1), moment(2)


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
    nn, z, _, m0, m1, m2 = _moments(n, zetas)
    kinetic = 0.5 * ((nn[:, None] * nn[None, :] + l * (l + 1)) * m2
                     - (nn[:, None] * z[None, :] + nn[None, :] * z[:, None]) * m1
                     + z[:, None] * z[None, :] * m0)
    return m0, np.asarray(kinetic, dtype=float), -float(Z) * m1


def sto_one_electron_derivatives(l: int, n: npt.ArrayLike, zetas: npt.ArrayLike, Z: float
                                 ) -> tuple[FloatArray, FloatArray, FloatArray]:
    """∂S_pq/∂ζ_p, ∂T_pq/∂ζ_p and ∂V_pq/∂ζ_p of :func:`sto_one_electron` (ζ_q held fixed).

    Parameters
    ----------
    l, n, zetas, Z
        As for :func:`sto_one_electron`.

    Returns
    -------
    dS, dT, dV : ndarray
        Element [p, q] is the derivative of element [p, q] with respect to the exponent
        of its first function only. A change dζ_i of one exponent changes X_pq by
        (δ_ip D[p, q] + δ_iq D[q, p]) dζ_i, since X is symmetric.

    Notes
    -----
    With ln N_p = (n_p + ½) ln 2ζ_p - ½ ln (2n_p)! and a = n_p + n_q - j + 1,
    ∂M_j/∂ζ_p = M_j [(n_p + ½)/ζ_p - a/s]; T and V are the sums of
    :func:`sto_one_electron` differentiated term by term (product rule on the
    ζ-dependent factors n_p ζ_q + n_q ζ_p and ζ_p ζ_q).

    References
    ----------
    Roothaan 1951 (as :func:`sto_one_electron`).

    Examples
    --------
    The overlap of a normalised function with itself is 1 for every ζ, so its total
    derivative 2 ∂S_pp/∂ζ_p vanishes; hydrogen-like 1s: T = ζ²/2, ∂T/∂ζ = ζ in total:

    >>> dS, dT, dV = sto_one_electron_derivatives(0, [1], [1.3], 1.0)
    >>> bool(abs(dS[0, 0]) < 1e-15 and abs(2 * dT[0, 0] - 1.3) < 1e-14 and abs(2 * dV[0, 0] + 1.0) < 1e-14)
    True
    """
    nn, z, s, m0, m1, m2 = _moments(n, zetas)
    total = nn[:, None] + nn[None, :]
    rate = ((nn + 0.5) / z)[:, None]

    def d_moment(moment: FloatArray, j: int) -> FloatArray:
        return np.asarray(moment * (rate - (total - j + 1) / s), dtype=float)

    d0, d1, d2 = d_moment(m0, 0), d_moment(m1, 1), d_moment(m2, 2)
    kinetic = 0.5 * ((nn[:, None] * nn[None, :] + l * (l + 1)) * d2
                     - nn[None, :] * m1
                     - (nn[:, None] * z[None, :] + nn[None, :] * z[:, None]) * d1
                     + z[None, :] * m0 + z[:, None] * z[None, :] * d0)
    return d0, np.asarray(kinetic, dtype=float), -float(Z) * d1


@dataclass(frozen=True, slots=True)
class _Block:
    """One set of function pairs of one k whose R^k elements an energy needs.

    ``pairs`` index the unordered pairs (p ≤ q) of functions; ``left``/``right`` are
    the orbital pairs (a, b) of the vectors X_ab over those pairs, and
    E = Σ_tt' ``omega``[t, t'] X_t R^k X_t'.
    """

    k: int
    pairs: npt.NDArray[np.intp]
    left: npt.NDArray[np.intp]
    right: npt.NDArray[np.intp]
    omega: FloatArray
    #: Where the block's upper triangle (u <= v) sits in the flat list of all blocks.
    start: int
    #: Row and column (within the block) of each element of that upper triangle.
    upper_u: npt.NDArray[np.intp]
    upper_v: npt.NDArray[np.intp]
    #: (coefficient, a, b, t, t'): each F^k(a, b) or G^k(a, b) of the block is X_t R^k X_t'.
    terms: tuple[tuple[float, int, int, int, int], ...]


@dataclass(frozen=True, slots=True)
class StoGradient:
    """An energy and its derivatives at fixed orbital coefficients (hartree).

    Attributes
    ----------
    kinetic, nuclear, repulsion : float
        The parts of the energy.
    zetas : ndarray
        ∂E/∂ζ_i, the coefficients C held fixed (one per subshell, in its order).
    coefficients : ndarray
        ∂E/∂C[a, p], row a the orbital of subshell a, column p the function of
        subshell p (zero outside the blocks of equal l).
    """

    kinetic: float
    nuclear: float
    repulsion: float
    zetas: FloatArray
    coefficients: FloatArray


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
    G^k(a, b) = Σ C_ap C_bq C_br C_as R^k[pq|rs]. R^k[pq|rs] depends on p, q only
    through n_p + n_q and ζ_p + ζ_q, so both are quadratic forms over unordered
    pairs u = {p, q}: F^k(a, b) = X_aa R^k X_bb and G^k(a, b) = X_ab R^k X_ab, with
    X_ab[u] = C_ap C_bq + C_aq C_bp (halved when p = q). Only the pairs an integral
    uses are evaluated, each symmetric element once, all k in one call: for each k,
    the same-l pairs of the l that enter an F^k, and for each G^k between l_a ≠ l_b
    the pairs of one l_a and one l_b function.

    The derivatives are closed forms too: ∂R^k/∂(ζ_p + ζ_q) is a combination of the
    same two incomplete-beta terms as R^k
    (:func:`zeffir.core.models._slater_integrals.rk_product_gradient`),
    ∂ ln N/∂ζ = (n + ½)/ζ, and E is a polynomial in C
    (:meth:`gradient_at`).

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
        size = len(self.subshells)
        self._pair_p, self._pair_q = np.triu_indices(size)
        self._blocks = self._make_blocks()
        # The upper triangles of all blocks, flat: one R^k evaluation serves every block.
        ks, us, vs = [], [], []
        for block in self._blocks:
            ks.append(np.full(block.upper_u.size, block.k))
            us.append(block.pairs[block.upper_u])
            vs.append(block.pairs[block.upper_v])
        self._flat_k = np.concatenate(ks) if ks else np.zeros(0, dtype=int)
        self._flat_u = np.concatenate(us) if us else np.zeros(0, dtype=np.intp)
        self._flat_v = np.concatenate(vs) if vs else np.zeros(0, dtype=np.intp)

    def _make_blocks(self) -> list[_Block]:
        ls = np.array([s.l for s in self.subshells])
        lp, lq = ls[self._pair_p], ls[self._pair_q]
        blocks: list[_Block] = []
        start = 0
        for k in sorted(set(self.f_terms) | set(self.g_terms)):
            # Terms by the pairs they need: None for the same-l pairs of the l in an F^k
            # (which also serve a G^k within one of those l), (l_a, l_b) for other G^k.
            f_ls = {int(ls[i]) for _, a, b in self.f_terms.get(k, []) for i in (a, b)}
            sets: dict[tuple[int, int] | None, list[tuple[str, float, int, int]]] = {}
            for c, a, b in self.f_terms.get(k, []):
                sets.setdefault(None, []).append(("F", c, a, b))
            for c, a, b in self.g_terms.get(k, []):
                la, lb = sorted((int(ls[a]), int(ls[b])))
                key = None if la == lb and la in f_ls else (la, lb)
                sets.setdefault(key, []).append(("G", c, min(a, b), max(a, b)))
            for key, terms in sets.items():
                if key is None:
                    chosen = (lp == lq) & np.isin(lp, sorted(f_ls))
                else:
                    la, lb = key
                    chosen = ((lp == la) & (lq == lb)) | ((lp == lb) & (lq == la))
                vectors: dict[tuple[int, int], int] = {}
                for kind, _, a, b in terms:
                    wanted = ((a, a), (b, b)) if kind == "F" else ((a, b),)
                    for t in wanted:
                        vectors.setdefault(t, len(vectors))
                omega = np.zeros((len(vectors), len(vectors)))
                placed = []
                for kind, c, a, b in terms:
                    if kind == "F":
                        i, j = vectors[(a, a)], vectors[(b, b)]
                        omega[i, j] += 0.5 * c
                        omega[j, i] += 0.5 * c
                    else:
                        i = j = vectors[(a, b)]
                        omega[i, i] += c
                    placed.append((c, a, b, i, j))
                order = sorted(vectors, key=vectors.__getitem__)
                pairs = np.flatnonzero(chosen)
                upper_u, upper_v = np.triu_indices(pairs.size)
                blocks.append(_Block(k, pairs, np.array([a for a, _ in order], dtype=np.intp),
                                     np.array([b for _, b in order], dtype=np.intp), omega, start,
                                     upper_u, upper_v, tuple(placed)))
                start += upper_u.size
        return blocks

    def _full(self, coefficients: dict[int, FloatArray]) -> FloatArray:
        """All coefficients as one matrix: row a the orbital of subshell a, columns all functions."""
        size = len(self.subshells)
        full = np.zeros((size, size))
        for l, members in self.groups.items():
            full[np.ix_(members, members)] = coefficients[l]
        return full

    def _integrals(self, z: FloatArray) -> tuple[FloatArray, FloatArray, FloatArray]:
        """R^k on the flat upper triangles of all blocks, with ∂/∂(ζ_p + ζ_q) of each side."""
        logs = log_norms(self.n, z)
        sums = z[self._pair_p] + z[self._pair_q]
        powers = self.n[self._pair_p] + self.n[self._pair_q]
        log_pairs = logs[self._pair_p] + logs[self._pair_q]
        u, v = self._flat_u, self._flat_v
        values, d_left, d_right = rk_product_gradient(self._flat_k, powers[u], sums[u], powers[v], sums[v])
        norms = np.exp(log_pairs[u] + log_pairs[v])
        return values * norms, d_left * norms, d_right * norms

    @staticmethod
    def _square(block: _Block, upper: FloatArray, lower: FloatArray | None = None) -> FloatArray:
        """The block's matrix from its flat upper triangle (and, if given, its lower one)."""
        out = np.empty((block.pairs.size, block.pairs.size))
        window = slice(block.start, block.start + block.upper_u.size)
        out[block.upper_v, block.upper_u] = (upper if lower is None else lower)[window]
        out[block.upper_u, block.upper_v] = upper[window]
        return out

    def _pair_vectors(self, block: _Block, full: FloatArray) -> FloatArray:
        """X_ab[u] = C_ap C_bq + C_aq C_bp (halved when p = q), one row per (a, b) of the block."""
        p, q = self._pair_p[block.pairs], self._pair_q[block.pairs]
        a, b = full[block.left], full[block.right]
        x = a[:, p] * b[:, q] + a[:, q] * b[:, p]
        x[:, p == q] *= 0.5
        return np.asarray(x, dtype=float)

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
        full = self._full(coefficients)
        kinetic = nuclear = 0.0
        for l, members in self.groups.items():
            c = coefficients[l]
            _, t, v = sto_one_electron(l, self.n[members], z[members], self.Z)
            w = self.weights[members]
            kinetic += float(np.sum(w * np.einsum("ap,pq,aq->a", c, t, c)))
            nuclear += float(np.sum(w * np.einsum("ap,pq,aq->a", c, v, c)))
        flat, _, _ = self._integrals(z)
        repulsion = 0.0
        for block in self._blocks:
            x = self._pair_vectors(block, full)
            repulsion += float(np.sum(block.omega * (x @ self._square(block, flat) @ x.T)))
        return kinetic, nuclear, repulsion

    def orbital_energies(self, zetas: Sequence[float], coefficients: dict[int, FloatArray]) -> FloatArray:
        """ε_a = ⟨φ_a|F_a|φ_a⟩ of the expression's Fock operators, in closed form (hartree).

        Parameters
        ----------
        zetas, coefficients
            As for :meth:`terms_at`.

        Returns
        -------
        ndarray
            One ε per subshell, in the order of ``subshells`` (NaN where the
            occupancy is zero).

        Notes
        -----
        The definition of :func:`zeffir.core.energy.orbital_energies`:
        ε_a = I(a) + (1/w_a) Σ c X over the Slater integrals X = F^k(a, b), G^k(a, b)
        with coefficient c that involve a, F^k(a, a) counted twice (it is quartic in
        φ_a), here with the closed-form integrals of the blocks.
        """
        z = np.asarray(zetas, dtype=float)
        full = self._full(coefficients)
        one = np.zeros(z.size)
        for l, members in self.groups.items():
            c = coefficients[l]
            _, t, v = sto_one_electron(l, self.n[members], z[members], self.Z)
            one[members] = np.einsum("ap,pq,aq->a", c, t + v, c)
        sums = np.zeros(z.size)
        flat, _, _ = self._integrals(z)
        for block in self._blocks:
            x = self._pair_vectors(block, full)
            values = x @ self._square(block, flat) @ x.T
            for factor, a, b, i, j in block.terms:
                if a == b:
                    sums[a] += 2.0 * factor * values[i, j]
                else:
                    sums[a] += factor * values[i, j]
                    sums[b] += factor * values[i, j]
        with np.errstate(divide="ignore", invalid="ignore"):
            return np.where(self.weights > 0, one + sums / self.weights, np.nan)

    def gradient_at(self, zetas: Sequence[float], coefficients: dict[int, FloatArray]) -> StoGradient:
        """The energy's parts and its derivatives with respect to ζ and to C.

        Parameters
        ----------
        zetas, coefficients
            As for :meth:`terms_at`.

        Returns
        -------
        StoGradient

        Notes
        -----
        One-electron part: E₁ = Σ_pq P_pq H_pq with P = Σ_a w_a C_a C_aᵀ, so
        ∂E₁/∂C_a = 2 w_a H C_a and ∂E₁/∂ζ_i = 2 Σ_q P_iq ∂H_iq/∂ζ_i
        (:func:`sto_one_electron_derivatives`). Repulsion of a block:
        E = Σ ω_tt' X_t R X_t'; with W = Xᵀ ω X, ∂E/∂R = W, and
        ∂R[u, v]/∂ζ_i = m_u(i) [(n_i + ½)/ζ_i R[u, v] + ∂_α R[u, v]] + (u ↔ v),
        m_u(i) the number of times function i is in pair u; ∂E/∂X_t = 2 (ω X R)_t
        goes to C through X_ab = Σ over the ordered pairs of u of C_ap C_bq.
        """
        z = np.asarray(zetas, dtype=float)
        size = z.size
        full = self._full(coefficients)
        grad_z = np.zeros(size)
        grad_c = np.zeros((size, size))
        kinetic = nuclear = 0.0
        for l, members in self.groups.items():
            c = coefficients[l]
            nl, zl = self.n[members], z[members]
            _, t, v = sto_one_electron(l, nl, zl, self.Z)
            _, dt, dv = sto_one_electron_derivatives(l, nl, zl, self.Z)
            w = self.weights[members]
            kinetic += float(np.sum(w * np.einsum("ap,pq,aq->a", c, t, c)))
            nuclear += float(np.sum(w * np.einsum("ap,pq,aq->a", c, v, c)))
            density = (c.T * w) @ c
            grad_z[members] += 2.0 * np.sum(density * (dt + dv), axis=1)
            grad_c[np.ix_(members, members)] += 2.0 * w[:, None] * (c @ (t + v))
        flat, d_left, d_right = self._integrals(z)
        rate = (self.n + 0.5) / z
        repulsion = 0.0
        for block in self._blocks:
            values = self._square(block, flat)
            # slope[u, v] = ∂R[u, v]/∂(ζ_p + ζ_q) of u = {p, q}: the upper triangle has u
            # on the left, the lower one the transposed element with u on the right.
            slope = self._square(block, d_left, d_right)
            x = self._pair_vectors(block, full)
            xr = x @ values
            repulsion += float(np.sum(block.omega * (xr @ x.T)))
            weight = x.T @ block.omega @ x
            p, q = self._pair_p[block.pairs], self._pair_q[block.pairs]
            rho = np.sum(weight * values, axis=1)
            kappa = np.sum(weight * slope, axis=1)
            np.add.at(grad_z, p, 2.0 * (rate[p] * rho + kappa))
            np.add.at(grad_z, q, 2.0 * (rate[q] * rho + kappa))
            lam = 2.0 * block.omega @ xr
            mats = np.zeros((lam.shape[0], size, size))
            mats[:, p, q] = lam
            mats[:, q, p] = lam
            np.add.at(grad_c, block.left, np.einsum("tpq,tq->tp", mats, full[block.right]))
            np.add.at(grad_c, block.right, np.einsum("tpq,tq->tp", mats, full[block.left]))
        return StoGradient(kinetic, nuclear, repulsion, grad_z, grad_c)

"""Hartree–Fock for an energy given as a combination of radial integrals (any configuration)."""

from __future__ import annotations

from collections.abc import Callable
from typing import TYPE_CHECKING

import numpy as np

from zeffir.core.config import Subshell
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis, default_basis
from zeffir.core.models.hartree_fock._checks import _check_coefficients, _check_virial
from zeffir.core.models.hartree_fock._matrices import _exchange_weight, _setup
from zeffir.core.models.hartree_fock._result import HartreeFockResult, SCFState, _positive_at_the_nucleus
from zeffir.core.models.hartree_fock._scf import MAX_ITERATIONS, _gradient, _Iterate, _run_scf
from zeffir.core.orbitals import FloatArray

if TYPE_CHECKING:
    from zeffir.core.energy import EnergyExpression

__all__ = ["solve_expression"]


def solve_expression(
    expression: EnergyExpression,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
    *,
    symbol: str = "E",
) -> HartreeFockResult:
    """Restricted Hartree–Fock for an energy given as a combination of radial integrals.

    The general solver: any configuration (closed shells, any number of open
    subshells, empty lower subshells) and any energy expression of it, such as the
    average of the configuration or the energy of its Hund determinant.

    Parameters
    ----------
    expression : EnergyExpression
        E = Σ_a w_a I(a) + Σ c^k_ab F^k(a, b) + Σ d^k_ab G^k(a, b) of a configuration
        (:mod:`zeffir.core.energy`); its subshells may leave lower ones of their l empty.
    basis, progress, should_stop, max_iterations
        As for :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`.
    symbol : str
        Name of the energy in progress messages.

    Returns
    -------
    HartreeFockResult
        ``coefficients[l]`` has a column per n = l+1 .. highest occupied n of l; a
        column of an empty subshell holds a virtual orbital. Each orbital energy is
        the diagonal element of its subshell's Fock operator.

    Raises
    ------
    ModelError
        A basis spanning fewer functions of some l than orbitals needed.
    HartreeFockError
        No convergence within ``max_iterations``, divergence, or a solution refused by
        the checks (virial ratio, cancelling coefficients).

    Notes
    -----
    One radial function per subshell a (occupancy w_a, density D_a = φ_a φ_aᵀ);
    F^k(a, b) = Σ D_a,pq D_b,rs R^k[pq|rs], G^k(a, b) = Σ φ_a,p φ_b,r φ_b,q φ_a,s R^k[pr|qs].
    The derivative of E defines one Fock operator per subshell (per electron),
    ∂E/∂φ_a = 2 w_a F_a φ_a. For the orbitals of one l, stationarity requires
    ⟨φ_j|w_i F_i - w_j F_j|φ_i⟩ = 0 and ⟨φ_v|F_i|φ_i⟩ = 0 (v virtual). As in
    :func:`~zeffir.core.models.hartree_fock.solve_open_shell` (Roothaan 1960) these are
    the off-diagonal blocks of one Hermitian matrix R per l, in the basis of the
    current orbitals: R_ii = F_i, R_iv = F_i, R_vv = F of the highest occupied
    subshell of l, and
    R_ij = (w_i F_i - w_j F_j)/(w_i - w_j) for w_i ≠ w_j, F_i - F_j for equal open
    occupancies (the step then scales like a Newton step), ½(F_i + F_j) for two full
    subshells (their rotation leaves E unchanged). Subshell nl takes the eigenvector
    of R number n - l (in increasing order): an empty lower subshell of the same l
    (the 3s of Na [Ne] 4s1) is the virtual orbital below it, so the occupied orbital
    keeps its n - l - 1 radial nodes, the usual choice for excited configurations in
    numerical Hartree–Fock (Froese Fischer 1977). DIIS on the gradient
    Σ_i w_i (F_i D_i S - S D_i F_i)/(2(2l+1)); convergence criteria as for
    :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`. For closed shells, or
    one open subshell with the Hund expression, the result is that of the other
    solvers. The pairs of subshells go through the closed-shell Coulomb-minus-exchange
    tensors at once; only the remainder of the expression (the pairs of open
    subshells) is contracted term by term.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 32, 179 (1960); C. Froese Fischer, *The
    Hartree–Fock Method for Atoms* (Wiley, 1977); P. Pulay, Chem. Phys. Lett. 73, 393
    (1980).

    Examples
    --------
    For closed shells every expression is the closed-shell energy: the general path
    meets Roothaan's closed-shell solver.

    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.energy import average_energy_expression
    >>> from zeffir.core.models.hartree_fock import solve_closed_shell
    >>> be = parse_spec("Be")
    >>> general = solve_expression(average_energy_expression(be))
    >>> bool(abs(general.energy - solve_closed_shell(be).energy) < 1e-9)
    True
    """
    from zeffir.core.models._slater_integrals import rk_tensor

    configuration = expression.configuration
    occ = {sub: float(w) for sub, w in configuration.occupations if w > 0}
    subs = list(occ)
    col = {sub: sub.n - sub.l - 1 for sub in subs}
    layout = {l: 1 + max(col[sub] for sub in subs if sub.l == l) for l in sorted({sub.l for sub in subs})}
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, zetas, overlap, core = setup.ls, setup.zetas, setup.overlap, setup.core
    interaction = setup.interaction
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)
    full = {sub: occ[sub] == 2 * (2 * sub.l + 1) for sub in subs}
    # The part every pair shares with closed shells goes through the closed-shell
    # Coulomb and exchange tensors at once; only the remainder (pairs of open subshells)
    # is contracted term by term.
    baseline = _spherical_pair_coefficients(occ)
    terms = []
    for key in set(expression.slater) | set(baseline):
        kind, k, a, b = key
        if a in occ and b in occ:
            delta = expression.slater.get(key, 0.0) - baseline.get(key, 0.0)
            if abs(delta) > 1e-12:
                terms.append((delta, kind, k, a, b))
    tensors: dict[tuple[str, int, int, int], FloatArray] = {}

    def tensor(kind: str, k: int, la: int, lb: int) -> FloatArray:
        """R^k arranged (p, q, r, s) with p, q of l_a and r, s of l_b, to contract with D_b."""
        key = (kind, k, la, lb)
        if key not in tensors:
            za, zb = zetas[la], zetas[lb]
            if kind == "F":
                tensors[key] = rk_tensor(k, la + 1, za, la + 1, za, lb + 1, zb, lb + 1, zb)
            else:  # R^k[p r | q s], p, s of l_a: moved to (p, s, r, q)
                t = rk_tensor(k, la + 1, za, lb + 1, zb, lb + 1, zb, la + 1, za)
                tensors[key] = t.transpose(0, 3, 1, 2)
        return tensors[key]

    def densities(c: dict[int, FloatArray]) -> dict[Subshell, FloatArray]:
        return {sub: np.outer(c[sub.l][:, col[sub]], c[sub.l][:, col[sub]]) for sub in subs}

    def fock_of(c: dict[int, FloatArray]) -> tuple[dict[Subshell, FloatArray], float]:
        dens = densities(c)
        weighted = {l: sum((occ[sub] * dens[sub] for sub in subs if sub.l == l), np.zeros_like(core[l]))
                    for l in ls}
        shared = {}
        for lam in ls:
            f = np.zeros_like(core[lam])
            for lp in ls:
                f += np.tensordot(interaction[lam, lp], weighted[lp], axes=([2, 3], [0, 1]))
            shared[lam] = f
        g = {sub: np.zeros_like(core[sub.l]) for sub in subs}
        energy = sum(occ[sub] * float(np.sum(dens[sub] * (core[sub.l] + 0.5 * shared[sub.l])))
                     for sub in subs)
        for coeff, kind, k, a, b in terms:
            on_a = np.tensordot(tensor(kind, k, a.l, b.l), dens[b], axes=([2, 3], [0, 1]))
            energy += coeff * float(np.sum(dens[a] * on_a))
            if a == b:
                g[a] += 2 * coeff * on_a
            else:
                g[a] += coeff * on_a
                g[b] += coeff * np.tensordot(tensor(kind, k, b.l, a.l), dens[a], axes=([2, 3], [0, 1]))
        return {sub: core[sub.l] + shared[sub.l] + g[sub] / occ[sub] for sub in subs}, energy

    def effective(c: dict[int, FloatArray], fock: dict[Subshell, FloatArray]) -> dict[int, FloatArray]:
        out = {}
        for l in ls:
            x = transform[l]
            mine = [sub for sub in subs if sub.l == l]
            f = {sub: x.T @ fock[sub] @ x for sub in mine}
            u = x.T @ overlap[l] @ c[l]
            p = {sub: np.outer(u[:, col[sub]], u[:, col[sub]]) for sub in mine}
            p_v = np.eye(x.shape[1]) - sum(p.values())
            r = p_v @ f[max(mine, key=lambda sub: sub.n)] @ p_v
            for i, a in enumerate(mine):
                r += p[a] @ f[a] @ p[a] + p[a] @ f[a] @ p_v + p_v @ f[a] @ p[a]
                for b in mine[i + 1:]:
                    if full[a] and full[b]:
                        block = 0.5 * (f[a] + f[b])
                    elif occ[a] != occ[b]:
                        block = (occ[a] * f[a] - occ[b] * f[b]) / (occ[a] - occ[b])
                    else:
                        block = f[a] - f[b]
                    r += p[a] @ block @ p[b] + p[b] @ block @ p[a]
            out[l] = 0.5 * (r + r.T)
        return out

    def diagonalise(matrices: dict[int, FloatArray]) -> dict[int, FloatArray]:
        return {l: transform[l] @ np.linalg.eigh(matrices[l])[1][:, : layout[l]] for l in ls}

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        fock, energy = fock_of(coefficients)
        dens = densities(coefficients)
        gradients = []
        for l in ls:
            g = sum((occ[sub] * fock[sub] @ dens[sub] for sub in subs if sub.l == l),
                    np.zeros_like(core[l])) @ overlap[l] / (2 * (2 * l + 1))
            gradients.append(_gradient(g, kept.get(l)).ravel())
        return energy, np.concatenate(gradients), (fock,)

    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept,
        diagonalise({l: transform[l].T @ core[l] @ transform[l] for l in ls}), evaluate,
        lambda c, last: effective(c, last[0]), diagonalise,
        progress, should_stop, max_iterations, symbol)
    (fock,) = payload
    dens = densities(coefficients)
    kinetic_energy = sum(occ[sub] * float(np.sum(dens[sub] * setup.kinetic[sub.l])) for sub in subs)
    _check_coefficients(configuration, coefficients, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {sub: float(np.sum(dens[sub] * fock[sub])) for sub in subs}
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, setup.dropped)


def _spherical_pair_coefficients(
        occupancy: dict[Subshell, float]) -> dict[tuple[str, int, Subshell, Subshell], float]:
    """Coefficients of ½ Σ_ab w_a w_b [F⁰(a, b) - ½ Σ_k (l_a k l_b; 0 0 0)² G^k(a, b)].

    G^k(a, a) stands for F^k(a, a).

    The interaction of every pair as if one of them were a closed shell: exact for
    closed–closed and closed–open pairs in both the average and the Hund expressions
    (a closed shell is spherical and has no net spin), and for a closed shell with
    itself (1s²: F⁰; p⁶: 15F⁰ - (6/5)F²). Keys as in
    :class:`zeffir.core.energy.EnergyExpression`.
    """
    square = _exchange_weight  # (l1 k l2; 0 0 0)²
    out: dict[tuple[str, int, Subshell, Subshell], float] = {}
    subs = sorted(occupancy, key=lambda s: (s.n, s.l))
    for i, a in enumerate(subs):
        wa = occupancy[a]
        out["F", 0, a, a] = 0.5 * wa * wa * (1.0 - 0.5 * square(a.l, 0, a.l))
        for k in range(2, 2 * a.l + 1, 2):
            out["F", k, a, a] = -0.25 * wa * wa * square(a.l, k, a.l)
        for b in subs[i + 1:]:
            wb = occupancy[b]
            out["F", 0, a, b] = wa * wb
            for k in range(abs(a.l - b.l), a.l + b.l + 1, 2):
                out["G", k, a, b] = -0.5 * wa * wb * square(a.l, k, b.l)
    return out

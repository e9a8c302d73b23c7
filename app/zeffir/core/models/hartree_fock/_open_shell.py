"""Roothaan's solver for closed shells plus one open subshell (the Hund term)."""

from __future__ import annotations

from collections.abc import Callable

import numpy as np

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis, default_basis
from zeffir.core.models.hartree_fock._checks import _check_coefficients, _check_virial, _lowest_subshells
from zeffir.core.models.hartree_fock._matrices import _setup
from zeffir.core.models.hartree_fock._result import HartreeFockResult, SCFState, _positive_at_the_nucleus
from zeffir.core.models.hartree_fock._scf import MAX_ITERATIONS, _gradient, _Iterate, _run_scf
from zeffir.core.orbitals import FloatArray

__all__ = ["solve_open_shell"]


def solve_open_shell(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for closed shells plus one open s, p, d or f subshell (Hund term).

    Parameters
    ----------
    configuration : Configuration
        Exactly one partly filled subshell, with l = 0, 1, 2 or 3, the highest occupied
        one of its l; the occupied subshells of each l the lowest ones (e.g. Li 2s1, C
        2p2, Sc 3d1 4s2, Fe²⁺ 3d6, Y 4d1 5s2 beside the closed 3d, Eu 4f7 6s2).
    basis, progress, should_stop, max_iterations
        As for :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`.

    Returns
    -------
    HartreeFockResult
        The energy is that of the Hund term (the LS term of highest S, then highest L);
        the closed orbitals are canonical within each l, and each orbital energy is
        the diagonal element of its class's Fock operator.

    Raises
    ------
    ModelError
        No open subshell, several, an open g (or higher) subshell, an open subshell
        below a closed one of its l, or occupied subshells that are not the lowest of
        their l.
    HartreeFockError
        No convergence within ``max_iterations`` (the message gives the last residual),
        divergence, or a solution refused by the checks (virial ratio, cancelling
        coefficients).

    Notes
    -----
    Every subshell has one radial function, the same for both spins (restricted). With
    D^l_c the density of the closed orbitals of l, D_o = φ_o φ_oᵀ that of the open
    subshell o (symmetry l_o, w_o electrons) and w_l = 2(2l+1), the energy is

    E = Σ_l w_l tr(D^l_c h^l) + ½ Σ_l w_l tr(D^l_c G^l[D_c]) + w_o tr(D_o (h + G^{l_o}[D_c]))
        + Σ_k a_k Σ D_o,pq D_o,rs R^k[pq|rs],

    G^λ[D]_pq = Σ_{l'} w_{l'} Σ_rs D^{l'}_rs (R⁰[pq|rs] - ½ Σ_k (λ k l'; 0 0 0)² R^k[pr|sq]),
    and a_k the coefficients of F^k(o, o) in the energy of the Hund determinant
    (:func:`zeffir.core.energy.hund_energy_expression`; a_0 = w_o(w_o-1)/2). For l^q the
    determinant of highest M_S, then highest M_L, is the only determinant with those
    M_S and M_L, so it is a state of the Hund term alone and its energy is that of
    that LS term (d² ³F: F0 - 8F2 - 9F4; d⁵ ⁶S: 10F0 - 35F2 - 315F4, with
    F2 = F²/49, F4 = F⁴/441). A closed shell sees the open one as spherical, so the
    closed–open interaction is the average one. Open d shells (Sc–Ni, Fe²⁺, Y, Zr)
    and the open 4f of Eu converge with the same iteration.

    Varying D_c and D_o gives one Fock operator per class (per electron),
    F_c = h + G[D_c] + w_o G_o, F_o = h + G[D_c] + (2/w_o) Σ_k a_k J^k[D_o], and the
    orbital gradient: for orbitals i, j of one l, ∂E/∂κ_ji = 2(w_i F_i - w_j F_j)_ji.
    Following Roothaan (1960), both are combined into one Hermitian operator R whose
    eigenvectors are the orbitals at self-consistency: in the basis of the current
    orbitals (closed c, open o, virtual v) its blocks are F_c everywhere except
    R_oo = F_o, R_ov = F_o and R_co = (w_c F_c - w_o F_o)/(w_c - w_o); the off-diagonal
    blocks are the orbital gradient divided by the weights, so they vanish exactly at
    the stationary point. Pulay's DIIS extrapolates R from the gradient
    Σ_classes (w_i/w_l) (F_i D_i S - S D_i F_i); orbitals are taken in order of
    eigenvalue (closed shells below the open one, aufbau). Convergence criteria,
    starting point and orthogonalisation are those of
    :func:`~zeffir.core.models.hartree_fock.solve_closed_shell`. The returned orbitals
    are those of the last iteration (closed ones made canonical within each l), so
    E = ½ Σ_i w_i (h_ii + ε_i) holds to rounding.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 32, 179 (1960) (open shells of one symmetry);
    C. C. J. Roothaan and P. S. Bagus, Methods Comput. Phys. 2, 47 (1963) (atomic
    self-consistent fields in Slater-type bases); E. U. Condon and G. H. Shortley, *The
    Theory of Atomic Spectra* (Cambridge, 1935), §7.6 (diagonal sums: the energy of a
    determinant); P. Pulay, Chem. Phys. Lett. 73, 393 (1980) (DIIS).

    Examples
    --------
    Li 1s² 2s ²S: the Hartree–Fock limit -7.4327269 Eh of C. F. Bunge, J. A. Barrientos,
    A. V. Bunge and J. A. Cogordan, Phys. Rev. A 46, 3691 (1992); the virial theorem to
    the basis error; and E = ½ Σ_i w_i (h_ii + ε_i) as for closed shells:

    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.models._slater_integrals import kinetic_matrix, nuclear_matrix
    >>> li = solve_open_shell(parse_spec("Li"))
    >>> bool(abs(li.energy - (-7.4327269)) < 1e-7 and abs(li.virial_ratio - 2.0) < 1e-6)
    True
    >>> zetas = li.basis.zetas(0)
    >>> h = kinetic_matrix(1, 0, zetas) + nuclear_matrix(1, zetas, 3.0)
    >>> c1s, c2s = li.coefficients[0].T
    >>> e1s, e2s = (li.orbital_energies[s] for s in sorted(li.orbital_energies, key=lambda s: s.n))
    >>> bool(abs(0.5 * (2 * (c1s @ h @ c1s + e1s) + (c2s @ h @ c2s + e2s)) - li.energy) < 1e-9)
    True
    """
    from zeffir.core.energy import hund_energy_expression
    from zeffir.core.models._slater_integrals import rk_tensor

    layout, open_sub, w_o = _open_shell_layout(configuration)
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, weight, zetas = setup.ls, setup.weight, setup.zetas
    overlap, kinetic, core = setup.overlap, setup.kinetic, setup.core
    interaction = setup.interaction
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)
    lo = open_sub.l
    closed = {l: layout[l] - (1 if l == lo else 0) for l in ls}
    w_c = weight[lo]
    expression = hund_energy_expression(configuration)
    self_terms = {k: expression.coefficient("F", k, open_sub, open_sub) for k in range(0, 2 * lo + 1, 2)}
    za = zetas[lo]
    self_tensors = {k: rk_tensor(k, lo + 1, za, lo + 1, za, lo + 1, za, lo + 1, za)
                    for k, a in self_terms.items() if a != 0.0}

    def split(coefficients: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], FloatArray]:
        d_c = {l: coefficients[l][:, : closed[l]] @ coefficients[l][:, : closed[l]].T for l in ls}
        phi = coefficients[lo][:, closed[lo]]
        return d_c, np.outer(phi, phi)

    def fock_of(d_c: dict[int, FloatArray], d_o: FloatArray
                ) -> tuple[dict[int, FloatArray], FloatArray, float]:
        two = {}
        for lam in ls:
            g = np.zeros_like(core[lam])
            for lp in ls:
                g += weight[lp] * np.tensordot(interaction[lam, lp], d_c[lp],
                                               axes=([2, 3], [0, 1]))
            two[lam] = g
        f_c = {}
        for lam in ls:
            g_open = np.tensordot(interaction[lam, lo], d_o, axes=([2, 3], [0, 1]))
            f_c[lam] = core[lam] + two[lam] + w_o * g_open
        self_part = sum((a * np.tensordot(self_tensors[k], d_o, axes=([2, 3], [0, 1]))
                         for k, a in self_terms.items() if a != 0.0), np.zeros_like(d_o))
        f_o = core[lo] + two[lo] + (2.0 / w_o) * self_part
        energy = float(sum(weight[l] * np.sum(d_c[l] * (core[l] + 0.5 * two[l])) for l in ls)
                       + w_o * np.sum(d_o * (core[lo] + two[lo])) + np.sum(d_o * self_part))
        return f_c, f_o, energy

    def effective(coefficients: dict[int, FloatArray], f_c: dict[int, FloatArray], f_o: FloatArray
                  ) -> dict[int, FloatArray]:
        """R of every l in its orthonormal basis (see Notes)."""
        out = {}
        for l in ls:
            x = transform[l]
            fc = x.T @ f_c[l] @ x
            if l != lo:
                out[l] = fc
                continue
            fo = x.T @ f_o @ x
            fco = (w_c * fc - w_o * fo) / (w_c - w_o)
            # Orbitals in the orthonormal basis: x⁺ C = xᵀ S C.
            u = x.T @ overlap[l] @ coefficients[l]
            u_c, u_o = u[:, : closed[l]], u[:, closed[l]: closed[l] + 1]
            p_c, p_o = u_c @ u_c.T, u_o @ u_o.T
            p_v = np.eye(fc.shape[0]) - p_c - p_o
            r = p_c @ fc @ p_c + p_v @ fc @ p_v + p_c @ fc @ p_v + p_v @ fc @ p_c
            r += p_o @ fo @ p_o + p_o @ fo @ p_v + p_v @ fo @ p_o
            r += p_c @ fco @ p_o + p_o @ fco @ p_c
            out[l] = 0.5 * (r + r.T)
        return out

    def diagonalise(matrices: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        coefficients, energies = {}, {}
        for l in ls:
            eps, vectors = np.linalg.eigh(matrices[l])
            coefficients[l] = transform[l] @ vectors[:, : layout[l]]
            energies[l] = eps[: layout[l]]
        return coefficients, energies

    def canonical(coefficients: dict[int, FloatArray], f_c: dict[int, FloatArray], f_o: FloatArray
                  ) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        """Closed orbitals diagonalising F_c among themselves; ε_o = ⟨φ_o|F_o|φ_o⟩."""
        out_c, out_e = {}, {}
        for l in ls:
            c = coefficients[l].copy()
            eps, vectors = np.linalg.eigh(c[:, : closed[l]].T @ f_c[l] @ c[:, : closed[l]])
            c[:, : closed[l]] = c[:, : closed[l]] @ vectors
            if l == lo:
                phi = c[:, closed[l]]
                eps = np.append(eps, phi @ f_o @ phi)
            out_c[l], out_e[l] = c, eps
        return out_c, out_e

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        d_c, d_o = split(coefficients)
        f_c, f_o, energy = fock_of(d_c, d_o)
        gradients = []
        for l in ls:
            g = f_c[l] @ d_c[l] @ overlap[l]
            if l == lo:
                g = g + (w_o / w_c) * (f_o @ d_o @ overlap[l])
            gradients.append(_gradient(g, kept.get(l)).ravel())
        return energy, np.concatenate(gradients), (d_c, d_o, f_c, f_o)

    start = diagonalise({l: transform[l].T @ core[l] @ transform[l] for l in ls})[0]
    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept, start, evaluate,
        lambda c, last: effective(c, last[2], last[3]), lambda matrices: diagonalise(matrices)[0],
        progress, should_stop, max_iterations, "E")
    d_c, d_o, f_c, f_o = payload
    # Keep the orbitals whose energy this is: only the closed ones of each l are made
    # canonical (a rotation among them changes nothing). A final diagonalisation of R
    # would rotate closed into open orbitals by ~residual/Δε, which moves the
    # one-electron energies of core orbitals at first order (~1e-8 Eh in Na).
    coefficients, energies = canonical(coefficients, f_c, f_o)
    kinetic_energy = float(sum(weight[l] * np.sum(d_c[l] * kinetic[l]) for l in ls)
                           + w_o * np.sum(d_o * kinetic[lo]))
    _check_coefficients(configuration, coefficients, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {}
    for l in ls:
        for i, n in enumerate(range(l + 1, l + 1 + layout[l])):
            orbital_energies[Subshell(n, l)] = float(energies[l][i])
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, setup.dropped)


def _open_shell_layout(configuration: Configuration) -> tuple[dict[int, int], Subshell, int]:
    """Occupied orbitals per l, the open subshell and its occupancy; refuses what it does not treat."""
    partial = [(s, w) for s, w in configuration.occupations if w != 2 * (2 * s.l + 1)]
    if not partial:
        raise ModelError(f"{configuration.spec}: no open subshell (use solve_closed_shell)")
    shown = " ".join(f"{s.label}{w}" for s, w in partial)
    if len(partial) > 1:
        raise ModelError(f"{configuration.spec}: several open subshells ({shown}); solve_open_shell "
                         "treats closed shells plus one open s, p, d or f subshell (solve_hund and "
                         "solve_average treat several)")
    sub, occupancy = partial[0]
    if sub.l > 3:
        raise ModelError(f"{configuration.spec}: an open {'spdfghik'[sub.l]} subshell ({shown}); "
                         "solve_open_shell treats one open s, p, d or f subshell beside closed shells")
    layout = _lowest_subshells(configuration)
    if sub.n != sub.l + layout[sub.l]:
        raise ModelError(f"{configuration.spec}: the open subshell {sub.label} must be the highest "
                         f"occupied {'spdfghik'[sub.l]} subshell")
    return layout, sub, int(occupancy)

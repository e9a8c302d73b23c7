"""Roothaan's closed-shell Hartree–Fock solver."""

from __future__ import annotations

from collections.abc import Callable

import numpy as np

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis, default_basis
from zeffir.core.models.hartree_fock._checks import _check_trustworthy, _check_virial, _lowest_subshells
from zeffir.core.models.hartree_fock._matrices import _setup
from zeffir.core.models.hartree_fock._result import HartreeFockResult, SCFState, _positive_at_the_nucleus
from zeffir.core.models.hartree_fock._scf import MAX_ITERATIONS, _gradient, _Iterate, _run_scf
from zeffir.core.orbitals import FloatArray

__all__ = ["solve_closed_shell"]


def solve_closed_shell(
    configuration: Configuration,
    basis: EvenTemperedBasis | None = None,
    progress: Callable[[SCFState], None] | None = None,
    should_stop: Callable[[], bool] | None = None,
    max_iterations: int = MAX_ITERATIONS,
) -> HartreeFockResult:
    """Restricted Hartree–Fock for a closed-shell atom or ion by Roothaan's method (¹S).

    Parameters
    ----------
    configuration : Configuration
        Every subshell full, and the occupied subshells of each l the lowest ones.
    basis : EvenTemperedBasis, optional
        Defaults to :func:`~zeffir.core.models.hartree_fock.default_basis`.
    progress : callable, optional
        Called with an :class:`~zeffir.core.models.hartree_fock.SCFState` after every
        iteration.
    should_stop : callable, optional
        Polled before every iteration; True stops the run with
        :class:`~zeffir.core.models.hartree_fock.HartreeFockCancelled`.
    max_iterations : int

    Returns
    -------
    HartreeFockResult
        Orbitals, canonical orbital energies ε and the energy of the ¹S state.

    Raises
    ------
    ModelError
        An open shell, or occupied subshells that are not the lowest of their l.
    HartreeFockError
        No convergence within ``max_iterations`` (the message gives the last residual),
        divergence, or a solution refused by the checks (virial ratio, cancelling
        coefficients, a negative electron repulsion from lost precision).

    Notes
    -----
    For each l the orbitals are φ = Σ_p C_p χ_p, χ_p normalised Slater-type functions
    r^l e^{-ζ_p r} (n = l+1); D^l = C_occ C_occᵀ and w_l = 2(2l+1). For closed shells
    (Roothaan 1951, 1960) the energy is

    E = Σ_l w_l tr(D^l h^l) + ½ Σ_{l,l'} w_l w_{l'} Σ [D^l_pq D^{l'}_rs R⁰[pq|rs]
        - ½ Σ_k (l k l'; 0 0 0)² D^l_ps D^{l'}_qr R^k[pq|rs]],

    and its derivative gives the Fock matrix of symmetry λ,

    F^λ_pq = h^λ_pq + Σ_{l'} w_{l'} Σ_rs D^{l'}_rs (R⁰[pq|rs] - ½ Σ_k (λ k l'; 0 0 0)² R^k[pr|sq]),

    solved as F C = S C ε. The one-electron and R^k integrals are in closed form
    (:mod:`zeffir.core.models._slater_integrals`). The basis of each l is canonically
    orthogonalised (X = U s^{-1/2}, eigenvalues of S below 1e-11 of the largest
    dropped). The start is the bare-nucleus Hamiltonian; Pulay's DIIS extrapolates the
    Fock matrices from the orbital gradients FDS - SDF. With d electrons, and for
    anions, the first iterations run in the basis without the combinations of overlap
    eigenvalue below 1e-8 of the largest (gradient projected on the kept span), until
    the gradient is below 1e-2; then the full basis takes over with a fresh DIIS
    history. Without this the early, far-from-self-consistent Fock matrices of Sr, Cs
    or Ba drive orbitals into near-null combinations whose cancelling coefficients
    magnify rounding, and the iteration diverges. Convergence: largest gradient element
    below 1e-9 and an energy change below 1e-11 Eh (or 1e-12 of |E|), or the gradient
    below 1e-9 twice in a row, or the rounding floor of the heaviest atoms (``_scf``).
    The returned orbitals and ε are those of the converged Fock matrix itself.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); 32, 179 (1960); P. Pulay, Chem.
    Phys. Lett. 73, 393 (1980) (DIIS); P.-O. Löwdin, Adv. Quantum Chem. 5, 185 (1970)
    (canonical orthogonalisation); T. Koga, K. Kanayama, S. Watanabe and A. J. Thakkar,
    Int. J. Quantum Chem. 71, 491 (1999), Be 1s² 2s² ¹S: E = -14.573023167 Eh (the
    digits as in the wave-function file of that work distributed with the BFit
    package, ``data/examples/be.slater``).

    Examples
    --------
    Be 1s² 2s²: the energy of Koga et al. (1999), and E = ½ Σ_i w_i (h_ii + ε_i), which
    holds for closed shells at self-consistency:

    >>> from zeffir.core import parse_spec
    >>> from zeffir.core.models._slater_integrals import kinetic_matrix, nuclear_matrix
    >>> from zeffir.core.config import Subshell
    >>> be = solve_closed_shell(parse_spec("Be"))
    >>> bool(abs(be.energy - (-14.573023167)) < 1e-8)  # Koga et al. 1999, Be: E = -14.573023167
    True
    >>> zetas = be.basis.zetas(0)
    >>> h = kinetic_matrix(1, 0, zetas) + nuclear_matrix(1, zetas, 4.0)
    >>> half_sum = sum(0.5 * 2 * (c @ h @ c + be.orbital_energies[Subshell(n, 0)])
    ...                for n, c in zip((1, 2), be.coefficients[0].T))
    >>> bool(abs(half_sum - be.energy) < 1e-9)
    True
    """

    layout = _closed_shell_layout(configuration)
    basis = basis or default_basis(configuration)
    setup = _setup(configuration, basis, layout)
    ls, weight, zetas = setup.ls, setup.weight, setup.zetas
    overlap, kinetic, core = setup.overlap, setup.kinetic, setup.core
    interaction = setup.interaction
    dropped = setup.dropped
    # Start in the reduced basis; swapped (in place, for the closures) for the full one.
    transform, kept = dict(setup.start_transform), dict(setup.start_kept)

    def diagonalise(fock: dict[int, FloatArray]) -> tuple[dict[int, FloatArray], dict[int, FloatArray]]:
        coefficients, energies = {}, {}
        for l in ls:
            x = transform[l]
            eps, vectors = np.linalg.eigh(x.T @ fock[l] @ x)
            coefficients[l] = x @ vectors[:, : layout[l]]
            energies[l] = eps[: layout[l]]
        return coefficients, energies

    def fock_of(density: dict[int, FloatArray]) -> dict[int, FloatArray]:
        out = {}
        for lam in ls:
            f = core[lam].copy()
            for lp in ls:
                f += weight[lp] * np.tensordot(interaction[lam, lp], density[lp],
                                               axes=([2, 3], [0, 1]))
            out[lam] = f
        return out

    def energy_of(density: dict[int, FloatArray], fock: dict[int, FloatArray]) -> float:
        return float(sum(0.5 * weight[l] * np.sum(density[l] * (core[l] + fock[l])) for l in ls))

    def evaluate(coefficients: dict[int, FloatArray]) -> tuple[float, FloatArray, _Iterate]:
        density = {l: coefficients[l] @ coefficients[l].T for l in ls}
        fock = fock_of(density)
        # The gradient in the normalised basis itself: the orthonormalised one would amplify
        # rounding by 1/s_min (up to ~1e8 for dense even-tempered sets) and stall the test.
        error = np.concatenate([_gradient(fock[l] @ density[l] @ overlap[l], kept.get(l)).ravel()
                                for l in ls])
        return energy_of(density, fock), error, (density, fock)

    coefficients, payload, state = _run_scf(
        configuration, setup, transform, kept, diagonalise(core)[0], evaluate,
        lambda _c, last: last[1], lambda matrices: diagonalise(matrices)[0],
        progress, should_stop, max_iterations, "E")
    density, fock = payload
    # Orbitals and energies of the converged Fock matrix itself (not an extrapolation).
    coefficients, energies = diagonalise(fock)
    kinetic_energy = float(sum(weight[l] * np.sum(density[l] * kinetic[l]) for l in ls))
    _check_trustworthy(configuration, coefficients, density, core, weight, state)
    _check_virial(configuration, kinetic_energy, state.energy, state)
    orbital_energies = {}
    for l in ls:
        for i, n in enumerate(range(l + 1, l + 1 + layout[l])):
            orbital_energies[Subshell(n, l)] = float(energies[l][i])
    signed = _positive_at_the_nucleus(coefficients, zetas)
    return HartreeFockResult(configuration, basis, signed, orbital_energies, kinetic_energy,
                             state.energy - kinetic_energy, state, dropped)


def _closed_shell_layout(configuration: Configuration) -> dict[int, int]:
    """Occupied orbitals per l; refuses open shells and gaps within an l."""
    open_shells = [f"{s.label}{w}" for s, w in configuration.occupations if w != 2 * (2 * s.l + 1)]
    if open_shells:
        raise ModelError(f"{configuration.spec} has {' '.join(open_shells)} partly filled: "
                         "solve_closed_shell treats closed shells only (solve picks the solver "
                         "for open shells)")
    return _lowest_subshells(configuration)

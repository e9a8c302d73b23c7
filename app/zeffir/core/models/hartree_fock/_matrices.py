"""The set-up every Hartree–Fock solver starts from.

One-electron matrices, Coulomb-minus-exchange tensors and the canonical
orthogonalisation of each l's basis (Roothaan 1951; Löwdin 1970).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration
from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis
from zeffir.core.orbitals import FloatArray

__all__ = ["LINEAR_DEPENDENCE", "START_LINEAR_DEPENDENCE"]

#: Overlap eigenvalues below this (relative to the largest) are dropped as linear dependence.
LINEAR_DEPENDENCE = 1e-11
#: The iteration starts in the basis without the combinations whose overlap eigenvalue is
#: below this (relative), and switches to the full basis once the orbital gradient is
#: below ``START_RESIDUAL`` (``_scf``): far from self-consistency, near-null combinations with
#: strongly cancelling coefficients can turn rounding into wild Fock matrices (Sr, Cs
#: and Ba diverged from the bare-nucleus start without it). Only for atoms with d
#: electrons and for anions (Na⁻); lighter neutral atoms and cations iterate in the
#: full basis from the start.
START_LINEAR_DEPENDENCE = 1e-8


def _exchange_weight(l1: int, k: int, l2: int) -> float:
    """(l1 k l2; 0 0 0)², the weight of R^k in the exchange with a closed shell of l2."""
    from zeffir.core.energy import wigner_3j_squared

    _, square = wigner_3j_squared(l1, k, l2, 0, 0, 0)
    return square.numerator / square.denominator


@dataclass(frozen=True)
class _Setup:
    """Basis-set matrices shared by every solver (see :func:`_setup`)."""

    ls: list[int]
    weight: dict[int, float]
    zetas: dict[int, FloatArray]
    overlap: dict[int, FloatArray]
    kinetic: dict[int, FloatArray]
    core: dict[int, FloatArray]
    #: ``{(λ, l'): J - K}``, Coulomb minus exchange, contracted with D^{l'} (see :func:`_setup`).
    interaction: dict[tuple[int, int], FloatArray]
    transform: dict[int, FloatArray]
    dropped: dict[int, int]
    #: ``{l: U_k U_kᵀ}``, the projector on the kept overlap eigenvectors, for the l with
    #: dropped combinations (the orbital gradient has no meaning outside their span).
    kept: dict[int, FloatArray]
    #: ``transform`` and ``kept`` with :data:`START_LINEAR_DEPENDENCE`, for the first iterations.
    start_transform: dict[int, FloatArray]
    start_kept: dict[int, FloatArray]


def _setup(configuration: Configuration, basis: EvenTemperedBasis, layout: dict[int, int]) -> _Setup:
    """One-electron matrices, Coulomb-minus-exchange tensors and the orthogonalisation of each l.

    ``layout[l]`` is the number of orbitals of l the solver needs (occupied, and virtual
    ones below an occupied subshell). The basis of each l is orthogonalised canonically,
    X = U s^{-1/2} over the overlap eigenvectors whose eigenvalue is above
    ``LINEAR_DEPENDENCE`` of the largest; a second, reduced X (``START_LINEAR_DEPENDENCE``)
    serves the first iterations of atoms with d electrons and of anions.

    References
    ----------
    C. C. J. Roothaan, Rev. Mod. Phys. 23, 69 (1951); P.-O. Löwdin, Adv. Quantum Chem. 5,
    185 (1970) (canonical orthogonalisation).
    """
    from zeffir.core.models._slater_integrals import (
        kinetic_matrix,
        nuclear_matrix,
        overlap_matrix,
        rk_tensor,
    )

    ls = sorted(layout)
    Z = configuration.Z
    weight = {l: 2.0 * (2 * l + 1) for l in ls}
    zetas = {l: basis.zetas(l) for l in ls}
    overlap = {l: overlap_matrix(l + 1, zetas[l]) for l in ls}
    kinetic = {l: kinetic_matrix(l + 1, l, zetas[l]) for l in ls}
    nuclear = {l: nuclear_matrix(l + 1, zetas[l], Z) for l in ls}
    core = {l: kinetic[l] + nuclear[l] for l in ls}
    # Coulomb J[λ, l'][p, q, r, s] = R⁰[pq|rs]; exchange K[λ, l'][p, q, r, s] = Σ_k c R^k[pr|sq]
    # arranged so that K contracts with D^{l'}_rs like J does. The solvers only need J - K.
    interaction: dict[tuple[int, int], FloatArray] = {}
    for lam in ls:
        for lp in ls:
            if (lp, lam) in interaction:
                # (J - K)[l', λ] is (J - K)[λ, l'] with the electrons swapped: R^k[pq|rs] =
                # R^k[rs|pq], and the 3j weights are symmetric.
                interaction[lam, lp] = interaction[lp, lam].transpose(2, 3, 0, 1)
                continue
            za, zb = zetas[lam], zetas[lp]
            j_minus_k = rk_tensor(0, lam + 1, za, lam + 1, za, lp + 1, zb, lp + 1, zb)
            for k in range(abs(lam - lp), lam + lp + 1, 2):
                # R^k[p r | s q]: p, r on electron 1 (λ, l'), s, q on electron 2 (l', λ).
                tensor = rk_tensor(k, lam + 1, za, lp + 1, zb, lp + 1, zb, lam + 1, za)
                j_minus_k -= 0.5 * _exchange_weight(lam, k, lp) * tensor.transpose(0, 3, 1, 2)
            interaction[lam, lp] = j_minus_k
    transform: dict[int, FloatArray] = {}
    dropped: dict[int, int] = {}
    kept: dict[int, FloatArray] = {}
    start_transform: dict[int, FloatArray] = {}
    start_kept: dict[int, FloatArray] = {}
    for l in ls:
        values, vectors = np.linalg.eigh(overlap[l])
        keep = values > LINEAR_DEPENDENCE * values[-1]
        if int(np.count_nonzero(keep)) < layout[l]:
            raise ModelError(f"{configuration.spec}: the l = {l} basis spans fewer functions "
                             "than occupied orbitals")
        transform[l] = vectors[:, keep] / np.sqrt(values[keep])
        dropped[l] = int(np.count_nonzero(~keep))
        if dropped[l]:
            kept[l] = vectors[:, keep] @ vectors[:, keep].T
        start = values > max(START_LINEAR_DEPENDENCE, LINEAR_DEPENDENCE) * values[-1]
        if int(np.count_nonzero(start)) < layout[l] or (max(ls) < 2 and configuration.charge >= 0):
            # Without d electrons the plain iteration converges (He–Ar, K, Ca tested);
            # anions start reduced too (Na⁻ diverged from the bare-nucleus start).
            start = keep
        start_transform[l] = vectors[:, start] / np.sqrt(values[start])
        if np.count_nonzero(~start):
            start_kept[l] = vectors[:, start] @ vectors[:, start].T
    return _Setup(ls, weight, zetas, overlap, kinetic, core, interaction, transform, dropped, kept,
                  start_transform, start_kept)

"""Checks of the configurations the solvers take and of the solutions they return."""

from __future__ import annotations

import numpy as np

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration
from zeffir.core.models.hartree_fock._result import HartreeFockError, SCFState
from zeffir.core.orbitals import FloatArray

__all__ = ["MAX_COEFFICIENT_SUM", "VIRIAL_TOLERANCE"]

#: A converged solution with |-V/T - 2| above this is refused: the virial theorem holds
#: for the exact Hartree–Fock orbitals, and the default bases reach |-V/T - 2| <= 5e-8
#: for every atom tested, so a larger deviation means the basis cannot represent an
#: orbital (He 1s1 4s1 with the ground-state basis: 5e-3, energy 7.7e-4 Eh too high).
VIRIAL_TOLERANCE = 1e-5
#: Largest Σ_p |C_p| of an occupied orbital accepted, times (n - l)². Rounding
#: errors of the integrals (~1e-16 relative) enter the energy multiplied by about
#: (Σ|C|)⁴; ground-state orbitals in the default bases have Σ|C| < 16 up to Kr (about
#: 42 for the 5s of Xe); larger cancellations there signal a numerically linearly
#: dependent basis. Rydberg-like orbitals with n - l lobes are sums of strongly
#: cancelling diffuse functions (Σ|C| ≈ 160 for the 4s of He 1s1 4s1 and the 5s of Na
#: [Ne] 5s1) whose integrals are small; their energies agree to 1e-8 Eh between bases
#: starting at ζ = 0.1 and 0.05, so the limit grows with the number of lobes n - l.
MAX_COEFFICIENT_SUM = 100.0


def _lowest_subshells(configuration: Configuration) -> dict[int, int]:
    """Occupied subshells per l, refusing an l whose occupied subshells are not the lowest ones.

    The Roothaan solvers of closed shells and of one open subshell take the k-th
    eigenvector of each l as the subshell n = l + k; an empty lower subshell (an
    excited configuration) needs :func:`~zeffir.core.models.hartree_fock.solve_expression`,
    which keeps a virtual orbital in its place.
    """
    layout: dict[int, int] = {}
    for l in sorted({s.l for s, _ in configuration.occupations}):
        ns = sorted(s.n for s, _ in configuration.occupations if s.l == l)
        if ns != list(range(l + 1, l + 1 + len(ns))):
            raise ModelError(f"{configuration.spec}: the occupied {'spdfghik'[l]} subshells must be "
                             f"the lowest ones (n = {l + 1}, {l + 2}, ...) for this solver; solve_hund "
                             "and solve_average treat excited configurations")
        layout[l] = len(ns)
    return layout


def _anion_hint(configuration: Configuration) -> str:
    """Why an anion may fail: its extra electron may not be bound at this level of theory."""
    if configuration.charge <= -2:
        return ("; a free multiply charged anion is not bound at this level of theory, so its "
                "outer electrons have no self-consistent orbital to settle in")
    if configuration.charge < 0:
        return ("; for an anion this usually means the extra electron is not bound at the "
                "Hartree–Fock level (Be⁻, Mg⁻, Ne⁻), so no orbital of the basis holds it")
    return ""



def _rydberg_hint(configuration: Configuration) -> str:
    """What a failed run of an excited configuration means, and what to try instead.

    A subshell nl above an empty one of the same l (He 1s1 5s1: the 5s above empty 2s,
    3s, 4s) must keep n − l − 1 radial nodes while the orbitals below it stay empty;
    from n − l = 5 on the nodeless Slater-type basis cannot hold it apart from them
    (see ``_basis.default_basis``).
    """
    occupied = {(sub.n, sub.l) for sub, w in configuration.occupations if w > 0}
    for sub, w in configuration.occupations:
        if w <= 0:
            continue
        empty_below = [n for n in range(sub.l + 1, sub.n) if (n, sub.l) not in occupied]
        if empty_below and sub.n - sub.l >= 5:
            name = f"{sub.n}{'spdfghik'[sub.l]}"
            letter = "spdfghik"[sub.l]
            below = ", ".join(f"{n}{letter}" for n in empty_below)
            return (f"; the {name} orbital lies above the empty {below}: with {sub.n - sub.l} radial "
                    f"lobes the Slater-type basis cannot keep it apart from the empty orbitals below "
                    f"it (it keeps trading places with them). Try a lower n (n − l ≤ 4, e.g. "
                    f"{name.replace(str(sub.n), str(sub.l + 4), 1)}), or the slater or clementi model "
                    f"for this configuration")
    return ""


def _check_trustworthy(configuration: Configuration, coefficients: dict[int, FloatArray],
                       density: dict[int, FloatArray], core: dict[int, FloatArray],
                       weight: dict[int, float], state: SCFState) -> None:
    """Refuse a solution that rounding, not physics, may have shaped."""
    _check_coefficients(configuration, coefficients, state)
    # For closed shells the electron repulsion energy J - K/2 summed over pairs is positive.
    one_electron = sum(weight[l] * float(np.sum(density[l] * core[l])) for l in density)
    if not state.energy - one_electron > 0:
        raise HartreeFockError(f"{configuration.spec}: negative electron repulsion energy "
                               f"({state.energy - one_electron:.3g} Eh); the integrals lost precision", state)


def _check_coefficients(configuration: Configuration, coefficients: dict[int, FloatArray],
                        state: SCFState) -> None:
    """Refuse orbitals whose coefficients cancel so much that rounding dominates.

    ``coefficients[l]`` columns are the subshells n = l+1, l+2, ... (an empty subshell's
    column, a virtual orbital, is not checked).
    """
    occupied = {(s.n, s.l) for s, w in configuration.occupations if w > 0}
    for l, c in coefficients.items():
        for column in range(c.shape[1]):
            lobes = column + 1
            if (l + lobes, l) not in occupied:
                continue
            total, limit = float(np.sum(np.abs(c[:, column]))), MAX_COEFFICIENT_SUM * lobes**2
            if total > limit:
                raise HartreeFockError(
                    f"{configuration.spec}: an occupied l = {l} orbital cancels coefficients up to "
                    f"Σ|C| = {total:.3g} (limit {limit:g}); the basis is "
                    "numerically linearly dependent for it and the energy would be dominated by "
                    f"rounding{_anion_hint(configuration)}", state)


def _check_virial(configuration: Configuration, kinetic: float, energy: float, state: SCFState) -> None:
    """Refuse a solution that breaks the virial theorem (see :data:`VIRIAL_TOLERANCE`)."""
    deviation = -(energy - kinetic) / kinetic - 2.0
    if not abs(deviation) <= VIRIAL_TOLERANCE:
        raise HartreeFockError(
            f"{configuration.spec}: the basis cannot represent the orbitals of this configuration "
            f"(virial ratio -V/T - 2 = {deviation:.1e}, limit {VIRIAL_TOLERANCE:g}); the energy "
            f"would be too high{_anion_hint(configuration)}", state)

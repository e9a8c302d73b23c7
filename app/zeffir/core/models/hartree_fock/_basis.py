"""The even-tempered Slater-type basis of the Roothaan–Hartree–Fock solvers."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from zeffir.core.config import Configuration
from zeffir.core.orbitals import FloatArray

__all__ = ["RYDBERG_TAIL", "EvenTemperedBasis", "default_basis"]

#: Smallest exponent of an l set holding a Rydberg-like orbital, in units of q/n (see
#: :func:`default_basis`).
RYDBERG_TAIL = 0.3


@dataclass(frozen=True, slots=True)
class EvenTemperedBasis:
    """Slater-type functions ζ_k = α β^k (k = 0 .. count-1) of n = l + 1, one set per l.

    Attributes
    ----------
    sets : dict
        ``{l: (alpha, beta, count)}``.

    Notes
    -----
    Each function is the normalised r^l e^{-ζ_k r} (n = l + 1); the exponents form a
    geometric sequence, so the set covers every length scale between 1/α and
    1/(α β^{count-1}) with the same density on a logarithmic scale.

    References
    ----------
    K. Ruedenberg, R. C. Raffenetti and R. D. Bardo, in *Energy, Structure and
    Reactivity* (Wiley, 1973) — even-tempered bases; Koga et al., Int. J. Quantum Chem.
    71, 491 (1999) for the Slater-type Roothaan–Hartree–Fock energies they approach.

    Examples
    --------
    >>> basis = EvenTemperedBasis({0: (0.25, 1.35, 4)})
    >>> z = basis.zetas(0)
    >>> bool(z[0] == 0.25 and np.allclose(z[1:] / z[:-1], 1.35, rtol=1e-15))
    True
    """

    sets: dict[int, tuple[float, float, int]]

    def zetas(self, l: int) -> FloatArray:
        """The exponents of angular momentum l (bohr⁻¹)."""
        alpha, beta, count = self.sets[l]
        return np.asarray(alpha * beta ** np.arange(count), dtype=float)


def default_basis(configuration: Configuration) -> EvenTemperedBasis:
    """An even-tempered basis reaching from the valence tail to the nuclear cusp.

    Parameters
    ----------
    configuration : Configuration

    Returns
    -------
    EvenTemperedBasis

    Notes
    -----
    s functions: ζ from 0.25 to 8Z with ratio β = 1.35; p functions: from 0.25 to 3Z
    with β = 1.4, or β = 1.3 when d subshells are occupied; d and f functions: from
    0.25 to Z with β = 1.3, or to 2Z with β = 1.25 when f subshells are occupied (Rn's
    energy drops by 1.2e-5 Eh from the narrower set, and is then stable to 3e-7 Eh).
    Each set has at least 4 functions. The smallest exponent lies below the decay constant
    √(2|ε|) of any valence orbital of a neutral atom, the largest s exponent well beyond
    the 1s cusp (ζ ≈ Z); the innermost d orbital (3d, ζ ≲ Z/3) needs no functions beyond
    Z, and stopping there keeps the d set small enough to be dense. The dense p and d
    sets matter from Kr on: with β = 1.4 for both (d up to 3Z), Kr lies 6e-6 Eh and Xe
    6e-5 Eh above the Hartree–Fock limit, with these sets within 1e-6 Eh; He–Ar land
    within 1e-6 Eh with the β = 1.4 p set, which keeps them fast (Ne in about half the
    time it takes with β = 1.3) (tests/reference/test_hartree_fock_references.py). Sizes for
    the ground configurations of He–Xe: 15–26 s, 14–26 p and 18–22 d functions (Cs–Og:
    26–29 s and p, 22–32 d and 29–32 f). For Kr, Sr and Xe the smallest overlap
    eigenvalue stays above 1e-10, so canonical orthogonalisation drops nothing. Denser or wider sets are not
    automatically better: d functions up to 3Z with β = 1.3 bring Kr's smallest d
    overlap eigenvalue to ~4e-9, and from the bare-nucleus start its iteration diverged
    (rounding, amplified by strongly cancelling coefficients, drove orbitals into the
    near-null space; see ``START_LINEAR_DEPENDENCE`` in ``_matrices``). Starting lower
    does not help anions: with ζ = 0.1 the H⁻ iteration oscillates between the compact
    orbital and an almost free one, while from 0.25 (or 0.15) it converges to the same
    energy to 1e-12 Eh.

    An excited configuration whose outermost subshell of some l lies above an empty one
    of that l (He 1s1 4s1, Na [Ne] 4d1) has a Rydberg-like orbital decaying as
    e^{-qr/n} (q the charge seen far out): its l set starts at
    ζ = min(0.25, :data:`RYDBERG_TAIL` q/n), with β = 1.25. From 0.25 the He 1s1 4s1
    energy is 7.7e-4 Eh too high (virial ratio off by 5e-3); with these sets the He
    1s1 ns energies (n ≤ 4) change by less than 3e-7 Eh when the tail or β is varied
    (tests/core/models/test_hartree_fock_hund.py). From n - l ≈ 5 on the nodeless
    Slater-type functions cancel too strongly: He 1s1 5s1 and Na [Ne] 6s1 do not
    converge (the Rydberg orbital trades places with the virtual orbital below it), and
    higher ones are refused by ``MAX_COEFFICIENT_SUM`` or ``VIRIAL_TOLERANCE`` (in
    ``_checks``); either way the run ends with a
    :class:`~zeffir.core.models.hartree_fock.HartreeFockError` naming the reason.
    Choosing each occupied orbital by maximum overlap with the previous iteration's
    (Gilbert, Besley and Gill 2008) instead of by its node count does not extend the
    range: measured here from the bare-nucleus start, He 1s1 5s1 and 1s1 6s1 then
    "converge" to the 1s 4s energy (−2.036436 Eh), He 1s1 4s1 to the 1s 3s one
    (−2.068485 Eh), and Na [Ne] 5s1, which converges by node count, stalls; the
    node-count choice stays.

    References
    ----------
    K. Ruedenberg, R. C. Raffenetti and R. D. Bardo, in *Energy, Structure and
    Reactivity* (Wiley, 1973) (even-tempered bases); A. T. B. Gilbert, N. A. Besley
    and P. M. W. Gill, J. Phys. Chem. A 112, 13164 (2008) (maximum overlap method).

    Examples
    --------
    The s set of Ne reaches from below the decay constant of its valence orbitals to
    beyond the 1s cusp (ζ ≈ Z); its p set has 16 functions:

    >>> from zeffir.core import parse_spec
    >>> ne = default_basis(parse_spec("Ne"))
    >>> bool(ne.zetas(0)[0] < 1.0 and ne.zetas(0)[-1] >= 8 * 10), ne.sets[1][2]
    (True, 16)
    >>> default_basis(parse_spec("Kr")).sets[1][1:], default_basis(parse_spec("Kr")).sets[2][1:]
    ((1.3, 25), (1.3, 20))
    """
    Z = configuration.Z
    sets: dict[int, tuple[float, float, int]] = {}
    occupied = [s for s, w in configuration.occupations if w > 0]
    ls = sorted({s.l for s in occupied})
    # Atoms with d electrons need denser p and d sets (see Notes); lighter ones keep the
    # cheaper β = 1.4 p set, which already reaches 1e-6 Eh.
    with_d = max(ls) >= 2
    # Charge felt by an outer electron far out (1 for a neutral atom).
    outer_charge = max(1, Z - configuration.n_electrons + 1)
    for l in ls:
        ns = sorted(s.n for s in occupied if s.l == l)
        if l == 0:
            top, beta = 8.0 * Z, 1.35
        elif l == 1:
            top, beta = 3.0 * Z, (1.3 if with_d else 1.4)
        elif max(ls) >= 3:
            # With f electrons (Z > 57) the d set reaches 2Z, denser: Rn's energy drops
            # by 1.2e-5 Eh from the Z, β = 1.3 set, and is then stable to 3e-7 Eh.
            top, beta = 2.0 * Z, 1.25
        else:
            top, beta = 1.0 * Z, 1.3
        alpha = 0.25
        if ns != list(range(l + 1, l + 1 + len(ns))):
            # An excited (Rydberg-like) orbital above an empty subshell: reach its tail,
            # with a denser set for its nodes.
            alpha, beta = min(alpha, RYDBERG_TAIL * outer_charge / ns[-1]), min(beta, 1.25)
        count = max(4, math.ceil(math.log(top / alpha) / math.log(beta)) + 1)
        sets[l] = (alpha, beta, count)
    return EvenTemperedBasis(sets)

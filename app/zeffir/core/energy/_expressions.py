"""Energy expressions: the coefficients of the one-electron and Slater radial integrals."""

from __future__ import annotations

from collections import defaultdict
from dataclasses import dataclass

from zeffir.core.config import Configuration, Subshell
from zeffir.core.energy._wigner import ck_coefficient, wigner_3j_squared

__all__ = ["EnergyExpression", "SlaterKey", "average_energy_expression", "hund_energy_expression"]

#: ("F" or "G", k, a, b): F^k(a, b) with a <= b, or G^k(a, b) with a < b.
SlaterKey = tuple[str, int, Subshell, Subshell]


@dataclass(frozen=True)
class EnergyExpression:
    """E = Σ_a w_a I(a) + Σ coefficient · F^k or G^k, for one configuration.

    Attributes
    ----------
    configuration : Configuration
        The configuration it belongs to.
    one_electron : dict
        Coefficient of each subshell's one-electron energy I(a) (its occupancy).
    slater : dict
        Coefficient of each Slater integral, keyed by :data:`SlaterKey`.

    Examples
    --------
    Each electron has one one-electron energy, and each of the N(N − 1)/2 pairs of
    electrons repels through F⁰ with unit weight, in both expressions (iron: 26
    electrons, 325 pairs):

    >>> from zeffir.core.config import parse_spec
    >>> iron = parse_spec("Fe")
    >>> for e in (hund_energy_expression(iron), average_energy_expression(iron)):
    ...     f0 = sum(c for (kind, k, _, _), c in e.slater.items() if kind == "F" and k == 0)
    ...     print(sum(e.one_electron.values()), round(f0, 9))
    26.0 325.0
    26.0 325.0
    """

    configuration: Configuration
    one_electron: dict[Subshell, float]
    slater: dict[SlaterKey, float]

    def coefficient(self, kind: str, k: int, a: Subshell, b: Subshell) -> float:
        """Coefficient of F^k(a, b) or G^k(a, b) (0 when absent), in either order of a, b."""
        lo, hi = sorted((a, b), key=lambda s: (s.n, s.l))
        return self.slater.get((kind, k, lo, hi), 0.0)


def _key(kind: str, k: int, a: Subshell, b: Subshell) -> SlaterKey:
    lo, hi = sorted((a, b), key=lambda s: (s.n, s.l))
    if kind == "G" and lo == hi:
        kind = "F"  # within one subshell the exchange integral is an F^k
    return (kind, k, lo, hi)


def _square(l1: int, k: int, l2: int) -> float:
    _, square = wigner_3j_squared(l1, k, l2, 0, 0, 0)
    return square.numerator / square.denominator


def average_energy_expression(configuration: Configuration) -> EnergyExpression:
    """The average energy of a configuration as a combination of radial integrals.

    Parameters
    ----------
    configuration : Configuration

    Returns
    -------
    EnergyExpression

    Notes
    -----
    The average over all determinants of the configuration (Slater 1960; Cowan 1981):

    E_av = Σ_a w_a I(a)
         + Σ_a w_a(w_a-1)/2 [F⁰(aa) - (2l_a+1)/(4l_a+1) Σ_{k>0} (l_a k l_a; 0 0 0)² F^k(aa)]
         + Σ_{a<b} w_a w_b [F⁰(ab) - ½ Σ_k (l_a k l_b; 0 0 0)² G^k(ab)],

    w_a the occupancy, I(a) the kinetic plus nuclear-attraction energy of one
    electron. It equals the (2S+1)(2L+1)-weighted mean of the configuration's LS
    term energies.

    References
    ----------
    J. C. Slater, *Quantum Theory of Atomic Structure* (McGraw-Hill, 1960), vol. II,
    ch. 21; R. D. Cowan, *The Theory of Atomic Structure and Spectra* (1981), eqs.
    (6.38)–(6.39).

    Examples
    --------
    >>> from zeffir.core.config import parse_spec, Subshell
    >>> e = average_energy_expression(parse_spec("C"))
    >>> round(e.coefficient("F", 2, Subshell(2, 1), Subshell(2, 1)) * 25, 12)  # p²: F0 - 2F2
    -2.0
    """
    one: dict[Subshell, float] = {}
    slater: dict[SlaterKey, float] = defaultdict(float)
    occupations = configuration.occupations
    for i, (a, wa) in enumerate(occupations):
        one[a] = float(wa)
        pairs = wa * (wa - 1) / 2
        if pairs:
            slater[_key("F", 0, a, a)] += pairs
            for k in range(2, 2 * a.l + 1, 2):
                slater[_key("F", k, a, a)] -= pairs * (2 * a.l + 1) / (4 * a.l + 1) * _square(a.l, k, a.l)
        for b, wb in occupations[i + 1:]:
            slater[_key("F", 0, a, b)] += wa * wb
            for k in range(abs(a.l - b.l), a.l + b.l + 1, 2):
                slater[_key("G", k, a, b)] -= wa * wb / 2 * _square(a.l, k, b.l)
    return EnergyExpression(configuration, one, dict(slater))


def hund_energy_expression(configuration: Configuration) -> EnergyExpression:
    """The energy of the Hund determinant as a combination of radial integrals.

    Parameters
    ----------
    configuration : Configuration

    Returns
    -------
    EnergyExpression

    Notes
    -----
    The determinant of highest M_S, then highest M_L (see
    :func:`zeffir.core.pairs.hund_determinant`). For orthonormal spin-orbitals
    i = (a, m, σ),

    E = Σ_i I(a_i) + Σ_{i<j} [Σ_k c^k(l_i m_i; l_i m_i) c^k(l_j m_j; l_j m_j) F^k(a_i, a_j)
                   - δ(σ_i, σ_j) Σ_k c^k(l_i m_i; l_j m_j)² G^k(a_i, a_j)],

    with G^k(a, a) = F^k(a, a). As the only determinant with M_L = L, M_S = S of the
    Hund term, its energy is that term's energy (e.g. p² ³P: F⁰ - 5F₂, F₂ = F²/25).

    References
    ----------
    Condon & Shortley 1935, §7.6 (the diagonal-sum method); Slater 1960, vol. I,
    ch. 14; Cowan 1981, eq. (6.20)–(6.22).

    Examples
    --------
    >>> from zeffir.core.config import parse_spec, Subshell
    >>> e = hund_energy_expression(parse_spec("C"))
    >>> round(e.coefficient("F", 2, Subshell(2, 1), Subshell(2, 1)) * 25, 12)  # ³P: F0 - 5F2
    -5.0
    """
    from zeffir.core.pairs import hund_determinant

    spin_orbitals = tuple(hund_determinant(configuration))
    one: dict[Subshell, float] = {a: float(w) for a, w in configuration.occupations}
    slater: dict[SlaterKey, float] = defaultdict(float)
    for i, p in enumerate(spin_orbitals):
        a, la = p.subshell, p.subshell.l
        for q in spin_orbitals[i + 1:]:
            b, lb = q.subshell, q.subshell.l
            for k in range(0, 2 * min(la, lb) + 1, 2):
                slater[_key("F", k, a, b)] += ck_coefficient(k, la, p.m, la, p.m) * ck_coefficient(
                    k, lb, q.m, lb, q.m
                )
            if p.spin == q.spin:
                for k in range(abs(la - lb), la + lb + 1, 2):
                    slater[_key("G", k, a, b)] -= ck_coefficient(k, la, p.m, lb, q.m) ** 2
    cleaned = {key: value for key, value in slater.items() if abs(value) > 1e-14}
    return EnergyExpression(configuration, one, cleaned)

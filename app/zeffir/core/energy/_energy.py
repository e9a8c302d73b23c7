"""Total energies of an orbital set: the Hund determinant and the configuration average."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from zeffir.core._errors import QuantumNumberError
from zeffir.core.config import Subshell
from zeffir.core.energy._expressions import (
    EnergyExpression,
    average_energy_expression,
    hund_energy_expression,
)
from zeffir.core.energy._integrals import DEFAULT_POINTS, RadialIntegrals, radial_integrals
from zeffir.core.orbitals import OrbitalSet

__all__ = ["EnergyKind", "EnergyTerms", "average_energy", "configuration_energy", "evaluate_expression",
           "hund_energy", "orbital_energies"]

EnergyKind = Literal["hund", "average"]


@dataclass(frozen=True, slots=True)
class EnergyTerms:
    """A total energy and its parts (hartree).

    Attributes
    ----------
    kinetic : float
        T, the kinetic energy.
    nuclear : float
        Electron–nucleus attraction.
    repulsion : float
        Electron–electron repulsion.

    Examples
    --------
    He⁺ 1s is an exact eigenstate: T = Z²/2, V = −Z², E = −Z²/2 (Bethe & Salpeter
    1957, §3) and the virial ratio −V/T is 2:

    >>> from zeffir.core import build
    >>> e = configuration_energy(build("He+", "hydrogenic"))
    >>> round(e.kinetic, 9), round(e.potential, 9), round(e.total, 9), round(e.virial_ratio, 9)
    (2.0, -4.0, -2.0, 2.0)
    """

    kinetic: float
    nuclear: float
    repulsion: float

    @property
    def total(self) -> float:
        """E = T + V."""
        return self.kinetic + self.nuclear + self.repulsion

    @property
    def potential(self) -> float:
        """V, nuclear attraction plus electron repulsion."""
        return self.nuclear + self.repulsion

    @property
    def virial_ratio(self) -> float:
        """-V/T, which is 2 for exact eigenstates and for any energy optimal under scaling."""
        return -self.potential / self.kinetic


def evaluate_expression(expression: EnergyExpression, integrals: RadialIntegrals) -> EnergyTerms:
    """Evaluate an energy expression with the radial integrals of an orbital set.

    Parameters
    ----------
    expression : EnergyExpression
        Coefficients of I(a), F^k and G^k.
    integrals : RadialIntegrals
        The radial integrals of the same subshells.

    Returns
    -------
    EnergyTerms

    Examples
    --------
    1s² in one Slater-type function of exponent ζ: T = ζ², V_nuc = −2Zζ and
    F⁰(1s, 1s) = 5ζ/8, so E = ζ² − 2Zζ + 5ζ/8 (here ζ = 1.7, Slater's rules for He):

    >>> from zeffir.core import build
    >>> from zeffir.core.energy import hund_energy_expression, radial_integrals
    >>> helium = build("He", "slater")
    >>> zeta = helium.orbital("1s").zeta
    >>> e = evaluate_expression(hund_energy_expression(helium.configuration), radial_integrals(helium))
    >>> bool(abs(e.kinetic - zeta**2) < 1e-9 and abs(e.total - (zeta**2 - 4 * zeta + 5 * zeta / 8)) < 1e-9)
    True
    """
    kinetic = sum(w * integrals.kinetic(a) for a, w in expression.one_electron.items())
    nuclear = sum(w * integrals.nuclear(a) for a, w in expression.one_electron.items())
    repulsion = 0.0
    for (kind, k, a, b), coefficient in expression.slater.items():
        value = integrals.slater_f(k, a, b) if kind == "F" else integrals.slater_g(k, a, b)
        repulsion += coefficient * value
    return EnergyTerms(float(kinetic), float(nuclear), float(repulsion))


def orbital_energies(expression: EnergyExpression, integrals: RadialIntegrals) -> dict[Subshell, float]:
    """Orbital energies ε_a = ⟨φ_a|F_a|φ_a⟩ of an energy expression's Fock operators.

    Parameters
    ----------
    expression : EnergyExpression
    integrals : RadialIntegrals
        The radial integrals of the same subshells.

    Returns
    -------
    dict
        ``{Subshell: ε}`` (hartree).

    Notes
    -----
    With ∂E/∂φ_a = 2 w_a F_a φ_a (w_a the occupancy), ε_a = I(a) + (1/w_a) Σ c X,
    summed over the Slater integrals X = F^k(a, b), G^k(a, b) with coefficient c that
    involve a, counted twice for F^k(a, a) (quartic in φ_a). For a self-consistent
    solution these are the orbital energies of its Fock operators (closed shells:
    Koopmans' estimates of ionisation energies); for other orbitals, the same
    expectation values. Two-electron ions in one Slater-type function:
    ε = ζ²/2 - Zζ + 5ζ/8.

    References
    ----------
    Roothaan 1960; C. Froese Fischer, *The Hartree–Fock Method for Atoms* (1977), ch. 3.

    Examples
    --------
    He 1s² with ζ = 1.7: ε = ζ²/2 − Zζ + 5ζ/8, and for two electrons in one orbital
    E = 2ε − F⁰(1s, 1s) (the repulsion is counted in both orbital energies):

    >>> from zeffir.core import build
    >>> from zeffir.core.config import Subshell
    >>> from zeffir.core.energy import hund_energy_expression, radial_integrals
    >>> helium, s = build("He", "slater"), Subshell(1, 0)
    >>> zeta, integrals = helium.orbital("1s").zeta, radial_integrals(helium)
    >>> eps = orbital_energies(hund_energy_expression(helium.configuration), integrals)[s]
    >>> bool(abs(eps - (zeta**2 / 2 - 2 * zeta + 5 * zeta / 8)) < 1e-9)
    True
    >>> bool(abs(2 * eps - integrals.slater_f(0, s, s) - hund_energy(helium)) < 1e-9)
    True
    """
    sums: dict[Subshell, float] = {a: 0.0 for a in expression.one_electron}
    for (kind, k, a, b), coefficient in expression.slater.items():
        value = integrals.slater_f(k, a, b) if kind == "F" else integrals.slater_g(k, a, b)
        if a == b:
            sums[a] += 2.0 * coefficient * value
        else:
            sums[a] += coefficient * value
            sums[b] += coefficient * value
    return {a: float(integrals.kinetic(a) + integrals.nuclear(a) + sums[a] / w)
            for a, w in expression.one_electron.items() if w > 0}


def configuration_energy(orbitals: OrbitalSet, kind: EnergyKind = "hund",
                         points: int = DEFAULT_POINTS) -> EnergyTerms:
    """The energy of a configuration for an orbital set of any radial functions.

    Parameters
    ----------
    orbitals : OrbitalSet
        Normalised radial functions, one per occupied subshell.
    kind : {"hund", "average"}
        The Hund determinant (highest M_S, then M_L: the M_L = L, M_S = S component of
        the Hund term) or the average over all determinants of the configuration.
    points : int
        Grid points in √r (see :func:`radial_integrals`).

    Returns
    -------
    EnergyTerms
        Kinetic, nuclear-attraction and repulsion energies (hartree) and their sum.

    Notes
    -----
    Non-relativistic, point nucleus, no correlation. Orbitals of the same l are
    Gram–Schmidt orthonormalised in order of n first (see :func:`radial_integrals`).
    One-electron energy I(a) = -½ ∫ P(d²/dr² - l(l+1)/r²)P dr - Z ∫ P²/r dr; the
    Slater integrals F^k, G^k; the coefficients from :func:`hund_energy_expression`
    or :func:`average_energy_expression`.

    References
    ----------
    Slater 1960, vol. I ch. 13–14, vol. II ch. 21; Condon & Shortley 1935, ch. 6–7;
    Cowan 1981, ch. 6.

    Examples
    --------
    >>> from zeffir.core import build
    >>> e = configuration_energy(build("He", "hydrogenic"))  # ζ = 2: E = ζ² - 2Zζ + 5ζ/8
    >>> abs(e.total - (4 - 8 + 1.25)) < 1e-9
    True
    """
    if kind == "hund":
        expression = hund_energy_expression(orbitals.configuration)
    elif kind == "average":
        expression = average_energy_expression(orbitals.configuration)
    else:
        raise QuantumNumberError(f"kind = {kind!r}: use 'hund' or 'average'")
    return evaluate_expression(expression, radial_integrals(orbitals, points))


def hund_energy(orbitals: OrbitalSet) -> float:
    """Total energy (hartree) of the Hund determinant; see :func:`configuration_energy`.

    Examples
    --------
    A closed-shell configuration is a single determinant, so its Hund energy is its
    average energy:

    >>> from zeffir.core import build
    >>> beryllium = build("Be", "slater")
    >>> bool(abs(hund_energy(beryllium) - average_energy(beryllium)) < 1e-12)
    True
    """
    return configuration_energy(orbitals, "hund").total


def average_energy(orbitals: OrbitalSet) -> float:
    """Average energy E_av (hartree) of the configuration; see :func:`configuration_energy`.

    Examples
    --------
    The p² terms lie at ³P = F⁰ − 5F₂, ¹D = F⁰ + F₂, ¹S = F⁰ + 10F₂ (F₂ = F²/25;
    Condon & Shortley 1935, ch. 7); their (2S+1)(2L+1)-weighted mean,
    (9·(−5) + 5·1 + 1·10)/15 = −2, puts E_av 3F₂ above the Hund ³P of carbon:

    >>> from zeffir.core import build
    >>> from zeffir.core.config import Subshell
    >>> from zeffir.core.energy import radial_integrals
    >>> carbon, p = build("C", "slater"), Subshell(2, 1)
    >>> f2 = radial_integrals(carbon).slater_f(2, p, p) / 25
    >>> bool(abs(average_energy(carbon) - hund_energy(carbon) - 3 * f2) < 1e-9)
    True
    """
    return configuration_energy(orbitals, "average").total

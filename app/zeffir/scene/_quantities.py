"""Names, symbols and units of the plotted quantities, shared by screen and export."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Final

import zeffir.core

__all__ = ["QUANTITIES", "Quantity", "length_factor", "length_symbol"]


@dataclass(frozen=True)
class Quantity:
    """A plotted quantity.

    Attributes
    ----------
    key : str
        Short name used in the state (``"D"``, ``"psi"``...).
    name : str
        Plain words for menus and legends.
    symbol : str
        Symbol for axis labels (matplotlib mathtext).
    length_power : float
        The quantity carries length^length_power (for unit conversion and labels).
    formula : str
        Definition shown in tooltips.
    """

    key: str
    name: str
    symbol: str
    length_power: float
    formula: str


QUANTITIES: Final[dict[str, Quantity]] = {
    "R": Quantity("R", "radial function", "R(r)", -1.5,
                  "R(r), normalised so that ∫ R² r² dr = 1"),
    "P": Quantity("P", "reduced radial function", "P(r)", -0.5, "P(r) = r R(r)"),
    "D": Quantity("D", "radial distribution", "D(r)", -1.0,
                  "D(r) = r² R(r)² per electron, times the occupancy when weighted; ∫ D dr = electrons"),
    "Q": Quantity("Q", "cumulative charge", "Q(r)", 0.0,
                  "Q(r) = ∫₀^r D(r') dr', electrons inside radius r"),
    "psi": Quantity("psi", "orbital ψ (signed)", "ψ", -1.5,
                    "ψ_nlm = R_nl(r) Y_lm(θ, φ); sign shown with a diverging scale"),
    "psi2": Quantity("psi2", "orbital density |ψ|²", "|ψ|²", -3.0,
                     "|ψ_nlm|², probability density of one electron"),
    "density": Quantity("density", "total density ρ", "ρ", -3.0,
                        "ρ(r) = Σ occ R²/4π: closed subshells exact, open ones spherically averaged"),
}


def length_factor(unit: str, power: float) -> float:
    """Factor converting a quantity carrying length^power from atomic units to ``unit``."""
    return 1.0 if unit == "bohr" else zeffir.core.ANGSTROM_PER_BOHR**power


def length_symbol(unit: str) -> str:
    """Unit symbol: ``'bohr'`` or ``'Å'``."""
    return "bohr" if unit == "bohr" else "Å"


def unit_text(unit: str, power: float) -> str:
    """Unit string of length^power, e.g. ``'bohr⁻³'``, ``'Å⁻³ᐟ²'``; ``''`` for power 0."""
    if power == 0:
        return "electrons"
    base = length_symbol(unit)
    names = {-0.5: "⁻¹ᐟ²", -1.0: "⁻¹", -1.5: "⁻³ᐟ²", -2.0: "⁻²", -3.0: "⁻³", 1.0: ""}
    return f"{base}{names[power]}"

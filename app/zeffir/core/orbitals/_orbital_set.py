"""What a model returns: one radial function and its parameters per occupied subshell."""

from __future__ import annotations

from dataclasses import dataclass, field

from zeffir.core._errors import QuantumNumberError
from zeffir.core.config import Configuration, Subshell
from zeffir.core.orbitals._radial import RadialFunction

__all__ = ["OrbitalComponent", "OrbitalSet", "SubshellOrbital"]


@dataclass(frozen=True, slots=True)
class OrbitalComponent:
    """One part of a subshell that a model splits: a j level or one spin's orbital.

    Attributes
    ----------
    label : str
        ``'2p1/2'`` for a j level; the subshell's own label for a spin orbital.
    j : float or None
        Total angular momentum of a j level.
    spin : str or None
        ``'up'`` or ``'down'`` for a spin orbital ("down" is the majority spin).
    occupancy : float
        Electrons in it (fractional where a model shares a subshell's electrons).
    energy : float or None
        Its eigenvalue (hartree).
    radial : RadialFunction
        Its own radial function, normalised.
    """

    label: str
    j: float | None
    spin: str | None
    occupancy: float
    energy: float | None
    radial: RadialFunction


@dataclass(frozen=True, slots=True)
class SubshellOrbital:
    """One occupied subshell under a model.

    Attributes
    ----------
    subshell : Subshell
        n and l.
    occupancy : int
        Electrons in the subshell.
    radial : RadialFunction
        Its radial function, normalised.
    zeta : float
        Orbital exponent ζ (bohr⁻¹): Z/n for hydrogenic, Z_eff/n* for Slater-type.
    z_eff : float
        Effective nuclear charge felt by an electron of this subshell.
    n_star : float or None
        Effective principal quantum number where the model has one.
    energy : float or None
        Orbital energy (hartree) where the model defines one.
    notes : tuple of str
        Where a value fell back to another rule, and why.
    components : tuple of OrbitalComponent
        The j levels (``relativistic-lda``) or spin orbitals (``lsda``) the subshell is
        made of, empty where a model keeps one radial function per subshell. ``radial``
        then carries the subshell's population-weighted density.

    Examples
    --------
    Under Slater's rules ζ = Z_eff/n* (J. C. Slater, Phys. Rev. 36, 57 (1930)); for a
    bare nucleus ζ = Z/n and ε = −Z²/2n² (Bethe & Salpeter 1957, §3):

    >>> from zeffir.core import build
    >>> all(o.zeta == o.z_eff / o.n_star for o in build("C", "slater").orbitals)
    True
    >>> o = build("Ne", "hydrogenic").orbital("2p")
    >>> o.zeta == 10 / 2, o.energy == -(10**2) / (2 * 2**2)
    (True, True)
    """

    subshell: Subshell
    occupancy: int
    radial: RadialFunction
    zeta: float
    z_eff: float
    n_star: float | None
    energy: float | None
    notes: tuple[str, ...] = ()
    components: tuple[OrbitalComponent, ...] = ()

    @property
    def label(self) -> str:
        """Subshell label, e.g. ``'3d'``."""
        return self.subshell.label

    @property
    def n(self) -> int:
        """Principal quantum number."""
        return self.subshell.n

    @property
    def l(self) -> int:
        """Orbital angular momentum quantum number."""
        return self.subshell.l


@dataclass(frozen=True, slots=True)
class OrbitalSet:
    """The orbitals of one configuration under one model.

    Attributes
    ----------
    configuration : Configuration
        What was evaluated.
    model : str
        Registry name of the model.
    orbitals : tuple of SubshellOrbital
        One per occupied subshell, ordered by (n, l).
    total_energy : float or None
        Total energy (hartree) where the model defines one.
    notes : tuple of str
        Remarks that apply to the whole set.
    virial_ratio : float or None
        -V/T of the total energy where the model minimises it (2 at a variational
        optimum that includes the scale of the orbitals).
    energy_components : tuple of (str, float), or None
        Parts of the total energy (hartree) where the model gives them, e.g. the
        Kohn–Sham ``kinetic``, ``nuclear``, ``hartree`` and ``xc`` terms of ``lda``.
    memo : dict
        Derived data cached by evaluators (e.g. a tabulated density profile); the
        set itself never changes, so cached values stay valid.

    Examples
    --------
    The occupancies add up to the configuration's electrons; without electron
    repulsion (bare-nucleus orbitals) the total energy is Σ occ · ε:

    >>> from zeffir.core import build
    >>> iron = build("Fe", "slater")
    >>> sum(o.occupancy for o in iron.orbitals) == iron.configuration.n_electrons == 26
    True
    >>> neon = build("Ne", "hydrogenic")
    >>> neon.total_energy == sum(o.occupancy * o.energy for o in neon.orbitals) == -200.0
    True
    """

    configuration: Configuration
    model: str
    orbitals: tuple[SubshellOrbital, ...]
    total_energy: float | None = None
    notes: tuple[str, ...] = ()
    virial_ratio: float | None = None
    energy_components: tuple[tuple[str, float], ...] | None = None
    memo: dict[str, object] = field(default_factory=dict, compare=False, repr=False)

    def orbital(self, label: str | Subshell) -> SubshellOrbital:
        """The orbital of a subshell given by label (``'2p'``) or :class:`Subshell`."""
        key = label.label if isinstance(label, Subshell) else str(label).strip()
        for item in self.orbitals:
            if item.label == key:
                return item
        occupied = " ".join(o.label for o in self.orbitals)
        raise QuantumNumberError(f"{key}: not occupied in this configuration ({occupied})")

    @property
    def labels(self) -> tuple[str, ...]:
        """Labels of the occupied subshells."""
        return tuple(o.label for o in self.orbitals)

"""Restricted Hartree–Fock for atoms and ions by the Roothaan method in Slater-type bases.

Every subshell has one radial function, the same for both spins. The solvers:

- :func:`solve_closed_shell`: closed shells (Roothaan 1951);
- :func:`solve_open_shell`: closed shells plus one open s, p, d or f subshell, the
  energy of its Hund term (Roothaan 1960);
- :func:`solve_expression`: any energy written as a combination of one-electron and
  Slater integrals, for any configuration: several open subshells, or excited ones
  with empty lower subshells;
- :func:`solve_average` and :func:`solve_hund`: :func:`solve_expression` with the
  average energy of the configuration (Slater 1960) or the energy of its Hund
  determinant (the LS term of highest S, then highest L);
- :func:`solve`: the solver a configuration needs.

All work in an even-tempered basis per l (:func:`default_basis`), with closed-form
integrals (:mod:`zeffir.core.models._slater_integrals`), canonical orthogonalisation
and Pulay's DIIS. :class:`HartreeFockModel` turns a solution into an
:class:`~zeffir.core.orbitals.OrbitalSet`.
"""

from zeffir.core.models.hartree_fock._basis import EvenTemperedBasis, default_basis
from zeffir.core.models.hartree_fock._closed_shell import solve_closed_shell
from zeffir.core.models.hartree_fock._dispatch import solve, solve_average, solve_hund
from zeffir.core.models.hartree_fock._expression import solve_expression
from zeffir.core.models.hartree_fock._model import HartreeFockModel
from zeffir.core.models.hartree_fock._open_shell import solve_open_shell
from zeffir.core.models.hartree_fock._result import (
    HartreeFockCancelled,
    HartreeFockError,
    HartreeFockResult,
    SCFState,
)
from zeffir.core.orbitals import SlaterExpansionRadial

__all__ = [
    "EvenTemperedBasis",
    "HartreeFockCancelled",
    "HartreeFockError",
    "HartreeFockModel",
    "HartreeFockResult",
    "SCFState",
    "SlaterExpansionRadial",
    "default_basis",
    "solve",
    "solve_average",
    "solve_closed_shell",
    "solve_expression",
    "solve_hund",
    "solve_open_shell",
]

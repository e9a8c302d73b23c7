"""The spin-unpolarised, non-relativistic Kohn–Sham LDA atom (the ``lda`` model's solver).

A name for the ``lda`` case of :func:`~zeffir.core.dft._kohn_sham.solve_kohn_sham`:
one radial orbital per subshell, the configuration's occupations spread evenly over
m, Dirac–Slater exchange and Vosko–Wilk–Nusair correlation, as in the LDA column of
NIST's atomic reference data (S. Kotochigova, Z. H. Levine, E. L. Shirley, M. D. Stiles
and C. W. Clark, Phys. Rev. A 55, 191 (1997)).
"""

from __future__ import annotations

from zeffir.core.config import Configuration
from zeffir.core.dft._kohn_sham import KS_TOLERANCE, KohnShamError, KohnShamResult, solve_kohn_sham
from zeffir.core.dft._radial_grid import LogGrid

__all__ = ["LDA_TOLERANCE", "LDAError", "LDAResult", "solve_lda"]

LDA_TOLERANCE = KS_TOLERANCE
LDAError = KohnShamError
LDAResult = KohnShamResult


def solve_lda(configuration: Configuration, grid: LogGrid | None = None,
              tolerance: float = LDA_TOLERANCE) -> KohnShamResult:
    """The self-consistent spin-unpolarised LDA solution of ``configuration``.

    Examples
    --------
    Neon, against NIST's LDA total energy −128.233481 hartree (Kotochigova et al. 1997):

    >>> from zeffir.core import parse_spec
    >>> result = solve_lda(parse_spec("Ne"))
    >>> bool(abs(result.total_energy + 128.233481) < 2e-6)
    True
    """
    return solve_kohn_sham(configuration, "lda", grid, tolerance)

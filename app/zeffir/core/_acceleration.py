"""Whether the numba-compiled grid kernels are used, for the whole process.

The compiled kernels (``core/density/_compiled.py``, ``core/pairs/_compiled.py``) make
repeated pictures fast, but loading numba and its cached machine code costs 1–2 s,
and the first run after installation compiles for about 10 s. A process that draws
many pictures (the window, a script sweeping a parameter) gains; a one-shot command
loses. The plain-numpy paths give the same values (the tests compare both), so the
choice is one of speed only. The one visible difference is far out: the compiled
kernels interpolate a radial table that ends at the radius beyond which less than
1e-16 of the electron lies, and give exact zeros past it, where the plain path
evaluates the tiny values themselves.

The radial equation solvers of the density-functional models (Numerov, Dirac and
scalar-relativistic recurrences) have a choice of their own. Their Python loops are
15-20 times slower than the compiled ones (a scalar-relativistic Rn takes 40 s
instead of 2.4 s in ``zeffir figure``), so loading numba always pays there; only
``ZEFFIR_NO_NUMBA`` or :func:`set_compiled_solvers` turns them off.

They are on by default, off when the environment variable ``ZEFFIR_NO_NUMBA`` is set
to a non-empty value. ``zeffir figure`` turns them off for its
picture unless ``--compiled`` is given, and gives the previous choice back when it
returns.
"""

from __future__ import annotations

import os

__all__ = [
    "compiled_kernels_enabled",
    "compiled_solvers_enabled",
    "set_compiled_kernels",
    "set_compiled_solvers",
]

# The two process-wide choices: the grid kernels and the radial solvers.
_choices: dict[str, bool] = dict.fromkeys(("kernels", "solvers"), not os.environ.get("ZEFFIR_NO_NUMBA"))


def _swap(which: str, enabled: bool) -> bool:
    """Set one of :data:`_choices` and return its previous value."""
    previous, _choices[which] = _choices[which], bool(enabled)
    return previous


def compiled_kernels_enabled() -> bool:
    """True when grid evaluations may use the numba-compiled kernels.

    Returns
    -------
    bool
        The process-wide choice (see the module notes).

    Examples
    --------
    >>> before = set_compiled_kernels(False)
    >>> compiled_kernels_enabled()
    False
    >>> set_compiled_kernels(before)
    False
    >>> compiled_kernels_enabled() == before
    True
    """
    return _choices["kernels"]


def set_compiled_kernels(enabled: bool) -> bool:
    """Use (True) or avoid (False) the compiled kernels from now on; return the previous choice.

    Parameters
    ----------
    enabled : bool
        False makes every grid evaluation take its plain-numpy path, and numba is
        then never imported.

    Returns
    -------
    bool
        The choice in force before the call.
    """
    return _swap("kernels", enabled)


def compiled_solvers_enabled() -> bool:
    """True when the density-functional radial solvers may use their compiled recurrences.

    Returns
    -------
    bool
        The process-wide choice (see the module notes); :func:`set_compiled_kernels`
        does not change it.
    """
    return _choices["solvers"]


def set_compiled_solvers(enabled: bool) -> bool:
    """Use (True) or avoid (False) the compiled radial solvers from now on; return the previous choice.

    Parameters
    ----------
    enabled : bool
        False makes the Numerov, Dirac and scalar-relativistic solvers run their
        plain-Python loops (same values, much slower).

    Returns
    -------
    bool
        The choice in force before the call.
    """
    return _swap("solvers", enabled)

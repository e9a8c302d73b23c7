"""``scipy.special``, imported on first use.

Importing :mod:`scipy.special` costs about 0.3 s, which ``zeffir --version``, ``--help``
and the window's first paint should not pay. ``special`` stands in for the module:
the first attribute looked up imports it, and every look-up is then answered by the
module itself.

Examples
--------
ln Γ(5) = ln 4! = ln 24, through the stand-in:

>>> import math
>>> from zeffir.core._scipy import special
>>> math.isclose(float(special.gammaln(5.0)), math.log(24.0), rel_tol=1e-15)
True
"""

from __future__ import annotations

from typing import Any

__all__ = ["special"]


class _OnFirstUse:
    """A stand-in for a module that imports it when an attribute is first asked for."""

    __slots__ = ("_name",)

    def __init__(self, name: str) -> None:
        self._name = name

    def __getattr__(self, attribute: str) -> Any:
        import importlib

        return getattr(importlib.import_module(self._name), attribute)

    def __repr__(self) -> str:
        return f"<{self._name}, imported on first use>"


special: Any = _OnFirstUse("scipy.special")

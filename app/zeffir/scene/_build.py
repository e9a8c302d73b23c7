"""Orbital sets for the views, built once per (spec, model) and reused.

A failed build is remembered too, so a model that cannot treat a configuration runs
once, not once for the table and again for every view; ``forget_failure`` lets the
user ask for a fresh attempt. A cancelled build is not a failure and is not kept.
"""

from __future__ import annotations

from functools import lru_cache

from zeffir.core import ComputationCancelled, OrbitalSet, ZeffirError, build
from zeffir.state import Source

__all__ = ["forget_failure", "model_title", "orbitals_for", "short_model_name"]

# Short names for panel titles, which must fit one of three panels at 1280 px; the menus,
# the standing strip and the titles' tooltips use the full titles.
_SHORT_NAMES = {"hydrogenic": "hydrogenic", "slater": "Slater", "clementi": "Clementi–Raimondi",
                "variational": "variational", "hartree-fock": "HF",
                "hartree-fock-average": "HF average", "lda": "LDA", "lsda": "LSD",
                "scalar-relativistic-lda": "ScRLDA", "relativistic-lda": "RLDA"}

_MAX_FAILURES = 64
_failures: dict[tuple[str, str], ZeffirError] = {}


@lru_cache(maxsize=64)
def _cached(spec: str, model: str) -> OrbitalSet:
    return build(spec, model)


def _key(source: Source) -> tuple[str, str]:
    return source.spec.strip(), source.model


def orbitals_for(source: Source) -> OrbitalSet:
    """The orbital set of a source (cached: sets are immutable, and their tables stay warm).

    Raises
    ------
    ZeffirError
        The model cannot treat the configuration; the same error again, without
        recomputing, until :func:`forget_failure` is called for the source.
    """
    key = _key(source)
    failure = _failures.get(key)
    if failure is not None:
        raise failure
    try:
        return _cached(*key)
    except ComputationCancelled:
        raise
    except ZeffirError as error:
        if len(_failures) >= _MAX_FAILURES:
            _failures.pop(next(iter(_failures)))
        _failures[key] = error
        raise


def model_title(name: str) -> str:
    """The model's display name (as the menus show it), or the name itself if unknown."""
    from zeffir.core import get_model

    try:
        return get_model(name).title
    except ZeffirError:
        return name


def short_model_name(name: str) -> str:
    """A model's name short enough for a panel title ('HF', 'Slater'); else its title."""
    return _SHORT_NAMES.get(name) or model_title(name)


def forget_failure(source: Source) -> None:
    """Forget a remembered failure, so the next request builds the source again."""
    _failures.pop(_key(source), None)

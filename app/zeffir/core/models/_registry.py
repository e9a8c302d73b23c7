"""The model registry: each model turns a configuration into an orbital set."""

from __future__ import annotations

from typing import Protocol

from zeffir.core._errors import ModelError
from zeffir.core.config import Configuration, parse_spec
from zeffir.core.orbitals import OrbitalSet

__all__ = ["DEFAULT_MODEL", "Model", "build", "get_model", "model_names", "register"]

#: The model used when none is named.
DEFAULT_MODEL = "slater"


class Model(Protocol):
    """What every model provides.

    Attributes
    ----------
    name : str
        Registry name, used on the command line (``--model NAME``).
    title : str
        Short human-readable name.
    reference : str
        The published source of the method.
    """

    @property
    def name(self) -> str: ...

    @property
    def title(self) -> str: ...

    @property
    def reference(self) -> str: ...

    def build(self, configuration: Configuration) -> OrbitalSet:
        """Return the orbitals of ``configuration`` under this model."""
        ...


_MODELS: dict[str, Model] = {}


def register(model: Model) -> Model:
    """Add a model to the registry (its name must be new)."""
    if model.name in _MODELS:
        raise ModelError(f"{model.name}: a model of that name is already registered")
    _MODELS[model.name] = model
    return model


def model_names() -> tuple[str, ...]:
    """Names of the registered models, in registration order."""
    return tuple(_MODELS)


def get_model(name: str) -> Model:
    """Look a model up by name; the error lists the known names."""
    try:
        return _MODELS[name]
    except KeyError:
        raise ModelError(f"{name}: unknown model (use one of {', '.join(_MODELS)})") from None


def build(spec: str | Configuration, model: str = DEFAULT_MODEL) -> OrbitalSet:
    """Evaluate a configuration (or a spec text) under a model.

    Examples
    --------
    >>> orbitals = build("N", "slater")
    >>> round(orbitals.orbital("2p").z_eff, 2)
    3.9
    """
    configuration = parse_spec(spec) if isinstance(spec, str) else spec
    return get_model(model).build(configuration)

"""Exception types of the computation core, one per domain."""

__all__ = ["ComputationCancelled", "ModelError", "QuantumNumberError", "SpecError", "ZeffirError"]


class ZeffirError(Exception):
    """Base class of every error the core raises on purpose."""


class SpecError(ZeffirError, ValueError):
    """A typed atom specification or configuration is invalid.

    The message names the offending token and the rule it breaks, e.g.
    ``2p7: a p subshell holds at most 6 electrons``.
    """


class QuantumNumberError(ZeffirError, ValueError):
    """Quantum numbers or orbital parameters outside their allowed range."""


class ModelError(ZeffirError, ValueError):
    """An unknown model name, or a model that cannot treat a configuration."""


class ComputationCancelled(ZeffirError):
    """A long computation stopped because its caller asked it to (not a failure of the input)."""

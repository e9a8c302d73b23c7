"""The built-in demo scenario shipped in ``resources/demo/``."""

from __future__ import annotations

import json
from dataclasses import dataclass

from zeffir.core import resource_path

__all__ = ["Demo", "load_demo"]


@dataclass(frozen=True)
class Demo:
    """A spec, the subshell to look at, and the models to compare."""

    title: str
    spec: str
    focus: str
    models: tuple[str, ...]


def load_demo(name: str = "sodium-valence.json") -> Demo:
    """Read a demo file from ``resources/demo/``."""
    data = json.loads(resource_path("demo", name).read_text(encoding="utf-8"))
    return Demo(
        title=str(data["title"]),
        spec=str(data["spec"]),
        focus=str(data["focus"]),
        models=tuple(str(m) for m in data["models"]),
    )

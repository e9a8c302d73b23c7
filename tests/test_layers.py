"""The import contract: each layer imports only from the layers below it, at any depth.

core < state < scene < export < ui < cli, and no Qt or matplotlib below export. The
check reads every import statement, including those inside functions (lazy imports),
so a lazy import that breaks the rule fails here rather than in a user's script.
"""

from __future__ import annotations

import ast
from pathlib import Path

import pytest

PACKAGE = Path(__file__).resolve().parents[1] / "app" / "zeffir"
#: Rank of each layer; a module may import zeffir modules of its own rank or lower.
LAYERS = {"core": 0, "state": 1, "scene": 2, "export": 3, "ui": 4, "cli": 5}
#: Top-level helper modules and their ranks (what they may import).
HELPERS = {"__init__": 0, "_references": 0, "_demo": 1, "_display_check": 0, "__main__": 5}
#: Third-party GUI and plotting packages, allowed from export (matplotlib) and ui (Qt) up.
FORBIDDEN_BELOW = {"PySide6": 4, "pyqtgraph": 4, "shiboken6": 4, "matplotlib": 3}


def _rank(module: str) -> int | None:
    """Layer rank of a dotted ``zeffir...`` module name (None for non-zeffir modules)."""
    parts = module.split(".")
    if parts[0] != "zeffir":
        return None
    if len(parts) == 1:
        return HELPERS["__init__"]
    if parts[1] in LAYERS:
        return LAYERS[parts[1]]
    return HELPERS.get(parts[1], 0)


def _imports(path: Path, root: Path = PACKAGE) -> list[tuple[int, str]]:
    """(line, module) of every import in the file, at module level or inside functions."""
    tree = ast.parse(path.read_text(encoding="utf-8"))
    package = ".".join(("zeffir", *path.relative_to(root).with_suffix("").parts))
    found: list[tuple[int, str]] = []
    for node in ast.walk(tree):
        if isinstance(node, ast.Import):
            found.extend((node.lineno, alias.name) for alias in node.names)
        elif isinstance(node, ast.ImportFrom):
            if node.level:  # relative: resolve against this module's package
                base = package.split(".")[: -node.level]
                module = ".".join([*base, *([node.module] if node.module else [])])
            else:
                module = node.module or ""
            found.append((node.lineno, module))
    return found


def _violations(path: Path, root: Path = PACKAGE) -> list[str]:
    own = _rank(".".join(("zeffir", *path.relative_to(root).with_suffix("").parts)))
    assert own is not None
    wrong = []
    for line, module in _imports(path, root):
        rank = _rank(module)
        if rank is not None and rank > own:
            wrong.append(f"line {line}: imports {module} (layer {rank} above {own})")
        top = module.split(".")[0]
        if top in FORBIDDEN_BELOW and own < FORBIDDEN_BELOW[top]:
            wrong.append(f"line {line}: imports {module}, not allowed below its layer")
    return wrong


def _modules() -> list[Path]:
    return sorted(p for p in PACKAGE.rglob("*.py") if "__pycache__" not in p.parts)


@pytest.mark.parametrize("path", _modules(), ids=lambda p: str(p.relative_to(PACKAGE)))
def test_imports_respect_the_layers(path):
    wrong = _violations(path)
    assert not wrong, "\n".join(wrong)


def test_the_contract_catches_lazy_and_relative_imports(tmp_path):
    probe = tmp_path / "core" / "probe.py"
    probe.parent.mkdir()
    probe.write_text("import numpy\n\ndef f():\n    from zeffir.ui import MainWindow\n"
                     "    import matplotlib.pyplot\n    from ..export import export_view\n",
                     encoding="utf-8")
    wrong = _violations(probe, tmp_path)
    assert [w.split(":")[0] for w in wrong] == ["line 4", "line 5", "line 6"]
    scene = tmp_path / "scene" / "ok.py"
    scene.parent.mkdir()
    scene.write_text("def g():\n    from zeffir.core import build\n    from zeffir.state import Source\n",
                     encoding="utf-8")
    assert _violations(scene, tmp_path) == []


def _private_owner(module: str, names: list[str]) -> str | None:
    """The package whose private part an import reaches into (None for a public import).

    ``from zeffir.core.density._slices import x`` reaches into ``zeffir.core.density``;
    ``from zeffir.core.pairs import _blocks`` into ``zeffir.core.pairs``.
    """
    parts = module.split(".")
    for i, part in enumerate(parts):
        if part.startswith("_") and not part.startswith("__"):
            return ".".join(parts[:i])
    if any(name.startswith("_") for name in names):
        return module
    return None


def _private_reaches(path: Path, root: Path = PACKAGE) -> list[str]:
    """Imports of another package's private modules or names (own package and below allowed)."""
    own = ".".join(("zeffir", *path.relative_to(root).with_suffix("").parts))
    tree = ast.parse(path.read_text(encoding="utf-8"))
    wrong = []
    for node in ast.walk(tree):
        if not isinstance(node, ast.ImportFrom) or node.level or not node.module:
            continue
        if not node.module.startswith("zeffir"):
            continue
        owner = _private_owner(node.module, [alias.name for alias in node.names])
        if owner is not None and not own.startswith(owner + "."):
            wrong.append(f"line {node.lineno}: reaches into {owner}'s private part ({node.module})")
    return wrong


@pytest.mark.parametrize("path", _modules(), ids=lambda p: str(p.relative_to(PACKAGE)))
def test_no_module_reaches_into_another_packages_private_part(path):
    wrong = _private_reaches(path)
    assert not wrong, "\n".join(wrong)


def test_the_private_rule_allows_own_package_and_catches_others(tmp_path):
    probe = tmp_path / "core" / "pairs" / "probe.py"
    probe.parent.mkdir(parents=True)
    probe.write_text("from zeffir.core.pairs._one_matrix import _blocks\n"
                     "from zeffir.core._errors import ModelError\n"
                     "from zeffir.core.density._slices import quadrant_radii\n"
                     "from zeffir.scene import _terms\n", encoding="utf-8")
    wrong = _private_reaches(probe, tmp_path)
    assert [w.split(":")[0] for w in wrong] == ["line 3", "line 4"]

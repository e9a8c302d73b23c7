"""The package layout: every sub-package is shipped, and the core stays free of Qt."""

import subprocess
import sys
import tomllib
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def test_every_subpackage_is_listed_in_pyproject():
    listed = set(tomllib.loads((ROOT / "pyproject.toml").read_text())["tool"]["setuptools"]["packages"])
    found = {
        ".".join(p.parent.relative_to(ROOT / "app").parts)
        for p in (ROOT / "app" / "zeffir").rglob("__init__.py")
    } | {"zeffir.resources"}
    assert found == listed


def test_core_imports_without_qt_or_matplotlib():
    # Block the GUI and plotting libraries outright: importing the core must still work
    # and must not have pulled any of them in.
    code = (
        "import sys\n"
        "for name in ('PySide6', 'pyqtgraph', 'matplotlib', 'zeffir.ui', 'zeffir.export'):\n"
        "    sys.modules[name] = None\n"
        "import zeffir.core, zeffir.core.config, zeffir.core.orbitals, zeffir.core.models\n"
        "import zeffir.core.density, zeffir.core.properties, zeffir.core.terms, zeffir.core.pairs\n"
        "import zeffir.core.energy\n"
        "zeffir.core.build('Fe', 'clementi')\n"
        "bad = [m for m in sys.modules if m.split('.')[0] in ('PySide6', 'pyqtgraph', 'matplotlib')"
        " and sys.modules[m] is not None]\n"
        "assert not bad, bad\n"
    )
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=False)
    assert result.returncode == 0, result.stderr


def test_shipped_resources_are_readable():
    from zeffir.core._resources import resource_path

    assert resource_path("data", "elements.csv").read_text(encoding="utf-8").startswith("#")
    assert resource_path("demo", "sodium-valence.json").is_file()

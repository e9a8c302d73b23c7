"""tools/check_lower_bounds.py pins exactly the lower bounds pyproject.toml declares."""

import importlib.util
import tomllib
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]


def _tool():
    path = ROOT / "tools" / "check_lower_bounds.py"
    spec = importlib.util.spec_from_file_location("check_lower_bounds", path)
    assert spec is not None and spec.loader is not None
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def test_every_dependency_is_pinned_at_its_lower_bound():
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    dependencies = project["dependencies"]
    pins = _tool().lower_bound_pins(dependencies)
    assert len(pins) == len(dependencies)
    assert "scipy==1.15" in pins
    assert "PySide6-Essentials==6.6" in pins
    assert "contourpy==1.2" in pins


@pytest.mark.parametrize("requirement", ["numpy", "numpy<3", "numpy>=1.26,!=1.26", "numpy>=1,>=2"])
def test_a_dependency_without_one_installable_lower_bound_is_refused(requirement):
    with pytest.raises(ValueError, match="numpy"):
        _tool().lower_bound_pins([requirement])

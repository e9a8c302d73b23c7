"""The version is written once, in pyproject.toml, and every other place reads or matches it."""

import tomllib
from importlib import metadata
from pathlib import Path

import pytest

import zeffir

ROOT = Path(__file__).resolve().parents[1]
VERSION = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]["version"]


def test_installed_version_is_pyproject_version():
    # A stale editable install (pyproject bumped, not reinstalled) fails here: reinstall.
    assert zeffir.__version__ == metadata.version("zeffir") == VERSION


def test_citation_file_names_the_same_version():
    lines = (ROOT / "CITATION.cff").read_text(encoding="utf-8").splitlines()
    assert f'version: "{VERSION}"' in lines


def test_uninstalled_source_tree_reads_pyproject(monkeypatch):
    def not_installed(name):
        raise metadata.PackageNotFoundError(name)

    monkeypatch.setattr(metadata, "version", not_installed)
    assert zeffir._find_version() == VERSION


@pytest.mark.parametrize(("text", "expected"), [
    ('[project]\nname = "zeffir"\nversion = "2.3.4"\n', "2.3.4"),
    ('[project]\nname = "another"\nversion = "2.3.4"\n', zeffir.UNKNOWN_VERSION),
    ('[project]\nname = "zeffir"\ndynamic = ["version"]\n', zeffir.UNKNOWN_VERSION),
    ("[project\n", zeffir.UNKNOWN_VERSION),
    (None, zeffir.UNKNOWN_VERSION),
])
def test_source_tree_version_needs_zeffirs_own_static_version(tmp_path, text, expected):
    pyproject = tmp_path / "pyproject.toml"
    if text is not None:
        pyproject.write_text(text, encoding="utf-8")
    assert zeffir._source_tree_version(pyproject) == expected

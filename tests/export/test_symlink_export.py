"""Exporting onto a symbolic link replaces the file it points to and keeps the link."""

from __future__ import annotations

import os

import pytest

from zeffir.export import ExportError, export_view, write_atomic
from zeffir.state import ViewState

pytestmark = pytest.mark.skipif(os.name == "nt", reason="symbolic links need privileges on Windows")


def _spy_replace(monkeypatch) -> list[tuple[str, str]]:
    calls: list[tuple[str, str]] = []
    real = os.replace

    def spy(src, dst, *args, **kwargs):
        calls.append((os.fspath(src), os.fspath(dst)))
        return real(src, dst, *args, **kwargs)

    monkeypatch.setattr(os, "replace", spy)
    return calls


def test_a_link_to_a_file_elsewhere_is_written_through_and_stays_a_link(tmp_path, monkeypatch):
    data, links = tmp_path / "data", tmp_path / "links"
    data.mkdir()
    links.mkdir()
    target = data / "curves.csv"
    target.write_text("old\n", encoding="utf-8")
    link = links / "latest.csv"
    link.symlink_to(os.path.relpath(target, links))
    calls = _spy_replace(monkeypatch)
    assert export_view(ViewState(), link) == link
    assert link.is_symlink() and os.readlink(link) == os.path.relpath(target, links)
    assert target.read_text(encoding="utf-8").startswith("r_bohr,")
    # The temporary file sat beside the target (one file system), and replaced the target.
    [(source, destination)] = calls
    assert os.path.samefile(os.path.dirname(source), data)
    assert os.path.samefile(destination, target) and not os.path.islink(destination)
    assert sorted(p.name for p in data.iterdir()) == ["curves.csv"]
    assert sorted(p.name for p in links.iterdir()) == ["latest.csv"]


def test_a_chain_of_links_ends_at_the_file(tmp_path):
    target = tmp_path / "figure.svg"
    target.write_text("old", encoding="utf-8")
    (tmp_path / "one.svg").symlink_to("figure.svg")
    (tmp_path / "two.svg").symlink_to(tmp_path / "one.svg")
    write_atomic(tmp_path / "two.svg", "new")
    assert target.read_text(encoding="utf-8") == "new"
    assert (tmp_path / "one.svg").is_symlink() and (tmp_path / "two.svg").is_symlink()


def test_a_dangling_link_creates_its_target_when_the_folder_exists(tmp_path):
    link = tmp_path / "out.csv"
    (tmp_path / "store").mkdir()
    link.symlink_to("store/new.csv")
    export_view(ViewState(), link)
    assert link.is_symlink()
    assert (tmp_path / "store" / "new.csv").read_text(encoding="utf-8").startswith("r_bohr,")
    assert sorted(p.name for p in (tmp_path / "store").iterdir()) == ["new.csv"]


def test_a_dangling_link_into_a_missing_folder_is_refused_and_writes_nothing(tmp_path):
    link = tmp_path / "out.csv"
    link.symlink_to("missing/new.csv")
    with pytest.raises(ExportError) as caught:
        export_view(ViewState(), link)
    message = str(caught.value)
    assert message.startswith(f"{link}: cannot write (it is a symbolic link to ")
    assert "missing/new.csv" in message and "does not exist" in message
    assert sorted(p.name for p in tmp_path.iterdir()) == ["out.csv"] and link.is_symlink()


def test_a_loop_of_links_is_refused(tmp_path):
    (tmp_path / "a.csv").symlink_to("b.csv")
    (tmp_path / "b.csv").symlink_to("a.csv")
    with pytest.raises(ExportError, match=r"a\.csv: cannot write \(a loop of symbolic links\)"):
        write_atomic(tmp_path / "a.csv", "x")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.csv", "b.csv"]


def test_a_link_to_a_folder_is_refused(tmp_path):
    (tmp_path / "folder").mkdir()
    (tmp_path / "f.csv").symlink_to("folder")
    with pytest.raises(ExportError, match="Is a directory"):
        write_atomic(tmp_path / "f.csv", "x")
    assert list((tmp_path / "folder").iterdir()) == []

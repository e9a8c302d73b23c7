"""Atomic writes: the target holds the old content or the complete new one, never a part."""

import errno
import os
import sys
from pathlib import Path

import pytest

from zeffir.core import ZeffirError
from zeffir.export import ExportError, atomic_file, atomic_path, write_atomic


def _names(folder: Path) -> list[str]:
    return sorted(p.name for p in folder.iterdir())


def test_write_atomic_writes_text_and_bytes_and_leaves_no_temporary(tmp_path):
    assert write_atomic(tmp_path / "a.txt", "D(r) / bohr⁻¹") == tmp_path / "a.txt"
    write_atomic(tmp_path / "b.bin", b"\x00\x01")
    assert (tmp_path / "a.txt").read_text(encoding="utf-8") == "D(r) / bohr⁻¹"
    assert (tmp_path / "b.bin").read_bytes() == b"\x00\x01"
    assert _names(tmp_path) == ["a.txt", "b.bin"]


def test_missing_directory_names_the_path_and_the_reason(tmp_path):
    target = tmp_path / "no" / "such" / "dir" / "f.png"
    with pytest.raises(ExportError) as caught:
        write_atomic(target, b"x")
    assert str(caught.value) == f"{target}: cannot write (No such file or directory)"
    assert isinstance(caught.value, ZeffirError) and isinstance(caught.value, OSError)
    assert _names(tmp_path) == []


def test_parent_that_is_a_file_is_refused(tmp_path):
    (tmp_path / "plain").write_text("x")
    with pytest.raises(ExportError, match="cannot write"):
        write_atomic(tmp_path / "plain" / "f.csv", "data")
    assert _names(tmp_path) == ["plain"]


def test_directory_as_target_is_refused(tmp_path):
    (tmp_path / "out.png").mkdir()
    with pytest.raises(ExportError, match=r"out\.png: cannot write \(Is a directory\)"):
        write_atomic(tmp_path / "out.png", b"x")


def test_failing_writer_keeps_the_old_file_and_removes_the_temporary(tmp_path):
    target = tmp_path / "f.csv"
    target.write_text("old")
    with pytest.raises(RuntimeError, match="writer broke"), atomic_file(target) as stream:
        stream.write(b"partial")
        raise RuntimeError("writer broke")
    assert target.read_text() == "old"
    assert _names(tmp_path) == ["f.csv"]


def test_os_error_inside_the_writer_becomes_a_clear_export_error(tmp_path):
    target = tmp_path / "f.npz"
    with pytest.raises(ExportError) as caught, atomic_file(target) as stream:
        stream.write(b"partial")
        raise OSError(errno.ENOSPC, os.strerror(errno.ENOSPC))
    assert str(caught.value) == f"{target}: cannot write ({os.strerror(errno.ENOSPC)})"
    assert _names(tmp_path) == []


def test_failed_rename_leaves_no_partial_file(tmp_path, monkeypatch):
    def refuse(src, dst):
        raise PermissionError(errno.EACCES, os.strerror(errno.EACCES))

    monkeypatch.setattr(os, "replace", refuse)
    with pytest.raises(ExportError, match=r"f\.png: cannot write \(Permission denied\)"):
        write_atomic(tmp_path / "f.png", b"complete")
    assert _names(tmp_path) == []


def test_failed_sync_leaves_no_partial_file(tmp_path, monkeypatch):
    def broken_fsync(fd):
        raise OSError(errno.EIO, os.strerror(errno.EIO))

    monkeypatch.setattr(os, "fsync", broken_fsync)
    with pytest.raises(ExportError, match="cannot write"):
        write_atomic(tmp_path / "f.svg", "<svg/>")
    assert _names(tmp_path) == []


def test_atomic_path_gives_a_temporary_with_the_target_suffix(tmp_path):
    target = tmp_path / "figure.pdf"
    with atomic_path(target) as temporary:
        assert temporary.parent == tmp_path and temporary.suffix == ".pdf"
        assert temporary != target and not target.exists()
        temporary.write_bytes(b"%PDF-1.4")
    assert target.read_bytes() == b"%PDF-1.4"
    assert _names(tmp_path) == ["figure.pdf"]


def test_atomic_path_failure_removes_the_temporary(tmp_path):
    with pytest.raises(ValueError, match="bad"), atomic_path(tmp_path / "f.png") as temporary:
        temporary.write_bytes(b"half")
        raise ValueError("bad")
    assert _names(tmp_path) == []


@pytest.mark.skipif(sys.platform == "win32", reason="POSIX permissions")
def test_new_files_get_the_usual_permissions_not_private_ones(tmp_path):
    mask = os.umask(0o022)
    try:
        write_atomic(tmp_path / "f.txt", "x")
    finally:
        os.umask(mask)
    assert (tmp_path / "f.txt").stat().st_mode & 0o777 == 0o644


def test_special_files_are_refused_and_kept(tmp_path):
    # A FIFO is neither opened (it would block) nor replaced by a regular file.
    import os
    import stat

    from zeffir.export import ExportError, check_target, write_atomic

    fifo = tmp_path / "pipe.csv"
    os.mkfifo(fifo)
    for call in (lambda: write_atomic(fifo, "x"), lambda: check_target(fifo)):
        with pytest.raises(ExportError, match="not a regular file"):
            call()
    assert stat.S_ISFIFO(os.stat(fifo).st_mode)


def test_long_names_up_to_the_limit_are_written_and_longer_ones_refused_early(tmp_path):
    from zeffir.export import MAX_NAME_BYTES, ExportError, check_target, write_atomic

    # 255 bytes in all: the temporary name, which adds a prefix and a random part, is
    # shortened to fit instead of failing.
    longest = tmp_path / ("a" * (MAX_NAME_BYTES - 4) + ".csv")
    assert write_atomic(longest, "x").read_text() == "x"
    assert sorted(p.name for p in tmp_path.iterdir()) == [longest.name]
    too_long = tmp_path / ("b" * MAX_NAME_BYTES + ".csv")
    with pytest.raises(ExportError, match="259 bytes long; at most 255"):
        check_target(too_long)
    with pytest.raises(ExportError, match="bytes long"):
        write_atomic(too_long, "x")


def test_a_full_disk_in_a_compressing_writer_is_a_clean_refusal(tmp_path):
    import zlib

    from zeffir.export import ExportError, atomic_path

    target = tmp_path / "figure.pdf"
    target.write_text("old")
    with pytest.raises(ExportError, match="is the disk full"), atomic_path(target) as temporary:
        temporary.write_bytes(b"partial")
        raise zlib.error("Error -3 while compressing data")
    assert target.read_text() == "old"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["figure.pdf"]


def test_a_compressor_error_on_a_full_file_system_says_so(tmp_path, monkeypatch):
    import os
    import zlib

    from zeffir.export import ExportError, atomic_path

    class Full:
        f_bavail, f_frsize = 3, 4096  # 12 KiB left

    monkeypatch.setattr(os, "statvfs", lambda _folder: Full())
    target = tmp_path / "figure.pdf"
    target.write_text("old")
    with pytest.raises(ExportError, match=r"cannot write \(no space left on the device; the "
                                          r"compressor stopped: Error -2"):
        with atomic_path(target) as temporary:
            temporary.write_bytes(b"partial")
            raise zlib.error("Error -2 while flushing: inconsistent stream state")
    assert target.read_text() == "old"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["figure.pdf"]

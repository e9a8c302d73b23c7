"""Starting the window: a Qt platform plugin that cannot load is named, and the demo printed."""

import os
import re
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

import zeffir.ui
from zeffir import _display_check
from zeffir._display_check import PACKAGES, check_platform, missing_libraries, platform_candidates
from zeffir.cli import main

ROOT = Path(__file__).resolve().parents[1]

# Shaped like glibc's ldd report on PySide6's libqxcb.so with two xcb utility libraries absent
# (each one is listed again under every library that needs it).
LDD_MISSING = """\
\tlinux-vdso.so.1 (0x00007ffd0b5f2000)
\tlibQt6XcbQpa.so.6 => /venv/PySide6/Qt/plugins/platforms/../../lib/libQt6XcbQpa.so.6 (0x00007f3b81ea4000)
\tlibxcb-cursor.so.0 => /lib/x86_64-linux-gnu/libxcb-cursor.so.0 (0x00007f3b81dba000)
\tlibxcb-icccm.so.4 => not found
\tlibxcb-keysyms.so.1 => not found
\tlibxcb-icccm.so.4 => not found
\tlibxcb-keysyms.so.1 => not found
\tlibEGL.so.1 => /lib/x86_64-linux-gnu/libEGL.so.1 (0x00007f3b811ca000)
\t/lib64/ld-linux-x86-64.so.2 (0x00007f3b81f74000)
"""
LDD_COMPLETE = "\n".join(line for line in LDD_MISSING.splitlines() if "not found" not in line)


@pytest.fixture
def x11_desktop(monkeypatch, tmp_path):
    """An X11 session with no platform chosen, and a plugin folder holding libqxcb.so."""
    (tmp_path / "libqxcb.so").write_bytes(b"\x7fELF")
    monkeypatch.delenv("QT_QPA_PLATFORM", raising=False)
    monkeypatch.delenv("WAYLAND_DISPLAY", raising=False)
    monkeypatch.delenv("XDG_SESSION_TYPE", raising=False)
    monkeypatch.setenv("DISPLAY", ":0")
    monkeypatch.setenv("QT_QPA_PLATFORM_PLUGIN_PATH", str(tmp_path))
    monkeypatch.setattr(_display_check.sys, "platform", "linux")
    return tmp_path


def _fake_ldd(monkeypatch, report):
    calls = []

    def run(path):
        calls.append(path)
        return report

    monkeypatch.setattr(_display_check, "_run_ldd", run)
    return calls


def _window_opened(monkeypatch):
    opened = []

    def run_window(session=None):
        opened.append(session)
        return 0

    monkeypatch.setattr(zeffir.ui, "run_window", run_window)
    return opened


def test_missing_xcb_libraries_name_their_packages_and_print_the_demo(x11_desktop, monkeypatch, capsys):
    calls = _fake_ldd(monkeypatch, LDD_MISSING)
    opened = _window_opened(monkeypatch)
    assert main([]) == 0
    out, err = capsys.readouterr()
    assert calls == [x11_desktop / "libqxcb.so"]
    assert opened == []
    assert "libxcb-icccm.so.4, libxcb-keysyms.so.1" in err  # generic names, once each
    assert re.search(r"sudo apt install libxcb-icccm4 libxcb-keysyms1$", err, re.MULTILINE)
    assert "libxcb-cursor" not in err  # found, so not asked for
    assert "Sodium (Z = 11)" in out and "model: slater" in out and "model: clementi" in out


def test_a_library_without_a_known_package_is_named_with_a_way_to_find_it(x11_desktop, monkeypatch, capsys):
    _fake_ldd(monkeypatch, LDD_COMPLETE + "\n\tlibxcb-frobnicate.so.7 => not found\n")
    _window_opened(monkeypatch)
    assert main([]) == 0
    err = capsys.readouterr().err
    assert "missing: libxcb-frobnicate.so.7." in err
    assert "apt-file search" in err and "sudo apt install" not in err


def test_a_complete_plugin_opens_the_window(x11_desktop, monkeypatch, capsys, tmp_path):
    from zeffir.export import save_session
    from zeffir.ui import demo_state

    session = tmp_path / "mine.zeffir"
    save_session(session, demo_state())  # a refused file would stop before the window
    calls = _fake_ldd(monkeypatch, LDD_COMPLETE)
    opened = _window_opened(monkeypatch)
    assert main(["--session", str(session)]) == 0
    out, err = capsys.readouterr()
    assert len(calls) == 1
    assert opened == [str(session)]
    assert out == "" and err == ""


def test_a_chosen_qt_platform_runs_no_probe(x11_desktop, monkeypatch, capsys):
    monkeypatch.setenv("QT_QPA_PLATFORM", "offscreen")
    calls = _fake_ldd(monkeypatch, LDD_MISSING)
    opened = _window_opened(monkeypatch)
    assert main([]) == 0
    assert calls == [] and opened == [None]
    assert capsys.readouterr().err == ""


def test_no_probe_off_linux(x11_desktop, monkeypatch):
    calls = _fake_ldd(monkeypatch, LDD_MISSING)
    assert check_platform(platform="darwin") is None
    assert check_platform(platform="win32") is None
    assert calls == []


def test_an_unanswered_probe_leaves_the_start_to_qt(x11_desktop, monkeypatch):
    calls = _fake_ldd(monkeypatch, None)  # no ldd, a timeout, or ldd refusing the file
    assert check_platform() is None
    assert len(calls) == 1


def test_wayland_that_loads_is_enough_even_when_xcb_cannot(x11_desktop, monkeypatch):
    (x11_desktop / "libqwayland.so").write_bytes(b"\x7fELF")
    monkeypatch.setenv("WAYLAND_DISPLAY", "wayland-0")
    reports = {"libqwayland.so": LDD_COMPLETE, "libqxcb.so": LDD_MISSING}
    calls = []

    def run(path):
        calls.append(path.name)
        return reports[path.name]

    assert check_platform(run_ldd=run) is None
    assert calls == ["libqwayland.so"]  # Qt tries Wayland first and stops there


def test_both_plugins_failing_lists_both(x11_desktop, monkeypatch):
    (x11_desktop / "libqwayland.so").write_bytes(b"\x7fELF")
    monkeypatch.setenv("WAYLAND_DISPLAY", "wayland-0")
    reports = {"libqwayland.so": "\tlibwayland-cursor.so.0 => not found\n", "libqxcb.so": LDD_MISSING}
    problem = check_platform(run_ldd=lambda path: reports[path.name])
    assert problem is not None
    assert problem.missing == (("wayland", ("libwayland-cursor.so.0",)),
                               ("xcb", ("libxcb-icccm.so.4", "libxcb-keysyms.so.1")))
    assert problem.packages == ("libwayland-cursor0", "libxcb-icccm4", "libxcb-keysyms1")
    message = problem.message()
    assert "Qt's wayland platform plugin" in message and "Qt's xcb platform plugin" in message


def test_platform_candidates_follow_qts_order():
    assert platform_candidates({"DISPLAY": ":0"}) == ("xcb",)
    assert platform_candidates({"DISPLAY": ":0", "WAYLAND_DISPLAY": "wayland-0"}) == ("wayland", "xcb")
    assert platform_candidates({"XDG_SESSION_TYPE": "wayland"}) == ("wayland",)
    assert platform_candidates({}) == ()


def test_missing_libraries_reads_ldd_once_each_in_order():
    assert missing_libraries(LDD_MISSING) == ("libxcb-icccm.so.4", "libxcb-keysyms.so.1")
    assert missing_libraries(LDD_COMPLETE) == ()


def test_real_ldd_reads_the_installed_xcb_plugin():
    plugin = _display_check._plugin_dir({})
    if plugin is None or not (plugin / "libqxcb.so").is_file():
        pytest.skip("this PySide6 ships no xcb plugin")
    report = _display_check._run_ldd(plugin / "libqxcb.so")
    if report is None:
        pytest.skip("no ldd on this machine")
    assert "libQt6XcbQpa.so.6" in report  # the plugin's own Qt library, bundled with the wheel


def test_readme_apt_line_names_known_packages_of_the_xcb_libraries():
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    line = re.search(r"^sudo apt install (.+)$", readme, re.MULTILINE)
    assert line is not None
    listed = line.group(1).split()
    assert set(listed) <= set(PACKAGES.values())
    for needed in ("libxcb-cursor0", "libxkbcommon-x11-0", "libxcb-icccm4", "libxcb-keysyms1",
                   "libegl1", "libgl1", "libfontconfig1", "libdbus-1-3"):
        assert needed in listed


def test_a_display_with_too_few_colours_is_refused_in_one_line():
    from zeffir.ui._app import MIN_COLOUR_DEPTH, colour_depth_problem

    assert colour_depth_problem(None) is None and colour_depth_problem(24) is None
    assert colour_depth_problem(MIN_COLOUR_DEPTH) is None  # 15- and 16-bit displays paint
    message = colour_depth_problem(8)
    assert message is not None and "\n" not in message
    assert message.startswith("zeffir: the display has 8-bit colour")
    assert "zeffir figure" in message


@pytest.mark.skipif(shutil.which("xvfb-run") is None or shutil.which("Xvfb") is None,
                    reason="needs xvfb-run and Xvfb to start an 8-bit X display")
def test_an_8_bit_x_display_gets_a_refusal_not_a_crash(tmp_path):
    # Qt's raster painter has no paint engine on an 8-bit visual and the process used to
    # crash (SIGSEGV) at the first paint; the window now refuses before it is built.
    env = {k: v for k, v in os.environ.items() if k not in ("QT_QPA_PLATFORM", "DISPLAY")}
    env["HOME"] = str(tmp_path)  # the window's settings stay out of the user's home
    result = subprocess.run(
        ["xvfb-run", "-a", "-s", "-screen 0 1024x768x8", sys.executable, "-m", "zeffir"],
        capture_output=True, text=True, timeout=120, env=env, check=False)
    assert result.returncode == 2, result.stderr[-2000:]
    assert "the display has 8-bit colour" in result.stderr

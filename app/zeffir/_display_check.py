"""Whether Qt's desktop platform plugin can load, checked before Qt starts.

When no platform plugin it tries can load, Qt aborts the whole process (SIGABRT, exit
status 134) with a message that names no package. On Linux the usual cause is a system
library missing from a minimal or server install. This module asks the dynamic linker
(``ldd``, some 0.07 s) which libraries the plugins Qt would try cannot find, so that the
command line can say what to install and print the demo instead. It imports no Qt.

Nothing is checked off Linux, when ``QT_QPA_PLATFORM`` chooses the platform, or when the
answer is unclear (no ``ldd``, no plugin file, ``ldd`` failing): then Qt is left to try.
"""

from __future__ import annotations

import os
import re
import subprocess
import sys
from collections.abc import Callable, Mapping
from dataclasses import dataclass
from importlib.util import find_spec
from pathlib import Path

__all__ = ["PACKAGES", "PlatformProblem", "check_platform", "missing_libraries", "platform_candidates"]

# The plugin files in PySide6's Qt/plugins/platforms; older wheels name Wayland's differently.
_PLUGIN_FILES: dict[str, tuple[str, ...]] = {
    "wayland": ("libqwayland.so", "libqwayland-generic.so"),
    "xcb": ("libqxcb.so",),
}

# Debian/Ubuntu package of each library Qt's xcb and wayland plugins link against
# (including the libraries of Qt's own libraries that the wheel does not bundle).
PACKAGES: dict[str, str] = {
    "libxcb-cursor.so.0": "libxcb-cursor0",
    "libxkbcommon-x11.so.0": "libxkbcommon-x11-0",
    "libxkbcommon.so.0": "libxkbcommon0",
    "libxcb-icccm.so.4": "libxcb-icccm4",
    "libxcb-keysyms.so.1": "libxcb-keysyms1",
    "libxcb-image.so.0": "libxcb-image0",
    "libxcb-render-util.so.0": "libxcb-render-util0",
    "libxcb-xinerama.so.0": "libxcb-xinerama0",
    "libxcb-shape.so.0": "libxcb-shape0",
    "libxcb-util.so.1": "libxcb-util1",
    "libxcb-randr.so.0": "libxcb-randr0",
    "libxcb-shm.so.0": "libxcb-shm0",
    "libxcb-sync.so.1": "libxcb-sync1",
    "libxcb-xfixes.so.0": "libxcb-xfixes0",
    "libxcb-render.so.0": "libxcb-render0",
    "libxcb-xkb.so.1": "libxcb-xkb1",
    "libxcb-glx.so.0": "libxcb-glx0",
    "libxcb.so.1": "libxcb1",
    "libX11-xcb.so.1": "libx11-xcb1",
    "libX11.so.6": "libx11-6",
    "libXau.so.6": "libxau6",
    "libXdmcp.so.6": "libxdmcp6",
    "libSM.so.6": "libsm6",
    "libICE.so.6": "libice6",
    "libGL.so.1": "libgl1",
    "libEGL.so.1": "libegl1",
    "libGLX.so.0": "libglx0",
    "libOpenGL.so.0": "libopengl0",
    "libGLdispatch.so.0": "libglvnd0",
    "libfontconfig.so.1": "libfontconfig1",
    "libfreetype.so.6": "libfreetype6",
    "libdbus-1.so.3": "libdbus-1-3",
    "libglib-2.0.so.0": "libglib2.0-0",
    "libgthread-2.0.so.0": "libglib2.0-0",
    "libwayland-client.so.0": "libwayland-client0",
    "libwayland-cursor.so.0": "libwayland-cursor0",
    "libwayland-egl.so.1": "libwayland-egl1",
    "libpng16.so.16": "libpng16-16",
    "libexpat.so.1": "libexpat1",
    "libz.so.1": "zlib1g",
    "libzstd.so.1": "libzstd1",
}

_NOT_FOUND = re.compile(r"^\s*(\S+)\s+=>\s+not found\s*$", re.MULTILINE)
_LDD_TIMEOUT_S = 5.0


def platform_candidates(environ: Mapping[str, str]) -> tuple[str, ...]:
    """The platform plugins Qt tries, in its order, when ``QT_QPA_PLATFORM`` is not set.

    Qt puts Wayland first in a Wayland session and tries xcb when ``DISPLAY`` is set; it
    aborts only when every one of them fails.
    """
    candidates = []
    if environ.get("WAYLAND_DISPLAY") or environ.get("XDG_SESSION_TYPE") == "wayland":
        candidates.append("wayland")
    if environ.get("DISPLAY"):
        candidates.append("xcb")
    return tuple(candidates)


def _plugin_dir(environ: Mapping[str, str]) -> Path | None:
    if environ.get("QT_QPA_PLATFORM_PLUGIN_PATH"):
        return Path(environ["QT_QPA_PLATFORM_PLUGIN_PATH"])
    spec = find_spec("PySide6")  # locates the package without importing Qt
    if spec is None or not spec.submodule_search_locations:
        return None
    return Path(next(iter(spec.submodule_search_locations))) / "Qt" / "plugins" / "platforms"


def _run_ldd(path: Path) -> str | None:
    """``ldd``'s report on a shared library, or None when it cannot give one."""
    try:
        done = subprocess.run(
            ["ldd", str(path)], capture_output=True, text=True, timeout=_LDD_TIMEOUT_S,
            env={**os.environ, "LC_ALL": "C"}, check=False,
        )
    except (OSError, subprocess.SubprocessError):
        return None
    return done.stdout if done.returncode == 0 else None


def missing_libraries(ldd_output: str) -> tuple[str, ...]:
    """The libraries ``ldd`` reports as ``not found``, once each, in its order."""
    return tuple(dict.fromkeys(_NOT_FOUND.findall(ldd_output)))


@dataclass(frozen=True)
class PlatformProblem:
    """Every platform plugin Qt would try lacks system libraries.

    ``missing`` pairs each plugin name with the file names of the libraries it cannot find.
    """

    missing: tuple[tuple[str, tuple[str, ...]], ...]

    @property
    def libraries(self) -> tuple[str, ...]:
        return tuple(dict.fromkeys(lib for _, libs in self.missing for lib in libs))

    @property
    def packages(self) -> tuple[str, ...]:
        """Debian/Ubuntu packages providing the missing libraries we know."""
        return tuple(dict.fromkeys(PACKAGES[lib] for lib in self.libraries if lib in PACKAGES))

    def message(self) -> str:
        lines = [
            f"zeffir: the window cannot open: Qt's {plugin} platform plugin needs system "
            f"libraries that are missing: {', '.join(libs)}."
            for plugin, libs in self.missing
        ]
        if self.packages:
            lines.append("zeffir: on Debian or Ubuntu install them with:\n"
                         f"    sudo apt install {' '.join(self.packages)}")
        unknown = [lib for lib in self.libraries if lib not in PACKAGES]
        if unknown:
            lines.append(f"zeffir: find the package providing {', '.join(unknown)} with "
                         "'apt-file search NAME' (Debian/Ubuntu) or 'dnf provides NAME' (Fedora).")
        lines.append("zeffir: on other systems install the packages that provide these libraries; "
                     "README.md (System libraries) lists all that a desktop needs.")
        lines.append("zeffir: showing the demo as text instead ('zeffir table' and 'zeffir figure' "
                     "work without a window).")
        return "\n".join(lines)


def check_platform(
    environ: Mapping[str, str] | None = None,
    platform: str | None = None,
    run_ldd: Callable[[Path], str | None] | None = None,
) -> PlatformProblem | None:
    """A :class:`PlatformProblem` when Qt could not load any platform plugin, else None.

    None also means "not known": off Linux, with ``QT_QPA_PLATFORM`` set, with no display
    variable, without PySide6's plugin folder, or when ``ldd`` gives no answer. One candidate
    that loads is enough, as Qt falls back to the next plugin in its list; a plugin file this
    Qt does not ship is skipped, as Qt skips it.
    """
    environ = os.environ if environ is None else environ
    platform = sys.platform if platform is None else platform
    run_ldd = _run_ldd if run_ldd is None else run_ldd
    if not platform.startswith("linux") or environ.get("QT_QPA_PLATFORM"):
        return None
    candidates = platform_candidates(environ)
    folder = _plugin_dir(environ) if candidates else None
    if folder is None:
        return None
    failures = []
    for name in candidates:
        path = next((folder / f for f in _PLUGIN_FILES[name] if (folder / f).is_file()), None)
        if path is None:  # not in this Qt: Qt skips it too
            continue
        report = run_ldd(path)
        if report is None:
            return None
        missing = missing_libraries(report)
        if not missing:
            return None
        failures.append((name, missing))
    return PlatformProblem(tuple(failures)) if failures else None

"""Render the window offscreen at 1600×1000 and save a PNG of each view.

Usage: ``python tools/screenshots.py OUT_DIR``. Used to look at the window as a
practitioner would before a change lands (no display needed).
"""

from __future__ import annotations

import os
import sys
import time
from dataclasses import replace
from pathlib import Path

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")


def main(out: Path) -> int:
    import pyqtgraph as pg
    from PySide6.QtCore import QSettings
    from PySide6.QtWidgets import QApplication

    from zeffir.state import CompareSettings, OrbitalChoice, Source
    from zeffir.ui import demo_state
    from zeffir.ui._main_window import MainWindow

    pg.setConfigOptions(imageAxisOrder="row-major", antialias=True)
    app = QApplication.instance() or QApplication([])
    out.mkdir(parents=True, exist_ok=True)
    settings = QSettings(str(out / "settings.ini"), QSettings.Format.IniFormat)
    window = MainWindow(demo_state(), synchronous=True, settings=settings)  # type: ignore[arg-type]
    window.resize(1600, 1000)
    window.show()

    def shot(name: str) -> None:
        for _ in range(5):
            app.processEvents()
        window.grab().save(str(out / f"{name}.png"))
        print(out / f"{name}.png")

    model = window.model
    shot("1-demo-radial-side-by-side")
    model.update(compare=replace(model.state.compare, enabled=False))
    shot("2-radial")
    model.update(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d", "real", -2), view="slice")
    model.update(slice=replace(model.state.slice, plane="xy", extent=4.0, resolution=512))
    shot("3-slice-psi")
    model.update(slice=replace(model.state.slice, quantity="density",
                               colour=replace(model.state.slice.colour, log_scale=True)))
    shot("4-slice-density-log")
    model.update(left=Source("Na", "hydrogenic"), orbital=OrbitalChoice("3s"),
                 slice=replace(model.state.slice, quantity="psi", extent=14.0,
                               colour=replace(model.state.slice.colour, log_scale=False)),
                 compare=CompareSettings(True, Source("Na", "clementi"), True))
    shot("5-slice-side-by-side")
    model.update(view="radial", length_unit="angstrom")
    shot("6-radial-side-by-side-angstrom")
    model.update(left=Source("N"), view="pair", length_unit="bohr",
                 compare=replace(model.state.compare, enabled=False),
                 slice=replace(model.state.slice, plane="xz", extent=4.0, resolution=256))
    model.update(pair=replace(model.state.pair, reference=(0.0, 0.0, 1.1)))
    shot("7-pair")
    model.update(left=Source("Li+ 1s1 2s1", "hydrogenic"), view="two-electron")
    shot("8-two-electron")
    model.update(left=Source("Cr", "slater"), orbital=OrbitalChoice("3d"), view="radial",
                 compare=CompareSettings(True, Source("Cr", "hartree-fock"), True))
    shot("9-radial-slater-vs-hartree-fock")
    model.update(left=Source("Gd", "hartree-fock"), orbital=OrbitalChoice("4f"),
                 compare=CompareSettings(True, Source("Gd", "hartree-fock-average"), True))
    shot("10-radial-hund-vs-average")
    model.update(left=Source("Na [Ne] 4s1", "hartree-fock"), orbital=OrbitalChoice("4s"),
                 compare=replace(model.state.compare, enabled=False))
    shot("11-radial-excited")
    # A failed build: the strip names what is drawn and what was asked.
    model.update(left=Source("Eu3+", "slater"), orbital=OrbitalChoice("4f"))
    shot("12-before-failed-build")
    model.update(left=Source("Be-", "hartree-fock"))
    shot("13-after-failed-build")
    model.update(left=Source("Eu3+", "slater"), view="slice")
    window.resize(1280, 720)
    shot("14-slice-1280x720")
    model.update(left=Source("Be-", "hartree-fock"))
    shot("15-slice-failed-1280x720")
    window.resize(1600, 1000)
    model.update(left=Source("Ce+", "slater"), view="terms")
    shot("16-terms-ce-plus")
    model.update(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d", "real", -2), view="slice",
                 slice=replace(model.state.slice, plane="xy", quantity="psi", fit_extent=True))
    window.slice_trio.views[0].profile_requested.emit(-4.0, -4.0, 4.0, 4.0)
    shot("17-slice-with-line-profile")
    # Unit switch at 1280×720 while a failed build stands.
    window.resize(1280, 720)
    model.update(left=Source("Be-", "hartree-fock"))
    model.update(length_unit="angstrom")
    shot("18-failed-build-in-angstrom-1280x720")
    # Trends: the three figures a practitioner would check first.
    from zeffir.state import TrendSettings

    window.resize(1600, 1000)
    model.update(length_unit="bohr", view="trends", trends=TrendSettings(
        quantity="z_eff", rule="Z=1-36", models="slater,clementi,hartree-fock"))
    shot("20-trend-z-eff-h-kr")
    model.update(trends=TrendSettings(quantity="energy", rule="Z=21-30", models="hartree-fock",
                                      subshell="3d,4s"))
    shot("21-trend-3d-4s-energies-sc-zn")
    model.update(length_unit="angstrom", trends=TrendSettings(
        quantity="ionization_energy", rule="Z=1-54", models="hartree-fock",
        methods="koopmans,delta-scf"))
    shot("22-trend-ionization-h-xe-nist")
    window.resize(1280, 720)
    model.update(trends=TrendSettings(quantity="ionization_energy", rule="Z=1-54",
                                      models="slater,hartree-fock", methods="koopmans,delta-scf"))
    shot("23-trend-ionization-1280x720")
    model.update(length_unit="bohr")
    # Relativity: gold's 6s, Dirac (relativistic-lda) beside non-relativistic LDA.
    window.resize(1600, 1000)
    window.profile_dock.hide()
    model.update(left=Source("Au", "relativistic-lda"), orbital=OrbitalChoice("6s"), view="radial",
                 compare=CompareSettings(True, Source("Au", "lda"), False, overlay=True),
                 radial=replace(model.state.radial, show_subshells=False, show_total=False,
                                weighted=False, r_limit=8.0))
    shot("24-radial-au-6s-relativistic-vs-lda")
    model.update(compare=CompareSettings(True, Source("Au", "lda"), True),
                 radial=replace(model.state.radial, show_subshells=True, show_total=True,
                                weighted=True, r_limit=None))
    shot("24b-radial-au-relativistic-vs-lda-whole-atom")
    model.update(left=Source("Mg+", "lsda"), orbital=OrbitalChoice("3s"),
                 compare=replace(model.state.compare, enabled=False))
    shot("25-radial-mg-plus-lsd")
    window.worker.shutdown()
    # A Cancel: a worker-thread window, a long build (Kr, variational) cancelled at once.
    live = MainWindow(demo_state(), synchronous=False, settings=settings)  # type: ignore[arg-type]
    live.resize(1280, 720)
    live.show()
    for _ in range(200):
        app.processEvents()
        if live.problem() is None:
            break
        time.sleep(0.02)
    live.apply(live.state.with_changes(left=Source("Kr", "variational")))
    live.cancel()
    for _ in range(20):
        app.processEvents()
    live.grab().save(str(out / "19-cancelled-1280x720.png"))
    print(out / "19-cancelled-1280x720.png")
    live.worker.shutdown()
    matrix(out, settings)
    return 0


def matrix(out: Path, settings: object) -> None:
    """Every view at 1600×1000 and 1280×720, before and after a failed build; four series."""
    from PySide6.QtWidgets import QApplication

    from zeffir.state import CompareSettings, OrbitalChoice, Source, ViewState
    from zeffir.ui._main_window import MainWindow

    app = QApplication.instance()
    failing = Source("Be-", "hartree-fock")
    atoms = {"radial": (Source("Fe", "slater"), OrbitalChoice("3d")),
             "slice": (Source("Fe", "slater"), OrbitalChoice("3d", "real", -2)),
             "pair": (Source("N", "slater"), OrbitalChoice("2p")),
             "two-electron": (Source("Li+ 1s1 2s1", "hydrogenic"), OrbitalChoice("2s")),
             "terms": (Source("Fe", "slater"), OrbitalChoice("3d"))}
    four = CompareSettings(True, Source("Fe", "clementi"), True, True,
                           more=(Source("", "hydrogenic"), Source("Co", "slater")))
    for width, height in ((1600, 1000), (1280, 720)):
        window = MainWindow(ViewState(), synchronous=True, settings=settings)  # type: ignore[arg-type]
        window.resize(width, height)
        window.show()

        def shot(name: str, w: MainWindow = window, size: str = f"{width}x{height}") -> None:
            for _ in range(5):
                app.processEvents()  # type: ignore[union-attr]
            path = out / f"m-{size}-{name}.png"
            w.grab().save(str(path))
            print(path, "|", w.problem() or "current")

        for view, (source, orbital) in atoms.items():
            window.apply(ViewState(left=source, orbital=orbital, view=view))  # type: ignore[arg-type]
            shot(f"{view}-before")
            window.apply(window.state.with_changes(left=failing))
            shot(f"{view}-after-failed-build")
        window.apply(ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d"), compare=four))
        shot("radial-four-series")
        window.apply(window.state.with_changes(compare=CompareSettings(**{**four.__dict__, "overlay": True})))
        shot("radial-four-series-overlaid")
        window.apply(window.state.with_changes(view="slice", orbital=OrbitalChoice("3d", "real", 0)))
        shot("slice-four-series")
        window.apply(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                               compare=CompareSettings(True, Source("Na", "clementi"))))
        shot("radial-two-series-with-difference")
        window.worker.shutdown()
        window.close()


if __name__ == "__main__":
    sys.exit(main(Path(sys.argv[1] if len(sys.argv) > 1 else "screenshots")))

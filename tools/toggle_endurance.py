"""Switch Side by side on and off many times in a running window and watch for stalls.

Usage::

    xvfb-run -a -s "-screen 0 1600x1000x24" python tools/toggle_endurance.py \\
        [--views slice,radial] [--toggles 300] [--pace-ms 20] [--input box|click|shortcut]
        [--size 1600x1000]

Unlike the test suite (``tests/ui/test_compare_toggle_endurance.py``, synchronous and
offscreen), this drives the demo window through a real event loop on a real X server
(``QT_QPA_PLATFORM=xcb``), with the background worker computing, one switch per timer
tick. After every 20 switches the timer pauses, lets the last switch's pictures
finish (1.5 s), and prints the CPU time the idle window uses over the next two
seconds: a window that keeps laying itself out or repainting with nothing to do
shows up there. A gap of more than ``--stall`` seconds between two
ticks is reported; if the event loop stops answering for ``--watchdog`` seconds every
thread's stack is written to standard error and the process ends at once.

Exit status: 0 if every view took all its switches with no stall, 1 otherwise (also
after a watchdog dump).
"""

from __future__ import annotations

import argparse
import faulthandler
import os
import sys
import tempfile
import time
from pathlib import Path

VIEWS = ("radial", "slice", "pair", "two-electron", "terms", "trends")
IDLE_EVERY = 20
IDLE_MS = 2000
SETTLE_MS = 1500


def _arguments(argv: list[str] | None) -> argparse.Namespace:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--views", default=",".join(VIEWS),
                        help="comma-separated views to drive, in order (default: all)")
    parser.add_argument("--toggles", type=int, default=300, help="switches per view")
    parser.add_argument("--pace-ms", type=int, default=20, help="timer interval between switches")
    parser.add_argument("--input", choices=("box", "click", "shortcut"), default="click",
                        help="how to switch: the check box's toggle(), a mouse click on it, "
                             "or the menu shortcut Ctrl+D")
    parser.add_argument("--shots", metavar="DIR",
                        help="save the window as DIR/<view>-after-switches.png after each view")
    parser.add_argument("--size", default="1600x1000", help="window size, WIDTHxHEIGHT")
    parser.add_argument("--stall", type=float, default=1.0,
                        help="report a gap between switches longer than this (s)")
    parser.add_argument("--watchdog", type=float, default=30.0,
                        help="dump stacks and stop when the loop is stuck this long (s)")
    args = parser.parse_args(argv)
    unknown = [v for v in args.views.split(",") if v not in VIEWS]
    if unknown:
        parser.error(f"--views: unknown {', '.join(unknown)}; choose from {', '.join(VIEWS)}")
    return args


def main(argv: list[str] | None = None) -> int:
    args = _arguments(argv)
    os.environ.setdefault("QT_QPA_PLATFORM", "xcb")
    import pyqtgraph as pg
    from PySide6.QtCore import QPoint, QSettings, Qt, QTimer
    from PySide6.QtTest import QTest
    from PySide6.QtWidgets import QApplication

    from zeffir.ui import demo_state
    from zeffir.ui._main_window import MainWindow

    pg.setConfigOptions(imageAxisOrder="row-major", antialias=True)
    app = QApplication.instance() or QApplication([])
    # Settings in a throw-away directory: QSettings saves by renaming a new file over
    # its target, which would replace a device such as /dev/null with a regular file.
    scratch = tempfile.TemporaryDirectory(prefix="zeffir-endurance-")
    settings = QSettings(str(Path(scratch.name) / "settings.ini"), QSettings.Format.IniFormat)
    window = MainWindow(demo_state(), settings=settings)  # type: ignore[arg-type]
    width, height = (int(part) for part in args.size.lower().split("x"))
    window.resize(width, height)
    window.show()

    views = args.views.split(",")
    box = window.controls.compare_on
    stalls: list[str] = []
    progress = {"view": 0, "done": 0, "last": time.monotonic(), "start": time.monotonic()}
    timer = QTimer()
    timer.setInterval(args.pace_ms)

    def switch() -> None:
        if args.input == "box":
            box.toggle()
        elif args.input == "click":
            QTest.mouseClick(box, Qt.MouseButton.LeftButton, pos=QPoint(8, box.height() // 2))
        else:
            QTest.keyClick(window, Qt.Key.Key_D, Qt.KeyboardModifier.ControlModifier)

    def begin_view() -> None:
        window.tabs.setCurrentIndex(VIEWS.index(views[progress["view"]]))
        progress.update(done=0, start=time.monotonic(), last=time.monotonic())
        timer.start()

    def start_idle() -> None:
        faulthandler.dump_traceback_later(args.watchdog, exit=True)
        cpu = time.process_time()
        QTimer.singleShot(IDLE_MS, lambda: idle_check(cpu))

    def idle_check(cpu_before: float) -> None:
        used = time.process_time() - cpu_before
        print(f"  {views[progress['view']]}: after {progress['done']} switches, "
              f"{used:.2f} s CPU in {IDLE_MS / 1000:g} s idle", flush=True)
        progress["last"] = time.monotonic()
        timer.start()

    def tick() -> None:
        faulthandler.dump_traceback_later(args.watchdog, exit=True)
        now = time.monotonic()
        gap = now - progress["last"]
        progress["last"] = now
        view = views[progress["view"]]
        if gap > args.stall:
            stalls.append(f"{view}: {gap:.2f} s before switch {progress['done'] + 1}")
            print(f"  stall: {stalls[-1]}", flush=True)
        switch()
        progress["done"] += 1
        if progress["done"] >= args.toggles:
            timer.stop()
            if args.shots:  # after the pictures of the last switch are in
                QTimer.singleShot(SETTLE_MS, lambda v=view: save_shot(v))
                return
            next_view()
        elif progress["done"] % IDLE_EVERY == 0:
            timer.stop()  # let the last switch's pictures finish, then measure the idle window
            QTimer.singleShot(SETTLE_MS, start_idle)

    def save_shot(view: str) -> None:
        path = Path(args.shots) / f"{view}-after-switches.png"
        path.parent.mkdir(parents=True, exist_ok=True)
        window.grab().save(str(path))
        print(f"  {path}", flush=True)
        next_view()

    def next_view() -> None:
        view = views[progress["view"]]
        print(f"{view}: {args.toggles} switches in "
              f"{time.monotonic() - progress['start']:.1f} s; "
              f"side by side {'on' if box.isChecked() else 'off'}", flush=True)
        progress["view"] += 1
        if progress["view"] < len(views):
            QTimer.singleShot(0, begin_view)
        else:
            faulthandler.cancel_dump_traceback_later()
            window.close()
            app.quit()

    timer.timeout.connect(tick)
    QTimer.singleShot(500, begin_view)
    faulthandler.dump_traceback_later(args.watchdog, exit=True)
    app.exec()
    faulthandler.cancel_dump_traceback_later()
    del settings
    scratch.cleanup()
    print("no stall" if not stalls else f"{len(stalls)} stalls:\n  " + "\n  ".join(stalls))
    return 1 if stalls else 0


if __name__ == "__main__":
    sys.exit(main())

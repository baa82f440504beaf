"""A walkthrough of the window on a demo league, a screenshot of every view into docs/screens/.

    python scripts/walkthrough.py [--league FILE] [--rounds K] [--out docs/screens] [--scale 2]

Opens the league, counts it, draws a schedule for K rounds (default: the fewest), ranks the
clash reasons, and grabs each tab, the Match columns dialog, the guide, the print preview's
first page and the restore bar (from a recovery file the walkthrough leaves itself). With
--scale 2 the window is drawn at 200% (QT_SCALE_FACTOR) and the files get a "-200" suffix.
Runs offscreen (no display needed); every image is written to a temporary file moved into
place. The README shows docs/screens/schedule.png.
"""

from __future__ import annotations

import argparse
import os
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))


def _arguments() -> argparse.Namespace:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--league", default=str(ROOT / "demo_leagues" / "season.xlsx"))
    parser.add_argument("--rounds", type=int, default=None)
    parser.add_argument("--out", default=str(ROOT / "docs" / "screens"))
    parser.add_argument("--scale", type=float, default=1.0)
    parser.add_argument("--settings", help=argparse.SUPPRESS)  # the first part, in a child
    return parser.parse_args()


def main() -> int:
    args = _arguments()
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    if args.scale != 1.0:
        os.environ["QT_SCALE_FACTOR"] = str(args.scale)
    suffix = "" if args.scale == 1.0 else f"-{round(args.scale * 100)}"

    from PySide6.QtCore import QSettings
    from PySide6.QtWidgets import QApplication, QWidget

    from leaguegrid.gui.app import create_application
    from leaguegrid.gui.main_window import MainWindow

    app = create_application()
    out = Path(args.out)
    out.mkdir(parents=True, exist_ok=True)
    written: list[Path] = []

    def settle(seconds: float = 0.3) -> None:
        end = time.monotonic() + seconds
        while time.monotonic() < end:
            app.processEvents()
            time.sleep(0.01)

    def wait(window: MainWindow, done, what: str, limit: float = 180) -> None:
        deadline = time.monotonic() + limit
        while time.monotonic() < deadline and not (done() and not window.runner.busy):
            app.processEvents()
            time.sleep(0.02)
        if not done():
            raise SystemExit(f"{what} did not finish within {limit:.0f} s: "
                             f"{window.stage_label.text()}")
        settle()

    def shoot(widget: QWidget, name: str) -> None:
        target = out / f"{name}{suffix}.png"
        tmp = target.with_name(f".{target.name}.tmp.png")
        if not widget.grab().save(str(tmp), "PNG"):
            raise SystemExit(f"could not write {target}")
        os.replace(tmp, target)
        written.append(target)

    if not args.settings:  # the views in a child that ends as a crash would, then the restore bar
        return _restore_bar(args, app, out, suffix, settle)
    if True:
        settings = QSettings(args.settings, QSettings.Format.IniFormat)
        window = MainWindow(settings)
        window.resize(1280, 820)
        window.show()
        window.open_path(args.league)
        wait(window, lambda: window.report is not None, "counting")
        tabs = window.tabs
        tabs.setCurrentWidget(window.import_view)
        shoot(window, "workbook")
        tabs.setCurrentWidget(window.fixtures_view)
        shoot(window, "fixtures")
        tabs.setCurrentWidget(window.clash_view)
        window.clash_view.fit()
        settle()
        shoot(window, "clash-graph")
        tabs.setCurrentWidget(window.counts_view)
        window.counts_view.table.selectRow(0)
        settle()
        shoot(window, "counts")
        if args.rounds:
            window.rounds_box.setValue(args.rounds)
        window.draw_schedule()
        wait(window, lambda: window.doc.schedule is not None, "drawing")
        tabs.setCurrentWidget(window.schedule_view)
        settle()
        shoot(window, "schedule")
        window.compute_whatif()
        wait(window, lambda: bool(window.whatif_view.rows), "ranking the clash reasons")
        tabs.setCurrentWidget(window.whatif_view)
        shoot(window, "what-if")
        tabs.setCurrentWidget(window.teams_view)
        window.teams_view.table.selectRow(0)
        settle()
        shoot(window, "teams")
        tabs.setCurrentWidget(window.venues_view)
        settle()
        shoot(window, "venues")
        window.show_guide()
        settle()
        shoot(window.guide, "guide")
        window.guide.close()
        window.edit_mapping()
        settle(1.0)
        dialog = QApplication.activeModalWidget()
        if dialog is not None:
            shoot(dialog, "match-columns")
            dialog.reject()
        settle()
        window.print_preview()
        wait(window, lambda: QApplication.activeModalWidget() is not None, "the print preview",
             60)
        preview = QApplication.activeModalWidget()
        settle(1.0)
        shoot(preview, "print-preview")
        preview.reject()
        settle()
        window.runner.cancel()
        window.runner.wait()
    for path in written:
        print(f"wrote {path.relative_to(ROOT) if path.is_relative_to(ROOT) else path}")
    sys.stdout.flush()
    os._exit(0)  # no clean close: the drawn schedule is unsaved, so its recovery file stays


def _restore_bar(args: argparse.Namespace, app, out: Path, suffix: str, settle) -> int:
    """Run the views' part in a child process (which ends without closing its window), then
    start a window on the same settings: it offers the work left behind in its restore bar."""
    import subprocess

    from PySide6.QtCore import QSettings

    from leaguegrid.gui.main_window import MainWindow

    with tempfile.TemporaryDirectory() as folder:
        ini = str(Path(folder) / "settings.ini")
        settings = QSettings(ini, QSettings.Format.IniFormat)
        settings.setValue("recoveryFolder", str(Path(folder) / "recovery"))
        settings.setValue("countBudget", 10)
        settings.sync()
        argv = [sys.executable, __file__, "--league", args.league, "--out", str(out),
                "--scale", str(args.scale), "--settings", ini]
        if args.rounds:
            argv += ["--rounds", str(args.rounds)]
        if subprocess.run(argv).returncode != 0:
            return 1
        window = MainWindow(QSettings(ini, QSettings.Format.IniFormat))
        window.resize(1280, 820)
        window.show()
        settle(1.0)
        target = out / f"restore-bar{suffix}.png"
        tmp = target.with_name(f".{target.name}.tmp.png")
        if not window.grab().save(str(tmp), "PNG"):
            return 4
        os.replace(tmp, target)
        print(f"wrote {target}")
        window.runner.cancel()
        window.runner.wait()
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

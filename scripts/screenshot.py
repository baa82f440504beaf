"""Save resources/screenshot.png: the main window on the bundled demo league with its counts.

    python scripts/screenshot.py [--league FILE] [--out resources/screenshot.png]

Runs offscreen (no display needed); the image is written atomically.
"""

from __future__ import annotations

import argparse
import os
import sys
import tempfile
import time
from pathlib import Path

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--league", default=str(ROOT / "demo_leagues" / "season.xlsx"))
    parser.add_argument("--out", default=str(ROOT / "resources" / "screenshot.png"))
    args = parser.parse_args()

    from PySide6.QtCore import QSettings

    from leaguegrid.gui.app import create_application
    from leaguegrid.gui.main_window import MainWindow

    app = create_application()
    with tempfile.TemporaryDirectory() as folder:
        settings = QSettings(str(Path(folder) / "settings.ini"), QSettings.Format.IniFormat)
        window = MainWindow(settings)
        window.resize(1280, 820)
        window.show()
        window.open_path(args.league)
        deadline = time.monotonic() + 120
        while time.monotonic() < deadline and (window.report is None or window.runner.busy):
            app.processEvents()
            time.sleep(0.02)
        if window.report is None:
            print(f"no counts within 120 s: {window.stage_label.text()}", file=sys.stderr)
            return 1
        window.tabs.setCurrentWidget(window.counts_view)
        window.counts_view.table.selectRow(0)
        for _ in range(20):
            app.processEvents()
        image = window.grab()
        out = Path(args.out)
        out.parent.mkdir(parents=True, exist_ok=True)
        tmp = out.with_name(f".{out.name}.tmp.png")
        if not image.save(str(tmp), "PNG"):
            print(f"could not write {out}", file=sys.stderr)
            return 4
        os.replace(tmp, out)
        window.close()
    print(f"wrote {out}")
    return 0


if __name__ == "__main__":
    sys.exit(main())

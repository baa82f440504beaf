"""Printing a large league, timed for the benchmark runner.

    python -m benchmarks.print_probe [LEAGUE] [--rounds 18]

Plans LEAGUE (default: demo_leagues/association.xlsx, 720 fixtures) for the given rounds, then
times: building the printout (app layer); painting the PDF off the GUI thread as a job of the
window's runner, with a 10 ms QTimer probe noting the event loop's largest gap meanwhile (target
under 200 ms); painting the print preview, which Qt does in the GUI thread (QPrintPreviewWidget).
"""

from __future__ import annotations

import argparse
import json
import os
import sys
import time
from pathlib import Path

DEFAULT_LEAGUE = Path(__file__).resolve().parents[1] / "demo_leagues" / "association.xlsx"


def measure(league: str | Path = DEFAULT_LEAGUE, rounds: int = 18) -> dict[str, float]:
    """Seconds to build the printout, to paint its PDF (and the GUI's largest gap meanwhile, ms),
    and to paint the print preview; with the number of pages."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtPrintSupport import QPrinter, QPrintPreviewWidget

    from benchmarks.latency import LatencyProbe
    from leaguegrid import engine
    from leaguegrid.app import league as opening
    from leaguegrid.app import planning
    from leaguegrid.app.printout import build_printout
    from leaguegrid.gui.app import create_application
    from leaguegrid.gui.print_pages import page_layout, paint, pdf_bytes
    from leaguegrid.gui.worker import Job, Runner

    app = create_application()
    opened = opening.open_league(league)
    schedule = planning.make_schedule(opened.league, opened.graph, rounds, seed=1,
                                      hooks=engine.Hooks(budget=30)).schedule
    if schedule is None:
        raise SystemExit(f"no schedule for {rounds} rounds")
    started = time.perf_counter()
    printout = build_printout(opened.league, schedule)
    built = time.perf_counter() - started

    out: dict = {}
    probe = LatencyProbe(10)

    def work(hooks: engine.Hooks) -> None:
        begun = time.perf_counter()
        out["data"], out["pages"] = pdf_bytes(printout, "A4", hooks)
        out["seconds"] = time.perf_counter() - begun

    runner = Runner()
    probe.start()
    runner.start(Job("Writing the PDF", work))
    while runner.busy:
        app.processEvents()
        time.sleep(0.001)
    largest = probe.stop()

    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setPageLayout(page_layout("A4"))
    preview = QPrintPreviewWidget(printer)
    preview.paintRequested.connect(lambda device: paint(printout, device))
    begun = time.perf_counter()
    preview.updatePreview()
    previewed = time.perf_counter() - begun
    return {"fixtures": len(opened.league.fixtures), "pages": out["pages"],
            "build_s": round(built, 3), "pdf_s": round(out["seconds"], 3),
            "pdf_bytes": len(out["data"]), "largest_gap_ms_during_pdf": round(largest * 1000, 1),
            "preview_s": round(previewed, 3), "preview_pages": preview.pageCount()}


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(prog="python -m benchmarks.print_probe")
    parser.add_argument("league", nargs="?", default=str(DEFAULT_LEAGUE))
    parser.add_argument("--rounds", type=int, default=18)
    args = parser.parse_args(argv)
    print(json.dumps(measure(args.league, args.rounds), indent=2))
    return 0


if __name__ == "__main__":
    sys.exit(main())

"""The window's main job, through its own actions: open each demo league, count, draw, export.

Counts are checked against the engine called directly on the counting model of the schedules
package (pins, ties, splits and blocked rounds as exact transformations); the exported calendar
is read back with openpyxl.
"""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from pathlib import Path  # noqa: E402

import pytest  # noqa: E402
from openpyxl import load_workbook  # noqa: E402
from PySide6.QtWidgets import QApplication, QFileDialog  # noqa: E402

from leaguegrid import engine  # noqa: E402
from leaguegrid.clashes.graph import build_clash_graph  # noqa: E402
from leaguegrid.gui import export_dialog  # noqa: E402
from leaguegrid.io.read.league_reader import load_league  # noqa: E402
from leaguegrid.scheduling.check import check_schedule  # noqa: E402
from leaguegrid.scheduling.constraints import build_model, with_splits  # noqa: E402

DEMOS = Path(__file__).resolve().parents[2] / "demo_leagues"
# bigseason.xlsx (90 fixtures, counts only as estimates) is opened by the cancel test instead.
FLOW_DEMOS = ["small.xlsx", "clubday.xlsx", "season.xlsx", "schedules.xlsx"]


def wait_idle(qtbot, win, timeout=60_000):
    """Until the worker has nothing running and no recount is pending."""
    qtbot.waitUntil(lambda: not win.runner.busy and not win._recount.isActive(),
                    timeout=timeout)


def open_through_action(qtbot, win, monkeypatch, path):
    """File > Open with the file dialog answering `path`."""
    monkeypatch.setattr(QFileDialog, "getOpenFileName",
                        staticmethod(lambda *a, **k: (str(path), "")))
    win.act_open.trigger()
    qtbot.waitUntil(lambda: win.doc.path == str(path), timeout=30_000)
    wait_idle(qtbot, win)


def export_through_action(qtbot, win, target: Path):
    """File > Export, the dialog's Write files clicked for an Excel calendar at `target` only."""
    win.act_export.trigger()
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(),
                                       export_dialog.ExportDialog))
    dialog = QApplication.activeModalWidget()
    dialog.xlsx_path.setText(str(target))
    dialog.ics_on.setChecked(False)
    dialog.csv_on.setChecked(False)
    dialog.write_button.click()


@pytest.mark.parametrize("name", FLOW_DEMOS)
def test_demo_league_counts_draw_and_export(qtbot, window, settings, monkeypatch, tmp_path,
                                            name):
    settings.setValue("countBudget", 3)
    path = DEMOS / name
    open_through_action(qtbot, window, monkeypatch, path)
    league = load_league(path).league
    assert window.windowTitle() == f"LeagueGrid — {league.settings.league or league.name}"
    assert window.report is not None, window.last_error

    graph = build_clash_graph(league)
    shown = window.counts_view.values()
    assert [row["rounds"] for row in shown] == [row.rounds for row in window.report.rows]
    assert shown[0]["rounds"] == window.report.min_rounds
    exact_rows = 0
    for row in shown:
        model = build_model(league, graph, row["rounds"])
        if isinstance(row["assignments"], int):
            exact_rows += 1
            assert row["assignments"] == engine.count_assignments(
                model.graph, row["rounds"], pins=model.pins, exclusions=model.exclusions)
        else:
            assert row["assignments"] is None or "(estimate)" in window.counts_view.model.index(
                shown.index(row), 1).data()
    assert exact_rows >= 1
    fewest = window.report.min_rounds
    assert fewest == build_model(league, graph, fewest).fewest_rounds()
    if window.report.polynomial is not None:
        assert window.report.polynomial == engine.chromatic_polynomial(with_splits(league, graph))
        assert window.counts_view.polynomial.toPlainText() == window.report.polynomial_text

    window.act_draw.trigger()
    wait_idle(qtbot, window)
    schedule = window.doc.schedule
    assert schedule is not None, window.stage_label.text()
    assert schedule.rounds == window.report.min_rounds
    assert check_schedule(league, graph, schedule) == []
    assert window.schedule_view.status.text().startswith("✔")
    assert set(window.schedule_view.model.labels()) == {f.label for f in league.fixtures}

    target = tmp_path / "calendar.xlsx"
    export_through_action(qtbot, window, target)
    wait_idle(qtbot, window)
    assert window.last_export == [str(target)]
    sheet = load_workbook(target, read_only=True)["Calendar"]
    rows = list(sheet.iter_rows(values_only=True))
    column = rows[0].index("Fixture")
    exported = [r[column] for r in rows[1:] if r[column] is not None]
    assert sorted(exported) == sorted(f.label for f in league.fixtures)

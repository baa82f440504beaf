"""The window's table models: each holds the app layer's typed data and shows it as the
wording module writes it (the expected texts below are written out by hand)."""

import os
import warnings

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from PySide6.QtCore import QModelIndex, QPoint, QRect, Qt  # noqa: E402
from PySide6.QtGui import QFontMetrics, QIcon  # noqa: E402
from PySide6.QtWidgets import QApplication  # noqa: E402

from leaguegrid import engine  # noqa: E402
from leaguegrid.app import counting, league  # noqa: E402
from leaguegrid.core.model import Fixture, League, Problem, Reason, Schedule  # noqa: E402
from leaguegrid.gui.chip_delegate import chip_at, chip_rects  # noqa: E402
from leaguegrid.gui.counts_model import CountsModel  # noqa: E402
from leaguegrid.gui.fixtures_model import FixturesModel  # noqa: E402
from leaguegrid.gui.problems_model import ProblemsModel  # noqa: E402
from leaguegrid.gui.reasons_model import ReasonsModel  # noqa: E402
from leaguegrid.gui.schedule_model import ScheduleGridModel, fixture_mime  # noqa: E402
from leaguegrid.gui.sheet_model import SheetModel  # noqa: E402
from leaguegrid.scheduling.rules import Violation  # noqa: E402
from leaguegrid.scheduling.whatif import Waived  # noqa: E402

D = Qt.ItemDataRole.DisplayRole
TIP = Qt.ItemDataRole.ToolTipRole
USER = Qt.ItemDataRole.UserRole


def texts(model, role=D):
    return [[model.index(r, c).data(role) for c in range(model.columnCount())]
            for r in range(model.rowCount())]


def triangle() -> League:
    """Three fixtures of one team: every pair clashes, the clash graph is a triangle."""
    return League("T", "t.xlsx", [Fixture("Otters v Herons", "Otters", "Herons"),
                                  Fixture("Otters v Wrens", "Otters", "Wrens"),
                                  Fixture("Badgers v Otters", "Badgers", "Otters")])


def test_counts_model_shows_the_triangles_counts(qtbot):
    # P(K3, k) = k(k-1)(k-2) (textbook): 6 for k = 3 and 24 for k = 4; the 3 fixtures fill
    # 3 rounds in one grouping (6 = 1 x 3!) and can never fill 4.
    lg = triangle()
    report = counting.count_report(lg, league.clash_graph(lg), rounds=[3, 4])
    model = CountsModel()
    model.set_report(report)
    assert model.rowCount() == 2 and model.columnCount() == 4
    assert texts(model) == [["3", "6", "6", "1"], ["4", "24", "0", "0"]]
    assert model.index(0, 0).data(TIP) == "3 rounds: the fewest that can work"
    assert model.index(1, 0).data(TIP) == "4 rounds"
    assert model.index(0, 0).data(Qt.ItemDataRole.FontRole).bold()
    assert model.index(1, 0).data(Qt.ItemDataRole.FontRole) is None
    assert model.values()[1] == {"rounds": 4, "assignments": 24, "all_rounds_used": 0,
                                 "groupings": 0}
    assert model.headerData(2, Qt.Orientation.Horizontal, TIP) == (
        "Schedules in which every one of the K rounds holds a fixture")


def test_counts_model_shows_long_counts_short_and_every_digit_in_the_tooltip(qtbot):
    report = counting.CountReport(fixtures=30, clashes=40, pinned=False, min_rounds=5,
                                  min_rounds_bounds=(5, 5))
    big = 12345678901234567890
    report.rows = [counting.CountRow(5, assignments=big, all_rounds_used=1234567,
                                     groupings=engine.Estimate(2000, 1000, 3000, "draws"))]
    model = CountsModel()
    model.set_report(report)
    assert texts(model) == [["5", "1.23 × 10¹⁹ (20 digits)", "1,234,567",
                             "≈ 1,000–3,000 (estimate)"]]
    assert model.index(0, 1).data(TIP) == "12,345,678,901,234,567,890"
    assert model.value(0, 1) == big
    with warnings.catch_warnings():
        warnings.simplefilter("error")  # no role hands Qt an int longer than 64 bits
        for role in range(USER + 1):
            model.index(0, 1).data(role)
    assert model.index(0, 3).data(TIP) == (
        "estimate ~2,000: between 1,000 and 3,000 (draws); not an exact count")
    model.set_report(None)
    assert model.rowCount() == 0


def test_fixtures_model_shows_pins_ties_rounds_and_clashes(qtbot):
    fixtures = [Fixture("Otters v Herons", "Otters", "Herons", "Alder Green", "2", "U11",
                        played=True),
                Fixture("Wrens v Badgers", "Wrens", "Badgers")]
    model = FixturesModel()
    model.set_fixtures(fixtures, {"Otters v Herons": 2, "Wrens v Badgers": None},
                       {"Wrens v Badgers": ["Otters v Herons"]}, {"Otters v Herons": 2})
    assert texts(model) == [
        ["Otters v Herons", "Otters", "Herons", "Alder Green", "2", "U11", "2 (played)", "2",
         ""],
        ["Wrens v Badgers  (together)", "Wrens", "Badgers", "", "", "", "", "", ""]]
    assert model.index(1, 0).data(TIP) == "Together with Otters v Herons"
    assert model.index(1, 4).data(USER) == "Wrens v Badgers"
    with qtbot.waitSignal(model.dataChanged):
        model.set_clashes({"Wrens v Badgers": [Reason("team", "Wrens"),
                                               Reason("venue", "Millbrook")]})
    assert model.index(1, 8).data() == "team Wrens; venue Millbrook"
    assert model.index(1, 0).data(Qt.ItemDataRole.FontRole).bold()
    assert model.index(0, 0).data(Qt.ItemDataRole.FontRole) is None
    assert model.row_of == {"Otters v Herons": 0, "Wrens v Badgers": 1}


def test_reasons_model_ranks_and_marks_what_is_waived(qtbot):
    rows = [Waived("team Herons", "team", [("A", "B"), ("A", "C")], 10**20, 10**20 - 24, 2),
            Waived("venue Millbrook", "venue", [("B", "C")], 48, 24, None)]
    model = ReasonsModel()
    model.set_rows(rows, set())
    assert texts(model) == [
        ["team Herons", "team", "2", "1.00 × 10²⁰ (21 digits)",
         "4.17 × 10¹⁸ times as many schedules", "2", ""],
        ["venue Millbrook", "venue", "1", "48", "2 × as many schedules", "", ""]]
    assert model.index(0, 4).data(TIP) == "+99,999,999,999,999,999,976 schedules"
    assert model.index(0, 0).data(TIP) == "A – B\nA – C"
    with qtbot.waitSignal(model.dataChanged) as changed:
        model.set_waived({"venue Millbrook"})
    assert [changed.args[0].column(), changed.args[1].column()] == [6, 6]
    assert [model.index(r, 6).data() for r in range(2)] == ["", "yes"]


def test_sheet_model_numbers_rows_as_the_spreadsheet_and_finds_columns(qtbot):
    rows = [(1, ["Fixture", "Home", "Away"]), (4, [None, "Otters", "Herons"]),
            (6, ["#REF!"] + [None] * 26 + ["far"])]
    model = SheetModel(rows)
    assert model.columnCount() == 28
    assert [model.headerData(c, Qt.Orientation.Horizontal) for c in (0, 2, 25, 26, 27)] == [
        "A", "C", "Z", "AA", "AB"]
    assert [model.headerData(r, Qt.Orientation.Vertical) for r in range(3)] == ["1", "4", "6"]
    assert texts(model)[1][:3] == ["", "Otters", "Herons"]
    assert model.index(2, 27).data() == "far"
    assert (model.row_of(4), model.row_of(5)) == (1, -1)
    assert (model.column_of("away"), model.column_of("AB"), model.column_of("Venue")) == (
        2, 27, -1)


def test_problems_model_lists_problems_and_counts_them_in_words(qtbot):
    error = Problem("l.xlsx", "Home and Away are the same team", "Fixtures", 2, "Away")
    warning = Problem("l.xlsx", "no venue", "Fixtures", 3, severity="warning")
    icons = {"error": QIcon(), "warning": QIcon()}
    model = ProblemsModel(icons)
    assert model.heading() == "No problems found."
    model.set_problems([error, warning])
    assert model.rowCount() == 2
    assert model.index(0).data() == str(error)
    assert model.index(1).data(USER) is warning
    assert model.heading() == "Problems: 1 error, 1 warning (click one to go to it)"


def grid_model():
    fixtures = [Fixture("Otters v Herons", venue="Alder Green", pitch="2"),
                Fixture("Wrens v Badgers", venue="Alder Green", pitch="2"),
                Fixture("Kites v Owls"), Fixture("Herons v Wrens", venue="Millbrook")]
    schedule = Schedule(rounds=2, assignment={"Otters v Herons": 1, "Wrens v Badgers": 1,
                                              "Kites v Owls": 2, "Herons v Wrens": 2})
    broken = Violation("capacity", "two fixtures on Alder Green pitch 2 in round 1",
                       ("Otters v Herons", "Wrens v Badgers"), (1,))
    model = ScheduleGridModel()
    model.set_schedule(fixtures, schedule, ["Round 1\n2026-04-04", "Round 2"],
                       {"Kites v Owls": 2}, [broken])
    return model


def test_schedule_grid_model_lays_fixtures_out_by_round_and_venue(qtbot):
    model = grid_model()
    assert [model.headerData(c, Qt.Orientation.Horizontal) for c in range(3)] == [
        "Alder Green · 2", "Millbrook", "(no venue)"]
    assert [model.headerData(r, Qt.Orientation.Vertical) for r in range(2)] == [
        "Round 1\n2026-04-04", "Round 2"]
    assert texts(model) == [
        ["⚠ Otters v Herons\n⚠ Wrens v Badgers", "", ""],
        ["", "Herons v Wrens", "Kites v Owls  [pinned 2]"]]
    assert model.index(0, 0).data(USER) == ["Otters v Herons", "Wrens v Badgers"]
    assert model.chip_tip("Wrens v Badgers") == (
        "Wrens v Badgers\nround 1\ntwo fixtures on Alder Green pitch 2 in round 1")
    model.set_selection("Kites v Owls", {"Herons v Wrens": [Reason("team", "Owls")]})
    assert model.chip_tip("Herons v Wrens") == (
        "Herons v Wrens\nround 2\nclashes with the selected fixture: team Owls")


def test_a_fixture_dropped_on_a_cell_asks_to_move_to_its_round(qtbot):
    model = grid_model()
    move = Qt.DropAction.MoveAction
    with qtbot.waitSignal(model.moveRequested) as asked:
        assert model.dropMimeData(fixture_mime("Kites v Owls"), move, -1, -1, model.index(0, 1))
    assert asked.args == ["Kites v Owls", 1]
    assert not model.dropMimeData(fixture_mime("Kites v Owls"), move, -1, -1, QModelIndex())
    assert not model.dropMimeData(fixture_mime("Nobody v Anyone"), move, -1, -1,
                                  model.index(0, 1))
    assert model.flags(model.index(1, 2)) & Qt.ItemFlag.ItemIsDropEnabled


def test_the_chip_under_a_point_is_the_one_drawn_there(qtbot):
    metrics = QFontMetrics(QApplication.font())
    cell = QRect(100, 50, 200, 120)
    labels = ["Otters v Herons", "Wrens v Badgers"]
    first, second = chip_rects(cell, 2, metrics)
    assert first.bottom() < second.top() and cell.contains(second)
    assert chip_at(cell, labels, metrics, second.center()) == "Wrens v Badgers"
    assert chip_at(cell, labels, metrics, first.center()) == "Otters v Herons"
    assert chip_at(cell, labels, metrics, QPoint(150, 169)) is None

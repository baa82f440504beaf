"""The Teams and Venues tabs: each team's strip of rounds with breaks marked and the season
warnings, after a draw and at once after a fixture is moved by hand (and undone); the legend;
de Werra's round robin shows exactly its n - 2 breaks."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import shutil  # noqa: E402
from pathlib import Path  # noqa: E402

from PySide6.QtWidgets import QLabel, QWidget  # noqa: E402

from leaguegrid.app.seasons import team_seasons  # noqa: E402
from leaguegrid.core.model import Fixture, League, Schedule  # noqa: E402
from leaguegrid.core.round_robin import single_round_robin  # noqa: E402
from leaguegrid.gui.season_strip import BREAK_ROLE, SIDE_ROLE  # noqa: E402
from leaguegrid.gui.table_model import Role  # noqa: E402
from leaguegrid.gui.teams_model import TeamsModel  # noqa: E402

SMALL = Path(__file__).resolve().parents[2] / "demo_leagues" / "small.xlsx"
DRAWN = {"Otters v Badgers": 1, "Herons v Otters": 2, "Badgers v Herons": 3,
         "Herons v Wrens": 4, "Wrens v Badgers": 5, "Otters v Wrens": 6}  # 6 rounds, seed 7


def wait_idle(qtbot, win):
    qtbot.waitUntil(lambda: not win.runner.busy and not win._recount.isActive(), timeout=60_000)


def draw_small(qtbot, win, tmp_path):
    """The small demo league drawn in 6 rounds with seed 7 (as `plan --seed 7` does)."""
    path = tmp_path / "small.xlsx"
    shutil.copy(SMALL, path)
    win.open_path(str(path))
    qtbot.waitUntil(lambda: win.report is not None, timeout=30_000)
    wait_idle(qtbot, win)
    win._set_rounds(6, user=True)
    win.draw_schedule(7)
    wait_idle(qtbot, win)
    assert win.doc.schedule.assignment == DRAWN


def strips(model):
    """Team -> its strip as the table shows it, letter by letter."""
    out = {}
    for row in range(model.rowCount()):
        team = model.index(row, 0).data(Role.UserRole)
        out[team] = "".join(model.index(row, c).data() for c in range(model.columnCount())
                            if model.index(row, c).data(SIDE_ROLE) is not None)
    return out


def test_teams_tab_shows_the_warnings_after_a_draw_and_after_a_move(qtbot, window, tmp_path):
    draw_small(qtbot, window, tmp_path)
    view = window.teams_view
    assert window.tabs.tabText(window.tabs.indexOf(view)) == "Teams"
    assert view.summary.text() == "4 teams, 0 breaks, 3 warnings"
    assert view.warnings.text() == ("⚠ Herons have byes in rounds 5 and 6; ⚠ Otters have byes "
                                    "in rounds 3, 4 and 5; ⚠ Wrens have byes in rounds 1, 2 "
                                    "and 3")
    assert strips(view.model) == {"Badgers": "ABHBAB", "Herons": "BHAHBB",
                                  "Otters": "HABBBH", "Wrens": "BBBAHA"}
    assert view.model.columns[-6:] == ["Home", "Away", "Byes", "Breaks", "Longest run",
                                       "Warnings"]
    otters = view.model.row_of("Otters")
    assert view.model.index(otters, 0).data() == "⚠ Otters"
    assert view.model.index(otters, view.model.columnCount() - 1).data() == (
        "Otters have byes in rounds 3, 4 and 5")

    # a hand move: Badgers v Herons from round 3 to round 6 (no clash there)
    window.schedule_view.moveRequested.emit("Badgers v Herons", 6)
    assert view.summary.text() == "4 teams, 2 breaks, 3 warnings"
    assert view.warnings.text() == ("⚠ Badgers have byes in rounds 2, 3 and 4; ⚠ Otters have "
                                    "byes in rounds 3, 4 and 5; ⚠ Wrens have byes in rounds "
                                    "1, 2 and 3")
    assert strips(view.model) == {"Badgers": "ABBBA•H", "Herons": "BHBH•BA",
                                  "Otters": "HABBBH", "Wrens": "BBBAHA"}
    assert view.model.breaks_marked() == 2
    herons = view.model.row_of("Herons")
    fourth = view.model.index(herons, view.model.lead + 3)
    assert fourth.data(BREAK_ROLE) is True
    assert fourth.data(Role.AccessibleTextRole).endswith(
        ": home v Wrens at Millbrook Field; break: home again")
    assert list(team_seasons(window.doc.working_league(), window.doc.schedule).warnings) == [
        w.removeprefix("⚠ ") for w in view.warnings.text().split("; ")]

    window.act_undo.trigger()
    assert view.summary.text() == "4 teams, 0 breaks, 3 warnings"
    assert strips(view.model)["Badgers"] == "ABHBAB"


def test_the_selected_team_lists_its_rounds_and_stays_selected(qtbot, window, tmp_path):
    draw_small(qtbot, window, tmp_path)
    view = window.teams_view
    view.table.selectRow(view.model.row_of("Wrens"))
    assert view.heading.text() == ("Wrens: 1 home game, 2 away games, 3 byes; longest runs "
                                   "1 home, 1 away")
    rounds = view.rounds_model
    rows = [[rounds.index(r, c).data() for c in (0, 2, 3, 4)] for r in range(rounds.rowCount())]
    assert rows == [["1", "B  Bye", "", ""], ["2", "B  Bye", "", ""], ["3", "B  Bye", "", ""],
                    ["4", "A  Away", "Herons", "Millbrook Field"],
                    ["5", "H  Home", "Badgers", "Millbrook Field"],
                    ["6", "A  Away", "Otters", "Alder Green"]]
    window.schedule_view.moveRequested.emit("Badgers v Herons", 6)
    assert view.selected_team() == "Wrens"


def test_the_legend_names_every_colour_and_mark(qtbot, window):
    box = window.teams_view.findChild(QWidget, "seasonLegend")
    assert box is not None and box.accessibleName() == "Legend of the team strips"
    names = [w.accessibleName() for w in box.findChildren(QLabel)]
    assert names[::2] == ["H: home game", "A: away game", "B: bye (no game that round)",
                          "H•: • and a bar: a break, the same side as the team's game before "
                          "(byes skipped)"]
    assert window.teams_view.summary.text().startswith("No schedule yet")


def test_venues_tab_lists_each_venue_by_round(qtbot, window, tmp_path):
    draw_small(qtbot, window, tmp_path)
    view = window.venues_view
    box = view.venue_box
    assert [box.itemText(i) for i in range(box.count())] == [
        "Venue Alder Green", "Venue Millbrook Field", "Venue Stonecross Rec"]
    model = view.model
    cols = {name: i for i, name in enumerate(model.columns)}
    assert [(model.index(r, cols["Round"]).data(), model.index(r, cols["Fixtures"]).data())
            for r in range(model.rowCount())] == [("1", "Otters v Badgers"),
                                                  ("6", "Otters v Wrens")]
    assert view.count.text() == "2 fixtures"
    box.setCurrentIndex(2)
    window.schedule_view.moveRequested.emit("Badgers v Herons", 6)
    assert box.currentText() == "Venue Stonecross Rec"
    assert model.index(0, cols["Round"]).data() == "6"


def test_de_werra_round_robin_shows_exactly_n_minus_2_breaks(qtbot):
    # de Werra, "Scheduling in sports" (1981): n - 2 breaks for n even, by the circle method
    n = 8
    fixtures, assignment = [], {}
    for r, games in enumerate(single_round_robin(n), start=1):
        for h, a in games:
            label = f"T{h + 1} v T{a + 1}"
            fixtures.append(Fixture(label, home=f"T{h + 1}", away=f"T{a + 1}"))
            assignment[label] = r
    league = League(name="Circle", source="test", fixtures=fixtures)
    model = TeamsModel()
    model.set_seasons(team_seasons(league, Schedule(n - 1, assignment)))
    cells = [model.index(r, c) for r in range(model.rowCount())
             for c in range(model.columnCount())]
    marked = [i for i in cells if i.data(BREAK_ROLE)]
    assert len(marked) == n - 2 == model.breaks_marked()
    assert all(i.data().endswith("•") for i in marked)
    assert sum("•" in (i.data() or "") for i in cells) == n - 2
    breaks = model.columns.index("Breaks")
    assert sum(int(model.index(r, breaks).data()) for r in range(model.rowCount())) == n - 2

"""`leaguegrid plan --keep PREVIOUS.csv`: planning again after a ground closes, keeping the
schedule published before where every rule allows, and saying what moved for each club."""

from __future__ import annotations

import csv
import json
import shutil
from pathlib import Path

import openpyxl

DEMO = Path(__file__).resolve().parents[2] / "demo_leagues"


def rounds_in(path: Path) -> dict[str, int]:
    with path.open(newline="", encoding="utf-8-sig") as handle:
        return {row["Fixture"]: int(row["Round"]) for row in csv.DictReader(handle)}


def test_nothing_changed_keeps_every_fixture_where_it_was(cli, tmp_path) -> None:
    book = shutil.copy(DEMO / "season.xlsx", tmp_path / "season.xlsx")
    before = tmp_path / "before.csv"
    assert cli("plan", str(book), "--rounds", "6", "--seed", "3", "--csv", str(before))[0] == 0
    code, out, _ = cli("plan", str(book), "--rounds", "6", "--seed", "8", "--keep", str(before),
                       "--csv", str(tmp_path / "after.csv"))
    assert code == 0
    assert "re-planned from the previous schedule: 0 of 30 fixtures moved" in out
    assert "Changes: none; every fixture is where it was" in out
    assert rounds_in(tmp_path / "after.csv") == rounds_in(before)


def test_a_closed_ground_moves_its_fixtures_and_names_the_changes_by_club(cli, tmp_path) -> None:
    book = shutil.copy(DEMO / "season.xlsx", tmp_path / "season.xlsx")
    before = tmp_path / "before.csv"
    cli("plan", str(book), "--rounds", "6", "--seed", "3", "--csv", str(before))
    wb = openpyxl.load_workbook(book)
    sheet = wb.create_sheet("Blocked")
    sheet.append(["Venue", "Round", "Reason"])
    sheet.append(["Rookham Lane", 1, "waterlogged"])
    wb.save(book)
    code, out, _ = cli("plan", str(book), "--rounds", "6", "--seed", "3", "--keep", str(before),
                       "--json", "--csv", str(tmp_path / "after.csv"))
    assert code == 0
    data = json.loads(out)
    after, old = rounds_in(tmp_path / "after.csv"), rounds_in(before)
    # checked here: nothing at Rookham Lane in round 1, a team once a round
    assert not [f for f in data["fixtures"] if f["venue"] == "Rookham Lane" and f["round"] == 1]
    seen = [(t, f["round"]) for f in data["fixtures"] for t in (f["home"], f["away"])]
    assert len(seen) == len(set(seen))
    moved = {label for label in after if after[label] != old[label]}
    assert {m["label"] for m in data["moved"]} == moved and 0 < len(moved) < 30
    assert all(m["before"] == old[m["label"]] and m["after"] == after[m["label"]]
               for m in data["moved"])
    listed = {line.split(":")[0] for lines in data["changes_by_club"].values() for line in lines}
    assert listed == moved
    assert any(line.startswith("Rookham U14 v Kestrelmoor U14: Round 1 2027-09-04 -> ")
               for line in data["changes_by_club"]["Rookham"]) == (
        "Rookham U14 v Kestrelmoor U14" in moved)


def test_a_previous_schedule_with_unknown_fixtures_is_refused_row_by_row(cli, tmp_path) -> None:
    book = shutil.copy(DEMO / "small.xlsx", tmp_path / "small.xlsx")
    previous = tmp_path / "old.csv"
    previous.write_text("Round,Fixture\n1,Herons v Otters\nx,Otters v Badgers\n2,Nobody v Wrens\n",
                        encoding="utf-8")
    code, _, err = cli("plan", str(book), "--rounds", "5", "--keep", str(previous))
    assert code == 1  # input problems
    assert "old.csv, row 3, column Round: 'x': not a round number" in err
    assert "old.csv, row 4, column Fixture: 'Nobody v Wrens': not a fixture of this league" in err

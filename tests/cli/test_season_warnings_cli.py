"""`leaguegrid plan` ends with the season warnings: a league pinned round by round in a CSV, so
the schedule (and every warning) is known beforehand; the same sentences in `--json`."""

from __future__ import annotations

import json

ROWS = """Home,Away,Venue,Round
Wrens,Kites,Wrens ground,1
Otters,Herons,Otters ground,1
Herons,Badgers,Herons ground,2
Herons,Wrens,Herons ground,3
Otters,Wrens,Otters ground,4
Badgers,Wrens,Badgers ground,5
Badgers,Otters,Badgers ground,6
Kites,Herons,Kites ground,6
"""
# worked out by hand from the rows: Wrens H B A A A B, Kites A B B B B H, ...
WARNINGS = [
    "Badgers have byes in rounds 3 and 4",
    "Herons have byes in rounds 4 and 5",
    "Kites have byes in rounds 2, 3, 4 and 5",
    "Otters have byes in rounds 2 and 3",
    "Wrens play away in rounds 3, 4 and 5",
    "Wrens play 1 home game and 3 away games",
    "Byes are unequal: Kites have 4 byes, Herons 2",
]


def test_plan_ends_with_the_season_warnings(cli, tmp_path):
    book = tmp_path / "pinned.csv"
    book.write_text(ROWS, encoding="utf-8")
    code, out, _ = cli("plan", str(book), "--rounds", "6", "--seed", "1")
    assert code == 0
    lines = out.splitlines()
    at = lines.index("Season warnings (7):")
    assert lines[at - 3:at] == ["  Badgers v Otters at Badgers ground",
                                "  Kites v Herons at Kites ground", ""]
    assert lines[at + 1:] == [f"  {w}" for w in WARNINGS]
    code, out, _ = cli("plan", str(book), "--rounds", "6", "--seed", "1", "--json")
    assert code == 0
    assert json.loads(out)["warnings"] == WARNINGS


def test_a_season_without_complaints_says_so(cli, round_robin):
    code, out, _ = cli("plan", str(round_robin(6)), "--rounds", "5", "--seed", "2")
    assert code == 0
    assert out.splitlines()[-1] == "Season warnings: none"

"""iCalendar files parsed back by a small RFC 5545 reader written here: every fixture once, dates
and times right, stable event identifiers, folding and escaping to the RFC, no clash reasons."""

from __future__ import annotations

import datetime as dt
import random
import re
from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from leaguegrid.core.model import ClashRow, Fixture, League, RoundInfo, Schedule, Settings, Team
from leaguegrid.core.wording import CAUTION
from leaguegrid.io.write.atomic import InputOverwriteError
from leaguegrid.io.write.ics import IcsError, escape_text, fixture_uids, fold_line, write_ics_files
from leaguegrid.scheduling.dates import date_schedule

NOW = dt.datetime(2025, 8, 1, 12, 0, tzinfo=dt.UTC)
LATER = dt.datetime(2025, 8, 2, 9, 30, tzinfo=dt.UTC)
SLOT_DAY = dt.date(2025, 7, 5)  # summer: Europe/Berlin is UTC+2 (CEST)
WINTER_DAY = dt.date(2025, 1, 11)  # winter: Europe/Berlin is UTC+1 (CET)
REASON = "Family of Ilse B. (two children)"


# --- a small RFC 5545 reader (section 3.1: unfolding, content lines; 3.3.11: TEXT) ----------

def unfold(data: bytes) -> list[str]:
    """Content lines: CRLF followed by one space or tab continues the previous line (3.1)."""
    text = data.decode("utf-8")
    assert "\n" not in text.replace("\r\n", "")  # bare LF is not a line end in iCalendar
    return re.sub(r"\r\n[ \t]", "", text).split("\r\n")[:-1]


def unescape(value: str) -> str:
    return re.sub(r"\\([\\;,nN])", lambda m: "\n" if m[1] in "nN" else m[1], value)


def parse(data: bytes) -> dict:
    """{'props': calendar properties, 'events': [ {name: (params, value)} ]}."""
    cal: dict = {"props": {}, "events": []}
    stack: list[str] = []
    current: dict | None = None
    for line in unfold(data):
        head, _, value = line.partition(":")
        name, *params = head.split(";")
        if name == "BEGIN":
            stack.append(value)
            if value == "VEVENT":
                current = {}
            continue
        if name == "END":
            assert stack.pop() == value
            if value == "VEVENT":
                cal["events"].append(current)
                current = None
            continue
        target = current if current is not None else cal["props"]
        assert name not in target, f"{name} repeated"
        target[name] = (tuple(params), value)
    assert stack == []
    return cal


def event_start(ev: dict) -> dt.datetime | dt.date:
    params, value = ev["DTSTART"]
    if params == ("VALUE=DATE",):
        return dt.datetime.strptime(value, "%Y%m%d").date()
    assert params == () and value.endswith("Z")
    return dt.datetime.strptime(value, "%Y%m%dT%H%M%SZ").replace(tzinfo=dt.UTC)


def event_end(ev: dict) -> dt.datetime | dt.date:
    return event_start({"DTSTART": ev["DTEND"]})


# --- leagues -------------------------------------------------------------------------------

def season_league(source: str = "") -> tuple[League, Schedule]:
    """Four teams, a double round-robin, matchdays from Settings (all-day events)."""
    names = ["Heron, Reds", "Wren; Blues", "Otter\\Burn", "=Hawks"]
    clubs = {"Heron, Reds": "Heron Vale", "Wren; Blues": "Heron Vale", "Otter\\Burn": "Otter Rise"}
    rounds_first = [[(0, 1), (2, 3)], [(0, 2), (3, 1)], [(3, 0), (1, 2)]]
    fixtures, assignment = [], {}
    for leg in (1, 2):
        for r, games in enumerate(rounds_first, start=1):
            for h, a in games:
                home, away = (names[h], names[a]) if leg == 1 else (names[a], names[h])
                label = f"{home} v {away}"
                fixtures.append(Fixture(label, home, away, venue=f"{home} Ground", leg=leg))
                assignment[label] = r + 3 * (leg - 1)
    league = League(
        name="Fenwick Vale Juniors",
        source=source,
        fixtures=fixtures,
        teams={t: Team(t, "U12", f"{t} Ground", clubs.get(t)) for t in names},
        clash_rows=[ClashRow("a", "b", REASON, 2, [(fixtures[0].label, fixtures[2].label)])],
        settings=Settings(start_date=dt.date(2025, 9, 6), skip=(dt.date(2025, 9, 13),)),
    )
    return league, Schedule(6, assignment, seed=7)


def clubday_league(day: dt.date = SLOT_DAY) -> tuple[League, Schedule]:
    """Time slots on one day at 09:00, 09:45, 10:30; pitches; the zone set to Europe/Berlin."""
    rounds = [RoundInfo(1, day, dt.time(9, 0)), RoundInfo(2, day, dt.time(9, 45)),
              RoundInfo(3, day, dt.time(10, 30))]
    fixtures = [
        Fixture("Kite U8 v Linnet U8", "Kite U8", "Linnet U8", "Brackenhill Park", "Pitch 1"),
        Fixture("Kite U9 v Linnet U9", "Kite U9", "Linnet U9", "Brackenhill Park", "Pitch 2"),
        Fixture("Kite U8 v Tarn U8", "Kite U8", "Tarn U8", "Brackenhill Park", "Pitch 1"),
        Fixture("Festival warm-up", venue="Brackenhill Park"),
    ]
    assignment = {"Kite U8 v Linnet U8": 1, "Kite U9 v Linnet U9": 1, "Kite U8 v Tarn U8": 3,
                  "Festival warm-up": 2}
    league = League(
        name="Kite Saturday", source="", fixtures=fixtures, rounds=rounds, rounds_fixed=True,
        teams={"Kite U8": Team("Kite U8", club="Kite"), "Kite U9": Team("Kite U9", club="Kite")},
        settings=Settings(time_zone="Europe/Berlin"),
    )
    return league, Schedule(3, assignment)


def export(folder: Path, league: League, schedule: Schedule, now=NOW) -> dict[str, dict]:
    paths = write_ics_files(folder, date_schedule(league, schedule, now=now))
    return {p.name: parse(p.read_bytes()) for p in paths}


# --- tests ---------------------------------------------------------------------------------

def test_files_one_per_team_one_per_club_and_the_league(tmp_path):
    league, schedule = season_league()
    cals = export(tmp_path, league, schedule)
    assert sorted(cals) == [
        "club-Heron Vale.ics", "club-Otter Rise.ics", "league-Fenwick Vale Juniors.ics",
        "team-=Hawks.ics", "team-Heron, Reds.ics", "team-Otter_Burn.ics", "team-Wren; Blues.ics",
    ]
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted(cals)  # no temporaries left


def test_every_fixture_once_with_its_round_date(tmp_path):
    league, schedule = season_league()
    cals = export(tmp_path, league, schedule)
    # Start 2025-09-06, every 7 days, 2025-09-13 skipped
    dates = {1: "20250906", 2: "20250920", 3: "20250927", 4: "20251004", 5: "20251011",
             6: "20251018"}
    events = cals["league-Fenwick Vale Juniors.ics"]["events"]
    summaries = [unescape(ev["SUMMARY"][1]) for ev in events]
    assert sorted(summaries) == sorted(f.label for f in league.fixtures)
    for ev in events:
        label = unescape(ev["SUMMARY"][1])
        r = schedule.assignment[label]
        assert ev["DTSTART"] == (("VALUE=DATE",), dates[r])
        assert event_end(ev) - event_start(ev) == dt.timedelta(days=1)
        assert ev["DTSTAMP"] == ((), "20250801T120000Z")
    for team in league.teams:
        name = "team-" + team.replace("\\", "_") + ".ics"
        got = sorted(unescape(ev["SUMMARY"][1]) for ev in cals[name]["events"])
        assert got == sorted(f.label for f in league.fixtures if team in f.teams)
        starts = [event_start(ev) for ev in cals[name]["events"]]
        assert starts == sorted(starts)
    heron_vale = [unescape(ev["SUMMARY"][1]) for ev in cals["club-Heron Vale.ics"]["events"]]
    assert len(heron_vale) == 10 and len(set(heron_vale)) == 10  # the derby only once per leg


def test_no_two_events_of_a_team_on_one_round(tmp_path):
    league, schedule = season_league()
    cals = export(tmp_path, league, schedule)
    for name, cal in cals.items():
        if name.startswith("team-"):
            starts = [event_start(ev) for ev in cal["events"]]
            assert len(starts) == len(set(starts))


def test_time_slots_in_utc_with_slot_lengths(tmp_path):
    league, schedule = clubday_league()
    cals = export(tmp_path, league, schedule)
    events = {unescape(ev["SUMMARY"][1]): ev for ev in cals["league-Kite Saturday.ics"]["events"]}
    utc = dt.UTC
    # 09:00 CEST = 07:00 UTC; a slot lasts until the next slot (45 min); the last slot as long
    # as the one before it
    assert event_start(events["Kite U8 v Linnet U8"]) == dt.datetime(2025, 7, 5, 7, 0, tzinfo=utc)
    assert event_end(events["Kite U8 v Linnet U8"]) == dt.datetime(2025, 7, 5, 7, 45, tzinfo=utc)
    assert event_start(events["Festival warm-up"]) == dt.datetime(2025, 7, 5, 7, 45, tzinfo=utc)
    assert event_start(events["Kite U8 v Tarn U8"]) == dt.datetime(2025, 7, 5, 8, 30, tzinfo=utc)
    assert event_end(events["Kite U8 v Tarn U8"]) == dt.datetime(2025, 7, 5, 9, 15, tzinfo=utc)
    assert unescape(events["Kite U9 v Linnet U9"]["LOCATION"][1]) == "Brackenhill Park, Pitch 2"
    assert cals["league-Kite Saturday.ics"]["props"]["X-WR-TIMEZONE"] == ((), "Europe/Berlin")


def test_winter_offset(tmp_path):
    league, schedule = clubday_league(WINTER_DAY)
    cals = export(tmp_path, league, schedule)
    ev = next(e for e in cals["team-Kite U9.ics"]["events"])
    assert event_start(ev) == dt.datetime(2025, 1, 11, 8, 0, tzinfo=dt.UTC)  # 09:00 CET


def test_team_without_fixtures_gets_no_file(tmp_path):
    league, schedule = season_league()
    league.teams["Idle Rovers"] = Team("Idle Rovers", "U12", club="Idle")
    cals = export(tmp_path, league, schedule)
    assert not any("Idle" in name for name in cals)
    assert all(cal["events"] for cal in cals.values())


def test_fixture_without_teams_only_in_the_league_file(tmp_path):
    league, schedule = clubday_league()
    cals = export(tmp_path, league, schedule)
    for name, cal in cals.items():
        labels = [unescape(ev["SUMMARY"][1]) for ev in cal["events"]]
        assert ("Festival warm-up" in labels) == name.startswith("league-")
    assert sorted(cals) == ["club-Kite.ics", "league-Kite Saturday.ics", "team-Kite U8.ics",
                            "team-Kite U9.ics", "team-Linnet U8.ics", "team-Linnet U9.ics",
                            "team-Tarn U8.ics"]


def uids_by_label(cals: dict[str, dict]) -> dict[str, str]:
    out: dict[str, str] = {}
    for cal in cals.values():
        for ev in cal["events"]:
            label, uid = unescape(ev["SUMMARY"][1]), ev["UID"][1]
            assert out.setdefault(label, uid) == uid  # one UID per fixture in every file
    return out


def test_uids_unique_and_stable_across_exports_and_reordering(tmp_path):
    league, schedule = season_league()
    first = uids_by_label(export(tmp_path / "a", league, schedule))
    assert len(set(first.values())) == len(league.fixtures)
    second = uids_by_label(export(tmp_path / "b", league, schedule, now=LATER))
    assert second == first
    shuffled, _ = season_league()
    random.Random(3).shuffle(shuffled.fixtures)
    reordered = Schedule(6, dict(sorted(schedule.assignment.items(), reverse=True)))
    third = uids_by_label(export(tmp_path / "c", shuffled, reordered, now=LATER))
    assert third == first


def test_uid_keys_ignore_case_and_spacing(tmp_path):
    league, schedule = season_league()
    base = uids_by_label(export(tmp_path / "a", league, schedule))
    for f in league.fixtures:
        f.home = "  " + f.home.upper().replace(" ", "   ")
    again = uids_by_label(export(tmp_path / "b", league, schedule))
    assert again == base


def test_same_pairing_twice_gets_two_uids():
    fixtures = [Fixture("A v B", "A", "B", leg=1), Fixture("A v B (2)", "A", "B", leg=2),
                Fixture("C v D", "C", "D"), Fixture("C v D (2)", "C", "D")]
    league = League(name="L", source="", fixtures=fixtures)
    uids = fixture_uids(league)
    assert len(set(uids.values())) == 4
    league.fixtures.reverse()
    assert fixture_uids(league) == uids


def test_return_leg_keeps_its_uid_when_rows_are_reordered():
    # The reader numbers legs in sheet order: moving "B v A" above "A v B" swaps their legs,
    # and the identifiers must not follow.
    first = [Fixture("A v B", "A", "B", leg=1), Fixture("B v A", "B", "A", leg=2)]
    league = League(name="L", source="", fixtures=first)
    uids = fixture_uids(league)
    assert len(set(uids.values())) == 2
    swapped = [Fixture("B v A", "B", "A", leg=1), Fixture("A v B", "A", "B", leg=2)]
    assert fixture_uids(League(name="L", source="", fixtures=swapped)) == uids


def test_lines_folded_at_75_octets_and_text_escaped(tmp_path):
    league, schedule = season_league()
    long = "Übermäßig Lange Mannschaftsbezeichnung Der Südlichen Wasserläufer, Zweite; Dritte"
    old = league.fixtures[0].label
    league.fixtures[0].label = long
    league.fixtures[0].venue = "Line one\nline two"
    schedule.assignment[long] = schedule.assignment.pop(old)
    paths = write_ics_files(tmp_path, date_schedule(league, schedule, now=NOW))
    for path in paths:
        data = path.read_bytes()
        assert data.endswith(b"\r\n")
        assert all(len(line) <= 75 for line in data.split(b"\r\n"))
    cal = parse((tmp_path / "league-Fenwick Vale Juniors.ics").read_bytes())
    ev = next(e for e in cal["events"] if unescape(e["SUMMARY"][1]) == long)
    assert ev["SUMMARY"][1] == escape_text(long)
    assert unescape(ev["LOCATION"][1]) == "Line one\nline two"


def test_escape_and_fold_examples():
    # RFC 5545 3.3.11: backslash, semicolon, comma and newline are escaped in TEXT
    assert escape_text("a\\b;c,d\ne\r\nf") == "a\\\\b\\;c\\,d\\ne\\nf"
    assert fold_line("X" * 75) == "X" * 75
    assert fold_line("X" * 76) == "X" * 75 + "\r\n X"
    folded = fold_line("D:" + "é" * 80)  # two octets each: never split inside a character
    assert all(len(p.encode()) <= 75 for p in folded.split("\r\n"))
    assert folded.replace("\r\n ", "") == "D:" + "é" * 80


def test_control_characters_become_spaces():
    # RFC 5545 3.3.11: TEXT holds no control characters other than tab
    assert escape_text("a\x07b\x0bc\td") == "a b c\td"


@settings(max_examples=300, deadline=None)
@given(
    st.text(
        alphabet=st.characters(blacklist_categories=("Cc", "Cs")) | st.sampled_from("\n\t,;\\:"),
        max_size=300,
    )
)
def test_escape_fold_round_trip(text):
    line = "DESCRIPTION:" + escape_text(text)
    folded = fold_line(line) + "\r\n"
    assert all(len(piece.encode()) <= 75 for piece in folded.split("\r\n"))
    (back,) = unfold(folded.encode())
    assert unescape(back.partition(":")[2]) == text


def test_caution_and_no_clash_reasons(tmp_path):
    league, schedule = season_league()
    for path in write_ics_files(tmp_path, date_schedule(league, schedule, now=NOW)):
        data = path.read_bytes()
        cal = parse(data)
        assert unescape(cal["props"]["X-WR-CALDESC"][1]) == CAUTION
        assert all(unescape(ev["DESCRIPTION"][1]).endswith(CAUTION) for ev in cal["events"])
        assert b"Ilse" not in data
        assert cal["props"]["VERSION"] == ((), "2.0")


def test_rounds_without_dates_cannot_be_exported(tmp_path):
    league, schedule = season_league()
    league.settings.start_date = None
    with pytest.raises(IcsError) as err:
        write_ics_files(tmp_path / "out", date_schedule(league, schedule, now=NOW))
    assert str(err.value) == (
        "rounds without a date cannot be exported to iCalendar (round 1, 2, 3, 4, 5, 6): give "
        "the Rounds sheet a Date for every round, or set Start date in Settings"
    )
    assert not (tmp_path / "out").exists()


def test_never_overwrites_the_input(tmp_path):
    source = tmp_path / "team-=Hawks.ics"
    source.write_bytes(b"not really a league")
    league, schedule = season_league(source=str(source))
    with pytest.raises(InputOverwriteError):
        write_ics_files(tmp_path, date_schedule(league, schedule, now=NOW))
    assert source.read_bytes() == b"not really a league"
    assert [p.name for p in tmp_path.iterdir()] == ["team-=Hawks.ics"]


# --- the demo leagues, loaded by the reader, planned and exported --------------------------

DEMO_DIR = Path(__file__).resolve().parents[3] / "demo_leagues"


@pytest.mark.parametrize(("name", "rounds"), [("clubday.xlsx", 6), ("season.xlsx", 6)])
def test_demo_league_calendars(tmp_path, name, rounds):
    from leaguegrid.clashes.graph import build_clash_graph
    from leaguegrid.io.read.league_reader import load_league
    from leaguegrid.scheduling.draw import plan

    league = load_league(DEMO_DIR / name).league
    graph = build_clash_graph(league)
    schedule = plan(league, graph, rounds, seed=5).schedule
    cals = export(tmp_path, league, schedule)
    everything = next(cal for n, cal in cals.items() if n.startswith("league-"))
    events = {unescape(ev["SUMMARY"][1]): ev for ev in everything["events"]}
    assert sorted(events) == sorted(f.label for f in league.fixtures)
    starts: dict[object, list[str]] = {}
    for label, ev in events.items():
        starts.setdefault(event_start(ev), []).append(label)
    for labels in starts.values():  # one start per round: no clash inside a start time
        assert not any(graph.has_edge(a, b) for a in labels for b in labels if a < b)
    def in_round(n: int) -> list[dict]:
        return [ev for label, ev in events.items() if schedule.assignment[label] == n]

    if name == "clubday.xlsx":  # 2027-10-02 in Europe/London is BST, UTC+1; slots of 50 min
        first = in_round(1)
        assert {event_start(ev) for ev in first} == {dt.datetime(2027, 10, 2, 8, 0, tzinfo=dt.UTC)}
        assert {event_end(ev) for ev in first} == {dt.datetime(2027, 10, 2, 8, 50, tzinfo=dt.UTC)}
    else:  # Start 2027-09-04, every 7 days (the first Skip date, 2027-10-23, is round 8's step)
        assert {event_start(ev) for ev in in_round(6)} == {dt.date(2027, 10, 9)}
    data = b"".join(p.read_bytes() for p in tmp_path.iterdir())
    for clash in league.clash_rows:
        assert clash.reason.encode() not in data
    assert len(cals) == 1 + len(league.teams) + len({t.club for t in league.teams.values()})


def test_event_ids_survive_renaming_moving_and_reordering_the_workbook(tmp_path, workbook):
    # Without a League setting, an event's id comes from its division and teams only.
    from leaguegrid.io.read.league_reader import load_league

    rows = [("Home", "Away", "Venue", "Division"), ("Herons", "Otters", "Mill", "U9"),
            ("Wrens", "Badgers", "Alder", "U9"), ("Otters", "Herons", "Alder", "U9")]
    first = workbook("autumn.xlsx", {"Fixtures": rows})
    (tmp_path / "elsewhere").mkdir()
    moved = workbook("elsewhere/renamed.xlsx", {"Fixtures": [rows[0], *reversed(rows[1:])]})
    before = fixture_uids(load_league(first).league)
    after = fixture_uids(load_league(moved).league)
    assert before == after and len(set(before.values())) == 3

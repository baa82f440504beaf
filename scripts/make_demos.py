"""Write the demo league workbooks (an invented scenario: every club, ground and person is made up).

    python scripts/make_demos.py [--out FOLDER]

The content is fixed (no randomness), so rebuilding gives the same sheets and cells.

- small.xlsx      four teams, six fixtures, a shared ground, a Clashes row, a pin: small enough
                  to check every count by hand.
- clubday.xlsx    one club's Saturday: six age groups, four pitches, time slots as rounds,
                  coaches, families and a referee shared between age groups.
- season.xlsx     two six-team divisions whose clubs share home grounds, fixtures generated
                  from the Teams sheet, dates from Start date, Every and Skip.
- bigseason.xlsx  a ten-team division playing home and away (90 fixtures), two teams sharing a
                  ground: its full polynomial is beyond exact reach, so counts are estimates.
- association.xlsx  an association's season: eight divisions of ten teams, home and away with
                  a return half (720 fixtures); clubs with teams in several divisions share
                  grounds of two or three pitches, two clubs field two teams in one division on
                  a one-pitch ground, neighbouring grounds share a car park (Clashes), grounds
                  are let out on some dates (Blocked), holidays are skipped.
- schedules.xlsx  the schedule rules: played fixtures, ties, splits, blocked rounds, a ground
                  with two pitches, distances, home and away runs, return half.
"""

from __future__ import annotations

import argparse
import datetime as dt
import sys
from collections.abc import Callable, Sequence
from pathlib import Path

from openpyxl import Workbook
from openpyxl.styles import Font
from openpyxl.utils import get_column_letter

try:
    from leaguegrid.io.write.atomic import atomic_write
except ImportError:  # run from a checkout without the package installed
    sys.path.insert(0, str(Path(__file__).resolve().parent.parent))
    from leaguegrid.io.write.atomic import atomic_write

HERE = Path(__file__).resolve().parent.parent / "demo_leagues"
Rows = Sequence[Sequence[object]]
FIXED_TIME = dt.datetime(2025, 1, 1, 12, 0)  # workbook properties, so rebuilds match


def add_sheet(wb: Workbook, title: str, header: Sequence[str], rows: Rows) -> None:
    """A sheet with a bold header row, dates and times formatted, columns wide enough."""
    ws = wb.create_sheet(title)
    ws.append(list(header))
    for cell in ws[1]:
        cell.font = Font(bold=True)
    for row in rows:
        ws.append([None if value == "" else value for value in row])
    for column in ws.iter_cols(min_row=2):
        for cell in column:
            if isinstance(cell.value, dt.time):
                cell.number_format = "hh:mm"
            elif isinstance(cell.value, dt.date):
                cell.number_format = "yyyy-mm-dd"
    for i, name in enumerate(header, start=1):
        values = [name] + [str(r[i - 1]) for r in rows if i - 1 < len(r) and r[i - 1] is not None]
        ws.column_dimensions[get_column_letter(i)].width = min(max(map(len, values)) + 2, 60)
    ws.freeze_panes = "A2"


def save(wb: Workbook, path: Path) -> None:
    """Save through a temporary file in the same folder, with fixed document properties."""
    wb.properties.creator = "LeagueGrid demo generator"
    wb.properties.created = FIXED_TIME
    with atomic_write(path, "wb") as handle:
        wb.save(handle)


def new_workbook() -> Workbook:
    wb = Workbook()
    wb.remove(wb.active)
    return wb


def settings_rows(**values: object) -> list[tuple[str, object]]:
    """Settings rows from keyword arguments (start_date -> "Start date")."""
    return [(key.replace("_", " ").capitalize(), value) for key, value in values.items()]


# --- small.xlsx ------------------------------------------------------------------------------

def small() -> Workbook:
    """Four teams, six fixtures. Herons and Wrens share Millbrook Field: "Herons v Otters" and
    "Wrens v Badgers" then clash, so the three-round schedules of four teams lose one of their
    three pairings and four rounds are the fewest. The Clashes row states a clash that the
    shared ground already makes: one clash edge with two reasons, counts unchanged."""
    wb = new_workbook()
    add_sheet(wb, "Fixtures", ["Fixture", "Home", "Away", "Venue", "Round", "Notes"], [
        ("Herons v Wrens", "Herons", "Wrens", "Millbrook Field", None, ""),
        ("Otters v Badgers", "Otters", "Badgers", "Alder Green", 1, "Opening day at Alder Green"),
        ("Herons v Otters", "Herons", "Otters", "Millbrook Field", None, ""),
        ("Wrens v Badgers", "Wrens", "Badgers", "Millbrook Field", None, ""),
        ("Otters v Wrens", "Otters", "Wrens", "Alder Green", None, ""),
        ("Badgers v Herons", "Badgers", "Herons", "Stonecross Rec", None, ""),
    ])
    add_sheet(wb, "Clashes", ["First", "Second", "Reason"], [
        ("Herons v Otters", "Wrens v Badgers", "One set of goals at Millbrook Field"),
    ])
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Fenwick Vale Under-11s", start_date=dt.date(2027, 9, 4), every=7,
    ))
    return wb


# --- clubday.xlsx ----------------------------------------------------------------------------

CLUB = "Brackenlow"
GROUND = "Brackenlow Park"
CLUBDAY = dt.date(2027, 10, 2)
AGE_GROUPS = ("U8", "U9", "U10", "U11", "U12", "U14")


def clubday() -> Workbook:
    """Brackenlow's Saturday: 24 fixtures on four pitches in up to eight 50-minute slots.

    U8 and U9 play festival round-robins on the two mini pitches; U10 and U11 share Pitch 3,
    U12 and U14 share Pitch 4. Coaches and families link age groups (Clashes rows naming
    teams), and a Referee column (a Shared column) links the older groups' fixtures."""
    b = CLUB
    plan: list[tuple[str, str, str, str | None]] = []  # home, away, pitch, referee

    def festival(teams: list[str], pitch: str) -> None:
        for i in range(len(teams)):
            for j in range(i + 1, len(teams)):
                plan.append((teams[i], teams[j], pitch, None))

    festival([f"{b} U8 Kites", f"{b} U8 Larks", "Linnetbeck U8", "Tarnwater U8"], "Mini 1")
    festival([f"{b} U9 Swifts", f"{b} U9 Martins", "Corvid Rise U9", "Ouselmere U9"], "Mini 2")
    festival([f"{b} U10", "Heronsgill U10", "Wrenhollow U10"], "Pitch 3")
    plan += [
        (f"{b} U11", "Ouselmere U11", "Pitch 3", "Sol V."),
        (f"{b} U11", "Linnetbeck U11", "Pitch 3", "Dara M."),
        ("Linnetbeck U11", "Ouselmere U11", "Pitch 3", "Dara M."),
        (f"{b} U12", "Heronsgill U12", "Pitch 4", "Sol V."),
        (f"{b} U12", "Wrenhollow U12", "Pitch 4", "Ines K."),
        ("Heronsgill U12", "Wrenhollow U12", "Pitch 4", "Ines K."),
        (f"{b} U14", "Tarnwater U14", "Pitch 4", "Sol V.; Ines K."),
        (f"{b} U14", "Corvid Rise U14", "Pitch 4", "Dara M."),
        ("Tarnwater U14", "Corvid Rise U14", "Pitch 4", "Ines K."),
    ]
    def age(team: str) -> str:
        return next(word for word in team.split() if word in AGE_GROUPS)

    fixtures = [
        (f"{h} v {a}", h, a, GROUND, pitch, age(h), ref or "") for h, a, pitch, ref in plan
    ]
    own_teams = sorted({t for _, h, a, *_ in fixtures for t in (h, a) if t.startswith(b)})
    visitors = sorted({t for _, h, a, *_ in fixtures for t in (h, a) if not t.startswith(b)})
    teams = [(t, GROUND, age(t), b) for t in own_teams]
    teams += [(t, None, age(t), t.rsplit(" ", 1)[0]) for t in visitors]
    first_slot = dt.datetime.combine(CLUBDAY, dt.time(9, 0))
    slots = [
        (n, CLUBDAY, (first_slot + dt.timedelta(minutes=50 * (n - 1))).time(),
         "Gates open at 08:30" if n == 1 else None)
        for n in range(1, 9)
    ]
    wb = new_workbook()
    add_sheet(wb, "Fixtures",
              ["Fixture", "Home", "Away", "Venue", "Pitch", "Division", "Referee"], fixtures)
    add_sheet(wb, "Teams", ["Team", "Venue", "Division", "Club"], teams)
    add_sheet(wb, "Clashes", ["First", "Second", "Reason"], [
        (f"team: {b} U8 Kites", f"team: {b} U10", "Coach Maren T. coaches both"),
        (f"team: {b} U9 Swifts", f"team: {b} U11", "Coach Idris L. coaches both"),
        (f"team: {b} U8 Larks", f"team: {b} U12", "Family of Joss and Petra W."),
        (f"team: {b} U9 Martins", f"team: {b} U14", "Family of Anouk D."),
        (f"team: {b} U10", f"team: {b} U12", "Family of Teo and Bram H."),
        (f"{b} U9 Swifts v Corvid Rise U9", f"{b} U8 Larks v Linnetbeck U8",
         "Minibus from Corvid Rise also brings Linnetbeck"),
    ])
    add_sheet(wb, "Rounds", ["Round", "Date", "Time", "Note"], slots)
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Brackenlow Juniors match day",
        shared="Home, Away, Venue, Referee",
        time_zone="Europe/London",
    ))
    return wb


# --- season.xlsx and bigseason.xlsx ----------------------------------------------------------

SEASON_CLUBS = {
    # club: home ground (the clubs with teams in both divisions share it between them)
    "Kestrelmoor": "Kestrelmoor Rec",
    "Rookham": "Rookham Lane",
    "Fernbeck": "Fernbeck Meadow",
    "Ouselmere": "Ouselmere Field",
    "Corvid Rise": "Moss Road",
    "Linnetbeck": "Linnetbeck Green",
    "Heronsgill": "Gill Top",
    "Tarnwater": "Tarn Field",
    "Wrenhollow": "Hollow Park",
}


def season() -> Workbook:
    """Two six-team divisions (U12 and U14); Kestrelmoor, Rookham and Fernbeck field a team in
    each and both teams use the club's ground, so the divisions' fixtures clash there."""
    u12 = ["Kestrelmoor", "Rookham", "Fernbeck", "Ouselmere", "Corvid Rise", "Linnetbeck"]
    u14 = ["Kestrelmoor", "Rookham", "Fernbeck", "Heronsgill", "Tarnwater", "Wrenhollow"]
    teams = [(f"{c} {d}", SEASON_CLUBS[c], d, c) for d, clubs in (("U12", u12), ("U14", u14))
             for c in clubs]
    wb = new_workbook()
    add_sheet(wb, "Teams", ["Team", "Venue", "Division", "Club"], teams)
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Hollowmere Junior League",
        start_date=dt.date(2027, 9, 4),
        every=7,
        skip="2027-10-23, 2027-12-18, 2027-12-25",
        legs=1,
    ))
    return wb


def bigseason() -> Workbook:
    """A ten-team open division playing home and away: 90 fixtures, 18 rounds at the fewest.
    Kestrelmoor's two sides share Kestrelmoor Rec, Rookham's two share Rookham Lane."""
    teams = [
        ("Kestrelmoor Reds", "Kestrelmoor Rec", "Kestrelmoor"),
        ("Kestrelmoor Blues", "Kestrelmoor Rec", "Kestrelmoor"),
        ("Rookham Athletic", "Rookham Lane", "Rookham"),
        ("Rookham Rovers", "Rookham Lane", "Rookham"),
        ("Fernbeck", "Fernbeck Meadow", "Fernbeck"),
        ("Ouselmere", "Ouselmere Field", "Ouselmere"),
        ("Corvid Rise", "Moss Road", "Corvid Rise"),
        ("Linnetbeck", "Linnetbeck Green", "Linnetbeck"),
        ("Heronsgill", "Gill Top", "Heronsgill"),
        ("Tarnwater", "Tarn Field", "Tarnwater"),
    ]
    wb = new_workbook()
    add_sheet(wb, "Teams", ["Team", "Venue", "Division", "Club"],
              [(t, v, "Open", c) for t, v, c in teams])
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Hollowmere Open League",
        start_date=dt.date(2027, 8, 28),
        every=7,
        skip="2027-10-23, 2027-12-18, 2027-12-25",
        legs=2,
    ))
    return wb


# --- association.xlsx ------------------------------------------------------------------------

ASSOCIATION_DIVISIONS = ["U9", "U10", "U11", "U12", "U13", "U14", "U15", "U16"]
# big clubs: ground, pitches, divisions they field a team in
ASSOCIATION_CLUBS = [
    ("Brambleford", "Brambleford Park", 3, ["U9", "U10", "U11", "U12", "U13", "U14"]),
    ("Coldwhistle", "Coldwhistle Fields", 3, ["U9", "U10", "U11", "U13", "U15", "U16"]),
    ("Dunmarrow", "Dunmarrow Rec", 2, ["U9", "U11", "U12", "U14"]),
    ("Elvesham", "Elvesham Meadows", 2, ["U10", "U12", "U14", "U16"]),
    ("Fallowmist Vale", "Vale Lane", 2, ["U9", "U13", "U15", "U16"]),
    ("Greywether", "Greywether Green", 2, ["U10", "U11", "U15", "U16"]),
    ("Hartsgrove", "Hartsgrove Common", 2, ["U12", "U13", "U14"]),
    ("Ivelbrook Lea", "Lea Road", 2, ["U11", "U14", "U15"]),
]
# clubs with two teams in one division sharing a one-pitch ground
ASSOCIATION_TWINS = [("Juniperwold", "Juniperwold Field", "U12"),
                     ("Kingsfallow", "Kingsfallow Paddock", "U15")]
ASSOCIATION_SMALL = [  # one team, a ground of its own
    prefix + suffix
    for prefix in ("Lark", "Mill", "Nettle", "Oak", "Penny", "Quill", "Red", "Sallow", "Thorn",
                   "Upper", "Vetch", "Whin", "Yarrow", "Ash", "Birch", "Calder", "Dove",
                   "East", "Fox", "Gorse", "Hazel")
    for suffix in ("wold", "sett")
]


def association_teams() -> list[tuple[str, str, str, str]]:
    """(team, ground, division, club), ten teams in each of the eight divisions."""
    teams = []
    for club, ground, _, divisions in ASSOCIATION_CLUBS:
        teams += [(f"{club} {d}", ground, d, club) for d in divisions]
    for club, ground, d in ASSOCIATION_TWINS:
        teams += [(f"{club} {d} {side}", ground, d, club) for side in ("Reds", "Blues")]
    small = iter(ASSOCIATION_SMALL)
    for d in ASSOCIATION_DIVISIONS:
        while sum(1 for t in teams if t[2] == d) < 10:
            club = next(small)
            teams.append((f"{club} {d}", f"{club} Ground", d, club))
    order = {d: i for i, d in enumerate(ASSOCIATION_DIVISIONS)}
    return sorted(teams, key=lambda t: order[t[2]])


def association() -> Workbook:
    """An association's season: 8 divisions x 10 teams, double round robin with a return
    half, 18 matchdays from late August with holidays skipped."""
    teams = association_teams()
    wb = new_workbook()
    add_sheet(wb, "Teams", ["Team", "Venue", "Division", "Club"], teams)
    venues = [(ground, pitches) for _, ground, pitches, _ in ASSOCIATION_CLUBS]
    venues += [(ground, 1) for _, ground, _ in ASSOCIATION_TWINS]
    add_sheet(wb, "Venues", ["Venue", "Pitches"], venues)
    # neighbouring one-team grounds that share a car park: never both in use on one day
    small_grounds = [t[1] for t in teams if t[3] in ASSOCIATION_SMALL]
    clashes = [(f"venue: {a}", f"venue: {b}", "shared car park")
               for a, b in zip(small_grounds[0:24:2], small_grounds[1:24:2], strict=True)]
    add_sheet(wb, "Clashes", ["First", "Second", "Reason"], clashes)
    start, every = dt.date(2027, 8, 28), 7
    skip = [dt.date(2027, 10, 23), dt.date(2027, 12, 18), dt.date(2027, 12, 25),
            dt.date(2028, 2, 12)]
    days = []
    day = start
    while len(days) < 18:
        if day not in skip:
            days.append(day)
        day += dt.timedelta(days=every)
    lets = ["cricket week", "village fete", "pitch reseeding", "school sports day",
            "county cup final", "ground let out"]
    blocked = [("", small_grounds[24 + i], days[(5 * i + 3) % 18], lets[i % len(lets)])
               for i in range(12)]
    add_sheet(wb, "Blocked", ["Team", "Venue", "Date", "Reason"], blocked)
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Wealdmoor Junior Football Association",
        start_date=start,
        every=every,
        skip=", ".join(d.isoformat() for d in skip),
        legs=2,
        return_half="yes",
        time_zone="Europe/London",
    ))
    return wb


# --- schedules.xlsx --------------------------------------------------------------------------

CUP_TEAMS = ["Kestrelmoor Reds", "Kestrelmoor Blues", "Fernbeck", "Rookham", "Ouselmere",
             "Tarnwater"]
CUP_GROUNDS = {"Kestrelmoor Reds": "Kestrelmoor Rec", "Kestrelmoor Blues": "Kestrelmoor Rec",
               "Fernbeck": "Fernbeck Meadow", "Rookham": "Rookham Lane",
               "Ouselmere": "Ouselmere Field", "Tarnwater": "Tarn Field"}


def cup_pairings() -> list[list[tuple[str, str]]]:
    """The first leg's pairings round by round, by the circle method (textbook round-robin)."""
    order = list(CUP_TEAMS)
    n = len(order)
    rounds = []
    for _ in range(n - 1):
        rounds.append([(order[i], order[n - 1 - i]) for i in range(n // 2)])
        order = [order[0], order[-1], *order[1:-1]]
    return rounds


def _runs_ok(sides: list[str], longest: int) -> bool:
    """No more than `longest` home ("H") or away ("A") fixtures in a row."""
    run = 1
    for a, b in zip(sides, sides[1:], strict=False):
        run = run + 1 if a == b else 1
        if run > longest:
            return False
    return True


def cup_rounds() -> list[list[tuple[str, str]]]:
    """All ten rounds (the return leg repeats the first leg's order, sides swapped), with home
    sides chosen so that one schedule meets every rule of schedules.xlsx: home and away runs of
    at most 2, Tarnwater away in round 6 and Fernbeck away in round 9 (their grounds are closed),
    and a round where both Kestrelmoor sides are at home (the tie). The first choice in a fixed
    order is taken, so the result never changes."""
    pairings = cup_pairings()
    games = [pair for rnd in pairings for pair in rnd]
    for bits in range(2 ** len(games)):
        first = [(a, b) if not bits >> i & 1 else (b, a) for i, (a, b) in enumerate(games)]
        leg1 = [first[3 * r:3 * r + 3] for r in range(5)]
        season_rounds = leg1 + [[(b, a) for a, b in rnd] for rnd in leg1]
        homes = [{h for h, _ in rnd} for rnd in season_rounds]
        sides = {t: ["H" if t in homes[r] else "A" for r in range(10)] for t in CUP_TEAMS}
        if (
            all(_runs_ok(sides[t], 2) for t in CUP_TEAMS)
            and "Tarnwater" not in homes[5]
            and "Fernbeck" not in homes[8]
            and any({"Kestrelmoor Reds", "Kestrelmoor Blues"} <= homes[r] for r in range(2, 5))
        ):
            return season_rounds
    raise RuntimeError("no home and away pattern meets the demo's rules")


def schedules() -> Workbook:
    """A six-team winter cup played home and away, two rounds already played, with the rules
    only a schedule generator can hold (capacity, blocked dates, runs, balance, return half)."""
    season_rounds = cup_rounds()
    scores = iter(["2-1", "0-0", "3-2", "1-4", "2-2", "1-0"])
    rows: list[tuple[object, ...]] = []
    for r, games in enumerate(season_rounds, start=1):
        for home, away in games:
            played = r <= 2
            rows.append((f"{home} v {away}", home, away, CUP_GROUNDS[home], "Winter Cup",
                         r if played else None, "yes" if played else "",
                         next(scores) if played else ""))
    tie_round = next(rnd for rnd in season_rounds[2:5]
                     if {"Kestrelmoor Reds", "Kestrelmoor Blues"} <= {h for h, _ in rnd})
    tie = [f"{h} v {a}" for h, a in tie_round if h.startswith("Kestrelmoor")]
    split_a = next(g for g in season_rounds[2] if "Kestrelmoor Reds" not in g)
    split_b = next(g for g in season_rounds[3] if not set(g) & set(split_a))
    wb = new_workbook()
    add_sheet(wb, "Fixtures",
              ["Fixture", "Home", "Away", "Venue", "Division", "Round", "Played", "Score"], rows)
    add_sheet(wb, "Teams", ["Team", "Venue", "Division", "Club"], [
        (t, CUP_GROUNDS[t], "Winter Cup", t.split()[0]) for t in CUP_TEAMS
    ])
    add_sheet(wb, "Ties", ["First", "Second"], [tuple(tie)])
    add_sheet(wb, "Splits", ["First", "Second", "Reason"], [
        ("{} v {}".format(*split_a), "{} v {}".format(*split_b),
         "Ask of the county: these two derbies on different weekends"),
    ])
    add_sheet(wb, "Blocked", ["Team", "Venue", "Round", "Date", "Reason"], [
        (None, "Tarn Field", None, dt.date(2027, 11, 6), "Ground closed for the autumn fair"),
        (None, "Fernbeck Meadow", 9, None, "Pitch reseeding"),
    ])
    add_sheet(wb, "Venues", ["Venue", "Pitches"], [
        ("Kestrelmoor Rec", 2), ("Fernbeck Meadow", 1), ("Rookham Lane", 1),
        ("Ouselmere Field", 1), ("Tarn Field", 1),
    ])
    km = {("Fernbeck Meadow", "Kestrelmoor Rec"): 12.5, ("Fernbeck Meadow", "Ouselmere Field"): 8.0,
          ("Fernbeck Meadow", "Rookham Lane"): 21.0, ("Fernbeck Meadow", "Tarn Field"): 17.5,
          ("Kestrelmoor Rec", "Ouselmere Field"): 9.5, ("Kestrelmoor Rec", "Rookham Lane"): 14.0,
          ("Kestrelmoor Rec", "Tarn Field"): 26.0, ("Ouselmere Field", "Rookham Lane"): 11.0,
          ("Ouselmere Field", "Tarn Field"): 19.5, ("Rookham Lane", "Tarn Field"): 30.0}
    add_sheet(wb, "Distances", ["From", "To", "Km"], [(a, b, d) for (a, b), d in km.items()])
    add_sheet(wb, "Settings", ["Setting", "Value"], settings_rows(
        league="Hollowmere Winter Cup",
        start_date=dt.date(2027, 10, 2),
        every=7,
        skip="2027-12-25",
        legs=2,
        max_home_run=2,
        max_away_run=2,
        round_balance=1,
        return_half="yes",
    ))
    return wb


DEMOS: dict[str, Callable[[], Workbook]] = {
    "small.xlsx": small,
    "clubday.xlsx": clubday,
    "season.xlsx": season,
    "bigseason.xlsx": bigseason,
    "association.xlsx": association,
    "schedules.xlsx": schedules,
}


def main(argv: Sequence[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Write the LeagueGrid demo league workbooks.")
    parser.add_argument("--out", type=Path, default=HERE, help="folder (default: demo_leagues)")
    args = parser.parse_args(argv)
    args.out.mkdir(parents=True, exist_ok=True)
    for name, build in DEMOS.items():
        save(build(), args.out / name)
        print(args.out / name)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

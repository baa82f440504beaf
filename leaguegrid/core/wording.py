"""The one place for user-facing wording and number formats, used by the command line, the
window and the exports alike: exact integers with every digit grouped, a short scientific form
for huge ones, estimates always labelled as estimates, plurals ("1 round", "2 rounds")."""

from __future__ import annotations

import errno
import math
from fractions import Fraction
from typing import Any

from leaguegrid.core.model import Schedule

SHORT_DIGITS = 16  # integers with more digits than this also get a short scientific form
SUPERSCRIPT = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")
NOT_COMPUTED = "not computed"
CAUTION = (
    "LeagueGrid counts and proposes schedules. Before publishing, a coordinator checks every "
    "schedule against the association's rules (rest between games for juniors, heat, lighting, "
    "travel) and local regulations."
)

METHODS = {"uniform": "drawn uniformly at random from every valid assignment",
           "search": "found by the rule-aware generator",
           "optimised": "optimised for the fewest breaks, every rule kept",
           "timetable": "taken from the round robin timetable LeagueGrid generated",
           "edited": "edited by hand",
           "kept": "re-planned from the previous schedule, moving as few fixtures as the "
                   "rules force"}


def plural(n: int, one: str, many: str | None = None) -> str:
    """'1 round', '2 rounds', '3 clashes' (with `many` given): never 'round(s)'."""
    return f"{n} {one if n == 1 else (many or one + 's')}"


FOUND_BY = {"dsatur": "one DSatur pass",
            "tabucol": "tabu search", "search": "exhaustive search", "sat": "the SAT solver",
            "count": "counting"}


def fewest_lower_text(low: int, method: str) -> str:
    """The proof below the fewest rounds, on one line: why low - 1 rounds are too few."""
    why = {"clique": f"{low} fixtures clash with each other pairwise (a clique)",
           "pin": f"a fixture is pinned to round {low}",
           "search": f"exhaustive search found no schedule with {plural(low - 1, 'round')}",
           "sat": (f"a SAT solver proved that no schedule fits in {plural(low - 1, 'round')} "
                   "(unsatisfiable)"),
           "count": f"counting found no schedule with {plural(low - 1, 'round')}"}
    if low <= 1:
        return f"At least {plural(low, 'round')}: the league has fixtures"
    return f"At least {plural(low, 'round')}: {why.get(method, method)}"


def fewest_upper_text(high: int, method: str) -> str:
    """The proof above the fewest rounds, on one line: who found a schedule with high rounds."""
    return (f"At most {plural(high, 'round')}: a schedule with {plural(high, 'round')} "
            f"found by {FOUND_BY.get(method, method)}")


def unsaved_question(before: str) -> str:
    """Save / Discard / Cancel's question, `before` what: "closing", "opening another league"."""
    return ("This league has pins, edits or a schedule that are not saved in a project file. "
            f"Save them before {before}?")


UNSAVED_QUESTION = unsaved_question("closing")


def recovery_offer(workbook: str, when: str, more: int = 0) -> str:
    """The restore banner's sentence for work a window left unsaved when it ended."""
    others = f" ({plural(more, 'other')} waiting after this one)" if more else ""
    return (f"LeagueGrid ended without saving the work on {workbook} (last change {when}). "
            f"Restore brings back its pins, edits and schedule; Discard deletes it{others}.")


def reloaded_notice(name: str, kept: bool) -> str:
    """What the status line says once a workbook that changed on disk has been read again."""
    if kept:
        return (f"{name} changed on disk and was read again; your unsaved pins, edits and "
                "schedule were kept where their fixtures still exist.")
    return f"{name} changed on disk and was read again."


def not_reloaded_notice(name: str, problems: list[str]) -> str:
    """Why a workbook read again was not put in place of the league holding unsaved edits."""
    shown = "; ".join(problems[:3]) + ("; …" if len(problems) > 3 else "")
    return (f"{name} was read again but cannot be used as it is now ({shown}). The league "
            "read before stays open with your unsaved edits; fix the workbook and it is read "
            "again, or save your work first.")


def is_estimate(value: Any) -> bool:
    """True for an engine Estimate (anything with low and high bounds that is not an int)."""
    return not isinstance(value, int) and hasattr(value, "low") and hasattr(value, "high")


def grouped(n: int) -> str:
    """Every digit, grouped in threes: 1,234,567."""
    return f"{n:,}"


def scientific(x: int | float, digits: int = 3) -> str:
    """The short form, such as 1.23 × 10¹⁸ (exact ints are rounded only for display)."""
    if x == 0:
        return "0"
    sign = "-" if x < 0 else ""
    x = abs(x)
    if isinstance(x, int):
        exp = len(str(x)) - 1
        lead = str(x)[:digits + 1]
        mantissa = round(int(lead) / 10 ** (len(lead) - 1), digits - 1)
    else:
        exp = math.floor(math.log10(x))
        mantissa = round(x / 10 ** exp, digits - 1)
    if mantissa >= 10:
        mantissa /= 10
        exp += 1
    return f"{sign}{mantissa:.{digits - 1}f} × 10{str(exp).translate(SUPERSCRIPT)}"


def _long(n: int) -> bool:
    return len(str(abs(n))) > SHORT_DIGITS


def compact(n: int | float) -> str:
    """Grouped digits when short enough to read, else the short form."""
    if isinstance(n, int) and not _long(n):
        return grouped(n)
    if isinstance(n, float) and abs(n) < 10 ** SHORT_DIGITS:
        return grouped(round(n))
    return scientific(n)


LINE_CHARS = 100  # the widest line holding an estimate that the command line prints
CONFIDENCE_WORDS = "95% confidence"


def rough(n: int | float, digits: int = 3) -> str:
    """An estimated number as it is printed: whole below 10,000, else `digits` significant
    digits as 2.43e42 (never every digit: an estimate has no exact digits)."""
    n = int(n)
    if n < 10_000:
        return grouped(n)
    text = str(n)
    exp = len(text) - 1
    lead = (int(text[:digits + 1]) + 5) // 10  # the first `digits` digits, rounded half up
    if lead >= 10**digits:
        lead //= 10
        exp += 1
    shown = str(lead)
    return f"{shown[0]}.{shown[1:]}e{exp}" if digits > 1 else f"{shown}e{exp}"


def estimate_marker(value: Any) -> str:
    """An estimate as a table cell shows it: 'estimate ~2.43e42' ('no estimate' when no
    draw found one)."""
    if getattr(value, "samples", 0) and not getattr(value, "found", 0):
        return "no estimate"
    return f"estimate ~{rough(value.value)}"


def none_found_text(samples: int) -> str:
    """Why there is no estimate: no draw reached a valid schedule."""
    return f"no estimate: none of {grouped(samples)} samples found one"


def estimate_text(value: Any) -> str:
    """An estimate in words, never mistaken for an exact count: its value, its interval with
    the confidence and the number of samples, or why there is no interval."""
    samples = getattr(value, "samples", 0)
    found = getattr(value, "found", 0)
    head = estimate_marker(value)
    if samples and not found:
        return none_found_text(samples)
    if not samples:  # not sampled: an exact answer labelled as an estimate, or an old one
        method = getattr(value, "method", "")
        if value.low == value.high == value.value:
            return f"{head} ({method})" if method else head
        return (f"{head}: between {rough(value.low, 2)} and {rough(value.high, 2)}"
                + (f" ({method})" if method else ""))
    if getattr(value, "too_few", False):
        return (f"{head}: too few samples for an interval ({grouped(found)} of "
                f"{grouped(samples)} found one)")
    return (f"{head}: between {rough(value.low, 2)} and {rough(value.high, 2)}, "
            f"{CONFIDENCE_WORDS}, from {grouped(samples)} samples")


def estimate_line(label: str, value: Any, indent: str = "  ") -> str:
    """One printed line for one estimated number, at most LINE_CHARS characters."""
    line = f"{indent}{label}: {estimate_text(value)}"
    if len(line) > LINE_CHARS:
        line = line.replace(", from ", ", ").replace(": between ", ": ").replace(" and ", " to ")
    return line if len(line) <= LINE_CHARS else line[:LINE_CHARS - 1] + "…"


def estimated_rows_head(rounds: int) -> str:
    """The heading of one row's estimates, printed under the table."""
    return f"Estimated for {plural(rounds, 'round')} (not exact counts):"


def estimate_note(rounds: int, what: str, value: Any) -> str | None:
    """The JSON note that takes the place of an estimate with none found (None otherwise)."""
    samples = getattr(value, "samples", 0)
    if samples and not getattr(value, "found", 0):
        return f"{plural(rounds, 'round')}, {what}: {none_found_text(samples)}"
    return None


def incomplete_text(cancelled: bool, stopped: list[str]) -> str:
    """Why a counts table is incomplete: cancelled, or the true limits that stopped it."""
    if cancelled:
        what = "cancelled"
    else:
        what = "stopped at " + " and at ".join(
            "the memory bound" if why == "memory bound" else "the budget"
            for why in (stopped or ["budget"]))
    return f"Incomplete: {what}; 'not computed' and estimates are not exact."


def budget_problem(text: str) -> str:
    """Why a --budget value cannot be used."""
    return f"--budget takes a positive number of seconds, such as 60, not {text!r}"


POLYNOMIAL_LEFT = ("not computed: it takes longer than the rounds asked for (leave out --rounds "
                   "to give it the budget)")


def full_text(value: Any) -> str:
    """The whole value: every digit of an exact count, an estimate in words, or 'not computed'
    (for a tooltip, the clipboard and the exports)."""
    if value is None:
        return NOT_COMPUTED
    if isinstance(value, int):
        return grouped(value)
    if is_estimate(value):
        return f"{estimate_text(value)}; not an exact count"
    return str(value)


def count_text(value: Any) -> str:
    """A count as the command line prints it: every digit, then the short form when long."""
    text = full_text(value)
    if isinstance(value, int) and _long(value):
        text += f" (about {scientific(value)})"
    return text


def cell_text(value: Any) -> str:
    """A count in a table cell: every digit when short, else the short form and its length."""
    if isinstance(value, int) and _long(value):
        return f"{scientific(value)} ({plural(len(str(abs(value))), 'digit')})"
    if is_estimate(value):
        return f"≈ {compact(value.low)}–{compact(value.high)} (estimate)"
    return full_text(value)


def times_text(after: int, before: int) -> str:
    """How a number of schedules changes, in words: '3.2 × as many schedules', 'no change',
    'none left'."""
    if before == 0:
        return "no change (none)" if after == 0 else "some where there were none"
    if after == before:
        return "no change"
    if after == 0:
        return "none left"
    more = after >= before
    factor = Fraction(after, before) if more else Fraction(before, after)
    word = "as many" if more else "fewer"
    if factor >= 1000:  # '4.17 × 10¹⁸ times as many schedules'
        return f"{scientific(int(factor))} times {word} schedules"
    return f"{float(factor):.3g} × {word} schedules"


def ratio_of(after: int | None, before: int | None) -> float | None:
    """after / before as a float (None when either is unknown, before is 0, or it overflows)."""
    if after is None or before is None or before == 0:
        return None
    try:
        return after / before
    except OverflowError:
        return None


def gained_text(gain: int | None) -> str:
    """The exact number of schedules gained, signed: '+3,200 schedules', '-12 schedules'."""
    if gain is None:
        return "not computed"
    sign = "+" if gain > 0 else ("-" if gain < 0 else "")
    return f"{sign}{grouped(abs(gain))} " + ("schedule" if abs(gain) == 1 else "schedules")


SCHEDULES_EXPLAINED = ("Schedules: ways to give each fixture one of K rounds, no clash in a "
                       "round; groupings: rounds' order ignored.")

# what a clash reason's kind is, in words
REASON_KINDS = {"team": "team", "venue": "venue", "shared": "Clash on column",
                "clash": "Clashes row", "split": "Apart row"}


def log10_of(value: Any) -> float | None:
    """log10 of a positive count (exact or the centre of an estimate); None for 0 or unknown."""
    if isinstance(value, int):
        return math.log10(value) if value > 0 else None
    if is_estimate(value):
        centre = value.value
        return math.log10(int(centre)) if centre and centre >= 1 else None
    return None


def log10_range(value: Any) -> tuple[float, float] | None:
    """(log10 low, log10 high) of an estimate; None for anything else."""
    if not is_estimate(value) or value.low is None or value.high is None:
        return None
    low = math.log10(int(value.low)) if value.low >= 1 else 0.0
    high = math.log10(int(value.high)) if value.high >= 1 else 0.0
    return low, high


def long_work_text(seconds: float | None, budget: float | None, quick: float) -> str | None:
    """What is said before a long count: the engine's guess of the time, or, when that passes
    the budget, that what does not finish in time will be estimated; None below `quick` s."""
    if seconds is None or seconds <= quick:
        return None
    if budget is not None and seconds > budget:
        return (f"Counting; the exact work may take longer than the {budget:.0f} s allowed: what "
                "does not finish in time is shown as a labelled estimate (Esc cancels)")
    return f"Counting; this may take about {seconds:.0f} s (Esc cancels)"


def when_text(date: Any, time: Any) -> str:
    """A round's date and time as shown on screen and on the command line: '2025-09-06 10:30',
    either part alone, or '' when the round has neither."""
    parts = [date.isoformat() if date is not None else None,
             time.strftime("%H:%M") if time is not None else None]
    return " ".join(p for p in parts if p)


def page_text(number: int, total: int) -> str:
    """A printed page's number in a page footer: 'Page 3 of 12'."""
    return f"Page {number} of {total}"


def continued(title: str) -> str:
    """The title of a part that runs on to another page: 'Team Herons (continued)'."""
    return f"{title} (continued)"


def season_totals(home: int, away: int, byes: int) -> str:
    """A team's season in one line: '9 home games, 8 away games, 1 bye'."""
    return f"{plural(home, 'home game')}, {plural(away, 'away game')}, {plural(byes, 'bye')}"


def breaks_text(total: int, bound: int | None) -> str:
    """'Breaks: 8 (lower bound 8: optimal)': a team's two games in a row on the same side,
    against the proven lower bound where one is known."""
    if bound is None:
        return f"Breaks: {total} (no lower bound known for these rounds)"
    if total <= bound:
        return f"Breaks: {total} (lower bound {bound}: optimal)"
    return f"Breaks: {total} (lower bound {bound})"


FAILURE_LIMIT = 200  # characters of a failed job's one sentence; the rest is in the details


def failure_sentence(name: str, text: str) -> str:
    """A failed job in one sentence: 'Counting failed: the workbook is open elsewhere.'; only
    the first line of `text`, cut to FAILURE_LIMIT characters."""
    first = next((line.strip() for line in text.splitlines() if line.strip()), "")
    if not first:
        first = "an unexpected error"
    if len(first) > FAILURE_LIMIT:
        first = first[:FAILURE_LIMIT - 1].rstrip() + "…"
    return sentence(f"{name} failed: {first}")


def sentence(text: str) -> str:
    """Text as a sentence: a capital first letter and one full stop."""
    return (text[:1].upper() + text[1:]).rstrip(".") + "."


def schedule_summary(schedule: Schedule) -> str:
    """One paragraph: rounds, seed, how the schedule was made, which rules the counts include."""
    how = METHODS.get(schedule.method, schedule.method)
    parts = [f"{plural(schedule.rounds, 'round')}, seed {schedule.seed}, {how}."]
    if schedule.rules_counted:
        parts.append("Counted exactly: " + "; ".join(schedule.rules_counted) + ".")
    if schedule.rules_generator:
        parts.append("Enforced by the generator only: " + "; ".join(schedule.rules_generator)
                     + ".")
    parts += [sentence(n) for n in schedule.notes]
    return " ".join(parts)


def plan_failure(status: str, rounds: int, reasons: list[str]) -> str:
    """Why no schedule came out: proven impossible, stopped at the budget, or cancelled."""
    if status == "impossible":
        return f"No schedule with {plural(rounds, 'round')}: " + "; ".join(reasons)
    if status == "budget":
        return (f"No schedule found for {plural(rounds, 'round')} within the time allowed; "
                "nothing is proven.")
    return "Making a schedule was cancelled."


def counted_note(described: list[str]) -> str:
    """Which rules the exact counts include, or '' when none is described."""
    return "Counts include: " + "; ".join(described) if described else ""


def rules_note(described: list[str]) -> str:
    """Which rules only the schedule generator enforces, or '' when there are none."""
    if not described:
        return ""
    return "Not in the counts (only the schedule generator enforces them): " + "; ".join(described)


def stale_matching(file: str, misses: str) -> str:
    """The one-line notice when a remembered column matching no longer fits its file."""
    return (f"The column matching remembered for {file} no longer fits it ({misses}), so it "
            "was dropped and the file read by its own headers.")


def counted(value: Any, one: str, many: str | None = None) -> str:
    """A count with its noun, digits grouped, singular for exactly 1: '1 grouping',
    '300,000 items'; an estimate or 'not computed' with the plural."""
    noun = one if value == 1 and isinstance(value, int) else (many or one + "s")
    return f"{full_text(value)} {noun}"


def guide_numbers(name: str, fixtures: int, clashes: int, fewest: int | None,
                  row: tuple[int, Any, Any, Any] | None) -> list[tuple[str, str]]:
    """The guide's 'what the numbers mean', told with the open league's own numbers: (title,
    text) pairs. `row` is one counted round count: (K, schedules, using every round,
    groupings)."""
    out = [("The league", f"{name} has {plural(fixtures, 'fixture')} and "
            f"{plural(clashes, 'pair')} of fixtures that clash: they share a team, a ground or "
            "pitch, a coach, an official, or a Clashes or Apart row, so they can never be in "
            "the same round.")]
    if fewest is not None:
        out.append(("Fewest rounds", f"At least {plural(fewest, 'round')} are needed: no "
                    f"schedule fits in {fewest - 1}, and one fits in {fewest}."))
    else:
        out.append(("Fewest rounds", "Not settled yet: count the league (Ctrl+R)."))
    if row is not None:
        k, schedules, every, groupings = row
        are = "is" if schedules == 1 else "are"
        out.append(("Schedules", (
            f"With {plural(k, 'round')} there {are} "
            f"{counted(schedules, 'valid schedule', 'valid schedules')}: ways to give each "
            f"fixture one of the {k} rounds so that nothing that clashes shares a round (pins, "
            "Together and blocked rounds kept). Some of them may leave a round empty.")))
        put = "puts" if every == 1 else "put"
        out.append(("Using every round",
                    f"{full_text(every)} of them {put} at least one fixture in every round."))
        out.append(("Groupings", (
            f"{counted(groupings, 'grouping', 'groupings')}: the same, with the order of the "
            "rounds ignored (which fixtures go together, not when). Groupings ignore pins, so "
            "on a league with pins they can be more than the schedules.")))
    out.append(("Breaks", "A break is two home games, or two away games, in a row for one "
                "team; families notice them. A single round robin of an even number of teams "
                "needs at least (teams - 2) breaks, and LeagueGrid aims for that."))
    out.append(("Schedules gained", "What-if: how many times as many schedules there would "
                "be if one clash reason were waived (the exact number on hover)."))
    return out


GUIDE_STEPS = (
    "Open your league's workbook (File > Open), or start from a blank one (File > New league).",
    "Fix what the Workbook tab lists: each problem names its sheet, row and column.",
    "Count (Ctrl+R) to see the fewest rounds and how many schedules each number of rounds "
    "allows.",
    "Draw (Ctrl+D) a schedule for the rounds in the toolbar; move fixtures by dragging them.",
    "Check each team's season, then export calendars (Ctrl+E) or print (Ctrl+Alt+P).",
)


MESSAGE_CHARS = 2000  # the longest message a box or the command line shows
SHOWN_ITEMS = 5  # items of a long list a message names before counting the rest

WRITE_REASONS = {  # errno name -> why a file could not be written, in the coordinator's words
    "ENOSPC": "the disk is full",
    "EDQUOT": "the disk quota is used up",
    "EFBIG": "the file would be larger than this system allows (or the disk is full)",
    "EACCES": "the folder or file does not allow writing",
    "EPERM": "the folder or file does not allow writing",
    "EROFS": "the disk is read-only",
    "EISDIR": "a folder of that name is in the way",
    "ENOTDIR": "part of the path is a file, not a folder",
    "ENOENT": "the folder does not exist",
    "ENAMETOOLONG": "the name is too long for the file system",
}


def clipped(text: str, most: int = 120) -> str:
    """Text of at most `most` characters: a long one keeps its start and end around '…'."""
    if len(text) <= most:
        return text
    head = (most - 1) * 2 // 3
    return text[:head] + "…" + text[len(text) - (most - 1 - head):]


def listed(items: list[str], most: int = SHOWN_ITEMS) -> str:
    """The first `most` items joined by '; ', the rest counted ('and 12 more')."""
    shown = "; ".join(clipped(item, 200) for item in items[:most])
    rest = len(items) - most
    return shown + (f"; and {grouped(rest)} more" if rest > 0 else "")


def message(text: str) -> str:
    """A message cut to MESSAGE_CHARS, however much it was asked to hold."""
    return clipped(text, MESSAGE_CHARS)


def write_failure(target: str, err: OSError) -> str:
    """One sentence: which file could not be written and why."""
    reason = WRITE_REASONS.get(errno.errorcode.get(err.errno or 0, ""))
    if reason is None:
        reason = (err.strerror or str(err) or type(err).__name__).lower()
    return message(f"could not write {clipped(target, 300)}: {reason}; nothing there was "
                   "changed")


# a team's season: the Teams view, `plan` and its JSON ----------------------------------------
SIDE_LETTERS = {"home": "H", "away": "A", "bye": "B"}
SIDE_WORDS = {"home": "Home", "away": "Away", "bye": "Bye"}
BREAK_MARK = "•"  # after the letter of a game that is a break (also drawn as a bar)
WARNING_SIGN = "⚠"
SEASON_LEGEND = (
    ("home", False, "home game"),
    ("away", False, "away game"),
    ("bye", False, "bye (no game that round)"),
    ("home", True, f"{BREAK_MARK} and a bar: a break, the same side as the team's game "
                   "before (byes skipped)"),
)
NO_SEASON_WARNINGS = ("No warnings: no team plays three in a row at home or away, has two byes "
                      "in a row or a home count off by more than one, and byes are even within "
                      "each division.")


def and_list(items: list[str]) -> str:
    """'3', '3 and 4', '3, 4 and 5'."""
    if len(items) <= 1:
        return "".join(items)
    return ", ".join(items[:-1]) + " and " + items[-1]


def _rounds_words(rounds: list[int]) -> str:
    return ("round " if len(rounds) == 1 else "rounds ") + and_list([str(r) for r in rounds])


def run_warning(team: str, side: str, rounds: list[int]) -> str:
    """'Wrens play away in rounds 3, 4 and 5': a run of games on one side (byes skipped)."""
    return f"{team} play {side} in {_rounds_words(rounds)}"


def bye_run_warning(team: str, rounds: list[int]) -> str:
    """'Otters have byes in rounds 3 and 4': byes in rounds next to each other."""
    return f"{team} have byes in {_rounds_words(rounds)}"


def unequal_byes_warning(division: str | None, most: tuple[str, int],
                         fewest: tuple[str, int]) -> str:
    """'Byes are unequal in division U10: Otters have 3 byes, Herons 1'."""
    where = f" in division {division}" if division else ""
    return (f"Byes are unequal{where}: {most[0]} have {plural(most[1], 'bye')}, "
            f"{fewest[0]} {fewest[1]}")


def home_balance_warning(team: str, home: int, away: int) -> str:
    """'Wrens play 5 home games and 2 away games'."""
    return f"{team} play {plural(home, 'home game')} and {plural(away, 'away game')}"


def longest_run_text(home: int, away: int) -> str:
    """A team's longest runs of games on one side: '2 home, 3 away'."""
    return f"{home} home, {away} away"


def break_note(side: str) -> str:
    """What a break is, where one is shown: 'break: home again'."""
    return f"break: {side} again"


def strip_tip(title: str, side: str, opponent: str | None, place: str, brk: bool) -> str:
    """A round of a team's strip in words: 'Round 3 (2027-09-18): away v Otters at Alder Green;
    break: away again' (a bye: 'Round 3: bye')."""
    if side == "bye":
        return f"{title}: bye"
    text = f"{title}: {side}" + (f" v {opponent}" if opponent else "")
    text += f" at {place}" if place else ""
    return text + (f"; {break_note(side)}" if brk else "")


def season_warnings_head(count: int) -> str:
    """The line above the warnings on the command line: 'Season warnings: none', 'Season
    warnings (3):'."""
    return "Season warnings: none" if count == 0 else f"Season warnings ({count}):"


def teams_summary(teams: int, breaks: int, warnings: int) -> str:
    """The Teams view's headline: '4 teams, 2 breaks, 3 warnings'."""
    return (f"{plural(teams, 'team')}, {plural(breaks, 'break')}, "
            f"{plural(warnings, 'warning')}")


SEASON_TOTAL_COLUMNS = (("Home", "Home games"), ("Away", "Away games"),
                        ("Byes", "Rounds without a game"),
                        ("Breaks", "Games on the same side as the team's game before (byes "
                                   "skipped): two home or two away in a row"),
                        ("Longest run", "Most home games and most away games in a row"),
                        ("Warnings", "What a family would notice: three in a row at home or "
                                     "away, two byes in a row, unequal byes, home and away "
                                     "games more than one apart"))
NO_SEASON = "No schedule yet: draw one (Ctrl+D) to see each team's season here."
NO_VENUES = "No schedule yet: draw one (Ctrl+D) to see each venue's rounds by date here."


def round_column_tip(title: str) -> str:
    """The tooltip of a round's column in the Teams strip: its title and the letters."""
    return f"{title}: H home, A away, B bye; {BREAK_MARK} a break"


def team_heading(team: str, totals: str, longest: str) -> str:
    """Over a team's rounds: 'Wrens: 1 home game, 3 away games, 2 byes; longest runs 1 home,
    3 away'."""
    return f"{team}: {totals}; longest runs {longest}"


def more_warnings(shown: list[str], total: int) -> str:
    """The Teams view's warning line: the first warnings, then how many more."""
    text = f"{WARNING_SIGN} " + f"; {WARNING_SIGN} ".join(shown)
    extra = total - len(shown)
    return text + (f" (and {extra} more in the Warnings column)" if extra > 0 else "")


COLUMN_TIPS = {  # the tooltips of the columns a team's or venue's rounds are shown in
    "Round": "The round (a matchday, or a time slot of one day)",
    "Date": "When the round is played",
    "Home/Away": "Whether the team plays at home or away, or has a bye",
    "Opponent": "Who the team plays",
    "Venue": "Where the game is played",
    "Pitch": "The pitch at that ground, when there are several",
    "Break": "A break: the second of two home games, or two away games, in a row",
}


def venue_column_tip(column: str) -> str:
    """A venue grid's column header tooltip: the round, its date, or a pitch."""
    return COLUMN_TIPS.get(column, f"What is played on {column} in that round")

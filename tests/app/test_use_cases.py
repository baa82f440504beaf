"""The application layer's use cases, as the command line and the window both call them."""

from __future__ import annotations

import datetime as dt
import itertools

import networkx as nx
import pytest

from leaguegrid import engine
from leaguegrid.app import counting, export, league, planning
from leaguegrid.app import whatif as what
from leaguegrid.app.defaults import SCORE_TERMS


def test_open_league_builds_the_clash_graph_of_a_round_robin(round_robin) -> None:
    # A 4-team single round robin: 6 fixtures; two fixtures clash when they share a team, so
    # the clash graph is the line graph of K4 (textbook), 12 clashing pairs.
    opened = league.open_league(round_robin(4), preview=True)
    assert opened.ok
    assert nx.is_isomorphic(opened.graph, nx.line_graph(nx.complete_graph(4)))
    assert opened.sha256 is not None and len(opened.sha256) == 64
    assert list(opened.preview) == ["Teams"]


def test_a_round_count_beyond_the_rounds_sheet_is_refused(workbook) -> None:
    book = workbook("r.xlsx", {"Fixtures": [("Home", "Away"), ("A", "B")],
                               "Rounds": [("Round", "Date"), (1, None), (2, None)]})
    opened = league.open_league(book)
    league.check_rounds(opened.league, 2)
    with pytest.raises(league.RoundsError, match="lists 2 rounds; 3 asks for more"):
        league.check_rounds(opened.league, 3)


def test_counts_match_the_chromatic_polynomial_from_networkx(round_robin) -> None:
    opened = league.open_league(round_robin(4))
    report = counting.count_report(opened.league, opened.graph, rounds=[3, 4, 5])
    reference = nx.chromatic_polynomial(nx.line_graph(nx.complete_graph(4)))
    (x,) = reference.free_symbols
    assert report.min_rounds == 3  # K4 has chromatic index 3 (textbook)
    assert [row.assignments for row in report.rows] == [
        int(reference.subs(x, k)) for k in (3, 4, 5)]
    assert report.complete


def test_best_of_many_without_terms_scores_every_term(round_robin) -> None:
    opened = league.open_league(round_robin(6))
    outcome = planning.make_schedule(opened.league, opened.graph, 5, seed=7, draws=3)
    assert outcome.seed_given and outcome.schedule is not None
    assert set(outcome.result.score.weights) == set(SCORE_TERMS)
    again = planning.make_schedule(opened.league, opened.graph, 5, seed=7, draws=3)
    assert again.schedule.assignment == outcome.schedule.assignment
    assert outcome.message.startswith("5 rounds, seed 7, drawn uniformly")


def test_too_few_rounds_is_said_in_one_sentence(round_robin) -> None:
    opened = league.open_league(round_robin(6))
    outcome = planning.make_schedule(opened.league, opened.graph, 4, seed=1)
    assert outcome.schedule is None and outcome.result.status == "impossible"
    assert outcome.message.startswith("No schedule with 4 rounds: ")
    with pytest.raises(ValueError, match="at least 1, not 0"):
        planning.make_schedule(opened.league, opened.graph, 5, draws=0)


def test_every_export_carries_the_one_moment_it_was_dated(round_robin, tmp_path) -> None:
    opened = league.open_league(round_robin(4))
    schedule = planning.make_schedule(opened.league, opened.graph, 3, seed=3).schedule
    moment = dt.datetime(2027, 3, 1, 9, 30, tzinfo=dt.UTC)
    targets = export.ExportTargets(xlsx=tmp_path / "cal.xlsx", csv=tmp_path / "all.csv",
                                   ics=tmp_path / "ics")
    # the Teams sheet gives no dates: the iCalendar export must say so, after the first two
    with pytest.raises(export.ExportFailed, match="rounds without a date") as failed:
        export.export_schedule(opened.league, opened.graph, schedule, targets, 3, now=moment)
    assert failed.value.written == [tmp_path / "cal.xlsx", tmp_path / "all.csv"]
    names, why = export.ics_file_names(opened.league, schedule)
    assert names == [] and "rounds without a date" in why


def test_every_export_of_a_dated_league_shares_one_stamp(demo, tmp_path) -> None:
    opened = league.open_league(demo / "season.xlsx")
    schedule = planning.make_schedule(opened.league, opened.graph, 10, seed=5).schedule
    moment = dt.datetime(2027, 3, 1, 9, 30, tzinfo=dt.UTC)
    written = export.export_schedule(opened.league, opened.graph, schedule,
                                     export.ExportTargets(ics=tmp_path), now=moment).written
    assert written and all("DTSTAMP:20270301T093000Z" in p.read_text(encoding="utf-8")
                           for p in written)


def test_an_unknown_name_in_a_what_if_is_named(round_robin) -> None:
    opened = league.open_league(round_robin(4))
    with pytest.raises(what.UnknownName, match="Team Q"):
        what.what_if(opened.league, opened.graph, 3, add=("Team A", "Team Q"))


def test_a_what_if_stopped_by_its_budget_is_marked_incomplete(round_robin) -> None:
    opened = league.open_league(round_robin(4))
    hooks = engine.Hooks(budget=0, clock=itertools.count().__next__)
    outcome = what.what_if(opened.league, opened.graph, 3, hooks=hooks)
    assert not outcome.complete


def test_the_calendar_summary_gives_the_breaks_against_the_bound(round_robin) -> None:
    # de Werra 1981: a compact single round robin of 6 teams has at least 4 breaks.
    opened = league.open_league(round_robin(6))
    schedule = planning.make_schedule(opened.league, opened.graph, 5, seed=2).schedule
    summary = export.summary_for(opened.league, opened.graph, schedule, 5)
    assert summary.breaks == "4 (lower bound 4: optimal)"

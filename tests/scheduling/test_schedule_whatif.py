"""What-if numbers against direct recomputation on the modified graph, networkx's
chromatic_polynomial (deletion-contraction, small graphs) and brute-force enumeration."""

from __future__ import annotations

import datetime as dt
import itertools
import json

import networkx as nx
import pytest
from schedule_helpers import brute, fx, make_league, round_robin, textbook_graph

from leaguegrid.core.model import Blocked, ClashRow, Reason, RoundInfo, Settings, Split, Tie
from leaguegrid.engine import Hooks
from leaguegrid.scheduling.constraints import build_model
from leaguegrid.scheduling.whatif import (
    count_variant,
    joining_fixtures,
    resolve,
    team_joins,
    venue_closes,
    whatif,
)

_POLYS: dict = {}


def nx_count(g: nx.Graph, k: int) -> int:
    """P(g, k) from networkx.chromatic_polynomial (deletion-contraction, a sympy expression in
    x), cached per graph: it is slow beyond about 12 edges."""
    import sympy

    key = (frozenset(g.nodes), frozenset(frozenset(e) for e in g.edges))
    if key not in _POLYS:
        assert g.number_of_nodes() <= 8 and g.number_of_edges() <= 12
        _POLYS[key] = nx.chromatic_polynomial(g)
    poly = _POLYS[key]
    return int(poly.subs(sympy.Symbol("x"), k)) if poly.free_symbols else int(poly)


def coach_league():
    """Seven fixtures, four teams, two grounds, a coach for Ash and Daisy, a split."""
    fixtures = [
        fx("Ash", "Birch", "North"),
        fx("Cedar", "Daisy", "South"),
        fx("Ash", "Cedar", "South"),
        fx("Birch", "Daisy", "North"),
        fx("Daisy", "Ash", "West"),
        fx("Birch", "Cedar", "West"),
        fx("Elm", "Fir", "North"),
    ]
    lg = make_league(fixtures)
    lg.clash_rows = [ClashRow("Ash", "Daisy", "coach Robin", 3,
                              pairs=[("Ash v Birch", "Cedar v Daisy"),
                                     ("Ash v Birch", "Birch v Daisy"),
                                     ("Ash v Cedar", "Cedar v Daisy")])]
    lg.splits = [Split("Birch v Cedar", "Elm v Fir", "referee Kim", row=2)]
    return lg


def small_league():
    """Six fixtures and ten clash edges: small enough for networkx's deletion-contraction."""
    fixtures = [
        fx("Ash", "Birch", "North"),
        fx("Cedar", "Daisy", "South"),
        fx("Ash", "Cedar", "West"),
        fx("Birch", "Daisy", "North"),
        fx("Elm", "Fir", "South"),
        fx("Gorse", "Ash", "Dell"),
    ]
    lg = make_league(fixtures)
    lg.clash_rows = [ClashRow("Ash", "Daisy", "coach Robin", 3,
                              pairs=[("Ash v Birch", "Cedar v Daisy"),
                                     ("Gorse v Ash", "Birch v Daisy")])]
    lg.splits = [Split("Elm v Fir", "Gorse v Ash", "referee Kim", row=2)]
    return lg


@pytest.mark.parametrize("k", [3, 4])
def test_waived_counts_match_networkx_and_direct_recomputation(k):
    lg = small_league()
    g = textbook_graph(lg)
    report = whatif(lg, g, k)
    model = build_model(lg, g, k)
    assert report.assignments == nx_count(model.clashes, k) == model.count()
    kinds = set()
    for w in report.reasons:
        waived = model.clashes.copy()
        waived.remove_edges_from(w.edges)
        assert w.assignments_if_waived == nx_count(waived, k), w.reason
        assert w.assignments_if_waived == model.with_clashes(waived).count(), w.reason
        assert w.gain == w.assignments_if_waived - report.assignments
        kinds.add(w.kind)
    assert kinds == {"venue", "clash", "split"}  # a team's own clashes are never offered
    gains = [w.gain for w in report.reasons]
    assert gains == sorted(gains, reverse=True)


def test_sole_edges_leave_edges_with_a_second_reason():
    lg = coach_league()
    report = whatif(lg, textbook_graph(lg), 4)
    by = {w.reason: w for w in report.reasons}
    # Ash v Birch / Birch v Daisy share Birch and North as well: only the other two pairs go
    assert by["coach Robin (row 3)"].edges == [("Ash v Birch", "Cedar v Daisy")]
    assert by["referee Kim (row 2)"].edges == [("Birch v Cedar", "Elm v Fir")]
    assert by["referee Kim (row 2)"].kind == "split"
    assert by["venue North"].edges == [("Ash v Birch", "Elm v Fir"), ("Birch v Daisy", "Elm v Fir")]


def test_single_edge_deletion_contraction_matches_direct_count():
    """P(G - e) = P(G) + P(G / e) with ties, pins and blocked rounds on the model."""
    lg = coach_league()
    lg.ties = [Tie("Daisy v Ash", "Elm v Fir", row=2)]
    lg.fixtures[1].pin = 2
    lg.blocked = [Blocked(1, team="Cedar", row=2)]
    g = textbook_graph(lg)
    model = build_model(lg, g, 5)
    base = model.count()
    assert base > 0
    for i, (u, v) in enumerate(sorted(model.clashes.edges)):
        fewer = model.clashes.copy()
        fewer.remove_edge(u, v)
        direct = model.with_clashes(fewer).count()
        assert count_variant(model, fewer, base) == direct
        if i % 6 == 0:
            assert direct == len(brute(lg, _without(g, lg, u, v), 5))


def _without(g, lg, u, v):
    """The textbook graph without edge u-v, and the split dropped if it was that pair."""
    h = g.copy()
    if h.has_edge(u, v):
        h.remove_edge(u, v)
    lg.splits = [s for s in lg.splits if {s.first, s.second} != {u, v}]
    return h


def test_waived_with_ties_pins_and_blocked_match_brute_force():
    lg = coach_league()
    lg.ties = [Tie("Cedar v Daisy", "Elm v Fir", row=2)]
    lg.fixtures[0].pin = 1
    lg.fixtures[0].played = True
    lg.blocked = [Blocked(2, venue="West", row=2)]
    g = textbook_graph(lg)
    report = whatif(lg, g, 5)
    assert report.assignments == len(brute(lg, g, 5)) == 12
    model = build_model(lg, g, 5)
    for w in report.reasons:
        waived = model.clashes.copy()
        waived.remove_edges_from(w.edges)
        fewest = next(k for k in range(1, 9) if model.at(k).with_clashes(waived).count())
        assert w.min_rounds_if_waived == fewest, w.reason
        assert w.assignments_if_waived == model.with_clashes(waived).count()


def test_min_rounds_if_waived_matches_brute_force():
    lg = make_league(round_robin(["Ash", "Birch", "Cedar", "Daisy"]))
    lg.clash_rows = [ClashRow("Ash v Birch", "Cedar v Daisy", "one referee", 2,
                              pairs=[("Ash v Birch", "Cedar v Daisy")])]
    g = textbook_graph(lg)
    report = whatif(lg, g, 4)
    assert report.min_rounds == 4
    by = {w.reason: w for w in report.reasons}
    assert by["one referee (row 2)"].min_rounds_if_waived == 3
    assert "team Ash" not in by  # a team cannot play twice in a round: never offered
    assert by["one referee (row 2)"].assignments_if_waived == nx_count(
        nx.line_graph(nx.complete_graph(4)), 4)


def test_pin_transform_edges_are_never_offered():
    """Pins to different rounds are joined by the engine's clique transform; those joins are
    not clashes, and what-if works on the clash graph, so they never appear."""
    lg = coach_league()
    lg.fixtures[6].pin = 1  # Elm v Fir
    lg.fixtures[2].pin = 2  # Ash v Cedar: no clash between the two
    g = textbook_graph(lg)
    report = whatif(lg, g, 5)
    assert report.assignments > 0
    offered = {frozenset(e) for w in report.reasons for e in w.edges}
    assert frozenset(("Elm v Fir", "Ash v Cedar")) not in offered
    model = build_model(lg, g, 5)
    assert offered <= {frozenset(e) for e in model.clashes.edges}
    reasons = {str(r) for _, _, d in model.clashes.edges(data=True) for r in d["reasons"]
               if r.kind != "team"}
    assert {w.reason for w in report.reasons} == reasons


def test_tie_contradiction_lifted_by_waiving_the_clash():
    lg = coach_league()
    lg.ties = [Tie("Ash v Birch", "Cedar v Daisy", row=4)]
    g = textbook_graph(lg)
    report = whatif(lg, g, 5)
    assert report.assignments == 0 and report.min_rounds is None
    coach = next(w for w in report.reasons if w.reason == "coach Robin (row 3)")
    assert coach.assignments_if_waived == len(brute(_no_coach(lg), textbook_graph(
        _no_coach(lg)), 5)) > 0
    assert report.reasons[0] is coach


def _no_coach(lg):
    from dataclasses import replace

    return replace(lg, clash_rows=[])


def test_added_clash_matches_networkx_and_direct():
    lg = small_league()
    g = textbook_graph(lg)
    # every fixture of Cedar already clashes with Ash v Birch (team Ash, coach Robin)
    assert whatif(lg, g, 4, add=("Ash v Birch", "team: Cedar")).added.edges == []
    report = whatif(lg, g, 4, add=("Elm v Fir", "team: Birch"))
    added = report.added
    assert added.edges == [("Ash v Birch", "Elm v Fir"), ("Birch v Daisy", "Elm v Fir")]
    model = build_model(lg, g, 4)
    more = model.clashes.copy()
    more.add_edges_from(added.edges, reasons=[Reason("clash", "new")])
    assert added.assignments_if_added == nx_count(more, 4) == model.with_clashes(more).count()
    assert added.loss == report.assignments - added.assignments_if_added
    fewest = next(k for k in range(1, 9) if model.at(k).with_clashes(more).count())
    assert added.min_rounds_if_added == fewest


def test_added_single_edge_uses_contraction_and_matches_networkx():
    lg = small_league()
    g = textbook_graph(lg)
    added = whatif(lg, g, 3, add=("Elm v Fir", "Ash v Cedar")).added
    model = build_model(lg, g, 3)
    more = model.clashes.copy()
    more.add_edge("Elm v Fir", "Ash v Cedar")
    assert added.edges == [("Ash v Cedar", "Elm v Fir")]
    assert added.assignments_if_added == nx_count(more, 3)
    assert added.loss == nx_count(model.clashes, 3) - nx_count(more, 3) > 0


def test_json_shape():
    lg = make_league([fx("Ash", "Birch", "North"), fx("Cedar", "Ash", "North")])
    report = whatif(lg, textbook_graph(lg), 2, add=("venue: North", "Cedar"))
    assert json.loads(json.dumps(report.to_json())) == {
        "rounds": 2,
        "assignments": 2,
        "min_rounds": 2,
        "complete": True,
        "reasons": [
            {"reason": "venue North", "kind": "venue", "edges": [],
             "assignments_if_waived": 2, "gain": 0, "ratio": 1.0, "min_rounds_if_waived": 2},
        ],
        "added": {"first": "venue: North", "second": "Cedar", "edges": [],
                  "assignments_if_added": 2, "loss": 0, "min_rounds_if_added": 2},
    }


def test_budget_spent_marks_the_report_incomplete():
    lg = coach_league()
    report = whatif(lg, textbook_graph(lg), 4,
                    hooks=Hooks(budget=0, clock=itertools.count().__next__))
    assert not report.complete
    assert report.to_json()["assignments"] is None


def test_names_resolve_or_fail_plainly():
    lg = make_league([fx("Ash", "Birch", "Ash"), fx("Cedar", "Daisy", "North")])
    assert resolve(lg, "team: Ash") == ["Ash v Birch"]
    assert resolve(lg, "venue: ash") == ["Ash v Birch"]
    assert resolve(lg, "cedar v daisy") == ["Cedar v Daisy"]
    with pytest.raises(ValueError, match="'Ash' names a team and a venue; write 'team: Ash' "
                                         "or 'venue: Ash'"):
        resolve(lg, "Ash")
    with pytest.raises(ValueError, match="'Nort' is not a fixture, team or venue of this "
                                         "league; did you mean 'North'"):
        resolve(lg, "Nort")


def test_a_venue_closing_for_a_date_before_and_after():
    lg = coach_league()
    lg.rounds = [RoundInfo(r, dt.date(2025, 4, 5) + dt.timedelta(days=7 * (r - 1)))
                 for r in range(1, 5)]
    lg.rounds.append(RoundInfo(5, dt.date(2025, 5, 3)))
    g = textbook_graph(lg)
    out = venue_closes(lg, g, 5, "North", dt.date(2025, 4, 12))
    assert out.change == "venue North closed in round 2"
    assert out.assignments_before == len(brute(lg, g, 5)) == 240
    closed = make_league(lg.fixtures, blocked=[Blocked(2, venue="North")],
                         clash_rows=lg.clash_rows, splits=lg.splits)
    assert out.assignments_after == len(brute(closed, g, 5))
    assert out.assignments_after < out.assignments_before
    with pytest.raises(ValueError, match="2025-04-13 is not a date of the Rounds sheet"):
        venue_closes(lg, g, 5, "North", dt.date(2025, 4, 13))


def test_a_team_joining_a_division_before_and_after():
    lg = make_league(round_robin(["Ash", "Birch", "Cedar"]), settings=Settings(legs=1))
    for f in lg.fixtures:
        f.division = "U10"
    new = joining_fixtures(lg, "Daisy", "U10", venue="Dell")
    assert [(f.label, f.venue) for f in new] == [("Daisy v Ash", "Dell"),
                                                 ("Birch v Daisy", None),
                                                 ("Daisy v Cedar", "Dell")]
    out = team_joins(lg, 4, "Daisy", "U10", venue="Dell", build_graph=textbook_graph)
    grown = make_league([*lg.fixtures, *new])
    assert out.assignments_before == len(brute(lg, textbook_graph(lg), 4))
    assert out.assignments_after == len(brute(grown, textbook_graph(grown), 4))
    assert (out.min_rounds_before, out.min_rounds_after) == (3, 3)
    assert out.fixtures_added == ["Daisy v Ash", "Birch v Daisy", "Daisy v Cedar"]
    with pytest.raises(ValueError, match="team 'Ash' already plays in this league"):
        joining_fixtures(lg, "Ash", "U10")

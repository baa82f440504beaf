"""`count`: the budget as a usage error, the rounds asked for before the whole polynomial, the
true stop reason, and estimate lines a coordinator can read (within 100 characters)."""

from __future__ import annotations

import itertools
import json
import threading

import networkx as nx
import pytest

from leaguegrid import engine
from leaguegrid.app import counting, league
from leaguegrid.cli.render import number_json
from leaguegrid.core.wording import estimate_text
from leaguegrid.engine import frontier


def grid_colourings(rows: int, cols: int, k: int) -> int:
    """Proper k-colourings of the rows x cols grid by the transfer matrix over its rows
    (textbook method, independent of the engine)."""
    lines = [c for c in itertools.product(range(k), repeat=cols)
             if all(a != b for a, b in zip(c, c[1:], strict=False))]
    ways = dict.fromkeys(lines, 1)
    for _ in range(rows - 1):
        ways = {c: sum(w for d, w in ways.items() if all(x != y for x, y in zip(c, d,
                                                                                 strict=True)))
                for c in lines}
    return sum(ways.values())


@pytest.fixture
def graph_league(workbook):
    """A league whose clash graph is the given graph: a fixture per vertex, Clashes rows."""

    def make(name: str, n: int, edges: list[tuple[int, int]]):
        fixtures = [("Fixture", "Home", "Away")] + [(f"G{v}", f"H{v}", f"A{v}") for v in range(n)]
        clashes = [("First", "Second", "Reason")]
        clashes += [(f"fixture: G{u}", f"fixture: G{v}", "edge") for u, v in edges]
        return workbook(f"{name}.xlsx", {"Fixtures": fixtures, "Clashes": clashes})

    return make


def grid(rows: int, cols: int) -> tuple[int, list[tuple[int, int]]]:
    edges = [(r * cols + c, r * cols + c + 1) for r in range(rows) for c in range(cols - 1)]
    edges += [(r * cols + c, (r + 1) * cols + c) for r in range(rows - 1) for c in range(cols)]
    return rows * cols, edges


def rook(n: int) -> tuple[int, list[tuple[int, int]]]:
    cells = [(i, j) for i in range(n) for j in range(n)]
    return n * n, [(x, y) for x, y in itertools.combinations(range(n * n), 2)
                   if cells[x][0] == cells[y][0] or cells[x][1] == cells[y][1]]


@pytest.mark.parametrize("value", ["0", "-1", "abc", "nan", "inf", "-0.5"])
def test_a_budget_that_is_not_a_positive_number_is_a_usage_error(cli, demo, value) -> None:
    code, out, err = cli("count", str(demo / "small.xlsx"), "--budget", value)
    assert code == 2
    assert out == ""
    assert err == ("leaguegrid count: --budget takes a positive number of seconds, such as 60, "
                   f"not {value!r}\n")


def test_the_rounds_asked_for_are_counted_before_the_polynomial(graph_league) -> None:
    # Cancel as soon as the polynomial starts: the row asked for must already be exact.
    opened = league.open_league(graph_league("grid", *grid(8, 8)))
    stages: list[str] = []
    stop = threading.Event()

    def progress(_: float, stage: str) -> None:
        stages.append(stage)
        if stage.startswith("polynomial"):
            stop.set()

    report = counting.count_report(opened.league, opened.graph, rounds=[3],
                                   hooks=engine.Hooks(progress=progress, cancel=stop))
    p3 = grid_colourings(8, 8, 3)
    row = report.rows[0]
    assert report.cancelled and report.polynomial is None
    assert any(s.startswith("3 rounds") for s in stages)
    assert row.exact and row.assignments == p3
    # A connected bipartite graph has 2 colourings with 2 given colours, none with 1:
    # every round used = P(3) - 3 x 2; groupings = that / 3!.
    assert row.all_rounds_used == p3 - 6
    assert row.groupings == (p3 - 6) // 6


def test_at_the_fewest_rounds_every_round_is_used_without_counting_it(graph_league) -> None:
    # Latin squares of order 4: 576 (OEIS A002860); reduced-free count / 4! = 24 groupings.
    opened = league.open_league(graph_league("rook4", *rook(4)))
    stages: list[str] = []
    report = counting.count_report(opened.league, opened.graph, rounds=[4],
                                   hooks=engine.Hooks(progress=lambda _, s: stages.append(s)))
    row = report.rows[0]
    assert (row.assignments, row.all_rounds_used, row.groupings) == (576, 576, 24)
    assert not any("every round used" in s for s in stages)  # filled in, not computed


def test_the_memory_bound_is_named_as_the_reason(cli, graph_league, monkeypatch) -> None:
    # A bound no table fits under: the exact work stops at the memory bound, not the budget.
    monkeypatch.setattr(frontier, "MEMORY_BYTES", 1)
    book = graph_league("grid56", *grid(5, 6))
    code, out, _ = cli("count", str(book), "--rounds", "3", "--budget", "60")
    assert code == 5
    lines = out.splitlines()
    assert lines[-1] == ("Incomplete: stopped at the memory bound; 'not computed' and estimates "
                         "are not exact.")
    code, out, _ = cli("count", str(book), "--rounds", "3", "--budget", "60", "--json")
    data = json.loads(out)
    assert data["stopped"] == ["memory bound"] and data["complete"] is False


def test_estimate_lines_are_short_and_say_their_confidence(cli, graph_league,
                                                           monkeypatch) -> None:
    monkeypatch.setattr(frontier, "MEMORY_BYTES", 1)  # no exact count: estimates only
    book = graph_league("grid56", *grid(5, 6))
    code, out, _ = cli("count", str(book), "--rounds", "3", "--budget", "60")
    assert code == 5
    held = [line for line in out.splitlines() if "estimate ~" in line]
    assert len(held) == 4  # the table row and one line per number under the table
    assert max(len(line) for line in held) <= 100
    assert held[0].startswith("     3 | estimate ~")
    assert "Estimated for 3 rounds (not exact counts):" in out
    for line, label in zip(held[1:], ("schedules", "every round", "groupings"), strict=True):
        assert line.startswith(f"  {label}: estimate ~")
        assert line.endswith(", 95% confidence, from 2,000 samples")
    code, out, _ = cli("count", str(book), "--rounds", "3", "--budget", "60", "--json")
    row = json.loads(out)["counts"][0]
    p3 = grid_colourings(5, 6, 3)
    for key, truth in (("assignments", p3), ("all_rounds_used", p3 - 6),
                       ("groupings", (p3 - 6) // 6)):
        est = row[key]
        assert all(isinstance(est[x], int) for x in ("value", "low", "high"))
        assert (est["samples"], est["confidence"]) == (2000, 0.95)
        assert est["low"] <= truth <= est["high"]  # seeded draws: this interval holds it


def test_no_sample_finding_one_is_said_and_the_json_estimate_is_null() -> None:
    # 4 fixtures that all clash, 3 rounds: every draw dead-ends (pigeonhole)
    est = engine.estimate_assignments(nx.complete_graph(4), 3)
    assert (est.samples, est.found, est.value, est.high) == (2000, 0, 0, 3**4)
    assert estimate_text(est) == "no estimate: none of 2,000 samples found one"
    assert number_json(est) is None

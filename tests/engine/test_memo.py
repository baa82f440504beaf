"""Counts are remembered only in a Memo the caller owns: shared, it saves work; not shared,
nothing carries over from one call to the next."""

from __future__ import annotations

import networkx as nx
import pytest

from leaguegrid.engine import Hooks, Memo, count_assignments, solve


def _no_more_work(monkeypatch):
    def refuse(*args, **kwargs):
        raise AssertionError("counted again")

    monkeypatch.setattr(solve, "_values", refuse)


def test_a_shared_memo_answers_the_second_call(monkeypatch):
    memo = Memo()
    petersen = nx.petersen_graph()
    # Petersen graph: P(3) = 120 (textbook value; networkx.chromatic_polynomial agrees)
    assert count_assignments(petersen, 3, hooks=Hooks(memo=memo)) == 120
    assert len(memo) >= 1
    _no_more_work(monkeypatch)
    assert count_assignments(petersen, 3, hooks=Hooks(memo=memo)) == 120


def test_without_a_shared_memo_each_call_counts_afresh(monkeypatch):
    petersen = nx.petersen_graph()
    assert count_assignments(petersen, 3) == 120
    _no_more_work(monkeypatch)
    with pytest.raises(AssertionError, match="counted again"):
        count_assignments(petersen, 3)


def test_the_oldest_values_go_first():
    memo = Memo(size=2)
    memo.remember((1,), {3: 6})
    memo.remember((2,), {3: 7})
    assert memo.known((1,), {3}) == {3: 6}  # now the most recent
    memo.remember((3,), {3: 8})
    assert memo.known((2,), {3}) == {}
    assert memo.known((1,), {3}) == {3: 6}
    assert len(memo) == 2

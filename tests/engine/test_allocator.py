"""The allocator tuning asks glibc for its two settings, and nothing elsewhere; the engine
leaves the process's allocator alone unless an entry point asks."""

from __future__ import annotations

import sys

import pytest

from leaguegrid.engine import allocator


class FakeLibc:
    def __init__(self) -> None:
        self.calls: list[tuple[int, int]] = []

    def mallopt(self, param: int, value: int) -> int:
        self.calls.append((param, value))
        return 1


@pytest.fixture
def fake(monkeypatch):
    libc = FakeLibc()
    monkeypatch.setattr(allocator.ctypes, "CDLL", lambda name: libc)
    return libc


def test_glibc_gets_threshold_and_top_pad(fake, monkeypatch):
    monkeypatch.setattr(sys, "platform", "linux")
    allocator.keep_freed_memory()
    # glibc malloc.h: M_MMAP_THRESHOLD = -3 (32 MiB is its largest value), M_TOP_PAD = -2
    assert fake.calls == [(-3, 32 * 2**20), (-2, 256 * 2**20)]


def test_an_exact_count_leaves_the_allocator_alone(fake, monkeypatch):
    import networkx as nx

    from leaguegrid.engine import count_assignments, frontier

    monkeypatch.setattr(sys, "platform", "linux")
    monkeypatch.setattr(frontier, "VECTOR_THRESHOLD", 1)  # the array programme runs
    rook = nx.cartesian_product(nx.complete_graph(4), nx.complete_graph(4))
    assert count_assignments(rook, 4) == 576  # OEIS A002860: 576 Latin squares of order 4
    assert fake.calls == []


def test_other_platforms_are_left_alone(fake, monkeypatch):
    monkeypatch.setattr(sys, "platform", "win32")
    allocator.keep_freed_memory()
    assert fake.calls == []


def test_missing_c_library_is_not_an_error(monkeypatch):
    def missing(name: str):
        raise OSError(f"{name}: cannot open shared object file")

    monkeypatch.setattr(sys, "platform", "linux")
    monkeypatch.setattr(allocator.ctypes, "CDLL", missing)
    allocator.keep_freed_memory()  # nothing raised


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="reads /proc/self/statm")
def test_resident_bytes_reads_this_process():
    assert allocator.resident_bytes() > 10 * 2**20  # the interpreter with numpy and flint


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="reads /proc/self/statm")
def test_resident_memory_bound_stops_exact_work(monkeypatch):
    import networkx as nx

    from leaguegrid.engine import BudgetExceeded, count_assignments, frontier

    monkeypatch.setattr(frontier, "RESIDENT_GROWTH", -(2**40))  # any reading is too much
    rook = nx.cartesian_product(nx.complete_graph(4), nx.complete_graph(4))
    with pytest.raises(BudgetExceeded, match="memory bound"):
        count_assignments(rook, 4)


MIB = 2**20


def test_memory_kept_by_the_allocator_is_handed_back_before_the_bound_stops_work(monkeypatch):
    from leaguegrid.engine import frontier

    readings = iter([900 * MIB, 100 * MIB])  # high (freed memory kept), low after the trim
    released = []
    monkeypatch.setattr(frontier, "resident_bytes", lambda: next(readings))
    monkeypatch.setattr(frontier, "release_freed_memory", lambda: released.append(1))
    assert frontier._resident_too_high(60 * MIB) is False
    assert released == [1]


def test_memory_in_use_stops_work_after_the_hand_back(monkeypatch):
    from leaguegrid.engine import frontier

    monkeypatch.setattr(frontier, "resident_bytes", lambda: 900 * MIB)
    monkeypatch.setattr(frontier, "release_freed_memory", lambda: None)
    assert frontier._resident_too_high(60 * MIB) is True  # grew by 840 MiB > 700 MiB


def test_the_bound_is_on_growth_not_on_what_earlier_work_left(monkeypatch):
    from leaguegrid.engine import frontier

    monkeypatch.setattr(frontier, "resident_bytes", lambda: 900 * MIB)
    monkeypatch.setattr(frontier, "release_freed_memory", lambda: None)
    assert frontier._resident_too_high(500 * MIB) is False  # grew by 400 MiB only


def test_a_programme_starts_by_handing_back_much_freed_memory(monkeypatch):
    from leaguegrid.engine import frontier

    readings = iter([600 * MIB, 90 * MIB])
    released = []
    monkeypatch.setattr(frontier, "resident_bytes", lambda: next(readings))
    monkeypatch.setattr(frontier, "release_freed_memory", lambda: released.append(1))
    assert frontier.resident_baseline() == 90 * MIB
    assert released == [1]


def test_release_asks_glibc_to_trim(fake, monkeypatch):
    calls = []
    fake.malloc_trim = lambda pad: calls.append(pad)
    monkeypatch.setattr(sys, "platform", "linux")
    allocator.release_freed_memory()
    assert calls == [0]

"""Exact counts already worked out, kept by whoever owns the memo (no module state)."""

from __future__ import annotations

import threading
from collections import OrderedDict

Key = tuple[tuple[int, ...], int]  # (a piece's adjacency rows, rounds)


class Memo:
    """The most recent `size` exact values P(piece, k), safe to share between threads.

    A caller that asks for counts one number at a time (a counts table, a what-if) shares
    one Memo through its Hooks, so that work done for one number is not repeated for the
    next; engine calls without one get a memo of their own for the length of the call."""

    def __init__(self, size: int = 4096) -> None:
        self.size = size
        self._values: OrderedDict[Key, int] = OrderedDict()
        self._lock = threading.Lock()

    def __len__(self) -> int:
        return len(self._values)

    def known(self, adj: tuple[int, ...], ks: set[int]) -> dict[int, int]:
        """{k: value} for the values of ks remembered for this piece."""
        with self._lock:
            out = {k: self._values[(adj, k)] for k in ks if (adj, k) in self._values}
            for k in out:
                self._values.move_to_end((adj, k))
        return out

    def remember(self, adj: tuple[int, ...], values: dict[int, int]) -> None:
        """Keep these values for this piece, forgetting the oldest beyond `size`."""
        with self._lock:
            for k, v in values.items():
                self._values[(adj, k)] = v
            while len(self._values) > self.size:
                self._values.popitem(last=False)

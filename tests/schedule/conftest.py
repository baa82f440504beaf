"""Schedule tests: until the real engine is importable, a brute-force stand-in (tests only).

The stand-in enumerates assignments by the textbook definition: every node gets a round in
1..k, adjacent nodes differ, pins and exclusions hold. It is used only when
leaguegrid.engine lacks the functions the schedule package calls.
"""

from __future__ import annotations

import sys
import types

NEEDED = ("count_assignments", "count_all_rounds_used", "min_rounds", "sample_assignment",
          "Hooks", "NoAssignment", "Cancelled", "BudgetExceeded")


def _engine_ready() -> bool:
    try:
        from leaguegrid import engine
    except ImportError:
        return False
    return all(hasattr(engine, name) for name in NEEDED)


def _assignments(G, k, pins=None, exclusions=None):
    pins = pins or {}
    exclusions = exclusions or {}
    nodes = list(G.nodes)
    colour: dict = {}

    def go(i):
        if i == len(nodes):
            yield dict(colour)
            return
        v = nodes[i]
        for r in range(1, k + 1):
            if v in pins and pins[v] != r:
                continue
            if r in exclusions.get(v, ()):
                continue
            if any(colour.get(u) == r for u in G[v]):
                continue
            colour[v] = r
            yield from go(i + 1)
            del colour[v]

    yield from go(0)


def _install_stand_in() -> None:
    import leaguegrid

    mod = types.ModuleType("leaguegrid.engine")

    class NoAssignment(Exception):
        pass

    class Cancelled(Exception):
        pass

    class BudgetExceeded(Exception):
        pass

    class Hooks:
        def __init__(self, progress=None, cancel=None, budget=None):
            self.progress, self.cancel, self.budget = progress, cancel, budget

    def count_assignments(G, k, pins=None, exclusions=None, hooks=None):
        return sum(1 for _ in _assignments(G, k, pins, exclusions))

    def count_all_rounds_used(G, k, pins=None, exclusions=None, hooks=None):
        return sum(1 for a in _assignments(G, k, pins, exclusions)
                   if set(a.values()) == set(range(1, k + 1)))

    def min_rounds(G, pins=None, exclusions=None, hooks=None):
        k = max([0, *(pins or {}).values()])
        while True:
            if next(_assignments(G, k, pins, exclusions), None) is not None:
                return k
            k += 1

    def sample_assignment(G, k, rng, pins=None, exclusions=None, hooks=None):
        every = list(_assignments(G, k, pins, exclusions))
        if not every:
            raise NoAssignment("no valid assignment")
        return every[rng.randrange(len(every))]

    for name, obj in list(locals().items()):
        if name in NEEDED:
            setattr(mod, name, obj)
    sys.modules["leaguegrid.engine"] = mod
    leaguegrid.engine = mod


if not _engine_ready():
    _install_stand_in()

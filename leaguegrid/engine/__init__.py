"""The counting engine: exact chromatic polynomials, counts of round assignments, the fewest
rounds, uniform draws and labelled estimates. Pure: no Qt, no file I/O."""

from .allocator import keep_freed_memory
from .api import (
    RoundsBounds,
    RoundsProof,
    chromatic_polynomial,
    count_all_rounds_used,
    count_assignments,
    count_table,
    estimate_assignments,
    estimate_counts,
    fewest_rounds_bounds,
    groupings,
    min_rounds,
    min_rounds_bounds,
    min_rounds_proof,
    sample_assignment,
    sample_assignments,
)
from .cost import Cost, estimate_cost
from .estimate import Estimate
from .falling import from_falling, to_falling
from .hooks import BudgetExceeded, Cancelled, Hooks, MemoryBound, NoAssignment
from .memo import Memo

__all__ = [
    "BudgetExceeded",
    "Cancelled",
    "Cost",
    "Estimate",
    "Hooks",
    "Memo",
    "MemoryBound",
    "NoAssignment",
    "RoundsBounds",
    "RoundsProof",
    "chromatic_polynomial",
    "count_all_rounds_used",
    "count_assignments",
    "count_table",
    "estimate_assignments",
    "estimate_cost",
    "estimate_counts",
    "fewest_rounds_bounds",
    "from_falling",
    "groupings",
    "keep_freed_memory",
    "min_rounds",
    "min_rounds_bounds",
    "min_rounds_proof",
    "sample_assignment",
    "sample_assignments",
    "to_falling",
]

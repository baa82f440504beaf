"""The defaults every front end uses, decided once: budgets, best-of sizes, score terms."""

from __future__ import annotations

COUNT_BUDGET = 60.0  # seconds for one counts table
PLAN_BUDGET = 60.0  # seconds to make one schedule (its exact count and draws included)
WHATIF_BUDGET = 60.0  # seconds for one what-if report
BEST_OF = 50  # schedules drawn when the coordinator asks for the best of many
SCORE_TERMS = ("balance", "alternation", "spread", "slots", "rest", "travel")  # when none given
LONG_WORK_SECONDS = 5.0  # above the engine's guess of this, a count says how long it may take
PREVIEW_ROWS = 5000  # rows of each sheet the workbook preview shows

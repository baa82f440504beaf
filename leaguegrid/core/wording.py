"""User-facing number formats and wording: exact integers with digit grouping, a short
scientific form for huge ones, estimates always labelled as estimates, plurals."""

from __future__ import annotations

import math
from typing import Any

SHORT_DIGITS = 16  # integers with more digits than this also get a short scientific form
SUPERSCRIPT = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")
NOT_COMPUTED = "not computed"


def is_estimate(value: Any) -> bool:
    """True for an engine Estimate (anything with low and high bounds that is not an int)."""
    return not isinstance(value, int) and hasattr(value, "low") and hasattr(value, "high")


def grouped(n: int) -> str:
    """Every digit, grouped in threes: 1,234,567."""
    return f"{n:,}"


def scientific(x: int | float, digits: int = 3) -> str:
    """A short scientific form such as 1.23 × 10¹⁸ (exact ints are rounded only for display)."""
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


def compact(n: int | float) -> str:
    """Grouped digits when short enough to read, else the short scientific form."""
    if isinstance(n, int) and len(str(abs(n))) <= SHORT_DIGITS:
        return grouped(n)
    if isinstance(n, float) and abs(n) < 10 ** SHORT_DIGITS:
        return grouped(round(n))
    return scientific(n)


def cell_text(value: Any) -> str:
    """The text of one count in the table."""
    if value is None:
        return NOT_COMPUTED
    if isinstance(value, int):
        if len(str(abs(value))) <= SHORT_DIGITS:
            return grouped(value)
        return f"{scientific(value)} ({len(str(abs(value)))} digits)"
    if is_estimate(value):
        return f"≈ {compact(value.low)}–{compact(value.high)} (estimate)"
    return str(value)


def full_text(value: Any) -> str:
    """The whole value, for a tooltip or the clipboard: every digit of an exact count."""
    if value is None:
        return NOT_COMPUTED
    if isinstance(value, int):
        return grouped(value)
    if is_estimate(value):
        method = getattr(value, "method", "")
        how = f" by {method}" if method else ""
        return (f"estimate{how}: between {compact(value.low)} and {compact(value.high)}, "
                f"about {compact(value.value)}; not an exact count")
    return str(value)


def log10_of(value: Any) -> float | None:
    """log10 of a positive count (exact or the centre of an estimate); None for 0 or unknown."""
    if isinstance(value, int):
        return _log10_int(value) if value > 0 else None
    if is_estimate(value):
        centre = value.value
        return _log10_int(int(centre)) if centre and centre >= 1 else None
    return None


def log10_range(value: Any) -> tuple[float, float] | None:
    """(log10 low, log10 high) of an estimate; None for anything else."""
    if not is_estimate(value) or value.low is None or value.high is None:
        return None
    low = _log10_int(int(value.low)) if value.low >= 1 else 0.0
    high = _log10_int(int(value.high)) if value.high >= 1 else 0.0
    return low, high


def _log10_int(n: int) -> float:
    """log10 of a positive integer of any size (math.log10 handles big ints exactly enough)."""
    return math.log10(n)


def plural(n: int, one: str, many: str | None = None) -> str:
    """'1 round', '2 rounds', '3 clashes' (with `many` given): never 'round(s)'."""
    return f"{n} {one if n == 1 else (many or one + 's')}"

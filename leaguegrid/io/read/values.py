"""Cell values read the way a coordinator means them: text, whole numbers, dates, times, yes/no."""

from __future__ import annotations

import datetime as dt
import math
import re

_WHOLE = re.compile(r"\+?\d+")
_NUMBER = re.compile(r"[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?")
_ISO_DATE = re.compile(r"\d{4}-\d{2}-\d{2}")
_DMY = re.compile(r"(\d{1,2})[./-](\d{1,2})[./-](\d{4}|\d{2})")
_YMD = re.compile(r"(\d{4})[./](\d{1,2})[./](\d{1,2})")
_TIME = re.compile(r"(\d{1,2})[:.](\d{2})(?::(\d{2}))?")
_EXCEL_EPOCH = dt.date(1899, 12, 30)
YES = frozenset({"yes", "y", "true", "x", "1"})
NO = frozenset({"no", "n", "false", "0"})


def cell_text(value: object) -> str | None:
    """The cell as text (stripped), or None when blank. Dates read as YYYY-MM-DD, times as HH:MM."""
    if value is None:
        return None
    if isinstance(value, str):
        return value.strip() or None
    if isinstance(value, bool):
        return "TRUE" if value else "FALSE"
    if isinstance(value, dt.datetime):
        if value.time() == dt.time(0, 0):
            return value.date().isoformat()
        return value.isoformat(sep=" ", timespec="minutes")
    if isinstance(value, dt.date):
        return value.isoformat()
    if isinstance(value, dt.time):
        return value.strftime("%H:%M:%S" if value.second else "%H:%M")
    if isinstance(value, float):
        return str(int(value)) if value.is_integer() else repr(value)
    return str(value)


def is_number(value: object) -> bool:
    """True for a number cell, or text that reads as a number (a decimal point, not a comma)."""
    if isinstance(value, bool):
        return False
    if isinstance(value, int | float):
        return True
    return isinstance(value, str) and _NUMBER.fullmatch(value.strip()) is not None


def whole_number(value: object) -> int | None:
    """A whole number from a number cell (3 or 3.0) or text ('3'); None for anything else."""
    if isinstance(value, bool):
        return None
    if isinstance(value, int):
        return value
    if isinstance(value, float):
        return int(value) if value.is_integer() else None
    if isinstance(value, str) and _WHOLE.fullmatch(value.strip()):
        return int(value.strip())
    return None


def to_number(value: object) -> float | None:
    """A finite number from a number cell or text ('51.5', or '51,5' with a decimal comma)."""
    if isinstance(value, bool):
        return None
    if isinstance(value, int | float):
        number = float(value)
    elif isinstance(value, str):
        text = value.strip()
        if text.count(",") == 1 and "." not in text:
            text = text.replace(",", ".")
        if not _NUMBER.fullmatch(text):
            return None
        number = float(text)
    else:
        return None
    return number if math.isfinite(number) else None


def to_date(value: object) -> dt.date | None:
    """A date from a date cell or ISO text YYYY-MM-DD; None for anything else."""
    if isinstance(value, dt.datetime):
        return value.date()
    if isinstance(value, dt.date):
        return value
    if isinstance(value, str) and _ISO_DATE.fullmatch(value.strip()):
        try:
            return dt.date.fromisoformat(value.strip())
        except ValueError:
            return None
    return None


def looks_like_date(value: object) -> bool:
    """True when the value was meant as a date: a date cell, or ISO- or d/m/y-shaped text."""
    if isinstance(value, dt.date):
        return True
    if not isinstance(value, str):
        return False
    text = value.strip()
    return bool(_ISO_DATE.fullmatch(text) or _DMY.fullmatch(text) or _YMD.fullmatch(text))


def guess_date(value: object) -> dt.date | None:
    """The date a non-ISO entry most likely means, when that is unambiguous; else None."""
    if isinstance(value, int | float) and not isinstance(value, bool):
        if 20000 <= value <= 80000 and float(value).is_integer():
            return _EXCEL_EPOCH + dt.timedelta(days=int(value))
        return None
    if not isinstance(value, str):
        return None
    text = value.strip()
    if m := _YMD.fullmatch(text):
        return _safe_date(int(m[1]), int(m[2]), int(m[3]))
    m = _DMY.fullmatch(text)
    if not m:
        return None
    a, b, year = int(m[1]), int(m[2]), int(m[3])
    if len(m[3]) == 2:
        year += 2000
    if a > 12 >= b or a == b:
        return _safe_date(year, b, a)
    if b > 12 >= a:
        return _safe_date(year, a, b)
    return None


def _safe_date(year: int, month: int, day: int) -> dt.date | None:
    try:
        return dt.date(year, month, day)
    except ValueError:
        return None


def date_advice(value: object) -> str:
    """How to write the date: 'write dates as YYYY-MM-DD' with the likely meaning when clear."""
    guess = guess_date(value)
    if guess is not None:
        return f"write dates as YYYY-MM-DD (did you mean {guess.isoformat()}?)"
    return "write dates as YYYY-MM-DD"


def to_time(value: object) -> dt.time | None:
    """A time of day from a time cell, a fraction of a day, or text H:MM / HH:MM[:SS] (24-hour)."""
    if isinstance(value, dt.datetime):
        return value.time()
    if isinstance(value, dt.time):
        return value
    if isinstance(value, float) and 0 <= value < 1:
        seconds = round(value * 86400)
        return dt.time(seconds // 3600, seconds % 3600 // 60, seconds % 60)
    if isinstance(value, str) and (m := _TIME.fullmatch(value.strip())):
        hour, minute, second = int(m[1]), int(m[2]), int(m[3] or 0)
        if hour < 24 and minute < 60 and second < 60:
            return dt.time(hour, minute, second)
    return None


def yes_no(value: object) -> bool | None:
    """True for yes/y/true/x/1 (any case) or a TRUE cell, False for no/n/false/0; None otherwise."""
    if isinstance(value, bool):
        return value
    if isinstance(value, int | float):
        return {1: True, 0: False}.get(value)  # type: ignore[call-overload]
    if isinstance(value, str):
        key = value.strip().casefold()
        if key in YES:
            return True
        if key in NO:
            return False
    return None


def split_values(text: str, separators: str = ";") -> list[str]:
    """The non-blank parts of a cell holding several values separated by any of `separators`."""
    parts = re.split("|".join(re.escape(s) for s in separators), text)
    return [p.strip() for p in parts if p.strip()]

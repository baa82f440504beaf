"""The one name key: how team, venue, division and fixture names are matched everywhere.

Two spellings name the same thing when their keys are equal: Unicode NFKC, case folded, every
whitespace character removed ("Alder  Green", "alder green" and "ALDERGREEN" are one venue).
"""

from __future__ import annotations

import difflib
import unicodedata
from collections.abc import Iterable


def name_key(text: str | None) -> str:
    """The matching key of a name: Unicode-normalised (NFKC), case-folded, every space removed;
    '' for None."""
    return "".join(unicodedata.normalize("NFKC", text or "").casefold().split())


def closest(name: str, candidates: Iterable[str], cutoff: float = 0.6) -> str | None:
    """The candidate spelled most like `name` (difflib ratio on keys), or None if none is close."""
    by_key: dict[str, str] = {}
    for c in candidates:
        by_key.setdefault(name_key(c), c)
    found = difflib.get_close_matches(name_key(name), list(by_key), n=1, cutoff=cutoff)
    return by_key[found[0]] if found else None


def suggestion(name: str, candidates: Iterable[str]) -> str:
    """'; did you mean 'X'?' for the closest candidate, or '' when none is close."""
    best = closest(name, candidates)
    return f"; did you mean '{best}'?" if best else ""

"""Column matching: which of a file's headers stands for which of our Fixtures columns, as one
dict (our column name -> the file's header, plus "Shared": more of the file's columns whose
equal values clash, ";"-separated) shared by the window's Match columns dialog, the project
file and the command line's `--columns home="Home Team",venue=Ground`."""

from __future__ import annotations

from leaguegrid.core.names import name_key, suggestion
from leaguegrid.io.read.columns import ALIASES
from leaguegrid.io.read.fixtures_sheet import FIXTURES_COLUMNS

SHARED = "Shared"  # the entry's name in the dict and the project file (kept for old projects)
# the names a matching takes on its left, by key: our Fixtures columns, and Clash on (Shared)
KEYS = {**FIXTURES_COLUMNS, name_key("Clash on"): SHARED, name_key(SHARED): SHARED}
LISTED = ", ".join([*FIXTURES_COLUMNS, "clash on"])  # as a message lists them
EXAMPLE = 'home="Home Team",venue=Ground'


class ColumnsError(ValueError):
    """A column matching that cannot be used: the message names the part at fault."""


def parse_columns(text: str) -> dict[str, str]:
    """`home="Home Team",venue=Ground` as {"Home": "Home Team", "Venue": "Ground"}: our column
    keys (any case) on the left, the file's headers on the right, quoted when they hold a
    comma; ColumnsError names the first bad part."""
    out: dict[str, str] = {}
    taken: dict[str, str] = {}
    for part in _parts(text):
        if not part:
            raise ColumnsError(f"an empty part in {text!r}: write KEY=HEADER pairs separated "
                               f"by commas, e.g. {EXAMPLE}")
        ours, sep, theirs = part.partition("=")
        ours, theirs = ours.strip(), _unquote(theirs.strip())
        if not sep:
            raise ColumnsError(f"{part!r} has no '=': write KEY=HEADER, e.g. {EXAMPLE}")
        name = KEYS.get(name_key(ours))
        if name is None:
            usual = ALIASES.get(name_key(ours))  # a header word (ground) for a key (venue)
            hint = f"; did you mean {usual!r}?" if usual in KEYS else suggestion(ours, KEYS)
            raise ColumnsError(f"{ours!r} is not one of our columns ({LISTED})" + hint)
        if not theirs:
            raise ColumnsError(f"{part!r} names no header after '='")
        if name in out:
            raise ColumnsError(f"{ours!r} is given twice")
        if name != SHARED:
            if name_key(theirs) in taken:
                raise ColumnsError(f"the header {theirs!r} is given for both "
                                   f"{taken[name_key(theirs)]} and {name}")
            taken[name_key(theirs)] = name
        out[name] = theirs
    return out


def _parts(text: str) -> list[str]:
    """The comma-separated parts of `text`, commas inside double quotes kept."""
    parts, current, quoted = [], [], False
    for ch in text:
        if ch == '"':
            quoted = not quoted
        if ch == "," and not quoted:
            parts.append("".join(current).strip())
            current = []
        else:
            current.append(ch)
    parts.append("".join(current).strip())
    return parts


def _unquote(text: str) -> str:
    if len(text) >= 2 and text[0] == text[-1] and text[0] in "\"'":
        return text[1:-1].strip()
    return text


def misses_text(unmatched: list[tuple[str, str]]) -> str:
    """'no column 'Home Team' for Home, no column 'Ref' for Shared'."""
    return ", ".join(f"no column {theirs!r} for {ours}" for ours, theirs in unmatched)


def guess_matching(headers: list[str]) -> dict[str, str]:
    """Our Fixtures column name -> the header the reader takes for it unmatched: the one of our
    name, else one of the usual spreadsheet words for it (Home Team, Ground, Kick-off, ...)."""
    out: dict[str, str] = {}
    for key, name in FIXTURES_COLUMNS.items():
        exact = [h for h in headers if name_key(h) == key]
        usual = [h for h in headers if ALIASES.get(name_key(h)) == key]
        if exact or usual:
            out[name] = (exact or usual)[0]
    return out

"""The one name key: Unicode NFKC, case folded, every whitespace removed."""

from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from leaguegrid.core.names import closest, name_key


def test_spellings_of_one_name_share_a_key() -> None:
    assert name_key("Alder  Green") == name_key("alder green") == name_key("ALDERGREEN")
    assert name_key("Ｕ１０ Ｋｅｓｔｒｅｌｓ") == name_key("U10 Kestrels")  # full width (NFKC)
    assert name_key("Stra\u00dfe") == name_key("STRASSE")  # casefold
    assert name_key(None) == ""


def test_closest_name_is_suggested() -> None:
    assert closest("Alder Gren", ["Alder Green", "Hill Top"]) == "Alder Green"
    assert closest("Zzz", ["Alder Green", "Hill Top"]) is None


@given(st.text(alphabet=st.characters(codec="ascii")), st.text(alphabet=" \t\n"))
def test_the_key_ignores_case_and_whitespace(text: str, spaces: str) -> None:
    assert name_key(text) == name_key(spaces + text.upper() + spaces)
    assert not any(c.isspace() for c in name_key(text))

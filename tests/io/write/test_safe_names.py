"""Names safe for every file system and for Excel: file names cut by bytes and kept unique with
a short hash; sheet titles within Excel's rules."""

from __future__ import annotations

import hashlib

import openpyxl
import pytest

from leaguegrid.io.write.names import FILE_NAME_BYTES, file_name, sheet_title


def test_a_long_multibyte_name_is_cut_by_bytes_and_tagged_with_its_hash():
    name = "緑" * 100 + " Rovers A"  # 309 bytes in UTF-8 (each 緑 is 3), 109 characters
    taken: set[str] = set()
    made = file_name(f"team-{name}", ".ics", taken)
    tag = "~" + hashlib.sha256(f"team-{name}".encode()).hexdigest()[:8]
    assert made == "team-" + "緑" * 74 + tag + ".ics"
    assert len(made.encode()) == 5 + 74 * 3 + 9 + 4 <= FILE_NAME_BYTES  # one byte short: no half 緑
    assert FILE_NAME_BYTES + len(".") + len(".abcdefgh.tmp") == 255  # the temporary name fits
    other = file_name(f"team-{'緑' * 100} Rovers B", ".ics", taken)
    assert other != made and other.startswith("team-" + "緑" * 74 + "~")


def test_short_names_keep_their_form_and_collisions_are_numbered():
    taken: set[str] = set()
    assert file_name("team-Herons", ".ics", taken) == "team-Herons.ics"
    assert file_name("team-HERONS", ".ics", taken) == "team-HERONS (2).ics"
    assert file_name('team-A/B: "C"?', ".ics", taken) == "team-A_B_ _C__.ics"
    assert file_name("team-Otters. ", ".ics", taken) == "team-Otters.ics"
    assert file_name("CON", ".ics", taken) == "CON_.ics"
    assert file_name("", ".ics", taken) == "calendar.ics"


def test_long_names_equal_but_for_case_differ_by_their_hash_and_fit():
    taken: set[str] = set()
    first = file_name("x" * 300, ".ics", taken)
    second = file_name("X" * 300, ".ics", taken)
    assert first == "x" * 228 + "~" + hashlib.sha256(b"x" * 300).hexdigest()[:8] + ".ics"
    assert second.casefold() != first.casefold()
    assert len(first.encode()) == len(second.encode()) == FILE_NAME_BYTES
    assert file_name("x" * 300, ".ics", taken) == "x" * 224 + first[228:237] + " (2).ics"


def test_files_of_the_longest_names_are_written_on_this_file_system(tmp_path):
    taken: set[str] = set()
    for letter in "AB":
        path = tmp_path / file_name(f"team-{'緑' * 100} {letter}", ".ics", taken)
        path.write_text("x", encoding="utf-8")
    assert len(list(tmp_path.iterdir())) == 2


@pytest.mark.parametrize(("name", "title"), [
    ("Hawks/Falcons [A]: U10*?\\", "Hawks_Falcons _A__ U10___"),
    ("'quoted'", "quoted"),
    ("St Mary's Under-11 Whites Firsts'", "St Mary's Under-11 Whites First"),
    ("Upper Tarnwater Kingfishers Ladie's", "Upper Tarnwater Kingfishers Lad"),
    ("Venue Abbot's Meadow Pitches 1 and 2", "Venue Abbot's Meadow Pitches 1"),
    ("History", "History_"),
    ("", "Sheet"),
    ("😀" * 20, "😀" * 15),  # Excel counts UTF-16 units: each of these is 2
])
def test_sheet_titles_follow_excels_rules(name, title):
    assert sheet_title(name, set()) == title


def test_a_title_cut_before_an_apostrophe_loses_it():
    assert sheet_title("Kestrel Lane Junior Fixtures A'B", set()) == \
        "Kestrel Lane Junior Fixtures A"
    assert sheet_title("Kestrel Lane Junior Fixtures Ab'cd", set()) == \
        "Kestrel Lane Junior Fixtures Ab"
    assert sheet_title("Kestrel Lane Junior Fixtures A 'x", set()) == \
        "Kestrel Lane Junior Fixtures A"


def test_our_sheets_keep_their_names_and_a_colliding_team_gets_a_suffix(tmp_path):
    taken: set[str] = set()
    titles = [sheet_title(n, taken) for n in
              ["Calendar", "Summary", "calendar", "SUMMARY", "Summary", "x" * 40, "X" * 40]]
    assert titles == ["Calendar", "Summary", "calendar (2)", "SUMMARY (2)", "Summary (3)",
                      "x" * 31, "X" * 27 + " (2)"]
    book = openpyxl.Workbook()
    for title in titles:
        book.create_sheet(title)
    book.save(tmp_path / "t.xlsx")
    assert openpyxl.load_workbook(tmp_path / "t.xlsx").sheetnames[1:] == titles

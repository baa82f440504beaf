"""The Workbook tab reads files with the importer's own reader, so the preview's row numbers are
the problems' row numbers (quoted line breaks, a BOM, semicolons); column matching is applied by
the reader itself and its problems point at the file's own columns and cells."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from openpyxl import Workbook  # noqa: E402
from PySide6.QtCore import Qt  # noqa: E402

from leaguegrid.app.league import open_league, preview_sheets  # noqa: E402
from leaguegrid.clashes.graph import build_clash_graph  # noqa: E402
from leaguegrid.gui.import_view import ImportView  # noqa: E402

MATCHING = {"Home": "Home team", "Away": "Away team", "Venue": "Ground", "Shared": "Referee"}


def shown(qtbot, path, mapping=None):
    """An ImportView showing `path` as the window shows it, and the reader's problems."""
    result = open_league(path, mapping).result
    view = ImportView()
    qtbot.addWidget(view)
    view.show_workbook(str(path), preview_sheets(path), list(result.problems), "")
    return view, result


def current_cell(view):
    """(row number as shown, column header, text) of the preview's selected cell."""
    model = view.sheets.currentWidget().model()
    current = view.sheets.currentWidget().currentIndex()
    row, column = current.row(), current.column()
    return (model.headerData(row, Qt.Orientation.Vertical), model.index(0, column).data(),
            current.data())


def test_matched_columns_problems_point_at_the_files_own_cells(qtbot, tmp_path):
    path = tmp_path / "clubs.csv"
    path.write_text("Home team;Away team;Ground;Referee\nOtters;Herons;Alder Green;Ms Pike\n"
                    "Wrens;Wrens;Millbrook;Mr Vale\n", encoding="utf-8")
    view, result = shown(qtbot, path, MATCHING)
    assert [str(p) for p in result.problems] == [
        f"{path}, row 3, column Away team: 'Wrens': Home and Away are the same team"]
    assert result.league.source == str(path)
    view.go_to_problem(view.problem_model.index(0))
    assert current_cell(view) == ("3", "Away team", "Wrens")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["clubs.csv"]  # no copy anywhere


def test_a_shared_column_from_the_matching_makes_clashes(tmp_path):
    path = tmp_path / "clubs.csv"
    path.write_text("Home team;Away team;Ground;Referee\nOtters;Herons;Alder Green;Ms Pike\n"
                    "Wrens;Kites;Millbrook;Mr Vale\nBadgers;Owls;Hill Top;Ms Pike\n",
                    encoding="utf-8")
    result = open_league(path, MATCHING).result
    assert result.ok, [str(p) for p in result.problems]
    graph = build_clash_graph(result.league)
    assert [tuple(sorted(e)) for e in graph.edges] == [("Badgers v Owls", "Otters v Herons")]
    reasons = graph.edges["Otters v Herons", "Badgers v Owls"]["reasons"]
    assert [(r.kind, r.key) for r in reasons] == [("shared", "Referee=Ms Pike")]


def test_preview_rows_follow_quoted_line_breaks_like_the_problems(qtbot, tmp_path):
    path = tmp_path / "league.csv"
    path.write_bytes(b"\xef\xbb\xbfFixture,Home,Away,Venue,Notes\n"
                     b',Otters,Herons,Alder Green,"bring\nboots"\n'
                     b",Wrens,Wrens,Millbrook,\n")
    view, result = shown(qtbot, path)
    assert [str(p) for p in result.problems] == [
        f"{path}, row 3, column Away: 'Wrens': Home and Away are the same team"]
    model = view.tables["fixtures"].model()
    assert [model.headerData(r, Qt.Orientation.Vertical) for r in range(model.rowCount())] == [
        "1", "2", "3"]
    assert model.index(0, 0).data() == "Fixture"  # the byte-order mark is not part of it
    assert model.index(1, 4).data() == "bring\nboots"
    view.go_to_problem(view.problem_model.index(0))
    assert current_cell(view) == ("3", "Away", "Wrens")


def test_workbook_preview_numbers_rows_as_the_spreadsheet_and_shows_error_cells(tmp_path):
    path = tmp_path / "league.xlsx"
    book = Workbook()
    sheet = book.active
    sheet.title = "Fixtures"
    sheet["A1"], sheet["B1"], sheet["C1"] = "Fixture", "Home", "Away"
    sheet["B4"], sheet["C4"] = "Otters", "Herons"
    sheet["A6"] = "#REF!"
    book.save(path)
    assert preview_sheets(path) == {"Fixtures": [
        (1, ["Fixture", "Home", "Away"]), (4, [None, "Otters", "Herons"]), (6, ["#REF!"])]}
    assert preview_sheets(path, limit=2) == {"Fixtures": [
        (1, ["Fixture", "Home", "Away"]), (4, [None, "Otters", "Herons"])]}


def test_an_unreadable_file_has_no_preview(tmp_path):
    path = tmp_path / "junk.xlsx"
    path.write_bytes(b"PK\x03\x04 truncated")
    assert preview_sheets(path) == {}
    assert preview_sheets(tmp_path / "nowhere.csv") == {}

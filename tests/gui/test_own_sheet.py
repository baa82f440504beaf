"""The window on a coordinator's own sheet: a remembered column matching that no longer fits is
forgotten with a notice (the workbook is not blamed); Match columns shows the reader's guess
and the sheet's first rows."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import openpyxl  # noqa: E402
from PySide6.QtWidgets import QApplication  # noqa: E402

from leaguegrid.gui import mapping_dialog  # noqa: E402


def own_book(path, header):
    wb = openpyxl.Workbook()
    sheet = wb.active
    sheet.title = "Fixtures"
    sheet.append(header)
    sheet.append(["Herons", "Otters", "Mill Field", "10:30"])
    sheet.append(["Kites", "Voles", "Brook Lane", None])
    wb.save(path)
    return path


def opened(qtbot, window, path):
    window.open_path(str(path))
    qtbot.waitUntil(lambda: window.doc.result is not None and not window.runner.busy,
                    timeout=30_000)


def test_a_stale_matching_is_dropped_with_a_notice(qtbot, window, settings, tmp_path):
    path = own_book(tmp_path / "spring.xlsx", ["Home", "Away", "Venue", "Time"])
    mapping_dialog.save_mapping(settings, str(path), {"Home": "Hosts", "Away": "Guests"})
    opened(qtbot, window, path)
    assert window.doc.usable
    assert not window.doc.result.problems  # nothing blamed on the workbook
    assert window.tabs.currentWidget() is window.import_view
    assert window.import_view.heading.text() == (
        "The column matching remembered for spring.xlsx no longer fits it (no column 'Guests' "
        "for Away, no column 'Hosts' for Home), so it was dropped and the file read by its "
        "own headers. spring.xlsx: 2 fixtures, 4 teams, 2 venues, 0 clashes.")
    assert mapping_dialog.load_mapping(settings, str(path)) is None
    assert window.doc.mapping is None


def test_match_columns_shows_the_guess_and_the_first_rows(qtbot, window, tmp_path):
    path = own_book(tmp_path / "spring.xlsx", ["Home Team", "Away Team", "Ground", "Kick-off"])
    opened(qtbot, window, path)
    window.act_mapping.trigger()
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(),
                                       mapping_dialog.MappingDialog))
    dialog = QApplication.activeModalWidget()
    chosen = {ours: combo.currentText() for ours, combo in dialog.combos.items()
              if combo.currentText() != mapping_dialog.NONE}
    assert chosen == {"Home": "Home Team", "Away": "Away Team", "Venue": "Ground",
                      "Time": "Kick-off"}
    model = dialog.preview.model()
    assert (model.rowCount(), model.columnCount()) == (3, 4)
    assert [model.index(1, c).data() for c in range(4)] == ["Herons", "Otters", "Mill Field",
                                                            "10:30"]
    dialog.reject()

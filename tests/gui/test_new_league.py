"""Start from nothing: File > New league writes the blank template where the coordinator says,
hands it to the spreadsheet program (a test receiver here, through Qt's URL handlers) and opens
it; a change on disk (saved by renaming a new file over it, as editors do) is read again with
the unsaved pins kept, and a version that cannot be read does not replace them."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from pathlib import Path  # noqa: E402

import pytest  # noqa: E402
from openpyxl import load_workbook  # noqa: E402
from PySide6.QtCore import QObject, QUrl, Slot  # noqa: E402
from PySide6.QtGui import QDesktopServices  # noqa: E402
from PySide6.QtWidgets import QFileDialog  # noqa: E402

from leaguegrid.io.write.blank_league import DIVISION  # noqa: E402

TEMPLATE_FIXTURES = ["Reds v Blues", "Greens v Golds", "Blues v Reds", "Golds v Greens"]


class Opened(QObject):
    """Receives the file URLs QDesktopServices.openUrl is asked to open."""

    def __init__(self) -> None:
        super().__init__()
        self.urls: list[QUrl] = []

    @Slot(QUrl)
    def open(self, url: QUrl) -> None:
        self.urls.append(url)


@pytest.fixture
def opened():
    receiver = Opened()
    QDesktopServices.setUrlHandler("file", receiver, "open")
    yield receiver
    QDesktopServices.unsetUrlHandler("file")


def wait_idle(qtbot, win):
    qtbot.waitUntil(lambda: not win.runner.busy and not win._recount.isActive(), timeout=30_000)


def new_league(qtbot, window, target: Path) -> None:
    window.act_new.trigger()
    qtbot.waitUntil(lambda: window.findChild(QFileDialog, "newLeagueDialog") is not None)
    dialog = window.findChild(QFileDialog, "newLeagueDialog")
    assert Path(dialog.selectedFiles()[0]) == target.parent / "new-league.xlsx"
    dialog.selectFile(str(target))
    dialog.accept()
    qtbot.waitUntil(lambda: window.doc.path == str(target) and window.report is not None,
                    timeout=30_000)
    wait_idle(qtbot, window)


def save_by_rename(path: Path, change) -> None:
    """Change the workbook as a spreadsheet program does: write a new file, rename it over."""
    book = load_workbook(path)
    change(book)
    fresh = path.with_name("~saving.xlsx")
    book.save(fresh)
    os.replace(fresh, path)


def add_fixture(book) -> None:
    sheet = book["Fixtures"]
    headers = [cell.value for cell in sheet[1]]
    row = {"Fixture": "Reds v Greens", "Home": "Example Reds", "Away": "Example Greens",
           "Venue": "Example Park", "Division": DIVISION}
    sheet.append([row.get(h) for h in headers])


def test_new_league_round_trip_reads_the_changed_workbook_and_keeps_the_pin(
        qtbot, window, settings, tmp_path, opened):
    settings.setValue("exportFolder", str(tmp_path))
    target = tmp_path / "my-league.xlsx"
    new_league(qtbot, window, target)
    assert opened.urls == [QUrl.fromLocalFile(str(target))]
    assert load_workbook(target).sheetnames[0] == "Instructions"
    assert [f.label for f in window.doc.league.fixtures] == TEMPLATE_FIXTURES
    assert window.doc.usable and not window.doc.unsaved
    window.pin_fixture("Reds v Blues", 1)
    wait_idle(qtbot, window)

    save_by_rename(target, add_fixture)
    qtbot.waitUntil(lambda: len(window.doc.league.fixtures) == 5, timeout=30_000)
    wait_idle(qtbot, window)
    assert window.fixtures_view.model.rowCount() == 5
    assert window.doc.edits.pins == {"Reds v Blues": 1} and window.doc.unsaved
    assert window.import_view.heading.text().startswith(
        "my-league.xlsx changed on disk and was read again; your unsaved pins, edits and "
        "schedule were kept where their fixtures still exist. my-league.xlsx: 5 fixtures, ")
    assert str(target) in window.watcher.files()  # the renamed-over file is watched again

    target.write_bytes(b"not a workbook any more")
    qtbot.waitUntil(lambda: window.last_error is not None, timeout=30_000)
    assert window.last_error.startswith("my-league.xlsx was read again but cannot be used as "
                                        "it is now (")
    assert len(window.doc.league.fixtures) == 5 and window.doc.edits.pins == {"Reds v Blues": 1}


def test_a_changed_workbook_without_edits_is_simply_read_again(qtbot, window, settings,
                                                               tmp_path, opened):
    settings.setValue("exportFolder", str(tmp_path))
    target = tmp_path / "plain.xlsx"
    new_league(qtbot, window, target)
    save_by_rename(target, add_fixture)
    qtbot.waitUntil(lambda: len(window.doc.league.fixtures) == 5, timeout=30_000)
    wait_idle(qtbot, window)
    assert not window.doc.unsaved
    assert window.import_view.heading.text().startswith(
        "plain.xlsx changed on disk and was read again. plain.xlsx: 5 fixtures, ")


def test_new_league_never_writes_over_a_file(qtbot, window, tmp_path, opened):
    taken = tmp_path / "taken.xlsx"
    taken.write_bytes(b"the coordinator's own file")
    window.new_league_at(str(taken))
    assert taken.read_bytes() == b"the coordinator's own file"
    assert window.last_error == (f"{taken} already exists; LeagueGrid never writes over a "
                                 "file. Choose a new name for the league.")
    assert opened.urls == []

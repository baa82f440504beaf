"""Print and PDF: the window's PDF read back with pypdf (pages, a team's fixtures on its page,
the caution and page number on every page, the paper size), the print preview's pages, and the
layout kept inside the page for a very long team name and a grid of many pitches.

Paper sizes from ISO 216 (A4: 210 mm x 297 mm = 595.28 pt x 841.89 pt) and ANSI/ASME Y14.1
(Letter: 8.5 in x 11 in = 612 pt x 792 pt), 1 pt = 1/72 in.
"""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

import io  # noqa: E402
import threading  # noqa: E402
from pathlib import Path  # noqa: E402

import pytest  # noqa: E402
from pypdf import PdfReader  # noqa: E402
from PySide6.QtCore import QLocale  # noqa: E402
from PySide6.QtGui import QPdfWriter  # noqa: E402
from PySide6.QtPrintSupport import QPrintPreviewDialog, QPrintPreviewWidget  # noqa: E402
from PySide6.QtWidgets import QApplication  # noqa: E402

from leaguegrid import engine  # noqa: E402
from leaguegrid.app.printout import build_printout  # noqa: E402
from leaguegrid.core.model import Fixture, League, Schedule  # noqa: E402
from leaguegrid.core.wording import CAUTION  # noqa: E402
from leaguegrid.gui import pdf_dialog  # noqa: E402
from leaguegrid.gui.print_flows import pdf_job  # noqa: E402
from leaguegrid.gui.print_pages import (  # noqa: E402
    Typesetter,
    default_paper,
    page_layout,
    pdf_bytes,
)
from leaguegrid.io.read.league_reader import load_league  # noqa: E402

DEMOS = Path(__file__).resolve().parents[2] / "demo_leagues"
A4 = (595.28, 841.89)
LETTER = (612.0, 792.0)


def words(text: str) -> str:
    return " ".join(text.split())


def text_starts(page) -> list[tuple[float, float]]:
    """Where each piece of text on the page starts, in points from the page's lower left."""
    spots: list[tuple[float, float]] = []

    def visit(text, cm, tm, _font, _size):
        if text.strip():  # the text matrix's origin mapped by the current matrix
            spots.append((cm[0] * tm[4] + cm[2] * tm[5] + cm[4],
                          cm[1] * tm[4] + cm[3] * tm[5] + cm[5]))

    page.extract_text(visitor_text=visit)
    return spots


def page_size(page) -> tuple[float, float]:
    box = page.mediabox
    return float(box.width), float(box.height)


def is_paper(page, paper: tuple[float, float]) -> bool:
    """The page's media box is `paper` to the whole point (Qt writes it in whole points)."""
    return all(abs(a - b) < 1 for a, b in zip(page_size(page), paper, strict=True))


@pytest.fixture
def drawn(qtbot, window, settings):
    """The window on the season demo with a schedule drawn for the fewest rounds."""
    settings.setValue("countBudget", 3)
    window.open_path(str(DEMOS / "season.xlsx"))
    qtbot.waitUntil(lambda: window.report is not None, timeout=60_000)
    window.act_draw.trigger()
    qtbot.waitUntil(lambda: window.doc.schedule is not None and not window.runner.busy,
                    timeout=60_000)
    return window


def test_the_window_writes_a_pdf_with_a_page_per_round_team_and_venue(qtbot, drawn, tmp_path):
    window = drawn
    league = load_league(DEMOS / "season.xlsx").league
    schedule = window.doc.schedule
    teams = sorted({t for f in league.fixtures for t in (f.home, f.away)})
    venues = {f.venue for f in league.fixtures}
    target = tmp_path / "out" / "season.pdf"
    target.parent.mkdir()
    assert window.act_pdf.isEnabled() and window.act_print.isEnabled()
    window.export_pdf(str(target), "A4")
    qtbot.waitUntil(lambda: not window.runner.busy, timeout=60_000)
    assert window.last_export == [str(target)], window.last_error
    assert [p.name for p in target.parent.iterdir()] == ["season.pdf"]  # no temporary file left

    pages = PdfReader(target).pages
    expected = schedule.rounds + len(teams) + len(venues)
    assert (len(teams), len(venues)) == (12, 9)
    assert len(pages) == expected
    assert window.stage_label.text() == f"Wrote {expected} pages to {target}."
    texts = [words(page.extract_text()) for page in pages]
    for number, text in enumerate(texts, start=1):
        assert words(CAUTION) in words(text)
        assert f"Page {number} of {expected}" in text
        assert is_paper(pages[number - 1], A4)
    for number in range(1, schedule.rounds + 1):
        text = texts[number - 1]
        assert f"Round {number}" in text
        for f in league.fixtures:
            if schedule.assignment[f.label] == number:
                assert f.home in text and f.away in text and f.venue in text
    team = teams[0]
    text = texts[schedule.rounds]
    mine = [f for f in league.fixtures if team in (f.home, f.away)]
    assert words(text).startswith(f"{league.settings.league} · Teams {team}")
    for f in mine:
        assert (f.away if f.home == team else f.home) in text
        assert f.venue in text
    home = sum(1 for f in mine if f.home == team)
    byes = schedule.rounds - len({schedule.assignment[f.label] for f in mine})
    assert (f"{home} home games, {len(mine) - home} away games, {byes} bye"
            f"{'s' * (byes != 1)}") in words(text)
    assert texts[-1].count("Venue ") >= 1


def test_the_pdf_dialog_offers_the_export_folder_and_the_locale_paper(qtbot, drawn, settings,
                                                                       tmp_path):
    settings.setValue("exportFolder", str(tmp_path))
    drawn.act_pdf.trigger()
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(), pdf_dialog.PdfDialog))
    dialog = QApplication.activeModalWidget()
    assert dialog.path.text() == str(tmp_path / "Hollowmere-Junior-League-schedule.pdf")
    assert dialog.paper.currentText() == default_paper()
    dialog.paper.setCurrentText("Letter")
    dialog.path.setText(str(tmp_path / "letter"))
    dialog.write_button.click()
    qtbot.waitUntil(lambda: not drawn.runner.busy and bool(drawn.last_export), timeout=60_000)
    assert drawn.last_export == [str(tmp_path / "letter.pdf")]
    assert is_paper(PdfReader(tmp_path / "letter.pdf").pages[0], LETTER)
    assert settings.value("printPaper") == "Letter"


def test_print_and_pdf_wait_for_a_schedule(window):
    assert not window.act_print.isEnabled()
    assert not window.act_pdf.isEnabled()
    assert "Export PD&F…" in [a.text() for a in window.menuBar().actions()[0].menu().actions()]


def test_a_pdf_that_cannot_be_written_says_why(qtbot, drawn, tmp_path):
    target = tmp_path / "missing" / "x.pdf"
    drawn.export_pdf(str(target), "A4")
    qtbot.waitUntil(lambda: not drawn.runner.busy, timeout=60_000)
    assert drawn.last_error == (f"could not write {target}: the folder does not exist; "
                               "nothing there was changed")
    assert drawn.last_export == []
    assert not target.parent.exists()


def test_a_pdf_asked_for_while_counting_waits_for_the_count(qtbot, drawn, tmp_path):
    stopped: list[str] = []
    drawn.runner.cancelled.connect(stopped.append)
    drawn.report = None
    drawn.compute_counts()
    target = tmp_path / "after-count.pdf"
    drawn.export_pdf(str(target), "A4")
    assert drawn.runner.current_name == "Counting"
    assert drawn.stage_label.text() == "Writing the PDF: waiting for Counting to end…"
    qtbot.waitUntil(lambda: bool(drawn.last_export), timeout=60_000)
    assert drawn.report is not None  # the count finished: it was not cancelled for the PDF
    assert stopped == []
    assert drawn.last_export == [str(target)]
    assert len(PdfReader(target).pages) == drawn.doc.schedule.rounds + 12 + 9


def test_the_print_preview_paints_every_page(qtbot, drawn):
    printout = build_printout(drawn.doc.working_league(), drawn.doc.schedule)
    drawn.act_print.trigger()
    qtbot.waitUntil(lambda: isinstance(QApplication.activeModalWidget(), QPrintPreviewDialog))
    preview = QApplication.activeModalWidget().findChild(QPrintPreviewWidget)
    qtbot.waitUntil(lambda: preview.pageCount() > 0, timeout=30_000)
    assert preview.pageCount() == len(printout.parts) == drawn.doc.schedule.rounds + 12 + 9
    QApplication.activeModalWidget().reject()


@pytest.mark.parametrize(("name", "territory"), [("en_US", "Letter"), ("fr_CA", "Letter"),
                                                 ("en_GB", "A4"), ("de_DE", "A4"),
                                                 ("es_MX", "A4")])
def test_letter_in_the_us_and_canada_a4_elsewhere(name, territory):
    assert default_paper(QLocale(name)) == territory


LONG = "The Very Long Named Under Eleven Girls Development Squad of Kestrelmoor Rover FC"
UNBROKEN = "X" * 80


def assert_inside(setter: Typesetter, printout, pages) -> None:
    """Every line inside the page's paint area, no wider than its box, and above the footer
    unless it is the footer."""
    footer_top = setter.area.bottom() - setter.footer_height(printout.caution)
    for page in pages:
        for box in page.boxes:
            assert setter.area.contains(box.rect), (box.text, box.rect)
            assert setter.width_of(box.text, box.style) <= box.rect.width() + 0.5, box.text
            if box.style != "footer":
                assert box.rect.bottom() <= footer_top, (box.text, page.part)


def wide_league() -> tuple[League, Schedule]:
    """A team named with 80 characters, one named by 80 letters without a space, and a ground of
    twelve pitches."""
    assert len(LONG) == len(UNBROKEN) == 80
    others = [f"Team {i}" for i in range(1, 13)]
    fixtures = [Fixture(f"{LONG} v {o}", LONG, o, "Big Park", f"Pitch {i}")
                for i, o in enumerate(others, start=1)]
    fixtures.append(Fixture(f"{UNBROKEN} v Team 1", UNBROKEN, "Team 1", "Small Park"))
    assignment = {f.label: i for i, f in enumerate(fixtures, start=1)}
    return League("wide", "", fixtures), Schedule(len(fixtures), assignment)


def crowded_league() -> tuple[League, Schedule]:
    """150 fixtures without teams at one ground in one round: one grid cell taller than a page."""
    fixtures = [Fixture(f"Session {i}", venue="Hall") for i in range(1, 151)]
    return League("crowded", "", fixtures), Schedule(1, {f.label: 1 for f in fixtures})


def test_a_cell_taller_than_a_page_runs_on_and_never_into_the_footer(qapp):
    league, schedule = crowded_league()
    printout = build_printout(league, schedule)
    writer = QPdfWriter(os.devnull)
    writer.setResolution(300)
    writer.setPageLayout(page_layout("A4"))
    setter = Typesetter(writer)
    pages = setter.lay_out(printout)
    venue = [p for p in pages if printout.parts[p.part].title == "Venue Hall"]
    assert len(venue) >= 2
    assert_inside(setter, printout, pages)
    cells = [b.text for p in venue for b in p.boxes if b.style == "cell"]
    assert [c for c in cells if c.startswith("Session")] == [f"Session {i}"
                                                             for i in range(1, 151)]


def test_a_long_team_name_wraps_inside_the_page_and_a_wide_grid_splits(qapp):
    league, schedule = wide_league()
    printout = build_printout(league, schedule)
    writer = QPdfWriter(os.devnull)
    writer.setResolution(300)
    writer.setPageLayout(page_layout("A4"))
    setter = Typesetter(writer)
    pages = setter.lay_out(printout)
    assert_inside(setter, printout, pages)
    for name in (LONG, UNBROKEN):
        title = [p for p in pages if printout.parts[p.part].title == name][0]
        lines = [b.text for b in title.boxes if b.style == "title"]
        assert len(lines) >= 2  # too long for one line at the title's size
        assert "".join(lines).replace(" ", "") == name.replace(" ", "")
    venue = next(p for p in pages if printout.parts[p.part].title == "Venue Big Park")
    headers = [b.text for b in venue.boxes if b.style == "header"]
    assert headers.count("Round") >= 2  # twelve pitches do not fit side by side: split
    on_first_page = [h for h in headers if h.startswith("Pitch")]
    assert on_first_page[:6] == [f"Pitch {i}" for i in range(1, 7)]
    # the second band runs on to the next page, under the title "(continued)" and its header
    assert len(pages) == len(printout.parts) + 1 == 13 + 14 + 2 + 1
    after = pages[pages.index(venue) + 1]
    assert after.part == venue.part
    assert [b.text for b in after.boxes if b.style == "title"] == [
        "Venue Big Park (continued)"]
    assert [b.text for b in after.boxes if b.style == "header"][:2] == ["Round", "Pitch 7"]
    headers += [b.text for b in after.boxes if b.style == "header"]
    assert {h for h in headers if h.startswith("Pitch")} == {f"Pitch {i}" for i in range(1, 13)}

    data, count = pdf_bytes(printout, "Letter")
    reader = PdfReader(io.BytesIO(data))
    assert len(reader.pages) == count >= len(printout.parts)  # Letter is shorter than A4
    for page in reader.pages:
        assert is_paper(page, LETTER)
        width, height = page_size(page)
        spots = text_starts(page)
        assert spots
        margin = 15 / 25.4 * 72  # page_layout's 15 mm, in points
        assert all(margin - 1 <= x <= width - margin and margin <= y <= height - margin
                   for x, y in spots), spots


def test_a_cancelled_pdf_job_writes_nothing(tmp_path):
    league, schedule = wide_league()
    stop = threading.Event()
    stop.set()
    with pytest.raises(engine.Cancelled):
        pdf_job(league, schedule, "A4", str(tmp_path / "x.pdf"), engine.Hooks(cancel=stop))
    assert list(tmp_path.iterdir()) == []

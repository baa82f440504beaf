"""A printout laid out on paper and painted: every part on a new page, tables as wide as the page
and no wider (columns share the width and wrap their text, a grid with too many columns is split
into bands that repeat its first columns), the running head at the top and the caution with
"Page 3 of 12" at the foot of every page.

The layout measures text with the device's own font metrics (QTextLayout) and returns, page by
page, the rectangle of every line of text, so what is painted is what was measured; a line is
never wider than its rectangle and no rectangle leaves the page's paint area.
"""

from __future__ import annotations

from collections.abc import Iterator
from dataclasses import dataclass, field

from PySide6.QtCore import (
    QBuffer,
    QByteArray,
    QIODevice,
    QLineF,
    QLocale,
    QMarginsF,
    QPointF,
    QRectF,
)
from PySide6.QtGui import (
    QFont,
    QFontMetricsF,
    QPagedPaintDevice,
    QPageLayout,
    QPageSize,
    QPaintDevice,
    QPainter,
    QPdfWriter,
    QPen,
    QTextLayout,
    QTextOption,
)

from leaguegrid.app.printout import Part, Printout, Table
from leaguegrid.core.wording import continued, page_text
from leaguegrid.engine import Hooks

PAPERS = {"A4": QPageSize.PageSizeId.A4, "Letter": QPageSize.PageSizeId.Letter}
LETTER_TERRITORIES = (QLocale.Country.UnitedStates, QLocale.Country.Canada)
MARGIN_MM = 15.0
PDF_DPI = 300
POINT_SIZES = {"head": 8.0, "title": 14.0, "line": 9.5, "header": 9.0, "cell": 9.0,
               "note": 9.0, "footer": 7.5}
BOLD = ("title", "header")
MIN_COLUMN_EM = 3.0  # no column narrower than three letters
BAND_COLUMN_EM = 9.0  # a split grid's columns are at least this wide


def default_paper(locale: QLocale | None = None) -> str:
    """Letter in the United States and Canada, A4 everywhere else."""
    territory = (locale or QLocale()).territory()
    return "Letter" if territory in LETTER_TERRITORIES else "A4"


def page_layout(paper: str) -> QPageLayout:
    """Portrait `paper` ("A4" or "Letter") with 15 mm margins."""
    return QPageLayout(QPageSize(PAPERS[paper]), QPageLayout.Orientation.Portrait,
                       QMarginsF(MARGIN_MM, MARGIN_MM, MARGIN_MM, MARGIN_MM),
                       QPageLayout.Unit.Millimeter)


@dataclass(frozen=True)
class Box:
    """One line of text, in the style it is painted in, and the rectangle it fits in."""

    rect: QRectF
    text: str
    style: str


@dataclass
class Page:
    """A laid-out page: the part it belongs to (its index), its lines of text and its rules."""

    part: int
    boxes: list[Box] = field(default_factory=list)
    rules: list[QLineF] = field(default_factory=list)


class Typesetter:
    """Lays a printout out on pages of a paint device, measuring with the device's fonts."""

    def __init__(self, device: QPaintDevice) -> None:
        self.device = device
        self.area = QRectF(0, 0, device.width(), device.height())
        self.fonts = {}
        for style, size in POINT_SIZES.items():
            font = QFont("Sans Serif")
            font.setPointSizeF(size)
            font.setBold(style in BOLD)
            self.fonts[style] = font
        self.metrics = {s: QFontMetricsF(f, device) for s, f in self.fonts.items()}
        self.em = self.metrics["cell"].horizontalAdvance("M")
        self.pad = self.em * 0.3
        self.gap = self.metrics["line"].lineSpacing() * 0.5
        self._widths: dict[tuple[str, str], float] = {}
        self.option = QTextOption()
        self.option.setWrapMode(QTextOption.WrapMode.WrapAtWordBoundaryOrAnywhere)

    # text ------------------------------------------------------------------------------------
    def line_height(self, style: str) -> float:
        return self.metrics[style].lineSpacing()

    def advance(self, text: str, style: str) -> float:
        """The width of `text` on one line (measured once per text and style)."""
        width = self._widths.get((text, style))
        if width is None:
            width = self._widths[(text, style)] = self.metrics[style].horizontalAdvance(text)
        return width

    def width_of(self, text: str, style: str) -> float:
        """The widest line of `text` set on one line each."""
        return max((self.advance(t, style) for t in text.split("\n")), default=0.0)

    def wrap(self, text: str, style: str, width: float) -> list[str]:
        """`text` broken into lines no wider than `width`: at spaces where it can, anywhere in a
        word longer than the width; a newline always starts a line."""
        out: list[str] = []
        for paragraph in text.split("\n"):
            if not paragraph or self.advance(paragraph, style) <= width:
                out.append(paragraph)
                continue
            layout = QTextLayout(paragraph, self.fonts[style], self.device)
            layout.setTextOption(self.option)
            layout.beginLayout()
            while True:
                line = layout.createLine()
                if not line.isValid():
                    break
                line.setLineWidth(width)
                part = paragraph[line.textStart():line.textStart() + line.textLength()]
                out.append(part.rstrip())
            layout.endLayout()
        return out

    # pages -----------------------------------------------------------------------------------
    def footer_height(self, caution: str) -> float:
        lines = len(self.wrap(caution, "footer", self.area.width())) + 1
        return lines * self.line_height("footer") + self.gap

    def lay_out(self, printout: Printout, hooks: Hooks | None = None) -> list[Page]:
        """Every page of the printout, footers numbered 'Page n of N' (progress and cancel by
        `hooks`, part by part)."""
        hooks = hooks or Hooks()
        body = QRectF(self.area)
        body.setBottom(self.area.bottom() - self.footer_height(printout.caution))
        pages: list[Page] = []
        for index, part in enumerate(printout.parts):
            hooks.check()
            hooks.report(index / len(printout.parts), f"Laying out {part.title}")
            pages += _PartWriter(self, body, printout.league, index, part).pages()
        for number, page in enumerate(pages, start=1):
            self._footer(page, printout.caution, page_text(number, len(pages)))
        return pages

    def _footer(self, page: Page, caution: str, number: str) -> None:
        width, step = self.area.width(), self.line_height("footer")
        lines = [*self.wrap(caution, "footer", width), number]
        y = self.area.bottom() - len(lines) * step
        page.rules.append(QLineF(0, y - self.gap / 2, width, y - self.gap / 2))
        for text in lines:
            page.boxes.append(Box(QRectF(0, y, width, step), text, "footer"))
            y += step

    def natural_widths(self, table: Table, columns: list[int]) -> list[float]:
        """Each column's width with every cell on one line (and its padding)."""
        return [max([self.width_of(table.columns[c], "header"),
                     *(self.width_of(row[c], "cell") for row in table.rows)]) + 2 * self.pad
                for c in columns]

    def column_widths(self, table: Table, columns: list[int], width: float) -> list[float]:
        """Widths of `columns` of `table` filling `width`: natural widths grown alike where all
        fit, else the narrow ones keep theirs and the wide ones share what is left by width."""
        natural = self.natural_widths(table, columns)
        if sum(natural) <= width:  # room to spare: each column grows by its share of the width
            return [n * width / sum(natural) for n in natural]
        widths: list[float | None] = [None] * len(natural)
        left, open_ = width, list(range(len(natural)))
        while open_:
            share = left / len(open_)
            narrow = [i for i in open_ if natural[i] <= share]
            if not narrow:
                break
            for i in narrow:
                widths[i] = natural[i]
                left -= natural[i]
            open_ = [i for i in open_ if i not in narrow]
        wide = sum(natural[i] for i in open_)
        for i in open_:
            widths[i] = left * natural[i] / wide
        return [w if w is not None else 0.0 for w in widths]

    def bands(self, table: Table, width: float) -> list[list[int]]:
        """The table's columns in bands that fit `width` side by side (each band repeating the
        `keep` first columns); one band when no split is asked for or needed."""
        count = len(table.columns)
        if not table.keep or count <= table.keep:
            return [list(range(count))]
        kept = list(range(table.keep))
        room = width - sum(self.natural_widths(table, kept))
        least = BAND_COLUMN_EM * self.em
        out: list[list[int]] = []
        band: list[int] = []
        used = 0.0
        for c, natural in zip(range(table.keep, count),
                              self.natural_widths(table, list(range(table.keep, count))),
                              strict=True):
            need = min(natural, least)
            if band and used + need > room:
                out.append(kept + band)
                band, used = [], 0.0
            band.append(c)
            used += need
        return [*out, kept + band]


class _PartWriter:
    """Fills pages with one part: its title, lines, table (band by band) and notes."""

    def __init__(self, setter: Typesetter, body: QRectF, league: str, index: int,
                 part: Part) -> None:
        self.t, self.body, self.part, self.index = setter, body, part, index
        self.head = f"{league} · {part.head}"
        self.done: list[Page] = []
        self.page = self._new_page(part.title)

    def pages(self) -> list[Page]:
        width = self.body.width()
        for text in self.part.lines:
            self._paragraph(text, "line")
        bands = self.t.bands(self.part.table, width)
        for columns in bands:
            self._table(self.part.table, columns, width)
        for text in self.part.notes:
            self._paragraph(text, "note")
        self.done.append(self.page)
        return self.done

    # placing ---------------------------------------------------------------------------------
    def _new_page(self, title: str) -> Page:
        page = Page(self.index)
        self.y = self.body.top()
        self.page = page
        self._lines(self.t.wrap(self.head, "head", self.body.width()), "head", 0.0,
                    self.body.width())
        self.y += self.t.gap / 2
        self._lines(self.t.wrap(title, "title", self.body.width()), "title", 0.0,
                    self.body.width())
        self.y += self.t.gap / 2
        return page

    def _next_page(self) -> None:
        self.done.append(self.page)
        self._new_page(continued(self.part.title))

    def _room(self) -> float:
        return self.body.bottom() - self.y

    def _lines(self, lines: list[str], style: str, x: float, width: float) -> None:
        step = self.t.line_height(style)
        for text in lines:
            self.page.boxes.append(Box(QRectF(x, self.y, width, step), text, style))
            self.y += step

    def _paragraph(self, text: str, style: str) -> None:
        lines = self.t.wrap(text, style, self.body.width())
        step = self.t.line_height(style)
        for line in lines:
            if step > self._room():
                self._next_page()
            self._lines([line], style, 0.0, self.body.width())
        self.y += self.t.gap / 3

    def _table(self, table: Table, columns: list[int], width: float) -> None:
        widths = self.t.column_widths(table, columns, width)
        header = [self._cell_lines(table.columns[c], "header", w) for c, w in zip(
            columns, widths, strict=True)]
        header_height = self._row_height(header, "header")
        step = self.t.line_height("cell")
        if header_height + step > self._room():
            self._next_page()
        self._row(header, widths, "header", header_height)
        for row in table.rows:
            cells = [self._cell_lines(row[c], "cell", w) for c, w in zip(columns, widths,
                                                                            strict=True)]
            for piece in self._pieces(cells, header_height):
                height = self._row_height(piece, "cell")
                if height > self._room():
                    self._next_page()
                    self._row(header, widths, "header", header_height)
                self._row(piece, widths, "cell", height)
        self.y += self.t.gap

    def _cell_lines(self, text: str, style: str, width: float) -> list[str]:
        return self.t.wrap(text, style, max(width - 2 * self.t.pad, self.t.em))

    def _row_height(self, cells: list[list[str]], style: str) -> float:
        return max(len(c) for c in cells) * self.t.line_height(style) + 2 * self.t.pad

    def _pieces(self, cells: list[list[str]], header_height: float) -> Iterator[list[list[str]]]:
        """The row as one piece, or in pieces that each fit a fresh page under the header."""
        t, width = self.t, self.body.width()
        top_matter = (len(t.wrap(self.head, "head", width)) * t.line_height("head")
                      + len(t.wrap(continued(self.part.title), "title", width))
                      * t.line_height("title") + t.gap)
        full = self.body.height() - top_matter - header_height
        most = max(1, int((full - 2 * t.pad) // t.line_height("cell")))
        tallest = max(len(c) for c in cells)
        for start in range(0, tallest, most):
            yield [c[start:start + most] for c in cells]

    def _row(self, cells: list[list[str]], widths: list[float], style: str,
             height: float) -> None:
        top, x, pad = self.y, 0.0, self.t.pad
        step = self.t.line_height(style)
        for lines, width in zip(cells, widths, strict=True):
            for i, text in enumerate(lines):
                if text:
                    rect = QRectF(x + pad, top + pad + i * step, width - 2 * pad, step)
                    self.page.boxes.append(Box(rect, text, style))
            x += width
        self.page.rules.append(QLineF(0, top + height, x, top + height))
        if style == "header":
            self.page.rules.append(QLineF(0, top, x, top))
        self.y = top + height


def paint_page(painter: QPainter, setter: Typesetter, page: Page) -> None:
    """Paint one laid-out page with `painter` (open on the device `setter` measured)."""
    pen = QPen()
    pen.setWidthF(max(setter.device.logicalDpiX() / 200, 1.0))
    painter.setPen(pen)
    painter.drawLines(page.rules)
    by_style: dict[str, list[Box]] = {}
    for box in page.boxes:
        by_style.setdefault(box.style, []).append(box)
    for style, boxes in by_style.items():  # one font change per style
        painter.setFont(setter.fonts[style])
        ascent = setter.metrics[style].ascent()
        for box in boxes:
            painter.drawText(QPointF(box.rect.left(), box.rect.top() + ascent), box.text)


def paint(printout: Printout, device: QPagedPaintDevice, hooks: Hooks | None = None) -> list[Page]:
    """Lay `printout` out on `device` and paint every page (a new page between them), reporting
    progress to `hooks` and stopping (engine.Cancelled) when they are cancelled; returns the
    pages as laid out."""
    hooks = hooks or Hooks()
    painter = QPainter(device)
    try:
        setter = Typesetter(device)
        with hooks.window(0.0, 0.5) as laying:
            pages = setter.lay_out(printout, laying)
        for number, page in enumerate(pages):
            hooks.check()
            hooks.report(0.5 + 0.5 * number / len(pages),
                         f"Painting {page_text(number + 1, len(pages)).lower()}")
            if number:
                device.newPage()
            paint_page(painter, setter, page)
        return pages
    finally:
        painter.end()


def pdf_bytes(printout: Printout, paper: str, hooks: Hooks | None = None) -> tuple[bytes, int]:
    """The printout as a PDF on `paper`, in memory, and its number of pages."""
    data = QByteArray()
    buffer = QBuffer(data)
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    writer = QPdfWriter(buffer)
    writer.setResolution(PDF_DPI)
    writer.setPageLayout(page_layout(paper))
    writer.setTitle(printout.league)
    writer.setCreator("LeagueGrid")
    pages = paint(printout, writer, hooks)  # the painter's end finishes the file
    buffer.close()
    return bytes(data.data()), len(pages)

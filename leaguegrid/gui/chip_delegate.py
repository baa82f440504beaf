"""How a schedule grid cell is drawn: its fixtures as chips stacked top to bottom, each filled
with its round's colour and outlined by its state (selected, breaking a rule, clashing with the
selected fixture); the same geometry says which chip a point is on."""

from __future__ import annotations

from PySide6.QtCore import QModelIndex, QPoint, QRect, QSize, Qt
from PySide6.QtGui import QFontMetrics, QPainter, QPalette, QPen, QPixmap
from PySide6.QtWidgets import QStyle, QStyledItemDelegate, QStyleOptionViewItem, QWidget

from leaguegrid.gui import palette
from leaguegrid.gui.schedule_model import ScheduleGridModel

MARGIN = 3  # around the chips of a cell
GAP = 2  # between two chips
PAD = 3  # inside a chip, around its text


def chip_height(metrics: QFontMetrics) -> int:
    return metrics.height() + 2 * PAD


def chip_rects(cell: QRect, count: int, metrics: QFontMetrics) -> list[QRect]:
    """Where the `count` chips of a cell are drawn."""
    h = chip_height(metrics)
    return [QRect(cell.left() + MARGIN, cell.top() + MARGIN + i * (h + GAP),
                  cell.width() - 2 * MARGIN, h) for i in range(count)]


def chip_at(cell: QRect, labels: list[str], metrics: QFontMetrics, point: QPoint) -> str | None:
    """The fixture whose chip is under `point`, or None."""
    for label, rect in zip(labels, chip_rects(cell, len(labels), metrics), strict=True):
        if rect.contains(point):
            return label
    return None


def paint_chip(painter: QPainter, rect: QRect, model: ScheduleGridModel, label: str,
               pal: QPalette) -> None:
    """One fixture's chip: the round's fill, an outline for its state, its text."""
    painter.save()
    painter.setRenderHint(QPainter.RenderHint.Antialiasing)
    highlight = pal.color(QPalette.ColorRole.Highlight)
    if label == model.selected:
        pen = QPen(highlight, 3)
    elif label in model.broken:
        pen = QPen(palette.conflict_colour(pal), 2)
    elif label in model.near:
        pen = QPen(highlight, 2, Qt.PenStyle.DashLine)
    else:
        pen = QPen(pal.color(QPalette.ColorRole.Mid), 1)
    painter.setPen(pen)
    painter.setBrush(palette.round_colour(model.round_of.get(label, 0), pal))
    painter.drawRoundedRect(rect.adjusted(1, 1, -1, -1), 3, 3)
    painter.setPen(pal.color(QPalette.ColorRole.Text))
    painter.drawText(rect.adjusted(PAD + 1, 0, -PAD, 0),
                     Qt.AlignmentFlag.AlignVCenter | Qt.AlignmentFlag.AlignLeft,
                     model.chip_text(label))
    painter.restore()


def chip_pixmap(widget: QWidget, model: ScheduleGridModel, label: str) -> QPixmap:
    """A picture of one chip, to show under the pointer while it is dragged."""
    metrics = widget.fontMetrics()
    size = QSize(metrics.horizontalAdvance(model.chip_text(label)) + 2 * PAD + 4,
                 chip_height(metrics))
    pixmap = QPixmap(size)
    pixmap.fill(Qt.GlobalColor.transparent)
    painter = QPainter(pixmap)
    painter.setFont(widget.font())
    paint_chip(painter, QRect(QPoint(0, 0), size), model, label, widget.palette())
    painter.end()
    return pixmap


class ChipDelegate(QStyledItemDelegate):
    """Draws a grid cell's fixtures as chips and sizes the cell to hold them."""

    def paint(self, painter: QPainter, option: QStyleOptionViewItem,
              index: QModelIndex) -> None:
        model = index.model()
        assert isinstance(model, ScheduleGridModel)
        style = option.widget.style() if option.widget is not None else None
        if style is not None:
            style.drawPrimitive(QStyle.PrimitiveElement.PE_PanelItemViewItem, option, painter,
                                option.widget)
        labels = model.labels_at(index.row(), index.column())
        painter.setFont(option.font)
        for label, rect in zip(labels, chip_rects(option.rect, len(labels), option.fontMetrics),
                               strict=True):
            paint_chip(painter, rect, model, label, option.palette)

    def sizeHint(self, option: QStyleOptionViewItem, index: QModelIndex) -> QSize:  # noqa: N802
        model = index.model()
        assert isinstance(model, ScheduleGridModel)
        labels = model.labels_at(index.row(), index.column())
        metrics = option.fontMetrics
        width = max((metrics.horizontalAdvance(model.chip_text(x)) for x in labels), default=0)
        count = max(len(labels), 1)
        return QSize(width + 2 * (PAD + MARGIN) + 4,
                     count * chip_height(metrics) + (count - 1) * GAP + 2 * MARGIN)

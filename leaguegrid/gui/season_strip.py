"""How a round of a team's strip is drawn: filled by its side (home, away, bye), its letter on
top, and a break marked twice more, by a bar along its foot and the break mark after the
letter; so it reads without colour. The legend is painted by the same code."""

from __future__ import annotations

from PySide6.QtCore import QModelIndex, QRect, QSize, Qt
from PySide6.QtGui import QFontMetrics, QPainter, QPalette, QPixmap
from PySide6.QtWidgets import (
    QHBoxLayout,
    QLabel,
    QStyle,
    QStyledItemDelegate,
    QStyleOptionViewItem,
    QWidget,
)

from leaguegrid.core import wording
from leaguegrid.gui import palette
from leaguegrid.gui.table_model import Role

SIDE_ROLE = Role.UserRole + 1  # "home", "away" or "bye" on a round's cell
BREAK_ROLE = Role.UserRole + 2  # True on a round's cell holding a break
BAR = 3  # height of the break bar, in pixels
INSET = 2  # between the cell's edge and its fill


def paint_round(painter: QPainter, rect: QRect, side: str, letter: str, is_break: bool,
                pal: QPalette) -> None:
    """One round of a strip: the side's fill in a thin frame, the letter, and the bar of a
    break."""
    painter.save()
    inner = rect.adjusted(INSET, INSET, -INSET, -INSET)
    painter.fillRect(inner, palette.side_colour(side, pal))
    painter.setPen(pal.color(QPalette.ColorRole.Mid))
    painter.drawRect(inner.adjusted(0, 0, -1, -1))
    text = pal.color(QPalette.ColorRole.Text)
    if is_break:
        painter.fillRect(QRect(inner.left(), inner.bottom() - BAR + 1, inner.width(), BAR), text)
    painter.setPen(text)
    painter.drawText(inner, Qt.AlignmentFlag.AlignCenter, letter)
    painter.restore()


def strip_size(metrics: QFontMetrics, text: str = "HH") -> QSize:
    """The size of a strip cell holding `text` (two letters at the least) in a font."""
    return QSize(max(metrics.horizontalAdvance(text), metrics.horizontalAdvance("HH"))
                 + 4 * INSET + 6, metrics.height() + 2 * INSET + BAR + 4)


class StripDelegate(QStyledItemDelegate):
    """Draws the round cells of the Teams table (those with a side); other cells as usual."""

    def paint(self, painter: QPainter, option: QStyleOptionViewItem,
              index: QModelIndex) -> None:
        side = index.data(SIDE_ROLE)
        if side is None:
            super().paint(painter, option, index)
            return
        style = option.widget.style() if option.widget is not None else None
        if style is not None:
            style.drawPrimitive(QStyle.PrimitiveElement.PE_PanelItemViewItem, option, painter,
                                option.widget)
        painter.setFont(option.font)
        paint_round(painter, option.rect, side, str(index.data(Role.DisplayRole) or ""),
                    bool(index.data(BREAK_ROLE)), option.palette)

    def sizeHint(self, option: QStyleOptionViewItem, index: QModelIndex) -> QSize:  # noqa: N802
        if index.data(SIDE_ROLE) is None:
            return super().sizeHint(option, index)
        return strip_size(option.fontMetrics, str(index.data(Role.DisplayRole) or ""))


def legend(parent: QWidget | None = None) -> QWidget:
    """A row explaining every fill, letter and mark of the strip (wording.SEASON_LEGEND)."""
    box = QWidget(parent)
    box.setObjectName("seasonLegend")
    box.setAccessibleName("Legend of the team strips")
    row = QHBoxLayout(box)
    row.setContentsMargins(0, 0, 0, 0)
    size = strip_size(box.fontMetrics())
    for side, is_break, text in wording.SEASON_LEGEND:
        letter = wording.SIDE_LETTERS[side] + (wording.BREAK_MARK if is_break else "")
        pixmap = QPixmap(size)
        pixmap.fill(Qt.GlobalColor.transparent)
        painter = QPainter(pixmap)
        painter.setFont(box.font())
        paint_round(painter, QRect(0, 0, size.width(), size.height()), side, letter, is_break,
                    box.palette())
        painter.end()
        swatch = QLabel()
        swatch.setPixmap(pixmap)
        swatch.setAccessibleName(f"{letter}: {text}")
        words = QLabel(text)
        words.setAccessibleName(f"{letter}: {text}")
        row.addWidget(swatch)
        row.addWidget(words)
        row.addSpacing(12)
    row.addStretch(1)
    return box

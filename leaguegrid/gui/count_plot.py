"""The counts drawn against the round count on a log scale, with QPainter only.

Exact counts are filled dots joined by a line; estimates are hollow dots with a bar from low to
high; the fewest rounds is marked by a dashed line. Colours come from the widget's palette.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from PySide6.QtCore import QPointF, QRectF, QSize, Qt
from PySide6.QtGui import QFontMetricsF, QPainter, QPainterPath, QPalette, QPen
from PySide6.QtWidgets import QSizePolicy, QWidget

from leaguegrid.core import wording


@dataclass
class PlotPoint:
    """One round count and its assignments (an int, an Estimate, or None)."""

    rounds: int
    value: Any


class CountPlot(QWidget):
    """log10(assignments) against rounds; the fewest rounds marked."""

    MARGIN_LEFT = 64
    MARGIN = 18

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.points: list[PlotPoint] = []
        self.fewest: int | None = None
        self.setMinimumHeight(180)
        self.setSizePolicy(QSizePolicy.Policy.Expanding, QSizePolicy.Policy.Expanding)
        self.setAccessibleName("Counts plotted on a log scale against the number of rounds")

    def sizeHint(self) -> QSize:
        return QSize(420, 260)

    def set_data(self, points: list[PlotPoint], fewest: int | None) -> None:
        self.points = list(points)
        self.fewest = fewest
        self.update()

    def plotted(self) -> list[tuple[int, float, tuple[float, float] | None]]:
        """(rounds, log10 value, log10 range of an estimate or None) for every drawable point."""
        out = []
        for p in self.points:
            y = wording.log10_of(p.value)
            if y is not None:
                out.append((p.rounds, y, wording.log10_range(p.value)))
        return out

    def paintEvent(self, event) -> None:  # noqa: N802 (Qt's name)
        painter = QPainter(self)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        pal = self.palette()
        painter.fillRect(self.rect(), pal.color(QPalette.ColorRole.Base))
        text_pen = QPen(pal.color(QPalette.ColorRole.Text))
        dots = self.plotted()
        area = QRectF(self.MARGIN_LEFT, self.MARGIN, self.width() - self.MARGIN_LEFT - self.MARGIN,
                      self.height() - 2 * self.MARGIN - 20)
        if not dots or area.width() < 40 or area.height() < 40:
            painter.setPen(text_pen)
            painter.drawText(self.rect(), Qt.AlignmentFlag.AlignCenter,
                             "No counts yet" if not self.points else "Nothing to plot")
            return
        xs = [d[0] for d in dots] + ([self.fewest] if self.fewest is not None else [])
        x0, x1 = min(xs) - 0.4, max(xs) + 0.4
        ys = [d[1] for d in dots] + [r[1] for d in dots if (r := d[2])] + \
             [r[0] for d in dots if (r := d[2])]
        y0, y1 = math.floor(min(ys)), math.ceil(max(ys))
        if min(ys) - y0 < 0.2:  # keep the lowest dot off the frame
            y0 -= 1
        if y1 - max(ys) < 0.2:
            y1 += 1

        def at(x: float, y: float) -> QPointF:
            px = area.left() + (x - x0) / (x1 - x0) * area.width()
            py = area.bottom() - (y - y0) / (y1 - y0) * area.height()
            return QPointF(px, py)

        self._axes(painter, area, x0, x1, y0, y1, at)
        self._fewest_marker(painter, area, at, y0)
        self._series(painter, dots, at)

    def _axes(self, painter: QPainter, area: QRectF, x0: float, x1: float, y0: int, y1: int,
              at) -> None:
        pal = self.palette()
        grid = QPen(pal.color(QPalette.ColorRole.Mid), 0, Qt.PenStyle.DotLine)
        axis = QPen(pal.color(QPalette.ColorRole.Text), 1)
        fm = QFontMetricsF(self.font())
        step = max(1, math.ceil((y1 - y0) / 8))
        for e in range(y0, y1 + 1, step):
            p = at(x0, e)
            painter.setPen(grid)
            painter.drawLine(QPointF(area.left(), p.y()), QPointF(area.right(), p.y()))
            painter.setPen(axis)
            label = "1" if e == 0 else f"10{str(e).translate(wording.SUPERSCRIPT)}"
            painter.drawText(QRectF(0, p.y() - fm.height() / 2, area.left() - 6, fm.height()),
                             Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter, label)
        xstep = max(1, math.ceil((x1 - x0) / 12))
        for k in range(math.ceil(x0), math.floor(x1) + 1, xstep):
            p = at(k, y0)
            painter.setPen(axis)
            painter.drawLine(QPointF(p.x(), area.bottom()), QPointF(p.x(), area.bottom() + 4))
            painter.drawText(QRectF(p.x() - 20, area.bottom() + 4, 40, fm.height()),
                             Qt.AlignmentFlag.AlignHCenter, str(k))
        painter.setPen(axis)
        painter.drawRect(area)
        painter.drawText(QRectF(area.left(), area.bottom() + 4 + fm.height(), area.width(),
                                fm.height()), Qt.AlignmentFlag.AlignHCenter,
                         "rounds (valid schedules on a log scale)")

    def _fewest_marker(self, painter: QPainter, area: QRectF, at, y0: int) -> None:
        if self.fewest is None:
            return
        pal = self.palette()
        x = at(self.fewest, y0).x()
        if not area.left() - 1 <= x <= area.right() + 1:
            return
        painter.setPen(QPen(pal.color(QPalette.ColorRole.Highlight), 2, Qt.PenStyle.DashLine))
        painter.drawLine(QPointF(x, area.top()), QPointF(x, area.bottom()))
        painter.setPen(QPen(pal.color(QPalette.ColorRole.Text)))
        label = f"fewest rounds: {self.fewest}"
        fm = QFontMetricsF(self.font())
        w = fm.horizontalAdvance(label) + 8
        left = x + 4 if x + 4 + w < area.right() else x - 4 - w
        painter.drawText(QRectF(left, area.top() + 2, w, fm.height()),
                         Qt.AlignmentFlag.AlignLeft, label)

    def _series(self, painter: QPainter, dots, at) -> None:
        pal = self.palette()
        colour = pal.color(QPalette.ColorRole.Link)
        path = QPainterPath()
        exact = [d for d in dots if d[2] is None]
        for i, (k, y, _r) in enumerate(exact):
            path.moveTo(at(k, y)) if i == 0 else path.lineTo(at(k, y))
        painter.setPen(QPen(colour, 2))
        painter.drawPath(path)
        radius = 4.0
        for k, y, rng in dots:
            centre = at(k, y)
            if rng is None:
                painter.setBrush(colour)
                painter.setPen(QPen(colour, 1))
            else:
                painter.setBrush(Qt.BrushStyle.NoBrush)
                painter.setPen(QPen(colour, 1.5))
                painter.drawLine(at(k, rng[0]), at(k, rng[1]))
            painter.drawEllipse(centre, radius, radius)
        painter.setBrush(Qt.BrushStyle.NoBrush)

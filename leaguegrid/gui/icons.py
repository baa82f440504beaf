"""Icons drawn here with QPainter (our own shapes), crisp at every size and device pixel ratio."""

from __future__ import annotations

from collections.abc import Callable

from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QIcon, QPainter, QPainterPath, QPen, QPixmap

SIZES = (16, 22, 24, 32, 48, 64, 128, 256)
# Our own round colours, also used by the app icon (see palette.py).
INK = QColor(40, 52, 70)


def _icon(draw: Callable[[QPainter, float], None]) -> QIcon:
    """An icon with a pixmap per size, each drawn at that size (no blurry scaling)."""
    icon = QIcon()
    for size in SIZES:
        pixmap = QPixmap(size, size)
        pixmap.fill(Qt.GlobalColor.transparent)
        painter = QPainter(pixmap)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        draw(painter, float(size))
        painter.end()
        icon.addPixmap(pixmap)
    return icon


def _draw_app(p: QPainter, s: float) -> None:
    """A 3 x 3 grid of rounded cells, a few filled in round colours: rounds against venues."""
    from leaguegrid.gui.palette import BASE_HUES

    gap = s * 0.06
    cell = (s - 4 * gap) / 3
    filled = {(0, 0): 0, (1, 1): 1, (2, 2): 2, (0, 2): 3, (2, 0): 1, (1, 2): 0}
    for r in range(3):
        for c in range(3):
            rect = QRectF(gap + c * (cell + gap), gap + r * (cell + gap), cell, cell)
            if (r, c) in filled:
                p.setBrush(QColor.fromHsvF(BASE_HUES[filled[(r, c)]], 0.55, 0.85))
                p.setPen(QPen(INK, max(1.0, s / 40)))
            else:
                p.setBrush(Qt.BrushStyle.NoBrush)
                p.setPen(QPen(INK, max(1.0, s / 40), Qt.PenStyle.DotLine))
            p.drawRoundedRect(rect, cell * 0.2, cell * 0.2)


def _draw_count(p: QPainter, s: float) -> None:
    """Three rising bars: counts growing with the number of rounds."""
    p.setPen(Qt.PenStyle.NoPen)
    p.setBrush(QColor(70, 120, 190))
    w = s * 0.22
    for i, h in enumerate((0.3, 0.55, 0.85)):
        p.drawRect(QRectF(s * 0.08 + i * (w + s * 0.08), s * (0.95 - h), w, s * h))


def _draw_draw(p: QPainter, s: float) -> None:
    """A die face: a schedule drawn at random."""
    p.setPen(QPen(INK, max(1.0, s / 20)))
    p.setBrush(QColor(235, 200, 90))
    p.drawRoundedRect(QRectF(s * 0.1, s * 0.1, s * 0.8, s * 0.8), s * 0.15, s * 0.15)
    p.setBrush(INK)
    r = s * 0.07
    for x, y in ((0.3, 0.3), (0.5, 0.5), (0.7, 0.7), (0.7, 0.3), (0.3, 0.7)):
        p.drawEllipse(QPointF(s * x, s * y), r, r)


def _draw_export(p: QPainter, s: float) -> None:
    """A sheet with an arrow leaving it."""
    p.setPen(QPen(INK, max(1.0, s / 20)))
    p.setBrush(QColor(245, 245, 245))
    p.drawRect(QRectF(s * 0.12, s * 0.08, s * 0.5, s * 0.8))
    path = QPainterPath(QPointF(s * 0.4, s * 0.5))
    path.lineTo(QPointF(s * 0.9, s * 0.5))
    path.moveTo(QPointF(s * 0.75, s * 0.35))
    path.lineTo(QPointF(s * 0.9, s * 0.5))
    path.lineTo(QPointF(s * 0.75, s * 0.65))
    p.setPen(QPen(QColor(40, 140, 80), max(1.5, s / 10)))
    p.setBrush(Qt.BrushStyle.NoBrush)
    p.drawPath(path)


def app_icon() -> QIcon:
    return _icon(_draw_app)


def count_icon() -> QIcon:
    return _icon(_draw_count)


def draw_icon() -> QIcon:
    return _icon(_draw_draw)


def export_icon() -> QIcon:
    return _icon(_draw_export)

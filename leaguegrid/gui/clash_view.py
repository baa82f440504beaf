"""The clash graph drawn: fixtures as nodes (coloured by round once a schedule exists), clashes
as edges with their reasons on hover, zoom and pan, divisions kept together."""

from __future__ import annotations

import math
from typing import Any

import networkx as nx
from PySide6.QtCore import QPointF, Qt
from PySide6.QtGui import QBrush, QPainter, QPainterPath, QPainterPathStroker, QPalette, QPen
from PySide6.QtWidgets import (
    QGraphicsEllipseItem,
    QGraphicsItem,
    QGraphicsLineItem,
    QGraphicsScene,
    QGraphicsSimpleTextItem,
    QGraphicsView,
    QLabel,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.gui import palette
from leaguegrid.gui.document import LeagueDocument

NODE_RADIUS = 14.0
SPACING = 70.0  # distance scale between nodes inside a division
NO_DIVISION = "(no division)"


def division_layout(graph: nx.Graph, division_of: dict[str, str]) -> dict[Any, QPointF]:
    """Positions keeping each division's fixtures in one cluster, clusters on a grid."""
    groups: dict[str, list] = {}
    for node in graph.nodes:
        groups.setdefault(division_of.get(node) or NO_DIVISION, []).append(node)
    names = sorted(groups, key=lambda d: (d == NO_DIVISION, d.casefold()))
    columns = max(1, math.ceil(math.sqrt(len(names))))
    radius = {d: SPACING * max(1.0, 1.4 * math.sqrt(len(groups[d]))) for d in names}
    cell = 2.6 * max(radius.values(), default=SPACING)
    out: dict[Any, QPointF] = {}
    for i, name in enumerate(names):
        cx, cy = (i % columns) * cell, (i // columns) * cell
        members = sorted(groups[name], key=str)
        sub = graph.subgraph(members)
        if len(members) == 1:
            local = {members[0]: (0.0, 0.0)}
        elif sub.number_of_edges() == 0 or len(members) <= 3:
            local = nx.circular_layout(members)
        else:
            local = nx.spring_layout(sub, seed=7, iterations=80, k=2.0 / math.sqrt(len(members)))
        for node, (x, y) in local.items():
            out[node] = QPointF(cx + float(x) * radius[name], cy + float(y) * radius[name])
    return out


class EdgeItem(QGraphicsLineItem):
    """A clash: its reasons show on hover; a wide invisible shape makes it easy to hover."""

    def __init__(self, a: str, b: str, reasons: list, p: QPointF, q: QPointF) -> None:
        super().__init__(p.x(), p.y(), q.x(), q.y())
        self.ends = (a, b)
        self.reasons = reasons
        self.setAcceptHoverEvents(True)
        self.setZValue(0)
        shown = "\n".join(f"• {r}" for r in reasons) or "• (no reason recorded)"
        self.setToolTip(f"{a} and {b} may not share a round:\n{shown}")

    def shape(self) -> QPainterPath:
        path = QPainterPath(self.line().p1())
        path.lineTo(self.line().p2())
        stroker = QPainterPathStroker()
        stroker.setWidth(8.0)
        return stroker.createStroke(path)


class NodeItem(QGraphicsEllipseItem):
    """A fixture: a disc with its label beside it."""

    def __init__(self, label: str, tip: str, centre: QPointF) -> None:
        r = NODE_RADIUS
        super().__init__(-r, -r, 2 * r, 2 * r)
        self.label = label
        self.setPos(centre)
        self.setZValue(2)
        self.setToolTip(tip)
        self.setFlag(QGraphicsItem.GraphicsItemFlag.ItemIsSelectable, True)
        self.text = QGraphicsSimpleTextItem(label if len(label) <= 28 else label[:27] + "…", self)
        self.text.setPos(r + 2, -self.text.boundingRect().height() / 2)
        self.round_text = QGraphicsSimpleTextItem("", self)

    def set_round(self, round_: int | None) -> None:
        self.round_text.setText("" if round_ is None else str(round_))
        box = self.round_text.boundingRect()
        self.round_text.setPos(-box.width() / 2, -box.height() / 2)


class GraphView(QGraphicsView):
    """Wheel zooms, dragging pans."""

    def __init__(self, scene: QGraphicsScene) -> None:
        super().__init__(scene)
        self.setRenderHint(QPainter.RenderHint.Antialiasing)
        self.setDragMode(QGraphicsView.DragMode.ScrollHandDrag)
        self.setTransformationAnchor(QGraphicsView.ViewportAnchor.AnchorUnderMouse)

    def wheelEvent(self, event) -> None:  # noqa: N802
        factor = 1.15 if event.angleDelta().y() > 0 else 1 / 1.15
        self.scale(factor, factor)


class ClashGraphView(QWidget):
    """The graph of one league; follows the document's selection and schedule."""

    def __init__(self, doc: LeagueDocument, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.doc = doc
        self.scene = QGraphicsScene(self)
        self.view = GraphView(self.scene)
        self.view.setAccessibleName("Clash graph: fixtures as dots, clashes as lines")
        self.view.setObjectName("clashGraph")
        self.note = QLabel("Fixtures are dots, clashes are lines (hover a line for its reasons). "
                           "Wheel to zoom, drag to pan, click a fixture to see its clashes.")
        self.note.setWordWrap(True)
        layout = QVBoxLayout(self)
        layout.addWidget(self.note)
        layout.addWidget(self.view)
        self.nodes: dict[str, NodeItem] = {}
        self.edges: list[EdgeItem] = []
        self._positions: dict[Any, QPointF] = {}
        self._node_set: frozenset = frozenset()
        self.scene.selectionChanged.connect(self._scene_picked)
        doc.selectionChanged.connect(self._highlight)
        doc.scheduleChanged.connect(self._schedule_changed)
        doc.graphChanged.connect(self._graph_changed)

    def _schedule_changed(self) -> None:
        self.colour_by(self.doc.schedule)

    def _graph_changed(self) -> None:
        self.set_graph(self.doc.graph)

    def set_graph(self, graph: nx.Graph | None) -> None:
        """Draw a graph; positions are kept when the fixtures are the same as before."""
        self.scene.blockSignals(True)
        self.scene.clear()
        self.nodes, self.edges = {}, []
        self.scene.blockSignals(False)
        if graph is None:
            return
        league = self.doc.league
        fixtures = {f.label: f for f in league.fixtures} if league is not None else {}
        if frozenset(graph.nodes) != self._node_set:
            division = {lbl: f.division for lbl, f in fixtures.items() if f.division}
            self._positions = division_layout(graph, division)
            self._node_set = frozenset(graph.nodes)
        pos = self._positions
        for a, b, data in graph.edges(data=True):
            edge = EdgeItem(a, b, list(data.get("reasons", [])), pos[a], pos[b])
            self.scene.addItem(edge)
            self.edges.append(edge)
        for node in graph.nodes:
            f = fixtures.get(node)
            tip = node if f is None else "\n".join(filter(None, (
                node, f"home {f.home}, away {f.away}" if f.home else None,
                f"venue {f.venue}" if f.venue else None,
                f"division {f.division}" if f.division else None)))
            item = NodeItem(node, tip, pos[node])
            self.scene.addItem(item)
            self.nodes[node] = item
        self._label_divisions(graph, fixtures)
        self.colour_by(self.doc.schedule)
        self.fit()

    def _label_divisions(self, graph: nx.Graph, fixtures: dict) -> None:
        groups: dict[str, list[QPointF]] = {}
        for node in graph.nodes:
            f = fixtures.get(node)
            groups.setdefault((f.division if f and f.division else NO_DIVISION),
                              []).append(self._positions[node])
        if len(groups) < 2:
            return
        for name, points in groups.items():
            top = min(p.y() for p in points) - 3 * NODE_RADIUS
            left = min(p.x() for p in points)
            text = self.scene.addSimpleText(name)
            font = text.font()
            font.setBold(True)
            text.setFont(font)
            text.setPos(left, top)
            text.setBrush(self.palette().color(QPalette.ColorRole.Text))

    def colour_by(self, schedule: Any) -> None:
        """Fill nodes with their round's colour (or the plain button colour without a round)."""
        pal = self.palette()
        assignment = schedule.assignment if schedule is not None else {}
        text_brush = QBrush(pal.color(QPalette.ColorRole.Text))
        for label, item in self.nodes.items():
            round_ = assignment.get(label)
            fill = (palette.round_colour(round_, pal) if round_ is not None
                    else palette.unassigned_colour(pal))
            item.setBrush(QBrush(fill))
            item.text.setBrush(text_brush)
            item.round_text.setBrush(text_brush)
            item.set_round(round_)
        self._highlight(self.doc.selected)

    def _highlight(self, label: str | None) -> None:
        pal = self.palette()
        plain = QPen(pal.color(QPalette.ColorRole.Mid), 1.2)
        strong = QPen(pal.color(QPalette.ColorRole.Highlight), 3.0)
        outline = QPen(pal.color(QPalette.ColorRole.Text), 1.0)
        near = set()
        for edge in self.edges:
            on = label is not None and label in edge.ends
            edge.setPen(strong if on else plain)
            edge.setZValue(1 if on else 0)
            if on:
                near.update(edge.ends)
        for name, item in self.nodes.items():
            item.setPen(strong if name == label or name in near else outline)
            item.setOpacity(1.0 if label is None or name in near or name == label else 0.45)
        self.scene.blockSignals(True)
        for name, item in self.nodes.items():
            item.setSelected(name == label)
        self.scene.blockSignals(False)

    def _scene_picked(self) -> None:
        chosen = [i for i in self.scene.selectedItems() if isinstance(i, NodeItem)]
        if chosen:
            self.doc.select(chosen[0].label)

    def showEvent(self, event) -> None:  # noqa: N802
        super().showEvent(event)
        self.fit()

    def zoom_in(self) -> None:
        self.view.scale(1.25, 1.25)

    def zoom_out(self) -> None:
        self.view.scale(0.8, 0.8)

    def fit(self) -> None:
        rect = self.scene.itemsBoundingRect()
        if not rect.isEmpty():
            self.view.fitInView(rect.adjusted(-20, -20, 20, 20), Qt.AspectRatioMode.KeepAspectRatio)

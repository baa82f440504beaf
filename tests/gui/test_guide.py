"""Help > Guide: the numbers explained with the open league's own numbers, every shortcut,
and the caution (issue 12, point 4)."""

import os

os.environ["QT_QPA_PLATFORM"] = "offscreen"

from pathlib import Path  # noqa: E402

from leaguegrid.core.wording import CAUTION  # noqa: E402
from leaguegrid.gui.help_view import shortcut_rows  # noqa: E402

SMALL = Path(__file__).resolve().parents[2] / "demo_leagues" / "small.xlsx"


def test_guide_tells_the_numbers_with_the_leagues_own(qtbot, window):
    window.act_guide.trigger()
    assert window.guide.isVisible() and not window.guide.isModal()
    assert "Open and count a league to see its own numbers here." in (
        window.guide.text.toPlainText())
    window.open_path(str(SMALL))
    qtbot.waitUntil(lambda: window.report is not None and not window.runner.busy,
                    timeout=60_000)
    window.guide.refresh()
    text = window.guide.text.toPlainText()
    # small.xlsx: 6 fixtures, 13 clashing pairs; P(4) = 6, every round used 6, 1 grouping
    # (checked against networkx in tests/cli and tests/docs)
    assert "Fenwick Vale Under-11s has 6 fixtures and 13 pairs of fixtures that clash" in text
    assert "At least 4 rounds are needed: no schedule fits in 3, and one fits in 4." in text
    assert "With 4 rounds there are 6 valid schedules" in text
    assert "1 groupings" not in text and "Groupings. 1 grouping: the same" in text
    assert " ".join(CAUTION.split()) in " ".join(text.split())
    assert "Count schedules" in text and "Ctrl+R" in text


def test_every_shortcut_is_listed_once(window):
    rows = shortcut_rows(window)
    keys = [k for k, _ in rows]
    assert ("Ctrl+D", "Draw a schedule") in rows
    assert ("F1", "Guide") in rows
    assert len(keys) == len(set(keys)), "two actions share a shortcut"


def test_every_column_header_has_a_tooltip(qtbot, window):
    """Issue 12, point 4: a tooltip on every column header of every table in the window."""
    from PySide6.QtCore import Qt
    from PySide6.QtWidgets import QTableView

    window.open_path(str(SMALL))
    qtbot.waitUntil(lambda: window.report is not None and not window.runner.busy,
                    timeout=60_000)
    window.draw_schedule()
    qtbot.waitUntil(lambda: window.doc.schedule is not None and not window.runner.busy,
                    timeout=60_000)
    seen = 0
    for view in window.findChildren(QTableView):
        model = view.model()
        for column in range(model.columnCount()):
            tip = model.headerData(column, Qt.Orientation.Horizontal,
                                   Qt.ItemDataRole.ToolTipRole)
            assert tip, (view.objectName(), model.headerData(column, Qt.Orientation.Horizontal))
            seen += 1
    assert seen > 20


def test_controls_have_accessible_names_and_every_action_a_menu(qtbot, window):
    """Issue 12, point 11: screen readers name every control; every action is in a menu (so
    the keyboard reaches it with Alt and a letter)."""
    from PySide6.QtGui import QAction
    from PySide6.QtWidgets import (
        QAbstractButton,
        QAbstractItemView,
        QAbstractSpinBox,
        QComboBox,
        QGraphicsView,
        QHeaderView,
        QLineEdit,
        QPlainTextEdit,
    )

    window.open_path(str(SMALL))
    qtbot.waitUntil(lambda: window.report is not None and not window.runner.busy,
                    timeout=60_000)
    def in_combo(widget):  # a combo box's own popup list: the box itself carries the name
        parent = widget.parent()
        while parent is not None and not isinstance(parent, QComboBox):
            parent = parent.parent()
        return parent is not None

    kinds = (QAbstractItemView, QAbstractSpinBox, QLineEdit, QComboBox, QPlainTextEdit,
             QGraphicsView)
    unnamed = [type(w).__name__ + ":" + w.objectName() for kind in kinds
               for w in window.findChildren(kind)
               if not (w.accessibleName() or isinstance(w, QHeaderView)
                       or w.objectName().startswith("qt_") or in_combo(w))]
    assert unnamed == [], unnamed
    buttons = [b.objectName() for b in window.findChildren(QAbstractButton)
               if not (b.accessibleName() or b.text() or b.toolTip()
                       or b.objectName().startswith("qt_"))]
    assert buttons == []
    from PySide6.QtWidgets import QMenu

    in_menus = {a for menu in window.menuBar().findChildren(QMenu) for a in menu.actions()}
    missing = [a.text() for a in window.findChildren(QAction)
               if a.text() and a.shortcut().toString() and a not in in_menus]
    assert missing == []

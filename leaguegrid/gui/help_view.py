"""Help > Guide: a short guide inside the window that explains the numbers with the open
league's own numbers, lists every keyboard shortcut, and says the cautions. It never blocks:
a window of its own, refreshed when a count ends or another league opens."""

from __future__ import annotations

import html
from typing import Any

from PySide6.QtGui import QAction, QKeySequence
from PySide6.QtWidgets import QDialog, QTextBrowser, QVBoxLayout, QWidget

from leaguegrid.core.wording import CAUTION, GUIDE_STEPS, guide_numbers


def shortcut_rows(window: QWidget) -> list[tuple[str, str]]:
    """(keys, what they do) for every action of `window` that has a shortcut, menu order."""
    rows = []
    for action in window.findChildren(QAction):
        keys = [k.toString(QKeySequence.SequenceFormat.NativeText) for k in action.shortcuts()]
        if keys and action.text():
            rows.append((", ".join(keys), action.text().replace("&", "").rstrip("…")))
    return sorted(set(rows), key=lambda r: r[1].casefold())


def guide_html(window: Any) -> str:
    """The guide's page for the window's league as it stands now."""
    parts = ["<h2>Getting started</h2><ol>"]
    parts += [f"<li>{html.escape(step)}</li>" for step in GUIDE_STEPS]
    parts.append("</ol><h2>What the numbers mean</h2>")
    league, report = window.doc.league, window.report
    if league is None or report is None:
        parts.append("<p>Open and count a league to see its own numbers here.</p>")
    else:
        wanted = window.rounds_box.value()
        row = next((r for r in report.rows if r.rounds == wanted), None) or (
            report.rows[0] if report.rows else None)
        values = None if row is None else (row.rounds, row.assignments, row.all_rounds_used,
                                           row.groupings)
        for title, text in guide_numbers(league.name, report.fixtures, report.clashes,
                                         report.min_rounds, values):
            parts.append(f"<p><b>{html.escape(title)}.</b> {html.escape(text)}</p>")
    parts.append("<h2>Keyboard</h2><table>")
    parts += [f"<tr><td><b>{html.escape(keys)}</b>&nbsp;&nbsp;</td><td>{html.escape(what)}"
              "</td></tr>" for keys, what in shortcut_rows(window)]
    parts.append("</table><p>Every menu opens with Alt and its underlined letter; Tab moves "
                 "between controls.</p>")
    parts.append(f"<h2>Before you publish</h2><p>{html.escape(CAUTION)}</p>")
    return "".join(parts)


class GuideWindow(QDialog):
    """The guide in a window of its own beside the main one (never modal)."""

    def __init__(self, window: Any) -> None:
        super().__init__(window)
        self.window_ = window
        self.setWindowTitle("LeagueGrid guide")
        self.resize(640, 720)
        self.text = QTextBrowser()
        self.text.setAccessibleName("Guide")
        self.text.setOpenExternalLinks(False)
        layout = QVBoxLayout(self)
        layout.addWidget(self.text)
        window.countsReady.connect(self.refresh)
        window.leagueOpened.connect(self.refresh)
        self.refresh()

    def refresh(self, *_: Any) -> None:
        self.text.setHtml(guide_html(self.window_))

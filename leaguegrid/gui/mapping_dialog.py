"""Matching a workbook's column names to ours (Home, Away, Venue, ...), remembered per file."""

from __future__ import annotations

import hashlib
import json
from pathlib import Path
from typing import Any

from PySide6.QtCore import QSettings, Qt
from PySide6.QtWidgets import (
    QAbstractItemView,
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFormLayout,
    QLabel,
    QListWidget,
    QListWidgetItem,
    QTableView,
    QVBoxLayout,
    QWidget,
)

from leaguegrid.app.matching import guess_matching
from leaguegrid.gui.sheet_model import SheetModel

OUR_COLUMNS = ("Fixture", "Home", "Away", "Venue", "Pitch", "Division", "Round", "Date", "Time")
PREVIEW = 6  # rows of the sheet shown under the choices (its header and the first fixtures)
SHARED_KEY = "Shared"  # mapping entry: the workbook columns that are shared resources, ";"-joined
NONE = "(not in this workbook)"


def _settings_key(path: str) -> str:
    digest = hashlib.sha1(str(Path(path).resolve()).encode("utf-8")).hexdigest()[:16]
    return f"mappings/{digest}"


def load_mapping(settings: QSettings, path: str) -> dict[str, str] | None:
    """The mapping saved for this file, or None."""
    raw = settings.value(_settings_key(path))
    if not raw:
        return None
    try:
        value = json.loads(str(raw))
    except json.JSONDecodeError:
        return None
    return {str(k): str(v) for k, v in value.items()} if isinstance(value, dict) else None


def save_mapping(settings: QSettings, path: str, mapping: dict[str, str]) -> None:
    """Remember the mapping for this file (an empty mapping forgets it)."""
    if mapping:
        settings.setValue(_settings_key(path), json.dumps(mapping, sort_keys=True))
    else:
        settings.remove(_settings_key(path))


def header_of(rows: list[tuple[int, list[Any]]]) -> list[str]:
    """The first non-empty row's cells as text: the sheet's column names."""
    for _n, cells in rows:
        names = [str(c).strip() for c in cells if c not in (None, "")]
        if names:
            return names
    return []


def fixtures_sheet(sheets: dict[str, list[tuple[int, list[Any]]]]) -> str | None:
    """The sheet holding fixtures (named Fixtures, else the first sheet)."""
    for name in sheets:
        if name.strip().casefold() == "fixtures":
            return name
    return next(iter(sheets), None)


class MappingDialog(QDialog):
    """A combo per column of ours (the reader's own guess chosen until the file's matching
    says otherwise), the sheet's first rows, and a checklist of columns that are shared
    resources."""

    def __init__(self, sheets: dict[str, list[tuple[int, list[Any]]]],
                 current: dict[str, str], parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setWindowTitle("Match columns")
        sheet = fixtures_sheet(sheets)
        self.columns = header_of(sheets.get(sheet, [])) if sheet else []
        intro = QLabel(f"Which column of the sheet “{sheet or '?'}” holds each of these? "
                       "The choice is remembered for this file.")
        intro.setWordWrap(True)
        form = QFormLayout()
        self.combos: dict[str, QComboBox] = {}
        guessed = guess_matching(self.columns)
        for ours in OUR_COLUMNS:
            combo = QComboBox()
            combo.addItem(NONE)
            combo.addItems(self.columns)
            chosen = current.get(ours) or guessed.get(ours)
            if chosen in self.columns:
                combo.setCurrentText(chosen)
            self.combos[ours] = combo
            form.addRow(f"{ours}:", combo)
        self.shared = QListWidget()
        shared_now = set(filter(None, current.get(SHARED_KEY, "").split(";")))
        for column in self.columns:
            item = QListWidgetItem(column)
            item.setFlags(item.flags() | Qt.ItemFlag.ItemIsUserCheckable)
            item.setCheckState(Qt.CheckState.Checked if column in shared_now
                               else Qt.CheckState.Unchecked)
            self.shared.addItem(item)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                   | QDialogButtonBox.StandardButton.Cancel)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        self.preview = QTableView()
        self.preview.setObjectName("matchPreview")
        self.preview.setAccessibleName("The sheet's first rows")
        self.preview.setModel(SheetModel(sheets.get(sheet, [])[:PREVIEW] if sheet else [], self))
        self.preview.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        layout = QVBoxLayout(self)
        layout.addWidget(intro)
        layout.addLayout(form)
        layout.addWidget(QLabel("The sheet's first rows:"))
        layout.addWidget(self.preview)
        layout.addWidget(QLabel("Other columns that are shared resources (a referee, a coach, "
                                "kit): fixtures with the same value there clash."))
        layout.addWidget(self.shared)
        layout.addWidget(buttons)

    def mapping(self) -> dict[str, str]:
        """Our column name -> the workbook's, only where they differ, plus the shared list."""
        out: dict[str, str] = {}
        for ours, combo in self.combos.items():
            theirs = combo.currentText()
            if theirs != NONE and theirs.strip().casefold() != ours.casefold():
                out[ours] = theirs
        shared = [self.shared.item(i).text() for i in range(self.shared.count())
                  if self.shared.item(i).checkState() == Qt.CheckState.Checked]
        if shared:
            out[SHARED_KEY] = ";".join(shared)
        return out

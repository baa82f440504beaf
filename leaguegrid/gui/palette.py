"""Our own round colours: hues spread around the wheel, lighter on a light theme and darker on
a dark one, so the palette's own text colour stays readable on top of them."""

from __future__ import annotations

from PySide6.QtGui import QColor, QPalette

# Hues (0..1) picked far apart for the first rounds; later rounds step by the golden angle.
BASE_HUES = (0.58, 0.08, 0.33, 0.83, 0.15, 0.48, 0.95, 0.70, 0.25, 0.40)
GOLDEN = 0.381966


def is_dark(palette: QPalette) -> bool:
    """True when the window background is darker than its text (a dark theme)."""
    window = palette.color(QPalette.ColorRole.Window)
    text = palette.color(QPalette.ColorRole.WindowText)
    return window.lightnessF() < text.lightnessF()


def hue(round_: int) -> float:
    """The hue of round `round_` (1-based)."""
    i = round_ - 1
    if i < len(BASE_HUES):
        return BASE_HUES[i]
    return (BASE_HUES[-1] + (i - len(BASE_HUES) + 1) * GOLDEN) % 1.0


def round_colour(round_: int, palette: QPalette) -> QColor:
    """The fill for fixtures in this round, readable under the palette's Text colour."""
    if is_dark(palette):
        return QColor.fromHslF(hue(round_), 0.45, 0.30)
    return QColor.fromHslF(hue(round_), 0.65, 0.82)


def unassigned_colour(palette: QPalette) -> QColor:
    """The fill for fixtures with no round yet: the palette's own button colour."""
    return palette.color(QPalette.ColorRole.Button)


def conflict_colour(palette: QPalette) -> QColor:
    """The outline for a fixture that breaks a clash or rule where it stands."""
    return QColor.fromHslF(0.0, 0.75, 0.62 if is_dark(palette) else 0.45)


SIDE_HUES = {"home": 0.58, "away": 0.08}  # blue and orange: apart for every kind of colour sight


def side_colour(side: str, palette: QPalette) -> QColor:
    """The fill of a round in a team's strip: blue at home, orange away, the palette's own
    button colour for a bye; readable under the palette's Text colour."""
    if side not in SIDE_HUES:
        return unassigned_colour(palette)
    if is_dark(palette):
        return QColor.fromHslF(SIDE_HUES[side], 0.50, 0.32)
    return QColor.fromHslF(SIDE_HUES[side], 0.70, 0.80)

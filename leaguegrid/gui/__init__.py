"""The desktop window (PySide6, Qt Widgets); the only package of LeagueGrid that imports Qt."""

"""LeagueGrid: count, plan and publish clash-free round schedules for sports leagues."""

__version__ = "0.1.0"

"""Benchmarks and probes of LeagueGrid (not part of the installed package)."""

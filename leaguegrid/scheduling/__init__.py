"""Schedules: the exact counting model of a league (constraints), uniform draws and best of
many (draw, score), the rule search (search, rules), checks and hand edits (check, edit),
what-if on clashes (whatif) and round dates (dates). Pure Python: no Qt, no file I/O."""

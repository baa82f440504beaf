"""The desktop window (PySide6, Qt Widgets); the only package of LeagueGrid that imports Qt.

Importing it first applies `guard_singleton_refcounts`, which keeps the window from aborting
under PySide6 6.12 on Python 3.11 (see there).
"""

from __future__ import annotations

import ctypes
import platform
import sys

GUARD = 1 << 40  # references added to each shared singleton; never reached by the leak


def _shiboken_version() -> tuple[int, int]:
    """The installed shiboken6 (major, minor), without importing Qt itself."""
    from importlib.metadata import PackageNotFoundError, version

    try:
        parts = version("shiboken6").split(".")
        return int(parts[0]), int(parts[1])
    except (PackageNotFoundError, ValueError, IndexError):
        return (0, 0)


def guard_singleton_refcounts() -> bool:
    """Keep None, True and False alive under a PySide6 that drops references to them.

    Shiboken 6.12 returns None and True/False from void methods and signal emits without
    taking a reference: harmless on Python 3.12+, where these objects are immortal, but on
    3.11 every call lowers their count until Python aborts ("deallocating None") within
    minutes of use. On CPython < 3.12 with shiboken >= 6.12 we add a large number of
    references to them once, which is what 3.12 does by design. True when applied.
    """
    if sys.version_info >= (3, 12) or platform.python_implementation() != "CPython":
        return False
    if _shiboken_version() < (6, 12):
        return False
    for obj in (None, True, False, Ellipsis, NotImplemented):
        ctypes.c_ssize_t.from_address(id(obj)).value += GUARD
    return True


GUARDED = guard_singleton_refcounts()

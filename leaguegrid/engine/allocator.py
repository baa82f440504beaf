"""The process's memory: keep freed memory for reuse while the array programme runs and
give it back afterwards (glibc only), and read what is resident.

The array programme (vectorized.py) allocates and frees tables of tens to hundreds of MiB
at every step. By default glibc hands each large block back to the system when it is
freed, and the next step faults the same pages in again: on the 10-team round-robin count
at 9 rounds that was a third of the run (8.2 s, of which 2.9 s in the kernel). Raising the
mmap threshold to its largest allowed value (32 MiB) and keeping 256 MiB of padding at the
top of the heap lets the next step reuse them (5.7 s when measured, for 0.03 GiB more peak
memory). On other C libraries (macOS, Windows, musl) nothing changes. The engine never
changes the process's allocator by itself: the program's entry points (the `leaguegrid`
command, the window's engine process, the benchmark) call `keep_freed_memory` once.
"""

from __future__ import annotations

import ctypes
import mmap
import sys

M_TOP_PAD = -2  # mallopt parameter numbers from glibc's malloc.h
M_MMAP_THRESHOLD = -3
PAGE = mmap.PAGESIZE


def resident_bytes() -> int | None:
    """The process's resident memory now (Linux), or None where it cannot be read cheaply."""
    try:
        with open("/proc/self/statm", "rb") as f:
            return int(f.read().split()[1]) * PAGE
    except (OSError, ValueError, IndexError):
        return None


def release_freed_memory() -> None:
    """Hand freed memory back to the system after the array programme (glibc's malloc_trim),
    so that a long-lived process (the window's engine process) starts its next count from a
    small resident set; a no-op elsewhere."""
    if not sys.platform.startswith("linux"):
        return
    try:
        ctypes.CDLL("libc.so.6").malloc_trim(0)
    except (OSError, AttributeError):
        return


def keep_freed_memory() -> None:
    """Tune glibc's allocator for the process (the same two settings each time it is
    called); a no-op elsewhere or when it fails."""
    if not sys.platform.startswith("linux"):
        return
    try:
        libc = ctypes.CDLL("libc.so.6")
        libc.mallopt(M_MMAP_THRESHOLD, 32 << 20)
        libc.mallopt(M_TOP_PAD, 256 << 20)
    except (OSError, AttributeError):
        return

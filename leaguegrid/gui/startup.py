"""Can the window start here? Checked before any QApplication exists.

Qt aborts the whole process when its window-system plugin cannot load; a coordinator should
instead read one plain sentence saying what is missing and how to install it.
"""

from __future__ import annotations

import ctypes
import os
import subprocess
import sys

CLI_NOTE = (
    "the command-line commands (leaguegrid check, count, plan, whatif) keep working "
    "without a window"
)

# Shared libraries the Qt X11 (xcb) plugin loads, with the Debian/Ubuntu and Fedora package names.
XCB_LIBRARIES: tuple[tuple[str, str, str], ...] = (
    ("libxcb-cursor.so.0", "libxcb-cursor0", "xcb-util-cursor"),
    ("libxcb-icccm.so.4", "libxcb-icccm4", "xcb-util-wm"),
    ("libxcb-keysyms.so.1", "libxcb-keysyms1", "xcb-util-keysyms"),
    ("libxcb-image.so.0", "libxcb-image0", "xcb-util-image"),
    ("libxcb-render-util.so.0", "libxcb-render-util0", "xcb-util-renderutil"),
    ("libxcb-shape.so.0", "libxcb-shape0", "libxcb"),
    ("libxcb-randr.so.0", "libxcb-randr0", "libxcb"),
    ("libxcb-xkb.so.1", "libxcb-xkb1", "libxcb"),
    ("libxkbcommon-x11.so.0", "libxkbcommon-x11-0", "libxkbcommon-x11"),
    ("libX11-xcb.so.1", "libx11-xcb1", "libX11-xcb"),
)
# Libraries every Qt platform needs, even offscreen (slim images often lack them).
BASE_LIBRARIES: tuple[tuple[str, str, str], ...] = (
    ("libEGL.so.1", "libegl1", "libglvnd-egl"),
    ("libGL.so.1", "libgl1", "libglvnd-glx"),
    ("libfontconfig.so.1", "libfontconfig1", "fontconfig"),
    ("libxkbcommon.so.0", "libxkbcommon0", "libxkbcommon"),
)
HEADLESS_PLATFORMS = {"offscreen", "minimal", "vnc", "linuxfb", "eglfs", "minimalegl"}
PROBE = (
    "import sys\n"
    "from PySide6.QtWidgets import QApplication\n"
    "app = QApplication(sys.argv[:1])\n"
    "sys.exit(0)\n"
)


def _loadable(soname: str) -> bool:
    """True when the dynamic linker can load this shared library."""
    try:
        ctypes.CDLL(soname)
    except OSError:
        return False
    return True


def missing_libraries(table: tuple[tuple[str, str, str], ...]) -> list[tuple[str, str, str]]:
    """The rows of `table` whose library cannot be loaded."""
    return [row for row in table if not _loadable(row[0])]


def _platform_name(environ: dict[str, str]) -> str:
    """The first platform Qt will try, as QT_QPA_PLATFORM or the session type decides it."""
    chosen = environ.get("QT_QPA_PLATFORM", "").split(";")[0].split(":")[0].strip().lower()
    if chosen:
        return chosen
    if environ.get("WAYLAND_DISPLAY") and environ.get("XDG_SESSION_TYPE") == "wayland":
        return "wayland"
    return "xcb"


def _install_hint(rows: list[tuple[str, str, str]]) -> str:
    """One apt line and one dnf line installing the packages for the missing libraries."""
    debian = " ".join(dict.fromkeys(r[1] for r in rows))
    fedora = " ".join(dict.fromkeys(r[2] for r in rows))
    return (f"install with `sudo apt-get install {debian}` (Debian/Ubuntu) "
            f"or `sudo dnf install {fedora}` (Fedora)")


def static_problem(environ: dict[str, str] | None = None,
                   platform: str | None = None) -> str | None:
    """A sentence naming what stops the window, found without starting Qt; None when nothing is."""
    environ = dict(os.environ if environ is None else environ)
    platform = platform or sys.platform
    if not platform.startswith("linux"):
        return None
    qpa = _platform_name(environ)
    rows = missing_libraries(BASE_LIBRARIES)
    if qpa == "xcb":
        rows += missing_libraries(XCB_LIBRARIES)
    no_display = qpa == "xcb" and not environ.get("DISPLAY")
    no_display = no_display or (qpa == "wayland" and not environ.get("WAYLAND_DISPLAY"))
    names = ", ".join(r[1] for r in rows)
    if rows and no_display:
        return (f"The LeagueGrid window cannot start: there is no graphical display (DISPLAY is "
                f"not set) and the system libraries {names} are missing ({_install_hint(rows)}); "
                f"{CLI_NOTE}.")
    if rows:
        return (f"The LeagueGrid window cannot start because the system libraries {names} are "
                f"missing: {_install_hint(rows)}; {CLI_NOTE}.")
    if no_display:
        return (f"The LeagueGrid window cannot start because there is no graphical display "
                f"(DISPLAY is not set): run it from a desktop session; {CLI_NOTE}.")
    return None


def probe_problem(timeout: float = 60.0) -> str | None:
    """Start Qt once in a child process; a sentence quoting its complaint when it fails."""
    try:
        done = subprocess.run([sys.executable, "-c", PROBE], capture_output=True, text=True,
                              timeout=timeout, check=False)
    except (OSError, subprocess.TimeoutExpired) as exc:
        return f"The LeagueGrid window could not be tried ({exc}); {CLI_NOTE}."
    if done.returncode == 0:
        return None
    lines = [ln.strip() for ln in done.stderr.splitlines() if ln.strip()]
    first = next((ln for ln in lines if "platform plugin" in ln or "needed" in ln),
                 lines[0] if lines else f"exit status {done.returncode}")
    return (f"The LeagueGrid window cannot start because Qt's window system failed "
            f"({first.rstrip('.')}); {CLI_NOTE}.")


def check(probe: bool = True) -> str | None:
    """None when the window can start; otherwise the one sentence to print."""
    try:
        import PySide6.QtGui  # noqa: F401  (an ImportError names a missing library)
    except ImportError as exc:
        rows = [r for r in BASE_LIBRARIES if r[0] in str(exc)] or list(BASE_LIBRARIES)
        return (f"The LeagueGrid window cannot start because Qt could not load ({exc}): "
                f"{_install_hint(rows)}; {CLI_NOTE}.")
    found = static_problem()
    if found is not None:
        return found
    platform = _platform_name(dict(os.environ))
    if probe and sys.platform.startswith("linux") and platform not in HEADLESS_PLATFORMS:
        return probe_problem()
    return None


def ensure_window_can_start(probe: bool = True) -> int:
    """0 when the window can start; otherwise print the reason to stderr and return 1."""
    problem = check(probe)
    if problem is None:
        return 0
    print(problem, file=sys.stderr)
    return 1

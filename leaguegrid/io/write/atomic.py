"""Safe writing: every file goes to a temporary file in the target folder and is moved into place.

A failed or interrupted export therefore never leaves a half-written file, and an existing file
of the same name stays untouched until the new one is complete. No export may overwrite the
league workbook it was made from.
"""

from __future__ import annotations

import contextlib
import os
import tempfile
from collections.abc import Iterable, Iterator
from pathlib import Path
from typing import IO, Any

StrPath = str | os.PathLike[str]


class ExportError(Exception):
    """An export could not be written (the command line maps this to exit code 4)."""


class InputOverwriteError(ExportError):
    """An export was asked to write over one of the files it was made from."""


def _default_file_mode() -> int:
    """The permissions a plain `open(path, "w")` would give a new file (0666 minus umask)."""
    mask = os.umask(0)
    os.umask(mask)
    return 0o666 & ~mask


_NEW_FILE_MODE = _default_file_mode()


def _fsync_folder(folder: Path) -> None:
    """Make the rename itself durable where the platform allows opening a folder."""
    if os.name != "posix":
        return
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


@contextlib.contextmanager
def atomic_write(
    path: StrPath,
    mode: str = "w",
    *,
    encoding: str | None = "utf-8",
    newline: str | None = None,
    replace: bool = True,
) -> Iterator[IO[Any]]:
    """Yield a file object for a temporary file beside `path`; on success it replaces `path`.

    `mode` is "w" (text, `encoding` and `newline` apply) or "wb" (bytes). The data is flushed
    and fsync'ed before `os.replace`. If the block raises, the temporary file is removed, the
    target is left as it was, and the exception propagates. With `replace=False` an existing
    `path` is never touched: the finished file is linked into place, which fails with
    FileExistsError when the name is taken, even by a file that appeared meanwhile.
    """
    if mode not in ("w", "wb"):
        raise ValueError(f"atomic_write mode must be 'w' or 'wb', not {mode!r}")
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    fd, tmp_name = tempfile.mkstemp(dir=folder, prefix=f".{target.name}.", suffix=".tmp")
    tmp = Path(tmp_name)
    os.close(fd)
    try:
        if mode == "wb":
            handle: IO[Any] = open(tmp, "wb")  # noqa: SIM115 (closed below, after fsync)
        else:
            handle = open(tmp, "w", encoding=encoding, newline=newline)  # noqa: SIM115
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise
    try:
        with handle:
            yield handle
            handle.flush()
            os.fsync(handle.fileno())
        try:
            os.chmod(tmp, os.stat(target).st_mode & 0o7777)
        except FileNotFoundError:
            os.chmod(tmp, _NEW_FILE_MODE)
        if replace:
            os.replace(tmp, target)
        else:
            _link_new(tmp, target)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise
    _fsync_folder(folder)


def _link_new(tmp: Path, target: Path) -> None:
    """Give the finished temporary file the name `target` only if no file has that name."""
    try:
        os.link(tmp, target)  # atomic, and refuses an existing name
    except FileExistsError:
        raise
    except OSError:  # a file system without hard links: check, then rename
        if target.exists():
            raise FileExistsError(str(target)) from None
        os.replace(tmp, target)
        return
    tmp.unlink()


def same_file(a: StrPath, b: StrPath) -> bool:
    """True when two paths name the same file (same inode when both exist, else same full path)."""
    pa, pb = Path(a), Path(b)
    try:
        return os.path.samefile(pa, pb)
    except OSError:
        norm = os.path.normcase
        return norm(str(pa.resolve(strict=False))) == norm(str(pb.resolve(strict=False)))


def refuse_overwriting_input(out: StrPath, inputs: Iterable[StrPath | None]) -> None:
    """Raise InputOverwriteError when `out` is one of `inputs` (blank inputs are ignored)."""
    for source in inputs:
        if source is None or str(source) == "":
            continue
        if same_file(out, source):
            raise InputOverwriteError(
                f"refusing to write {out}: it is the input file {source}, which LeagueGrid "
                "only reads; choose another output name"
            )

"""Safe writing: every file goes to a temporary file in the target folder and is moved into place.

A failed or interrupted export therefore never leaves a half-written file, and an existing file
of the same name stays untouched until the new one is complete. No export may overwrite the
league workbook it was made from.

Temporary files are named `.<name>.<8 random characters>.tmp` beside the target. A write that
is killed (power cut, kill -9) cannot remove its own; the next write into the same folder
removes those of ours that have not been modified for STALE_SECONDS (15 minutes), so a write
still running in another process, which touches its file as it goes, is never disturbed.
"""

from __future__ import annotations

import contextlib
import errno
import os
import re
import tempfile
import time
import unicodedata
from collections.abc import Iterable, Iterator
from pathlib import Path
from typing import IO, Any

from leaguegrid.core.wording import write_failure

StrPath = str | os.PathLike[str]

MAX_NAME_BYTES = 255  # the longest file name (UTF-8 bytes) the common file systems take
TEMP_AFFIX_BYTES = len(".") + len(".abcdefgh.tmp")  # what a temporary name adds to a name
STALE_SECONDS = 15 * 60
_OUR_TEMPORARY = re.compile(r"\A\..+\.[a-z0-9_]{8}\.tmp\Z", re.DOTALL)


class ExportError(Exception):
    """An export could not be written (the command line maps this to exit code 4)."""


class InputOverwriteError(ExportError):
    """An export was asked to write over one of the files it was made from."""


class WriteError(ExportError, OSError):
    """The file system refused a write (full, read-only, a folder in the way): one sentence
    naming the target; the target was left as it was."""


def fit_bytes(text: str, most: int) -> str:
    """`text` cut at a character boundary to at most `most` UTF-8 bytes."""
    data = unicodedata.normalize("NFC", text).encode("utf-8")
    return data[:most].decode("utf-8", errors="ignore") if len(data) > most else text


def remove_stale_temporaries(folder: Path, now: float | None = None) -> list[Path]:
    """Remove our temporary files in `folder` not modified for STALE_SECONDS; the removed."""
    now = time.time() if now is None else now
    removed = []
    try:
        entries = list(os.scandir(folder))
    except OSError:
        return removed
    for entry in entries:
        if not _OUR_TEMPORARY.match(entry.name):
            continue
        try:
            if entry.is_file(follow_symlinks=False) and \
                    now - entry.stat(follow_symlinks=False).st_mtime > STALE_SECONDS:
                os.unlink(entry.path)
                removed.append(Path(entry.path))
        except OSError:  # gone meanwhile, or not ours to remove: leave it
            continue
    return removed


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
    tidy: bool = True,
) -> Iterator[IO[Any]]:
    """Yield a file object for a temporary file beside `path`; on success it replaces `path`.

    `mode` is "w" (text, `encoding` and `newline` apply) or "wb" (bytes). The data is flushed
    and fsync'ed before `os.replace`. If the block raises, the temporary file is removed, the
    target is left as it was, and the exception propagates; a file system error (in the block
    or here) becomes a WriteError saying "could not write <path>: <why>". With `replace=False`
    an existing `path` is never touched: the finished file is linked into place, which fails
    with FileExistsError when the name is taken, even by a file that appeared meanwhile.
    With `tidy` (the default) stale temporary files of ours in the folder are removed first.
    """
    if mode not in ("w", "wb"):
        raise ValueError(f"atomic_write mode must be 'w' or 'wb', not {mode!r}")
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    try:
        if target.is_dir():
            raise IsADirectoryError(errno.EISDIR, "a folder is in the way", str(target))
        if tidy:
            remove_stale_temporaries(folder)
        prefix = "." + fit_bytes(target.name, MAX_NAME_BYTES - TEMP_AFFIX_BYTES) + "."
        fd, tmp_name = tempfile.mkstemp(dir=folder, prefix=prefix, suffix=".tmp")
    except OSError as err:
        raise write_error(target, err) from err
    tmp = Path(tmp_name)
    os.close(fd)
    try:
        if mode == "wb":
            handle: IO[Any] = open(tmp, "wb")  # noqa: SIM115 (closed below, after fsync)
        else:
            handle = open(tmp, "w", encoding=encoding, newline=newline)  # noqa: SIM115
    except BaseException as err:
        tmp.unlink(missing_ok=True)
        if isinstance(err, OSError):
            raise write_error(target, err) from err
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
    except BaseException as err:
        with contextlib.suppress(OSError):
            tmp.unlink(missing_ok=True)
        if isinstance(err, OSError) and not isinstance(err, FileExistsError | ExportError):
            raise write_error(target, err) from err
        raise
    _fsync_folder(folder)


def write_error(target: StrPath, err: OSError) -> WriteError:
    """The WriteError for `err` met while writing `target`."""
    failure = WriteError(write_failure(os.fspath(target), err))
    failure.errno = err.errno
    return failure


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

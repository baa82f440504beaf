"""Atomic writes: a failed write leaves no half file and no temporary; inputs are never
overwritten."""

from __future__ import annotations

import os
import stat

import pytest

from leaguegrid.io.write.atomic import InputOverwriteError, atomic_write, refuse_overwriting_input


class Boom(Exception):
    pass


def test_text_write_lands_complete(tmp_path):
    target = tmp_path / "out.csv"
    with atomic_write(target, "w", newline="") as fh:
        fh.write("Round,Fixture\r\n1,Ärzte v Öle\r\n")
    assert target.read_bytes() == "Round,Fixture\r\n1,Ärzte v Öle\r\n".encode()
    assert [p.name for p in tmp_path.iterdir()] == ["out.csv"]


def test_binary_write(tmp_path):
    target = tmp_path / "out.bin"
    with atomic_write(target, "wb") as fh:
        fh.write(b"\x00\x01PK")
    assert target.read_bytes() == b"\x00\x01PK"


def test_failure_mid_write_leaves_no_file_and_no_temporary(tmp_path):
    target = tmp_path / "calendar.xlsx"
    with pytest.raises(Boom), atomic_write(target, "wb") as fh:
        fh.write(b"half of a workbook")
        raise Boom
    assert list(tmp_path.iterdir()) == []


def test_failure_leaves_the_old_file_untouched(tmp_path):
    target = tmp_path / "calendar.csv"
    target.write_text("old complete file\n")
    with pytest.raises(Boom), atomic_write(target) as fh:
        fh.write("new but broken")
        fh.flush()
        raise Boom
    assert target.read_text() == "old complete file\n"
    assert [p.name for p in tmp_path.iterdir()] == ["calendar.csv"]


def test_a_new_file_never_replaces_one_that_appeared_meanwhile(tmp_path):
    target = tmp_path / "league.xlsx"
    with pytest.raises(FileExistsError), atomic_write(target, "wb", replace=False) as fh:
        fh.write(b"blank league")
        target.write_bytes(b"the coordinator's own file")  # made while we were writing
    assert target.read_bytes() == b"the coordinator's own file"
    assert [p.name for p in tmp_path.iterdir()] == ["league.xlsx"]


def test_a_new_file_lands_when_the_name_is_free(tmp_path):
    target = tmp_path / "league.xlsx"
    with atomic_write(target, "wb", replace=False) as fh:
        fh.write(b"blank league")
    assert target.read_bytes() == b"blank league"
    assert [p.name for p in tmp_path.iterdir()] == ["league.xlsx"]


def test_temporary_file_is_in_the_target_folder(tmp_path):
    target = tmp_path / "a.txt"
    with atomic_write(target) as fh:
        seen = os.path.dirname(fh.name)
        assert not target.exists()
    assert seen == str(tmp_path)


def test_new_file_gets_ordinary_permissions_and_old_ones_are_kept(tmp_path):
    if os.name != "posix":
        pytest.skip("permission bits are POSIX")
    mask = os.umask(0o022)
    try:
        fresh = tmp_path / "fresh.txt"
        with atomic_write(fresh) as fh:
            fh.write("x")
        old = tmp_path / "old.txt"
        old.write_text("y")
        old.chmod(0o640)
        with atomic_write(old) as fh:
            fh.write("z")
    finally:
        os.umask(mask)
    assert stat.S_IMODE(fresh.stat().st_mode) == 0o666 & ~mask
    assert stat.S_IMODE(old.stat().st_mode) == 0o640


def test_bad_mode_is_refused(tmp_path):
    message = "atomic_write mode must be 'w' or 'wb', not 'a'"
    with pytest.raises(ValueError, match=message), atomic_write(tmp_path / "x", "a"):
        pass
    assert list(tmp_path.iterdir()) == []


def test_refuse_overwriting_input_same_path_any_spelling(tmp_path, monkeypatch):
    source = tmp_path / "league.xlsx"
    source.write_bytes(b"workbook")
    monkeypatch.chdir(tmp_path)
    for out in (source, "league.xlsx", tmp_path / "sub" / ".." / "league.xlsx"):
        with pytest.raises(InputOverwriteError) as err:
            refuse_overwriting_input(out, [None, "", source])
        assert str(err.value) == (
            f"refusing to write {out}: it is the input file {source}, which LeagueGrid only "
            "reads; choose another output name"
        )
    refuse_overwriting_input(tmp_path / "calendar.xlsx", [source])
    assert source.read_bytes() == b"workbook"


def test_refuse_overwriting_input_through_a_link(tmp_path):
    source = tmp_path / "league.xlsx"
    source.write_bytes(b"workbook")
    link = tmp_path / "alias.xlsx"
    try:
        link.symlink_to(source)
    except OSError:
        pytest.skip("symbolic links not available")
    with pytest.raises(InputOverwriteError):
        refuse_overwriting_input(link, [source])

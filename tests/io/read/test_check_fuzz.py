"""A seeded mutation loop over workbooks and CSV files through `leaguegrid check` (run in-process
as the program runs it): truncations, flipped bytes, cells of the wrong type, huge values and
far-away references. Each run exits 0, 1 or 4 with no traceback and leaves its input as it was.
Deterministic (fixed seeds), a few seconds."""

from __future__ import annotations

import io
import os
import random
import zipfile
from pathlib import Path

import pytest
from test_import_fuzz import originals

from leaguegrid.launch import main

SEEDS = range(60)
UNEXPECTED = "because of an unexpected error"
TOKENS = [
    b'<c r="A2" t="s"><v>999999</v></c>', b'<c r="A2" t="s"><v>-1</v></c>',
    b'<c r="XFD1048576"><v>1</v></c>', b'<c r="ZZZZ1"><v>1</v></c>', b'<c r="A0"><v>1</v></c>',
    b'<c r="B99999999999999"><v>1</v></c>', b'<c r="A3" t="b"><v>yes</v></c>',
    b'<c r="A3" t="d"><v>soon</v></c>', b'<c r="C2" s="1"><v>1e308</v></c>',
    b'<c r="C2"><v>99999999999999999999999999</v></c>', b"<v>-1e999</v>", b"<v>nan</v>",
    b'<row r="0">', b'<row r="-5">', b'<row r="99999999999">', b"&bogus;", b"]]>",
    b'<c r="D2" t="inlineStr"><is><t>' + b"x" * 40_000 + b"</t></is></c>",
    b'<c r="A2" t="e"><v>#REF!</v></c>', b"<f>1/0</f>", b'<xf numFmtId="14"/>',
    b'<sheet name="Teams" sheetId="9" state="veryHidden" r:id="rId1"/>',
    b'<!DOCTYPE x [<!ENTITY a "b">]>', b"\xff\xfe", b"\x00",
]
WRONG_TYPES = [(b't="s"', b't="b"'), (b't="s"', b't="n"'), (b't="s"', b't="e"'),
               (b't="inlineStr"', b't="d"'), (b't="str"', b't="s"'), (b'r="', b'r="Z')]


def run_check(capsys, data: bytes, folder: Path, suffix: str) -> int:
    """`leaguegrid check` on the bytes; the exit code (the checks are made here)."""
    path = folder / f"league{suffix}"
    path.write_bytes(data)
    stamp = os.stat(path).st_mtime_ns
    code = main(["check", str(path)])
    out, err = capsys.readouterr()
    assert code in (0, 1, 4), (code, out[-500:], err[-500:])
    assert "Traceback" not in out + err and UNEXPECTED not in out + err, (out[-800:], err)
    assert path.read_bytes() == data and os.stat(path).st_mtime_ns == stamp
    assert sorted(p.name for p in folder.iterdir()) == [path.name]
    path.unlink()
    return code


def damage_bytes(rng: random.Random, data: bytes) -> bytes:
    out = bytearray(data)
    for _ in range(rng.randint(1, 4)):
        if not out:
            break
        at = rng.randrange(len(out))
        action = rng.choice(["flip", "cut", "insert", "zero"])
        if action == "flip":
            out[at] ^= rng.randint(1, 255)
        elif action == "cut":
            del out[at:]
        elif action == "insert":
            out[at:at] = rng.choice(TOKENS)
        else:
            out[at : at + 64] = bytes(len(out[at : at + 64]))
    return bytes(out)


def damage_part(rng: random.Random, data: bytes) -> bytes:
    """Damage the XML of one part and store it back with a valid checksum, so that the damage
    reaches the XML reader rather than the zip layer."""
    with zipfile.ZipFile(io.BytesIO(data)) as archive:
        parts = {n: archive.read(n) for n in archive.namelist()}
    name = rng.choice(sorted(parts))
    part = bytearray(parts[name])
    for _ in range(rng.randint(1, 3)):
        if not part:
            break
        action = rng.choice(["flip", "cut", "insert", "retype"])
        at = rng.randrange(len(part))
        if action == "flip":
            part[at] = rng.choice(b"<>/\"'=&;0123456789az \x00\xff")
        elif action == "cut":
            del part[at:]
        elif action == "insert":
            gap = part.find(b"<", at)
            at = gap if gap >= 0 else at
            part[at:at] = rng.choice(TOKENS)
        else:
            old, new = rng.choice(WRONG_TYPES)
            part = bytearray(bytes(part).replace(old, new, rng.randint(1, 3)))
    parts[name] = bytes(part)
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as archive:
        for part_name, content in parts.items():
            archive.writestr(part_name, content)
    return buffer.getvalue()


def csv_text(rng: random.Random) -> bytes:
    """CSV rows of fixtures with odd values, in one of the encodings coordinators send."""
    values = ["Alder", "Birch", "Cedar", "", " ", "1", "0", "-3", "1e400", "99999999999999999999",
              "2025-13-01", '"quoted, comma"', '"unclosed', "x" * 5000, "Ünïcødé", "🦉", "=A1",
              "team: Alder", "#N/A", "yes", "\t"]
    delimiter = rng.choice([",", ";"])
    rows = [delimiter.join(["Home", "Away", "Round", "Venue"])]
    for _ in range(rng.randint(0, 12)):
        rows.append(delimiter.join(rng.choice(values) for _ in range(rng.randint(0, 6))))
    text = rng.choice(["\n", "\r\n", "\r"]).join(rows)
    encoding = rng.choice(["utf-8", "utf-8-sig", "utf-16", "utf-16-le", "cp1252", "latin-1"])
    data = text.encode(encoding, errors="replace")
    return damage_bytes(rng, data) if rng.random() < 0.3 else data


@pytest.mark.parametrize("seed", SEEDS)
def test_damaged_workbooks_and_csv_files(seed, tmp_path, capsys):
    rng = random.Random(seed)
    books = originals()
    run_check(capsys, damage_bytes(rng, rng.choice(books)), tmp_path, ".xlsx")
    run_check(capsys, damage_part(rng, rng.choice(books)), tmp_path, ".xlsx")
    run_check(capsys, csv_text(rng), tmp_path, rng.choice([".csv", ".txt"]))


def test_the_loop_reaches_both_usable_and_refused_files(tmp_path, capsys):
    """The mutations are neither all harmless nor all fatal (the loop exercises both ends)."""
    codes = set()
    for seed in range(20):
        rng = random.Random(seed)
        codes.add(run_check(capsys, csv_text(rng), tmp_path, ".csv"))
        codes.add(run_check(capsys, damage_part(rng, originals()[0]), tmp_path, ".xlsx"))
    assert codes == {0, 1}

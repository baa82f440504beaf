"""The Excel calendar opens cleanly in LibreOffice too (issue 13's fixed point): every sheet
present, dates as dates, formula-like text kept as text. LibreOffice converts our workbook to
its flat XML format (.fods) headless, and the cells are read back from that. Skipped where
LibreOffice is not installed (Debian: libreoffice-calc-nogui)."""

from __future__ import annotations

import shutil
import subprocess
import xml.etree.ElementTree as ET

import pytest

from leaguegrid.launch import main

SOFFICE = shutil.which("soffice") or shutil.which("libreoffice")
pytestmark = pytest.mark.skipif(SOFFICE is None, reason="LibreOffice is not installed")

TABLE = "{urn:oasis:names:tc:opendocument:xmlns:table:1.0}"
OFFICE = "{urn:oasis:names:tc:opendocument:xmlns:office:1.0}"
TEXT = "{urn:oasis:names:tc:opendocument:xmlns:text:1.0}"


def cells(table: ET.Element) -> list[tuple[str | None, str | None, str]]:
    """(value type, formula, text) of every non-empty cell of a sheet."""
    out = []
    for cell in table.iter(f"{TABLE}table-cell"):
        text = "".join("".join(p.itertext()) for p in cell.iter(f"{TEXT}p"))
        if text:
            out.append((cell.get(f"{OFFICE}value-type"), cell.get(f"{TABLE}formula"), text))
    return out


def convert(workbook, folder):
    """The workbook as LibreOffice reads it: its sheets, each a list of cells."""
    profile = folder / "profile"  # a profile of its own: no clash with a running LibreOffice
    subprocess.run([SOFFICE, f"-env:UserInstallation=file://{profile}", "--headless",
                    "--convert-to", "fods", "--outdir", str(folder / "out"), str(workbook)],
                   check=True, capture_output=True, timeout=180)
    root = ET.parse(folder / "out" / (workbook.stem + ".fods")).getroot()
    return {t.get(f"{TABLE}name"): cells(t) for t in root.iter(f"{TABLE}table")}


def test_dates_are_dates_and_every_sheet_is_there(tmp_path, capsys):
    from pathlib import Path

    from openpyxl import load_workbook

    demo = Path(__file__).resolve().parents[3] / "demo_leagues" / "small.xlsx"
    target = tmp_path / "small-calendar.xlsx"
    assert main(["plan", str(demo), "--rounds", "6", "--seed", "7", "--out", str(target)]) == 0
    tables = convert(target, tmp_path)
    assert list(tables) == load_workbook(target, read_only=True).sheetnames
    dates = [text for kind, _f, text in tables["Calendar"] if kind == "date"]
    # small.xlsx: Start date 2027-09-04, every 7 days; one fixture a round in 6 rounds
    assert dates == ["2027-09-04", "2027-09-11", "2027-09-18", "2027-09-25", "2027-10-02",
                     "2027-10-09"]


def test_formula_like_text_stays_text(tmp_path, capsys):
    league = tmp_path / "league.csv"
    league.write_text("Home,Away,Venue\n=Hawks,Kite,Brackenhill Park\n+Plus,-Minus,@Tarn Field\n"
                      "Kite,+Plus,Brackenhill Park\n", encoding="utf-8")
    settings = tmp_path / "calendar.xlsx"
    code = main(["plan", str(league), "--rounds", "3", "--seed", "1", "--out", str(settings)])
    assert code == 0, capsys.readouterr()
    calendar = convert(settings, tmp_path)["Calendar"]
    for kind, formula, text in calendar:
        assert formula is None, text  # nothing became a formula
        if text.startswith(("=", "+", "-", "@")) or " v " in text:
            assert kind == "string", text
    home_cells = [text for kind, _f, text in calendar if text in ("=Hawks", "+Plus", "-Minus")]
    assert sorted(set(home_cells)) == ["+Plus", "-Minus", "=Hawks"]

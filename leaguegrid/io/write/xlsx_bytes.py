"""An openpyxl workbook as the complete bytes of an .xlsx file, made in memory."""

from __future__ import annotations

import io
import zipfile

from openpyxl import Workbook
from openpyxl.writer.excel import ExcelWriter


def workbook_bytes(wb: Workbook) -> bytes:
    """The .xlsx file's bytes (its `modified` time as the caller set it). The zip is closed
    before any byte goes to disk, so a disk that fails mid-write never leaves a half-closed
    zip (nor the zip library's complaint about one) behind."""
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED, allowZip64=True) as archive:
        ExcelWriter(wb, archive).write_data()
    return buffer.getvalue()

"""Reading user text safely: invalid UTF-8 is replaced and counted, never fatal.

Input is read in binary and decoded line by line with U+FFFD for each invalid byte; the number of
replaced bytes is kept so the CLI can report it.
"""

from __future__ import annotations

import codecs
import sys
import unicodedata
from collections.abc import Iterator
from dataclasses import dataclass
from pathlib import Path
from typing import BinaryIO

from .errors import Position, UserError


@dataclass
class ReadStats:
    """What was read: lines, bytes, and invalid bytes replaced."""

    lines: int = 0
    bytes: int = 0
    replaced_bytes: int = 0
    nul_bytes: int = 0


_replaced_counter: list[int] = [0]


def _counting_replace(exc: UnicodeError) -> tuple[str, int]:
    if not isinstance(exc, UnicodeDecodeError):
        raise exc
    _replaced_counter[0] += exc.end - exc.start
    return "\ufffd" * (exc.end - exc.start), exc.end


codecs.register_error("morphfst-count", _counting_replace)


def open_binary(path: str | None) -> BinaryIO:
    """A binary handle on ``path``, or on standard input for ``None`` or ``-``."""
    if path is None or path == "-":
        return sys.stdin.buffer
    try:
        return Path(path).open("rb")
    except OSError as exc:
        raise UserError(f"cannot read input file: {exc.strerror or exc}", Position(path), hint="check the path") from None


def read_lines(handle: BinaryIO, stats: ReadStats) -> Iterator[str]:
    """Decoded lines (without the newline), NFC-normalized; invalid bytes become U+FFFD and are counted."""
    for raw in handle:
        stats.lines += 1
        stats.bytes += len(raw)
        if b"\x00" in raw:
            stats.nul_bytes += raw.count(b"\x00")
        before = _replaced_counter[0]
        text = raw.decode("utf-8", errors="morphfst-count")
        stats.replaced_bytes += _replaced_counter[0] - before
        if text.endswith("\n"):
            text = text[:-1]
            if text.endswith("\r"):
                text = text[:-1]
        yield unicodedata.normalize("NFC", text)

"""Options and output helpers shared by the subcommands."""

from __future__ import annotations

import argparse
import json
import sys
from collections.abc import Iterator
from typing import Any, TextIO

from ..build import load
from ..runtime.compiled_language import Language
from ..textio import ReadStats, open_binary, read_lines

FORMATS = ("table", "tsv", "jsonl")


def add_language(parser: argparse.ArgumentParser) -> None:
    parser.add_argument(
        "-l",
        "--lang",
        default="tur",
        metavar="LANG",
        help="a shipped language (tur, fin: always the grammar shipped with morphfst), or the path of a grammar "
        "(.mfg) or compiled file (.mfc, loaded as it is); names not shipped are also looked up in the folders "
        "of $MORPHFST_GRAMMARS, and the file used is then printed; default: tur",
    )


def add_input(parser: argparse.ArgumentParser, what: str = "words") -> None:
    parser.add_argument(
        "-i",
        "--input",
        metavar="FILE",
        help=f"read {what} from FILE ('-' for standard input); without arguments standard input is read",
    )


def add_format(parser: argparse.ArgumentParser) -> None:
    parser.add_argument(
        "-f",
        "--format",
        choices=FORMATS,
        default="table",
        help="table: aligned, for people; tsv: header line and one row per record; jsonl: one JSON object per line",
    )


def open_language(args: argparse.Namespace) -> Language:
    from ..build import find_grammar, shipped_names

    name = str(args.lang)
    if name not in shipped_names() and "/" not in name and not name.endswith((".mfg", ".mfc")):
        sys.stderr.write(f"note: language {name!r} is {find_grammar(name)} (from $MORPHFST_GRAMMARS)\n")
    return load(args.lang, recompile=getattr(args, "recompile", False))


def input_lines(args: argparse.Namespace, stats: ReadStats) -> Iterator[str]:
    """Lines from --input, or standard input."""
    handle = open_binary(args.input)
    try:
        yield from read_lines(handle, stats)
    finally:
        if handle is not sys.stdin.buffer:
            handle.close()


def words_from(args: argparse.Namespace, stats: ReadStats) -> Iterator[str]:
    """The words given as arguments, or else every whitespace-separated token of the input lines."""
    if args.words:
        yield from args.words
        return
    for line in input_lines(args, stats):
        yield from line.replace("\x00", " ").split()  # a NUL separates words, as in segment and corpus


def checked_word(word: str) -> str:
    """A word for the debugging tools: not empty and not longer than the analyzers read."""
    from ..errors import UserError
    from ..runtime.compiled_language import MAX_WORD

    if not word.strip():
        raise UserError("empty word", hint="give the word to look at, e.g. morphfst explain evlerde")
    if len(word) > MAX_WORD:
        raise UserError(
            f"a token of {len(word):,} characters is not a word",
            hint=f"tokens longer than {MAX_WORD:,} characters get no analysis; give a single word",
        )
    return word


def split_labels(text: str | None) -> list[str]:
    """Labels given as 'A,B' or 'A;B' on the command line."""
    if not text:
        return []
    return [x.strip() for x in text.replace(";", ",").split(",") if x.strip()]


def report_stats(stats: ReadStats, err: TextIO | None = None) -> None:
    err = err or sys.stderr
    if stats.replaced_bytes:
        err.write(f"note: replaced {stats.replaced_bytes} invalid UTF-8 byte(s) with U+FFFD\n")
    if stats.nul_bytes:
        err.write(f"note: input had {stats.nul_bytes} NUL byte(s)\n")


def write_json(obj: Any, out: TextIO) -> None:
    out.write(json.dumps(obj, ensure_ascii=False) + "\n")


def tsv_field(text: str) -> str:
    """A TSV-safe field (tabs and newlines replaced by spaces)."""
    return text.replace("\t", " ").replace("\n", " ").replace("\r", " ")


def shorten(text: str, width: int = 60) -> str:
    return text if len(text) <= width else text[: width - 1] + "…"


class Aligned:
    """Rows printed in aligned columns, flushed in blocks so that long inputs stream."""

    def __init__(self, header: list[str], out: TextIO, block: int = 500) -> None:
        self.header = header
        self.rows: list[list[str]] = []
        self.out = out
        self.block = block
        self.widths = [len(h) for h in header]
        self.printed_header = False

    def add(self, row: list[str]) -> None:
        self.rows.append(row)
        if len(self.rows) >= self.block:
            self.flush()

    def flush(self) -> None:
        if not self.rows and self.printed_header:
            return
        for row in self.rows:
            self.widths = [max(w, len(c)) for w, c in zip(self.widths, row)]
        if not self.printed_header:
            self._line(self.header)
            self._line(["-" * w for w in self.widths])
            self.printed_header = True
        for row in self.rows:
            self._line(row)
        self.rows = []

    def _line(self, cells: list[str]) -> None:
        parts = [c.ljust(w) for c, w in zip(cells, self.widths)]
        self.out.write("  ".join(parts).rstrip() + "\n")

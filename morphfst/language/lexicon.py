"""Read lexicon files: UTF-8 TSV with a header line, ``#`` comments and blank lines.

Columns (by header name, any order): ``lemma``, ``class``, ``pos``, ``gloss`` (required) and
``weight``, ``count``, ``stem``, ``flags`` (optional). The evidence columns that ``morphfst harvest``
writes after them (``score``, ``attested``, ``tokens``, ``examples``, ``runner_up``) are accepted and
ignored, so a reviewed harvest file can be placed among the lexicon files as it is. A count becomes a tropical weight
``-ln(count / total)`` over the entries that give counts; an explicit weight is used as it is.
"""

from __future__ import annotations

import math
import unicodedata
from collections.abc import Callable
from pathlib import Path

from ..errors import Position, UserError
from . import model as m
from .syntax import parse_form

REQUIRED = ("lemma", "class", "pos", "gloss")
OPTIONAL = ("weight", "count", "stem", "flags")
EVIDENCE = ("score", "attested", "tokens", "examples", "runner_up")  # written by morphfst harvest; ignored here


def lexicon_files(grammar: m.Grammar) -> list[Path]:
    """The TSV files named by the grammar's ``lexicon`` lines (directories: every *.tsv, sorted)."""
    base = Path(grammar.path).parent
    files: list[Path] = []
    for entry in grammar.lexicon_paths:
        path = (base / entry).resolve()
        if path.is_dir():
            files.extend(sorted(path.glob("*.tsv")))
        elif path.exists():
            files.append(path)
        else:
            raise UserError(
                f"lexicon path not found: {entry}",
                Position(grammar.path),
                hint=f"the path is relative to the grammar file; looked for {path}",
            )
    return files


def read_lexicon(grammar: m.Grammar, fold: Callable[[str], str], files: list[Path] | None = None) -> list[m.LexEntry]:
    """Read and validate every lexicon file of ``grammar``; ``fold`` normalizes a lemma to a stem."""
    entries: list[m.LexEntry] = []
    counts: list[tuple[int, float]] = []
    seen: dict[tuple[str, str, str, tuple[str, ...]], Position] = {}
    for path in files if files is not None else lexicon_files(grammar):
        grammar.sources.append(str(path))
        for entry, count in _read_file(path, grammar, fold):
            key = (entry.lemma, entry.klass, entry.pos_tag, tuple(entry.stem))
            if key in seen:
                raise UserError(
                    f"duplicate entry {entry.lemma!r} ({entry.klass}, {entry.pos_tag})",
                    entry.pos,
                    hint=f"the same entry is already at {seen[key]}; delete one of them",
                )
            seen[key] = entry.pos
            if count is not None:
                counts.append((len(entries), count))
            entries.append(entry)
    total = sum(c for _, c in counts)
    for index, count in counts:
        entries[index].weight += -math.log(count / total) if total > 0 else 0.0
    if counts:
        # Entries without a count where others have one get half a count (simple smoothing), so that
        # an entry without a count is not preferred over every counted one.
        counted = {index for index, _ in counts}
        unseen = -math.log(0.5 / total)
        for index, entry in enumerate(entries):
            if index not in counted and entry.weight == 0.0:
                entry.weight = unseen
    return entries


def _read_file(path: Path, grammar: m.Grammar, fold: Callable[[str], str]) -> list[tuple[m.LexEntry, float | None]]:
    try:
        raw = path.read_bytes()
    except OSError as exc:
        raise UserError(f"cannot read lexicon file: {exc.strerror or exc}", Position(str(path))) from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        bad_line = raw[: exc.start].count(b"\n") + 1
        raise UserError("lexicon file is not valid UTF-8", Position(str(path), bad_line), hint="save it as UTF-8") from None
    text = unicodedata.normalize("NFC", text.removeprefix("\ufeff"))  # a byte-order mark from an editor
    header: list[str] | None = None
    out: list[tuple[m.LexEntry, float | None]] = []
    for number, line in enumerate(text.splitlines(), start=1):
        if not line.strip() or line.lstrip().startswith("#"):
            continue
        fields = line.split("\t")
        if header is None:
            header = [f.strip().lower() for f in fields]
            for name in header:
                if name not in REQUIRED + OPTIONAL + EVIDENCE:
                    raise UserError(
                        f"unknown column {name!r} in the header",
                        Position(str(path), number, _column(line, header.index(name))),
                        hint="columns are " + ", ".join(REQUIRED + OPTIONAL),
                        source_line=line,
                    )
            missing = [c for c in REQUIRED if c not in header]
            if missing:
                raise UserError(
                    f"the header lacks the column(s) {', '.join(missing)}",
                    Position(str(path), number, 1),
                    hint="the first non-comment line names the columns, separated by tabs",
                    source_line=line,
                )
            continue
        out.append(_entry(path, number, line, fields, header, grammar, fold))
    return out


def _column(line: str, index: int) -> int:
    parts = line.split("\t")
    return sum(len(p) + 1 for p in parts[:index]) + 1


def _entry(
    path: Path,
    number: int,
    line: str,
    fields: list[str],
    header: list[str],
    grammar: m.Grammar,
    fold: Callable[[str], str],
) -> tuple[m.LexEntry, float | None]:
    if len(fields) > len(header):
        raise UserError(
            f"{len(fields)} fields but the header names {len(header)} columns",
            Position(str(path), number, _column(line, len(header))),
            hint="separate columns with exactly one tab; leave an optional column empty",
            source_line=line,
        )
    row = {name: (fields[i].strip() if i < len(fields) else "") for i, name in enumerate(header)}

    def where(column: str) -> Position:
        return Position(str(path), number, _column(line, header.index(column)))

    def fail(column: str, message: str, hint: str) -> UserError:
        return UserError(message, where(column), hint=hint, source_line=line)

    lemma = row["lemma"]
    if not lemma:
        raise fail("lemma", "empty lemma", "every line needs a lemma in the first column")
    if not row["gloss"]:
        raise fail("gloss", "empty gloss", "every line needs an English gloss (it is shown in Leipzig glosses)")
    klass = row["class"]
    if klass not in grammar.classes:
        near = _nearest(klass, list(grammar.classes))
        raise fail(
            "class",
            f"unknown class {klass!r}",
            f"did you mean {near!r}?" if near else "declare it in the grammar's classes block",
        )
    pos_tag = row["pos"]
    allowed = grammar.classes[klass].pos_allowed or grammar.pos_tags
    if pos_tag not in allowed:
        raise fail("pos", f"part of speech {pos_tag!r} does not fit class {klass}", "allowed here: " + ", ".join(allowed))
    weight = 0.0
    count: float | None = None
    if row.get("weight"):
        try:
            weight = float(row["weight"])
        except ValueError:
            raise fail(
                "weight", f"malformed weight {row['weight']!r}", "a weight is a number such as 0.5 (lower is better)"
            ) from None
        if not math.isfinite(weight):
            raise fail("weight", f"malformed weight {row['weight']!r}", "a weight must be a finite number")
    if row.get("count"):
        try:
            count = float(row["count"])
            if count <= 0 or not math.isfinite(count):
                raise ValueError
        except ValueError:
            raise fail(
                "count", f"malformed count {row['count']!r}", "a count is a positive number of corpus occurrences"
            ) from None
    flags = [f.strip() for f in row.get("flags", "").split(",") if f.strip()]
    for flag in flags:
        if flag not in grammar.flags:
            near = _nearest(flag, list(grammar.flags))
            raise fail(
                "flags",
                f"unknown flag {flag!r}",
                f"did you mean {near!r}?" if near else "declare it in the grammar's flags block",
            )
    pos = Position(str(path), number, 1)
    stem_text = row.get("stem") or fold(lemma)
    stem = parse_form(stem_text, where("stem") if row.get("stem") else pos)
    known = set(grammar.letters) | set(grammar.archiphonemes) | set(grammar.markers)
    for sym in stem:
        base = sym[1:-1] if sym.startswith("(") else sym
        if sym not in known and base not in known:
            column = "stem" if row.get("stem") else "lemma"
            raise fail(
                column,
                f"symbol {sym!r} of stem {stem_text!r} is not in the alphabet",
                "add it to the grammar's letters, or give an underlying stem in the stem column",
            )
    entry = m.LexEntry(lemma, klass, pos_tag, row["gloss"], weight, stem, flags, pos, stem_given=bool(row.get("stem")))
    return entry, count


def _nearest(word: str, choices: list[str]) -> str | None:
    import difflib

    close = difflib.get_close_matches(word, choices, n=1, cutoff=0.6)
    return close[0] if close else None

"""Counting word types: a corpus (files or directories of text) or a word list (``word<TAB>count``).

Counting comes first, so the harvest holds one entry per distinct spelling and never the text: memory
grows with the vocabulary, not with the corpus. Text is split by the corpus pipeline's tokenizer
(:class:`morphfst.runtime.tokenize.Tokenizer`, with the language's apostrophes); invalid UTF-8 is replaced and
counted like everywhere else. A malformed word list line is a user error with its file and line.
"""

from __future__ import annotations

import math
import os
from collections import Counter
from collections.abc import Iterable
from dataclasses import dataclass, field

from ..corpus.progress import Progress
from ..corpus.sources import Source, expand_inputs
from ..errors import Position, UserError
from ..runtime.compiled_language import Language
from ..runtime.tokenize import Tokenizer
from ..textio import ReadStats, open_binary, read_lines


@dataclass
class TypeCounts:
    """Tokens per spelling as written (case kept), and what was read."""

    spellings: Counter[str] = field(default_factory=Counter)
    tokens: int = 0
    stats: ReadStats = field(default_factory=ReadStats)


def count_types(
    lang: Language, inputs: Iterable[str], word_list: bool = False, quiet: bool = False, progress: bool = True
) -> TypeCounts:
    """Count the word types of ``inputs`` (files, directories, ``-``): running text tokenized with the
    corpus tokenizer, or with ``word_list`` lines ``word<TAB>count``."""
    sources = expand_inputs(list(inputs))
    total = sum(s.size or 0 for s in sources) if all(s.size is not None for s in sources) else None
    bar = Progress(total, quiet=quiet or not progress, desc="counting")
    out = TypeCounts()
    tokenizer = Tokenizer.for_meta(lang.meta)
    try:
        for source in sources:
            if word_list:
                _read_word_list(source, out, bar)
            else:
                _read_text(source, tokenizer, out, bar)
    finally:
        bar.close()
    if not out.spellings:
        where = ", ".join(s.path for s in sources)
        raise UserError(
            f"no words in the input ({where})",
            hint="give text files or directories, or a word list of word<TAB>count lines with --word-list",
        )
    return out


def _read_text(source: Source, tokenizer: Tokenizer, out: TypeCounts, bar: Progress) -> None:
    handle = open_binary(source.path)
    spellings = out.spellings
    tokens = tokenizer.tokens
    before = out.stats.bytes
    try:
        for number, line in enumerate(read_lines(handle, out.stats), start=1):
            found = tokens(line)
            spellings.update(found)
            out.tokens += len(found)
            if number % 2000 == 0:
                bar.update(out.stats.bytes - before, 0)
                before = out.stats.bytes
                bar.tokens = out.tokens
    finally:
        if source.path != "-":
            handle.close()
    bar.update(out.stats.bytes - before, 0)
    bar.tokens = out.tokens


def _read_word_list(source: Source, out: TypeCounts, bar: Progress) -> None:
    handle = open_binary(source.path)
    name = "standard input" if source.path == "-" else source.path
    before = out.stats.bytes
    try:
        for number, line in enumerate(read_lines(handle, out.stats), start=1):
            if not line.strip() or line.lstrip().startswith("#"):
                continue
            word, tab, count_text = line.partition("\t")
            word = word.strip()
            try:
                count = float(count_text.strip()) if tab else math.nan
            except ValueError:
                count = math.nan
            if not word or not math.isfinite(count) or count <= 0 or count != int(count):
                raise UserError(
                    f"malformed word list line: expected word<TAB>count, got {line[:60]!r}",
                    Position(name, number, len(word) + 2 if tab else 1),
                    hint="every line is a word, a tab and a positive whole number (its count)",
                    source_line=line,
                )
            out.spellings[word] += int(count)
            out.tokens += int(count)
            if number % 5000 == 0:
                bar.update(out.stats.bytes - before, 0)
                before = out.stats.bytes
                bar.tokens = out.tokens
    finally:
        if source.path != "-":
            handle.close()
    bar.update(out.stats.bytes - before, 0)


def default_jobs() -> int:
    return max(1, min(4, os.cpu_count() or 1))

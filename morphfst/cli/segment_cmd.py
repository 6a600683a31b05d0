"""``morphfst segment``: split words, or every word of a text, into stem and affix morphs."""

from __future__ import annotations

import argparse
import contextlib
import os
import sys
import unicodedata
from collections import Counter
from collections.abc import Iterator
from typing import BinaryIO, TextIO

from ..corpus.progress import Progress
from ..corpus.reading import CHUNK_BYTES, MAX_LINE_BYTES, Chunk, chunks, read_blocks
from ..corpus.records import decode
from ..runtime.compiled_language import Language
from ..runtime.results import Segmentation
from ..runtime.tokenize import HYPHENS, Tokenizer, split_line
from ..textio import ReadStats, open_binary
from .common import Aligned, add_input, add_language, open_language, report_stats, shorten, tsv_field, write_json

EXAMPLES = """examples:
  morphfst segment evlerinden kitapçılar          words given on the command line
  morphfst segment -i demo/tur_library.txt        a text: same lines, words split into morphs
  morphfst segment -i demo/tur_library.txt --sep ' +'  morphs as separate terms for an indexer
  morphfst segment -i demo/tur_library.txt -f jsonl  one JSON object per token, all segmentations
  morphfst segment -i demo/tur_library.txt --guess --mark-unknown '?'  unknown words split by the guesser, marked
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "segment",
        help="split words or a text into stem and affix morphs",
        description="Split each word into its surface morphs (best segmentation first). Given words, print a table; "
        "given a text, print the same text with every analyzable word split, keeping lines and punctuation, "
        "and a coverage summary on standard error.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("words", nargs="*", help="words to segment (default: read a text from --input or standard input)")
    add_language(p)
    add_input(p, "a text")
    p.add_argument("-f", "--format", choices=("text", "tsv", "jsonl"), default="text", help="text (default), tsv or jsonl")
    p.add_argument("--sep", default="-", help="string put between morphs in text output (default '-')")
    p.add_argument(
        "--guess",
        action="store_true",
        help="split words the lexicon does not know by the guesser's best reading (counted apart in the summary; "
        "--mark-unknown marks them too)",
    )
    p.add_argument("--mark-unknown", default="", metavar="MARK", help="put MARK before words with no analysis in text output")
    p.add_argument("--no-summary", action="store_true", help="do not print the coverage summary")
    p.set_defaults(func=run)


def project(original: str, normalized: str, morphs: list[str]) -> list[str]:
    """Cut the original spelling at the morph boundaries when normalization kept the length."""
    if len(original) != len(normalized):
        return morphs
    out, pos = [], 0
    for morph in morphs:
        # a hyphen that no morph carries (a hyphenated word analyzed by its last part) is skipped:
        # the separator stands for it
        while pos < len(normalized) and normalized[pos] in HYPHENS and not normalized.startswith(morph, pos):
            pos += 1
        out.append(original[pos : pos + len(morph)])
        pos += len(morph)
    return out


class Coverage:
    """Token and type coverage of a run."""

    def __init__(self) -> None:
        self.tokens = 0
        self.analyzed = 0
        self.analyses = 0
        self.guessed = 0
        self.types: Counter[str] = Counter()
        self.unknown: Counter[str] = Counter()

    def add(self, word: str, n_analyses: int, guessed: bool = False) -> None:
        """Count a token with ``n_analyses`` lexicon analyses (a guessed token counts as unanalyzed)."""
        self.tokens += 1
        self.types[word] += 1
        if guessed:
            self.guessed += 1
            self.unknown[word] += 1
        elif n_analyses:
            self.analyzed += 1
            self.analyses += n_analyses
        else:
            self.unknown[word] += 1

    def summary(self, top: int = 10) -> str:
        types = len(self.types)
        known_types = types - len(self.unknown)
        pct = 100.0 * self.analyzed / self.tokens if self.tokens else 0.0
        tpct = 100.0 * known_types / types if types else 0.0
        amb = self.analyses / self.analyzed if self.analyzed else 0.0
        lines = [
            "coverage summary",
            f"  tokens:  {self.tokens:>8}   analyzed {self.analyzed:>8}  ({pct:5.1f}%)",
            f"  types:   {types:>8}   analyzed {known_types:>8}  ({tpct:5.1f}%)",
            f"  analyses per analyzed token: {amb:.2f}",
        ]
        if self.guessed:
            lines.append(f"  unanalyzed tokens split by the guesser: {self.guessed}")
        if self.unknown:
            common = ", ".join(f"{w} ({n})" for w, n in self.unknown.most_common(top))
            lines.append(f"  most frequent unanalyzed: {common}")
        return "\n".join(lines) + "\n"


def run(args: argparse.Namespace) -> int:
    lang = open_language(args)
    tokenizer = Tokenizer.for_meta(lang.meta)
    stats = ReadStats()
    coverage = Coverage()
    out = sys.stdout
    if args.words:
        table = Aligned(["word", "segmentation", "gloss", "analysis"], out)
        for word in args.words:
            segs = lang.segment(word, guess=args.guess)
            coverage.add(word, len(segs), _guessed(segs))
            if args.format == "jsonl":
                write_json({"word": word, "segmentations": [s.to_dict() for s in segs]}, out)
            elif args.format == "tsv":
                best = segs[0] if segs else None
                out.write(f"{tsv_field(word)}\t{best.text if best else ''}\t{best.gloss if best else ''}\n")
            elif not segs:
                table.add([shorten(word), "(no analysis)", "", ""])
            else:
                for rank, s in enumerate(segs):
                    table.add([shorten(word) if rank == 0 else "", s.text, s.gloss, s.analyses[0].text])
        if args.format == "text":
            table.flush()
    else:
        if args.format == "tsv":
            out.write("line\tword\tsegmentation\tgloss\tlemma\n")
        _segment_text(args, lang, tokenizer, coverage, stats, out)
    if not args.no_summary:
        sys.stderr.write(coverage.summary())
    report_stats(stats)
    return 0


CACHE_TYPES = 200_000  # word types whose segmentations are kept (the cache is emptied when full)


def _segment_text(
    args: argparse.Namespace, lang: Language, tokenizer: Tokenizer, coverage: Coverage, stats: ReadStats, out: TextIO
) -> None:
    """Segment a text with the corpus pipeline's streaming path: chunks of whole lines read in binary
    (overlong lines cut at white space, constant memory), a cache per word type, and a progress bar on
    standard error when it is a terminal."""
    handle = open_binary(args.input)
    size = None
    if handle is not sys.stdin.buffer:
        with contextlib.suppress(OSError):
            size = os.fstat(handle.fileno()).st_size
    progress = Progress(size, quiet=args.no_summary)
    cache: dict[str, list[Segmentation]] = {}
    try:
        for chunk in _chunks_of(handle):
            text, replaced = decode(chunk.data)
            stats.bytes += len(chunk.data)
            stats.replaced_bytes += replaced
            stats.nul_bytes += chunk.data.count(b"\x00")
            lines = text.split("\n")
            ended = text.endswith("\n")
            if ended:
                lines.pop()
            tokens = 0
            for i, raw_line in enumerate(lines):
                last = i == len(lines) - 1
                line_end = not (last and chunk.continues)
                if line_end:
                    stats.lines += 1
                line = unicodedata.normalize("NFC", raw_line[:-1] if raw_line.endswith("\r") and line_end else raw_line)
                pieces: list[str] = []
                for piece, is_word in split_line(line, tokenizer):
                    if not is_word:
                        pieces.append(piece)
                        continue
                    segs = cache.get(piece)
                    if segs is None:
                        if len(cache) >= CACHE_TYPES:
                            cache.clear()
                        segs = cache[piece] = lang.segment(piece, guess=args.guess)
                    coverage.add(piece, len(segs), _guessed(segs))
                    tokens += 1
                    _emit_token(args, out, chunk.first_line + i, piece, segs, pieces)
                if args.format == "text":
                    out.write("".join(pieces) + ("\n" if line_end else ""))
            progress.update(len(chunk.data), tokens)
    finally:
        progress.close()
        if handle is not sys.stdin.buffer:
            handle.close()


def _chunks_of(handle: BinaryIO) -> Iterator[Chunk]:
    """Chunks of whole lines; one line at a time when a person types at a terminal."""
    if handle is sys.stdin.buffer and sys.stdin.isatty():
        for index, raw in enumerate(iter(handle.readline, b"")):
            yield Chunk(index, index + 1, raw)
        return
    yield from chunks(read_blocks(handle), 1, CHUNK_BYTES, MAX_LINE_BYTES)


def _emit_token(
    args: argparse.Namespace, out: TextIO, number: int, text: str, segs: list[Segmentation], pieces: list[str]
) -> None:
    best = segs[0] if segs else None
    if args.format == "text":
        if best is None:
            pieces.append(args.mark_unknown + text)
        else:
            morphs = project(text, best.word, [m for m in best.morphs if m])
            pieces.append((args.mark_unknown if _guessed(segs) else "") + args.sep.join(morphs))
    elif args.format == "tsv":
        lemma = best.analyses[0].lemma if best else ""
        out.write(f"{number}\t{tsv_field(text)}\t{best.text if best else ''}\t{best.gloss if best else ''}\t{lemma}\n")
    else:
        write_json({"line": number, "word": text, "segmentations": [s.to_dict() for s in segs]}, out)


def _guessed(segs: list[Segmentation]) -> bool:
    """True when the segmentations are the guesser's (the lexicon does not know the word)."""
    return bool(segs) and segs[0].analyses[0].guessed

"""Turning chunks of input into output records: tokenize, analyze each word type once, format.

One :class:`ChunkProcessor` lives in each worker (or in the main process with one job). It keeps a
cache of the formatted output of every word type it has seen (most tokens of a corpus are repeats,
Zipf's law), bounded in size: two generations of at most ``cache_size`` types (and ``cache_chars``
characters) each; when the young generation is full, it becomes the old one and the previous old one is dropped, so frequent types
stay while memory stays constant.

Output modes (one record per input token, line structure kept):

``terms``
    one output line per input line: one index term group per token, separated by a space. With
    ``term=lemma`` or ``term=stem`` a group is one term; with ``term=morphs`` it is the stem followed
    by the affix morphs with a leading ``+`` (``kitap +lar +da``); a token is thus a term without
    ``+`` and its morphs. Punctuation is dropped.
``jsonl``
    one JSON object per input line: ``{"line": N, "tokens": [...]}``, each token with its text, its
    offsets in the decoded, NFC-normalized line (``start`` and ``end`` in characters, ``start_byte``
    and ``end_byte`` in UTF-8 bytes; ends are exclusive), status and every ranked analysis.
``conllu``
    CoNLL-U (Universal Dependencies v2): sentences split at ``. ! ? …`` and at line ends, LEMMA,
    UPOS, XPOS (the grammar's part of speech) and FEATS (the grammar's UD mapping); punctuation rows
    have UPOS PUNCT (or SYM); MISC carries the segmentation, gloss, guess marks and SpaceAfter=No.

A token's status is ``analyzed`` (lexicon stem), ``guessed`` (the grammar's guesser), ``unknown``
(neither) or ``number`` (contains a digit; not analyzed as a word).
"""

from __future__ import annotations

import codecs
import gc
import itertools
import json
import marshal
import unicodedata
from collections import Counter
from collections.abc import Iterable
from dataclasses import dataclass, field, fields
from operator import not_
from typing import Any

from ..runtime.compiled_language import MAX_WORD, Language
from ..runtime.results import Analysis
from ..runtime.tokenize import DOT_BEFORE_LOWER_BYTES, PUNCT, SPACE, Tokenizer
from ..runtime.walk import MAX_GUESSES
from .reading import CHUNK_BYTES, MAX_LINE_BYTES, Chunk

# The type caches and the walker's tables only grow during a run, and Python's cycle collector would
# scan all of them at every full collection (a fifth of a corpus run). Every FREEZE_EVERY analyzed
# types and after each chunk, what is alive is moved out of the collector's generations
# (``gc.freeze``): later collections look only at what was made since. Memory is still freed by
# reference counting; only cyclic garbage made before a freeze would stay (the pipeline makes none).
FREEZE_EVERY = 1024

MODES = ("terms", "jsonl", "conllu")
TERMS = ("lemma", "stem", "morphs")
ANALYZED, GUESSED, UNKNOWN, NUMBER = 0, 1, 2, 3
STATUS = ("analyzed", "guessed", "unknown", "number")
MAX_CACHED_TOKEN = 200  # longer tokens are not cached
SENTENCE_END = frozenset(".!?…")
NEWLINE = "\n"


@dataclass
class Options:
    """What to produce and how (shared by every engine)."""

    mode: str = "terms"
    term: str = "lemma"
    guess: bool = True
    max_analyses: int = 20  # analyses per token in jsonl output
    guess_mark: str = ""  # terms mode: put before the term of a guessed word
    cache_size: int = 100_000  # types per cache generation
    cache_chars: int = 24_000_000  # characters of output per cache generation (jsonl values are long)
    chunk_bytes: int = CHUNK_BYTES
    max_line_bytes: int = MAX_LINE_BYTES

    def __post_init__(self) -> None:
        if self.mode not in MODES:
            raise ValueError(f"unknown output mode {self.mode!r}")
        if self.term not in TERMS:
            raise ValueError(f"unknown term kind {self.term!r}")

    @property
    def suffix(self) -> str:
        """File name suffix of the output."""
        return {"terms": ".terms.txt", "jsonl": ".jsonl", "conllu": ".conllu"}[self.mode]


TypeRow = tuple[int, int, int]  # a word type's tokens, status and number of analyses


@dataclass
class Tally:
    """Per-token and per-type figures of the tokens processed since the last flush."""

    status_tokens: list[int] = field(default_factory=lambda: [0, 0, 0, 0])
    analyses: int = 0  # sum of the number of analyses over analyzed tokens
    ambiguous: int = 0  # analyzed tokens with more than one analysis
    long_tokens: int = 0  # tokens longer than the runtime's word limit
    unlisted_tokens: int = 0  # tokens too long to be listed as types
    types: dict[str, TypeRow] = field(default_factory=dict)  # normalized type -> (tokens, status, analyses)
    analyzed: int = 0  # word types analyzed (cache misses): the same type in two processes counts twice

    def packed(self) -> bytes:
        """These figures as :mod:`marshal` bytes, for a worker process's last figures: a table of
        45,000 types packs and unpacks in 9 ms against 23 ms with pickle, and a run's last flush is
        waited for. Only between processes of one interpreter (marshal's format is its own)."""
        return marshal.dumps(tuple(getattr(self, f.name) for f in fields(self)))

    @classmethod
    def unpacked(cls, data: bytes) -> Tally:
        """The figures :meth:`packed` made."""
        return cls(*marshal.loads(data))

    def merge(self, other: Tally) -> None:
        """Add ``other``'s figures to these (a type's status and analyses are those first seen)."""
        for i, n in enumerate(other.status_tokens):
            self.status_tokens[i] += n
        self.analyses += other.analyses
        self.ambiguous += other.ambiguous
        self.long_tokens += other.long_tokens
        self.unlisted_tokens += other.unlisted_tokens
        self.analyzed += other.analyzed
        add_types(self.types, other.types)


def add_types(into: dict[str, TypeRow], other: dict[str, TypeRow]) -> None:
    """Add the per-type table ``other`` to ``into``: token counts add up, a type's status and number
    of analyses are those first seen (an empty table takes the other whole, in one C-level copy)."""
    if not into:
        into.update(other)
        return
    get = into.get
    for norm, row in other.items():
        prev = get(norm)
        into[norm] = (prev[0] + row[0], prev[1], prev[2]) if prev else row


@dataclass
class ChunkResult:
    """The output of one chunk and what was counted on the way (``tally``: set when the processor flushed)."""

    index: int
    data: bytes
    lines: int
    tokens: int
    bytes_in: int
    replaced_bytes: int = 0
    nul_bytes: int = 0
    empty_lines: int = 0
    cut_lines: int = 0
    tally: Tally | None = None


_replaced: list[int] = [0]


def _count_replace(exc: UnicodeError) -> tuple[str, int]:
    if not isinstance(exc, UnicodeDecodeError):
        raise exc
    _replaced[0] += exc.end - exc.start
    return "\ufffd" * (exc.end - exc.start), exc.end


codecs.register_error("morphfst-corpus", _count_replace)


def decode(data: bytes) -> tuple[str, int]:
    """UTF-8 text (NFC) of ``data`` and the number of invalid bytes replaced by U+FFFD."""
    try:
        text = data.decode("utf-8")
        replaced = 0
    except UnicodeDecodeError:
        before = _replaced[0]
        text = data.decode("utf-8", errors="morphfst-corpus")
        replaced = _replaced[0] - before
    if not text.isascii():
        text = unicodedata.normalize("NFC", text)
    return text, replaced


def _clean_term(text: str) -> str:
    return "_".join(text.split()) if not text or any(ch.isspace() for ch in text) else text


def _misc_value(text: str) -> str:
    return "".join("_" if ch.isspace() or ch == "|" else ch for ch in text) or "_"


class TypeResult:
    """Everything the outputs need about one word type."""

    __slots__ = ("norm", "status", "analyses", "prefix", "split", "count")

    def __init__(
        self,
        norm: str,
        status: int,
        analyses: list[Analysis],
        prefix: str = "",
        split: tuple[str, str] | None = None,
        count: int | None = None,
    ):
        self.norm = norm
        self.status = status
        self.analyses = analyses  # all of them, or the best only (``count`` says how many there are)
        self.prefix = prefix  # hyphenated word analyzed by its last part: what comes before it
        self.split = split  # no analysis, but an apostrophe or colon: (stem, suffix)
        self.count = len(analyses) if count is None else count

    def stem_form(self, apostrophes: str) -> str:
        best = self.analyses[0]
        if not best.has_stem:  # suffixes read without their word: the lemma stands for the stem
            return self.prefix + best.lemma
        # the leading stem morphs: one for a lexicon word, the parts of a hyphenated word (joined
        # with its hyphen: etelä-suome), the first part of a compound as before
        stems = [best.morphs[0].form]
        if "-" in best.word:
            for morph in best.morphs[1:]:
                if morph.kind != "stem":
                    break
                stems.append(morph.form)
        return self.prefix + "-".join(stems).rstrip(apostrophes)

    def terms(self, kind: str, apostrophes: str, mark: str = "") -> str:
        if mark and self.status == GUESSED:
            return mark + self.terms(kind, apostrophes)
        if self.analyses:
            best = self.analyses[0]
            if kind == "lemma":
                return _clean_term(self.prefix + best.lemma)
            stem = _clean_term(self.stem_form(apostrophes))
            if kind == "stem":
                return stem
            affixes = [_clean_term(m.form.strip(apostrophes)) for m in best.affixes]
            return " ".join([stem] + ["+" + a for a in affixes if a])
        if self.split is not None:
            stem, suffix = self.split
            return _clean_term(stem) if kind != "morphs" else f"{_clean_term(stem)} +{_clean_term(suffix)}"
        return _clean_term(self.norm)

    def json_fields(self, limit: int) -> str:
        out: dict[str, Any] = {"status": STATUS[self.status]}
        if self.prefix:
            out["prefix"] = self.prefix
        if self.split is not None:
            out["split"] = list(self.split)
        out["analyses"] = [
            {
                "analysis": a.text,
                "lemma": self.prefix + a.lemma,
                "pos": a.pos,
                "features": list(a.features),
                "morphs": [m.form for m in a.morphs if m.form],
                "segmentation": a.segmentation,
                "gloss": a.gloss,
                "weight": round(a.weight, 4),
                "guessed": a.guessed,
            }
            for a in self.analyses[:limit]
        ]
        return json.dumps(out, ensure_ascii=False, separators=(",", ":"))[1:-1]

    def conllu_columns(self, apostrophes: str) -> tuple[str, str]:
        """(LEMMA, UPOS, XPOS, FEATS joined by tabs; MISC items joined by ``|`` or empty)."""
        if self.analyses:
            best = self.analyses[0]
            lemma = _clean_term(self.prefix + best.lemma)
            cols = f"{lemma}\t{best.upos()}\t{best.final_pos}\t{best.ud_feats()}"
            items = [
                f"MorphSeg={_misc_value(self.prefix + best.segmentation)}",
                f"MorphGloss={_misc_value(self.prefix + best.gloss)}",
            ]
            if self.status == GUESSED:
                items.append("MorphGuessed=Yes")
            if self.count > 1:
                items.append(f"MorphAnalyses={self.count}")
            return cols, "|".join(items)
        lemma = _clean_term(self.split[0] if self.split else self.norm)
        upos = "NUM" if self.status == NUMBER else "X"
        misc = "MorphUnknown=Yes" if self.status == UNKNOWN else ""
        return f"{lemma}\t{upos}\t_\t_", misc


# decoded text, bytes replaced; in terms mode also the tokens and line ends, their cached outputs
# (None where not cached when prepared), the positions of those holes and the cache's generation
# then (see ChunkProcessor.prepare)
Prepared = tuple[str, int, list[str] | None, list[Any] | None, list[int] | None, int]


class ChunkProcessor:
    """Analyzes and formats chunks for one language with a per-type cache (see the module documentation)."""

    type_affine = True  # worker processes may share word types by owner (:mod:`morphfst.corpus.local`)

    def __init__(self, lang: Language, options: Options, doc: str = "") -> None:
        self.lang = lang
        self.options = options
        self.doc = doc or "doc"
        self.fast = lang.fast
        self.tokenizer = Tokenizer.for_meta(lang.meta)
        self.apostrophes = "".join(self.tokenizer.apostrophes)
        self.young: dict[str, Any] = {}
        self.old: dict[str, Any] = {}
        self.info_young: dict[str, tuple[str, int, int]] = {}  # token -> (normalized type, status, analyses)
        self.info_old: dict[str, tuple[str, int, int]] = {}
        self.young_chars = 0  # characters held by the young generation (keys and values)
        self.generation = 0  # times the young generation became the old one
        self.counts: Counter[str] = Counter()  # tokens since the last flush
        self.pending = Tally()  # figures of overlong tokens since the last flush
        self.long_in_chunk = False
        self.misses = 0
        # answers found elsewhere (a Dask batch's owners): consulted before analyzing a type not cached
        self.known: dict[str, tuple[Any, tuple[str, int, int]]] = {}
        self.guess_limit = MAX_GUESSES if options.mode == "jsonl" else 1  # only jsonl lists every guess
        # terms and CoNLL-U write the best analysis and count them all: the others need not be built
        # (see FastAnalyzer.analyze_best); a caller that reads every analysis sets this to False
        self.best_only = options.mode != "jsonl"
        self._seed()

    def _seed(self) -> None:
        """The line-end item of the terms fast path maps to itself."""
        self.young[NEWLINE] = NEWLINE

    # ---- one word type ------------------------------------------------------------------------------
    def analyze_type(self, token: str) -> TypeResult:
        """Status, analyses and fallbacks of one word type (no cache)."""
        lang = self.lang
        norm = lang.normalize(token)
        if len(norm) > MAX_WORD:
            return TypeResult(norm, UNKNOWN, [])
        tok = self.tokenizer
        if any(ch.isdigit() for ch in token):
            return TypeResult(norm, NUMBER, [], split=tok.split_joiner(norm))
        analyses, count = self._lexicon_analyses(token)
        if analyses:
            return TypeResult(norm, ANALYZED, analyses, count=count)
        hyphen = tok.split_hyphen(token)
        if hyphen is not None:
            prefix, last = hyphen
            analyses, count = self._lexicon_analyses(last)
            if analyses:
                return TypeResult(norm, ANALYZED, analyses, lang.normalize(prefix), count=count)
        if self.options.guess:
            target = hyphen[1] if hyphen is not None else token
            guesses = self.fast.guess(target, self.guess_limit)
            if guesses:
                return TypeResult(norm, GUESSED, guesses, lang.normalize(hyphen[0]) if hyphen is not None else "")
        return TypeResult(norm, UNKNOWN, [], split=tok.split_joiner(norm))

    def _lexicon_analyses(self, word: str) -> tuple[list[Analysis], int]:
        """The lexicon's analyses of ``word`` (every one, or the best only with :attr:`best_only`)
        and how many there are."""
        if self.best_only:
            best, count = self.fast.analyze_best(word)
            return ([best], count) if best is not None else ([], 0)
        analyses = self.fast.analyze(word)
        return analyses, len(analyses)

    def propose(self, word: str) -> tuple[str, str]:
        """The guesser's best proposal for a word as (analysis text, segmentation); empty strings when none."""
        result = self.analyze_type(word)
        if result.status != GUESSED or not result.analyses:
            return "", ""
        best = result.analyses[0]
        return result.prefix + best.text, result.prefix + best.segmentation

    def format_type(self, result: TypeResult) -> Any:
        mode = self.options.mode
        if mode == "terms":
            return result.terms(self.options.term, self.apostrophes, self.options.guess_mark)
        if mode == "jsonl":
            return result.json_fields(self.options.max_analyses)
        return result.conllu_columns(self.apostrophes)

    def miss(self, token: str) -> Any:
        """The formatted output of a token not in the young cache generation (and its type info)."""
        value = self.old.get(token)
        if value is not None:
            info = self.info_old[token]
        elif token in self.known:
            value, info = self.known[token]
        else:
            self.misses += 1
            if not self.misses % FREEZE_EVERY:
                gc.freeze()
            result = self.analyze_type(token)
            value = self.format_type(result)
            if self.options.mode == "jsonl":
                value = f'"token":{json.dumps(token, ensure_ascii=False)},{value}'
            info = (result.norm, result.status, result.count)
        if len(token) > MAX_CACHED_TOKEN:
            self._count_long(info)
        else:
            self.young[token] = value
            self.info_young[token] = info
            self.young_chars += len(token) + (len(value) if isinstance(value, str) else sum(map(len, value)))
        return value

    def _count_long(self, info: tuple[str, int, int]) -> None:
        """Tally a token too long to cache or list (counted here, once per occurrence)."""
        norm, status, n = info
        t = self.pending
        t.status_tokens[status] += 1
        t.unlisted_tokens += 1
        if len(norm) > MAX_WORD:
            t.long_tokens += 1
        if status == ANALYZED:
            t.analyses += n
            t.ambiguous += n > 1
        self.long_in_chunk = True

    # ---- sharing word types between processes ---------------------------------------------------------
    def types_of(self, parts: Iterable[Chunk]) -> list[str]:
        """Every word type of some chunks that the cache can hold, cached or not (what a Dask partition
        will look up; see :mod:`morphfst.corpus.cluster`).

        Each distinct white-space-separated piece of bytes is decoded and read once for all the chunks
        (a token never spans white space, see :meth:`Tokenizer.distinct_tokens`; ASCII white space
        never falls inside a UTF-8 sequence, so an invalid byte is replaced in a piece as in the whole
        text; and no character composes with white space, so NFC of the pieces is NFC of the text).
        On running text, most pieces recur, and this is about twice as fast as reading each chunk.
        The tokens of a piece ending with a period may depend on the next piece (an ordinal's period
        before a lower-case letter: *23. madde*): the lines where a period stands before white space
        and a byte that may begin a lower-case letter are read whole, each distinct line once."""
        pieces: set[bytes] = set()
        lines: set[bytes] = set()
        dotted = DOT_BEFORE_LOWER_BYTES.search
        for chunk in parts:
            data = chunk.data
            if dotted(data) is None:
                pieces.update(data.split())
                continue
            for line in data.split(b"\n"):
                if dotted(line) is None:
                    pieces.update(line.split())
                else:
                    lines.add(line)
        found = self.tokenizer.distinct_tokens(decode(b"\n".join(pieces))[0])
        if lines:
            found = list(dict.fromkeys(found + self.tokenizer.distinct_tokens(decode(b"\n".join(lines))[0])))
        return _cacheable(found)

    def prepare(self, chunk: Chunk) -> tuple[Prepared, list[str]]:
        """The decoded text of a chunk and its word types that are not in the cache, in no particular
        order (overlong tokens left out: they are never cached).

        In terms mode the chunk's items are looked up once here, in C (``map`` over the young
        generation's ``get``), and kept: :meth:`process` then fills only the holes (the items not
        cached yet, answered or analyzed meanwhile) and joins. Finding the uncached types by set
        differences, and looking every item up again in :meth:`_terms`, made two more passes over
        the chunk. Other modes find them by set differences over the chunk's distinct items."""
        text, replaced = decode(chunk.data)
        items = self.tokenizer.tokens_and_newlines(text)
        terms = self.options.mode == "terms"
        vals: list[Any] | None = None
        holes: list[int] | None = None
        if terms:
            vals = list(map(self.young.get, items))
            holes = list(itertools.compress(itertools.count(), map(not_, vals)))  # not cached (or empty, as in _terms)
            missing = {items[i] for i in holes}
        else:
            missing = set(items).difference(self.young)  # the line end is always in the young generation
        if self.old and missing:
            missing = missing.difference(self.old)
        prepared = (text, replaced, items if terms else None, vals, holes, self.generation)
        return prepared, [t for t in missing if len(t) <= MAX_CACHED_TOKEN]

    def lookup(self, token: str) -> tuple[Any, tuple[str, int, int]]:
        """The formatted output and type information of ``token``, analyzed here if not cached."""
        value = self.young.get(token)
        if value is None:
            value = self.miss(token)
        return value, self.info_young[token]

    def learn_all(self, tokens: list[str], found: list[tuple[Any, tuple[str, int, int]]]) -> None:
        """Cache what another process found for each of ``tokens`` (``found``: value and info of each)."""
        young, info_young = self.young, self.info_young
        chars = 0
        for token, (value, info) in zip(tokens, found):
            if token not in young:
                young[token] = value
                info_young[token] = info
                chars += len(token) + (len(value) if isinstance(value, str) else sum(map(len, value)))
        self.young_chars += chars

    def flush(self) -> Tally:
        """The figures of every token counted since the last flush (then forgotten)."""
        tally, self.pending = self.pending, Tally()
        tally.analyzed, self.misses = self.misses, 0
        status_tokens = tally.status_tokens
        types = tally.types
        young, old = self.info_young, self.info_old
        self.counts.pop(NEWLINE, None)
        for token, count in self.counts.items():
            norm, status, n = young.get(token) or old[token]
            status_tokens[status] += count
            if status == ANALYZED:
                tally.analyses += n * count
                if n > 1:
                    tally.ambiguous += count
            prev = types.get(norm)
            types[norm] = (count + prev[0], status, n) if prev else (count, status, n)
        self.counts = Counter()
        return tally

    def _rotate(self) -> Tally | None:
        """Keep the cache bounded; returns a flushed tally when the type information is about to go."""
        tally = None
        size, chars = self.options.cache_size, self.options.cache_chars
        full = len(self.young) > size or self.young_chars > chars
        if full or len(self.counts) > size:
            tally = self.flush()
        if full:
            self.old, self.young = self.young, {}
            self.info_old, self.info_young = self.info_young, {}
            self.young_chars = 0
            self.generation += 1
            self._seed()
        return tally

    # ---- one chunk -----------------------------------------------------------------------------------
    def process(self, chunk: Chunk, prepared: Prepared | None = None) -> ChunkResult:
        text, replaced, items, vals, holes, generation = prepared or (*decode(chunk.data), None, None, None, -1)
        if generation != self.generation:
            # the cache turned over since: a type read then could lose its figures at the next
            # turn, so every item is looked up again
            vals = holes = None
        lines = text.split("\n")
        if text.endswith("\n") or not text:
            lines.pop()
        result = ChunkResult(chunk.index, b"", chunk.lines, 0, len(chunk.data), replaced, chunk.data.count(b"\x00"))
        result.cut_lines = 1 if chunk.continues else 0
        whole = lines[1 if chunk.part else 0 : len(lines) - 1 if chunk.continues else len(lines)]
        result.empty_lines = sum(1 for line in whole if not line or line == "\r")
        mode = self.options.mode
        if mode == "terms":
            out, tokens = self._terms(text, chunk, items, vals, holes)
            result.tokens = len(tokens) - tokens.count(NEWLINE)
        else:
            out, tokens = self._jsonl(lines, chunk) if mode == "jsonl" else self._conllu(lines, chunk)
            result.tokens = len(tokens)
        result.data = out.encode("utf-8")
        if self.long_in_chunk:
            tokens = [t for t in tokens if len(t) <= MAX_CACHED_TOKEN]
            self.long_in_chunk = False
        self.counts.update(tokens)
        result.tally = self._rotate()
        gc.freeze()  # what survived the chunk is long-lived (see FREEZE_EVERY)
        return result

    def _terms(
        self,
        text: str,
        chunk: Chunk,
        items: list[str] | None = None,
        vals: list[Any] | None = None,
        holes: list[int] | None = None,
    ) -> tuple[str, list[str]]:
        """Terms of a whole chunk at once: tokens and line ends in one pass of the tokenizer; with
        ``vals`` (see :meth:`prepare`) only the ``holes`` are looked up again."""
        get = self.young.get
        miss = self.miss
        if items is None:
            items = self.tokenizer.tokens_and_newlines(text)
        if vals is None or holes is None:
            vals = [get(t) or miss(t) for t in items]
        else:
            for i in holes:
                t = items[i]
                vals[i] = get(t) or miss(t)
        out = " ".join(vals).replace(" \n", "\n").replace("\n ", "\n")
        if chunk.part and out and not out.startswith("\n"):
            out = " " + out
        if not chunk.continues and not text.endswith("\n"):
            out += "\n"
        return out, items

    def _jsonl(self, lines: list[str], chunk: Chunk) -> tuple[str, list[str]]:
        get = self.young.get
        miss = self.miss
        spans = self.tokenizer.spans
        out: list[str] = []
        every: list[str] = []
        for offset, line in enumerate(lines):
            number = chunk.first_line + offset
            part = chunk.part if offset == 0 else 0
            items = []
            ascii_line = line.isascii()
            char_at = byte_at = 0  # byte offsets counted incrementally from the previous token
            for start, tok in spans(line):
                every.append(tok)
                end = start + len(tok)
                if ascii_line:
                    bstart, bend = start, end
                else:
                    bstart = byte_at + len(line[char_at:start].encode("utf-8"))
                    bend = bstart + len(tok.encode("utf-8"))
                    char_at, byte_at = end, bend
                items.append(f'{{{get(tok) or miss(tok)},"start":{start},"end":{end},"start_byte":{bstart},"end_byte":{bend}}}')
            head = f'{{"line":{number},"part":{part},' if part else f'{{"line":{number},'
            out.append(f'{head}"tokens":[{",".join(items)}]}}\n')
        return "".join(out), every

    def _conllu(self, lines: list[str], chunk: Chunk) -> tuple[str, list[str]]:
        get = self.young.get
        miss = self.miss
        pieces = self.tokenizer.pieces
        out: list[str] = []
        every: list[str] = []
        for offset, line in enumerate(lines):
            if line.endswith("\r"):
                line = line[:-1]
            number = chunk.first_line + offset
            part = chunk.part if offset == 0 else 0
            base = f"{self.doc}-{number}" + (f"p{part}" if part else "")
            ps = pieces(line)
            rows: list[tuple[str, str, str]] = []
            first = 0
            sentence = 0
            for i, piece in enumerate(ps):
                if piece.kind == SPACE or (piece.kind == PUNCT and not piece.text.isprintable()):
                    continue
                nxt = ps[i + 1] if i + 1 < len(ps) else None
                space_after = nxt is None or nxt.kind == SPACE
                if piece.kind == PUNCT:
                    upos = "SYM" if unicodedata.category(piece.text[0]).startswith("S") else "PUNCT"
                    cols, misc = f"{piece.text}\t{upos}\t_\t_", ""
                else:
                    every.append(piece.text)
                    cols, misc = get(piece.text) or miss(piece.text)
                if not space_after:
                    misc = f"{misc}|SpaceAfter=No" if misc else "SpaceAfter=No"
                if not rows:
                    first = i
                rows.append((piece.text, cols, misc))
                if piece.kind == PUNCT and piece.text[0] in SENTENCE_END and space_after:
                    sentence += 1
                    out.append(_sentence(f"{base}-{sentence}", ps[first : i + 1], rows))
                    rows = []
            if rows:
                sentence += 1
                out.append(_sentence(f"{base}-{sentence}", ps[first:], rows))
        return "".join(out), every


def _sentence(sent_id: str, ps: list[Any], rows: list[tuple[str, str, str]]) -> str:
    """One CoNLL-U sentence: its id, its text (other whitespace as a space, control characters as U+FFFD) and its rows."""
    text = "".join(p.text for p in ps).strip()
    text = "".join(ch if ch.isprintable() else " " if ch.isspace() else "\ufffd" for ch in text)
    body = [f"# sent_id = {sent_id}", f"# text = {text}"]
    for n, (form, cols, misc) in enumerate(rows, start=1):
        body.append(f"{n}\t{form}\t{cols}\t_\t_\t_\t{misc or '_'}")
    return "\n".join(body) + "\n\n"


def _cacheable(items: list[str]) -> list[str]:
    """The distinct word types among a chunk's items, in first-seen order, that the cache can hold
    (line ends and overlong tokens left out)."""
    return [t for t in dict.fromkeys(items) if t != NEWLINE and len(t) <= MAX_CACHED_TOKEN]

"""Index terms of a text: the toolkit's tokenizer, UTF-8 byte offsets, and the terms of each word.

Every word token of a text becomes one position with one or more **colocated terms** (the same byte
offsets, so a full-text engine highlights the original word whichever term matched):

``lemma``
    the lemma, case-folded by the grammar's normalization (``kitap`` for *Kitaplarımızdan*); no prefix,
    so a plain query word matches it.
``stem``
    the stem morph as it appears in the word, prefixed with ``~`` (``~kitab`` for *kitabı*).
``morphs``
    the stem term and every affix morph prefixed with ``+`` (``~kitap +lar +ımız +dan``).
``surface``
    the normalized word itself, prefixed with ``=`` (``=kitaplarımızdan``).

The prefixes keep the kinds apart, so that a stem never matches a lemma by accident. A **document**
gets the terms of every kind chosen; a **query** word gets the terms of the first kind chosen (by
default the lemma), or of the kind named by a prefix written right before it in the query
(``"=kitaplar"`` for the exact form, ``"~kitab"``, ``"+lar"``). With ``analyses="all"`` every
distinct term of every analysis is emitted (at query time, FTS5 treats colocated query terms as
alternatives); with ``"best"`` only the first analysis counts.

Words the lexicon does not know: with guesses, the guessed lemmas (at most ``max_guesses``) and the
surface form as a lemma term, so that both the guess and the exact word find them; without guesses,
the surface form. Numbers and other unanalyzed tokens give their normalized text (``2023'te`` gives
``2023``). A hyphenated word analyzed by its last part keeps the first part in its lemma.

This is the common practice of colocated synonyms in an inverted index (SQLite FTS5 documentation,
"Synonym support", method 2: every variant indexed in the document, one variant queried).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from ..corpus.records import ANALYZED, GUESSED, NUMBER, UNKNOWN, ChunkProcessor, Options
from ..runtime.compiled_language import Language

KINDS = ("lemma", "stem", "morphs", "surface")
PREFIX = {"lemma": "", "stem": "~", "surface": "=", "affix": "+"}
QUERY_PREFIXES = {"=": "surface", "~": "stem", "+": "affix"}
MAX_TERM = 200  # longer terms are cut (SQLite FTS5 handles long tokens, but they are never useful)


@dataclass(frozen=True)
class TermOptions:
    """Which terms a word gives (see the module documentation)."""

    terms: tuple[str, ...] = ("lemma",)
    analyses: str = "best"  # "best" or "all"
    guess: bool = True
    max_guesses: int = 3

    def __post_init__(self) -> None:
        if not self.terms:
            raise ValueError("no term kind chosen")
        for kind in self.terms:
            if kind not in KINDS:
                raise ValueError(f"unknown term kind {kind!r}; choose from {', '.join(KINDS)}")
        if self.analyses not in ("best", "all"):
            raise ValueError(f"analyses must be 'best' or 'all', not {self.analyses!r}")
        if self.max_guesses < 1:
            raise ValueError("max_guesses must be at least 1")

    @property
    def query_kind(self) -> str:
        """The kind of term a plain query word gives (morphs: its stem)."""
        return "stem" if self.terms[0] == "morphs" else self.terms[0]

    def args(self) -> list[str]:
        """These options as FTS5 tokenizer arguments (``terms lemma,surface analyses best guess 1``)."""
        return ["terms", ",".join(self.terms), "analyses", self.analyses, "guess", "1" if self.guess else "0"]

    @classmethod
    def from_args(cls, args: Sequence[str]) -> tuple[TermOptions, dict[str, str]]:
        """Options from tokenizer arguments given as name-value pairs; the other pairs are returned as they are."""
        if len(args) % 2:
            raise ValueError(f"tokenizer arguments come in name-value pairs, got {' '.join(args)!r}")
        pairs = dict(zip(args[0::2], args[1::2]))
        terms = tuple(t for t in pairs.pop("terms", "lemma").replace("+", ",").split(",") if t)
        analyses = pairs.pop("analyses", "best")
        guess_text = pairs.pop("guess", "1").lower()
        if guess_text not in ("0", "1", "yes", "no", "true", "false"):
            raise ValueError(f"guess must be 1 or 0, not {guess_text!r}")
        return cls(terms, analyses, guess_text in ("1", "yes", "true")), pairs


Position = tuple[int, int, tuple[str, ...]]  # (start byte, end byte, colocated terms)


class TermAnalyzer:
    """Terms and UTF-8 byte offsets of texts in one language, with a bounded cache per word type."""

    def __init__(self, lang: Language, options: TermOptions | None = None, cache_size: int = 200_000) -> None:
        self.lang = lang
        self.options = options or TermOptions()
        self.types = ChunkProcessor(lang, Options(mode="terms", guess=self.options.guess))
        self.types.guess_limit = self.options.max_guesses
        self.types.best_only = False  # every analysis may give terms (analyses="all")
        self.tokenizer = self.types.tokenizer
        self.apostrophes = self.types.apostrophes
        self.cache_size = cache_size
        self._doc: dict[str, tuple[str, ...]] = {}
        self._query: dict[tuple[str, str], tuple[str, ...]] = {}

    # ---- one word -----------------------------------------------------------------------------------
    def document_terms(self, token: str) -> tuple[str, ...]:
        """Every term of every chosen kind for one word token of a document."""
        terms = self._doc.get(token)
        if terms is None:
            terms = self._terms(token, self.options.terms, document=True)
            if len(self._doc) >= self.cache_size:
                self._doc.clear()
            self._doc[token] = terms
        return terms

    def query_terms(self, token: str, kind: str | None = None) -> tuple[str, ...]:
        """The terms a query word gives: the first chosen kind, or ``kind`` (``surface``, ``stem``, ``affix``)."""
        kind = kind or self.options.query_kind
        key = (token, kind)
        terms = self._query.get(key)
        if terms is None:
            if kind == "affix":
                terms = (PREFIX["affix"] + _cut(self.lang.normalize(token)),)
            else:
                terms = self._terms(token, (kind,), document=False)
            if len(self._query) >= self.cache_size:
                self._query.clear()
            self._query[key] = terms
        return terms

    def _terms(self, token: str, kinds: Sequence[str], document: bool) -> tuple[str, ...]:
        result = self.types.analyze_type(token)
        out: list[str] = []
        add = out.append
        if result.status in (ANALYZED, GUESSED) and result.analyses:
            analyses = result.analyses if self.options.analyses == "all" else result.analyses[:1]
            if result.status == GUESSED:
                analyses = analyses[: self.options.max_guesses]
            prefix = result.prefix
            for kind in kinds:
                for a in analyses:
                    if kind == "lemma":
                        add(_cut(self.lang.normalize(prefix + a.lemma)))
                    elif kind == "surface":
                        add(PREFIX["surface"] + _cut(result.norm))
                    else:
                        stem = a.morphs[0].form if a.has_stem else a.lemma  # a suffix read alone: its lemma
                        add(PREFIX["stem"] + _cut(prefix + stem.rstrip(self.apostrophes)))
                        if kind == "morphs":
                            for m in a.affixes:
                                form = m.form.strip(self.apostrophes)
                                if form:
                                    add(PREFIX["affix"] + _cut(form))
            if result.status == GUESSED and "lemma" in kinds:
                add(_cut(result.norm))  # the exact word finds a guessed word too
        else:
            base = result.split[0] if result.split is not None else result.norm
            for kind in kinds:
                if kind == "surface":
                    add(PREFIX["surface"] + _cut(result.norm))
                else:
                    add(PREFIX[kind if kind != "morphs" else "stem"] + _cut(base))
                    if kind == "morphs" and result.split is not None and result.split[1]:
                        add(PREFIX["affix"] + _cut(result.split[1]))
        return tuple(dict.fromkeys(t for t in out if t.strip(PREFIX["stem"] + PREFIX["surface"] + PREFIX["affix"])))

    # ---- whole texts --------------------------------------------------------------------------------
    def positions(self, text: str, query: bool = False) -> list[Position]:
        """(start byte, end byte, terms) of every word of ``text`` (offsets into its UTF-8 encoding)."""
        out: list[Position] = []
        ascii_text = text.isascii()
        char_at = byte_at = 0
        for start, token in self.tokenizer.spans(text):
            end = start + len(token)
            if ascii_text:
                bstart, bend = start, end
            else:
                bstart = byte_at + len(text[char_at:start].encode("utf-8"))
                bend = bstart + len(token.encode("utf-8"))
                char_at, byte_at = end, bend
            if query:
                mark = text[start - 1] if start > 0 else ""
                terms = self.query_terms(token, QUERY_PREFIXES.get(mark))
            else:
                terms = self.document_terms(token)
            out.append((bstart, bend, terms or (PREFIX["surface"] + token,)))  # every word keeps its position
        return out

    def offsets(self, text: str) -> list[tuple[int, int, str]]:
        """(start byte, end byte, word) of every word of ``text``, with no analysis: what FTS5's
        ``highlight()`` and ``snippet()`` need (they count positions and take the matches from the index)."""
        out: list[tuple[int, int, str]] = []
        ascii_text = text.isascii()
        char_at = byte_at = 0
        for start, token in self.tokenizer.spans(text):
            end = start + len(token)
            if ascii_text:
                out.append((start, end, token))
                continue
            bstart = byte_at + len(text[char_at:start].encode("utf-8"))
            bend = bstart + len(token.encode("utf-8"))
            char_at, byte_at = end, bend
            out.append((bstart, bend, token))
        return out

    def prefix_terms(self, text: str) -> list[Position]:
        """Positions of a prefix query (``kita*``): the normalized text, no analysis (a word part has none)."""
        out: list[Position] = []
        for start, token in self.tokenizer.spans(text):
            bstart = len(text[:start].encode("utf-8"))
            mark = text[start - 1] if start > 0 else ""
            kind = QUERY_PREFIXES.get(mark, self.options.query_kind)
            out.append((bstart, bstart + len(token.encode("utf-8")), (PREFIX[kind] + _cut(self.lang.normalize(token)),)))
        return out


def _cut(term: str) -> str:
    return term if len(term) <= MAX_TERM else term[:MAX_TERM]


__all__ = ["KINDS", "NUMBER", "UNKNOWN", "Position", "TermAnalyzer", "TermOptions"]

"""Splitting text into word tokens and separator pieces, so that the pieces rebuild the text exactly.

A **token** is a run of letters and digits (Unicode general categories L and N) together with the
combining marks that follow them (category M, taken from Python's Unicode database for every script:
Tamil வீடுகளில், Devanagari, Kannada, Thai ... stay one token), zero-width (non-)joiners and the
invisible format characters that normalization drops (soft hyphen, word joiner, zero-width no-break
space: ``lasten\u00adtarhassa`` is one token) inside a word, joined into one token across:

- an apostrophe of the language followed by more letters: ``Ankara'da``, ``2023'te``, ``Ankara’da``;
- a hyphen followed by more letters: ``sarı-kırmızı``, ``e-posta``;
- a colon after an upper-case letter or a digit, before more letters: ``TRT:nin``, ``10:30``
  (a colon after a lower-case letter is a separator: ``not:bu`` is three pieces);
- a period or a comma between digits: ``3.5``, ``1,000``;
- the ending after a sign, joined by a colon: ``5 %:n``, ``%:lla``, ``€:oon``, ``§:ssä`` (a sign is a
  word of its own before its ending in Finnish writing; a sign without a colon stays a separator);
- the period of an ordinal: after a digit string or a Roman numeral I-XXXIX written as a token of its
  own, before white space (not a line end) and a lower-case letter: ``23. madde``, ``3. luokka``,
  ``XX. yüzyıl`` (a period before an upper-case letter or at the line's end stays a piece of its own,
  the end of a sentence: ``yıl 2023. Sonra``).

Everything else (white space, punctuation, symbols, control characters) is a **separator** piece:
white-space runs are one piece, a run of one repeated punctuation character (``...``, ``!!``) is one
piece, any other character is a piece of its own. Joining the texts of all pieces gives the line back.

The apostrophes come from the grammar's ``normalize`` block (``apostrophes ...``); the rest follows
the Unicode general categories. This is not the word-boundary algorithm of Unicode's UAX #29: scripts
written without spaces between words (Chinese, Japanese, Thai) are not split into words.
"""

from __future__ import annotations

import re
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from functools import lru_cache
from typing import Any

from ..language.normalize import INVISIBLE
from .unicode_tables import tables

DEFAULT_APOSTROPHES = ("'", "\u2019", "\u02bc")  # ASCII apostrophe, right single quotation mark, modifier letter apostrophe
HYPHENS = "-\u2010\u2011"  # hyphen-minus, hyphen, non-breaking hyphen
ZERO_WIDTH_JOINERS = "\u200c\u200d"  # zero-width non-joiner and joiner, inside words of Indic and Arabic scripts
# punctuation often written against a word (.,;:!? brackets, quotes, dashes, apostrophes): stripped from a
# piece's edges before the fast check of :meth:`Tokenizer._add_tokens` (no letter, digit or combining mark)
EDGE_PUNCTUATION = ".,;:!?()[]{}<>\"'`«»“”„‘’‚‹›…-–—/*\u2010\u2011"


def _class_body(spans: tuple[tuple[int, int], ...]) -> str:
    """A regular-expression class body (no brackets) of code point ranges."""
    return "".join(re.escape(chr(a)) if a == b else f"{re.escape(chr(a))}-{re.escape(chr(b))}" for a, b in spans)


@lru_cache(maxsize=1)
def combining_marks() -> str:
    """A regular-expression class body of every combining mark (Unicode general category M: Mn, Mc,
    Me) known to this Python's Unicode database, for every script (:mod:`.unicode_tables`: shipped for
    the supported Python releases, else computed)."""
    return _class_body(tables().marks)


_UPPER = _class_body(tables().upper)  # upper-case letters of the BMP (str.isupper)
# lower-case letters of the BMP (category Ll: each is a token character): after an ordinal's period
_LOWER_CHARS = "".join(chr(cp) for a, b in tables().lower for cp in range(a, b + 1))
_LOWER_SET = frozenset(_LOWER_CHARS)
# an ordinal with its period: a digit string or a well-formed Roman numeral I-XXXIX, then the period,
# then white space within the line and a lower-case letter (read by the look-ahead only)
ORDINAL = rf"(?:\d+|(?=[IVX])X{{0,3}}(?:IX|IV|V?I{{0,3}}))\.(?=[^\S\n]+[{re.escape(_LOWER_CHARS)}])"
# a sign with its ending after a colon (5 %:n, €:oon, §:ssä): the sign is read as the word it stands for
SIGN_ENDING = r"[%‰€$£¥§]:[^\W_]+"
# a period, white space within the line and a lower-case letter: where a piece's tokens may depend on
# the next piece (the fast path looks at the next piece only on a line that has one)
_DOT_BEFORE_LOWER = re.compile(rf"\.[^\S\n]+[{re.escape(_LOWER_CHARS)}]")
# the same in UTF-8 bytes, generously: white space is an ASCII one (with the separators \x1c-\x1f) or
# any non-ASCII byte, and so is the first byte of a lower-case letter other than a-z
DOT_BEFORE_LOWER_BYTES = re.compile(rb"\.[\t\x0b\x0c\r \x1c-\x1f\x80-\xff]+[a-z\x80-\xff]")

WORD = "word"
SPACE = "space"
PUNCT = "punct"


@dataclass(frozen=True)
class Piece:
    """One piece of a line: its text, its kind (``word``, ``space`` or ``punct``) and its start offset."""

    text: str
    kind: str
    start: int

    @property
    def is_token(self) -> bool:
        return self.kind == WORD


class Tokenizer:
    """A tokenizer for one language (its apostrophe characters); see the module documentation."""

    def __init__(self, apostrophes: Sequence[str] = DEFAULT_APOSTROPHES) -> None:
        self.apostrophes = tuple(dict.fromkeys(a for a in apostrophes if a)) or DEFAULT_APOSTROPHES
        apos = "".join(re.escape(a) for a in self.apostrophes)
        joiner = (
            rf"[{combining_marks()}{ZERO_WIDTH_JOINERS}{INVISIBLE}]+"  # combining marks (zero-width joiners, soft hyphens) after a letter
            rf"|[{apos}{re.escape(HYPHENS)}](?=[^\W_])"  # apostrophe or hyphen before more letters
            rf"|(?<=[{_UPPER}\d]):(?=[^\W_])"  # colon after an abbreviation or a number
            r"|(?<=\d)[.,](?=\d)"  # decimal point or digit group separator
        )
        # the ordinal is tried first, at a token's start: it must end at its period; a sign starts a
        # token only before a colon and an ending
        word = rf"{ORDINAL}|{SIGN_ENDING}|[^\W_]+(?:(?:{joiner})[^\W_]*)*"
        self.word_re = re.compile(word)
        self.word_or_newline_re = re.compile(rf"{word}|\n")
        self.sep_re = re.compile(r"\s+|(.)\1*", re.DOTALL)

    @classmethod
    def for_meta(cls, meta: dict[str, Any]) -> Tokenizer:
        """The tokenizer of a compiled language (its metadata's normalization apostrophes)."""
        norm = meta.get("normalization") or {}
        return cls(tuple(norm.get("apostrophes") or ()) + DEFAULT_APOSTROPHES)

    # ---- tokens only (the fast path used on corpora) ------------------------------------------------
    def tokens(self, line: str) -> list[str]:
        """The word tokens of ``line``, in order (the same as ``word_re.findall(line)``; see
        :meth:`_add_tokens`)."""
        out: list[str] = []
        self._add_tokens(line, out)
        return out

    def tokens_and_newlines(self, text: str) -> list[str]:
        """The word tokens of a text of several lines, with a ``"\\n"`` item at each line end (the same
        as ``word_or_newline_re.findall(text)``, about twice as fast: see :meth:`_add_tokens`)."""
        out: list[str] = []
        lines = text.split("\n")
        last = lines.pop()
        add = self._add_tokens
        for line in lines:
            add(line, out)
            out.append("\n")
        add(last, out)
        return out

    def _add_tokens(self, line: str, out: list[str]) -> None:
        """Append the word tokens of one line (no ``"\\n"`` in it) to ``out``.

        No token holds white space, so the line is cut at white space first (``str.split``) and each
        piece read on its own. Most pieces are one token as they stand (every character a letter or a
        digit: ``str.isalnum``, the very class ``[^\\W_]`` of the regular expression); a piece with
        punctuation at its edges only is one token once they are stripped (an edge character of
        :data:`EDGE_PUNCTUATION` joins nothing: a joiner needs a letter on both sides, and those
        characters are neither letters nor combining marks). Any other piece goes through the regular
        expression, which gives the same tokens on the piece as on the whole line (its look-arounds
        see only letters, digits and joiners, which white space never is), but for the look-ahead
        after an ordinal's period (:data:`ORDINAL`), which sees white space and a lower-case letter:
        on a line with a period before those, a piece ending with a period is read with the first
        letter of the next piece (:meth:`_ordinal_units`)."""
        self._add_piece_tokens(self._line_units(line), out)

    @classmethod
    def _line_units(cls, line: str) -> list[str]:
        """The white-space-separated pieces of one line, through :meth:`_ordinal_units` on a line with a
        period before white space and a lower-case letter."""
        pieces = line.split()
        return cls._ordinal_units(pieces) if _DOT_BEFORE_LOWER.search(line) else pieces

    @staticmethod
    def _ordinal_units(pieces: list[str]) -> list[str]:
        """The pieces of one line, where a piece that ends with a period is followed by a lower-case
        letter in the next piece written after a space: ``23.`` before ``madde`` is ``23. m``, which
        :meth:`_add_piece_tokens` reads with the regular expression, leaving out the last token (the
        letter). The expression's look-ahead after an ordinal's period sees white space and a letter
        only, so the tokens are those of the whole line."""
        last = len(pieces) - 1
        return [
            f"{piece} {pieces[i + 1][0]}" if i < last and piece[-1] == "." and pieces[i + 1][0] in _LOWER_SET else piece
            for i, piece in enumerate(pieces)
        ]

    def distinct_tokens(self, text: str) -> list[str]:
        """The distinct word tokens of a text of any number of lines, in first-seen order: the same as
        ``dict.fromkeys(self.tokens_and_newlines(text))`` without the line ends, but each distinct
        white-space-separated piece is read once (a token never spans white space, and a piece's tokens
        do not depend on its neighbours but for an ordinal's period: see :meth:`_add_tokens`). On
        running text this is several times faster than reading every token."""
        out: list[str] = []
        if _DOT_BEFORE_LOWER.search(text):
            # a piece's tokens may depend on the next piece of its line (an ordinal's period)
            units: dict[str, None] = {}
            for line in text.split("\n"):
                units.update(dict.fromkeys(self._line_units(line)))
            self._add_piece_tokens(units, out)
        else:
            self._add_piece_tokens(dict.fromkeys(text.split()), out)
        return list(dict.fromkeys(out))

    def _add_piece_tokens(self, pieces: Iterable[str], out: list[str]) -> None:
        """Append the word tokens of white-space-free ``pieces`` to ``out`` (see :meth:`_add_tokens`)."""
        findall = self.word_re.findall
        append = out.append
        for piece in pieces:
            if piece.isalnum():
                append(piece)
                continue
            if " " in piece:  # a piece and the lower-case letter after it (see _ordinal_units)
                out.extend(findall(piece)[:-1])
                continue
            core = piece.strip(EDGE_PUNCTUATION)
            if core.isalnum():
                append(core)
            elif core:
                out.extend(findall(piece))

    def spans(self, line: str) -> list[tuple[int, str]]:
        """(start offset, text) of every word token of ``line``."""
        return [(m.start(), m.group()) for m in self.word_re.finditer(line)]

    # ---- all pieces ----------------------------------------------------------------------------------
    def pieces(self, line: str) -> list[Piece]:
        """Every piece of ``line`` (tokens and separators); their texts joined give ``line``."""
        out: list[Piece] = []
        pos = 0
        for start, text in self.spans(line):
            if start > pos:
                out.extend(self._separators(line, pos, start))
            out.append(Piece(text, WORD, start))
            pos = start + len(text)
        if pos < len(line):
            out.extend(self._separators(line, pos, len(line)))
        return out

    def _separators(self, line: str, start: int, end: int) -> Iterable[Piece]:
        for match in self.sep_re.finditer(line, start, end):
            text = match.group()
            yield Piece(text, SPACE if text.isspace() else PUNCT, match.start())

    def split_joiner(self, token: str) -> tuple[str, str] | None:
        """(before, after) at the first apostrophe or colon of a token (``2023'te`` → ``2023``, ``te``)."""
        for i, ch in enumerate(token):
            if (ch in self.apostrophes or ch == ":") and 0 < i < len(token) - 1:
                return token[:i], token[i + 1 :]
        return None

    def split_hyphen(self, token: str) -> tuple[str, str] | None:
        """(everything up to and including the last hyphen, the last part) of a hyphenated token."""
        for i in range(len(token) - 2, 0, -1):
            if token[i] in HYPHENS:
                return token[: i + 1], token[i + 1 :]
        return None


def split_line(line: str, tokenizer: Tokenizer | None = None) -> list[tuple[str, bool]]:
    """``(text, is_token)`` for every piece of ``line``."""
    tok = tokenizer or Tokenizer()
    return [(p.text, p.is_token) for p in tok.pieces(line)]

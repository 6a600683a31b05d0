"""Input normalization per language: NFC, invisible format characters dropped, language-specific
case folding, apostrophe variants.

Soft hyphens (U+00AD, a hyphenation hint web text leaves inside words), word joiners (U+2060) and
zero-width no-break spaces (U+FEFF) change nothing in how a word is spelled: they are dropped before
analysis (the Unicode word-boundary rules ignore such format characters inside a word too, UAX #29
rule WB4).

Turkish folds dotted and dotless i differently from Python's default (``I`` → ``ı``, ``İ`` → ``i``);
a grammar says so with ``map`` lines, applied before lower-casing (common practice).
"""

from __future__ import annotations

import unicodedata
from collections.abc import Callable
from dataclasses import dataclass, field

INVISIBLE = "\u00ad\u2060\ufeff"  # soft hyphen, word joiner, zero-width no-break space
_DROP_INVISIBLE = dict.fromkeys(map(ord, INVISIBLE))


@dataclass
class Normalization:
    """Input normalization: NFC, invisible format characters dropped, language-specific case folding,
    apostrophe variants."""

    maps: list[tuple[str, str]] = field(default_factory=list)
    lowercase: bool = True
    apostrophes: list[str] = field(default_factory=list)


def make_normalizer(norm: Normalization) -> Callable[[str], str]:
    """A function that normalizes one word the way the grammar's normalize block says."""
    maps = list(norm.maps)
    canonical = norm.apostrophes[0] if norm.apostrophes else "'"
    for variant in norm.apostrophes[1:]:
        maps.append((variant, canonical))
    lowercase = norm.lowercase

    def normalize(word: str) -> str:
        text = unicodedata.normalize("NFC", word)
        if not text.isalnum():  # a word of letters only (most words) holds none of them
            text = text.translate(_DROP_INVISIBLE)
        for source, target in maps:
            if source in text:
                text = text.replace(source, target)
        if lowercase:
            text = text.lower()
        return text

    return normalize


def restore_case(lemma: str, form: str, fold: Callable[[str], str]) -> str:
    """``form`` with the leading letters that spell the lemma in folded case written as in the lemma
    (generated forms are in the folded case of the stem: ``ankara'da`` → ``Ankara'da``)."""
    out = []
    for i, ch in enumerate(form):
        if i < len(lemma) and lemma[i] != ch and fold(lemma[i]) == ch:
            out.append(lemma[i])
        elif i < len(lemma) and lemma[i] == ch:
            out.append(ch)
        else:
            out.append(form[i:])
            break
    return "".join(out)

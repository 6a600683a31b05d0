"""Input normalization per language: NFC, language-specific case folding, apostrophe variants.

Turkish folds dotted and dotless i differently from Python's default (``I`` → ``ı``, ``İ`` → ``i``);
a grammar says so with ``map`` lines, applied before lower-casing (common practice).
"""

from __future__ import annotations

import unicodedata
from collections.abc import Callable
from dataclasses import dataclass, field


@dataclass
class Normalization:
    """Input normalization: NFC, language-specific case folding, apostrophe variants."""

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

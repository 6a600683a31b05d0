"""Input normalization per language: NFC, language-specific case folding, apostrophe variants.

Turkish folds dotted and dotless i differently from Python's default (``I`` → ``ı``, ``İ`` → ``i``);
a grammar says so with ``map`` lines, applied before lower-casing (common practice).
"""

from __future__ import annotations

import unicodedata
from collections.abc import Callable

from .model import Normalization


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

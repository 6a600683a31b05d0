"""Suffixes that a tokenizer split from their word (*Ankara'nın* cut into *ankara* and *nın*): read
as the suffixes they are when the word has no reading of its own.

Turkish writes an apostrophe between a proper name, an abbreviation or a number and its suffixes, and
Finnish a colon after an abbreviation or a number (common practice); many tokenizers, and word lists
built with them, cut the word there, so that *nın*, *te*, *deki* or *lerin* (Finnish *ssa*, *lle*)
stand alone. The
grammar's ``detached`` block names a part of speech and a few host words, each written with its
separator (*Zza'*: any letters before an apostrophe are a name); a word with no reading is analyzed
after each host, and every reading in which the host is the whole stem gives one reading of the
word:

- the lemma is :data:`DETACHED_LEMMA` (a bound suffix has no stem of its own; a hyphen marks it as
  bound, common practice in glossing), the part of speech the block's, the features the host
  reading's (*nın*: ``- X;SG;GEN``);
- the morphs are the host's suffixes, the separator taken off the first, without the zero morphs
  before the first one written (their features stay in the analysis), so that the segmentation and
  the gloss line up (*nın*: ``nın``, ``GEN``);
- the weight is the host reading's; a reading given by several hosts is kept once, at its lowest.

The hosts are chosen to give every harmony a suffix can show (one per last vowel and ending of the
host); the readings come only where the lexicon has none, so no word of the language loses a reading.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence

from .results import Analysis, Morph

DETACHED_LEMMA = "-"
MAX_DETACHED = 12  # letters: a longer word is no suffix chain a tokenizer cut off


def detached(
    surface: str,
    hosts: Sequence[tuple[str, str]],
    pos: str,
    analyze: Callable[[str], Sequence[Analysis]],
    accepts: Callable[[str], bool] | None = None,
) -> list[Analysis]:
    """The readings of ``surface`` (normalized) as suffixes split from their word, best first.

    ``hosts`` are (normalized host word, separator) pairs; ``analyze`` analyzes a normalized word
    (lexicon readings only); ``accepts``, when given, tells cheaply whether a word has any reading."""
    if not surface.isalpha() or len(surface) > MAX_DETACHED:
        return []
    best: dict[tuple[tuple[str, ...], str], Analysis] = {}
    for word, separator in hosts:
        whole = word + separator + surface
        if accepts is not None and not accepts(whole):
            continue
        for reading in analyze(whole):
            found = _suffixes(reading, word, separator, surface, pos)
            if found is None:
                continue
            key = (found.features, found.segmentation)
            kept = best.get(key)
            if kept is None or found.weight < kept.weight:
                best[key] = found
    return sorted(best.values(), key=lambda a: (round(a.weight, 5), a.text, a.segmentation))


def _suffixes(reading: Analysis, word: str, separator: str, surface: str, pos: str) -> Analysis | None:
    """The reading of ``surface`` that ``reading`` of host + separator + ``surface`` gives, or None
    when the host is not the reading's whole stem."""
    morphs = reading.morphs
    if not morphs or morphs[0].kind != "stem" or morphs[0].form not in (word, word + separator) or reading.guessed:
        return None  # the separator is written with the stem (Finnish eu:-ssa) or with the suffix (zza-'nın)
    rest: list[Morph] = []
    for morph in morphs[1:]:
        if morph.kind == "stem":
            return None
        form = morph.form
        if not rest:
            if not form or form == separator:
                continue  # a zero morph before the first written one, or the separator alone
            if form.startswith(separator):
                form = form[len(separator) :]
            morph = Morph(
                form, morph.gloss, morph.features, morph.kind, morph.underlying, morph.slot, morph.affix_id, morph.new_pos
            )
        rest.append(morph)
    if "".join(m.form for m in rest) != surface:
        return None
    return Analysis(surface, DETACHED_LEMMA, pos, reading.features, tuple(rest), reading.weight, reading.ud, False)

"""Hyphenated words that the lexicon does not have as a whole (*Etelä-Suomessa*, *EU-maissa*,
*sarı-kırmızılı*): analyzed as their last part, the parts before it kept as written first parts.

In Finnish and Turkish writing (common practice) a hyphen joins the parts of a compound whose first
parts are names, abbreviations, numbers or bound forms, and only the last part inflects. The
tokenizer keeps such a word together (:mod:`morphfst.runtime.tokenize`); when no analysis reads the
whole word, this module gives one analysis per analysis of the last part:

- the lemma is the first parts as written (hyphens kept) followed by the last part's lemma
  (*Etelä-Suomi*); part of speech and features are the last part's. A first part whose own lemma
  is in lower case is lower-cased when the last part's lemma is too (a capital at the start of a
  sentence: *Metsänhoito-opas* -> *metsänhoito-opas*, as for a closed compound), and kept as
  written before a name (*Keski-Suomi*) or when its lemma has capitals (*EU-maa*);
- each first part is a stem morph (gloss and underlying form from its own best analysis), so the
  segmentation is the parts' morphs joined with hyphens, as for any word (*etelä-suome-ssa*);
- the weight is the last part's plus the first parts' best weights, so the order is the last part's;
- a compound's last part is a nominal: its verb readings (UniMorph part of speech ``V``) are kept only
  when it has no other (*pinta-ala* is 'surface area', not *pinta* + the connegative of *alkaa*).

Every first part must be a word of the language (at least one analysis); otherwise, and when the
last part has no analysis, there is none. Guessed analyses never come from here.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence

from .results import Analysis, Morph

HYPHEN = "-"
VERB = "V"  # UniMorph's part of speech of verbs


def hyphenated(
    surface: str,
    written: str,
    analyze: Callable[[str], Sequence[Analysis]],
) -> list[Analysis]:
    """The analyses of the hyphenated word ``surface`` (normalized) through its parts.

    ``written`` is the word as the caller wrote it (its first parts go into the lemma with their
    capitals when normalizing did not change anything else); ``analyze`` analyzes one normalized part.
    """
    head, _, tail = surface.rpartition(HYPHEN)
    if not head or not tail:
        return []
    firsts = head.split(HYPHEN)
    if not all(firsts):
        return []
    last = [a for a in analyze(tail) if not a.guessed]
    if not last:
        return []
    nominal = [a for a in last if a.pos != VERB]
    if nominal:
        last = nominal
    stems: list[Morph] = []
    extra = 0.0
    common: list[bool] = []  # per first part: its best lemma has no capital
    for part in firsts:
        found = analyze(part)
        if not found:
            return []
        best = found[0]
        stem = next((m for m in best.morphs if m.kind == "stem"), None)
        gloss = stem.gloss if stem is not None else best.lemma
        stems.append(Morph(part, gloss, (best.pos,), "stem", best.lemma))
        extra += best.weight
        common.append(best.lemma == best.lemma.lower())
    written_head = written.rpartition(HYPHEN)[0]
    as_written = (written_head if written_head.lower() == head.lower() else head).split(HYPHEN)
    lowered = HYPHEN.join(p.lower() if low else p for p, low in zip(as_written, common)) + HYPHEN
    kept = HYPHEN.join(as_written) + HYPHEN
    return [
        Analysis(
            surface,
            (lowered if a.lemma == a.lemma.lower() else kept) + a.lemma,
            a.pos,
            a.features,
            (*stems, *a.morphs),
            a.weight + extra,
            a.ud,
            False,
        )
        for a in last
    ]

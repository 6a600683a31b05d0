"""``FastAnalyzer.analyze_best`` (what the corpus writes in terms and CoNLL-U modes) is the first analysis
of ``analyze`` and the number of its analyses, with only the best one built.

The words are made from the shipped lexicons with real endings of each language (common practice),
written in the ways a corpus writes them (capitalized, upper case, hyphenated, a name with an
apostrophe), so that the comparison meets ambiguous words, names weighed for lower case, open-class
names, hyphenated words and compounds (the last three are decoded whole)."""

from __future__ import annotations

import pytest

import morphfst
from morphfst.runtime.walk import NAME_POS

ENDINGS = {
    "tur": ["", "ler", "lar", "de", "da", "den", "in", "ı", "i", "leri", "ları", "yor", "di", "mış", "e", "a"],
    "fin": ["", "n", "t", "a", "ä", "ssa", "ssä", "sta", "lla", "lle", "ksi", "ni", "kin", "jen", "ihin"],
}
# words that reach the readings decoded whole (common practice: an invented name with a case ending,
# a hyphenated word, compounds the lexicon does not list)
SPECIAL = {
    "tur": ["Zorbuldak'ta", "zorbuldak'ta", "Ankara'da", "Ali", "ali", "gözlük-camı", "ev-de", "yüz", "evlerde"],
    "fin": ["kirjastotalossa", "jalkapallokentällä", "talo-ovessa", "Helsingissä", "helsingissä", "kaupunkilaiskoira"],
}


def _words(lang: morphfst.Language, name: str) -> list[str]:
    lemmas = sorted({e["lemma"] for e in lang.meta["lexicon"]})[::15]
    words = [lemma + ending for lemma in lemmas for ending in ENDINGS[name]]
    written = [w.capitalize() for w in words[::7]] + [w.upper() for w in words[::31]]
    written += [f"{a}-{b}" for a, b in zip(words[::29], words[3::29])] + [f"{w.capitalize()}'da" for w in words[::37]]
    return list(dict.fromkeys(SPECIAL[name] + words + written))


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_the_best_analysis_and_the_count_are_those_of_analyze(name: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    fast = lang.fast
    words = _words(lang, name)
    assert len(words) > 10_000
    differ = []
    several = names = 0
    for word in words:
        found = fast.analyze(word)
        expected = (found[0], len(found)) if found else (None, 0)
        if fast.analyze_best(word) != expected:
            differ.append(word)
        several += len(found) > 1
        names += any(a.pos == NAME_POS for a in found)
    assert not differ, differ[:10]
    assert several > 1000 and names > 50  # ambiguous words and names were compared


def test_a_corpus_processor_of_the_search_keeps_every_analysis(tur: morphfst.Language) -> None:
    from morphfst.corpus.records import ChunkProcessor, Options
    from morphfst.search.terms import TermAnalyzer

    assert ChunkProcessor(tur, Options(mode="terms")).best_only
    assert not ChunkProcessor(tur, Options(mode="jsonl")).best_only
    every = TermAnalyzer(tur).types
    assert not every.best_only
    assert len(every.analyze_type("evlerde").analyses) == len(tur.analyze("evlerde")) > 1
    best = ChunkProcessor(tur, Options(mode="terms")).analyze_type("evlerde")
    assert len(best.analyses) == 1 and best.count == len(tur.analyze("evlerde"))

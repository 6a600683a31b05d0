"""Names and abbreviations the lexicon lacks, read from the apostrophe (Turkish) or the colon (Finnish)
that the spelling puts between them and their endings.

Sources named beside each check:
  TDK-YK  Türk Dil Kurumu, Yazım Kılavuzu: the apostrophe after proper names and abbreviations before
          their suffixes, and the abbreviation's suffix after its last letter as said (common practice)
  G&K     Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar (2005), 2.2 vowel harmony
  KT      Kotimaisten kielten keskus, Kielitoimiston ohjepankki: abbreviations inflected with a colon,
          the ending after the last letter's name (common practice)
The names and abbreviations below (Zorbuldak, Kemerlioğlu, KZBT, XKQ, QFW) are made up for the tests,
so that no lexicon entry answers for them; the forms are written from memory of the rules above.
"""

from __future__ import annotations

import pytest

import morphfst


def texts(lang: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in lang.analyze(word)]


@pytest.mark.parametrize(
    ("word", "first"),
    [
        ("Zorbuldak'ta", "Zorbuldak PROPN;SG;LOC"),  # TDK-YK; G&K: a back vowel, -DA after k: -ta
        ("Zorbuldak'a", "Zorbuldak PROPN;SG;DAT"),  # a name keeps its k before a vowel (TDK-YK)
        ("Kemerlioğlu'nun", "Kemerlioğlu PROPN;SG;GEN"),  # G&K: rounded back u: -nun
        # a surname in -oğlu is possessed: n before a case (from memory, as the lexicon's Kılıçdaroğlu)
        ("Kemerlioğlu'ndan", "Kemerlioğlu PROPN;SG;ABL"),
        ("Kemerlioğlu'na", "Kemerlioğlu PROPN;SG;DAT"),
        ("Zorbuldak'takiler", "Zorbuldak PROPN;SG;LOC;RELZ;PL;NOM"),  # from memory: 'those in Zorbuldak'
        ("KZBT'nin", "KZBT PROPN;SG;GEN"),  # TDK-YK: said ka-ze-be-te, the genitive after e
        ("KZBT'ye", "KZBT PROPN;SG;DAT"),  # TDK-YK
        ("KZBT'li", "KZBT PROPN;PROPR;ADJ;SG;NOM"),  # TDK-YK: an abbreviation keeps its apostrophe before -li
    ],
)
def test_an_unlisted_turkish_name_is_read_from_its_apostrophe(tur: morphfst.Language, word: str, first: str) -> None:
    assert texts(tur, word)[:1] == [first]


@pytest.mark.parametrize(
    "word",
    [
        "zorbuldak",  # no apostrophe, no suffix: no name the lexicon lacks (TDK-YK)
        "zorbuldak'",  # an apostrophe with no suffix
        "kzbt'nın",  # TDK-YK: said ka-ze-be-te, never -nın
        "zorbuldak'de",  # G&K: the last vowel is back
    ],
)
def test_turkish_words_that_are_no_such_name(tur: morphfst.Language, word: str) -> None:
    assert texts(tur, word) == []


def test_a_listed_name_is_not_repeated_by_the_open_reading(tur: morphfst.Language) -> None:
    # the lexicon's Ankara (TDK-YK: Ankara'da) comes first and once; no lower-case twin
    readings = texts(tur, "Ankara'da")
    assert readings[0] == "Ankara PROPN;SG;LOC"
    assert [t for t in readings if t.lower().startswith("ankara ")] == ["Ankara PROPN;SG;LOC"]


def test_an_unlisted_name_is_glossed_by_itself_as_written(tur: morphfst.Language) -> None:
    # a proper name is glossed by the name itself (common practice in Leipzig glosses), in its capitals
    first = tur.analyze("Zorbuldak'ta")[0]
    assert first.lemma == "Zorbuldak" and first.morphs[0].gloss == "Zorbuldak"
    assert tur.analyze("zorbuldak'ta")[0].morphs[0].gloss == "zorbuldak"  # written in lower case: as written


def test_an_unlisted_name_is_segmented_at_its_apostrophe(tur: morphfst.Language) -> None:
    # for indexing: the name, then its suffixes (TDK-YK)
    assert tur.segment("Zorbuldak'tan")[0].morphs == ("zorbuldak", "'tan")


@pytest.mark.parametrize("word", ["Zorbuldak'ta", "Kemerlioğlu'nun", "KZBT'ye", "İzmitgücü'ne"])
def test_an_unlisted_turkish_name_generates_the_word_it_was_read_from(tur: morphfst.Language, word: str) -> None:
    # the lemma keeps the name's capitals (TDK-YK: the name as written, then the apostrophe and the
    # ending); generating from the first reading's lemma and labels gives the word back
    first = tur.analyze(word)[0]
    forms = [f.form for f in tur.generate(first.lemma, first.tags)]
    assert word in forms, (first.text, forms)


def test_a_capitalized_lower_case_lemma_generates_in_its_capitals(tur: morphfst.Language) -> None:
    # what analysis does for a capitalized word (Evlerde: ev N;PL;LOC), generation does for a lemma
    assert [f.form for f in tur.generate("Ev", "N;PL;LOC")] == ["Evlerde"]  # G&K: ev-ler-de
    assert tur.generate("Ankara", "PROPN;SG;LOC")[0].form == "Ankara'da"  # the lexicon's own lemma (TDK-YK)


@pytest.mark.parametrize(
    ("word", "first"),
    [
        ("XKQ:n", "XKQ PROPN;SG;GEN"),  # KT: the genitive -n after the letter's name (kuu)
        ("XKQ:ssa", "XKQ PROPN;SG;IN+ESS"),  # KT: q said kuu, back endings
        ("QFW:ssä", "QFW PROPN;SG;IN+ESS"),  # KT: w said kaksoisvee, front endings
        ("QFW:hen", "QFW PROPN;SG;IN+ALL"),  # KT: the illative -hVn after a letter name in a vowel
    ],
)
def test_an_unlisted_finnish_abbreviation_is_read_from_its_colon(fin: morphfst.Language, word: str, first: str) -> None:
    assert texts(fin, word)[:1] == [first]


@pytest.mark.parametrize("word", ["xkq", "xkq:", "xkq:ssä", "qfw:ssa"])
def test_finnish_words_that_are_no_such_abbreviation(fin: morphfst.Language, word: str) -> None:
    # KT: no colon or no ending, or the ending in the wrong harmony for the last letter's name
    assert texts(fin, word) == []


def test_a_listed_finnish_abbreviation_is_read_once(fin: morphfst.Language) -> None:
    # KT: EU:n, the lexicon's abbreviation, with no lower-case twin
    assert [t for t in texts(fin, "EU:n") if t.lower().startswith("eu ")] == ["EU PROPN;SG;GEN"]

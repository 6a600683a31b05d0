"""Turkish clitics written together with the word before them (informal writing), read at a cost.

Sources named beside each check:
  TDK-YK  Türk Dil Kurumu, Yazım Kılavuzu: the question particle mI and the conjunction dA are written
          apart from the word before them, mI with the person endings (geliyor musun, var mı; ben de,
          ya da); joining them is a common slip of informal writing (common practice)
  G&K     Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar (2005), 13.2.1 (mI), 28.3 (dA)
The forms are written from memory of those works ("from memory").
"""

from __future__ import annotations

import pytest

import morphfst


def texts(tur: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in tur.analyze(word)]


@pytest.mark.parametrize(
    ("word", "first", "segmentation"),
    [
        ("varmı", "var ADJ;INT", "var-mı"),  # TDK-YK: var mı
        ("değilmi", "değil AUX;INT", "değil-mi"),  # TDK-YK: değil mi
        # the features of the two words written apart, in order: geliyor (3sg) + musun (2sg)
        ("geliyormusun", "gelmek V;PROG;3;SG;INT;2;SG", "gel-iyor-mu-sun"),  # G&K 13.2.1
        ("istermisin", "istemek V;HAB;3;SG;INT;2;SG", "iste-r-mi-sin"),  # from memory
        ("gelirmiydin", "gelmek V;HAB;3;SG;INT;PST;2;SG", "gel-ir-mi-ydi-n"),  # G&K 13.2.1: gelir miydin
        ("yada", "ya CONJ;ADD", "ya-da"),  # TDK-YK: ya da
        ("belkide", "belki ADV;ADD", "belki-de"),  # TDK-YK: belki de
        ("hemde", "hem CONJ;ADD", "hem-de"),  # TDK-YK: dA keeps its d after a voiceless consonant
    ],
)
def test_a_joined_clitic_is_read(tur: morphfst.Language, word: str, first: str, segmentation: str) -> None:
    readings = tur.analyze(word)
    assert (readings[0].text, readings[0].segmentation) == (first, segmentation)


@pytest.mark.parametrize(
    ("word", "first"),
    [
        ("kalemi", "kalem N;SG;PSS3S;NOM"),  # the word's own reading first: kalem-i, not kale mi
        ("evde", "ev N;SG;LOC"),  # ev-de, not ev de
        ("gelirdi", "gelmek V;HAB;PST;3;SG"),  # G&K: the past of the aorist, no clitic
        ("Ankara'da", "Ankara PROPN;SG;LOC"),  # G&K: a name's apostrophe comes before a suffix only
    ],
)
def test_the_words_own_reading_comes_first(tur: morphfst.Language, word: str, first: str) -> None:
    assert texts(tur, word)[0] == first


def test_no_clitic_after_a_written_apostrophe_and_none_with_t(tur: morphfst.Language) -> None:
    # TDK-YK: Ankara da is written apart and never with the name's apostrophe; dA has no t
    assert all("ADD" not in t for t in texts(tur, "Ankara'da"))
    assert all("ADD" not in t for t in texts(tur, "hemte"))


def test_a_joined_clitic_is_never_generated(tur: morphfst.Language) -> None:
    # TDK-YK: the standard spelling writes them apart, so the generator writes no joined form
    assert [f.form for f in tur.generate("ev", "N;SG;LOC")] == ["evde"]
    assert tur.generate("gelmek", "V;PROG;3;SG;INT;2;SG") == []
    assert tur.generate("ev", "N;SG;NOM;ADD") == []

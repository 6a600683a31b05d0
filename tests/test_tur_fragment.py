"""The Turkish fragment against grammar-book forms.

Source for the expected forms: Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar
(Routledge, 2005), chapters on vowel harmony, consonant alternations, the plural, possessive and case
suffixes. Every value below was written from memory of those tables, not copied from the book.
"""

from __future__ import annotations

import pytest

import morphfst

# (lemma, features, expected surface) — from memory (Göksel & Kerslake 2005, noun inflection tables)
PARADIGM = [
    ("ev", "N;SG;NOM", "ev"),
    ("ev", "N;PL;NOM", "evler"),  # two-way harmony, front
    ("oda", "N;PL;NOM", "odalar"),  # two-way harmony, back
    ("ev", "N;PL;LOC", "evlerde"),
    ("oda", "N;PL;LOC", "odalarda"),
    ("kitap", "N;SG;LOC", "kitapta"),  # D -> t after a voiceless consonant
    ("ev", "N;SG;ABL", "evden"),
    ("kitap", "N;SG;ABL", "kitaptan"),
    ("ev", "N;SG;ACC", "evi"),  # four-way harmony
    ("göz", "N;SG;ACC", "gözü"),
    ("okul", "N;SG;ACC", "okulu"),
    ("balık", "N;SG;ACC", "balığı"),  # k -> ğ before a vowel
    ("oda", "N;SG;ACC", "odayı"),  # buffer y after a vowel
    ("oda", "N;SG;DAT", "odaya"),
    ("ev", "N;SG;DAT", "eve"),
    ("kitap", "N;SG;ACC", "kitabı"),  # final-stop voicing
    ("ağaç", "N;SG;ACC", "ağacı"),
    ("çiçek", "N;SG;ACC", "çiçeği"),
    ("renk", "N;SG;ACC", "rengi"),  # nk -> ng
    ("oda", "N;SG;GEN", "odanın"),  # buffer n in the genitive
    ("ev", "N;SG;GEN", "evin"),
    ("kuzu", "N;SG;GEN", "kuzunun"),
    ("ev", "N;SG;INS", "evle"),
    ("oda", "N;SG;INS", "odayla"),
    ("ev", "N;SG;PSS1S;NOM", "evim"),
    ("oda", "N;SG;PSS1S;NOM", "odam"),
    ("ev", "N;SG;PSS3S;NOM", "evi"),
    ("oda", "N;SG;PSS3S;NOM", "odası"),  # buffer s in the 3rd person possessive
    ("ev", "N;SG;PSS1P;NOM", "evimiz"),
    ("göz", "N;SG;PSS2P;NOM", "gözünüz"),
    ("ev", "N;SG;PSS3S;LOC", "evinde"),  # pronominal n after the 3rd person possessive
    ("ev", "N;SG;PSS3S;ACC", "evini"),
    ("oda", "N;SG;PSS3S;DAT", "odasına"),
    ("ev", "N;PL;PSS1S;ABL", "evlerimden"),
    ("saat", "N;PL;NOM", "saatler"),  # lexical exception: front harmony after a back vowel
    ("kalp", "N;SG;ACC", "kalbi"),
    ("top", "N;SG;ACC", "topu"),  # monosyllable that keeps its voiceless stop
    ("at", "N;SG;ACC", "atı"),
    ("Ankara", "PROPN;SG;LOC", "Ankara'da"),  # proper names keep their capital and take an apostrophe before suffixes
    ("Ahmet", "PROPN;SG;DAT", "Ahmet'e"),
    ("Ahmet", "PROPN;SG;LOC", "Ahmet'te"),
    ("Ankara", "PROPN;SG;NOM", "Ankara"),
    ("kitap", "N;AGT;N;SG;NOM", "kitapçı"),  # -CI: C -> ç after a voiceless consonant
    ("göz", "N;AGT;N;SG;NOM", "gözcü"),
    ("tuz", "N;PROPR;ADJ", "tuzlu"),
    ("tuz", "N;PRIV;ADJ", "tuzsuz"),
    # verbs: from memory (Göksel & Kerslake 2005, chapters on the verb and person markers)
    ("okumak", "V;PROG;1;SG", "okuyorum"),
    ("gelmek", "V;PROG;3;PL", "geliyorlar"),
    ("anlamak", "V;PROG;3;SG", "anlıyor"),  # a stem-final low vowel is raised before -Iyor
    ("beklemek", "V;PROG;1;PL", "bekliyoruz"),
    ("görmek", "V;PROG;2;PL", "görüyorsunuz"),
    ("okumak", "V;NEG;PROG;3;SG", "okumuyor"),
    ("gelmek", "V;PST;1;SG", "geldim"),
    ("içmek", "V;PST;1;PL", "içtik"),  # D -> t after ç
    ("bakmak", "V;PST;3;SG", "baktı"),
    ("yazmak", "V;FUT;1;SG", "yazacağım"),  # k -> ğ before the person marker
    ("gelmek", "V;NEG;FUT;3;SG", "gelmeyecek"),
    ("bakmak", "V;PROG;3;SG", "bakıyor"),  # verb stems keep their final stop
]


@pytest.mark.parametrize("lemma, features, surface", PARADIGM)
def test_generation_matches_the_handbook(tur: morphfst.Language, lemma: str, features: str, surface: str) -> None:
    forms = [f.form for f in tur.generate(lemma, features)]
    assert forms and forms[0] == surface


@pytest.mark.parametrize("lemma, features, surface", PARADIGM)
def test_analysis_matches_the_handbook(tur: morphfst.Language, lemma: str, features: str, surface: str) -> None:
    assert f"{lemma} {features}" in [a.text for a in tur.analyze(surface)]


# from memory (Göksel & Kerslake 2005): forms that break harmony or alternation rules
@pytest.mark.parametrize("word", ["evlar", "odaler", "kitapı", "kitapda", "evyi", "saatlar", "odada'", "gözi", "ağaçı"])
def test_wrong_forms_are_rejected(tur: morphfst.Language, word: str) -> None:
    assert tur.analyze(word) == []


def test_segmentation_and_gloss(tur: morphfst.Language) -> None:
    best = tur.analyze("evlerimden")[0]
    assert best.segmentation == "ev-ler-im-den"
    assert best.gloss == "house-PL-1SG.POSS-ABL"
    assert [m.form for m in best.morphs] == ["ev", "ler", "im", "den"]
    pron = next(a for a in tur.analyze("evinde") if "PSS3S" in a.features)
    assert pron.segmentation == "ev-i-nde"


def test_turkish_case_folding(tur: morphfst.Language) -> None:
    # common practice: Turkish I folds to ı and İ to i
    assert tur.normalize("IŞIK") == "ışık"
    assert tur.normalize("İzmir") == "izmir"
    assert [a.lemma for a in tur.analyze("İZMİR'DE")] == ["İzmir"]
    assert tur.analyze("Ankara’da")[0].text == "Ankara PROPN;SG;LOC"  # typographic apostrophe


def test_inline_tests_of_the_grammar(tur: morphfst.Language) -> None:
    for case in tur.meta["tests"]:
        if case["kind"] == "reject":
            assert tur.analyze(case["word"]) == [], case
        elif case["kind"] == "generate":
            lemma, _, feats = case["word"].rpartition(" ")
            assert [f.form for f in tur.generate(lemma, feats)][: len(case["expected"])] == case["expected"], case
        else:
            texts = {a.text for a in tur.analyze(case["word"])}
            if case["kind"] == "exact":
                assert texts == set(case["expected"]), case
            else:
                assert set(case["expected"]) <= texts, case

"""Spoken Finnish written in chat, forums and subtitles: the forms the analyzer reads besides the
standard ones (grammars/fin/spoken.mfg, lexicons/fin/spoken.tsv, the rules *_spoken of fin/rules.mfg).

Every form is written from memory of the spoken language ("common practice": the forms are what any
speaker writes in informal text); none is generated where a rule reads it leniently, and a standard
word spelt alike keeps its first place. The grammar is compiled once per test session (``fin``).
"""

from __future__ import annotations

import pytest

import morphfst


def best(fin: morphfst.Language, word: str) -> str:
    readings = fin.analyze(word)
    return readings[0].text if readings else "-"


def forms(fin: morphfst.Language, lemma: str, features: str) -> list[str]:
    return [f.form for f in fin.generate(lemma, features)]


@pytest.mark.parametrize(
    ("word", "reading"),
    [
        # the short present stems (common practice): oon 'olen', oot 'olet', en oo 'en ole', tuun, meen, tiiän
        ("oon", "olla V;IND;PRS;1;SG"),
        ("oot", "olla V;IND;PRS;2;SG"),
        ("ootte", "olla V;IND;PRS;2;PL"),
        ("oo", "olla V;IND;PRS;NEG"),
        ("ootko", "olla V;IND;PRS;2;SG;KO"),
        ("tuun", "tulla V;IND;PRS;1;SG"),
        ("meen", "mennä V;IND;PRS;1;SG"),
        ("tiiä", "tietää V;IND;PRS;NEG"),
        # olla's conditional without l, pitäs, tarvii, kattoo (common practice)
        ("ois", "olla V;COND;3;SG"),
        ("oisin", "olla V;COND;1;SG"),
        ("oisko", "olla V;COND;3;SG;KO"),
        ("pitäs", "pitää V;COND;3;SG"),
        ("tarvii", "tarvita V;IND;PRS;3;SG"),
        ("kattoo", "katsoa V;IND;PRS;3;SG"),
        # uninflected words without their last sound (common practice)
        ("ku", "kun CONJ"),
        ("nii", "niin ADV"),
        ("kyl", "kyllä ADV"),
        ("sitte", "sitten ADV"),
        ("miks", "miksi ADV"),
        ("yks", "yksi NUM;SG;NOM"),
        ("ite", "itse PRON;SG;NOM"),
    ],
)
def test_spoken_words(fin: morphfst.Language, word: str, reading: str) -> None:
    assert best(fin, word) == reading


@pytest.mark.parametrize(
    ("word", "reading"),
    [
        # -nUt without its t, in any verb and in the adjectives of type 47 (common practice)
        ("ollu", "olla V;V.PTCP;ACT;PST;ADJ;SG;NOM"),
        ("menny", "mennä V;V.PTCP;ACT;PST;ADJ;SG;NOM"),
        ("sanonu", "sanoa V;V.PTCP;ACT;PST;ADJ;SG;NOM"),
        ("väsyny", "väsynyt ADJ;SG;NOM"),
        # -inen without its i after a vowel (common practice)
        ("sellanen", "sellainen ADJ;SG;NOM"),
        ("semmosta", "semmoinen PRON;SG;PRT"),
        ("ilonen", "iloinen ADJ;SG;NOM"),
        ("punaset", "punainen ADJ;PL;NOM"),
        # -kin without its n, ea as ee (common practice)
        ("ainaki", "ainakin ADV"),
        ("kuitenki", "kuitenkin ADV"),
        ("korkee", "korkea ADJ;SG;NOM"),
        ("oikeesti", "oikeasti ADV"),
    ],
)
def test_spoken_sound_changes_are_read(fin: morphfst.Language, word: str, reading: str) -> None:
    assert best(fin, word) == reading


def test_standard_words_keep_their_place(fin: morphfst.Language) -> None:
    # joki 'river' is not jokin without its n; nainen keeps its i (one syllable before it); mäki
    # 'hill' comes before mä + -kin (common practice)
    assert best(fin, "joki") == "joki N;SG;NOM"
    assert best(fin, "mäki") == "mäki N;SG;NOM"
    assert fin.analyze("nanen") == []
    assert best(fin, "olen") == "olla V;IND;PRS;1;SG"


def test_spoken_forms_are_read_not_generated_by_rules(fin: morphfst.Language) -> None:
    # a lenient rule's form is never generated: the participle and -inen keep their written forms
    assert forms(fin, "mennä", "V;V.PTCP;ACT;PST;ADJ;SG;NOM") == ["mennyt"]
    assert forms(fin, "iloinen", "ADJ;SG;NOM") == ["iloinen"]
    # the spoken stems are second forms of the standard cell, after it
    assert forms(fin, "olla", "V;IND;PRS;1;SG")[0] == "olen"

"""The Finnish collective nouns and uninflected first parts of compounds: the rules that read unlisted
derived words and compounds. (The reflexive -UA, -UtUA and frequentative -skellA verbs are not read by
rule: a derivation on the verbs doubled the Finnish compile; the listed ones keep their reading.)

Sources named beside each check:
  KARLSSON  Karlsson, F., Finnish: An Essential Grammar, 3rd ed. (Routledge, 2018), the sections on
       derivation and on compounds
Forms are written from memory of that book or of the language ("from memory"); a plain fact of usage
is "common practice". The derived words read by rule are not lexicon entries (the tests of the listed
ones say so). The grammar is compiled once per test session (the ``fin`` fixture).
"""

from __future__ import annotations

import pytest

import morphfst


def best(fin: morphfst.Language, word: str) -> str:
    readings = fin.analyze(word)
    return readings[0].text if readings else "-"


def texts(fin: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in fin.analyze(word)]


def test_collective_sto(fin: morphfst.Language) -> None:
    # -stO on the vowel or plural stem of a noun (KARLSSON, derivation; from memory): tammi 'oak':
    # tammisto 'oak grove'; soitin 'instrument': soittimisto 'set of instruments'
    # (the listed name Tammisto ranks first, the collective second)
    assert "tammi N;COLL;N;SG;NOM" in texts(fin, "tammisto")
    assert "tammi N;COLL;N;SG;IN+ESS" in texts(fin, "tammistossa")
    assert best(fin, "soittimistoja") == "soitin N;COLL;N;PL;PRT"


def test_listed_words_keep_their_own_reading(fin: morphfst.Language) -> None:
    # the listed kehittyä, jakautua, istuskella, kirjasto, puisto (a 'park', not puu's collective)
    # keep their own lemma (common practice)
    for word, lemma in [
        ("kehittyä", "kehittyä"),
        ("kehittyi", "kehittyä"),
        ("jakautuu", "jakautua"),
        ("istuskeli", "istuskella"),
        ("kirjastossa", "kirjasto"),
        ("puisto", "puisto"),
        ("henkilöstö", "henkilöstö"),
    ]:
        assert fin.analyze(word)[0].lemma == lemma, word


@pytest.mark.parametrize(
    "word",
    [
        # test data invented: the wrong harmony of -stO, -stO on the consonant stem of a type other
        # than 1-22 (sisar, sisaren: not *sisaresto)
        "tammistö",
        "sisaresto",
    ],
)
def test_no_derived_reading_of_wrong_forms(fin: morphfst.Language, word: str) -> None:
    assert not any("COLL" in a for a in texts(fin, word)), word


@pytest.mark.parametrize(
    ("word", "analysis"),
    [
        # an uninflected first part: an indeclinable adjective, an adverb, a postposition (KARLSSON,
        # compounds; from memory); none of the compounds is a lexicon entry
        ("erimakuisia", "erimaku N;PROPR;ADJ;PL;PRT"),
        ("uudelleenjärjestelyn", "uudelleenjärjestellä V;ACTN;N;SG;GEN"),
        ("jälleenmyyntiin", "jälleenmyydä V;ACTN;N;SG;IN+ALL"),
    ],
)
def test_uninflected_first_parts(fin: morphfst.Language, word: str, analysis: str) -> None:
    assert best(fin, word) == analysis


def test_uninflected_first_parts_keep_frequent_words(fin: morphfst.Language) -> None:
    # listed words and inflected forms keep their reading before an adverb first part (common
    # practice): ainakin, edelleen, jälleen
    assert best(fin, "ainakin").startswith("ainakin ")
    assert best(fin, "edelleen").startswith("edelleen ")
    assert best(fin, "jälleen").startswith("jälleen ")

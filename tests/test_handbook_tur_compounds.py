"""Turkish compounds of a noun and a noun with the third person possessive that the lexicon does not
list (grammars/tur/compounds.mfg), and ordinary words that keep their own reading.

Sources named beside each check:
  G&K  Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar (Routledge, 2005)
  L    Lewis, G., Turkish Grammar, 2nd ed. (Oxford University Press, 2000)
  TDK  Türk Dil Kurumu, Güncel Türkçe Sözlük and Yazım Kılavuzu
Forms are written from memory of those works ("from memory"); a plain rule of spelling is "common
practice".
"""

from __future__ import annotations

import morphfst


def texts(tur: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in tur.analyze(word)]


def best(tur: morphfst.Language, word: str) -> str:
    readings = tur.analyze(word)
    return readings[0].text if readings else "-"


def stems(a: morphfst.Analysis) -> list[str]:
    return [m.form for m in a.morphs if m.kind == "stem"]


UNLISTED = ["gecekuşu", "kuzgunkılıcı", "koyungözü", "farekulağı", "kuyrukyağı"]


def test_the_words_are_not_listed(tur: morphfst.Language) -> None:
    # the checks below are of the compound rule only: none of these is a lexicon entry
    for word in UNLISTED:
        assert not tur.entries(word), word


def test_unlisted_compounds_are_read_with_the_whole_lemma(tur: morphfst.Language) -> None:
    # gecekuşu 'night owl (a person up at night)', kuzgunkılıcı 'gladiolus', koyungözü 'feverfew',
    # farekulağı 'mouse-ear (a plant)', kuyrukyağı 'fat of a sheep's tail': written as one word, the
    # last part with the third person possessive (TDK, from memory); the lemma is the whole word
    for word in UNLISTED:
        (a,) = tur.analyze(word)
        assert a.text == f"{word} N;SG;NOM", word
        assert len(stems(a)) == 2, word
    (a,) = tur.analyze("gecekuşu")
    assert a.segmentation == "gece-kuş-u"
    # the final stop of the last part voices before the possessive vowel (kılıç: kılıcı, kulak:
    # kulağı; common practice), and the lemma writes it so
    assert stems(tur.analyze("kuzgunkılıcı")[0]) == ["kuzgun", "kılıc"]


def test_unlisted_compounds_inflect_as_listed_ones(tur: morphfst.Language) -> None:
    # the plural -lArI takes the place of -(s)I (gecekuşları, not *gecekuşuları), a case follows -(s)I
    # with the pronominal n (gecekuşunu, gecekuşunda), a personal possessive replaces it
    # (gecekuşumuz) (G&K on compound nouns, L on the izafet; from memory)
    assert texts(tur, "gecekuşları") == ["gecekuşu N;PL;NOM"]
    assert texts(tur, "gecekuşunu") == ["gecekuşu N;SG;ACC"]
    assert texts(tur, "gecekuşunda") == ["gecekuşu N;SG;LOC"]
    assert best(tur, "gecekuşumuz") == "gecekuşu N;SG;PSS1P;NOM"
    assert best(tur, "gecekuşlarınız") == "gecekuşu N;PL;PSS2P;NOM"
    # the stop is voiceless before a consonant (kuzgunkılıçları, farekulakları; common practice)
    assert texts(tur, "kuzgunkılıçları") == ["kuzgunkılıcı N;PL;NOM"]
    assert texts(tur, "kuzgunkılıcını") == ["kuzgunkılıcı N;SG;ACC"]
    assert texts(tur, "farekulakları") == ["farekulağı N;PL;NOM"]
    assert texts(tur, "koyungözleri") == ["koyungözü N;PL;NOM"]


def test_listed_compounds_read_as_before(tur: morphfst.Language) -> None:
    # a listed compound has one stem and its own reading (TDK, from memory: dilbilgisi, gökkuşağı)
    (a,) = [a for a in tur.analyze("dilbilgisini") if a.text == "dilbilgisi N;SG;ACC"]
    assert len(stems(a)) == 1
    assert best(tur, "gökkuşağının") == "gökkuşağı N;SG;GEN"
    assert all(len(stems(a)) == 1 for a in tur.analyze("gökkuşağının"))


def test_ordinary_words_keep_their_reading(tur: morphfst.Language) -> None:
    # these are also spelt by a noun before a noun with a possessive (kan + ser-i, baş + kan-ı, ark +
    # adaş-ı, kont + rol-ü, yük + sele-n, tas + arı-m): their own reading is the only one shown
    # (common practice: the plain words)
    for word, reading in [
        ("kanseri", "kanser N;SG;PSS3S;NOM"),
        ("başkanı", "başkan N;SG;PSS3S;NOM"),
        ("arkadaşı", "arkadaş N;SG;PSS3S;NOM"),
        ("kontrolü", "kontrol N;SG;PSS3S;NOM"),
        ("yükselen", "yükselmek V;V.PTCP;ADJ;SG;NOM"),
        ("tasarım", "tasarım N;SG;NOM"),
    ]:
        found = tur.analyze(word)
        assert found[0].text == reading, word
        assert all(len(stems(a)) == 1 for a in found), word


def test_what_the_rule_leaves_out(tur: morphfst.Language) -> None:
    # by the block's design (grammars/tur/compounds.mfg), not an outside fact: a part of two letters
    # (el + kitab-ı), the singular possessives -(I)m and -(I)n of the first and second person
    # (gecekuşum, gecekuşun) and a word written without its Turkish letters (gecekusu) give no
    # compound reading
    for word in ["elkitabı", "gecekuşum", "gecekuşun", "gecekusu"]:
        assert not any(len(stems(a)) > 1 for a in tur.analyze(word)), word


def test_compounds_are_analysis_only(tur: morphfst.Language) -> None:
    assert tur.generate("gecekuşu", "N;SG;ACC") == []

"""Which reading comes first: a listed uninflected word against an inflected form spelt like it.

Users take the first analysis (lemma look-ups, segmentation before indexing). A frozen adverb,
postposition, numeral or lexicalized adjective comes first where it is the usual reading in running
text; an inflected or derived reading stays first where it is the usual one (the -sti adverbs, the
clitic forms, the aorist of a verb).

Sources named beside each check:
  from memory      the usual reading in running text, written from knowledge of the language
  common practice  the citation form of a numeral is its nominative (Finnish), a dictionary headword
  G&K              Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar (Routledge, 2005),
                   on the aorist and its past (from memory)
"""

from __future__ import annotations

import pytest

import morphfst


def best(lang: morphfst.Language, word: str) -> str:
    readings = lang.analyze(word)
    return readings[0].text if readings else "-"


def readings(lang: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in lang.analyze(word)]


# Finnish frozen adverbs and postpositions before the case form of a frequent word (from memory):
# siksi 'therefore' (not se's translative), miksi 'why', ajoissa 'in time' (not aika's plural
# inessive), kaikkiaan 'altogether', aikoinaan 'once, formerly', uudestaan 'again', olemassa
# 'existing' (olla olemassa), toisinaan 'sometimes', itsekseen 'to oneself', selville (saada
# selville 'find out'), jäljessä 'behind', tuntumassa 'near', hyvästi 'goodbye'.
@pytest.mark.parametrize(
    "word, first",
    [
        ("siksi", "siksi ADV"),
        ("miksi", "miksi ADV"),
        ("ajoissa", "ajoissa ADV"),
        ("kaikkiaan", "kaikkiaan ADV"),
        ("aikoinaan", "aikoinaan ADV"),
        ("uudestaan", "uudestaan ADV"),
        ("olemassa", "olemassa ADV"),
        ("toisinaan", "toisinaan ADV"),
        ("itsekseen", "itsekseen ADV"),
        ("selville", "selville ADV"),
        ("jäljessä", "jäljessä ADP"),
        ("tuntumassa", "tuntumassa ADP"),
        ("hyvästi", "hyvästi INTJ"),
    ],
)
def test_fin_frozen_adverb_first(fin: morphfst.Language, word: str, first: str) -> None:
    assert best(fin, word) == first


# ... and the inflected reading is still there, second (from memory: se's translative 'into it',
# aika's plural inessive 'in the times' are real, rarer readings)
@pytest.mark.parametrize(
    "word, other", [("siksi", "se PRON;SG;TRANS"), ("ajoissa", "aika N;PL;IN+ESS"), ("hyvästi", "hyvä ADJ;STI;ADV")]
)
def test_fin_inflected_reading_kept(fin: morphfst.Language, word: str, other: str) -> None:
    assert other in readings(fin, word)[1:]


# A clitic on the adverb follows it (from memory: miksiköhän 'I wonder why', olemassakaan)
@pytest.mark.parametrize(
    "word, first", [("miksiköhän", "miksi ADV;KO;HAN"), ("olemassakaan", "olemassa ADV;KAAN"), ("siksikin", "siksi ADV;KIN")]
)
def test_fin_clitic_on_frozen_adverb(fin: morphfst.Language, word: str, first: str) -> None:
    assert best(fin, word) == first


# Where the analysis is the better first reading it stays first (from memory): the -sti adverbs of
# listed adjectives, a clitic on an adverb, voi as voida's 'can', sillä as se's adessive ('it has'),
# mukaansa as 'according to him', tarvittaessa as the passive second infinitive, eläköön as elää's
# third person imperative.
@pytest.mark.parametrize(
    "word, first",
    [
        ("pahasti", "paha ADJ;STI;ADV"),
        ("hienosti", "hieno ADJ;STI;ADV"),
        ("vieläkin", "vielä ADV;KIN"),
        ("niinpä", "niin ADV;PA"),
        ("voi", "voida V;IND;PRS;3;SG"),
        ("sillä", "se PRON;SG;AT+ESS"),
        ("mukaansa", "mukaan ADP;PSS3S"),
        ("tarvittaessa", "tarvita V;NFIN;INF2;PASS;IN+ESS"),
        ("eläköön", "elää V;IMP;3;SG"),
        ("aikaa", "aika N;SG;PRT"),
    ],
)
def test_fin_analysis_stays_first(fin: morphfst.Language, word: str, first: str) -> None:
    assert best(fin, word) == first


# The n of seitsemän, kahdeksan, yhdeksän, kymmenen is the nominative's and the genitive's: the
# nominative, the citation form, comes first (common practice; seitsemän vuotta, from memory), the
# genitive second (seitsemän vuoden)
@pytest.mark.parametrize("word", ["seitsemän", "kahdeksan", "yhdeksän", "kymmenen"])
def test_fin_numeral_nominative_before_genitive(fin: morphfst.Language, word: str) -> None:
    assert readings(fin, word)[:2] == [f"{word} NUM;SG;NOM", f"{word} NUM;SG;GEN"]


# mm is mostly muun muassa 'among other things'; the unit millimetre second (from memory)
def test_fin_mm_is_muun_muassa_first(fin: morphfst.Language) -> None:
    assert readings(fin, "mm")[:2] == ["mm ADV", "mm N"]


# Turkish listed words before an inflected homograph (from memory): tekin 'safe' (tekin değil), not
# tek's genitive; giderek 'increasingly', not gitmek's converb; yetmiş 'seventy', not yetmek's
# evidential; beklenmedik 'unexpected', not beklemek's passive 1PL past; inanılmaz, kaçınılmaz
# before the negative aorist of the passive; sıradan 'ordinary', not sıra's ablative; sözde
# 'so-called'; yana 'since' (bu yana), not yan's dative.
@pytest.mark.parametrize(
    "word, first",
    [
        ("tekin", "tekin ADJ;SG;NOM"),
        ("giderek", "giderek ADV"),
        ("yetmiş", "yetmiş NUM;SG;NOM"),
        ("beklenmedik", "beklenmedik ADJ;SG;NOM"),
        ("inanılmaz", "inanılmaz ADJ;SG;NOM"),
        ("kaçınılmaz", "kaçınılmaz ADJ;SG;NOM"),
        ("sıradan", "sıradan ADJ;SG;NOM"),
        ("sözde", "sözde ADV"),
        ("yana", "yana ADP"),
    ],
)
def test_tur_listed_word_first(tur: morphfst.Language, word: str, first: str) -> None:
    assert best(tur, word) == first


# The simple past of a lexicon verb in -Ar before the aorist's past of the shorter verb spelt alike
# (from memory: çıkardı 'took out', kopardı 'tore off', uyardı 'warned'; G&K on the aorist's past)
@pytest.mark.parametrize(
    "word, first, other",
    [
        ("çıkardı", "çıkarmak V;PST;3;SG", "çıkmak V;HAB;PST;3;SG"),
        ("çıkardılar", "çıkarmak V;PST;3;PL", "çıkmak V;HAB;PST;3;PL"),
        ("kopardı", "koparmak V;PST;3;SG", "kopmak V;HAB;PST;3;SG"),
        ("uyardı", "uyarmak V;PST;3;SG", "uymak V;HAB;PST;3;SG"),
    ],
)
def test_tur_lexicon_verb_past_before_aorist_past(tur: morphfst.Language, word: str, first: str, other: str) -> None:
    found = readings(tur, word)
    assert found[0] == first
    assert other in found[1:]


# Where the inflected reading is the usual one it stays first (from memory): the aorist itself and
# its conditional (çıkar 'it comes out', sorun çıkarsa 'if a problem arises'); the aorist's past of a
# verb whose -Ar homograph is rare (giderdi 'he would go', derdi 'he would say') or has none
# (yapardı); tanımak's participle (tanıdığı 'whom he knows'), üst's possessive dative (üstüne).
@pytest.mark.parametrize(
    "word, first",
    [
        ("çıkar", "çıkmak V;HAB;3;SG"),
        ("çıkarsa", "çıkmak V;HAB;COND;3;SG"),
        ("giderdi", "gitmek V;HAB;PST;3;SG"),
        ("derdi", "demek V;HAB;PST;3;SG"),
        ("yapardı", "yapmak V;HAB;PST;3;SG"),
        ("tanıdığı", "tanımak V;V.PTCP;PST;ADJ;SG;PSS3S;NOM"),
        ("üstüne", "üst N;SG;PSS3S;DAT"),
    ],
)
def test_tur_inflected_reading_stays_first(tur: morphfst.Language, word: str, first: str) -> None:
    assert best(tur, word) == first


# The weight only ranks: the aorist's past is still generated (G&K, from memory: çıkardı 'he would go out')
def test_tur_aorist_past_still_generated(tur: morphfst.Language) -> None:
    assert [g.form for g in tur.generate("çıkmak", "V;HAB;PST;3;SG")] == ["çıkardı"]

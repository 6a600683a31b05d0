"""The Finnish grammar's derivations of this round and the compound blocks for unseen words.

Sources named beside each check:
  KARLSSON  Karlsson, F., Finnish: An Essential Grammar, 3rd ed. (Routledge, 2018), the sections on
       derivation and on compounds
Forms are written from memory of that book or of the language ("from memory"); a plain fact of usage
is "common practice". The words are everyday Finnish; the ones that are not lexicon entries are chosen so (the
test says which are listed). The grammar is compiled once per test session (the ``fin`` fixture).
"""

from __future__ import annotations

import pytest

import morphfst


def best(fin: morphfst.Language, word: str) -> str:
    readings = fin.analyze(word)
    return readings[0].text if readings else "-"


def texts(fin: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in fin.analyze(word)]


def forms(fin: morphfst.Language, lemma: str, features: str) -> list[str]:
    return [f.form for f in fin.generate(lemma, features)]


def test_llinen_on_the_weak_vowel_stem(fin: morphfst.Language) -> None:
    # -llinen 'having, of' on the stem of the genitive, weak grade and all (KARLSSON, derivation;
    # from memory): kesä-llinen, aika: aja-llinen, ääni: äänellinen, ravinto: ravinno-llinen
    assert best(fin, "kesällinen") == "kesä N;ASSOC;ADJ;SG;NOM"
    assert best(fin, "kesällisiä") == "kesä N;ASSOC;ADJ;PL;PRT"
    assert best(fin, "äänellisen") == "ääni N;ASSOC;ADJ;SG;GEN"
    assert best(fin, "ravinnollisesti") == "ravinto N;ASSOC;ADJ;STI;ADV"
    assert forms(fin, "aika", "N;ASSOC;ADJ;SG;GEN") == ["ajallisen"]
    assert forms(fin, "kesä", "N;ASSOC;ADJ;PL;GEN")[:1] == ["kesällisten"]
    # type 40 and type 48 stems: talous: taloude-llinen, rakenne: rakentee-llinen (from memory)
    assert "talous N;ASSOC;ADJ;SG;NOM" in texts(fin, "taloudellinen")
    assert "rakenne N;ASSOC;ADJ;SG;NOM" in texts(fin, "rakenteellinen")
    # the quality noun of the derived adjective (kesällisyys), as of a listed one
    assert "kesä N;ASSOC;ADJ;ABSTR;N;SG;NOM" in texts(fin, "kesällisyys")


def test_a_listed_adjective_in_llinen_ranks_first(fin: morphfst.Language) -> None:
    # the listed taloudellinen, ajallinen, kunnallinen keep their own lemma before the derivation of
    # their noun, even of a noun as frequent as aika (common practice)
    for word in ["taloudellinen", "ajallinen", "kunnallinen", "ajallisesti", "taloudellisuus"]:
        assert fin.analyze(word)[0].lemma in ("taloudellinen", "ajallinen", "kunnallinen"), word


def test_kas_on_the_weak_vowel_stem(fin: morphfst.Language) -> None:
    # -kAs 'having much of' (type 41, kk : k) on the weak vowel stem (KARLSSON, derivation; from
    # memory): tuoksu-kas, vitsi-käs, vitsikkään, vitsikkäästi
    assert best(fin, "tuoksukas") == "tuoksu N;ABUND;ADJ;SG;NOM"
    assert best(fin, "tuoksukkaan") == "tuoksu N;ABUND;ADJ;SG;GEN"
    assert best(fin, "vitsikkäitä") == "vitsi N;ABUND;ADJ;PL;PRT"
    assert forms(fin, "vitsi", "N;ABUND;ADJ;SG;GEN") == ["vitsikkään"]
    assert forms(fin, "vitsi", "N;ABUND;ADJ;STI;ADV") == ["vitsikkäästi"]
    # the listed voimakas, innokas, laadukas keep their own lemma
    for word, lemma in [("voimakas", "voimakas"), ("innokkaan", "innokas"), ("laadukkaasti", "laadukas")]:
        assert fin.analyze(word)[0].lemma == lemma, word


@pytest.mark.parametrize(
    "word",
    [
        # test data invented: wrong harmony, a single k in the vowel stem, a single l of -llinen
        "vitsikas",
        "tuoksukaan",
        "kesälinen",
        # -llinen and -kAs are a noun's, not a verb's or an adjective's (*hyvällinen, *sanokas)
        "hyvällinen",
        "sanokas",
    ],
)
def test_no_derived_reading_of_wrong_forms(fin: morphfst.Language, word: str) -> None:
    assert not any("ASSOC" in t or "ABUND" in t for t in texts(fin, word)), word


def test_stua_verbs_have_their_infinitive(fin: morphfst.Language) -> None:
    # -stUA 'become' of an adjective in -inen inflects as a verb of type 52 in every form, the first
    # infinitive and the passive too (KARLSSON, derivation; from memory): aikuistua,
    # aikuistutaan, aikuistuttiin
    assert best(fin, "aikuistua") == "aikuinen N;BECOME;V;NFIN"
    assert "aikuinen N;BECOME;V;PASS;IND;PRS" in texts(fin, "aikuistutaan")
    assert best(fin, "aikuistuttiin") == "aikuinen N;BECOME;V;PASS;IND;PST"


def test_no_action_noun_in_us_where_the_verb_has_another(fin: morphfst.Language) -> None:
    # maata 'lie' makes makuu, palata 'return' paluu, not *makaus, *palaus (from memory); the -Us of
    # other verbs of type 73 stays (hakkaus, a listed noun; hoivaus)
    for word in ["makaus", "makauksen", "palaus", "palauksessa"]:
        assert fin.analyze(word) == [], word
    assert "hoivata V;ACTN;N;SG;NOM" in texts(fin, "hoivaus")


def test_lukuisa_has_the_genitive_lukuisten(fin: morphfst.Language) -> None:
    # lukuisa 'numerous': the plural genitive lukuisten beside lukuisien (common practice)
    assert best(fin, "lukuisten") == "lukuisa ADJ;PL;GEN"
    assert best(fin, "lukuisien") == "lukuisa ADJ;PL;GEN"


@pytest.mark.parametrize(
    ("word", "analysis", "segmentation"),
    [
        # an adjective in the genitive before an adjective: shades of colour (KARLSSON, compounds;
        # from memory); none of the compounds below is a lexicon entry
        ("vihertävänharmaa", "vihertävänharmaa ADJ;SG;NOM", "vihertävän-harmaa"),
        ("kellertävänruskea", "kellertävänruskea ADJ;SG;NOM", "kellertävän-ruskea"),
        # a pronoun or quantifier before a noun or adjective (KARLSSON, compounds; from memory)
        ("monipäiväisen", "monipäivä N;PROPR;ADJ;SG;GEN", "moni-päivä-ise-n"),
        ("kaikenkokoisia", "kaikenkokoinen ADJ;PL;PRT", "kaiken-kokois-i-a"),
        # a derived noun before a noun: the action noun of hoivata (from memory)
        ("hoivaustyössä", "hoivaustyö N;SG;IN+ESS", "hoivaus-työ-ssä"),
        # -llinen and -kAs as the last part of a compound (common practice)
        ("kuntataloudellisen", "kuntataloudellinen ADJ;SG;GEN", "kunta-taloudellise-n"),
    ],
)
def test_compounds_of_the_new_blocks(fin: morphfst.Language, word: str, analysis: str, segmentation: str) -> None:
    assert (analysis, segmentation) in [(a.text, a.segmentation) for a in fin.analyze(word)]


def test_the_new_compound_blocks_keep_frequent_words(fin: morphfst.Language) -> None:
    # frequent words keep their own reading before a compound reading of the new blocks
    # (common practice): monet, kaikenlainen, uimari
    assert best(fin, "kaikenlainen").startswith("kaikenlainen ")
    assert best(fin, "monet").startswith("moni ")
    assert best(fin, "uimari").startswith("uimari ")

"""The Turkish grammar's derivations and the lexicon gaps of the development list.

Sources named beside each check:
  G&K  Göksel, A. & Kerslake, C., Turkish: A Comprehensive Grammar (Routledge, 2005)
  L    Lewis, G., Turkish Grammar, 2nd ed. (Oxford University Press, 2000)
  TDK  Türk Dil Kurumu, Güncel Türkçe Sözlük and Yazım Kılavuzu
Forms are written from memory of those works ("from memory"); a plain rule of spelling is "common
practice".
"""

from __future__ import annotations

import morphfst


def best(tur: morphfst.Language, word: str) -> str:
    readings = tur.analyze(word)
    return readings[0].text if readings else "-"


def forms(tur: morphfst.Language, lemma: str, features: str) -> list[str]:
    return [f.form for f in tur.generate(lemma, features)]


def test_geminate_voiced_stops_written_voiced(tur: morphfst.Language) -> None:
    # Rab 'Lord', had 'limit', hac 'pilgrimage' keep their voiced stop at the end (Rab, had, hac;
    # Rabbi, haddi, haccı), while ret and zıt are written voiceless (reddi, zıddı) (TDK, 'Rab, -bbi',
    # 'had, -ddi', 'hac, -ccı', 'ret, -ddi', 'zıt, -ddı'; from memory)
    assert best(tur, "rab") == "rab N;SG;NOM"
    assert best(tur, "had") == "had N;SG;NOM"
    assert best(tur, "hac") == "hac N;SG;NOM"
    assert forms(tur, "had", "N;SG;PSS3S;NOM")[:1] == ["haddi"]
    assert forms(tur, "hac", "N;SG;LOC")[:1] == ["hacda"]
    assert forms(tur, "rab", "N;SG;PSS1S;NOM")[:1] == ["rabbim"]
    # rap is its own word now, not a spelling of Rab
    assert not any(a.lemma in ("rab", "Rab") for a in tur.analyze("rap"))
    assert best(tur, "ret") == "ret N;SG;NOM" and forms(tur, "ret", "N;SG;ACC")[:1] == ["reddi"]
    assert best(tur, "zıt") == "zıt ADJ;SG;NOM"


def test_the_fellow_noun_dash(tur: morphfst.Language) -> None:
    # -DAş 'one who shares X' on any noun (G&K 7.1 on -DAş, from memory): new words keep its a after
    # a front vowel too (ülküdaş, görevdaş, like the listed meslektaş) and its D devoices (sınıftaş)
    assert best(tur, "ülküdaş") == "ülkü N;FELLOW;N;SG;NOM"
    assert best(tur, "görevdaşları").startswith("görev N;FELLOW;N;PL;")
    assert best(tur, "sınıftaşım") == "sınıf N;FELLOW;N;SG;PSS1S;NOM"
    assert forms(tur, "kan", "N;FELLOW;N;PL;NOM") == ["kandaşlar"]
    # listed words come first (meslektaş, vatandaş, kardeş, özdeş)
    for word, lemma in [("meslektaş", "meslektaş"), ("vatandaş", "vatandaş"), ("kardeş", "kardeş"), ("özdeş", "özdeş")]:
        assert tur.analyze(word)[0].lemma == lemma, word
    # no *evdeş, *sınıfdaş (test data invented: misspellings)
    for word in ["evdeş", "sınıfdaş"]:
        assert not any("FELLOW" in a.text for a in tur.analyze(word)), word


def test_the_diminutive_cik_on_adjectives(tur: morphfst.Language) -> None:
    # -CIk on an adjective 'nice and, rather' (G&K 7.1 on -CIk, from memory): güzelcik, yalnızcık,
    # tatlıcık; the listed küçücük, kısacık, incecik come first
    assert best(tur, "güzelcik") == "güzel ADJ;DIM;ADJ;SG;NOM"
    assert best(tur, "yalnızcık") == "yalnız ADJ;DIM;ADJ;SG;NOM"
    assert forms(tur, "tatlı", "ADJ;DIM;ADJ;SG;NOM") == ["tatlıcık"]
    for word in ["küçücük", "kısacık", "incecik"]:
        assert tur.analyze(word)[0].lemma == word, word


def test_deverbal_nouns_in_im_and_inti(tur: morphfst.Language) -> None:
    # -(I)m 'the act or its result' and -(I)ntI 'what is left or comes of it' on a verb's root or voice
    # (G&K 7.2, from memory): kazıntı 'scrapings', çözüm, kullanım; listed words come first
    assert "kazmak V;REMN;N;SG;NOM" in [a.text for a in tur.analyze("kazıntı")]
    assert forms(tur, "dökmek", "V;REMN;N;SG;NOM") == ["döküntü"]
    assert forms(tur, "ölçmek", "V;ACTN;N;SG;NOM") == ["ölçüm"]
    assert forms(tur, "yazmak", "V;PASS;ACTN;N;SG;NOM") == ["yazılım"]
    for word in ["kullanım", "çözüm", "anlam", "kavram", "akıntı", "beklenti", "seçim", "ölüm"]:
        assert tur.analyze(word)[0].lemma == word, word
    # not after the abilitative, a descriptive auxiliary, the negative or a verb made with -lA
    # (test data invented: impossible forms)
    for word in ["gelebilim", "yapıverim", "sellem"]:
        assert not any("ACTN" in a.text for a in tur.analyze(word)), word
    assert forms(tur, "gelmek", "V;NEG;ACTN;N;SG;NOM") == []


def test_words_added_from_the_unanalyzed_development_list(tur: morphfst.Language) -> None:
    # abbreviations of the spelling rules' list, said as letters or as the word (TDK Yazım Kılavuzu,
    # abbreviations, from memory): HES'te (said hes), TOKİ'nin, AÖF'te (said aöf), CEO'su, T.C., A.Ş.,
    # M.Ö., Yrd. (said yardımcı), Bkz., Örn., No'lu (written as spelt, common practice)
    assert best(tur, "HES'te") == "HES N;SG;LOC"
    assert best(tur, "TOKİ'nin") == "TOKİ PROPN;SG;GEN"
    assert best(tur, "AÖF'te") == "AÖF PROPN;SG;LOC"
    assert best(tur, "CEO'su") == "CEO N;SG;PSS3S;NOM"
    assert best(tur, "STK'lerin").startswith("STK N;PL;")  # said se-te-ke
    assert best(tur, "T.C") == "T.C. PROPN;SG;NOM"
    assert best(tur, "M.Ö") == "M.Ö. ADV"
    assert best(tur, "a.s") == "a.s. N;SG;NOM"
    assert best(tur, "No'lu") == "No N;PROPR;ADJ;SG;NOM"
    assert forms(tur, "Yrd", "N;SG;DAT") == ["Yrd'ya"]  # yardımcıya
    # names of the Arabic tradition and their particles (common practice): Ebu Bekir, İbn Haldun,
    # İbni Sina, Abdülhamid, Davud, Suudi Arabistan
    for word, lemma in [
        ("Ebu", "Ebu"),
        ("İbn", "İbn"),
        ("İbni", "İbni"),
        ("Abdülhamid", "Abdülhamid"),
        ("Davud'un", "Davud"),
        ("Suudi", "Suudi"),
        ("Resulullah", "Resulullah"),
    ]:
        assert tur.analyze(word)[0].lemma == lemma, word
    # loans in everyday use (common practice): web sitesi, webde; euro (beside avro), euroya; online
    assert best(tur, "webde") == "web N;SG;LOC"
    assert best(tur, "euroya") == "euro N;SG;DAT"
    assert best(tur, "online") == "online ADJ;SG;NOM"
    # gibisi 'the like of it' (onun gibisi yok, senin gibisini; TDK, 'gibi', from memory), beraber as
    # an adjective 'equal' and in beraberinde 'with it' (TDK, 'beraber', from memory); Allah teâlâ,
    # aleyküm selam
    assert best(tur, "gibisi") == "gibisi N;SG;NOM"
    assert best(tur, "gibisini") == "gibisi N;SG;ACC"
    assert best(tur, "beraberinde") == "beraber ADJ;SG;PSS3S;LOC"
    assert best(tur, "beraber") == "beraber ADV"
    assert best(tur, "teâlâ") == "teâlâ ADJ;SG;NOM"
    assert best(tur, "aleyküm") == "aleyküm INTJ"


def test_adjectives_take_the_nouns_derivations(tur: morphfst.Language) -> None:
    # an adjective used as a noun takes -lI, -sIz, -CI, -sAl (G&K 7.1, from memory): siyahlı 'the one
    # in black', beyazlılar, eksiksiz, antikacı, doğrusal; the listed words come first
    assert best(tur, "siyahlı") == "siyah ADJ;PROPR;ADJ;SG;NOM"
    assert best(tur, "beyazlılar") == "beyaz ADJ;PROPR;ADJ;PL;NOM"
    assert forms(tur, "eksik", "ADJ;PRIV;ADJ;SG;NOM") == ["eksiksiz"]
    assert forms(tur, "mavi", "ADJ;PROPR;ADJ;PL;NOM") == ["mavililer"]
    assert forms(tur, "doğru", "ADJ;RELADJ;ADJ;SG;NOM") == ["doğrusal"]
    assert "antika ADJ;AGT;N;PL;NOM" in [a.text for a in tur.analyze("antikacılar")]
    assert best(tur, "uygunsuzluk") == "uygunsuz ADJ;ABSTR;N;SG;NOM"
    for word in ["eksiksiz", "rahatsız", "eskici", "doğrusal", "ilerici", "sarılı", "kurucu"]:
        assert tur.analyze(word)[0].lemma == word, word
    # a noun's possessive stays first where it spells the same (pahalısı is pahalı + 3SG.POSS, not
    # paha-lı + -sI; kötüsü, iyisi)
    assert best(tur, "pahalısı") == "pahalı ADJ;SG;PSS3S;NOM"
    assert best(tur, "iyisi") == "iyi ADJ;SG;PSS3S;NOM"


def test_the_similative_si_after_a_consonant(tur: morphfst.Language) -> None:
    # -sI 'X-like' after a consonant (G&K 7.1 on -sI, from memory): taşsı 'stony-looking', kitapsı;
    # after a vowel the similative is -(I)msI (kırmızımsı), so kırmızısı, arabası are possessives only
    assert best(tur, "taşsı") == "taş N;SIMIL;ADJ;SG;NOM"
    assert best(tur, "kitapsı") == "kitap N;SIMIL;ADJ;SG;NOM"
    assert forms(tur, "bebek", "N;SIMIL;ADJ;SG;NOM")[:1] == ["bebeksi"]
    assert forms(tur, "kırmızı", "ADJ;SIMIL;ADJ;SG;NOM") == ["kırmızımsı"]
    # the listed words come first (masalsı, camsı, bebeksi, kumsu)
    for word in ["masalsı", "camsı", "bebeksi", "kumsu"]:
        assert tur.analyze(word)[0].lemma == word, word
    # not after a vowel, and not before a noun's own possessive (test data: forms of listed words)
    for word in ["kırmızısı", "arabası", "hastası"]:
        assert not any("SIMIL" in a.text for a in tur.analyze(word)), word
    assert best(tur, "tersi") == "ters ADJ;SG;PSS3S;NOM"
    assert best(tur, "cinsi") == "cins N;SG;PSS3S;NOM"


def test_the_resultative_adjective_ik_of_verbs(tur: morphfst.Language) -> None:
    # -(I)k after a verb's consonant, the adjective of the resulting state (G&K 7.2 on -(I)k, from
    # memory): kırık 'broken', yıkık, bükük; on a voice too (yapışık: yap-ış-ık); inflected and
    # derived like an adjective (kırıklar, bozukluk)
    assert forms(tur, "kırmak", "V;RESULT;ADJ;SG;NOM") == ["kırık"]
    assert forms(tur, "gitmek", "V;RESULT;ADJ;PL;NOM") == ["gidikler"]
    assert "sökmek V;RESULT;ADJ;SG;NOM" in [a.text for a in tur.analyze("sökük")]
    assert "yapmak V;RECP;RESULT;ADJ;SG;NOM" in [a.text for a in tur.analyze("yapışık")]
    # the listed words come first (kırık, yazık, sanık, bozuk, açık, balık is no verb's)
    for word in ["kırık", "yazık", "sanık", "bozuk", "açık", "yıkık", "balık"]:
        assert tur.analyze(word)[0].lemma == word, word
    # not after a vowel, the abilitative or the negative (test data invented: impossible forms)
    for word in ["okuk", "gelebilik", "yapmık"]:
        assert tur.analyze(word) == [], word
    assert forms(tur, "okumak", "V;RESULT;ADJ;SG;NOM") == []


def test_the_inclination_adjective_gan_of_verbs(tur: morphfst.Language) -> None:
    # -GAn 'inclined to, apt to' after a verb's consonant (G&K 7.2 on -GAn, from memory): k after a
    # voiceless consonant (çalışkan, iletken, yansıtkan), else g (kırılgan, saldırgan, soğurgan)
    assert best(tur, "soğurgan") == "soğurmak V;INCL;ADJ;SG;NOM"
    assert best(tur, "yansıtkan") == "yansıtmak V;INCL;ADJ;SG;NOM"
    assert forms(tur, "çalışmak", "V;INCL;ADJ;SG;NOM") == ["çalışkan"]
    assert forms(tur, "kırmak", "V;PASS;INCL;ADJ;SG;NOM") == ["kırılgan"]
    assert forms(tur, "yansımak", "V;CAUS;INCL;ADJ;SG;NOM") == ["yansıtkan"]
    # the listed words come first (çalışkan, kırılgan, saldırgan, yorgan 'quilt', kaygan)
    for word in ["çalışkan", "kırılgan", "saldırgan", "yorgan", "kaygan"]:
        assert tur.analyze(word)[0].lemma == word, word
    # not after a vowel, no g after a voiceless consonant nor k after a voiced one (test data
    # invented: impossible forms)
    for word in ["okugan", "kırılkan", "çalışgan"]:
        assert tur.analyze(word) == [], word
    # the copula's -(y)ken on a noun keeps its reading (çocukken 'as a child', sıkken)
    assert best(tur, "çocukken") == "çocuk N;SG;NOM;V.CVB;WHILE"

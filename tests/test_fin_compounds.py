"""Finnish compounds (grammars/fin/compounds.mfg): analysis of compounds that are not in the lexicon.

What the checks rest on, each marked beside it: a Finnish compound puts its first part in the
nominative singular (kirjasto+auto) or, less often, in the genitive singular (maailma-n+sota); only the
last part inflects, and it alone decides consonant gradation and vowel harmony of the endings (Karlsson,
F., Finnish: An Essential Grammar, 3rd ed., Routledge, 2018, the section on compounds; written from
memory, not copied). The words are everyday Finnish ("common practice"). The grammar is compiled once
per test session (the ``fin`` fixture of conftest.py).
"""

from __future__ import annotations

import pytest

import morphfst

KARLSSON = "Karlsson, Finnish: An Essential Grammar (3rd ed., 2018), compounds; from memory"


def readings(fin: morphfst.Language, word: str) -> list[tuple[str, str]]:
    return [(a.text, a.segmentation) for a in fin.analyze(word)]


@pytest.mark.parametrize(
    ("word", "analysis", "segmentation"),
    [
        # the nominative first part, the last part inflected (KARLSSON); kirjastoauto "mobile library"
        # is common practice
        ("kirjastoauto", "kirjastoauto N;SG;NOM", "kirjasto-auto"),
        ("kirjastoautossa", "kirjastoauto N;SG;IN+ESS", "kirjasto-auto-ssa"),
        ("kirjastoautoon", "kirjastoauto N;SG;IN+ALL", "kirjasto-auto-on"),
        ("kirjastoautolla", "kirjastoauto N;SG;AT+ESS", "kirjasto-auto-lla"),
        ("kirjastoautot", "kirjastoauto N;PL;NOM", "kirjasto-auto-t"),
        ("kirjastoautoissa", "kirjastoauto N;PL;IN+ESS", "kirjasto-auto-i-ssa"),
        # gradation is the last part's: kauppa, kaupassa (KARLSSON); kirjakauppa "bookshop", common practice
        ("kirjakaupassa", "kirjakauppa N;SG;IN+ESS", "kirja-kaupa-ssa"),
        ("kirjakaupat", "kirjakauppa N;PL;NOM", "kirja-kaupa-t"),
        # harmony is the last part's: kylä + talo takes back -ssa (KARLSSON); kylätalo "village hall"
        ("kylätalossa", "kylätalo N;SG;IN+ESS", "kylä-talo-ssa"),
    ],
)
def test_nominative_first_part(fin: morphfst.Language, word: str, analysis: str, segmentation: str) -> None:
    assert (analysis, segmentation) in readings(fin, word)


def test_harmony_follows_the_last_part(fin: morphfst.Language) -> None:
    assert fin.analyze("kylätalossä") == []  # front ending after back talo: wrong (KARLSSON)


def test_morphs_and_glosses_of_the_parts(fin: morphfst.Language) -> None:
    found = [a for a in fin.analyze("kirjastoautossa") if a.segmentation == "kirjasto-auto-ssa"]
    assert found, "kirjastoautossa: no compound reading"
    a = found[0]
    assert (a.lemma, a.pos, a.features) == ("kirjastoauto", "N", ("SG", "IN+ESS"))
    first, second = a.morphs[:2]
    assert (first.kind, first.form, first.underlying, first.gloss) == (
        "stem",
        "kirjasto",
        "kirjasto",
        fin.glosses[("kirjasto", "N")],
    )
    assert (second.kind, second.form, second.underlying, second.gloss) == ("stem", "auto", "auto", fin.glosses[("auto", "N")])
    assert a.gloss.split("-")[:2] == [fin.glosses[("kirjasto", "N")], f"{fin.glosses[('auto', 'N')]}.SG"]
    assert [s.text for s in fin.segment("kirjastoautossa")][:1] == ["kirjasto-auto-ssa"]


def test_genitive_first_part(fin: morphfst.Language) -> None:
    # kaupungin + kirjasto "city library": the genitive singular first part (KARLSSON); common practice
    found = [a for a in fin.analyze("kaupunginkirjastossa") if a.segmentation == "kaupungin-kirjasto-ssa"]
    assert found and found[0].text == "kaupunginkirjasto N;SG;IN+ESS"
    assert (found[0].morphs[0].form, found[0].morphs[0].underlying) == ("kaupungin", "kaupunki")


def test_three_parts(fin: morphfst.Language) -> None:
    # kaupungin + kirjasto + auto, inflected in the last part (KARLSSON; the word is common practice)
    assert ("kaupunginkirjastoauto N;SG;IN+ESS", "kaupungin-kirjasto-auto-ssa") in readings(fin, "kaupunginkirjastoautossa")
    assert ("koulukirjastoauto N;SG;NOM", "koulu-kirjasto-auto") in readings(fin, "koulukirjastoauto")


def test_lexicon_word_ranks_above_its_compound_reading(fin: morphfst.Language) -> None:
    # maailmansota "world war" is in the lexicon (common practice): its own reading is the one given;
    # the transducer also holds the heavier compound path maailman-soda-ssa, which analyze leaves out
    assert fin.entries("maailmansota")
    found = readings(fin, "maailmansodassa")
    assert found == [("maailmansota N;SG;IN+ESS", "maailmansoda-ssa")]
    paths = fin.fast.bounded.walk(fin.normalize("maailmansodassa"))
    seam = fin.fast.seam
    assert any(seam in side for side, _, _ in paths)
    assert min(w for side, _, w in paths if seam not in side) < min(w for side, _, w in paths if seam in side)
    # a compound with fewer seams ranks first: jalkapallo (lexicon) + joukkue before jalka + pallo + joukkue
    segs = [s for _, s in readings(fin, "jalkapallojoukkueessa")]
    assert segs.index("jalkapallo-joukkuee-ssa") < segs.index("jalka-pallo-joukkuee-ssa")


def test_unlisted_compounds_are_generated_by_their_last_part(fin: morphfst.Language) -> None:
    # not in the lexicon: generated by the last part, the first parts as the lemma writes them
    assert not fin.entries("kirjastoauto")
    assert [f.form for f in fin.generate("kirjastoauto", "N;SG;IN+ESS")] == ["kirjastoautossa"]  # common practice
    assert [f.form for f in fin.generate("maailmansota", "N;SG;IN+ESS")] == ["maailmansodassa"]  # common practice


def test_walk_agrees_with_composition(fin: morphfst.Language) -> None:
    for word in ["kirjastoautossa", "kirjakaupat", "kaupunginkirjastossa", "maailmansodassa", "kaupunginkirjastoautossa"]:
        walked, composed = fin.analyze(word), fin.analyze_composed(word)
        assert [(a.text, a.segmentation, a.gloss) for a in walked] == [(a.text, a.segmentation, a.gloss) for a in composed], word
        assert all(abs(a.weight - b.weight) < 1e-3 for a, b in zip(walked, composed)), word


def test_compound_numerals_agree_in_case(fin: morphfst.Language) -> None:
    # a compound numeral is one word whose parts all take the case of the whole, and its lemma is the
    # nominative (common practice; kaksikymmentä, sata and the units are lexicon numerals)
    assert readings(fin, "kaksikymmentäkolme")[0] == ("kaksikymmentäkolme NUM;SG;NOM", "kaksikymmentä-kolme")
    assert readings(fin, "kahdessakymmenessäkolmessa")[0] == ("kaksikymmentäkolme NUM;SG;IN+ESS", "kahdessakymmenessä-kolme-ssa")
    assert readings(fin, "sadassakahdessakymmenessä")[0][0] == "satakaksikymmentä NUM;SG;IN+ESS"
    assert readings(fin, "kolmesataaviisikymmentäkaksi")[0][0] == "kolmesataaviisikymmentäkaksi NUM;SG;NOM"
    # parts in different cases are no numeral (common practice)
    assert fin.analyze("kahdenkymmentäkolme") == []
    assert fin.analyze("kahdessakymmenessäkolme") == []
    for word in ["kaksikymmentäkolme", "kahdessakymmenessäkolmessa"]:
        walked, composed = fin.analyze(word), fin.analyze_composed(word)
        assert [(a.text, a.segmentation) for a in walked] == [(a.text, a.segmentation) for a in composed], word


def test_compound_ordinals(fin: morphfst.Language) -> None:
    # Karlsson, Finnish: An Essential Grammar, the ordinals (from memory): 11th-19th inflect the first
    # part only (yhdestoista, yhdennessätoista), the tens both parts in the same case
    # (kahdeskymmenes, kahdennenkymmenennen); 21st adds ensimmäinen or yhdes, in the case of the whole
    assert readings(fin, "yhdennessätoista")[0] == ("yhdestoista NUM;SG;IN+ESS", "yhdenne-ssä-toista")
    assert readings(fin, "kahdeksannentoista")[0][0] == "kahdeksastoista NUM;SG;GEN"
    assert readings(fin, "kahdennenkymmenennen")[0][0] == "kahdeskymmenes NUM;SG;GEN"
    assert readings(fin, "kolmannessakymmenennessä")[0][0] == "kolmaskymmenes NUM;SG;IN+ESS"
    assert readings(fin, "kahdeskymmenesensimmäinen")[0][0] == "kahdeskymmenesensimmäinen NUM;SG;NOM"
    assert readings(fin, "kahdennenkymmenennenensimmäisen")[0][0] == "kahdeskymmenesensimmäinen NUM;SG;GEN"
    assert readings(fin, "kahdeskymmenesyhdes")[0][0] == "kahdeskymmenesyhdes NUM;SG;NOM"
    assert readings(fin, "sadaskahdeskymmenes")[0][0] == "sadaskahdeskymmenes NUM;SG;NOM"
    # the cardinal 11 keeps its reading; parts in different cases, or -toista inflected, are no numeral
    assert readings(fin, "yhdessätoista")[0][0] == "yksitoista NUM;SG;IN+ESS"
    for word in ["kahdeskymmenennen", "kahdennenkymmenes", "yhdennessätoistassa", "yhdestoistassa"]:
        assert fin.analyze(word) == [], word


def test_compound_numerals_go_from_the_largest_part(fin: morphfst.Language) -> None:
    # Karlsson, Finnish: An Essential Grammar, the numerals (from memory): the parts of a number written
    # as one word go from the thousands to the units, cardinals with cardinals and ordinals with
    # ordinals, each part in the case of the whole
    for word, text in [
        ("sataviisikymmentä", "sataviisikymmentä NUM;SG;NOM"),
        ("kolmetuhattaneljäsataa", "kolmetuhattaneljäsataa NUM;SG;NOM"),
        ("kaksituhattakaksikymmentäneljä", "kaksituhattakaksikymmentäneljä NUM;SG;NOM"),
        ("kaksisataaviisikymmentätuhatta", "kaksisataaviisikymmentätuhatta NUM;SG;NOM"),
        ("tuhatyksi", "tuhatyksi NUM;SG;NOM"),
        ("satakymmenen", "satakymmenen NUM;SG;NOM"),
        ("kahdennessakymmenennessäkolmannessa", "kahdeskymmeneskolmas NUM;SG;IN+ESS"),
        ("kolmassadas", "kolmassadas NUM;SG;NOM"),
        ("sadaskahdeskymmenes", "sadaskahdeskymmenes NUM;SG;NOM"),
        # an ordinal before a round cardinal: the range below it (kolmattakymmentä 'twenty odd')
        ("kolmannellesadalle", "kolmassata NUM;SG;AT+ALL"),
    ]:
        assert readings(fin, word)[0][0] == text, word
    # a unit before another part, parts out of order, a part twice, an ordinal with a cardinal
    # (common practice): no numeral
    for word in [
        "kolmeneljä",
        "kymmenentuhat",
        "kaksikymmenenkolme",
        "toinenkymmenes",
        "kaksikymmentäkolmekymmentä",
        "kaksisataakolmesataa",
        "kaksikymmentäkymmenentuhatta",
        "satakolmas",
    ]:
        assert fin.analyze(word) == [], word


def test_both_parts_of_a_compound_ordinal_are_split(fin: morphfst.Language) -> None:
    # the second part of kolmaskymmenes is an ordinal in the case of the whole, segmented like the first
    # (Karlsson, numerals, from memory)
    assert readings(fin, "kolmannessakymmenennessä")[0] == ("kolmaskymmenes NUM;SG;IN+ESS", "kolmanne-ssa-kymmenenne-ssä")
    assert readings(fin, "kahdennenkymmenennen")[0] == ("kahdeskymmenes NUM;SG;GEN", "kahdenne-n-kymmenenne-n")
    assert readings(fin, "kahdettakymmenettä")[0] == ("kahdeskymmenes NUM;SG;PRT", "kahdet-ta-kymmenet-tä")
    assert readings(fin, "kahdeskymmenes")[0] == ("kahdeskymmenes NUM;SG;NOM", "kahdes-kymmenes")


def test_a_multiplier_before_tuhat(fin: morphfst.Language) -> None:
    # a multiplier before tuhat is written as one word, both parts in the case of the whole and tuhat
    # a partitive in the nominative (common practice): kymmenentuhatta, kahdessakymmenessätuhannessa
    assert readings(fin, "kymmenentuhatta")[0][0] == "kymmenentuhatta NUM;SG;NOM"
    assert readings(fin, "kymmenentuhannen")[0][0] == "kymmenentuhatta NUM;SG;GEN"
    assert readings(fin, "neljäkymmentätuhatta")[0][0] == "neljäkymmentätuhatta NUM;SG;NOM"
    assert readings(fin, "kahdessakymmenessätuhannessa")[0][0] == "kaksikymmentätuhatta NUM;SG;IN+ESS"
    assert readings(fin, "sadassatuhannessa")[0][0] == "satatuhatta NUM;SG;IN+ESS"
    assert readings(fin, "viidensadantuhannen")[0][0] == "viisisataatuhatta NUM;SG;GEN"
    assert readings(fin, "viidessätoistatuhannessa")[0][0] == "viisitoistatuhatta NUM;SG;IN+ESS"
    # the units before them through the compound numeral block (kaksikymmentäviisituhatta)
    assert readings(fin, "kaksikymmentäviisituhatta")[0][0] == "kaksikymmentäviisituhatta NUM;SG;NOM"
    # parts in different cases are no numeral (common practice)
    for word in ["kymmenessätuhatta", "neljäkymmentätuhannen", "kahdessakymmenessätuhatta", "sadantuhatta"]:
        assert fin.analyze(word) == [], word


def test_adjective_first_parts(fin: morphfst.Language) -> None:
    # an adjective in the nominative before a noun (KARLSSON; autio 'deserted' and talo are listed,
    # autiotalo is not), at a heavier seam than a noun's
    assert readings(fin, "autiotalossa")[0] == ("autiotalo N;SG;IN+ESS", "autio-talo-ssa")
    assert fin.analyze("autiotalossa")[0].weight > fin.analyze("kirjastoautossa")[0].weight


def test_info_lists_the_compound_block(fin: morphfst.Language, capsys: pytest.CaptureFixture[str]) -> None:
    from morphfst.cli import main

    assert main(["info", "-l", fin.path or "fin"]) == 0
    out = capsys.readouterr().out
    assert "compounds (analysis only):" in out
    block = fin.meta["compounds"][0]
    assert block["parts"] == 3 and block["min"] == 3 and ["SG", "NOM"] in block["forms"]


def test_an_adjective_last_part_follows_one_first_part_only(fin: morphfst.Language) -> None:
    # common practice: a two-part compound may end in an adjective (verovapaa), but a third part does
    # not split the -UUs noun of a compound (muotiteollisuuden: muoti + teollisuus, not muoti +
    # teollis- + uusi)
    assert not [a for a in fin.analyze("muotiteollisuuden") if a.lemma == "muotiteollisuusi"]
    assert fin.analyze("muotiteollisuuden")[0].text == "muotiteollisuus N;SG;GEN"
    assert "verovapaa ADJ;SG;NOM" in {a.text for a in fin.analyze("verovapaa")}

"""The Finnish fragment against handbook forms.

Source for the expected forms: Karlsson, F., Finnish: An Essential Grammar (3rd ed., Routledge,
2018), the chapters on vowel harmony, consonant gradation, the noun cases and their plural, the
possessive suffixes, and the present tense, past tense and imperative of verbs. Every value below was written from memory of
those tables, not copied from the book; checks that rest on no single source say "common practice".
The grammar is compiled once per test session (the ``fin`` fixture of conftest.py).
"""

from __future__ import annotations

import pytest

import morphfst
from morphfst import debug
from morphfst.layout import arrange
from morphfst.paradigm import make_bound, paradigms

KARLSSON = "Karlsson, Finnish: An Essential Grammar (3rd ed., 2018)"

CASES = ["NOM", "GEN", "PRT", "ESS", "TRANS", "IN+ESS", "IN+ABL", "IN+ALL", "AT+ESS", "AT+ABL", "AT+ALL"]


def table(lemma: str, number: str, forms: str) -> list[tuple[str, str, str]]:
    """One number of a noun paradigm, the eleven forms in the order of CASES."""
    words = forms.split()
    assert len(words) == len(CASES)
    return [(lemma, f"N;{number};{case}", word) for case, word in zip(CASES, words)]


# Full noun paradigms, cases in the order NOM GEN PRT ESS TRANS INE ELA ILL ADE ABL ALL.
PARADIGMS = (
    # Karlsson, Finnish: An Essential Grammar (3rd ed., 2018), noun inflection tables — from memory
    # back harmony, o-stem, no gradation; plural i becomes j between vowels
    table("talo", "SG", "talo talon taloa talona taloksi talossa talosta taloon talolla talolta talolle")
    + table("talo", "PL", "talot talojen taloja taloina taloiksi taloissa taloista taloihin taloilla taloilta taloille")
    # Karlsson (3rd ed., 2018), consonant gradation t : d — from memory
    + table("katu", "SG", "katu kadun katua katuna kaduksi kadussa kadusta katuun kadulla kadulta kadulle")
    + table("katu", "PL", "kadut katujen katuja katuina kaduiksi kaduissa kaduista katuihin kaduilla kaduilta kaduille")
    # Karlsson (3rd ed., 2018), e-stems (kivi : kive-) and front harmony — from memory
    + table("kivi", "SG", "kivi kiven kiveä kivenä kiveksi kivessä kivestä kiveen kivellä kiveltä kivelle")
    + table("kivi", "PL", "kivet kivien kiviä kivinä kiviksi kivissä kivistä kiviin kivillä kiviltä kiville")
    # Karlsson (3rd ed., 2018), e-stems with t : d : s and a consonant-stem partitive — from memory
    + table("käsi", "SG", "käsi käden kättä kätenä kädeksi kädessä kädestä käteen kädellä kädeltä kädelle")
    + table("käsi", "PL", "kädet käsien käsiä käsinä käsiksi käsissä käsistä käsiin käsillä käsiltä käsille")
    # Karlsson (3rd ed., 2018), gradation tt : t with front harmony — from memory
    + table("tyttö", "SG", "tyttö tytön tyttöä tyttönä tytöksi tytössä tytöstä tyttöön tytöllä tytöltä tytölle")
    + table("tyttö", "PL", "tytöt tyttöjen tyttöjä tyttöinä tytöiksi tytöissä tytöistä tyttöihin tytöillä tytöiltä tytöille")
    # Karlsson (3rd ed., 2018), gradation pp : p and the plural a : o — from memory
    + table("kauppa", "SG", "kauppa kaupan kauppaa kauppana kaupaksi kaupassa kaupasta kauppaan kaupalla kaupalta kaupalle")
    + table(
        "kauppa",
        "PL",
        "kaupat kauppojen kauppoja kauppoina kaupoiksi kaupoissa kaupoista kauppoihin kaupoilla kaupoilta kaupoille",
    )
    # Karlsson (3rd ed., 2018), gradation nt : nn — from memory
    + table("ranta", "SG", "ranta rannan rantaa rantana rannaksi rannassa rannasta rantaan rannalla rannalta rannalle")
    + table(
        "ranta", "PL", "rannat rantojen rantoja rantoina rannoiksi rannoissa rannoista rantoihin rannoilla rannoilta rannoille"
    )
    # Karlsson (3rd ed., 2018), gradation nk : ng and the plural ä : ∅ — from memory
    + table("kenkä", "SG", "kenkä kengän kenkää kenkänä kengäksi kengässä kengästä kenkään kengällä kengältä kengälle")
    + table("kenkä", "PL", "kengät kenkien kenkiä kenkinä kengiksi kengissä kengistä kenkiin kengillä kengiltä kengille")
    # Karlsson (3rd ed., 2018), gradation k : ∅ in an e-stem — from memory
    + table("joki", "SG", "joki joen jokea jokena joeksi joessa joesta jokeen joella joelta joelle")
    + table("joki", "PL", "joet jokien jokia jokina joiksi joissa joista jokiin joilla joilta joille")
    # Karlsson (3rd ed., 2018), gradation mp : mm in an e-stem — from memory
    + table("lampi", "SG", "lampi lammen lampea lampena lammeksi lammessa lammesta lampeen lammella lammelta lammelle")
    + table("lampi", "PL", "lammet lampien lampia lampina lammiksi lammissa lammista lampiin lammilla lammilta lammille")
    # Karlsson (3rd ed., 2018), nouns in -e with a lengthened stem vowel; illative -seen, -siin — from memory
    + table(
        "huone", "SG", "huone huoneen huonetta huoneena huoneeksi huoneessa huoneesta huoneeseen huoneella huoneelta huoneelle"
    )
    + table(
        "huone",
        "PL",
        "huoneet huoneiden huoneita huoneina huoneiksi huoneissa huoneista huoneisiin huoneilla huoneilta huoneille",
    )
    # Karlsson (3rd ed., 2018), one-syllable long vowels; illative -hVn, partitive -tA — from memory
    + table("maa", "SG", "maa maan maata maana maaksi maassa maasta maahan maalla maalta maalle")
    + table("maa", "PL", "maat maiden maita maina maiksi maissa maista maihin mailla mailta maille")
    # Karlsson (3rd ed., 2018), diphthong ie shortening to e in the plural — from memory
    + table("tie", "SG", "tie tien tietä tienä tieksi tiessä tiestä tiehen tiellä tieltä tielle")
    + table("tie", "PL", "tiet teiden teitä teinä teiksi teissä teistä teihin teillä teiltä teille")
    # Karlsson (3rd ed., 2018), i-stems: i becomes e before the plural i — from memory
    + table("tunti", "SG", "tunti tunnin tuntia tuntina tunniksi tunnissa tunnista tuntiin tunnilla tunnilta tunnille")
    + table(
        "tunti", "PL", "tunnit tuntien tunteja tunteina tunneiksi tunneissa tunneista tunteihin tunneilla tunneilta tunneille"
    )
)

# Single cells of other stem types.
CELLS = [
    # Karlsson (3rd ed., 2018), the plural of a-stems: a drops after a rounded first vowel — from memory
    ("koira", "N;PL;PRT", "koiria"),
    ("koira", "N;PL;GEN", "koirien"),
    ("koira", "N;PL;IN+ALL", "koiriin"),
    ("kukka", "N;PL;IN+ESS", "kukissa"),
    ("kukka", "N;SG;GEN", "kukan"),  # kk : k
    # ... else it becomes o — from memory
    ("kala", "N;PL;IN+ESS", "kaloissa"),
    ("kissa", "N;PL;PRT", "kissoja"),
    ("ilta", "N;SG;AT+ESS", "illalla"),  # lt : ll
    ("ilta", "N;PL;PRT", "iltoja"),
    ("kerta", "N;SG;GEN", "kerran"),  # rt : rr
    ("tapa", "N;SG;IN+ESS", "tavassa"),  # p : v
    ("tapa", "N;SG;PRT", "tapaa"),
    ("jalka", "N;SG;GEN", "jalan"),  # k : ∅
    ("jalka", "N;PL;IN+ESS", "jaloissa"),
    ("leipä", "N;SG;GEN", "leivän"),  # p : v, front
    ("pöytä", "N;PL;IN+ESS", "pöydissä"),  # t : d, ä : ∅
    ("pöytä", "N;PL;PRT", "pöytiä"),
    ("lintu", "N;SG;GEN", "linnun"),  # nt : nn
    ("sänky", "N;SG;IN+ESS", "sängyssä"),  # nk : ng, front
    ("hattu", "N;SG;IN+ESS", "hatussa"),  # tt : t
    ("vesi", "N;SG;GEN", "veden"),
    ("vesi", "N;SG;PRT", "vettä"),
    ("vesi", "N;PL;IN+ESS", "vesissä"),
    ("mäki", "N;SG;IN+ESS", "mäessä"),
    ("äiti", "N;SG;GEN", "äidin"),
    ("äiti", "N;PL;PRT", "äitejä"),
    ("pankki", "N;PL;GEN", "pankkien"),
    ("päivä", "N;PL;PRT", "päiviä"),
    ("kirje", "N;SG;PRT", "kirjettä"),
    ("kirje", "N;SG;IN+ALL", "kirjeeseen"),
    ("puu", "N;SG;IN+ALL", "puuhun"),
    ("työ", "N;SG;IN+ALL", "työhön"),
    ("työ", "N;PL;IN+ESS", "töissä"),
    ("yö", "N;PL;AT+ESS", "öillä"),
    # Karlsson (3rd ed., 2018), possessive suffixes: the case-final n and t drop, -ksi becomes -kse,
    # the third person is -Vn after a short vowel of a case ending — from memory
    ("talo", "N;SG;IN+ESS;PSS1S", "talossani"),
    ("talo", "N;SG;NOM;PSS2S", "talosi"),
    ("talo", "N;SG;IN+ESS;PSS3S", "talossaan"),
    ("talo", "N;SG;NOM;PSS3S", "talonsa"),
    ("talo", "N;SG;IN+ALL;PSS1S", "talooni"),
    ("talo", "N;PL;GEN;PSS1P", "talojemme"),
    ("talo", "N;SG;TRANS;PSS1S", "talokseni"),
    ("katu", "N;SG;NOM;PSS1S", "katuni"),  # the possessive keeps the strong grade
    ("katu", "N;SG;AT+ESS;PSS1S", "kadullani"),
    ("käsi", "N;SG;NOM;PSS1P", "kätemme"),
    ("käsi", "N;SG;IN+ESS;PSS3S", "kädessään"),
    ("jalka", "N;SG;PRT;PSS3S", "jalkaansa"),  # -nsA after a long vowel
    ("kivi", "N;PL;IN+ESS;PSS2P", "kivissänne"),
    ("huone", "N;SG;NOM;PSS1S", "huoneeni"),
    # Karlsson (3rd ed., 2018), verb type 1 present tense and gradation — from memory
    ("puhua", "V;IND;PRS;1;SG", "puhun"),
    ("puhua", "V;IND;PRS;3;SG", "puhuu"),
    ("puhua", "V;IND;PRS;3;PL", "puhuvat"),
    ("ottaa", "V;IND;PRS;1;SG", "otan"),
    ("ottaa", "V;IND;PRS;3;SG", "ottaa"),
    ("ottaa", "V;IND;PRS;1;PL", "otamme"),
    ("lukea", "V;IND;PRS;1;SG", "luen"),
    ("lukea", "V;IND;PRS;3;SG", "lukee"),
    ("antaa", "V;IND;PRS;2;PL", "annatte"),
    ("kertoa", "V;IND;PRS;1;SG", "kerron"),
    ("tietää", "V;IND;PRS;1;SG", "tiedän"),
    ("tietää", "V;IND;PRS;3;PL", "tietävät"),
    ("kysyä", "V;NFIN", "kysyä"),
    # ... the past active participle -nUt and the third person imperative -kOOn — from memory
    ("puhua", "V;V.PTCP;ACT;PST", "puhunut"),
    ("kysyä", "V;V.PTCP;ACT;PST", "kysynyt"),
    ("lähteä", "V;V.PTCP;ACT;PST", "lähtenyt"),
    ("sanoa", "V;IMP;3;SG", "sanokoon"),
    ("tietää", "V;IMP;3;SG", "tietäköön"),
    # Karlsson (3rd ed., 2018), the past tense: the stem changes before -i- as a noun stem before the
    # plural -i- (a drops after o/u in the first syllable, else becomes o; e and i drop, t : s in
    # tietää), and gradation as in the present — from memory
    ("ottaa", "V;IND;PST;1;SG", "otin"),
    ("ottaa", "V;IND;PST;3;SG", "otti"),
    ("ottaa", "V;IND;PST;3;PL", "ottivat"),
    ("ostaa", "V;IND;PST;3;SG", "osti"),
    ("antaa", "V;IND;PST;1;SG", "annoin"),
    ("antaa", "V;IND;PST;3;SG", "antoi"),
    ("puhua", "V;IND;PST;1;PL", "puhuimme"),
    ("sanoa", "V;IND;PST;3;SG", "sanoi"),
    ("kysyä", "V;IND;PST;3;PL", "kysyivät"),
    ("nukkua", "V;IND;PST;1;SG", "nukuin"),
    ("nukkua", "V;IND;PST;3;SG", "nukkui"),
    ("kertoa", "V;IND;PST;2;SG", "kerroit"),
    ("lukea", "V;IND;PST;1;SG", "luin"),
    ("lukea", "V;IND;PST;3;SG", "luki"),
    ("lähteä", "V;IND;PST;2;PL", "lähditte"),
    ("oppia", "V;IND;PST;3;SG", "oppi"),
    ("tietää", "V;IND;PST;1;SG", "tiesin"),
    ("tietää", "V;IND;PST;3;SG", "tiesi"),
    # ... the imperative: the second person singular has the weak grade, the others -kAA-, -kOOn,
    # -kOOt with the strong grade — from memory
    ("ottaa", "V;IMP;2;SG", "ota"),
    ("lukea", "V;IMP;2;SG", "lue"),
    ("antaa", "V;IMP;2;SG", "anna"),
    ("tietää", "V;IMP;2;SG", "tiedä"),
    ("puhua", "V;IMP;2;SG", "puhu"),
    ("ottaa", "V;IMP;1;PL", "ottakaamme"),
    ("ottaa", "V;IMP;2;PL", "ottakaa"),
    ("tietää", "V;IMP;2;PL", "tietäkää"),
    ("ottaa", "V;IMP;3;PL", "ottakoot"),
    ("kysyä", "V;IMP;3;PL", "kysykööt"),
    # Karlsson (3rd ed., 2018), possessive suffixes after the illative, the allative and a plural
    # case — from memory
    ("talo", "N;SG;IN+ALL;PSS3S", "taloonsa"),
    ("talo", "N;SG;AT+ALL;PSS3S", "talolleen"),
    ("talo", "N;PL;IN+ESS;PSS3P", "taloissaan"),
    ("huone", "N;SG;IN+ALL;PSS3S", "huoneeseensa"),
    ("kivi", "N;SG;PRT;PSS3S", "kiveään"),
    ("käsi", "N;SG;PRT;PSS3S", "kättään"),
    ("kala", "N;SG;PRT;PSS3S", "kalaansa"),  # not *kalaaan
]

ALL = PARADIGMS + CELLS


@pytest.mark.parametrize("lemma, features, surface", ALL)
def test_generation_matches_the_handbook(fin: morphfst.Language, lemma: str, features: str, surface: str) -> None:
    forms = [f.form for f in fin.generate(lemma, features)]
    assert forms and forms[0] == surface, forms


@pytest.mark.parametrize("lemma, features, surface", ALL)
def test_analysis_matches_the_handbook(fin: morphfst.Language, lemma: str, features: str, surface: str) -> None:
    assert f"{lemma} {features}" in [a.text for a in fin.analyze(surface)]


# Wrong forms: gradation in the wrong syllable, broken harmony, wrong allomorph.
# Karlsson (3rd ed., 2018), gradation and harmony chapters — from memory
WRONG = [
    "katussa",  # strong grade before a closed syllable (kadussa)
    "kadua",  # weak grade before an open syllable (katua)
    "kaduun",  # the illative keeps the strong grade (katuun)
    "tyttössä",  # tytössä
    "kengässa",  # harmony: kengässä
    "talossä",  # harmony: talossa
    "taloissä",
    "kivissa",  # neutral vowels only: front (kivissä)
    "kivejä",  # e-stem plural: kiviä
    "kätessä",  # kädessä
    "kätiä",  # käsiä
    "kalaissa",  # kaloissa
    "koiroja",  # koiria
    "maaan",  # maahan
    "taloohon",  # taloon
    "huoneessen",  # huoneeseen
    "huonetä",  # huonetta
    "tieissä",  # teissä
    "jojen",  # jokien: i-e is not a diphthong, so the syllable is open
    "pöydien",  # pöytien
    "pankeja",  # pankkeja
    "talonni",  # the genitive n drops before a possessive: taloni
    "jalkaaan",  # jalkaansa
    "ottan",  # otan
    "kysynut",  # harmony: kysynyt
    "tietäkoon",  # harmony: tietäköön
    "ottin",  # weak grade in the closed syllable: otin
    "oti",  # strong grade in the open syllable: otti
    "lukin",  # luin
    "tiedin",  # tiesin
    "antain",  # annoin
    "kysyivat",  # harmony: kysyivät
    "otta",  # the imperative has the weak grade: ota
    "ottakoo",  # ottakoon, ottakoot
    "kalaaan",  # kalaansa
    "öihiin",  # öihin
    "yöihin",  # öihin
]


@pytest.mark.parametrize("word", WRONG)
def test_wrong_forms_are_rejected(fin: morphfst.Language, word: str) -> None:
    assert fin.analyze(word) == []


# common practice: the strong grade before an open syllable, the weak grade before a closed one
GRADATION_PAIRS = [
    ("katu", "katua", "kadun"),
    ("kauppa", "kauppaa", "kaupan"),
    ("tyttö", "tyttöä", "tytön"),
    ("kukka", "kukkaa", "kukan"),
    ("jalka", "jalkaa", "jalan"),
    ("tapa", "tapaa", "tavan"),
    ("ranta", "rantaa", "rannan"),
    ("lampi", "lampea", "lammen"),
    ("kenkä", "kenkää", "kengän"),
    ("ilta", "iltaa", "illan"),
    ("kerta", "kertaa", "kerran"),
]


@pytest.mark.parametrize("lemma, strong, weak", GRADATION_PAIRS)
def test_gradation_follows_the_next_syllable(fin: morphfst.Language, lemma: str, strong: str, weak: str) -> None:
    assert [f.form for f in fin.generate(lemma, "N;SG;PRT")][0] == strong
    assert [f.form for f in fin.generate(lemma, "N;SG;GEN")][0] == weak
    # and the opposite grades are rejected: *katun, *kadua
    assert fin.analyze(strong[:-1] + "n") == []
    assert fin.analyze(weak[:-1] + strong[-1]) == []


def test_every_noun_has_one_form_per_cell(fin: morphfst.Language) -> None:
    # common practice: a regular noun has one standard form in each of the 22 number-case cells
    nouns = [e["lemma"] for e in fin.lexicon if e["pos"] == "N"]
    assert 20 <= len(nouns) <= 45
    for lemma in nouns:
        for number in ("SG", "PL"):
            for case in CASES:
                forms = [f.form for f in fin.generate(lemma, f"N;{number};{case}")]
                assert len(forms) == 1, (lemma, number, case, forms)


def test_harmony_follows_the_stem(fin: morphfst.Language) -> None:
    # common practice: back if the stem has a, o or u, else front (e and i are neutral)
    assert [f.form for f in fin.generate("talo", "N;SG;IN+ESS")] == ["talossa"]
    assert [f.form for f in fin.generate("kylä", "N;SG;IN+ESS")] == ["kylässä"]
    assert [f.form for f in fin.generate("kivi", "N;SG;IN+ESS")] == ["kivessä"]
    assert [f.form for f in fin.generate("joki", "N;SG;IN+ESS")] == ["joessa"]
    assert [f.form for f in fin.generate("nukkua", "V;V.PTCP;ACT;PST")] == ["nukkunut"]
    assert [f.form for f in fin.generate("kertoa", "V;IMP;3;SG")] == ["kertokoon"]


def test_syncretism_of_the_possessive(fin: morphfst.Language) -> None:
    # Karlsson (3rd ed., 2018), possessive suffixes — from memory: nominative and genitive singular
    # and nominative plural all give taloni
    texts = {a.text for a in fin.analyze("taloni")}
    assert texts == {"talo N;SG;NOM;PSS1S", "talo N;SG;GEN;PSS1S", "talo N;PL;NOM;PSS1S"}
    # -nsA after a short vowel is the less usual variant: generated, but after -Vn
    assert [f.form for f in fin.generate("talo", "N;SG;IN+ESS;PSS3S")] == ["talossaan", "talossansa"]


def test_segmentation_gloss_and_ud(fin: morphfst.Language) -> None:
    best = fin.analyze("kaduissa")[0]
    assert best.text == "katu N;PL;IN+ESS"
    assert best.segmentation == "kadu-i-ssa"
    assert best.gloss == "street-PL-INE"
    assert best.ud_feats() == "Case=Ine|Number=Plur"
    # common practice: UD Finnish case names for the UniMorph labels
    expected = {
        "NOM": "Case=Nom",
        "GEN": "Case=Gen",
        "PRT": "Case=Par",
        "ESS": "Case=Ess",
        "TRANS": "Case=Tra",
        "IN+ESS": "Case=Ine",
        "IN+ABL": "Case=Ela",
        "IN+ALL": "Case=Ill",
        "AT+ESS": "Case=Ade",
        "AT+ABL": "Case=Abl",
        "AT+ALL": "Case=All",
        "SG": "Number=Sing",
        "PL": "Number=Plur",
        "N": "NOUN",
    }
    for label, value in expected.items():
        assert fin.ud[label] == value
    assert fin.analyze("huoneeseen")[0].segmentation == "huonee-seen"
    assert fin.analyze("kättä")[0].segmentation == "kät-tä"


def test_lowercase_normalization(fin: morphfst.Language) -> None:
    assert fin.normalize("TALOSSA") == "talossa"
    assert [a.text for a in fin.analyze("Kädessä")] == ["käsi N;SG;IN+ESS"]


def test_inline_tests_of_the_grammar(fin: morphfst.Language) -> None:
    cases = fin.meta["tests"]
    assert {c["kind"] for c in cases} == {"analyze", "exact", "generate", "reject"}
    for case in cases:
        if case["kind"] == "reject":
            assert fin.analyze(case["word"]) == [], case
        elif case["kind"] == "generate":
            lemma, _, feats = case["word"].rpartition(" ")
            assert [f.form for f in fin.generate(lemma, feats)][: len(case["expected"])] == case["expected"], case
        else:
            texts = {a.text for a in fin.analyze(case["word"])}
            if case["kind"] == "exact":
                assert texts == set(case["expected"]), case
            else:
                assert set(case["expected"]) <= texts, case


def test_every_verb_has_one_form_per_cell(fin: morphfst.Language) -> None:
    # common practice: a regular verb of the puhua type has one standard form in each of these cells
    cells = ["V;NFIN", "V;V.PTCP;ACT;PST"]
    cells += [f"V;IND;{tense};{person};{number}" for tense in ("PRS", "PST") for number in ("SG", "PL") for person in "123"]
    cells += ["V;IMP;2;SG", "V;IMP;3;SG", "V;IMP;1;PL", "V;IMP;2;PL", "V;IMP;3;PL"]
    verbs = [e["lemma"] for e in fin.lexicon if e["pos"] == "V"]
    assert len(verbs) >= 10
    for lemma in verbs:
        for cell in cells:
            forms = [f.form for f in fin.generate(lemma, cell)]
            assert len(forms) == 1, (lemma, cell, forms)


def test_imperative_third_person_number(fin: morphfst.Language) -> None:
    # Karlsson (3rd ed., 2018), the imperative — from memory: -kOOn is singular, -kOOt plural
    assert {a.text for a in fin.analyze("puhukoon")} == {"puhua V;IMP;3;SG"}
    assert {a.text for a in fin.analyze("puhukoot")} == {"puhua V;IMP;3;PL"}


def test_conjugation_layout(fin: morphfst.Language) -> None:
    # common practice of grammar books: persons down (singular 1-2-3, plural 1-2-3), the present and the
    # past indicative across, the imperative in a table of its own, the non-finite forms listed apart
    (reading,) = paradigms(fin, "ottaa", make_bound(fin, 0), "V")
    sections = arrange(reading, fin.meta).sections
    indicative = sections[0].grids[0]
    assert indicative.row_dims == ["Number", "Person"]
    assert indicative.rows == ["1st singular", "2nd singular", "3rd singular", "1st plural", "2nd plural", "3rd plural"]
    assert indicative.columns == ["present", "past"]
    assert [row[1].forms[0].form for row in indicative.cells if row[1] is not None] == [
        "otin",
        "otit",
        "otti",
        "otimme",
        "otitte",
        "ottivat",
    ]
    imperative = sections[1].grids[0]
    assert [row[0].forms[0].form for row in imperative.cells if row[0] is not None] == [
        "ota",
        "ottakoon",
        "ottakaamme",
        "ottakaa",
        "ottakoot",
    ]
    listed = {c.features for s in sections[2:] for g in s.grids for row in g.cells for c in row if c is not None}
    assert listed == {"V;NFIN", "V;V.PTCP;ACT;PST"}


def test_lint_and_coverage_of_the_grammar(fin: morphfst.Language) -> None:
    # The grammar resolves every archiphoneme on every path (no path is dropped silently), and its
    # inline tests pass, fire every rule and exercise every affix.
    report = debug.lint(fin)
    assert [f.message for f in report.findings] == []
    tests = debug.run_tests(fin)
    assert tests.exit_code == 0
    assert tests.coverage is not None
    assert tests.coverage.rules_never == [] and tests.coverage.affixes_never == [] and tests.coverage.slots_never == []


def test_guessed_nouns(fin: morphfst.Language) -> None:
    # Unknown words: kahvila 'cafe', pöllö 'owl', radio and paperi are not in the lexicon; their forms
    # are regular (from memory).
    assert fin.analyze("kahvilassa") == []
    best = fin.guess("kahvilassa")[0]
    assert best.guessed and best.text == "kahvila N;SG;IN+ESS" and best.segmentation == "kahvila-ssa"
    assert fin.analyze("kahvilassa", guess=True)[0].text == "kahvila N;SG;IN+ESS"
    assert "kahvila N;PL;IN+ESS" in [g.text for g in fin.guess("kahviloissa")]
    assert fin.guess("pöllöllä")[0].text == "pöllö N;SG;AT+ESS"
    assert fin.guess("radioissa")[0].text == "radio N;PL;IN+ESS"
    assert fin.guess("paperista")[0].text == "paperi N;SG;IN+ABL"
    # common practice: guessed stems keep vowel harmony, so a back stem with a front ending is no
    # inessive, and a word without a vowel gets no guess
    assert all(g.text != "kahvila N;SG;IN+ESS" for g in fin.guess("kahvilassä"))
    assert fin.guess("kkk") == []
    # a word of the lexicon is never guessed
    assert fin.analyze("talossa", guess=True) == fin.analyze("talossa")

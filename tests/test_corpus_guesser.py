"""The guesser for unknown words (``guess`` patterns of classes) and the fast analysis path."""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import TOY_GRAMMAR, write_toy

import morphfst
from morphfst.compile.compiler import GUESS_OFFSET

GUESS_TOY = TOY_GRAMMAR.replace("noun pos N -> number", "noun pos N -> number guess @cons* @vowel [@vowel @cons]*")


@pytest.fixture(scope="module")
def toy(tmp_path_factory: pytest.TempPathFactory) -> morphfst.Language:
    assert GUESS_TOY != TOY_GRAMMAR
    return morphfst.load(write_toy(tmp_path_factory.mktemp("guess"), GUESS_TOY))


def test_guessed_analyses_rank_below_lexicon_analyses(toy: morphfst.Language) -> None:
    known = toy.analyze("kalar")
    assert [a.text for a in known] == ["ka N;PL;NOM"]
    assert not known[0].guessed
    guesses = toy.guess("kalar")
    assert guesses and all(g.guessed for g in guesses)
    assert min(g.weight for g in guesses) >= GUESS_OFFSET > max(a.weight for a in known)
    # The guesser is consulted only when the lexicon gives nothing.
    assert toy.analyze("kalar", guess=True) == known
    assert toy.fast.analyze("kalar", guess=True) == known


def test_an_unknown_word_gets_a_guessed_stem_and_the_same_rules(toy: morphfst.Language) -> None:
    assert toy.analyze("tiler") == []
    guesses = toy.analyze("tiler", guess=True)
    assert guesses[0].guessed
    assert guesses[0].text == "ti N;PL;NOM"  # the shortest stem the pattern allows, with a two-letter affix
    assert guesses[0].segmentation == "ti-ler"
    # Harmony still applies to guessed stems: a back-vowel plural cannot follow the front stem 'ti'.
    assert all(g.segmentation != "ti-lar" for g in toy.guess("tilar"))
    assert [g.text for g in toy.guess("tilar")][0] == "tilar N;SG;NOM"
    # Words the pattern cannot read (no vowel) get no guess.
    assert toy.guess("kktt") == []


def test_guessed_analyses_serialize_their_mark(toy: morphfst.Language) -> None:
    g = toy.guess("tiler")[0]
    assert g.to_dict()["guessed"] is True
    assert "guessed" not in toy.analyze("kalar")[0].to_dict()


def test_a_grammar_without_guess_patterns_guesses_nothing(tmp_path: Path) -> None:
    lang = morphfst.load(write_toy(tmp_path))
    assert "guesser" not in lang.fsts
    assert lang.guess("tiler") == []
    assert lang.analyze("tiler", guess=True) == []


def test_a_pattern_without_letters_is_a_user_error(tmp_path: Path) -> None:
    bad = TOY_GRAMMAR.replace("noun pos N -> number", "noun pos N -> number guess A A")
    with pytest.raises(morphfst.UserError, match="guess pattern matches no string of letters"):
        morphfst.load(write_toy(tmp_path, bad))


def test_fast_path_gives_the_runtime_analyses(tur: morphfst.Language) -> None:
    words = [
        "evlerde",
        "odalarda",
        "kitabı",
        "gözünü",
        "evinde",
        "odaya",
        "kitapta",
        "saatler",
        "topu",
        "Ankara'da",
        "kitapçılar",
        "evlerinden",
        "kitapçılıklarımızdan",
        "xyz",
        "",
        "ev ev",
        "çiçeği",
    ]
    for word in words:
        slow = [(a.text, a.segmentation, a.gloss, a.morphs, round(a.weight, 3)) for a in tur.analyze(word)]
        fast = [(a.text, a.segmentation, a.gloss, a.morphs, round(a.weight, 3)) for a in tur.fast.analyze(word)]
        assert fast == slow, word


def test_turkish_guesses_follow_the_grammar(tur: morphfst.Language) -> None:
    # 'kalemler' is not in the lexicon: a noun stem and the plural suffix are guessed; the
    # apostrophe marks the suffix boundary of an unknown proper name.
    assert "kalemler" not in {e["lemma"] for e in tur.lexicon}
    best = tur.guess("kalemler")[0]
    assert (best.lemma, best.segmentation, best.guessed) == ("kalem", "kalem-ler", True)
    name = tur.guess("Eskişehir'de")[0]  # a guessed name's lemma is written with the word's capitals
    assert (name.lemma, name.pos, name.features) == ("Eskişehir", "PROPN", ("SG", "LOC"))


@pytest.mark.parametrize(
    ("word", "segmentation", "text"),
    [
        # Loanwords not in the lexicon, with native suffixes (common practice: Turkish loans take the
        # regular plural, possessive and case suffixes by vowel harmony; Göksel & Kerslake, ch. 8 and 14)
        ("vlogunda", "vlog-u-nda", "vlog N;SG;PSS3S;LOC"),
        # (selfie has become a lexicon word: an invented stem of its shape, that no lexicon word takes)
        ("glorfielerimiz", "glorfie-ler-imiz", "glorfie N;PL;PSS1P;NOM"),
        # (kriptopara too)
        ("fırtoparalar", "fırtopara-lar", "fırtopara N;PL;NOM"),
        ("vlogcular", "vlogcu-lar", "vlogcu N;PL;NOM"),
        # verbs not in the lexicon: -lA verbs made from a loan (the stems invented), the aorist -Ar of a
        # root of one syllable (common practice: Göksel & Kerslake, ch. 8)
        ("glorplamışlar", "glorpla-mış-lar", "glorplamak V;NFH;3;PL"),
        ("fırzopluyoruz", "fırzoplu-yor-uz", "fırzoplamak V;PROG;1;PL"),
    ],
)
def test_the_first_guess_finds_the_suffixes_of_an_unknown_word(
    tur: morphfst.Language, word: str, segmentation: str, text: str
) -> None:
    assert not tur.analyze(word)
    first = tur.guess(word)[0]
    assert (first.segmentation, first.text) == (segmentation, text)


@pytest.mark.parametrize(
    ("word", "segmentation", "text"),
    [
        # Finnish loans inflect by the standard word list's types (from memory): a consonant-final
        # loan takes an -i stem as type 5 (podcast: podcastin, podcasteissa), -i nouns likewise
        # (meemi: meemeissä), -us nouns are type 39 (striimaus: striimauksen), -ata verbs type 73
        # (tiktokkata: tiktokkaamassa, the third infinitive's inessive). The stems are invented,
        # shaped like those loans, so that no lexicon word ever takes them (podcast and striimaus
        # have become lexicon words)
        ("trabcasteissa", "trabcaste-i-ssa", "trabcast N;PL;IN+ESS"),
        ("glorppauksen", "glorppaukse-n", "glorppaus N;SG;GEN"),
        ("plonkkaamassa", "plonkkaa-massa", "plonkkata V;NFIN;INF3;IN+ESS"),
        # more of those types (from memory): -in nouns type 33 (puhelin: puhelimen), -uus/-yys/-eus/-eys
        # type 40 (korkeus: korkeuden), -e nouns type 48 (kirje: kirjeen), -io type 3 (organisaatio:
        # organisaation), -ia type 12 (biologia: biologiaa), -as/-äs type 41 (vieras: vieraan)
        ("kraapimen", "kraapime-n", "kraapin N;SG;GEN"),
        ("rötkeyden", "rötkeyde-n", "rötkeys N;SG;GEN"),
        ("vörjeen", "vörjee-n", "vörje N;SG;GEN"),
        ("valisaation", "valisaatio-n", "valisaatio N;SG;GEN"),
        ("kalsologiaa", "kalsologia-a", "kalsologia N;SG;PRT"),
    ],
)
def test_the_first_finnish_guess_finds_the_inflection_type(
    fin: morphfst.Language, word: str, segmentation: str, text: str
) -> None:
    assert not fin.analyze(word)
    first = fin.guess(word)[0]
    assert (first.segmentation, first.text) == (segmentation, text)


@pytest.mark.parametrize(
    ("lemma", "features", "form"),
    [
        # generated as guessed, by the same types (from memory; invented stems as above)
        ("kraapin", "N;PL;PRT", "kraapimia"),
        ("rötkeys", "N;SG;GEN", "rötkeyden"),
        ("tölväs", "ADJ;SG;GEN", "tölvään"),
        ("valisaatio", "N;PL;PRT", "valisaatioita"),
        ("glorppaus", "N;SG;GEN", "glorppauksen"),
    ],
)
def test_finnish_lemmas_the_lexicon_lacks_are_generated_by_their_guessed_type(
    fin: morphfst.Language, lemma: str, features: str, form: str
) -> None:
    assert not fin.generate(lemma, features)
    assert [f.form for f in fin.generate(lemma, features, guess=True)][:1] == [form]


def test_a_new_word_is_guessed_a_noun_before_an_adjective(tur: morphfst.Language) -> None:
    # The guess prior (Compiler.guess_priors): the Turkish lexicon lists about three nouns for each
    # adjective, so a bare unknown word is a noun first; before, the two tied and the analysis text
    # ranked the adjective first. The adjective reading is still there, a little dearer.
    for word in ["fırzopluk", "glorfi"]:
        guesses = tur.guess(word)
        assert guesses[0].pos == "N", word
        adjective = [g for g in guesses if g.pos == "ADJ" and g.segmentation == guesses[0].segmentation]
        assert adjective and adjective[0].weight > guesses[0].weight, word


def test_guess_priors_follow_the_lexicon_shares() -> None:
    from morphfst.compile.compiler import Compiler
    from morphfst.compile.loader import load_model

    root = Path(__file__).resolve().parent.parent
    tur = Compiler(load_model(root / "grammars" / "tur.mfg")).guess_priors()
    # classes of one part of speech: more nouns than adjectives than verbs in the lexicon, a lower
    # prior for each, the commonest 0
    assert tur[("noun", "N")] == 0.0
    assert tur[("noun", "N")] < tur[("adj", "ADJ")] < tur[("verb", "V")]
    fin = Compiler(load_model(root / "grammars" / "fin.mfg")).guess_priors()
    # a class of two: the Finnish -nen words (type 38) are mostly adjectives; the gradating and the
    # plain noun types weigh alike (their order is the grammar's)
    assert fin[("guess38", "ADJ")] == 0.0 < fin[("guess38", "N")]
    assert fin[("guess1", "N")] == fin[("guess1A", "N")] == 0.0


def test_a_finnish_nen_word_is_guessed_an_adjective_first(fin: morphfst.Language) -> None:
    # common practice: the -inen words of type 38 are mostly adjectives (the stem invented)
    first = fin.guess("tromppiselle")[0]
    assert (first.lemma, first.pos) == ("tromppinen", "ADJ")

"""Guessed compounds: a first part the lexicon lacks before a word it has (FastAnalyzer.compound_guesses).

The first part *sorbu* is made up for these tests (the test checks that the lexicon lacks it): what
is checked against the language are the last parts' forms, each with its source."""

from __future__ import annotations

import morphfst
from morphfst.compile.guessweights import GUESS_OFFSET

FIRST = "sorbu"  # invented first part (mechanism test data)


def test_the_first_part_is_unknown(fin: morphfst.Language) -> None:
    assert fin.analyze(FIRST) == []
    assert fin.analyze(FIRST + "kaupungin") == []


def test_an_unknown_first_part_before_a_known_noun_takes_its_lemma_and_gradation(fin: morphfst.Language) -> None:
    # kaupunki 'town', genitive kaupungin (k : g gradation; common practice)
    best = fin.guess(FIRST + "kaupungin")[0]
    assert (best.lemma, best.pos, best.features) == (FIRST + "kaupunki", "N", ("SG", "GEN"))
    assert best.segmentation == f"{FIRST}-kaupungi-n"
    assert best.guessed and best.weight >= GUESS_OFFSET
    assert best.morphs[0].form == FIRST and best.morphs[0].gloss == FIRST
    # yliopisto 'university', adessive yliopistolla (from memory)
    best = fin.guess(FIRST + "yliopistolla")[0]
    assert (best.lemma, best.segmentation) == (FIRST + "yliopisto", f"{FIRST}-yliopisto-lla")


def test_a_short_last_part_weighs_about_what_its_letters_guessed_weigh(fin: morphfst.Language) -> None:
    # A last part of four or five letters weighs about what as many guessed letters weigh, so the
    # compound reading stands beside the guessed stems; both give the lemma. asema 'station', adessive
    # asemalla; työ 'work', partitive työtä (from memory)
    for word, lemma, segmentation in [("asemalla", "asema", "asema-lla"), ("työtä", "työ", "työ-tä")]:
        found = fin.fast.compound_guesses(FIRST + word)
        assert (found[0].lemma, found[0].segmentation) == (FIRST + lemma, f"{FIRST}-{segmentation}")
        assert fin.guess(FIRST + word)[0].lemma == FIRST + lemma


def test_the_longest_known_last_part_is_taken(fin: morphfst.Language) -> None:
    # rautatieasema 'railway station' (adessive rautatieasemalla) ends in asema 'station', itself a word
    # (from memory): the guess reads the longest lexicon word that ends the word
    found = fin.fast.compound_guesses(FIRST + "rautatieasemalla")
    assert found and {a.lemma for a in found} == {FIRST + "rautatieasema"}


def test_a_derivational_ending_is_not_read_as_a_short_last_part(fin: morphfst.Language) -> None:
    # the agent noun -jA (johtaja 'leader', genitive johtajan; common practice): its -ajan is also the
    # genitive of aika 'time', but the guess keeps the guessed stem's reading first
    assert fin.guess("johtajan")[0].lemma == "johtaja"
    # the third infinitive -mAAn (toimimaan; common practice) is not the noun maa 'land'
    assert fin.guess("toimimaan")[0].lemma != "toimimaa"


def test_a_word_with_no_known_last_part_gets_class_guesses_only(fin: morphfst.Language) -> None:
    assert fin.fast.compound_guesses(FIRST + "k") == []
    guesses = fin.guess(FIRST + "k")
    assert guesses and all(len([m for m in g.morphs if m.kind == "stem"]) == 1 for g in guesses)


def test_known_words_keep_their_lexicon_reading(fin: morphfst.Language) -> None:
    # kaupungin is in the lexicon: analysis with guessing on gives the lexicon's reading, not a guess
    found = fin.analyze("kaupungin", guess=True)
    assert found and not found[0].guessed and found[0].lemma == "kaupunki"


def test_grammars_without_compound_blocks_guess_no_compounds(tur: morphfst.Language) -> None:
    # Turkish has no compound blocks: ev 'house', evlerde 'in the houses' (common practice)
    assert not tur.fast.guess_heads
    assert tur.fast.compound_guesses(FIRST + "evlerde") == []


def test_a_capitalized_unknown_word_is_guessed_as_a_name_first(tur: morphfst.Language) -> None:
    # Turkish spelling (common practice): proper names are capitalized and their endings follow an
    # apostrophe. Karadenizspor is a made-up club name (mechanism test data).
    best = tur.guess("Karadenizspor")[0]
    assert (best.lemma, best.pos) == ("Karadenizspor", "PROPN") and best.guessed
    assert tur.fast.guess("Karadenizspor", 1)[0].text == best.text  # the corpus asks for the best only
    best = tur.analyze("Karadenizspor'un", guess=True)[0]
    assert (best.lemma, best.pos, best.features) == ("Karadenizspor", "PROPN", ("SG", "GEN"))
    # written in lower case, the same letters are a common noun first, as before
    assert tur.guess("karadenizspor")[0].pos == "N"
    # İ keeps its dot when the lemma is written with the word's capital
    assert tur.guess("İzmirspor")[0].lemma == "İzmirspor"

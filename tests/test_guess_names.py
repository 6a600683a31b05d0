"""Guessed names: the guesser weighs a guessed name as a lexicon name read in lower case; a word written
with a capital takes that weight back and is a name first (both shipped grammars guess names).

The unknown words here are made up for the test (invented data); the Finnish name types are common
practice (-nen surnames inflect as type 38: Virtanen, Virtasen; -la/-lä place and family names as
types 9/10: Koskela, Koskelan).
"""

from __future__ import annotations

import math

import pytest

import morphfst
from morphfst.compile.guessweights import GUESS_NAME_WEIGHT, NAME_POS
from morphfst.runtime.walk import LOWER_CASE_NAME_WEIGHT


@pytest.mark.parametrize(
    "name, word, lemma",
    [
        ("fin", "Blorpisen", "Blorpinen"),  # genitive of a -nen surname
        ("fin", "Zorbelassa", "Zorbela"),  # inessive of a -la name
        # written without its apostrophe (with it, Blorpkaya'da is read by the grammar's open class of
        # names, not guessed: tests/test_open_names.py)
        ("tur", "Blorpkayada", "Blorpkayada"),
    ],
)
def test_a_capitalized_unknown_word_is_guessed_as_a_name_first(
    name: str, word: str, lemma: str, request: pytest.FixtureRequest
) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    assert not lang.analyze(word)
    first = lang.guess(word)[0]
    assert (first.pos, first.lemma, first.guessed) == (NAME_POS, lemma, True), [a.text for a in lang.guess(word)]


@pytest.mark.parametrize("name, word", [("fin", "blorpisen"), ("fin", "zorbelassa"), ("tur", "blorpkayada")])
def test_a_lower_case_unknown_word_is_not_guessed_as_a_name_first(name: str, word: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    guesses = lang.guess(word)
    assert guesses and guesses[0].pos != NAME_POS, [a.text for a in guesses]


@pytest.mark.parametrize("name, word", [("fin", "zorbelassa"), ("tur", "blorpkayada")])
def test_name_guesses_weigh_by_the_capitals_known(name: str, word: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    fast = lang.fast

    def names(guesses: list[morphfst.Analysis]) -> dict[str, float]:
        return {a.text.lower(): a.weight for a in guesses if a.pos == NAME_POS}

    lower = names(fast.guess(word, limit=50))
    caseless = names(fast.guess(word, limit=50, cased=False))
    capital = names(fast.guess(word[:1].upper() + word[1:], limit=50))
    shared = set(lower) & set(caseless) & set(capital)
    assert shared
    for text in shared:
        assert lower[text] - caseless[text] == pytest.approx(GUESS_NAME_WEIGHT)
        assert caseless[text] - capital[text] == pytest.approx(LOWER_CASE_NAME_WEIGHT)
    assert GUESS_NAME_WEIGHT == pytest.approx(math.log(10))

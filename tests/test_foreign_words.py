"""Foreign (English) words in the shipped grammars: lexicons/LANG/foreign.tsv, class ``foreign``.

English words quoted in Turkish or Finnish text are read as part of speech X (Universal Dependencies
tags foreign words X: common practice), uninflected, and only where no native reading takes the word;
the file is written by bench/foreign_words.py from the wordfreq English list (development ranks).
"""

from __future__ import annotations

import importlib.util
from pathlib import Path

import pytest

import morphfst

ROOT = Path(__file__).resolve().parent.parent


def _foreign_rows(lang: str) -> list[list[str]]:
    lines = (ROOT / "lexicons" / lang / "foreign.tsv").read_text(encoding="utf-8").splitlines()
    rows = [line.split("\t") for line in lines if line and not line.startswith("#")]
    return rows[1:]  # after the header


# English words of everyday web text (from memory) that neither language has a word for
ENGLISH = ["restaurant", "weekend", "the", "and", "with", "download", "happy", "birthday"]


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_english_words_read_as_foreign(name: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    for word in ENGLISH:
        found = lang.analyze(word)
        assert [(a.lemma, a.pos, a.features) for a in found] == [(word, "X", ())], (name, word)
        assert found[0].segmentation == word and not found[0].guessed
        assert found[0].upos() == "X"


@pytest.mark.parametrize(
    "name, word, native",
    [
        # Turkish words spelt like English ones keep their own reading alone (from memory)
        ("tur", "her", "DET"),  # 'every'
        ("tur", "on", "NUM"),  # 'ten'
        ("tur", "son", "N"),  # 'end' (also an adjective)
        # Finnish (from memory)
        ("fin", "on", "V"),  # olla 'is'
        ("fin", "talo", "N"),  # 'house'
        ("fin", "me", "PRON"),  # 'we'
    ],
)
def test_native_words_spelt_like_english_ones_have_no_foreign_reading(
    name: str, word: str, native: str, request: pytest.FixtureRequest
) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    found = lang.analyze(word)
    assert found and native in {a.pos for a in found}, (word, [a.text for a in found])
    assert "X" not in {a.pos for a in found}, (word, [a.text for a in found])


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_the_foreign_lexicon_is_what_the_script_keeps(name: str) -> None:
    spec = importlib.util.spec_from_file_location("foreign_words", ROOT / "bench" / "foreign_words.py")
    assert spec and spec.loader
    script = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(script)
    rows = _foreign_rows(name)
    assert len(rows) > 5000
    lemmas = [row[0] for row in rows]
    assert lemmas == sorted(set(lemmas))
    assert all(row[1:4] == [script.CLASS, script.POS, row[0]] for row in rows)
    assert all(float(row[5]) == script.WEIGHT for row in rows)
    # ASCII letters, three or more or an English two-letter word; none past the development ranks
    assert all(w.isascii() and w.isalpha() and (len(w) >= 3 or w in script.TWO_LETTER) for w in lemmas)
    assert set(lemmas) <= set(script.candidates(10_000))
    assert not [w for w in lemmas if script.left_out(w)]
    with pytest.raises(SystemExit):
        script.candidates(script.DEV_RANKS + 1)

"""Suffixes a tokenizer split from their word (the grammar's ``detached`` block).

Turkish writes an apostrophe between a proper name or a number and its suffixes (Ankara'nın, 3'te),
Finnish a colon after an abbreviation or a number (EU:ssa, 2010:ssä): common practice in both
languages' spelling rules (from memory). Tokenizers that cut at those marks leave the suffixes alone.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import TOY_GRAMMAR, write_toy

import morphfst
from morphfst.corpus.records import ChunkProcessor, Options
from morphfst.errors import UserError
from morphfst.runtime.detached import DETACHED_LEMMA


@pytest.mark.parametrize(
    ("word", "text", "segmentation", "gloss"),
    [
        # the genitive, locative, relative -ki and plural (G&K, the case and number suffixes, from memory)
        ("nın", "- X;SG;GEN", "nın", "GEN"),
        ("nin", "- X;SG;GEN", "nin", "GEN"),
        ("te", "- X;SG;LOC", "te", "LOC"),
        ("deki", "- X;SG;LOC;RELZ;NOM", "de-ki", "LOC-REL.NOM"),
        ("lerin", "- X;PL;GEN", "ler-in", "PL-GEN"),
        ("ları", "- X;PL;PSS3S;NOM", "lar-ı", "PL-3SG.POSS.NOM"),
        # a number keeps its apostrophe before -lIk (3'lük; common practice)
        ("lük", "- X;ABSTR;N;SG;NOM", "lük", "ABSTR.SG.NOM"),
    ],
)
def test_turkish_suffixes_read_without_their_word(
    tur: morphfst.Language, word: str, text: str, segmentation: str, gloss: str
) -> None:
    best = tur.analyze(word)[0]
    assert (best.text, best.segmentation, best.gloss) == (text, segmentation, gloss)
    assert best.lemma == DETACHED_LEMMA and not best.guessed and not best.has_stem
    assert tur.analyze_composed(word) == tur.analyze(word)  # the reference path reads them alike
    assert tur.fast.analyze_best(word) == (best, len(tur.analyze(word)))


@pytest.mark.parametrize(
    ("word", "text"),
    [
        # the inessive, allative, illative and elative (Karlsson, the case endings, from memory)
        ("ssa", "- X;SG;IN+ESS"),
        ("lle", "- X;SG;AT+ALL"),
        ("een", "- X;SG;IN+ALL"),
        ("stä", "- X;SG;IN+ABL"),
    ],
)
def test_finnish_suffixes_read_without_their_word(fin: morphfst.Language, word: str, text: str) -> None:
    assert fin.analyze(word)[0].text == text
    assert fin.analyze_composed(word) == fin.analyze(word)


def test_a_word_of_the_language_keeps_only_its_own_readings(tur: morphfst.Language) -> None:
    # de, da 'too' and ki 'that' are words: no suffix reading is added to theirs
    for word in ("de", "da", "ki", "evde", "ankara"):
        found = tur.analyze(word)
        assert found and all(a.lemma != DETACHED_LEMMA for a in found), word
    # letters that no suffix spells have no reading at all
    for word in ("hd", "qwx", "nınnın" * 3):
        assert tur.analyze(word) == [], word


def test_corpus_terms_of_a_detached_suffix(tur: morphfst.Language) -> None:
    processor = ChunkProcessor(tur, Options())
    result = processor.analyze_type("nın")
    assert result.terms("lemma", "'") == "-"
    assert result.terms("stem", "'") == "-"
    assert result.terms("morphs", "'") == "- +nın"
    assert processor.analyze_type("lerin").terms("morphs", "'") == "- +ler +in"


@pytest.mark.parametrize(
    ("block", "message"),
    [
        ('detached Q {\n  "ka\'"\n}', "Q is not a declared part of speech"),
        ('detached N {\n  "ka"\n}', "is not a word followed by its separator"),
        ("detached N {\n}", "no host word"),
    ],
)
def test_detached_block_errors(tmp_path: Path, block: str, message: str) -> None:
    grammar = TOY_GRAMMAR.replace("rules {", f"{block}\n\nrules {{")
    with pytest.raises(UserError) as caught:
        morphfst.load(write_toy(tmp_path, grammar))
    assert message in str(caught.value)
    assert (
        caught.value.position is not None and caught.value.position.line == grammar.splitlines().index(block.splitlines()[0]) + 1
    )

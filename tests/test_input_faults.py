"""Reading input: byte-order marks, empty glosses, zero-morph cycles, the path limit, NUL bytes, the
tokenizer on many scripts, and segment -i streaming through the corpus path."""

from __future__ import annotations

import json
import random
from pathlib import Path

import pynini
import pytest
from toygrammar import TOY_GRAMMAR, TOY_LEXICON, write_toy

import morphfst
from morphfst.cli import main
from morphfst.compile.fstutil import paths
from morphfst.errors import UserError
from morphfst.runtime.tokenize import Tokenizer


def test_a_byte_order_mark_at_the_start_of_a_lexicon_is_accepted(tmp_path: Path) -> None:
    lang = morphfst.load(write_toy(tmp_path, lexicon="\ufeff" + TOY_LEXICON))
    assert lang.analyze("kalar")[0].text == "ka N;PL;NOM"


def test_an_empty_gloss_is_a_located_error(tmp_path: Path) -> None:
    grammar = write_toy(tmp_path, lexicon=TOY_LEXICON + "lo\tnoun\tN\t\n")
    with pytest.raises(UserError) as info:
        morphfst.load(grammar)
    assert "empty gloss" in info.value.message
    assert info.value.position is not None and info.value.position.line == 4 and info.value.position.column > 1
    assert info.value.position.file.endswith("toy.tsv")


def test_a_cycle_of_zero_morphs_is_a_located_error_at_build_time(tmp_path: Path) -> None:
    grammar = TOY_GRAMMAR.replace("slot case {", "slot case -> number {")
    with pytest.raises(UserError) as info:
        morphfst.load(write_toy(tmp_path, grammar))
    assert "cycle of zero morphs" in info.value.message and "number" in info.value.message
    assert info.value.position is not None and info.value.position.line > 0


def test_the_path_limit_keeps_the_best_paths() -> None:
    rng = random.Random(7)
    for _ in range(5):
        weights = [rng.uniform(1, 10) for _ in range(400)]
        best = rng.randrange(400)
        weights[best] = 0.5
        fst = pynini.union(*(pynini.accep(f"w{i}", weight=w) for i, w in enumerate(weights))).optimize()
        got = paths(fst, 200)
        assert len(got) == 200
        assert got[0][0] == f"w{best}" or min(w for _, _, w in got) == pytest.approx(0.5)
        assert sorted(w for _, _, w in got) == pytest.approx(sorted(weights)[:200])


def test_nul_bytes_separate_words_in_analyze_segment_and_corpus(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    grammar = write_toy(tmp_path / "toy")
    text = tmp_path / "nul.txt"
    text.write_bytes(b"ka\x00te\n")
    assert main(["analyze", "-l", str(grammar), "-i", str(text), "-f", "jsonl"]) == 0
    analyzed = [json.loads(line)["word"] for line in capsys.readouterr().out.splitlines()]
    assert main(["segment", "-l", str(grammar), "-i", str(text), "-f", "jsonl", "--no-summary"]) == 0
    segmented = [json.loads(line)["word"] for line in capsys.readouterr().out.splitlines()]
    assert main(["corpus", "-l", str(grammar), str(text), "-m", "jsonl", "-q"]) == 0
    corpus = [t["token"] for line in capsys.readouterr().out.splitlines() for t in json.loads(line)["tokens"]]
    assert analyzed == segmented == corpus == ["ka", "te"]


@pytest.mark.parametrize(
    "word",
    [
        "வீடுகளில்",  # Tamil, "in the houses" (from memory)
        "किताबें",  # Hindi (Devanagari), "books" (from memory)
        "ಮನೆಗಳಲ್ಲಿ",  # Kannada, "in the houses" (from memory)
        "학교에서",  # Korean, "at school" (from memory)
        "სახლებში",  # Georgian, "in the houses" (from memory)
        "домами",  # Russian (Cyrillic), "houses" instrumental plural (from memory)
        "ру́сский",  # Cyrillic with a combining stress mark (common practice in dictionaries)
        "می‌روم",  # Persian, "I go", with a zero-width non-joiner inside the word (from memory)
    ],
)
def test_words_of_many_scripts_are_one_token(word: str) -> None:
    tok = Tokenizer()
    assert tok.tokens(f"({word}), {word}.") == [word, word]
    assert "".join(p.text for p in tok.pieces(f"({word}), x")) == f"({word}), x"


def test_segment_input_streams_through_the_corpus_path(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    from morphfst.cli import segment_cmd
    from morphfst.corpus import reading

    grammar = write_toy(tmp_path / "toy")
    made: list[object] = []
    real_progress = segment_cmd.Progress

    def spy(*args: object, **kwargs: object) -> object:
        made.append(args)
        return real_progress(*args, **kwargs)  # type: ignore[arg-type]

    monkeypatch.setattr(segment_cmd, "Progress", spy)
    monkeypatch.setattr(segment_cmd, "MAX_LINE_BYTES", 4096)  # a long line is read in pieces
    monkeypatch.setattr(segment_cmd, "CHUNK_BYTES", 1024)
    assert reading.MAX_LINE_BYTES > 4096
    text = tmp_path / "long.txt"
    text.write_text("ka kalar, te\n" + "kalar te " * 2000 + "\nte\n", encoding="utf-8")
    assert main(["segment", "-l", str(grammar), "-i", str(text), "--no-summary"]) == 0
    out = capsys.readouterr().out.split("\n")
    assert made and out[0] == "ka ka-lar, te" and out[2] == "te" and out[3] == ""
    assert out[1] == "ka-lar te " * 2000

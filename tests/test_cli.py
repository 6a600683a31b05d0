"""The morphfst command: subcommands, output formats, bad input, exit codes."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

import morphfst
from morphfst.cli import main


def run(capsys: pytest.CaptureFixture[str], *args: str) -> tuple[int, str, str]:
    code = main(list(args))
    out, err = capsys.readouterr()
    return code, out, err


def test_analyze_table(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    code, out, _ = run(capsys, "analyze", "evlerden", "xyz")
    assert code == 0
    lines = out.splitlines()
    assert lines[0].split() == ["word", "analysis", "segmentation", "gloss", "weight"]
    assert "ev N;PL;ABL" in lines[2] and "ev-ler-den" in lines[2] and "house-PL-ABL" in lines[2]
    assert "(no analysis)" in lines[3]


def test_analyze_tsv_one_record_per_token_in_order(
    capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language
) -> None:
    words = tmp_path / "words.txt"
    words.write_text("evlerde qqq\n\nodaya\n", encoding="utf-8")
    code, out, _ = run(capsys, "analyze", "-i", str(words), "-f", "tsv", "--best", "1")
    rows = [line.split("\t") for line in out.splitlines()]
    assert code == 0 and rows[0][0] == "word"
    assert [r[0] for r in rows[1:]] == ["evlerde", "qqq", "odaya"]
    assert rows[2][1] == "0"  # no analysis: rank 0, empty fields


def test_analyze_guess_marks_guessed_readings(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    # "blorpkayada" is a made-up word (test data): the lexicon has no reading, the guesser splits off
    # the locative -da; a lexicon word keeps its lexicon readings, unmarked.
    code, out, _ = run(capsys, "analyze", "--guess", "blorpkayada", "evlerde", "--best", "1")
    lines = out.splitlines()
    assert code == 0
    assert "(guess) blorpkaya N;SG;LOC" in lines[2] and "blorpkaya-da" in lines[2]
    assert "ev N;PL;LOC" in lines[3] and "(guess)" not in lines[3]
    code, out, _ = run(capsys, "analyze", "--guess", "blorpkayada", "evlerde", "-f", "tsv", "--best", "1")
    rows = [line.split("\t") for line in out.splitlines()]
    assert rows[0][-1] == "guessed" and rows[1][-1] == "yes" and rows[2][-1] == ""
    code, out, _ = run(capsys, "analyze", "--guess", "blorpkayada", "-f", "jsonl", "--best", "1")
    assert json.loads(out)["analyses"][0]["guessed"] is True
    code, out, _ = run(capsys, "analyze", "blorpkayada", "-f", "tsv")
    assert out.splitlines()[1].split("\t")[:2] == ["blorpkayada", "0"]  # without --guess: no analysis


def test_analyze_jsonl(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    code, out, _ = run(capsys, "analyze", "kitabı", "-f", "jsonl")
    record = json.loads(out)
    assert code == 0 and record["word"] == "kitabı"
    assert [a["analysis"] for a in record["analyses"]] == ["kitap N;SG;PSS3S;NOM", "kitap N;SG;ACC"]
    assert [m["form"] for m in record["analyses"][1]["morphs"]] == ["kitab", "", "ı"]


def test_generate(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    code, out, _ = run(capsys, "generate", "ev", "N", "PL", "ABL", "-f", "tsv")
    assert code == 0 and out.splitlines()[1].split("\t")[:4] == ["ev", "N;PL;ABL", "1", "evlerden"]
    code, _, err = run(capsys, "generate", "ev", "N;PLURAL")
    assert code == 2 and "unknown feature label 'PLURAL'" in err and "Traceback" not in err
    code, out, _ = run(capsys, "generate", "tırzop", "N;PL;DAT", "-f", "tsv")
    assert code == 0 and out.splitlines()[1].split("\t")[2:4] == ["0", ""]  # not in the lexicon
    code, out, _ = run(capsys, "generate", "--guess", "tırzop", "N;PL;DAT", "-f", "tsv")
    rows = [line.split("\t") for line in out.splitlines()]
    assert code == 0 and rows[0][-1] == "guessed" and rows[1][3] == "tırzoplara" and rows[1][-1] == "1"
    code, out, _ = run(capsys, "generate", "--guess", "tırzop", "N;PL;DAT")
    assert code == 0 and "tırzop N;PL;DAT (guessed)" in out


def test_segment_text_keeps_lines_and_reports_coverage(
    capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language
) -> None:
    text = tmp_path / "text.txt"
    text.write_text("Evlerde kitaplar qqq.\n\nAnkara'da, zzz!\n", encoding="utf-8")
    code, out, err = run(capsys, "segment", "-i", str(text))
    assert code == 0
    assert out.splitlines() == ["Ev-ler-de kitap-lar qqq.", "", "Ankara-'da, zzz!"]
    assert "tokens:" in err and "most frequent unanalyzed" in err and "qqq (1)" in err


def test_segment_splits_unknown_words_by_the_guesser_when_asked(
    capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language
) -> None:
    text = tmp_path / "text.txt"
    text.write_text("Evlerde vlogunda konuştu.\n", encoding="utf-8")
    code, out, err = run(capsys, "segment", "-i", str(text))
    assert code == 0 and out.splitlines() == ["Ev-ler-de vlogunda konuş-tu."]
    code, out, err = run(capsys, "segment", "-i", str(text), "--guess", "--mark-unknown", "?")
    assert code == 0 and out.splitlines() == ["Ev-ler-de ?vlog-u-nda konuş-tu."]
    assert "split by the guesser: 1" in err and "vlogunda (1)" in err


def test_invalid_utf8_is_replaced_and_counted(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    data = tmp_path / "bad.txt"
    data.write_bytes(b"evlerde \xff\xfe odaya\n")
    code, out, err = run(capsys, "analyze", "-i", str(data), "-f", "tsv", "--best", "1")
    assert code == 0
    assert [r.split("\t")[0] for r in out.splitlines()[1:]] == ["evlerde", "\ufffd\ufffd", "odaya"]
    assert "replaced 2 invalid UTF-8 byte(s)" in err


def test_empty_input_and_enormous_token(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    empty = tmp_path / "empty.txt"
    empty.write_bytes(b"")
    code, out, _ = run(capsys, "analyze", "-i", str(empty), "-f", "jsonl")
    assert code == 0 and out == ""
    big = tmp_path / "big.txt"
    big.write_text("ev " + "a" * 100_000 + " oda\n", encoding="utf-8")
    code, out, _ = run(capsys, "analyze", "-i", str(big), "-f", "jsonl")
    records = [json.loads(line) for line in out.splitlines()]
    assert code == 0 and len(records) == 3
    assert records[1]["analyses"] == [] and len(records[1]["word"]) == 100_000
    code, out, _ = run(capsys, "segment", "-i", str(big), "--no-summary")
    assert code == 0 and out.count("\n") == 1


def test_negative_best_is_a_user_error(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, "analyze", "--best", "-1", "evlerde")
    assert code == 2 and out == "" and "--best" in err


def test_missing_input_file(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    code, _, err = run(capsys, "analyze", "-i", "/nonexistent/words.txt")
    assert code == 2 and "cannot read input file" in err


def test_bad_option_exits_2(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as info:
        main(["analyze", "--no-such-option"])
    assert info.value.code == 2
    assert "hint:" in capsys.readouterr().err


def test_every_subcommand_has_help_with_examples(capsys: pytest.CaptureFixture[str]) -> None:
    from morphfst.cli import build_parser

    parser = build_parser()
    sub = next(a for a in parser._actions if a.dest == "command")
    for name in sub.choices:  # type: ignore[union-attr]
        with pytest.raises(SystemExit):
            main([name, "--help"])
        out = capsys.readouterr().out
        assert "examples:" in out, name


def test_console_script_runs_as_a_process(tur: morphfst.Language) -> None:
    proc = subprocess.run(
        [sys.executable, "-m", "morphfst", "analyze", "odalarda", "-f", "tsv"],
        capture_output=True,
        text=True,
        check=False,
    )
    assert proc.returncode == 0, proc.stderr
    assert "oda\tN\tPL;LOC" in proc.stdout
    proc = subprocess.run(
        [sys.executable, "-m", "morphfst", "build", "/no/such.mfg"], capture_output=True, text=True, check=False
    )
    assert proc.returncode == 2 and "Traceback" not in proc.stderr and "no such file" in proc.stderr


def test_output_files_get_ordinary_permissions(tmp_path: Path, tur_small: morphfst.Language) -> None:
    import os
    import stat

    from morphfst.atomic import default_file_mode

    out = morphfst.compile_grammar(Path(tur_small.meta["grammar_path"]), tmp_path / "tur.mfc")
    assert stat.S_IMODE(os.stat(out).st_mode) == default_file_mode()


@pytest.mark.parametrize(
    "command",
    [
        ["graph", "-o", "{d}"],
        ["build", "tur", "-o", "{d}"],
        ["corpus", "{words}", "-q", "-o", "{out}", "--report", "{d}"],
    ],
)
def test_output_to_a_directory_is_a_user_error(
    capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language, command: list[str]
) -> None:
    d = tmp_path / "taken"
    d.mkdir()
    words = tmp_path / "words.txt"
    words.write_text("evler\n", encoding="utf-8")
    paths = {"d": str(d), "words": str(words), "out": str(tmp_path / "out.txt")}
    code, _, err = run(capsys, *[part.format(**paths) for part in command])
    assert code == 2 and "is a directory" in err and "Traceback" not in err
    assert list(d.iterdir()) == [] and not [p for p in tmp_path.iterdir() if p.name.endswith(".part")]


def test_unknown_option_of_a_subcommand_points_at_its_help(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as info:
        main(["info", "--no-such-option"])
    err = capsys.readouterr().err
    assert info.value.code == 2
    assert "usage: morphfst info" in err and "morphfst info --help" in err


def test_debugging_tools_refuse_empty_and_overlong_words(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    code, _, err = run(capsys, "explain", "")
    assert code == 2 and "empty word" in err
    code, _, err = run(capsys, "diagnose", "a" * 3000)
    assert code == 2 and "not a word" in err and "Traceback" not in err

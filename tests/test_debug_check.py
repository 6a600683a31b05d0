"""The grammar test runner: exit codes, failure diffs, rule/affix/slot coverage, test files, pytest plugin.

The grammar is an invented toy with one failing inline test and one rule (devoicing) that no test
touches.
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

import pytest

import morphfst
from morphfst.cli import main
from morphfst.debug import DebugSession, read_test_file, render_report, run_tests
from morphfst.errors import UserError

GRAMMAR = """\
language toyc "Harmony toy for test-runner tests"
lexicon "toyc.tsv"

alphabet {
  letters a e i o u b d k l m n p r s t v
  archiphonemes A D
}

sets {
  vowel     = a e i o u
  front     = e i
  back      = a o u
  cons      = b d k l m n p r s t v D
  voiceless = k p s t
  skip      = @cons +
}

features {
  pos: N
  Number: SG PL
  Case: NOM DAT LOC
}

classes {
  noun pos N -> number
}

slot number -> case {
  ""     SG
  "lAr"  PL
}

slot case {
  ""     NOM
  "A"    DAT
  "DA"   LOC
}

rules {
  rule front_harmony : A -> e / @front @skip* _
  rule back_harmony  : A -> a / @back @skip* _
  rule devoicing     : D -> t / @voiceless + _
  rule voicing       : D -> d
  rule final_voicing : p -> b / _ + @vowel
}

tests {
  evlerde   => ev N;PL;LOC
  kitaba    == kitap N;SG;DAT
  odalar    => oda N;SG;NOM
  ev N;PL;DAT -> evlere
  reject evlarde
}
"""

LEXICON = "lemma\tclass\tpos\tgloss\nev\tnoun\tN\thouse\nkitap\tnoun\tN\tbook\noda\tnoun\tN\troom\n"

TEST_FILE = """\
# tests of the toy grammar, one per line, fields separated by tabs
grammar\ttoyc.mfg
analyze\toda\toda N;SG;NOM
exact\todada\toda N;SG;LOC
generate\tkitap N;SG;LOC\tkitapta
reject\tkitapda odalerde
"""


@pytest.fixture(scope="module")
def toy(tmp_path_factory: pytest.TempPathFactory) -> tuple[DebugSession, Path]:
    d = tmp_path_factory.mktemp("check")
    (d / "toyc.tsv").write_text(LEXICON, encoding="utf-8")
    path = d / "toyc.mfg"
    path.write_text(GRAMMAR, encoding="utf-8")
    (d / "toyc.mfgtest").write_text(TEST_FILE, encoding="utf-8")
    return DebugSession.open(morphfst.load(path)), d


def test_inline_tests_one_failure_and_coverage(toy: tuple[DebugSession, Path]) -> None:
    session, _ = toy
    report = run_tests(session)
    assert len(report.results) == 5
    assert report.exit_code == 1
    (failed,) = report.failed
    odalar_line = next(n for n, line in enumerate(GRAMMAR.splitlines(), start=1) if line.strip().startswith("odalar"))
    assert failed.test.input == "odalar" and failed.test.line == odalar_line
    assert failed.missing == ["oda N;SG;NOM"]
    assert failed.diff == ["- oda N;SG;NOM", "+ oda N;PL;NOM"]
    cov = report.coverage
    assert cov is not None
    assert [r["name"] for r in cov.rules_never] == ["devoicing"]
    assert cov.rules_fired["front_harmony"] == 2  # evlerde, evlere
    assert cov.rules_fired["final_voicing"] == 1  # kitaba
    assert cov.rules_total == 5
    # the zero nominative is used only by the failing test (odalar), so no passing test exercises it
    assert [(a["slot"], a["form"], a["features"]) for a in cov.affixes_never] == [("case", "", ["NOM"])]
    assert cov.slots_never == []
    text = render_report(report)
    assert f"FAIL toyc.mfg:{odalar_line}  analyze  odalar" in text
    assert "never fired: devoicing" in text
    assert "5 tests, 4 passed, 1 failed" in text


def test_test_file_runs_and_covers_the_rest(toy: tuple[DebugSession, Path]) -> None:
    session, d = toy
    grammar, tests = read_test_file(d / "toyc.mfgtest")
    assert grammar == str(d / "toyc.mfg")
    assert [(t.kind, t.input, t.line) for t in tests] == [
        ("analyze", "oda", 3),
        ("exact", "odada", 4),
        ("generate", "kitap N;SG;LOC", 5),
        ("reject", "kitapda", 6),
        ("reject", "odalerde", 6),
    ]
    report = run_tests(session, [d / "toyc.mfgtest"], inline=False)
    assert report.exit_code == 0
    assert report.coverage is not None
    assert {r["name"] for r in report.coverage.rules_never} == {"front_harmony", "final_voicing"}
    assert report.coverage.rules_fired["devoicing"] == 1  # kitapta


def test_check_cli_exit_codes(toy: tuple[DebugSession, Path], capsys: pytest.CaptureFixture[str]) -> None:
    session, d = toy
    grammar = str(d / "toyc.mfg")
    assert main(["check", "-l", grammar]) == 1
    out = capsys.readouterr().out
    assert "odalar" in out and "never fired: devoicing" in out
    assert main(["check", "-l", grammar, "--no-inline", str(d / "toyc.mfgtest")]) == 0
    capsys.readouterr()
    assert main(["check", "--no-inline", str(d)]) == 0  # a directory; the grammar comes from the file's grammar line
    capsys.readouterr()
    assert main(["check", "--no-inline", "--strict-coverage", str(d / "toyc.mfgtest")]) == 1
    capsys.readouterr()
    assert main(["check", "-l", grammar, "-f", "json", "--diagnose"]) == 1
    data = json.loads(capsys.readouterr().out)
    assert (data["tests"], data["failed"]) == (5, 1)
    assert [r["name"] for r in data["coverage"]["rules_never"]] == ["devoicing"]
    bad = d / "bad.mfgtest"
    bad.write_text("grammar\ttoyc.mfg\nanalyse\toda\toda N;SG;NOM\n", encoding="utf-8")
    assert main(["check", str(bad)]) == 2
    assert "unknown test kind 'analyse'" in capsys.readouterr().err
    assert main(["check", str(d / "missing.mfgtest")]) == 2


def test_failing_word_is_diagnosed(toy: tuple[DebugSession, Path], tmp_path: Path) -> None:
    session, d = toy
    f = tmp_path / "more.mfgtest"
    f.write_text("analyze\tkitapa\tkitap N;SG;DAT\n", encoding="utf-8")
    report = run_tests(session, [f], inline=False, diagnose_failures=True)
    (failed,) = report.failed
    assert failed.diff == ["- kitap N;SG;DAT", "+ (nothing)"]
    assert "sound change" in failed.diagnosis and "final_voicing" in failed.diagnosis


def test_test_file_mistakes_are_user_errors(tmp_path: Path) -> None:
    f = tmp_path / "x.mfgtest"
    f.write_text("analyze\tonly-a-word\n", encoding="utf-8")
    with pytest.raises(UserError) as err:
        read_test_file(f)
    assert err.value.position is not None and err.value.position.line == 1
    f.write_text("reject\n", encoding="utf-8")
    with pytest.raises(UserError):
        read_test_file(f)


def test_pytest_plugin_collects_grammar_test_files(toy: tuple[DebugSession, Path], tmp_path: Path) -> None:
    _, d = toy
    project = tmp_path / "project"
    (project / "tests").mkdir(parents=True)
    text = TEST_FILE.replace("grammar\ttoyc.mfg", f"grammar\t{d / 'toyc.mfg'}") + "analyze\tev\tev N;PL;NOM\n"
    (project / "tests" / "toy.mfgtest").write_text(text, encoding="utf-8")
    env = dict(os.environ)
    # the subprocess imports the same morphfst as this test process (not another installed copy)
    package_root = str(Path(morphfst.__file__).resolve().parent.parent)
    env["PYTHONPATH"] = os.pathsep.join(p for p in (package_root, env.get("PYTHONPATH", "")) if p)
    done = subprocess.run(
        [sys.executable, "-m", "pytest", "-p", "morphfst.pytest_plugin", "-p", "no:cacheprovider", "-q", "-rf", "tests"],
        cwd=project,
        env=env,
        capture_output=True,
        text=True,
        timeout=300,
    )
    out = done.stdout + done.stderr
    assert done.returncode == 1, out
    assert "1 failed, 5 passed" in out
    assert "FAIL toy.mfgtest:7  analyze  ev" in out
    assert "- ev N;PL;NOM" in out and "+ ev N;SG;NOM" in out

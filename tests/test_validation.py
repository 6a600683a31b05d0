"""Semantic errors in grammars and lexicons: one message with file, line, a hint, and exit code 2."""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import TOY_GRAMMAR, TOY_LEXICON, write_toy

from morphfst.cli import main
from morphfst.compile.loader import load_model
from morphfst.errors import UserError


def line_of(text: str, needle: str) -> int:
    """1-based number of the first line of ``text`` containing ``needle``."""
    return next(i for i, line in enumerate(text.splitlines(), start=1) if needle in line)


def error_of(tmp_path: Path, grammar: str = TOY_GRAMMAR, lexicon: str = TOY_LEXICON) -> UserError:
    path = write_toy(tmp_path, grammar, lexicon)
    with pytest.raises(UserError) as info:
        load_model(path)
    return info.value


def test_undeclared_symbol_in_a_form(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR.replace('"nA"', '"nAx"'))
    assert "symbol 'x'" in err.message and err.position and err.position.line == line_of(TOY_GRAMMAR, '"nA"')


def test_undeclared_set_in_a_rule(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR.replace("@front @cons*", "@fronts @cons*"))
    assert "undeclared set @fronts" in err.message
    assert err.position and err.position.line == line_of(TOY_GRAMMAR, "rule front") and err.position.column > 1
    assert err.hint and "front" in err.hint


def test_undeclared_feature(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR.replace('"nA"   LOC', '"nA"   LOCC'))
    assert "undeclared feature 'LOCC'" in err.message and err.hint and "LOC" in err.hint


def test_affix_pointing_at_undefined_slot(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR.replace('"lAr"  PL', '"lAr"  PL -> kase'))
    assert "undefined slot 'kase'" in err.message and err.hint and "case" in err.hint


def test_slot_no_path_reaches(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR + '\nslot orphan {\n  "o" SG\n}\n')
    assert "slot orphan is not reachable" in err.message
    assert err.position and err.position.line == TOY_GRAMMAR.count("\n") + 2


def test_rule_target_outside_alphabet(tmp_path: Path) -> None:
    err = error_of(tmp_path, TOY_GRAMMAR.replace("rule back  : A -> a", "rule back  : Q -> a"))
    assert "outside the alphabet" in err.message and "'Q'" in err.message
    assert err.position and err.position.line == line_of(TOY_GRAMMAR, "rule back")


def test_rule_rewriting_a_boundary(tmp_path: Path) -> None:
    from morphfst.compile.compiler import Compiler

    path = write_toy(tmp_path, TOY_GRAMMAR.replace("rule back  : A -> a", "rule back  : A + -> a"))
    grammar = load_model(path)
    with pytest.raises(UserError) as info:
        Compiler(grammar).rule_fst(grammar.rules[1])
    assert "boundary" in info.value.message


def test_unequal_sets_in_a_rule(tmp_path: Path) -> None:
    from morphfst.compile.compiler import Compiler

    path = write_toy(tmp_path, TOY_GRAMMAR.replace("rule back  : A -> a", "rule back  : [ae] -> [o]"))
    grammar = load_model(path)
    with pytest.raises(UserError) as info:
        Compiler(grammar).rule_fst(grammar.rules[1])
    assert "same size" in (info.value.hint or "")


def test_unknown_class_in_lexicon(tmp_path: Path) -> None:
    err = error_of(tmp_path, lexicon=TOY_LEXICON + "lu\tnoum\tN\tstone\n")
    assert "unknown class 'noum'" in err.message
    assert err.position and err.position.line == 4 and err.position.column == 4
    assert err.hint and "noun" in err.hint


def test_unknown_flag_in_lexicon(tmp_path: Path) -> None:
    lexicon = "lemma\tclass\tpos\tgloss\tflags\nka\tnoun\tN\thouse\tirregular\n"
    err = error_of(tmp_path, lexicon=lexicon)
    assert "unknown flag 'irregular'" in err.message and err.position and err.position.line == 2


def test_duplicate_entry(tmp_path: Path) -> None:
    err = error_of(tmp_path, lexicon=TOY_LEXICON + "ka\tnoun\tN\thouse again\n")
    assert "duplicate entry 'ka'" in err.message and err.hint and ":2" in err.hint


def test_malformed_weight(tmp_path: Path) -> None:
    lexicon = "lemma\tclass\tpos\tgloss\tweight\nka\tnoun\tN\thouse\tlight\n"
    err = error_of(tmp_path, lexicon=lexicon)
    assert "malformed weight 'light'" in err.message and err.position and err.position.line == 2


def test_unknown_column(tmp_path: Path) -> None:
    err = error_of(tmp_path, lexicon="lemma\tclass\tpos\tgloss\tcolour\n")
    assert "unknown column 'colour'" in err.message


def test_counts_become_negative_log_weights(tmp_path: Path) -> None:
    import math

    lexicon = "lemma\tclass\tpos\tgloss\tcount\nka\tnoun\tN\thouse\t3\nte\tnoun\tN\ttree\t1\n"
    grammar = load_model(write_toy(tmp_path, lexicon=lexicon))
    weights = {e.lemma: e.weight for e in grammar.lexicon}
    assert weights["ka"] == pytest.approx(-math.log(3 / 4))
    assert weights["te"] == pytest.approx(-math.log(1 / 4))


@pytest.mark.parametrize(
    "change",
    [
        ("rule back  : A -> a", "rule back  : Q -> a"),
        ('"nA"   LOC', '"nA"   LOCC'),
        ("slot case {", "slot case {{"),
    ],
)
def test_cli_reports_errors_with_exit_code_2_and_no_traceback(
    tmp_path: Path, capsys: pytest.CaptureFixture[str], change: tuple[str, str]
) -> None:
    path = write_toy(tmp_path, TOY_GRAMMAR.replace(*change))
    code = main(["build", str(path), "-o", str(tmp_path / "out.mfc")])
    err = capsys.readouterr().err
    assert code == 2
    assert "Traceback" not in err
    assert err.startswith(f"{path}:") and "error:" in err
    assert not (tmp_path / "out.mfc").exists()


def test_layout_with_unknown_dimension_is_a_grammar_error(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    grammar = TOY_GRAMMAR + '\nlayout N "declension" {\n  rows Kase\n  columns Number\n}\n'
    path = write_toy(tmp_path, grammar)
    code = main(["build", str(path), "-o", str(tmp_path / "out.mfc")])
    err = capsys.readouterr().err
    assert code == 2 and "unknown dimension 'Kase'" in err
    assert f"{path}:{line_of(grammar, 'layout N')}" in err

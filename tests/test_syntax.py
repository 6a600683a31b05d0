"""The grammar language parser: blocks, rule notation, forms, and syntax errors with a caret."""

from __future__ import annotations

import pytest
from toygrammar import TOY_GRAMMAR

from morphfst.errors import UserError
from morphfst.language import model as m
from morphfst.language.syntax import parse_form, parse_grammar_text


def test_toy_grammar_blocks() -> None:
    g = parse_grammar_text(TOY_GRAMMAR, "toy.mfg")
    assert g.name == "toy" and g.title == "Toy language for tests"
    assert g.lexicon_paths == ["toy.tsv"]
    assert g.archiphonemes == ["A"]
    assert g.sets["back"].members == ["a", "o", "u"]
    assert g.dimensions["Case"].values == ["NOM", "LOC"]
    assert g.classes["noun"].next == ["number"] and g.classes["noun"].pos_allowed == ["N"]
    number = g.slots["number"]
    assert number.next == ["case"]
    assert [a.form for a in number.affixes] == [[], ["l", "A", "r"]]
    assert number.affixes[1].features == ["PL"] and number.affixes[1].gloss == "PL"
    assert g.slots["case"].next == [m.END_SLOT]
    assert [r.name for r in g.rules] == ["front", "back"]
    assert g.tests[0].kind == "analyze" and g.tests[0].expected == ["ka N;PL;NOM"]


def test_rule_notation() -> None:
    src = """
alphabet {
  letters a b c y
  archiphonemes A
}
sets {
  v = a
}
rules {
  rule one ltr: A -> a / @v [bc]* + _ $
  rule two rtl optional weight 1.5: (y) -> ∅ / ^ _
  rule three sim: b -> c
  rule four: ∅ -> y / a + _ a
  rule five: a -> b / (a | c)? _ .
}
"""
    g = parse_grammar_text(src)
    one, two, three, four, five = g.rules
    assert one.direction == "ltr" and not one.optional
    assert one.left == m.Seq((m.SetRef("v"), m.Repeat(m.Klass((m.Sym("b"), m.Sym("c"))), 0, None), m.Sym("+")))
    assert one.right == m.Sym("$")
    assert two.direction == "rtl" and two.optional and two.weight == 1.5
    assert two.target == m.Sym("(y)?") and two.replacement == m.Empty()
    assert two.left == m.Sym("^") and two.right is None
    assert three.direction == "sim" and three.left is None and three.right is None
    assert four.target == m.Empty()
    assert isinstance(five.left, m.Repeat) and isinstance(five.right, m.AnySym)
    assert "rule one" in one.text


def test_forms_with_optional_segments_and_multichar_symbols() -> None:
    pos = m.Position("x")
    assert parse_form("(y)I", pos) == ["(y)", "I"]
    assert parse_form("ka<t>u", pos) == ["k", "a", "<t>", "u"]
    assert parse_form("", pos) == []


def test_syntax_error_has_line_column_caret_and_hint() -> None:
    src = 'alphabet {\n  letters a b\n}\nslot x {\n  "a" PL gloss\n}\n'
    with pytest.raises(UserError) as info:
        parse_grammar_text(src, "bad.mfg")
    err = info.value
    assert err.position is not None and err.position.line == 5
    text = err.render()
    assert text.startswith("bad.mfg:5:")
    assert "^" in text.splitlines()[2]
    assert "hint: expected" in text


def test_unclosed_block_is_reported_at_end_of_file() -> None:
    with pytest.raises(UserError) as info:
        parse_grammar_text("alphabet {\n  letters a b\n", "open.mfg")
    assert "end of file" in info.value.message or "unexpected" in info.value.message


def test_unexpected_character() -> None:
    with pytest.raises(UserError) as info:
        parse_grammar_text("alphabet {\n  letters a b\n}\nsets {\n  v = a \\ b\n}\n", "chars.mfg")
    assert info.value.position is not None
    assert (info.value.position.line, info.value.position.column) == (5, 9)


def test_plus_glued_to_a_symbol_is_an_error() -> None:
    src = "alphabet {\n  letters a b\n}\nrules {\n  rule r: a -> b / b+ _\n}\n"
    with pytest.raises(UserError) as info:
        parse_grammar_text(src, "plus.mfg")
    assert "one or more" in info.value.message and info.value.position and info.value.position.line == 5


def test_quoted_letters_for_characters_the_rule_syntax_reserves() -> None:
    # a period or comma inside a word (1.000'den, 3,5'lik) is a letter written in quotes; rules and
    # class patterns reach it through a set, since a bare . is 'any symbol' there
    src = 'alphabet {\n  letters a 0 1 "." ","\n}\nsets {\n  sep = "." ","\n  digit = 0 1\n}\n'
    src += "rules {\n  rule r: a -> ∅ / @digit @sep _\n}\n"
    g = parse_grammar_text(src, "quoted.mfg")
    assert g.letters == ["a", "0", "1", ".", ","]
    assert g.sets["sep"].members == [".", ","]
    with pytest.raises(UserError) as info:
        parse_grammar_text('alphabet {\n  letters a ".,"\n}\n', "two.mfg")
    assert "one character" in info.value.message and info.value.position and info.value.position.line == 2

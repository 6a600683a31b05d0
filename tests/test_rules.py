"""Rewrite-rule compilation (cdrewrite): directions, sets, insertion, optional rules, contexts.

Expected outputs follow the standard semantics of ordered context-dependent rewrite rules
(Kaplan & Kay 1994; Mohri & Sproat 1996) as implemented by pynini.cdrewrite (reference library).
"""

from __future__ import annotations

import pynini
import pytest

from morphfst.compile.compiler import Compiler
from morphfst.compile.fstutil import acc, paths
from morphfst.language.syntax import parse_grammar_text
from morphfst.language.validate import validate

BASE = """
alphabet {
  letters a e i o u k l m n p r s t y d b v c h g
  archiphonemes A I
}
sets {
  vowel = a e i o u
  front = e i
  back  = a o u
  cons  = k l m n p r s t y d b v c h g
  voiceless = p t k s
  voiced = b d k s
}
features {
  pos: N
}
rules {
%s
}
"""


def apply(rules: str, underlying: str) -> list[tuple[str, float]]:
    """Apply the rules (in order) to an underlying string written with '+' for boundaries."""
    g = parse_grammar_text(BASE % rules)
    validate(g)
    c = Compiler(g)
    text = "".join(c.space.code(ch) if ch in "+^$" or ch in g.archiphonemes else ch for ch in underlying)
    fst = acc(text)
    for rule in g.rules:
        fst = pynini.compose(fst, c.rule_fst(rule))
    out = sorted({(c.space.decode(o) and "".join(c.space.decode(o)), round(w, 3)) for _, o, w in paths(fst)})
    return [(s, w) for s, w in out]


def forms(rules: str, underlying: str) -> list[str]:
    return [s for s, _ in apply(rules, underlying)]


def test_ltr_harmony_resolves_a_chain_left_to_right() -> None:
    # common practice: one left-to-right rule per value resolves suffix chains (evlerde, odalarda)
    rules = "rule f: A -> e / @front @cons* +? @cons* _\nrule b: A -> a"
    assert forms(rules, "ev+lAr+dA") == ["ev+ler+de"]
    assert forms(rules, "oda+lAr+dA") == ["oda+lar+da"]


def test_set_to_set_maps_element_by_element() -> None:
    rules = "rule v: [ptk] -> [bdk] / _ + @vowel"
    assert forms(rules, "kitap+i") == ["kitab+i"]
    assert forms(rules, "kitap+l") == ["kitap+l"]


def test_deletion_and_insertion() -> None:
    assert forms("rule d: y -> ∅ / @cons + _", "ev+yi") == ["ev+i"]
    assert forms('rule i: "" -> y / @vowel + _ @vowel', "oda+a") == ["oda+ya"]


def test_word_boundaries_in_contexts() -> None:
    rules = "rule final: d -> t / _ $\nrule initial: t -> d / ^ _"
    assert forms(rules, "^tad$") == ["^dat$"]


def test_optional_rule_gives_both_outputs_with_its_weight() -> None:
    out = apply("rule o optional weight 2: a -> e", "^ka$")
    assert out == [("^ka$", 0.0), ("^ke$", 2.0)]


def test_rule_order_matters() -> None:
    assert forms("rule one: a -> e\nrule two: e -> i", "^a$") == ["^i$"]
    assert forms("rule two: e -> i\nrule one: a -> e", "^a$") == ["^e$"]


@pytest.mark.parametrize("direction, expected", [("ltr", "^beee$"), ("rtl", "^beea$"), ("sim", "^beea$")])
def test_directions(direction: str, expected: str) -> None:
    # "a -> e after e": left to right matches the left context against its own output (the change
    # spreads); right to left and simultaneous application match it against the input (common practice).
    assert forms(f"rule s {direction}: a -> e / e _", "^beaa$") == [expected]


def test_replacement_class_may_repeat_symbols() -> None:
    assert forms("rule m: [ptk] -> [bbg] / _ $", "^kap$") == ["^kab$"]
    assert forms("rule m: [ptk] -> [bbg] / _ $", "^kat$") == ["^kab$"]

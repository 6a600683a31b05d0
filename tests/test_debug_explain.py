"""Explaining accepted words: gloss, slot path, underlying form and the rule trace, step by step.

The Turkish and Finnish forms are standard inflected forms (the expected analyses are also in the
grammars' own tests blocks). Turkish: kitap 'book' → kitabı (final stop voiced before a vowel), göz
'eye' → gözünü (pronominal n after the 3rd-person possessive, rounding harmony), ev 'house' →
evlerinde; see Göksel & Kerslake, Turkish: A Comprehensive Grammar (Routledge 2005), chapters on
sound changes and on nominal suffixes (chapter numbers from memory). Finnish: katu 'street' → kadun,
kukka 'flower' → kukan (consonant gradation before a closed syllable); see Karlsson, Finnish: An
Essential Grammar (Routledge), section on consonant gradation (edition and section from memory).
Which rules fire, and in which order, is a property of our grammars and is checked against them.
"""

from __future__ import annotations

import json

import pytest

import morphfst
from morphfst.cli import main
from morphfst.debug import DebugSession, explain, render_explanation
from morphfst.debug.explain import render_columns


def steps(ex, analysis: str) -> list[tuple[str, str, str]]:
    (a,) = [a for a in ex.analyses if a.analysis == analysis]
    assert a.derivation is not None
    return [(s.rule, s.before, s.after) for s in a.derivation.steps]


def test_kitabi_rule_by_rule(tur: morphfst.Language) -> None:
    ex = explain(tur, "kitabı")
    assert {a.analysis for a in ex.analyses} >= {"kitap N;SG;ACC", "kitap N;SG;PSS3S;NOM"}
    assert steps(ex, "kitap N;SG;ACC") == [
        ("buffer_drop", "^kitap+(y)I$", "^kitap+I$"),
        ("voicing", "^kitap+I$", "^kitab+I$"),
        ("back_harmony", "^kitab+I$", "^kitab+<Ib>$"),
        ("unround_harmony", "^kitab+<Ib>$", "^kitab+ı$"),
    ]
    (acc,) = [a for a in ex.analyses if a.analysis == "kitap N;SG;ACC"]
    assert acc.derivation is not None
    assert acc.derivation.underlying == "^kitap+(y)I$"
    assert acc.derivation.bounded == "kitab+ı"
    voicing = acc.derivation.steps[1]
    # the changed position is marked under both strings: the p (column 5 of ^kitap) became b
    assert voicing.before_marks == "     ^" and voicing.after_marks == "     ^"
    assert voicing.line == DebugSession.open(tur).rule("voicing").pos.line
    assert [(c.kind, c.old, c.new) for c in voicing.changes] == [("substitute", "p", "b")]
    # the deletion of the buffer consonant is marked under the old string only
    first = acc.derivation.steps[0]
    assert [(c.kind, c.old, c.new) for c in first.changes] == [("delete", "(y)", "")]
    assert first.before_marks == "       ^^^"


def test_gozunu_rule_by_rule(tur: morphfst.Language) -> None:
    ex = explain(tur, "gözünü")
    assert steps(ex, "göz N;SG;PSS3S;ACC") == [
        ("pronominal_n", "^göz+(s)I<p3>+(y)I$", "^göz+(s)I<p3>+nI$"),
        ("buffer_drop", "^göz+(s)I<p3>+nI$", "^göz+I<p3>+nI$"),
        ("front_harmony", "^göz+I<p3>+nI$", "^göz+<If><p3>+n<If>$"),
        ("round_harmony", "^göz+<If><p3>+n<If>$", "^göz+ü<p3>+nü$"),
    ]


def test_evlerinde_rule_by_rule(tur: morphfst.Language) -> None:
    ex = explain(tur, "evlerinde")
    assert steps(ex, "ev N;PL;PSS3S;LOC") == [
        ("pronominal_n_loc", "^ev+lAr+(s)I<p3>+DA$", "^ev+lAr+(s)I<p3>+nDA$"),
        ("buffer_drop", "^ev+lAr+(s)I<p3>+nDA$", "^ev+lAr+I<p3>+nDA$"),
        ("front_harmony", "^ev+lAr+I<p3>+nDA$", "^ev+ler+<If><p3>+nDe$"),
        ("unround_harmony", "^ev+ler+<If><p3>+nDe$", "^ev+ler+i<p3>+nDe$"),
        ("d_voiced", "^ev+ler+i<p3>+nDe$", "^ev+ler+i<p3>+nde$"),
    ]
    (a,) = [a for a in ex.analyses if a.analysis == "ev N;PL;PSS3S;LOC"]
    insert = a.derivation.steps[0]  # type: ignore[union-attr]
    assert [(c.kind, c.new) for c in insert.changes] == [("insert", "n")]
    assert [(p.node, p.kind) for p in a.path] == [
        ("noun", "class"),
        ("nnumber", "slot"),
        ("possessive", "slot"),
        ("case", "slot"),
        ("end", "end"),
    ]
    assert all(p.allowed for p in a.path)
    assert [(c.form, c.gloss) for c in a.columns] == [("ev", "house"), ("ler", "PL"), ("i", "3SG.POSS"), ("nde", "LOC")]
    assert a.entry is not None and a.entry["lemma"] == "ev" and a.entry["file"].endswith("nouns.tsv")


def test_derivational_path_and_gloss(tur: morphfst.Language) -> None:
    ex = explain(tur, "kitapçılar")
    (a,) = [a for a in ex.analyses if a.analysis == "kitap N;AGT;N;PL;NOM"]
    derive = [p for p in a.path if p.new_pos]
    assert [(p.node, p.new_pos) for p in derive] == [("nderive", "N")]
    assert render_columns(a.columns) == ["  kitap -çı  -lar", "  book  -AGT -PL.NOM"]


def test_provenance_of_surface_symbols(tur: morphfst.Language) -> None:
    (a,) = [a for a in explain(tur, "kitabı").analyses if a.analysis == "kitap N;SG;ACC"]
    d = a.derivation
    assert d is not None
    b = d.bounded.index("b")
    assert d.origins[b].rules == ("voicing",)
    assert d.underlying_symbols[d.origins[b].source] == "p"  # type: ignore[index]
    vowel = d.origins[len(d.bounded) - 1]
    assert vowel.rules == ("back_harmony", "unround_harmony")
    assert d.underlying_symbols[vowel.source] == "I"  # type: ignore[index]


def test_finnish_gradation_rule_by_rule(fin: morphfst.Language) -> None:
    session = DebugSession.open(fin)
    names = {r.name for r in session.grammar.rules}
    if not {"weak_grade", "weak_d", "weak_single"} <= names:
        pytest.skip("the Finnish grammar has no gradation rules of these names")
    ex = explain(fin, "kadun")
    assert steps(ex, "katu N;SG;GEN") == [
        ("weak_grade", "^ka<t>u+n$", "^ka<t-w>u+n$"),
        ("weak_d", "^ka<t-w>u+n$", "^kadu+n$"),
    ]
    ex = explain(fin, "kukan")
    assert steps(ex, "kukka N;SG;GEN") == [
        ("mk_drop", "^ku<kk>a<ad>+n$", "^ku<kk>a+n$"),  # type 10 marks its stem (a drops in the plural)
        ("weak_grade", "^ku<kk>a+n$", "^ku<kk-w>a+n$"),
        ("weak_single", "^ku<kk-w>a+n$", "^kuka+n$"),
    ]


def test_rejected_word_points_to_diagnose(tur: morphfst.Language) -> None:
    ex = explain(tur, "evlarde")
    assert not ex.accepted
    assert "morphfst diagnose evlarde" in render_explanation(ex)


def test_explain_cli(tur: morphfst.Language, capsys: pytest.CaptureFixture[str]) -> None:
    path = tur.meta["grammar_path"]
    assert main(["explain", "-l", path, "kitabı"]) == 0
    out = capsys.readouterr().out
    assert "kitap N;SG;ACC" in out and "voicing" in out and "underlying  ^kitap+(y)I$" in out
    assert "book.SG -ACC" in out
    assert main(["explain", "-l", path, "-f", "jsonl", "--no-rules", "evlerde"]) == 0
    (row,) = [json.loads(line) for line in capsys.readouterr().out.splitlines()]
    assert row["accepted"] and row["analyses"][0]["analysis"] == "ev N;PL;LOC"
    assert "derivation" not in row["analyses"][0]
    assert main(["explain", "-l", path, "-f", "jsonl", "evlerde"]) == 0
    (row,) = [json.loads(line) for line in capsys.readouterr().out.splitlines()]
    assert [s["rule"] for s in row["analyses"][0]["derivation"]["steps"]] == ["front_harmony", "d_voiced"]

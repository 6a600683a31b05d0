"""Diagnosis of rejected words: each failure layer on a deliberately broken small grammar.

The grammars below are invented for these tests (a harmony toy in the style of a Turkic fragment);
the checks are about which part of *the toy grammar* is at fault, not about a real language.
"""

from __future__ import annotations

import json
from pathlib import Path

import pytest

import morphfst
from morphfst.cli import main
from morphfst.debug import DebugSession, diagnose, diagnose_expected, explain, nearest_words

BASE = """\
language toyd "Harmony toy for diagnosis tests"
lexicon "toyd.tsv"

alphabet {
  letters a e ı i o ö u ü b d k l m n p r s t v z
  archiphonemes A D
}

sets {
  vowel     = a e ı i o ö u ü
  front     = e i ö ü
  back      = a ı o u
  cons      = b d k l m n p r s t v z D
  voiceless = k p s t
  skip      = @cons +
}

features {
  pos: N
  Number: SG PL
  Case: NOM DAT LOC
}

flags {
  keeps_p blocks final_voicing "the stem-final stop stays voiceless"
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

constraints {
}

rules {
  rule front_harmony : A -> e / @front @skip* _
  rule back_harmony  : A -> a / @back @skip* _
  rule devoicing     : D -> t / @voiceless + _
  rule voicing       : D -> d
  rule final_voicing : p -> b / _ + @vowel
}
"""

LEXICON = (
    "lemma\tclass\tpos\tgloss\tflags\n"
    "ev\tnoun\tN\thouse\t\nkitap\tnoun\tN\tbook\t\noda\tnoun\tN\troom\t\ntop\tnoun\tN\tball\t\nkap\tnoun\tN\tpot\tkeeps_p\n"
)


def write(directory: Path, name: str, grammar: str, lexicon: str = LEXICON) -> Path:
    directory.mkdir(parents=True, exist_ok=True)
    text = grammar.replace("language toyd", f"language {name}").replace('lexicon "toyd.tsv"', f'lexicon "{name}.tsv"')
    (directory / f"{name}.tsv").write_text(lexicon, encoding="utf-8")
    path = directory / f"{name}.mfg"
    path.write_text(text, encoding="utf-8")
    return path


@pytest.fixture(scope="module")
def grammars(tmp_path_factory: pytest.TempPathFactory) -> dict[str, DebugSession]:
    d = tmp_path_factory.mktemp("diagnose")
    variants = {
        "good": BASE,
        # forbidden order: the number slot forgot its follower (the class still reaches case directly)
        "noorder": BASE.replace("slot number -> case {", "slot number -> end {").replace(
            "noun pos N -> number", "noun pos N -> number case"
        ),
        # wrong rule: front harmony writes a back vowel
        "badrule": BASE.replace("rule front_harmony : A -> e /", "rule front_harmony : A -> a /"),
        # a constraint that forbids the plural locative
        "constrained": BASE.replace("constraints {\n}", "constraints {\n  no_plural_locative: PL excludes LOC\n}"),
    }
    return {name: DebugSession.open(morphfst.load(write(d, f"toyd_{name}", text))) for name, text in variants.items()}


def test_the_base_grammar_accepts_its_words(grammars: dict[str, DebugSession]) -> None:
    lang = grammars["good"].lang
    assert [a.text for a in lang.analyze("evlerde")] == ["ev N;PL;LOC"]
    assert [a.text for a in lang.analyze("kitaba")] == ["kitap N;SG;DAT"]
    assert diagnose(grammars["good"], "evlerde").layer == "accepted"


def test_missing_stem_is_the_lexicon_layer(grammars: dict[str, DebugSession]) -> None:
    d = diagnose(grammars["good"], "masalarda")
    assert d.layer == "lexicon"
    assert d.lexicon is not None
    assert d.lexicon.stem == "masa"
    assert d.lexicon.analysis == "masa N;PL;LOC"
    assert d.lexicon.segmentation == "masa-lar-da"
    assert [a.slot for a in d.lexicon.affixes] == ["number", "case"]
    assert d.lexicon.tsv_line == "masa\tnoun\tN\t?\t".rstrip("\t")
    assert d.lexicon.verified
    assert d.lexicon.lexicon_file and d.lexicon.lexicon_file.endswith("toyd_good.tsv")
    assert "masa" in d.hint and "toyd_good.tsv" in d.hint


def test_exception_flag_is_suggested_for_an_existing_entry(grammars: dict[str, DebugSession]) -> None:
    # 'top' is in the lexicon without the flag, so the grammar writes 'toba'; 'topa' needs keeps_p.
    d = diagnose(grammars["good"], "topa")
    assert d.layer == "sound change"
    assert d.sound_change is not None and d.sound_change.rule is not None
    assert d.sound_change.rule["name"] == "final_voicing"
    assert d.sound_change.exception_flags == ["keeps_p"]
    assert "flag keeps_p" in d.hint and "toyd_good.tsv:5" in d.hint


def test_forbidden_order_names_the_slots_and_the_missing_transition(grammars: dict[str, DebugSession]) -> None:
    s = grammars["noorder"]
    assert not s.lang.analyze("evlerde")
    d = diagnose(s, "evlerde")
    assert d.layer == "morphotactics"
    f = d.morphotactics
    assert f is not None and f.kind == "order"
    assert (f.after, f.after_kind, f.wanted) == ("number", "slot", "case")
    assert f.reachable == ["end"]
    assert f.segmentation == "ev-ler-de"
    assert [mo.slot for mo in f.morphs] == ["number", "case"]
    assert "number -> case" in d.summary
    assert f.slot_line == s.grammar.slots["number"].pos.line


def test_order_the_graph_never_allows(grammars: dict[str, DebugSession]) -> None:
    d = diagnose(grammars["good"], "evdeler")
    assert d.layer == "morphotactics"
    assert d.morphotactics is not None
    assert (d.morphotactics.after, d.morphotactics.wanted) == ("case", "number")


def test_constraint_is_named(grammars: dict[str, DebugSession]) -> None:
    s = grammars["constrained"]
    assert not s.lang.analyze("evlerde")
    d = diagnose(s, "evlerde")
    assert d.layer == "morphotactics"
    assert d.morphotactics is not None and d.morphotactics.kind == "constraint"
    assert d.morphotactics.constraint is not None
    assert d.morphotactics.constraint["name"] == "no_plural_locative"
    assert d.morphotactics.analysis == "ev N;PL;LOC"


def test_wrong_rule_is_the_sound_change_layer_and_names_the_rule(grammars: dict[str, DebugSession]) -> None:
    s = grammars["badrule"]
    assert not s.lang.analyze("evlerde")
    d = diagnose(s, "evlerde")
    assert d.layer == "sound change"
    f = d.sound_change
    assert f is not None
    assert f.analysis == "ev N;PL;LOC"
    assert f.expected == "evlarda"
    assert f.underlying == "^ev+lAr+DA$"
    assert f.rule is not None and f.rule["name"] == "front_harmony"
    assert f.rule["line"] == s.rule("front_harmony").pos.line
    assert (f.position, f.word_has, f.grammar_has) == (3, "e", "a")
    assert f.word_line == "evlerde" and f.expected_line == "evlarda"
    assert f.marks == "   ^"
    assert any(n.word == "evlarda" for n in d.nearest)


def test_sound_change_in_a_correct_grammar_points_at_the_rule_that_wrote_the_symbol(grammars: dict[str, DebugSession]) -> None:
    d = diagnose(grammars["good"], "kitapa")
    assert d.layer == "sound change"
    assert d.sound_change is not None and d.sound_change.rule is not None
    assert d.sound_change.rule["name"] == "final_voicing"
    assert (d.sound_change.word_has, d.sound_change.grammar_has) == ("p", "b")


def test_explain_skips_rules_blocked_by_flags(grammars: dict[str, DebugSession]) -> None:
    (a,) = explain(grammars["good"], "kapa").analyses
    assert a.derivation is not None
    assert a.derivation.skipped == ["final_voicing"]
    assert a.fired == ["back_harmony"]
    assert a.entry is not None and a.entry["flags"] == ["keeps_p"]


def test_characters_outside_the_alphabet(grammars: dict[str, DebugSession]) -> None:
    d = diagnose(grammars["good"], "evxe")
    assert d.layer == "alphabet"
    assert d.outside == ["x"]


def test_nearest_words_come_with_distance_and_analyses(grammars: dict[str, DebugSession]) -> None:
    near = nearest_words(grammars["good"], "evlarde", max_distance=2)
    assert near[0].word == "evlerde" and near[0].distance == 1
    assert near[0].analyses == ["ev N;PL;LOC"]
    assert all(n.distance <= 2 for n in near)
    assert [n.distance for n in near] == sorted(n.distance for n in near)


def test_diagnosis_on_turkish(tur: morphfst.Language) -> None:
    # Turkish voices a stem-final k/p/t/ç before a vowel-initial suffix (kitap → kitabı); common practice,
    # e.g. Göksel & Kerslake, Turkish: A Comprehensive Grammar (2005), chapter on sound changes (from memory).
    d = diagnose(tur, "kitapı")
    assert d.layer == "sound change"
    assert d.sound_change is not None and d.sound_change.rule is not None
    assert d.sound_change.rule["name"] == "voicing"
    # A possessive cannot precede the plural in Turkish (common practice): *evimlerde. The longest
    # morphs are all known, so the finding is an order break in ev-im-ler-de: -im read as the possessive
    # or the copula's 1SG, after which the plural or (ev-im-ler read with the copula's 3PL) a case is
    # wanted; which of these equally cheap readings is reported depends on the grammar's weights.
    # Since the copula's 3PL begins with a marker (<c3>lAr), -ler is read as a plural, which an
    # adjective's number slot (anumber) holds as well as the noun's; a singular noun's cases other than
    # the nominative are the slot case_oblique (its nominative has a slot of its own, nominative_noun).
    d = diagnose(tur, "evimlerde")
    assert d.layer == "morphotactics" and d.morphotactics is not None
    assert d.morphotactics.kind == "order" and d.morphotactics.segmentation == "ev-im-ler-de"
    assert (d.morphotactics.after, d.morphotactics.wanted) in {
        ("predicate", "case"),
        ("predicate", "rcase"),
        ("predicate", "case_oblique"),
        ("predicate", "number"),
        ("possessive", "number"),
        ("possessive", "anumber"),
    }


def test_expected_analysis_each_layer(grammars: dict[str, DebugSession]) -> None:
    d = diagnose_expected(grammars["noorder"], "evlerde", "ev N;PL;LOC")
    assert d.layer == "morphotactics" and d.morphotactics is not None
    assert (d.morphotactics.after, d.morphotactics.wanted) == ("number", "case")
    d = diagnose_expected(grammars["constrained"], "evlerde", "ev N;PL;LOC")
    assert d.morphotactics is not None and d.morphotactics.constraint is not None
    assert d.morphotactics.constraint["name"] == "no_plural_locative"
    d = diagnose_expected(grammars["good"], "masa", "masa N;SG;NOM")
    assert d.layer == "lexicon" and d.lexicon is not None and d.lexicon.verified
    assert d.lexicon.tsv_line == "masa\tnoun\tN\t?"
    # the word is accepted, but not with the expected analysis: the rule output differs at the stem's p
    d = diagnose_expected(grammars["good"], "kitaba", "kitap N;SG;LOC")
    assert d.layer == "sound change" and d.sound_change is not None
    assert d.sound_change.expected == "kitapta"
    assert (d.sound_change.word_has, d.sound_change.grammar_has) == ("b", "p")
    assert d.sound_change.rule is None
    assert [c["name"] for c in d.sound_change.could] == ["final_voicing"]
    assert d.analyses == ["kitap N;SG;DAT"]
    assert diagnose_expected(grammars["good"], "evlerde", "ev N;PL;LOC").layer == "accepted"


def test_diagnose_cli_table_and_jsonl(grammars: dict[str, DebugSession], capsys: pytest.CaptureFixture[str]) -> None:
    path = grammars["badrule"].meta["grammar_path"]
    assert main(["diagnose", "-l", path, "evlerde"]) == 0
    out = capsys.readouterr().out
    assert "evlerde: sound change" in out and "front_harmony" in out and "rule output  evlarda" in out
    assert main(["diagnose", "-l", path, "-f", "jsonl", "evlerde", "evlarda"]) == 0
    rows = [json.loads(line) for line in capsys.readouterr().out.splitlines()]
    assert [r["layer"] for r in rows] == ["sound change", "accepted"]
    assert rows[0]["sound_change"]["rule"]["name"] == "front_harmony"
    assert main(["diagnose", "-l", path, "--fail-on-reject", "evlerde"]) == 1
    assert main(["diagnose", "-l", path, "--distance", "9", "evlerde"]) == 2
    capsys.readouterr()
    assert main(["diagnose", "-l", path, "evlarda", "--expect", "ev N;SG;LOC"]) == 0
    assert "sound change" in capsys.readouterr().out
    assert main(["diagnose", "-l", path, "evlarda", "--expect", "ev"]) == 2


@pytest.mark.parametrize("word", ["kitabı", "kitapı", "evlerde", "evimlerde", "gözlerimizden", "okudum"])
def test_meeting_in_the_middle_finds_what_the_whole_cascade_finds(tur_small: morphfst.Language, word: str) -> None:
    # match() runs the first rules forward on the machine and meets the rest, inverted from the word,
    # in the middle; the analyses and best weights must be those of the machine run through the whole
    # cascade (forward, then the final step) and kept where it gives the word
    import pynini

    from morphfst.compile.fstutil import acc, paths

    session = DebugSession.open(tur_small)
    machine = session.stem_group_fst(list(session.grammar.lexicon))
    k, _ = session.back_lattice(word)
    assert 0 < k < len(session.grammar.rules)  # both sides do some of the work on this grammar
    whole = machine
    for rule in session.rules_for(frozenset()):
        whole = pynini.compose(whole, session.compiler.rule_fst(rule)).connect()
    whole = pynini.compose(pynini.compose(whole, session.realize), acc(word)).connect()

    def best(fst: pynini.Fst) -> dict[str, float]:
        out: dict[str, float] = {}
        for analysis, _, weight in paths(pynini.shortestpath(fst, nshortest=200), 200):
            out[analysis] = min(out.get(analysis, weight), round(weight, 4))
        return out

    assert best(session.match(machine, word)) == best(whole)

"""Grammar-language features for broad grammars: stem rules per class, numbered class names,
included files, labels shared by every layout, a byte-order mark."""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import TOY_GRAMMAR, write_toy

import morphfst
from morphfst.compile.loader import load_model
from morphfst.errors import UserError

# A toy gradation: a lemma's t between vowels before the last vowel is a gradation site <t>, which
# surfaces as d before a closed syllable (a consonant-initial suffix), like the weak grade of katu.
STEM_GRAMMAR = (
    TOY_GRAMMAR.replace("letters a e i o u k l m n p r s t", "letters a d e i o u k l m n p r s t")
    .replace(
        "archiphonemes A",
        "archiphonemes A <t>",
    )
    .replace(
        "classes {\n  noun pos N -> number\n}",
        """classes {
  noun pos N -> number
  1F pos N -> number stems grade_t
  verb pos N -> number stems infinitive grade_t
}

stems grade_t {
  rule site : t -> <t> / @vowel _ @vowel $
}

stems infinitive {
  rule ending : m a -> ∅ / _ $
}""",
    )
    .replace(
        "rules {",
        """rules {
  rule weak   : <t> -> d / _ @vowel + @cons
  rule strong : <t> -> t""",
    )
    .replace("  kalar => ka N;PL;NOM\n", "")
)

STEM_LEXICON = "lemma\tclass\tpos\tgloss\nka\tnoun\tN\thouse\nkatu\t1F\tN\tstreet\nmetu\tnoun\tN\tplain\npetuma\tverb\tN\tact\n"


def test_stem_rules_rewrite_the_lemma_into_its_stem(tmp_path: Path) -> None:
    lang = morphfst.load(write_toy(tmp_path, STEM_GRAMMAR, STEM_LEXICON))
    assert [a.text for a in lang.analyze("katu")] == ["katu N;SG;NOM"]  # strong grade at the word end
    assert [a.text for a in lang.analyze("kadular")] == ["katu N;PL;NOM"]  # weak grade before a closed syllable
    assert [a.text for a in lang.analyze("kaduna")] == ["katu N;SG;LOC"]
    assert lang.analyze("katular") == []
    assert [a.text for a in lang.analyze("metular")] == ["metu N;PL;NOM"]  # class noun: no stem rules
    assert [a.text for a in lang.analyze("pedular")] == ["petuma N;PL;NOM"]  # two groups, in order
    entry = next(e for e in load_model(tmp_path / "toy.mfg").lexicon if e.lemma == "katu")
    assert entry.stem == ["k", "a", "<t>", "u"]


def test_undeclared_stem_rules_are_a_located_error(tmp_path: Path) -> None:
    bad = write_toy(tmp_path, STEM_GRAMMAR.replace("stems infinitive grade_t", "stems infinitive grade_x"), STEM_LEXICON)
    with pytest.raises(UserError) as info:
        load_model(bad)
    assert "undeclared stem rules 'grade_x'" in str(info.value)
    assert info.value.position is not None and info.value.position.line > 0


def test_optional_stem_rule_giving_two_stems_is_an_error(tmp_path: Path) -> None:
    grammar = STEM_GRAMMAR.replace("rule site : t ->", "rule site optional : t ->")
    with pytest.raises(UserError) as info:
        load_model(write_toy(tmp_path, grammar, STEM_LEXICON))
    assert "give 2 stems (ka<t>u, katu) for lemma 'katu'" in str(info.value)
    assert info.value.position is not None and info.value.position.line == 3  # the lexicon line of katu


def test_an_explicit_stem_column_wins_over_stem_rules(tmp_path: Path) -> None:
    lexicon = "lemma\tclass\tpos\tgloss\tstem\nka\tnoun\tN\thouse\t\nkatu\t1F\tN\tstreet\tkatu\n"
    entry = next(e for e in load_model(write_toy(tmp_path, STEM_GRAMMAR, lexicon)).lexicon if e.lemma == "katu")
    assert entry.stem == ["k", "a", "t", "u"]


def test_guessed_stems_go_through_the_class_stem_rules(tmp_path: Path) -> None:
    grammar = STEM_GRAMMAR.replace(
        "1F pos N -> number stems grade_t", "1F pos N -> number stems grade_t guess @cons @vowel t @vowel"
    )
    lang = morphfst.load(write_toy(tmp_path, grammar, STEM_LEXICON))
    guessed = [a.text for a in lang.guess("podular")]
    assert "potu N;PL;NOM" in guessed


def test_include_reads_another_file_in_place(tmp_path: Path) -> None:
    case_slot = 'slot case {\n  ""     NOM\n  "nA"   LOC\n}\n'
    assert case_slot in TOY_GRAMMAR
    main = TOY_GRAMMAR.replace(case_slot, 'include "parts/case.mfg"\n')
    (tmp_path / "parts").mkdir(parents=True)
    (tmp_path / "parts" / "case.mfg").write_text(
        '# the case slot, in a file of its own\nslot case {\n  ""     NOM\n  "nA"   LOC\n}\n', "utf-8"
    )
    path = write_toy(tmp_path, main)
    g = load_model(path)
    assert [a.form_text for a in g.slots["case"].affixes] == ["", "nA"]
    assert any(src.endswith("case.mfg") for src in g.sources)  # part of the source hash


def test_include_errors_point_into_the_included_file(tmp_path: Path) -> None:
    (tmp_path / "part.mfg").write_text('slot case {\n  "nA" LOC\n  oops\n}\n', "utf-8")
    path = write_toy(tmp_path, TOY_GRAMMAR.replace("slot case {", 'include "part.mfg"\nslot case2 {'))
    with pytest.raises(UserError) as info:
        load_model(path)
    assert info.value.position is not None and info.value.position.file.endswith("part.mfg") and info.value.position.line == 3
    missing = write_toy(tmp_path / "m", TOY_GRAMMAR.replace("slot case {", 'include "nowhere.mfg"\nslot case {'))
    with pytest.raises(UserError, match="cannot read included file"):
        load_model(missing)
    (tmp_path / "c").mkdir()
    (tmp_path / "c" / "loop.mfg").write_text('include "loop.mfg"\n', "utf-8")
    cyclic = write_toy(tmp_path / "c", TOY_GRAMMAR.replace("slot case {", 'include "loop.mfg"\nslot case {'))
    with pytest.raises(UserError, match="include cycle"):
        load_model(cyclic)


def test_shared_labels_apply_to_every_layout(tmp_path: Path) -> None:
    grammar = (
        TOY_GRAMMAR
        + 'labels {\n  LOC "locative"\n  PL "plural"\n}\n\nlayout N "noun" {\n  rows Case\n  columns Number\n  label PL "many"\n}\n'
    )
    g = load_model(write_toy(tmp_path, grammar))
    assert g.layouts[0].labels == {"LOC": "locative", "PL": "many"}  # the layout's own label wins


def test_a_byte_order_mark_is_accepted(tmp_path: Path) -> None:
    path = write_toy(tmp_path)
    path.write_bytes(b"\xef\xbb\xbf" + path.read_bytes())
    assert load_model(path).name == "toy"

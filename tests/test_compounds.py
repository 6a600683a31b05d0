"""The ``compound`` block: syntax, located errors, seams, ranking, bounds, analysis only, walk == composition.

The toy language is invented for these tests (no outside source): nouns inflect for number and case,
and a noun in the nominative or genitive singular may stand before another noun.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import write_toy

import morphfst
from morphfst.errors import UserError
from morphfst.language.syntax import parse_grammar_text

GRAMMAR = """\
language ctoy "Toy compounds"
lexicon "toy.tsv"

alphabet {
  letters a e i o u k l m n p r s t
}

features {
  pos: N ADJ
  Number: SG PL
  Case: NOM GEN LOC
}

classes {
  noun pos N -> number
  short pos N -> number
  adj pos ADJ -> number
}

slot number -> case {
  ""     SG
  "t"    PL -> plcase
}

slot case {
  ""     NOM
  "n"    GEN
  "ssa"  LOC
}

slot plcase {
  ""     NOM
}

COMPOUND
"""

BLOCK = """\
compound {
  first N
  forms SG NOM | SG GEN
  last N
  parts 3
  min 3
  weight 0.5
}
"""

LEXICON = (
    "lemma\tclass\tpos\tgloss\n"
    "kala\tnoun\tN\tfish\n"
    "talo\tnoun\tN\thouse\n"
    "tie\tnoun\tN\troad\n"
    "uu\tshort\tN\tegg\n"
    "pelto\tnoun\tN\tfield\n"
    "kalatalo\tnoun\tN\tfishery\n"
    "iso\tadj\tADJ\tbig\n"
)


def toy(tmp_path: Path, block: str = BLOCK, lexicon: str = LEXICON) -> morphfst.Language:
    return morphfst.load(write_toy(tmp_path, GRAMMAR.replace("COMPOUND", block), lexicon))


@pytest.fixture(scope="module")
def lang(tmp_path_factory: pytest.TempPathFactory) -> morphfst.Language:
    return toy(tmp_path_factory.mktemp("compounds"))


def readings(lang: morphfst.Language, word: str) -> list[tuple[str, str, str]]:
    return [(a.text, a.segmentation, a.gloss) for a in lang.analyze(word)]


# ---- syntax and errors ---------------------------------------------------------------------------------


def test_block_is_parsed() -> None:
    g = parse_grammar_text(BLOCK)
    (c,) = g.compounds
    assert (c.first, c.forms, c.last, c.parts, c.min_letters, c.weight) == (
        ["N"],
        [["SG", "NOM"], ["SG", "GEN"]],
        ["N"],
        3,
        3,
        0.5,
    )


def test_defaults() -> None:
    (c,) = parse_grammar_text("compound {\n  first N\n  forms SG\n  last N\n}\n").compounds
    assert (c.parts, c.min_letters, c.weight) == (2, 1, 0.0)


def test_names_that_are_keywords_elsewhere_still_work() -> None:
    g = parse_grammar_text('sets {\n  first = a\n  last = a\n}\nslot parts {\n  "" SG name min\n}\n')
    assert set(g.sets) == {"first", "last"} and "parts" in g.slots


def error_of(tmp_path: Path, block: str) -> UserError:
    with pytest.raises(UserError) as info:
        toy(tmp_path, block)
    return info.value


@pytest.mark.parametrize(
    ("block", "message", "line", "column"),
    [
        ("compound {\n  first NOUN\n  forms SG NOM\n  last N\n}\n", "'NOUN' in 'first' is neither", 2, 9),
        ("compound {\n  first N\n  forms SG NOM\n  last N VERB\n}\n", "'VERB' in 'last'", 4, 10),
        ("compound {\n  first N\n  forms SG NOM | SG ELA\n  last N\n}\n", "'ELA' in 'forms' is not a declared feature", 3, 21),
        ("compound {\n  first N\n  forms SG N\n  last N\n}\n", "'N' in 'forms'", 3, 12),
        ("compound {\n  first N\n  forms SG\n  last N\n  parts 1\n}\n", "parts 1 is not a whole number of at least 2", 5, 9),
        ("compound {\n  first N\n  forms SG\n  last N\n  parts 2.5\n}\n", "parts 2.5", 5, 9),
        ("compound {\n  first N\n  forms SG\n  last N\n  parts 7\n}\n", "parts 7 is more than 6", 5, 9),
        ("compound {\n  first N\n  forms SG\n  last N\n  min 0\n}\n", "min 0 is not a whole number of at least 1", 5, 7),
        ("compound {\n  first N\n  forms SG\n  last N\n  weight -1\n}\n", "weight -1 is negative", 5, 10),
        ("compound {\n  first N\n  forms SG\n  last N\n  min 2\n  min 3\n}\n", "'min' given twice", 6, 3),
        ("compound {\n  first N\n  forms SG\n  last N\n  agree\n  agree\n}\n", "'agree' given twice", 6, 3),
        ("compound {\n  first N\n  last N\n}\n", "no 'forms' line", 1, 1),
    ],
)
def test_errors_are_located(tmp_path: Path, block: str, message: str, line: int, column: int) -> None:
    err = error_of(tmp_path, block)
    assert message in err.message
    assert err.position is not None and err.position.file.endswith("toy.mfg")
    first_line = GRAMMAR.splitlines().index("COMPOUND") + 1
    assert (err.position.line - first_line + 1, err.position.column) == (line, column)


def test_syntax_error_in_block_is_located(tmp_path: Path) -> None:
    err = error_of(tmp_path, "compound {\n  first N\n  forms SG\n  last N\n  parts three\n}\n")
    assert err.position is not None and err.position.line > 0 and "three" in err.message


# ---- analysis ----------------------------------------------------------------------------------------------


def test_two_parts_with_a_seam(lang: morphfst.Language) -> None:
    assert readings(lang, "talokala") == [("talokala N;SG;NOM", "talo-kala", "house-fish.SG.NOM")]
    (a,) = lang.analyze("talokalassa")
    assert (a.lemma, a.pos, a.features) == ("talokala", "N", ("SG", "LOC"))
    assert [(m.form, m.gloss, m.kind, m.underlying) for m in a.morphs[:2]] == [
        ("talo", "house", "stem", "talo"),
        ("kala", "fish", "stem", "kala"),
    ]
    assert a.gloss == "house-fish.SG-LOC"
    assert [s.text for s in lang.segment("talokalassa")] == ["talo-kala-ssa"]


def test_genitive_first_part_keeps_its_ending_in_the_lemma(lang: morphfst.Language) -> None:
    (a,) = lang.analyze("talonkalassa")
    assert (a.lemma, a.segmentation) == ("talonkala", "talon-kala-ssa")
    assert a.morphs[0].underlying == "talo"


def test_only_the_declared_forms_and_parts_of_speech(lang: morphfst.Language) -> None:
    assert lang.analyze("talotkala") == []  # plural first part: not a declared form
    assert lang.analyze("talossakala") == []  # locative first part
    assert lang.analyze("isokala") == []  # an adjective is not a first part here
    assert lang.analyze("kalaiso") == []  # nor a last part
    assert [a.text for a in lang.analyze("talokalat")] == ["talokala N;PL;NOM"]  # the last part inflects freely


def test_max_parts(lang: morphfst.Language) -> None:
    assert readings(lang, "talokalapelto") == [("talokalapelto N;SG;NOM", "talo-kala-pelto", "house-fish-field.SG.NOM")]
    assert lang.analyze("talokalapeltotalo") == []  # four parts, three allowed


def test_min_letters_bounds_non_last_parts_only(lang: morphfst.Language) -> None:
    assert lang.analyze("uukala") == []  # a first part of two letters, min 3
    assert [a.text for a in lang.analyze("kalauu")] == ["kalauu N;SG;NOM"]  # the last part may be short
    assert [a.text for a in lang.analyze("tiekala")] == ["tiekala N;SG;NOM"]  # three letters


def test_classes_may_be_named(tmp_path: Path) -> None:
    lang = toy(tmp_path, BLOCK.replace("first N", "first short").replace("min 3", "min 1"))
    assert [a.text for a in lang.analyze("uukala")] == ["uukala N;SG;NOM"]
    assert lang.analyze("talokala") == []  # talo is of class noun, not short


def test_seam_weight_and_ranking(lang: morphfst.Language) -> None:
    # no lexicon weights here: each seam weighs the block's 0.5, the heaviest entry's 0 and 1
    (a,) = lang.analyze("talokala")
    assert a.weight == pytest.approx(1.5)
    assert lang.analyze("talokalapelto")[0].weight == pytest.approx(3.0)


def _paths(lang: morphfst.Language, word: str) -> list[tuple[str, float]]:
    """The bounded surfaces and weights of every path of ``word``, compound paths included."""
    return [(side, weight) for side, _, weight in lang.fast.bounded.walk(lang.normalize(word))]


def test_lexicon_word_ranks_above_its_compound_reading(lang: morphfst.Language) -> None:
    # the transducer has both paths, the compound one heavier; analyze offers the lexicon word only
    paths = _paths(lang, "kalatalossa")
    assert len(paths) == 2 and lang.fast.seam in paths[1][0] and lang.fast.seam not in paths[0][0]
    assert paths[0][1] < paths[1][1]
    found = lang.analyze("kalatalossa")
    assert [(a.text, a.segmentation) for a in found] == [("kalatalo N;SG;LOC", "kalatalo-ssa")]
    assert [(a.text, a.segmentation) for a in lang.analyze_composed("kalatalossa")] == [("kalatalo N;SG;LOC", "kalatalo-ssa")]


def test_lexicon_word_ranks_above_compound_with_counted_weights(tmp_path: Path) -> None:
    # the compound's parts are frequent and the lexicon word rare: the seam still outweighs the difference
    lexicon = "lemma\tclass\tpos\tgloss\tcount\nkala\tnoun\tN\tfish\t100000\ntalo\tnoun\tN\thouse\t100000\nkalatalo\tnoun\tN\tfishery\t1\n"
    lang = toy(tmp_path, BLOCK, lexicon)
    paths = _paths(lang, "kalatalo")
    assert [side.replace(lang.fast.seam, "-") for side, _ in paths] == ["kalatalo", "kala-talo"]
    assert [a.segmentation for a in lang.analyze("kalatalo")] == ["kalatalo"]


def test_fewer_seams_rank_first(lang: morphfst.Language) -> None:
    # kalatalo + pelto (one seam) before kala + talo + pelto (two seams)
    found = lang.analyze("kalatalopelto")
    assert [a.segmentation for a in found] == ["kalatalo-pelto", "kala-talo-pelto"]


def test_analysis_only(tmp_path: Path, lang: morphfst.Language) -> None:
    # the generator has no compounds; generate() makes an unlisted compound's forms from its last
    # part (Language.compound_split), with the first part as the lemma writes it
    assert [f.form for f in lang.generate("kala", "N;SG;LOC")] == ["kalassa"]
    assert lang.compound_split("talokala") == ("talo", "kala")
    assert [f.form for f in lang.generate("talokala", "N;SG;LOC")] == ["talokalassa"]
    assert lang.generate("talokalassa", "N;SG;LOC") == []  # not a citation form
    plain = toy(tmp_path / "plain", "")
    assert plain.analyze("talokala") == []
    assert plain.stats()["generator"] == lang.stats()["generator"]


def test_more_than_one_block(tmp_path: Path) -> None:
    adjectives = "compound {\n  first ADJ\n  forms SG NOM\n  last N\n}\n"
    lang = toy(tmp_path, BLOCK + adjectives)
    assert [a.text for a in lang.analyze("isokala")] == ["isokala N;SG;NOM"]
    assert lang.analyze("isonkala") == []  # the genitive is declared for nouns only
    assert [a.text for a in lang.analyze("talonkala")] == ["talonkala N;SG;NOM"]


WORDS = ["talokala", "talonkalassa", "kalatalossa", "kalatalopelto", "talokalapelto", "tiekalat", "kalauu", "kala", "uukala"]


def test_walk_agrees_with_composition(lang: morphfst.Language) -> None:
    for word in WORDS:
        walked, composed = lang.analyze(word), lang.analyze_composed(word)
        assert [(a.text, a.segmentation, a.gloss) for a in walked] == [(a.text, a.segmentation, a.gloss) for a in composed]
        assert all(abs(a.weight - b.weight) < 1e-3 for a, b in zip(walked, composed))
        assert lang.accepts(word) == bool(walked)


def test_agree_puts_every_part_in_the_same_form(tmp_path: Path) -> None:
    """With ``agree`` the last part is in the very bundle its first parts are in (and in no other
    features): the parts share the case of the whole, as Finnish compound numerals do."""
    block = BLOCK.replace("  weight 0.5\n", "  weight 0.5\n  agree\n")
    lang = toy(tmp_path, block)
    assert lang.meta["compounds"][0]["agree"] is True
    # the lemma is the parts' own lemmas (a compound numeral's lemma is its nominative)
    assert [(a.text, a.segmentation) for a in lang.analyze("peltontien")] == [("peltotie N;SG;GEN", "pelton-tie-n")]
    assert lang.analyze("peltotien") == []  # a nominative part before a genitive last part
    assert lang.analyze("peltontiessa") == []  # the locative is not a bundle of forms
    assert [a.segmentation for a in lang.analyze("peltotietalo")] == ["pelto-tie-talo"]
    # without agree, the last part takes any form
    plain = toy(tmp_path / "plain")
    assert [a.text for a in plain.analyze("peltotien")] == ["peltotie N;SG;GEN"]


def test_lastmin_bounds_the_last_part(tmp_path: Path) -> None:
    """``lastmin``: the last part's lemma has at least that many letters (the first parts keep ``min``)."""
    lang = toy(tmp_path, BLOCK.replace("  weight 0.5\n", "  weight 0.5\n  lastmin 4\n"))
    assert lang.meta["compounds"][0]["lastmin"] == 4
    assert lang.analyze("kalatie") == []  # tie has three letters
    assert [a.text for a in lang.analyze("tiekala")] == ["tiekala N;SG;NOM"]
    assert [a.text for a in lang.analyze("tiepelto")] == ["tiepelto N;SG;NOM"]


def test_order_of_groups(tmp_path: Path) -> None:
    """``group`` lines name sets of parts of speech or classes, and ``order`` is a regular expression
    of group names that the parts, the last one too, must follow."""
    block = BLOCK.replace(
        "  weight 0.5\n", '  weight 0.5\n  group BIG noun\n  group SMALL short\n  order "BIG BIG? SMALL | BIG BIG"\n'
    ).replace("min 3", "min 1")
    g = parse_grammar_text(block)
    assert g.compounds[0].groups == {"BIG": ["noun"], "SMALL": ["short"]}
    lang = toy(tmp_path, block)
    assert [a.text for a in lang.analyze("kalauu")] == ["kalauu N;SG;NOM"]
    assert [a.text for a in lang.analyze("talokalauu")] == ["talokalauu N;SG;NOM"]
    assert [a.text for a in lang.analyze("talokala")] == ["talokala N;SG;NOM"]
    assert lang.analyze("uukala") == []  # SMALL only last
    assert lang.analyze("kalauuuu") == []  # not two SMALL
    assert lang.analyze("talokalapelto") == []  # BIG BIG BIG is not in the order
    for word in ["kalauu", "talokalauu"]:
        walked, composed = lang.analyze(word), lang.analyze_composed(word)
        assert [(a.text, a.segmentation) for a in walked] == [(a.text, a.segmentation) for a in composed]


@pytest.mark.parametrize(
    ("block", "message"),
    [
        ('compound {\n  first N\n  forms SG\n  last N\n  group A noun\n  order "A B"\n}\n', "'B' is not a group"),
        ('compound {\n  first N\n  forms SG\n  last N\n  group A nouns\n  order "A A"\n}\n', "'nouns' in group 'A'"),
        ("compound {\n  first N\n  forms SG\n  last N\n  group A noun\n}\n", "groups but no 'order'"),
        ('compound {\n  first N\n  forms SG\n  last N\n  group A noun\n  order "(A"\n}\n', "malformed"),
        ("compound {\n  first N\n  forms SG\n  last N\n  lastmin 0\n}\n", "lastmin 0 is not a whole number"),
    ],
)
def test_order_and_lastmin_errors(tmp_path: Path, block: str, message: str) -> None:
    err = error_of(tmp_path, block)
    assert message in err.message


def test_a_bare_bundle_takes_an_uninflected_first_part(tmp_path: Path) -> None:
    """``forms -``: a first part with no feature at all, an uninflected word (an indeclinable adjective
    here; Finnish eri+kokoinen, jälleen+rakennus); an inflecting word's forms do not match it."""
    grammar = GRAMMAR.replace("  adj pos ADJ -> number\n", "  adj pos ADJ -> number\n  bare pos ADJ -> bare\n")
    grammar = grammar.replace("COMPOUND", 'slot bare {\n  ""\n}\n\ncompound {\n  first ADJ\n  forms -\n  last N\n}\n')
    lexicon = LEXICON + "eri\tbare\tADJ\tother\n"
    lang = morphfst.load(write_toy(tmp_path, grammar, lexicon))
    assert lang.meta["compounds"][0]["forms"] == [[]]
    assert [(a.text, a.segmentation) for a in lang.analyze("erikalassa")] == [("erikala N;SG;LOC", "eri-kala-ssa")]
    assert lang.analyze("isokala") == []  # iso is in SG NOM, not bare
    (c,) = parse_grammar_text("compound {\n  first ADJ\n  forms - | SG NOM\n  last N\n}\n").compounds
    assert c.forms == [[], ["SG", "NOM"]]

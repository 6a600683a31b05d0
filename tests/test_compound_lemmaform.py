"""A ``compound`` block's ``lastforms``, ``lemmaform`` and ``hide`` lines: a last part that must carry
a possessive, a lemma that ends with the last part's possessed form, the possessive left out of the
analysis (the shape of Turkish dil + bilgi-si 'grammar').

The toy language is invented for these tests (no outside source): nouns take a derivation, number,
a possessive and a case; the possessive -si loses its s after a consonant, before which p voices.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import write_toy

import morphfst
from morphfst.errors import UserError

GRAMMAR = """\
language ptoy "Toy possessive compounds"
lexicon "toy.tsv"

alphabet {
  letters a b d e g i k l m n p r s t z
}

sets {
  cons = b d g k l m n p r s t z
}

features {
  pos: N
  Derivation: ABSTR
  Number: SG PL
  Possession: PSS3S PSS1P
  Case: NOM ACC LOC
}

classes {
  noun pos N -> derive number
}

slot derive {
  "lik"  ABSTR -> number
}

slot number -> possessive case {
  ""     SG
  "ler"  PL
}

slot possessive -> case {
  "si"   PSS3S
  "imiz" PSS1P
}

slot case {
  ""     NOM
  "ni"   ACC
  "de"   LOC
}

rules {
  rule buffer_s : s -> ∅ / @cons + _ i
  rule buffer_i : i -> ∅ / [a e i] + _ m
  rule voicing  : p -> b / _ + [a e i]
  # a spelling tolerance: b written p (analysis only)
  rule written_p optional lenient weight 3.0 : b -> p
}

COMPOUND
"""

BLOCK = """\
compound {
  first noun
  forms SG NOM
  last noun
  min 3
  lastmin 3
  weight 2
  lastforms SG PSS3S | PL PSS3S | SG PSS1P | PL PSS1P
  lemmaform SG PSS3S NOM
  hide PSS3S
}
"""

LEXICON = "lemma\tclass\tpos\tgloss\ndil\tnoun\tN\tlanguage\nbilgi\tnoun\tN\tknowledge\nkitap\tnoun\tN\tbook\nel\tnoun\tN\thand\n"


def toy(tmp_path: Path, block: str = BLOCK) -> morphfst.Language:
    return morphfst.load(write_toy(tmp_path, GRAMMAR.replace("COMPOUND", block), LEXICON))


@pytest.fixture(scope="module")
def lang(tmp_path_factory: pytest.TempPathFactory) -> morphfst.Language:
    return toy(tmp_path_factory.mktemp("ptoy"))


def texts(lang: morphfst.Language, word: str) -> list[str]:
    return [a.text for a in lang.analyze(word)]


def test_the_lemma_ends_with_the_possessed_form(lang: morphfst.Language) -> None:
    assert texts(lang, "dilbilgisi") == ["dilbilgisi N;SG;NOM"]
    assert texts(lang, "dilbilgisini") == ["dilbilgisi N;SG;ACC"]
    assert texts(lang, "dilbilgileri") == ["dilbilgisi N;PL;NOM"]
    # a personal possessive stands instead of the compound's own
    assert texts(lang, "dilbilgimiz") == ["dilbilgisi N;SG;PSS1P;NOM"]
    assert texts(lang, "dilbilgimizde") == ["dilbilgisi N;SG;PSS1P;LOC"]


def test_the_lemma_is_the_form_as_written(lang: morphfst.Language) -> None:
    # kitap + -si is kitabi (the buffer s drops, the p voices): the lemma writes it so
    (a,) = lang.analyze("dilkitabini")
    assert (a.lemma, a.features, a.segmentation) == ("dilkitabi", ("SG", "ACC"), "dil-kitab-i-ni")
    assert [m.kind for m in a.morphs[:2]] == ["stem", "stem"]
    assert a.morphs[0].gloss == "language"
    assert texts(lang, "dilkitabimiz") == ["dilkitabi N;SG;PSS1P;NOM"]


def test_only_possessed_last_parts(lang: morphfst.Language) -> None:
    assert lang.analyze("dilbilgi") == []  # no possessive
    assert lang.analyze("dilbilgini") == []  # a case without a possessive
    assert lang.analyze("dilbilgiliksi") == []  # a derivation before the possessive
    assert lang.analyze("elbilgisi") == []  # a first part of two letters (min 3)
    assert lang.analyze("dilelsi") == []  # a last part of two letters (lastmin 3)


def test_listed_words_keep_their_readings(lang: morphfst.Language) -> None:
    assert texts(lang, "bilgisi") == ["bilgi N;SG;PSS3S;NOM"]
    assert texts(lang, "kitabimiz") == ["kitap N;SG;PSS1P;NOM"]


def test_analysis_only(lang: morphfst.Language) -> None:
    assert lang.generate("dilbilgisi", "N;SG;ACC") == []
    assert lang.compound_split("dilbilgisi") is None


def test_walk_agrees_with_composition(lang: morphfst.Language) -> None:
    for word in ["dilbilgisi", "dilbilgisini", "dilbilgimiz", "dilkitabini", "dilbilgileri", "bilgisi", "dilbilgi"]:
        walked, composed = lang.analyze(word), lang.analyze_composed(word)
        assert [(a.text, a.segmentation, a.gloss) for a in walked] == [(a.text, a.segmentation, a.gloss) for a in composed]
        assert all(abs(a.weight - b.weight) < 1e-3 for a, b in zip(walked, composed))


def test_without_the_new_lines_the_last_part_keeps_its_lemma(tmp_path: Path) -> None:
    plain = "compound {\n  first noun\n  forms SG NOM\n  last noun\n  min 3\n}\n"
    lang = toy(tmp_path, plain)
    assert "dilbilgi N;SG;PSS3S;ACC" in texts(lang, "dilbilgisini")
    assert "dilbilgi N;SG;NOM" in texts(lang, "dilbilgi")


def test_metadata_records_the_lines(lang: morphfst.Language) -> None:
    (block,) = lang.meta["compounds"]
    assert block["lemmaform"] == ["SG", "PSS3S", "NOM"]
    assert block["hide"] == ["PSS3S"]
    assert block["lastforms"][0] == ["SG", "PSS3S"]


def test_strict_reads_the_parts_without_the_lenient_rules(tmp_path: Path, lang: morphfst.Language) -> None:
    # kitabi written kitapi is read by the lenient rule, alone and in a compound
    assert texts(lang, "kitapini")[:1] == ["kitap N;SG;PSS3S;ACC"]
    assert texts(lang, "dilkitapini") == ["dilkitabi N;SG;ACC"]
    strict = toy(tmp_path, BLOCK.replace("hide PSS3S", "hide PSS3S\n  strict"))
    assert texts(strict, "kitapini")[:1] == ["kitap N;SG;PSS3S;ACC"]
    assert strict.analyze("dilkitapini") == []
    assert texts(strict, "dilkitabini") == ["dilkitabi N;SG;ACC"]
    assert strict.meta["compounds"][0]["strict"] is True


@pytest.mark.parametrize(
    ("old", "new", "message"),
    [
        ("hide PSS3S", "hide PSS9", "'PSS9' in 'hide' is not a declared feature"),
        ("lemmaform SG PSS3S NOM", "lemmaform SG PSS3S NOMX", "'NOMX' in 'lemmaform'"),
        ("lastforms SG PSS3S |", "lastforms SG PSSX |", "'PSSX' in 'lastforms'"),
        ("weight 2", "weight 2\n  agree", "'agree' with 'lastforms'"),
    ],
)
def test_errors_are_located(tmp_path: Path, old: str, new: str, message: str) -> None:
    with pytest.raises(UserError) as info:
        toy(tmp_path, BLOCK.replace(old, new))
    assert message in info.value.message
    assert info.value.position is not None and info.value.position.line > 0

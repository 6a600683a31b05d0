"""The runtime API and the compiler features behind it: flags, constraints, derivation, caching."""

from __future__ import annotations

from pathlib import Path

import pytest
from toygrammar import TOY_GRAMMAR, TOY_LEXICON, write_toy

import morphfst
from morphfst.errors import UserError
from morphfst.language.syntax import parse_grammar_text


def test_analysis_object(tur: morphfst.Language) -> None:
    a = tur.analyze("evlerde")[0]
    assert (a.lemma, a.pos, a.features) == ("ev", "N", ("PL", "LOC"))
    assert a.text == "ev N;PL;LOC"
    assert a.ud_feats() == "Case=Loc|Number=Plur" and a.upos() == "NOUN"
    assert a.morphs[0].kind == "stem" and a.morphs[0].gloss == "house"
    assert [(m.slot, m.underlying) for m in a.morphs[1:]] == [("nnumber", "lAr"), ("case", "DA")]
    assert a.to_dict()["segmentation"] == "ev-ler-de"


def test_ranked_and_deterministic(tur: morphfst.Language) -> None:
    first = [a.text for a in tur.analyze("kitabı")]
    assert first == ["kitap N;SG;PSS3S;NOM", "kitap N;SG;ACC"]  # the accusative carries 0.1 more
    assert [a.text for a in tur.analyze("kitabı")] == first
    ties = [a.text for a in tur.analyze("evlerinden") if a.weight == tur.analyze("evlerinden")[0].weight]
    assert ties == sorted(ties)  # equal weights: ties broken by the analysis text
    weights = [a.weight for a in tur.analyze("evlerinden")]
    assert weights == sorted(weights)


def test_generate_accepts_labels_in_any_order(tur: morphfst.Language) -> None:
    assert [f.form for f in tur.generate("ev", ["LOC", "PL", "N"])] == ["evlerde"]
    assert [f.form for f in tur.generate_text("ev N;PL;LOC")] == ["evlerde"]


def test_generated_forms_keep_the_case_of_the_lemma(tur: morphfst.Language) -> None:
    # the same forms as the inflection table (proper names keep their capitals: common practice)
    assert [f.form for f in tur.generate("İzmir", "PROPN;SG;LOC")] == ["İzmir'de"]
    assert [f.form for f in tur.generate("Ahmet", "PROPN;PL;DAT")] == ["Ahmet'lere"]
    assert [f.form for f in tur.generate("ev", "N;PL;LOC")] == ["evlerde"]


def test_generate_guesses_the_forms_of_a_lemma_the_lexicon_lacks(tur: morphfst.Language) -> None:
    # tırzop: a made-up stem of Turkish shape; back harmony (-lAr -> -lar, -A -> -a) and the voicing of a
    # final p before a vowel in a word of two syllables are common practice
    assert tur.generate("tırzop", "N;PL;DAT") == []
    guessed = tur.generate("tırzop", "N;PL;DAT", guess=True)
    assert [(f.form, f.guessed) for f in guessed] == [("tırzoplara", True)] and guessed[0].weight >= 100
    assert [f.form for f in tur.generate("tırzop", ["DAT", "N", "PL"], guess=True)] == ["tırzoplara"]  # any order
    assert [f.form for f in tur.generate("tırzop", "N;SG;ACC", guess=True)] == ["tırzobu"]
    assert [f.form for f in tur.generate("Tırzop", "PROPN;SG;DAT", guess=True)] == ["Tırzop'a"]
    assert guessed[0].to_dict()["guessed"] is True and "guessed" not in tur.generate("ev", "N;PL;DAT")[0].to_dict()
    # a lemma the lexicon has is generated from the lexicon, guess or not
    assert tur.generate("kitap", "N;SG;ACC", guess=True) == tur.generate("kitap", "N;SG;ACC")
    assert not tur.generate("kitap", "N;SG;ACC", guess=True)[0].guessed


@pytest.mark.parametrize("lemma", ["tırzop", "bılgıt", "fenerlik", "kömpür", "tarıka"])
@pytest.mark.parametrize("features", ["N;PL;DAT", "N;SG;ACC", "N;SG;PSS1S;ABL", "N;PL;PSS3P;GEN"])
def test_a_guessed_form_is_read_back_by_the_guesser(tur: morphfst.Language, lemma: str, features: str) -> None:
    forms = tur.generate_guessed(lemma, features)
    assert forms and all(f.guessed for f in forms)
    for form in forms:
        assert f"{lemma} {features}" in [a.text for a in tur.guess(form.form)]


def test_unknown_label_is_a_user_error(tur: morphfst.Language) -> None:
    with pytest.raises(UserError) as info:
        tur.generate("ev", "N;PLURAL")
    assert "PLURAL" in info.value.message and "PL" in (info.value.hint or "")


def test_words_outside_the_alphabet_get_no_analysis(tur: morphfst.Language) -> None:
    for word in ["evlerdeq", "ев", "", "e\u0000v", "\U000f0001", "x" * 100_000]:
        assert tur.analyze(word) == []
        assert tur.segment(word) == []
        assert not tur.accepts(word)


def test_segment_groups_analyses_by_split(tur: morphfst.Language) -> None:
    segs = tur.segment("kitabı")
    assert len(segs) == 1 and segs[0].text == "kitab-ı"
    assert {a.text for a in segs[0].analyses} == {"kitap N;SG;ACC", "kitap N;SG;PSS3S;NOM"}


def test_flag_markers(tur: morphfst.Language) -> None:
    assert [f.form for f in tur.generate("top", "N;SG;ACC")] == ["topu"]  # <nv> marker stops final voicing
    assert [f.form for f in tur.generate("bakmak", "V;FUT;1;SG")] == ["bakacağım"]  # ... of the stem only
    assert [f.form for f in tur.generate("saat", "N;SG;LOC")] == ["saatte"]  # <fr> marker: front harmony


def test_flag_that_blocks_a_rule(tmp_path: Path) -> None:
    grammar = TOY_GRAMMAR.replace("classes {", 'flags {\n  stubborn blocks front "keeps back vowels in suffixes"\n}\n\nclasses {')
    lexicon = (
        TOY_LEXICON.replace("lemma\tclass\tpos\tgloss\n", "lemma\tclass\tpos\tgloss\tflags\n") + "pe\tnoun\tN\tstone\tstubborn\n"
    )
    lang = morphfst.load(write_toy(tmp_path, grammar, lexicon))
    assert [f.form for f in lang.generate("te", "N;PL;NOM")] == ["teler"]
    assert [f.form for f in lang.generate("pe", "N;PL;NOM")] == ["pelar"]


def test_constraint_excludes(tmp_path: Path) -> None:
    grammar = TOY_GRAMMAR.replace("rules {", "constraints {\n  no_plural_locative: PL excludes LOC\n}\n\nrules {")
    lang = morphfst.load(write_toy(tmp_path, grammar))
    assert lang.generate("ka", "N;PL;LOC") == [] and lang.analyze("kalarna") == []
    assert [f.form for f in lang.generate("ka", "N;SG;LOC")] == ["kana"]
    assert [f.form for f in lang.generate("ka", "N;PL;NOM")] == ["kalar"]


def test_turkish_their_books_has_no_second_plural(tur: morphfst.Language) -> None:
    # -lArI 'their' takes no plural -lAr before it: evleri is 'their house' and 'their houses'
    # (Göksel & Kerslake 2005, 14.1); the singular reading ranks first
    assert [f.form for f in tur.generate("ev", "N;PL;PSS3P;NOM")] == ["evleri"]
    assert [f.form for f in tur.generate("ev", "N;SG;PSS3P;NOM")] == ["evleri"]
    texts = [a.text for a in tur.analyze("evlerini")]
    assert texts.index("ev N;SG;PSS3P;ACC") < texts.index("ev N;PL;PSS3P;ACC")
    assert not any("ler-leri" in a.segmentation for a in tur.analyze("evlerleri"))


def test_derivation_cycle_is_finite_per_word(tur: morphfst.Language) -> None:
    texts = [a.text for a in tur.analyze("kitapçılık")]
    assert "kitap N;AGT;N;ABSTR;N;SG;NOM" in texts


def test_requires_constraint(tmp_path: Path) -> None:
    grammar = TOY_GRAMMAR.replace("rules {", "constraints {\n  loc_needs_plural: LOC requires PL\n}\n\nrules {")
    lang = morphfst.load(write_toy(tmp_path, grammar))
    assert [a.text for a in lang.analyze("kalarna")] == ["ka N;PL;LOC"]
    assert lang.analyze("kana") == []


def test_weights_rank_lexicon_entries(tmp_path: Path) -> None:
    lexicon = "lemma\tclass\tpos\tgloss\tweight\nka\tnoun\tN\thouse\t2.5\nkal\tnoun\tN\tbig house\t0.5\n"
    grammar = TOY_GRAMMAR.replace('"nA"   LOC', '"nA"   LOC\n  "ar"   LOC gloss LOC weight 1')
    lang = morphfst.load(write_toy(tmp_path, grammar, lexicon))
    # "kalar" is ka+PL (2.5) or kal+LOC via "ar" (0.5 + 1): the cheaper reading comes first
    assert [a.text for a in lang.analyze("kalar")] == ["kal N;SG;LOC", "ka N;PL;NOM"]
    assert [round(a.weight, 3) for a in lang.analyze("kalar")] == [1.5, 2.5]


def test_compiled_file_is_reused_and_recompiled_when_sources_change(tmp_path: Path) -> None:
    path = write_toy(tmp_path)
    first = morphfst.load(path)
    again = morphfst.load(path)
    assert again.path == first.path
    (tmp_path / "toy.tsv").write_text(TOY_LEXICON + "lo\tnoun\tN\tstone\n", encoding="utf-8")
    changed = morphfst.load(path)
    assert changed.path != first.path
    assert changed.analyze("lolar")[0].text == "lo N;PL;NOM"


def test_explicit_compiled_file(tmp_path: Path) -> None:
    path = write_toy(tmp_path)
    out = morphfst.compile_grammar(path, tmp_path / "toy.mfc")
    lang = morphfst.load(out)
    assert lang.analyze("kalar")[0].text == "ka N;PL;NOM"
    meta = lang.meta
    assert meta["name"] == "toy" and meta["digest"] and len(meta["sources"]) == 2
    assert [r["name"] for r in meta["rules"]] == ["front", "back"]
    # a compiled file named by the user is loaded as it is (with a warning), never recompiled
    (tmp_path / "toy.tsv").write_text(TOY_LEXICON + "lo\tnoun\tN\tstone\n", encoding="utf-8")
    assert morphfst.load(out).analyze("lo") == []


def test_unknown_language_name() -> None:
    with pytest.raises(UserError) as info:
        morphfst.load("klingon")
    assert "tur" in (info.value.hint or "")


def test_a_word_without_capitals_reads_as_a_name_last(fin: morphfst.Language) -> None:
    """kiveä is the partitive of kivi 'stone' and of the name Kivi (both in the lexicon, equally
    frequent): written without capitals the name weighs ln 10 more and comes second; capitalized,
    both readings keep their weights. The composed path ranks the same way, and a word that is only
    a name keeps its reading."""
    from morphfst.runtime.walk import LOWER_CASE_NAME_WEIGHT

    lower, upper = fin.analyze("kiveä"), fin.analyze("Kiveä")
    assert lower[0].text == "kivi N;SG;PRT"
    name_lower = next(a for a in lower if a.lemma == "Kivi")
    name_upper = next(a for a in upper if a.lemma == "Kivi")
    assert name_lower.weight == pytest.approx(name_upper.weight + LOWER_CASE_NAME_WEIGHT)
    assert next(a for a in upper if a.lemma == "kivi").weight == pytest.approx(lower[0].weight)
    assert [(a.text, round(a.weight, 5)) for a in fin.analyze_composed("kiveä")] == [(a.text, round(a.weight, 5)) for a in lower]
    assert fin.analyze("helsingissä")[0].lemma == "Helsinki"
    # a word list that is lower-cased throughout (the lexicon counts' source) says nothing of capitals
    blind = fin.fast.analyze("kiveä", cased=False)
    assert next(a for a in blind if a.lemma == "Kivi").weight == pytest.approx(name_upper.weight)


def test_an_open_class_weight_ranks_its_stems_below_the_lexicon(tmp_path: Path) -> None:
    # a class's `weight` is added to every stem its open pattern accepts; a lexicon word spelt alike
    # keeps its own weight (the two readings are one: the cheaper is kept)
    grammar = TOY_GRAMMAR.replace(
        "  noun pos N -> number\n", "  noun pos N -> number\n  open3 pos N -> number weight 20 open @cons @vowel @cons\n"
    )
    lexicon = "lemma\tclass\tpos\tgloss\nkam\tnoun\tN\tfield\n"
    lang = morphfst.load(write_toy(tmp_path, grammar, lexicon))
    assert [(a.text, round(a.weight, 3)) for a in lang.analyze("pesne")] == [("pes N;SG;LOC", 20.0)]
    assert [(a.text, round(a.weight, 3)) for a in lang.analyze("kamna")] == [("kam N;SG;LOC", 0.0)]
    assert lang.analyze("peksa") == []


def test_a_weight_on_a_class_without_an_open_pattern_is_a_user_error() -> None:
    grammar = TOY_GRAMMAR.replace("  noun pos N -> number\n", "  noun pos N -> number weight 3\n")
    with pytest.raises(UserError) as err:
        parse_grammar_text(grammar, "toy.mfg")
    assert "open class" in str(err.value) and err.value.position is not None and err.value.position.line > 0


def test_an_enclitic_slot_follows_any_whole_word_once(tmp_path: Path) -> None:
    # `slot NAME enclitic`: reached from the end of every word (no class or slot lists it), once
    grammar = TOY_GRAMMAR.replace("rules {", 'slot question enclitic {\n  "ko" Q weight 2\n}\n\nrules {').replace(
        "  Case: NOM LOC\n", "  Case: NOM LOC\n  Clitic: Q\n"
    )
    lang = morphfst.load(write_toy(tmp_path, grammar))
    assert [(a.text, a.segmentation, round(a.weight, 3)) for a in lang.analyze("kalarko")] == [
        ("ka N;PL;NOM;Q", "ka-lar-ko", 2.0)
    ]
    assert [a.text for a in lang.analyze("kanako")] == ["ka N;SG;LOC;Q"]
    assert lang.analyze("kakoko") == []
    assert [f.form for f in lang.generate("ka", "N;SG;NOM;Q")] == ["kako"]


def test_implied_labels_are_added_where_a_bundle_has_no_form(tmp_path: Path) -> None:
    # `implied { LOC => N LOC PL }`: a bundle with LOC stands for N;LOC;PL, each added label only where
    # the bundle has none of its dimension (a part of speech where it lacks that very one)
    grammar = TOY_GRAMMAR.replace("rules {", "implied {\n  LOC => N LOC PL\n}\n\nrules {")
    lang = morphfst.load(write_toy(tmp_path, grammar))
    assert lang.implied_bundle(["LOC"]) == ["N", "LOC", "PL"]
    assert lang.implied_bundle(["LOC", "SG"]) == ["N", "LOC", "SG"]
    assert lang.implied_bundle(["N", "PL"]) == ["N", "PL"]  # no label with a line: unchanged
    assert [f.form for f in lang.generate("ka", "LOC")] == ["kalarna"]
    assert [f.form for f in lang.generate("ka", "SG;LOC")] == ["kana"]
    assert [f.form for f in lang.generate("ka", "N;SG;LOC")] == ["kana"]  # has a form as given
    assert lang.generate("ka", "NOM") == []  # no line for NOM: nothing is added
    assert [a.text for a in lang.analyze("kalarna")] == ["ka N;PL;LOC"]


@pytest.mark.parametrize(
    ("line", "message"),
    [
        ("LOC => N LOC XYZ", "XYZ is not a declared feature label"),
        ("LOC => N PL", "implied labels for LOC leave it out"),
        ("LOC => N LOC PL PL", "name a label twice"),
    ],
)
def test_implied_block_errors_point_at_their_line(tmp_path: Path, line: str, message: str) -> None:
    grammar = TOY_GRAMMAR.replace("rules {", f"implied {{\n  {line}\n}}\n\nrules {{")
    path = write_toy(tmp_path, grammar)
    with pytest.raises(UserError) as caught:
        morphfst.load(path)
    assert message in str(caught.value)
    assert caught.value.position is not None and caught.value.position.line == grammar.splitlines().index(f"  {line}") + 1


def test_unmarked_labels_are_left_out_where_no_form_has_them(tmp_path: Path) -> None:
    # `unmarked { ... }`: labels a bundle may spell out (UniMorph's POS for the positive) that the
    # grammar leaves unwritten; an unmarked label the grammar has a feature for is dropped only when
    # the bundle has no form with it
    grammar = TOY_GRAMMAR.replace("rules {", "unmarked {\n  POS NOM\n}\n\nrules {")
    lang = morphfst.load(write_toy(tmp_path, grammar))
    assert [f.form for f in lang.generate("ka", "N;PL;LOC;POS")] == ["kalarna"]
    assert [f.form for f in lang.generate("ka", "N;PL;LOC;NOM")] == ["kalarna"]  # NOM: no LOC form has it
    assert [f.form for f in lang.generate("ka", "N;PL;NOM")] == ["kalar"]
    assert [a.text for a in lang.analyze("kalarna")] == ["ka N;PL;LOC"]
    with pytest.raises(UserError):
        lang.generate("ka", "N;PL;LOC;XYZ")  # any other unknown label stays an error

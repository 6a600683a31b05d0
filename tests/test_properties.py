"""Property tests (hypothesis): generated forms analyze back, and analyzer and generator agree."""

from __future__ import annotations

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import morphfst

NOUN_FEATURES = st.tuples(
    st.sampled_from(["SG", "PL"]),
    st.sampled_from([None, "PSS1S", "PSS2S", "PSS3S", "PSS1P", "PSS2P", "PSS3P"]),
    st.sampled_from(["NOM", "ACC", "DAT", "LOC", "ABL", "GEN", "INS"]),
)


@pytest.fixture(scope="module")
def nouns(tur: morphfst.Language) -> list[str]:
    return sorted({e["lemma"] for e in tur.lexicon if e["pos"] == "N"})


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(data=st.data())
def test_generated_forms_analyze_back(tur: morphfst.Language, nouns: list[str], data: st.DataObject) -> None:
    lemma = data.draw(st.sampled_from(nouns))
    number, poss, case = data.draw(NOUN_FEATURES)
    feats = ";".join(f for f in ["N", number, poss, case] if f)
    for form in tur.generate(lemma, feats):
        assert f"{lemma} {feats}" in [a.text for a in tur.analyze(form.form)]


PLAIN_LETTERS = str.maketrans("çğıöşü", "cgiosu")
JOINED = {"INT", "ADD"}  # the labels of the enclitic slot of tur/joined.mfg (mi, de written joined)


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(word=st.text(alphabet="aeıioöuübcçdgğklmnprsştvyz'", min_size=1, max_size=12))
def test_every_analysis_generates_the_word(tur: morphfst.Language, word: str) -> None:
    # The grammar's lenient rules accept an apostrophe left out of a name or written after a common
    # noun, and the Turkish letters written plain (c for ç), which generation never produces: compare
    # spellings without apostrophes, with those letters folded.
    def plain(form: str) -> str:
        return tur.normalize(form).replace("'", "").translate(PLAIN_LETTERS)

    for analysis in tur.analyze(word):
        assert "".join(m.form for m in analysis.morphs) == word
        if JOINED & set(analysis.tags):
            continue  # a word written apart joined to this one: read, never generated (tur/joined.mfg)
        if not analysis.has_stem:
            continue  # suffixes split from their word (the detached block): read, never generated
        assert plain(word) in [plain(f.form) for f in tur.generate(analysis.lemma, analysis.tags)]


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(data=st.data())
def test_finnish_generated_forms_analyze_back(fin: morphfst.Language, data: st.DataObject) -> None:
    entries = [e for e in fin.lexicon if e["pos"] == "N"]
    entry = data.draw(st.sampled_from(entries))
    number = data.draw(st.sampled_from(["SG", "PL"]))
    cases = [v for v in fin.dimensions.get("Case", [])]
    case = data.draw(st.sampled_from(cases))
    feats = f"N;{number};{case}"
    for form in fin.generate(entry["lemma"], feats):
        assert f"{entry['lemma']} {feats}" in [a.text for a in fin.analyze(form.form)]


@settings(max_examples=200, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(word=st.text(alphabet="aeıioöuübcçdgğklmnprsştvyz'", min_size=1, max_size=12))
def test_arc_walk_agrees_with_composition(tur: morphfst.Language, word: str) -> None:
    assert_same(tur.analyze(word), tur.analyze_composed(word), word)


def assert_same(walked: list[morphfst.Analysis], composed: list[morphfst.Analysis], word: str) -> None:
    """The same analyses and segmentations in the same order, with weights equal up to float summation order."""
    assert [(a.text, a.segmentation) for a in walked] == [(a.text, a.segmentation) for a in composed], word
    assert all(abs(a.weight - b.weight) < 1e-3 for a, b in zip(walked, composed)), word


def test_arc_walk_agrees_with_composition_on_generated_words(tur: morphfst.Language, fin: morphfst.Language) -> None:
    import pynini

    for lang in (tur, fin):
        surfaces = lang.fsts["analyzer"].copy().project("input")
        sample = pynini.randgen(surfaces, npath=300, seed=3, max_length=30)
        for word in set(sample.paths(input_token_type="utf8", output_token_type="utf8").istrings()):
            assert_same(lang.analyze(word), lang.analyze_composed(word), word)

"""Bulk export in the UniMorph three-column format: lemma, form, features."""

from __future__ import annotations

from pathlib import Path

import pytest
from tabletoy import write_table_toy

import morphfst
from morphfst.cli import main
from morphfst.tables.export import export_unimorph, iter_unimorph
from morphfst.tables.paradigm import make_bound, paradigms


def read_lines(path: Path) -> list[list[str]]:
    return [line.split("\t") for line in path.read_text(encoding="utf-8").splitlines()]


@pytest.fixture(scope="module")
def tur_export(tur_small: morphfst.Language, tmp_path_factory: pytest.TempPathFactory) -> tuple[Path, object]:
    out = tmp_path_factory.mktemp("export") / "tur.tsv"
    stats = export_unimorph(tur_small, out)
    return out, stats


def test_three_columns_and_known_forms(tur_small: morphfst.Language, tur_export: tuple[Path, object]) -> None:
    path, stats = tur_export
    rows = read_lines(path)
    assert rows and all(len(r) == 3 and all(r) for r in rows)
    # UniMorph 4.0 (Batsuren et al. 2022): lemma, inflected form, feature bundle separated by ';'.
    labels = set(tur_small.labels())
    assert all(set(r[2].split(";")) <= labels for r in rows)
    lines = {tuple(r) for r in rows}
    # Göksel & Kerslake (2005), Turkish: A Comprehensive Grammar, ch. 8; forms from memory.
    for expected in [
        ("ev", "evlerde", "N;PL;LOC"),
        ("kitap", "kitabı", "N;SG;ACC"),
        ("oda", "odaya", "N;SG;DAT"),
        ("Ankara", "Ankara'da", "PROPN;SG;LOC"),
    ]:
        assert expected in lines, expected
    assert stats.forms == len(rows)  # type: ignore[attr-defined]


def test_every_lexicon_entry_is_exported(tur_small: morphfst.Language, tur_export: tuple[Path, object]) -> None:
    path, _ = tur_export
    exported = {(r[0], r[2].split(";")[0]) for r in read_lines(path)}
    assert {(e["lemma"], e["pos"]) for e in tur_small.lexicon} <= exported


def test_export_equals_the_tables(tur_small: morphfst.Language, tur_export: tuple[Path, object]) -> None:
    path, _ = tur_export
    rows = [tuple(r) for r in read_lines(path) if r[0] == "kitap"]
    table = [(c.lemma, v.form, c.features) for p in paradigms(tur_small, "kitap") for c in p.cells for v in c.forms]
    assert rows == table


def test_depth_limit_and_feature_filter(tur_small: morphfst.Language, tmp_path: Path) -> None:
    depth0 = {
        (lemma, form, feats) for lemma, form, feats in iter_unimorph(tur_small, make_bound(tur_small, 0, layout_only=True), ["N"])
    }
    depth1 = {
        (lemma, form, feats) for lemma, form, feats in iter_unimorph(tur_small, make_bound(tur_small, 1, layout_only=True), ["N"])
    }
    assert ("kitap", "kitapçılar", "N;AGT;N;PL;NOM") in depth1 - depth0
    assert depth0 < depth1
    assert all(f.count(";N;") + f.count(";ADJ;") <= 1 for _, _, f in depth1)
    no_agt = list(iter_unimorph(tur_small, make_bound(tur_small, 1, exclude=["AGT"], layout_only=True), ["N"]))
    assert no_agt and not any("AGT" in f.split(";") for _, _, f in no_agt)
    only_loc = list(iter_unimorph(tur_small, make_bound(tur_small, 0, require=["LOC"], layout_only=True), ["N"]))
    assert only_loc and all("LOC" in f.split(";") for _, _, f in only_loc)


def test_cyclic_grammar_export_is_finite(tmp_path: Path) -> None:
    lang = morphfst.load(write_table_toy(tmp_path))
    counts = [sum(1 for _ in iter_unimorph(lang, make_bound(lang, d))) for d in range(3)]
    assert counts[0] < counts[1] < counts[2]
    lines = set(iter_unimorph(lang, make_bound(lang, 1)))
    assert ("ka", "kasiler", "N;DIM;N;PL;NOM") in lines and ("ka", "kasirer", "N;DIM;N;PL;NOM") in lines
    assert not any(f.count("DIM") > 1 for _, _, f in lines)


def test_failed_export_leaves_no_file(tur_small: morphfst.Language, tmp_path: Path) -> None:
    out = tmp_path / "out.tsv"

    def stop(stats: object) -> None:
        raise RuntimeError("stopped")

    with pytest.raises(RuntimeError):
        export_unimorph(tur_small, out, on_group=stop)
    assert list(tmp_path.iterdir()) == []


def test_export_command(capsys: pytest.CaptureFixture[str], tur_small: morphfst.Language, tmp_path: Path) -> None:
    out = tmp_path / "verbs.tsv"
    assert main(["export", "-l", str(tur_small.path), "-o", str(out), "--pos", "V", "--no-progress"]) == 0
    rows = read_lines(out)
    assert rows and {r[2].split(";")[0] for r in rows} == {"V"}
    # Lewis (2000), Turkish Grammar, ch. VIII; from memory.
    assert ["gelmek", "geldim", "V;PST;1;SG"] in rows
    assert "wrote" in capsys.readouterr().err
    assert main(["export", "-l", str(tur_small.path), "-o", "-", "--pos", "ADJ", "--no-progress"]) == 0
    assert "güzel\tgüzel\tADJ;SG;NOM" in capsys.readouterr().out.splitlines()


def test_export_mistakes_exit_2(capsys: pytest.CaptureFixture[str], tur_small: morphfst.Language, tmp_path: Path) -> None:
    assert main(["export", "-o", str(tmp_path / "x.tsv"), "--without", "AGENT"]) == 2
    assert "hint" in capsys.readouterr().err
    assert main(["export", "-o", str(tmp_path / "x.tsv"), "--pos", "NOUN"]) == 2
    assert main(["export", "-o", str(tmp_path / "no" / "x.tsv")]) == 2
    assert main(["export", "-o", str(tmp_path / "x.tsv"), "--depth", "-1"]) == 2
    assert not (tmp_path / "x.tsv").exists()

"""Search integration: the FTS5 tokenizer on real SQLite databases, the index and search commands, bad input.

The inflected forms used here are handbook forms already checked in test_tur_fragment.py (Göksel &
Kerslake 2005, noun inflection, from memory) and test_fin_fragment.py (Karlsson 2018, noun
inflection, from memory); the sentences around them are invented, in the scenario of demo/.
"""

from __future__ import annotations

import json
import os
import shutil
from pathlib import Path

import pytest

import morphfst
from morphfst.cli import main
from morphfst.corpus import Options, run_corpus

apsw = pytest.importorskip("apsw")

from morphfst.search import TermAnalyzer, TermOptions, register  # noqa: E402
from morphfst.search.fts import sql_string, tokenize_directive  # noqa: E402
from morphfst.search.index import open_index, search, update_index  # noqa: E402

TUR_DOCS = [
    "Kitaplarımızdan birini limanda okuduk.",  # kitap only as kitaplarımızdan
    "Öğretmen kitabı masaya koydu.",  # kitap only as kitabı
    "Gemiler sabah limana geldi.",  # no form of kitap
]
FIN_DOCS = [
    "Lapset leikkivät kaduilla koko illan.",  # katu only as kaduilla
    "Kirjasto on kadun päässä.",  # katu only as kadun
    "Tyttö lukee kirjaa huoneessa.",
]


def memory_table(lang: morphfst.Language, docs: list[str], options: TermOptions | None = None, spec: str = "tur") -> object:
    con = apsw.Connection(":memory:")
    register(con, lang, spec=spec)
    directive = tokenize_directive(spec, options or TermOptions())
    con.execute(f"CREATE VIRTUAL TABLE docs USING fts5(body, tokenize={sql_string(directive)})")
    con.executemany("INSERT INTO docs(body) VALUES (?)", [(d,) for d in docs])
    return con


def matches(con: object, query: str) -> list[str]:
    rows = con.execute("SELECT highlight(docs, 0, '[', ']') FROM docs WHERE docs MATCH ? ORDER BY rowid", (query,))  # type: ignore[attr-defined]
    return [r[0] for r in rows]


# ---- the tokenizer --------------------------------------------------------------------------------
def test_a_lemma_finds_documents_with_only_inflected_forms(tur: morphfst.Language, fin: morphfst.Language) -> None:
    con = memory_table(tur, TUR_DOCS)
    assert matches(con, "kitap") == ["[Kitaplarımızdan] birini limanda okuduk.", "Öğretmen [kitabı] masaya koydu."]
    fcon = memory_table(fin, FIN_DOCS, spec="fin")
    assert matches(fcon, "katu") == ["Lapset leikkivät [kaduilla] koko illan.", "Kirjasto on [kadun] päässä."]


def test_an_inflected_query_finds_the_other_forms(tur: morphfst.Language, fin: morphfst.Language) -> None:
    con = memory_table(tur, TUR_DOCS)
    assert len(matches(con, "kitaplarda")) == 2
    assert matches(con, "kitabı") == matches(con, "kitap")
    fcon = memory_table(fin, FIN_DOCS, spec="fin")
    assert len(matches(fcon, "kadulla")) == 2


def test_highlight_and_snippet_mark_the_original_words(tur: morphfst.Language) -> None:
    con = memory_table(tur, ["Ahmet kütüphanede Kitaplarımızdan ikisini buldu."])
    (marked,) = matches(con, "kitap")
    assert marked == "Ahmet kütüphanede [Kitaplarımızdan] ikisini buldu."  # original capital and suffixes kept
    (snip,) = con.execute("SELECT snippet(docs, 0, '<', '>', '…', 3) FROM docs WHERE docs MATCH 'kitap'").fetchone()
    assert "<Kitaplarımızdan>" in snip
    # a phrase of lemmas: positions stay one per word, whatever the number of colocated terms
    con = memory_table(tur, TUR_DOCS, TermOptions(("lemma", "morphs", "surface"), "all"))
    assert matches(con, '"kitap masa"') == ["Öğretmen [kitabı masaya] koydu."]


def test_byte_offsets_and_colocated_terms(tur: morphfst.Language) -> None:
    analyzer = TermAnalyzer(tur, TermOptions(("lemma", "morphs", "surface")))
    text = "Çocuklar kitabı okuyor"
    positions = analyzer.positions(text)
    raw = text.encode("utf-8")
    assert [raw[s:e].decode("utf-8") for s, e, _ in positions] == ["Çocuklar", "kitabı", "okuyor"]
    _, _, terms = positions[1]
    assert terms[0] == "kitap" and "~kitab" in terms and "+ı" in terms and "=kitabı" in terms


def test_exact_form_query_with_surface_terms(tur: morphfst.Language) -> None:
    con = memory_table(tur, TUR_DOCS, TermOptions(("lemma", "surface")))
    assert matches(con, '"=kitabı"') == ["Öğretmen [kitabı] masaya koydu."]
    assert len(matches(con, "kitap")) == 2


def test_unknown_words_are_indexed(tur: morphfst.Language) -> None:
    word = "zırpıtlarda"  # invented, not a Turkish word; shaped like a noun in the plural locative
    docs = [f"Dün {word} bekledik."]
    con = memory_table(tur, docs)
    assert len(matches(con, word)) == 1  # the same word, analyzed the same way at query time
    guesses = tur.guess(word)
    if guesses:  # the guessed lemma finds it as well
        assert len(matches(con, tur.normalize(guesses[0].lemma))) == 1
    plain = memory_table(tur, docs, TermOptions(guess=False))
    assert matches(plain, word) == [f"Dün [{word}] bekledik."]
    terms = TermAnalyzer(tur, TermOptions(guess=False)).document_terms(word)
    assert terms == (word,)


def test_all_analyses_are_alternatives(tur: morphfst.Language) -> None:
    analyzer = TermAnalyzer(tur, TermOptions(analyses="all"))
    best = TermAnalyzer(tur, TermOptions()).document_terms("kitabı")
    assert best == ("kitap",)
    assert set(best) <= set(analyzer.document_terms("kitabı"))


# ---- the index and its commands --------------------------------------------------------------------
def write(path: Path, lines: list[str]) -> Path:
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def test_an_updated_index_finds_new_files_and_skips_unchanged(tmp_path: Path, tur: morphfst.Language) -> None:
    corpus = tmp_path / "corpus"
    write(corpus / "a.txt", TUR_DOCS)
    db = tmp_path / "books.db"
    index = open_index(db, "tur", create=True, load_language=lambda spec: tur)
    first = update_index(index, [str(corpus)])
    assert (first.added, first.docs) == (1, 3)
    assert search(index, "gemi")[0].line == 3
    write(corpus / "b.txt", ["Balıkçılar yeni evlerine taşındı."])
    second = update_index(index, [str(corpus)])
    assert (second.added, second.unchanged, second.docs) == (1, 1, 1)
    hits = search(index, "ev")
    assert [(Path(h.path).name, h.line) for h in hits] == [("b.txt", 1)]
    assert hits[0].marked("[", "]") == "Balıkçılar yeni [evlerine] taşındı."
    # a changed file is re-indexed: its old documents go, the new ones come
    a = corpus / "a.txt"
    write(a, ["Kızlar odalarda bekliyor."])
    os.utime(a, ns=(a.stat().st_atime_ns, a.stat().st_mtime_ns + 10**9))
    third = update_index(index, [str(corpus)])
    assert (third.changed, third.unchanged) == (1, 1)
    assert search(index, "kitap") == [] and len(search(index, "oda")) == 1
    assert index.con.execute("SELECT count(*) FROM docs").fetchone()[0] == 2
    # a file deleted from disk stays until an update with prune
    (corpus / "b.txt").unlink()
    assert update_index(index, [str(corpus)]).removed == 0 and len(search(index, "ev")) == 1
    assert update_index(index, [str(corpus)], prune=True).removed == 1 and search(index, "ev") == []
    index.close()


def test_grammar_change_reanalyzes_stored_documents(tmp_path: Path, tur: morphfst.Language) -> None:
    corpus = write(tmp_path / "a.txt", TUR_DOCS)
    db = tmp_path / "books.db"
    index = open_index(db, "tur", create=True, load_language=lambda spec: tur)
    update_index(index, [str(corpus)])
    index.con.execute("UPDATE morphfst_meta SET value = 'older' WHERE key = 'grammar_digest'")
    index.close()
    index = open_index(db, load_language=lambda spec: tur)
    assert index.stale
    write(corpus, TUR_DOCS + ["Kitabı geri getirdi."])
    result = update_index(index, [str(corpus)])
    assert result.rebuilt and not index.stale
    assert len(search(index, "kitap")) == 3
    index.close()


def test_worker_processes_give_the_same_index(tmp_path: Path, tur: morphfst.Language) -> None:
    corpus = write(tmp_path / "lib.txt", TUR_DOCS * 3)
    results = []
    for jobs in (1, 2):
        index = open_index(tmp_path / f"j{jobs}.db", "tur", create=True, load_language=lambda spec: tur)
        update_index(index, [str(corpus)], jobs=jobs)
        results.append([(h.line, h.snippet, h.matches) for h in search(index, "kitap", limit=20)])
        check = index.con.execute("INSERT INTO docs(docs, rank) VALUES ('integrity-check', 1)")
        assert check.fetchall() == []
        index.close()
    assert results[0] == results[1] and len(results[0]) == 6


def test_cli_index_and_search(capsys: pytest.CaptureFixture[str], tmp_path: Path, fin: morphfst.Language) -> None:
    corpus = write(tmp_path / "kirjasto.txt", FIN_DOCS)
    db = tmp_path / "kirjat.db"
    assert main(["index", str(db), str(corpus), "-l", str(fin.path), "-q"]) == 0
    assert main(["search", str(db), "katu", "-f", "jsonl"]) == 0
    out = capsys.readouterr().out
    records = [json.loads(line) for line in out.splitlines()]
    assert sorted(r["line"] for r in records) == [1, 2]
    first = next(r for r in records if r["line"] == 1)
    assert first["snippet"] == "Lapset leikkivät [kaduilla] koko illan." and first["matches"] == [[17, 25]]
    assert main(["search", str(db), "kadulla", "--color", "never"]) == 0
    text = capsys.readouterr().out
    assert "[kaduilla]" in text and "[kadun]" in text
    assert main(["search", str(db), "laiva"]) == 1  # no match: exit 1


# ---- bad input -------------------------------------------------------------------------------------
def built_index(tmp_path: Path, lang: morphfst.Language) -> Path:
    """An index built by the command, with the session's compiled grammar (immune to grammar edits during the run)."""
    corpus = write(tmp_path / "lib.txt", TUR_DOCS)
    db = tmp_path / "books.db"
    assert main(["index", str(db), str(corpus), "-q", "-l", str(lang.path)]) == 0
    return db


def test_corrupt_database(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    bad = tmp_path / "bad.db"
    bad.write_bytes(b"this is not an SQLite database\n" * 40)
    before = bad.read_bytes()
    corpus = write(tmp_path / "lib.txt", TUR_DOCS)
    for argv in (["search", str(bad), "kitap"], ["index", str(bad), str(corpus)]):
        capsys.readouterr()
        assert main(argv) == 2
        err = capsys.readouterr().err
        assert "not a usable SQLite database" in err and err.count("error:") == 1 and "Traceback" not in err
    assert bad.read_bytes() == before
    # an SQLite database that is not an index is left alone too
    other = tmp_path / "other.db"
    con = apsw.Connection(str(other))
    con.execute("CREATE TABLE t(x)")
    con.close()
    assert main(["index", str(other), str(corpus)]) == 2
    assert "holds no morphfst index" in capsys.readouterr().err


def test_locked_database_loses_nothing(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    db = built_index(tmp_path, tur)
    extra = write(tmp_path / "more.txt", ["Kitabı geri getirdi."])
    holder = apsw.Connection(str(db))
    holder.execute("BEGIN EXCLUSIVE")
    try:
        capsys.readouterr()
        assert main(["index", str(db), str(extra), "--busy-timeout", "0.1"]) == 2
        assert "locked" in capsys.readouterr().err
        assert main(["search", str(db), "kitap", "--busy-timeout", "0.1"]) == 2
    finally:
        holder.execute("ROLLBACK")
        holder.close()
    assert main(["search", str(db), "kitap", "-f", "jsonl"]) == 0
    assert len(capsys.readouterr().out.splitlines()) == 2  # nothing lost, nothing half-added


def test_query_syntax_error(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    db = built_index(tmp_path, tur)
    saved = db.read_bytes()
    for query in ["kitap AND (", '"kitap', "NEAR(kitap"]:
        capsys.readouterr()
        assert main(["search", str(db), query]) == 2
        err = capsys.readouterr().err
        assert "not valid FTS5 syntax" in err and "Traceback" not in err
    assert db.read_bytes() == saved


def test_missing_language_and_missing_index(capsys: pytest.CaptureFixture[str], tmp_path: Path, tur: morphfst.Language) -> None:
    corpus = write(tmp_path / "lib.txt", TUR_DOCS)
    db = tmp_path / "new.db"
    assert main(["index", str(db), str(corpus), "-l", "no_such_language"]) == 2
    assert "unknown language" in capsys.readouterr().err and not db.exists()
    assert main(["search", str(db), "kitap"]) == 2
    assert "no such index file" in capsys.readouterr().err and not db.exists()
    # an index whose language is gone: a clear message, the file untouched
    built = built_index(tmp_path, tur)
    con = apsw.Connection(str(built))
    con.execute("UPDATE morphfst_meta SET value = 'no_such_language' WHERE key = 'lang'")
    con.close()
    saved = built.read_bytes()
    capsys.readouterr()
    assert main(["search", str(built), "kitap"]) == 2
    assert "unknown language" in capsys.readouterr().err
    assert built.read_bytes() == saved
    # a different language or term options for an existing index are refused
    fresh = tmp_path / "fresh.db"
    shutil.copy(built_index(tmp_path / "x", tur), fresh)
    assert main(["index", str(fresh), str(corpus), "-l", "fin"]) == 2  # built with another language
    assert main(["index", str(fresh), str(corpus), "--terms", "stem"]) == 2


# ---- offsets for other engines ---------------------------------------------------------------------
def test_corpus_jsonl_gives_end_offsets_in_characters_and_bytes(tmp_path: Path, tur: morphfst.Language) -> None:
    line = "Ankara’da çocuklar kitabı okuyor."
    source = write(tmp_path / "in.txt", [line])
    out = tmp_path / "out.jsonl"
    run_corpus(tur, [str(source)], str(out), Options(mode="jsonl"))
    tokens = json.loads(out.read_text(encoding="utf-8").splitlines()[0])["tokens"]
    raw = line.encode("utf-8")
    for tok in tokens:
        assert line[tok["start"] : tok["end"]] == tok["token"]
        assert raw[tok["start_byte"] : tok["end_byte"]].decode("utf-8") == tok["token"]
    assert tokens[0]["end"] == 9 and tokens[0]["end_byte"] == 11  # ’ is three bytes in UTF-8


# ---- conflation quality ----------------------------------------------------------------------------
def _bench_module() -> object:
    import importlib.util

    path = Path(__file__).resolve().parent.parent / "bench" / "bench_search.py"
    spec = importlib.util.spec_from_file_location("_bench_search", path)
    assert spec is not None and spec.loader is not None
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def test_paice_indices_on_a_toy_partition() -> None:
    bench = _bench_module()
    groups = {"ev": "ev", "evler": "ev", "oda": "oda", "odalar": "oda"}
    assert bench.paice(groups, lambda w: w) == (1.0, 0.0)  # type: ignore[attr-defined]
    assert bench.paice(groups, lambda w: w[:2]) == (0.0, 0.0)  # type: ignore[attr-defined]
    # one term for everything: no pair of a group is split, every one of the 4 cross-group pairs is merged
    assert bench.paice(groups, lambda w: "x") == (0.0, 1.0)  # type: ignore[attr-defined]
    assert bench.paice(groups | {"od": "oda"}, lambda w: w[:2]) == (0.0, 0.0)  # type: ignore[attr-defined]


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_lemma_terms_beat_both_baselines_on_the_handbook_paradigms(name: str, request: pytest.FixtureRequest) -> None:
    # Paice 1994 (SIGIR), understemming and overstemming indices, from memory; baselines: no stemming and
    # truncation to five characters (Can et al. 2008, JASIST, from memory)
    lang = request.getfixturevalue(name)
    bench = _bench_module()
    groups = bench.word_groups(lang, bench.paradigm_triples(name))  # type: ignore[attr-defined]
    assert len(groups) >= 20
    analyzer = TermAnalyzer(lang, TermOptions())
    ours = sum(bench.paice(groups, lambda w: analyzer.document_terms(w)[0]))  # type: ignore[attr-defined]
    assert ours < sum(bench.paice(groups, lambda w: w))  # type: ignore[attr-defined]
    assert ours < sum(bench.paice(groups, lambda w: w[:5]))  # type: ignore[attr-defined]

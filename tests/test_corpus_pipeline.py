"""The corpus pipeline: every token and line accounted for, bad input handled, outputs, failures."""

from __future__ import annotations

import io
import json
import sys
import unicodedata
from pathlib import Path
from typing import Any

import pytest
from corpus_helpers import DyingProcessor, FailingProcessor
from hypothesis import given, settings
from hypothesis import strategies as st

import morphfst
from morphfst.cli import main
from morphfst.corpus import Options, WorkerFailure, run_corpus
from morphfst.corpus.reading import Chunk, chunks, finer_tail, read_blocks
from morphfst.corpus.records import MAX_CACHED_TOKEN, ChunkProcessor, Tally
from morphfst.runtime.tokenize import Tokenizer

# Invented demo sentences (our own), mixing lexicon words, names with apostrophes, numbers with
# suffixes, hyphenated and unknown words, punctuation and CRLF line ends.
SENTENCES = [
    "Evlerde kitaplar var. Ankara'da 2023'te TRT:nin haberi!",
    "",
    "sarı-kırmızı kalemlerinde, e-posta ve çiçekler...",
    "Kitapçılar gözünü odaya çevirdi?\r",
    "   ",
    "Ahmet’in köyünde 3,5 saat kaldık",
]


def bad_corpus() -> bytes:
    """Lines with every kind of bad input the pipeline must count and survive."""
    parts = [s.encode() for s in SENTENCES]
    parts.append(b"bozuk \xff\xfe bayt \xc3 ve ev")  # invalid UTF-8
    parts.append(b"NUL\x00bayt\x00 evde")  # NUL bytes
    parts.append(("ev " * 33_333 + "x").encode())  # a 100,000-character line
    parts.append(("a" * 100_000).encode())  # a 100,000-character token
    parts.append(b"")
    parts.append("son satır kitapta".encode())  # no newline at the end
    return b"\n".join(parts)


def expected_tokens(data: bytes, tok: Tokenizer) -> list[int]:
    text = unicodedata.normalize("NFC", data.decode("utf-8", errors="replace"))
    lines = text.split("\n")
    if text.endswith("\n"):
        lines.pop()
    return [len(tok.tokens(line)) for line in lines]


@pytest.fixture(scope="module")
def corpus(tmp_path_factory: pytest.TempPathFactory) -> Path:
    path = tmp_path_factory.mktemp("corpus") / "bad.txt"
    path.write_bytes(bad_corpus())
    return path


@pytest.fixture(scope="module")
def per_line(corpus: Path, tur: morphfst.Language) -> list[int]:
    return expected_tokens(corpus.read_bytes(), Tokenizer.for_meta(tur.meta))


def term_counts(output: Path) -> list[int]:
    """Tokens per output line of terms/morphs output: terms that do not start with '+'."""
    lines = output.read_text(encoding="utf-8").split("\n")
    assert lines[-1] == ""
    return [sum(1 for t in line.split() if not t.startswith("+")) for line in lines[:-1]]


@pytest.mark.parametrize("jobs", [1, 2])
def test_every_line_and_token_is_kept(
    tur: morphfst.Language, corpus: Path, per_line: list[int], tmp_path: Path, jobs: int
) -> None:
    out = tmp_path / "out.txt"
    options = Options(mode="terms", term="morphs", chunk_bytes=2048)  # small chunks: many of them
    run = run_corpus(tur, [str(corpus)], str(out), options, jobs=jobs)
    assert term_counts(out) == per_line
    cov = run.coverage
    assert cov.lines == len(per_line)
    assert cov.tokens == sum(per_line) == sum(cov.status_tokens)
    assert cov.replaced_bytes == 3
    assert cov.nul_bytes == 2
    assert cov.empty_lines == 2
    assert cov.long_tokens == 1
    assert list(tmp_path.iterdir()) == [out]  # no temporary file left


@pytest.mark.parametrize("start", ["fork", "spawn"])
def test_one_and_two_processes_give_the_same_bytes(
    tur: morphfst.Language, corpus: Path, tmp_path: Path, start: str, monkeypatch: pytest.MonkeyPatch
) -> None:
    monkeypatch.setenv("MORPHFST_WORKER_START", start)  # forked workers share the loaded language; spawned ones load it
    options = Options(mode="jsonl", chunk_bytes=1024)
    one = run_corpus(tur, [str(corpus)], str(tmp_path / "one.jsonl"), options, jobs=1)
    two = run_corpus(tur, [str(corpus)], str(tmp_path / "two.jsonl"), options, jobs=2)
    assert (tmp_path / "one.jsonl").read_bytes() == (tmp_path / "two.jsonl").read_bytes()
    assert one.coverage.figures() == two.coverage.figures()


def test_jsonl_records(tur: morphfst.Language, corpus: Path, per_line: list[int], tmp_path: Path) -> None:
    out = tmp_path / "out.jsonl"
    run_corpus(tur, [str(corpus)], str(out), Options(mode="jsonl"))
    records = [json.loads(line) for line in out.read_text(encoding="utf-8").splitlines()]
    assert [r["line"] for r in records] == list(range(1, len(per_line) + 1))
    assert [len(r["tokens"]) for r in records] == per_line
    first = {t["token"]: t for t in records[0]["tokens"]}
    assert first["Evlerde"]["status"] == "analyzed"
    assert first["Evlerde"]["analyses"][0]["analysis"] == "ev N;PL;LOC"  # the grammar's own inline test
    assert first["Evlerde"]["start"] == 0
    assert first["2023'te"]["status"] == "number"
    assert first["2023'te"]["split"] == ["2023", "te"]
    statuses = {t["status"] for r in records for t in r["tokens"]}
    assert statuses <= {"analyzed", "guessed", "unknown", "number"}
    guessed = [t for r in records for t in r["tokens"] if t["status"] == "guessed"]
    assert guessed and all(a["guessed"] for t in guessed for a in t["analyses"])


def test_term_kinds(tur: morphfst.Language, tmp_path: Path) -> None:
    src = tmp_path / "in.txt"
    src.write_text("Evlerde kitaplarımız Ankara'da\n", encoding="utf-8")
    got = {}
    for term in ("lemma", "stem", "morphs"):
        out = tmp_path / f"{term}.txt"
        run_corpus(tur, [str(src)], str(out), Options(mode="terms", term=term))
        got[term] = out.read_text(encoding="utf-8")
    assert got["lemma"] == "ev kitap Ankara\n"
    assert got["stem"] == "ev kitap ankara\n"
    assert got["morphs"] == "ev +ler +de kitap +lar +ımız ankara +da\n"


def test_conllu_parsed_by_a_general_reader(tur: morphfst.Language, corpus: Path, per_line: list[int], tmp_path: Path) -> None:
    # Read back with the 'conllu' package (PyPI), a general-purpose reader of the CoNLL-U format of
    # Universal Dependencies v2.
    conllu = pytest.importorskip("conllu")
    out = tmp_path / "out.conllu"
    run_corpus(tur, [str(corpus)], str(out), Options(mode="conllu"))
    sentences = conllu.parse(out.read_text(encoding="utf-8"))
    words = [t for s in sentences for t in s if t["upos"] not in ("PUNCT", "SYM")]
    assert len(words) == sum(per_line)
    first = sentences[0]
    assert first.metadata["text"] == "Evlerde kitaplar var."
    evlerde = first[0]
    assert (evlerde["form"], evlerde["lemma"], evlerde["upos"]) == ("Evlerde", "ev", "NOUN")
    # FEATS from the grammar's UD mapping of PL and LOC (UD v2 features Number=Plur, Case=Loc).
    assert evlerde["feats"] == {"Case": "Loc", "Number": "Plur"}
    assert first[-1]["upos"] == "PUNCT"
    # SpaceAfter=No (UD v2 MISC) lets the sentence text be rebuilt from its tokens.
    for sentence in sentences[:3]:
        rebuilt = "".join(t["form"] + ("" if (t["misc"] or {}).get("SpaceAfter") == "No" else " ") for t in sentence).strip()
        assert rebuilt == sentence.metadata["text"]
    ids = [s.metadata["sent_id"] for s in sentences]
    assert len(ids) == len(set(ids))


def test_overlong_lines_are_cut_and_rejoined(tur: morphfst.Language, corpus: Path, per_line: list[int], tmp_path: Path) -> None:
    out = tmp_path / "out.txt"
    options = Options(mode="terms", term="lemma", chunk_bytes=4096, max_line_bytes=5000)
    run = run_corpus(tur, [str(corpus)], str(out), options, jobs=1)
    assert run.coverage.cut_lines > 0
    # Lines are cut at white space, so their tokens survive; a 100,000-byte token with no white space
    # in reach is itself cut into pieces of at most 5,000 bytes (20 pieces), on the same output line.
    giant = per_line.index(1, 8)
    expected = per_line[:giant] + [20] + per_line[giant + 1 :]
    assert term_counts(out) == expected


def test_reader_keeps_every_byte_across_ranges() -> None:
    import io

    data = bad_corpus()
    cut = [0, 100, 101, 5000, 60_000, len(data)]
    got = b""
    for a, b in zip(cut, cut[1:]):
        handle = io.BytesIO(data)
        handle.seek(a)
        got += b"".join(c.data for c in chunks(read_blocks(handle, a, b, block=777), 1, 1000, 3000))
    assert got == data


@settings(max_examples=200, deadline=None)
@given(
    lines=st.lists(st.binary(max_size=40).map(lambda b: b.replace(b"\n", b"")), max_size=40),
    newline_at_end=st.booleans(),
    chunk_bytes=st.integers(1, 300),
    max_line_bytes=st.integers(1, 100),
    hold=st.integers(0, 6),
    parts=st.integers(1, 6),
)
def test_the_finer_tail_keeps_every_byte_and_line_number(
    lines: list[bytes], newline_at_end: bool, chunk_bytes: int, max_line_bytes: int, hold: int, parts: int
) -> None:
    # the last chunks of a run are cut finer so the workers run out of work together: the pieces are
    # whole lines (or a cut line's pieces, left whole), in order, each with its first line number
    data = b"\n".join(lines) + (b"\n" if newline_at_end and lines else b"")
    plain = list(chunks([data], 1, chunk_bytes, max_line_bytes))
    fine = list(finer_tail(iter(plain), hold, parts))
    assert b"".join(c.data for c in fine) == data
    assert sum(c.lines for c in fine) == sum(c.lines for c in plain)
    line = 1
    for chunk in fine:
        assert chunk.first_line == line
        assert chunk.data
        line += chunk.data.count(b"\n")
    assert len(fine) >= len(plain)


def test_a_failure_mid_run_leaves_no_output(tur: morphfst.Language, corpus: Path, tmp_path: Path) -> None:
    out = tmp_path / "out.txt"
    with pytest.raises(RuntimeError, match="simulated failure"):
        run_corpus(tur, [str(corpus)], str(out), Options(chunk_bytes=512), jobs=1, processor_class=FailingProcessor)
    assert list(tmp_path.iterdir()) == []  # neither the final file nor a temporary one


def test_a_dead_worker_is_reported(tur: morphfst.Language, corpus: Path, tmp_path: Path) -> None:
    out = tmp_path / "out.txt"
    # the main process notices the death reading the dead worker's pipe ("while processing lines
    # ...") or while it waits for the other worker, whose chunk needs the dead one's answers
    # ("while lines ... waited for it"): a forked worker dies soon enough for either to come first
    with pytest.raises(WorkerFailure, match="died .*SIGKILL.* while (processing lines|lines .* waited for it)"):
        run_corpus(tur, [str(corpus)], str(out), Options(chunk_bytes=512), jobs=2, processor_class=DyingProcessor)
    assert not out.exists()
    assert not [p for p in tmp_path.iterdir() if not p.name.startswith(".")]  # nothing that looks whole


def test_cli_directory_report_and_manifest(
    tur: morphfst.Language, corpus: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    indir = tmp_path / "in"
    indir.mkdir()
    (indir / "a.txt").write_bytes(corpus.read_bytes())
    (indir / "b.txt").write_text("Evlerde kitaplar var.\n", encoding="utf-8")
    out = tmp_path / "out"
    report = tmp_path / "report.json"
    code = main(["corpus", "-l", tur.path or "tur", str(indir), "-o", str(out), "--report", str(report), "-q"])
    assert code == 0
    manifest = json.loads((out / "manifest.json").read_text(encoding="utf-8"))
    assert [e["output"] for e in manifest["outputs"]] == ["a.txt.terms.txt", "b.txt.terms.txt"]
    data = json.loads(report.read_text(encoding="utf-8"))
    assert data["figures"]["tokens"] == manifest["tokens"]
    assert data["unanalyzed"] and data["unanalyzed"][0]["rank"] == 1
    tsv = tmp_path / "report.tsv"
    assert (
        main(["corpus", "-l", tur.path or "tur", str(indir / "b.txt"), "-o", str(tmp_path / "b.out"), "--report", str(tsv)]) == 0
    )
    assert "rank\tword\ttokens\tstatus\tproposal\tsegmentation" in tsv.read_text(encoding="utf-8")
    assert "coverage report" in capsys.readouterr().err


def test_cli_dask_without_the_package(
    tur: morphfst.Language, corpus: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    import sys

    monkeypatch.setitem(sys.modules, "distributed", None)  # as if dask.distributed were not installed
    code = main(["corpus", "-l", tur.path or "tur", str(corpus), "-o", str(tmp_path / "o"), "--dask"])
    assert code == 2
    err = capsys.readouterr().err
    assert "dask.distributed" in err and "pip install" in err


@pytest.mark.parametrize("per_worker", [4, 1])  # one batch of partitions, or several
def test_dask_local_cluster_keeps_every_token(
    tur: morphfst.Language, corpus: Path, per_line: list[int], tmp_path: Path, monkeypatch: pytest.MonkeyPatch, per_worker: int
) -> None:
    pytest.importorskip("distributed")
    from morphfst.corpus import cluster

    monkeypatch.setattr(cluster, "PARTITIONS_PER_WORKER", per_worker)
    local = tmp_path / "local.txt"
    options = Options(mode="terms", term="morphs")
    one = run_corpus(tur, [str(corpus)], str(local), options, jobs=1)
    out = tmp_path / "dask"
    run = run_corpus(tur, [str(corpus)], str(out), options, jobs=2, dask=True, partition_bytes=40_000)
    # type-affine workers: every word type analyzed once across the cluster, as in one process
    assert run.coverage.figures() == one.coverage.figures()
    assert run.coverage.analyzed == one.coverage.analyzed > 0
    manifest = json.loads((out / "manifest.json").read_text(encoding="utf-8"))
    parts = [out / e["output"] for e in manifest["outputs"]]
    assert len(parts) > 2  # with per_worker 1: more than one batch of 2 partitions
    assert b"".join(p.read_bytes() for p in parts) == local.read_bytes()
    assert run.coverage.lines == len(per_line)
    assert run.coverage.tokens == sum(per_line)
    assert [e["first_line"] for e in manifest["outputs"]][0] == 1


def test_dask_running_cluster_keeps_the_grammar_loaded_but_not_the_cache(
    tur: morphfst.Language, corpus: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    # A cluster kept running between runs loads a grammar once (by the digest of its compiled bytes)
    # and is sent its bytes once; each run still gets a new cache of word types, so each run analyzes
    # its own types and counts them.
    pytest.importorskip("distributed")
    import logging

    from distributed import Client, LocalCluster

    from morphfst.corpus import cluster, dask_worker

    sent: list[bool] = []
    make_plugin = cluster.grammar_plugin

    def recording(*args: Any) -> Any:
        plugin = make_plugin(*args)
        sent.append(plugin.data is not None)
        return plugin

    monkeypatch.setattr(cluster, "grammar_plugin", recording)

    options = Options(mode="terms", term="morphs")
    one = run_corpus(tur, [str(corpus)], str(tmp_path / "one.txt"), options, jobs=1)
    with LocalCluster(
        n_workers=2, threads_per_worker=1, processes=True, dashboard_address=":0", silence_logs=logging.ERROR
    ) as lc:
        runs = []
        for i in range(3):
            # the first run sends the compiled bytes (as to workers that do not share the file
            # system); the second finds the grammar loaded; the third may read it from the path
            monkeypatch.setattr(cluster, "SHARED_FILES", i > 0)
            runs.append(
                run_corpus(
                    tur, [str(corpus)], str(tmp_path / f"run{i}"), options, dask=lc.scheduler_address, partition_bytes=40_000
                )
            )
        with Client(lc.scheduler_address) as client:
            loaded = client.run(lambda: sorted(dask_worker._loaded))
    for i, run in enumerate(runs):
        assert run.coverage.analyzed == one.coverage.analyzed > 0
        manifest = json.loads((tmp_path / f"run{i}" / "manifest.json").read_text(encoding="utf-8"))
        joined = b"".join((tmp_path / f"run{i}" / e["output"]).read_bytes() for e in manifest["outputs"])
        assert joined == (tmp_path / "one.txt").read_bytes()
    assert len(loaded) == 2 and all(len(digests) == 1 for digests in loaded.values())
    assert sent == [True, False, False]


def test_dask_analyzes_each_type_once_when_a_batch_outgrows_the_cache(tur: morphfst.Language, tmp_path: Path) -> None:
    # A batch's word types far outnumber a cache generation, and the partitions are read in many
    # chunks (so the cache turns over many times): the owners' answers must still serve every
    # partition, each type analyzed once, the output that of one process.
    pytest.importorskip("distributed")
    import random

    lemmas = sorted({e["lemma"] for e in tur.lexicon if e["lemma"].isalpha()})[:1500]
    rng = random.Random(3)
    lines = [" ".join(rng.choice(lemmas) for _ in range(12)) for _ in range(1200)]
    src = tmp_path / "many.txt"
    src.write_text("\n".join(lines) + "\n", encoding="utf-8")
    one = run_corpus(tur, [str(src)], str(tmp_path / "one.txt"), Options(), jobs=1)
    small = Options(cache_size=50, chunk_bytes=2048)
    out = tmp_path / "dask"
    run = run_corpus(tur, [str(src)], str(out), small, jobs=2, dask=True, partition_bytes=12_000)
    distinct = len({w for line in lines for w in line.split()})
    assert one.coverage.analyzed == distinct
    assert run.coverage.analyzed == distinct
    manifest = json.loads((out / "manifest.json").read_text(encoding="utf-8"))
    assert len(manifest["outputs"]) > 4
    joined = b"".join((out / e["output"]).read_bytes() for e in manifest["outputs"])
    assert joined == (tmp_path / "one.txt").read_bytes()


def test_progress_bar_shows_bytes_tokens_and_rate_only_on_a_terminal() -> None:
    from morphfst.corpus.progress import Progress

    class Terminal(io.StringIO):
        def isatty(self) -> bool:
            return True

    shown = Terminal()
    bar = Progress(10_000_000, stream=shown)
    bar.update(2_000_000, 300_000)
    bar.update(2_000_000, 300_000)
    bar.close()
    text = shown.getvalue()
    assert "600,000 tokens" in text and "tokens/s" in text and "B/s" in text and "%" in text
    piped = io.StringIO()  # not a terminal: nothing is written
    quiet_bar = Progress(100, stream=piped)
    quiet_bar.update(10, 10)
    quiet_bar.close()
    assert piped.getvalue() == ""
    assert Progress(100, quiet=True, stream=Terminal()).bar is None


def test_workers_are_forked_only_while_no_other_thread_runs(monkeypatch: pytest.MonkeyPatch) -> None:
    import threading

    from morphfst.corpus.local import start_method
    from morphfst.corpus.progress import Progress

    class Terminal(io.StringIO):
        def isatty(self) -> bool:
            return True

    monkeypatch.delenv("MORPHFST_WORKER_START", raising=False)
    before = threading.active_count()
    bar = Progress(1000, stream=Terminal())  # a shown bar starts no thread (no tqdm monitor)
    assert threading.active_count() == before
    bar.close()
    stop = threading.Event()
    other = threading.Thread(target=stop.wait)
    other.start()
    try:
        assert start_method() == "spawn"  # a fork would copy a lock the other thread may hold
    finally:
        stop.set()
        other.join()
    if sys.platform.startswith("linux") and threading.active_count() == 1:
        assert start_method() == "fork"
    monkeypatch.setenv("MORPHFST_WORKER_START", "spawn")
    assert start_method() == "spawn"


def test_a_tiny_cache_gives_the_same_output_and_figures(tur: morphfst.Language, corpus: Path, tmp_path: Path) -> None:
    big = run_corpus(tur, [str(corpus)], str(tmp_path / "big.jsonl"), Options(mode="jsonl"))
    tiny_options = Options(mode="jsonl", cache_size=3, cache_chars=500, chunk_bytes=300)  # rotates all the time
    tiny = run_corpus(tur, [str(corpus)], str(tmp_path / "tiny.jsonl"), tiny_options, jobs=1)
    assert (tmp_path / "big.jsonl").read_bytes() == (tmp_path / "tiny.jsonl").read_bytes()
    assert big.coverage.figures() == tiny.coverage.figures()
    assert big.coverage.types == tiny.coverage.types


def test_hyphenated_word_keeps_its_first_part_in_the_gloss(tmp_path: Path) -> None:
    # the segmentation and the gloss of a word analyzed by its last part must stay aligned morph by morph
    src = tmp_path / "in.txt"
    src.write_text("e-posta\n", encoding="utf-8")
    out = tmp_path / "out.conllu"
    assert main(["corpus", str(src), "-o", str(out), "-m", "conllu", "-q"]) == 0
    misc = next(line for line in out.read_text(encoding="utf-8").splitlines() if line.startswith("1\t")).split("\t")[9]
    fields = dict(item.split("=", 1) for item in misc.split("|"))
    # the first part is a morph of its own (glossed from its own analysis when it is a word: e is
    # the letter), so segmentation and gloss have as many pieces
    assert fields["MorphSeg"].startswith("e-")
    assert fields["MorphSeg"].count("-") == fields["MorphGloss"].count("-")


def test_a_worker_asks_only_for_the_types_it_has_not_cached(tur: morphfst.Language) -> None:
    # what a worker of -j N analyzes or asks its owner for: each uncached type once, never the line
    # end, never an overlong token (those are counted where they occur and never cached)
    processor = ChunkProcessor(tur, Options())
    long = "a" * (MAX_CACHED_TOKEN + 1)
    data = f"ev evde ev {long}\nkitap evde\n".encode()
    chunk = next(iter(chunks([data], 1, 1 << 20, 1 << 20)))
    (_, _, items, _, _, _), missing = processor.prepare(chunk)
    assert items is not None and long in items
    assert sorted(missing) == ["ev", "evde", "kitap"]
    processor.lookup("ev")
    processor.old["kitap"] = "kitap"  # a type in the old cache generation counts as cached too
    assert sorted(processor.prepare(chunk)[1]) == ["evde"]


def test_a_prepared_chunk_is_processed_right_after_the_cache_turned_over(tur: morphfst.Language) -> None:
    # a worker prepares a chunk (its cached outputs looked up then), and processes it once the
    # answers are in: other chunks processed meanwhile may turn the cache over, and the chunk's
    # output and figures must be those of a chunk processed at once
    data = b"ev evde kitap okul ev\nkitaplar okulda evde\n"
    chunk = next(iter(chunks([data], 1, 1 << 20, 1 << 20)))
    words = "masa kalem defter kapı pencere duvar yol su ağaç taş dağ deniz göl köy şehir ülke gün gece yıl ay"
    lines = [" ".join(words.split()[i : i + 10]) for i in (0, 10)]  # ten new types: the cache turns over
    others = [next(iter(chunks([line.encode() + b"\n"], 1, 1 << 20, 1 << 20))) for line in lines]
    reference = ChunkProcessor(tur, Options(cache_size=8))
    expected = reference.process(chunk).data
    for turns in (0, 1, 2):
        processor = ChunkProcessor(tur, Options(cache_size=8))
        total = Tally()
        first = processor.process(chunk)  # every type cached: the prepared chunk has no holes
        prepared, missing = processor.prepare(chunk)
        assert missing == []
        results = [first] + [processor.process(other) for other in others[:turns]]
        result = processor.process(chunk, prepared)
        assert result.data == expected
        for done in [*results, result]:
            if done.tally is not None:
                total.merge(done.tally)
        total.merge(processor.flush())  # every token counted has its figures (none lost in the turns)
        assert total.types["ev"][0] == 4 and total.types["evde"][0] == 4 and total.types["kitaplar"][0] == 2


def _types_by_chunk(processor: ChunkProcessor, parts: list[Chunk]) -> set[str]:
    """The word types a chunk-by-chunk reading looks up (what the partition's output will need)."""
    seen: set[str] = set()
    for chunk in parts:
        (_, _, items, _, _, _), _ = processor.prepare(chunk)
        seen.update(t for t in items or [] if t != "\n" and len(t) <= MAX_CACHED_TOKEN)
    return seen


@pytest.mark.parametrize("chunk_bytes,max_line_bytes", [(1 << 20, 1 << 20), (64, 256), (7, 16)])
def test_survey_types_are_the_types_the_chunks_look_up(tur: morphfst.Language, chunk_bytes: int, max_line_bytes: int) -> None:
    # A Dask partition's survey reads each distinct piece of bytes once for all its chunks; it must list
    # exactly the types the partition's chunks then look up: invalid bytes, NUL, non-NFC text, long and
    # cut lines and white space of every kind included.
    data = bad_corpus() + "\ne\u0301v\u00a0evde\u2028kitap\u3000okul\x1cev 23. madde 23. Madde XX.\u00a0yüzyıl 3.\n".encode()
    processor = ChunkProcessor(tur, Options(chunk_bytes=chunk_bytes, max_line_bytes=max_line_bytes))
    parts = list(chunks([data], 1, chunk_bytes, max_line_bytes))
    assert set(processor.types_of(parts)) == _types_by_chunk(processor, parts)


@settings(max_examples=150, deadline=None)
@given(
    st.lists(
        st.sampled_from(
            [b"ev", b"\xc3\xa9", b"e\xcc\x81", b"\xff", b"\xc3", b" ", b"\n", b"'", b"-", b".", b"\xc2\xa0", b"\x00", b"a1"]
            # an ordinal's period before a lower-case letter (23. madde, XX. \xc3\xbcye) and before a capital
            + [b"23.", b"XX.", b"\t", b"\x1c", b"\xc3\xbc", b"\xc3\x9c", b"M"]
        ),
        max_size=40,
    )
)
def test_survey_types_on_any_bytes(tur: morphfst.Language, pieces: list[bytes]) -> None:
    data = b"".join(pieces)
    processor = ChunkProcessor(tur, Options(chunk_bytes=5, max_line_bytes=8))
    parts = list(chunks([data], 1, 5, 8))
    assert set(processor.types_of(parts)) == _types_by_chunk(processor, parts)


def test_dask_counts_again_the_partitions_whose_figures_a_worker_lost(
    tur: morphfst.Language, corpus: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    # Workers keep the per-type figures of the partitions they write and send them at the end of the
    # run. If a worker loses them (it left the cluster after writing its partitions), the client counts
    # those partitions again: the figures are still those of one process.
    pytest.importorskip("distributed")
    from morphfst.corpus import cluster
    from morphfst.corpus import dask_worker as dask_worker_module

    settle = cluster.settle_tallies
    dropped: list[int] = []

    def lose_one_worker(client: Any, specs: list[dict[str, Any]], total: Any, covered: list[int]) -> None:
        first = sorted(client.scheduler_info()["workers"])[0]
        for _, covers in client.run(
            lambda dask_worker: dask_worker_module.collect_tallies(dask_worker), workers=[first]
        ).values():
            dropped.extend(covers)
        settle(client, specs, total, covered)

    monkeypatch.setattr(cluster, "settle_tallies", lose_one_worker)
    monkeypatch.setattr(cluster, "LAST_PARTITIONS", 0)  # every worker holds its figures to the end
    options = Options(mode="terms", term="morphs")
    one = run_corpus(tur, [str(corpus)], str(tmp_path / "one.txt"), options, jobs=1)
    run = run_corpus(tur, [str(corpus)], str(tmp_path / "dask"), options, jobs=2, dask=True, partition_bytes=40_000)
    assert dropped  # the first worker held the figures of some partitions, and they were lost
    figures, expected = run.coverage.figures(), one.coverage.figures()
    # the recount analyzes its partitions' types again (and says so), unless every one was a number
    assert figures.pop("types_analyzed") >= expected.pop("types_analyzed")
    assert figures == expected
    assert run.coverage.types == one.coverage.types


def test_dask_worker_with_two_threads_counts_exactly(tur: morphfst.Language, corpus: Path, tmp_path: Path) -> None:
    # A worker with two threads may run two partitions (or a partition and an owner's answers) at
    # once: they share one processor, so they take turns, and the figures are those of one process.
    pytest.importorskip("distributed")
    import logging

    from distributed import LocalCluster

    options = Options(mode="terms", term="morphs")
    one = run_corpus(tur, [str(corpus)], str(tmp_path / "one.txt"), options, jobs=1)
    with LocalCluster(
        n_workers=1, threads_per_worker=2, processes=True, dashboard_address=":0", silence_logs=logging.ERROR
    ) as lc:
        run = run_corpus(tur, [str(corpus)], str(tmp_path / "dask"), options, dask=lc.scheduler_address, partition_bytes=20_000)
    assert run.coverage.figures() == one.coverage.figures()
    assert run.coverage.types == one.coverage.types
    manifest = json.loads((tmp_path / "dask" / "manifest.json").read_text(encoding="utf-8"))
    joined = b"".join((tmp_path / "dask" / e["output"]).read_bytes() for e in manifest["outputs"])
    assert joined == (tmp_path / "one.txt").read_bytes()


def test_a_worker_reads_the_grammar_from_a_path_only_when_the_bytes_are_the_same(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    pytest.importorskip("distributed")
    import hashlib

    from toygrammar import write_toy

    from morphfst.corpus import dask_worker

    monkeypatch.setattr(dask_worker, "_loaded", {})  # this process's languages, as on a fresh worker
    compiled = morphfst.compile_grammar(write_toy(tmp_path), tmp_path / "toy.mfc")
    digest = hashlib.sha256(compiled.read_bytes()).hexdigest()
    assert not dask_worker.grammar_reachable(hashlib.sha256(b"other bytes").hexdigest(), str(compiled))
    assert not dask_worker.grammar_reachable(digest, str(tmp_path / "missing.mfc"))
    assert not dask_worker.grammar_reachable(digest, "")  # the client did not offer its path
    assert dask_worker._loaded == {}
    assert dask_worker.grammar_reachable(digest, str(compiled))
    assert list(dask_worker._loaded) == [digest]  # loaded once, now: the plugin's setup finds it
    assert dask_worker._loaded[digest].analyze("kalar")
    assert dask_worker.grammar_reachable(digest, "")  # held

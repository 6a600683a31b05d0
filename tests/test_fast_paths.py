"""The paths that make morphfst fast at scale, and that they change no result: the cache key read
without parsing the grammar, transducers and lexicon read on first use, the walk's lazy tables and
subset automaton, type-affine corpus workers (each word type analyzed once across processes) and
automatic Dask partitions; the packed arc tables of the compiled file and the walk's tables kept out of
the cycle collector."""

from __future__ import annotations

import gc
from pathlib import Path

import pynini
import pytest
from toygrammar import TOY_LEXICON, write_toy
from walk_helpers import epsilon_cycle

import morphfst
from morphfst import build
from morphfst.cli import build_parser
from morphfst.compile import archive, arctable
from morphfst.compile.archive import LazyFsts, Metadata
from morphfst.compile.fstutil import Arc
from morphfst.corpus import Options, run_corpus
from morphfst.corpus.cluster import MIN_PARTITION_BYTES, PARTITION_BYTES, auto_partition_bytes
from morphfst.corpus.local import owner
from morphfst.corpus.sources import Source
from morphfst.runtime import walk


@pytest.fixture()
def own_cache(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    cache = tmp_path / "cache"
    monkeypatch.setenv("MORPHFST_CACHE", str(cache))
    return cache


def _no_parsing(monkeypatch: pytest.MonkeyPatch) -> None:
    def refuse(*_: object, **__: object) -> None:
        raise AssertionError("the grammar was parsed")

    monkeypatch.setattr(build, "_parsed_sources", refuse)


def test_an_unchanged_grammar_is_loaded_without_parsing(tmp_path: Path, own_cache: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    grammar = write_toy(tmp_path / "g")
    first = morphfst.load(grammar)
    with monkeypatch.context() as patch:
        _no_parsing(patch)
        again = morphfst.load(grammar)
    assert again.path == first.path
    assert again.analyze("kalar")[0].text == "ka N;PL;NOM"


def test_a_changed_source_is_parsed_and_compiled_again(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path / "g")
    first = morphfst.load(grammar)
    (grammar.parent / "toy.tsv").write_text(TOY_LEXICON + "lo\tnoun\tN\tlake\n", encoding="utf-8")
    second = morphfst.load(grammar)
    assert second.path != first.path
    assert second.analyze("lolar")


def test_a_file_added_to_a_lexicon_folder_is_seen(tmp_path: Path, own_cache: Path) -> None:
    folder = tmp_path / "g"
    grammar = write_toy(folder)
    (folder / "lex").mkdir()
    (folder / "toy.tsv").rename(folder / "lex" / "toy.tsv")
    grammar.write_text(grammar.read_text(encoding="utf-8").replace('lexicon "toy.tsv"', 'lexicon "lex"'), encoding="utf-8")
    assert not morphfst.load(grammar).analyze("lolar")
    (folder / "lex" / "more.tsv").write_text("lemma\tclass\tpos\tgloss\nlo\tnoun\tN\tlake\n", encoding="utf-8")
    assert morphfst.load(grammar).analyze("lolar")


def test_a_damaged_manifest_means_parsing_again(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path / "g")
    morphfst.load(grammar)
    for manifest in (own_cache / "sources").glob("*.json"):
        manifest.write_text("{not json", encoding="utf-8")
    assert morphfst.load(grammar).analyze("kalar")


def test_transducers_and_lexicon_are_read_on_first_use(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path / "g")
    path = morphfst.compile_grammar(grammar, tmp_path / "toy.mfc")
    fsts, meta = archive.load_archive(path)
    assert isinstance(fsts, LazyFsts) and isinstance(meta, Metadata)
    assert not meta.is_loaded("lexicon") and "lexicon" in meta
    lang = morphfst.Language(fsts, meta, str(path))
    assert lang.analyze("kalar")[0].morphs[0].gloss == "house"
    assert not meta.is_loaded("lexicon")  # decoding read the glosses only
    assert [e["lemma"] for e in lang.entries("ka")] == ["ka"]
    assert meta.is_loaded("lexicon")
    assert set(fsts) >= {"analyzer", "generator", "segmenter", "bounded"}


def test_a_loaded_language_saves_back_whole(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path / "g")
    path = morphfst.compile_grammar(grammar, tmp_path / "toy.mfc")
    lang = morphfst.load(path)
    again = archive.save_archive(tmp_path / "copy.mfc", lang.fsts, lang.meta)
    copy = morphfst.load(again)
    assert copy.meta["lexicon"] == morphfst.load(path).meta["lexicon"]
    assert [a.text for a in copy.analyze("kalar")] == [a.text for a in lang.analyze("kalar")]


def test_a_flipped_byte_anywhere_is_a_damaged_file(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path / "g")
    path = morphfst.compile_grammar(grammar, tmp_path / "toy.mfc")
    data = bytearray(path.read_bytes())
    for where in (10, len(data) // 2, len(data) - 80):
        bad = tmp_path / f"bad{where}.mfc"
        changed = bytearray(data)
        changed[where] ^= 0x40
        bad.write_bytes(bytes(changed))
        with pytest.raises(archive.DamagedArchive):
            archive.load_archive(bad)


def test_the_walker_reads_states_as_words_need_them(tur: morphfst.Language) -> None:
    walker = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    assert walker.size() == 0
    found = walker.walk("evlerde")
    assert found and walker.size() > 0
    assert walker.accepts("evlerde") and not walker.accepts("evlerdeq")


def test_the_subset_automaton_started_afresh_gives_the_same_paths(
    tur: morphfst.Language, monkeypatch: pytest.MonkeyPatch
) -> None:
    words = ["evlerde", "kitaplarımızdan", "gelmeyecekmişsiniz", "okulda", "ev", "evde", "yok"]
    walker = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    expected = [walker.walk(w) for w in words]
    monkeypatch.setattr(walk, "MAX_SETS", 3)
    fresh = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    assert [fresh.walk(w) for w in words] == expected


def test_best_only_walk_keeps_the_best_paths(tur: morphfst.Language) -> None:
    walker = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    for word in ["yüzü", "atın", "kalemlerimizde"]:
        full = walker.walk(word)
        best = walker.walk(word, best=True)
        assert best[0][2] == pytest.approx(full[0][2])
        assert {p for p in full if p[2] <= full[0][2] + 1e-5} <= set(best)


def _text(tokens: int) -> str:
    words = "ev evler evlerde kitap kitaplar kitapta okul okulda gel geldi gelmeyecek yok var ve bir bu".split()
    return "\n".join(" ".join(words[(i * 7 + j) % len(words)] for j in range(12)) for i in range(tokens // 12)) + "\n"


@pytest.mark.parametrize("mode", ["terms", "jsonl", "conllu"])
def test_two_workers_analyze_each_word_type_once(tur: morphfst.Language, tmp_path: Path, mode: str) -> None:
    corpus = tmp_path / "in.txt"
    corpus.write_text(_text(6000), encoding="utf-8")
    options = Options(mode=mode, chunk_bytes=2048)
    one = run_corpus(tur, [str(corpus)], str(tmp_path / "one.out"), options, jobs=1)
    two = run_corpus(tur, [str(corpus)], str(tmp_path / "two.out"), options, jobs=2)
    assert (tmp_path / "one.out").read_bytes() == (tmp_path / "two.out").read_bytes()
    assert one.coverage.figures() == two.coverage.figures()
    assert two.coverage.figures()["types_analyzed"] == one.coverage.analyzed > 0


def test_the_index_workers_keep_their_own_scheme() -> None:
    from morphfst.search.index import IndexChunkProcessor

    assert IndexChunkProcessor.type_affine is False


def test_dask_partitions_give_every_worker_work(tmp_path: Path) -> None:
    def source(size: int) -> Source:
        return Source(str(tmp_path / "x.txt"), "x.txt", size)

    assert auto_partition_bytes([source(20 * 1024 * 1024)], 2) == 20 * 1024 * 1024 // 8
    assert auto_partition_bytes([source(1000)], 2) == MIN_PARTITION_BYTES
    assert auto_partition_bytes([source(10**12)], 2) == PARTITION_BYTES


def test_the_command_line_imports_only_the_command_it_runs() -> None:
    parser = build_parser(["analyze", "evlerde"])
    sub = parser.parse_args(["analyze", "evlerde"])
    assert sub.command == "analyze"
    assert set(parser._subparsers._group_actions[0].choices) == {"analyze"}  # type: ignore[union-attr]
    everything = build_parser(["--help"])
    assert {"analyze", "corpus", "table", "explain"} <= set(everything._subparsers._group_actions[0].choices)  # type: ignore[union-attr]


def test_a_packed_arc_table_reads_back_the_transducer(tur: morphfst.Language) -> None:
    fst = tur.fsts["bounded"]
    packed = arctable.PackedArcs(arctable.pack(fst))
    plain = arctable.FstArcs(fst)
    assert packed.start == plain.start and packed.num_states == fst.num_states()
    for state in range(0, fst.num_states(), 97):
        assert list(packed.arcs(state)) == plain.arcs(state)
        assert packed.final(state) == plain.final(state)


def test_a_damaged_arc_table_is_refused() -> None:
    fst = pynini.accep("ab")
    data = arctable.pack(fst)
    for bad in (data[:-3], b"not a table", data + b"x"):
        with pytest.raises(ValueError):
            arctable.PackedArcs(bad)


def test_a_loaded_language_walks_its_packed_tables(tmp_path: Path, own_cache: Path) -> None:
    path = morphfst.compile_grammar(write_toy(tmp_path / "g"), tmp_path / "toy.mfc")
    lang = morphfst.load(path)
    assert lang.analyze("kalar")[0].text == "ka N;PL;NOM"
    assert isinstance(lang.fast.bounded.table, arctable.PackedArcs)
    assert "bounded" not in lang.fsts._loaded  # type: ignore[attr-defined]  # no OpenFst binary was parsed
    assert [a.text for a in lang.analyze("kalarna")] == [a.text for a in lang.analyze_composed("kalarna")]


def test_arc_tables_are_stored_and_the_rest_deflated(tmp_path: Path, own_cache: Path) -> None:
    import zipfile

    path = morphfst.compile_grammar(write_toy(tmp_path / "g"), tmp_path / "toy.mfc")
    with zipfile.ZipFile(path) as zf:
        kinds = {info.filename: info.compress_type for info in zf.infolist()}
    assert kinds["bounded.arcs"] == zipfile.ZIP_STORED  # read at every start: a copy, no inflation
    assert kinds["lexicon.json"] == kinds["bounded.fst"] == zipfile.ZIP_DEFLATED


def test_glosses_found_in_the_text_are_the_parsed_glosses(tur: morphfst.Language, monkeypatch: pytest.MonkeyPatch) -> None:
    text = archive.glosses_tsv(tur.lexicon)
    parsed = archive.read_glosses(text)
    monkeypatch.setattr(archive.Glosses, "FINDS", 50)
    found = archive.Glosses(text)
    keys = list(parsed)[::37]
    assert len(keys) > 60  # past FINDS: the rest are answered from the whole parse
    assert [found.get(k) for k in keys] == [parsed[k] for k in keys]
    assert found.get(("no such lemma", "N"), "?") == "?" and found.get(("no such lemma", "N")) is None  # parsed whole
    with pytest.raises(KeyError):
        found[("no such lemma", "N")]
    fresh = archive.Glosses(text)
    assert fresh.get(("no such lemma", "N"), "?") == "?" and ("ev", "N") in fresh and fresh[("ev", "N")] == parsed[("ev", "N")]
    assert dict(fresh) == parsed and len(fresh) == len(parsed)


def test_a_corpus_processor_reads_the_glosses_whole_once_many_words_came_and_learns_answers_in_one_call(
    tur: morphfst.Language,
) -> None:
    from morphfst.corpus.reading import chunks
    from morphfst.corpus.records import ChunkProcessor, Options

    lang = morphfst.load(tur.meta["grammar_path"])  # a fresh load: its glosses not yet parsed
    glosses = lang.glosses
    assert isinstance(glosses, archive.Glosses) and not glosses._parsed
    processor = ChunkProcessor(lang, Options())
    processor.process(next(iter(chunks([b"evlerde kitaplar\n"], 1, 1 << 20, 1 << 20))))
    assert not glosses._parsed  # a short text: a few searches of the text, no parse of every gloss
    words = sorted({e["lemma"] for e in tur.lexicon if e["pos"] == "N" and e["lemma"].isalpha()})[: 2 * archive.Glosses.FINDS]
    processor.process(next(iter(chunks([" ".join(words).encode() + b"\n"], 1, 1 << 20, 1 << 20))))
    assert glosses._parsed  # many words follow: one parse, not a search of the text per lemma
    teacher, learner = ChunkProcessor(tur, Options()), ChunkProcessor(tur, Options())
    tokens = ["evlerde", "kitaplar", "evlerde"]
    found = [teacher.lookup(t) for t in tokens]
    learner.learn_all(tokens, found)
    assert [learner.lookup(t) for t in tokens] == found and learner.misses == 0
    assert learner.young_chars == sum(len(t) + len(v) for t, (v, _) in zip(tokens[:2], found[:2]))


def test_the_walk_ends_on_a_cycle_of_arcs_that_read_nothing() -> None:
    # the recursive fold meets the cycle and falls back to the depth-bounded closure
    found = walk.ArcWalker(epsilon_cycle()).walk("a")
    outputs = [out for _, out, _ in found]
    assert outputs[:3] == ["a", "xya", "xyxya"]
    assert len(found) == walk.MAX_CLOSURE_DEPTH // 2 + 1


def test_the_walk_tables_stay_out_of_the_cycle_collector(tur: morphfst.Language) -> None:
    walker = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    for word in ["evlerde", "kitaplarımızdan", "gelmeyecekmişsiniz", "okulda", "evde"]:
        assert walker.walk(word)
    for _ in range(4):  # a tuple is untracked once the tuples it holds are: one level per collection
        gc.collect()
    tables = [walker._folded, walker._ends_memo, walker._moves, walker._raw, walker._consume]
    values = [v for table in tables for v in table.values() if v is not None]  # type: ignore[attr-defined]
    assert values and not any(gc.is_tracked(v) for v in values)


def test_word_types_that_begin_alike_have_one_owner() -> None:
    assert owner("evlerde", 2) == owner("evler", 2) == owner("Evde", 2)
    assert {owner(w, 7) for w in ("kitap", "kitaplar", "kitabı")} == {owner("kit", 7)}
    # the first letters of a synthetic word list spread about evenly over two workers
    words = [a + b + c for a in "abcdefghijklmnoprstuvyz" for b in "aeiou" for c in "klmnrst"]
    share = sum(owner(w, 2) == 0 for w in words) / len(words)
    assert 0.4 < share < 0.6


def test_labels_out_of_order_are_generated_from_a_remembered_order(
    tur: morphfst.Language, monkeypatch: pytest.MonkeyPatch
) -> None:
    from morphfst.runtime import compiled_language as runtime

    expected = [f.form for f in tur.generate("kitap", "N;PL;LOC")]
    assert [f.form for f in tur.generate("ev", "LOC;PL;N")] == ["evlerde"]

    def refuse(codes: list[str]) -> None:
        raise AssertionError("the permutations were built again")

    monkeypatch.setattr(runtime, "_permutations", refuse)
    assert [f.form for f in tur.generate("kitap", "LOC;PL;N")] == expected


def _branching(length: int) -> pynini.Fst:
    """An acceptor-like transducer with two arcs per letter (outputs x/y, weights 1/0.5): 2**length paths."""
    fst = pynini.Fst()
    states = [fst.add_state() for _ in range(length + 1)]
    fst.set_start(states[0])
    fst.set_final(states[-1])
    for here, there in zip(states, states[1:]):
        fst.add_arc(here, Arc(ord("a"), ord("x"), 1.0, there))
        fst.add_arc(here, Arc(ord("a"), ord("y"), 0.5, there))
    return fst


def _both_passes(walker: walk.ArcWalker, word: str) -> tuple[object, object]:
    found = walker._forward(word)
    assert found is not None
    ident, trail = found
    partial = walker._final_pieces(ident)
    return walk._follow_back(trail, partial), walk._breadth_back(trail, partial, False)


def test_paths_followed_back_one_by_one_are_the_breadth_first_paths_in_order(tur: morphfst.Language) -> None:
    walker = walk.ArcWalker(_branching(6))
    one_by_one, breadth = _both_passes(walker, "aaaaaa")
    assert one_by_one == breadth and len(breadth) == 64  # type: ignore[arg-type]
    turkish = walk.ArcWalker(tur.fsts["bounded"], skip=[tur.plus])
    for word in ["yüzü", "atın", "kalemlerimizde", "evlerde", "gelmeyecekmişsiniz", "okuldakiler"]:
        one_by_one, breadth = _both_passes(turkish, word)
        assert one_by_one == breadth


def test_more_paths_than_kept_live_fall_back_to_the_pruning_pass(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(walk, "MAX_LIVE", 5)
    walker = walk.ArcWalker(_branching(4))
    one_by_one, breadth = _both_passes(walker, "aaaa")
    assert one_by_one is None and len(breadth) == 5  # type: ignore[arg-type]
    found = walker.walk("aaaa")
    assert [w for *_, w in found] == sorted(w for *_, w in breadth)  # type: ignore[misc]
    assert found[0] == ("aaaa", "yyyy", 2.0)


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_decoded_keys_are_the_analysis_text_and_segmentation(name: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    fast = lang.fast
    words = {
        "tur": ["evlerde", "yüzü", "atın", "kitaplarımızdan", "gelmeyecekmişsiniz", "okuldakiler", "değil", "kadar"],
        "fin": ["taloissa", "kirjastoautossa", "talossani", "juoksin", "kauniimpi", "ja", "hyvin"],
    }[name]
    checked = 0
    for word in words:
        for guessed, walker in ((False, fast.bounded), (True, fast.guesser)):
            for bounded, internal, weight in walker.walk(lang.normalize(word), 50) if walker else []:
                analysis, key = fast._decode(word, internal, bounded, weight, guessed)
                if key is not None:
                    assert key == (analysis.text, analysis.segmentation)
                    checked += 1
    assert checked > len(words)


def test_analyses_share_their_affix_morphs(tur: morphfst.Language) -> None:
    # one object per (form, affix, labels): fewer objects for the cycle collector to walk
    first, second = tur.analyze("evlerde")[0], tur.analyze("kitaplarda")[0]
    assert (first.text, second.text) == ("ev N;PL;LOC", "kitap N;PL;LOC")
    other = tur.analyze("adamlarda")[0]
    assert other.morphs[1] is second.morphs[1] and other.morphs[2] is second.morphs[2]  # -lar, -da
    assert first.morphs[1] is not second.morphs[1]  # -ler is another form


@pytest.mark.parametrize(
    ("name", "words"),
    [
        # stems the lexicons lack, with real endings (common practice: loanwords take native suffixes)
        ("tur", ["blogunda", "tweetlerimiz", "kriptoparalar", "vlogcular", "podcastlerden", "selfieyi"]),
        ("fin", ["vloggaamassa", "striimaajat", "podcasteissa", "meemeissä"]),
    ],
)
def test_the_best_guesses_are_the_first_of_all_guesses_decoded(
    name: str, words: list[str], request: pytest.FixtureRequest
) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    fast = lang.fast
    assert fast.guesser is not None
    assert any(len(fast.guess(word, 10)) > 1 for word in words)  # ties and cuts are compared
    for word in words:
        decoded = fast.decode_all(word, fast.guesser.walk(word, walk.MAX_PATHS), True)
        # guessed compounds (a first part the lexicon lacks before a word it has) rank among them, as
        # decode_all ranks: each (text, segmentation) at its lowest weight, by weight, text, segmentation
        low: dict[tuple[str, str], walk.Analysis] = {}
        for a in sorted(decoded + fast.compound_guesses(word, 10), key=lambda a: round(a.weight, 5)):
            low.setdefault((a.text, a.segmentation), a)
        ranked = sorted(low.values(), key=lambda a: (round(a.weight, 5), a.text, a.segmentation))
        for limit in (1, 3, 10):
            every = ranked[:limit]
            best = fast.guess(word, limit)
            assert best, word
            assert [(a.text, a.segmentation) for a in best] == [(a.text, a.segmentation) for a in every], (word, limit)
            assert [a.weight for a in best] == pytest.approx([a.weight for a in every]), (word, limit)

"""Search integration: conflation quality (Paice's indices) and the cost of the FTS5 tokenizer, in one run.

**Conflation quality.** Word forms that share a lemma form a group; the groups are read at run time
from the handbook paradigms of the test suites (every module-level table of ``(lemma, features, form)``
triples in ``tests/test_tur_*.py`` and ``tests/test_fin_*.py``; a form listed under two lemmas is kept
in the first group). Each conflation method maps a form to one index term; Paice's indices compare the
resulting partition with the groups (Paice 1994, "An evaluation method for stemming algorithms",
SIGIR; from memory):

- understemming index UI = GUMT / GDMT: the share of pairs of forms of one group that get different terms;
- overstemming index OI = GWMT / GDNT: pairs that share a term but belong to different groups, over
  all pairs of forms of different groups;
- ERRT: the distance from the origin to the method's (UI, OI) point over the distance to the
  truncation line (the (UI, OI) points of truncation to k = 1, 2, ... characters) along the same
  ray; 1 for any truncation, lower is better. UI + OI is reported too.

Methods: no stemming (the case-folded form), truncation to the first five characters (the usual strong
baseline for Turkish retrieval; Can et al. 2008, "Information retrieval on Turkish texts", JASIST; from
memory), and morphfst's lemma term (best analysis, guesses on: what ``morphfst index`` indexes).

**Cost.** A corpus sampled by frequency from the wordfreq list (ranks 1-20,000 only, as in
``bench_corpus.py``), one document per line, indexed with the morphfst tokenizer (1 and 2 processes)
and with FTS5's built-in ``unicode61`` tokenizer in the same schema: tokens per second and their ratio,
index file size and FTS data size ratio, and the median latency of top-10 queries with snippets for
words drawn from the corpus (with the mean number of matching documents, the recall side of the
trade). Times are medians of ``--runs`` runs. Usage::

    python bench/bench_search.py                          # both languages, 300,000 tokens, 3 runs
    python bench/bench_search.py --langs tur --tokens 100000 --runs 1
    python bench/bench_search.py --conflation-only
"""

from __future__ import annotations

import argparse
import importlib.util
import os
import random
import statistics
import sys
import tempfile
import time
from collections import Counter, defaultdict
from collections.abc import Callable, Iterable
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "bench"))
sys.path.insert(0, str(ROOT / "tests"))

import morphfst  # noqa: E402
from morphfst.search import TermAnalyzer, TermOptions  # noqa: E402

WORDFREQ_CODES = {"tur": "tr", "fin": "fi"}


# ---- the word groups --------------------------------------------------------------------------------
def paradigm_triples(lang: str) -> list[tuple[str, str, str]]:
    """Every (lemma, features, form) triple in the module-level tables of tests/test_<lang>_*.py, in order.

    Tables are found by shape, whatever their names: lists, tuples and dicts (their values) holding
    tuples of strings in which a feature bundle (``N;PL;LOC``) stands between the lemma and the form."""
    found: dict[tuple[str, str, str], None] = {}
    for path in sorted((ROOT / "tests").glob(f"test_{lang}_*.py")):
        spec = importlib.util.spec_from_file_location(f"_paradigms_{path.stem}", path)
        assert spec is not None and spec.loader is not None
        module = importlib.util.module_from_spec(spec)
        spec.loader.exec_module(module)
        for name, value in vars(module).items():
            if not name.startswith("_"):
                for triple in _triples(value, 0):
                    found.setdefault(triple, None)
    return list(found)


def _triples(value: object, depth: int) -> Iterable[tuple[str, str, str]]:
    if isinstance(value, tuple) and value and all(isinstance(x, str) for x in value):
        for i in range(1, len(value) - 1):
            if ";" in value[i] and " " not in value[i] and value[i - 1] and value[i + 1]:
                yield value[i - 1], value[i], value[i + 1]
                return
        return
    if depth >= 3:
        return
    if isinstance(value, dict):
        value = list(value.values())
    if isinstance(value, list | tuple):
        for item in value:
            yield from _triples(item, depth + 1)


def word_groups(lang: morphfst.Language, triples: Iterable[tuple[str, str, str]]) -> dict[str, str]:
    """Normalized form -> group (its lemma); a form already in a group stays there."""
    groups: dict[str, str] = {}
    for lemma, _features, form in triples:
        groups.setdefault(lang.normalize(form), lemma)
    return groups


# ---- Paice's indices --------------------------------------------------------------------------------
def paice(groups: dict[str, str], term: Callable[[str], str]) -> tuple[float, float]:
    """(UI, OI) of a conflation ``term`` on the word groups (Paice 1994; see the module documentation)."""
    words = list(groups)
    total = len(words)
    by_group: dict[str, list[str]] = defaultdict(list)
    for w in words:
        by_group[groups[w]].append(w)
    terms = {w: term(w) for w in words}
    gdmt = gumt = gdnt = 0.0
    for members in by_group.values():
        n = len(members)
        gdmt += 0.5 * n * (n - 1)
        gdnt += 0.5 * n * (total - n)
        counts = Counter(terms[w] for w in members)
        gumt += 0.5 * sum(u * (n - u) for u in counts.values())
    by_term: dict[str, list[str]] = defaultdict(list)
    for w in words:
        by_term[terms[w]].append(w)
    gwmt = 0.0
    for members in by_term.values():
        n = len(members)
        counts = Counter(groups[w] for w in members)
        gwmt += 0.5 * sum(v * (n - v) for v in counts.values())
    return (gumt / gdmt if gdmt else 0.0), (gwmt / gdnt if gdnt else 0.0)


def errt(point: tuple[float, float], line: list[tuple[float, float]]) -> float:
    """Paice's ERRT: |OP| / |OX|, X where the ray from the origin through P meets the truncation line."""
    px, py = point
    if px == 0 and py == 0:
        return 0.0
    segments = list(zip(line, line[1:]))
    for (ax, ay), (bx, by) in segments:
        collinear = abs(ax * py - ay * px) < 1e-15 and abs(bx * py - by * px) < 1e-15
        if collinear and min(ax, bx) - 1e-12 <= px <= max(ax, bx) + 1e-12 and min(ay, by) - 1e-12 <= py <= max(ay, by) + 1e-12:
            return 1.0  # the point lies on the line itself (a truncation, or OI = 0 along a flat stretch)
    for (ax, ay), (bx, by) in segments:
        dx, dy = bx - ax, by - ay
        denom = px * dy - py * dx
        if abs(denom) < 1e-15:
            continue
        t = (ax * dy - ay * dx) / denom  # X = t * P
        s = (ax * py - ay * px) / denom  # X = A + s * (B - A)
        if t > 0 and -1e-9 <= s <= 1 + 1e-9:
            return 1.0 / t
    return float("nan")


def conflation_table(lang: morphfst.Language, details: bool = False) -> list[str]:
    groups = word_groups(lang, paradigm_triples(lang.name))
    analyzer = TermAnalyzer(lang, TermOptions(("lemma",), "best", True))
    longest = max(len(w) for w in groups)
    line = [paice(groups, lambda w, k=k: w[:k]) for k in range(1, longest + 2)]
    methods: list[tuple[str, Callable[[str], str]]] = [
        ("no stemming", lambda w: w),
        ("truncation to 5 characters", lambda w: w[:5]),
        ("morphfst lemma term (best analysis)", lambda w: (analyzer.document_terms(w) or (w,))[0]),
    ]
    if details:
        term = methods[2][1]
        by_group: dict[str, set[str]] = defaultdict(set)
        by_term: dict[str, set[str]] = defaultdict(set)
        for w, g in groups.items():
            by_group[g].add(term(w))
            by_term[term(w)].add(g)
        for g, ts in sorted(by_group.items()):
            if len(ts) > 1:
                print(
                    f"  split   {g}: "
                    + ", ".join(f"{t}<-{'/'.join(w for w in groups if groups[w] == g and term(w) == t)}" for t in sorted(ts))
                )
        for t, gs in sorted(by_term.items()):
            if len(gs) > 1:
                print(f"  merged  {t}: " + ", ".join(sorted(gs)))
    n_groups = len(set(groups.values()))
    rows = [f"{lang.name}: {len(groups)} word forms in {n_groups} groups (lemmas) from tests/test_{lang.name}_*.py", ""]
    rows.append(f"{'method':<38} {'UI':>7} {'OI':>8} {'UI+OI':>7} {'ERRT':>6}")
    for name, fn in methods:
        ui, oi = paice(groups, fn)
        rows.append(f"{name:<38} {ui:7.4f} {oi:8.5f} {ui + oi:7.4f} {errt((ui, oi), line):6.3f}")
    return rows


# ---- indexing cost ----------------------------------------------------------------------------------
def build_baseline(db: Path, lines: list[str]) -> float:
    import apsw

    con = apsw.Connection(str(db))
    start = time.perf_counter()
    con.execute("CREATE VIRTUAL TABLE docs USING fts5(path UNINDEXED, line UNINDEXED, body, tokenize='unicode61')")
    with con:
        con.executemany("INSERT INTO docs VALUES ('corpus', ?, ?)", ((i, t) for i, t in enumerate(lines, 1) if t.strip()))
    seconds = time.perf_counter() - start
    con.close()
    return seconds


def build_morphfst(db: Path, corpus: Path, lang: morphfst.Language, jobs: int) -> float:
    from morphfst.search.index import open_index, update_index

    start = time.perf_counter()
    index = open_index(db, lang.name, create=True, load_language=lambda spec: lang)
    update_index(index, [str(corpus)], jobs=jobs)
    index.close()
    return time.perf_counter() - start


def fts_data_bytes(db: Path) -> int:
    import apsw

    con = apsw.Connection(str(db))
    size = con.execute("SELECT coalesce(sum(length(block)), 0) FROM docs_data").fetchone()[0]
    con.close()
    return int(size)


def query_latency(db: Path, lang: morphfst.Language | None, queries: list[str]) -> tuple[float, float]:
    """(median seconds per query, mean documents matched)."""
    import apsw

    from morphfst.search.index import open_index, search, top_documents

    if lang is not None:
        index = open_index(db, readonly=True, load_language=lambda spec: lang)
        con = index.con
    else:
        con = apsw.Connection(str(db), flags=apsw.SQLITE_OPEN_READONLY)
    times = []
    found = []
    for q in queries:
        quoted = '"' + q.replace('"', '""') + '"'
        start = time.perf_counter()
        if lang is not None:
            search(index, quoted, 10)  # the query analyzed, top 10 by bm25, snippets and highlights
        else:
            top_documents(con, quoted, 10)  # the same statements on the unicode61 table
        times.append(time.perf_counter() - start)
        found.append(con.execute("SELECT count(*) FROM docs WHERE docs MATCH ?", (quoted,)).fetchone()[0])
    con.close()
    return statistics.median(times), statistics.fmean(found)


def cost_table(lang: morphfst.Language, tokens: int, runs: int, workdir: Path, queries: int) -> list[str]:
    from bench_corpus import build_corpus

    corpus = workdir / f"{lang.name}.txt"
    build_corpus(WORDFREQ_CODES[lang.name], tokens, corpus)
    lines = corpus.read_text(encoding="utf-8").split("\n")
    ntok = sum(len(line.split()) for line in lines)
    timings: dict[str, list[float]] = {"unicode61": [], "morphfst, 1 process": [], "morphfst, 2 processes": []}
    for run in range(runs):
        for name in timings:
            db = workdir / f"{lang.name}-{run}-{name.split(',')[0]}{'-j2' if '2' in name else ''}.db"
            if db.exists():
                db.unlink()
            if name == "unicode61":
                timings[name].append(build_baseline(db, lines))
            else:
                timings[name].append(build_morphfst(db, corpus, lang, 2 if "2 processes" in name else 1))
    base_db = workdir / f"{lang.name}-0-unicode61.db"
    ours_db = workdir / f"{lang.name}-0-morphfst.db"
    rate = {name: ntok / statistics.median(ts) for name, ts in timings.items()}
    rng = random.Random(11)
    words = sorted({w for line in lines for w in line.split()})
    sample = rng.sample(words, min(queries, len(words)))
    base_latency, base_found = query_latency(base_db, None, sample)
    ours_latency, ours_found = query_latency(ours_db, lang, sample)
    size_base, size_ours = os.path.getsize(base_db), os.path.getsize(ours_db)
    data_base, data_ours = fts_data_bytes(base_db), fts_data_bytes(ours_db)
    rows = [
        f"{lang.name}: {ntok:,} tokens in {len(lines):,} lines (wordfreq ranks 1-20,000 by frequency), medians of {runs} run(s)",
        "",
    ]
    rows.append(f"{'indexing':<28} {'tokens/s':>10} {'ratio':>7}")
    for name, value in rate.items():
        rows.append(f"{name:<28} {value:10,.0f} {value / rate['unicode61']:7.2f}")
    rows.append("")
    rows.append(
        f"index file: {size_ours / 2**20:.1f} MiB vs {size_base / 2**20:.1f} MiB (ratio {size_ours / size_base:.2f}); "
        f"FTS data only: ratio {data_ours / max(data_base, 1):.2f}"
    )
    rows.append(
        f"query (top 10, snippet and highlight), {len(sample)} words: median {ours_latency * 1000:.2f} ms vs "
        f"{base_latency * 1000:.2f} ms (ratio {ours_latency / base_latency:.2f}); "
        f"mean documents matched {ours_found:.1f} vs {base_found:.1f}"
    )
    return rows


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--langs", default="tur,fin")
    parser.add_argument("--tokens", type=int, default=300_000)
    parser.add_argument("--runs", type=int, default=3)
    parser.add_argument("--queries", type=int, default=300)
    parser.add_argument("--conflation-only", action="store_true")
    parser.add_argument(
        "--details", action="store_true", help="list the groups the lemma terms split and the terms that merge groups"
    )
    args = parser.parse_args(argv)
    for name in args.langs.split(","):
        lang = morphfst.load(name)
        print("\n".join(conflation_table(lang, args.details)))
        print()
        if not args.conflation_only:
            with tempfile.TemporaryDirectory(prefix="morphfst-bench-search-") as tmp:
                print("\n".join(cost_table(lang, args.tokens, args.runs, Path(tmp), args.queries)))
            print()
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

"""Core benchmark: compile time, load time, transducer sizes, cold analysis throughput.

Prints, in one run and side by side on the same unique words:
  * the composition path (segmenter, then bounded analyzer, decoded into Analysis objects),
  * analyze(): the bounded analyzer's arcs walked in Python and decoded, no per-word cache,
  * the walk alone (ranked analysis strings, what the baseline returns),
  * the plain baseline: one ``pynini.lib.rewrite.rewrites`` call per word on the analyzer,
  * the practical ceiling: a dict lookup of precomputed answers,
and the ratios against the baseline. Figures are medians of --runs runs. Also prints how compile
time and analyzer size grow with lexicon size (the lexicon cloned under new stems).

Words: analyzable words sampled from the language itself (pynini.randgen on the analyzer's input
side), plus, with --wordfreq, the wordfreq list of the language restricted to ranks 1-20,000 (the
development range; higher ranks are kept for evaluation and never read here).

    python bench/bench_core.py                 # Turkish, defaults
    python bench/bench_core.py --lang fin --words 3000 --runs 5 --wordfreq
"""

from __future__ import annotations

import argparse
import itertools
import os
import shutil
import statistics
import sys
import tempfile
import time
from pathlib import Path

import pynini
import pynini.lib.rewrite as rewrite

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import compile_grammar  # noqa: E402
from morphfst.compile.fstutil import size  # noqa: E402

DEV_RANKS = 20_000  # wordfreq ranks past this are evaluation data: never read by benchmarks


def sample_words(lang: morphfst.Language, n: int, seed: int = 7) -> list[str]:
    """Distinct analyzable surface words drawn at random from the analyzer."""
    surfaces = lang.fsts["analyzer"].copy().project("input")
    words: set[str] = set()
    tries = 0
    while len(words) < n and tries < 20:
        fst = pynini.randgen(surfaces, npath=n * 2, seed=seed + tries, max_length=25)
        for path in fst.paths(input_token_type="utf8", output_token_type="utf8").istrings():
            words.add(path)
        tries += 1
    return sorted(words)[:n]


def wordfreq_words(code: str, n: int) -> list[str]:
    from wordfreq import top_n_list

    return top_n_list(code, DEV_RANKS)[:n]


def timed(fn, words: list[str]) -> float:  # type: ignore[no-untyped-def]
    t0 = time.perf_counter()
    for w in words:
        fn(w)
    return time.perf_counter() - t0


def median_rate(fn, words: list[str], runs: int, reset=None) -> float:  # type: ignore[no-untyped-def]
    rates = []
    for _ in range(runs):
        if reset:
            reset()
        rates.append(len(words) / timed(fn, words))
    return statistics.median(rates)


def throughput(lang: morphfst.Language, words: list[str], runs: int, label: str) -> None:
    analyzer = lang.fsts["analyzer"]

    def baseline(w: str) -> None:
        try:
            rewrite.rewrites(lang.normalize(w), analyzer, input_token_type="utf8", output_token_type="utf8")
        except rewrite.Error:
            pass

    def fresh() -> None:
        lang._fast = None  # a new arc-table analyzer: its decoding memos start empty ...
        _ = lang.fast  # ... and its arc tables are built before the clock starts

    def walk_only(w: str) -> None:
        lang.fast.bounded.walk(lang.normalize(w))

    answers = {w: lang._analyze_tuple(w) for w in words}

    def ceiling(w: str) -> None:
        answers.get(w)

    rows = [("plain baseline: pynini.lib.rewrite.rewrites per word", median_rate(baseline, words, runs))]
    rows.append(("composition path (analyze_composed), full analyses", median_rate(lang._composed, words, runs)))
    rows.append(("analyze(): arc-table walk + decoding, no word cache", median_rate(lang._analyze_tuple, words, runs, fresh)))
    rows.append(("arc-table walk only (ranked analysis strings)", median_rate(walk_only, words, runs, fresh)))
    rows.append(("ceiling: dict lookup of precomputed answers", median_rate(ceiling, words, runs)))
    base = rows[0][1]
    known = sum(1 for w in words if answers[w])
    print(f"\n{label}: {len(words)} unique words ({known} analyzable), median of {runs} runs")
    print(f"  {'path':<55} {'words/s':>12} {'µs/word':>10} {'x baseline':>11}")
    for name, rate in rows:
        print(f"  {name:<55} {rate:>12,.0f} {1e6 / rate:>10.1f} {rate / base:>11.2f}")


def scaling(grammar: Path, factors: list[int]) -> None:
    """Compile time and analyzer size against lexicon size (entries cloned under new stems)."""
    from morphfst.compile.loader import load_model

    print("\ncompile cost against lexicon size (lexicon cloned under new stems)")
    print(f"  {'entries':>8} {'compile s':>10} {'analyzer states':>16} {'arcs':>10}")
    base = load_model(grammar)
    src_lex = [p for p in (grammar.parent / base.lexicon_paths[0]).resolve().glob("*.tsv")]
    for factor in factors:
        counter = itertools.count()
        with tempfile.TemporaryDirectory() as tmp:
            tmpdir = Path(tmp)
            lexdir = tmpdir / "lex"
            lexdir.mkdir()
            text = grammar.read_text(encoding="utf-8").replace(f'lexicon "{base.lexicon_paths[0]}"', 'lexicon "lex"')
            (tmpdir / grammar.name).write_text(text, encoding="utf-8")
            for path in src_lex:
                lines = path.read_text(encoding="utf-8").splitlines()
                header = next(i for i, ln in enumerate(lines) if ln.strip() and not ln.startswith("#"))
                cols = lines[header].split("\t")
                out = [lines[header]]
                for _copy in range(factor):
                    for ln in lines[header + 1 :]:
                        if not ln.strip() or ln.startswith("#"):
                            continue
                        f = ln.split("\t")
                        if factor > 1:
                            # a new stem: the lemma behind a fixed-length prefix, distinct for each copy
                            prefix = _prefix(next(counter))
                            f[0] = prefix + f[0]
                            if "stem" in cols and f[cols.index("stem")]:
                                f[cols.index("stem")] = prefix + f[cols.index("stem")]
                        out.append("\t".join(f))
                (lexdir / path.name).write_text("\n".join(out) + "\n", encoding="utf-8")
            t0 = time.perf_counter()
            out_path = compile_grammar(tmpdir / grammar.name, tmpdir / "x.mfc")
            secs = time.perf_counter() - t0
            lang = morphfst.load(out_path)
            states, arcs = size(lang.fsts["analyzer"])
            print(f"  {len(lang.meta['lexicon']):>8} {secs:>10.2f} {states:>16,} {arcs:>10,}")


_COMBOS: list[str] = []


def _prefix(k: int) -> str:
    """A fixed-length (three-syllable) prefix, drawn at random without repetition, so that copies share
    no structure (each entry of each copy gets its own) and equal-length prefixes never collide."""
    import random

    if not _COMBOS:
        cons, vowels = "bdklmnrst", "aeiou"
        syl = [c + v for c in cons for v in vowels]
        _COMBOS.extend(a + b + c for a in syl for b in syl for c in syl)
        random.Random(12345).shuffle(_COMBOS)
    return _COMBOS[k]


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--lang", default="tur")
    ap.add_argument("--words", type=int, default=2000)
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--wordfreq", action="store_true", help="also time the wordfreq dev list (ranks 1-20,000)")
    ap.add_argument("--scale", default="1,10,50", help="lexicon clone factors for the growth table ('' to skip)")
    args = ap.parse_args()
    grammar = ROOT / "grammars" / f"{args.lang}.mfg"
    os.environ.setdefault("MORPHFST_CACHE", tempfile.mkdtemp(prefix="morphfst-bench-"))
    cache = Path(os.environ["MORPHFST_CACHE"])

    t0 = time.perf_counter()
    out = compile_grammar(grammar, cache / f"{args.lang}-bench.mfc")
    compile_s = time.perf_counter() - t0
    loads = []
    for _ in range(max(args.runs, 3)):
        t0 = time.perf_counter()
        lang = morphfst.load(out)
        loads.append(time.perf_counter() - t0)
    print(f"morphfst core benchmark: {lang.title}")
    print(
        f"  compile time:            {compile_s:.2f} s ({len(lang.meta['lexicon'])} lexicon entries, {len(lang.meta['rules'])} rules)"
    )
    print(
        f"  compiled file:           {out.stat().st_size / 1024:.0f} KiB, load time median {statistics.median(loads) * 1000:.1f} ms"
    )
    for name, fst in lang.fsts.items():
        states, arcs = size(fst)
        print(f"  {name:<24} {states:>8,} states {arcs:>9,} arcs")
    words = sample_words(lang, args.words)
    throughput(lang, words, args.runs, "sampled analyzable words")
    if args.wordfreq:
        code = {"tur": "tr", "fin": "fi"}.get(args.lang, args.lang)
        throughput(lang, wordfreq_words(code, args.words), args.runs, f"wordfreq '{code}' ranks 1-{args.words}")
    if args.scale:
        scaling(grammar, [int(x) for x in args.scale.split(",") if x])
    shutil.rmtree(cache / "unused", ignore_errors=True)


if __name__ == "__main__":
    main()

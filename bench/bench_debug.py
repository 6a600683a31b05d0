"""Debugging-tools benchmark: what explaining, diagnosing, testing and linting cost per call.

Prints, in one run and side by side, medians of --runs runs:
  * the baseline: one plain ``pynini.lib.rewrite.rewrites`` call on the analyzer per word,
  * morphfst's analyze() with its cache cleared,
  * explain() per accepted word (rule-by-rule trace of every analysis),
  * diagnose() per rejected word (every relaxation, nearest words), with a fresh session each run,
  * the session setup (grammar source reloaded, compiler built), the inline test run with coverage,
    and lint of the whole grammar,
and the per-word ratios against the baseline.

Accepted words are sampled from the language itself (pynini.randgen on the analyzer's input side);
rejected words are made from them by one random edit that the language does not accept.

    python bench/bench_debug.py                      # Turkish
    python bench/bench_debug.py --lang fin --words 40 --runs 3
"""

from __future__ import annotations

import argparse
import random
import statistics
import sys
import time
from pathlib import Path

import pynini
import pynini.lib.rewrite as rewrite

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.compile.fstutil import paths  # noqa: E402
from morphfst.debug import DebugSession, diagnose, explain, lint, run_tests  # noqa: E402


def sample_words(lang: morphfst.Language, n: int, seed: int) -> list[str]:
    acceptor = lang.fsts["analyzer"].copy().project("input").rmepsilon()
    words: list[str] = []
    for _, out, _ in paths(pynini.randgen(acceptor, npath=n * 4, seed=seed, select="uniform"), n * 4):
        if out and out not in words:
            words.append(out)
    return words[:n]


def corrupt(lang: morphfst.Language, words: list[str], seed: int) -> list[str]:
    rng = random.Random(seed)
    letters = sorted({c for w in words for c in w})
    out: list[str] = []
    for w in words:
        for _ in range(20):
            i = rng.randrange(len(w))
            op = rng.choice("sdi")
            bad = (
                w[:i] + (rng.choice(letters) if op == "s" else "") + w[i + 1 :]
                if op != "i"
                else w[:i] + rng.choice(letters) + w[i:]
            )
            if bad and bad != w and not lang.accepts(bad):
                out.append(bad)
                break
    return out


def timed(fn, runs: int) -> float:  # type: ignore[no-untyped-def]
    times = []
    for _ in range(runs):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--lang", default="tur")
    ap.add_argument("--words", type=int, default=30)
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--seed", type=int, default=7)
    args = ap.parse_args()
    lang = morphfst.load(args.lang)
    good = sample_words(lang, args.words, args.seed)
    bad = corrupt(lang, good, args.seed)
    analyzer = lang.fsts["analyzer"]

    def baseline() -> None:
        for w in good:
            rewrite.rewrites(w, analyzer, input_token_type="utf8", output_token_type="utf8")

    def analyze() -> None:
        lang.analyze_cached.cache_clear()
        for w in good:
            lang.analyze(w)

    session = DebugSession.open(lang)
    session.grammar  # noqa: B018  (load once outside the timed loops)

    def do_explain() -> None:
        for w in good:
            explain(session, w)

    def do_diagnose() -> None:
        fresh = DebugSession(lang)
        for w in bad:
            diagnose(fresh, w)

    def setup() -> None:
        DebugSession(lang).compiler  # noqa: B018

    def tests() -> None:
        run_tests(DebugSession(lang))

    def do_lint() -> None:
        lint(DebugSession(lang))

    t_base = timed(baseline, args.runs) / max(len(good), 1)
    t_an = timed(analyze, args.runs) / max(len(good), 1)
    t_ex = timed(do_explain, args.runs) / max(len(good), 1)
    t_setup = timed(setup, args.runs)
    t_diag = (timed(do_diagnose, args.runs) - t_setup) / max(len(bad), 1)
    t_tests = timed(tests, args.runs)
    t_lint = timed(do_lint, args.runs)
    print(
        f"language {lang.name}: {len(good)} accepted words, {len(bad)} rejected words, {len(session.grammar.lexicon)} lexicon entries, "
        f"{len(session.grammar.rules)} rules, medians of {args.runs} runs"
    )
    print(f"{'per word':<34}{'ms':>10}{'x baseline':>12}")
    for name, t in (
        ("baseline rewrite.rewrites", t_base),
        ("analyze (cache cleared)", t_an),
        ("explain (every analysis traced)", t_ex),
        ("diagnose (rejected word)", t_diag),
    ):
        print(f"{name:<34}{t * 1000:>10.2f}{t / t_base:>12.1f}")
    print(f"{'per grammar':<34}{'s':>10}")
    print(f"{'session setup (grammar reloaded)':<34}{t_setup:>10.2f}")
    print(f"{'inline tests with coverage':<34}{t_tests:>10.2f}")
    print(f"{'lint (whole grammar)':<34}{t_lint:>10.2f}")
    layers: dict[str, int] = {}
    for w in bad:
        layer = diagnose(session, w).layer
        layers[layer] = layers.get(layer, 0) + 1
    print("layers found for the rejected words: " + ", ".join(f"{k} {v}" for k, v in sorted(layers.items())))


if __name__ == "__main__":
    main()

"""Benchmark of corpus segmentation (``morphfst corpus``) on a Zipfian corpus, with baselines, in one run.

The corpus is built by sampling tokens from the wordfreq word list of each language by frequency
(wordfreq, PyPI; only ranks 1-20,000 are used: the list is read with ``top_n_list(code, 20000)`` and
the rest is kept for evaluation), in lines of 5 to 20 tokens, into a temporary file.

Reported for each language, side by side:

- the plain baseline: one ``pynini.lib.rewrite.rewrites`` call on the analyzer per token (a sample);
- the cold analyzer: every word type analyzed once without cache, by the fast path (the packed arc
  tables walked in C, or in Python without the extension), against the same baseline on the same
  types, and with the guesser;
- end to end (read, tokenize, analyze with the per-type cache, write, count): 1 and 2 processes,
  cold (fresh processes, empty caches) and warm (the same processes, a second pass);
- the practical ceiling: a dict lookup of precomputed answers per token;
- peak memory of the command's process tree (main process and workers, sampled every 50 ms).

Times are medians of ``--runs`` runs. Usage::

    python bench/bench_corpus.py                      # 5,000,000 tokens per language, 3 runs
    python bench/bench_corpus.py --tokens 1000000 --runs 1 --langs tur
"""

from __future__ import annotations

import argparse
import os
import random
import statistics
import sys
import tempfile
import time
from collections.abc import Callable
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.corpus import Options  # noqa: E402
from morphfst.corpus.local import Workers, run_local  # noqa: E402
from morphfst.corpus.outputs import open_sink  # noqa: E402
from morphfst.corpus.records import ChunkProcessor  # noqa: E402
from morphfst.corpus.sources import expand_inputs  # noqa: E402
from morphfst.runtime.walk import FastAnalyzer  # noqa: E402

WORDFREQ_CODES = {"tur": "tr", "fin": "fi"}
DEV_RANKS = 20_000  # wordfreq ranks usable for development; the rest is for evaluation only


def build_corpus(code: str, tokens: int, path: Path, seed: int = 5) -> tuple[list[str], int]:
    """Write a corpus of ``tokens`` tokens sampled by frequency from ranks 1-20,000; returns (types, lines)."""
    from wordfreq import top_n_list, word_frequency

    words = top_n_list(code, DEV_RANKS)
    assert len(words) <= DEV_RANKS
    weights = [word_frequency(w, code) for w in words]
    rng = random.Random(seed)
    sample = rng.choices(words, weights=weights, k=tokens)
    return words, write_lines(sample, path, rng)


def write_lines(tokens: list[str], path: Path, rng: random.Random) -> int:
    """Write ``tokens`` to ``path`` in lines of 5 to 20 tokens; returns the number of lines."""
    lines = 0
    with path.open("w", encoding="utf-8") as out:
        i = 0
        while i < len(tokens):
            n = rng.randint(5, 20)
            out.write(" ".join(tokens[i : i + n]) + "\n")
            i += n
            lines += 1
    return lines


def run_command(argv: list[str]) -> tuple[float, float]:
    """Run a command; returns (wall seconds, peak resident memory of its process tree in bytes)."""
    import subprocess

    env = dict(os.environ, PYTHONPATH=str(ROOT) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    peak = 0.0
    t0 = time.perf_counter()
    child = subprocess.Popen(argv, cwd=ROOT, env=env)
    try:
        import psutil

        proc = psutil.Process(child.pid)
        while child.poll() is None:
            try:
                tree = [proc, *proc.children(recursive=True)]
                peak = max(peak, sum(p.memory_info().rss for p in tree))
            except psutil.Error:
                pass
            time.sleep(0.05)
    except ImportError:
        child.wait()
        import resource

        peak = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss * 1024.0
    seconds = time.perf_counter() - t0
    if child.wait() != 0:
        raise RuntimeError(f"command failed: {' '.join(argv)}")
    return seconds, peak


def median_time(fn: Callable[[], object], runs: int) -> float:
    times = []
    for _ in range(runs):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def baseline_analyze(analyzer: object) -> Callable[[str], list[str]]:
    from pynini.lib import rewrite

    def run(word: str) -> list[str]:
        try:
            return list(rewrite.rewrites(word, analyzer, input_token_type="utf8", output_token_type="utf8"))
        except rewrite.Error:
            return []

    return run


def bench_language(lang_name: str, tokens: int, runs: int, sample: int, workdir: Path) -> list[str]:
    code = WORDFREQ_CODES[lang_name]
    out: list[str] = []
    corpus = workdir / f"{lang_name}-zipf.txt"
    t0 = time.perf_counter()
    words, lines = build_corpus(code, tokens, corpus)
    size = corpus.stat().st_size
    build_s = time.perf_counter() - t0
    lang = morphfst.load(lang_name)
    fast = lang.fast
    text = corpus.read_text(encoding="utf-8")
    processor = ChunkProcessor(lang, Options())
    all_tokens = processor.tokenizer.tokens(text.replace("\n", " "))
    types = sorted(set(all_tokens))
    rng = random.Random(11)
    out.append(
        f"language {lang_name}: {len(all_tokens):,} tokens, {len(types):,} types, {lines:,} lines, {size / 1e6:.1f} MB "
        f"(wordfreq '{code}' ranks 1-{DEV_RANKS:,} sampled by frequency; built in {build_s:.1f} s)"
    )

    # ---- per word: baseline vs the fast path, cold (every type once, no cache) ---------------------------
    # Measured in paired rounds (baseline, then each contender, on the same words) so that the ratio of
    # each round compares runs made under the same machine load; medians over the rounds.
    base = baseline_analyze(lang.fsts["analyzer"])
    type_sample = rng.sample(types, min(sample, len(types)))
    known = [w for w in types if fast.analyze(w)]
    rounds = max(runs, 5)
    per_word: dict[str, list[float]] = {
        name: [] for name in ["base", "compose", "walk", "fast", "pipeline", "base_known", "fast_known", "walk_known"]
    }
    ratios: dict[str, list[float]] = {name: [] for name in ["compose", "walk", "fast", "pipeline", "known", "walk_known"]}
    for _ in range(rounds):
        # Fresh analyzers each round: their decoding memos (shared suffix chains, stem morphs) start empty.
        fresh = FastAnalyzer(lang)
        fresh_processor = ChunkProcessor(lang, Options())
        fresh_processor.fast = FastAnalyzer(lang)
        contenders: dict[str, Callable[[str], object]] = {
            "compose": lang._composed,
            "walk": lambda w, fresh=fresh: fresh.bounded.walk(lang.normalize(w)),  # type: ignore[misc]
            "fast": fresh.analyze,
            "pipeline": fresh_processor.analyze_type,
        }
        t_base = median_time(lambda: [base(w) for w in type_sample], 1) / len(type_sample)
        per_word["base"].append(t_base)
        for name, fn in contenders.items():
            t = median_time(lambda fn=fn: [fn(w) for w in type_sample], 1) / len(type_sample)  # type: ignore[misc]
            per_word[name].append(t)
            ratios[name].append(t_base / t)
        if known:
            tb = median_time(lambda: [base(w) for w in known], 1) / len(known)
            fresh_known = FastAnalyzer(lang)
            tf = median_time(lambda fk=fresh_known: [fk.analyze(w) for w in known], 1) / len(known)  # type: ignore[misc]
            tw = median_time(lambda fk=fresh_known: [fk.bounded.walk(lang.normalize(w)) for w in known], 1) / len(known)  # type: ignore[misc]
            per_word["base_known"].append(tb)
            per_word["fast_known"].append(tf)
            per_word["walk_known"].append(tw)
            ratios["known"].append(tb / tf)
            ratios["walk_known"].append(tb / tw)
    med = {name: statistics.median(v) if v else float("nan") for name, v in per_word.items()}
    ratio = {name: statistics.median(v) if v else float("nan") for name, v in ratios.items()}

    # ---- per token: plain baseline and practical ceiling ---------------------------------------------------------
    token_sample = rng.sample(all_tokens, min(sample, len(all_tokens)))
    base_tps = len(token_sample) / median_time(lambda: [base(t) for t in token_sample], runs)
    answers = {t: processor.format_type(processor.analyze_type(t)) for t in types}
    ceiling_tps = len(all_tokens) / median_time(lambda: [answers[t] for t in all_tokens], runs)

    # ---- end to end ------------------------------------------------------------------------------------------------------
    # Cold: the command a user runs ('morphfst corpus', a fresh process with empty caches; the time
    # includes start-up and loading the compiled grammar); memory is the peak of its process tree.
    # Warm: the same worker processes (or processor) run the corpus a second time, in this process.
    n = len(all_tokens)
    rows: list[tuple[str, float, float | None]] = []
    target = workdir / f"{lang_name}.terms.txt"
    for jobs in (1, 2):
        cold, peaks = [], []
        for _ in range(runs):
            seconds, peak = run_command(
                [
                    sys.executable,
                    "-m",
                    "morphfst",
                    "corpus",
                    "-l",
                    lang.path or lang_name,
                    str(corpus),
                    "-o",
                    str(target),
                    "-q",
                    "-j",
                    str(jobs),
                ]
            )
            cold.append(seconds)
            peaks.append(peak)
        rows.append((f"end to end, {jobs} process{'es' if jobs > 1 else ''}, cold cache", statistics.median(cold), max(peaks)))
        sources = expand_inputs([str(corpus)])
        warm: list[float] = []
        if jobs == 1:
            proc = ChunkProcessor(lang, Options())
            run_local(lang, sources, lambda s: open_sink(target), Options(), 1, processor=proc)
            for _ in range(runs):
                t1 = time.perf_counter()
                run_local(lang, sources, lambda s: open_sink(target), Options(), 1, processor=proc)
                warm.append(time.perf_counter() - t1)
        else:
            pool = Workers(lang, Options(), jobs, ChunkProcessor)
            try:
                run_local(lang, sources, lambda s: open_sink(target), Options(), jobs, workers=pool)
                for _ in range(runs):
                    t1 = time.perf_counter()
                    run_local(lang, sources, lambda s: open_sink(target), Options(), jobs, workers=pool)
                    warm.append(time.perf_counter() - t1)
                pool.finish()
            finally:
                pool.close()
        rows.append((f"end to end, {jobs} process{'es' if jobs > 1 else ''}, warm cache", statistics.median(warm), None))

    out.append("")
    out.append(
        f"  per word type, no cache ({len(type_sample):,} random types; medians of {rounds} paired rounds)   µs/word   speed-up vs baseline"
    )
    out.append(f"  plain baseline: rewrite on the analyzer    {med['base'] * 1e6:9.1f}   1.0x")
    out.append(f"  FST composition path (Language.analyze)    {med['compose'] * 1e6:9.1f}   {ratio['compose']:.1f}x")
    out.append(f"  fast path, walk only (raw analyses)        {med['walk'] * 1e6:9.1f}   {ratio['walk']:.1f}x")
    out.append(f"  fast path, decoded analyses                {med['fast'] * 1e6:9.1f}   {ratio['fast']:.1f}x")
    out.append(
        f"  fast path + guesser (pipeline, per type)   {med['pipeline'] * 1e6:9.1f}   {ratio['pipeline']:.1f}x (the baseline does not guess)"
    )
    out.append(
        f"  words the lexicon knows ({len(known):,} types): baseline {med['base_known'] * 1e6:.1f} µs; fast path walk only "
        f"{med['walk_known'] * 1e6:.1f} µs ({ratio['walk_known']:.1f}x), decoded {med['fast_known'] * 1e6:.1f} µs ({ratio['known']:.1f}x)"
    )
    out.append(
        "  (walk only: the ranked analysis strings, what the baseline returns; decoded: Analysis objects with morphs and glosses)"
    )
    out.append("")
    out.append("  per token (median)                              tokens/s   vs baseline   vs ceiling   peak memory")
    out.append(f"  plain baseline: rewrite per token (sample)  {base_tps:12,.0f}   {1.0:9.1f}x   {base_tps / ceiling_tps:9.3f}x")
    for label, seconds, peak in rows:
        tps = n / seconds
        memory = f"{peak / 2**20:7.0f} MiB" if peak else "      -"
        out.append(f"  {label:<42}{tps:12,.0f}   {tps / base_tps:9.1f}x   {tps / ceiling_tps:9.3f}x   {memory}")
    out.append(
        "  (cold: the 'morphfst corpus' command, start-up and grammar loading included; warm: a second pass of the same processes)"
    )
    out.append(f"  practical ceiling: dict lookup per token  {ceiling_tps:12,.0f}   {ceiling_tps / base_tps:9.1f}x   {1.0:9.3f}x")
    target.unlink(missing_ok=True)
    corpus.unlink(missing_ok=True)
    return out


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--tokens", type=int, default=5_000_000, help="corpus size in tokens per language (default 5,000,000)")
    parser.add_argument("--runs", type=int, default=3, help="runs per measure; medians are reported (default 3)")
    parser.add_argument("--sample", type=int, default=3000, help="words timed with the plain baseline (default 3000)")
    parser.add_argument(
        "--langs", default="", help="comma-separated languages (default: tur, and fin when grammars/fin.mfg exists)"
    )
    args = parser.parse_args(argv)
    langs = [x for x in args.langs.split(",") if x] or ["tur"] + (["fin"] if (ROOT / "grammars" / "fin.mfg").exists() else [])
    os.environ.setdefault("MORPHFST_GRAMMARS", str(ROOT / "grammars"))
    print(f"morphfst {morphfst.__version__} corpus benchmark, {os.cpu_count()} CPUs, {args.runs} run(s) per measure")
    start = time.perf_counter()
    with tempfile.TemporaryDirectory(prefix="morphfst-bench-") as tmp:
        for name in langs:
            try:
                lines = bench_language(name, args.tokens, args.runs, args.sample, Path(tmp))
            except morphfst.UserError as exc:
                lines = [f"language {name}: skipped ({exc.message})"]
            print("\n".join(lines))
            print()
    print(f"total benchmark time {time.perf_counter() - start:.0f} s")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

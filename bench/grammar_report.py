"""Grammar report: how much of a language's frequent vocabulary a shipped grammar analyzes, and at what cost.

For the wordfreq list of the language, ranks 1 to 20,000 only (the development range; higher ranks are
kept for evaluation and are never read here), prints:

  * type coverage and frequency-weighted coverage without the guesser (with and without the
    foreign words of lexicons/LANG/foreign.tsv),
  * the average number of analyses per analyzed word,
  * the most frequent unanalyzed words,
  * compile time, compiled file size, load time, and analysis throughput on the list.

    python bench/grammar_report.py --lang tur
    python bench/grammar_report.py --lang fin --missing 100 --tsv missing.tsv

Needs the bench extra (``pip install -e '.[bench]'``: wordfreq).
"""

from __future__ import annotations

import argparse
import statistics
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
FOREIGN_POS = "X"  # the part of speech of foreign words (bench/foreign_words.py)
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import compile_grammar, find_grammar  # noqa: E402
from morphfst.runtime.tokenize import Tokenizer  # noqa: E402

DEV_RANKS = 20_000  # wordfreq ranks past this are evaluation data: never read here
WORDFREQ_CODES = {"tur": "tr", "fin": "fi"}


def word_list(lang: str, n: int) -> list[tuple[str, float]]:
    """(word, frequency) for ranks 1..n of the wordfreq list (n at most 20,000)."""
    from wordfreq import top_n_list, word_frequency

    code = WORDFREQ_CODES.get(lang, lang)
    n = min(n, DEV_RANKS)
    return [(w, word_frequency(w, code)) for w in top_n_list(code, n)]


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    ap.add_argument("--lang", default="tur", help="shipped language name or grammar file (default tur)")
    ap.add_argument("--words", type=int, default=DEV_RANKS, help="how many ranks of the list (at most 20,000)")
    ap.add_argument("--missing", type=int, default=50, help="how many unanalyzed words to list (default 50)")
    ap.add_argument("--tsv", help="also write every unanalyzed word with its frequency to this TSV file")
    ap.add_argument("--sample", type=int, default=0, help="print this many analyzed words at random, for checking by hand")
    args = ap.parse_args(argv)

    grammar = find_grammar(args.lang)
    with tempfile.TemporaryDirectory() as tmp:
        t0 = time.perf_counter()
        compiled = compile_grammar(grammar, Path(tmp) / "lang.mfc")
        compile_s = time.perf_counter() - t0
        size_kib = compiled.stat().st_size / 1024
        loads = []
        for _ in range(3):
            t1 = time.perf_counter()
            lang = morphfst.load(compiled)
            loads.append(time.perf_counter() - t1)
        load_s = statistics.median(loads)

    words = word_list(lang.name if hasattr(lang, "name") else args.lang, args.words)
    tokenizer = Tokenizer.for_meta(lang.meta)
    total_f = sum(f for _, f in words) or 1.0
    covered_types = 0
    covered_f = 0.0
    foreign_types = 0  # read only as foreign words (part of speech X: lexicons/LANG/foreign.tsv)
    foreign_f = 0.0
    readings: list[int] = []
    missing: list[tuple[str, float]] = []
    analyzed: list[tuple[str, str]] = []
    t2 = time.perf_counter()
    for word, freq in words:
        # the word list is lower-cased: a word the tokenizer would split (eu:n, whose colon joins
        # only after a capital) is first analyzed whole, as a caller of analyze() would
        whole = lang.analyze(word)
        pieces = [word] if whole else (tokenizer.tokens(word) or [word])
        results = [whole] if whole else [lang.analyze(p) for p in pieces]
        if all(results):
            covered_types += 1
            covered_f += freq
            if all(a.pos == FOREIGN_POS and a.has_stem for r in results for a in r):  # not suffixes read alone (detached)
                foreign_types += 1
                foreign_f += freq
            readings.append(sum(len(r) for r in results) // len(results))
            analyzed.append((word, results[0][0].text if len(results) == 1 else " + ".join(r[0].text for r in results)))
        else:
            missing.append((word, freq))
    analyze_s = time.perf_counter() - t2

    n = len(words)
    print(f"language            {lang.meta.get('title', args.lang)} ({args.lang}), grammar {grammar}")
    print(f"lexicon entries     {len(lang.meta.get('lexicon', [])):,}")
    print(f"compile time        {compile_s:.1f} s")
    print(f"compiled size       {size_kib:,.0f} KiB")
    print(f"load time           {load_s * 1000:.0f} ms (median of 3, from the compiled file)")
    print(f"word list           wordfreq ranks 1-{n:,} ({n:,} types)")
    print(f"type coverage       {covered_types / n:.1%} ({covered_types:,} of {n:,}) without the guesser")
    print(f"weighted coverage   {covered_f / total_f:.1%} of the list's frequency mass without the guesser")
    native_types, native_f = covered_types - foreign_types, covered_f - foreign_f
    print(
        f"without foreign     {native_types / n:.1%} of the types, {native_f / total_f:.1%} of the mass "
        f"({foreign_types:,} types read only as foreign words, part of speech {FOREIGN_POS})"
    )
    if readings:
        print(f"analyses per word   {statistics.mean(readings):.2f} (mean over analyzed words)")
    print(f"throughput          {n / analyze_s:,.0f} words/s (analyze(), cold, one process)")
    print(f"\nthe {min(args.missing, len(missing))} most frequent unanalyzed words:")
    for word, freq in missing[: args.missing]:
        print(f"  {word}\t{freq:.2e}")
    if args.tsv:
        with open(args.tsv, "w", encoding="utf-8") as out:
            out.write("word\tfrequency\n")
            for word, freq in missing:
                out.write(f"{word}\t{freq:.3e}\n")
    if args.sample:
        import random

        rng = random.Random(20261202)
        print(f"\n{args.sample} analyzed words at random (best analysis), for checking by hand:")
        for word, text in rng.sample(analyzed, min(args.sample, len(analyzed))):
            print(f"  {word}\t{text}")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

"""Lexicon harvesting benchmark and report.

Prints, in one run:
  * recovery: every second entry of the chosen classes (up to --limit) is taken out of a copy of the
    lexicon, a word list of their forms (and of kept entries) is harvested, and the proposals are
    compared with the removed entries: recall (right lemma, class, part of speech and flags) and
    precision (see morphfst/harvest/recovery.py);
  * timing: the same experiment at a size that gives about --types word types, with the harvest's
    time split into compile (candidate guesser), known words, readings of the unknown types and
    resolution, on one core (--jobs 1) and with --jobs N;
  * the wordfreq lists (ranks 1-20,000 only, never beyond): candidates, proposals, time, and the best
    --show proposals with their evidence, for judging precision by hand.

    python bench/bench_harvest.py                        # Turkish recovery + timing, wordfreq tur and fin
    python bench/bench_harvest.py --skip-timing --show 100
"""

from __future__ import annotations

import argparse
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.harvest import Harvester, HarvestOptions  # noqa: E402
from morphfst.harvest.recovery import recovery_experiment  # noqa: E402

WORDFREQ = {"tur": "tr", "fin": "fi"}
WORDFREQ_LIMIT = 20000  # ranks 1-20,000 only: the words beyond are kept for evaluation


def recovery(grammar: Path, limit: int, known: int, jobs: int = 1, keep: tuple[str, ...] | None = None) -> None:
    with tempfile.TemporaryDirectory() as tmp:
        report = recovery_experiment(
            grammar,
            Path(tmp) / "copy",
            classes=("noun",),
            every=2,
            limit=limit,
            known=known,
            keep_files=keep,
            options=HarvestOptions(progress=False, jobs=jobs),
        )
    r = report.result
    harvest_s = sum(r.seconds.values())
    print(f"  {report.summary()}")
    print(
        f"  harvest of {report.word_types:,} word types ({r.unknown_types:,} unknown, {r.candidates:,} candidates), "
        f"jobs {jobs}: {harvest_s:.1f} s (" + ", ".join(f"{k} {v:.1f} s" for k, v in r.seconds.items()) + ")"
    )
    by_lemma = {k[0]: k for k in report.removed}
    for key in report.wrong[:15]:
        print(f"    wrong: {' '.join(key[:3])} {','.join(key[3]) or '-'}   removed entry: {by_lemma.get(key[0], '(none)')}")


def wordfreq_run(lang_name: str, show: int) -> None:
    import wordfreq

    code = WORDFREQ[lang_name]
    words = wordfreq.top_n_list(code, WORDFREQ_LIMIT)
    counts = {w: max(1, round(wordfreq.word_frequency(w, code) * 1e8)) for w in words}
    lang = morphfst.load(lang_name)
    t0 = time.perf_counter()
    harvester = Harvester(lang)
    result = harvester.harvest(counts, HarvestOptions(progress=False))
    seconds = time.perf_counter() - t0
    print(
        f"{lang_name}: wordfreq ranks 1-{WORDFREQ_LIMIT:,}: {result.types:,} types, {result.unknown_types:,} unknown, "
        f"{result.candidates:,} candidates, {len(result.proposals):,} proposals (min 2 forms, 2 tokens) in {seconds:.1f} s"
    )
    for i, p in enumerate(result.proposals[:show], start=1):
        examples = ", ".join(f for f, _ in p.examples()[:6])
        print(f"  {i:3d} {p.lemma:<16} {p.klass:<6} {','.join(p.flags) or '-':<14} {p.score:6.2f} {len(p.forms):3d}  {examples}")


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--grammar", default=str(ROOT / "grammars" / "tur.mfg"))
    ap.add_argument("--limit", type=int, default=150, help="entries removed for the recovery figures")
    ap.add_argument("--timing-limit", type=int, default=1800, help="entries removed for the timing run")
    ap.add_argument("--jobs", type=int, default=2)
    ap.add_argument("--show", type=int, default=100)
    ap.add_argument("--skip-timing", action="store_true")
    ap.add_argument("--skip-wordfreq", action="store_true")
    args = ap.parse_args()
    grammar = Path(args.grammar)
    print(f"recovery ({grammar.name}, nouns, every second removed, up to {args.limit}):")
    recovery(grammar, args.limit, args.limit)
    if not args.skip_timing:
        print(f"timing ({grammar.name}, up to {args.timing_limit} nouns removed, whole lexicon):")
        recovery(grammar, args.timing_limit, args.timing_limit, jobs=1)
        if args.jobs > 1:
            recovery(grammar, args.timing_limit, args.timing_limit, jobs=args.jobs)
    if not args.skip_wordfreq:
        for name in WORDFREQ:
            wordfreq_run(name, args.show)


if __name__ == "__main__":
    main()

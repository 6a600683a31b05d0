"""Tables and bulk export benchmark.

Prints, in one run:
  * bulk export over a cloned lexicon of --entries entries (the shipped entries cloned under new stems
    into a temporary directory with a copy of the grammar): forms per second, median of --runs runs;
  * the plain baseline on a sample of the same lemmas: every cell generated with one
    ``pynini.lib.rewrite.rewrites`` call on the generator, forms per second, and the ratio;
  * the practical ceiling: writing precomputed lines from a Python list;
  * peak memory of the export, measured in a fresh process for two lexicon sizes (peak resident set
    growth during the export, via /proc/self/clear_refs and VmHWM on Linux, and the tracemalloc peak
    of Python objects), to show that memory does not grow with the lexicon;
  * the time for one table (paradigm, layout and text rendering), for a lexicon lemma at depth 0 and 1
    and for a new word compiled from its class.

    python bench/bench_tables.py                       # Turkish, 5,000 entries, 5 runs
    python bench/bench_tables.py --entries 2000 --runs 3 --lang grammars/fin.mfg --lemma talo --new-class noun
"""

from __future__ import annotations

import argparse
import json
import os
import random
import shutil
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import pynini.lib.rewrite as rewrite

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import compile_grammar, find_grammar  # noqa: E402
from morphfst.compile.loader import load_model  # noqa: E402
from morphfst.tables.export import export_unimorph, lexicon_groups  # noqa: E402
from morphfst.tables.layout import arrange  # noqa: E402
from morphfst.tables.paradigm import Bound, CellFiller, paradigms, trial_paradigm  # noqa: E402
from morphfst.tables.table_formats import render_text  # noqa: E402

# ---------------------------------------------------------------------------------------------
# A cloned lexicon


def _syllables(seed: int = 20240) -> list[str]:
    # Only e and i: a prefix of these vowels leaves the vowel harmony of a Turkish stem (decided by its
    # last vowel) and of a Finnish stem (e and i are neutral) as it was.
    cons, vowels = "bdgklmnprstv", "ei"
    pairs = [c + v for c in cons for v in vowels]
    combos = [a + b for a in pairs for b in pairs]
    random.Random(seed).shuffle(combos)
    return combos


def clone_lexicon(grammar: Path, entries: int, into: Path) -> Path:
    """Copy ``grammar`` into ``into`` with a lexicon of ``entries`` entries: the shipped entries, then
    clones of them under new stems (a two-syllable prefix before lemma and stem, one per copy, so vowel
    harmony and final-consonant rules behave as in the original). Returns the copied grammar's path."""
    model = load_model(grammar)
    shipped = [Path(p) for p in model.sources[1:]]
    lexdir = into / "lexicon"
    lexdir.mkdir(parents=True)
    text = grammar.read_text(encoding="utf-8")
    for entry in model.lexicon_paths:
        text = text.replace(f'lexicon "{entry}"', 'lexicon "lexicon"')
    (into / grammar.name).write_text(text, encoding="utf-8")
    rows_per_copy = len(model.lexicon)
    copies = max(1, -(-entries // rows_per_copy))
    prefixes = _syllables()
    written = 0
    for path in shipped:
        lines = path.read_text(encoding="utf-8").splitlines()
        header_at = next(i for i, line in enumerate(lines) if line.strip() and not line.startswith("#"))
        columns = lines[header_at].split("\t")
        body = [line.split("\t") for line in lines[header_at + 1 :] if line.strip() and not line.startswith("#")]
        out = [lines[header_at]]
        for copy in range(copies):
            prefix = prefixes[copy - 1] if copy else ""  # the first copy is the shipped lexicon itself
            for fields in body:
                if written >= entries:
                    break
                f = list(fields) + [""] * (len(columns) - len(fields))
                f[0] = prefix + f[0]
                if "stem" in columns and f[columns.index("stem")]:
                    f[columns.index("stem")] = prefix + f[columns.index("stem")]
                out.append("\t".join(f))
                written += 1
        (lexdir / path.name).write_text("\n".join(out) + "\n", encoding="utf-8")
    return into / grammar.name


# ---------------------------------------------------------------------------------------------
# Measurements


def export_rate(lang: morphfst.Language, target: Path, bound: Bound, runs: int) -> tuple[float, int, float]:
    """(median forms per second, forms, median seconds) of the bulk export."""
    rates, secs = [], []
    forms = 0
    for _ in range(runs):
        stats = export_unimorph(lang, target, bound)
        rates.append(stats.forms_per_second)
        secs.append(stats.seconds)
        forms = stats.forms
    return statistics.median(rates), forms, statistics.median(secs)


def baseline_rate(lang: morphfst.Language, bound: Bound, lemmas: int, runs: int) -> tuple[float, float, int]:
    """Forms per second of the plain way (one rewrite call per cell) and of our filler, on the same
    sample of lemmas, medians of ``runs``."""
    filler = CellFiller(lang)
    groups = list(lexicon_groups(lang))
    sample = random.Random(3).sample(groups, min(lemmas, len(groups)))
    jobs = []
    for group in sample:
        shape = filler.shape(list(dict.fromkeys(e["class"] for e in group)), group[0]["pos"], bound)
        jobs.append((group[0]["lemma"], shape))
    generator = lang.fsts["generator"]

    def plain() -> int:
        n = 0
        for lemma, shape in jobs:
            for code in shape.index:
                try:
                    n += len(rewrite.rewrites(lemma + code, generator, input_token_type="utf8", output_token_type="utf8"))
                except rewrite.Error:
                    pass  # an unfilled cell
        return n

    def ours() -> int:
        return sum(len(c.forms) for lemma, shape in jobs for c in filler.fill(lemma, shape))

    plain_rates, our_rates = [], []
    forms = 0
    for _ in range(runs):
        t0 = time.perf_counter()
        forms = plain()
        plain_rates.append(forms / (time.perf_counter() - t0))
        t0 = time.perf_counter()
        ours_forms = ours()
        our_rates.append(ours_forms / (time.perf_counter() - t0))
    return statistics.median(plain_rates), statistics.median(our_rates), forms


def ceiling_rate(path: Path, runs: int) -> float:
    """Forms per second of writing precomputed lines (read back from the export) to a file."""
    lines = path.read_text(encoding="utf-8").splitlines(keepends=True)
    rates = []
    with tempfile.TemporaryDirectory() as tmp:
        for _ in range(runs):
            t0 = time.perf_counter()
            with open(Path(tmp) / "x.tsv", "w", encoding="utf-8") as out:
                for line in lines:
                    out.write(line)
            rates.append(len(lines) / (time.perf_counter() - t0))
    return statistics.median(rates)


def table_time(lang: morphfst.Language, lemma: str, depth: int, runs: int, new: dict[str, object] | None = None) -> float:
    """Median seconds for one table: paradigm (or a new entry's compilation), layout, text."""
    times = []
    for _ in range(runs):
        t0 = time.perf_counter()
        if new:
            found = [trial_paradigm(lang, lemma, bound=Bound(depth), **new)]  # type: ignore[arg-type]
        else:
            found = paradigms(lang, lemma, Bound(depth))
        render_text([arrange(p, lang.meta) for p in found], 80)
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def memory_child(compiled: str, depth: int) -> None:
    """Run in a fresh process: load, reset the peak RSS, export, report the growth as JSON."""
    import tracemalloc

    lang = morphfst.load(compiled)
    lang.fsts["generator"]  # noqa: B018  (loaded)
    status = Path("/proc/self/status")
    clear = Path("/proc/self/clear_refs")

    def kib(field: str) -> int:
        for line in status.read_text().splitlines():
            if line.startswith(field + ":"):
                return int(line.split()[1])
        return -1

    can_reset = clear.exists() and status.exists()
    if can_reset:
        clear.write_text("5")
    before = kib("VmRSS") if can_reset else -1
    tracemalloc.start()
    with tempfile.TemporaryDirectory() as tmp:
        stats = export_unimorph(lang, Path(tmp) / "out.tsv", Bound(depth))
    _, peak_py = tracemalloc.get_traced_memory()
    tracemalloc.stop()
    hwm = kib("VmHWM") if can_reset else -1
    print(
        json.dumps(
            {
                "entries": stats.entries,
                "forms": stats.forms,
                "rss_growth_kib": hwm - before if can_reset else None,
                "python_peak_kib": peak_py // 1024,
            }
        )
    )


def memory_figures(compiled: Path, depth: int) -> dict[str, object]:
    out = subprocess.run(
        [sys.executable, __file__, "--memory-child", str(compiled), "--depth", str(depth)],
        capture_output=True,
        text=True,
        check=True,
        env=os.environ.copy(),
    )
    return json.loads(out.stdout.strip().splitlines()[-1])


# ---------------------------------------------------------------------------------------------


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--lang", default="tur", help="shipped grammar name or grammar file")
    ap.add_argument("--entries", type=int, default=5000)
    ap.add_argument("--small", type=int, default=1000, help="the smaller lexicon for the memory comparison")
    ap.add_argument("--runs", type=int, default=5)
    ap.add_argument("--depth", type=int, default=0)
    ap.add_argument("--sample", type=int, default=150, help="lemmas in the baseline comparison")
    ap.add_argument("--lemma", default="kitap", help="lemma for the one-table timing")
    ap.add_argument("--new-class", default="noun", help="class for the new-word table timing")
    ap.add_argument("--memory-child", help=argparse.SUPPRESS)
    args = ap.parse_args()
    if args.memory_child:
        memory_child(args.memory_child, args.depth)
        return

    grammar = find_grammar(args.lang).resolve()
    print(f"tables and export benchmark: {grammar.name}, {args.entries} entries, depth {args.depth}, medians of {args.runs} runs")
    with tempfile.TemporaryDirectory() as tmp:
        tmpdir = Path(tmp)
        os.environ["MORPHFST_CACHE"] = str(tmpdir / "cache")
        compiled: dict[int, Path] = {}
        for n in (args.small, args.entries):
            src = clone_lexicon(grammar, n, tmpdir / f"g{n}")
            t0 = time.perf_counter()
            compiled[n] = compile_grammar(src, tmpdir / f"g{n}.mfc")
            print(f"  compiled {n} cloned entries in {time.perf_counter() - t0:.1f} s")
        lang = morphfst.load(compiled[args.entries])
        bound = Bound(args.depth)

        rate, forms, secs = export_rate(lang, tmpdir / "export.tsv", bound, args.runs)
        lemmas = sum(1 for _ in lexicon_groups(lang))
        print("\nbulk export (UniMorph lines, streamed to a file)")
        print(f"  {lemmas} lemmas, {forms} forms, {secs:.2f} s: {rate:,.0f} forms/s")
        ceiling = ceiling_rate(tmpdir / "export.tsv", args.runs)
        plain, ours, sample_forms = baseline_rate(lang, bound, args.sample, args.runs)
        print(f"\nsame {args.sample} lemmas ({sample_forms} forms), cells only (no file):")
        print(f"  {'one rewrite call per cell (baseline)':<44} {plain:>12,.0f} forms/s   1.00x")
        print(f"  {'morphfst: one composition per lemma':<44} {ours:>12,.0f} forms/s   {ours / plain:.2f}x")
        print(f"  {'ceiling: writing precomputed lines':<44} {ceiling:>12,.0f} forms/s   {ceiling / plain:.2f}x")

        print("\npeak memory of the export (fresh process; language loaded before the measurement)")
        for n in (args.small, args.entries):
            m = memory_figures(compiled[n], args.depth)
            rss = f"{m['rss_growth_kib']:,} KiB" if m["rss_growth_kib"] is not None else "n/a"
            print(
                f"  {m['entries']:>6} entries, {m['forms']:>8} forms: resident set growth {rss:>12}, Python peak {m['python_peak_kib']:,} KiB"
            )

        print("\none table (paradigm + layout + text), median seconds")
        base = morphfst.load(grammar)
        lemma = args.lemma
        model = [e for e in base.lexicon if e["class"] == args.new_class]
        rows: list[tuple[str, morphfst.Language, str, int, dict[str, object] | None]] = [
            (f"{lemma}, depth 0, shipped lexicon", base, lemma, 0, None),
            (f"{lemma}, depth 1, shipped lexicon", base, lemma, 1, None),
            (f"{lemma}, depth 0, {args.entries}-entry lexicon", lang, lemma, 0, None),
        ]
        if model:
            # A new word: a shipped entry of the class behind a prefix no clone uses.
            e, prefix = model[0], _syllables()[-1]
            stem = prefix + "".join(e["stem"])
            new = {"klass": e["class"], "pos": e["pos"], "stem": stem, "flags": e["flags"]}
            rows.append(
                (
                    f"new word {prefix + e['lemma']} (--class {e['class']}), compiled on the spot",
                    base,
                    prefix + e["lemma"],
                    0,
                    new,
                )
            )
        for label, lg, word, depth, spec in rows:
            if spec is None and not lg.entries(word):
                print(f"  {label:<60} skipped: not in the lexicon")
                continue
            t = table_time(lg, word, depth, args.runs, spec)
            print(f"  {label:<60} {t * 1000:8.1f} ms")
    shutil.rmtree(tmpdir, ignore_errors=True)


if __name__ == "__main__":
    main()

"""``morphfst corpus``: segment whole corpora for indexing, on this machine or on a Dask cluster."""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

from ..errors import UserError
from .common import add_language, open_language

EXAMPLES = """examples:
  morphfst corpus news.txt -o news.terms.txt                     one lemma per word, same lines
  morphfst corpus news.txt -o news.terms.txt --term morphs -j 2  stem and affixes as terms, 2 processes
  morphfst corpus corpus/ -o out/ -m jsonl --report cov.tsv      a directory: one output per file, a report
  morphfst corpus news.txt -o news.conllu -m conllu              CoNLL-U with LEMMA, UPOS and FEATS
  morphfst corpus big/ -o out/ --dask                            a local Dask cluster started by the command
  morphfst corpus big/ -o out/ --dask tcp://sched:8786           an existing Dask cluster (shared file system)
  cat news.txt | morphfst corpus -l fin > terms.txt              standard input to standard output

Every input token gives one output record and every input line one output line (terms, jsonl) or its
sentences (conllu). Output files are written under a temporary name and renamed when complete; an
output directory gets manifest.json last. Word statuses: analyzed (lexicon stem), guessed (the
grammar's guesser), unknown, number.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "corpus",
        help="segment whole corpora for indexing (processes, Dask, coverage report)",
        description="Tokenize and analyze every word of large texts, streaming in constant memory, and write "
        "index-ready output: one term per word (lemma, stem, or stem plus affix morphs), JSON Lines with every "
        "ranked analysis, or CoNLL-U. Words the lexicon does not know get the grammar's guesses (flagged). "
        "A coverage summary goes to standard error; --report writes the full report.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("inputs", nargs="*", metavar="INPUT", help="input files or directories ('-' or nothing: standard input)")
    add_language(p)
    p.add_argument(
        "-o", "--output", metavar="PATH", help="output file, or directory (several inputs, or --dask); default: standard output"
    )
    p.add_argument("-m", "--mode", choices=("terms", "jsonl", "conllu"), default="terms", help="output mode (default: terms)")
    p.add_argument(
        "--term", choices=("lemma", "stem", "morphs"), default="lemma", help="terms mode: what each word becomes (default: lemma)"
    )
    p.add_argument(
        "-j",
        "--jobs",
        type=int,
        default=None,
        metavar="N",
        help="worker processes (default 1); with --dask, workers of the local cluster (default 2)",
    )
    p.add_argument(
        "--dask",
        nargs="?",
        const="local",
        default=None,
        metavar="ADDRESS",
        help="run on Dask: the scheduler at ADDRESS, or a local cluster started here when no address is given",
    )
    p.add_argument(
        "--partition-mb",
        type=float,
        default=None,
        metavar="MB",
        help="--dask: size of an input partition (default: the input in about 4 partitions per worker, 1-64 MB each)",
    )
    p.add_argument("--report", metavar="FILE", help="write the coverage report to FILE (.json: JSON, otherwise TSV)")
    p.add_argument("--top", type=int, default=1000, metavar="N", help="unanalyzed words listed in the report (default 1000)")
    p.add_argument("--no-guess", action="store_true", help="do not guess unknown words")
    p.add_argument(
        "--guess-mark",
        default="",
        metavar="MARK",
        help="terms mode: put MARK before the term of a guessed word (default: nothing)",
    )
    p.add_argument("--max-analyses", type=int, default=20, metavar="N", help="jsonl: analyses kept per word (default 20)")
    p.add_argument("-q", "--quiet", action="store_true", help="no progress bar and no summary on standard error")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    from ..corpus import ChunkProcessor, Options, WorkerFailure, run_corpus

    if args.dask not in (None, "local") and "://" not in args.dask and Path(args.dask).exists():
        args.inputs.insert(0, args.dask)  # '--dask INPUT ...': the word after --dask was an input, not an address
        args.dask = "local"
    if args.jobs is None:
        args.jobs = 2 if args.dask == "local" else 1
    if args.jobs < 1:
        raise UserError("--jobs must be at least 1", hint="give the number of worker processes, e.g. -j 2")
    if args.partition_mb is not None and args.partition_mb <= 0:
        raise UserError("--partition-mb must be positive")
    if args.dask is not None:
        from ..corpus.cluster import require_dask

        require_dask()
    lang = open_language(args)
    options = Options(
        mode=args.mode,
        term=args.term,
        guess=not args.no_guess,
        max_analyses=max(args.max_analyses, 1),
        guess_mark=args.guess_mark,
    )
    dask = False if args.dask is None else args.dask
    _stop_on_terminate()
    try:
        result = run_corpus(
            lang,
            args.inputs,
            args.output,
            options,
            jobs=args.jobs,
            dask=dask,
            partition_bytes=int(args.partition_mb * 1024 * 1024) if args.partition_mb is not None else None,
            quiet=args.quiet,
        )
    except WorkerFailure as exc:
        sys.stderr.write(exc.render() + "\n")
        return 1
    proposer: list[ChunkProcessor] = []

    def propose(word: str) -> tuple[str, str]:
        """The guesser's proposal for an unanalyzed type of the report (a processor made on first use)."""
        if not proposer:
            proposer.append(ChunkProcessor(lang, options))
        return proposer[0].propose(word)

    cov = result.coverage
    if args.report:
        extra = {"seconds": round(result.seconds, 3), "tokens_per_second": round(result.tokens_per_second)}
        cov.write(args.report, top=max(args.top, 0), propose=propose, extra=extra)
    if not args.quiet:
        sys.stderr.write(cov.summary(10, propose))
        sys.stderr.write(
            f"  {result.seconds:.1f} s, {result.tokens_per_second:,.0f} tokens/s"
            + (f"; manifest {result.manifest}" if result.manifest else "")
            + "\n"
        )
    return 0


def _stop_on_terminate() -> None:
    """Treat SIGTERM like Ctrl-C, so a terminated run removes its temporary output files too."""
    import signal
    import threading

    if threading.current_thread() is not threading.main_thread():
        return

    def handler(signum: int, frame: object) -> None:
        raise KeyboardInterrupt

    signal.signal(signal.SIGTERM, handler)

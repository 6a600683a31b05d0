"""``morphfst harvest``: propose new lexicon entries from a corpus, ranked by their evidence."""

from __future__ import annotations

import argparse
import json
import os
import sys
import time

from ..errors import UserError
from ..harvest import Harvester, HarvestOptions, count_types, write_tsv
from .common import add_language, open_language

EXAMPLES = """examples:
  morphfst harvest demo/tur_library.txt -o new.tsv            proposals for the words the lexicon lacks
  morphfst harvest corpus/ -o new.tsv --top 200 -j 2          a directory of text, the best 200, 2 processes
  morphfst harvest --word-list words.tsv -o new.tsv           a word list of word<TAB>count lines
  morphfst harvest -l fin texts/ -o - --min-forms 3 | less    Finnish, at least 3 distinct forms, to standard output

Output: a lexicon file (lemma, class, pos, gloss, stem, flags) with evidence columns after it: score,
attested (distinct forms), tokens, examples (up to ten forms with their analyses) and runner_up (the
closest competing entry when it was close). Rows are sorted by score. Give each accepted line a gloss
and copy it into lexicons/<lang>/, or place the reviewed file there as it is: the lexicon reader
ignores the evidence columns.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "harvest",
        help="propose new lexicon entries from a corpus, with their evidence",
        description="Propose lexicon entries for the words of a corpus that the lexicon does not analyze "
        "(paradigm-based lexicon extraction): each unknown word type gets candidate entries (lemma, class, "
        "part of speech, flags) from the classes' guess patterns, each candidate collects the corpus words "
        "its bounded paradigm generates, and competing candidates are resolved by that evidence; every word "
        "is credited to at most one proposal.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    add_language(p)
    p.add_argument("inputs", nargs="*", metavar="INPUT", help="text files or directories ('-' or none: standard input)")
    p.add_argument("-o", "--output", required=True, metavar="FILE", help="the proposals file ('-' for standard output)")
    p.add_argument("--word-list", action="store_true", help="the inputs are word lists of word<TAB>count lines")
    p.add_argument("--min-forms", type=int, default=2, metavar="N", help="distinct attested forms a proposal needs (default 2)")
    p.add_argument("--min-tokens", type=int, default=2, metavar="N", help="attested tokens a proposal needs (default 2)")
    p.add_argument("--min-score", type=float, default=0.0, metavar="X", help="the lowest score a proposal may have (default 0)")
    p.add_argument("--top", type=int, metavar="N", help="keep only the best N proposals")
    p.add_argument("--depth", type=int, default=0, metavar="N", help="derivational affixes allowed in a matched form (default 0)")
    p.add_argument("-j", "--jobs", type=int, default=1, metavar="N", help="worker processes for the unknown words (default 1)")
    p.add_argument("--gloss", default="?", metavar="TEXT", help="the gloss written in each proposal (default '?')")
    p.add_argument("-q", "--quiet", action="store_true", help="no progress bar and no summary")
    p.add_argument("--stats", action="store_true", help="print figures about the run as JSON on standard error")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    for name in ("min_forms", "min_tokens", "top", "jobs"):
        value = getattr(args, name)
        if value is not None and value < 1:
            raise UserError(f"--{name.replace('_', '-')} must be 1 or more, not {value}", hint="give a positive number")
    if not args.gloss.strip() or "\t" in args.gloss or "\n" in args.gloss:
        raise UserError(
            "--gloss must be a non-empty text without tabs", hint="the lexicon reader needs a gloss; '?' is the default"
        )
    if args.depth < 0:
        raise UserError(f"--depth must be 0 or more, not {args.depth}", hint="depth 0 is the inflection of the entry itself")
    if args.output != "-" and os.path.isdir(args.output):
        raise UserError(f"{args.output} is a directory", hint="give a file name for the proposals")
    start = time.perf_counter()
    lang = open_language(args)
    harvester = Harvester(lang, depth=args.depth)  # a language without guess patterns stops here
    counts = count_types(lang, args.inputs, word_list=args.word_list, quiet=args.quiet)
    options = HarvestOptions(
        min_forms=args.min_forms,
        min_tokens=args.min_tokens,
        top=args.top,
        min_score=args.min_score,
        depth=args.depth,
        jobs=args.jobs,
        gloss=args.gloss,
        progress=not args.quiet,
    )
    result = harvester.harvest(counts.spellings, options)
    comment = (
        f"morphfst harvest -l {args.lang}: {len(result.proposals)} proposals from {result.types:,} word types "
        f"({result.unknown_types:,} unknown), {counts.tokens:,} tokens.\n"
        "Review each line, give it a gloss, and copy it into the lexicon; the columns after flags are evidence."
    )
    write_tsv(result, args.output, gloss=args.gloss, comment=comment)
    elapsed = time.perf_counter() - start
    if args.stats:
        figures = {
            "proposals": len(result.proposals),
            "types": result.types,
            "unknown_types": result.unknown_types,
            "candidates": result.candidates,
            "tokens": counts.tokens,
            "seconds": {k: round(v, 3) for k, v in result.seconds.items()} | {"total": round(elapsed, 3)},
        }
        sys.stderr.write(json.dumps(figures) + "\n")
    elif not args.quiet and args.output != "-":
        sys.stderr.write(
            f"wrote {args.output}: {len(result.proposals)} proposals from {result.unknown_types:,} unknown of "
            f"{result.types:,} word types in {elapsed:.1f} s\n"
        )
    return 0

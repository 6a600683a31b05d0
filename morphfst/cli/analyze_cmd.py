"""``morphfst analyze``: every analysis of each word, ranked by weight."""

from __future__ import annotations

import argparse
import sys

from ..errors import UserError
from ..textio import ReadStats
from .common import (
    Aligned,
    add_format,
    add_input,
    add_language,
    open_language,
    report_stats,
    shorten,
    tsv_field,
    words_from,
    write_json,
)

EXAMPLES = """examples:
  morphfst analyze evlerde kitabı                 two Turkish words, aligned for reading
  morphfst analyze -l fin talossa -f jsonl        Finnish, one JSON object per word
  morphfst analyze -i words.txt -f tsv --best 1   a word list, best analysis only, as TSV
  echo "Ankara'da" | morphfst analyze             words from standard input
  morphfst analyze --guess blorpkayada            a word the lexicon lacks: the guesser's readings, marked
"""

TSV_HEADER = ["word", "rank", "lemma", "pos", "features", "segmentation", "gloss", "weight"]
GUESS_MARK = "(guess) "  # before a guessed analysis in the table format


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "analyze",
        help="analyze words (lemma, features, segmentation, gloss, weight)",
        description="Analyze words: every analysis with lemma, part of speech, features, morphs with glosses and weight, best first. "
        "Each input token gives exactly one record (a word with no analysis included), in input order.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("words", nargs="*", help="words to analyze (default: read them from --input or standard input)")
    add_language(p)
    add_input(p)
    add_format(p)
    p.add_argument("--best", type=int, default=0, metavar="N", help="keep only the N best analyses of each word (0: all)")
    p.add_argument(
        "--guess",
        action="store_true",
        help="a word the lexicon does not analyze gets the guesser's analyses, marked as guessed "
        "(table: '(guess)' before the analysis; tsv: a 'guessed' column; jsonl: \"guessed\": true)",
    )
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    if args.best < 0:
        raise UserError(f"--best must be 0 or more, not {args.best}", hint="--best 1 keeps the best analysis; 0 keeps all")
    lang = open_language(args)
    stats = ReadStats()
    out = sys.stdout
    table = Aligned(["word", "analysis", "segmentation", "gloss", "weight"], out) if args.format == "table" else None
    header = TSV_HEADER + (["guessed"] if args.guess else [])
    if args.format == "tsv":
        out.write("\t".join(header) + "\n")
    unknown = 0
    for word in words_from(args, stats):
        analyses = lang.analyze(word, guess=args.guess)
        if args.best > 0:
            analyses = analyses[: args.best]
        if not analyses:
            unknown += 1
        if args.format == "jsonl":
            write_json({"word": word, "analyses": [a.to_dict() for a in analyses]}, out)
        elif args.format == "tsv":
            if not analyses:
                out.write("\t".join([tsv_field(word), "0"] + [""] * (len(header) - 2)) + "\n")
            for rank, a in enumerate(analyses, start=1):
                row = [word, str(rank), a.lemma, a.pos, ";".join(a.features), a.segmentation, a.gloss, f"{a.weight:.4f}"]
                if args.guess:
                    row.append("yes" if a.guessed else "")
                out.write("\t".join(tsv_field(c) for c in row) + "\n")
        else:
            assert table is not None
            shown = shorten(word)
            if not analyses:
                table.add([shown, "(no analysis)", "", "", ""])
            for rank, a in enumerate(analyses):
                text = GUESS_MARK + a.text if a.guessed else a.text
                table.add([shown if rank == 0 else "", text, a.segmentation, a.gloss, f"{a.weight:.2f}"])
    if table:
        table.flush()
    report_stats(stats)
    return 0

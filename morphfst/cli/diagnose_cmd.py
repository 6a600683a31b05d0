"""``morphfst diagnose``: which part of the grammar rejects a word, and what to change."""

from __future__ import annotations

import argparse
import sys

from ..debug.diagnose import diagnose, diagnose_expected, render_diagnosis
from ..debug.session import DebugSession
from ..textio import ReadStats
from .common import add_input, add_language, checked_word, report_stats, words_from, write_json

EXAMPLES = """examples:
  morphfst diagnose kitapı                 sound change: the rule behind the difference from kitabı
  morphfst diagnose evdeler                morphotactics: the slots and the missing transition
  morphfst diagnose kedilerde              lexicon: a guessed stem and the TSV line to add
  morphfst diagnose kitabı --expect "kitap N;SG;DAT"   why a word lacks the analysis you expect
  morphfst diagnose -l my.mfg -i rejected.txt -f jsonl
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "diagnose",
        help="find out why a word is rejected (lexicon, morphotactics or sound change)",
        description="For a word without analysis, say which layer of the grammar rejects it: the lexicon (no known stem "
        "fits: a guessed stem and the lexicon line that would make the word work), the morphotactics (known morphs in an "
        "order the slot graph or a constraint forbids: the slots and the missing transition or the constraint), or a "
        "sound change (the rule output of an underlying form differs from the word: both aligned, the first difference "
        "and the rule behind it). Also lists the nearest accepted words. With --expect, the same layers are followed for an analysis the word should have but does not get. Exit code 0 (1 with --fail-on-reject when a word is rejected).",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("words", nargs="*", help="words to diagnose (default: read them from --input or standard input)")
    add_language(p)
    add_input(p)
    p.add_argument(
        "-f", "--format", choices=("table", "jsonl"), default="table", help="table: for reading; jsonl: one JSON object per word"
    )
    p.add_argument(
        "--distance", type=int, default=2, metavar="N", help="largest edit distance for the nearest accepted words (default 2)"
    )
    p.add_argument("--nearest", type=int, default=6, metavar="N", help="how many nearest accepted words to list (default 6)")
    p.add_argument(
        "--expect",
        metavar="ANALYSIS",
        help="the analysis the word should have ('lemma POS;FEAT;...'): diagnose why it does not get it",
    )
    p.add_argument("--fail-on-reject", action="store_true", help="exit with code 1 when some word is rejected")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    from ..errors import UserError

    if not 0 <= args.distance <= 4:
        raise UserError(f"--distance {args.distance} is out of range", hint="use an edit distance from 0 to 4")
    session = DebugSession.open(args.lang)
    stats = ReadStats()
    rejected = 0
    for word in map(checked_word, words_from(args, stats)):
        if args.expect:
            d = diagnose_expected(session, word, args.expect)
        else:
            d = diagnose(session, word, max_distance=args.distance, nearest=args.nearest)
        rejected += d.layer != "accepted"
        if args.format == "jsonl":
            write_json(d.to_dict(), sys.stdout)
        else:
            sys.stdout.write(render_diagnosis(d) + "\n")
    report_stats(stats)
    return 1 if rejected and args.fail_on_reject else 0

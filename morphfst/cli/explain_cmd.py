"""``morphfst explain``: why an accepted word has the analyses it has."""

from __future__ import annotations

import argparse
import sys

from ..debug.explain import explain, render_explanation
from ..debug.session import DebugSession
from ..textio import ReadStats
from .common import add_input, add_language, checked_word, report_stats, words_from, write_json

EXAMPLES = """examples:
  morphfst explain kitabı                    gloss, slot path, underlying form and every rule that fired
  morphfst explain -l fin kadun --no-rules   Finnish; gloss and slot path only
  morphfst explain evlerinde -f jsonl        the same as one JSON object per word
  morphfst explain -i words.txt              every word of a file
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "explain",
        help="explain a word: gloss, slot path, underlying form, rule by rule",
        description="For each analysis of each word: the morphs aligned over their glosses (Leipzig style), the path "
        "through the slot graph, the lexicon entry, the underlying form and every rule that changed it, with the rule's "
        "line and the changed positions marked. A word without analysis points to 'morphfst diagnose'.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("words", nargs="*", help="words to explain (default: read them from --input or standard input)")
    add_language(p)
    add_input(p)
    p.add_argument(
        "-f", "--format", choices=("table", "jsonl"), default="table", help="table: for reading; jsonl: one JSON object per word"
    )
    p.add_argument("--no-rules", action="store_true", help="leave out the rule-by-rule derivation")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    session = DebugSession.open(args.lang)
    stats = ReadStats()
    for word in map(checked_word, words_from(args, stats)):
        ex = explain(session, word)
        if args.format == "jsonl":
            data = ex.to_dict()
            if args.no_rules:
                for a in data["analyses"]:
                    a.pop("derivation", None)
            write_json(data, sys.stdout)
        else:
            sys.stdout.write(render_explanation(ex, rules=not args.no_rules))
            if not ex.analyses:
                sys.stdout.write("\n")
    report_stats(stats)
    return 0

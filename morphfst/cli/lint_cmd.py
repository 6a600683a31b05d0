"""``morphfst lint``: things in a grammar that compile but are probably mistakes."""

from __future__ import annotations

import argparse
import json
import sys

from ..debug.lint import lint, read_words, render_lint
from ..debug.session import DebugSession
from .common import add_language

EXAMPLES = """examples:
  morphfst lint                                 the default grammar (tur)
  morphfst lint -l grammars/fin.mfg --strict    exit with code 1 when there is a warning (for CI)
  morphfst lint --words corpus-words.txt --top 20   also the 20 most ambiguous words of a word list
  morphfst lint -f json                         findings as JSON
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "lint",
        help="find rules that never apply or are shadowed, duplicate affixes, dead ends, ambiguous words",
        description="Check a grammar for things that compile but are probably mistakes: slots from which no word can end, "
        "classes without entries, affixes with identical form and features in one slot, rules that can never apply, rules "
        "shadowed by an earlier rule, archiphonemes left unresolved on some path; with --words, the most ambiguous words of a word list.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    add_language(p)
    p.add_argument(
        "--words",
        metavar="FILE",
        help="a word list (whitespace-separated words; '-' for standard input) for the ambiguity report",
    )
    p.add_argument("--top", type=int, default=10, metavar="N", help="how many ambiguous words to report (default 10)")
    p.add_argument("--strict", action="store_true", help="exit with code 1 when there is a warning")
    p.add_argument("-f", "--format", choices=("table", "json"), default="table", help="table: for reading; json: one JSON report")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    session = DebugSession.open(args.lang)
    words = read_words(args.words) if args.words else None
    report = lint(session, words, args.top)
    if args.format == "json":
        sys.stdout.write(json.dumps(report.to_dict(), ensure_ascii=False, indent=1) + "\n")
    else:
        sys.stdout.write(render_lint(report))
    warnings = [f for f in report.findings if f.severity == "warning"]
    return 1 if args.strict and warnings else 0

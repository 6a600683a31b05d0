"""``morphfst search``: ranked full-text search by lemma in an index built by ``morphfst index``."""

from __future__ import annotations

import argparse
import json
import sys

from ..errors import UserError

EXAMPLES = """examples:
  morphfst search books.db kitap                     every line with a form of kitap (kitabı, kitaplarımızdan, ...)
  morphfst search books.db kitaplarımızdan           the same: the query word is analyzed too
  morphfst search books.db 'kitap AND çocuk'         FTS5 operators: AND, OR, NOT, NEAR(a b, 5), "phrases", prefix*
  morphfst search books.db '"=kitabı"'               only this exact form (index built with --terms lemma,surface)
  morphfst search kirjat.db katu -f jsonl            JSON lines: rank, path, line, score, snippet, matched spans

Results are ranked by FTS5's bm25 (best first). Matched words are shown in bold on a terminal and in
[brackets] otherwise. Exit code 0 with results, 1 with none, 2 on an error.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "search",
        help="search an index by lemma: ranked results with highlighted snippets",
        description="Search an index built by 'morphfst index'. The query is an SQLite FTS5 query whose words are "
        "analyzed like the indexed text, so any form of a word finds every other form of it.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("index", metavar="INDEX", help="the index file")
    p.add_argument(
        "query", nargs="+", metavar="QUERY", help="the query (several arguments are joined with spaces: all words must match)"
    )
    p.add_argument("-n", "--limit", type=int, default=10, metavar="N", help="results to show (default 10)")
    p.add_argument("-f", "--format", choices=("text", "jsonl"), default="text", help="text for people (default) or JSON lines")
    p.add_argument("--tokens", type=int, default=16, metavar="N", help="words per snippet (default 16)")
    p.add_argument("--color", choices=("auto", "always", "never"), default="auto", help="bold matches (default: on a terminal)")
    p.add_argument(
        "--busy-timeout", type=float, default=5.0, metavar="SECONDS", help="wait this long for a locked index (default 5)"
    )
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    from ..search.index import open_index, search

    if args.limit < 1:
        raise UserError("--limit must be at least 1")
    query = " ".join(args.query).strip()
    if not query:
        raise UserError("empty query", hint="give a word to search for, e.g. morphfst search books.db kitap")
    index = open_index(args.index, readonly=True, busy_timeout=args.busy_timeout)
    try:
        if index.stale:
            sys.stderr.write(
                "note: the grammar changed since this index was updated; run 'morphfst index' on it again to refresh it\n"
            )
        hits = search(index, query, args.limit, args.tokens)
    finally:
        index.close()
    out = sys.stdout
    if args.format == "jsonl":
        for hit in hits:
            out.write(json.dumps(hit.as_json(), ensure_ascii=False) + "\n")
        return 0 if hits else 1
    color = args.color == "always" or (args.color == "auto" and out.isatty())
    start, end = ("\x1b[1;31m", "\x1b[0m") if color else ("[", "]")
    for hit in hits:
        out.write(f"{hit.rank}. {hit.path}:{hit.line}\n   {' '.join(hit.marked(start, end).split())}\n")
    if not hits:
        sys.stderr.write(f"no document matches {query!r}\n")
    return 0 if hits else 1

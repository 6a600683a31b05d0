"""``morphfst index``: build or update a lemma-aware full-text index (SQLite FTS5) of files."""

from __future__ import annotations

import argparse
import sys
from typing import TYPE_CHECKING

from ..errors import UserError

if TYPE_CHECKING:
    from ..search import TermOptions

EXAMPLES = """examples:
  morphfst index books.db demo/tur_library.txt                 one document per line, Turkish lemmas
  morphfst index books.db notes/                               add a directory; unchanged files are skipped
  morphfst index kirjat.db -l fin demo/fin_library.txt         a Finnish index
  morphfst index books.db corpus/ --terms lemma,surface -j 2   lemmas and exact forms, 2 worker processes
  morphfst index books.db corpus/ --prune                      also drop files deleted from disk

Then: morphfst search books.db kitap

An existing index is updated in place: new and changed files are (re-)indexed, unchanged ones skipped.
The language and term options are fixed when the index is created and kept for every update and every
query. Needs the search extra: pip install 'morphfst[search]'.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "index",
        help="build or update a lemma-aware full-text index (SQLite FTS5) of files",
        description="Index files or directories in an SQLite FTS5 database whose tokenizer is the grammar's "
        "analyzer: every word is indexed under its lemma (and, by option, its stem, morphs or exact form) at its "
        "own position, so a search for a lemma finds every inflected form and highlights the original words.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("index", metavar="INDEX", help="the index file (created when missing)")
    p.add_argument("inputs", nargs="+", metavar="INPUT", help="files or directories to index")
    p.add_argument(
        "-l",
        "--lang",
        default=None,
        metavar="LANG",
        help="language of a new index (default: tur); an existing index keeps its own",
    )
    p.add_argument(
        "--terms",
        default=None,
        metavar="KINDS",
        help="new index: comma-separated term kinds per word, the first one used for queries: lemma (default), stem, morphs, surface",
    )
    p.add_argument(
        "--analyses", choices=("best", "all"), default=None, help="new index: terms of the best analysis (default) or of all"
    )
    p.add_argument("--no-guess", action="store_true", help="new index: index unknown words as they are, without the guesser")
    p.add_argument(
        "--unit", choices=("line", "file"), default=None, help="new index: one document per line (default) or per file"
    )
    p.add_argument(
        "-j", "--jobs", type=int, default=1, metavar="N", help="worker processes that analyze while SQLite indexes (default 1)"
    )
    p.add_argument("--prune", action="store_true", help="remove files from the index that no longer exist on disk")
    p.add_argument(
        "--busy-timeout", type=float, default=5.0, metavar="SECONDS", help="wait this long for a locked index (default 5)"
    )
    p.add_argument("-q", "--quiet", action="store_true", help="no progress bar and no summary")
    p.set_defaults(func=run)


def term_options(args: argparse.Namespace) -> TermOptions | None:
    from ..search import TermOptions

    if args.terms is None and args.analyses is None and not args.no_guess:
        return None
    terms = tuple(t.strip() for t in (args.terms or "lemma").split(",") if t.strip())
    try:
        return TermOptions(terms, args.analyses or "best", not args.no_guess)
    except ValueError as exc:
        raise UserError(str(exc), hint="--terms takes lemma, stem, morphs and surface, comma-separated") from None


def run(args: argparse.Namespace) -> int:
    from ..search.index import index_stats, open_index, update_index

    if args.jobs < 1:
        raise UserError("--jobs must be at least 1", hint="give the number of worker processes, e.g. -j 2")
    from ..corpus.sources import expand_inputs

    options = term_options(args)
    expand_inputs([i for i in args.inputs if i != "-"] or ["-"])  # a missing input fails before the index is touched
    index = open_index(
        args.index,
        args.lang,
        options,
        args.unit,
        create=True,
        busy_timeout=args.busy_timeout,
    )
    try:
        result = update_index(index, args.inputs, jobs=args.jobs, quiet=args.quiet, prune=args.prune)
        stats = index_stats(index)
    finally:
        index.close()
    if not args.quiet:
        parts = [f"{result.added} new", f"{result.changed} changed", f"{result.unchanged} unchanged"]
        if result.removed:
            parts.append(f"{result.removed} removed")
        sys.stderr.write(
            f"{args.index}: {', '.join(parts)} file(s); {result.docs:,} document(s) added in {result.seconds:.1f} s; "
            f"index: {stats['files']:,} files, {stats['docs']:,} documents, {stats['bytes'] / 1024:,.0f} KiB\n"
        )
        if result.rebuilt:
            sys.stderr.write("note: the grammar had changed since the last update: every stored document was re-analyzed\n")
    return 0

"""``morphfst export``: every form of every lexicon entry, UniMorph three-column lines."""

from __future__ import annotations

import argparse
import json
import sys

from ..tables.export import export_unimorph
from ..tables.paradigm import make_bound
from .common import add_language, open_language, split_labels

EXAMPLES = """examples:
  morphfst export -o tur.unimorph.tsv              the whole Turkish lexicon, inflection only (depth 0)
  morphfst export -l fin -o fin.unimorph.tsv       the Finnish lexicon
  morphfst export --depth 1 -o tur-derived.tsv     also one derivational affix (kitapçı, kitaplık, ...)
  morphfst export --depth 2 --without PRIV -o x.tsv  deeper, leaving one derivation out
  morphfst export --pos V -o verbs.tsv             verbs only
  morphfst export -o - | head                      to standard output
  morphfst export -o tur.tsv --stats               also print counts and forms per second as JSON

Each line: lemma<TAB>form<TAB>features (UniMorph labels, e.g. ev<TAB>evlerde<TAB>N;PL;LOC); a cell with
several forms gives one line per form, preferred first; cells with no form give no line.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "export",
        help="write every form of every lexicon entry (UniMorph format)",
        description="Write every form of every lexicon entry as UniMorph three-column lines (lemma, form, "
        "features), streaming entry by entry to a file that is renamed into place when complete. Cyclic "
        "derivation is bounded by --depth and the feature filter.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    add_language(p)
    p.add_argument("-o", "--output", required=True, metavar="FILE", help="the output file ('-' for standard output)")
    p.add_argument("--depth", type=int, default=0, metavar="N", help="derivational affixes allowed in a word (default 0)")
    p.add_argument("--with", dest="require", metavar="LABELS", help="only forms whose features include all these labels")
    p.add_argument("--without", dest="exclude", metavar="LABELS", help="leave out forms with any of these labels")
    p.add_argument("--pos", metavar="POS", help="only entries of these parts of speech (comma-separated)")
    p.add_argument(
        "--all-cells", action="store_true", help="every cell within the depth, not only the dimensions of the grammar's layouts"
    )
    p.add_argument("--no-progress", action="store_true", help="no progress bar on standard error")
    p.add_argument("--stats", action="store_true", help="print what was written as JSON on standard error")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    lang = open_language(args)
    bound = make_bound(lang, args.depth, split_labels(args.require), split_labels(args.exclude), layout_only=not args.all_cells)
    progress = not args.no_progress and sys.stderr.isatty()  # never \r frames in a log
    stats = export_unimorph(lang, args.output, bound, split_labels(args.pos), progress=progress)
    if args.stats:
        sys.stderr.write(json.dumps(stats.to_dict(), ensure_ascii=False) + "\n")
    elif args.output != "-":
        sys.stderr.write(
            f"wrote {args.output}: {stats.forms} forms of {stats.lemmas} lemmas "
            f"({stats.empty_cells} cells without a form) in {stats.seconds:.1f} s\n"
        )
    return 0

"""``morphfst table``: the inflection table of a lemma, laid out like a grammar book."""

from __future__ import annotations

import argparse
import shutil
import sys

from ..errors import UserError
from ..tables.export import write_text
from ..tables.layout import arrange, layout_override
from ..tables.paradigm import make_bound, paradigms, trial_paradigm
from ..tables.table_formats import FORMATS, render
from .common import add_language, open_language, split_labels

EXAMPLES = """examples:
  morphfst table kitap                          every form of kitap 'book', one table per possessor
  morphfst table gelmek                         a verb: persons down, polarity across, one table per tense
  morphfst table -l fin talo                    Finnish
  morphfst table kitap --depth 1                also the derived stems (kitapçı, kitaplık, ...)
  morphfst table kitap --depth 2 --without PRIV,PROPR   deeper, leaving two derivations out
  morphfst table kitap --with PL                only the cells carrying PL
  morphfst table kalem --class noun             a word not in the lexicon yet, tried as a noun
  morphfst table yapmak --class verb --stem yap --flags no_voicing   a new verb: its stem and a lexical flag
  morphfst table kitap -f html -o kitap.html    a printable page (no network resources)
  morphfst table ev -f markdown                 Markdown; also csv, tsv, json
  morphfst table ev --rows Case --columns Possession --tables Number   another arrangement
  morphfst table ev --width 120                 use 120 terminal columns
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "table",
        help="print the inflection table of a lemma",
        description="Print every form of a lemma (every reading of an ambiguous one), laid out by the grammar's "
        "layout for its part of speech or by one derived from the feature inventory. A word that is not in the "
        "lexicon can be tried by giving its class (--class), optionally with part of speech, stem and flags. "
        "Forms tied for the best weight are joined with ' / ', less preferred variants follow in parentheses, "
        "and a cell the grammar leaves unfilled shows '—'.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("lemmas", nargs="+", metavar="LEMMA", help="the lemma(s) to inflect")
    add_language(p)
    p.add_argument(
        "-f",
        "--format",
        choices=FORMATS,
        default="text",
        help="text (aligned, default), markdown, csv or tsv (one record per form), html (a page), json",
    )
    p.add_argument("-o", "--output", metavar="FILE", help="write to FILE (written under a temporary name, then renamed)")
    p.add_argument("--width", type=int, metavar="N", help="terminal columns for the text view (default: the terminal's, or 80)")
    bound = p.add_argument_group("which cells")
    bound.add_argument(
        "--depth",
        type=int,
        default=0,
        metavar="N",
        help="derivational affixes allowed in a word (0: the entry's own inflection; default 0)",
    )
    bound.add_argument("--with", dest="require", metavar="LABELS", help="only cells carrying all these labels (comma-separated)")
    bound.add_argument("--without", dest="exclude", metavar="LABELS", help="leave out cells carrying any of these labels")
    bound.add_argument(
        "--all-cells",
        action="store_true",
        help="every cell within the depth, not only those whose labels the layout lays out (stacked copulas, voices...)",
    )
    bound.add_argument(
        "--pos", metavar="POS", help="only the reading with this part of speech (or the part of speech of a new word)"
    )
    new = p.add_argument_group("a word not in the lexicon")
    new.add_argument("--class", dest="klass", metavar="CLASS", help="inflect the word as an entry of this class")
    new.add_argument("--stem", metavar="STEM", help="its underlying stem, if it differs from the lemma (e.g. a verb's stem)")
    new.add_argument("--flags", metavar="FLAGS", help="its lexical flags, comma-separated")
    new.add_argument("--gloss", default="", metavar="TEXT", help="a gloss to show in the heading")
    lay = p.add_argument_group("layout (instead of the grammar's)")
    lay.add_argument("--rows", metavar="DIMS", help="dimensions down the side, outermost first (comma-separated)")
    lay.add_argument("--columns", metavar="DIMS", help="dimensions across the top")
    lay.add_argument("--tables", metavar="DIMS", help="dimensions that make separate tables")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    lang = open_language(args)
    custom = bool(args.rows or args.columns or args.tables)
    bound = make_bound(
        lang, args.depth, split_labels(args.require), split_labels(args.exclude), layout_only=not (args.all_cells or custom)
    )
    if args.pos and args.pos not in lang.dimensions.get("pos", []):
        raise UserError(
            f"unknown part of speech {args.pos!r}", hint="parts of speech: " + ", ".join(lang.dimensions.get("pos", []))
        )
    if not args.klass and (args.stem or args.flags):
        raise UserError("--stem and --flags describe a new entry", hint="give its class too, e.g. --class noun")
    if args.width is not None and args.width < 20:
        raise UserError(f"--width {args.width} is too narrow", hint="give 20 columns or more")
    override = None
    if args.rows or args.columns or args.tables:
        override = layout_override(lang.meta, "", split_labels(args.rows), split_labels(args.columns), split_labels(args.tables))
    found = []
    for lemma in args.lemmas:
        if args.klass:
            found.append(
                trial_paradigm(
                    lang,
                    lemma,
                    args.klass,
                    pos=args.pos,
                    stem=args.stem,
                    flags=split_labels(args.flags),
                    gloss=args.gloss,
                    bound=bound,
                )
            )
        else:
            found.extend(paradigms(lang, lemma, bound, args.pos))
    arranged = [arrange(p, lang.meta, override) for p in found]
    width = args.width or (shutil.get_terminal_size((80, 24)).columns if sys.stdout.isatty() else 80)
    text = render(arranged, args.format, lang.name, lang.title, width)
    if args.output:
        write_text(args.output, text)
        sys.stderr.write(f"wrote {args.output}: {len(found)} reading(s), {sum(len(p.cells) for p in found)} cells\n")
    else:
        sys.stdout.write(text)
    return 0

"""``morphfst graph``: draw the slot graph (Graphviz DOT, or SVG/PNG through the dot program)."""

from __future__ import annotations

import argparse
import sys

from ..debug.graph import FORMATS, slot_graph_dot, write_graph
from .common import add_language, open_language

EXAMPLES = """examples:
  morphfst graph > tur.dot                     DOT text on standard output
  morphfst graph -o tur.svg                    SVG (needs Graphviz's dot program)
  morphfst graph -l fin -o fin.png --rankdir TB   Finnish, PNG, top to bottom
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "graph",
        help="draw the slot graph as Graphviz DOT, SVG or PNG",
        description="Write the morphotactic graph: classes as entry nodes, each slot as a box listing its affixes, "
        "plain edges between slots, blue edges for affixes with their own followers, dashed red edges for derivational "
        "affixes (they change the part of speech). DOT needs nothing else; SVG and PNG need Graphviz's dot program.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    add_language(p)
    p.add_argument(
        "-o",
        "--output",
        metavar="FILE",
        help="write to FILE (format from --format or the suffix .dot/.svg/.png); default: DOT on standard output",
    )
    p.add_argument(
        "--format", dest="graph_format", choices=FORMATS, help="dot, svg or png (default: from the output suffix, else dot)"
    )
    p.add_argument(
        "--rankdir", choices=("LR", "TB"), default="LR", help="layout direction: left to right (default) or top to bottom"
    )
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    from ..errors import UserError

    lang = open_language(args)
    if args.output is None:
        if args.graph_format not in (None, "dot"):
            raise UserError(f"--format {args.graph_format} needs an output file", hint="add -o FILE")
        sys.stdout.write(slot_graph_dot(lang, args.rankdir))
        return 0
    out = write_graph(lang, args.output, args.graph_format, args.rankdir)
    sys.stderr.write(f"wrote {out}\n")
    return 0

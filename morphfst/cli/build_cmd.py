"""``morphfst build``: compile a grammar and its lexicons into one compiled file."""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

from ..build import compile_grammar, find_grammar
from ..compile.archive import load_archive
from ..errors import UserError
from ..runtime.compiled_language import Language

EXAMPLES = """examples:
  morphfst build grammars/tur.mfg                 compile into the cache (what 'load' uses)
  morphfst build grammars/tur.mfg -o tur.mfc      compile into a file of your choice
  morphfst analyze -l tur.mfc evlerde             use a compiled file directly
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "build",
        help="compile a grammar and its lexicons",
        description="Compile a grammar file and its lexicon files into one compiled file (transducers plus metadata).",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("grammar", help="grammar file (.mfg) or shipped grammar name")
    p.add_argument("-o", "--output", metavar="FILE", help="where to write the compiled file (default: the cache)")
    p.add_argument("-q", "--quiet", action="store_true", help="print only the path of the compiled file")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    path = find_grammar(args.grammar)
    if path.suffix != ".mfg":
        raise UserError(f"{path} is not a grammar file", hint="give a .mfg grammar file or a shipped grammar name")
    if args.output and Path(args.output).is_dir():  # said before a compile of a minute, not after it
        raise UserError(f"{args.output} is a directory", hint="give a file name for the output")
    t0 = time.perf_counter()
    out = compile_grammar(path, args.output)
    seconds = time.perf_counter() - t0
    if args.quiet:
        print(out)
        return 0
    fsts, meta = load_archive(out)
    lang = Language(fsts, meta, str(out))
    sys.stdout.write(f"compiled {meta['title']} ({meta['name']}) in {seconds:.2f} s -> {out}\n")
    sys.stdout.write(f"  lexicon entries: {len(meta['lexicon'])}, slots: {len(meta['slots'])}, rules: {len(meta['rules'])}\n")
    for name, stat in lang.stats().items():
        sys.stdout.write(f"  {name:<10} {stat['states']:>8} states {stat['arcs']:>9} arcs\n")
    return 0

"""``morphfst generate``: surface forms from a lemma and features."""

from __future__ import annotations

import argparse
import sys
from collections.abc import Iterator

from ..errors import UserError
from ..textio import ReadStats
from .common import Aligned, add_format, add_input, add_language, input_lines, open_language, report_stats, tsv_field, write_json

EXAMPLES = """examples:
  morphfst generate ev "N;PL;ABL"                 -> evlerden
  morphfst generate kitap N SG PSS3S ACC          labels may also be separate arguments
  morphfst generate -l fin katu "N;SG;IN+ESS"     Finnish
  morphfst generate -i requests.txt -f tsv        lines 'lemma FEATURES' (space or tab between)
  morphfst generate --guess tırzop "N;PL;DAT"     a lemma the lexicon lacks, inflected as its shape is guessed
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "generate",
        help="generate surface forms from a lemma and features",
        description="Generate the surface forms of a lemma with a feature bundle (UniMorph labels, separated by ';' "
        "or given as separate arguments, in any order), best first.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("lemma", nargs="?", help="the lemma")
    p.add_argument("features", nargs="*", help="feature labels, e.g. 'N;PL;LOC' or N PL LOC")
    add_language(p)
    add_input(p, "requests (lemma and features per line)")
    add_format(p)
    p.add_argument(
        "--guess",
        action="store_true",
        help="inflect a lemma the lexicon does not know as the guesser reads its shape (the classes whose guess "
        "pattern allows it; forms marked guessed, weighing 100 more)",
    )
    p.set_defaults(func=run)


def requests(args: argparse.Namespace, stats: ReadStats) -> Iterator[tuple[str, str]]:
    if args.lemma:
        if not args.features:
            raise UserError("no features given", hint='write them after the lemma, e.g. morphfst generate ev "N;PL;LOC"')
        yield args.lemma, ";".join(f.strip(";") for f in args.features)
        return
    for line in input_lines(args, stats):
        parts = line.replace("\t", " ").split()
        if not parts:
            continue
        yield parts[0], ";".join(parts[1:])


def run(args: argparse.Namespace) -> int:
    lang = open_language(args)
    stats = ReadStats()
    out = sys.stdout
    table = Aligned(["analysis", "form", "weight"], out) if args.format == "table" else None
    guessing = bool(args.guess)
    if args.format == "tsv":
        out.write("lemma\tfeatures\trank\tform\tweight" + ("\tguessed\n" if guessing else "\n"))
    for lemma, feats in requests(args, stats):
        forms = lang.generate(lemma, feats, guess=guessing) if feats else []
        analysis = f"{lemma} {feats}"
        if args.format == "jsonl":
            write_json({"lemma": lemma, "features": feats, "forms": [f.to_dict() for f in forms]}, out)
        elif args.format == "tsv":
            end = "\t\n" if guessing else "\n"
            if not forms:
                out.write(f"{tsv_field(lemma)}\t{tsv_field(feats)}\t0\t\t{end}")
            for rank, f in enumerate(forms, start=1):
                mark = ("\t1\n" if f.guessed else "\t0\n") if guessing else "\n"
                out.write(f"{tsv_field(lemma)}\t{tsv_field(feats)}\t{rank}\t{f.form}\t{f.weight:.4f}{mark}")
        else:
            assert table is not None
            if not forms:
                table.add([analysis, "(no form)", ""])
            for rank, f in enumerate(forms):
                shown = f"{analysis} (guessed)" if f.guessed else analysis
                table.add([shown if rank == 0 else "", f.form, f"{f.weight:.2f}"])
    if table:
        table.flush()
    report_stats(stats)
    return 0

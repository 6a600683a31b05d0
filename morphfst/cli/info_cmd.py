"""``morphfst info``: what a compiled language contains."""

from __future__ import annotations

import argparse
import sys

from .common import add_language, open_language

EXAMPLES = """examples:
  morphfst info                 the default grammar (tur)
  morphfst info -l fin --slots  Finnish, with every slot and affix
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "info",
        help="show a language's features, rules, compounds, slots and transducer sizes",
        description="Show what a compiled language contains: lexicon size, feature inventory, slots, rules and transducer sizes.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    add_language(p)
    p.add_argument("--slots", action="store_true", help="list every slot with its affixes")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    lang = open_language(args)
    meta = lang.meta
    w = sys.stdout.write
    w(f"{meta['title']} ({meta['name']}), morphfst {meta['version']}\n")
    w(f"  compiled file: {lang.path}\n  grammar:       {meta['grammar_path']}\n")
    w(
        f"  lexicon entries: {len(meta['lexicon'])}   classes: {len(meta['classes'])}   slots: {len(meta['slots'])}   rules: {len(meta['rules'])}\n"
    )
    w("features:\n")
    for dim, values in meta["dimensions"].items():
        w(f"  {dim:<12} {' '.join(values)}\n")
    w("rules (in order):\n")
    for rule in meta["rules"]:
        w(f"  {rule['name']:<22} line {rule['line']:<4} {rule['text']}\n")
    compounds = meta.get("compounds") or []
    if compounds:
        w("compounds (analysis only):\n")
        for c in compounds:
            forms = " | ".join(" ".join(f) for f in c["forms"])
            w(
                f"  {' '.join(c['first'])} in {forms} + ... + {' '.join(c['last'])}: at most {c['parts']} parts, "
                f"parts of {c['min']}+ letters, weight {c['weight']:g} per seam (line {c['line']})\n"
            )
            if c.get("lastmin", 1) > 1:
                w(f"    the last part's lemma of {c['lastmin']}+ letters\n")
            if c.get("order"):
                w(f"    parts in the order {c['order']!r} of the groups {', '.join(sorted(c['groups']))}\n")
    if args.slots:
        w("slots:\n")
        for name, slot in meta["slots"].items():
            w(f"  {name} -> {' '.join(slot['next'])}\n")
            for a in slot["affixes"]:
                form = "".join(a["form"]) or "∅"
                nxt = f" -> {' '.join(a['next'])}" if a["next"] else ""
                w(f"    {form:<12} {';'.join(a['features']):<16} {a['gloss']}{nxt}\n")
    from ..runtime import native

    walk = (
        "in C (morphfst.runtime._cwalk)"
        if native.available()
        else "in Python (the C extension is not built, or MORPHFST_PURE_PYTHON is set)"
    )
    w(f"  analysis walk: {walk}\n")
    w("transducers:\n")
    for name, stat in lang.stats().items():
        w(f"  {name:<10} {stat['states']:>8} states {stat['arcs']:>9} arcs\n")
    return 0

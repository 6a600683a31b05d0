"""How well the Finnish compound rule reads words it has never seen (a held-out measure).

Listed lexicon nouns and adjectives that are themselves compounds of two listed words stand in for
unseen compounds: each lemma is split at every point where the left side is a form a compound's first
part takes (analysed by the grammar as a listed word, not itself a compound) and the right side a
listed noun or adjective. For each such lemma four forms are generated (singular nominative, genitive
and inessive, plural partitive) and analysed path by path (the reference composition, before the
deduplication that keeps only the lexicon entry's reading of a lemma and tags); a form counts as read
when one of its paths is a compound reading (two stems or more) with the lemma's own tags, which is
what the compound rule would give if the entry were not listed, and as read first when that reading
is also the best of all readings but the entry's own. The entries stay in the lexicon: their own
reading is simply ignored.

usage (from the root of the checkout, with MORPHFST_CACHE set):
    python3 bench/fin_compound_heldout.py [--fail N] [--show CLASS]
prints the share of forms and of lemmas read and the failures by class of first part (SG NOM, SG
GEN, CPD form, PL GEN, adjective, other case form or word, -nen word, -minen) and of last part.
"""

from __future__ import annotations

import argparse
import collections
import glob
import os
import sys
from pathlib import Path

sys.path.insert(0, os.getcwd())
import pynini  # noqa: E402

import morphfst  # noqa: E402
from morphfst.compile.fstutil import acc, paths  # noqa: E402
from morphfst.runtime.compiled_language import MAX_PATHS  # noqa: E402

FORMS = ("SG;NOM", "SG;GEN", "PL;PRT", "SG;IN+ESS")


def load_lexicon(root: Path) -> dict[str, set[tuple[str, str]]]:
    lex: dict[str, set[tuple[str, str]]] = {}
    for f in glob.glob(str(root / "lexicons/fin/*.tsv")):
        if f.endswith(("irregular.tsv", "names.tsv", "abbreviations.tsv", "bound.tsv")):
            continue
        for line in open(f, encoding="utf-8"):
            if line.startswith(("#", "lemma\t")):
                continue
            p = line.rstrip("\n").split("\t")
            if len(p) >= 3 and p[0]:
                lex.setdefault(p[0], set()).add((p[1], p[2]))
    return lex


def all_paths(lang, word: str):
    """Every analysis of every path of ``word``, undeduplicated (see the module docstring)."""
    surface = lang.normalize(word)
    out = []
    for bounded, _ in lang._bounded(surface):
        lattice = pynini.compose(acc(bounded), lang.fsts["bounded"])
        for p in paths(lattice, MAX_PATHS):
            out.extend(lang.fast.decode_all(surface, [(bounded, p[1], p[2])], False, word))
    return out


def is_compound(a) -> bool:
    return sum(1 for m in a.morphs if m.kind == "stem") >= 2


def first_class(lang, left: str, lex) -> str | None:
    """The form class of a first part, or None when left is no listed word's form."""
    classes = []
    for a in lang.analyze(left):
        if is_compound(a) or a.lemma not in lex:
            continue
        f = a.features
        if a.pos == "V" and "V.MSDR" in f and "CPD" in f:
            classes.append("minen-CPD")
        elif "CPD" in f:
            classes.append("CPD")
        elif a.pos in ("N", "NUM") and f[:2] in (("SG", "NOM"),):
            classes.append("N-SG-NOM")
        elif a.pos in ("N", "NUM") and f[:2] == ("SG", "GEN"):
            classes.append("N-SG-GEN")
        elif a.pos == "N" and f[:2] == ("PL", "GEN"):
            classes.append("N-PL-GEN")
        elif a.pos == "ADJ" and f[:2] == ("SG", "NOM"):
            classes.append("ADJ-SG-NOM")
        elif a.pos in ("N", "ADJ", "NUM") and not any(x in f for x in ("V.PTCP", "AGTN", "ACTN", "PROPR")):
            classes.append("other-case:" + a.pos + "-" + "-".join(f[:2]))
        elif a.pos in ("ADV", "PART", "ADP", "PRON", "V"):
            classes.append("other-word:" + a.pos)
    if not classes:
        return None
    order = ["N-SG-NOM", "N-SG-GEN", "CPD", "minen-CPD", "N-PL-GEN", "ADJ-SG-NOM"]
    for c in order:
        if c in classes:
            return c
    return sorted(classes)[0]


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--fail", type=int, default=0, help="print this many failures of each class")
    ap.add_argument("--limit", type=int, default=0, help="only the first N candidate lemmas")
    args = ap.parse_args()
    lang = morphfst.load(Path("grammars/fin.mfg").resolve())
    lex = load_lexicon(Path("."))
    lastok = {w for w, cs in lex.items() if any(p in ("N", "ADJ") for c, p in cs) and len(w) >= 2}
    cands = []
    for lemma, cs in sorted(lex.items()):
        pos = {p for c, p in cs if not c.startswith("p_")}
        if not pos & {"N", "ADJ"} or "-" in lemma or " " in lemma:
            continue
        split = None
        for i in range(3, len(lemma) - 1):
            left, right = lemma[:i], lemma[i:]
            if right not in lastok:
                continue
            fc = first_class(lang, left, lex)
            if fc:
                split = (left, right, fc)
                break
        if split:
            cands.append((lemma, sorted(pos)[0], split))
    if args.limit:
        cands = cands[: args.limit]
    forms_total = forms_read = forms_first = lem_read = 0
    by_class = collections.defaultdict(lambda: [0, 0, 0])
    fails = collections.defaultdict(list)
    for lemma, pos, (left, right, fc) in cands:
        rpos = sorted(p for c, p in lex[right] if p in ("N", "ADJ"))
        klass = fc + (" +ADJ" if rpos == ["ADJ"] else "")
        ok_all = True
        for tags in FORMS:
            gens = lang.generate(lemma, f"{pos};{tags}")
            if not gens:
                continue
            form = gens[0].form
            forms_total += 1
            want = (pos, *tags.split(";"))
            rest = [a for a in all_paths(lang, form) if not (a.lemma == lemma and not is_compound(a))]
            hit = any(is_compound(a) and a.lemma == lemma and a.tags == want for a in rest)
            best = min(rest, key=lambda a: a.weight) if rest else None
            first = hit and best is not None and is_compound(best) and best.lemma == lemma and best.tags == want
            forms_read += hit
            forms_first += first
            by_class[klass][0] += 1
            by_class[klass][1] += hit
            by_class[klass][2] += first
            if not hit:
                ok_all = False
                if len(fails[klass]) < 10000:
                    fails[klass].append(f"{form} ({left}+{right})")
        lem_read += ok_all
    print(f"candidate compound lemmas: {len(cands)}; read in all four forms: {lem_read} ({lem_read / len(cands):.1%})")
    print(
        f"forms: {forms_read}/{forms_total} read ({forms_read / forms_total:.1%}), "
        f"{forms_first} read first ({forms_first / forms_total:.1%})"
    )
    for k, (t, r, f) in sorted(by_class.items(), key=lambda x: -x[1][0] + x[1][1]):
        print(f"  {k:32s} {r:5d}/{t:<5d} read {r / t:6.1%}  first {f / t:6.1%}  failed {t - r}")
        if args.fail:
            print("     ", " ".join(fails[k][: args.fail]))


if __name__ == "__main__":
    main()

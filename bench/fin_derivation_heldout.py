"""How well the Finnish derivation rules read derived words they have never seen (a held-out measure).

Listed lexicon entries that are regular derivations of another listed entry stand in for unseen
derived words: an entry whose lemma ends in a derivational suffix (below: -inen, -llinen, -tOn, -kAs,
-mAinen adjectives, -sti adverbs, -UUs, -Us, -ntI, -lU, -jA, -minen, -stO nouns, -UA, -UtUA, -stUA,
-skellA verbs) and whose base, found by spelling, is a listed word of the suffix's part of speech. The
base is any listed lemma of that part of speech that begins with the derived stem less its last two
letters (at least three letters: gradation and the stem vowel change there, taloude-llinen from
talous, kulje-skella from kulkea) and is at most three letters longer than the stem. For each entry
four forms are generated (nominals: singular nominative, genitive and inessive, plural partitive;
verbs: the infinitive, the present and past third person singular, the present passive; an adverb:
itself) and analysed path by path (the reference composition, before the deduplication that keeps
only the entry's own reading); a form counts as read when one of its paths is a derived reading: a
base's lemma and part of speech, the suffix's feature label, and the derived word's part of speech
and the form's features at the end (kesällisiä: kesä N;ASSOC;ADJ;PL;PRT). The
entries stay in the lexicon: their own reading is simply ignored.

usage (from the root of the checkout, with MORPHFST_CACHE set):
    python3 bench/fin_derivation_heldout.py [--fail N] [--suffix NAME]
prints, by suffix, the derived entries found, the share of their forms read through the derivation
rule, and (with --fail) the first N forms that were not.
"""

from __future__ import annotations

import argparse
import collections
import os
import sys
from pathlib import Path

sys.path.insert(0, os.getcwd())
sys.path.insert(0, str(Path(__file__).resolve().parent))

from fin_compound_heldout import all_paths, is_compound, load_lexicon  # noqa: E402

import morphfst  # noqa: E402

NOMINAL_FORMS = ("SG;NOM", "SG;GEN", "PL;PRT", "SG;IN+ESS")
VERB_FORMS = ("NFIN", "IND;PRS;3;SG", "IND;PST;3;SG", "PASS;IND;PRS")

# name: (derived part of speech, lemma endings, base part of speech, feature label, endings it must not have)
SUFFIXES: dict[str, tuple[str, tuple[str, ...], str, str, tuple[str, ...]]] = {
    "-inen (PROPR)": ("ADJ", ("inen",), "N", "PROPR", ("llinen", "mainen", "mäinen", "lainen", "läinen")),
    "-llinen (ASSOC)": ("ADJ", ("llinen",), "N", "ASSOC", ()),
    "-tOn (CAR)": ("ADJ", ("ton", "tön"), "N", "CAR", ("maton", "mätön")),
    "-kAs (ABUND)": ("ADJ", ("kas", "käs"), "N", "ABUND", ()),
    "-mAinen (SIM)": ("ADJ", ("mainen", "mäinen"), "N", "SIM", ()),
    "-sti (STI)": ("ADV", ("sti",), "ADJ", "STI", ()),
    "-UUs (ABSTR)": ("N", ("uus", "yys"), "ADJ", "ABSTR", ()),
    "-Us (ACTN)": ("N", ("us", "ys"), "V", "ACTN", ("uus", "yys")),
    "-ntI (ACTN)": ("N", ("nti",), "V", "ACTN", ()),
    "-lU (ACTN)": ("N", ("lu", "ly"), "V", "ACTN", ()),
    "-jA (AGTN)": ("N", ("ja", "jä"), "V", "AGTN", ()),
    "-minen (V.MSDR)": ("N", ("minen",), "V", "V.MSDR", ()),
    "-stO (COLL)": ("N", ("sto", "stö"), "N", "COLL", ()),
    "-UtUA (REFL)": ("V", ("utua", "ytyä"), "V", "REFL", ()),
    "-UA (REFL)": ("V", ("ua", "yä"), "V", "REFL", ("utua", "ytyä", "stua", "styä")),
    "-stUA (BECOME)": ("V", ("stua", "styä"), "ADJ", "BECOME", ()),
    "-skellA (FREQ)": ("V", ("skella", "skellä"), "V", "FREQ", ()),
}


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--fail", type=int, default=0, help="print this many unread forms of each suffix")
    ap.add_argument("--suffix", default="", help="only the suffixes whose name contains this")
    args = ap.parse_args()
    lang = morphfst.load(Path("grammars/fin.mfg").resolve())
    lex = load_lexicon(Path("."))
    by_pos: dict[str, list[str]] = collections.defaultdict(list)
    for lemma, cs in lex.items():
        for _, pos in cs:
            by_pos[pos].append(lemma)
    for pos in by_pos:
        by_pos[pos].sort()
    total_forms = total_read = 0
    for name, (dpos, ends, bpos, label, unless) in SUFFIXES.items():
        if args.suffix and args.suffix not in name:
            continue
        entries = []
        for lemma, cs in sorted(lex.items()):
            if dpos not in {p for _, p in cs} or not lemma.endswith(ends) or lemma.endswith(unless) or "-" in lemma:
                continue
            end = next(e for e in ends if lemma.endswith(e))
            stem = lemma[: -len(end)]
            if len(stem) < 3:
                continue
            prefix = stem[: max(3, len(stem) - 2)]
            bases = {b for b in by_pos.get(bpos, []) if b.startswith(prefix) and b != lemma and len(b) <= len(stem) + 3}
            if bases:
                entries.append((lemma, bases))
        forms_total = forms_read = lem_read = 0
        fails = []
        for lemma, bases in entries:
            tagsets = [""] if dpos == "ADV" else NOMINAL_FORMS if dpos in ("N", "ADJ") else VERB_FORMS
            ok = True
            for tags in tagsets:
                if tags:
                    gens = lang.generate(lemma, f"{dpos};{tags}")
                    if not gens:
                        continue
                    form = gens[0].form
                else:
                    form = lemma
                want = tuple(tags.split(";")) if tags else ()
                forms_total += 1
                hit = any(
                    a.lemma in bases
                    and not is_compound(a)
                    and a.pos == bpos
                    and label in a.features
                    and a.features[len(a.features) - len(want) :] == want
                    and a.features[len(a.features) - len(want) - 1] == dpos
                    for a in all_paths(lang, form)
                )
                forms_read += hit
                if not hit:
                    ok = False
                    fails.append(f"{form} ({'/'.join(sorted(bases)[:2])})")
            lem_read += ok
        total_forms += forms_total
        total_read += forms_read
        share = forms_read / forms_total if forms_total else 0.0
        print(
            f"{name:18s} entries {len(entries):5d}  all forms read {lem_read:5d}  "
            f"forms {forms_read:5d}/{forms_total:<5d} read {share:6.1%}  missing {forms_total - forms_read}"
        )
        if args.fail:
            print("     ", " ".join(fails[: args.fail]))
    if total_forms:
        print(f"all suffixes: {total_read}/{total_forms} forms read ({total_read / total_forms:.1%})")


if __name__ == "__main__":
    main()

"""How well the Turkish derivation rules read words they have never seen (a held-out measure).

Listed lexicon entries that are regular derivations of another listed entry stand in for unseen
derived words. The pairs come from the lexicon by spelling and part of speech alone, not from the
grammar: an entry is X + suffix, with the suffix's vowel harmony (the last vowel of X, or a front
vowel after a stem flagged front_harmony), C and D voiceless after a voiceless consonant, a buffer
y or a dropped link vowel after a vowel, and a verb root's final stop voiced before a vowel where
the root is flagged voicing (git-: gidiş). Nominal suffixes: -lIk, -CI, -lI, -sIz, -sAl, -CIk,
-(I)msI, -DAş on a listed noun or adjective, and -CA on an adjective giving a listed adverb; verbs
from nominals: -lA-, -lAş-, -lAn-, -Al-; verbs from verbs: -(I)n-, -(I)ş-, -(I)l-, -DIr-/-t-;
nouns from verbs: -mA, -(y)Iş, -(y)IcI, -(I)m, -(I)ntI, and the adjectives -(I)k and -GAn. For each derived entry four forms are
generated from the entry itself (nouns: accusative, plural, locative, third person possessive +
dative; adjectives: bare, accusative, plural, locative; verbs: past 3sg, progressive 3sg, verbal
noun -mA, negative aorist 3sg; an adverb: the word alone), and every analysis of each form is
looked at: a form counts as read when one analysis has the base's lemma and the derivation's label
with the entry's own features after it (göz N;ABSTR;N;SG;ACC for gözlüğü), which is what the
derivation rule gives when the entry is not listed, and as read first when that analysis is also
the best of all analyses whose lemma is not the entry's. The entries stay in the lexicon: their
own readings are simply ignored.

Compounds: listed nouns written as one word that are a listed noun or adjective X followed by a
listed noun Y with its third person possessive -(s)I (X + Y-(s)I: demiryolu) are counted too, in
four forms (accusative, plural, locative, first person plural possessive: demiryolunu, demiryolları,
demiryolunda, demiryolumuz), each analysed path by path (as bench/fin_compound_heldout.py does: the
compound paths of a word the lexicon lists are dropped before ranking); a form counts as read when a
path is a compound reading (two stems or more) with the entry's lemma and tags, which is what the
compound block gives when the entry is not listed, and as read first when it is also the best of all
readings but the entry's own. They are counted by the first part: a noun of three letters or more
(what grammars/tur/compounds.mfg takes), an adjective, or a noun of two letters.

usage (from the root of the checkout, with MORPHFST_CACHE set):
    python3 bench/tur_derivation_heldout.py [--fail N] [--beaten N]
prints the share of forms read and read first, and of entries read in all their forms, by suffix,
with N failures of each suffix when asked.
"""

from __future__ import annotations

import argparse
import collections
import os
import sys
from pathlib import Path

sys.path.insert(0, os.getcwd())
sys.path.insert(0, str(Path(__file__).resolve().parent))
from fin_compound_heldout import all_paths, is_compound  # noqa: E402  (every path; a reading with two stems)

import morphfst  # noqa: E402

FILES = ("nouns", "adjectives", "adverbs", "verbs", "compounds", "core")
VOWELS = "aeıioöuü"
FRONT = "eiöü"
ROUND = "oöuü"
VOICELESS = "çfhkpsşt"
NOUN_FORMS = ("SG;ACC", "PL;NOM", "SG;LOC", "SG;PSS3S;DAT")
ADJ_FORMS = ("SG;NOM", "SG;ACC", "PL;NOM", "SG;LOC")
VERB_FORMS = ("PST;3;SG", "PROG;3;SG", "V.MSDR;N;SG;NOM", "NEG;HAB;3;SG")
COMPOUND_FORMS = ("SG;ACC", "PL;NOM", "SG;LOC", "SG;PSS1P;NOM")

# suffix name -> (base parts of speech, derived part of speech, the labels a derived reading shows)
NOMINAL = {
    "-lIk": ("ABSTR;N",),
    "-CI": ("AGT;N",),
    "-lI": ("PROPR;ADJ",),
    "-sIz": ("PRIV;ADJ",),
    "-sAl": ("RELADJ;ADJ",),
    "-CIk": ("DIM;N", "DIM;ADJ"),
    "-(I)msI": ("SIMIL;ADJ",),
    "-sI": ("SIMIL;ADJ",),
    "-DAş": ("FELLOW;N",),
    "-CA (adv)": ("SG;EQTV",),
    "-lA-": ("VBZ;V",),
    "-lAş-": ("BECOME;V",),
    "-lAn-": ("VBZ;V;PASS", "VBZ;V;REFL"),
    "-Al-": ("BECOME;V", "VBZ;V"),
}
VERBAL = {
    "-(I)n-": ("REFL", "PASS"),
    "-(I)ş-": ("RECP",),
    "-(I)l-": ("PASS",),
    "-DIr-/-t-": ("CAUS",),
    "-mA": ("V.MSDR;N",),
    "-(y)Iş": ("V.MSDR;N",),
    "-(y)IcI": ("AGT;N",),
    "-(I)m": ("ACTN;N",),
    "-(I)ntI": ("REMN;N",),
    "-(I)k": ("RESULT;ADJ",),
    "-GAn": ("INCL;ADJ",),
}


def load_lexicon(root: Path) -> dict[str, list[tuple[str, str, str]]]:
    """lemma -> [(class, pos, flags)] of the open-class lexicon files."""
    lex: dict[str, list[tuple[str, str, str]]] = collections.defaultdict(list)
    for name in FILES:
        for line in open(root / f"lexicons/tur/{name}.tsv", encoding="utf-8"):
            if line.startswith(("#", "lemma\t")):
                continue
            p = line.rstrip("\n").split("\t") + [""] * 6
            if p[0]:
                lex[p[0]].append((p[1], p[2], p[5]))
    return lex


def last_vowel(stem: str, flags: str) -> str:
    for ch in reversed(stem):
        if ch in VOWELS:
            return {"a": "e", "ı": "i", "o": "ö", "u": "ü"}.get(ch, ch) if "front_harmony" in flags else ch
    return "e"


def spell(stem: str, suffix: str, flags: str = "") -> str:
    """stem + suffix in the archiphoneme notation (A I C D, (y) (I) (s) optional), spelt out."""
    out = stem
    i = 0
    while i < len(suffix):
        if any(v in out[len(stem) :] for v in VOWELS):
            flags = ""  # a suffix vowel decides the harmony after it
        ch = suffix[i]
        if ch == "(":
            seg, i = suffix[i + 1], i + 3
            if out[-1] in VOWELS:
                if seg in "ys":
                    out += seg
            elif seg == "I":
                out += spell_vowel(out, "I", flags)
            continue
        if ch in "AI":
            out += spell_vowel(out, ch, flags)
        elif ch in "CD":
            low = "c" if ch == "C" else "d"
            out += {"c": "ç", "d": "t"}[low] if out[-1] in VOICELESS else low
        else:
            out += ch
        i += 1
    return out


def spell_vowel(left: str, arch: str, flags: str) -> str:
    v = last_vowel(left, flags)
    front = v in FRONT
    if arch == "A":
        return "e" if front else "a"
    if v in ROUND:
        return "ü" if front else "u"
    return "i" if front else "ı"


def voiced_root(root: str, flags: str) -> str:
    if "voicing" in flags and root[-1] in "tçkp":
        return root[:-1] + {"t": "d", "ç": "c", "k": "ğ", "p": "b"}[root[-1]]
    return root


def verb_root(lemma: str) -> str | None:
    return lemma[:-3] if lemma.endswith(("mak", "mek")) and len(lemma) > 4 else None


def candidates(lex) -> list[tuple[str, str, str, str]]:
    """(suffix, base, derived, derived pos) for every listed entry that derives from a listed one."""
    out = []
    pos_of = {w: {p for _, p, _ in es} for w, es in lex.items()}
    flags_of = {w: ",".join(f for _, _, f in es) for w, es in lex.items()}
    for base, bpos in pos_of.items():
        if len(base) < 2 or " " in base or "-" in base or not base.islower():
            continue
        fl = flags_of[base]
        if bpos & {"N", "ADJ"}:
            tries = [
                ("-lIk", "lIk", "N"),
                ("-CI", "CI", "N"),
                ("-lI", "lI", "ADJ"),
                ("-sIz", "sIz", "ADJ"),
                ("-sAl", "sAl", "ADJ"),
                ("-CIk", "CIk", "N"),
                ("-CIk", "CIk", "ADJ"),
                ("-(I)msI", "(I)msI", "ADJ"),
                ("-DAş", "Daş", "N"),
                ("-lA-", "lAmAk", "V"),
                ("-lAş-", "lAşmAk", "V"),
                ("-lAn-", "lAnmAk", "V"),
                ("-Al-", "AlmAk", "V"),
            ]
            if "ADJ" in bpos:
                tries.append(("-CA (adv)", "CA", "ADV"))
            if base[-1] not in VOWELS:
                tries.append(("-sI", "sI", "ADJ"))
            for name, suf, dpos in tries:
                stem = base
                if suf.startswith("(I)") and "vowel_loss" in fl:
                    continue
                d = spell(stem, suf, fl)
                if d != base and dpos in pos_of.get(d, ()):
                    out.append((name, base, d, dpos))
        root = verb_root(base) if "V" in bpos else None
        if root:
            vroot = voiced_root(root, fl)
            vowel_end = root[-1] in VOWELS
            tries = [
                ("-(I)n-", (root + "n") if vowel_end else spell(root, "In"), "V", True),
                ("-(I)ş-", (root + "ş") if vowel_end else spell(vroot, "Iş"), "V", True),
                ("-(I)l-", None if vowel_end else spell(vroot, "Il"), "V", True),
                ("-DIr-/-t-", spell(root, "DIr"), "V", True),
                ("-DIr-/-t-", root + "t", "V", True),
                ("-mA", spell(root, "mA"), "N", False),
                ("-(y)Iş", spell(vroot, "(y)Iş"), "N", False),
                ("-(y)IcI", spell(vroot, "(y)IcI"), "N", False),
                ("-(I)m", spell(vroot, "(I)m"), "N", False),
                ("-(I)ntI", spell(vroot, "(I)ntI"), "N", False),
                ("-(I)k", None if vowel_end else spell(vroot, "Ik"), "ADJ", False),
                ("-GAn", spell(root, ("kAn" if root[-1] in VOICELESS else "gAn")), "ADJ", False),
            ]
            for name, d, dpos, is_verb in tries:
                if d is None:
                    continue
                if is_verb:
                    d = spell(d, "mAk")
                if d != base and dpos in pos_of.get(d, ()):
                    out.append((name, base, d, dpos))
    return sorted(set(out))


def compound_candidates(lex) -> list[tuple[str, str, str]]:
    """(first, last, compound) for listed nouns written X + Y-(s)I of a listed X and Y."""
    nominal = {w for w, es in lex.items() if any(p in ("N", "ADJ") for _, p, _ in es) and len(w) >= 2}
    nouns = {w for w, es in lex.items() if any(p == "N" for _, p, _ in es) and len(w) >= 2}
    out = []
    for w, es in lex.items():
        if not any(p == "N" for _, p, _ in es) or not w.islower():
            continue
        for i in range(2, len(w) - 2):
            x, rest = w[:i], w[i:]
            if x not in nominal:
                continue
            for y in (rest[:-1], rest[:-2]):
                if y in nouns and len(y) >= 2 and spell(y, "(s)I") == rest:
                    out.append((x, y, w))
                    break
                # a final stop voiced before the possessive (ayak + kap: ayakkabı; kuş + bakış)
                if len(y) >= 2 and y[-1] in "bcdğ":
                    yv = y[:-1] + {"b": "p", "c": "ç", "d": "t", "ğ": "k"}[y[-1]]
                    if yv in nouns and spell(y, "(s)I") == rest:
                        out.append((x, yv, w))
                        break
    return sorted(set(out))


def forms_of(lang, lemma: str, pos: str, cells: tuple[str, ...] | None = None) -> list[tuple[str, str]]:
    """(tags after the part of speech, form) of the entry's four forms (see the docstring)."""
    if pos == "ADV":
        return [("", lemma)]
    cells = cells or {"N": NOUN_FORMS, "ADJ": ADJ_FORMS, "V": VERB_FORMS}[pos]
    out = []
    for c in cells:
        g = lang.generate(lemma, f"{pos};{c}")
        if g:
            out.append((c, g[0].form))
    return out


def tally(stats, beaten, fails, name: str, form: str, others: list, hit: bool, first: bool, note: str) -> bool:
    """Count one form of an entry of group ``name``: read (``hit``), read first (``first``); a form
    read but not first goes to ``beaten`` with what beat it, a form not read to ``fails``. Returns ``hit``."""
    st = stats[name]
    if hit and not first:
        beaten[name].append(f"{form}:{others[0].text}")
    st[2] += 1
    st[3] += hit
    st[4] += first
    if not hit:
        fails[name].append(f"{form}({note})")
    return hit


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--fail", type=int, default=0, help="print this many failures of each suffix")
    ap.add_argument("--beaten", type=int, default=0, help="print this many forms read but not first, and what beat them")
    args = ap.parse_args()
    lang = morphfst.load(Path("grammars/tur.mfg").resolve())
    lex = load_lexicon(Path("."))
    labels = {**NOMINAL, **VERBAL}
    stats = collections.defaultdict(lambda: [0, 0, 0, 0, 0])  # entries, all read, forms, read, first
    fails = collections.defaultdict(list)
    beaten = collections.defaultdict(list)
    cands = candidates(lex)
    for name, base, derived, dpos in cands:
        bpos = sorted({p for _, p, _ in lex[base]} & {"N", "ADJ", "V"})
        st = stats[name]
        st[0] += 1
        ok_all = True
        for rest, form in forms_of(lang, derived, dpos):
            want = {f"{base} {bp};{lab}" + (f";{rest}" if rest else "") for bp in bpos for lab in labels[name]}
            others = [a for a in lang.analyze(form) if a.lemma != derived]
            hit = any(a.text in want for a in others)
            # first: the best analysis but the entry's is a reading of the derivation, in any cell
            # (gözlüğü: göz-lük's possessive before its accusative)
            prefixes = tuple(f"{base} {bp};{lab};" for bp in bpos for lab in labels[name])
            first = bool(others) and (others[0].text in want or bool(rest) and others[0].text.startswith(prefixes))
            ok_all &= tally(stats, beaten, fails, name, form, others, hit, first, base)
        st[1] += ok_all
    for first_part, last, word in compound_candidates(lex):
        nounish = any(p == "N" for _, p, _ in lex[first_part])
        name = (
            "compound N+Y-(s)I"
            if nounish and len(first_part) >= 3
            else "compound A+Y-(s)I"
            if not nounish
            else "compound NN+Y-(s)I"
        )
        st = stats[name]
        st[0] += 1
        ok_all = True
        for cell, form in forms_of(lang, word, "N", COMPOUND_FORMS):
            want = f"{word} N;{cell}"
            others = sorted(
                (a for a in all_paths(lang, form) if not (a.lemma == word and not is_compound(a))), key=lambda a: a.weight
            )
            hit = any(is_compound(a) and a.text == want for a in others)
            first = bool(others) and is_compound(others[0]) and others[0].text == want
            ok_all &= tally(stats, beaten, fails, name, form, others, hit, first, f"{first_part}+{last}")
        st[1] += ok_all
    tot = [sum(s[i] for s in stats.values()) for i in range(5)]
    print(f"derived entries: {tot[0]}, read in all their forms: {tot[1]} ({tot[1] / tot[0]:.1%})")
    print(f"forms: {tot[3]}/{tot[2]} read ({tot[3] / tot[2]:.1%}), read first {tot[4]} ({tot[4] / tot[2]:.1%})")
    print(f"  {'suffix':20s} {'entries':>7s} {'all read':>8s} {'forms':>6s} {'read':>7s} {'first':>7s} missing")
    for name, (n, alln, f, r, fi) in sorted(stats.items(), key=lambda x: -(x[1][2] - x[1][3])):
        print(f"  {name:20s} {n:7d} {alln / n:8.1%} {f:6d} {r / f:7.1%} {fi / f:7.1%} {f - r:5d}")
        if args.fail:
            print("      ", " ".join(fails[name][: args.fail]))
        if args.beaten and beaten[name]:
            print("       beaten:", " | ".join(beaten[name][: args.beaten]))


if __name__ == "__main__":
    main()

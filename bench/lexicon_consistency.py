"""Lexicon consistency: listed words against what the grammar makes of the same word, cell by cell.

A lexicon entry that the grammar could also build gives two paradigms of one word, and where they
differ one of them is wrong: the entry's class or flags, or a rule. Two kinds are compared (no word
list is read; the lexicon alone is the input):

1. **Compounds** (grammars with a ``compound`` block): a listed noun or adjective written as a
   first part (a word of the lexicon in the nominative or genitive singular, or a compound form or
   bound part) followed by a listed last part of at least three letters. A compound inflects its
   last part only, so each case and number of the entry must be the first part followed by the last
   part's form (*pääosa* 9 gave *pääosoja*, *osa* gives *osia*: the entry needs the last part's type).
2. **Derivations**: a listed noun or adjective that the grammar also reads as a derived word of
   another lemma (*ajaminen* and *ajaa* + -minen, *tunnettu* and the participle of *tuntea*): each
   case and number of the entry against the same cell of the derivation.

Only a cell where both sides give forms and the first form of one side is not among the other's is
reported; the report groups entries by their lexicon file. Splits into a first and last part are
guessed from spelling and may be false (*palaveri* is not *pala* + *veri*): read each line.

    python bench/lexicon_consistency.py --lang fin            # both sections, about 5 minutes
    python bench/lexicon_consistency.py --lang fin --only compounds
"""

from __future__ import annotations

import argparse
import sys
from collections.abc import Iterator
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import find_grammar  # noqa: E402
from morphfst.tables.paradigm import Bound, CellFiller  # noqa: E402

FIRST_PART_ENDINGS = (";SG;NOM", ";SG;GEN", ";CPD")  # readings of a word that may begin a compound
MIN_LAST = 3  # letters of a last part at least (shorter tails split words at random)


def entries(lang: morphfst.Language) -> Iterator[tuple[str, str, str, str]]:
    """(file name, lemma, class, part of speech) of every lower-case noun and adjective without a hyphen."""
    for e in lang.lexicon:
        lemma, pos = e["lemma"], e["pos"]
        if pos in ("N", "ADJ") and lemma.islower() and "-" not in lemma:
            yield Path(e["file"]).name, lemma, e["class"], pos


def case_cells(lang: morphfst.Language, pos: str, sample: str, klass: str) -> list[str]:
    """The case and number cells (no possessor) of a part of speech, from a sample word's table."""
    filler = CellFiller(lang)
    cells = filler.fill(sample, filler.shape([klass], pos, Bound(layout_only=True)))
    return [c.features.split(";", 1)[1] for c in cells if "PSS" not in c.features]


def first_forms(lang: morphfst.Language, lemma: str, features: str) -> list[str]:
    return [f.form for f in lang.generate(lemma, features)]


def compound_split(lang: morphfst.Language, lemma: str) -> tuple[str, str] | None:
    """(first part, last part) of a listed word spelt as a possible compound, the longest last part first."""
    for i in range(MIN_LAST, len(lemma) - MIN_LAST + 1):
        head, tail = lemma[:i], lemma[i:]
        if not lang.entries(tail):
            continue
        if any(r.text.endswith(FIRST_PART_ENDINGS) and r.lemma == head or r.text.endswith(";CPD") for r in lang.analyze(head)):
            return head, tail
    return None


def compare_compounds(lang: morphfst.Language, cells: dict[str, list[str]]) -> tuple[int, list[str]]:
    """Listed compounds against their first part + the last part's forms (see the module documentation)."""
    seen, lines = 0, []
    for fname, lemma, klass, pos in entries(lang):
        split = compound_split(lang, lemma)
        if split is None:
            continue
        seen += 1
        head, tail = split
        for cell in cells[pos]:
            want = first_forms(lang, lemma, f"{pos};{cell}")
            got = [head + f for f in first_forms(lang, tail, f"{pos};{cell}") or first_forms(lang, tail, f"N;{cell}")]
            if want and got and want[0] not in got:
                lines.append(f"{fname}\t{lemma}\t{klass}\t{head}+{tail}\t{cell}\t{'/'.join(want[:2])}\t{'/'.join(got[:2])}")
                break
    return seen, lines


def compare_derivations(lang: morphfst.Language, cells: dict[str, list[str]]) -> tuple[int, list[str]]:
    """Listed nouns and adjectives against a derivation of another lemma spelt alike."""
    seen, lines = 0, []
    for fname, lemma, klass, pos in entries(lang):
        tail = f";{pos};SG;NOM"
        derived = [
            (r.lemma, r.text.split(" ", 1)[1][: -len("SG;NOM")])
            for r in lang.analyze(lemma)
            if r.lemma != lemma and r.lemma.islower() and r.text.endswith(tail) and ";CPD" not in r.text
        ]
        if not derived:
            continue
        seen += 1
        base, prefix = derived[0]
        for cell in cells[pos]:
            want = first_forms(lang, lemma, f"{pos};{cell}")
            got = first_forms(lang, base, prefix + cell)
            if want and got and want[0] != got[0]:
                lines.append(
                    f"{fname}\t{lemma}\t{klass}\t{base} {prefix.rstrip(';')}\t{cell}\t{'/'.join(want[:2])}\t{'/'.join(got[:2])}"
                )
                break
    return seen, lines


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--lang", default="fin", help="a shipped language (default fin)")
    ap.add_argument("--only", choices=["compounds", "derivations"], help="run one section")
    args = ap.parse_args(argv)
    lang = morphfst.load(find_grammar(args.lang))
    samples = {"fin": {"N": ("talo", "1"), "ADJ": ("iso", "1")}, "tur": {"N": ("ev", "noun"), "ADJ": ("büyük", "adj")}}
    sample = samples.get(args.lang, samples["fin"])
    cells = {pos: case_cells(lang, pos, word, klass) for pos, (word, klass) in sample.items()}
    header = "file\tlemma\tclass\tcompared with\tfirst cell that differs\tlisted\tcompared"
    sections = []
    if args.only in (None, "compounds") and lang.meta.get("compounds"):
        sections.append(("compounds", compare_compounds))
    if args.only in (None, "derivations"):
        sections.append(("derivations", compare_derivations))
    for name, compare in sections:
        seen, lines = compare(lang, cells)
        print(f"# {name}: {seen} listed words compared, {len(lines)} differ")
        print(header)
        print("\n".join(lines))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

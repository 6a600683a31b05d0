"""Guess report: how well the guesser reads words, measured on words the lexicon knows.

Takes words of the wordfreq list, ranks 1 to 20,000 only (the development range; higher ranks are kept
for evaluation and are never read here), that the shipped grammar analyzes (proper names, foreign words, words
of fewer than four letters and hyphenated words left out), guesses each as if the lexicon did not know
it, and compares the first guess with the lexicon's best analysis. Prints the share of words with a
guess at all, with the lexicon's segmentation, and with its lemma and part of speech, overall and by
the lexicon's part of speech; and, for the names among the words, written with a capital as in text,
the share whose first guess is a name of the lexicon's lemma. A word with no guess counts as a miss. This is what the guesser's
weights (``compile/compiler.py``: ``GUESS_STEM_WEIGHT``) and the grammars' guess classes were
chosen by.

    python bench/guess_report.py --lang tur
    python bench/guess_report.py --lang fin --words 4000 --examples 20

Needs the bench extra (``pip install -e '.[bench]'``: wordfreq).
"""

from __future__ import annotations

import argparse
import random
import sys
from collections import Counter
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402

DEV_RANKS = 20_000  # wordfreq ranks past this are evaluation data: never read here
WORDFREQ_CODES = {"tur": "tr", "fin": "fi"}
# left out: proper names, and foreign words (part of speech X, lexicons/LANG/foreign.tsv), which no
# guess class reads
NAME_POS = "PROPN"
LEFT_OUT = {NAME_POS, "X"}


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--lang", default="tur", help="shipped language (tur or fin) or a grammar file with --code")
    ap.add_argument("--code", default="", help="wordfreq language code when --lang is a grammar file")
    ap.add_argument("--words", type=int, default=4000, help="words of the shuffled list to try (default 4000)")
    ap.add_argument("--examples", type=int, default=0, help="print this many words whose first guess differs")
    ap.add_argument("--seed", type=int, default=5, help="shuffle seed (default 5)")
    args = ap.parse_args(argv)
    from wordfreq import top_n_list

    code = args.code or WORDFREQ_CODES[args.lang]
    lang = morphfst.load(args.lang)
    words = top_n_list(code, DEV_RANKS)
    random.Random(args.seed).shuffle(words)
    tried = guessed = same_seg = same_lemma = 0
    names = names_right = 0  # names of the lexicon, written with a capital, guessed as unknown
    by_pos: Counter[str] = Counter()
    right_by_pos: Counter[str] = Counter()
    wrong: list[str] = []
    for word in words[: args.words]:
        known = lang.analyze(word)
        if known and known[0].pos == NAME_POS and len(word) >= 4 and "-" not in word:
            # the list is lower-cased: the name as written in text, its guesses against the lexicon's
            names += 1
            written = word[:1].upper() + word[1:]
            named = lang.guess(written)
            lemma = next((a.lemma for a in lang.analyze(written) if a.pos == NAME_POS), "")
            names_right += bool(named) and (named[0].pos, named[0].lemma) == (NAME_POS, lemma)
        if not known or known[0].pos in LEFT_OUT or len(word) < 4 or "-" in word:
            continue
        tried += 1
        best = known[0]
        by_pos[best.pos] += 1
        guesses = lang.guess(word)
        if not guesses:
            continue
        guessed += 1
        first = guesses[0]
        if first.segmentation == best.segmentation:
            same_seg += 1
            right_by_pos[best.pos] += 1
        elif len(wrong) < args.examples:
            wrong.append(f"  {word:<20} lexicon {best.segmentation} ({best.text}); guess {first.segmentation} ({first.text})")
        same_lemma += (first.lemma, first.pos) == (best.lemma, best.pos)
    if not tried:
        print("no known words in the sample")
        return 1
    print(f"{lang.name}: {tried:,} known words of wordfreq ranks 1-{DEV_RANKS:,} guessed as if unknown")
    print(f"  with a guess                      {guessed / tried:6.1%}")
    print(f"  first guess, same segmentation    {same_seg / tried:6.1%}")
    print(f"  first guess, same lemma and POS   {same_lemma / tried:6.1%}")
    if names:
        print(
            f"  names written with a capital      {names:,}: first guess a name of the lexicon's lemma {names_right / names:6.1%}"
        )
    print("  same segmentation by the lexicon's part of speech:")
    for pos, n in by_pos.most_common(8):
        print(f"    {pos:<6} {right_by_pos[pos]:>5} of {n:>5}  {right_by_pos[pos] / n:6.1%}")
    if wrong:
        print("  first guesses that differ:")
        print("\n".join(wrong))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

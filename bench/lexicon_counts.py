"""Lexicon counts from a word list: give each lexicon entry the summed frequency of the words it analyzes.

Each word of the wordfreq list (ranks 1 to 20,000 only; higher ranks are kept for evaluation and are
never read) is analyzed without the guesser; its frequency (per billion words) is shared equally by
the lemmas (lemma and part of speech) of its best-weighted analyses, or, when the word is itself a
postposition or adverb of the lexicon (or only a conjunction), by those readings, and when it is
the citation form of other lexicon entries, by the best of those (see :func:`_bare_readings`). The totals are written into the
``count`` column of the language's lexicon files, which the compiler turns into tropical weights
``-ln(count / total)``: frequent lemmas then rank first among competing analyses. An entry whose words
are not in the list gets half the smallest count seen (simple smoothing), so that a rare lexicon word
still ranks above a derivation from a frequent stem that spells it.

Run it twice: the first pass ranks readings without counts, the second with the first pass's counts.

    python bench/lexicon_counts.py --lang fin           # prints the 30 most frequent lemmas, writes nothing
    python bench/lexicon_counts.py --lang tur --write   # rewrites lexicons/tur/*.tsv in place
"""

from __future__ import annotations

import argparse
import collections
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import find_grammar  # noqa: E402
from morphfst.language.lexicon import lexicon_files  # noqa: E402
from morphfst.language.syntax import parse_grammar_file  # noqa: E402

DEV_RANKS = 20_000
INVARIABLE = {"ADP", "CONJ", "ADV"}  # parts of speech whose word is its only form
CARRIERS = {"ADP", "ADV"}  # a word that is one of these counts for its bare readings
NAMES = {"PROPN"}  # the word list is lowercased: a bare name reading (doğan, yaşar) is no evidence
WORDFREQ_CODES = {"tur": "tr", "fin": "fi"}


def lemma_counts(lang: morphfst.Language, code: str) -> collections.Counter[tuple[str, str]]:
    from wordfreq import top_n_list, word_frequency

    counts: collections.Counter[tuple[str, str]] = collections.Counter()
    for word in top_n_list(code, DEV_RANKS):
        analyses = lang.fast.analyze(word, cased=False)  # the list is lower-cased: a name is no rarer for it
        if not analyses:
            continue
        best = analyses[0].weight
        lemmas = _bare_readings(word, analyses) or {(a.lemma, a.pos) for a in analyses if abs(a.weight - best) < 1e-6}
        share = word_frequency(word, code) * 1e9 / len(lemmas)
        for key in lemmas:
            counts[key] += share
    return counts


def _bare_readings(word: str, analyses: list[morphfst.Analysis]) -> set[tuple[str, str]]:
    """When ``word`` is itself a postposition or adverb of the lexicon (or only a conjunction), the
    lexicon words it is the bare form of (lemma spelt like it, no affix with a form) that take its
    frequency. Without this the first pass gives için to iç's genitive and en to the noun 'width',
    and the counts then keep them there. An adjective spelt like the adverb shares it (an adjective
    is used as an adverb unchanged: doğru, başka); a noun or pronoun does not (sonra, çok, en); a
    conjunction only when every bare reading is invariable (de; not ne, a pronoun first). Any other
    word that is the citation form of lexicon entries (a noun's nominative, a verb's infinitive)
    counts for the best-weighted of them, not for a form of another word spelt alike: without it
    var went to varmak's imperative, kaç to kaçmak's, çalışma to the verbal noun, and such entries
    kept the smallest count for good. Proper names are left out (the list is lowercased)."""
    readings = [a for a in analyses if a.lemma.lower() == word.lower() and not any(m.form for m in a.morphs[1:])]
    bare = {(a.lemma, a.pos) for a in readings}
    kinds = {pos for _, pos in bare}
    if kinds & CARRIERS:
        return {(lemma, pos) for lemma, pos in bare if pos in CARRIERS | {"ADJ"} or (pos == "CONJ" and kinds <= INVARIABLE)}
    if kinds and kinds <= INVARIABLE:
        return bare
    # a lexicon word's citation form (a noun's nominative, a verb's infinitive) counts for it
    common = [a for a in analyses if a.lemma.lower() == word.lower() and a.pos not in NAMES]
    if common:
        best = min(a.weight for a in common)
        return {(a.lemma, a.pos) for a in common if abs(a.weight - best) < 1e-6}
    return set()


def rewrite(path: Path, counts: collections.Counter[tuple[str, str]], floor: int) -> int:
    """Write the counts into one lexicon file (adding a count column if it has none); returns entries counted."""
    lines = path.read_text(encoding="utf-8").splitlines()
    header_index = next(i for i, line in enumerate(lines) if line.strip() and not line.lstrip().startswith("#"))
    header = lines[header_index].split("\t")
    if "count" not in header:
        header.append("count")
        lines[header_index] = "\t".join(header)
    col = header.index("count")
    lemma_col, pos_col = header.index("lemma"), header.index("pos")
    counted = 0
    for i in range(header_index + 1, len(lines)):
        line = lines[i]
        if not line.strip() or line.lstrip().startswith("#"):
            continue
        fields = line.split("\t")
        fields += [""] * (len(header) - len(fields))
        total = counts.get((fields[lemma_col], fields[pos_col]), 0.0)
        fields[col] = str(max(floor, round(total))) if total >= floor else str(floor)
        counted += total >= floor
        lines[i] = "\t".join(fields)
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return counted


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    ap.add_argument("--lang", default="tur", help="shipped language name (default tur)")
    ap.add_argument("--write", action="store_true", help="rewrite the count column of the lexicon files in place")
    ap.add_argument("--dry-run", action="store_true", help="print the most frequent lemmas, write nothing (the default)")
    args = ap.parse_args(argv)
    grammar_path = find_grammar(args.lang)
    lang = morphfst.load(grammar_path)
    counts = lemma_counts(lang, WORDFREQ_CODES.get(lang.name, lang.name))
    if args.dry_run or not args.write:
        for (lemma, pos), n in counts.most_common(30):
            print(f"{lemma}\t{pos}\t{n:,.0f}")
        return 0
    floor = max(1, round(min(n for n in counts.values() if n > 0) / 2))
    for path in lexicon_files(parse_grammar_file(grammar_path)):
        print(f"{path.name}: {rewrite(path, counts, floor):,} entries counted (others: {floor})")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

"""Foreign (English) words for a language's lexicon: ``lexicons/LANG/foreign.tsv``.

Turkish and Finnish text on the web quotes English words as they stand (titles, brands, slang,
technical terms: *show*, *weekend*, *online*). Without entries they are unanalyzed, or the guesser gives
them a made-up native segmentation. This script lists the most frequent English words of the wordfreq
list (``--top``, default 10,000: within the development ranks 1-20,000, the only ranks ever read) that
the language's grammar reads in no other way, as words of the class ``foreign`` (part of speech ``X``,
as Universal Dependencies tags foreign words: common practice), uninflected. Each entry has the
smallest count of the language's other lexicon files and the weight ``WEIGHT``, so that a foreign
reading comes after every native one should a later entry spell the same word.

Kept: words of ASCII letters only, of three letters or more, or one of the English two-letter words
in ``TWO_LETTER`` (the list's other two-letter items are mostly fragments and foreign particles:
la, de, el), and not the few words :func:`left_out` names. Names among them (john, london) are read as
foreign words, not as names.

Run it again after the native lexicon grows (it rewrites the file; words the grammar now reads by
itself drop out):

    python bench/foreign_words.py --lang tur
    python bench/foreign_words.py --lang fin --dry-run   # counts only
"""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import morphfst  # noqa: E402
from morphfst.build import find_grammar  # noqa: E402
from morphfst.language.lexicon import lexicon_files  # noqa: E402
from morphfst.language.syntax import parse_grammar_file  # noqa: E402

DEV_RANKS = 20_000  # wordfreq ranks past this are kept for evaluation and never read
CLASS = "foreign"
POS = "X"
WEIGHT = 10.0  # about ln 22,000: after any native reading
# English words of two letters (from memory); the list's other two-letter items are left out
TWO_LETTER = frozenset("am an as at be by do go he if in is it me my no of oh ok on or so to up us we".split())
# Left out by choice: a few English words of meetings and teaching, which these lexicons do not need:
# these words, and the word families that begin with LEFT_OUT_STARTS (the noun, its plural, the verb)
LEFT_OUT_WORDS = frozenset(
    "class classes conference course courses discourse keynote seminar seminars speaker speakers "
    "speech talk talked talking talks ted tutorial tutorials webinar".split()
)
LEFT_OUT_STARTS = ("lectur", "transcri")


def left_out(word: str) -> bool:
    """Whether ``word`` is one of the words this script leaves out by choice."""
    return word in LEFT_OUT_WORDS or word.startswith(LEFT_OUT_STARTS)


HEADER = """\
# Foreign (English) words quoted in running text, uninflected, read as part of speech X after every
# native reading. Written by bench/foreign_words.py from the wordfreq English list (ranks 1-{top:,},
# development ranks only): the words of ASCII letters (three or more, or an English two-letter word)
# that the grammar reads in no other way. Do not edit by hand: run the script again.
lemma\tclass\tpos\tgloss\tcount\tweight
"""


def _floor_count(lexicon_dir: Path, own: Path) -> int:
    """The smallest count in the language's other lexicon files (1 when none has one)."""
    counts: list[int] = []
    for path in sorted(lexicon_dir.glob("*.tsv")):
        if path == own:
            continue
        header: list[str] | None = None
        for line in path.read_text(encoding="utf-8").splitlines():
            if not line.strip() or line.startswith("#"):
                continue
            fields = line.split("\t")
            if header is None:
                header = [f.strip().lower() for f in fields]
                continue
            if "count" in header and header.index("count") < len(fields):
                value = fields[header.index("count")].strip()
                if value.isdigit() and int(value) > 0:
                    counts.append(int(value))
    return min(counts, default=1)


def candidates(top: int) -> list[str]:
    """English words of the wordfreq list's first ``top`` ranks that this script keeps."""
    from wordfreq import top_n_list

    if top > DEV_RANKS:
        raise SystemExit(f"--top {top}: only the development ranks 1-{DEV_RANKS:,} may be read")
    words = []
    for word in top_n_list("en", top):
        if not (word.isascii() and word.isalpha() and word.islower()):
            continue
        if (len(word) >= 3 or word in TWO_LETTER) and not left_out(word):
            words.append(word)
    return words


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--lang", required=True, help="shipped language (tur, fin)")
    parser.add_argument("--top", type=int, default=10_000, help="English ranks read (at most 20,000)")
    parser.add_argument("--dry-run", action="store_true", help="print the counts, write nothing")
    args = parser.parse_args(argv)

    grammar_path = find_grammar(args.lang)
    files = lexicon_files(parse_grammar_file(grammar_path))
    lexicon_dir = files[0].parent if files else ROOT / "lexicons" / args.lang
    out = lexicon_dir / "foreign.tsv"
    lang = morphfst.load(grammar_path)
    words = candidates(args.top)
    # a word some native reading takes needs no foreign entry (its X reading, from an earlier run, aside)
    kept = [w for w in words if not any(a.pos != POS for a in lang.fast.analyze(w, cased=False))]
    count = _floor_count(lexicon_dir, out)
    print(f"{args.lang}: {len(words):,} English words considered, {len(words) - len(kept):,} read natively, {len(kept):,} kept")
    if args.dry_run:
        return 0
    rows = "".join(f"{w}\t{CLASS}\t{POS}\t{w}\t{count}\t{WEIGHT:g}\n" for w in sorted(kept))
    out.write_text(HEADER.format(top=args.top) + rows, encoding="utf-8")
    print(f"wrote {out}")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())

"""Tokenization for corpora: the pieces rebuild the text exactly; words, numbers and joiners."""

from __future__ import annotations

import re
import unicodedata

from hypothesis import given, settings
from hypothesis import strategies as st

from morphfst.language.normalize import INVISIBLE, Normalization, make_normalizer
from morphfst.runtime.tokenize import EDGE_PUNCTUATION, ZERO_WIDTH_JOINERS, Tokenizer, split_line

TOK = Tokenizer(("'", "’"))

# Characters that exercise every branch: letters (with Turkish and Finnish ones), digits, joiners,
# punctuation, white space of several kinds, control characters and a combining mark.
ALPHABET = "aeıioöuükltrsşçğäAİIEKVX019'’-:.,!?… \t\u00a0\x00\x1f\u0307\u00ad_()\"«»"


@settings(max_examples=300, deadline=None)
@given(st.text(alphabet=ALPHABET, max_size=60))
def test_pieces_rebuild_the_line(line: str) -> None:
    pieces = TOK.pieces(line)
    assert "".join(p.text for p in pieces) == line
    assert all(p.text for p in pieces)
    assert [p.text for p in pieces if p.is_token] == TOK.tokens(line)
    assert [(p.start, p.text) for p in pieces if p.is_token] == TOK.spans(line)
    offsets = [p.start for p in pieces]
    assert offsets == sorted(offsets)


@settings(max_examples=100, deadline=None)
@given(st.lists(st.text(alphabet=ALPHABET, max_size=30), min_size=1, max_size=6))
def test_tokens_and_newlines_agree_with_lines(lines: list[str]) -> None:
    text = "\n".join(lines) + "\n"
    items = TOK.tokens_and_newlines(text)
    per_line: list[list[str]] = [[]]
    for item in items:
        if item == "\n":
            per_line.append([])
        else:
            per_line[-1].append(item)
    assert per_line[:-1] == [TOK.tokens(line) for line in lines]


def test_suffixes_after_apostrophes_colons_and_digits_stay_in_the_token() -> None:
    # Turkish writes case suffixes after an apostrophe on proper names and numbers, and after a
    # colon on abbreviations (common practice in Turkish orthography).
    line = "Ankara'da 2023'te TRT:nin haberine göre saat 10:30'da Ankara’dan"
    assert TOK.tokens(line) == ["Ankara'da", "2023'te", "TRT:nin", "haberine", "göre", "saat", "10:30'da", "Ankara’dan"]


def test_hyphens_decimals_and_separators() -> None:
    line = "sarı-kırmızı e-posta 3.5 ve 1,000... 'alıntı' not:bu -- x_y"
    pieces = TOK.pieces(line)
    assert [p.text for p in pieces if p.is_token] == [
        "sarı-kırmızı",
        "e-posta",
        "3.5",
        "ve",
        "1,000",
        "alıntı",
        "not",
        "bu",
        "x",
        "y",
    ]
    assert "..." in [p.text for p in pieces if p.kind == "punct"]  # a run of one punctuation character is one piece
    assert ":" in [p.text for p in pieces if p.kind == "punct"]  # a colon after a lower-case word separates


def test_the_grammar_apostrophes_are_used() -> None:
    # U+2019 is punctuation: it joins a suffix only when the grammar lists it as an apostrophe.
    assert Tokenizer(("'",)).tokens("Ankara’da") == ["Ankara", "da"]
    assert Tokenizer(("’",)).tokens("Ankara’da") == ["Ankara’da"]
    assert Tokenizer(("’",)).tokens("Ankara'da") == ["Ankara", "da"]


def test_split_helpers() -> None:
    assert TOK.split_joiner("2023'te") == ("2023", "te")
    assert TOK.split_joiner("trt:nin") == ("trt", "nin")
    assert TOK.split_joiner("evde") is None
    assert TOK.split_hyphen("sarı-kırmızı") == ("sarı-", "kırmızı")
    assert TOK.split_hyphen("ev") is None


def test_split_line_has_the_shape_of_the_simple_splitter() -> None:
    line = "Evlerde, kitaplar var."
    assert [t for t, w in split_line(line, TOK) if w] == ["Evlerde", "kitaplar", "var"]
    assert "".join(t for t, _ in split_line(line, TOK)) == line


def test_the_combining_mark_class_has_every_mark_of_the_unicode_database() -> None:
    # Unicode general category M (Mn, Mc, Me), as Python's unicodedata gives it (a published standard)
    import re
    import sys
    import unicodedata

    from morphfst.runtime.tokenize import combining_marks

    marks = re.compile(f"[{combining_marks()}]")
    every = [chr(cp) for cp in range(sys.maxunicode + 1) if unicodedata.category(chr(cp))[0] == "M"]
    assert every and all(marks.fullmatch(c) for c in every)
    assert not marks.search("aA9 -'\u4e00\U00020000")


def test_the_shipped_unicode_tables_are_those_of_this_pythons_unicode_database() -> None:
    # general categories M and Ll and str.isupper, as Python's unicodedata gives them (a published
    # standard, the Unicode Character Database): the shipped tables must equal a scan of the database
    from morphfst.runtime import tokenize, unicode_tables

    assert unicode_tables.tables() == unicode_tables.compute()
    lower = "".join(chr(cp) for cp in range(0x10000) if unicodedata.category(chr(cp)) == "Ll")
    assert tokenize._LOWER_CHARS == lower and "ş" in lower and "ä" in lower
    assert re.fullmatch(f"[{tokenize._UPPER}]+", "ŞÄÖIİ") and not re.search(f"[{tokenize._UPPER}]", "şäöıi9-")
    for version, texts in unicode_tables.SHIPPED.items():  # every entry reads as ordered, separate ranges
        for text in texts:
            spans = unicode_tables._read(text)
            assert all(a <= b < c - 1 for (a, b), (c, _) in zip(spans, spans[1:])) and spans[-1][0] <= spans[-1][1], version


# The fast path of tokens() and tokens_and_newlines() cuts at white space and strips edge punctuation
# before it falls back to the regular expression: it must give exactly what the expression gives.
FAST_PATH_ALPHABET = (
    ALPHABET
    + EDGE_PUNCTUATION
    + ZERO_WIDTH_JOINERS
    + INVISIBLE
    + "\u02bc\u0301\u093f\u0915\n\r\x0b\x0c\x1c\x85\u2028\u200b\u3000²½٣%€§:"
)


@settings(max_examples=400, deadline=None)
@given(st.text(alphabet=FAST_PATH_ALPHABET, max_size=80))
def test_fast_tokens_are_the_regular_expression_tokens(text: str) -> None:
    assert TOK.tokens_and_newlines(text) == TOK.word_or_newline_re.findall(text)
    for line in text.split("\n"):
        assert TOK.tokens(line) == TOK.word_re.findall(line)


def test_edge_punctuation_joins_nothing() -> None:
    """No edge character is a letter, digit, combining mark or zero-width joiner (the condition under
    which stripping it from a piece's edges leaves the tokens unchanged)."""
    for ch in EDGE_PUNCTUATION:
        assert not ch.isalnum() and not ch.isspace(), repr(ch)
        assert unicodedata.category(ch)[0] != "M" and ch not in ZERO_WIDTH_JOINERS + INVISIBLE, repr(ch)


def test_invisible_format_characters_stay_inside_a_word_and_are_dropped_by_normalization() -> None:
    # Soft hyphens (hyphenation hints left in web text), word joiners and zero-width no-break spaces
    # do not break a word (Unicode UAX #29, rule WB4); a zero-width space does (common practice)
    line = "lasten\u00adtarhassa kou\u2060lu\ufeffun ja\u200bsitten tar\u00ad"
    assert TOK.tokens(line) == ["lasten\u00adtarhassa", "kou\u2060lu\ufeffun", "ja", "sitten", "tar\u00ad"]
    normalize = make_normalizer(Normalization(maps=[("I", "ı")], apostrophes=["'", "’"]))
    assert [normalize(t) for t in TOK.tokens(line)] == ["lastentarhassa", "kouluun", "ja", "sitten", "tar"]
    assert normalize("Ev\u00adler\u00adde") == normalize("Evlerde") == "evlerde"
    assert normalize("IRMAK’ta") == "ırmak'ta"


@settings(max_examples=300, deadline=None)
@given(st.text(alphabet=FAST_PATH_ALPHABET, max_size=120))
def test_distinct_tokens_are_the_tokens_in_first_seen_order(text: str) -> None:
    # what a Dask partition's survey lists: every distinct token, each distinct piece read once
    every = TOK.word_or_newline_re.findall(text)
    assert TOK.distinct_tokens(text) == [t for t in dict.fromkeys(every) if t != "\n"]


def test_distinct_tokens_of_repeated_pieces() -> None:
    text = "Evde, evde ev. Evde!\nev (evde) Ankara'da Ankara'da"
    assert TOK.distinct_tokens(text) == ["Evde", "evde", "ev", "Ankara'da"]


def test_an_ordinals_period_before_a_lower_case_letter_stays_in_the_token() -> None:
    # common practice (Turkish and Finnish spelling): an ordinal in digits or Roman numerals is written
    # with a period (23. madde, 3. sınıf, XX. yüzyıl, II. Dünya Savaşı, 3. luokka); the period before
    # an upper-case letter or at the line's end is the end of a sentence
    assert TOK.tokens("23. madde ve 3. sınıf") == ["23.", "madde", "ve", "3.", "sınıf"]
    assert TOK.tokens("XX. yüzyıl, XIX.\tyüzyılda, IV. Murat") == ["XX.", "yüzyıl", "XIX.", "yüzyılda", "IV", "Murat"]
    assert TOK.tokens("3. luokka ja 1.000. kerta") == ["3.", "luokka", "ja", "1.000", "kerta"]
    assert TOK.tokens("yıl 2023. Sonra geldi 1990.") == ["yıl", "2023", "Sonra", "geldi", "1990"]
    # not after a word, a decimal or an ill-formed numeral, not before a digit or a line end
    line = "Dr. ayşe a23. madde 3.5. madde IIII. yüzyıl XL. beden 3. 4. kat"
    assert TOK.tokens(line) == "Dr ayşe a23 madde 3.5 madde IIII yüzyıl XL beden 3 4. kat".split()
    assert TOK.tokens_and_newlines("23.\nmadde") == ["23", "\n", "madde"]
    assert TOK.distinct_tokens("23. madde 23. Madde\n23.\n(23. madde)") == ["23.", "madde", "23", "Madde"]
    pieces = TOK.pieces("bkz. 3. sınıf.")
    assert [p.text for p in pieces] == ["bkz", ".", " ", "3.", " ", "sınıf", "."]
    assert [p.kind for p in pieces] == ["word", "punct", "space", "word", "space", "word", "punct"]


# pieces around an ordinal's period: numbers, words, letters of either case, white space, line ends
ORDINAL_PARTS = ["23.", "XX.", "IV.", "3.5.", "a.", "(3.", "madde", "Madde", "ü", "Ü", "x", "\n", " ", "  ", "\t", ".", "1"]


@settings(max_examples=300, deadline=None)
@given(st.lists(st.sampled_from(ORDINAL_PARTS), max_size=20))
def test_ordinal_periods_fast_and_regular_expression_agree(parts: list[str]) -> None:
    # the fast path looks at the next piece after a period; the expression's look-ahead does the same
    text = "".join(parts)
    assert TOK.tokens_and_newlines(text) == TOK.word_or_newline_re.findall(text)
    every = TOK.word_or_newline_re.findall(text)
    assert TOK.distinct_tokens(text) == [t for t in dict.fromkeys(every) if t != "\n"]


def test_a_signs_ending_after_a_colon_is_one_token_with_the_sign() -> None:
    # Finnish spelling (common practice): an ending after a sign is joined with a colon, the sign read
    # as the word it stands for (5 %:n 'of 5 percent', 20 €:lla, 3 §:ssä); a bare sign is a separator
    line = "kasvu oli 5 %:n luokkaa, 20 €:lla ja 3 §:ssä; 5% ja 5%:n, %: ja :n"
    assert TOK.tokens(line) == [
        "kasvu",
        "oli",
        "5",
        "%:n",
        "luokkaa",
        "20",
        "€:lla",
        "ja",
        "3",
        "§:ssä",
        "5",
        "ja",
        "5",
        "%:n",
        "ja",
        "n",
    ]
    assert TOK.tokens(line) == TOK.word_re.findall(line)
    assert [p.text for p in TOK.pieces("5 %:n")] == ["5", " ", "%:n"]

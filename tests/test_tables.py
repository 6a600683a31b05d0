"""Inflection tables: paradigms from the generator, layouts, output formats, the table command.

Turkish and Finnish tables are compared with handbook paradigms; the source is named beside each
check, and forms written from memory are marked so. Mechanism checks (layouts, variants, bounds,
formats) use the invented grammar in tabletoy.py.
"""

from __future__ import annotations

import csv
import io
import json
import xml.etree.ElementTree as ET
from html.parser import HTMLParser
from pathlib import Path

import pytest
from tabletoy import write_table_toy

import morphfst
from morphfst.cli import main
from morphfst.errors import UserError
from morphfst.tables.layout import Arranged, arrange, default_layout, layout_override, paradigm_data
from morphfst.tables.paradigm import Paradigm, cell_templates, make_bound, paradigms, trial_paradigm
from morphfst.tables.table_formats import display_width, render, render_text

ROOT = Path(__file__).resolve().parent.parent


@pytest.fixture(scope="module")
def toy(tmp_path_factory: pytest.TempPathFactory) -> morphfst.Language:
    return morphfst.load(write_table_toy(tmp_path_factory.mktemp("tabletoy")))


def forms_by_features(p: Paradigm) -> dict[str, list[str]]:
    return {c.features: [v.form for v in c.forms] for c in p.cells}


def preferred(p: Paradigm, features: str) -> str:
    cells = [c for c in p.cells if c.features == features]
    assert cells, f"no cell {features}"
    return cells[0].forms[0].form if cells[0].forms else ""


def only(lang: morphfst.Language, lemma: str, pos: str | None = None, depth: int = 0, layout_only: bool = True) -> Paradigm:
    found = paradigms(lang, lemma, make_bound(lang, depth, layout_only=layout_only), pos)
    assert len(found) == 1
    return found[0]


def only_with(lang: morphfst.Language, lemma: str, pos: str, labels: list[str]) -> Paradigm:
    """The cells carrying ``labels``, beyond the layout's dimensions (clitics left out to keep it small)."""
    clitics = [c for c in ("KO", "PA", "HAN", "KIN", "KAAN", "S", "KA") if c in lang.labels()]
    (found,) = paradigms(lang, lemma, make_bound(lang, 0, require=labels, exclude=clitics, layout_only=False), pos)
    return found


def grid_of(a: Arranged, title: str, section: int = 0):  # type: ignore[no-untyped-def]
    for grid in a.sections[section].grids:
        if grid.title == title:
            return grid
    raise AssertionError(f"no grid {title!r}: " + ", ".join(g.title for g in a.sections[section].grids))


# ---------------------------------------------------------------------------------------------
# Turkish against handbook paradigms

# Göksel, A. & Kerslake, C. (2005), Turkish: A Comprehensive Grammar, Routledge, ch. 8 (nominal
# inflection: plural -lAr, possessive and case suffixes) and ch. 2 (vowel harmony, consonant
# alternation). The forms below were written from memory of those tables.
TUR_EV = {
    "N;SG;NOM": "ev",
    "N;SG;ACC": "evi",
    "N;SG;DAT": "eve",
    "N;SG;LOC": "evde",
    "N;SG;ABL": "evden",
    "N;SG;GEN": "evin",
    "N;SG;INS": "evle",
    "N;PL;NOM": "evler",
    "N;PL;ACC": "evleri",
    "N;PL;DAT": "evlere",
    "N;PL;LOC": "evlerde",
    "N;PL;ABL": "evlerden",
    "N;PL;GEN": "evlerin",
    "N;PL;INS": "evlerle",
    "N;SG;PSS1S;NOM": "evim",
    "N;SG;PSS2S;NOM": "evin",
    "N;SG;PSS3S;NOM": "evi",
    "N;SG;PSS1P;NOM": "evimiz",
    "N;SG;PSS2P;NOM": "eviniz",
    "N;SG;PSS3P;NOM": "evleri",
    "N;SG;PSS3S;ACC": "evini",
    "N;SG;PSS3S;DAT": "evine",
    "N;SG;PSS3S;LOC": "evinde",
    "N;SG;PSS3S;ABL": "evinden",
    "N;PL;PSS1S;LOC": "evlerimde",
}
# Same source, from memory: back-vowel stem (oda), final-stop voicing (kitap, ağaç), round harmony (göz).
TUR_OTHERS = {
    ("oda", "N;SG;DAT"): "odaya",
    ("oda", "N;SG;ACC"): "odayı",
    ("oda", "N;PL;LOC"): "odalarda",
    ("oda", "N;SG;PSS3S;NOM"): "odası",
    ("oda", "N;SG;PSS3S;LOC"): "odasında",
    ("kitap", "N;SG;ACC"): "kitabı",
    ("kitap", "N;SG;DAT"): "kitaba",
    ("kitap", "N;SG;LOC"): "kitapta",
    ("kitap", "N;SG;ABL"): "kitaptan",
    ("kitap", "N;SG;GEN"): "kitabın",
    ("kitap", "N;SG;PSS1S;NOM"): "kitabım",
    ("ağaç", "N;SG;ACC"): "ağacı",
    ("ağaç", "N;SG;LOC"): "ağaçta",
    ("göz", "N;SG;ACC"): "gözü",
    ("göz", "N;SG;PSS3S;ACC"): "gözünü",
    ("göz", "N;PL;NOM"): "gözler",
    ("kuzu", "N;SG;PSS1S;GEN"): "kuzumun",
    ("kuzu", "N;SG;PSS3S;NOM"): "kuzusu",
}


def test_turkish_noun_paradigm_matches_handbook(tur: morphfst.Language) -> None:
    ev = only(tur, "ev", "N")
    for features, form in TUR_EV.items():
        assert preferred(ev, features) == form, features
    for (lemma, features), form in TUR_OTHERS.items():
        assert preferred(only(tur, lemma, "N"), features) == form, (lemma, features)


def test_turkish_table_is_laid_out_like_a_grammar_book(tur: morphfst.Language) -> None:
    a = arrange(only(tur, "ev", "N"), tur.meta)
    base = grid_of(a, "no possessor")
    # Cases down, singular and plural across (Göksel & Kerslake 2005, ch. 8 tables; common practice).
    assert base.rows == ["nominative", "accusative", "dative", "locative", "ablative", "genitive", "instrumental", "equative"]
    assert base.columns == ["singular", "plural"]
    assert [[c.forms[0].form for c in row] for row in base.cells][:3] == [["ev", "evler"], ["evi", "evleri"], ["eve", "evlere"]]
    titles = [g.title for g in a.sections[0].grids]
    assert titles[0] == "no possessor" and len(titles) == 7


def test_unfilled_cells_stay_as_empty_cells(tmp_path: Path) -> None:
    from tabletoy import TABLE_TOY

    grammar = TABLE_TOY.replace("rules {", "constraints {\n  no_plural_locative: PL excludes LOC\n}\n\nrules {")
    lang = morphfst.load(write_table_toy(tmp_path, grammar))
    a = arrange(only(lang, "ka"), lang.meta)
    blocked = [c for g in a.sections[0].grids for row in g.cells for c in row if c is not None and not c.forms]
    assert blocked and all(c.template.blocked_by == ("no_plural_locative",) for c in blocked)  # shown, not dropped
    text = render_text([a], 80)
    assert f"{len(blocked)} of " in text and f"cells have no form (constraint no_plural_locative: {len(blocked)})" in text


def test_turkish_their_houses_cell_is_filled(tur: morphfst.Language) -> None:
    # evleri 'their houses': the plural is not written twice before -lArI (Göksel & Kerslake 2005, 14.1)
    a = arrange(only(tur, "ev", "N"), tur.meta)
    grid = grid_of(a, "possessor 3pl (their)")
    plural, singular = grid.columns.index("plural"), grid.columns.index("singular")
    assert [row[plural].forms[0].form for row in grid.cells][:3] == ["evleri", "evlerini", "evlerine"]  # type: ignore[union-attr]
    assert [row[singular].forms[0].form for row in grid.cells][:3] == ["evleri", "evlerini", "evlerine"]  # type: ignore[union-attr]
    assert "cells have no form" not in render_text([a], 80)


def test_turkish_numeral_and_kim_tables(tur: morphfst.Language) -> None:
    # a numeral is declined like a noun (dördü, dörde, dördüm; G&K ch. 15, from memory): cases by
    # number in seven possessor tables, without the associative plural, -gil or the copula's persons
    dort = only(tur, "dört", "NUM")
    assert len(dort.cells) == 8 * 2 * 7
    assert not [c for c in dort.cells if {"ASSOC", "FAM", "1", "2", "3"} & set(c.features.split(";"))]
    assert [preferred(dort, f) for f in ("NUM;SG;ACC", "NUM;SG;DAT", "NUM;SG;PSS1S;NOM")] == ["dördü", "dörde", "dördüm"]
    # kim: kiminle and the colloquial kimle in one instrumental row
    base = grid_of(arrange(only(tur, "kim", "PRO"), tur.meta), "no possessor")
    assert base.rows.count("instrumental") == 1
    row = base.cells[base.rows.index("instrumental")]
    assert [v.form for v in row[base.columns.index("singular")].forms] == ["kiminle", "kimle"]  # type: ignore[union-attr]


def test_turkish_verb_conjugation(tur: morphfst.Language) -> None:
    # Lewis, G. (2000), Turkish Grammar, 2nd ed., Oxford University Press, ch. VIII (the verb):
    # present progressive -Iyor, past -DI, future -(y)AcAk with personal endings; forms from memory.
    expected = {
        "V;PROG;1;SG": "geliyorum",
        "V;PROG;3;PL": "geliyorlar",
        "V;PST;1;SG": "geldim",
        "V;PST;1;PL": "geldik",
        "V;PST;2;PL": "geldiniz",
        "V;FUT;1;SG": "geleceğim",
        "V;FUT;3;SG": "gelecek",
        "V;NEG;PROG;1;SG": "gelmiyorum",
        "V;NEG;PST;3;SG": "gelmedi",
        "V;NEG;FUT;1;PL": "gelmeyeceğiz",
    }
    gel = only(tur, "gelmek", "V")
    for features, form in expected.items():
        assert preferred(gel, features) == form, features
    a = arrange(gel, tur.meta)
    grid = grid_of(a, "past (-DI)")
    assert grid.rows[0] == "1st singular" and grid.rows[-1] == "3rd plural"
    assert grid.columns == ["positive", "negative"]
    assert grid.cells[0][0] is not None and grid.cells[0][0].forms[0].form == "geldim"


def test_turkish_copulas_in_another_order_are_two_tables(tur: morphfst.Language) -> None:
    # -DIysA 'if (it is so that) I did' and -sAydI 'if I had (done)' carry the same two copulas in
    # the other order and mean different things (Lewis 2000, ch. VIII, the compound tenses; G&K
    # ch. 21 — from memory): two sub-tables titled in word order, not two variants of one cell.
    # The person and -DIr in another order stay variants of one cell (gelmişlerdi / gelmiştiler).
    a = arrange(only(tur, "gelmek", "V"), tur.meta)
    did = grid_of(a, "past (-DI), conditional (-sA)")
    had = grid_of(a, "conditional (-sA), past (-DI)")
    assert [f.form for f in did.cells[0][0].forms] == ["geldiysem"]  # type: ignore[union-attr]
    assert [f.form for f in had.cells[0][0].forms] == ["gelseydim"]  # type: ignore[union-attr]
    pluperfect = grid_of(a, "past (-DI), evidential (-mIş)")
    assert {f.form for f in pluperfect.cells[-1][0].forms} == {"gelmişlerdi", "gelmiştiler"}  # type: ignore[union-attr]
    # the stacked evidential and past + past are not generated: their cells are left empty
    stacked = grid_of(a, "NFH+NFH")
    assert all(c is None or not c.forms for row in stacked.cells for c in row)
    # the viewing formats leave such a sub-table out and name it under the table; the records keep it
    text = render_text([a], 80)
    assert "NFH+NFH\n" not in text and "NFH+NFH  " not in text
    assert "with no form at all not shown" in " ".join(text.split()) and "NFH+NFH" in text
    markdown = render([a], "markdown", "tur", "gelmek")
    assert "| positive | negative |" in markdown and "### NFH+NFH" not in markdown
    assert "<caption>NFH+NFH</caption>" not in render([a], "html", "tur", "gelmek")
    assert any(line.split("\t")[4] == "NFH+NFH" for line in render([a], "tsv", "tur", "gelmek").splitlines()[1:])


def test_word_not_in_the_lexicon_with_its_class(tur: morphfst.Language) -> None:
    # A made-up noun whose last vowel is front inflects like ev (Göksel & Kerslake 2005, ch. 8: regular
    # front harmony; common practice).
    p = trial_paradigm(tur, "zelem", "noun", bound=make_bound(tur))
    assert p.source == "command line" and any("not in the lexicon" in n for n in p.notes)
    assert preferred(p, "N;PL;LOC") == "zelemlerde"
    assert preferred(p, "N;SG;PSS3S;ACC") == "zelemini"
    # A verb's stem comes from its infinitive by the class's stem rules; a one-syllable root takes
    # the aorist -Ar: a made-up zapmak gives zaptım, zapıyor, zapar (Lewis 2000, ch. VIII; common practice).
    v = trial_paradigm(tur, "zapmak", "verb", bound=make_bound(tur))
    assert preferred(v, "V;PST;1;SG") == "zaptım" and preferred(v, "V;PROG;3;SG") == "zapıyor"
    assert preferred(v, "V;HAB;3;SG") == "zapar"


def test_trial_entry_mistakes_are_user_errors(tur: morphfst.Language) -> None:
    with pytest.raises(UserError, match="unknown class 'nuon'") as err:
        trial_paradigm(tur, "kalem", "nuon")
    assert "noun" in (err.value.hint or "")
    with pytest.raises(UserError, match="unknown flag"):
        trial_paradigm(tur, "kalem", "noun", flags=["no_such_flag"])
    with pytest.raises(UserError, match="not in the alphabet"):
        trial_paradigm(tur, "kalemx", "noun", stem="kal%m")


def test_proper_names_keep_their_capital(tur: morphfst.Language) -> None:
    # Göksel & Kerslake (2005), ch. 8, from memory: proper names take an apostrophe before a suffix.
    p = only(tur, "Ankara", "PROPN")
    assert preferred(p, "PROPN;SG;LOC") == "Ankara'da"
    assert preferred(p, "PROPN;SG;NOM") == "Ankara"


def test_plain_data_api(tur: morphfst.Language) -> None:
    data = paradigm_data(tur, "ev")
    assert isinstance(data, list) and data[0]["lemma"] == "ev"
    cells = {c["features"]: c for c in data[0]["cells"]}
    assert cells["N;PL;LOC"]["forms"][0]["form"] == "evlerde"
    json.dumps(data)  # plain data
    assert paradigm_data(tur, "kalem", klass="noun")[0]["source"] == "command line"
    laid_out = paradigm_data(tur, "ev", tables=True)[0]["sections"][0]["tables"][0]
    assert laid_out["title"] == "no possessor" and laid_out["rows"][3]["cells"][1]["forms"][0]["form"] == "evlerde"


# ---------------------------------------------------------------------------------------------
# Mechanism, on the invented grammar


def test_variants_are_kept_preferred_first(toy: morphfst.Language) -> None:
    ka = only(toy, "ka")
    cell = next(c for c in ka.cells if c.features == "N;PL;NOM")
    assert [v.form for v in cell.forms] == ["kalar", "karar"]
    assert [v.preferred for v in cell.forms] == [True, False]
    assert cell.forms[1].weight > cell.forms[0].weight
    text = render_text([arrange(ka, toy.meta)], 80)
    assert "kalar (karar)" in text


def test_default_layout_from_the_feature_inventory(toy: morphfst.Language) -> None:
    noun = arrange(only(toy, "ka"), toy.meta).sections[0]
    assert noun.layout.origin == "derived"
    assert noun.layout.rows == ["Case"] and noun.layout.columns == ["Number"]
    verb = arrange(only(toy, "sama"), toy.meta).sections[0]
    assert verb.layout.rows == ["Number", "Person"] and verb.layout.columns == ["Tense"]
    assert verb.grids[0].rows == ["1 SG", "2 SG", "3 SG", "1 PL", "2 PL", "3 PL"]
    # Cells with unrelated dimensions (the infinitive) are listed apart, one row per cell.
    infinitive = arrange(only(toy, "sama"), toy.meta).sections[1]
    assert infinitive.layout.listing and infinitive.grids[0].rows == ["NFIN"]
    assert infinitive.grids[0].cells[0][0].forms[0].form == "samata"  # type: ignore[union-attr]
    # The largest dimension makes the rows; ties go to the one nearer the end of the word.
    spec = default_layout("N", {"Number": ["SG", "PL"], "Possession": [None, "P1", "P2"], "Case": ["A", "B", "C"]})
    assert spec.rows == ["Case"] and spec.columns == ["Number"] and spec.tables == ["Possession"]


def test_depth_limit_bounds_cyclic_derivation(toy: morphfst.Language, tur: morphfst.Language) -> None:
    counts = []
    for depth in range(4):
        templates = cell_templates(toy.meta, "noun", "N", make_bound(toy, depth))
        assert all(t.depth <= depth for t in templates)
        counts.append(len(templates))
    assert counts == [4, 8, 12, 16]
    # A cycle that keeps the part of speech is bounded too (each slot entered at most depth+1 times).
    assert [len(cell_templates(toy.meta, "part", "PART", make_bound(toy, d))) for d in range(3)] == [2, 3, 4]
    # On Turkish (-CI and -lIk lead back into the noun paradigm), and a feature filter prunes the walk.
    d1 = cell_templates(tur.meta, "noun", "N", make_bound(tur, 1))
    d1_no_agt = cell_templates(tur.meta, "noun", "N", make_bound(tur, 1, exclude=["AGT"]))
    assert len(d1_no_agt) < len(d1) and not any("AGT" in t.tags for t in d1_no_agt)
    with_pl = cell_templates(tur.meta, "noun", "N", make_bound(tur, 0, require=["PL"]))
    assert with_pl and all("PL" in t.tags for t in with_pl)
    kitap = only(tur, "kitap", "N", depth=1)
    assert preferred(kitap, "N;AGT;N;PL;NOM") == "kitapçılar"  # Göksel & Kerslake (2005), ch. 7 (-CI), from memory
    assert preferred(kitap, "N;ABSTR;N;SG;ACC") == "kitaplığı"  # same, -lIk, from memory
    sections = arrange(kitap, tur.meta).sections
    assert sections[0].stem == "kitap N" and {s.citation for s in sections[1:]} >= {"kitapçı", "kitaplık", "kitaplı", "kitapsız"}


def test_ambiguous_lemma_gives_every_reading(tmp_path: Path) -> None:
    lexicon = (
        "lemma\tclass\tpos\tgloss\tstem\nka\tnoun\tN\thouse\t\nka\tverb\tV\tmake\t\nte\tnoun\tN\ttree\t\nte\tnoun\tN\ttea\ttel\n"
    )
    lang = morphfst.load(write_table_toy(tmp_path, lexicon=lexicon))
    ka = paradigms(lang, "ka")
    assert [(p.pos, p.gloss) for p in ka] == [("N", "house"), ("V", "make")]
    assert preferred(ka[1], "V;PST;1;SG") == "katm"
    # Same lemma and part of speech, different stems: each reading is compiled on its own, so the
    # forms of one never show in the table of the other.
    te = paradigms(lang, "te")
    assert [p.gloss for p in te] == ["tree", "tea"]
    assert forms_by_features(te[0])["N;SG;LOC"] == ["tene"] and forms_by_features(te[1])["N;SG;LOC"] == ["telne"]
    assert "compiled on its own" in te[1].notes[0]
    text = render_text([arrange(p, lang.meta) for p in te], 80)
    assert text.count("te (N)") == 2


def test_declared_layout_checks(toy: morphfst.Language) -> None:
    with pytest.raises(UserError, match="unknown dimension 'Cas'"):
        layout_override(toy.meta, "", ["Cas"], [], [])
    with pytest.raises(UserError, match="both"):
        layout_override(toy.meta, "", ["Case"], ["Case"], [])
    spec = layout_override(toy.meta, "", ["Number"], ["Case"], [])
    grid = arrange(only(toy, "ka"), toy.meta, spec).sections[0].grids[0]
    assert grid.rows == ["SG", "PL"] and grid.columns == ["NOM", "LOC"]


def test_fixed_layout_and_leftover_cells(tmp_path: Path) -> None:
    from tabletoy import TABLE_TOY

    grammar = TABLE_TOY + '\nlayout V "past" {\n  rows Person\n  columns Number\n  fixed PST\n  label PST "past tense"\n}\n'
    lang = morphfst.load(write_table_toy(tmp_path, grammar))
    sections = arrange(only(lang, "sama", layout_only=False), lang.meta).sections
    assert sections[0].layout.origin == "declared" and sections[0].fixed_note == "past tense"
    assert sections[0].grids[0].columns == ["SG", "PL"] and sections[0].grids[0].cells[0][0].forms[0].form == "samatm"  # type: ignore[union-attr]
    # Cells no declared layout takes (the present) are not dropped: they follow with the default layout.
    assert sections[1].layout.origin == "derived" and "other forms" in sections[1].title
    assert sum(len(r) for g in sections[1].grids for r in g.cells) == 6


# ---------------------------------------------------------------------------------------------
# Formats


@pytest.fixture(scope="module")
def kitap_tables(tur: morphfst.Language) -> list[Arranged]:
    # depth 1 without the noun-to-verb derivations, whose conjugations would be most of the output
    return [arrange(p, tur.meta) for p in paradigms(tur, "kitap", make_bound(tur, 1, exclude=["VBZ", "BECOME"]))]


def test_text_fits_the_terminal(kitap_tables: list[Arranged], tur: morphfst.Language) -> None:
    for width in (80, 120):
        text = render(kitap_tables, "text", "tur", tur.title, width)
        assert max(display_width(x) for x in text.splitlines()) <= width
    # A wide arrangement (14 columns) is split into sub-tables that each fit.
    spec = layout_override(tur.meta, "", ["Case"], ["Possession", "Number"], [])
    wide = [arrange(only(tur, "ev", "N"), tur.meta, spec)]
    text = render_text(wide, 80)
    assert max(display_width(x) for x in text.splitlines()) <= 80
    assert "(1/" in text and "evlerimizden" in text


def test_csv_and_tsv_parse_back(kitap_tables: list[Arranged], tur: morphfst.Language) -> None:
    cells = {c.features: c for a in kitap_tables for c in a.paradigm.cells}
    for fmt, delimiter in (("csv", ","), ("tsv", "\t")):
        rows = list(csv.DictReader(io.StringIO(render(kitap_tables, fmt, "tur", tur.title)), delimiter=delimiter))
        forms = {(r["features"], r["form"]) for r in rows if r["form"]}
        expected = {(c.features, v.form) for c in cells.values() for v in c.forms}
        assert forms == expected
        empty = {r["features"] for r in rows if not r["form"]}
        assert empty == {f for f, c in cells.items() if not c.forms}


def test_json_parses_back(kitap_tables: list[Arranged], tur: morphfst.Language) -> None:
    data = json.loads(render(kitap_tables, "json", "tur", tur.title))
    reading = data["readings"][0]
    assert reading["lemma"] == "kitap" and reading["bound"]["depth"] == 1
    table = reading["sections"][0]["tables"][0]
    assert table["columns"] == ["singular", "plural"]
    assert table["rows"][1]["label"] == "accusative" and table["rows"][1]["cells"][0]["forms"][0]["form"] == "kitabı"


def test_html_is_well_formed_and_self_contained(kitap_tables: list[Arranged], tur: morphfst.Language) -> None:
    page = render(kitap_tables, "html", "tur", tur.title)
    root = ET.fromstring(page.split("\n", 1)[1])  # XHTML syntax: parses as XML after the doctype
    ns = {"h": "http://www.w3.org/1999/xhtml"}
    tables = root.findall(".//h:table", ns)
    assert len(tables) >= 7 * 3
    assert "http" not in page.replace('xmlns="http://www.w3.org/1999/xhtml"', "")  # no network resources
    assert "<script" not in page and "@media print" in page

    class Check(HTMLParser):
        def __init__(self) -> None:
            super().__init__()
            self.stack: list[str] = []
            self.cells: list[str] = []

        def handle_starttag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
            if tag not in ("meta",):
                self.stack.append(tag)

        def handle_startendtag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
            pass

        def handle_endtag(self, tag: str) -> None:
            assert self.stack and self.stack[-1] == tag, (tag, self.stack[-3:])
            self.stack.pop()

        def handle_data(self, data: str) -> None:
            if self.stack and self.stack[-1] in ("td", "span"):
                self.cells.append(data)

    check = Check()
    check.feed(page)
    assert check.stack == [] and "kitapçılar" in check.cells


def test_markdown_tables(kitap_tables: list[Arranged], tur: morphfst.Language) -> None:
    md = render(kitap_tables, "markdown", "tur", tur.title)
    assert "| **accusative** | kitabı | kitapları |" in md
    assert "## kitapçı (N; kitap N;AGT;N) — declension" in md


# ---------------------------------------------------------------------------------------------
# The command


def test_table_command(capsys: pytest.CaptureFixture[str], tur: morphfst.Language, tmp_path: Path) -> None:
    assert main(["table", "ev", "--width", "80"]) == 0
    out = capsys.readouterr().out
    assert "ev (N) ‘house’" in out and "evlerinden" in out
    page = tmp_path / "ev.html"
    assert main(["table", "ev", "kitap", "-f", "html", "-o", str(page)]) == 0
    assert page.read_text(encoding="utf-8").count("<article") == 2
    assert [p.name for p in tmp_path.iterdir()] == ["ev.html"]  # no temporary file left
    assert main(["table", "kalem", "--class", "noun", "-f", "json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert data["readings"][0]["source"] == "command line"


def test_table_command_mistakes_exit_2_with_a_hint(capsys: pytest.CaptureFixture[str], tur: morphfst.Language) -> None:
    assert main(["table", "kalem", "--class", "nuon"]) == 2
    err = capsys.readouterr().err
    assert "unknown class 'nuon'" in err and "hint: did you mean 'noun'?" in err
    assert main(["table", "kalemq"]) == 2
    assert "--class" in capsys.readouterr().err
    assert main(["table", "ev", "--with", "PLURAL"]) == 2
    assert "unknown feature label" in capsys.readouterr().err
    assert main(["table", "ev", "--rows", "Cas"]) == 2
    assert "unknown dimension" in capsys.readouterr().err


def test_help_has_examples(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit):
        main(["table", "--help"])
    assert "examples:" in capsys.readouterr().out


# ---------------------------------------------------------------------------------------------
# Finnish against handbook paradigms (skipped while the Finnish grammar is missing)

# Karlsson, F. (2008), Finnish: An Essential Grammar, 2nd ed., Routledge, the chapters on the cases
# and on consonant gradation; the forms below were written from memory of those tables.
FIN_CASES = ("NOM", "GEN", "PRT", "ESS", "TRANS", "IN+ESS", "IN+ABL", "IN+ALL", "AT+ESS", "AT+ABL", "AT+ALL")
FIN_NOUNS = {
    "talo": (
        "talo talon taloa talona taloksi talossa talosta taloon talolla talolta talolle",
        "talot talojen taloja taloina taloiksi taloissa taloista taloihin taloilla taloilta taloille",
    ),
    # weak grade t : d in closed syllables (katu : kadun)
    "katu": (
        "katu kadun katua katuna kaduksi kadussa kadusta katuun kadulla kadulta kadulle",
        "kadut katujen katuja katuina kaduiksi kaduissa kaduista katuihin kaduilla kaduilta kaduille",
    ),
}


def test_finnish_noun_table_matches_handbook(fin: morphfst.Language) -> None:
    for lemma, (singular, plural) in FIN_NOUNS.items():
        p = only(fin, lemma, "N")
        for number, forms in (("SG", singular), ("PL", plural)):
            for case, form in zip(FIN_CASES, forms.split()):
                assert preferred(p, f"N;{number};{case}") == form, (lemma, number, case)
    a = arrange(only(fin, "talo", "N"), fin.meta)
    grid = a.sections[0].grids[0]
    assert grid.row_dims == ["Case"] and grid.column_dims == ["Number"] and len(grid.rows) >= len(FIN_CASES)


def test_finnish_possessive_variants_are_shown_preferred_first(fin: morphfst.Language) -> None:
    # Karlsson (2008), the chapter on possessive suffixes, from memory: the third person suffix is -Vn
    # after a case ending in a short vowel (talossaan), with -nsA (talossansa) as the less usual variant.
    p = only(fin, "talo", "N")
    cell = next(c for c in p.cells if c.features == "N;SG;IN+ESS;PSS3S")
    assert [v.form for v in cell.forms] == ["talossaan", "talossansa"]
    assert cell.forms[0].preferred and not cell.forms[1].preferred
    assert "talossaan (talossansa)" in render_text([arrange(p, fin.meta)], 80)


def test_finnish_verb_table_with_the_derived_layout(fin: morphfst.Language) -> None:
    # Karlsson (2008), the chapter on verb conjugation: present tense of ottaa with gradation tt : t,
    # from memory.
    p = only(fin, "ottaa", "V")
    expected = {"1;SG": "otan", "2;SG": "otat", "3;SG": "ottaa", "1;PL": "otamme", "2;PL": "otatte", "3;PL": "ottavat"}
    for person, form in expected.items():
        assert preferred(p, f"V;IND;PRS;{person}") == form
    a = arrange(p, fin.meta)
    finite = a.sections[0].grids[0]
    assert finite.row_dims == ["Number", "Person"] and len(finite.rows) == 6
    column = next(i for i, key in enumerate(finite.column_keys) if "PRS" in key)
    present = [row[column] for row in finite.cells]
    assert [c.forms[0].form for c in present if c is not None] == list(expected.values())
    # The infinitive is outside the conjugation's dimensions: asked for, it is there.
    nonfinite = only_with(fin, "ottaa", "V", ["NFIN"])
    assert preferred(nonfinite, "V;NFIN") == "ottaa"


def test_every_cell_of_a_large_paradigm_is_laid_out_once(tur: morphfst.Language) -> None:
    """Beyond the layout's dimensions a Turkish noun has thousands of cells over many dimensions; the
    cells left to derived layouts become sub-tables by the values present (not by the product of
    every dimension's values, which is far larger), and every form is shown."""
    (p,) = paradigms(tur, "ev", make_bound(tur, 0, require=["PL"], layout_only=False), "N")
    assert len(p.cells) > 1000
    (arranged,) = [arrange(p, tur.meta)]
    placed = [c for s in arranged.sections for g in s.grids for row in g.cells for c in row if c is not None]
    # a cell with another cell's labels in another order (a copula's person before or after -DIr:
    # evimizdirler, evimizlerdir) shares its place, its forms ranked with the other's
    shown = {frozenset(c.tags) for c in placed}
    assert all(frozenset(c.tags) in shown for c in p.cells)
    forms_shown = {v.form for c in placed for v in c.forms}
    assert {v.form for c in p.cells for v in c.forms} == forms_shown
    assert len(placed) < len(p.cells)


def test_strings_acceptor_equals_the_union_of_its_strings() -> None:
    """The one-pass trie the table filler composes with the generator accepts exactly its strings,
    symbols that pynini's string syntax treats specially included."""
    import pynini

    from morphfst.compile.fstutil import acc, strings, union

    texts = ["ab", "a[b", "x]", "\\q", "", "abc", "ab", "ğüş"]
    built = strings(texts)
    assert pynini.equivalent(built, union(acc(t) for t in texts).optimize())
    assert sorted(built.paths(input_token_type="utf8", output_token_type="utf8").istrings()) == sorted(set(texts))

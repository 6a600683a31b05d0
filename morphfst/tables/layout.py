"""Layouts: which dimensions of a paradigm make the rows, the columns and the sub-tables.

A grammar may declare layouts per part of speech::

    layout N "Noun declension" {
      rows Case
      columns Number
      tables Possession
      label NOM "nominative"
      label Possession.none "no possessor"
    }

``fixed FEAT...`` restricts a layout to the cells carrying those labels (several layouts for one part
of speech may split its cells, e.g. one per polarity); cells that no declared layout takes are shown
in a further table with the default layout, so nothing is dropped. ``label`` gives human labels for
values, for dimension names (``label Case "case"``) and for the absence of a dimension
(``label Possession.none "no possessor"``). A dimension present in the cells but named nowhere in a
declared layout becomes one more sub-table dimension.

Without a declared layout, one is derived from the feature inventory (common practice of grammar
books): a person dimension (values 1, 2, 3 in the UniMorph schema) with the number dimension makes
the rows, in the order singular 1-2-3, plural 1-2-3; otherwise the dimension with the most values
makes the rows (ties go to the one nearer the end of the word, where case endings stand); the
smallest remaining dimensions make the columns while there are at most four columns; the rest make
sub-tables. A dimension with one value in every cell is stated in the title instead of taking space.

Derived stems (a derivational affix changes the part of speech) get their own section, laid out
with the layout of their new part of speech.
"""

from __future__ import annotations

import itertools
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from ..errors import Position, UserError
from ..runtime.compiled_language import Language
from .paradigm import Cell, Paradigm, make_bound, paradigms, rank_forms, trial_paradigm

MAX_DEFAULT_COLUMNS = 4
LISTING_MAX_CELLS = 3  # a group of this few cells is listed, one row per cell
LISTING_DENSITY = 0.5  # ... and so is a group whose grids would be mostly blank
MAX_COLUMN_DIMENSION = 8
PERSON_VALUES = {"0", "1", "2", "3", "4"}  # UniMorph person labels (Sylak-Glassman 2016)
NUMBER_VALUES = {"SG", "PL", "DU", "TRI", "PAUC", "GRPL", "GRPAUC", "INVN"}  # UniMorph number labels
NONE_SUFFIX = ".none"

Value = str | None  # None: the cell has no value of this dimension
Key = tuple[Value, ...]


@dataclass
class LayoutSpec:
    """A layout for one part of speech (declared in the grammar, given on the command line, or derived)."""

    pos: str
    title: str
    rows: list[str]
    columns: list[str]
    tables: list[str]
    fixed: list[str] = field(default_factory=list)
    labels: dict[str, str] = field(default_factory=dict)
    origin: str = "derived"  # "declared", "command line" or "derived"
    listing: bool = False  # one row per cell (rows are only the value combinations that occur)
    line: int = 0  # the grammar line of a declared layout

    def label(self, value: str) -> str:
        return self.labels.get(value, value)

    def value_label(self, dim: str, value: Value) -> str:
        if value is None:
            return self.labels.get(dim + NONE_SUFFIX, f"no {dim.lower()}")
        return self.labels.get(value, value)

    def to_dict(self) -> dict[str, Any]:
        return {
            "pos": self.pos,
            "title": self.title,
            "rows": self.rows,
            "columns": self.columns,
            "tables": self.tables,
            "fixed": self.fixed,
            "origin": self.origin,
            "listing": self.listing,
        }


@dataclass
class Grid:
    """One two-dimensional table: row and column labels and the cell at each crossing.

    A crossing holds a :class:`Cell` (possibly with no form: the grammar leaves it unfilled) or
    ``None`` when the paradigm has no such cell at all.
    """

    title: str
    row_header: str
    rows: list[str]
    columns: list[str]
    cells: list[list[Cell | None]]
    row_keys: list[Key] = field(default_factory=list)
    column_keys: list[Key] = field(default_factory=list)
    row_dims: list[str] = field(default_factory=list)
    column_dims: list[str] = field(default_factory=list)

    @property
    def single(self) -> bool:
        """True for a grid of one cell with no dimension at all (a word that does not inflect)."""
        return not self.row_dims and not self.column_dims

    def to_dict(self) -> dict[str, Any]:
        return {
            "title": self.title,
            "row_header": self.row_header,
            "columns": self.columns,
            "rows": [
                {"label": label, "cells": [c.to_dict() if c is not None else None for c in row]}
                for label, row in zip(self.rows, self.cells)
            ],
        }


@dataclass
class Section:
    """The tables of one stem of a reading: the entry itself, or one derived stem."""

    title: str
    stem: str  # lemma and tags of the stem, e.g. "kitap N;AGT;N"
    pos: str
    citation: str | None  # a representative form (the cell with the fewest affixes)
    layout: LayoutSpec
    grids: list[Grid]
    fixed_note: str = ""

    def to_dict(self) -> dict[str, Any]:
        return {
            "title": self.title,
            "stem": self.stem,
            "pos": self.pos,
            "citation": self.citation,
            "layout": self.layout.to_dict(),
            "note": self.fixed_note,
            "tables": [g.to_dict() for g in self.grids],
        }


@dataclass
class Arranged:
    """One reading laid out: the paradigm and its sections of tables."""

    paradigm: Paradigm
    sections: list[Section]

    @property
    def heading(self) -> str:
        p = self.paradigm
        gloss = f" ‘{p.gloss}’" if p.gloss else ""
        return f"{p.lemma} ({p.pos}){gloss}"

    @property
    def details(self) -> str:
        p = self.paradigm
        parts = [f"class {', '.join(p.classes)}"]
        if p.stems:
            parts.append(f"stem {', '.join(p.stems)}")
        if p.flags:
            parts.append(f"flags {', '.join(p.flags)}")
        parts.append(f"from {p.source}" if p.source != "lexicon" else "lexicon " + ", ".join(Path(o).name for o in p.origins))
        parts.append(p.bound.describe())
        return "; ".join(parts)

    def to_dict(self) -> dict[str, Any]:
        out = self.paradigm.to_dict()
        out["heading"] = self.heading
        out["sections"] = [s.to_dict() for s in self.sections]
        return out


# ---------------------------------------------------------------------------------------------
# Layout specifications


def dimension_index(meta: dict[str, Any]) -> dict[str, str]:
    """Feature label → dimension name (parts of speech left out)."""
    return {v: d for d, values in meta["dimensions"].items() if d != "pos" for v in values}


def declared_layouts(meta: dict[str, Any], pos: str | None) -> list[LayoutSpec]:
    """The grammar's layouts for ``pos`` (every layout for ``None``), checked against the feature inventory."""
    out = []
    for raw in meta.get("layouts", []):
        if pos is not None and raw["pos"] != pos:
            continue
        spec = LayoutSpec(
            raw["pos"],
            raw["title"],
            list(raw["rows"]),
            list(raw["columns"]),
            list(raw["tables"]),
            list(raw["fixed"]),
            dict(raw["labels"]),
            "declared",
            line=int(raw.get("line", 0)),
        )
        check_layout(meta, spec)
        out.append(spec)
    return out


def check_layout(meta: dict[str, Any], spec: LayoutSpec) -> None:
    """A user error when a layout names an unknown dimension or label, or uses a dimension twice."""
    dims = {d for d in meta["dimensions"] if d != "pos"}
    index = dimension_index(meta)
    where = Position(meta.get("grammar_path", ""), spec.line) if spec.origin == "declared" else Position("command line")
    if spec.origin == "declared" and spec.pos not in meta["dimensions"].get("pos", []):
        raise UserError(
            f"layout {spec.title!r}: unknown part of speech {spec.pos!r}",
            where,
            hint="parts of speech: " + ", ".join(meta["dimensions"].get("pos", [])),
        )
    what = f"layout {spec.title!r} ({spec.pos})" if spec.origin == "declared" else "the layout options"
    seen: dict[str, str] = {}
    for role, names in (("rows", spec.rows), ("columns", spec.columns), ("tables", spec.tables)):
        for name in names:
            if name not in dims:
                raise UserError(
                    f"{what}: unknown dimension {name!r} in {role}", where, hint="dimensions: " + ", ".join(sorted(dims))
                )
            if name in seen:
                raise UserError(
                    f"{what}: dimension {name} is used in both {seen[name]} and {role}",
                    where,
                    hint="give each dimension one role",
                )
            seen[name] = role
    for label in spec.fixed:
        if label not in index:
            raise UserError(
                f"{what}: unknown feature label {label!r} in fixed",
                where,
                hint="fixed takes feature labels such as " + ", ".join(list(index)[:4]),
            )
        if index[label] in seen:
            raise UserError(
                f"{what}: {label} is fixed but its dimension {index[label]} is also in {seen[index[label]]}",
                where,
                hint="drop one of them",
            )
    for key in spec.labels:
        base = key[: -len(NONE_SUFFIX)] if key.endswith(NONE_SUFFIX) else key
        if key not in index and base not in dims and key not in meta["dimensions"].get("pos", []):
            raise UserError(
                f"{what}: label for unknown value {key!r}", where, hint="label a feature value, a dimension, or DIMENSION.none"
            )


def default_layout(pos: str, present: dict[str, list[Value]], title: str = "") -> LayoutSpec:
    """A layout derived from the dimensions present in some cells (``present``: dimension → its values,
    in word order of the dimensions; ``None`` among the values when some cells lack the dimension)."""
    order = list(present)
    varying = [d for d in order if len(present[d]) > 1]
    fixed = [v for d in order if len(present[d]) == 1 for v in present[d] if v is not None]
    rows: list[str] = []
    person = [d for d in varying if set(v for v in present[d] if v is not None) <= PERSON_VALUES]
    number = [d for d in varying if set(v for v in present[d] if v is not None) <= NUMBER_VALUES]
    if person:
        rows = ([number[0]] if number and len(present[number[0]]) <= 3 else []) + [person[0]]
    elif varying:
        # Most values first; ties go to the dimension nearer the end of the word.
        rows = [max(varying, key=lambda d: (len(present[d]), order.index(d)))]
    rest = [d for d in varying if d not in rows]
    columns: list[str] = []
    product = 1
    for d in sorted(rest, key=lambda d: (len(present[d]), order.index(d))):
        n = len(present[d])
        if (not columns and n <= MAX_COLUMN_DIMENSION) or product * n <= MAX_DEFAULT_COLUMNS:
            columns.append(d)
            product *= n
        else:
            break
    tables = [d for d in rest if d not in columns]
    return LayoutSpec(pos, title or pos, rows, columns, tables, fixed, {}, "derived")


# ---------------------------------------------------------------------------------------------
# Arranging a paradigm


def arrange(paradigm: Paradigm, meta: dict[str, Any], override: LayoutSpec | None = None) -> Arranged:
    """Lay a paradigm out in sections (one per stem) of grids."""
    index = dimension_index(meta)
    inventory: dict[str, list[str]] = {d: list(v) for d, v in meta["dimensions"].items() if d != "pos"}
    groups: dict[tuple[str, ...], list[Cell]] = {}
    for cell in paradigm.cells:
        groups.setdefault(cell.tags[: cell.template.stem_length], []).append(cell)
    ordered = sorted(groups.items(), key=lambda kv: len(kv[0]))  # the entry itself first, then by depth
    sections: list[Section] = []
    for stem_tags, cells in ordered:
        pos = stem_tags[-1]
        values = [(_values(c, index), c) for c in cells]
        citation = _citation(cells, meta)
        stem = f"{paradigm.lemma} {';'.join(stem_tags)}"
        # The entry's own section needs no title of its own (the reading's heading names it);
        # a derived stem is named by its citation form and its derivation.
        title = "" if len(stem_tags) == 1 else f"{citation or '?'} ({pos}; {stem})"
        if override is not None:
            specs = [
                LayoutSpec(
                    pos,
                    override.title or pos,
                    override.rows,
                    override.columns,
                    override.tables,
                    override.fixed,
                    dict(override.labels),
                    override.origin,
                )
            ]
        else:
            specs = declared_layouts(meta, pos)
        remaining = values
        for spec in specs:
            taken = [(v, c) for v, c in remaining if all(v.get(index.get(f, "")) == f for f in spec.fixed)]
            taken_ids = {id(c) for _, c in taken}
            remaining = [(v, c) for v, c in remaining if id(c) not in taken_ids]
            if taken:
                sections.append(_section(title, stem, pos, citation, spec, taken, inventory))
        if remaining:
            # Labels of values mean the same for every part of speech: the grammar's labels serve the
            # cells no declared layout takes, those of this part of speech first.
            labels = {k: v for raw in meta.get("layouts", []) for k, v in raw["labels"].items()}
            labels.update({k: v for s in specs for k, v in s.labels.items()})
            families = _families(remaining)
            for number, family in enumerate(families):
                present = _present(family, inventory)
                heading = "other forms" if specs else ""
                if len(families) > 1 and number > 0:
                    heading = " ".join(x for x in (heading, "by " + ", ".join(labels.get(d, d) for d in present)) if x)
                spec = default_layout(pos, present, heading or pos)
                spec.labels = dict(labels)
                section = _section(title, stem, pos, citation, spec, family, inventory)
                if len(family) <= LISTING_MAX_CELLS or _density(section) < LISTING_DENSITY:
                    spec = LayoutSpec(pos, spec.title, list(present), [], [], [], dict(labels), "derived", listing=True)
                    section = _section(title, stem, pos, citation, spec, family, inventory)
                sections.append(section)
    return Arranged(paradigm, sections)


def _families(values: list[tuple[dict[str, str], Cell]]) -> list[list[tuple[dict[str, str], Cell]]]:
    """Cells grouped by the dimensions they carry: cells whose dimensions are a subset of another
    group's (a possessive ending that may be absent) join that group; unrelated sets of dimensions
    (non-finite forms beside a conjugation) make separate groups. The largest group comes first."""
    signatures: dict[frozenset[str], list[tuple[dict[str, str], Cell]]] = {}
    for item in values:
        signatures.setdefault(frozenset(item[0]), []).append(item)
    groups: list[tuple[set[str], list[tuple[dict[str, str], Cell]]]] = []
    for sig in sorted(signatures, key=lambda s: (-len(s), sorted(s))):
        homes = [g for g in groups if sig <= g[0]]
        if homes:
            min(homes, key=lambda g: len(g[0]))[1].extend(signatures[sig])
        else:
            groups.append((set(sig), list(signatures[sig])))
    order = {id(c): i for i, (_, c) in enumerate(values)}
    out = [sorted(items, key=lambda vc: order[id(vc[1])]) for _, items in groups]
    return sorted(out, key=lambda items: -len(items))


def _density(section: Section) -> float:
    """Share of the crossings of a section's grids that hold a cell of the paradigm."""
    total = sum(len(g.rows) * len(g.columns) for g in section.grids)
    used = sum(1 for g in section.grids for row in g.cells for c in row if c is not None)
    return used / total if total else 1.0


def _values(cell: Cell, index: dict[str, str]) -> dict[str, str]:
    out: dict[str, str] = {}
    for tag in cell.tags[cell.template.stem_length :]:
        dim = index.get(tag, tag)
        out[dim] = f"{out[dim]}+{tag}" if dim in out else tag
    return out


def _present(values: list[tuple[dict[str, str], Cell]], inventory: dict[str, list[str]]) -> dict[str, list[Value]]:
    """Dimension → its values in these cells (inventory order; None first when some cells lack it),
    with the dimensions in the order they appear in the words."""
    order: dict[str, int] = {}
    for v, _ in values:
        for i, dim in enumerate(v):
            order[dim] = min(order.get(dim, i), i)
    names = list(inventory)
    dims = sorted(order, key=lambda d: (order[d], names.index(d) if d in names else len(names)))
    out: dict[str, list[Value]] = {}
    for dim in dims:
        seen = {v[dim] for v, _ in values if dim in v}
        lacking = any(dim not in v for v, _ in values)
        ref = inventory.get(dim, [])
        out[dim] = ([None] if lacking else []) + sorted(seen, key=lambda v: (ref.index(v) if v in ref else len(ref), v))
    return out


def _citation(cells: list[Cell], meta: dict[str, Any]) -> str | None:
    """The preferred form of the filled cell with the fewest non-zero affixes (the dictionary form)."""
    forms: dict[int, bool] = {}
    for slot in meta["slots"].values():
        for affix in slot["affixes"]:
            forms[affix["id"]] = bool(affix["form"])
    best: tuple[int, int] | None = None
    choice: str | None = None
    for i, cell in enumerate(cells):
        if not cell.forms:
            continue
        key = (sum(1 for a in cell.template.affixes if forms.get(a)), i)
        if best is None or key < best:
            best, choice = key, cell.forms[0].form
    return choice


def _section(
    title: str,
    stem: str,
    pos: str,
    citation: str | None,
    spec: LayoutSpec,
    values: list[tuple[dict[str, str], Cell]],
    inventory: dict[str, list[str]],
) -> Section:
    present = _present(values, inventory)
    named = set(spec.rows) | set(spec.columns) | set(spec.tables)
    fixed_dims = {d for d in present if len(present[d]) == 1 and present[d][0] is not None and d not in named}
    if spec.listing:
        fixed_dims = set()
    elif spec.origin != "derived":
        # A declared layout keeps its own choice; dimensions it does not name become sub-tables.
        fixed_dims = {d for d in fixed_dims if any(f in present[d] for f in spec.fixed)}
    extra = [d for d in present if d not in named and d not in fixed_dims]
    rows = [d for d in spec.rows if d in present]
    columns = [d for d in spec.columns if d in present]
    tables = [d for d in spec.tables if d in present] + extra
    note = ", ".join(spec.label(present[d][0] or "") for d in present if d in fixed_dims)
    lookup: dict[tuple[Key, Key, Key], Cell] = {}
    # the sub-table key ends with the order in which the word carries the sub-table dimensions a
    # declared layout names: the same values in another order of those affixes are another form, not
    # a variant (Turkish -sAydI 'if it had' and -DIysA 'if it did': COND then PST, PST then COND)
    ordered = set(spec.tables) if spec.origin == "declared" and not spec.listing else set()
    for v, cell in values:
        order = "|".join(d for d in v if d in ordered)
        key = ((*(v.get(d) for d in tables), order), tuple(v.get(d) for d in rows), tuple(v.get(d) for d in columns))
        kept = lookup.get(key)
        # cells with the same values in another order of the other affixes (gelmiştirler,
        # gelmişlerdir: the person against -DIr) share a place
        lookup[key] = cell if kept is None else _merged(kept, cell)
    # the cells of each sub-table; sub-tables in the order of the product of their dimensions' values
    # (only those with cells: the product of many dimensions is far larger than the cells there are)
    by_table: dict[Key, dict[tuple[Key, Key], Cell]] = {}
    for (t, r, c), cell in lookup.items():
        by_table.setdefault(t, {})[(r, c)] = cell
    rank = [{v: i for i, v in enumerate(present[d])} for d in tables]
    # the orders each set of sub-table values comes in: a set that comes in two is titled in word order
    orders: dict[Key, list[Value]] = {}
    for t in by_table:
        orders.setdefault(t[:-1], []).append(t[-1])
    every_row = _all(present, rows)
    all_columns = _all(present, columns)
    grids: list[Grid] = []
    for tkey in sorted(by_table, key=lambda t: tuple(order[v] for order, v in zip(rank, t))):
        here = by_table[tkey]
        all_rows = list(dict.fromkeys(r for r, _ in here)) if spec.listing else every_row
        rkeys = [r for r in all_rows if any((r, c) in here for c in all_columns)]
        ckeys = [c for c in all_columns if any((r, c) in here for r in rkeys)]
        if not rkeys or not ckeys:
            continue
        grid_cells = [[here.get((r, c)) for c in ckeys] for r in rkeys]
        # a value labelled "" (e.g. 'label Mood.none ""') is left out of the title
        titled = list(zip(tables, tkey[:-1]))
        if len(orders[tkey[:-1]]) > 1:
            place = {d: i for i, d in enumerate((tkey[-1] or "").split("|"))}
            titled.sort(key=lambda dv: place.get(dv[0], -1))
        gtitle = ", ".join(x for x in (spec.value_label(d, val) for d, val in titled) if x)
        grids.append(
            Grid(
                title=gtitle,
                row_header="" if spec.listing else " / ".join(spec.label(d) for d in rows),
                rows=[(_listed(spec, rows, r) if spec.listing else _joined(spec, rows, r)) or pos for r in rkeys],
                columns=[_joined(spec, columns, c) or "form" for c in ckeys],
                cells=grid_cells,
                row_keys=list(rkeys),
                column_keys=list(ckeys),
                row_dims=rows,
                column_dims=columns,
            )
        )
    heading = spec.title if spec.origin == "declared" or (spec.origin == "derived" and spec.title not in ("", pos)) else ""
    full = " — ".join(x for x in (title, heading) if x)
    return Section(full, stem, pos, citation, spec, grids, note)


def _merged(kept: Cell, other: Cell) -> Cell:
    """One cell with the forms of two cells that a layout puts in one place, ranked together (the
    first cell's labels name it)."""
    if not other.forms:
        return kept
    if not kept.forms:
        return Cell(kept.lemma, kept.template, list(other.forms))
    weights: dict[str, float] = {}
    for variant in (*kept.forms, *other.forms):
        weights[variant.form] = min(variant.weight, weights.get(variant.form, variant.weight))
    return Cell(kept.lemma, kept.template, rank_forms(weights))


def _joined(spec: LayoutSpec, dims: list[str], key: Key) -> str:
    """The label of a row or column; with several dimensions the innermost comes first, as grammar
    books name cells ("nominative singular", "1 SG"), and an absent dimension is named only when
    no other dimension is there to name the row."""
    pairs = list(reversed(list(zip(dims, key))))
    named = [(d, v) for d, v in pairs if v is not None] if len(pairs) > 1 else pairs
    return " ".join(spec.value_label(d, v) for d, v in (named or pairs))


def _listed(spec: LayoutSpec, dims: list[str], key: Key) -> str:
    """The label of a listed cell: its values in word order, absent dimensions left out."""
    return " ".join(spec.value_label(d, v) for d, v in zip(dims, key) if v is not None)


def _all(present: dict[str, list[Value]], dims: list[str]) -> list[Key]:
    return list(itertools.product(*(present[d] for d in dims)))


def layout_override(meta: dict[str, Any], pos: str, rows: list[str], columns: list[str], tables: list[str]) -> LayoutSpec:
    """A layout given on the command line (checked like a declared one)."""
    spec = LayoutSpec(pos, "", rows, columns, tables, [], {}, "command line")
    for raw in meta.get("layouts", []):
        spec.labels.update(raw["labels"])
    check_layout(meta, spec)
    return spec


def paradigm_data(
    lang: Language,
    lemma: str,
    depth: int = 0,
    require: Iterable[str] = (),
    exclude: Iterable[str] = (),
    pos: str | None = None,
    klass: str | None = None,
    stem: str | None = None,
    flags: Sequence[str] = (),
    tables: bool = False,
) -> list[dict[str, Any]]:
    """Every reading of ``lemma`` as plain data (dicts and lists), for the Python API: its cells, and
    with ``tables=True`` also its sections of laid-out tables (rows, columns and cells).

    With ``klass`` the word is compiled as a new entry of that class (it need not be in the lexicon)::

        from morphfst.tables.layout import paradigm_data
        paradigm_data(tur, "ev")[0]["cells"][0]      # {'analysis': 'ev N;SG;PSS1S;NOM', 'forms': [...], ...}
        paradigm_data(tur, "kalem", klass="noun", tables=True)[0]["sections"]
    """
    bound = make_bound(lang, depth, require, exclude, layout_only=True)
    if klass:
        found = [trial_paradigm(lang, lemma, klass, pos=pos, stem=stem, flags=flags, bound=bound)]
    else:
        found = paradigms(lang, lemma, bound, pos)
    if not tables:
        return [p.to_dict() for p in found]
    return [arrange(p, lang.meta).to_dict() for p in found]

"""Paradigms: every cell of a lemma's inflection, generated from the compiled language.

A *cell* is one path through the slot graph from the entry's class to the end of the word, written
as its tags (part of speech, then the features of each affix in slot order, with the new part of
speech after a derivational affix): ``N;PL;LOC``, ``N;AGT;N;SG;NOM``. The cells of a paradigm come
from the slot graph saved in the metadata, so cells the grammar leaves unfilled (a constraint
forbids them, or the rules produce nothing) are listed with no form instead of disappearing.

Derivation can be cyclic (a noun → adjective → noun chain never ends), so enumeration is bounded by a
:class:`Bound`: at most ``depth`` derivational affixes (affixes that change the part of speech), each
slot entered at most ``depth + 1`` times on one path (this also bounds cycles that keep the part of
speech), and a feature filter (labels every cell must carry, labels no cell may carry; the second
prunes the walk early).

Forms come from the generator in one composition per lemma: the cells are compiled into one acceptor
(a trie over the lemma, part-of-speech and feature codes), composed with the generator, and the paths
of the result give every form of every cell with its weight. Cells with several forms keep all of
them, preferred (lowest weight, tropical semiring) first.

A word that is not in the lexicon yet can be tried with :func:`trial_paradigm`: the entry is built
from the lemma and class given, and that one entry is compiled with the grammar source the language
was compiled from.
"""

from __future__ import annotations

import difflib
import unicodedata
from collections.abc import Iterable, Iterator, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

import pynini

from ..compile.fstutil import ACYCLIC, TOKEN, acc, is_empty, strings
from ..errors import Position, UserError
from ..language import model as m
from ..language.normalize import restore_case
from ..runtime.compiled_language import Language

DEFAULT_MAX_CELLS = 100_000
WEIGHT_EPSILON = 1e-6
MAX_CYCLIC_PATHS = 10_000


# ---------------------------------------------------------------------------------------------
# Bounds and cell templates


@dataclass(frozen=True)
class Bound:
    """How far to enumerate: derivation depth and a feature filter."""

    depth: int = 0
    require: frozenset[str] = frozenset()  # every cell carries all of these labels
    exclude: frozenset[str] = frozenset()  # no cell carries any of these labels
    max_cells: int = DEFAULT_MAX_CELLS
    layout_only: bool = False  # keep only cells whose labels belong to the dimensions of the pos's layout

    def describe(self) -> str:
        parts = [f"depth {self.depth}"]
        if self.layout_only:
            parts.append("layout dimensions only")
        if self.require:
            parts.append("with " + ",".join(sorted(self.require)))
        if self.exclude:
            parts.append("without " + ",".join(sorted(self.exclude)))
        return ", ".join(parts)


def make_bound(
    lang: Language,
    depth: int = 0,
    require: Iterable[str] = (),
    exclude: Iterable[str] = (),
    max_cells: int = DEFAULT_MAX_CELLS,
    layout_only: bool = True,
) -> Bound:
    """A :class:`Bound` with its labels checked against the language's feature inventory."""
    if depth < 0:
        raise UserError(f"the depth must be 0 or more, not {depth}", hint="depth 0 is the inflection of the entry itself")
    known = lang.labels()
    for label in [*require, *exclude]:
        if label not in known:
            near = difflib.get_close_matches(label, list(known), n=1)
            raise UserError(
                f"unknown feature label {label!r} in the feature filter",
                hint=(f"did you mean {near[0]!r}? " if near else "") + "labels: " + " ".join(sorted(known)),
            )
    return Bound(depth, frozenset(require), frozenset(exclude), max_cells, layout_only)


def layout_labels(meta: dict[str, Any], pos: str) -> set[str] | None:
    """The labels of the dimensions that the layouts of ``pos`` lay out (rows, columns, sub-tables and
    fixed labels), or ``None`` when the grammar has no layout for ``pos``.

    A broad grammar's full paradigm includes stacked copulas, voices and the like (tens of thousands
    of cells for one Turkish verb); a table shows what its layout names, unless asked for more.
    """
    dims = meta.get("dimensions", {})
    layouts = [lay for lay in meta.get("layouts", []) if lay["pos"] == pos]
    if not layouts:
        return None
    labels: set[str] = set()
    for lay in layouts:
        for name in [*lay["rows"], *lay["columns"], *lay["tables"]]:
            labels.update(dims.get(name, []))
        labels.update(lay.get("fixed", []))
    return labels


@dataclass(frozen=True)
class Template:
    """One cell shape: its tags, which of them are parts of speech, and the affixes on its path."""

    tags: tuple[str, ...]  # part of speech first, then features (and new parts of speech) in slot order
    pos_mask: tuple[bool, ...]  # True where the tag is a part of speech
    affixes: tuple[int, ...]  # affix ids along the path
    blocked_by: tuple[str, ...] = ()  # constraints of the grammar this path breaks

    @property
    def stem_length(self) -> int:
        """Number of leading tags up to and including the last part of speech (the derivation prefix)."""
        last = 0
        for i, is_pos in enumerate(self.pos_mask):
            if is_pos:
                last = i
        return last + 1

    @property
    def depth(self) -> int:
        return sum(self.pos_mask) - 1


def cell_templates(meta: dict[str, Any], klass: str, pos: str, bound: Bound) -> list[Template]:
    """Every cell of an entry of class ``klass`` and part of speech ``pos``, within ``bound``.

    The walk follows the slot graph saved in the metadata, depth first, so the cells come in slot
    order with each slot's affixes in the order the grammar lists them.
    """
    classes = meta["classes"]
    if klass not in classes:
        raise UserError(f"unknown class {klass!r}", hint="classes: " + ", ".join(classes))
    slots = meta["slots"]
    constraints = meta.get("constraints", [])
    out: dict[tuple[str, ...], Template] = {}
    visits: dict[str, int] = {}
    tags: list[str] = [pos]
    mask: list[bool] = [True]
    path: list[int] = []
    names: list[str | None] = []
    depth = 0
    allowed_by_pos: dict[str, set[str] | None] = {}

    def allowed() -> set[str] | None:
        """The labels the current part of speech's layout allows (the last part of speech on the path)."""
        if not bound.layout_only:
            return None
        current = next(t for t, is_pos in zip(reversed(tags), reversed(mask)) if is_pos)
        if current not in allowed_by_pos:
            allowed_by_pos[current] = layout_labels(meta, current)
        return allowed_by_pos[current]

    def emit() -> None:
        key = tuple(tags)
        if key in out:
            return
        if bound.require and not bound.require.issubset(tags):
            return
        present = set(tags) | {n for n in names if n}
        broken = tuple(c["name"] for c in constraints if _breaks(c, present))
        out[key] = Template(key, tuple(mask), tuple(path), broken)
        if len(out) > bound.max_cells:
            raise UserError(
                f"the paradigm has more than {bound.max_cells} cells within {bound.describe()}",
                hint="lower the depth, or leave derivational labels out with the feature filter",
            )

    def walk(targets: Sequence[str]) -> None:
        nonlocal depth
        for target in targets:
            if target == m.END_SLOT:
                emit()
                continue
            if visits.get(target, 0) > bound.depth:
                continue
            slot = slots[target]
            visits[target] = visits.get(target, 0) + 1
            for affix in slot["affixes"]:
                labels = list(affix["features"])
                new_pos = affix.get("new_pos")
                if bound.exclude and (bound.exclude.intersection(labels) or new_pos in bound.exclude):
                    continue
                limit = allowed()
                if limit is not None and not new_pos and not limit.issuperset(labels):
                    continue
                if new_pos and depth + 1 > bound.depth:
                    continue
                n_added = len(labels) + (1 if new_pos else 0)
                tags.extend(labels)
                mask.extend([False] * len(labels))
                if new_pos:
                    tags.append(new_pos)
                    mask.append(True)
                    depth += 1
                path.append(affix["id"])
                names.append(affix.get("name"))
                walk(affix["next"] if affix["next"] is not None else slot["next"])
                names.pop()
                path.pop()
                if new_pos:
                    depth -= 1
                del tags[len(tags) - n_added :]
                del mask[len(mask) - n_added :]
            visits[target] -= 1

    walk(classes[klass]["next"])
    return list(out.values())


def _breaks(constraint: dict[str, Any], present: set[str]) -> bool:
    left = constraint["left"] in present
    right = constraint["right"] in present
    if constraint["kind"] == "excludes":
        return left and right
    return left and not right


# ---------------------------------------------------------------------------------------------
# Cells and paradigms


@dataclass(frozen=True)
class Variant:
    """One form of a cell; ``rank`` 1 is the preferred form, ``preferred`` marks every form tied with it."""

    form: str
    weight: float
    rank: int
    preferred: bool

    def to_dict(self) -> dict[str, Any]:
        return {"form": self.form, "weight": round(self.weight, 6), "rank": self.rank, "preferred": self.preferred}


@dataclass
class Cell:
    """One cell of a paradigm with all its forms, preferred first (empty when the grammar leaves it unfilled)."""

    lemma: str
    template: Template
    forms: list[Variant] = field(default_factory=list)

    @property
    def tags(self) -> tuple[str, ...]:
        return self.template.tags

    @property
    def features(self) -> str:
        """The tags as a UniMorph feature bundle, ``N;PL;LOC``."""
        return ";".join(self.template.tags)

    @property
    def analysis(self) -> str:
        return f"{self.lemma} {self.features}"

    @property
    def filled(self) -> bool:
        return bool(self.forms)

    @property
    def preferred(self) -> list[Variant]:
        return [v for v in self.forms if v.preferred]

    @property
    def others(self) -> list[Variant]:
        return [v for v in self.forms if not v.preferred]

    def to_dict(self) -> dict[str, Any]:
        out: dict[str, Any] = {
            "analysis": self.analysis,
            "features": self.features,
            "forms": [v.to_dict() for v in self.forms],
        }
        if not self.forms and self.template.blocked_by:
            out["blocked_by"] = list(self.template.blocked_by)
        return out


@dataclass
class Paradigm:
    """One reading of a lemma (one lexicon entry, or entries that share lemma and part of speech)."""

    lemma: str
    pos: str
    classes: list[str]
    gloss: str
    stems: list[str]  # underlying stems where they differ from the (normalized) lemma
    flags: list[str]
    source: str  # "lexicon" or "command line"
    origins: list[str]  # file:line of the lexicon entries
    bound: Bound
    cells: list[Cell]
    notes: list[str] = field(default_factory=list)

    @property
    def title(self) -> str:
        return f"{self.lemma} ({self.pos})"

    @property
    def form_count(self) -> int:
        return sum(len(c.forms) for c in self.cells)

    def to_dict(self) -> dict[str, Any]:
        return {
            "lemma": self.lemma,
            "pos": self.pos,
            "classes": self.classes,
            "gloss": self.gloss,
            "stems": self.stems,
            "flags": self.flags,
            "source": self.source,
            "origins": self.origins,
            "bound": {"depth": self.bound.depth, "with": sorted(self.bound.require), "without": sorted(self.bound.exclude)},
            "notes": self.notes,
            "cells": [c.to_dict() for c in self.cells],
        }


@dataclass
class Shape:
    """The cells of one class (or classes) and part of speech within a bound, compiled once: the
    templates and a trie over their codes that every lemma of that shape reuses."""

    templates: list[Template]
    trie: pynini.Fst
    index: dict[str, int]  # code string after the lemma → template index


class CellFiller:
    """Fills cells from a generator: one composition per lemma with a trie of the cell codes.

    Shapes are cached by (classes, part of speech, bound), so a bulk run over a lexicon compiles each
    shape once and then holds nothing per entry.
    """

    def __init__(self, lang: Language) -> None:
        self.lang = lang
        self.generator = lang.fsts["generator"]
        self.space = lang.space
        self._shapes: dict[tuple[tuple[str, ...], str, Bound], Shape] = {}

    def encode(self, template: Template) -> str:
        """The generator-input codes of a template (without the lemma)."""
        to_char = self.space.to_char
        out = []
        for tag, is_pos in zip(template.tags, template.pos_mask):
            key = ("pos:" if is_pos else "feature:") + tag
            out.append(to_char[key] if key in to_char else self._code(tag))
        return "".join(out)

    def _code(self, label: str) -> str:
        for kind in ("feature", "pos"):
            key = f"{kind}:{label}"
            if key in self.space.to_char:
                return self.space.to_char[key]
        raise UserError(f"label {label!r} is not in the compiled language", hint="recompile the grammar (morphfst build)")

    def shape(self, classes: Sequence[str], pos: str, bound: Bound) -> Shape:
        key = (tuple(classes), pos, bound)
        found = self._shapes.get(key)
        if found is None:
            templates: list[Template] = []
            seen: set[tuple[str, ...]] = set()
            for klass in classes:
                for t in cell_templates(self.lang.meta, klass, pos, bound):
                    if t.tags not in seen:
                        seen.add(t.tags)
                        templates.append(t)
            index: dict[str, int] = {}
            for i, t in enumerate(templates):
                index.setdefault(self.encode(t), i)
            trie = strings(index)  # accepts nothing when there are no cells
            found = self._shapes[key] = Shape(templates, trie, index)
        return found

    def fill(self, lemma: str, shape: Shape) -> list[Cell]:
        """The cells of ``lemma`` for ``shape``, in template order, each with its forms."""
        cells = [Cell(lemma, t) for t in shape.templates]
        if not shape.templates or not lemma:
            return cells
        lattice = pynini.compose(acc(lemma) + shape.trie, self.generator)
        if is_empty(lattice):
            return cells
        if lattice.properties(ACYCLIC, True) != ACYCLIC:
            # Only a grammar that inserts material without bound can do this; keep the best paths.
            lattice = pynini.shortestpath(lattice, nshortest=MAX_CYCLIC_PATHS)
        found: dict[int, dict[str, float]] = {}
        n = len(lemma)
        index = shape.index
        it = lattice.paths(input_token_type=TOKEN, output_token_type=TOKEN)
        while not it.done():
            i = index.get(it.istring()[n:])
            if i is not None:
                w = float(it.weight())
                forms = found.setdefault(i, {})
                surface = it.ostring()
                if surface not in forms or w < forms[surface]:
                    forms[surface] = w
            it.next()
        recase = self.lang.normalize(lemma) != lemma
        for i, forms in found.items():
            if recase:
                forms = {restore_case(lemma, f, self.lang.normalize): w for f, w in forms.items()}
            cells[i].forms = rank_forms(forms)
        return cells


def rank_forms(forms: dict[str, float]) -> list[Variant]:
    """Forms with weights → variants, lowest weight first (ties by form), rank 1 is preferred."""
    ordered = sorted(forms.items(), key=lambda kv: (round(kv[1], 6), kv[0]))
    if not ordered:
        return []
    best = ordered[0][1]
    return [Variant(f, w, i + 1, w - best <= WEIGHT_EPSILON) for i, (f, w) in enumerate(ordered)]


# ---------------------------------------------------------------------------------------------
# Readings of a lemma


def find_entries(lang: Language, lemma: str) -> list[dict[str, Any]]:
    """Lexicon entries for ``lemma``: exact match first, then by the language's normalization."""
    lemma = unicodedata.normalize("NFC", lemma.strip())
    exact = lang.entries(lemma)
    if exact:
        return exact
    folded = lang.normalize(lemma)
    return [e for e in lang.meta["lexicon"] if lang.normalize(e["lemma"]) == folded]


def not_found(lang: Language, lemma: str) -> UserError:
    lemmas = sorted({e["lemma"] for e in lang.meta["lexicon"]})
    near = difflib.get_close_matches(lemma, lemmas, n=3)
    classes = ", ".join(f"{name} ({'/'.join(c['pos']) or 'any'})" for name, c in lang.meta["classes"].items())
    hint = (
        f"did you mean {', '.join(near)}? " if near else ""
    ) + f"to try it as a new entry, give its class: --class CLASS (classes: {classes})"
    return UserError(f"{lemma!r} is not in the {lang.name} lexicon", hint=hint)


def compound_paradigms(
    lang: Language,
    lemma: str,
    split: tuple[str, str],
    bound: Bound,
    pos: str | None,
    filler: CellFiller | None,
) -> list[Paradigm]:
    """The tables of a compound the lexicon does not list (``split`` from
    :meth:`Language.compound_split`): its last part's tables with the first parts written before every
    form, since a compound inflects its last part only (*kirjasto* + *autoissa*)."""
    head, tail = split
    out = paradigms(lang, tail, bound, pos, filler)
    for par in out:
        par.lemma = lemma
        par.stems = []
        for cell in par.cells:
            cell.lemma = lemma
            cell.forms = [Variant(head + v.form, v.weight, v.rank, v.preferred) for v in cell.forms]
        par.notes.append(f"not in the lexicon: a compound of {head!r} and the lexicon word {tail!r}, inflected by its last part")
    return out


def paradigms(
    lang: Language,
    lemma: str,
    bound: Bound | None = None,
    pos: str | None = None,
    filler: CellFiller | None = None,
) -> list[Paradigm]:
    """Every reading of a lexicon lemma (one per part of speech, or per entry where entries of one
    part of speech differ), each with all its cells.

    Entries that share lemma and part of speech but differ in class, stem or flags would mix their
    forms in the generator; each is then compiled on its own from the grammar source (when the source
    is there) so that each reading shows only its own forms.
    """
    bound = bound or Bound(layout_only=True)
    entries = find_entries(lang, lemma)
    if pos:
        entries = [e for e in entries if e["pos"] == pos]
    if not entries:
        if pos and find_entries(lang, lemma):
            have = sorted({e["pos"] for e in find_entries(lang, lemma)})
            raise UserError(f"{lemma!r} has no {pos} entry", hint="its parts of speech: " + ", ".join(have))
        split = lang.compound_split(lemma)
        if split is None:
            raise not_found(lang, lemma)
        return compound_paradigms(lang, lemma, split, bound, pos, filler)
    filler = filler or CellFiller(lang)
    groups: dict[tuple[str, str], list[dict[str, Any]]] = {}
    for e in entries:
        groups.setdefault((e["lemma"], e["pos"]), []).append(e)
    out: list[Paradigm] = []
    for group in groups.values():
        distinct = {(e["class"], tuple(e["stem"]), tuple(e["flags"])) for e in group}
        if len(distinct) > 1 and _source_available(lang):
            for e in group:
                par = trial_paradigm(
                    lang,
                    e["lemma"],
                    e["class"],
                    pos=e["pos"],
                    stem="".join(e["stem"]),
                    flags=e["flags"],
                    gloss=e["gloss"],
                    bound=bound,
                )
                par.source = "lexicon"
                par.origins = [_origin(e)]
                par.notes.append("compiled on its own: other entries share this lemma and part of speech")
                out.append(par)
            continue
        notes = []
        if len(distinct) > 1:
            notes.append("entries with different classes, stems or flags share this lemma; their forms are shown together")
        out.append(_paradigm_from(lang, filler, group, bound, "lexicon", notes))
    return out


def _paradigm_from(
    lang: Language, filler: CellFiller, group: list[dict[str, Any]], bound: Bound, source: str, notes: list[str]
) -> Paradigm:
    first = group[0]
    classes = list(dict.fromkeys(e["class"] for e in group))
    cells = filler.fill(first["lemma"], filler.shape(classes, first["pos"], bound))
    return Paradigm(
        lemma=first["lemma"],
        pos=first["pos"],
        classes=classes,
        gloss=" / ".join(dict.fromkeys(e["gloss"] for e in group if e["gloss"])),
        stems=[x for x in dict.fromkeys("".join(e["stem"]) for e in group) if x != lang.normalize(first["lemma"])],
        flags=list(dict.fromkeys(f for e in group for f in e["flags"])),
        source=source,
        origins=[_origin(e) for e in group],
        bound=bound,
        cells=cells,
        notes=notes,
    )


def _origin(entry: dict[str, Any]) -> str:
    if entry.get("file"):
        return f"{entry['file']}:{entry.get('line', 0)}"
    return "command line"


def _source_available(lang: Language) -> bool:
    path = lang.meta.get("grammar_path")
    return isinstance(path, str) and bool(path) and Path(path).exists()


# ---------------------------------------------------------------------------------------------
# Trying a word that is not in the lexicon


def trial_entry(
    grammar: m.Grammar,
    lemma: str,
    klass: str,
    pos: str | None = None,
    stem: str | None = None,
    flags: Sequence[str] = (),
    gloss: str = "",
) -> m.LexEntry:
    """A lexicon entry built from command-line values, checked like a lexicon line."""
    from ..language.normalize import make_normalizer
    from ..language.syntax import parse_form

    where = Position("command line")
    lemma = unicodedata.normalize("NFC", lemma.strip())
    if not lemma:
        raise UserError("empty lemma", where, hint="give the word to inflect")
    if klass not in grammar.classes:
        near = difflib.get_close_matches(klass, list(grammar.classes), n=1)
        listing = ", ".join(f"{c.name} ({'/'.join(c.pos_allowed) or 'any'})" for c in grammar.classes.values())
        raise UserError(
            f"unknown class {klass!r}",
            where,
            hint=(f"did you mean {near[0]!r}? " if near else "") + f"classes of {grammar.name}: {listing}",
        )
    allowed = grammar.classes[klass].pos_allowed or grammar.pos_tags
    if pos is None:
        if len(allowed) != 1:
            raise UserError(
                f"class {klass} allows several parts of speech", where, hint="choose one with --pos: " + ", ".join(allowed)
            )
        pos = allowed[0]
    if pos not in allowed:
        raise UserError(f"part of speech {pos!r} does not fit class {klass}", where, hint="allowed here: " + ", ".join(allowed))
    for flag in flags:
        if flag not in grammar.flags:
            near = difflib.get_close_matches(flag, list(grammar.flags), n=1)
            raise UserError(
                f"unknown flag {flag!r}",
                where,
                hint=(f"did you mean {near[0]!r}? " if near else "") + "flags: " + (", ".join(grammar.flags) or "none declared"),
            )
    fold = make_normalizer(grammar.normalization)
    stem_text = stem or fold(lemma)
    symbols = parse_form(stem_text, where)
    known = set(grammar.letters) | set(grammar.archiphonemes) | set(grammar.markers)
    for sym in symbols:
        base = sym[1:-1] if sym.startswith("(") else sym
        if sym not in known and base not in known:
            raise UserError(
                f"symbol {sym!r} of stem {stem_text!r} is not in the alphabet of {grammar.name}",
                where,
                hint="give the underlying stem with --stem, using the grammar's letters and archiphonemes",
            )
    from ..compile.compiler import Compiler
    from ..compile.stemrules import derive_stems

    entry = m.LexEntry(lemma, klass, pos, gloss, 0.0, symbols, list(flags), where, stem_given=stem is not None)
    derive_stems(grammar, [entry], make=Compiler)
    return entry


def compile_entry(lang: Language, entry_args: dict[str, Any]) -> tuple[Language, m.LexEntry]:
    """Compile one entry with the grammar source ``lang`` was compiled from; returns a language
    whose lexicon is that entry alone."""
    from ..compile.compiler import Compiler
    from ..compile.loader import load_model
    from ..compile.metadata import build_metadata

    path = lang.meta.get("grammar_path")
    if not path or not Path(path).exists():
        raise UserError(
            "the grammar source of this compiled language is not here, so a new entry cannot be compiled",
            hint=f"the language was compiled from {path or 'an unknown file'}; give the grammar file with -l",
        )
    grammar = load_model(path)
    entry = trial_entry(grammar, **entry_args)
    compiler = Compiler(grammar)
    fsts = compiler.entry_fsts([entry])
    meta = build_metadata(grammar, compiler.space)
    meta["lexicon"] = [
        {
            "lemma": entry.lemma,
            "class": entry.klass,
            "pos": entry.pos_tag,
            "gloss": entry.gloss,
            "weight": entry.weight,
            "stem": entry.stem,
            "flags": entry.flags,
            "file": "",
            "line": 0,
        }
    ]
    return Language(fsts, meta, None), entry


def trial_paradigm(
    lang: Language,
    lemma: str,
    klass: str,
    pos: str | None = None,
    stem: str | None = None,
    flags: Sequence[str] = (),
    gloss: str = "",
    bound: Bound | None = None,
) -> Paradigm:
    """The paradigm of a word given with its class (and optionally part of speech, stem and flags),
    whether or not it is in the lexicon: the entry is compiled on its own with the grammar source."""
    bound = bound or Bound(layout_only=True)
    trial, entry = compile_entry(
        lang, {"lemma": lemma, "klass": klass, "pos": pos, "stem": stem, "flags": list(flags), "gloss": gloss}
    )
    notes = []
    in_lexicon = [e for e in lang.entries(entry.lemma) if e["class"] == entry.klass and e["pos"] == entry.pos_tag]
    if not in_lexicon:
        notes.append("not in the lexicon: compiled from the class given on the command line")
    par = _paradigm_from(trial, CellFiller(trial), trial.meta["lexicon"], bound, "command line", notes)
    par.origins = ["command line"]
    return par


# ---------------------------------------------------------------------------------------------
# Plain-data helpers


def iter_forms(cells: Iterable[Cell]) -> Iterator[tuple[str, str, str]]:
    """(lemma, form, features) for every form of every cell, preferred first within a cell."""
    for cell in cells:
        for v in cell.forms:
            yield cell.lemma, v.form, cell.features

"""The language model: plain dataclasses between parsing and compiling.

The parser fills these from a grammar file and lexicon files; the compiler reads only these (it never
sees syntax trees). Every object keeps the :class:`~morphfst.errors.Position` it came from so that
later errors and traces can point at the source line.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from typing import Literal

from ..errors import Position
from .normalize import Normalization

# ---------------------------------------------------------------------------------------------
# Rule and pattern expressions (regular expressions over the grammar's symbols)


@dataclass(frozen=True)
class Sym:
    """One symbol: a letter, an archiphoneme, a marker, a boundary or an optional segment."""

    name: str
    pos: Position | None = field(default=None, compare=False)


@dataclass(frozen=True)
class SetRef:
    """A reference to a named symbol set (``@vowel``)."""

    name: str
    pos: Position | None = field(default=None, compare=False)


@dataclass(frozen=True)
class Klass:
    """A bracketed class of symbols (``[ptk]``)."""

    items: tuple[Expr, ...]
    negated: bool = False


@dataclass(frozen=True)
class Seq:
    items: tuple[Expr, ...]


@dataclass(frozen=True)
class Alt:
    options: tuple[Expr, ...]


@dataclass(frozen=True)
class Repeat:
    """``x*`` (low=0, high=None) or ``x?`` (low=0, high=1)."""

    item: Expr
    low: int
    high: int | None


@dataclass(frozen=True)
class Empty:
    """The empty string (``∅`` or ``""``)."""


@dataclass(frozen=True)
class AnySym:
    """Any symbol of the underlying alphabet (``.``)."""


Expr = Sym | SetRef | Klass | Seq | Alt | Repeat | Empty | AnySym

# ---------------------------------------------------------------------------------------------
# Declarations


@dataclass
class SymbolSet:
    name: str
    members: list[str]  # resolved symbol names
    pos: Position


@dataclass
class Dimension:
    """A feature dimension with its values, in UniMorph labels (Sylak-Glassman 2016)."""

    name: str
    values: list[str]
    pos: Position


@dataclass
class Flag:
    """A lexical exception flag.

    ``marks``: a marker symbol placed right after the stem in the underlying form (rules may refer to
    it; it never reaches the surface). ``blocks``: names of rules that do not apply to entries with
    this flag.
    """

    name: str
    marks: str | None
    blocks: list[str]
    description: str
    pos: Position


@dataclass
class StemClass:
    """An inflection class: the entry point of a lexicon entry into the slot graph."""

    name: str
    next: list[str]
    pos_allowed: list[str]
    apostrophe: bool
    guess: Expr | None
    pos: Position
    stems: list[str] = field(default_factory=list)  # stem-rule groups that turn a lemma into its stem
    open: Expr | None = None  # an open class: every string of letters this pattern accepts is a stem
    weight: float = 0.0  # added to every stem of an open class (a lexicon entry has its own weight)


@dataclass
class Affix:
    """One affix (or zero morph) of a slot."""

    form: list[str]  # underlying symbols; empty for a zero morph
    features: list[str]
    gloss: str
    weight: float
    next: list[str] | None  # None: the slot's followers
    new_pos: str | None  # derivational: the part of speech after this affix
    name: str | None
    slot: str
    pos: Position
    ident: int = -1  # set by the compiler-facing model: index in Grammar.affixes

    @property
    def form_text(self) -> str:
        return "".join(self.form)


@dataclass
class Slot:
    """A position class in the morphotactic graph."""

    name: str
    next: list[str]  # follower slots; "end" ends the word
    affixes: list[Affix]
    pos: Position
    enclitic: bool = False  # may follow any whole word (see Grammar.word_final_slots)


@dataclass
class Constraint:
    """A co-occurrence constraint between features or named affixes anywhere in a word."""

    name: str
    left: str
    kind: Literal["requires", "excludes"]
    right: str
    pos: Position


@dataclass
class Rule:
    """An ordered rewrite rule ``A -> B / L _ R`` (compiled with cdrewrite; Mohri & Sproat 1996)."""

    name: str
    target: Expr
    replacement: Expr
    left: Expr | None
    right: Expr | None
    direction: Literal["ltr", "rtl", "sim"]
    optional: bool
    weight: float
    pos: Position
    text: str
    lenient: bool = False  # accepted when analyzing, never used when generating (spelling tolerance)


@dataclass
class Compound:
    """A ``compound`` block (analysis only): a word of the lexicon whose part of speech or class is in
    ``first``, in one of the feature bundles of ``forms``, joined at a seam to further parts; the last
    part is a word whose part of speech or class is in ``last``, inflected. At most ``parts`` parts,
    each non-last part of at least ``min_letters`` letters; each seam adds ``weight`` (and the weight
    of the heaviest lexicon entry, see the compiler). With ``agree``, every part is in the same bundle
    of ``forms``, the last one too (and in no other features): Finnish compound numerals, whose parts
    share the case of the whole (kahdessakymmenessäkolmessa)."""

    first: list[str]
    forms: list[list[str]]
    last: list[str]
    parts: int
    min_letters: int
    weight: float
    pos: Position
    lines: dict[str, Position] = field(default_factory=dict)  # statement keyword -> where it stands
    agree: bool = False
    # the fewest letters of the last part's lemma (a bound first part that joins only longer words)
    last_min: int = 1
    # named groups of parts of speech or classes, and the order of the parts over them: a regular
    # expression of group names with ( ) | ? * + (every part, the last one too, is of the group its
    # place names, besides being of 'first' or 'last'); empty: any order
    groups: dict[str, list[str]] = field(default_factory=dict)
    order: str = ""
    # the last part's features begin with one of these bundles (affix ids between, any features
    # after); empty: any features
    last_forms: list[list[str]] = field(default_factory=list)
    # the compound's lemma ends with the last part's form in this bundle, as written, instead of the
    # last part's lemma (Turkish dil + bilgi-si: dilbilgisi); empty: the last part's lemma
    lemma_form: list[str] = field(default_factory=list)
    # features of the last part left out of the compound's analysis (its lemma holds them: the
    # possessive of dilbilgisi)
    hide: list[str] = field(default_factory=list)
    # the parts are read without the lenient rules (a word written with the spelling tolerance of
    # the lenient rules is no compound)
    strict: bool = False

    def order_regex(self) -> re.Pattern[str]:
        """The ``order`` expression as a regular expression over the group names of a compound's parts,
        each followed by one space (``"H T U "``); a ``ValueError`` names what is wrong with it."""
        out = []
        for tok in re.findall(r"[A-Za-z_][A-Za-z0-9_\-]*|\S", self.order):
            if tok in "()|?*+":
                out.append("(?:" if tok == "(" else tok)
            elif tok in self.groups:
                out.append(f"(?:{re.escape(tok)} )")
            else:
                raise ValueError(f"{tok!r} is not a group of the block")
        try:
            return re.compile("".join(out))
        except re.error as exc:
            raise ValueError(f"the expression is malformed ({exc.msg})") from None


@dataclass
class TestCase:
    """An inline test: expected analyses, expected generated forms, or a rejected word."""

    kind: Literal["analyze", "exact", "generate", "reject"]
    word: str  # surface word (analyze/exact/reject) or analysis text (generate)
    expected: list[str]
    pos: Position


@dataclass
class Layout:
    """A table layout for one part of speech (rows, columns and sub-table dimensions)."""

    pos_tag: str
    title: str
    rows: list[str]
    columns: list[str]
    tables: list[str]
    fixed: list[str]
    labels: dict[str, str]
    pos: Position


@dataclass
class Implied:
    """One line of an ``implied`` block: a bundle with ``label`` stands for ``labels`` (in order)."""

    label: str
    labels: list[str]
    pos: Position


@dataclass
class Detached:
    """The ``detached`` block: a word with no reading of its own is read as the suffixes of these
    ``hosts`` (each written with what separates it from its suffixes), with part of speech ``pos``."""

    pos_label: str
    hosts: list[str]
    pos: Position


@dataclass
class LexEntry:
    """One lexicon line."""

    lemma: str
    klass: str
    pos_tag: str
    gloss: str
    weight: float
    stem: list[str]  # underlying stem symbols
    flags: list[str]
    pos: Position
    stem_given: bool = True  # False: the stem is the folded lemma, to be rewritten by the class's stem rules


@dataclass
class Grammar:
    """Everything a grammar file and its lexicons declare."""

    name: str
    title: str
    path: str
    lexicon_paths: list[str] = field(default_factory=list)
    letters: list[str] = field(default_factory=list)
    archiphonemes: list[str] = field(default_factory=list)
    markers: list[str] = field(default_factory=list)
    optionals: list[str] = field(default_factory=list)  # "(y)" style optional segments
    sets: dict[str, SymbolSet] = field(default_factory=dict)
    dimensions: dict[str, Dimension] = field(default_factory=dict)
    ud: dict[str, str] = field(default_factory=dict)
    flags: dict[str, Flag] = field(default_factory=dict)
    classes: dict[str, StemClass] = field(default_factory=dict)
    slots: dict[str, Slot] = field(default_factory=dict)
    constraints: list[Constraint] = field(default_factory=list)
    rules: list[Rule] = field(default_factory=list)
    stem_rules: dict[str, list[Rule]] = field(default_factory=dict)  # named groups (``stems NAME { ... }``)
    labels: dict[str, str] = field(default_factory=dict)  # layout labels shared by every layout
    normalization: Normalization = field(default_factory=Normalization)
    tests: list[TestCase] = field(default_factory=list)
    layouts: list[Layout] = field(default_factory=list)
    compounds: list[Compound] = field(default_factory=list)
    # labels of unmarked values a bundle to generate may spell out (UniMorph's IND, POS, ACT), dropped
    # where no form carries them
    unmarked: list[str] = field(default_factory=list)
    # labels a bundle to generate may leave out (UniMorph's V.PTCP;ACT;PRS for V;V.PTCP;ACT;PRS;ADJ;SG;NOM):
    # label -> the bundle it stands for, in order, itself included (see the ``implied`` block)
    implied: dict[str, Implied] = field(default_factory=dict)
    # suffixes split from their word by a tokenizer: their part of speech and the host words they are
    # read after (see the ``detached`` block)
    detached: Detached | None = None
    lexicon: list[LexEntry] = field(default_factory=list)
    sources: list[str] = field(default_factory=list)  # every file read, for the source hash

    @property
    def affixes(self) -> list[Affix]:
        out: list[Affix] = []
        for slot in self.slots.values():
            out.extend(slot.affixes)
        return out

    def enclitic_tail(self) -> set[str]:
        """The enclitic slots and every slot reachable from them: the word ends for good after any of
        them (one enclitic per word), while the other slots' ``end`` may go on into an enclitic."""
        todo = [s.name for s in self.slots.values() if s.enclitic]
        seen: set[str] = set()
        while todo:
            name = todo.pop()
            if name in seen or name not in self.slots:
                continue
            seen.add(name)
            slot = self.slots[name]
            todo.extend(slot.next)
            for affix in slot.affixes:
                todo.extend(affix.next or ())
        return seen

    def dimension_of(self, label: str) -> str | None:
        for dim in self.dimensions.values():
            if label in dim.values:
                return dim.name
        return None

    @property
    def pos_tags(self) -> list[str]:
        dim = self.dimensions.get("pos")
        return list(dim.values) if dim else []

    @property
    def feature_labels(self) -> set[str]:
        """Every label of every dimension but the part of speech."""
        return {v for name, d in self.dimensions.items() if name != "pos" for v in d.values}


MORPH_BOUNDARY = "+"
WORD_START = "^"
WORD_END = "$"
END_SLOT = "end"

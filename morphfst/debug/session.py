"""A debugging session: a compiled language together with its grammar model and compiler.

The saved transducers answer *what* a word is; the debugging tools also need *why*, which only the
grammar source knows (the rule list, flags, the slot graph as data). A :class:`DebugSession` reloads
the language model from ``metadata["grammar_path"]`` once, builds a :class:`~morphfst.compile.compiler.Compiler`
over the compiled language's own symbol space, and caches what the tools recompile (single rules,
per-word lattices) for the life of the session.
"""

from __future__ import annotations

from collections import defaultdict
from collections.abc import Callable
from collections.abc import Set as AbstractSet
from functools import cached_property, partial
from pathlib import Path
from typing import Any

import pynini

from ..build import load
from ..compile.compiler import Compiler, build_space
from ..compile.fstutil import Arc, Weight, acc, cross, union
from ..compile.loader import load_model
from ..compile.metadata import file_hash
from ..errors import Position, UserError
from ..language import model as m
from ..runtime.compiled_language import Language

_SESSIONS: dict[str, DebugSession] = {}


class DebugSession:
    """A compiled language plus what the debugging tools rebuild from its grammar source."""

    def __init__(self, lang: Language) -> None:
        self.lang = lang
        self.meta = lang.meta
        self.space = lang.space
        self._back_lattices: dict[tuple[str, frozenset[str]], tuple[int, pynini.Fst]] = {}
        self._lattices: dict[tuple[str, frozenset[str]], pynini.Fst] = {}
        self._surface_acceptor: pynini.Fst | None = None
        self._memo: dict[Any, Any] = {}

    def memo(self, key: Any, build: Callable[[], Any]) -> Any:
        """A value built once per session (machines that do not depend on the word)."""
        if key not in self._memo:
            self._memo[key] = build()
        return self._memo[key]

    @classmethod
    def open(cls, lang: Language | DebugSession | str | Path) -> DebugSession:
        """A session for a language object, a shipped grammar name, a grammar file or a compiled file."""
        if isinstance(lang, DebugSession):
            return lang
        if not isinstance(lang, Language):
            lang = load(lang)
        key = f"{lang.path}:{lang.meta.get('digest', '')}:{id(lang)}"
        if key not in _SESSIONS:
            _SESSIONS[key] = cls(lang)
        return _SESSIONS[key]

    # ---- the grammar model -------------------------------------------------------------------------
    @cached_property
    def grammar(self) -> m.Grammar:
        """The language model reloaded from the grammar source the language was compiled from."""
        path = Path(self.meta.get("grammar_path", ""))
        if not path.is_file():
            raise UserError(
                f"the grammar source of {self.meta['name']} is not here: {path}",
                hint="the debugging tools read the grammar source; run them on the grammar file (.mfg) or keep it beside the compiled file",
            )
        for src in self.meta.get("sources", []):
            p = Path(src["path"])
            if p.exists() and file_hash(p) != src["sha256"]:
                raise UserError(
                    f"{p} changed after {self.meta['name']} was compiled",
                    Position(str(p)),
                    hint="give the grammar file (.mfg) instead of the compiled file, so that it is recompiled, or rebuild with 'morphfst build'",
                )
        grammar = load_model(path)
        fresh = build_space(grammar)
        for name, code in fresh.to_char.items():
            if self.space.to_char.get(name) != code:
                raise UserError(
                    f"the compiled language and its grammar source disagree about symbol {name!r}",
                    Position(str(path)),
                    hint="rebuild the compiled file from this grammar",
                )
        return grammar

    @cached_property
    def compiler(self) -> Compiler:
        return Compiler(self.grammar, self.space)

    @cached_property
    def affixes(self) -> dict[int, m.Affix]:
        return {a.ident: a for a in self.grammar.affixes}

    @cached_property
    def entries_by_lemma(self) -> dict[tuple[str, str], list[m.LexEntry]]:
        out: dict[tuple[str, str], list[m.LexEntry]] = defaultdict(list)
        for e in self.grammar.lexicon:
            out[(e.lemma, e.pos_tag)].append(e)
        return out

    @cached_property
    def letters(self) -> list[str]:
        """The one-character codes of the grammar's letters (the surface alphabet)."""
        return [self.space.code(x) for x in self.grammar.letters]

    @cached_property
    def analysis_filter(self) -> pynini.Fst | None:
        """The constraint filter over every letter and lemma character (None without constraints)."""
        chars = set(self.letters) | {ch for e in self.grammar.lexicon for ch in e.lemma}
        return self.compiler.constraint_filter(chars)

    def blocked_rules(self, flags: list[str]) -> frozenset[str]:
        return frozenset(r for f in flags for r in self.grammar.flags[f].blocks)

    def rule(self, name: str) -> m.Rule:
        for r in self.grammar.rules:
            if r.name == name:
                return r
        raise KeyError(name)

    # ---- symbols -------------------------------------------------------------------------------------
    def names(self, codes: str) -> list[str]:
        """A string of symbol codes as symbol names."""
        return self.space.decode(codes)

    def render(self, codes: str) -> str:
        """A string of symbol codes as readable text (``^kitap+(y)I$``)."""
        return "".join(self.names(codes))

    def encode_underlying(self, entry: m.LexEntry, affix_ids: list[int]) -> str:
        """The underlying form of an entry with an affix chain, exactly as stem_fst + slot_graph write it."""
        s = self.space
        out = s.code(m.WORD_START) + s.encode(entry.stem)
        for flag in entry.flags:
            marker = self.grammar.flags[flag].marks
            if marker:
                out += s.code(marker)
        if self.grammar.classes[entry.klass].apostrophe and "'" in s.to_char:
            out += s.code("'")
        for ident in affix_ids:
            affix = self.affixes[ident]
            if affix.form:
                out += s.code(m.MORPH_BOUNDARY) + s.encode(affix.form)
        return out + s.code(m.WORD_END)

    # ---- machines reused by the tools ------------------------------------------------------------------
    @cached_property
    def realize(self) -> pynini.Fst:
        """Output of the rule cascade → surface without boundaries (final step, then boundaries deleted)."""
        return pynini.compose(self.compiler.final_step(), self.compiler.delete_boundaries()).optimize()

    def rules_for(self, blocked: frozenset[str]) -> list[m.Rule]:
        return [r for r in self.grammar.rules if r.name not in blocked]

    def lattice(self, surface: str, blocked: frozenset[str] = frozenset()) -> pynini.Fst:
        """Every string before the first rule whose rule output is ``surface``: :meth:`back_lattice` run
        to the cascade's start. Dearer than :meth:`match` (the marker bookkeeping inverted), but built
        once per word and blocked set and then composed cheaply with many machines: the guessed stems
        of every class and flag."""
        key = (surface, blocked)
        if key not in self._lattices:
            k, fst = self.back_lattice(surface, blocked)
            # sorted once here, or every composition with a guess machine sorts its own copy first
            self._lattices[key] = self._invert(fst, k, blocked, limit=None)[1].arcsort("ilabel")
        return self._lattices[key]

    def back_lattice(self, surface: str, blocked: frozenset[str] = frozenset()) -> tuple[int, pynini.Fst]:
        """(k, the strings before rule k whose rule output is ``surface``), built right to left from the
        word and stopped at the first stage past :data:`SPLIT_STATES` states.

        Composing from the word backwards keeps every step small: only strings that can still reach
        the word survive, and each step is made a trimmed, determinized, minimized acceptor of its input
        side (:func:`_shrink`); the stem-region filters keep out markers no underlying form has there.
        The first rules of a cascade mostly move and drop the markers of flags and classes; inverted,
        each lets a marker in after any letter, and the lattice doubles with every one of them (a
        Finnish word: 25,000 states and minutes). :meth:`match` runs those rules forward on the
        machine instead, where each marker stands only where the stems put it."""
        key = (surface, blocked)
        if key not in self._back_lattices:
            n = len(self.rules_for(blocked))
            word = _shrink(pynini.compose(self._stem_region_filters(blocked)[n], pynini.compose(self.realize, acc(surface))))
            self._back_lattices[key] = self._invert(word, n, blocked, limit=SPLIT_STATES)
        return self._back_lattices[key]

    def _invert(self, fst: pynini.Fst, k: int, blocked: frozenset[str], limit: int | None) -> tuple[int, pynini.Fst]:
        """The lattice ``fst`` of the strings before rule ``k`` carried back over the rules before it, one
        at a time, until the cascade's start, an empty lattice or (with a ``limit``) one past ``limit``
        states; returns the stage reached and its lattice."""
        cascade = self.rules_for(blocked)
        filters = self._stem_region_filters(blocked)
        while k > 0 and fst.num_states() and (limit is None or fst.num_states() <= limit):
            k -= 1
            fst = _shrink(pynini.compose(filters[k], pynini.compose(self.compiler.rule_fst(cascade[k]), fst)))
        return k, fst

    def match(self, machine: pynini.Fst, surface: str, blocked: frozenset[str] = frozenset()) -> pynini.Fst:
        """The paths of ``machine`` (analysis to underlying form) whose rule output (the cascade without
        the rules ``blocked``) is ``surface``, as a machine from analysis to an intermediate form: the
        analyses and weights that running the machine through the whole cascade and keeping what gives
        the word would find, built from both ends (the first rules forward on the machine, the rest
        backward from the word: :meth:`back_lattice`)."""
        k, back = self.back_lattice(surface, blocked)
        if back.num_states() == 0:
            return back
        fwd = machine.copy().optimize()
        for i, rule in enumerate(self.rules_for(blocked)[:k], start=1):
            fwd = pynini.compose(fwd, self.compiler.rule_fst(rule)).connect()
            if fwd.num_states() == 0:
                return fwd
            if i % OPTIMIZE_EVERY == 0:  # made small again now and then (a Finnish machine: 17,000 -> 1,800 states)
                fwd = fwd.optimize()
        return pynini.compose(fwd, back).connect()

    @cached_property
    def stem_region_symbols(self) -> frozenset[str]:
        """Markers and archiphonemes that no affix form holds: in an underlying form they come only from
        the stem (the lexicon's stems, stem rules, flag markers), so before the first morph boundary."""
        s = self.space
        in_affixes = {sym for a in self.grammar.affixes for sym in a.form}
        names = [*self.grammar.markers, *self.grammar.archiphonemes]
        return frozenset(s.code(n) for n in names if n not in in_affixes and n in s.to_char)

    def _writes(self, rule: m.Rule) -> frozenset[str]:
        """The symbols ``rule`` writes (output labels of its arcs that change a symbol)."""

        def build() -> frozenset[str]:
            fst = self.compiler.rule_fst(rule)
            return frozenset(
                chr(arc.olabel) for state in fst.states() for arc in fst.arcs(state) if arc.olabel and arc.olabel != arc.ilabel
            )

        return self.memo(("writes", rule.name), build)

    def _stem_region_filters(self, blocked: frozenset[str]) -> list[pynini.Fst]:
        """For each stage i of the cascade without the rules ``blocked`` (the strings before rule i;
        stage len(cascade) is the output),
        an acceptor of the strings in which no stem-region symbol stands after a morph boundary, leaving
        out the symbols that a rule before stage i writes (they may stand anywhere by then).

        Every string a stage holds obeys its filter (a rule only deletes or keeps a symbol it does not
        write), so the lattice loses nothing by it; without it the inverse of a rule that deletes a flag
        marker lets the marker in after every morph, and the lattice doubles with each such rule."""

        def build() -> list[pynini.Fst]:
            cascade = self.rules_for(blocked)
            plus = self.compiler.plus
            sigma = sorted(set(self.space.to_char.values()))
            out: list[pynini.Fst] = []
            written: set[str] = set()
            for i in range(len(cascade) + 1):
                if i:
                    written |= self._writes(cascade[i - 1])
                kept = set() if plus in written else self.stem_region_symbols - written
                out.append(self.memo(("stem-region", frozenset(kept)), partial(_boundary_filter, sigma, plus, kept)))
            return out

        return self.memo(("stem-region-filters", blocked), build)

    @property
    def surface_acceptor(self) -> pynini.Fst:
        """Every word the language accepts, as an acceptor weighted by its best analysis."""
        if self._surface_acceptor is None:
            fst = self.lang.fsts["analyzer"].copy().project("input").rmepsilon()
            fst.arcsort("ilabel")
            self._surface_acceptor = fst
        return self._surface_acceptor

    def stem_group_fst(self, entries: list[m.LexEntry], graph: Callable[[list[str]], pynini.Fst] | None = None) -> pynini.Fst:
        """Stems of ``entries`` followed by their classes' slot graphs (or by ``graph(start slots)``)."""
        by_class: dict[tuple[str, ...], list[m.LexEntry]] = defaultdict(list)
        for e in entries:
            by_class[tuple(self.grammar.classes[e.klass].next)].append(e)
        parts = []
        for starts, group in by_class.items():
            tail = graph(list(starts)) if graph is not None else self.compiler.slot_graph(list(starts))
            parts.append(self.compiler.stem_fst(group) + tail)
        return union(parts)

    def groups(self, entries: list[m.LexEntry]) -> dict[frozenset[str], list[m.LexEntry]]:
        """Entries grouped by the set of rules their flags block (each group has its own cascade)."""
        out: dict[frozenset[str], list[m.LexEntry]] = defaultdict(list)
        for e in entries:
            out[self.blocked_rules(e.flags)].append(e)
        return out

    def reachable_slots(self, starts: list[str]) -> list[str]:
        """Slots reachable from ``starts`` through any edges of the slot graph, in declaration order."""
        seen: set[str] = set()
        todo = list(starts)
        while todo:
            name = todo.pop()
            if name == m.END_SLOT or name in seen:
                continue
            seen.add(name)
            slot = self.grammar.slots[name]
            todo.extend(slot.next)
            for a in slot.affixes:
                todo.extend(a.next or [])
        return [name for name in self.grammar.slots if name in seen]

    def affix_path(self, affix: m.Affix) -> pynini.Fst:
        """One affix as in slot_graph: affix id and features on the analysis side, ``+form`` below."""
        s = self.space
        labels = s.code(f"affix:{affix.ident}")
        for f in affix.features:
            labels += s.code(f"feature:{f}") if f"feature:{f}" in s.to_char else s.code(f"pos:{f}")
        if affix.new_pos:
            labels += s.code(f"pos:{affix.new_pos}")
        form = s.code(m.MORPH_BOUNDARY) + s.encode(affix.form) if affix.form else ""
        return cross(labels, form)

    def decode_internal(self, internal: str) -> tuple[str, str, list[int]]:
        """(lemma, part of speech, affix ids) of an internal analysis string."""
        kinds = self.space.kinds
        i = 0
        while i < len(internal) and kinds.get(internal[i]) != "pos":
            i += 1
        lemma = internal[:i]
        pos = self.space.name(internal[i]).split(":", 1)[1] if i < len(internal) else "?"
        ids = [int(self.space.name(c).split(":", 1)[1]) for c in internal[i + 1 :] if kinds.get(c) == "affix"]
        return lemma, pos, ids

    def analysis_text(self, internal: str) -> str:
        """The public analysis text (``lemma POS;FEAT``) of an internal analysis string."""
        kinds = self.space.kinds
        lemma, pos, _ = self.decode_internal(internal)
        tags = [pos] + [
            self.space.name(c).split(":", 1)[1] for c in internal[len(lemma) + 1 :] if kinds.get(c) in {"feature", "pos"}
        ]
        return f"{lemma} {';'.join(tags)}"

    def entry_info(self, entry: m.LexEntry) -> dict[str, Any]:
        return {
            "lemma": entry.lemma,
            "class": entry.klass,
            "pos": entry.pos_tag,
            "stem": "".join(entry.stem),
            "flags": list(entry.flags),
            "file": entry.pos.file,
            "line": entry.pos.line,
        }


def _boundary_filter(sigma: list[str], plus: str, stem_only: AbstractSet[str]) -> pynini.Fst:
    """Strings over ``sigma`` with no symbol of ``stem_only`` after the first ``plus``."""
    fst = pynini.Fst()
    one = Weight.one(fst.weight_type())
    before, after = fst.add_state(), fst.add_state()
    fst.set_start(before)
    fst.set_final(before)
    fst.set_final(after)
    for code in sigma:
        label = ord(code)
        fst.add_arc(before, Arc(label, label, one, after if code == plus else before))
        if code not in stem_only:
            fst.add_arc(after, Arc(label, label, one, after))
    return fst.arcsort("olabel")


SHRINK_STATES = 1_000_000  # a determinized lattice step larger than this is kept as it was
SPLIT_STATES = 400  # a right-to-left lattice past this size leaves the earlier rules to the forward side
OPTIMIZE_EVERY = 10  # rules run forward between two optimizations of the machine


def _shrink(fst: pynini.Fst) -> pynini.Fst:
    """The input side of ``fst`` as a trimmed, epsilon-free, determinized and minimized acceptor."""
    fst = fst.connect().project("input").rmepsilon()
    if fst.num_states() == 0:
        return fst
    # determinizing bounds the machine (the inserted markers collapse into one set of states); the
    # state limit keeps a pathological grammar from running away: past it, the plain machine is kept
    small = pynini.determinize(fst, nstate=SHRINK_STATES)
    if small.num_states() >= SHRINK_STATES:
        return fst
    return small.minimize()

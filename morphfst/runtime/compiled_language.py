"""The runtime API: a compiled language that analyzes, generates and segments words.

``analyze`` walks the bounded analyzer (internal analysis → surface with morph boundaries) from
Python (:mod:`morphfst.runtime.walk`), so every analysis comes with its surface morphs aligned with
glosses and features; ``analyze_composed`` gives the same analyses by composition with the segmenter
and the bounded analyzer. Ties are broken by the analysis text, so the order is deterministic.
"""

from __future__ import annotations

import itertools
import re
from collections.abc import Mapping, Sequence
from functools import cached_property, lru_cache
from typing import TYPE_CHECKING, Any

from ..compile.archive import LazyFsts, Metadata
from ..compile.arctable import Arcs, FstArcs
from ..errors import UserError
from ..language.normalize import Normalization, make_normalizer, restore_case
from ..language.symbols import GUESS_SYMBOL, PRIVATE_START, SymbolSpace
from .hyphenated import HYPHEN, hyphenated
from .results import Analysis, Form, Segmentation
from .walk import FastAnalyzer

if TYPE_CHECKING:  # pynini is imported by the methods that compose (reference path, generation), not to walk
    import pynini

_UNREADABLE = re.compile(f"[\\x00{chr(PRIVATE_START)}-\\U0010ffff]")  # NUL cuts pynini strings; the rest is ours
MAX_PATHS = 200
MAX_WORD = 1000  # longer tokens are not words; they get no analysis
MAX_UNMARKED = 4  # at most this many unmarked labels of a bundle are tried left out (15 more generations)


class Language:
    """A compiled language. Build one with :func:`morphfst.load`."""

    def __init__(self, fsts: Mapping[str, pynini.Fst], meta: dict[str, Any], path: str | None = None) -> None:
        self.fsts = fsts
        self.meta = meta
        self.path = path
        self.name: str = meta["name"]
        self.title: str = meta["title"]
        self.space = SymbolSpace.from_json(meta["space"])
        self.ud: dict[str, str] = meta["ud"]
        self.dimensions: dict[str, list[str]] = meta["dimensions"]
        norm = meta["normalization"]
        self.normalize = make_normalizer(Normalization([tuple(p) for p in norm["maps"]], norm["lowercase"], norm["apostrophes"]))
        self.affixes: dict[int, dict[str, Any]] = {}
        for slot_name, slot in meta["slots"].items():
            for affix in slot["affixes"]:
                self.affixes[affix["id"]] = affix | {"slot": slot_name}
        self._glosses: Mapping[tuple[str, str], str] | None = None
        self._by_lemma: dict[str, list[dict[str, Any]]] | None = None
        self.plus = self.space.code("+")
        self.analyze_cached = lru_cache(maxsize=65536)(self._analyze_tuple)
        self._fast: FastAnalyzer | None = None
        self._orders: dict[str, str] = {}  # label codes in an order that generated nothing -> one that did

    # ---- analysis ---------------------------------------------------------------------------------
    def analyze(self, word: str, guess: bool = False) -> list[Analysis]:
        """All analyses of ``word``, best (lowest weight) first; an empty list when there is none.

        With ``guess=True``, a word with no analysis gets the guesser's analyses instead (see :meth:`guess`).
        """
        found = list(self.analyze_cached(word))
        if not found and guess:
            return self.guess(word)
        return found

    @property
    def fast(self) -> FastAnalyzer:
        """The fast path (arc tables walked in Python; built on first use): same analyses, plus guesses."""
        if self._fast is None:
            self._fast = FastAnalyzer(self)
        return self._fast

    def arcs(self, name: str) -> Arcs:
        """The arcs of transducer ``name`` as the walk reads them (the compiled file's packed table
        when there is one)."""
        if isinstance(self.fsts, LazyFsts):
            return self.fsts.arcs(name)
        return FstArcs(self.fsts[name])

    def guess(self, word: str) -> list[Analysis]:
        """Guessed analyses of ``word``: a stem of the shape a class's ``guess`` pattern allows, a valid
        affix chain and the same rules; each is marked ``guessed`` and weighs more than any analysis with
        a lexicon stem. Empty when the grammar declares no guess pattern."""
        return self.fast.guess(word)

    def _analyze_tuple(self, word: str) -> tuple[Analysis, ...]:
        return tuple(self.fast.analyze(word))

    def analyze_composed(self, word: str) -> list[Analysis]:
        """The same analyses as :meth:`analyze`, by FST composition (segmenter, then bounded analyzer).

        This is the reference path: :meth:`analyze` walks the bounded analyzer's arcs in Python
        (:mod:`morphfst.runtime.walk`), which is several times faster; the tests check that both agree.
        """
        return list(self._composed(word))

    def _composed(self, word: str) -> tuple[Analysis, ...]:
        surface = self.normalize(word)
        if not self.acceptable(surface):
            return ()
        found = self._composed_surface(surface, word)
        if not found and HYPHEN in surface:
            return tuple(hyphenated(surface, word, self._composed_surface))
        if not found:
            return tuple(self.fast.detached(surface, self._composed_surface))
        return found

    def _composed_surface(self, surface: str, written: str | None = None) -> tuple[Analysis, ...]:
        if not self.acceptable(surface):
            return ()
        import pynini

        from ..compile.fstutil import acc, paths

        found: list[tuple[str, str, float]] = []
        for bounded, _ in self._bounded(surface):
            lattice = pynini.compose(acc(bounded), self.fsts["bounded"])
            found.extend((bounded, internal, weight) for _, internal, weight in paths(lattice, MAX_PATHS))
        # the same decoding, deduplication and ranking as the arc walk: only the path search differs
        return tuple(self.fast.decode_all(surface, found, False, written))

    def acceptable(self, surface: str) -> bool:
        """False for words the transducers cannot read: empty, too long, or using reserved code points."""
        return 0 < len(surface) <= MAX_WORD and _UNREADABLE.search(surface) is None

    def _bounded(self, surface: str) -> list[tuple[str, float]]:
        import pynini

        from ..compile.fstutil import acc, is_empty, paths

        lattice = pynini.compose(acc(surface), self.fsts["segmenter"])
        if is_empty(lattice):
            return []
        found: dict[str, float] = {}
        for _, bounded, weight in paths(lattice, MAX_PATHS):
            found[bounded] = min(weight, found.get(bounded, weight))
        return sorted(found.items(), key=lambda kv: (round(kv[1], 5), kv[0]))

    def segment(self, word: str, guess: bool = False) -> list[Segmentation]:
        """Distinct splits of ``word`` into surface morphs, best first, each with its analyses; with
        ``guess``, a word the lexicon does not know is split by the guesser's analyses (marked ``guessed``)."""
        groups: dict[tuple[str, ...], list[Analysis]] = {}
        for analysis in self.analyze(word, guess=guess):
            key = tuple(m.form for m in analysis.morphs if m.kind == "stem" or m.underlying)
            groups.setdefault(key, []).append(analysis)
        # analyses arrive ranked, so the first analysis of each split decides the split's rank
        return [Segmentation(self.normalize(word), key, group[0].weight, tuple(group)) for key, group in groups.items()]

    def accepts(self, word: str) -> bool:
        """True when ``word`` has at least one analysis (one composition, no decoding)."""
        surface = self.normalize(word)
        if not self.acceptable(surface):
            return False
        import pynini

        from ..compile.fstutil import acc, is_empty

        if not is_empty(pynini.compose(acc(surface), self.fsts["analyzer"]).connect()):
            return True
        return HYPHEN in surface and bool(self.analyze(word))

    # ---- generation -------------------------------------------------------------------------------
    def labels(self) -> dict[str, str]:
        """Every feature and part-of-speech label with its dimension."""
        return {v: d for d, values in self.dimensions.items() for v in values}

    def _code_of(self, label: str) -> str | None:
        """The symbol of a part-of-speech or feature label, ``None`` for a label the grammar lacks."""
        to_char = self.space.to_char
        return to_char.get(f"pos:{label}") or to_char.get(f"feature:{label}")

    def _label_code(self, label: str) -> str:
        code = self._code_of(label)
        if code is not None:
            return code
        known = sorted(self.labels())
        import difflib

        near = difflib.get_close_matches(label, known, n=1)
        raise UserError(
            f"unknown feature label {label!r}",
            hint=(f"did you mean {near[0]!r}? " if near else "") + "labels: " + " ".join(known),
        )

    def generate(self, lemma: str, features: str | Sequence[str], guess: bool = False) -> list[Form]:
        """Surface forms of ``lemma`` with ``features`` (``"N;PL;LOC"`` or a list), best first.

        The labels may be given in any order: when the given order has no form, every order is tried (an
        acceptor over the permutations of the labels), and the order found is remembered, so that the next
        call with the labels in the same order (any lemma) tries that order first, as fast as labels in
        the grammar's order.

        With ``guess``, a lemma that gives no form (one the lexicon lacks) is inflected as the guesser
        would read it: as a stem of each class whose ``guess`` pattern allows its shape, through the
        same slots and rules (see :meth:`generate_guessed`).
        """
        labels, codes = self._labels(features)
        forms = self._generate_spelled(lemma, labels, codes, guess)
        if forms:
            return forms
        # labels the bundle leaves out where the grammar writes them (UniMorph's V.PTCP;ACT;PRS: the
        # participle's nominative singular): added as the grammar's ``implied`` block says
        filled = self.implied_bundle(labels)
        if filled == labels:
            return []
        return self._generate_spelled(lemma, filled, [self._label_code(f) for f in filled], guess)

    def implied_bundle(self, labels: list[str]) -> list[str]:
        """``labels`` with what the grammar's ``implied`` block adds to them: for the first label that
        has a line there, the line's labels in its order, that label's place taking the bundle's other
        labels after it; a label of the line is added only where the bundle has no label of its
        dimension (a part of speech only where the bundle lacks that very one). Unchanged when no
        label has a line."""
        implied: dict[str, list[str]] = self.meta.get("implied") or {}
        trigger = next((f for f in labels if f in implied), None)
        if trigger is None:
            return labels
        line = implied[trigger]
        dimension = self.labels()
        given = {dimension.get(f) for f in labels} - {"pos"}
        out: list[str] = []
        for f in line:
            if f == trigger:
                out.append(f)
                out.extend(g for g in labels if g not in line)
            elif f in labels or dimension.get(f) not in given:
                out.append(f)
        return out

    def _generate_spelled(self, lemma: str, labels: list[str], codes: list[str], guess: bool) -> list[Form]:
        """:meth:`_generate_bundle`, then with the grammar's unmarked labels that the bundle spells out
        (UniMorph's V;IND;PRS;ACT;1;SG where the active is unwritten) left out, fewest first, until a
        form is found."""
        forms = self._generate_bundle(lemma, labels, codes, guess)
        if forms:
            return forms
        unmarked = set(self.meta.get("unmarked") or ())
        optional = [i for i, label in enumerate(labels) if label in unmarked]
        for size in range(1, min(len(optional), MAX_UNMARKED) + 1):
            for left_out in itertools.combinations(optional, size):
                kept = [i for i in range(len(labels)) if i not in left_out]
                forms = self._generate_bundle(lemma, [labels[i] for i in kept], [codes[i] for i in kept], guess)
                if forms:
                    return forms
        return []

    def _generate_bundle(self, lemma: str, labels: list[str], codes: list[str], guess: bool) -> list[Form]:
        """:meth:`generate` for exactly these labels: the lexicon's forms, else a compound's, else (with
        ``guess``) the guesser's."""
        forms = self._generate_with(self.fsts["generator"], lemma, labels, codes)
        if not forms:
            forms = self._generate_compound(lemma, labels)
        if not forms and self.normalize(lemma) != lemma:
            # a lemma with capitals the lexicon lists in lower case or not at all: a name read from its
            # apostrophe (Karadenizspor'un: Karadenizspor) generates its word again
            forms = self._generate_folded(self.fsts["generator"], lemma, labels, codes)
        if not forms and guess:
            forms = self._generate_guessed(lemma, labels, codes)
        return forms

    def _labels(self, features: str | Sequence[str]) -> tuple[list[str], list[str]]:
        """The labels of a feature bundle (``"N;PL;LOC"`` or a list) and their codes; an unmarked label
        the grammar has no feature for (Turkish ``IND``, ``POS``) is left out, any other unknown label
        is a user error."""
        labels = [f.strip() for f in (features.split(";") if isinstance(features, str) else features) if f.strip()]
        unmarked = self.meta.get("unmarked") or ()
        if unmarked:
            labels = [f for f in labels if f not in unmarked or self._code_of(f) is not None]
        return labels, [self._label_code(f) for f in labels]

    def generate_guessed(self, lemma: str, features: str | Sequence[str]) -> list[Form]:
        """Forms of ``lemma`` as a guessed stem (marked ``guessed``, weighing what a guessed analysis
        weighs), whether or not the lexicon has it: the guesser's transducer run from the analysis side,
        so a form generated here is one that :meth:`guess` reads back as ``lemma`` with ``features``.
        Empty when no class has a ``guess`` pattern that allows the lemma's shape."""
        return self._generate_guessed(lemma, *self._labels(features))

    def _generate_guessed(self, lemma: str, labels: list[str], codes: list[str]) -> list[Form]:
        # a guessed stem is written in the folded case of the guess patterns: Tırzop as tırzop
        generator = self._guess_generator
        return [] if generator is None else self._generate_folded(generator, lemma, labels, codes, guessed=True)

    def _generate_folded(
        self, generator: pynini.Fst, lemma: str, labels: list[str], codes: list[str], guessed: bool = False
    ) -> list[Form]:
        """The forms of ``lemma`` generated from its folded spelling through ``generator``, written back
        in the lemma's capitals (Tırzop'a, Karadenizspor'un)."""
        folded = self.normalize(lemma)
        analysis = f"{lemma} {';'.join(labels)}"
        return [
            Form(restore_case(lemma, f.form, self.normalize) if folded != lemma else f.form, f.weight, analysis, guessed)
            for f in self._generate_with(generator, folded, labels, codes)
        ]

    @cached_property
    def _guess_generator(self) -> pynini.Fst | None:
        """The guesser inverted (analysis -> surface) with the guess marker and affix ids read as nothing
        and the morph boundaries written as nothing: what the generator is to the bounded analyzer
        (built on first use; the guesser is small). None when the grammar has no guesser."""
        if "guesser" not in self.fsts:
            return None
        silent = [(ord(c), 0) for c, kind in self.space.kinds.items() if kind == "affix"]
        mark = self.space.to_char.get(GUESS_SYMBOL)
        if mark:
            silent.append((ord(mark), 0))
        fst = self.fsts["guesser"].copy().invert()
        fst.relabel_pairs(ipairs=silent, opairs=[(ord(self.plus), 0)])
        return fst.arcsort("ilabel")

    def _generate_with(self, generator: pynini.Fst, lemma: str, labels: list[str], codes: list[str]) -> list[Form]:
        """:meth:`generate` through ``generator`` (labels in the order given, else in any order)."""
        import pynini

        from ..compile.fstutil import acc, paths

        analysis = f"{lemma} {';'.join(labels)}"
        given = "".join(codes)
        known = self._orders.get(given)  # an order that served these labels when the given one did not
        forms = self._generate_from(generator, acc(lemma + known), analysis) if known else []
        if not forms:
            forms = self._generate_from(generator, acc(lemma + given), analysis)
        if not forms and 1 < len(codes) <= 8:
            lattice = pynini.compose(acc(lemma) + _permutations(codes), generator)
            found = paths(lattice, MAX_PATHS)
            forms = _forms(found, analysis)
            if found and len(self._orders) < 10_000:
                self._orders[given] = min(found, key=lambda p: p[2])[0][len(lemma) :]
        if forms and self.normalize(lemma) != lemma:
            # surface stems are in folded case: write the lemma's letters as the lemma does (Ankara'da)
            forms = [Form(restore_case(lemma, f.form, self.normalize), f.weight, f.analysis) for f in forms]
        return forms

    def compound_split(self, lemma: str) -> tuple[str, str] | None:
        """``(first parts, last part)`` of a compound the grammar analyzes but the lexicon does not list
        (Finnish *kirjastoauto*: ``("kirjasto", "auto")``, *kaupunginkirjasto*: ``("kaupungin",
        "kirjasto")``): ``lemma`` must be that compound's citation form (an analysis of it has it as its
        lemma) and the last part a lexicon lemma. None for a lexicon lemma or any other word."""
        if self.entries(lemma):
            return None
        for reading in self.analyze(lemma):
            stems = [i for i, m in enumerate(reading.morphs) if m.kind == "stem"]
            if reading.lemma != lemma or len(stems) < 2:
                continue
            head = "".join(m.form for m in reading.morphs[: stems[-1]])
            tail = lemma[len(head) :] if head and lemma.startswith(head) else ""
            if tail and self.entries(tail):
                return head, tail
        return None

    def _generate_compound(self, lemma: str, labels: list[str]) -> list[Form]:
        """The forms of a compound the lexicon does not list (:meth:`compound_split`): a compound
        inflects its last part only, so the last part's forms are generated and the first parts
        written before them as the lemma writes them (*kirjasto* + *autoissa*)."""
        split = self.compound_split(lemma)
        if split is None:
            return []
        head, tail = split
        analysis = f"{lemma} {';'.join(labels)}"
        return [Form(head + f.form, f.weight, analysis) for f in self.generate(tail, labels)]

    def _generate_from(self, generator: pynini.Fst, query: pynini.Fst, analysis: str) -> list[Form]:
        import pynini

        from ..compile.fstutil import paths

        return _forms(paths(pynini.compose(query, generator), MAX_PATHS), analysis)

    def generate_text(self, analysis: str) -> list[Form]:
        """Generate from an analysis text ``lemma POS;FEAT;...``."""
        lemma, _, bundle = analysis.strip().rpartition(" ")
        if not lemma:
            raise UserError(f"malformed analysis {analysis!r}", hint="write it as: lemma POS;FEAT;FEAT")
        return self.generate(lemma, bundle)

    def expect_many_words(self) -> None:
        """Get ready to decode many words (a corpus run): the glosses are read whole now instead of
        being looked up in their text one by one (:class:`morphfst.compile.archive.Glosses`; a process
        that forks workers calls this first, so they share the table instead of each building it)."""
        read_all = getattr(self.glosses, "read_all", None)
        if read_all is not None:
            read_all()

    # ---- information -----------------------------------------------------------------------------------
    @property
    def glosses(self) -> Mapping[tuple[str, str], str]:
        """The gloss of every (lemma, part of speech) of the lexicon (the first entry's), read on first use."""
        if self._glosses is None:
            if isinstance(self.meta, Metadata) and not self.meta.is_loaded("lexicon") and "glosses" in self.meta:
                self._glosses = self.meta["glosses"]
            else:
                found: dict[tuple[str, str], str] = {}
                for entry in self.meta["lexicon"]:
                    found.setdefault((entry["lemma"], entry["pos"]), entry["gloss"])
                self._glosses = found
        return self._glosses

    @property
    def lexicon(self) -> list[dict[str, Any]]:
        return list(self.meta["lexicon"])

    def entries(self, lemma: str) -> list[dict[str, Any]]:
        """Lexicon entries whose lemma is ``lemma`` (an index by lemma is built on first use)."""
        if self._by_lemma is None:
            index: dict[str, list[dict[str, Any]]] = {}
            for entry in self.meta["lexicon"]:
                index.setdefault(entry["lemma"], []).append(entry)
            self._by_lemma = index
        return list(self._by_lemma.get(lemma, ()))

    def stats(self) -> dict[str, Any]:
        from ..compile.fstutil import size

        return {name: dict(zip(("states", "arcs"), size(f))) for name, f in self.fsts.items()}


def _forms(found: list[tuple[str, str, float]], analysis: str) -> list[Form]:
    """Distinct surface forms of generated paths, each at its best weight, best first."""
    best: dict[str, float] = {}
    for _, surface, weight in found:
        best[surface] = min(weight, best.get(surface, weight))
    return [Form(s, w, analysis) for s, w in sorted(best.items(), key=lambda kv: (round(kv[1], 5), kv[0]))]


def _permutations(codes: list[str]) -> pynini.Fst:
    """An acceptor for every ordering of a multiset of single-symbol codes (subset construction)."""
    import pynini

    from ..compile.fstutil import Arc, Weight

    counts: dict[str, int] = {}
    for c in codes:
        counts[c] = counts.get(c, 0) + 1
    symbols = sorted(counts)
    fst = pynini.Fst()
    one = Weight.one(fst.weight_type())
    states: dict[tuple[int, ...], int] = {}

    def state(remaining: tuple[int, ...]) -> int:
        if remaining not in states:
            states[remaining] = fst.add_state()
            if not any(remaining):
                fst.set_final(states[remaining])
        return states[remaining]

    start = tuple(counts[s] for s in symbols)
    fst.set_start(state(start))
    todo = [start]
    seen = {start}
    while todo:
        rem = todo.pop()
        for i, sym in enumerate(symbols):
            if rem[i]:
                nxt = rem[:i] + (rem[i] - 1,) + rem[i + 1 :]
                fst.add_arc(state(rem), Arc(ord(sym), ord(sym), one, state(nxt)))
                if nxt not in seen:
                    seen.add(nxt)
                    todo.append(nxt)
    return fst

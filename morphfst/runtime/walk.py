"""A fast path for analysis: a transducer's arcs walked from Python, one word at a time.

Calling OpenFst for every word (build an acceptor, compose, enumerate paths) costs a few hundred
microseconds, mostly in the crossing between Python and C++. For the arc-sorted transducers of a
grammar it is faster to read each state's arcs once into Python dicts, with the arcs that read no
input (epsilons, and the morph boundary ``+`` of the bounded machine, which the surface word does not
contain) folded into the arcs that read a letter, and to walk them: see :class:`ArcWalker`. States
are read when a walk first reaches them, so loading costs nothing whatever the lexicon's size.

A walk returns, for each accepting path, the side tape (the input letters with the skipped boundary
symbols put back, i.e. the bounded surface), the output string and the path weight (tropical
semiring: weights add, lower is better).
"""

from __future__ import annotations

import heapq
import math
import re
from collections.abc import Callable, Iterable, Mapping, Sequence
from dataclasses import MISSING, fields
from typing import TYPE_CHECKING, Any, Protocol, TypeVar, cast

from ..compile.arctable import NO_STATE_ID, Arcs, FstArcs, PackedArcs
from ..compile.guessweights import GUESS_COMPOUND_WEIGHT, GUESS_NAME_WEIGHT, GUESS_OFFSET, GUESS_STEM_WEIGHT, NAME_POS
from ..language.normalize import restore_case
from ..language.symbols import COMPOUND_SEAM, GUESS_SYMBOL, SymbolSpace
from .detached import detached
from .hyphenated import HYPHEN, hyphenated
from .native import native_walker
from .results import Analysis, Morph

if TYPE_CHECKING:  # a walk over a packed table needs no pynini; it is imported when an Fst is walked
    import pynini


class Language(Protocol):
    """What the fast path reads of a compiled language (:class:`morphfst.runtime.Language` has it;
    named here so that this module does not import the runtime, which imports it)."""

    fsts: Mapping[str, pynini.Fst]
    space: SymbolSpace
    plus: str
    affixes: dict[int, dict[str, Any]]
    ud: dict[str, str]

    @property
    def meta(self) -> Mapping[str, Any]: ...

    @property
    def glosses(self) -> Mapping[tuple[str, str], str]: ...

    def arcs(self, name: str) -> Arcs: ...

    def normalize(self, word: str) -> str: ...

    def acceptable(self, surface: str) -> bool: ...


Step = tuple[str, str, float, int]  # side-tape text, output text, weight, next state
End = tuple[str, str, float]  # side-tape text, output text, weight of a path that ends
Path = tuple[int, str, str, float]  # state (or its index in a set), side-tape text, output text, weight
Back = tuple[tuple[Path, ...], ...]  # per state of a set (in its order): the steps that lead there
Move = tuple[int, Back]  # next set of states, and the steps into each of its states
Raw = tuple[tuple[Step, ...], str, float | None]  # a state's arcs that read nothing, the letters it reads, final weight
_Piece = TypeVar("_Piece", Step, End)
Key = tuple[str, str]  # an analysis's text and segmentation: what makes two decoded paths the same
Tail = tuple[str, tuple[str, ...], tuple[tuple[int, tuple[str, ...]], ...], int, str]  # see FastAnalyzer._parse_tail
Parts = tuple[str, str, tuple[str, ...], str, tuple[Morph, ...], Key]  # see FastAnalyzer._parts
Shared = tuple[str, tuple[str, ...], tuple[Morph, ...], str, str]  # see FastAnalyzer._parse_shared
_UNSEEN: Any = object()


class _Cycle(Exception):
    """A cycle of arcs that read no input was met while folding closures."""


MAX_CLOSURE_DEPTH = 64  # longest chain of arcs that read no input (a guard against epsilon cycles)
MAX_LIVE = 4096  # partial paths kept per input position (the best ones by weight)
MAX_SETS = 200_000  # sets of states remembered before the subset automaton is started afresh
MAX_GUESSES = 10  # guessed analyses kept per word
MAX_PATHS = 200  # paths read from one walk
MAX_GUESS_LENGTH = 60  # longer words get no guess (they are rarely words, and guessing grows with length)
GUESS_HEAD_MIN = 3  # letters of the shortest last part of a guessed compound (osa, työ, maa)
# A word written without capitals is a proper name rarely: an analysis whose lemma is capitalized
# (a name, Kivi) weighs ln 10 more for it than for the same word capitalized (the estimate that a
# lower-case token spelt like a name is the name about one time in ten is from memory), so that
# kiveä reads as the noun kivi first and Kiveä as either; words without another reading keep theirs.
LOWER_CASE_NAME_WEIGHT = math.log(10)


class ArcWalker:
    """The arcs of one transducer walked from Python; :meth:`walk` finds every path for an input string.

    ``skip`` names input labels (one-character codes) that a walk may take without reading input;
    they are written to the side tape, so the side tape of a path is the full input string of the
    transducer (for the bounded analyzer: the surface with its morph boundaries).

    Nothing is built up front, so a language loads in constant time whatever its size. A state's
    arcs are read from its table (:mod:`morphfst.compile.arctable`) the first time a walk reaches it, and the
    steps that read a letter from it, with the arcs that read nothing folded in, the first time a
    walk reads that letter there. A walk then runs in two passes. Forward, it follows the *set* of
    live states, letter by letter, through a lazily built subset automaton (Rabin & Scott 1959): each
    (set, letter) move is computed once and remembered, so a word whose prefixes were seen before
    costs one dict lookup per letter and no string is built. Backward, from the final states of the
    last set, it follows the remembered predecessor steps of each move and builds the side and output
    strings of the accepting paths only: the partial paths that would have died are never extended.

    Everything remembered is kept in a few flat dicts of tuples of strings and numbers: Python's
    cycle collector stops tracking such tuples, so a long run's tables (hundreds of thousands of
    entries) do not make every full collection slower (with lists and a dict per state they cost
    about a third of a corpus run).
    """

    def __init__(self, fst: pynini.Fst | Arcs, skip: Iterable[str] = (), future: bool = False) -> None:
        # a table as it is; anything else is an in-memory transducer, read through pynini
        self.table: Arcs = fst if isinstance(fst, (PackedArcs, FstArcs)) else FstArcs(cast("pynini.Fst", fst))
        self.start = self.table.start
        self._skip = {ord(c) for c in skip}
        self._raw: dict[int, Raw] = {}
        self._consume: dict[tuple[int, str], tuple[Step, ...]] = {}  # a state's own arcs for a letter
        self._folded: dict[tuple[int, str], tuple[Step, ...]] = {}
        self._ends_memo: dict[int, tuple[End, ...]] = {}
        self._closures: dict[int, list[Path]] = {}  # only where arcs that read nothing form a cycle
        self._active: set[tuple[int, str]] = set()  # (state, letter) folds under way (a cycle guard)
        self._active_ends: set[int] = set()
        self._firsts: dict[int, str] = {}
        self._active_firsts: set[int] = set()
        self._reset_sets()
        # the same walk in C over a packed table, when the extension is built: a word it gives up on
        # (too many paths, a cycle of arcs that read nothing) is walked here; with ``future`` it also
        # skips the states that cannot read the rest of the word (worth its start-up cost on the guesser)
        self._native = native_walker(self.table, self._skip, future)

    # ---- one state: its arcs, closure and folded table (built on first use) ---------------------------
    def _arcs(self, state: int) -> Raw:
        """The arcs of ``state`` that read no input, the letters its own arcs read, its final weight
        (its arcs for each letter go to ``_consume``)."""
        raw = self._raw.get(state)
        if raw is None:
            free: list[Step] = []
            consume: dict[str, list[Step]] = {}
            skip = self._skip
            for ilabel, olabel, weight, nxt in self.table.arcs(state):
                out = chr(olabel) if olabel else ""
                if ilabel == 0:
                    free.append(("", out, weight, nxt))
                elif ilabel in skip:
                    free.append((chr(ilabel), out, weight, nxt))
                else:
                    consume.setdefault(chr(ilabel), []).append(("", out, weight, nxt))
            for letter, arcs in consume.items():
                self._consume[(state, letter)] = tuple(arcs)
            raw = self._raw[state] = (tuple(free), "".join(consume), self.table.final(state))
        return raw

    def _consuming(self, state: int, letter: str) -> tuple[Step, ...]:
        """The arcs of ``state`` that read ``letter``."""
        if state not in self._raw:
            self._arcs(state)
        return self._consume.get((state, letter), ())

    def _closure(self, state: int) -> list[Path]:
        """Every (state, side text, output, weight) reachable from ``state`` by arcs that read no input."""
        found: dict[tuple[int, str, str], float] = {(state, "", ""): 0.0}
        todo: list[tuple[int, str, str, float, int]] = [(state, "", "", 0.0, 0)]
        while todo:
            here, side, out, weight, depth = todo.pop()
            if depth >= MAX_CLOSURE_DEPTH:
                continue
            for s2, o2, w2, nxt in self._arcs(here)[0]:
                key = (nxt, side + s2, out + o2)
                total = weight + w2
                if key not in found or total < found[key]:
                    found[key] = total
                    todo.append((nxt, key[1], key[2], total, depth + 1))
        return [(k[0], k[1], k[2], w) for k, w in found.items()]

    def _reachable(self, state: int) -> list[Path]:
        """:meth:`_closure` of ``state``, memoized: what the fallbacks of :meth:`_steps` and
        :meth:`_ends_of` read when arcs that read nothing form a cycle (a zero-morph derivation loop)."""
        reach = self._closures.get(state)
        if reach is None:
            reach = self._closures[state] = self._closure(state)
        return reach

    def _steps(self, state: int, letter: str) -> tuple[Step, ...]:
        """The steps that read ``letter`` from ``state``, closure folded in (built on first use: a walk
        reads one or two of the letters a state could read, so only those are folded)."""
        steps = self._folded.get((state, letter))
        if steps is None:
            try:
                steps = self._fold(state, letter, 0)
            except _Cycle:
                self._active.clear()
                self._active_firsts.clear()
                steps = self._folded[(state, letter)] = self._fold_closure(state, letter)
        return steps

    def _fold(self, state: int, letter: str, depth: int) -> tuple[Step, ...]:
        """:meth:`_steps` by recursion over the arcs that read no input: the state's own arcs for
        ``letter`` and, behind each arc that reads nothing, the folded steps of its target with that
        arc's side text, output and weight put in front (memoized per (state, letter), so the suffix
        network that every stem of a class reaches through one boundary arc is folded once per letter,
        and a state's whole closure is never listed). Equal (side, output, next state) keep the lowest
        weight. Raises :class:`_Cycle` on a cycle of arcs that read nothing."""
        key = (state, letter)
        found = self._folded.get(key)
        if found is not None:
            return found
        if depth >= MAX_CLOSURE_DEPTH or key in self._active:
            raise _Cycle
        free, letters, _ = self._raw.get(state) or self._arcs(state)
        own = self._consume.get(key) if letter in letters else None
        if not free:
            result = self._folded[key] = tuple((letter, out, weight, nxt) for _, out, weight, nxt in own) if own else ()
            return result
        steps: list[Step] = [(letter, out, weight, nxt) for _, out, weight, nxt in own] if own else []
        self._active.add(key)
        firsts = self._firsts
        for s2, o2, w2, target in free:
            first = firsts.get(target)
            if first is None:
                first = self._first_letters(target, depth + 1)
            if letter not in first:
                continue
            behind = self._fold(target, letter, depth + 1)
            if behind:
                steps.extend([(s2 + side, o2 + out, w2 + weight, nxt) for side, out, weight, nxt in behind])
        self._active.discard(key)
        if len(free) > 1 and len(steps) > 1:
            steps = _lowest(steps)
        result = self._folded[key] = tuple(steps)
        return result

    def _first_letters(self, state: int, depth: int = 0) -> str:
        """The letters some step from ``state`` reads (its own arcs' and those behind arcs that read
        nothing), memoized per state: a fold skips the arcs behind which the letter cannot be read.
        Raises :class:`_Cycle` on a cycle of arcs that read nothing."""
        found = self._firsts.get(state)
        if found is not None:
            return found
        if depth >= MAX_CLOSURE_DEPTH or state in self._active_firsts:
            raise _Cycle
        free, letters, _ = self._raw.get(state) or self._arcs(state)
        if free:
            self._active_firsts.add(state)
            seen = set(letters)
            for _, _, _, target in free:
                first = self._firsts.get(target)
                seen.update(self._first_letters(target, depth + 1) if first is None else first)
            self._active_firsts.discard(state)
            letters = "".join(sorted(seen))
        self._firsts[state] = letters
        return letters

    def _fold_closure(self, state: int, letter: str) -> tuple[Step, ...]:
        """The steps that read ``letter`` from ``state`` through its (depth-bounded) closure: the
        fallback when arcs that read nothing form a cycle (a zero-morph derivation loop)."""
        steps: list[Step] = []
        for target, side, out, weight in self._reachable(state):
            for _, o2, w2, nxt in self._consuming(target, letter):
                steps.append((side + letter, out + o2, weight + w2, nxt))
        return tuple(steps)

    def _ends_of(self, state: int) -> tuple[End, ...]:
        """The (side text, output, weight) of the paths from ``state`` to a final state that read nothing."""
        ends = self._ends_memo.get(state)
        if ends is None:
            try:
                ends = self._end(state, 0)
            except _Cycle:
                self._active_ends.clear()
                found: list[End] = []
                for target, side, out, weight in self._reachable(state):
                    final = self._arcs(target)[2]
                    if final is not None:
                        found.append((side, out, weight + final))
                ends = self._ends_memo[state] = tuple(found)
        return ends

    def _end(self, state: int, depth: int) -> tuple[End, ...]:
        """:meth:`_ends_of` by recursion over the arcs that read nothing, memoized per state (as :meth:`_fold`)."""
        found = self._ends_memo.get(state)
        if found is not None:
            return found
        if depth >= MAX_CLOSURE_DEPTH or state in self._active_ends:
            raise _Cycle
        free, _, final = self._raw.get(state) or self._arcs(state)
        ends: list[End] = [("", "", final)] if final is not None else []
        if free:
            self._active_ends.add(state)
            for s2, o2, w2, target in free:
                behind = self._end(target, depth + 1)
                if behind:
                    ends.extend([(s2 + side, o2 + out, w2 + weight) for side, out, weight in behind])
            self._active_ends.discard(state)
            if len(free) > 1 and len(ends) > 1:
                ends = _lowest(ends)
        result = self._ends_memo[state] = tuple(ends)
        return result

    # ---- sets of states: the subset automaton, built as words need it ------------------------------
    def _reset_sets(self) -> None:
        self._sets: list[tuple[int, ...]] = []
        self._ids: dict[tuple[int, ...], int] = {}
        self._moves: dict[tuple[int, str], Move | None] = {}
        self._ends: dict[int, tuple[Path, ...]] = {}
        if self.start != NO_STATE_ID:
            self._set_id((self.start,))

    def _set_id(self, states: tuple[int, ...]) -> int:
        ident = self._ids.get(states)
        if ident is None:
            ident = self._ids[states] = len(self._sets)
            self._sets.append(states)
        return ident

    def _advance(self, ident: int, letter: str) -> Move | None:
        """The move of set ``ident`` on ``letter``: the next set and, for each of its states (in the
        set's order), the steps that lead there, each from the index of its state in set ``ident``
        (``None`` when no state reads the letter)."""
        into: dict[int, list[Path]] = {}
        for index, state in enumerate(self._sets[ident]):
            steps = self._folded.get((state, letter))
            if steps is None:
                steps = self._steps(state, letter)
            for side, out, weight, target in steps:
                found = into.get(target)
                if found is None:
                    into[target] = [(index, side, out, weight)]
                else:
                    found.append((index, side, out, weight))
        if not into:
            move = None
        else:
            order = tuple(sorted(into))
            move = (self._set_id(order), tuple(tuple(into[state]) for state in order))
        self._moves[(ident, letter)] = move
        return move

    def _final_pieces(self, ident: int) -> tuple[Path, ...]:
        pieces = self._ends.get(ident)
        if pieces is None:
            pieces = self._ends[ident] = tuple(
                (index, side, out, weight)
                for index, state in enumerate(self._sets[ident])
                for side, out, weight in self._ends_of(state)
            )
        return pieces

    def _forward(self, word: str) -> tuple[int, list[Back]] | None:
        """The set of states after ``word`` and the predecessor steps of each move (``None``: no path)."""
        if len(self._sets) > MAX_SETS:
            self._reset_sets()
        moves = self._moves
        ident = 0
        trail: list[Back] = []
        for letter in word:
            move = moves.get((ident, letter), _UNSEEN)
            if move is _UNSEEN:
                move = self._advance(ident, letter)
            if move is None:
                return None
            ident = move[0]  # type: ignore[index]
            trail.append(move[1])  # type: ignore[index]
        return ident, trail

    def walk(self, word: str, limit: int = 1000, best: bool = False) -> list[tuple[str, str, float]]:
        """(side tape, output, weight) of every accepting path for ``word``, at most ``limit``, best first.

        With ``best``, only the best paths are sought: at each input position a state keeps only the
        partial paths (from there to the end) of its lowest weight, ties kept, which is exact for the
        best complete paths because what leads to a state costs the same whichever way it continues.
        (The walk in C, when it takes the word, returns every path, ranked: the best ones first.)
        """
        if self.start == NO_STATE_ID:
            return []
        if self._native is not None:
            # every path, ranked as _ranked ranks (with ``best``, the best come first: what is asked for)
            paths = self._native.paths(word, MAX_LIVE, limit)
            if paths is not None:
                return paths
        found = self._forward(word)
        if found is None:
            return []
        ident, trail = found
        partial: Any = self._final_pieces(ident)
        if not partial:
            return []
        results = None if best else _follow_back(trail, partial)
        if results is None:
            results = _breadth_back(trail, partial, best)
        return _ranked(results, limit)

    def accepts(self, word: str) -> bool:
        """True when some path reads ``word`` (no outputs are built)."""
        if self.start == NO_STATE_ID:
            return False
        if self._native is not None:
            accepted = self._native.accepts(word)
            if accepted is not None:
                return bool(accepted)
        found = self._forward(word)
        return found is not None and bool(self._final_pieces(found[0]))

    def size(self) -> int:
        """Number of folded steps built so far (a measure of the tables' memory; they grow with use)."""
        return sum(map(len, self._folded.values())) + sum(map(len, self._ends_memo.values()))


def _ranked(paths: list[tuple[str, str, float]], limit: int) -> list[tuple[str, str, float]]:
    """At most ``limit`` paths, each (side tape, output) once at its lowest weight, by weight, then
    output, then side tape (the order both walks give, whatever order they found the paths in)."""
    if len(paths) > 1:
        low: dict[tuple[str, str], float] = {}
        for side, out, weight in paths:
            kept = low.get((side, out))
            if kept is None or weight < kept:
                low[(side, out)] = weight
        if len(low) < len(paths):
            paths = [(side, out, weight) for (side, out), weight in low.items()]
        paths.sort(key=lambda r: (r[2], r[1], r[0]))
    return paths[:limit]


def _follow_back(trail: list[Back], partial: tuple[Path, ...]) -> list[tuple[str, str, float]] | None:
    """The accepting paths, each followed back alone from its final piece (depth first, pieces kept in
    lists and joined once), in the order :func:`_breadth_back` gives them. Backward, a path never dies
    (every state of a set was reached from the start), so the live paths at any position are at most
    the complete ones: ``None`` when those exceed ``MAX_LIVE``, where the breadth-first pass prunes."""
    results: list[tuple[str, str, float]] = []
    # (index, remaining moves, side pieces, output pieces, weight); alternatives pushed in reverse so
    # that they come off the stack in the breadth-first pass's order
    stack = [(index, len(trail), [side], [out], weight) for index, side, out, weight in reversed(partial)]
    while stack:
        index, rest, sides, outs, weight = stack.pop()
        while rest:
            rest -= 1
            preds = trail[rest][index]
            if len(preds) > 1:
                if len(stack) + len(results) + len(preds) > MAX_LIVE:
                    return None
                for before, s2, o2, w2 in reversed(preds[1:]):
                    stack.append((before, rest, [*sides, s2], [*outs, o2], w2 + weight))
            index, s2, o2, w2 = preds[0]
            sides.append(s2)
            outs.append(o2)
            weight = w2 + weight
        sides.reverse()
        outs.reverse()
        results.append(("".join(sides), "".join(outs), weight))
    return results


def _breadth_back(trail: list[Back], partial: tuple[Path, ...], best: bool) -> list[tuple[str, str, float]]:
    """The accepting paths, all partial paths extended one move back at a time (with ``best``, only the
    lowest per state; at most ``MAX_LIVE`` per position, the lowest by weight)."""
    live: Any = partial
    for back in reversed(trail):
        nxt: list[Path] = []
        for index, side, out, weight in live:
            for before, s2, o2, w2 in back[index]:
                nxt.append((before, s2 + side, o2 + out, w2 + weight))
        if best and len(nxt) > 1:
            nxt = _best_per_state(nxt)
        if len(nxt) > MAX_LIVE:
            nxt = heapq.nsmallest(MAX_LIVE, nxt, key=lambda p: p[3])
        live = nxt
    return [(side, out, weight) for _, side, out, weight in live]


def _ranked_analyses(analyses: Iterable[Analysis], limit: int) -> list[Analysis]:
    """The first ``limit`` analyses ranked as :meth:`FastAnalyzer.decode_all` ranks them: each (text,
    segmentation) once at its lowest weight, by rounded weight, then text and segmentation."""
    best: dict[Key, Analysis] = {}
    for a in analyses:
        kept = best.get((a.text, a.segmentation))
        if kept is None or a.weight < kept.weight:
            best[(a.text, a.segmentation)] = a
    return sorted(best.values(), key=lambda a: (round(a.weight, 5), a.text, a.segmentation))[:limit]


def _merged(first: list[Analysis], second: list[Analysis], limit: int) -> list[Analysis]:
    """The first ``limit`` analyses of two ranked lists with no (text, segmentation) in common, ranked as
    :meth:`FastAnalyzer.decode_all` ranks: by weight rounded to 5 places, then text and segmentation
    (built only when two weights tie: a guess's text is not free)."""
    both = first + second
    rounded = [round(a.weight, 5) for a in both]
    if len(set(rounded)) == len(rounded):
        order = sorted(range(len(both)), key=rounded.__getitem__)
    else:
        order = sorted(range(len(both)), key=lambda i: (rounded[i], both[i].text, both[i].segmentation))
    return [both[i] for i in order[:limit]]


def _builder(cls: type) -> Callable[..., Any]:
    """A fast constructor for a frozen dataclass: the same object as ``cls(...)`` with every field given.

    A frozen dataclass's ``__init__`` sets each field through ``object.__setattr__``; calling each
    slot's own setter (or, for a class without slots, giving the instance a dict literal of its
    fields at once) is about twice as fast (generated once per class, as ``dataclasses`` generates
    ``__init__``), which matters when thousands of analyses are decoded per second. Every field is a
    parameter; fields added later with defaults keep their defaults.
    """
    names = [f.name for f in fields(cls)]
    args = ", ".join(f"{n}=_d_{n}" if n in _defaults(cls) else n for n in names)
    scope: dict[str, Any] = {"_new": object.__new__, "_set": object.__setattr__, "_cls": cls}
    scope.update({f"_d_{n}": v for n, v in _defaults(cls).items()})
    if "__slots__" in cls.__dict__:
        scope.update({f"_s_{n}": cls.__dict__[n].__set__ for n in names})
        body = "".join(f"    _s_{n}(obj, {n})\n" for n in names)
    else:
        body = "    _set(obj, '__dict__', {" + ", ".join(f"{n!r}: {n}" for n in names) + "})\n"
    exec(f"def build({args}):\n    obj = _new(_cls)\n{body}    return obj\n", scope)
    return scope["build"]  # type: ignore[no-any-return]


def _defaults(cls: type) -> dict[str, Any]:
    return {f.name: f.default for f in fields(cls) if f.default is not MISSING}


_new_morph = _builder(Morph)
_new_analysis = _builder(Analysis)


def _as_name(a: Analysis, lemma: str, weight: float, guessed: bool) -> Analysis:
    """``a`` with its lemma written ``lemma`` (a name's capitals, as the word writes them), and a stem
    with no gloss of its own (glossed by the folded lemma) glossed by the name as written
    (*Karadenizspor*: a proper name is glossed by itself, common practice in Leipzig glosses)."""
    morphs = a.morphs
    if lemma != a.lemma:
        morphs = tuple(
            _new_morph(m.form, lemma, m.features, m.kind, m.underlying, m.slot, m.affix_id, m.new_pos)
            if m.kind == "stem" and m.gloss == a.lemma
            else m
            for m in morphs
        )
    return _new_analysis(a.word, lemma, a.pos, a.features, morphs, weight, a.ud, guessed)  # type: ignore[no-any-return]


def _lowest(items: list[_Piece]) -> list[_Piece]:
    """Steps (or ends) with distinct side text, output (and next state), each at its lowest weight
    (the third field), in first-seen order."""
    low: dict[tuple[Any, ...], _Piece] = {}
    for item in items:
        key = item[:2] + item[3:]
        kept = low.get(key)
        if kept is None or item[2] < kept[2]:
            low[key] = item
    return items if len(low) == len(items) else list(low.values())


def _best_per_state(paths: list[Path]) -> list[Path]:
    """The paths of lowest weight at each state (ties within 1e-5 kept)."""
    low: dict[int, float] = {}
    for state, _, _, weight in paths:
        if weight < low.get(state, float("inf")):
            low[state] = weight
    return [p for p in paths if p[3] <= low[p[0]] + 1e-5]


class FastAnalyzer:
    """Analyses of a :class:`~morphfst.runtime.Language` by walking its transducers' arcs in Python.

    It gives the same analyses as :meth:`Language.analyze` (same decoding, ranking and ties), and adds
    guessed analyses for words the lexicon does not know when the grammar has a guesser.
    """

    def __init__(self, lang: Language) -> None:
        self.lang = lang
        self.seam = lang.space.to_char.get(COMPOUND_SEAM, "")  # between compound parts, on both tapes
        self.plus = lang.plus
        self.bounded = ArcWalker(lang.arcs("bounded"), skip=[lang.plus, self.seam] if self.seam else [lang.plus])
        self._guesser: ArcWalker | None | bool = False  # False: not looked up yet (read on first guess)
        self.mark = lang.space.to_char.get(GUESS_SYMBOL, "")
        # Decoding tables: the label and kind of every code, the affixes by id; morphs are shared objects.
        self.labels = {code: name.split(":", 1)[1] if ":" in name else name for name, code in lang.space.to_char.items()}
        self.kinds = dict(lang.space.kinds)
        self.affix_rows = {
            ident: (info["gloss"], "".join(info["form"]), info["slot"], info["new_pos"], bool(info["form"]))
            for ident, info in lang.affixes.items()
        }
        self.affix_ids = {code: int(self.labels[code]) for code, kind in self.kinds.items() if kind == "affix"}
        pos_codes = "".join(code for code, kind in self.kinds.items() if kind == "pos")
        self.pos_re = re.compile(f"[{re.escape(pos_codes)}]" if pos_codes else "(?!)")
        self._tails: dict[str, Tail] = {}
        self._shared: dict[tuple[str, str], Shared] = {}  # see _parts
        # one Morph per (form, affix, labels), shared by every analysis that has it: fewer objects for
        # the cycle collector to walk (a word's own objects are what a new word costs it)
        self._affix_pool: dict[tuple[str, int, tuple[str, ...]], Morph] = {}
        self._stems: dict[tuple[str, str, str], Morph] = {}
        # the first parts of 'agree' compounds stand in the compound's lemma by their own lemma (a
        # compound numeral's lemma is its nominative: kahdessakymmenessäkolmessa -> kaksikymmentäkolme)
        # (only there: a numeral genitive before a noun or adjective is written as it stands,
        # yhdenmukainen, kahdenkertainen); (first names, last names) of each agree block
        self.lemma_parts = [
            (set(c.get("first", ())), set(c.get("last", ()))) for c in lang.meta.get("compounds") or () if c.get("agree")
        ]
        # guessed compounds (compound_guesses): what the compound blocks with a noun first part take as
        # their last part (parts of speech and derivations: N, ADJ, V.MSDR, ...), and their shortest first part
        blocks = [c for c in lang.meta.get("compounds") or () if "N" in c.get("first", ()) and not c.get("agree")]
        self.guess_heads = frozenset(name for c in blocks for name in c.get("last", ()))
        self.guess_first_min = min((int(c.get("min", 1)) for c in blocks), default=1)
        # an open class of names (a name the lexicon lacks, read from its written apostrophe): its
        # lemmas are the word's letters in folded case (see _open_names)
        self.open_names = any(c.get("open") and NAME_POS in c.get("pos", ()) for c in lang.meta["classes"].values())
        self._listed_names: frozenset[str] | None = None  # read on the first open reading
        # suffixes a tokenizer split from their word (Ankara'nın: nın; see runtime/detached.py): the
        # grammar's part of speech for them and its host words, normalized, each with its separator
        spec = lang.meta.get("detached") or {}
        self.detached_pos: str = spec.get("pos", "")
        self.detached_hosts = [(host[:-1], host[-1]) for host in map(lang.normalize, spec.get("hosts", ()))]

    @property
    def guesser(self) -> ArcWalker | None:
        """The guesser's walker (``None`` when the grammar has no guesser); its transducer is read on first use."""
        if self._guesser is False:
            has = "guesser" in self.lang.fsts
            self._guesser = ArcWalker(self.lang.arcs("guesser"), skip=[self.lang.plus], future=True) if has else None
        return self._guesser  # type: ignore[return-value]

    def analyze(self, word: str, guess: bool = False, limit: int = MAX_PATHS, cased: bool = True) -> list[Analysis]:
        """Every analysis of ``word``, best first; with ``guess``, guessed ones when the lexicon has none.

        ``cased=False`` says the word's capitals are not known (a lower-cased word list): names then
        weigh what they weigh for a capitalized word (no :data:`LOWER_CASE_NAME_WEIGHT`)."""
        surface = self.lang.normalize(word)
        if not self.lang.acceptable(surface):
            return []
        found = self.decode_all(surface, self.bounded.walk(surface, limit), False, word if cased else None)
        if not found and HYPHEN in surface:
            found = hyphenated(surface, word, self._analyze_part)
        if not found:
            found = self.detached(surface)
        if not found and guess:
            return self.guess(word, cased=cased)
        return found

    def detached(self, surface: str, analyze: Callable[[str], Sequence[Analysis]] | None = None) -> list[Analysis]:
        """Readings of a normalized word as suffixes a tokenizer split from their word (the grammar's
        ``detached`` block; :func:`morphfst.runtime.detached.detached`); each host word is analyzed by
        ``analyze`` (by default this walk, which also tells cheaply which hosts read the word at all)."""
        if not self.detached_hosts:
            return []
        if analyze is not None:
            return detached(surface, self.detached_hosts, self.detached_pos, analyze)
        return detached(surface, self.detached_hosts, self.detached_pos, self._analyze_part, self.bounded.accepts)

    def _analyze_part(self, part: str) -> list[Analysis]:
        """Lexicon analyses of one part of a hyphenated word (normalized; no guesses)."""
        if not self.lang.acceptable(part):
            return []
        return self.decode_all(part, self.bounded.walk(part, MAX_PATHS), False)

    def guess(self, word: str, limit: int = MAX_GUESSES, cased: bool = True) -> list[Analysis]:
        """Guessed analyses of ``word`` (a stem the lexicon may not have), best first, marked ``guessed``.

        The guesser weighs a guessed name (part of speech ``PROPN``) as a lexicon name read in lower
        case (:data:`GUESS_NAME_WEIGHT`). A word written with a capital is a proper name more often
        than not when the lexicon lacks it: its name guesses take that weight back and weigh
        :data:`LOWER_CASE_NAME_WEIGHT` less besides, and their lemma is written with the word's
        capitals (*Karadenizspor'un*: *Karadenizspor* PROPN). ``cased=False`` (the word's capitals
        are not known) takes the weight back only."""
        surface = self.lang.normalize(word)
        if not self.lang.acceptable(surface):
            return []
        capital = cased and word[:1].isupper()
        if cased and not capital:
            return self.guess_normalized(surface, limit)
        found = self.guess_normalized(surface, max(limit, MAX_GUESSES))
        if not any(a.pos == NAME_POS for a in found):
            return found[:limit]
        fold = self.lang.normalize
        back = GUESS_NAME_WEIGHT + (LOWER_CASE_NAME_WEIGHT if capital else 0.0)
        names = [
            _as_name(a, restore_case(word, a.lemma, fold) if capital else a.lemma, a.weight - back, True)
            for a in found
            if a.pos == NAME_POS
        ]
        return _merged([a for a in found if a.pos != NAME_POS], names, limit)

    def guess_normalized(self, surface: str, limit: int = MAX_GUESSES) -> list[Analysis]:
        """Guesses of a normalized word: the ``limit`` best (only the paths that can be among them are decoded),
        as for a word written in lower case (a guessed name weighs :data:`GUESS_NAME_WEIGHT` more)."""
        guesser = self.guesser
        if guesser is None or len(surface) > MAX_GUESS_LENGTH or limit < 1:
            return []
        walked = guesser.walk(surface, MAX_PATHS, best=limit == 1)
        guesses = self._best_guesses(surface, walked, limit) if walked else []
        compounds = self.compound_guesses(surface, limit)
        if not compounds:
            return guesses
        return _ranked_analyses(compounds + guesses, limit)

    def compound_guesses(self, surface: str, limit: int = MAX_GUESSES) -> list[Analysis]:
        """Guessed compounds of a word the lexicon lacks: a first part the lexicon does not know (at
        least as long as the compound blocks' shortest first part) before a word of the lexicon that a
        compound block with a noun first part takes as its last part (*zorbataloissa*: zorba + talo-i-ssa,
        lemma *zorbatalo*; *blorpikaupungin*: lemma *blorpikaupunki*, its gradation the last part's).

        The last part is the longest such word that ends the word (its analyses, best first): a longer
        known last part explains more of the word. The lemma is the first part as written and the last
        part's lemma, as in a compound of lexicon words; the first part is one stem morph, glossed by
        itself. Each weighs :data:`GUESS_OFFSET`, :data:`GUESS_STEM_WEIGHT` per letter of the first part,
        :data:`GUESS_COMPOUND_WEIGHT` and the last part's weight. Grammars without compound blocks
        (Turkish) have none."""
        heads = self.guess_heads
        if not heads:
            return []
        for i in range(max(self.guess_first_min, 1), len(surface) - GUESS_HEAD_MIN + 1):
            tail = surface[i:]
            walked = self.bounded.walk(tail, MAX_PATHS)
            if not walked:
                continue
            found = [a for a in self.decode_all(tail, walked) if a.pos in heads or heads.intersection(a.features)]
            if not found:
                continue
            first = surface[:i]
            stem = _new_morph(first, first, (), "stem", first, None, None, None)
            base = GUESS_OFFSET + GUESS_STEM_WEIGHT * i + GUESS_COMPOUND_WEIGHT
            ud = self.lang.ud
            return [
                _new_analysis(surface, first + a.lemma, a.pos, a.features, (stem, *a.morphs), base + a.weight, ud, True)
                for a in found[:limit]
            ]
        return []

    def _best_guesses(self, surface: str, walked: list[tuple[str, str, float]], limit: int) -> list[Analysis]:
        """``decode_all(surface, walked, True)[:limit]``, building only the analyses kept.

        The paths come sorted by weight. Their (text, segmentation) keys are read in that order until
        ``limit`` distinct keys are found, and on through the paths that tie with the last of them
        (weights rounded as :meth:`decode_all` rounds them): no later path can be among the best, and
        every key met has its lowest weight first. Then the keys are ranked as :meth:`decode_all`
        ranks them and only the first ``limit`` are built, the analyses of one stem sharing its morph.

        A guessed path's analysis side is the stem's letters, a part of speech and the guess mark
        (then affix ids and features), so the lemma ends one code before the mark: found with one
        ``str.find`` instead of the part-of-speech pattern."""
        low: dict[Key, tuple[float, Parts]] = {}
        bound: float | None = None
        mark = self.mark
        parts_at = self._parts_at
        for bounded, internal, weight in walked:
            if bound is not None and round(weight, 5) > bound:
                break
            i = internal.find(mark) - 1
            if i < 0:  # not a plain guess: decode everything
                return self.decode_all(surface, walked, True)[:limit]
            parts = parts_at(internal, i, bounded, True)
            if parts[5] not in low:
                low[parts[5]] = (weight, parts)
                if bound is None and len(low) >= limit:
                    bound = round(weight, 5)
        ranked = sorted([(round(weight, 5), key, weight, parts) for key, (weight, parts) in low.items()])[:limit]
        stems: dict[tuple[str, str, str], Morph] = {}  # this word's guessed stems, kept for it alone
        return [self._build(surface, parts, weight, True, stems) for _, _, weight, parts in ranked]

    def decode(self, surface: str, internal: str, bounded: str, weight: float, guessed: bool = False) -> Analysis:
        """One :class:`Analysis` from a walked or composed path, through precomputed tables."""
        return self._decode(surface, internal, bounded, weight, guessed)[0]

    def _lower_case_names(self, walked: list[tuple[str, str, float]]) -> list[tuple[str, str, float]]:
        """The paths with :data:`LOWER_CASE_NAME_WEIGHT` added where the lemma (the analysis before the
        part of speech) starts with a capital; a compound's lemma starts with its first part as
        written, so compounds are left as they are."""
        seam = self.seam
        return [
            (bounded, internal, weight + LOWER_CASE_NAME_WEIGHT)
            if internal[:1].isupper() and not (seam and seam in internal)
            else (bounded, internal, weight)
            for bounded, internal, weight in walked
        ]

    def _decode(self, surface: str, internal: str, bounded: str, weight: float, guessed: bool) -> tuple[Analysis, Key | None]:
        """:meth:`decode`, with the analysis's (text, segmentation) when the tables give it for free
        (``None`` for compounds: :func:`_key` builds it)."""
        parts = self._parts(internal, bounded, guessed)
        if parts is None:
            return self._decode_compound(surface, internal, bounded, weight), None
        return self._build(surface, parts, weight, guessed), parts[5]

    def _parts(self, internal: str, bounded: str, guessed: bool) -> Parts | None:
        """Lemma, part of speech, features, stem form, affix morphs and (text, segmentation) of a path
        (``None`` for a compound), without building the analysis.

        What follows the lemma (part of speech, affix ids, features; with a guess, the guess mark)
        and the surface forms after the stem are shared by many words: each such pair is parsed once
        and kept, with its affix morphs and its parts of the analysis text and of the segmentation,
        so that a path costs one lookup besides cutting its two strings.
        """
        if not guessed and self.seam and self.seam in internal:
            return None
        found = self.pos_re.search(internal)
        return self._parts_at(internal, found.start() if found else len(internal), bounded, guessed)

    def _parts_at(self, internal: str, i: int, bounded: str, guessed: bool) -> Parts:
        """:meth:`_parts` of a path whose lemma ends at ``i`` (where its part of speech begins)."""
        lemma = internal[:i]
        cut = bounded.find(self.plus)
        if cut < 0:
            stem_form, rest = bounded, ""
        else:
            stem_form, rest = bounded[:cut], bounded[cut:]
        key = (internal[i:], rest)
        shared = self._shared.get(key)
        if shared is None:
            shared = self._parse_shared(key, guessed)
        pos, features, affixes, affix_seg, tags = shared
        # Analysis.text and .segmentation, from the shared parts
        segmentation = f"{stem_form}-{affix_seg}" if stem_form and affix_seg else stem_form or affix_seg
        return lemma, pos, features, stem_form, affixes, (f"{lemma} {tags}", segmentation)

    def _parse_shared(self, key: tuple[str, str], guessed: bool) -> Shared:
        """The shared parts of :meth:`_parts` for (analysis after the lemma, surface after the stem)."""
        tail, rest = key
        if guessed:
            tail = tail.replace(self.mark, "")
        parsed = self._tails.get(tail)
        if parsed is None:
            parsed = self._parse_tail(tail)
        pos, features, groups, nforms, tags = parsed
        affixes = self._build_affixes(groups, nforms, rest.split(self.plus)[1:] if rest else [])
        if len(self._shared) > 100_000:
            self._shared.clear()
            self._affix_pool.clear()
        shared = self._shared[key] = (pos, features, affixes, "-".join(m.form for m in affixes if m.form), tags)
        return shared

    def _build(
        self, surface: str, parts: Parts, weight: float, guessed: bool, stems: dict[tuple[str, str, str], Morph] | None = None
    ) -> Analysis:
        """The :class:`Analysis` of :meth:`_parts` (the stem morph shared by every analysis that has it).

        A guessed stem is new to the lexicon and seldom met again: it is kept only in ``stems``, the
        caller's dict for one word (the stems kept for good are objects that every full collection of
        the cycle collector walks)."""
        lemma, pos, features, stem_form, affixes, _ = parts
        kept = stems if stems is not None else {} if guessed else self._stems
        stem = kept.get((stem_form, lemma, pos)) or self._new_stem(kept, stem_form, lemma, pos)
        return _new_analysis(surface, lemma, pos, features, (stem, *affixes), weight, self.lang.ud, guessed)  # type: ignore[no-any-return]

    def _new_stem(self, kept: dict[tuple[str, str, str], Morph], form: str, lemma: str, pos: str) -> Morph:
        """A stem morph with its lexicon gloss, kept in ``kept`` (cleared past 100,000 stems)."""
        if len(kept) > 100_000:
            kept.clear()
        stem = kept[(form, lemma, pos)] = _new_morph(
            form, self.lang.glosses.get((lemma, pos), lemma), (pos,), "stem", lemma, None, None, None
        )
        return stem  # type: ignore[no-any-return]

    def _decode_compound(self, surface: str, internal: str, bounded: str, weight: float) -> Analysis:
        """A compound: every part but the last is lemma and part of speech (its surface form between
        seams); the last is decoded as a word. The lemma is the first parts' surface forms (their lemmas
        in an ``agree`` compound) and the last part's lemma; part of speech and features are the last
        part's; each part is a stem morph."""
        seam = self.seam
        parts = internal.split(seam)
        forms = bounded.split(seam)
        last = self.decode(surface, parts[-1], forms[-1], weight)
        stems = []
        heads = []
        for part, form in zip(parts[:-1], forms):
            lemma, pos = part[:-1], self.labels.get(part[-1:], "?")
            agree = any(pos in first and last.pos in lasts for first, lasts in self.lemma_parts)
            heads.append(lemma if agree else form)
            stems.append(self._stems.get((form, lemma, pos)) or self._new_stem(self._stems, form, lemma, pos))
        lemma = "".join(heads) + last.lemma
        return _new_analysis(surface, lemma, last.pos, last.features, (*stems, *last.morphs), weight, self.lang.ud, False)

    def _parse_tail(self, tail: str) -> Tail:
        """Part of speech, features, (affix id, its labels) groups, the number of affixes with a form
        and the analysis text after the lemma (``POS;FEAT;...``)."""
        labels = self.labels
        pos = labels.get(tail[0], tail[0]) if tail else "?"
        features: list[str] = []
        groups: list[tuple[int, list[str]]] = []
        for ch in tail[1:]:
            ident = self.affix_ids.get(ch)
            if ident is not None:
                groups.append((ident, []))
            else:
                label = labels.get(ch, ch)
                features.append(label)
                if groups:
                    groups[-1][1].append(label)
        frozen = tuple((ident, tuple(g)) for ident, g in groups)
        nforms = sum(1 for ident, _ in groups if self.affix_rows[ident][4])
        parsed = (pos, tuple(features), frozen, nforms, ";".join((pos, *features)))
        if len(self._tails) > 100_000:
            self._tails.clear()
        self._tails[tail] = parsed
        return parsed

    def _build_affixes(self, groups: tuple[tuple[int, tuple[str, ...]], ...], nforms: int, forms: list[str]) -> tuple[Morph, ...]:
        aligned = len(forms) == nforms
        out = []
        k = 0
        pool = self._affix_pool
        for ident, group_labels in groups:
            if self.affix_rows[ident][4]:
                form = forms[k] if aligned else "?"
                k += 1
            else:
                form = ""
            key = (form, ident, group_labels)
            morph = pool.get(key)
            if morph is None:
                gloss, underlying, slot, new_pos, _ = self.affix_rows[ident]
                morph = pool[key] = _new_morph(form, gloss, group_labels, "affix", underlying, slot, ident, new_pos)
            out.append(morph)
        return tuple(out)

    def decode_all(
        self, surface: str, walked: list[tuple[str, str, float]], guessed: bool = False, written: str | None = None
    ) -> list[Analysis]:
        """Decoded analyses of (bounded surface, internal analysis, weight) paths, deduplicated and ranked.

        ``written`` is the word as written: when it has no capitals, readings with a capitalized lemma
        weigh :data:`LOWER_CASE_NAME_WEIGHT` more."""
        if not walked:
            return []
        walked = self._readable(walked, written)
        decode = self._decode
        if len(walked) == 1:
            bounded, internal, weight = walked[0]
            found = [decode(surface, internal, bounded, weight, guessed)[0]]
        else:
            best: dict[Key, Analysis] = {}
            for bounded, internal, weight in walked:
                analysis, key = decode(surface, internal, bounded, weight, guessed)
                if key is None:
                    key = (analysis.text, analysis.segmentation)
                if key not in best or weight < best[key].weight:
                    best[key] = analysis
            ranked = sorted((round(a.weight, 5), key, a) for key, a in best.items())
            found = [a for _, _, a in ranked]
        if self.open_names and not guessed:
            return self._open_names(found, written)
        return found

    def _readable(self, walked: list[tuple[str, str, float]], written: str | None) -> list[tuple[str, str, float]]:
        """The paths :meth:`decode_all` decodes: names weighed for a word written in lower case, and
        no compound reading of a word the lexicon spells (compounds are for the words it lacks)."""
        if written is not None and written.islower() and any(w[1][:1].isupper() for w in walked):
            walked = self._lower_case_names(walked)
        seam = self.seam
        if seam and len(walked) > 1:
            plain = [w for w in walked if seam not in w[1]]
            if plain:
                walked = plain
        return walked

    def analyze_best(self, word: str) -> tuple[Analysis | None, int]:
        """The best analysis of ``word`` and the number of its analyses: ``(analyze(word)[0],
        len(analyze(word)))``, or ``(None, 0)``, with only the best one built.

        What a corpus run writes in its terms and CoNLL-U outputs (and counts in its report): of a
        Turkish word's 2.7 paths on average, the others are read only far enough to tell them apart
        (their text and segmentation, from the decoding memos), not built into analyses."""
        surface = self.lang.normalize(word)
        if not self.lang.acceptable(surface):
            return None, 0
        walked = self.bounded.walk(surface, MAX_PATHS)
        if walked:
            best = self._decode_best(surface, walked, word)
            if best is not None:
                return best
            found = self.decode_all(surface, walked, False, word)
        else:
            found = []
        if not found and HYPHEN in surface:
            found = hyphenated(surface, word, self._analyze_part)
        if not found:
            found = self.detached(surface)
        return (found[0], len(found)) if found else (None, 0)

    def _decode_best(self, surface: str, walked: list[tuple[str, str, float]], written: str) -> tuple[Analysis, int] | None:
        """:meth:`analyze_best` of the lexicon's paths (not guesses), or ``None`` when they need
        :meth:`decode_all` whole: a compound, or a reading of an open class of names that
        :meth:`_open_names` may drop or rewrite."""
        walked = self._readable(walked, written)
        parts_of = self._parts
        names = self.open_names
        best: dict[Key, tuple[float, Parts]] = {}
        for bounded, internal, weight in walked:
            parts = parts_of(internal, bounded, False)
            if parts is None or (names and parts[1] == NAME_POS and parts[0].islower()):
                return None
            key = parts[5]
            kept = best.get(key)
            if kept is None or weight < kept[0]:
                best[key] = (weight, parts)
        # decode_all ranks by (weight rounded, key); keys are distinct, so the first is this one
        key = min(best, key=lambda k: (round(best[k][0], 5), k))
        weight, parts = best[key]
        return self._build(surface, parts, weight, False), len(best)

    def _open_names(self, found: list[Analysis], written: str | None) -> list[Analysis]:
        """``found`` without the readings of an open class of names (part of speech :data:`NAME_POS`,
        a lemma with no capital letter) whose lemma the lexicon lists as a name or abbreviation (it
        says how that one is said: *kg'da*, never the letters' *kg'de*; *TMMOB'nin* once), the others
        written with the word's capitals when it has one (*Zorbuldak'ta*: *Zorbuldak*)."""
        if not any(a.pos == NAME_POS and a.lemma.islower() for a in found):
            return found
        if self._listed_names is None:
            self._listed_names = frozenset(self.lang.meta.get("listed_names") or ())
        listed = self._listed_names
        fold = self.lang.normalize
        capital = written is not None and written[:1].isupper()
        kept = []
        for a in found:
            if a.pos == NAME_POS and a.lemma.islower():
                if a.lemma in listed:
                    continue
                if capital:
                    a = _as_name(a, restore_case(written or "", a.lemma, fold), a.weight, a.guessed)
            kept.append(a)
        return kept

"""A fast path for analysis: a transducer's arcs held in Python dicts, walked one word at a time.

Calling OpenFst for every word (build an acceptor, compose, enumerate paths) costs a few hundred
microseconds, mostly in the crossing between Python and C++. For the small, arc-sorted transducers
of a grammar it is faster to copy the arcs once into Python dicts and walk them: at load time, for
every state, the arcs that read no input (epsilons, and the morph boundary ``+`` of the bounded
machine, which the surface word does not contain) are folded into the arcs that read a letter, so a
walk is one dict lookup per live path and input letter.

A walk returns, for each accepting path, the side tape (the input letters with the skipped boundary
symbols put back, i.e. the bounded surface), the output string and the path weight (tropical
semiring: weights add, lower is better).
"""

from __future__ import annotations

import heapq
import re
from collections.abc import Callable, Iterable
from dataclasses import MISSING, fields
from typing import TYPE_CHECKING, Any

import pynini

from .fstutil import NO_STATE_ID, Weight
from .results import Analysis, Morph

if TYPE_CHECKING:
    from .runtime import Language

Step = tuple[str, str, float, int]  # side-tape text, output text, weight, next state
Path = tuple[int, str, str, float]  # state, side-tape text, output text, weight

MAX_CLOSURE_DEPTH = 64  # longest chain of arcs that read no input (a guard against epsilon cycles)
MAX_LIVE = 4096  # live partial paths kept per input position (the best ones by weight)
MAX_GUESSES = 10  # guessed analyses kept per word
MAX_PATHS = 200  # paths read from one walk
MAX_GUESS_LENGTH = 60  # longer words get no guess (they are rarely words, and guessing grows with length)


class ArcWalker:
    """The arcs of one transducer in Python dicts; :meth:`walk` finds every path for an input string.

    ``skip`` names input labels (one-character codes) that a walk may take without reading input;
    they are written to the side tape, so the side tape of a path is the full input string of the
    transducer (for the bounded analyzer: the surface with its morph boundaries).
    """

    def __init__(self, fst: pynini.Fst, skip: Iterable[str] = ()) -> None:
        skip_labels = {ord(c) for c in skip}
        zero = Weight.zero(fst.weight_type())
        start = fst.start()
        self.start = start
        n = fst.num_states()
        consume: list[dict[str, list[Step]]] = [{} for _ in range(n)]
        free: list[list[Step]] = [[] for _ in range(n)]
        final: list[float | None] = [None] * n
        if start != NO_STATE_ID:
            for state in fst.states():
                w = fst.final(state)
                if w != zero:
                    final[state] = float(w)
                for arc in fst.arcs(state):
                    out = chr(arc.olabel) if arc.olabel else ""
                    weight = float(arc.weight)
                    if arc.ilabel == 0:
                        free[state].append(("", out, weight, arc.nextstate))
                    elif arc.ilabel in skip_labels:
                        free[state].append((chr(arc.ilabel), out, weight, arc.nextstate))
                    else:
                        consume[state].setdefault(chr(arc.ilabel), []).append(("", out, weight, arc.nextstate))
        closures = [self._closure(state, free) for state in range(n)]
        # Fold each state's closure into its letter arcs: trans[state][letter] = steps that read the letter.
        self.trans: list[dict[str, list[Step]]] = []
        self.finals: list[list[tuple[str, str, float]]] = []
        for state in range(n):
            table: dict[str, list[Step]] = {}
            ends: list[tuple[str, str, float]] = []
            for target, side, out, weight in closures[state]:
                for letter, steps in consume[target].items():
                    bucket = table.setdefault(letter, [])
                    for _, o2, w2, nxt in steps:
                        bucket.append((side + letter, out + o2, weight + w2, nxt))
                if final[target] is not None:
                    ends.append((side, out, weight + final[target]))  # type: ignore[operator]
            self.trans.append(table)
            self.finals.append(ends)
        self.num_states = n

    @staticmethod
    def _closure(state: int, free: list[list[Step]]) -> list[Path]:
        """Every (state, side text, output, weight) reachable from ``state`` by arcs that read no input."""
        found: dict[tuple[int, str, str], float] = {(state, "", ""): 0.0}
        todo: list[tuple[int, str, str, float, int]] = [(state, "", "", 0.0, 0)]
        while todo:
            here, side, out, weight, depth = todo.pop()
            if depth >= MAX_CLOSURE_DEPTH:
                continue
            for s2, o2, w2, nxt in free[here]:
                key = (nxt, side + s2, out + o2)
                total = weight + w2
                if key not in found or total < found[key]:
                    found[key] = total
                    todo.append((nxt, key[1], key[2], total, depth + 1))
        return [(k[0], k[1], k[2], w) for k, w in found.items()]

    def walk(self, word: str, limit: int = 1000, best: bool = False) -> list[tuple[str, str, float]]:
        """(side tape, output, weight) of every accepting path for ``word``, at most ``limit``, best first.

        With ``best``, only the best paths are sought: at each input position a state keeps only the
        partial paths of its lowest weight (ties kept), which is exact for the best complete paths
        because what follows a state costs the same whichever way the state was reached.
        """
        if self.start == NO_STATE_ID:
            return []
        trans = self.trans
        live: list[Path] = [(self.start, "", "", 0.0)]
        for letter in word:
            nxt: list[Path] = []
            for state, side, out, weight in live:
                steps = trans[state].get(letter)
                if steps:
                    for s2, o2, w2, target in steps:
                        nxt.append((target, side + s2, out + o2, weight + w2))
            if not nxt:
                return []
            if best and len(nxt) > 1:
                nxt = _best_per_state(nxt)
            if len(nxt) > MAX_LIVE:
                nxt = heapq.nsmallest(MAX_LIVE, nxt, key=lambda p: p[3])
            live = nxt
        results: list[tuple[str, str, float]] = []
        finals = self.finals
        for state, side, out, weight in live:
            for s2, o2, w2 in finals[state]:
                results.append((side + s2, out + o2, weight + w2))
        if len(results) > 1:
            results.sort(key=lambda r: (r[2], r[1]))
        return results[:limit]

    def accepts(self, word: str) -> bool:
        """True when some path reads ``word`` (no outputs are built)."""
        if self.start == NO_STATE_ID:
            return False
        trans = self.trans
        live = {self.start}
        for letter in word:
            nxt = set()
            for state in live:
                for step in trans[state].get(letter, ()):
                    nxt.add(step[3])
            if not nxt:
                return False
            live = nxt
        return any(self.finals[state] for state in live)

    def size(self) -> int:
        """Number of folded steps held (a measure of the table's memory)."""
        return sum(len(steps) for table in self.trans for steps in table.values()) + sum(len(f) for f in self.finals)


def _builder(cls: type) -> Callable[..., Any]:
    """A fast constructor for a frozen dataclass: the same object as ``cls(...)`` with every field given.

    A frozen dataclass's ``__init__`` sets each field through ``object.__setattr__``; filling the
    instance dict directly is about twice as fast, which matters when thousands of analyses are
    decoded per second. Fields added later with defaults keep their defaults.
    """
    names = [f.name for f in fields(cls)]
    defaults = {f.name: f.default for f in fields(cls) if f.default is not MISSING}
    new = object.__new__

    def build(*values: Any) -> Any:
        obj: Any = new(cls)
        obj.__dict__.update(defaults)
        obj.__dict__.update(zip(names, values))
        return obj

    return build


_new_morph = _builder(Morph)
_new_analysis = _builder(Analysis)


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
        from .compiler import GUESS_SYMBOL

        self.lang = lang
        self.bounded = ArcWalker(lang.fsts["bounded"], skip=[lang.plus])
        guesser = lang.fsts.get("guesser")
        self.guesser = ArcWalker(guesser, skip=[lang.plus]) if guesser is not None else None
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
        self._tails: dict[str, tuple[str, tuple[str, ...], tuple[tuple[int, tuple[str, ...]], ...], int]] = {}
        self._affix_morphs: dict[tuple[str, str], tuple[Morph, ...]] = {}
        self._stems: dict[tuple[str, str, str], Morph] = {}

    def analyze(self, word: str, guess: bool = False, limit: int = MAX_PATHS) -> list[Analysis]:
        """Every analysis of ``word``, best first; with ``guess``, guessed ones when the lexicon has none."""
        surface = self.lang.normalize(word)
        if not self.lang.acceptable(surface):
            return []
        found = self.decode_all(surface, self.bounded.walk(surface, limit), False)
        if not found and guess:
            return self.guess_normalized(surface)
        return found

    def guess(self, word: str, limit: int = MAX_GUESSES) -> list[Analysis]:
        """Guessed analyses of ``word`` (a stem the lexicon may not have), best first, marked ``guessed``."""
        surface = self.lang.normalize(word)
        if not self.lang.acceptable(surface):
            return []
        return self.guess_normalized(surface, limit)

    def guess_normalized(self, surface: str, limit: int = MAX_GUESSES) -> list[Analysis]:
        """Guesses of a normalized word: the ``limit`` best (only the paths that can be among them are decoded)."""
        if self.guesser is None or len(surface) > MAX_GUESS_LENGTH or limit < 1:
            return []
        walked = self.guesser.walk(surface, MAX_PATHS, best=limit == 1)
        if len(walked) > limit:
            # Paths come sorted by weight; keep every path that ties with the last one kept, so the
            # final order (weight, then analysis text) is the same as when everything is decoded.
            bound = round(walked[limit - 1][2], 5)
            walked = [w for w in walked if round(w[2], 5) <= bound]
        return self.decode_all(surface, walked, True)[:limit]

    def decode(self, surface: str, internal: str, bounded: str, weight: float, guessed: bool = False) -> Analysis:
        """One :class:`Analysis` from a walked or composed path, through precomputed tables.

        The analysis after the lemma (part of speech, affix ids, features) and the affix morphs are
        shared by many words: both are parsed once and kept in dicts.
        """
        if guessed:
            internal = internal.replace(self.mark, "")
        found = self.pos_re.search(internal)
        i = found.start() if found else len(internal)
        lemma = internal[:i]
        tail = internal[i:]
        parsed = self._tails.get(tail)
        if parsed is None:
            parsed = self._parse_tail(tail)
        pos, features, groups, nforms = parsed
        plus = self.lang.plus
        cut = bounded.find(plus)
        stem_form = bounded if cut < 0 else bounded[:cut]
        rest = "" if cut < 0 else bounded[cut:]
        key = (tail, rest)
        affixes = self._affix_morphs.get(key)
        if affixes is None:
            affixes = self._build_affixes(groups, nforms, rest.split(plus)[1:] if rest else [])
            if len(self._affix_morphs) > 100_000:
                self._affix_morphs.clear()
            self._affix_morphs[key] = affixes
        stem_key = (stem_form, lemma, pos)
        stem = self._stems.get(stem_key)
        if stem is None:
            if len(self._stems) > 100_000:
                self._stems.clear()
            gloss = self.lang.glosses.get((lemma, pos), lemma)
            stem = self._stems[stem_key] = _new_morph(stem_form, gloss, (pos,), "stem", lemma, None, None, None)
        return _new_analysis(surface, lemma, pos, features, (stem, *affixes), weight, self.lang.ud, guessed)

    def _parse_tail(self, tail: str) -> tuple[str, tuple[str, ...], tuple[tuple[int, tuple[str, ...]], ...], int]:
        """Part of speech, features, (affix id, its labels) groups and the number of affixes with a form."""
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
        parsed = (pos, tuple(features), frozen, nforms)
        if len(self._tails) > 100_000:
            self._tails.clear()
        self._tails[tail] = parsed
        return parsed

    def _build_affixes(self, groups: tuple[tuple[int, tuple[str, ...]], ...], nforms: int, forms: list[str]) -> tuple[Morph, ...]:
        aligned = len(forms) == nforms
        out = []
        k = 0
        for ident, group_labels in groups:
            gloss, underlying, slot, new_pos, has_form = self.affix_rows[ident]
            if has_form:
                form = forms[k] if aligned else "?"
                k += 1
            else:
                form = ""
            out.append(_new_morph(form, gloss, group_labels, "affix", underlying, slot, ident, new_pos))
        return tuple(out)

    def decode_all(self, surface: str, walked: list[tuple[str, str, float]], guessed: bool = False) -> list[Analysis]:
        """Decoded analyses of (bounded surface, internal analysis, weight) paths, deduplicated and ranked."""
        if not walked:
            return []
        decode = self.decode
        if len(walked) == 1:
            bounded, internal, weight = walked[0]
            return [decode(surface, internal, bounded, weight, guessed)]
        best: dict[tuple[str, str], Analysis] = {}
        for bounded, internal, weight in walked:
            analysis = decode(surface, internal, bounded, weight, guessed)
            key = (analysis.text, analysis.segmentation)
            if key not in best or weight < best[key].weight:
                best[key] = analysis
        ranked = sorted((round(a.weight, 5), key, a) for key, a in best.items())
        return [a for _, _, a in ranked]

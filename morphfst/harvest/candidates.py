"""Candidate entries for unknown words: a guesser that names the class and flags of each stem.

The language's own guesser (:meth:`Compiler.guesser`) maps a word to guessed lemmas and parts of
speech. For harvesting we need more: the class and the flags of each candidate, because competing
candidates differ exactly there (a voicing and a non-voicing stem, a front-harmony flag or not, a
stem type or its neighbour). This module compiles, from the grammar source, one transducer

    surface word  →  lemma · part of speech · variant · affix ids and features

where a *variant* is a (class, flag set) pair: every class with a ``guess`` pattern, with no flags and
with each flag set that entries of that class carry in the lexicon (the most common ones; a flag set
no entry of the class uses is not proposed). The guessed lemma goes through the class's stem rules
(like :meth:`Compiler.guess_stem_fst`), the flags put their markers after the stem and keep the rules
they block out of the cascade, exactly as for a lexicon entry (:meth:`Compiler.bounded`). Derivation
is bounded like the tables and the export: paths with more than ``depth`` derivational affixes are cut
from the transducer. Nothing here is specific to a language.
"""

from __future__ import annotations

from collections import Counter, defaultdict
from dataclasses import dataclass

import pynini

from ..compile.compiler import Compiler
from ..compile.fstutil import NO_STATE_ID, acc, chars, cross, union
from ..compile.stemrules import lemma_to_stem
from ..errors import Position, UserError
from ..language import model as m
from ..runtime.walk import ArcWalker

MAX_VARIANTS_PER_CLASS = 8  # flag sets tried per class (the most common in the lexicon)
MIN_FLAG_SET_SHARE = 0.005  # a flag set carried by a smaller share of a class's entries is not proposed
MAX_WALK = 3000  # paths read per word


@dataclass(frozen=True)
class Variant:
    """One way to enter a guessed stem: a class, its part of speech and a flag set, with its prior."""

    klass: str
    pos: str
    flags: tuple[str, ...]
    prior: float  # share of the class's lexicon entries that carry exactly these flags


@dataclass(frozen=True)
class Reading:
    """One guessed analysis of a word: candidate lemma, variant index and the cell (``N;PL;LOC``)."""

    lemma: str
    variant: int
    cell: str


def class_variants(grammar: m.Grammar, max_per_class: int = MAX_VARIANTS_PER_CLASS) -> list[Variant]:
    """Every (class, part of speech, flag set) a candidate may take, from the classes' guess patterns
    and the flag sets the lexicon's entries of each class carry."""
    from ..language.normalize import make_normalizer

    fold = make_normalizer(grammar.normalization)
    out: list[Variant] = []
    for klass in grammar.classes.values():
        if klass.guess is None:
            continue
        entries = [e for e in grammar.lexicon if e.klass == klass.name]
        sets = Counter(tuple(sorted(e.flags)) for e in entries)
        # a guessed stem is its lemma (through the class's stem rules): flag sets whose entries mostly
        # need a stem column (a geminate written single in the lemma, say) cannot be guessed
        plain = Counter(tuple(sorted(e.flags)) for e in entries if klass.stems or "".join(e.stem) == fold(e.lemma))
        total = max(len(entries), 1)
        chosen = [()] + [fs for fs, n in sets.most_common() if fs and n >= MIN_FLAG_SET_SHARE * total and plain[fs] * 2 > n]
        chosen = chosen[:max_per_class]
        tags = klass.pos_allowed or sorted({e.pos_tag for e in entries}) or grammar.pos_tags
        for pos in tags:
            for fs in chosen:
                # add-one smoothing: an unflagged stem is always possible, even in a class with no entries
                prior = (sets.get(fs, 0) + 1) / (total + len(chosen))
                out.append(Variant(klass.name, pos, fs, prior))
    return out


class CandidateGuesser:
    """Compiled candidate guesser of a grammar; :meth:`readings` lists the guessed analyses of a word."""

    def __init__(self, grammar: m.Grammar, depth: int = 0, max_per_class: int = MAX_VARIANTS_PER_CLASS) -> None:
        self.variants = class_variants(grammar, max_per_class)
        if not self.variants:
            raise UserError(
                f"no class of {grammar.name} declares a guess pattern, so there is nothing to harvest",
                Position(grammar.path),
                hint="give the classes that take new words a guess pattern: noun pos N -> number guess @cons* @vowel @letter*",
            )
        self.grammar = grammar
        self.depth = depth
        compiler = Compiler(grammar)
        s = compiler.space
        self.codes = [s.add(f"harvest:{i}", "guess", single_char_ok=False) for i in range(len(self.variants))]
        self.variant_of = {c: i for i, c in enumerate(self.codes)}
        self.labels = {code: name.split(":", 1)[1] for name, code in s.to_char.items() if ":" in name}
        self.kinds = dict(s.kinds)
        self.letters = {s.code(x): x for x in grammar.letters}
        self.fst = self._compile(compiler)
        self.walker = ArcWalker(self.fst)

    def _compile(self, compiler: Compiler) -> pynini.Fst:
        g, s = self.grammar, compiler.space
        groups: dict[frozenset[str], list[pynini.Fst]] = defaultdict(list)
        stems: dict[str, pynini.Fst] = {}
        letters = chars(compiler.letter_codes).closure().optimize()
        for i, v in enumerate(self.variants):
            klass = g.classes[v.klass]
            if v.klass not in stems:
                assert klass.guess is not None
                try:
                    pattern = compiler.expr(klass.guess).optimize()
                except KeyError as exc:
                    raise UserError(
                        f"class {klass.name}: the guess pattern names an unknown symbol or set {exc.args[0]!r}", klass.pos
                    ) from None
                stem = pynini.intersect(pattern, letters).optimize()
                stems[v.klass] = lemma_to_stem(compiler, klass, stem).optimize()
            markers = "".join(s.code(g.flags[f].marks) for f in v.flags if g.flags[f].marks)  # type: ignore[arg-type]
            after = s.code("'") if klass.apostrophe and "'" in s.to_char else ""
            tail = cross(acc(s.code(f"pos:{v.pos}") + self.codes[i]), markers + after)
            blocked = frozenset(r for f in v.flags for r in g.flags[f].blocks)
            groups[blocked].append(stems[v.klass] + tail + compiler.slot_graph(list(klass.next)))
        depth_filter = self._depth_filter(compiler)
        filt = compiler.constraint_filter(set(compiler.letter_codes) | set(self.codes))
        final = compiler.final_step()
        delete = compiler.delete_boundaries()
        parts = []
        for blocked, group in sorted(groups.items(), key=lambda kv: sorted(kv[0])):
            fst = pynini.compose(depth_filter, union(group).optimize())
            if filt is not None:
                fst = pynini.compose(filt, fst)
            for rule in g.rules:
                if rule.name not in blocked:
                    fst = pynini.compose(fst, compiler.rule_fst(rule))
            parts.append(pynini.compose(pynini.compose(fst, final), delete))
        out = union(parts).invert().optimize()
        if out.start() == NO_STATE_ID:
            raise UserError(f"the guess patterns of {g.name} give no word at all", Position(g.path))
        out.arcsort("ilabel")
        return out

    def _depth_filter(self, compiler: Compiler) -> pynini.Fst:
        """Analysis-side strings with at most ``depth`` derivational affixes (parts of speech after the first)."""
        s = compiler.space
        pos = [c for c, k in s.kinds.items() if k == "pos"]
        other = list(compiler.letter_codes) + [c for c, k in s.kinds.items() if k in ("feature", "affix", "guess")]
        rest = chars(other).closure()
        one = chars(pos) + rest
        fst = rest + one
        more = one
        for _ in range(self.depth):
            fst = fst | (rest + one + more)
            more = more + one
        return fst.optimize()

    def readings(self, surface: str) -> list[Reading]:
        """Every guessed analysis of a normalized word (at most :data:`MAX_WALK` paths), deduplicated."""
        out: dict[tuple[str, int, str], None] = {}
        letters, labels, variant_of = self.letters, self.labels, self.variant_of
        for _, internal, _ in self.walker.walk(surface, MAX_WALK):
            i = next((k for k, ch in enumerate(internal) if ch not in letters), -1)
            if i < 0:
                continue
            lemma = "".join(letters[c] for c in internal[:i])
            pos = labels.get(internal[i], "?")
            variant = variant_of.get(internal[i + 1], -1) if i + 1 < len(internal) else -1
            if variant < 0:
                continue
            feats = [labels[c] for c in internal[i + 2 :] if self.kinds.get(c) in ("feature", "pos")]
            out[(lemma, variant, ";".join([pos, *feats]))] = None
        return [Reading(lemma, v, cell) for lemma, v, cell in out]

"""Derive underlying stems from lemmas with a class's stem rules.

A class may name ``stems`` groups: ordered rewrite rules (the phonologists' ``A -> B / L _ R``,
compiled with cdrewrite like the main cascade; Kaplan & Kay 1994, Mohri & Sproat 1996) that turn the
folded lemma, between the word edges ``^`` and ``$``, into the underlying stem the slot graph starts
from. A lexicographer then writes ``katu`` with its inflection type and nothing else, and the type's
rules put the gradation site in (``ka<t>u``); a Turkish verb's rules take the infinitive ending off
(``gelmek`` → ``gel``). A stem given in the lexicon's ``stem`` column is used as it is.

Every lemma must get exactly one stem: none (no rule path) or several (an optional rule) is a user
error at the lexicon line.
"""

from __future__ import annotations

from collections import defaultdict
from collections.abc import Callable
from typing import Protocol

import pynini

from ..errors import UserError
from ..language import model as m
from ..language.symbols import SymbolSpace
from .fstutil import acc, chars, cross, paths, union


class Compiler(Protocol):
    """What stem rules need of :class:`morphfst.compile.compiler.Compiler` (which calls this module, so it is
    named here rather than imported)."""

    g: m.Grammar
    space: SymbolSpace
    sigma_star: pynini.Fst
    underlying_codes: list[str]

    def rule_fst(self, rule: m.Rule, cache_key: str | None = None) -> pynini.Fst: ...


def cascade(compiler: Compiler, groups: tuple[str, ...]) -> pynini.Fst:
    """The composed rules of the named stem-rule groups, in order, over the underlying alphabet."""
    cache: dict[tuple[str, ...], pynini.Fst] = compiler.__dict__.setdefault("_stem_cascades", {})
    if groups not in cache:
        fst = compiler.sigma_star.copy()
        for name in groups:
            for rule in compiler.g.stem_rules[name]:
                fst = pynini.compose(fst, compiler.rule_fst(rule, cache_key=f"stems:{name}:{rule.name}")).optimize()
        cache[groups] = fst
    return cache[groups]


def lemma_to_stem(compiler: Compiler, klass: m.StemClass, lemmas: pynini.Fst) -> pynini.Fst:
    """A transducer from the lemmas accepted by ``lemmas`` (letters only) to ``^`` + their stems.

    Used for guessed stems, whose lemma is any string a pattern allows.
    """
    s = compiler.space
    start, end = s.code(m.WORD_START), s.code(m.WORD_END)
    fst = cross("", start) + lemmas + cross("", end)
    if klass.stems:
        fst = pynini.compose(fst, cascade(compiler, tuple(klass.stems)))
    drop_end = union([chars([c for c in compiler.underlying_codes if c != end]), cross(end, "")]).closure()
    return pynini.compose(fst, drop_end.optimize()).optimize()


def derive_stems(
    grammar: m.Grammar,
    entries: list[m.LexEntry],
    compiler: Compiler | None = None,
    make: Callable[[m.Grammar], Compiler] | None = None,
) -> None:
    """Rewrite in place the stems of ``entries`` that were not given, by their classes' stem rules
    (compiled by ``compiler``, or by one ``make`` builds when some entry needs it)."""
    todo: dict[tuple[str, ...], list[m.LexEntry]] = defaultdict(list)
    for e in entries:
        klass = grammar.classes.get(e.klass)
        if not e.stem_given and klass is not None and klass.stems:
            todo[tuple(klass.stems)].append(e)
    if not todo:
        return
    if compiler is None:
        if make is None:
            raise ValueError("derive_stems needs a compiler or a way to make one")
        compiler = make(grammar)
    s = compiler.space
    start, end = s.code(m.WORD_START), s.code(m.WORD_END)
    for groups, group in todo.items():
        rules = cascade(compiler, groups)
        by_input: dict[str, list[m.LexEntry]] = defaultdict(list)
        for e in group:
            by_input[start + s.encode(e.stem) + end].append(e)
        inputs = union(acc(text) for text in by_input).optimize()
        found: dict[str, set[str]] = defaultdict(set)
        for inp, out, _ in paths(pynini.compose(inputs, rules), limit=4 * len(by_input) + 16):
            found[inp].add(out)
        for inp, es in by_input.items():
            outs = found.get(inp, set())
            if len(outs) != 1:
                e = es[0]
                what = "no stem" if not outs else f"{len(outs)} stems (" + ", ".join(sorted(_text(s, o) for o in outs)) + ")"
                raise UserError(
                    f"the stem rules of class {e.klass} ({', '.join(groups)}) give {what} for lemma {e.lemma!r}",
                    e.pos,
                    hint="check the entry's class, or give its underlying stem in the stem column",
                )
            stem = s.decode(next(iter(outs)))[1:-1]
            for e in es:
                e.stem = stem
                e.stem_given = True


def _text(space: object, codes: str) -> str:
    return "".join(space.decode(codes)[1:-1])  # type: ignore[attr-defined]

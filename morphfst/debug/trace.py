"""The derivation of a surface form through the ordered rules, with every change located.

Each rule is applied on its own (``Compiler.rule_fst``) to the current string; the path through the
composed machine pairs input and output symbols, so every change is known exactly (substitution,
deletion, insertion) without guessing an alignment afterwards. Each symbol of the current string
carries its provenance: the position of the underlying symbol it came from and the rules that wrote
it, so a later tool can say which rule produced a given surface letter.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import pynini

from ..compile.fstutil import NO_STATE_ID, Weight, acc, is_empty
from ..language import model as m
from .session import DebugSession

MAX_BRANCHES = 32  # optional rules branch a derivation; at most this many branches are followed


@dataclass
class Change:
    """One change made by a rule: symbols ``old`` at ``before[start:end]`` became ``new`` at ``after[at:at_end]``."""

    kind: str  # "substitute", "delete" or "insert"
    old: str
    new: str
    start: int  # symbol index in the string before the rule
    end: int
    at: int  # symbol index in the string after the rule
    at_end: int


@dataclass
class RuleStep:
    """A rule that changed the string, with the string before and after and the changes marked."""

    rule: str
    line: int
    text: str
    before: str
    after: str
    before_marks: str  # a line of spaces and carets under ``before``
    after_marks: str  # a line of spaces and carets under ``after``
    changes: list[Change]


@dataclass
class Origin:
    """Provenance of one symbol of a derived string."""

    source: int | None  # index of the underlying symbol it came from (None: inserted by a rule)
    rules: tuple[str, ...] = ()  # rules that wrote this symbol, in order


@dataclass
class Derivation:
    """The whole derivation of one underlying form."""

    underlying: str  # rendered with symbol names, e.g. ^kitap+(y)I$
    underlying_symbols: list[str]
    steps: list[RuleStep]
    skipped: list[str]  # rules blocked by the entry's flags
    output: str  # rendered result of the last rule
    bounded: str  # surface with "+" between morphs, e.g. kitab+ı ("" when an archiphoneme is left)
    surface: str
    resolved: bool  # False when an archiphoneme is left unresolved (no surface form)
    output_symbols: list[str] = field(default_factory=list)
    origins: list[Origin] = field(default_factory=list)  # per symbol of the bounded surface (boundaries included)
    gaps: list[tuple[str, ...]] = field(default_factory=list)  # per gap of the bounded surface: rules that deleted there

    @property
    def fired(self) -> list[str]:
        return [s.rule for s in self.steps]


@dataclass
class _State:
    codes: str
    origins: list[Origin]
    gaps: list[tuple[str, ...]]
    steps: list[RuleStep]


def _arc_paths(fst: pynini.Fst, limit: int) -> list[list[tuple[int, int]]]:
    """The label pairs of the successful paths of an acyclic machine (at most ``limit``)."""
    out: list[list[tuple[int, int]]] = []
    start = fst.start()
    if start == NO_STATE_ID:
        return out
    zero = Weight.zero(fst.weight_type())
    stack: list[tuple[int, list[tuple[int, int]]]] = [(start, [])]
    while stack and len(out) < limit:
        state, pairs = stack.pop()
        if fst.final(state) != zero:
            out.append(pairs)
        if len(pairs) > 4000:
            continue
        for arc in fst.arcs(state):
            stack.append((arc.nextstate, pairs + [(arc.ilabel, arc.olabel)]))
    return out


def apply_rule(session: DebugSession, rule: m.Rule, state: _State, limit: int = MAX_BRANCHES) -> list[_State]:
    """Every distinct result of one rule on the current string, with provenance carried along."""
    lattice = pynini.compose(acc(state.codes), session.compiler.rule_fst(rule)).connect()
    if is_empty(lattice):
        return []
    results: dict[str, _State] = {}
    for pairs in _arc_paths(lattice, limit * 4):
        new = _follow(session, rule, state, pairs)
        if new.codes not in results:
            results[new.codes] = new
        if len(results) >= limit:
            break
    return list(results.values())


def _follow(session: DebugSession, rule: m.Rule, state: _State, pairs: list[tuple[int, int]]) -> _State:
    """The string after a rule, from the label pairs of one path, with changes and provenance."""
    before = state.codes
    out: list[str] = []
    origins: list[Origin] = []
    gaps: list[tuple[str, ...]] = [state.gaps[0] if state.gaps else ()]
    i = 0  # index into before
    changes: list[Change] = []
    for il, ol in pairs:
        if il and ol and il == ol:
            out.append(chr(ol))
            origins.append(state.origins[i])
            i += 1
            gaps.append(state.gaps[i] if i < len(state.gaps) else ())
            continue
        if il and ol:
            changes.append(Change("substitute", chr(il), chr(ol), i, i + 1, len(out), len(out) + 1))
            out.append(chr(ol))
            origins.append(Origin(state.origins[i].source, state.origins[i].rules + (rule.name,)))
            i += 1
            gaps.append(state.gaps[i] if i < len(state.gaps) else ())
        elif il:
            changes.append(Change("delete", chr(il), "", i, i + 1, len(out), len(out)))
            i += 1
            gaps[-1] = gaps[-1] + (rule.name,) + (state.gaps[i] if i < len(state.gaps) else ())
        elif ol:
            changes.append(Change("insert", "", chr(ol), i, i, len(out), len(out) + 1))
            out.append(chr(ol))
            origins.append(Origin(None, (rule.name,)))
            gaps.append(())
    after = "".join(out)
    steps = state.steps
    if after != before:
        steps = steps + [_step(session, rule, before, after, _merge(changes))]
    return _State(after, origins, gaps, steps)


def _merge(changes: list[Change]) -> list[Change]:
    """Adjacent changes of one path as one change each (a deletion next to an insertion is a substitution)."""
    merged: list[Change] = []
    for c in changes:
        if merged and merged[-1].end == c.start and merged[-1].at_end == c.at:
            last = merged[-1]
            kind = last.kind if last.kind == c.kind else "substitute"
            merged[-1] = Change(kind, last.old + c.old, last.new + c.new, last.start, c.end, last.at, c.at_end)
        else:
            merged.append(c)
    return merged


def _columns(names: list[str]) -> list[int]:
    cols = [0]
    for n in names:
        cols.append(cols[-1] + len(n))
    return cols


def _marks(names: list[str], spans: list[tuple[int, int]]) -> str:
    """Carets under the symbols of ``spans``; an empty span (a gap) gets one caret where it is."""
    cols = _columns(names)
    line = [" "] * (cols[-1] + 1)
    for a, b in spans:
        if a == b:
            line[min(cols[a], len(line) - 1)] = "^"
        for k in range(cols[a], cols[b]):
            line[k] = "^"
    return "".join(line).rstrip()


def _step(session: DebugSession, rule: m.Rule, before: str, after: str, changes: list[Change]) -> RuleStep:
    bnames, anames = session.names(before), session.names(after)
    for c in changes:
        c.old = session.render(c.old)
        c.new = session.render(c.new)
    return RuleStep(
        rule.name,
        rule.pos.line,
        rule.text,
        "".join(bnames),
        "".join(anames),
        _marks(bnames, [(c.start, c.end) for c in changes if c.kind != "insert"] or [(c.start, c.start) for c in changes]),
        _marks(anames, [(c.at, c.at_end) for c in changes if c.kind != "delete"] or [(c.at, c.at) for c in changes]),
        changes,
    )


def derive(session: DebugSession, underlying: str, flags: list[str] | None = None, target: str | None = None) -> list[Derivation]:
    """Derivations of an underlying form (symbol codes) through the ordered rules.

    Rules blocked by ``flags`` are skipped. Obligatory rules give one result; optional rules branch.
    With ``target`` (a surface word), only derivations ending in that surface are returned.
    """
    blocked = session.blocked_rules(flags or [])
    states = [_State(underlying, [Origin(i) for i in range(len(underlying))], [()] * (len(underlying) + 1), [])]
    skipped: list[str] = []
    for rule in session.grammar.rules:
        if rule.name in blocked:
            skipped.append(rule.name)
            continue
        nxt: list[_State] = []
        for st in states:
            nxt.extend(apply_rule(session, rule, st))
        states = nxt[:MAX_BRANCHES]
        if not states:
            break
    out = [_finish(session, underlying, st, skipped) for st in states]
    if target is not None:
        out = [d for d in out if d.surface == target]
    return out


def _finish(session: DebugSession, underlying: str, st: _State, skipped: list[str]) -> Derivation:
    """Apply the final step (markers and word boundaries dropped, optional segments realized)."""
    s = session.space
    g = session.grammar
    drop = {s.code(x) for x in g.markers} | {s.code(m.WORD_START), s.code(m.WORD_END)}
    letters = set(session.letters) | {s.code(m.MORPH_BOUNDARY)}
    realize = {s.code(o): s.code(o[1:-1]) for o in g.optionals if o[1:-1] in s.to_char}
    out: list[str] = []
    origins: list[Origin] = []
    gaps: list[tuple[str, ...]] = [st.gaps[0] if st.gaps else ()]
    resolved = True
    for i, ch in enumerate(st.codes):
        following = st.gaps[i + 1] if i + 1 < len(st.gaps) else ()
        if ch in drop:
            gaps[-1] = gaps[-1] + following
            continue
        ch = realize.get(ch, ch)
        if ch not in letters:
            resolved = False
        out.append(ch)
        origins.append(st.origins[i])
        gaps.append(following)
    bounded = session.render("".join(out)) if resolved else ""
    return Derivation(
        underlying=session.render(underlying),
        underlying_symbols=session.names(underlying),
        steps=st.steps,
        skipped=skipped,
        output=session.render(st.codes),
        bounded=bounded,
        surface=bounded.replace(m.MORPH_BOUNDARY, ""),
        resolved=resolved,
        output_symbols=session.names(st.codes),
        origins=origins,
        gaps=gaps,
    )

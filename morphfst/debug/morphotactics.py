"""Walks through the slot graph as data: the path of an analysis, and where a morph sequence breaks it.

The slot graph of the language model: a class enters some slots; each affix of a slot leads to its
own followers or to the slot's; ``end`` ends the word. Zero morphs (affixes without a form) are
taken silently when a sequence of morphs with forms is checked.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from ..language import model as m


@dataclass
class PathStep:
    """One step of a path through the slot graph."""

    node: str  # class name, slot name, or "end"
    kind: str  # "class", "slot" or "end"
    affix_id: int | None = None
    form: str = ""  # underlying form of the affix ("" for a zero morph)
    features: list[str] = field(default_factory=list)
    new_pos: str | None = None  # set for a derivational affix (part of speech after it)
    allowed: bool = True  # False when the graph has no edge into this step


def followers(affix: m.Affix, grammar: m.Grammar) -> list[str]:
    return list(affix.next) if affix.next is not None else list(grammar.slots[affix.slot].next)


def analysis_path(grammar: m.Grammar, klass: str, affixes: list[m.Affix]) -> list[PathStep]:
    """The path of a class and a full affix chain (zero morphs included), each edge checked."""
    steps = [PathStep(klass, "class")]
    allowed_next = list(grammar.classes[klass].next)
    for a in affixes:
        steps.append(PathStep(a.slot, "slot", a.ident, a.form_text, list(a.features), a.new_pos, a.slot in allowed_next))
        allowed_next = followers(a, grammar)
    steps.append(PathStep(m.END_SLOT, "end", allowed=m.END_SLOT in allowed_next))
    return steps


def closure(grammar: m.Grammar, names: set[str]) -> set[str]:
    """Slots (and ``end``) reachable from ``names`` through zero morphs only."""
    out = set(names)
    todo = list(names)
    while todo:
        name = todo.pop()
        if name == m.END_SLOT:
            continue
        for a in grammar.slots[name].affixes:
            if not a.form:
                for nxt in followers(a, grammar):
                    if nxt not in out:
                        out.add(nxt)
                        todo.append(nxt)
    return out


@dataclass
class Break:
    """Where a sequence of morphs leaves the slot graph."""

    index: int  # index of the morph that cannot come next (len(sequence) when the word cannot end)
    after: str  # the slot (or class) of the morph before
    after_kind: str  # "class" or "slot"
    reachable: list[str]  # slots reachable there (through zero morphs), "end" included
    wanted: str  # the slot of the morph that cannot come next, or "end"


def find_break(grammar: m.Grammar, klass: str, affixes: list[m.Affix]) -> Break | None:
    """The first point where a sequence of affixes with forms cannot be placed in the slot graph.

    Zero morphs may be taken anywhere between them. ``None`` when the sequence fits.
    """
    current = closure(grammar, set(grammar.classes[klass].next))
    after, after_kind = klass, "class"
    for index, a in enumerate(affixes):
        if a.slot not in current:
            return Break(index, after, after_kind, sorted(current), a.slot)
        current = closure(grammar, set(followers(a, grammar)))
        after, after_kind = a.slot, "slot"
    if m.END_SLOT not in current:
        return Break(len(affixes), after, after_kind, sorted(current), m.END_SLOT)
    return None


def constraint_violations(grammar: m.Grammar, affixes: list[m.Affix], pos: str) -> list[m.Constraint]:
    """The co-occurrence constraints that a full affix chain (zero morphs included) violates."""
    present: set[str] = {pos}
    for a in affixes:
        present.update(a.features)
        if a.new_pos:
            present.add(a.new_pos)
        if a.name:
            present.add(a.name)
    bad = []
    for c in grammar.constraints:
        if c.kind == "excludes" and c.left in present and c.right in present:
            bad.append(c)
        elif c.kind == "requires" and c.left in present and c.right not in present:
            bad.append(c)
    return bad

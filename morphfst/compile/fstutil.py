"""Small helpers over pynini (OpenFst) for strings of one-character symbol codes."""

from __future__ import annotations

from collections.abc import Iterable

import pynini

TOKEN = "utf8"

# pynini provides these at run time but its type stubs do not re-export them; name them once here.
Arc = pynini.Arc  # type: ignore[attr-defined]
Weight = pynini.Weight  # type: ignore[attr-defined]
NO_STATE_ID: int = pynini.NO_STATE_ID  # type: ignore[attr-defined]
ACYCLIC = pynini.ACYCLIC  # type: ignore[attr-defined]


def acc(text: str, weight: float = 0.0) -> pynini.Fst:
    """An acceptor for a string of symbol codes (the empty string allowed)."""
    fst = pynini.accep(pynini.escape(text), token_type=TOKEN)
    if weight:
        fst = pynini.accep(pynini.escape(text), token_type=TOKEN, weight=weight)
    return fst


def strings(texts: Iterable[str]) -> pynini.Fst:
    """A deterministic, minimal acceptor for a set of code strings (a trie, then minimized).

    Built in one pass by OpenFst's string compiler: a union of one acceptor per string followed by
    ``optimize`` grows faster than the number of strings (tens of thousands of strings took minutes).
    """
    items = [pynini.escape(t) for t in dict.fromkeys(texts)]
    if not items:
        return empty()
    return pynini.string_map(items, input_token_type=TOKEN, output_token_type=TOKEN).optimize()


def cross(a: str | pynini.Fst, b: str | pynini.Fst) -> pynini.Fst:
    """A transducer from ``a`` to ``b`` (strings of codes or FSTs)."""
    left = acc(a) if isinstance(a, str) else a
    right = acc(b) if isinstance(b, str) else b
    return pynini.cross(left, right)


def union(fsts: Iterable[pynini.Fst]) -> pynini.Fst:
    items = list(fsts)
    if not items:
        return empty()
    if len(items) == 1:
        return items[0].copy()
    return pynini.union(*items)


def chars(codes: Iterable[str]) -> pynini.Fst:
    """An acceptor for any one of the given single symbols."""
    return union(acc(c) for c in dict.fromkeys(codes))


def empty() -> pynini.Fst:
    """The FST that accepts nothing."""
    fst = pynini.Fst()
    fst.add_state()
    fst.set_start(0)
    return fst


def is_empty(fst: pynini.Fst) -> bool:
    return fst.start() == NO_STATE_ID or fst.num_states() == 0


def size(fst: pynini.Fst) -> tuple[int, int]:
    """(states, arcs)."""
    return fst.num_states(), sum(fst.num_arcs(s) for s in fst.states())


def paths(fst: pynini.Fst, limit: int = 1000) -> list[tuple[str, str, float]]:
    """(input, output, weight) of the paths of ``fst``, at most ``limit`` (best first if cyclic)."""
    if is_empty(fst):
        return []
    if not fst.properties(ACYCLIC, True) == ACYCLIC:
        fst = pynini.shortestpath(fst, nshortest=limit)
    out = _read_paths(fst, limit + 1)
    if len(out) > limit:
        # more paths than the limit: take the best ones, so the limit never drops the best analysis
        out = _read_paths(pynini.shortestpath(fst, nshortest=limit), limit)
    return out


def _read_paths(fst: pynini.Fst, limit: int) -> list[tuple[str, str, float]]:
    out: list[tuple[str, str, float]] = []
    it = fst.paths(input_token_type=TOKEN, output_token_type=TOKEN)
    while not it.done():
        out.append((it.istring(), it.ostring(), float(it.weight())))
        if len(out) >= limit:
            break
        it.next()
    return out

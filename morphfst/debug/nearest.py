"""Nearest accepted words: a weighted edit transducer composed with the language's accepted words.

The edit transducer has one state per number of edits made so far (at most ``max_edits``), so it is
finite and small: matching a symbol costs nothing and keeps the state, a substitution, insertion or
deletion costs :data:`EDIT_COST` and moves to the next state. Composed with the word on one side and
with the acceptor of every word the analyzer accepts (weighted by its best analysis) on the other,
its shortest paths are the accepted words closest in edit distance (Levenshtein), best analysis
weight breaking ties.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import pynini

from ..compile.fstutil import Arc, Weight, acc, is_empty, paths
from .session import DebugSession

EDIT_COST = 1000.0  # large against analysis weights, so edit distance ranks first


@dataclass
class NearWord:
    """An accepted word near the given one, with its distance and analyses."""

    word: str
    distance: int
    analyses: list[str] = field(default_factory=list)


def edit_transducer(alphabet: list[str], max_edits: int) -> pynini.Fst:
    """Σ* → Σ* with at most ``max_edits`` substitutions, insertions or deletions, each weighing EDIT_COST."""
    fst = pynini.Fst()
    one = Weight.one(fst.weight_type())
    cost = Weight(fst.weight_type(), EDIT_COST)
    states = [fst.add_state() for _ in range(max_edits + 1)]
    fst.set_start(states[0])
    labels = sorted({ord(c) for c in alphabet})
    for k, state in enumerate(states):
        fst.set_final(state)
        for a in labels:
            fst.add_arc(state, Arc(a, a, one, state))
        if k == max_edits:
            continue
        nxt = states[k + 1]
        for a in labels:
            fst.add_arc(state, Arc(a, 0, cost, nxt))  # deletion
            fst.add_arc(state, Arc(0, a, cost, nxt))  # insertion
            for b in labels:
                if a != b:
                    fst.add_arc(state, Arc(a, b, cost, nxt))  # substitution
    fst.arcsort("olabel")
    return fst


def nearest_words(lang: object, word: str, max_distance: int = 2, limit: int = 8, include_self: bool = False) -> list[NearWord]:
    """Accepted words within ``max_distance`` edits of ``word``, nearest first, with their analyses."""
    session = DebugSession.open(lang)  # type: ignore[arg-type]
    surface = session.lang.normalize(word)
    if not session.lang.acceptable(surface):
        return []
    alphabet = sorted(set(session.letters) | set(surface))
    query = pynini.compose(acc(surface), edit_transducer(alphabet, max_distance))
    lattice = pynini.compose(query, session.surface_acceptor).connect()
    if is_empty(lattice):
        return []
    best: dict[str, float] = {}
    for _, out, weight in paths(pynini.shortestpath(lattice, nshortest=limit * 8), limit * 8):
        if out == surface and not include_self:
            continue
        if out not in best or weight < best[out]:
            best[out] = weight
    ranked = sorted(best.items(), key=lambda kv: (kv[1], kv[0]))[:limit]
    found = []
    for near, weight in ranked:
        distance = int(round(weight // EDIT_COST)) if weight >= EDIT_COST - 1e-6 else 0
        found.append(
            NearWord(
                near,
                _levenshtein(surface, near) if distance == 0 and near != surface else distance,
                [a.text for a in session.lang.analyze(near)],
            )
        )
    return sorted(found, key=lambda n: (n.distance, ranked_index(ranked, n.word)))


def ranked_index(ranked: list[tuple[str, float]], word: str) -> int:
    for i, (w, _) in enumerate(ranked):
        if w == word:
            return i
    return len(ranked)


def _levenshtein(a: str, b: str) -> int:
    prev = list(range(len(b) + 1))
    for i, ca in enumerate(a, start=1):
        cur = [i]
        for j, cb in enumerate(b, start=1):
            cur.append(min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (ca != cb)))
        prev = cur
    return prev[-1]


def align(a: str, b: str) -> list[tuple[str, str]]:
    """A minimal edit alignment of two strings as pairs (``""`` for a gap)."""
    n, k = len(a), len(b)
    d = [[0] * (k + 1) for _ in range(n + 1)]
    for i in range(n + 1):
        d[i][0] = i
    for j in range(k + 1):
        d[0][j] = j
    for i in range(1, n + 1):
        for j in range(1, k + 1):
            d[i][j] = min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + (a[i - 1] != b[j - 1]))
    pairs: list[tuple[str, str]] = []
    i, j = n, k
    # Walking back from the end: a match first, then gaps, then a substitution, so that among equally
    # short alignments the differences are pushed towards the start of the word.
    while i or j:
        if i and j and a[i - 1] == b[j - 1] and d[i][j] == d[i - 1][j - 1]:
            pairs.append((a[i - 1], b[j - 1]))
            i, j = i - 1, j - 1
        elif j and d[i][j] == d[i][j - 1] + 1:
            pairs.append(("", b[j - 1]))
            j -= 1
        elif i and d[i][j] == d[i - 1][j] + 1:
            pairs.append((a[i - 1], ""))
            i -= 1
        else:
            pairs.append((a[i - 1], b[j - 1]))
            i, j = i - 1, j - 1
    return pairs[::-1]

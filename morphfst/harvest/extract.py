"""Paradigm-based lexicon extraction: candidate entries for unknown words, resolved by evidence.

The method follows Forsberg, Hammarström & Ranta (2006, *Morphological lexicon extraction from raw
text data*, FinTAL): a candidate entry (lemma, class, part of speech, flags) is supported by the word
types of the corpus its paradigm generates, and candidates that compete for the same words are
resolved by that evidence (from memory).

1. Every word type the lexicon does not analyze is given its candidate entries by the candidate
   guesser (:mod:`.candidates`): the guesser is the inverse of the bounded paradigm generator over
   guessed stems, so reading all the unknown types through it and grouping the readings by candidate
   gives, for each candidate, exactly the attested forms its bounded paradigm generates, each with
   the cells it fills.
2. Each candidate is scored::

       score = attested distinct forms
               - Σ over the paradigm's frequent cells with no attested form of (1 - exp(-N · p(cell)))
               + 0.5 · ln prior(class, flags)
               + 0.5 · Σ over attested forms of ln [P(capitalization of the form | class) / (1/2)]

   ``p(cell)`` is the share of the class's tokens in that cell, measured on the corpus words the
   lexicon knows (the same corpus, so the same genre; a class with few known tokens borrows the
   shares of all classes pooled). ``N`` is the number of draws the candidate's evidence stands for:
   its attested tokens, but no more than its distinct forms divided by the share of the cells they
   fill (token counts of word forms are bursty, distinct forms are not). The second term counts the
   forms the paradigm predicts to be frequent but that never occur: a cell expected three times
   costs almost one form, a rare cell almost nothing; the frequent cells are the most frequent ones
   that hold 90 % of the class's tokens (at most 40). The prior is the share of the lexicon's entries
   with that class and flag set, and breaks ties between candidates whose forms in the corpus are the
   same. The capitalization term compares how the candidate's forms are written with how the corpus
   writes the known words of the class (names are written with a capital; common nouns rarely).
3. Resolution is greedy: the best candidate wins and claims its forms; every candidate that shared
   one of them loses it and is scored again (lazily); each attested word is credited to at most one
   winner. The best competitor at the time a candidate wins is its runner-up.
"""

from __future__ import annotations

import heapq
import math
import multiprocessing
import sys
import time
from collections import Counter, defaultdict
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from ..compile.loader import load_model
from ..errors import UserError
from ..runtime.compiled_language import Language
from ..tables.paradigm import Bound, cell_templates
from .candidates import CandidateGuesser, Reading, Variant

PRIOR_WEIGHT = 0.5  # weight of ln prior(class, flags)
CAP_WEIGHT = 0.5  # weight of the capitalization term
CAP_CLIP = 0.02  # capitalization probabilities are kept in [CAP_CLIP, 1 - CAP_CLIP]
CELL_SMOOTHING = 0.1  # share of the observed cell mass spread evenly over all cells of a class
MIN_SHARE = 0.02  # lowest share of the cells a candidate fills, when estimating its token count
CLOSE_MARGIN = 1.0  # a runner-up within this many points (or a quarter of the score) is close
MAX_EXAMPLES = 10
BORROW_TOKENS = 100.0  # known tokens at which a class relies half on its own cell shares, half on the pooled ones
MAX_RIVALS = 20  # competitors scored again when looking for a proposal's runner-up
CORE_MASS = 0.9  # the penalty looks at the most frequent cells that hold this share of a class's tokens
MAX_CORE_CELLS = 40
MAX_MEASURED = 2000  # known word types (the most frequent) measured for cell shares and capitalization


@dataclass
class HarvestOptions:
    """Options of a harvest (see ``morphfst harvest --help``)."""

    min_forms: int = 2  # distinct attested forms a proposal needs
    min_tokens: int = 2  # attested tokens a proposal needs
    top: int | None = None  # keep the best N proposals
    min_score: float | None = 0.0  # the lowest score a proposal may have (None: no floor)
    depth: int = 0  # derivational affixes allowed in a matched form (as in tables and export)
    jobs: int = 1  # worker processes for reading the unknown types
    gloss: str = "?"  # the gloss written in the proposals (the reviewer replaces it)
    progress: bool = True


@dataclass
class Proposal:
    """One proposed lexicon entry with its evidence."""

    lemma: str
    klass: str
    pos: str
    flags: tuple[str, ...]
    score: float
    forms: dict[str, int]  # attested form → tokens
    cells: dict[str, str]  # attested form → the cell shown for it
    runner_up: str = ""

    @property
    def tokens(self) -> int:
        return sum(self.forms.values())

    def examples(self) -> list[tuple[str, str]]:
        """Up to ten (form, analysis) pairs, most frequent first."""
        ranked = sorted(self.forms.items(), key=lambda kv: (-kv[1], kv[0]))[:MAX_EXAMPLES]
        return [(f, f"{self.lemma} {self.cells[f]}") for f, _ in ranked]

    def to_dict(self) -> dict[str, Any]:
        return {
            "lemma": self.lemma,
            "class": self.klass,
            "pos": self.pos,
            "flags": list(self.flags),
            "score": round(self.score, 3),
            "attested": len(self.forms),
            "tokens": self.tokens,
            "examples": self.examples(),
            "runner_up": self.runner_up,
        }


@dataclass
class HarvestResult:
    """The proposals, best first, and figures about the run."""

    proposals: list[Proposal]
    types: int = 0
    tokens: int = 0
    unknown_types: int = 0
    candidates: int = 0
    seconds: dict[str, float] = field(default_factory=dict)


# ---------------------------------------------------------------------------------------------
# Reading unknown types (in worker processes with --jobs)

_WORKER: CandidateGuesser | None = None


def _read_chunk(words: list[str]) -> list[list[Reading]]:
    assert _WORKER is not None
    return [_WORKER.readings(w) for w in words]


class Harvester:
    """Harvest proposals for one compiled language (its grammar source is compiled once into the
    candidate guesser, then any number of corpora can be harvested)."""

    def __init__(self, lang: Language, depth: int = 0) -> None:
        self.lang = lang
        path = lang.meta.get("grammar_path")
        if not path or not Path(path).exists():
            raise UserError(
                "the grammar source of this compiled language is not here, so candidate entries cannot be built",
                hint=f"the language was compiled from {path or 'an unknown file'}; give the grammar file with -l",
            )
        self.grammar = load_model(path)
        t0 = time.perf_counter()
        self.guesser = CandidateGuesser(self.grammar, depth=depth)
        self.compile_seconds = time.perf_counter() - t0
        self.depth = depth
        self.variants = self.guesser.variants
        self.entry_class = {(e.lemma, e.pos_tag): e.klass for e in self.grammar.lexicon}
        guessable = Counter(e.klass for e in self.grammar.lexicon if self.grammar.classes[e.klass].guess is not None)
        total = sum(guessable.values())
        classes = {v.klass for v in self.variants}
        self.class_prior = {c: (guessable.get(c, 0) + 1) / (total + len(classes)) for c in classes}
        self.cells: dict[tuple[str, str], list[str]] = {}
        bound = Bound(depth=depth)
        for v in self.variants:
            if (v.klass, v.pos) not in self.cells:
                try:
                    templates = cell_templates(lang.meta, v.klass, v.pos, bound)
                except UserError:
                    # too many cells within the depth (a Turkish verb's chains of voice, mood, tense and
                    # person): the cells of its inflection table's layout stand for its paradigm
                    templates = cell_templates(lang.meta, v.klass, v.pos, Bound(depth=depth, layout_only=True))
                self.cells[(v.klass, v.pos)] = [";".join(t.tags) for t in templates if not t.blocked_by]

    # ---- the whole run -----------------------------------------------------------------------------
    def harvest(self, spellings: Mapping[str, int], options: HarvestOptions | None = None) -> HarvestResult:
        """Proposals from word types and their counts (spellings as written; case is kept for lemmas)."""
        opts = options or HarvestOptions()
        if opts.depth != self.depth:
            raise UserError("this harvester was built for another derivation depth", hint=f"build it with depth={opts.depth}")
        if opts.min_forms < 1 or opts.min_tokens < 1:
            raise UserError("the minimum evidence must be at least 1", hint="--min-forms and --min-tokens take 1 or more")
        if opts.top is not None and opts.top < 1:
            raise UserError("--top must be 1 or more", hint="leave it out to keep every proposal")
        if not spellings:
            raise UserError("no words to harvest", hint="give a corpus or a word list with at least one word")
        seconds: dict[str, float] = {"compile": self.compile_seconds}
        t0 = time.perf_counter()
        lang = self.lang
        types: Counter[str] = Counter()
        written: dict[str, Counter[str]] = defaultdict(Counter)
        for spelling, count in spellings.items():
            if count <= 0:
                continue
            surface = lang.normalize(spelling)
            if lang.acceptable(surface):
                types[surface] += count
                written[surface][spelling] += count
        if not types:
            raise UserError("none of the input's words can be read by this language", hint="check the language (-l)")
        known: dict[str, int] = {}
        unknown: list[str] = []
        accepts = lang.fast.bounded.accepts
        for surface in types:
            if accepts(surface):
                known[surface] = types[surface]
            else:
                unknown.append(surface)
        unknown.sort()
        self._measure(known, written)
        seconds["known"] = time.perf_counter() - t0
        t1 = time.perf_counter()
        readings = self._read_all(unknown, opts)
        seconds["readings"] = time.perf_counter() - t1
        t2 = time.perf_counter()
        # Group the readings by candidate: (lemma, variant) → form → cells.
        evidence: dict[tuple[str, int], dict[str, set[str]]] = defaultdict(lambda: defaultdict(set))
        for surface, found in zip(unknown, readings):
            for r in found:
                evidence[(r.lemma, r.variant)][surface].add(r.cell)
        candidates = {k: v for k, v in evidence.items() if len(v) >= opts.min_forms}
        proposals = self._resolve(candidates, types, written, opts)
        seconds["resolve"] = time.perf_counter() - t2
        return HarvestResult(
            proposals,
            types=len(types),
            tokens=sum(types.values()),
            unknown_types=len(unknown),
            candidates=len(evidence),
            seconds=seconds,
        )

    def _read_all(self, unknown: list[str], opts: HarvestOptions) -> list[list[Reading]]:
        bar = _TypeBar(len(unknown), opts.progress)
        size = 500
        chunks = [unknown[i : i + size] for i in range(0, len(unknown), size)]
        out: list[list[Reading]] = []
        try:
            if opts.jobs > 1 and len(chunks) > 1 and "fork" in multiprocessing.get_all_start_methods():
                global _WORKER
                _WORKER = self.guesser  # inherited by the forked workers: nothing is pickled or compiled again
                try:
                    with multiprocessing.get_context("fork").Pool(opts.jobs) as pool:
                        for result in pool.imap(_read_chunk, chunks):
                            out.extend(result)
                            bar.update(len(result))
                finally:
                    _WORKER = None
            else:
                for chunk in chunks:
                    out.extend(self.guesser.readings(w) for w in chunk)
                    bar.update(len(chunk))
        finally:
            bar.close()
        return out

    # ---- the corpus's known words: cell shares and capitalization per class ------------------------
    def _measure(self, known: dict[str, int], written: dict[str, Counter[str]]) -> None:
        mass: dict[str, dict[str, float]] = defaultdict(lambda: defaultdict(float))
        caps: dict[str, list[float]] = defaultdict(lambda: [0.0, 0.0])
        classes = {v.klass for v in self.variants}
        analyze = self.lang.fast.analyze
        for surface, count in sorted(known.items(), key=lambda kv: -kv[1])[:MAX_MEASURED]:
            found = [a for a in analyze(surface) if not a.guessed]
            share = []
            for a in found:
                klass = self.entry_class.get((a.lemma, a.pos))
                if klass in classes:
                    share.append((klass, a.text.rpartition(" ")[2]))
            if not share:
                continue
            upper = sum(n for w, n in written[surface].items() if _capitalized(w))
            for klass, cell in share:
                mass[klass][cell] += count / len(share)
            for klass in {k for k, _ in share}:
                caps[klass][0] += upper
                caps[klass][1] += count
        # Cell shares per class. A class with few known tokens borrows the shares of all classes pooled
        # (cells compared without their part of speech): with no data of its own, a class would
        # otherwise expect nothing and never pay for a missing form.
        pooled: dict[str, float] = defaultdict(float)
        for got in mass.values():
            for cell, n in got.items():
                pooled[_features(cell)] += n
        pooled_total = sum(pooled.values())
        self.cell_share: dict[tuple[str, str], dict[str, float]] = {}
        for (klass, pos), cells in self.cells.items():
            got = mass.get(klass, {})
            observed = sum(got.get(c, 0.0) for c in cells)
            own = observed / (observed + BORROW_TOKENS)
            raw = {}
            for c in cells:
                mine = got.get(c, 0.0) / observed if observed else 0.0
                borrowed = pooled.get(_features(c), 0.0) / pooled_total if pooled_total else 1 / len(cells)
                raw[c] = own * mine + (1 - own) * borrowed
            # a tenth of the mass is spread evenly over every cell of the class
            self.cell_share[(klass, pos)] = {c: (raw[c] + CELL_SMOOTHING / len(cells)) / (1 + CELL_SMOOTHING) for c in cells}
        # the cells a paradigm is expected to show: the most frequent ones, up to CORE_MASS of the tokens
        self.core: dict[tuple[str, str], list[tuple[str, float]]] = {}
        for key, shares in self.cell_share.items():
            ranked = sorted(shares.items(), key=lambda kv: (-kv[1], kv[0]))
            core: list[tuple[str, float]] = []
            held = 0.0
            for cell, p in ranked[:MAX_CORE_CELLS]:
                core.append((cell, p))
                held += p
                if held >= CORE_MASS:
                    break
            self.core[key] = core
        self.cap_rate = {
            k: min(1 - CAP_CLIP, max(CAP_CLIP, (caps[k][0] + 0.5) / (caps[k][1] + 1))) if k in caps else 0.5 for k in classes
        }

    # ---- scores and resolution -------------------------------------------------------------------
    def score(
        self, key: tuple[str, int], forms: dict[str, set[str]], types: Mapping[str, int], upper: Mapping[str, float]
    ) -> float:
        """The score of candidate ``key`` with the attested ``forms`` still open to it (see the module text)."""
        v = self.variants[key[1]]
        shares = self.cell_share[(v.klass, v.pos)]
        seen: set[str] = set()
        tokens = 0
        cap = 0.0
        rate = self.cap_rate[v.klass]
        log_up, log_low = math.log(rate), math.log(1 - rate)
        for form, cells in forms.items():
            seen |= cells
            tokens += types[form]
            u = upper[form]
            cap += u * log_up + (1 - u) * log_low
        filled = sum(shares.get(c, 0.0) for c in seen)
        draws = min(tokens, len(forms) / max(filled, MIN_SHARE))
        missing = sum(-math.expm1(-draws * p) for c, p in self.core[(v.klass, v.pos)] if c not in seen)
        prior = self.class_prior[v.klass] * v.prior
        # the capitalization term is measured against an even split, so it is 0 when the corpus says nothing
        even = len(forms) * math.log(0.5) if rate != 0.5 else cap
        return len(forms) - missing + PRIOR_WEIGHT * math.log(prior) + CAP_WEIGHT * (cap - even)

    def _resolve(
        self,
        candidates: dict[tuple[str, int], dict[str, set[str]]],
        types: Mapping[str, int],
        written: Mapping[str, Counter[str]],
        opts: HarvestOptions,
    ) -> list[Proposal]:
        upper = {f: sum(n for w, n in written[f].items() if _capitalized(w)) / types[f] for f in types}
        by_form: dict[str, list[tuple[str, int]]] = defaultdict(list)
        for key, forms in candidates.items():
            for f in forms:
                by_form[f].append(key)
        last = {k: self.score(k, forms, types, upper) for k, forms in candidates.items()}
        heap = [(-s, k) for k, s in last.items()]
        heapq.heapify(heap)
        claimed: set[str] = set()
        done: set[tuple[str, int]] = set()
        out: list[Proposal] = []
        while heap:
            neg, key = heapq.heappop(heap)
            if key in done:
                continue
            forms = {f: c for f, c in candidates[key].items() if f not in claimed}
            if len(forms) < opts.min_forms:
                done.add(key)
                last.pop(key, None)
                continue
            current = self.score(key, forms, types, upper)
            last[key] = current
            if current < -neg - 1e-9:
                heapq.heappush(heap, (-current, key))
                continue
            done.add(key)
            last.pop(key, None)
            tokens = sum(types[f] for f in forms)
            if tokens < opts.min_tokens or (opts.min_score is not None and current < opts.min_score):
                continue
            proposal = self._proposal(key, forms, current, types, written)
            rival = self._runner_up(key, forms, candidates, by_form, claimed, last, types, upper)
            if rival is not None and rival[0] >= current - max(CLOSE_MARGIN, 0.25 * abs(current)):
                rv = self.variants[rival[1][1]]
                proposal.runner_up = f"{rival[1][0]} {rv.klass} {rv.pos} {','.join(rv.flags) or '-'} {rival[0]:.2f}"
            out.append(proposal)
            claimed.update(forms)
            if opts.top is not None and len(out) >= opts.top:
                break
        out.sort(key=lambda p: (-p.score, p.lemma, p.klass, p.flags))
        return out

    def _runner_up(
        self,
        key: tuple[str, int],
        forms: dict[str, set[str]],
        candidates: dict[tuple[str, int], dict[str, set[str]]],
        by_form: dict[str, list[tuple[str, int]]],
        claimed: set[str],
        last: dict[tuple[str, int], float],
        types: Mapping[str, int],
        upper: Mapping[str, float],
    ) -> tuple[float, tuple[str, int]] | None:
        """The best competitor: the rivals with the best last known scores (upper bounds, since
        scores only fall as forms are claimed) are scored again, best first, until none can win."""
        rivals = sorted({k for f in forms for k in by_form[f] if k != key and k in last}, key=lambda k: (-last[k], k))
        best: tuple[float, tuple[str, int]] | None = None
        for k in rivals[:MAX_RIVALS]:
            if best is not None and last[k] <= best[0]:
                break
            open_forms = {f: c for f, c in candidates[k].items() if f not in claimed}
            s = self.score(k, open_forms, types, upper) if len(open_forms) else -math.inf
            last[k] = s
            if best is None or s > best[0]:
                best = (s, k)
        return best

    def _proposal(
        self,
        key: tuple[str, int],
        forms: dict[str, set[str]],
        score: float,
        types: Mapping[str, int],
        written: Mapping[str, Counter[str]],
    ) -> Proposal:
        lemma, index = key
        v: Variant = self.variants[index]
        shares = self.cell_share[(v.klass, v.pos)]
        cells = {f: max(sorted(c), key=lambda x: shares.get(x, 0.0)) for f, c in forms.items()}
        return Proposal(
            lemma=self._spelling(lemma, forms, written),
            klass=v.klass,
            pos=v.pos,
            flags=v.flags,
            score=score,
            forms={f: types[f] for f in forms},
            cells=cells,
        )

    def _spelling(self, lemma: str, forms: Mapping[str, Any], written: Mapping[str, Counter[str]]) -> str:
        """The lemma written as the corpus mostly writes the start of its forms (``Ankara`` from ``Ankara'da``)."""
        votes: Counter[str] = Counter()
        normalize = self.lang.normalize
        for f in forms:
            for spelling, n in written[f].items():
                for cut in (len(lemma), len(lemma) + 1, len(lemma) - 1):
                    prefix = spelling[:cut]
                    if 0 < cut <= len(spelling) and normalize(prefix) == lemma:
                        votes[prefix] += n
                        break
        return votes.most_common(1)[0][0] if votes else lemma


class _TypeBar:
    """A tqdm bar of word types on standard error (only on a terminal)."""

    def __init__(self, total: int, enabled: bool) -> None:
        self.bar: Any = None
        if enabled and sys.stderr.isatty():
            from tqdm import tqdm

            self.bar = tqdm(total=total, unit="type", desc="reading unknown types", file=sys.stderr, dynamic_ncols=True)

    def update(self, n: int) -> None:
        if self.bar is not None:
            self.bar.update(n)

    def close(self) -> None:
        if self.bar is not None:
            self.bar.close()


def _features(cell: str) -> str:
    """A cell without its leading part of speech (``N;PL;LOC`` → ``PL;LOC``)."""
    return cell.partition(";")[2]


def _capitalized(word: str) -> bool:
    return word[:1].isupper()


def harvest(lang: Language, spellings: Mapping[str, int], options: HarvestOptions | None = None) -> HarvestResult:
    """Proposed lexicon entries for the words of ``spellings`` (word → count) that ``lang`` does not know.

    ::

        import morphfst
        from morphfst.harvest import harvest
        tur = morphfst.load("tur")
        result = harvest(tur, {"kitapçığı": 3, "kitapçıklar": 2, "kitapçık": 5})
        result.proposals[0].to_dict()   # {'lemma': 'kitapçık', 'class': 'noun', ...}
    """
    opts = options or HarvestOptions()
    return Harvester(lang, depth=opts.depth).harvest(spellings, opts)


__all__: Sequence[str] = ("HarvestOptions", "HarvestResult", "Harvester", "Proposal", "harvest")

"""Compile a language model into weighted finite-state transducers with pynini (OpenFst).

Data flow (see DEVELOPERS.md):

  lexicon × slot graph  ──►  M: internal analysis → underlying form (morph boundaries, markers)
  co-occurrence filters ──►  M restricted on its analysis side
  ordered rewrite rules ──►  cdrewrite cascade (Kaplan & Kay 1994; Mohri & Sproat 1996)
  final step            ──►  bounded surface (letters and morph boundaries)

From the bounded machine come the four saved transducers: ``analyzer`` (surface → internal
analysis), ``generator`` (public analysis → surface), ``segmenter`` (surface → surface with morph
boundaries) and ``bounded`` (surface with boundaries → internal analysis). Weights are in the
tropical semiring; lower is better.
"""

from __future__ import annotations

import functools
import itertools
import math
import time
from collections import Counter, defaultdict
from collections.abc import Callable, Mapping
from dataclasses import dataclass, field
from typing import Literal

import pynini

from ..errors import UserError
from ..language import model as m
from ..language.symbols import COMPOUND_SEAM, GUESS_SYMBOL, SymbolSpace
from ..language.validate import BOUNDARIES
from .fstutil import NO_STATE_ID, Arc, Weight, acc, chars, cross, empty, union
from .guessweights import GUESS_MORPH_WEIGHT, GUESS_NAME_WEIGHT, GUESS_OFFSET, GUESS_PRIOR_SCALE, GUESS_STEM_WEIGHT, NAME_POS
from .stemrules import derive_stems, lemma_to_stem

SETLIKE = (m.SetRef, m.Klass)


@dataclass
class CompiledFsts:
    """The transducers of one language and the symbol space they are written in."""

    space: SymbolSpace
    fsts: dict[str, pynini.Fst]
    timings: dict[str, float] = field(default_factory=dict)
    stats: dict[str, object] = field(default_factory=dict)


def build_space(g: m.Grammar) -> SymbolSpace:
    """Register every symbol of the grammar in a fresh symbol space."""
    space = SymbolSpace()
    for sym in g.letters:
        space.add(sym, "letter")
    for sym in g.archiphonemes:
        space.add(sym, "archiphoneme", single_char_ok=False)
    for sym in g.markers:
        space.add(sym, "marker", single_char_ok=False)
    for sym in g.optionals:
        space.add(sym, "optional", single_char_ok=False)
    for sym in BOUNDARIES:
        space.add(sym, "boundary", single_char_ok=False)
    for dim in g.dimensions.values():
        for value in dim.values:
            kind = "pos" if dim.name == "pos" else "feature"
            space.add(f"{kind}:{value}", kind, single_char_ok=False)
    for affix in g.affixes:
        space.add(f"affix:{affix.ident}", "affix", single_char_ok=False)
    if g.compounds:
        space.add(COMPOUND_SEAM, "boundary", single_char_ok=False)
    return space


class Compiler:
    """Builds the transducers of a grammar; each step is a method so tools can reuse it."""

    def __init__(self, grammar: m.Grammar, space: SymbolSpace | None = None) -> None:
        self.g = grammar
        self.space = space or build_space(grammar)
        s = self.space
        self.letter_codes = [s.code(x) for x in grammar.letters]
        self.underlying_codes = [
            s.code(x) for x in grammar.letters + grammar.archiphonemes + grammar.markers + grammar.optionals
        ] + [s.code(b) for b in BOUNDARIES]
        self.sigma = chars(self.underlying_codes).optimize()
        self.sigma_star = self.sigma.closure().optimize()
        self.plus = s.code(m.MORPH_BOUNDARY)
        self._rule_cache: dict[str, pynini.Fst] = {}
        self.enclitic_tail = grammar.enclitic_tail()  # see slot_graph

    # ---- expressions --------------------------------------------------------------------------
    def set_codes(self, e: m.Expr, dedupe: bool = True) -> list[str]:
        """The symbol codes of a set-like expression (``@set`` or ``[...]``), in order.

        A rule's replacement class keeps repeated symbols (``[t T p] -> [d d v]`` maps two symbols to
        ``d``); everywhere else a class is a set. A negated class means any symbol of the underlying
        alphabet except those listed, boundaries and markers included.
        """
        s = self.space
        if isinstance(e, m.SetRef):
            return [s.code(x) for x in self.g.sets[e.name].members]
        if isinstance(e, m.Sym):
            return [s.code(e.name)]
        if isinstance(e, m.Klass):
            codes: list[str] = []
            for item in e.items:
                codes.extend(self.set_codes(item, dedupe))
            if e.negated:
                return [c for c in self.underlying_codes if c not in codes]
            return list(dict.fromkeys(codes)) if dedupe else codes
        raise TypeError(e)

    def expr(self, e: m.Expr) -> pynini.Fst:
        """An unweighted acceptor for a rule or pattern expression over the underlying alphabet."""
        if isinstance(e, m.Sym):
            return acc(self.space.code(e.name))
        if isinstance(e, SETLIKE):
            codes = self.set_codes(e)
            return chars(codes) if codes else empty()
        if isinstance(e, m.Seq):
            out = acc("")
            for item in e.items:
                out = out + self.expr(item)
            return out
        if isinstance(e, m.Alt):
            return union(self.expr(o) for o in e.options)
        if isinstance(e, m.Repeat):
            inner = self.expr(e.item)
            return inner.closure() if e.high is None else inner.ques
        if isinstance(e, m.Empty):
            return acc("")
        if isinstance(e, m.AnySym):
            return self.sigma.copy()
        raise TypeError(e)

    # ---- rules ----------------------------------------------------------------------------------
    def rule_fst(self, rule: m.Rule, cache_key: str | None = None) -> pynini.Fst:
        """One rewrite rule as a transducer over the underlying alphabet (cdrewrite)."""
        key = cache_key or rule.name
        if key in self._rule_cache:
            return self._rule_cache[key]
        tau = self.rule_tau(rule)
        left = self.expr(rule.left).optimize() if rule.left is not None else acc("")
        right = self.expr(rule.right).optimize() if rule.right is not None else acc("")
        mode: Literal["opt", "obl"] = "opt" if rule.optional else "obl"
        fst = pynini.cdrewrite(tau, left, right, self.sigma_star, direction=rule.direction, mode=mode).optimize()
        self._rule_cache[key] = fst
        return fst

    def rule_tau(self, rule: m.Rule) -> pynini.Fst:
        t, r = rule.target, rule.replacement
        for side, e in (("target", t), ("replacement", r)):
            if _mentions_boundary(e):
                raise UserError(
                    f"rule {rule.name}: the {side} contains a boundary (+, ^ or $)",
                    rule.pos,
                    hint="boundaries may appear in contexts only; rules never add or remove them",
                )
        if isinstance(t, SETLIKE) and isinstance(r, SETLIKE):
            src, dst = self.set_codes(t), self.set_codes(r, dedupe=False)
            if len(src) != len(dst):
                raise UserError(
                    f"rule {rule.name}: the target set has {len(src)} symbols but the replacement set has {len(dst)}",
                    rule.pos,
                    hint="a set is rewritten symbol by symbol into a set of the same size, in order",
                )
            tau = union(cross(a, b) for a, b in zip(src, dst))
        else:
            target = self.expr(t).optimize()
            if target.start() == NO_STATE_ID:
                raise UserError(
                    f"rule {rule.name}: the target matches nothing", rule.pos, hint="check the set or symbols named in the target"
                )
            tau = pynini.cross(target, self.expr(r).optimize())
        if rule.weight:
            tau = tau + pynini.accep("", weight=rule.weight)
        return tau.optimize()

    # ---- morphotactics ----------------------------------------------------------------------------
    def stem_fst(self, entries: list[m.LexEntry]) -> pynini.Fst:
        """Lemma and part of speech (analysis side) to word start, stem, flag markers, apostrophe."""
        s = self.space
        paths = []
        start = s.code(m.WORD_START)
        for e in entries:
            underlying = start + s.encode(e.stem)
            for flag in e.flags:
                marker = self.g.flags[flag].marks
                if marker:
                    underlying += s.code(marker)
            if self.g.classes[e.klass].apostrophe:
                underlying += s.code("'") if "'" in s.to_char else ""
            analysis = e.lemma + s.code(f"pos:{e.pos_tag}")
            path = cross(analysis, underlying)
            if e.weight:
                path = path + pynini.accep("", weight=e.weight)
            paths.append(path)
        return union(paths)

    def slot_graph(self, starts: list[str]) -> pynini.Fst:
        """The morphotactic graph from the given slots to the end of the word (cycles allowed)."""
        s = self.space
        fst = pynini.Fst()
        one = Weight.one(fst.weight_type())
        start = fst.add_state()
        fst.set_start(start)
        entry = {name: fst.add_state() for name in self.g.slots}
        end = fst.add_state()
        final = fst.add_state()
        fst.set_final(final)
        fst.add_arc(end, Arc(0, ord(s.code(m.WORD_END)), one, final))
        # a whole word may go on into an enclitic slot; after the enclitic's slots it ends for good
        tail = self.enclitic_tail
        word_end = end
        if tail:
            word_end = fst.add_state()
            fst.add_arc(word_end, Arc(0, 0, one, end))
            for slot in self.g.slots.values():
                if slot.enclitic:
                    fst.add_arc(word_end, Arc(0, 0, one, entry[slot.name]))

        def target(name: str, source: str | None = None) -> int:
            if name == m.END_SLOT:
                return end if source in tail else word_end
            return entry[name]

        for name in starts:
            fst.add_arc(start, Arc(0, 0, one, target(name)))
        for slot in self.g.slots.values():
            for affix in slot.affixes:
                ilabels = [s.code(f"affix:{affix.ident}")] + [
                    s.code(f"feature:{f}") if f"feature:{f}" in s.to_char else s.code(f"pos:{f}") for f in affix.features
                ]
                if affix.new_pos:
                    ilabels.append(s.code(f"pos:{affix.new_pos}"))
                olabels = [self.plus + s.encode(affix.form)] if affix.form else []
                pairs = [(ord(c), 0) for c in ilabels] + [(0, ord(c)) for c in "".join(olabels)]
                state = entry[slot.name]
                weight = Weight(fst.weight_type(), affix.weight)
                for index, (il, ol) in enumerate(pairs):
                    nxt = fst.add_state()
                    fst.add_arc(state, Arc(il, ol, weight if index == 0 else one, nxt))
                    state = nxt
                for follower in affix.next if affix.next is not None else slot.next:
                    fst.add_arc(state, Arc(0, 0, one, target(follower, slot.name)))
        return fst

    def constraint_filter(self, lemma_chars: set[str]) -> pynini.Fst | None:
        """An acceptor over the analysis side that forbids what the constraints forbid."""
        if not self.g.constraints:
            return None
        s = self.space
        codes = set(lemma_chars) | {c for c, k in s.kinds.items() if k in {"feature", "pos", "affix"}}
        sigma_star = chars(sorted(codes)).closure().optimize()
        allowed = sigma_star
        for c in self.g.constraints:
            left = self._contains(c.left, sigma_star)
            right = self._contains(c.right, sigma_star)
            bad = (
                pynini.intersect(left, right) if c.kind == "excludes" else pynini.difference(left, right.optimize())
            ).optimize()
            allowed = pynini.difference(allowed, bad).optimize()
        return allowed

    def _contains(self, operand: str, sigma_star: pynini.Fst) -> pynini.Fst:
        s = self.space
        codes = [s.code(f"affix:{a.ident}") for a in self.g.affixes if a.name == operand]
        for kind in ("feature", "pos"):
            if f"{kind}:{operand}" in s.to_char:
                codes.append(s.code(f"{kind}:{operand}"))
        return (sigma_star + chars(codes) + sigma_star).optimize()

    def final_step(self) -> pynini.Fst:
        """Markers and word boundaries deleted, optional segments realized, archiphonemes filtered out."""
        s = self.space
        parts = [acc(c) for c in self.letter_codes] + [acc(self.plus)]
        parts += [cross(s.code(mk), "") for mk in self.g.markers]
        # leftover optional segments of letters surface as the letter; those of archiphonemes had to be
        # realized by a rule, so a path still holding one is dropped like an unresolved archiphoneme
        parts += [cross(s.code(o), s.code(o[1:-1])) for o in self.g.optionals if o[1:-1] in self.g.letters]
        parts += [cross(s.code(m.WORD_START), ""), cross(s.code(m.WORD_END), "")]
        return union(parts).closure().optimize()

    def delete_boundaries(self) -> pynini.Fst:
        """Bounded surface → plain surface: morph boundaries (and compound seams) deleted."""
        parts = [acc(c) for c in self.letter_codes] + [cross(self.plus, "")]
        if COMPOUND_SEAM in self.space.to_char:
            parts.append(cross(self.space.code(COMPOUND_SEAM), ""))
        return union(parts).closure().optimize()

    # ---- the whole ------------------------------------------------------------------------------------
    def bounded(
        self, entries: list[m.LexEntry], progress: Callable[[str], None] | None = None, lenient: bool = True
    ) -> pynini.Fst:
        """Internal analysis → bounded surface, for the given lexicon entries (without the ``lenient``
        rules when ``lenient`` is False: the machine generation is made from)."""
        derive_stems(self.g, entries, self)
        groups: dict[frozenset[str], list[m.LexEntry]] = defaultdict(list)
        for e in entries:
            blocked = frozenset(r for f in e.flags for r in self.g.flags[f].blocks)
            groups[blocked].append(e)
        open_classes = [c for c in self.g.classes.values() if c.open is not None]
        if open_classes:
            groups.setdefault(frozenset(), [])
        filt = self.constraint_filter({ch for e in entries for ch in e.lemma} | set(self.letter_codes))
        final = self.final_step()
        results = []
        for blocked, group in sorted(groups.items(), key=lambda kv: sorted(kv[0])):
            by_class: dict[tuple[str, ...], list[m.LexEntry]] = defaultdict(list)
            for e in group:
                by_class[tuple(self.g.classes[e.klass].next)].append(e)
            parts = [self.stem_fst(es) + self.slot_graph(list(starts)) for starts, es in by_class.items()]
            if not blocked:
                parts += [self.open_stem_fst(c) + self.slot_graph(list(c.next)) for c in open_classes]
            fst = union(parts).optimize()
            if filt is not None:
                fst = pynini.compose(filt, fst)
            for rule in self.g.rules:
                if rule.name in blocked or (rule.lenient and not lenient):
                    continue
                if progress:
                    progress(rule.name)
                fst = pynini.compose(fst, self.rule_fst(rule))
            fst = pynini.compose(fst, final)
            results.append(fst)
        return union(results).optimize()

    def build(self, progress: Callable[[str], None] | None = None) -> CompiledFsts:
        """All saved transducers of the grammar's lexicon."""
        timings: dict[str, float] = {}
        fsts = self.entry_fsts(self.g.lexicon, progress, timings)
        t2 = time.perf_counter()
        guesser = self.guesser()
        if guesser is not None:
            fsts["guesser"] = guesser
            timings["guesser"] = time.perf_counter() - t2
        return CompiledFsts(self.space, fsts, timings)

    def entry_fsts(
        self,
        entries: list[m.LexEntry],
        progress: Callable[[str], None] | None = None,
        timings: dict[str, float] | None = None,
    ) -> dict[str, pynini.Fst]:
        """The four saved transducers for ``entries``: the rule cascade, and a second one without the
        lenient rules for the generator when the grammar has any."""
        t0 = time.perf_counter()
        bounded = self.bounded(entries, progress)
        strict = self.bounded(entries, progress, lenient=False) if any(r.lenient for r in self.g.rules) else None
        t1 = time.perf_counter()
        compounds = self.compound_fst(bounded, entries, strict)
        t2 = time.perf_counter()
        fsts = self.derive(bounded, strict, compounds)
        if timings is not None:
            timings["lexicon_rules"] = t1 - t0
            if compounds is not None:
                timings["compounds"] = t2 - t1
            timings["derive"] = time.perf_counter() - t2
        return fsts

    def derive(
        self, bounded: pynini.Fst, strict: pynini.Fst | None = None, compounds: pynini.Fst | None = None
    ) -> dict[str, pynini.Fst]:
        """The four saved transducers from the bounded machine.

        The analyzer, segmenter and bounded analyzer read ``bounded`` together with ``compounds`` (the
        compound words, analysis only); the generator comes from ``strict`` (the machine without the
        lenient rules) when there is one, else from ``bounded``, never with compounds. The segmenter
        only says where boundaries may stand (weights come from the bounded analyzer), so its surfaces
        are unweighted, which makes them much cheaper to determinize and minimize.
        """
        delete = self.delete_boundaries()
        plain = pynini.compose(bounded, delete).optimize() if compounds is None or strict is None else None
        if compounds is not None:
            bounded = union([bounded, compounds]).optimize()
            # the boundaries erased from the bounded machine's surface side, not optimized again: the
            # analyzer serves only accepts() and the debugging tools, and optimizing it costs seconds
            boundaries = [(ord(self.plus), 0), (ord(self.space.code(COMPOUND_SEAM)), 0)]
            analyzer = bounded.copy().relabel_pairs(opairs=boundaries).invert()
        else:
            assert plain is not None
            # an optimized machine stays optimal when inverted (determinism on label pairs does not change)
            analyzer = plain.copy().invert()
        affix_labels = [(ord(c), 0) for c, k in self.space.kinds.items() if k == "affix"]
        source = pynini.compose(strict, delete).optimize() if strict is not None else plain
        assert source is not None
        generator = source.copy().relabel_pairs(ipairs=affix_labels).optimize()
        surfaces = _determinize_minimize(pynini.arcmap(bounded.copy().project("output"), map_type="rmweight"))
        # deterministic already: a deterministic acceptor composed with the one-state boundary inserter
        segmenter = pynini.compose(delete.copy().invert(), surfaces)
        bounded_analyzer = bounded.copy().invert()
        for fst in (analyzer, generator, segmenter, bounded_analyzer):
            fst.arcsort("ilabel")
        return {"analyzer": analyzer, "generator": generator, "segmenter": segmenter, "bounded": bounded_analyzer}

    # ---- compounds (analysis only) --------------------------------------------------------------------
    def compound_fst(self, bounded: pynini.Fst, entries: list[m.LexEntry], strict: pynini.Fst | None = None) -> pynini.Fst | None:
        """The compound words of the grammar's ``compound`` blocks, on the tapes of the bounded machine
        (``None`` when there is no block).

        A part is a path of ``bounded`` whose analysis is a word of a ``first`` part of speech (or
        class) in exactly one feature bundle of ``forms``; its analysis is rewritten to lemma, part of
        speech and the seam symbol (affix ids and features deleted), its surface loses its morph
        boundaries and gets the seam symbol appended, and parts of fewer than ``min`` letters are
        dropped. A compound is one to ``parts - 1`` parts followed by a path of ``bounded`` of a
        ``last`` part of speech (or class); with ``agree``, every part, the last one too, is in the same
        bundle of ``forms`` (one compound machine per bundle); with ``lastforms``, the last part's features
        begin with one of its bundles; with ``lemmaform``, the last part's lemma on the analysis side is
        its form in that bundle as written (from ``strict``, the machine without lenient rules, when
        given: :meth:`_lemma_forms`), and the features of ``hide`` are left out of its analysis (Turkish
        dil + bilgi-si-ni: ``dil N seam bilgisi N SG ACC``); with ``strict``, every part is read from
        ``strict`` (when given) instead of ``bounded``. Every seam weighs the block's weight, plus the weight of the
        heaviest entry of ``entries``, plus :data:`SEAM_BASE_WEIGHT`, so a lexicon word always ranks above
        a compound reading of itself with the same endings (when no lexicon weight is negative, as with
        counts; see README.md).
        """
        if not self.g.compounds:
            return None
        s = self.space
        seam = s.code(COMPOUND_SEAM)
        heaviest = max((e.weight for e in entries), default=0.0)
        base = max(heaviest, 0.0) + SEAM_BASE_WEIGHT
        lemma_codes = sorted({ch for e in entries for ch in e.lemma} | set(self.letter_codes))
        tail_codes = [c for c, k in s.kinds.items() if k in {"feature", "pos", "affix"}]
        affix_codes = [c for c, k in s.kinds.items() if k == "affix"]
        letter = chars(self.letter_codes)
        drop_plus = cross(self.plus, "")
        keep = union([letter, drop_plus])
        pos_codes = [c for c, k in s.kinds.items() if k == "pos"]
        found = []
        for c in self.g.compounds:
            words = strict if c.strict and strict is not None else bounded
            head = self._compound_heads(c.first, entries, lemma_codes, derived_out=False)
            last_head = self._compound_heads(c.last, entries, lemma_codes, derived_out=True)
            if c.last_min > 1:  # the last part's lemma has at least lastmin letters
                longer = (chars(lemma_codes).closure(c.last_min) + chars(pos_codes)).optimize()
                last_head = pynini.intersect(last_head, longer).optimize()
            surface = (drop_plus.closure() + letter).closure(c.min_letters, c.min_letters) + keep.closure()
            surface = (surface + cross("", seam) + pynini.accep("", weight=base + c.weight)).optimize()
            bundles = [_bundle_tail([s.code(f"feature:{f}") for f in b], affix_codes) for b in c.forms]
            free_tail = chars(tail_codes).closure()
            if c.last_forms:  # the last part's features begin with one of these bundles
                starts = [_bundle_tail([s.code(f"feature:{f}") for f in b], affix_codes) for b in c.last_forms]
                free_tail = (union(starts) + free_tail).optimize()
            shown = None
            if c.lemma_form:  # the last part's lemma is shown as its form in this bundle (bilgi: bilgisi)
                machine = strict if strict is not None else bounded
                shown = self._lemma_forms(last_head, machine, c.lemma_form, c.hide, lemma_codes)
            # the sequences of groups that the order accepts, two to 'parts' parts (none: any order)
            sequences: list[tuple[str, ...]] = []
            if c.order:
                rx = c.order_regex()
                sequences = [
                    seq
                    for n in range(2, c.parts + 1)
                    for seq in itertools.product(sorted(c.groups), repeat=n)
                    if rx.fullmatch("".join(f"{g} " for g in seq))
                ]
                # (groups name parts of speech and classes, never a derivation feature)
                group_heads = {
                    g: self._compound_heads(names, entries, lemma_codes, derived_out=False) for g, names in c.groups.items()
                }
            # with agree, one machine per bundle, shared by every part; else one for them all
            for group in [[b] for b in bundles] if c.agree else [bundles]:
                tails = union(group).optimize()
                last_tail = tails if c.agree else free_tail

                part_of = functools.partial(_compound_part, bounded=words, surface=surface, seam=seam, tails=tails)
                last_of = functools.partial(_compound_last, bounded=words, tail=last_tail, shown=shown)
                if not c.order:
                    part, last = part_of(head), last_of(last_head)
                    if part is not None and last is not None:
                        found.append(part.closure(1, c.parts - 1) + last)
                    continue
                # in order: each place a part of its group (and of 'first', or 'last' for the last part)
                parts: dict[str, pynini.Fst | None] = {}
                lasts: dict[str, pynini.Fst | None] = {}
                for seq in sequences:
                    for g in seq[:-1]:
                        if g not in parts:
                            parts[g] = part_of(pynini.intersect(group_heads[g], head).optimize())
                    if seq[-1] not in lasts:
                        lasts[seq[-1]] = last_of(pynini.intersect(group_heads[seq[-1]], last_head).optimize())
                    pieces = [parts[g] for g in seq[:-1]] + [lasts[seq[-1]]]
                    if all(p is not None for p in pieces):
                        fst = pieces[0].copy()  # type: ignore[union-attr]
                        for p in pieces[1:]:
                            fst.concat(p)  # type: ignore[arg-type]
                        found.append(fst)
        if not found:
            return None
        return union(found)  # optimized together with the lexicon words in derive

    def _lemma_forms(
        self, head: pynini.Fst, machine: pynini.Fst, bundle: list[str], hide: list[str], lemma_codes: list[str]
    ) -> pynini.Fst:
        """Shown analysis → analysis of the bounded machine, for a compound's last part whose lemma
        is shown as its form in ``bundle`` (a block's ``lemmaform``): the form's letters (as
        ``machine`` writes the words of ``head`` in exactly that bundle, morph boundaries dropped,
        unweighted) stand for the lemma's, and the features of ``hide`` are put back wherever they
        stand (the last part's own paths say where). Turkish: ``bilgisi N SG ACC`` → ``bilgi N SG
        PSS3S ACC``."""
        s = self.space
        affix_codes = [c for c, k in s.kinds.items() if k == "affix"]
        tail_codes = [c for c, k in s.kinds.items() if k in {"feature", "pos", "affix"}]
        exact = (head + _bundle_tail([s.code(f"feature:{f}") for f in bundle], affix_codes)).optimize()
        spelt = pynini.compose(exact, machine)  # lemma, part of speech, the bundle → its bounded form
        # lemma → form: the analysis after the lemma deleted, and the form's morph boundaries
        strip = (chars(lemma_codes).closure() + cross(chars(tail_codes).closure(), "")).optimize()
        unplus = union([chars(self.letter_codes), cross(self.plus, "")]).closure().optimize()
        forms = pynini.compose(pynini.compose(strip.invert(), spelt), unplus)
        forms = pynini.arcmap(forms, map_type="rmweight").optimize()
        hidden = [s.code(f"feature:{f}") for f in hide]
        shown_codes = [c for c in tail_codes if c not in hidden]
        rest = union([chars(shown_codes)] + [cross("", h) for h in hidden]).closure()
        return (forms.invert() + rest).optimize()

    def _compound_heads(
        self, names: list[str], entries: list[m.LexEntry], lemma_codes: list[str], derived_out: bool
    ) -> pynini.Fst:
        """A lemma and its part of speech: any lemma of a named part of speech, or the lemmas of the
        entries of a named class, or (a named feature) any lemma whose first affixes with a feature
        have that one, a derivation such as a verbal noun (kohota -> kohoaminen). A derived head
        reads that affix and feature too: kept on both tapes for a last part (``derived_out``), for a
        first part on the analysis of the bounded machine only (the compound's part is lemma and
        part of speech)."""
        s = self.space
        features = self.g.feature_labels
        tags = [n for n in names if n in self.g.pos_tags]
        derived = [n for n in names if n not in tags and n not in self.g.classes and n in features]
        classes = {n for n in names if n not in tags and n not in derived}
        heads = []
        if tags:
            heads.append(chars(lemma_codes).closure() + chars(s.code(f"pos:{t}") for t in tags))
        if derived:
            affix_codes = [c for c, k in s.kinds.items() if k == "affix"]
            feats = chars(s.code(f"feature:{f}") for f in derived)
            any_pos = chars(s.code(f"pos:{t}") for t in self.g.pos_tags)
            # the derivation's own part of speech follows its feature (kohota V V.MSDR N)
            pos_opt = any_pos.copy().closure(0, 1)
            after = chars(affix_codes).closure() + union([feats + pos_opt, any_pos + feats]).optimize()
            heads.append(chars(lemma_codes).closure() + any_pos + (after if derived_out else cross("", after.optimize())))
        if classes:
            pairs = {(e.lemma, e.pos_tag) for e in entries if e.klass in classes}
            heads.extend(acc(lemma + s.code(f"pos:{tag}")) for lemma, tag in sorted(pairs))
        return union(heads).optimize()

    def open_stem_fst(self, klass: m.StemClass) -> pynini.Fst:
        """The stems of an open class: every string of letters its ``open`` pattern accepts is a lemma
        (numbers written in digits), through the class's stem rules, like a lexicon stem, with the
        class's weight. (Taking the lexicon's names out of the pattern here made the Turkish analyzer
        1.7 times as large: the runtime drops such readings instead, see ``listed_names`` in the
        metadata.)"""
        assert klass.open is not None
        s = self.space
        stem = self.pattern_stems(klass, klass.open, "open", chars(self.letter_codes).closure())
        tags = klass.pos_allowed or self.g.pos_tags
        after = s.code("'") if klass.apostrophe and "'" in s.to_char else ""
        tail = cross(union(acc(s.code(f"pos:{t}")) for t in tags), after)
        if klass.weight:
            tail = tail + pynini.accep("", weight=klass.weight)
        return lemma_to_stem(self, klass, stem) + tail

    def pattern_stems(self, klass: m.StemClass, pattern: m.Expr, kind: str, letters: pynini.Fst) -> pynini.Fst:
        """The strings of ``letters`` that a class's ``guess`` or ``open`` pattern accepts (a user error
        when the pattern names an unknown symbol or accepts no string of letters)."""
        try:
            accepted = self.expr(pattern).optimize()
        except KeyError as exc:
            raise UserError(
                f"class {klass.name}: the {kind} pattern names an unknown symbol or set {exc.args[0]!r}",
                klass.pos,
                hint=f"a {kind} pattern is written with the grammar's letters and @sets",
            ) from None
        stem = pynini.intersect(accepted, letters.optimize()).optimize()
        if stem.start() == NO_STATE_ID:
            raise UserError(f"class {klass.name}: the {kind} pattern matches no string of letters", klass.pos)
        return stem

    # ---- the guesser for unknown words ----------------------------------------------------------------
    def guess_stem_fst(self, klass: m.StemClass, priors: Mapping[tuple[str, str], float] | None = None) -> pynini.Fst | None:
        """Guessed stems of a class: lemma = stem, any string of letters its ``guess`` pattern allows.

        Analysis side: the stem's letters, a part of speech of the class and the guess marker; underlying
        side: word start, the stem and the class's apostrophe. Every guessed analysis weighs at least
        :data:`GUESS_OFFSET` (so it always ranks below an analysis with a lexicon stem) plus
        :data:`GUESS_STEM_WEIGHT` per stem letter (shorter stems, i.e. longer affix chains, rank first), half
        of it counted on the lemma and half on the stem the class's stem rules make of it, plus the
        prior of each part of speech (``priors``, see :meth:`guess_priors`), and a name (``NAME_POS``)
        :data:`GUESS_NAME_WEIGHT` more.
        """
        if klass.guess is None:
            return None
        s = self.space
        mark = s.add(GUESS_SYMBOL, "guess", single_char_ok=False)
        # half the weight on the lemma's letters, half on the stem's: where the class's stem rules take an
        # ending off the lemma (a verb's infinitive), the ending costs half as much as a stem letter,
        # so a verb reading is not dearer than a bare noun of the same letters by its whole ending
        half = GUESS_STEM_WEIGHT / 2
        letters = union(acc(c, weight=half) for c in self.letter_codes).closure()
        lemmas = self.pattern_stems(klass, klass.guess, "guess", letters)
        plain = set(self.underlying_codes) - set(self.letter_codes)
        weigh = union(
            [acc(c, weight=half) for c in self.letter_codes] + [acc(c) for c in self.underlying_codes if c in plain]
        ).closure()
        stems = pynini.compose(lemma_to_stem(self, klass, lemmas), weigh.optimize())
        tags = self.guess_tags(klass)
        priors = priors or {}
        # a guessed name weighs as a lexicon name in lower case (see guessweights)
        weights = {t: priors.get((klass.name, t), 0.0) + (GUESS_NAME_WEIGHT if t == NAME_POS else 0.0) for t in tags}
        tail = union(acc(s.code(f"pos:{t}"), weight=weights[t]) for t in tags) + acc(mark)
        after = s.code("'") if klass.apostrophe and "'" in s.to_char else ""
        return stems + cross(tail, after) + pynini.accep("", weight=GUESS_OFFSET)

    def guess_tags(self, klass: m.StemClass) -> list[str]:
        """The parts of speech a word guessed into ``klass`` may have: the class's own list, else those of
        its lexicon entries, else every part of speech."""
        return klass.pos_allowed or sorted({e.pos_tag for e in self.g.lexicon if e.klass == klass.name}) or self.g.pos_tags

    def guess_priors(self) -> dict[tuple[str, str], float]:
        """A prior for each (class, part of speech) a word may be guessed as, :data:`GUESS_PRIOR_SCALE`
        times -ln a share of lexicon entries (add-one smoothed, the likeliest 0):

        - a class that gives one part of speech: that part of speech's share among the parts of speech
          such classes give (a Turkish unknown word is a noun before an adjective, as the lexicon's own
          lemmas are);
        - a class that gives several: each one's share among the entries of the classes with its stem
          rules (a Finnish -nen word is an adjective before a noun).

        Without it, guesses that differed only by part of speech tied and were ranked by their text
        (ADJ before N). The classes of one part of speech keep the order their weights give (the
        grammar's choice among inflection types: Finnish *tortikun* is the gradating *tortikku*)."""
        tags_of = {k.name: self.guess_tags(k) for k in self.g.classes.values() if k.guess is not None}
        per_tag = Counter(e.pos_tag for e in self.g.lexicon)

        def scaled(counts: dict[str, int]) -> dict[str, float]:
            total = sum(counts.values())
            raw = {tag: -math.log((n + 1) / (total + 1)) for tag, n in counts.items()}
            low = min(raw.values(), default=0.0)
            return {tag: GUESS_PRIOR_SCALE * (value - low) for tag, value in raw.items()}

        overall = scaled({tags[0]: per_tag[tags[0]] for tags in tags_of.values() if len(tags) == 1})
        priors: dict[tuple[str, str], float] = {}
        for name, tags in tags_of.items():
            if len(tags) == 1:
                priors[(name, tags[0])] = overall[tags[0]]
                continue
            k = self.g.classes[name]
            mine = {c.name for c in self.g.classes.values() if c.name == name or (k.stems and c.stems == k.stems)}
            counts = dict.fromkeys(tags, 0)
            for e in self.g.lexicon:
                if e.klass in mine and e.pos_tag in counts:
                    counts[e.pos_tag] += 1
            priors.update({(k.name, tag): value for tag, value in scaled(counts).items()})
        return priors

    def guesser(self) -> pynini.Fst | None:
        """Bounded surface → internal analysis of guessed words (``None`` when no class has a guess pattern).

        Each class's guessed stems enter the class's slot graph and go through the same constraints,
        rule cascade (without its lenient rules: an unknown word is guessed as written; the Turkish
        rule for letters written plain tripled a guess's cost and changed no guess's quality) and
        final step as lexicon stems; the internal analysis carries the guess marker
        right after the part of speech. Each affix with a surface form costs :data:`GUESS_MORPH_WEIGHT`
        besides its features' weights, against :data:`GUESS_STEM_WEIGHT` for each stem letter it saves.
        """
        parts = []
        priors = self.guess_priors()
        for klass in self.g.classes.values():
            stem = self.guess_stem_fst(klass, priors)
            if stem is not None:
                parts.append(stem + self.slot_graph(list(klass.next)))
        if not parts:
            return None
        fst = union(parts).optimize()
        filt = self.constraint_filter(set(self.letter_codes) | {self.space.code(GUESS_SYMBOL)})
        if filt is not None:
            fst = pynini.compose(filt, fst)
        for rule in self.g.rules:
            if rule.lenient:
                continue
            fst = pynini.compose(fst, self.rule_fst(rule))
        fst = pynini.compose(fst, self.final_step())
        morph_cost = union([chars(self.letter_codes), acc(self.plus, weight=GUESS_MORPH_WEIGHT)]).closure()
        fst = pynini.compose(fst, morph_cost)
        guesser = fst.invert().optimize()
        guesser.arcsort("ilabel")
        return guesser


SEAM_BASE_WEIGHT = 1.0  # added to every seam besides the block's weight and the heaviest lexicon entry's


def _determinize_minimize(fst: pynini.Fst) -> pynini.Fst:
    """Epsilon removal, determinization and minimization (what ``optimize`` does, without its extra
    passes, which cost several times as much on a large unweighted acceptor)."""
    return pynini.determinize(fst.rmepsilon()).minimize()


def _compound_part(head: pynini.Fst, bounded: pynini.Fst, surface: pynini.Fst, seam: str, tails: pynini.Fst) -> pynini.Fst | None:
    """A non-last part of a compound: the words of ``bounded`` whose lemma and part of speech ``head``
    accepts, in a form of ``tails``, the analysis rewritten to lemma, part of speech and seam and the
    surface through ``surface`` (``None`` when there is no such word)."""
    to_internal = head + pynini.cross(acc(seam), tails)  # new analysis → analysis of bounded
    fst = pynini.compose(pynini.compose(to_internal.optimize(), bounded), surface).optimize()
    return None if fst.start() == NO_STATE_ID or fst.num_states() == 0 else fst


def _compound_last(head: pynini.Fst, bounded: pynini.Fst, tail: pynini.Fst, shown: pynini.Fst | None = None) -> pynini.Fst | None:
    """The last part of a compound: the words of ``bounded`` whose lemma and part of speech ``head``
    accepts, with features and affixes of ``tail`` (``None`` when there is no such word); with
    ``shown`` (:meth:`Compiler._lemma_forms`), read on the analysis side through it."""
    fst = pynini.compose((head + tail).optimize(), bounded).connect()
    if shown is not None:
        fst = pynini.compose(shown, fst).connect()
    return None if fst.start() == NO_STATE_ID or fst.num_states() == 0 else fst


def _bundle_tail(features: list[str], affix_codes: list[str]) -> pynini.Fst:
    """An acceptor of the analysis after a part of speech whose feature symbols are exactly ``features``
    (in any order), with any affix identifiers between them."""
    fst = pynini.Fst()
    one = Weight.one(fst.weight_type())
    counts: dict[str, int] = {}
    for f in features:
        counts[f] = counts.get(f, 0) + 1
    symbols = sorted(counts)
    states: dict[tuple[int, ...], int] = {}

    def state(remaining: tuple[int, ...]) -> int:
        if remaining not in states:
            here = states[remaining] = fst.add_state()
            for code in affix_codes:
                fst.add_arc(here, Arc(ord(code), ord(code), one, here))
            if not any(remaining):
                fst.set_final(here)
        return states[remaining]

    start = tuple(counts[x] for x in symbols)
    fst.set_start(state(start))
    todo = [start]
    while todo:
        rem = todo.pop()
        for i, sym in enumerate(symbols):
            if rem[i]:
                nxt = rem[:i] + (rem[i] - 1,) + rem[i + 1 :]
                new = nxt not in states
                fst.add_arc(state(rem), Arc(ord(sym), ord(sym), one, state(nxt)))
                if new:
                    todo.append(nxt)
    return fst


def _mentions_boundary(e: m.Expr) -> bool:
    if isinstance(e, m.Sym):
        return e.name in BOUNDARIES
    if isinstance(e, m.Seq):
        return any(_mentions_boundary(i) for i in e.items)
    if isinstance(e, m.Alt):
        return any(_mentions_boundary(i) for i in e.options)
    if isinstance(e, m.Repeat):
        return _mentions_boundary(e.item)
    if isinstance(e, m.Klass):
        return any(_mentions_boundary(i) for i in e.items)
    return False

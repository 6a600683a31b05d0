"""Diagnose a rejected word: which layer of the grammar rejects it, where, and what to change.

Each layer is tested by relaxing it and asking whether the relaxed grammar accepts the word:

- morphotactics: the lexicon's stems with the slot graph but without the co-occurrence constraints
  (a constraint is at fault), then with every affix that has a form allowed in any order (the slot
  graph is at fault: the first morph that cannot follow is located on the graph as data);
- sound change: the nearest accepted words (edit transducer, see :mod:`.nearest`) are derived rule
  by rule; the word and the rule output are aligned, and the first difference is attributed to the
  rule that wrote (or deleted, or inserted) the symbol there, or to a rule that could have produced
  the word's symbol but did not apply;
- lexicon: stems are guessed (any string of letters, restricted by the class's ``guess`` pattern,
  optionally with each lexical flag) and go through the real slot graph, constraints and rules.

Every relaxed machine meets the word in the middle of the rule cascade (:meth:`DebugSession.match`):
the last rules are inverted right to left from the word into a *lattice* of the strings that can
become it, the first rules run forward on the machine, and the two are composed where they meet, so
nothing as large as the whole analyzer is rebuilt per word, and the marker bookkeeping of the first
rules, which inverted would let markers in everywhere, stays on the side where the stems place them.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import asdict, dataclass, field
from pathlib import Path
from typing import Any

import pynini

from ..compile.fstutil import acc, cross, is_empty, paths, union
from ..errors import UserError
from ..language import model as m
from .explain import explain_analysis, render_derivation
from .morphotactics import Break, constraint_violations, find_break
from .nearest import NearWord, align, nearest_words
from .session import DebugSession
from .trace import Derivation, derive

LAYERS = ("accepted", "alphabet", "morphotactics", "sound change", "lexicon", "unknown")
GUESS_LETTER_COST = 1.0  # per letter of a guessed stem: shorter stems (longer affix chains) first
GUESS_FLAG_COST = 1.5  # a guess that needs a lexical flag ranks after one that does not
FREE_MORPH_COST = 0.1  # per morph in the free-order relaxation: fewer morphs first


@dataclass
class MorphInfo:
    """One affix of a chain: underlying form, slot, id and gloss."""

    form: str
    slot: str
    affix_id: int
    gloss: str


@dataclass
class LexiconFinding:
    """No known stem fits: the best guessed stem and the lexicon line that would make the word work."""

    lemma: str
    stem: str
    klass: str
    pos: str
    flags: list[str]
    analysis: str
    segmentation: str
    affixes: list[MorphInfo]
    tsv_line: str
    lexicon_file: str | None
    verified: bool  # the suggested entry was compiled with the real slot graph and rules and accepts the word
    existing: list[dict[str, Any]] = field(default_factory=list)  # entries with the same lemma already in the lexicon
    alternatives: list[str] = field(default_factory=list)  # other guesses (analysis and segmentation)


@dataclass
class MorphotacticsFinding:
    """Known morphs in an order the slot graph or a constraint forbids."""

    kind: str  # "order" (no edge), "end" (the word cannot end there) or "constraint"
    lemma: str
    entry: dict[str, Any]
    analysis: str
    morphs: list[MorphInfo]
    after: str = ""  # the slot (or class) before the break
    after_kind: str = ""
    wanted: str = ""  # the slot that cannot follow (or "end")
    reachable: list[str] = field(default_factory=list)
    slot_line: int = 0
    constraint: dict[str, Any] | None = None
    segmentation: str = ""  # the word split into its surface morphs


@dataclass
class SoundChangeFinding:
    """An underlying form whose rule output differs from the word, and the rule behind the difference."""

    analysis: str
    expected: str  # the rule output (surface) of the underlying form
    underlying: str
    word_line: str  # the word aligned over the rule output (gaps as "·")
    expected_line: str
    marks: str  # a caret under the first difference
    position: int  # index in the word of the first difference
    word_has: str  # "" when the word lacks a symbol the grammar writes
    grammar_has: str  # "" when the word has a symbol the grammar does not write
    rule: dict[str, Any] | None  # the rule whose application produced the difference
    could: list[dict[str, Any]]  # rules that could have produced the word's symbol but did not apply
    blocked: list[str]
    derivation: Derivation | None = None
    entry: dict[str, Any] | None = None  # the lexicon entry of the underlying form
    exception_flags: list[str] = field(default_factory=list)  # flags that would block the rule for this entry


@dataclass
class Diagnosis:
    """Which layer rejects a word, where, and what to change."""

    word: str
    surface: str
    layer: str
    summary: str
    hint: str = ""
    analyses: list[str] = field(default_factory=list)
    morphotactics: MorphotacticsFinding | None = None
    sound_change: SoundChangeFinding | None = None
    lexicon: LexiconFinding | None = None
    nearest: list[NearWord] = field(default_factory=list)
    outside: list[str] = field(default_factory=list)  # characters outside the alphabet
    expected: str = ""  # the analysis the word should have (diagnosis of a mis-analysed word)

    def to_dict(self) -> dict[str, Any]:
        out = asdict(self)
        if self.sound_change and out["sound_change"]:
            out["sound_change"].pop("derivation", None)
        return out


# ---------------------------------------------------------------------------------------------


def diagnose(lang: Any, word: str, max_distance: int = 2, nearest: int = 6) -> Diagnosis:
    """Find out why ``word`` has no analysis (or report its analyses when it has some)."""
    session = DebugSession.open(lang)
    surface = session.lang.normalize(word)
    analyses = session.lang.analyze(word)
    if analyses:
        return Diagnosis(
            word, surface, "accepted", f"{word} is accepted ({len(analyses)} analyses)", analyses=[a.text for a in analyses]
        )
    outside = sorted({ch for ch in surface if ch not in set(session.letters)})
    near = nearest_words(session, word, max_distance, nearest) if not outside else []
    diag = Diagnosis(word, surface, "unknown", "", nearest=near, outside=outside)
    if outside:
        diag.layer = "alphabet"
        diag.summary = f"{word}: {', '.join(repr(c) for c in outside)} is not a letter of the grammar"
        diag.hint = "add the character(s) to the alphabet's letters line, or normalize them away (normalize block)"
        return diag
    finding = morphotactics_finding(session, surface)
    if finding is not None:
        diag.layer, diag.morphotactics = "morphotactics", finding
        diag.summary, diag.hint = _morphotactics_text(session, finding)
        return diag
    sound = sound_change_finding(session, surface, near)
    if sound is not None:
        diag.layer, diag.sound_change = "sound change", sound
        diag.summary, diag.hint = _sound_text(sound)
        return diag
    lex = lexicon_finding(session, surface)
    if lex is not None:
        diag.layer, diag.lexicon = "lexicon", lex
        diag.summary, diag.hint = _lexicon_text(lex)
        return diag
    diag.summary = f"{word}: no layer explains the rejection (no known or guessed stem, no near accepted word a rule explains)"
    diag.hint = "check the classes' guess patterns and the alphabet; 'morphfst explain' shows how similar words are built"
    closest = _closest_difference(session, surface, near)
    if closest is not None:
        diag.sound_change = closest
        diag.summary += (
            f"; the nearest accepted word {closest.expected} ({closest.analysis}) differs at position {closest.position + 1}: "
            f"{closest.word_has or 'nothing'!r} in the word, {closest.grammar_has or 'nothing'!r} in the grammar's form"
        )
    return diag


def _closest_difference(session: DebugSession, surface: str, near: list[NearWord]) -> SoundChangeFinding | None:
    """The first difference between the word and the nearest accepted word, whether or not a rule explains it."""
    for candidate in near[:1]:
        for analysis in session.lang.analyze(candidate.word)[:1]:
            ex = explain_analysis(session, analysis, candidate.word)
            if ex.derivation is not None and ex.derivation.resolved:
                return _attribute(
                    session, surface, ex.analysis, ex.derivation, ex.entry["flags"] if ex.entry else [], require_rule=False
                )
    return None


def diagnose_expected(lang: Any, word: str, expected: str) -> Diagnosis:
    """Find out why ``word`` does not get the analysis ``expected`` (``lemma POS;FEAT;...``).

    The expected analysis is followed down the layers: is there a lexicon entry for the lemma and
    part of speech (lexicon), is there a path through the slot graph and the constraints with these
    features in this order (morphotactics), and what does the rule cascade make of its underlying
    form (sound change: aligned with the word, the first difference and the rule behind it)?
    """
    session = DebugSession.open(lang)
    surface = session.lang.normalize(word)
    lemma, _, bundle = expected.strip().rpartition(" ")
    tags = [t.strip() for t in bundle.split(";") if t.strip()]
    if not lemma or not tags:
        from ..errors import UserError

        raise UserError(f"malformed analysis {expected!r}", hint="write it as: lemma POS;FEAT;FEAT")
    diag = Diagnosis(word, surface, "unknown", "", expected=f"{lemma} {';'.join(tags)}")
    got = [a.text for a in session.lang.analyze(word)]
    diag.analyses = got
    if diag.expected in got:
        diag.layer, diag.summary = "accepted", f"{word} already has the analysis {diag.expected}"
        return diag
    pos = tags[0]
    entries = session.entries_by_lemma.get((lemma, pos), [])
    if not entries:
        lex = _expected_entry(session, surface, lemma, pos)
        diag.layer, diag.lexicon = "lexicon", lex
        diag.summary = f"lexicon: there is no entry {lemma} ({pos})"
        diag.hint = _lexicon_text(lex)[1] if lex else "add an entry for it to a lexicon file"
        return diag
    codes = [session.lang._label_code(t) for t in tags]
    public = lemma + "".join(codes)
    chains = _chains(session, entries, public, constrained=True)
    if not chains:
        free = _chains(session, entries, public, constrained=False)
        g = session.grammar
        for entry, internal in free:
            ids = session.decode_internal(internal)[2]
            bad = constraint_violations(g, [session.affixes[i] for i in ids], pos)
            if bad:
                c = bad[0]
                diag.layer = "morphotactics"
                diag.morphotactics = MorphotacticsFinding(
                    "constraint",
                    lemma,
                    session.entry_info(entry),
                    diag.expected,
                    _morph_infos(session, ids),
                    constraint={"name": c.name, "line": c.pos.line, "text": f"{c.left} {c.kind} {c.right}"},
                )
                diag.summary, diag.hint = _morphotactics_text(session, diag.morphotactics)
                return diag
        loose = _chains(
            session, entries, public, constrained=False, graph=lambda starts: free_order_graph(session, starts, zero=True)
        )
        for entry, internal in loose:
            ids = session.decode_internal(internal)[2]
            affixes = [session.affixes[i] for i in ids]
            brk = _full_break(g, entry.klass, affixes)
            if brk is None:
                continue
            line = g.slots[brk.after].pos.line if brk.after_kind == "slot" else g.classes[brk.after].pos.line
            diag.layer = "morphotactics"
            diag.morphotactics = MorphotacticsFinding(
                "end" if brk.wanted == m.END_SLOT else "order",
                lemma,
                session.entry_info(entry),
                diag.expected,
                _morph_infos(session, ids),
                brk.after,
                brk.after_kind,
                brk.wanted,
                brk.reachable,
                line,
            )
            diag.summary, diag.hint = _morphotactics_text(session, diag.morphotactics)
            return diag
        diag.layer = "morphotactics"
        diag.summary = (
            f"morphotactics: no affixes of the slots {entries[0].klass} reaches carry {';'.join(tags[1:])} in this order"
        )
        diag.hint = "check the features of the affixes and the order of the labels (slot order)"
        return diag
    best: tuple[int, SoundChangeFinding] | None = None
    for entry, internal in chains:
        ids = session.decode_internal(internal)[2]
        for d in derive(session, session.encode_underlying(entry, ids), entry.flags):
            if not d.resolved:
                continue
            finding = _attribute(session, surface, diag.expected, d, entry.flags, require_rule=False)
            if finding is None:
                continue
            finding.entry = session.entry_info(entry)
            distance = sum(1 for w, e in align(surface, d.surface) if w != e)
            if best is None or distance < best[0]:
                best = (distance, finding)
    if best is None:
        diag.summary = f"{diag.expected} has no surface form: an archiphoneme is left unresolved on its path"
        diag.hint = "run 'morphfst lint' to find the unresolved archiphoneme and add a rule for it"
        return diag
    finding = best[1]
    if finding.rule:
        have = set(finding.entry["flags"]) if finding.entry else set()
        finding.exception_flags = [
            f.name for f in session.grammar.flags.values() if finding.rule["name"] in f.blocks and f.name not in have
        ]
    diag.layer, diag.sound_change = "sound change", finding
    diag.summary, diag.hint = _sound_text(finding)
    return diag


def _full_break(g: m.Grammar, klass: str, affixes: list[m.Affix]) -> Break | None:
    """Where a full affix chain (zero morphs included) leaves the slot graph (see find_break)."""
    current = set(g.classes[klass].next)
    after, after_kind = klass, "class"
    for index, a in enumerate(affixes):
        if a.slot not in current:
            return Break(index, after, after_kind, sorted(current), a.slot)
        current = set(a.next if a.next is not None else g.slots[a.slot].next)
        after, after_kind = a.slot, "slot"
    if m.END_SLOT not in current:
        return Break(len(affixes), after, after_kind, sorted(current), m.END_SLOT)
    return None


def _chains(
    session: DebugSession,
    entries: list[m.LexEntry],
    public: str,
    constrained: bool,
    graph: Callable[[list[str]], pynini.Fst] | None = None,
) -> list[tuple[m.LexEntry, str]]:
    """(entry, internal analysis) pairs whose public analysis (affix ids removed) is ``public``."""
    s = session.space
    kinds = s.kinds
    affix_codes = [c for c, k in kinds.items() if k == "affix"]
    keep = sorted(
        {c for c, k in kinds.items() if k in {"feature", "pos"}} | set(public) | {ch for e in entries for ch in e.lemma}
    )
    drop = union([union(acc(c) for c in keep), union(cross(c, "") for c in affix_codes)]).closure()
    target = pynini.compose(drop, acc(public)).optimize()
    filt = session.analysis_filter if constrained else None
    out: list[tuple[m.LexEntry, str]] = []
    for group in session.groups(entries).values():
        machine = session.stem_group_fst(group, graph)
        if filt is not None:
            machine = pynini.compose(filt, machine)
        analyses = machine.copy().project("input")
        found = pynini.compose(analyses, target).connect()
        if is_empty(found):
            continue
        for internal, _, _ in paths(pynini.shortestpath(found, nshortest=8), 8):
            lemma = session.decode_internal(internal)[0]
            entry = next(e for e in group if e.lemma == lemma)
            out.append((entry, internal))
    return out


def _expected_entry(session: DebugSession, surface: str, lemma: str, pos: str) -> LexiconFinding | None:
    """A lexicon line for a lemma that has no entry: the first class (and flag) that makes the word work."""
    g = session.grammar
    stem = list(session.lang.normalize(lemma))
    if any(ch not in g.letters for ch in stem):
        return None
    classes = [c for c in g.classes.values() if not c.pos_allowed or pos in c.pos_allowed]
    variants: list[list[str]] = [[]] + [[f] for f in g.flags]
    for klass in classes:
        for flags in variants:
            entry = m.LexEntry(lemma, klass.name, pos, "?", 0.0, list(stem), flags, m.Position("<guess>"), stem_given=False)
            try:
                verified = verify_entry(session, surface, entry)
            except UserError:  # the class's stem rules do not fit this lemma
                continue
            if verified:
                file = _lexicon_file(session, klass.name)
                return LexiconFinding(
                    lemma,
                    "".join(stem),
                    klass.name,
                    pos,
                    flags,
                    f"{lemma} {pos}",
                    surface,
                    [],
                    tsv_line(_header(file), lemma, klass.name, pos, flags),
                    file,
                    True,
                )
    return None


# ---- helpers ---------------------------------------------------------------------------------------


def _morph_infos(session: DebugSession, ids: list[int]) -> list[MorphInfo]:
    return [MorphInfo(session.affixes[i].form_text, session.affixes[i].slot, i, session.affixes[i].gloss) for i in ids]


def candidate_entries(session: DebugSession, surface: str, limit: int = 3000) -> list[m.LexEntry]:
    """Lexicon entries whose stem could start the word (all of them for a small lexicon).

    A stem is kept when its plain letters share a prefix with the word of at least
    min(3, len(stem) - 2) letters (at least 1), which allows stem-final alternations.
    """
    lexicon = session.grammar.lexicon
    if len(lexicon) <= limit:
        return list(lexicon)
    out = []
    for e in lexicon:
        stem = [s for s in e.stem if len(s) == 1]
        need = max(1, min(3, len(stem) - 2))
        common = 0
        for a, b in zip(stem, surface):
            if a != b:
                break
            common += 1
        if common >= need:
            out.append(e)
    return out


def _relaxed_paths(
    session: DebugSession,
    surface: str,
    entries: list[m.LexEntry],
    graph: Callable[[list[str]], pynini.Fst] | None,
    limit: int = 20,
    name: str = "",
) -> list[tuple[m.LexEntry | None, str, float]]:
    """(entry, internal analysis, weight) of the paths of a relaxed machine that give ``surface``.

    With a ``name`` and the whole lexicon as ``entries``, each group's machine is built once per session.
    """
    out: list[tuple[m.LexEntry | None, str, float]] = []
    whole = len(entries) == len(session.grammar.lexicon)
    for blocked, group in session.groups(entries).items():
        if is_empty(session.back_lattice(surface, blocked)[1]):
            continue
        if name and whole:

            def build(group: list[m.LexEntry] = group) -> pynini.Fst:
                return session.stem_group_fst(group, graph)

            machine = session.memo(("relaxed", name, blocked), build)
        else:
            machine = session.stem_group_fst(group, graph)
        found = session.match(machine, surface, blocked)
        if is_empty(found):
            continue
        for internal, _, weight in paths(pynini.shortestpath(found, nshortest=limit), limit):
            lemma, pos, _ = session.decode_internal(internal)
            entry = next((e for e in group if e.lemma == lemma and e.pos_tag == pos), None)
            out.append((entry, internal, weight))
    # ties in weight broken by the analysis string, so the order is the grammar's, not the lattice's
    return sorted(out, key=lambda t: (round(t[2], 5), t[1]))


def free_order_graph(session: DebugSession, starts: list[str], zero: bool = False) -> pynini.Fst:
    """Every affix with a form (and with ``zero``, every zero morph too) from the slots reachable from
    ``starts``, in any order and number, then the word end."""

    def build() -> pynini.Fst:
        reachable = set(session.reachable_slots(starts))
        with_form = [a for a in session.grammar.affixes if (a.form or zero) and a.slot in reachable]
        free = union(session.affix_path(a) + pynini.accep("", weight=FREE_MORPH_COST) for a in with_form).closure()
        return (free + cross("", session.space.code(m.WORD_END))).optimize()

    return session.memo(("free-order", tuple(starts), zero), build)


def morphotactics_finding(session: DebugSession, surface: str) -> MorphotacticsFinding | None:
    """Known stem and known morphs, rejected by a constraint or by the slot graph."""
    g = session.grammar
    entries = candidate_entries(session, surface)
    if g.constraints:
        for entry, internal, _ in _relaxed_paths(session, surface, entries, None, name="unconstrained"):
            if entry is None:
                continue
            lemma, pos, ids = session.decode_internal(internal)
            bad = constraint_violations(g, [session.affixes[i] for i in ids], pos)
            if bad:
                c = bad[0]
                return MorphotacticsFinding(
                    "constraint",
                    lemma,
                    session.entry_info(entry),
                    session.analysis_text(internal),
                    _morph_infos(session, ids),
                    constraint={"name": c.name, "line": c.pos.line, "text": f"{c.left} {c.kind} {c.right}"},
                    segmentation=_segmentation(session, entry, ids, surface),
                )
    # Of the best relaxed paths (equal weight), the one whose break comes latest: the longest prefix
    # the slot graph accepts is the most telling; between breaks as late, the one that wants the slot
    # defined first (the grammar's main slot, e.g. case before a relative's own case), so the choice
    # depends neither on how the lattice orders paths of equal weight nor on affix numbering.
    order = {name: i for i, name in enumerate(g.slots)}
    best: tuple[float, tuple[int, int], m.LexEntry, str, list[int], Any] | None = None
    for entry, internal, weight in _relaxed_paths(
        session, surface, entries, lambda starts: free_order_graph(session, starts), name="free"
    ):
        if entry is None:
            continue
        if best is not None and round(weight, 5) > best[0]:
            break
        _, _, ids = session.decode_internal(internal)
        brk = find_break(g, entry.klass, [session.affixes[i] for i in ids])
        if brk is None:
            continue
        rank = (brk.index, -order.get(brk.wanted, len(order)))
        if best is None or rank > best[1]:
            best = (round(weight, 5), rank, entry, internal, ids, brk)
    if best is not None:
        _, _, entry, internal, ids, brk = best
        lemma, _, _ = session.decode_internal(internal)
        line = g.slots[brk.after].pos.line if brk.after_kind == "slot" else g.classes[brk.after].pos.line
        return MorphotacticsFinding(
            "end" if brk.wanted == m.END_SLOT else "order",
            lemma,
            session.entry_info(entry),
            session.analysis_text(internal),
            _morph_infos(session, ids),
            brk.after,
            brk.after_kind,
            brk.wanted,
            brk.reachable,
            line,
            segmentation=_segmentation(session, entry, ids, surface),
        )
    return None


def _rule_info(session: DebugSession, name: str) -> dict[str, Any]:
    r = session.rule(name)
    return {"name": r.name, "line": r.pos.line, "text": r.text}


def _rules_mapping(session: DebugSession, source: list[str], wanted: str, exclude: set[str]) -> list[str]:
    """Rules whose target-to-replacement mapping turns one of ``source`` (symbol codes) into ``wanted`` ("" = deletion)."""
    names = []
    for rule in session.grammar.rules:
        if rule.name in exclude:
            continue
        try:
            tau = session.compiler.rule_tau(rule)
        except Exception:  # a rule the compiler rejects is reported by the compiler itself
            continue
        for code in dict.fromkeys(source):
            outs = {o for _, o, _ in paths(pynini.compose(acc(code), tau), 20)}
            if wanted in outs:
                names.append(rule.name)
                break
    return names


def sound_change_finding(session: DebugSession, surface: str, near: list[NearWord]) -> SoundChangeFinding | None:
    """The nearest accepted word whose difference from ``surface`` a rule explains.

    Only the accepted words at the smallest distance are considered: a farther word differs by more
    than a sound change.
    """
    if not near:
        return None
    closest = min(n.distance for n in near)
    for candidate in near:
        if candidate.distance != closest:
            continue
        for analysis in session.lang.analyze(candidate.word):
            ex = explain_analysis(session, analysis, candidate.word)
            d = ex.derivation
            if d is None or not d.resolved:
                continue
            finding = _attribute(session, surface, ex.analysis, d, ex.entry["flags"] if ex.entry else [])
            if finding is not None:
                finding.entry = ex.entry
                if finding.rule:
                    name = finding.rule["name"]
                    have = set(ex.entry["flags"]) if ex.entry else set()
                    finding.exception_flags = [
                        f.name for f in session.grammar.flags.values() if name in f.blocks and f.name not in have
                    ]
                return finding
    return None


def _attribute(
    session: DebugSession, surface: str, analysis: str, d: Derivation, flags: list[str], require_rule: bool = True
) -> SoundChangeFinding | None:
    expected = d.surface
    # indices of surface letters in the bounded string (boundaries skipped)
    letter_index = [k for k, sym in enumerate(d.bounded) if sym != m.MORPH_BOUNDARY]
    gap_index = [0] + [k + 1 for k in letter_index]  # gap j of the surface = gap before bounded symbol
    pairs = align(surface, expected)
    i = j = 0  # positions in the word and in the expected surface
    blocked = sorted(session.blocked_rules(flags))
    codes = session.space
    for w, e in pairs:
        if w == e:
            i += bool(w)
            j += bool(e)
            continue
        rule: str | None = None
        could: list[str] = []
        exclude: set[str] = set()
        if w and e:  # substitution: the rule that last wrote e, or one that could have written w
            origin = d.origins[letter_index[j]]
            rule = origin.rules[-1] if origin.rules else None
            sources = [e] + ([d.underlying_symbols[origin.source]] if origin.source is not None else [])
            if rule and origin.source is not None:
                source = d.underlying_symbols[origin.source]
                if source in session.grammar.letters and w != source and w not in _reachable(session, source):
                    # a plain letter that no rule could turn into w: a different stem or affix, not a sound change
                    # (an archiphoneme's value comes from the rules alone, so there the rule is always to blame)
                    rule = None
            could = _rules_mapping(session, [codes.to_char.get(x, x) for x in sources], w, {rule} if rule else set())
        elif e:  # the word lacks e: a rule inserted it, or a rule could have deleted it
            origin = d.origins[letter_index[j]]
            rule = origin.rules[0] if origin.source is None and origin.rules else None
            sources = [e] + ([d.underlying_symbols[origin.source]] if origin.source is not None else [])
            could = _rules_mapping(session, [codes.to_char.get(x, x) for x in sources], "", exclude)
        else:  # the word has an extra w: a rule deleted something here, or a rule could have inserted w
            gap = d.gaps[gap_index[j]] if gap_index[j] < len(d.gaps) else ()
            rule = gap[-1] if gap else None
            could = _rules_mapping(session, [""], w, exclude)
        if rule is None and not could and require_rule:
            return None
        word_line, exp_line, marks = _aligned_lines(pairs, len([p for p in pairs[: pairs.index((w, e))]]))
        return SoundChangeFinding(
            analysis=analysis,
            expected=expected,
            underlying=d.underlying,
            word_line=word_line,
            expected_line=exp_line,
            marks=marks,
            position=i,
            word_has=w,
            grammar_has=e,
            rule=_rule_info(session, rule) if rule else None,
            could=[_rule_info(session, r) | {"blocked": r in blocked} for r in could],
            blocked=blocked,
            derivation=d,
        )
    return None


def _reachable(session: DebugSession, name: str, depth: int = 4) -> set[str]:
    """Symbol names the rules' target-to-replacement mappings can turn ``name`` into (transitively)."""

    def build() -> set[str]:
        s = session.space
        taus = []
        for rule in session.grammar.rules:
            try:
                taus.append(session.compiler.rule_tau(rule))
            except Exception:  # a rule the compiler rejects is reported by the compiler itself
                continue
        seen: set[str] = set()
        frontier = {name}
        for _ in range(depth):
            nxt: set[str] = set()
            for sym in frontier:
                code = s.to_char.get(sym)
                if code is None:
                    continue
                for tau in taus:
                    for _, out, _ in paths(pynini.compose(acc(code), tau), 20):
                        if len(out) <= 1:
                            out_name = s.name(out) if out else ""
                            if out_name not in seen:
                                seen.add(out_name)
                                nxt.add(out_name)
            frontier = nxt
        return seen

    return session.memo(("reachable", name), build)


def _aligned_lines(pairs: list[tuple[str, str]], first: int) -> tuple[str, str, str]:
    top, bottom, marks = [], [], []
    for k, (w, e) in enumerate(pairs):
        top.append(w or "·")
        bottom.append(e or "·")
        marks.append("^" if k == first else " ")
    return "".join(top), "".join(bottom), "".join(marks).rstrip()


# ---- the lexicon layer ---------------------------------------------------------------------------


def _guess_stems(session: DebugSession, klass: m.StemClass, flag: m.Flag | None) -> pynini.Fst | None:
    """Guessed stems of a class (optionally with a flag's marker): lemma = stem, letters only.

    What does not depend on the flag (the stem letters the class's guess pattern allows, its slot
    graph) is built once per class and session; a flag adds only its marker and cost."""
    parts = session.memo(("guess-parts", klass.name), lambda: _class_guess_parts(session, klass))
    if parts is None:
        return None
    stem, tags, slots = parts
    s = session.space
    after = ""
    if flag is not None and flag.marks:
        after += s.code(flag.marks)
    if klass.apostrophe and "'" in s.to_char:
        after += s.code("'")
    tail = union(cross(s.code(f"pos:{t}"), after) for t in tags)
    out = cross("", s.code(m.WORD_START)) + stem + tail
    if flag is not None:
        out = out + pynini.accep("", weight=GUESS_FLAG_COST)
    return out + slots


def _class_guess_parts(session: DebugSession, klass: m.StemClass) -> tuple[pynini.Fst, list[str], pynini.Fst] | None:
    """The flag-independent parts of :func:`_guess_stems`: stem letters, parts of speech, slot graph."""
    s = session.space
    comp = session.compiler
    structural = {s.code("'")} if "'" in s.to_char and any(c.apostrophe for c in session.grammar.classes.values()) else set()
    letters = union(acc(c, weight=GUESS_LETTER_COST) for c in session.letters if c not in structural)
    stem = pynini.closure(letters, 2)
    if klass.guess is not None:
        try:
            stem = pynini.intersect(comp.expr(klass.guess).optimize(), stem.optimize())
        except KeyError:
            pass
    stem = stem.optimize()
    if is_empty(stem):
        return None
    tags = list(klass.pos_allowed or session.grammar.pos_tags)
    return stem, tags, comp.slot_graph(list(klass.next))


def guesses(session: DebugSession, surface: str, limit: int = 4) -> list[tuple[str, list[str], str, float]]:
    """(class, flags, internal analysis, weight) of guessed-stem analyses of ``surface``, best first."""
    g = session.grammar
    filt = session.analysis_filter
    found: list[tuple[str, list[str], str, float]] = []
    variants: list[m.Flag | None] = [None] + list(g.flags.values())
    for flag in variants:
        blocked = frozenset(flag.blocks) if flag else frozenset()
        # one whole lattice for the many guess machines (a class and flag each): cheaper than running
        # each of them forward through the first rules (Turkish: 527 machines)
        lattice = session.lattice(surface, blocked)
        if is_empty(lattice):
            continue
        for klass in g.classes.values():

            def build(klass: m.StemClass = klass, flag: m.Flag | None = flag) -> pynini.Fst | None:
                machine = _guess_stems(session, klass, flag)
                if machine is not None and filt is not None:
                    machine = pynini.compose(filt, machine)
                if machine is not None:
                    machine.arcsort("olabel")  # composed with a new lattice for every word: sorted once
                return machine

            machine = session.memo(("guess", klass.name, flag.name if flag else ""), build)
            if machine is None:
                continue
            result = pynini.compose(machine, lattice).connect()
            if is_empty(result):
                continue
            for internal, _, weight in paths(pynini.shortestpath(result, nshortest=limit), limit):
                found.append((klass.name, [flag.name] if flag else [], internal, weight))
    found.sort(key=lambda t: (t[3], t[2]))
    seen: set[tuple[str, str]] = set()
    out = []
    for item in found:
        key = (item[0], item[2])
        if key not in seen:
            seen.add(key)
            out.append(item)
    return out[:limit]


def _lexicon_file(session: DebugSession, klass: str) -> str | None:
    counts: dict[str, int] = {}
    for e in session.grammar.lexicon:
        if e.klass == klass:
            counts[e.pos.file] = counts.get(e.pos.file, 0) + 1
    if counts:
        return max(counts.items(), key=lambda kv: kv[1])[0]
    files = [e.pos.file for e in session.grammar.lexicon]
    return files[0] if files else None


def _header(path: str | None) -> list[str]:
    if path and Path(path).is_file():
        for line in Path(path).read_text(encoding="utf-8", errors="replace").splitlines():
            if line.strip() and not line.lstrip().startswith("#"):
                return [c.strip().lower() for c in line.split("\t")]
    return ["lemma", "class", "pos", "gloss"]


def tsv_line(header: list[str], lemma: str, klass: str, pos: str, flags: list[str]) -> str:
    values = {"lemma": lemma, "class": klass, "pos": pos, "gloss": "?", "flags": ",".join(flags)}
    cols = list(header)
    if flags and "flags" not in cols:
        cols.append("flags")
    return "\t".join(values.get(c, "") for c in cols).rstrip("\t")


def verify_entry(session: DebugSession, surface: str, entry: m.LexEntry) -> bool:
    """True when the entry, compiled with the real slot graph, constraints and rules, accepts the word."""
    machine = session.stem_group_fst([entry])
    filt = session.analysis_filter
    if filt is not None and set(entry.lemma) <= set(session.letters) | {ch for e in session.grammar.lexicon for ch in e.lemma}:
        machine = pynini.compose(filt, machine)
    return not is_empty(session.match(machine, surface, session.blocked_rules(entry.flags)))


def lexicon_finding(session: DebugSession, surface: str) -> LexiconFinding | None:
    found = guesses(session, surface)
    if not found:
        return None
    klass, flags, internal, _ = found[0]
    lemma, pos, ids = session.decode_internal(internal)
    stem = lemma
    entry = m.LexEntry(lemma, klass, pos, "?", 0.0, list(stem), flags, m.Position("<guess>"), stem_given=False)
    file = _lexicon_file(session, klass)
    bounded = _segmentation(session, entry, ids, surface)
    alternatives = []
    for k2, f2, int2, _ in found[1:]:
        lem2, pos2, ids2 = session.decode_internal(int2)
        e2 = m.LexEntry(lem2, k2, pos2, "?", 0.0, list(lem2), f2, m.Position("<guess>"), stem_given=False)
        extra = f" (flags {','.join(f2)})" if f2 else ""
        alternatives.append(f"{session.analysis_text(int2)}  {_segmentation(session, e2, ids2, surface)}  class {k2}{extra}")
    return LexiconFinding(
        lemma=lemma,
        stem=stem,
        klass=klass,
        pos=pos,
        flags=flags,
        analysis=session.analysis_text(internal),
        segmentation=bounded,
        affixes=_morph_infos(session, ids),
        tsv_line=tsv_line(_header(file), lemma, klass, pos, flags),
        lexicon_file=file,
        verified=verify_entry(session, surface, entry),
        existing=[session.entry_info(e) for e in session.grammar.lexicon if e.lemma == lemma or "".join(e.stem) == stem],
        alternatives=alternatives,
    )


def _segmentation(session: DebugSession, entry: m.LexEntry, ids: list[int], surface: str) -> str:
    found = derive(session, session.encode_underlying(entry, ids), entry.flags, target=surface)
    return found[0].bounded.replace(m.MORPH_BOUNDARY, "-") if found else surface


# ---- messages -----------------------------------------------------------------------------------------


def _morphotactics_text(session: DebugSession, f: MorphotacticsFinding) -> tuple[str, str]:
    slots = " ".join(f"{mo.slot}:{mo.form or '∅'}" for mo in f.morphs if mo.form or not f.segmentation)
    if f.segmentation:
        head = f"{f.segmentation} splits into known morphs ({slots})"
    else:  # an expected analysis: its affix chain, underlying forms and zero morphs included
        head = f"{f.analysis} needs the affix chain {slots}"
    if f.kind == "constraint":
        c = f.constraint or {}
        return (
            f"morphotactics: {f.segmentation or f.lemma} ({f.analysis}) is built of known morphs, but constraint {c.get('name')} "
            f"(line {c.get('line')}: {c.get('text')}) forbids it",
            f"remove or narrow constraint {c.get('name')} if the word is right",
        )
    where = f"{f.after_kind} {f.after}"
    if f.kind == "end":
        return (
            f"morphotactics: {head}, but the word cannot end after {where}: "
            f"from there the graph only goes to {', '.join(f.reachable) or 'nothing'}",
            f"add 'end' to the followers of {where} (line {f.slot_line}) if the word is right",
        )
    return (
        f"morphotactics: {head}, but slot {f.wanted} cannot follow {where}: "
        f"the slot graph has no transition {f.after} -> {f.wanted} (from {f.after} it reaches {', '.join(f.reachable) or 'nothing'})",
        f"add {f.wanted} to the followers of {where} (line {f.slot_line}) if the word is right",
    )


def _sound_text(f: SoundChangeFinding) -> tuple[str, str]:
    def show(x: str) -> str:
        return repr(x) if x else "nothing"

    head = (
        f"sound change: {f.underlying} ({f.analysis}) comes out as {f.expected}; at position {f.position + 1} "
        f"the word has {show(f.word_has)} where the rules give {show(f.grammar_has)}"
    )
    if f.rule:
        head += f"; rule {f.rule['name']} (line {f.rule['line']}) produced the difference"
    hint_parts = []
    if f.rule:
        hint_parts.append(f"check rule {f.rule['name']} (line {f.rule['line']}): {' '.join(f.rule['text'].split())}")
    for c in f.could:
        if c["blocked"]:
            hint_parts.append(f"rule {c['name']} would give {show(f.word_has)} here but the entry's flags block it")
        else:
            hint_parts.append(
                f"rule {c['name']} (line {c['line']}) would give {show(f.word_has)} here but its context did not match"
            )
    if not f.rule and not f.could:
        hint_parts.append("no rule touches this position")
    if f.exception_flags and f.entry:
        hint_parts.append(
            f"or, if {f.entry['lemma']} is an exception, give its entry at {f.entry['file']}:{f.entry['line']} "
            f"the flag {' or '.join(f.exception_flags)} (it blocks {f.rule['name'] if f.rule else 'the rule'})"
        )
    return head, "; ".join(hint_parts)


def _lexicon_text(f: LexiconFinding) -> tuple[str, str]:
    flags = f" with flag {','.join(f.flags)}" if f.flags else ""
    summary = (
        f"lexicon: no known stem fits; the best guess is stem {f.stem!r} (class {f.klass}, {f.pos}{flags}) "
        f"giving {f.segmentation} = {f.analysis}"
    )
    where = f" to {f.lexicon_file}" if f.lexicon_file else ""
    hint = f"add the line{where}: {f.tsv_line.replace(chr(9), ' <TAB> ')}"
    if not f.verified:
        hint += " (not verified)"
    for e in f.existing:
        if f.flags and sorted(e["flags"]) != sorted(f.flags) and e["class"] == f.klass:
            hint += f"; or give the existing entry at {e['file']}:{e['line']} the flag {','.join(f.flags)}"
    return summary, hint


def render_diagnosis(d: Diagnosis) -> str:
    out = [f"{d.word}: {d.layer}", f"  {d.summary}"]
    if d.hint:
        out.append(f"  hint: {d.hint}")
    if d.morphotactics:
        mf = d.morphotactics
        out.append(f"  entry: {mf.entry['lemma']} ({mf.entry['class']}) at {mf.entry['file']}:{mf.entry['line']}")
        for mo in mf.morphs:
            out.append(f"    {mo.slot:<14} {mo.form or '∅':<10} #{mo.affix_id:<4} {mo.gloss}")
    if d.sound_change:
        sf = d.sound_change
        out.append(f"  word         {sf.word_line}")
        out.append(f"  rule output  {sf.expected_line}")
        out.append(f"               {sf.marks}")
        if sf.derivation is not None:
            out.append(f"  derivation of {sf.analysis}:")
            out.extend(render_derivation(sf.derivation, indent="    "))
    if d.lexicon:
        lf = d.lexicon
        out.append(f"  TSV line: {lf.tsv_line!r}  ({'verified' if lf.verified else 'not verified'} against the grammar)")
        for e in lf.existing:
            out.append(
                f"  note: an entry {e['lemma']} ({e['class']}, flags {','.join(e['flags']) or 'none'}) exists at {e['file']}:{e['line']}"
            )
        for alt in lf.alternatives:
            out.append(f"  other guess: {alt}")
    if d.analyses:
        for a in d.analyses:
            out.append(f"  analysis: {a}")
    if d.nearest:
        out.append("  nearest accepted words:")
        for n in d.nearest:
            out.append(f"    {n.word:<16} distance {n.distance}  {' | '.join(n.analyses[:3])}")
    return "\n".join(out) + "\n"

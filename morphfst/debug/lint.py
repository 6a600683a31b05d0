"""Lint a grammar: things that compile but are probably mistakes.

Checks (validation already rejects undeclared names and unreachable slots):

- ``dead-end-slot``: a slot from which no path reaches the end of a word;
- ``unused-class``: a class no lexicon entry uses (an open class, whose pattern spells its stems, needs none);
- ``duplicate-affix``: two affixes of one slot with the same form, features, part of speech,
  continuation and name;
- ``rule-never-applies``: a rule that changes no string the lexicon × slot graph can feed it (the
  output projection of the machine is pushed through the cascade rule by rule, per group of entries
  with the same blocked rules);
- ``rule-shadowed``: a later rule whose every application an earlier obligatory rule takes first
  (its target is contained in the earlier target, its contexts in the earlier contexts, and the
  earlier replacement does not give its target back, and no rule from the earlier to the later one
  writes a symbol the later one reads: the later rule may meet a context made after the earlier one);
- ``unresolved-archiphoneme``: an archiphoneme that reaches the end of the cascade on some path (the
  final step drops such paths, so those words silently cannot be analyzed);
- ``filter-archiphoneme`` (a note): archiphonemes that rules write and no obligatory rule rewrites,
  used to rule paths out (their paths are left out of the check above);

Each finding names its file and line (an included grammar file's own).
- an ambiguity report: the words of a word list with the most analyses.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field
from pathlib import Path
from typing import Any

import pynini

from ..compile.fstutil import acc, is_empty, paths
from ..errors import Position, UserError
from ..language import model as m
from ..textio import ReadStats, open_binary, read_lines
from .morphotactics import followers
from .session import DebugSession


@dataclass
class Finding:
    kind: str
    severity: str  # "warning" or "note"
    subject: str
    line: int
    message: str
    detail: dict[str, Any] = field(default_factory=dict)
    file: str = ""  # the source file of ``line`` when it is not the grammar file itself (an included file)


@dataclass
class AmbiguousWord:
    word: str
    count: int
    analyses: list[str]


@dataclass
class LintReport:
    grammar: str
    path: str
    findings: list[Finding]
    ambiguous: list[AmbiguousWord] = field(default_factory=list)
    words_checked: int = 0

    def to_dict(self) -> dict[str, Any]:
        return asdict(self)


# ---- graph checks ------------------------------------------------------------------------------------


def dead_end_slots(g: m.Grammar) -> list[Finding]:
    ends: set[str] = set()
    changed = True
    while changed:
        changed = False
        for slot in g.slots.values():
            if slot.name in ends:
                continue
            for a in slot.affixes:
                if any(n == m.END_SLOT or n in ends for n in followers(a, g)):
                    ends.add(slot.name)
                    changed = True
                    break
    return [
        Finding(
            "dead-end-slot",
            "warning",
            s.name,
            s.pos.line,
            f"slot {s.name}: no path from it reaches the end of a word",
            {"next": s.next},
            s.pos.file,
        )
        for s in g.slots.values()
        if s.name not in ends
    ]


def unused_classes(g: m.Grammar) -> list[Finding]:
    """Classes no lexicon entry uses; an open class (its ``open`` pattern makes every string it accepts a
    stem) needs no entry."""
    used = {e.klass for e in g.lexicon}
    return [
        Finding("unused-class", "note", c.name, c.pos.line, f"class {c.name} has no lexicon entry", file=c.pos.file)
        for c in g.classes.values()
        if c.name not in used and c.open is None
    ]


def duplicate_affixes(g: m.Grammar) -> list[Finding]:
    """Two affixes of a slot with the same form, features, part of speech, continuation and name (the
    same affix routed to other slots, often at another weight, or named for a constraint, is a way of
    writing the graph, not a repeat)."""
    out = []
    for slot in g.slots.values():
        seen: dict[tuple[str, tuple[str, ...], str | None, tuple[str, ...] | None, str | None], m.Affix] = {}
        for a in slot.affixes:
            key = (a.form_text, tuple(a.features), a.new_pos, tuple(a.next) if a.next is not None else None, a.name)
            if key in seen:
                first = seen[key]
                out.append(
                    Finding(
                        "duplicate-affix",
                        "warning",
                        f"{slot.name}:{a.form_text or '∅'}",
                        a.pos.line,
                        f"slot {slot.name}: affix {a.form_text or '∅'!r} {';'.join(a.features)} repeats the affix at line {first.pos.line}",
                        {"first_line": first.pos.line},
                        a.pos.file,
                    )
                )
            else:
                seen[key] = a
    return out


# ---- rule checks ----------------------------------------------------------------------------------------


def _changes(fst: pynini.Fst) -> bool:
    """True when some successful path of a connected transducer rewrites a symbol (an arc with ilabel ≠ olabel)."""
    for state in fst.states():
        for arc in fst.arcs(state):
            if arc.ilabel != arc.olabel:
                return True
    return False


OPTIMIZE_GROWTH = 1.5  # the cascade check optimizes the word list again when it has grown by this factor


def cascade_checks(session: DebugSession) -> list[Finding]:
    """Rules that never apply and archiphonemes left unresolved, over the whole lexicon × slot graph."""
    g = session.grammar
    comp = session.compiler
    s = session.space
    applies: dict[str, bool] = {r.name: False for r in g.rules}
    seen_rule: dict[str, bool] = {r.name: False for r in g.rules}
    arch_codes = [s.code(a) for a in g.archiphonemes]
    # an archiphoneme that rules write and no obligatory rule rewrites is a filter: a path that keeps it
    # has no surface form by design (a form the grammar rules out, or one read only by a lenient rule);
    # paths that keep a filter are left out of the search for unresolved archiphonemes, and the filters
    # get one note (an archiphoneme of the lexicon or affixes that no rule rewrites is still reported)
    resolved: set[int] = set()
    written: set[int] = set()
    for rule in g.rules:
        try:
            written |= _written(session, rule)
            if not rule.optional and not rule.lenient:
                resolved |= _symbols(comp.expr(rule.target))
        except (UserError, KeyError):
            resolved |= {ord(code) for code in arch_codes}
    # (a code is one character; its label is its code point)
    filters = [code for code in arch_codes if ord(code) in written and ord(code) not in resolved]
    arch_codes = [code for code in arch_codes if code not in filters]
    unfiltered = None
    if filters:
        keeps = comp.sigma_star + pynini.union(*(acc(code) for code in filters)) + comp.sigma_star
        unfiltered = pynini.difference(comp.sigma_star, keeps.optimize()).optimize()
    unresolved: dict[str, tuple[str, str]] = {}
    filt = comp.constraint_filter({ch for e in g.lexicon for ch in e.lemma})
    for blocked, entries in session.groups(g.lexicon).items():
        machine = session.stem_group_fst(entries)
        if filt is not None:
            machine = pynini.compose(filt, machine)
        language = machine.copy().project("output").rmepsilon().optimize()
        optimized = language.num_states()
        for rule in g.rules:
            if rule.name in blocked:
                continue
            seen_rule[rule.name] = True
            step = pynini.compose(language, comp.rule_fst(rule)).connect()
            if not applies[rule.name] and _changes(step):
                applies[rule.name] = True
            language = step.project("output").rmepsilon()
            # optimizing (determinize, minimize) the whole word list after every rule cost 20 x the
            # composition and seldom made it smaller: only when it has grown by half
            if language.num_states() > OPTIMIZE_GROWTH * optimized:
                language = language.optimize()
                optimized = language.num_states()
        if arch_codes:
            kept = language if unfiltered is None else pynini.compose(language, unfiltered).connect()
            for code in arch_codes:
                if s.name(code) in unresolved:
                    continue
                has = (comp.sigma_star + acc(code) + comp.sigma_star).optimize()
                left = pynini.compose(kept, has).connect()
                if not is_empty(left):
                    unresolved[s.name(code)] = _witness(session, machine, blocked, pynini.shortestpath(left))
    out = []
    for rule in g.rules:
        if seen_rule[rule.name] and not applies[rule.name]:
            out.append(
                Finding(
                    "rule-never-applies",
                    "warning",
                    rule.name,
                    rule.pos.line,
                    f"rule {rule.name} changes no underlying form the lexicon and slot graph can feed it (after the rules before it)",
                    {"text": rule.text},
                    rule.pos.file,
                )
            )
    if filters:
        names = ", ".join(s.name(code) for code in filters)
        out.append(
            Finding(
                "filter-archiphoneme",
                "note",
                names,
                0,
                f"rules write {names} and no obligatory rule rewrites it: a path that keeps one has no surface form "
                "(a filter; such paths are left out of the check for unresolved archiphonemes)",
                {"archiphonemes": [s.name(code) for code in filters]},
            )
        )
    for name, (analysis, output) in unresolved.items():
        out.append(
            Finding(
                "unresolved-archiphoneme",
                "warning",
                name,
                0,
                f"archiphoneme {name} is left unresolved after the last rule on some path, e.g. {analysis} -> {output}; "
                "the final step drops such paths, so these words have no surface form (ignore this if the grammar uses it as a filter)",
                {"analysis": analysis, "output": output},
            )
        )
    return out


def _witness(session: DebugSession, machine: pynini.Fst, blocked: frozenset[str], outputs: pynini.Fst) -> tuple[str, str]:
    """(analysis text, rendered cascade output) of one path whose cascade output is in ``outputs``."""
    back = outputs
    for rule in reversed(session.rules_for(blocked)):
        back = pynini.compose(session.compiler.rule_fst(rule), back).connect()
    found = paths(pynini.shortestpath(pynini.compose(machine, back).connect()), 1)
    if not found:
        return "?", ""
    internal, output, _ = found[0]
    return session.analysis_text(internal), session.render(output)


def _contained(a: pynini.Fst, b: pynini.Fst) -> bool:
    """True when the language of acceptor ``a`` is contained in that of ``b``."""
    b = pynini.determinize(b.copy().rmepsilon()).minimize()
    return is_empty(pynini.difference(a.copy().rmepsilon(), b).connect())


def _symbols(fst: pynini.Fst) -> set[int]:
    """The labels an acceptor's arcs read (a pattern like ``.*`` reads the whole alphabet)."""
    return {arc.ilabel for state in fst.states() for arc in fst.arcs(state) if arc.ilabel}


def _written(session: DebugSession, rule: m.Rule) -> set[int]:
    """The symbols a rule's replacement writes."""
    return _symbols(session.compiler.rule_tau(rule).copy().project("output"))


def shadowed_rules(session: DebugSession) -> list[Finding]:
    """Later rules whose every application an earlier obligatory rule takes first: the later target,
    left and right contexts contained in the earlier ones, the earlier replacement not giving the target
    back, and no rule from the earlier one to the later one writing a symbol the later one reads."""
    g = session.grammar
    comp = session.compiler
    sigma_star = comp.sigma_star
    blockers: dict[str, set[str]] = {r.name: set() for r in g.rules}
    for flag in g.flags.values():
        for name in flag.blocks:
            blockers[name].add(flag.name)

    def target(r: m.Rule) -> pynini.Fst:
        return comp.expr(r.target).optimize()

    def left(r: m.Rule) -> pynini.Fst:
        return (sigma_star + (comp.expr(r.left) if r.left is not None else acc(""))).optimize()

    def right(r: m.Rule) -> pynini.Fst:
        return ((comp.expr(r.right) if r.right is not None else acc("")) + sigma_star).optimize()

    def replacement(r: m.Rule) -> pynini.Fst:
        return comp.rule_tau(r).copy().project("output").optimize()

    def reads(r: m.Rule) -> set[int]:
        """The symbols the rule's target and contexts read."""
        return set().union(*(_symbols(comp.expr(e)) for e in (r.target, r.left, r.right) if e is not None))

    written: dict[str, set[int]] = {}

    def writes(r: m.Rule) -> set[int]:
        if r.name not in written:
            written[r.name] = _written(session, r)
        return written[r.name]

    out = []
    for j, later in enumerate(g.rules):
        try:
            read = reads(later)
        except (UserError, KeyError):
            continue
        for i, earlier in enumerate(g.rules[:j]):
            if earlier.optional or earlier.direction != later.direction:
                continue
            if not blockers[earlier.name] <= blockers[later.name]:
                continue
            try:
                # the earlier rule and those between the two may write what the later one reads: a target
                # or context made after the earlier rule looked (yap-DIr-<CS>: a second causative)
                if any(writes(r) & read for r in g.rules[i:j]):
                    continue
                t_later, t_earlier = target(later), target(earlier)
                if is_empty(t_later) or not _contained(t_later, t_earlier):
                    continue
                if not _contained(left(later), left(earlier)) or not _contained(right(later), right(earlier)):
                    continue
                if not is_empty(pynini.intersect(replacement(earlier), t_later).connect()):
                    continue
            except (UserError, KeyError):
                continue
            out.append(
                Finding(
                    "rule-shadowed",
                    "warning",
                    later.name,
                    later.pos.line,
                    f"rule {later.name} is shadowed by rule {earlier.name} (line {earlier.pos.line}): every target it could rewrite, "
                    f"{earlier.name} rewrites first",
                    {"by": earlier.name, "by_line": earlier.pos.line},
                    later.pos.file,
                )
            )
            break
    return out


# ---- ambiguity -------------------------------------------------------------------------------------------


def most_ambiguous(session: DebugSession, words: list[str], top: int = 10) -> list[AmbiguousWord]:
    counted: dict[str, AmbiguousWord] = {}
    for word in words:
        if word in counted:
            continue
        analyses = session.lang.analyze(word)
        counted[word] = AmbiguousWord(word, len(analyses), [a.text for a in analyses])
    ranked = sorted((a for a in counted.values() if a.count > 1), key=lambda a: (-a.count, a.word))
    return ranked[:top]


def read_words(path: str | Path) -> list[str]:
    """Whitespace-separated words of a file ('-' for standard input)."""
    stats = ReadStats()
    try:
        handle = open_binary(str(path))
    except OSError as exc:
        raise UserError(f"cannot read word list: {exc.strerror or exc}", Position(str(path))) from None
    words: list[str] = []
    for line in read_lines(handle, stats):
        words.extend(line.split())
    return words


def lint(lang: Any, words: list[str] | None = None, top: int = 10) -> LintReport:
    """Lint the grammar of a language; with ``words``, also report the most ambiguous of them."""
    session = DebugSession.open(lang)
    g = session.grammar
    findings = dead_end_slots(g) + unused_classes(g) + duplicate_affixes(g) + shadowed_rules(session)
    shadowed = {f.subject for f in findings if f.kind == "rule-shadowed"}
    for f in cascade_checks(session):
        if f.kind == "rule-never-applies" and f.subject in shadowed:
            continue  # already explained by the shadowing rule
        findings.append(f)
    findings.sort(key=lambda f: (f.line or 10**9, f.kind))
    report = LintReport(g.name, g.path, findings)
    if words is not None:
        report.ambiguous = most_ambiguous(session, words, top)
        report.words_checked = len(words)
    return report


def render_lint(report: LintReport) -> str:
    out = []
    for f in report.findings:
        where = f"{f.file or report.path}:{f.line}" if f.line else report.path
        out.append(f"{where}: {f.severity}: [{f.kind}] {f.message}")
    if not report.findings:
        out.append(f"{report.path}: no findings")
    if report.words_checked:
        out.append(f"most ambiguous of {report.words_checked} words:")
        if not report.ambiguous:
            out.append("  (no word has more than one analysis)")
        for a in report.ambiguous:
            out.append(f"  {a.word:<18} {a.count:>3}  {' | '.join(a.analyses)}")
    return "\n".join(out) + "\n"


__all__ = ["AmbiguousWord", "Finding", "LintReport", "lint", "render_lint"]

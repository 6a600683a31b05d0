"""Lint a grammar: things that compile but are probably mistakes.

Checks (validation already rejects undeclared names and unreachable slots):

- ``dead-end-slot``: a slot from which no path reaches the end of a word;
- ``unused-class``: a class no lexicon entry uses;
- ``duplicate-affix``: two affixes of one slot with the same form, features and part of speech;
- ``rule-never-applies``: a rule that changes no string the lexicon × slot graph can feed it (the
  output projection of the machine is pushed through the cascade rule by rule, per group of entries
  with the same blocked rules);
- ``rule-shadowed``: a later rule whose every application an earlier obligatory rule takes first
  (its target is contained in the earlier target, its contexts in the earlier contexts, and the
  earlier replacement does not give its target back);
- ``unresolved-archiphoneme``: an archiphoneme that reaches the end of the cascade on some path (the
  final step drops such paths, so those words silently cannot be analyzed);
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
        )
        for s in g.slots.values()
        if s.name not in ends
    ]


def unused_classes(g: m.Grammar) -> list[Finding]:
    used = {e.klass for e in g.lexicon}
    return [
        Finding("unused-class", "note", c.name, c.pos.line, f"class {c.name} has no lexicon entry")
        for c in g.classes.values()
        if c.name not in used
    ]


def duplicate_affixes(g: m.Grammar) -> list[Finding]:
    out = []
    for slot in g.slots.values():
        seen: dict[tuple[str, tuple[str, ...], str | None], m.Affix] = {}
        for a in slot.affixes:
            key = (a.form_text, tuple(a.features), a.new_pos)
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


def cascade_checks(session: DebugSession) -> list[Finding]:
    """Rules that never apply and archiphonemes left unresolved, over the whole lexicon × slot graph."""
    g = session.grammar
    comp = session.compiler
    s = session.space
    applies: dict[str, bool] = {r.name: False for r in g.rules}
    seen_rule: dict[str, bool] = {r.name: False for r in g.rules}
    arch_codes = [s.code(a) for a in g.archiphonemes]
    unresolved: dict[str, tuple[str, str]] = {}
    filt = comp.constraint_filter({ch for e in g.lexicon for ch in e.lemma})
    for blocked, entries in session.groups(g.lexicon).items():
        machine = session.stem_group_fst(entries)
        if filt is not None:
            machine = pynini.compose(filt, machine)
        language = machine.copy().project("output").rmepsilon().optimize()
        for rule in g.rules:
            if rule.name in blocked:
                continue
            seen_rule[rule.name] = True
            step = pynini.compose(language, comp.rule_fst(rule)).connect()
            if not applies[rule.name] and _changes(step):
                applies[rule.name] = True
            language = step.project("output").rmepsilon().optimize()
        if arch_codes:
            for code in arch_codes:
                if s.name(code) in unresolved:
                    continue
                has = (comp.sigma_star + acc(code) + comp.sigma_star).optimize()
                left = pynini.compose(language, has).connect()
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


def shadowed_rules(session: DebugSession) -> list[Finding]:
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

    out = []
    for j, later in enumerate(g.rules):
        for earlier in g.rules[:j]:
            if earlier.optional or earlier.direction != later.direction:
                continue
            if not blockers[earlier.name] <= blockers[later.name]:
                continue
            try:
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
        where = f"{report.path}:{f.line}" if f.line else report.path
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

"""Explain an accepted word: gloss, slot path, underlying form and the rules that made the surface."""

from __future__ import annotations

from dataclasses import asdict, dataclass, field
from typing import Any

from ..language import model as m
from ..runtime.results import Analysis
from .morphotactics import PathStep, analysis_path
from .session import DebugSession
from .trace import Derivation, derive


@dataclass
class GlossColumn:
    """One column of a Leipzig-style interlinear gloss: a surface morph over its gloss."""

    form: str
    gloss: str


@dataclass
class AnalysisExplanation:
    """Why one analysis of a word has the surface it has."""

    analysis: str
    weight: float
    segmentation: str
    gloss: str
    columns: list[GlossColumn]
    entry: dict[str, Any] | None  # the lexicon entry (lemma, class, file, line, ...)
    path: list[PathStep]
    derivation: Derivation | None  # None when no lexicon entry reproduces the word (e.g. a guess)
    compound: list[str] = field(default_factory=list)  # the parts' surface forms of a compound (the last explained)
    detached: bool = False  # suffixes read without their word (the grammar's detached block)

    @property
    def fired(self) -> list[str]:
        return self.derivation.fired if self.derivation else []

    def to_dict(self) -> dict[str, Any]:
        out = asdict(self)
        if self.derivation is not None:
            for key in ("origins", "gaps", "output_symbols", "underlying_symbols"):
                out["derivation"].pop(key, None)
        return out


@dataclass
class Explanation:
    """Every analysis of a word, explained."""

    word: str
    surface: str  # the normalized word
    analyses: list[AnalysisExplanation] = field(default_factory=list)

    @property
    def accepted(self) -> bool:
        return bool(self.analyses)

    def to_dict(self) -> dict[str, Any]:
        return {
            "word": self.word,
            "surface": self.surface,
            "accepted": self.accepted,
            "analyses": [a.to_dict() for a in self.analyses],
        }


def gloss_columns(analysis: Analysis) -> list[GlossColumn]:
    """Morphs over glosses, column by column; a zero morph's gloss joins its left neighbour with a dot."""
    cols: list[GlossColumn] = []
    for morph in analysis.morphs:
        if morph.form or not cols:
            cols.append(GlossColumn(morph.form, morph.gloss))
        elif morph.gloss and morph.gloss != "∅":
            cols[-1] = GlossColumn(cols[-1].form, f"{cols[-1].gloss}.{morph.gloss}")
    return cols


def explain_analysis(session: DebugSession, analysis: Analysis, surface: str) -> AnalysisExplanation:
    """Explain one analysis: find the lexicon entry whose derivation gives ``surface``."""
    affix_ids = [mo.affix_id for mo in analysis.morphs if mo.affix_id is not None]
    affixes = [session.affixes[i] for i in affix_ids]
    # a compound: the parts before the last are lexicon words in a fixed form; the last one is explained
    first = [mo for mo in analysis.morphs if mo.kind == "stem"][:-1]
    morphs = analysis.morphs[len(first) :]
    lemma = morphs[0].underlying if first else analysis.lemma
    prefix = "".join(mo.form for mo in first)
    surface = surface[len(prefix) :] if first and surface.startswith(prefix) else surface
    wanted_bounded = m.MORPH_BOUNDARY.join(mo.form for mo in morphs if mo.form) if all(mo.form != "?" for mo in morphs) else None
    chosen: tuple[m.LexEntry, Derivation] | None = None
    fallback: m.LexEntry | None = None
    for candidate in session.entries_by_lemma.get((lemma, analysis.pos), []):
        fallback = fallback or candidate
        underlying = session.encode_underlying(candidate, affix_ids)
        found = derive(session, underlying, candidate.flags, target=surface)
        if not found:
            continue
        exact = [d for d in found if wanted_bounded is None or d.bounded == wanted_bounded]
        chosen = (candidate, (exact or found)[0])
        if exact:
            break
    entry = chosen[0] if chosen else fallback
    klass = entry.klass if entry else next(iter(session.grammar.classes))
    return AnalysisExplanation(
        analysis=analysis.text,
        weight=round(analysis.weight, 6),
        segmentation=analysis.segmentation,
        gloss=analysis.gloss,
        columns=gloss_columns(analysis),
        entry=session.entry_info(entry) if entry else None,
        path=analysis_path(session.grammar, klass, affixes),
        derivation=chosen[1] if chosen else None,
        compound=[mo.form for mo in first] + [surface] if first else [],
        detached=not analysis.has_stem,
    )


def explain(lang: Any, word: str) -> Explanation:
    """Explain every analysis of ``word`` (an empty explanation when the word is rejected)."""
    session = DebugSession.open(lang)
    surface = session.lang.normalize(word)
    out = Explanation(word, surface)
    for analysis in session.lang.analyze(word):
        out.analyses.append(explain_analysis(session, analysis, surface))
    return out


# ---- text rendering ----------------------------------------------------------------------------------


def render_columns(columns: list[GlossColumn], indent: str = "  ") -> list[str]:
    """Two aligned lines, morphs over glosses, hyphens between columns (Leipzig Glossing Rules, rule 2)."""
    top: list[str] = []
    bottom: list[str] = []
    for k, col in enumerate(columns):
        form = ("-" if k else "") + (col.form or "∅")
        gloss = ("-" if k else "") + col.gloss
        width = max(len(form), len(gloss))
        top.append(form.ljust(width))
        bottom.append(gloss.ljust(width))
    return [indent + " ".join(top).rstrip(), indent + " ".join(bottom).rstrip()]


def render_path(path: list[PathStep]) -> str:
    parts = []
    for step in path:
        if step.kind == "class":
            parts.append(f"class {step.node}")
        elif step.kind == "end":
            parts.append("end" if step.allowed else "end (not allowed here)")
        else:
            label = f"{step.node}:{step.form or '∅'}#{step.affix_id}"
            if step.new_pos:
                label += f"=>{step.new_pos}"
            if not step.allowed:
                label += " (no edge)"
            parts.append(label)
    return " -> ".join(parts)


def render_derivation(d: Derivation, indent: str = "  ") -> list[str]:
    lines = [f"{indent}underlying  {d.underlying}"]
    if d.skipped:
        lines.append(f"{indent}blocked     {', '.join(d.skipped)} (by the entry's flags)")
    if not d.steps:
        lines.append(f"{indent}(no rule changed anything)")
    width = max((len(s.rule) for s in d.steps), default=0)
    for s in d.steps:
        head = f"{indent}{s.rule.ljust(width)}  line {s.line:<4} "
        pad = " " * len(head)
        lines.append(f"{head}{s.before}")
        if s.before_marks.strip():
            lines.append(f"{pad}{s.before_marks}")
        lines.append(f"{pad}{s.after}")
        if s.after_marks.strip():
            lines.append(f"{pad}{s.after_marks}")
    lines.append(
        f"{indent}surface     {d.bounded}" if d.resolved else f"{indent}surface     (an archiphoneme is left: {d.output})"
    )
    return lines


def render_explanation(ex: Explanation, rules: bool = True) -> str:
    out: list[str] = []
    if not ex.analyses:
        out.append(f"{ex.word}: no analysis; run 'morphfst diagnose {ex.word}' to find out why")
        return "\n".join(out) + "\n"
    for n, a in enumerate(ex.analyses, start=1):
        out.append(f"{ex.word}  [{n}/{len(ex.analyses)}]  {a.analysis}  (weight {a.weight:.2f})")
        out.extend(render_columns(a.columns))
        if a.compound:
            out.append(f"  compound    {' + '.join(a.compound)} (lexicon words; the last one explained below)")
        if a.entry:
            flags = f", flags {','.join(a.entry['flags'])}" if a.entry["flags"] else ""
            out.append(
                f"  entry       {a.entry['lemma']} ({a.entry['class']}, {a.entry['pos']}{flags}) at {a.entry['file']}:{a.entry['line']}"
            )
        out.append(f"  path        {render_path(a.path)}")
        if a.detached:
            out.append("  (suffixes read without their word, after the hosts of the grammar's detached block)")
        elif a.derivation is None:
            out.append("  (no lexicon entry reproduces this surface; the analysis may be a guess)")
        elif rules:
            out.extend(render_derivation(a.derivation))
        out.append("")
    return "\n".join(out)

"""The metadata saved beside the transducers: plain JSON describing the compiled language.

It records what the runtime and the tools need without the grammar source: the symbol space,
feature inventory and UD mapping, classes, the slot graph with every affix, the rule list, the
lexicon entries, normalization, inline tests, layouts, and the source files with their hashes.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from ..language import model as m
from ..language.normalize import make_normalizer
from ..language.symbols import SymbolSpace
from ..version import FORMAT_VERSION, __version__
from .guessweights import NAME_POS
from .sourcehash import COMPILER_MODULES, compiler_digest, file_hash, sources_digest

__all__ = ["COMPILER_MODULES", "build_metadata", "compiler_digest", "file_hash", "sources_digest"]


def build_metadata(g: m.Grammar, space: SymbolSpace) -> dict[str, Any]:
    """Everything about a compiled language that is not a transducer."""
    return {
        "format": FORMAT_VERSION,
        "version": __version__,
        "name": g.name,
        "title": g.title,
        "grammar_path": str(Path(g.path).resolve()),
        "sources": [{"path": str(Path(p).resolve()), "sha256": file_hash(p)} for p in g.sources],
        "digest": sources_digest(g.sources),
        "space": space.to_json(),
        "dimensions": {d.name: d.values for d in g.dimensions.values()},
        "ud": g.ud,
        "classes": {
            c.name: {
                "next": c.next,
                "pos": c.pos_allowed,
                "apostrophe": c.apostrophe,
                "line": c.pos.line,
                "guess": expr_text(c.guess),
                "open": expr_text(c.open),
            }
            for c in g.classes.values()
        },
        "slots": {
            s.name: {
                "next": s.next,
                "enclitic": s.enclitic,
                "line": s.pos.line,
                "affixes": [
                    {
                        "id": a.ident,
                        "form": a.form,
                        "features": a.features,
                        "gloss": a.gloss,
                        "weight": a.weight,
                        "next": a.next,
                        "new_pos": a.new_pos,
                        "name": a.name,
                        "line": a.pos.line,
                    }
                    for a in s.affixes
                ],
            }
            for s in g.slots.values()
        },
        "constraints": [
            {"name": c.name, "left": c.left, "kind": c.kind, "right": c.right, "line": c.pos.line} for c in g.constraints
        ],
        "rules": [
            {"name": r.name, "text": r.text, "line": r.pos.line, "direction": r.direction, "optional": r.optional}
            for r in g.rules
        ],
        "flags": {f.name: {"marks": f.marks, "blocks": f.blocks, "description": f.description} for f in g.flags.values()},
        "compounds": [
            {
                "first": c.first,
                "forms": c.forms,
                "last": c.last,
                "parts": c.parts,
                "min": c.min_letters,
                "weight": c.weight,
                "agree": c.agree,
                "lastmin": c.last_min,
                "groups": c.groups,
                "order": c.order,
                "lastforms": c.last_forms,
                "lemmaform": c.lemma_form,
                "hide": c.hide,
                "strict": c.strict,
                "file": c.pos.file,
                "line": c.pos.line,
            }
            for c in g.compounds
        ],
        "normalization": {
            "maps": g.normalization.maps,
            "lowercase": g.normalization.lowercase,
            "apostrophes": g.normalization.apostrophes,
        },
        "tests": [{"kind": t.kind, "word": t.word, "expected": t.expected, "line": t.pos.line} for t in g.tests],
        "unmarked": g.unmarked,
        "implied": {label: line.labels for label, line in g.implied.items()},
        "detached": {"pos": g.detached.pos_label, "hosts": g.detached.hosts} if g.detached else None,
        "layouts": [
            {
                "pos": lay.pos_tag,
                "title": lay.title,
                "rows": lay.rows,
                "columns": lay.columns,
                "tables": lay.tables,
                "fixed": lay.fixed,
                "labels": lay.labels,
                "line": lay.pos.line,
            }
            for lay in g.layouts
        ],
        # the folded lemmas of the names and abbreviations the lexicon lists (its classes that write an
        # apostrophe), when an open class may read a name: the runtime drops an open reading of one
        "listed_names": listed_names(g),
        "lexicon": [
            {
                "lemma": e.lemma,
                "class": e.klass,
                "pos": e.pos_tag,
                "gloss": e.gloss,
                "weight": e.weight,
                "stem": e.stem,
                "flags": e.flags,
                "file": e.pos.file,
                "line": e.pos.line,
            }
            for e in g.lexicon
        ],
    }


def listed_names(g: m.Grammar) -> list[str]:
    """The lexicon's lemmas of classes with an apostrophe (names, abbreviations), folded as the
    analyzer reads a word; empty unless an open class has the part of speech PROPN."""
    if not any(c.open is not None and NAME_POS in c.pos_allowed for c in g.classes.values()):
        return []
    fold = make_normalizer(g.normalization)
    return sorted({fold(e.lemma) for e in g.lexicon if g.classes[e.klass].apostrophe})


def expr_text(e: m.Expr | None) -> str | None:
    """A pattern expression written back in the grammar's notation (``None`` for no pattern)."""
    if e is None:
        return None
    if isinstance(e, m.Sym):
        return e.name
    if isinstance(e, m.SetRef):
        return f"@{e.name}"
    if isinstance(e, m.Klass):
        return ("[^" if e.negated else "[") + " ".join(expr_text(i) or "" for i in e.items) + "]"
    if isinstance(e, m.Seq):
        return " ".join(expr_text(i) or "" for i in e.items)
    if isinstance(e, m.Alt):
        return "(" + " | ".join(expr_text(o) or "" for o in e.options) + ")"
    if isinstance(e, m.Repeat):
        inner = expr_text(e.item) or ""
        if isinstance(e.item, (m.Seq, m.Alt)) and not inner.startswith("("):
            inner = f"({inner})"
        return inner + ("*" if e.high is None else "?")
    if isinstance(e, m.Empty):
        return "∅"
    if isinstance(e, m.AnySym):
        return "."
    return str(e)

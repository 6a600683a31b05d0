"""From a grammar file to a validated language model (grammar plus its lexicons)."""

from __future__ import annotations

from pathlib import Path

from ..errors import Position, UserError
from ..language import model as m
from ..language.lexicon import read_lexicon
from ..language.normalize import make_normalizer
from ..language.syntax import parse_grammar_file
from ..language.validate import validate
from .compiler import Compiler
from .stemrules import derive_stems


def load_model(path: str | Path, extra_entries: list[m.LexEntry] | None = None) -> m.Grammar:
    """Parse ``path``, validate it, and read and validate its lexicon files."""
    grammar = parse_grammar_file(path)
    validate(grammar)
    if any(c.apostrophe for c in grammar.classes.values()) and "'" not in grammar.letters:
        klass = next(c for c in grammar.classes.values() if c.apostrophe)
        raise UserError(
            f"class {klass.name} writes an apostrophe, but ' is not a letter",
            klass.pos,
            hint="add ' to the alphabet's letters line",
        )
    fold = make_normalizer(grammar.normalization)
    grammar.lexicon = read_lexicon(grammar, fold)
    if extra_entries:
        grammar.lexicon.extend(extra_entries)
    derive_stems(grammar, grammar.lexicon, make=Compiler)
    if not grammar.lexicon:
        raise UserError("the lexicon is empty", Position(grammar.path), hint="add a lexicon line naming a TSV file or directory")
    return grammar

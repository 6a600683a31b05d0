"""The harvest's output: a lexicon file with evidence columns, written whole or not at all.

The first columns are the lexicon's own (``lemma class pos gloss stem flags``), so an accepted line can
be copied into ``lexicons/<lang>/`` unchanged; the evidence columns after them (``score``,
``attested``, ``tokens``, ``examples``, ``runner_up``) are declared in :mod:`morphfst.language.lexicon` and
ignored by the lexicon reader, so a reviewed file can also be placed there as it is.
"""

from __future__ import annotations

import sys
from typing import TextIO

from ..corpus.outputs import atomic_text
from ..language.lexicon import EVIDENCE
from .extract import HarvestResult, Proposal

LEXICON_COLUMNS = ("lemma", "class", "pos", "gloss", "stem", "flags")
HEADER = LEXICON_COLUMNS + EVIDENCE


def _field(text: str) -> str:
    return text.replace("\t", " ").replace("\n", " ").replace("\r", " ")


def proposal_row(p: Proposal, gloss: str = "?") -> list[str]:
    examples = ", ".join(f"{form} ({analysis})" for form, analysis in p.examples())
    return [
        p.lemma,
        p.klass,
        p.pos,
        gloss,
        "",
        ",".join(p.flags),
        f"{p.score:.2f}",
        str(len(p.forms)),
        str(p.tokens),
        examples,
        p.runner_up,
    ]


def write_rows(result: HarvestResult, out: TextIO, gloss: str = "?", comment: str = "") -> None:
    if comment:
        for line in comment.splitlines():
            out.write(f"# {line}\n")
    out.write("\t".join(HEADER) + "\n")
    for p in result.proposals:
        out.write("\t".join(_field(x) for x in proposal_row(p, gloss)) + "\n")


def write_tsv(result: HarvestResult, path: str, gloss: str = "?", comment: str = "") -> None:
    """Write the proposals to ``path`` (``-``: standard output), renamed into place when complete."""
    if path == "-":
        write_rows(result, sys.stdout, gloss, comment)
        return
    with atomic_text(path) as out:
        write_rows(result, out, gloss, comment)

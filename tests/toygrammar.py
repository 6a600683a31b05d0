"""A tiny grammar written by the tests, for checks that need a grammar of their own."""

from __future__ import annotations

from pathlib import Path

TOY_GRAMMAR = """\
language toy "Toy language for tests"
lexicon "toy.tsv"

alphabet {
  letters a e i o u k l m n p r s t
  archiphonemes A
}

sets {
  vowel = a e i o u
  back  = a o u
  front = e i
  cons  = k l m n p r s t
}

features {
  pos: N
  Number: SG PL
  Case: NOM LOC
}

classes {
  noun pos N -> number
}

slot number -> case {
  ""     SG
  "lAr"  PL
}

slot case {
  ""     NOM
  "nA"   LOC
}

rules {
  rule front : A -> e / @front @cons* + ? @cons* _
  rule back  : A -> a
}

tests {
  kalar => ka N;PL;NOM
}
"""

TOY_LEXICON = "lemma\tclass\tpos\tgloss\nka\tnoun\tN\thouse\nte\tnoun\tN\ttree\n"


def write_toy(directory: Path, grammar: str = TOY_GRAMMAR, lexicon: str = TOY_LEXICON) -> Path:
    """Write the toy grammar and lexicon into ``directory``; returns the grammar path."""
    directory.mkdir(parents=True, exist_ok=True)
    (directory / "toy.tsv").write_text(lexicon, encoding="utf-8")
    path = directory / "toy.mfg"
    path.write_text(grammar, encoding="utf-8")
    return path

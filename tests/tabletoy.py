"""A small invented grammar for the table and export tests: nouns with a derivation cycle, verbs with
person and number, a particle with a cycle that keeps its part of speech, and an optional weighted
rule that gives some cells a second, less preferred form. No layout is declared, so the derived
default layout is what the tests see."""

from __future__ import annotations

from pathlib import Path

TABLE_TOY = """\
language tabletoy "Invented language for the table tests"
lexicon "tabletoy.tsv"

alphabet {
  letters a e i o u k l m n p r s t
  archiphonemes A
}

sets {
  vowel = a e i o u
  front = e i
  cons  = k l m n p r s t
}

features {
  pos: N V PART
  Number: SG PL
  Case: NOM LOC
  Person: 1 2 3
  Tense: PRS PST
  Derivation: DIM
  Emphasis: EMPH
  VerbForm: NFIN
}

classes {
  noun pos N -> deriv number
  verb pos V -> tense infinitive
  part pos PART -> clitic end
}

slot deriv {
  "si"   DIM pos N gloss DIM -> deriv number
}

slot number -> case {
  ""     SG
  "lAr"  PL
}

slot case {
  ""     NOM
  "nA"   LOC
}

slot tense -> person {
  ""     PRS
  "t"    PST
}

slot person {
  "m"    1 SG gloss 1SG
  "s"    2 SG gloss 2SG
  ""     3 SG gloss 3SG
  "mo"   1 PL gloss 1PL
  "so"   2 PL gloss 2PL
  "no"   3 PL gloss 3PL
}

slot infinitive {
  "ta"   NFIN
}

slot clitic {
  "ko"   EMPH gloss EMPH -> clitic end
}

rules {
  rule liquid_variant optional weight 0.7 : l -> r / + _
  rule front : A -> e / @front @cons* + ? @cons* _
  rule back  : A -> a
}
"""

TABLE_TOY_LEXICON = "lemma\tclass\tpos\tgloss\nka\tnoun\tN\thouse\nte\tnoun\tN\ttree\nsama\tverb\tV\tgo\nno\tpart\tPART\tindeed\n"


def write_table_toy(directory: Path, grammar: str = TABLE_TOY, lexicon: str = TABLE_TOY_LEXICON) -> Path:
    directory.mkdir(parents=True, exist_ok=True)
    (directory / "tabletoy.tsv").write_text(lexicon, encoding="utf-8")
    path = directory / "tabletoy.mfg"
    path.write_text(grammar, encoding="utf-8")
    return path

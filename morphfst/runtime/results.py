"""Plain result objects returned by the runtime API (analyses, morphs, forms, segmentations).

Glosses follow the Leipzig Glossing Rules (morphs separated by hyphens, grammatical labels in
capitals); feature labels are UniMorph labels; ``ud_feats`` renders Universal Dependencies v2 FEATS.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field
from typing import Any


@dataclass(frozen=True, slots=True)
class Morph:
    """One morph of a word: its surface form, gloss and features."""

    form: str
    gloss: str
    features: tuple[str, ...]
    kind: str  # "stem" or "affix"
    underlying: str
    slot: str | None = None
    affix_id: int | None = None
    new_pos: str | None = None


@dataclass(frozen=True, slots=True)
class Analysis:
    """One analysis of a word: lemma, part of speech, ordered features, morphs and weight."""

    word: str
    lemma: str
    pos: str
    features: tuple[str, ...]
    morphs: tuple[Morph, ...]
    weight: float
    ud: dict[str, str] = field(default_factory=dict, compare=False, repr=False)
    guessed: bool = False  # True when the stem was guessed (not in the lexicon); see Language.guess

    @property
    def tags(self) -> tuple[str, ...]:
        """Part of speech followed by the features, as in the analysis text."""
        return (self.pos, *self.features)

    @property
    def has_stem(self) -> bool:
        """Whether the first morph is a stem (not so for suffixes read without their word:
        :mod:`morphfst.runtime.detached`)."""
        return bool(self.morphs) and self.morphs[0].kind == "stem"

    @property
    def affixes(self) -> tuple[Morph, ...]:
        """The morphs after the first stem (every morph when there is none)."""
        return self.morphs[1:] if self.has_stem else self.morphs

    @property
    def text(self) -> str:
        """The analysis as ``lemma POS;FEAT;...`` (UniMorph labels in slot order)."""
        return f"{self.lemma} {';'.join(self.tags)}"

    @property
    def final_pos(self) -> str:
        """The part of speech after the last derivation."""
        pos = self.pos
        for morph in self.morphs:
            if morph.new_pos:
                pos = morph.new_pos
        return pos

    @property
    def segmentation(self) -> str:
        """Surface morphs joined with hyphens; zero morphs are left out."""
        return "-".join(m.form for m in self.morphs if m.form)

    @property
    def gloss(self) -> str:
        """Leipzig gloss aligned with :attr:`segmentation`; zero morphs join the previous gloss with a dot."""
        parts: list[str] = []
        for m in self.morphs:
            if m.form or not parts:
                parts.append(m.gloss)
            elif m.gloss and m.gloss != "∅":
                parts[-1] = f"{parts[-1]}.{m.gloss}"
        return "-".join(parts)

    def ud_feats(self) -> str:
        """Universal Dependencies FEATS (sorted, ``_`` when empty) from the grammar's UD mapping."""
        pairs: dict[str, str] = {}
        for label in self.features:
            mapped = self.ud.get(label, "")
            for item in mapped.split("|"):
                if "=" in item:
                    key, value = item.split("=", 1)
                    pairs[key] = value
        if not pairs:
            return "_"
        return "|".join(f"{k}={pairs[k]}" for k in sorted(pairs, key=str.lower))

    def upos(self) -> str:
        """The UD part of speech of the final part of speech (``X`` when unmapped)."""
        mapped = self.ud.get(self.final_pos, "")
        return mapped if mapped and "=" not in mapped else "X"

    def to_dict(self) -> dict[str, Any]:
        return {
            "word": self.word,
            "lemma": self.lemma,
            "pos": self.pos,
            "features": list(self.features),
            "analysis": self.text,
            "segmentation": self.segmentation,
            "gloss": self.gloss,
            "weight": round(self.weight, 6),
            "morphs": [asdict(m) | {"features": list(m.features)} for m in self.morphs],
        } | ({"guessed": True} if self.guessed else {})


@dataclass(frozen=True)
class Form:
    """A generated surface form with its weight."""

    form: str
    weight: float
    analysis: str
    guessed: bool = False  # True when generated from a guessed stem (see Language.generate_guessed)

    def to_dict(self) -> dict[str, Any]:
        found = {"form": self.form, "weight": round(self.weight, 6), "analysis": self.analysis}
        return found | {"guessed": True} if self.guessed else found


@dataclass(frozen=True)
class Segmentation:
    """One way of splitting a word into surface morphs, with the analyses that share it."""

    word: str
    morphs: tuple[str, ...]
    weight: float
    analyses: tuple[Analysis, ...]

    @property
    def text(self) -> str:
        return "-".join(m for m in self.morphs if m)

    @property
    def gloss(self) -> str:
        return self.analyses[0].gloss if self.analyses else ""

    def to_dict(self) -> dict[str, Any]:
        return {
            "word": self.word,
            "morphs": [m for m in self.morphs if m],
            "segmentation": self.text,
            "gloss": self.gloss,
            "weight": round(self.weight, 6),
            "analyses": [a.text for a in self.analyses],
        }

"""The symbol space: every symbol of every tape is one Unicode code point.

Single-character letters keep their own code point, so an input word is already a string of labels.
Multi-character symbols (boundaries, markers, optional segments, feature labels, parts of speech,
affix identifiers) get code points from the Supplementary Private Use Areas. A string of symbols is
therefore a plain Python ``str`` and compiles to an FST with pynini's ``utf8`` token type.
"""

from __future__ import annotations

from dataclasses import dataclass, field

GUESS_SYMBOL = "mark:guess"  # the marker of a guessed analysis (kind "guess"), right after the part of speech
COMPOUND_SEAM = "seam"  # the seam between compound parts (kind "boundary"), on both tapes of the bounded machine
PRIVATE_START = 0xF0000
PRIVATE_END = 0x10FFFD


def is_private(ch: str) -> bool:
    """True for a code point in the range used for multi-character symbols."""
    return ord(ch) >= PRIVATE_START


@dataclass
class SymbolSpace:
    """Two-way map between symbol names and their one-character codes."""

    to_char: dict[str, str] = field(default_factory=dict)
    to_name: dict[str, str] = field(default_factory=dict)
    kinds: dict[str, str] = field(default_factory=dict)  # code -> kind (letter, feature, pos, affix, ...)
    _next: int = PRIVATE_START

    def add(self, name: str, kind: str, single_char_ok: bool = True) -> str:
        """Register ``name`` (idempotent) and return its one-character code."""
        if name in self.to_char:
            return self.to_char[name]
        if single_char_ok and len(name) == 1 and not is_private(name):
            code = name
        else:
            if self._next > PRIVATE_END:
                raise ValueError("too many multi-character symbols")
            if self._next == 0x10000 + 0xFFFE:  # skip noncharacters
                self._next += 2
            code = chr(self._next)
            self._next += 1
        self.to_char[name] = code
        self.to_name[code] = name
        self.kinds[code] = kind
        return code

    def code(self, name: str) -> str:
        return self.to_char[name]

    def encode(self, names: list[str]) -> str:
        """Symbols to a string of codes."""
        return "".join(self.to_char[n] for n in names)

    def name(self, code: str) -> str:
        return self.to_name.get(code, code)

    def decode(self, codes: str) -> list[str]:
        """A string of codes to symbol names (unknown single characters stand for themselves)."""
        return [self.to_name.get(c, c) for c in codes]

    def kind(self, code: str) -> str:
        return self.kinds.get(code, "char")

    def to_json(self) -> dict[str, object]:
        return {"symbols": [[n, ord(c), self.kinds[c]] for n, c in self.to_char.items()], "next": self._next}

    @classmethod
    def from_json(cls, data: dict[str, object]) -> SymbolSpace:
        space = cls()
        for name, code, kind in data["symbols"]:  # type: ignore[attr-defined]
            ch = chr(code)
            space.to_char[name] = ch
            space.to_name[ch] = name
            space.kinds[ch] = kind
        space._next = int(data["next"])  # type: ignore[call-overload]
        return space

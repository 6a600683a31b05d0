"""User-facing errors: one clear message with file, line, column, the offending line and a hint.

Every mistake a user can make (bad grammar, bad lexicon line, bad option, unreadable file) is raised
as a :class:`UserError`; the CLI prints :meth:`UserError.render` and exits with code 2.
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

EXIT_USER_ERROR = 2


@dataclass(frozen=True)
class Position:
    """A place in a source file (1-based line and column)."""

    file: str
    line: int = 0
    column: int = 0

    def __str__(self) -> str:
        if self.line and self.column:
            return f"{self.file}:{self.line}:{self.column}"
        if self.line:
            return f"{self.file}:{self.line}"
        return self.file


class UserError(Exception):
    """A mistake in the user's input, reported without a traceback."""

    def __init__(
        self,
        message: str,
        position: Position | None = None,
        hint: str | None = None,
        source_line: str | None = None,
    ) -> None:
        super().__init__(message)
        self.message = message
        self.position = position
        self.hint = hint
        self.source_line = source_line

    def render(self) -> str:
        """The message as printed by the CLI: location, message, source line with caret, hint."""
        head = f"{self.position}: error: {self.message}" if self.position else f"error: {self.message}"
        lines = [head]
        src = self.source_line
        if src is None and self.position and self.position.line:
            src = _read_line(self.position.file, self.position.line)
        if src is not None:
            lines.append(f"  {src.rstrip()}")
            if self.position and self.position.column:
                lines.append("  " + _caret_pad(src, self.position.column) + "^")
        if self.hint:
            lines.append(f"hint: {self.hint}")
        return "\n".join(lines)

    def __str__(self) -> str:
        return self.render()


def _caret_pad(src: str, column: int) -> str:
    """Spaces (keeping tabs) up to the 1-based column, so the caret sits under the offending character."""
    return "".join("\t" if ch == "\t" else " " for ch in src[: max(column - 1, 0)])


def _read_line(file: str, line: int) -> str | None:
    try:
        with Path(file).open(encoding="utf-8", errors="replace") as handle:
            for number, text in enumerate(handle, start=1):
                if number == line:
                    return text.rstrip("\n")
    except OSError:
        return None
    return None

from collections.abc import Sequence
from typing import Any

class Walker:
    sorted: bool
    def __init__(
        self,
        first: Sequence[Any],
        ilabel: Sequence[Any],
        olabel: Sequence[Any],
        weight: Sequence[Any],
        next: Sequence[Any],
        final: Sequence[Any],
        start: int,
        skip: str,
        future: bool = False,
    ) -> None: ...
    def paths(self, word: str, max_paths: int, limit: int = -1) -> list[tuple[str, str, float]] | None: ...
    def accepts(self, word: str) -> bool | None: ...

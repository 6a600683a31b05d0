"""A tqdm progress bar on standard error: bytes (with the time left when the size is known) and tokens.

Quiet when standard error is not a terminal, or when the user asks for it.
"""

from __future__ import annotations

import sys
import time
from functools import cache
from typing import Any, TextIO


class Progress:
    """Bytes and tokens processed so far, shown as one tqdm bar."""

    def __init__(
        self, total_bytes: int | None, quiet: bool = False, desc: str = "segmenting", stream: TextIO | None = None
    ) -> None:
        self.stream = stream or sys.stderr
        self.enabled = not quiet and _is_terminal(self.stream)
        self.tokens = 0
        self.bytes = 0
        self.start = time.perf_counter()
        self.bar: Any = None
        if self.enabled:
            self.bar = _bar_class()(
                total=total_bytes or None,
                unit="B",
                unit_scale=True,
                unit_divisor=1024,
                desc=desc,
                file=self.stream,
                dynamic_ncols=True,
                smoothing=0.1,
            )

    def update(self, nbytes: int, ntokens: int) -> None:
        self.bytes += nbytes
        self.tokens += ntokens
        if self.bar is not None:
            self.bar.update(nbytes)
            elapsed = max(time.perf_counter() - self.start, 1e-9)
            self.bar.set_postfix_str(f"{self.tokens:,} tokens, {self.tokens / elapsed:,.0f} tokens/s", refresh=False)

    def close(self) -> None:
        if self.bar is not None:
            self.bar.close()
            self.bar = None

    @property
    def elapsed(self) -> float:
        return time.perf_counter() - self.start


@cache
def _bar_class() -> Any:
    """tqdm without its monitor thread: worker processes are forked only while the main process runs
    no other thread (see :func:`morphfst.corpus.local.start_method`); every update refreshes the bar.
    Made once, on the first bar shown, so that tqdm is imported only then."""
    from tqdm import tqdm

    class Bar(tqdm):  # type: ignore[type-arg,misc]
        monitor_interval = 0

    return Bar


def _is_terminal(stream: TextIO) -> bool:
    try:
        return bool(stream.isatty())
    except (AttributeError, ValueError):
        return False

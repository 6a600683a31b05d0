"""Processors that fail on purpose, for the corpus tests (importable by spawned worker processes)."""

from __future__ import annotations

import os
import signal

from morphfst.corpus.reading import Chunk
from morphfst.corpus.records import ChunkProcessor, ChunkResult, Prepared


class FailingProcessor(ChunkProcessor):
    """Raises an error on the third chunk, as a bug in the middle of a run would."""

    def process(self, chunk: Chunk, prepared: Prepared | None = None) -> ChunkResult:
        if chunk.index == 2:
            raise RuntimeError("simulated failure in the middle of the run")
        return super().process(chunk, prepared)


class DyingProcessor(ChunkProcessor):
    """Kills its own process on the third chunk, as the system does to a worker out of memory."""

    def process(self, chunk: Chunk, prepared: Prepared | None = None) -> ChunkResult:
        if chunk.index == 2:
            os.kill(os.getpid(), signal.SIGKILL)
        return super().process(chunk, prepared)

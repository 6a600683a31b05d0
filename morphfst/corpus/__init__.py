"""Corpus-scale segmentation for indexing: streaming, worker processes, a Dask engine, coverage reports.

``run_corpus`` is what ``morphfst corpus`` calls::

    import morphfst
    from morphfst.corpus import Options, run_corpus
    tur = morphfst.load("tur")
    run = run_corpus(tur, ["news.txt"], "news.terms.txt", Options(mode="terms", term="lemma"), jobs=2)
    print(run.coverage.summary())

Modules: ``reading`` (binary chunks of whole lines), ``records`` (tokenize, per-type cache, output
modes), ``local`` (worker processes, ordered results), ``cluster`` and ``dask_worker`` (Dask),
``coverage`` (the report), ``outputs`` (atomic files), ``sources`` (inputs, output names, manifest).
"""

from __future__ import annotations

import time
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from ..runtime.compiled_language import Language
from ..version import __version__
from .coverage import Coverage
from .local import WorkerFailure, run_local
from .outputs import open_sink
from .progress import Progress
from .records import MODES, TERMS, ChunkProcessor, Options
from .sources import Source, expand_inputs, output_is_directory, output_path, write_manifest

__all__ = ["MODES", "TERMS", "ChunkProcessor", "Coverage", "Options", "RunResult", "WorkerFailure", "run_corpus"]


@dataclass
class RunResult:
    """What a run produced: the coverage, the output files (in input order) and the wall time."""

    coverage: Coverage
    outputs: list[str] = field(default_factory=list)
    seconds: float = 0.0
    manifest: str | None = None

    @property
    def tokens_per_second(self) -> float:
        return self.coverage.tokens / self.seconds if self.seconds else 0.0


def run_corpus(
    lang: Language,
    inputs: list[str],
    output: str | None,
    options: Options,
    jobs: int = 1,
    dask: str | None | bool = False,
    partition_bytes: int | None = None,
    quiet: bool = True,
    processor_class: type[ChunkProcessor] = ChunkProcessor,
) -> RunResult:
    """Segment every input into index-ready output (see :mod:`morphfst.corpus`).

    ``dask``: ``False`` for this machine only; ``None`` or ``True`` for a local Dask cluster started
    here; a scheduler address (``tcp://host:8786``) for an existing cluster.
    """
    sources = expand_inputs(inputs)
    cluster = dask is not False
    directory = output_is_directory(output, sources, cluster)
    if cluster and not output:
        from ..errors import UserError

        raise UserError("the Dask engine writes an output directory", hint="give one with -o DIR")
    start = time.perf_counter()
    total_bytes = sum(s.size for s in sources if s.size is not None) if all(s.size is not None for s in sources) else None
    progress = Progress(total_bytes, quiet=quiet)
    outputs: list[str] = []
    entries: list[dict[str, Any]] = []
    try:
        if cluster:
            from .cluster import run_dask

            address = dask if isinstance(dask, str) and dask not in ("", "local") else None
            assert output is not None
            Path(output).mkdir(parents=True, exist_ok=True)
            coverage, entries = run_dask(lang, sources, output, options, address, max(jobs, 1), partition_bytes, progress)
            outputs = [str(Path(output) / e["output"]) for e in entries]
        else:

            def make_sink(source: Source) -> Any:
                if directory:
                    assert output is not None
                    return open_sink(output_path(output, source, options.suffix))
                return open_sink(output)

            def on_done(source: Source, path: Path, cov: Coverage) -> None:
                outputs.append(str(path))
                entries.append(
                    {"input": source.path, "output": path.name, "first_line": 1, "lines": cov.lines, "tokens": cov.tokens}
                )

            coverage = run_local(lang, sources, make_sink, options, jobs, progress, processor_class, on_done)
    finally:
        progress.close()
    seconds = time.perf_counter() - start
    result = RunResult(coverage, outputs, seconds)
    if directory:
        assert output is not None
        info = {
            "tool": f"morphfst {__version__}",
            "language": lang.name,
            "grammar_digest": lang.meta.get("digest", ""),
            "mode": options.mode,
            "term": options.term,
            "lines": coverage.lines,
            "tokens": coverage.tokens,
        }
        result.manifest = str(write_manifest(output, entries, info))
    return result

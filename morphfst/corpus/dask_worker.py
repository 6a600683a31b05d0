"""What runs on Dask workers (imported only when the Dask engine is used; needs dask.distributed).

The compiled grammar travels once per worker, inside a worker plugin: its bytes are written to the
worker's local directory and loaded there when the plugin is registered, and the worker keeps one
:class:`~morphfst.corpus.records.ChunkProcessor` (so its per-type cache serves every partition the
worker processes). The tasks: :func:`count_line_starts` (line numbers), :func:`survey_partition` (the
word types of a partition), :func:`answer_types` (the owner of some word types analyzes them) and
:func:`process_partition` (a partition's output, its types found in the owners' answers).
"""

from __future__ import annotations

import hashlib
import pickle
import threading
from collections.abc import Iterator
from pathlib import Path
from typing import Any

from distributed import get_worker
from distributed.diagnostics.plugin import WorkerPlugin

from ..atomic import write_bytes_atomic
from ..runtime.compiled_language import Language
from .coverage import Coverage
from .local import owner
from .outputs import AtomicFile
from .reading import Chunk, chunks, read_blocks
from .records import ChunkProcessor, Options, Tally

PLUGIN_NAME = "morphfst-grammar"
KEPT_BATCHES = 2  # batches whose owners' answers a worker keeps
KEPT_GRAMMARS = 2  # compiled grammars a worker keeps loaded between runs (by their bytes' digest)
# digest of a compiled file's bytes -> the language loaded from it, on this worker (see GrammarPlugin.setup)
_loaded: dict[str, Language] = {}
Answers = dict[str, tuple[Any, tuple[str, int, int]]]  # word type -> (formatted output, type information)


class GrammarPlugin(WorkerPlugin):
    """Holds the compiled grammar (the bytes of a .mfc file, identified by their SHA-256 digest) and,
    on each worker, the loaded language. ``data`` may be ``None`` when every worker already holds the
    grammar (a cluster kept running between runs) or reads the same bytes at ``path`` (a shared file
    system, a local cluster): see :func:`grammar_reachable`; the 15 MB of a compiled grammar then do
    not travel."""

    name = PLUGIN_NAME

    def __init__(self, data: bytes | None, filename: str, options: Options, digest: str, path: str = "") -> None:
        self.data = data
        self.path = path
        self.filename = filename
        self.options = options
        self.digest = digest
        self.processor: ChunkProcessor | None = None
        self.answers: dict[int, Answers] = {}  # batch -> its owners' answers (the last two batches)
        self.lock = threading.Lock()
        self.counted: list[int] = []  # partitions whose figures this worker holds, not yet sent
        self.held = Tally()  # figures flushed meanwhile (the cache turned over), not yet sent

    def __getstate__(self) -> dict[str, Any]:
        state = dict(self.__dict__)
        state.pop("lock", None)  # a lock does not travel; each worker makes its own
        return state

    def __setstate__(self, state: dict[str, Any]) -> None:
        self.__dict__.update(state)
        self.lock = threading.Lock()

    def hold(self, index: int, rotated: list[Tally], last: bool = False) -> tuple[Tally | None, list[int]]:
        """Keep the figures of partition ``index`` (and ``rotated``, flushed while it was processed);
        release them all (:meth:`release`) with one of the run's ``last`` partitions or past a cache
        generation of types, else ``(None, [])``."""
        for tally in rotated:
            self.held.merge(tally)
        self.counted.append(index)
        processor = self.processor
        assert processor is not None
        if last or len(self.held.types) + len(processor.counts) > processor.options.cache_size:
            return self.release()
        return None, []

    def release(self) -> tuple[Tally, list[int]]:
        """Every figure held (the processor's counts flushed) and the partitions they cover; then none."""
        tally, covers = self.held, self.counted
        if self.processor is not None:
            tally.merge(self.processor.flush())
        self.held, self.counted = Tally(), []
        return tally, covers

    def spoil(self) -> None:
        """A partition failed half-way: its counts are mixed with the others', so nothing held is sent
        (the client counts the partitions left uncovered again)."""
        self.held, self.counted = Tally(), []
        if self.processor is not None:
            self.processor.flush()

    def setup(self, worker: Any) -> None:
        """Load the grammar on this worker, or take the language a run before loaded from the same
        bytes (a cluster kept running between runs loads each grammar once). The processor, and so
        the cache of word types, is new for every run: a run's figures count its own analyses."""
        self.processor = ChunkProcessor(self._language(worker), self.options)

    def _language(self, worker: Any) -> Language:
        from .sources import load_compiled

        if grammar_reachable(self.digest, self.path):  # held, or read now from the client's path
            return _loaded[self.digest]
        if self.data is None:  # a worker that joined after the client looked, on another file system
            raise RuntimeError(
                f"this worker does not hold the grammar {self.filename} and it was not sent: run the command again"
            )
        directory = Path(getattr(worker, "local_directory", None) or ".")
        path = directory / f"morphfst-{self.digest[:16]}-{self.filename}"
        if not path.exists() or path.stat().st_size != len(self.data):
            write_bytes_atomic(path, self.data)  # the name holds the digest: a whole file is the right one
        return _keep(self.digest, load_compiled(str(path)))


def _keep(digest: str, lang: Language) -> Language:
    """Keep ``lang`` loaded on this worker under the digest of its compiled bytes (the last few)."""
    _loaded[digest] = lang
    while len(_loaded) > KEPT_GRAMMARS:
        del _loaded[next(iter(_loaded))]
    return lang


def grammar_reachable(digest: str, path: str) -> bool:
    """Whether this worker holds the grammar whose compiled bytes have ``digest``, or reads those
    very bytes at ``path`` (then it loads them now, once: the plugin's setup finds them loaded). Run
    on every worker by the client before it registers the plugin."""
    if digest in _loaded:
        return True
    if not path:
        return False
    try:
        with open(path, "rb") as handle:
            if hashlib.file_digest(handle, "sha256").hexdigest() != digest:
                return False
    except OSError:
        return False
    from .sources import load_compiled

    try:
        _keep(digest, load_compiled(path))
    except Exception:  # the same bytes the client loaded, so not expected: they are sent, and the setup says why
        return False
    return True


def _plugin() -> GrammarPlugin:
    plugin = get_worker().plugins[PLUGIN_NAME]
    if not isinstance(getattr(plugin, "processor", None), ChunkProcessor):
        raise RuntimeError("the morphfst grammar plugin is not set up on this worker")
    return plugin  # type: ignore[return-value]


def _processor() -> ChunkProcessor:
    return _plugin().processor  # type: ignore[return-value]


def _partition_chunks(spec: dict[str, Any], options: Options) -> Iterator[Chunk]:
    """The chunks of the lines that start in a partition's byte range, numbered from its first line."""
    with open(spec["path"], "rb") as handle:
        blocks = read_blocks(handle, spec["start"], spec["stop"], block=options.chunk_bytes)
        yield from chunks(blocks, spec.get("first_line", 1), options.chunk_bytes, options.max_line_bytes)


def survey_partition(spec: dict[str, Any], owners: int) -> list[str]:
    """The distinct word types of one partition (every one, cached on this worker or not), shared
    out by owner (:func:`~morphfst.corpus.local.owner`): one string per owner, a type per line (Dask
    sends one string about ten times faster than a list of tens of thousands of strings)."""
    processor = _processor()
    seen = processor.types_of(_partition_chunks(spec, processor.options))
    buckets: list[list[str]] = [[] for _ in range(max(owners, 1))]
    for token in seen:
        buckets[owner(token, len(buckets))].append(token)
    return ["\n".join(bucket) for bucket in buckets]  # a word type never holds a line end


def answer_types(me: int, *surveys: list[str]) -> tuple[bytes, int]:
    """The output and type information of the word types owner ``me`` has in the partitions'
    ``surveys`` (:func:`survey_partition` results; each type analyzed here unless cached), pickled
    (:data:`Answers`; one bytes object travels between workers far faster than a dict of tens of
    thousands of entries), and how many were analyzed."""
    processor = _processor()
    tokens: dict[str, None] = {}
    for survey in surveys:
        if survey[me]:
            tokens.update(dict.fromkeys(survey[me].split("\n")))
    with _plugin().lock:  # a worker with several threads may be writing a partition meanwhile
        before = processor.misses
        found: Answers = {token: processor.lookup(token) for token in tokens}
        analyzed = processor.misses - before
        processor.misses = before  # counted by the caller, so that no partition's tally counts them again
    return pickle.dumps(found, protocol=pickle.HIGHEST_PROTOCOL), analyzed


def count_line_starts(path: str, start: int, stop: int, block: int = 1 << 22) -> int:
    """Lines that start in ``[start, stop)`` of a file (a line starts at 0 and after each newline)."""
    n = 1 if start == 0 and stop > 0 else 0
    lo = max(start - 1, 0)
    hi = stop - 1
    with open(path, "rb") as handle:
        handle.seek(lo)
        remaining = hi - lo
        while remaining > 0:
            data = handle.read(min(block, remaining))
            if not data:
                break
            n += data.count(b"\n")
            remaining -= len(data)
    return n


def analyzed_count(answered: tuple[bytes, int]) -> int:
    """The number of types an :func:`answer_types` task analyzed (run where its result is)."""
    return answered[1]


def process_partition(spec: dict[str, Any], answers: list[tuple[bytes, int]] | None = None) -> dict[str, Any]:
    """Process the lines that start in one byte range of a file into one output file (atomic). The
    owners' ``answers`` for the partition's batch are what the processor consults before analyzing
    a type it has not cached (unpickled once per batch and kept until the next one: not poured into
    the cache, whose bounded generations would drop a large batch's types before they are used).

    The partition's per-type figures stay on this worker, added to those of the partitions it
    processed before (:meth:`GrammarPlugin.hold`): they travel with a partition's result only when
    the worker holds more than a cache generation of types or the partition is one of the run's last
    (most often the last one of its worker: the figures then come back while the other workers
    finish), else at the end of the run (:func:`collect_tallies`). Sending a table of every type with every partition, and adding the
    tables up in the client, took a tenth of a Dask run; each table says which partitions it covers,
    so the client can check that every partition is counted exactly once."""
    plugin = _plugin()
    with plugin.lock:  # one partition at a time per worker: the processor and its counts are not thread-safe
        processor = _processor()
        batch = int(spec.get("batch", -1))
        if answers:
            if batch not in plugin.answers:
                known: Answers = {}
                for data, _ in answers:
                    known.update(pickle.loads(data))
                plugin.answers[batch] = known
                while len(plugin.answers) > KEPT_BATCHES:  # the next batch's partitions may start first
                    del plugin.answers[min(plugin.answers)]
            processor.known = plugin.answers.get(batch, {})
        options = processor.options
        processor.doc = spec["doc"]
        coverage = Coverage(files=[spec["path"]])
        rotated: list[Tally] = []  # figures flushed when the cache turned over (with earlier partitions' counts)
        sink = AtomicFile(spec["output"])
        try:
            for chunk in _partition_chunks(spec, options):
                result = processor.process(chunk)
                sink.write(result.data)
                if result.tally is not None:
                    rotated.append(result.tally)
                    result.tally = None
                coverage.add(result)
            sink.commit()
        except BaseException:
            sink.abort()
            plugin.spoil()
            raise
        tally, covers = plugin.hold(spec["index"], rotated, bool(spec.get("last")))
    return {
        "index": spec["index"],
        "output": spec["output"],
        "coverage": coverage,
        "tally": tally,
        "covers": covers,
        "bytes": spec["stop"] - spec["start"],
    }


def collect_tallies(dask_worker: Any) -> tuple[Tally, list[int]]:
    """The per-type figures this worker still holds and the partitions they cover (run on every
    worker by the client once every partition is written: ``client.run`` passes the worker)."""
    plugin = dask_worker.plugins.get(PLUGIN_NAME)
    if not isinstance(plugin, GrammarPlugin) or plugin.processor is None:
        return Tally(), []
    with plugin.lock:
        return plugin.release()


def recount_partition(spec: dict[str, Any]) -> Tally:
    """The per-type figures of one partition, counted again by a processor of its own (for a partition
    whose figures were lost with the worker that held them; its types are analyzed again)."""
    plugin = _plugin()
    processor = ChunkProcessor(_processor().lang, plugin.options)
    total = Tally()
    with plugin.lock:  # the language's analyzer is shared
        for chunk in _partition_chunks(spec, processor.options):
            result = processor.process(chunk)
            if result.tally is not None:
                total.merge(result.tally)
        total.merge(processor.flush())
    return total

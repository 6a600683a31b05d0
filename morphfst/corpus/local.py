"""The engine on one machine: the main process reads chunks, worker processes analyze them, results
are written back in input order.

With one job everything runs in the main process. With N jobs, N worker processes are started:
forked on Linux while the main process runs no other thread (they share its loaded language and
start at once), else spawned (a fresh interpreter that loads the compiled file; no lock or thread of
the main process is copied, and a fork with threads running could copy a held lock); chunk i goes
to worker ``i mod N`` and results are collected in the same round-robin order, so reassembly is
ordered by construction. Each word type is analyzed by one worker only, its owner by hash, which
answers the others' questions (type-affine dispatch, :func:`_shared_loop`): N workers do the work
of one, not N times the analysis of the frequent types. At most ``window`` chunks are in flight, so memory stays constant whatever
the input size. Results come back over one pipe per worker whose write end only the worker holds:
a worker that dies (killed, out of memory, crashed) closes it, and the main process stops with a
:class:`WorkerFailure` naming the worker, its exit status and the lines it was working on.
"""

from __future__ import annotations

import gc
import multiprocessing as mp
import os
import sys
import time
import traceback
import zlib
from collections import deque
from collections.abc import Callable, Iterator
from contextlib import ExitStack, contextmanager
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path
from typing import Any

from ..errors import UserError
from ..runtime.compiled_language import Language
from ..runtime.tokenize import Tokenizer
from .coverage import Coverage
from .outputs import AtomicFile, StdoutSink
from .progress import Progress
from .reading import Chunk, chunks, finer_tail, read_blocks
from .records import ChunkProcessor, ChunkResult, Options, Tally
from .sources import Source, compiled_file, load_compiled

POLL_SECONDS = 0.5
TAIL_CHUNKS, TAIL_PARTS = 2, 4  # per worker, the input's last chunks are cut in this many (see finer_tail)
ANSWER_EVERY = 32  # word types a worker analyzes between two looks for other workers' questions
WORKER_GC_THRESHOLD = 20_000  # new container objects between two collections of the youngest generation in a worker


class WorkerFailure(UserError):
    """A worker process died or raised an error: the run stops and no output is committed."""


@dataclass
class Job:
    """What one chunk is and where it came from (for error messages)."""

    source: int
    chunk: Chunk
    name: str

    def where(self) -> str:
        c = self.chunk
        last = c.first_line + max(c.lines - 1, 0)
        return f"lines {c.first_line}-{last} of {self.name}"


def source_chunks(source: Source, options: Options) -> Iterator[Chunk]:
    """The chunks of one input (standard input included)."""
    import sys

    if source.is_stdin:
        yield from chunks(
            read_blocks(sys.stdin.buffer, block=options.chunk_bytes), 1, options.chunk_bytes, options.max_line_bytes
        )
        return
    try:
        handle = Path(source.path).open("rb")
    except OSError as exc:
        raise UserError(f"cannot read input file: {exc.strerror or exc}", hint="check the path and its permissions") from None
    with handle:
        yield from chunks(read_blocks(handle, block=options.chunk_bytes), 1, options.chunk_bytes, options.max_line_bytes)


def _end_with_parent(parent: int) -> None:
    """Make this worker end when the process that started it dies (even by SIGKILL): the kernel's
    parent-death signal on Linux, and a thread that watches the parent's id everywhere."""
    import ctypes
    import signal
    import threading

    try:
        libc = ctypes.CDLL(None, use_errno=True)
        libc.prctl(1, int(signal.SIGKILL), 0, 0, 0)  # PR_SET_PDEATHSIG
    except (OSError, AttributeError):
        pass

    def watch() -> None:
        while True:
            if os.getppid() != parent:
                os._exit(1)
            time.sleep(0.5)

    if os.getppid() != parent:
        os._exit(1)
    threading.Thread(target=watch, name="morphfst-parent-watch", daemon=True).start()


def _worker_main(
    source: str | Language,
    options: Options,
    processor_class: type[ChunkProcessor],
    tasks: Any,
    results: Any,
    parent: int = 0,
    peers: list[Any] | None = None,
    me: int = 0,
) -> None:
    """A worker process: load the compiled language once (``source`` is its path; a forked worker
    gets the main process's loaded language itself), then process chunks until told to stop."""
    if parent:
        _end_with_parent(parent)
    try:
        lang = load_compiled(source) if isinstance(source, str) else source
        processor = processor_class(lang, options)
    except BaseException:
        results.send(("error", traceback.format_exc()))
        return
    # A worker unpickles thousands of small tuples a chunk (the others' answers) and keeps what
    # survives a chunk out of the collector's way (gc.freeze, see records.FREEZE_EVERY); collecting
    # the youngest generation every 700 new objects cost 5 % of a worker's CPU (this process is ours).
    gc.set_threshold(WORKER_GC_THRESHOLD, *gc.get_threshold()[1:])
    if peers and len(peers) > 1 and processor.type_affine:
        _shared_loop(processor, tasks, results, peers, me)
        return
    drained = False
    while True:
        item = tasks.get()
        if item is None:
            results.send(("bye" if drained else "final", processor.flush().packed()))
            break
        if item[0] == "drain":  # every chunk is done: the figures go now (see _shared_loop)
            results.send(("final", processor.flush().packed()))
            drained = True
            continue
        _, doc, chunk = item
        processor.doc = doc
        try:
            result = processor.process(chunk)
        except BaseException:
            results.send(("error", traceback.format_exc()))
            return
        results.send(("ok", result))
    results.close()


OWNER_PREFIX = 3  # letters of a word type that choose its owner


def owner(token: str, workers: int) -> int:
    """The worker that analyzes ``token``: a hash of its first letters (lowercased), the same in every
    process. Types that begin alike go to one worker, so each worker walks mostly its own part of the
    analyzer (the stems it spells, the states along their prefixes and the decoding memos of their
    morphs) instead of every worker touching all of it; the first three letters still spread the
    types evenly (49-51 % at two workers on the benchmark texts)."""
    return _prefix_owner(token[:OWNER_PREFIX], workers)


@lru_cache(maxsize=1 << 16)  # a text has a few thousand prefixes; a worker asks for every type it lacks
def _prefix_owner(prefix: str, workers: int) -> int:
    return zlib.crc32(prefix.lower().encode("utf-8", "surrogatepass")) % workers


def _shared_loop(processor: ChunkProcessor, inbox: Any, results: Any, peers: list[Any], me: int) -> None:
    """Type-affine processing: every word type is analyzed by one worker, its owner (by hash).

    A chunk's word types that are not in this worker's cache are split by owner; this worker analyzes
    its own, and asks each other owner for theirs (a message on the owner's inbox). The chunk waits
    until every answer is in, then is processed from the cache. Meanwhile the worker goes on with its
    inbox: other chunks, other workers' questions (answered at once: from the cache, or analyzed and
    kept, so a type asked for by several workers is analyzed once) and answers. No worker ever waits
    for one particular message, so none can wait for another in a circle. Chunks leave in the order
    they came, which keeps the main process's round-robin reading in input order.

    After its last chunk the main process sends ``drain``: once every chunk it holds is out, the
    worker sends its figures (``final``) at once, while the others finish their chunks, and goes on
    answering questions until told to stop; then it sends what those answers analyzed (``bye``).
    """
    import queue
    import threading

    workers = len(peers)
    waiting: deque[list[Any]] = deque()  # [number, doc, chunk, prepared, answers still expected, asks by owner]
    by_number: dict[int, list[Any]] = {}
    count = 0
    # Results go out through a thread: a send blocks while the main process reads another worker's
    # pipe, and this loop must keep answering the others meanwhile (else two workers could wait on
    # each other through the main process). The queue holds at most the chunks in flight.
    outbox: queue.Queue[tuple[str, Any] | None] = queue.Queue()

    def sender() -> None:
        while (message := outbox.get()) is not None:
            results.send(message)

    thread = threading.Thread(target=sender, name="morphfst-results", daemon=True)
    thread.start()

    def finish(message: tuple[str, Any]) -> None:
        outbox.put(message)
        outbox.put(None)
        thread.join()

    backlog: deque[Any] = deque()  # messages taken from the inbox while answering questions early
    draining = drained = False  # the main process sent its last chunk / this worker sent its figures

    def answer(item: Any) -> None:
        _, asker, number, tokens = item
        lookup = processor.lookup
        peers[asker].put(("answer", number, me, [lookup(t) for t in tokens]))

    def answer_waiting_questions() -> None:
        """Answer the questions already in the inbox now (another worker is waiting for them); keep
        every other message for later, in order."""
        while True:
            try:
                item = inbox.get_nowait()
            except queue.Empty:
                return
            if item is not None and item[0] == "ask":
                answer(item)
            else:
                backlog.append(item)

    try:
        while True:
            item = backlog.popleft() if backlog else inbox.get()
            kind = item[0] if item is not None else "stop"
            if kind == "chunk":
                _, doc, chunk = item
                decoded, missing = processor.prepare(chunk)
                asks: dict[int, list[str]] = {}
                own: list[str] = []
                for token in missing:
                    who = owner(token, workers)
                    if who == me:
                        own.append(token)
                    else:
                        asks.setdefault(who, []).append(token)
                job = [count, doc, chunk, decoded, len(asks), asks]  # the asks, to read the answers by
                by_number[count] = job
                waiting.append(job)
                for who, tokens in asks.items():
                    peers[who].put(("ask", me, count, tokens))
                count += 1
                # analyze this chunk's own types now, stopping every few words to answer the others
                for done, token in enumerate(own, start=1):
                    processor.lookup(token)
                    if done % ANSWER_EVERY == 0:
                        answer_waiting_questions()
                answer_waiting_questions()
            elif kind == "ask":
                answer(item)
            elif kind == "answer":
                _, number, who, found = item  # in the order of the tokens asked of ``who``
                job = by_number[number]
                processor.learn_all(job[5][who], found)
                job[4] -= 1
            elif kind == "drain":
                draining = True
            else:
                # after a drain, what is left to count is the types analyzed for the others since
                finish(("bye" if drained else "final", processor.flush().packed()))
                break
            while waiting and waiting[0][4] == 0:
                number, doc, chunk, decoded, _, _ = waiting.popleft()
                del by_number[number]
                processor.doc = doc
                outbox.put(("ok", processor.process(chunk, decoded)))
            if draining and not waiting:
                # every chunk is out: the figures go now, while the other workers finish theirs
                outbox.put(("final", processor.flush().packed()))
                draining, drained = False, True
    except BaseException:
        finish(("error", traceback.format_exc()))
        return
    results.close()


START_ENV = "MORPHFST_WORKER_START"  # "spawn" or "fork": overrides the choice below (tests, debugging)


def start_method() -> str:
    """How worker processes start: ``fork`` on Linux when this process runs no other thread (a forked
    child shares the loaded language page by page and starts in milliseconds instead of importing
    pynini and loading the compiled file again, ~0.3 s of CPU per worker); ``spawn`` everywhere else,
    because a fork copies only the calling thread, and a lock another thread held stays held in the
    child. ``MORPHFST_WORKER_START`` overrides the choice."""
    import threading

    forced = os.environ.get(START_ENV, "").strip().lower()
    if forced in ("fork", "spawn"):
        return forced if forced in mp.get_all_start_methods() else "spawn"
    if sys.platform.startswith("linux") and threading.active_count() == 1 and "fork" in mp.get_all_start_methods():
        return "fork"
    return "spawn"


class Workers:
    """N worker processes fed round-robin; results read back in the same order."""

    def __init__(self, lang: Language, options: Options, jobs: int, processor_class: type[ChunkProcessor]) -> None:
        self.procs: list[Any] = []
        self.tasks: list[Any] = []
        self.results: list[Any] = []
        self.start_method = start_method()
        ctx = mp.get_context(self.start_method)
        if self.start_method == "fork":
            for stream in (sys.stdout, sys.stderr):  # a child flushes what it copied: write it once, now
                try:
                    stream.flush()
                except (AttributeError, OSError, ValueError):
                    pass
            # the tokenizer's expressions (about 6 ms to compile) and the glosses table (25-30 ms to
            # parse) made once here and inherited, not once in each worker (and again for the report)
            Tokenizer.for_meta(lang.meta)
            lang.expect_many_words()
            self._start(ctx, lang, options, jobs, processor_class)
        else:
            with _main_file_hidden_if_missing():
                self._start(ctx, compiled_file(lang), options, jobs, processor_class)
        self.next_put = 0
        self.next_get = 0
        self.closed = False
        self.drained = False

    def _start(
        self, ctx: Any, source: str | Language, options: Options, jobs: int, processor_class: type[ChunkProcessor]
    ) -> None:
        inboxes = [ctx.Queue() for _ in range(jobs)]
        for inbox in inboxes:
            _widen(inbox._writer)
        for me, tasks in enumerate(inboxes):
            reader, writer = ctx.Pipe(duplex=False)
            _widen(writer)
            proc = ctx.Process(
                target=_worker_main,
                args=(source, options, processor_class, tasks, writer, os.getpid(), inboxes, me),
                daemon=True,
            )
            proc.start()
            writer.close()  # only the worker holds the write end: its death closes the pipe
            self.procs.append(proc)
            self.tasks.append(tasks)
            self.results.append(reader)

    def put(self, doc: str, chunk: Chunk) -> None:
        self.tasks[self.next_put % len(self.procs)].put(("chunk", doc, chunk))
        self.next_put += 1

    def get(self, job: Job) -> ChunkResult:
        index = self.next_get % len(self.procs)
        self.next_get += 1
        kind, payload = self._receive(index, job.where(), others=True)
        if kind != "ok":
            raise WorkerFailure(f"worker process {index + 1} sent {kind!r} while processing {job.where()}")
        return payload  # type: ignore[no-any-return]

    def _receive(self, index: int, doing: str, others: bool = False) -> tuple[str, Any]:
        """The next message of worker ``index``; a dead worker or an error raises :class:`WorkerFailure`."""
        conn, proc = self.results[index], self.procs[index]
        hint = "no output was written; a worker killed by signal 9 has often run out of memory (try fewer --jobs)"
        while True:
            try:
                if conn.poll(POLL_SECONDS):
                    kind, payload = conn.recv()
                    break
            except (EOFError, OSError):
                proc.join(timeout=5)
                raise WorkerFailure(
                    f"worker process {index + 1} (pid {proc.pid}) died {_exit_text(proc.exitcode)} while processing {doing}",
                    hint=hint,
                ) from None
            if not proc.is_alive() and not conn.poll(0):
                proc.join(timeout=5)
                raise WorkerFailure(
                    f"worker process {index + 1} (pid {proc.pid}) died {_exit_text(proc.exitcode)} while processing {doing}",
                    hint=hint,
                )
            if others:
                # workers answer each other's questions: one that died leaves the others waiting
                for other, peer in enumerate(self.procs):
                    if other != index and not peer.is_alive():
                        peer.join(timeout=5)
                        raise WorkerFailure(
                            f"worker process {other + 1} (pid {peer.pid}) died {_exit_text(peer.exitcode)} "
                            f"while {doing} waited for it",
                            hint=hint,
                        )
        if kind == "error":
            last = payload.strip().splitlines()[-1] if payload.strip() else "unknown error"
            raise WorkerFailure(
                f"worker process {index + 1} failed while processing {doing}: {last}",
                hint="no output was written; this is a bug, please report it with the traceback:\n" + payload.rstrip(),
            )
        return kind, payload

    def drain(self) -> None:
        """Say that no chunk follows: each worker sends its figures as soon as its chunks are out."""
        for tasks in self.tasks:
            tasks.put(("drain",))
        self.drained = True

    def finish(self) -> list[Tally]:
        """Tell every worker to stop (after every result was read); returns the figures each sent."""
        tallies = []
        if self.drained:
            for index in range(len(self.procs)):
                tallies.append(self._expect(index, "final"))
        for tasks in self.tasks:
            tasks.put(None)
        for index in range(len(self.procs)):
            tallies.append(self._expect(index, "bye" if self.drained else "final"))
        self.drained = False
        return tallies

    def _expect(self, index: int, kind: str) -> Tally:
        got, payload = self._receive(index, "its last figures")
        if got != kind:
            raise WorkerFailure(f"worker process {index + 1} sent {got!r} instead of its last figures")
        return Tally.unpacked(payload)

    def close(self, wait: bool = True) -> None:
        if self.closed:
            return
        self.closed = True
        for tasks in self.tasks:
            try:
                tasks.put(None)
            except (OSError, ValueError):
                pass
        for proc in self.procs:
            proc.join(timeout=10 if wait else 0.1)
            if proc.is_alive():
                proc.terminate()
                proc.join(timeout=5)
        for tasks in self.tasks:
            tasks.cancel_join_thread()
            tasks.close()
        for conn in self.results:
            conn.close()


PIPE_BYTES = 1 << 20


def _widen(conn: Any) -> None:
    """Let a pipe hold a whole chunk (Linux: 64 KiB by default)."""
    try:
        import fcntl

        fcntl.fcntl(conn.fileno(), 1031, PIPE_BYTES)  # F_SETPIPE_SZ
    except (ImportError, OSError, AttributeError, ValueError):
        pass


@contextmanager
def _main_file_hidden_if_missing() -> Iterator[None]:
    """Start workers even when the main program has no file (``python -`` or an interactive session):
    a spawned process re-imports the main program from its file, and fails when that is ``<stdin>``."""
    main = sys.modules.get("__main__")
    name = getattr(main, "__file__", None)
    hide = main is not None and name is not None and not Path(name).exists() and getattr(main, "__spec__", None) is None
    if hide:
        del main.__file__  # type: ignore[union-attr]
    try:
        yield
    finally:
        if hide:
            main.__file__ = name  # type: ignore[union-attr]


def _exit_text(code: int | None) -> str:
    if code is None:
        return "(exit status unknown)"
    if code < 0:
        import signal

        try:
            name = signal.Signals(-code).name
        except ValueError:
            name = f"signal {-code}"
        return f"(killed by {name})"
    return f"(exit code {code})"


Sink = AtomicFile | StdoutSink


def run_local(
    lang: Language,
    sources: list[Source],
    make_sink: Callable[[Source], Sink],
    options: Options,
    jobs: int = 1,
    progress: Progress | None = None,
    processor_class: type[ChunkProcessor] = ChunkProcessor,
    on_done: Callable[[Source, Path, Coverage], None] | None = None,
    processor: ChunkProcessor | None = None,
    workers: Workers | None = None,
) -> Coverage:
    """Process every source into its sink, in order; returns the coverage of the whole run.

    Each sink is committed (renamed into place) when its last chunk is written; if anything fails,
    every sink not yet committed is aborted (its temporary file removed). A ``processor`` (one job)
    or running ``workers`` may be passed in to reuse their caches across runs; ``workers`` passed in
    are left running (their per-type figures are then flushed with :meth:`Workers.finish` only when
    the caller stops them, so the returned coverage has no per-type figures).
    """
    total = Coverage(files=[s.path for s in sources])
    with ExitStack() as stack:
        sinks: dict[int, Sink] = {}
        per_source: dict[int, Coverage] = {}

        def abort_all() -> None:
            for sink in sinks.values():
                sink.abort()

        stack.callback(abort_all)

        def open_source(i: int) -> Sink:
            if i not in sinks:
                sinks[i] = make_sink(sources[i])
                per_source[i] = Coverage()
            return sinks[i]

        def finish(i: int) -> None:
            path = sinks.pop(i).commit()
            if on_done:
                on_done(sources[i], path, per_source.pop(i))

        def write(job: Job, result: ChunkResult) -> None:
            open_source(job.source).write(result.data)
            total.add(result)
            per_source[job.source].add(result)
            if progress:
                progress.update(result.bytes_in, result.tokens)

        if jobs <= 1 and workers is None:
            processor = processor or processor_class(lang, options)
            for i, source in enumerate(sources):
                open_source(i)
                processor.doc = source.name
                for chunk in source_chunks(source, options):
                    write(Job(i, chunk, source.path), processor.process(chunk))
                finish(i)
            total.add_tally(processor.flush())
            return total

        owned = workers is None
        pool = workers or Workers(lang, options, jobs, processor_class)
        if owned:
            stack.callback(pool.close, False)
        window = 3 * len(pool.procs)
        pending: deque[Job] = deque()
        reading_done: set[int] = set()

        def collect() -> None:
            job = pending.popleft()
            write(job, pool.get(job))
            if job.source in reading_done and not any(p.source == job.source for p in pending):
                finish(job.source)

        for i, source in enumerate(sources):
            open_source(i)
            read = source_chunks(source, options)
            if i == len(sources) - 1:
                read = finer_tail(read, TAIL_CHUNKS * len(pool.procs), TAIL_PARTS)
            for chunk in read:
                while len(pending) >= window:
                    collect()
                job = Job(i, chunk, source.path)
                pool.put(source.name, chunk)
                pending.append(job)
            reading_done.add(i)
            if not any(p.source == i for p in pending):
                finish(i)
        if owned:
            pool.drain()
        while pending:
            collect()
        if owned:
            for tally in pool.finish():
                total.add_tally(tally)
            pool.close()
    return total

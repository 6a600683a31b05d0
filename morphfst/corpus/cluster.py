"""The engine on a Dask cluster (dask.distributed): input files cut into byte-range partitions,
each partition processed by a Dask worker into its own output file.

The compiled grammar is shipped once to each worker (a worker plugin holding the .mfc bytes). A first
pass counts the lines of every partition (so every output record carries its line number in the
input file). The partitions are then processed in batches (a few per worker), each batch in three
steps that make the workers type-affine, as the local worker processes are: every partition lists
its word types, shared out by owner (the hash of their first letters,
:func:`morphfst.corpus.local.owner`); each worker gathers its share from every partition's list (from
the other workers directly, not through the client) and analyzes those types (or finds them in its
cache); each partition's task puts the owners' answers in its worker's cache and writes its output
from there, under a temporary name renamed when complete. So a word type is analyzed once across the
cluster, not once per worker that meets it. Dask is optional: nothing here is imported unless
``--dask`` is used.
"""

from __future__ import annotations

import logging
from pathlib import Path
from typing import Any

from ..errors import UserError
from ..runtime.compiled_language import Language
from .coverage import Coverage
from .local import WorkerFailure
from .progress import Progress
from .records import Options
from .sources import Source, compiled_file, output_path

PARTITION_BYTES = 64 * 1024 * 1024  # largest partition chosen automatically
MIN_PARTITION_BYTES = 1024 * 1024  # smallest partition chosen automatically
PARTITIONS_PER_WORKER = 4  # automatic size: the input in about this many partitions per worker
# The run's last partitions (this many per worker) send back the per-type figures their worker holds
# (most often the worker's last partition: the figures come back while the others finish); what is
# still held at the end is collected from every worker (see dask_worker.process_partition).
LAST_PARTITIONS = 1
SHARED_FILES = True  # workers may load the compiled file from the client's path when they read the same bytes


def auto_partition_bytes(sources: list[Source], workers: int) -> int:
    """A partition size that gives every worker several partitions (so none is idle while another
    works through one large file), between 1 MB and 64 MB."""
    total = sum(s.size or 0 for s in sources)
    per = -(-total // max(workers * PARTITIONS_PER_WORKER, 1))
    return max(MIN_PARTITION_BYTES, min(PARTITION_BYTES, per))


INSTALL_HINT = "install the optional extra: pip install 'morphfst[dask]' (or: pip install 'dask[distributed]')"


def require_dask() -> None:
    """Raise a clear :class:`UserError` when dask.distributed is not installed."""
    try:
        import distributed  # noqa: F401
    except ImportError:
        raise UserError("--dask needs the dask.distributed package, which is not installed", hint=INSTALL_HINT) from None


def partitions(sources: list[Source], partition_bytes: int) -> list[tuple[int, int, int, int]]:
    """(source index, partition number, start, stop) byte ranges covering every source (one at least each)."""
    out = []
    for i, s in enumerate(sources):
        size = s.size or 0
        starts = list(range(0, size, max(partition_bytes, 1))) or [0]
        for n, start in enumerate(starts):
            out.append((i, n, start, min(start + partition_bytes, size)))
    return out


def connect(address: str | None, workers: int) -> tuple[Any, Any]:
    """A client on the scheduler at ``address``, or on a local cluster of ``workers`` processes started here."""
    import dask
    from distributed import Client, LocalCluster

    if address:
        try:
            return Client(address, timeout="20s"), None
        except OSError as exc:
            raise UserError(
                f"cannot reach the Dask scheduler at {address}: {exc}", hint="check the address (e.g. tcp://host:8786)"
            ) from None
    # No dashboard (nobody looks at it), so no statistical profiler either: it samples every task's
    # stack 100 times a second and made the survey tasks twice as slow (bench/bench_perf.py). The
    # scheduler's HTTP server listens on any free port: the default one may be another cluster's.
    with dask.config.set({"distributed.worker.profile.enabled": False}):
        cluster = LocalCluster(
            n_workers=max(workers, 1),
            threads_per_worker=1,
            processes=True,
            dashboard_address=":0",
            scheduler_kwargs={"dashboard": False},
            silence_logs=logging.ERROR,
        )
    return Client(cluster), cluster


def grammar_plugin(client: Any, mfc: Path, options: Options) -> Any:
    """The worker plugin that carries the compiled grammar: with its bytes, unless every worker
    already holds that grammar or reads the same bytes at the client's path (by the SHA-256 of the
    bytes): a cluster kept running between runs, or one that shares the file system (a local
    cluster), is not sent 15 MB (0.1-0.15 s of a run on a local cluster)."""
    import hashlib

    from .dask_worker import GrammarPlugin, grammar_reachable

    data = mfc.read_bytes()
    digest = hashlib.sha256(data).hexdigest()
    path = str(mfc.resolve()) if SHARED_FILES else ""
    reachable = client.run(grammar_reachable, digest, path)
    if reachable and all(reachable.values()):
        return GrammarPlugin(None, mfc.name, options, digest, path)
    return GrammarPlugin(data, mfc.name, options, digest)


def _answers(client: Any, specs: list[dict[str, Any]], addresses: list[str]) -> list[Any]:
    """Futures of the owners' answers for the word types of ``specs`` (one per worker, each run on the
    worker that owns its types): :func:`~morphfst.corpus.dask_worker.answer_types` results. Each
    partition's survey shares its types out by owner on its worker, and each owner reads its share
    of every survey from the workers directly: no word type passes through this process. The owner
    is a preference, not a requirement: if it leaves the cluster, another worker answers (the run goes
    on; only those types may then be analyzed twice)."""
    from .dask_worker import answer_types, survey_partition

    if not addresses:
        return []
    surveys = client.map(survey_partition, specs, owners=len(addresses), pure=False)
    return [
        client.submit(answer_types, me, *surveys, workers=[where], allow_other_workers=True, pure=False)
        for me, where in enumerate(addresses)
    ]


def settle_tallies(client: Any, specs: list[dict[str, Any]], total: Coverage, covered: list[int]) -> None:
    """Add the per-type figures the workers still hold (:func:`~morphfst.corpus.dask_worker.collect_tallies`),
    then make sure every partition is counted exactly once: a partition whose figures were lost
    (its worker left the cluster after writing it) is counted again; one counted twice stops the run."""
    from collections import Counter

    from .dask_worker import collect_tallies, recount_partition

    for tally, covers in client.run(collect_tallies).values():
        total.add_tally(tally)
        covered.extend(covers)
    times = Counter(covered)
    twice = sorted(i for i, n in times.items() if n > 1)
    if twice:
        raise RuntimeError(f"the figures of partitions {twice[:5]} came back twice (a task ran twice)")
    lost = [spec for spec in specs if spec["index"] not in times]
    if lost:
        for tally in client.gather(client.map(recount_partition, lost, pure=False)):
            total.add_tally(tally)


def run_dask(
    lang: Language,
    sources: list[Source],
    out_dir: str | Path,
    options: Options,
    address: str | None = None,
    workers: int = 2,
    partition_bytes: int | None = None,
    progress: Progress | None = None,
) -> tuple[Coverage, list[dict[str, Any]]]:
    """Run on Dask; returns the run's coverage and the manifest entries (every output in input order).

    ``partition_bytes`` None: :func:`auto_partition_bytes` for the local cluster's ``workers`` (or the
    scheduler's workers). A file cut into several partitions gets one output per partition
    (``NAME.partNNNNN``), listed in order in the manifest."""
    require_dask()
    if any(s.is_stdin for s in sources):
        raise UserError("the Dask engine reads files, not standard input", hint="give input files or directories")
    from distributed import as_completed

    from .dask_worker import analyzed_count, count_line_starts, process_partition

    mfc = Path(compiled_file(lang))
    client, cluster = connect(address, workers)
    try:
        if cluster is not None:
            client.wait_for_workers(workers)
        client.register_plugin(grammar_plugin(client, mfc, options), name="morphfst-grammar")
        addresses = sorted(client.scheduler_info().get("workers", {}))
        if partition_bytes is None:
            partition_bytes = auto_partition_bytes(sources, max(len(addresses) if address else workers, 1))
        parts = partitions(sources, partition_bytes)
        counts = client.gather(
            client.map(
                count_line_starts,
                [sources[i].path for i, _, _, _ in parts],
                [a for *_, a, _ in parts],
                [b for *_, b in parts],
                pure=False,
            )
        )
        specs: list[dict[str, Any]] = []
        first_line: dict[int, int] = {}
        for index, ((i, n, start, stop), count) in enumerate(zip(parts, counts)):
            line = first_line.get(i, 1)
            first_line[i] = line + count
            single = sum(1 for p in parts if p[0] == i) == 1
            target = output_path(out_dir, sources[i], options.suffix, None if single else n)
            specs.append(
                {
                    "index": index,
                    "path": sources[i].path,
                    "doc": sources[i].name,
                    "start": start,
                    "stop": stop,
                    "first_line": line,
                    "output": str(target),
                    "batch": index // max(len(addresses) * PARTITIONS_PER_WORKER, 1),
                    "last": index >= len(parts) - LAST_PARTITIONS * max(len(addresses), 1),
                }
            )
        total = Coverage(files=[s.path for s in sources])
        futures: list[Any] = []
        entries: list[dict[str, Any] | None] = [None] * len(specs)
        covered: list[int] = []  # partitions whose per-type figures are in ``total``

        def take(future: Any) -> None:
            result = future.result()
            cov: Coverage = result["coverage"]
            total.merge(cov)
            if result["tally"] is not None:
                total.add_tally(result["tally"])
                covered.extend(result["covers"])
            spec = specs[result["index"]]
            entries[result["index"]] = {
                "input": spec["path"],
                "output": Path(result["output"]).name,
                "bytes": [spec["start"], spec["stop"]],
                "first_line": spec["first_line"],
                "lines": cov.lines,
                "tokens": cov.tokens,
            }
            if progress:
                progress.update(result["bytes"], cov.tokens)

        try:
            done = as_completed()
            batches = 1 + max((int(spec["batch"]) for spec in specs), default=-1)
            for batch in range(batches):
                chosen = [spec for spec in specs if spec["batch"] == batch]
                answers = _answers(client, chosen, addresses)
                submitted = client.map(process_partition, chosen, answers=answers, pure=False)
                futures += submitted
                done.update(submitted)
                total.analyzed += sum(client.gather(client.map(analyzed_count, answers, pure=False)))
                while done.has_ready():
                    take(next(done))
            for future in done:
                take(future)
            settle_tallies(client, specs, total, covered)
        except Exception as exc:
            for f in futures:
                f.cancel()
            raise WorkerFailure(
                f"a Dask task failed: {type(exc).__name__}: {exc}",
                hint="outputs of finished partitions are complete files, but the run has no manifest: rerun it",
            ) from None
        return total, [e for e in entries if e is not None]
    finally:
        client.close()
        if cluster is not None:
            cluster.close()

"""A lemma-aware full-text index of files in one SQLite database, updated in place, and its search.

Layout of an index file (plain SQLite, readable by any SQLite with FTS5 once the tokenizer is
registered; see :func:`morphfst.search.register`):

- ``docs``: an FTS5 table ``(path UNINDEXED, line UNINDEXED, body)`` whose tokenizer is ``morphfst``
  with the language and term options as arguments, so queries are analyzed the same way;
- ``morphfst_files``: every indexed file with its size, modification time and the rowids of its
  documents (inserted contiguously), so an update re-indexes only new and changed files;
- ``morphfst_meta``: the language, the grammar digest and the options the index was built with.

A document is one line (``unit="line"``, the default; blank lines skipped; a line longer than the
corpus reader's limit is split into several documents) or one whole file (``unit="file"``). Text is
decoded as the corpus pipeline does (invalid UTF-8 replaced, NFC), and stored as decoded.

Updates run in transactions: a file's old documents are deleted and its new ones inserted in the
same transaction, committed every few megabytes and at the end; an error or an interrupt rolls the
open transaction back, so an existing index never loses what it had. When the grammar changed since
the last run (a different digest), every stored document is re-analyzed first (FTS5 ``rebuild``),
so that deleting old documents removes exactly the terms they were indexed with.
"""

from __future__ import annotations

import os
import time
from collections.abc import Callable, Iterator
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from ..corpus.local import source_chunks
from ..corpus.progress import Progress
from ..corpus.reading import Chunk
from ..corpus.records import ChunkProcessor, ChunkResult, Options, decode
from ..corpus.sources import Source, expand_inputs
from ..errors import Position as ErrorPosition
from ..errors import UserError
from ..runtime.compiled_language import Language
from ..version import __version__
from .fts import Registration, register, require_apsw, sql_string, tokenize_directive
from .terms import TermAnalyzer, TermOptions

SCHEMA_VERSION = "1"
COMMIT_BYTES = 16 * 1024 * 1024  # commit after this much new text (and at the end)
UNITS = ("line", "file")
MARK_START, MARK_END = "\ue000", "\ue001"  # private-use marks for highlight() (never in analyzed text)


# ---- opening ----------------------------------------------------------------------------------------
def connect(path: str | Path, create: bool = False, readonly: bool = False, busy_timeout: float = 5.0) -> Any:
    """An ``apsw.Connection`` to an index file, with clear errors for a missing, corrupt or locked file."""
    apsw = require_apsw()
    path = str(path)
    if not create and not Path(path).exists():
        raise UserError("no such index file", ErrorPosition(path), hint="build one first: morphfst index INDEX FILES...")
    if Path(path).is_dir():
        raise UserError("the index path is a directory", ErrorPosition(path), hint="give a file name, e.g. books.db")
    flags = apsw.SQLITE_OPEN_READONLY if readonly else apsw.SQLITE_OPEN_READWRITE | apsw.SQLITE_OPEN_CREATE
    try:
        con = apsw.Connection(path, flags=flags)
        con.set_busy_timeout(int(busy_timeout * 1000))
        con.execute("SELECT count(*) FROM sqlite_schema").fetchall()
    except apsw.Error as exc:
        raise database_error(exc, path) from None
    return con


def database_error(exc: BaseException, path: str) -> UserError:
    """A user error for an SQLite failure on an index file."""
    import apsw

    if isinstance(exc, apsw.BusyError | apsw.LockedError):
        return UserError(
            "the index file is locked by another program",
            ErrorPosition(path),
            hint="wait until the other indexing or writing process ends, or raise --busy-timeout; nothing was changed",
        )
    if isinstance(exc, apsw.NotADBError | apsw.CorruptError):
        return UserError(
            f"the index file is not a usable SQLite database ({_sqlite_message(exc)})",
            ErrorPosition(path),
            hint="give the right file, or build a new index under another name; this file was not changed",
        )
    if isinstance(exc, apsw.ReadOnlyError | apsw.CantOpenError | apsw.PermissionsError):
        return UserError(
            f"cannot open the index file for writing ({_sqlite_message(exc)})",
            ErrorPosition(path),
            hint="check the path and its permissions",
        )
    return UserError(f"SQLite error on the index file: {_sqlite_message(exc)}", ErrorPosition(path))


def _sqlite_message(exc: BaseException) -> str:
    text = str(exc)
    return text.split(": ", 1)[1] if text.startswith(type(exc).__name__ + ":") else text


def read_meta(con: Any) -> dict[str, str] | None:
    """The index's metadata, or None when the database holds no morphfst index."""
    found = con.execute("SELECT name FROM sqlite_schema WHERE type='table' AND name='morphfst_meta'").fetchall()
    if not found:
        return None
    return {k: v for k, v in con.execute("SELECT key, value FROM morphfst_meta")}


@dataclass
class Index:
    """An open index: its connection, metadata, language, term options and registered tokenizer."""

    path: str
    con: Any
    meta: dict[str, str]
    lang: Language
    options: TermOptions
    registration: Registration

    @property
    def stale(self) -> bool:
        """True when the grammar changed since the index was last updated."""
        return self.meta.get("grammar_digest", "") != self.lang.meta.get("digest", "")

    def close(self) -> None:
        self.con.close()


def _existing_options(meta: dict[str, str]) -> TermOptions:
    return TermOptions(tuple(meta.get("terms", "lemma").split(",")), meta.get("analyses", "best"), meta.get("guess", "1") == "1")


def open_index(
    path: str | Path,
    lang_spec: str | None = None,
    options: TermOptions | None = None,
    unit: str | None = None,
    create: bool = False,
    readonly: bool = False,
    busy_timeout: float = 5.0,
    load_language: Callable[[str], Language] | None = None,
) -> Index:
    """Open (or with ``create``, create when missing) an index. Options given for an existing index must
    match the ones it was built with (they fix its terms); ``None`` means "as built"."""
    from ..build import load

    loader = load_language or load
    path = str(path)
    present = Path(path).exists()
    existed = present and Path(path).stat().st_size > 0
    new_lang = loader(lang_spec or "tur") if create and not existed else None  # a missing language fails before any file is made
    con = connect(path, create=create, readonly=readonly, busy_timeout=busy_timeout)
    apsw = require_apsw()
    try:
        meta = read_meta(con)
        if meta is None:
            if existed:
                raise UserError(
                    "this SQLite database holds no morphfst index",
                    ErrorPosition(path),
                    hint="give an index built by 'morphfst index', or a new file name; this file was not changed",
                )
            if not create:
                raise UserError("no such index file", ErrorPosition(path), hint="build one first: morphfst index INDEX FILES...")
            spec = lang_spec or "tur"
            lang = new_lang or loader(spec)
            opts = options or TermOptions()
            unit = unit or "line"
            if unit not in UNITS:
                raise UserError(f"unknown document unit {unit!r}", hint="use line or file")
            reg = register(con, lang, opts, spec=spec)
            meta = {
                "schema": SCHEMA_VERSION,
                "tool": f"morphfst {__version__}",
                "lang": spec,
                "language": lang.name,
                "grammar_digest": lang.meta.get("digest", ""),
                "terms": ",".join(opts.terms),
                "analyses": opts.analyses,
                "guess": "1" if opts.guess else "0",
                "unit": unit,
            }
            directive = tokenize_directive(spec, opts)
            with con:
                con.execute("CREATE TABLE morphfst_meta(key TEXT PRIMARY KEY, value TEXT NOT NULL)")
                con.execute(
                    "CREATE TABLE morphfst_files(path TEXT PRIMARY KEY, size INTEGER, mtime_ns INTEGER, "
                    "first_rowid INTEGER, last_rowid INTEGER, docs INTEGER, bytes INTEGER)"
                )
                con.execute(
                    f"CREATE VIRTUAL TABLE docs USING fts5(path UNINDEXED, line UNINDEXED, body, tokenize={sql_string(directive)})"
                )
                con.executemany("INSERT INTO morphfst_meta VALUES (?, ?)", list(meta.items()))
            return Index(path, con, meta, lang, opts, reg)
        built = _existing_options(meta)
        if options is not None and options != built:
            raise UserError(
                f"this index was built with terms {','.join(built.terms)}, analyses {built.analyses}, "
                f"guesses {'on' if built.guess else 'off'}; other term options cannot be mixed into it",
                ErrorPosition(path),
                hint="leave out the term options to update it as built, or build a new index under another name",
            )
        if unit is not None and unit != meta.get("unit", "line"):
            raise UserError(
                f"this index holds one document per {meta.get('unit', 'line')}",
                ErrorPosition(path),
                hint="leave out --unit, or build a new index under another name",
            )
        spec = meta.get("lang", "tur")
        if lang_spec is not None and lang_spec != spec:
            raise UserError(
                f"this index was built with language {spec!r}",
                ErrorPosition(path),
                hint=f"leave out -l, or give -l {spec}; build a new index for another language",
            )
        lang = loader(spec)
        reg = register(con, lang, built, spec=spec)
        return Index(path, con, meta, lang, built, reg)
    except BaseException as exc:
        con.close()
        if not present and Path(path).exists():
            Path(path).unlink()  # a file this call created and could not finish
        if isinstance(exc, apsw.Error):
            raise database_error(exc, path) from None
        raise


# ---- building and updating --------------------------------------------------------------------------
@dataclass
class IndexOptions(Options):
    """Corpus options plus the search terms (what worker processes need)."""

    term_options: TermOptions = field(default_factory=TermOptions)


class IndexChunkProcessor(ChunkProcessor):
    """A corpus worker that analyzes word types for the indexer: a "chunk" holds new word types, one per
    line (already decoded and normalized by the main process); the result holds their terms (pickled)."""

    def __init__(self, lang: Language, options: Options) -> None:
        super().__init__(lang, options)
        term_options = options.term_options if isinstance(options, IndexOptions) else TermOptions()
        self.analyzer = TermAnalyzer(lang, term_options)

    type_affine = False  # the indexer's main process hands out new word types itself

    def process(self, chunk: Chunk, prepared: Any = None) -> ChunkResult:
        import pickle

        types = chunk.data.decode("utf-8").split("\n")
        terms = [self.analyzer.document_terms(t) for t in types]
        return ChunkResult(chunk.index, pickle.dumps(terms, protocol=pickle.HIGHEST_PROTOCOL), 0, len(types), 0)

    def flush(self) -> Any:
        from ..corpus.records import Tally

        return Tally()


def chunk_lines(chunk: Chunk) -> list[tuple[int, str]]:
    """(line number, text) of every line of a chunk (no line end; a cut line's pieces each count)."""
    text, _ = decode(chunk.data)
    lines = text.split("\n")
    if text.endswith("\n") or not text:
        lines.pop()
    return [(chunk.first_line + i, line[:-1] if line.endswith("\r") else line) for i, line in enumerate(lines)]


@dataclass
class UpdateResult:
    """What an update did."""

    added: int = 0  # files new to the index
    changed: int = 0  # files re-indexed
    unchanged: int = 0
    removed: int = 0  # files dropped with prune
    docs: int = 0  # documents inserted
    bytes: int = 0
    seconds: float = 0.0
    rebuilt: bool = False  # the grammar had changed: stored documents were re-analyzed first
    files: list[str] = field(default_factory=list)


def _file_key(source: Source) -> str:
    return os.path.abspath(source.path)


def update_index(
    index: Index,
    inputs: list[str],
    jobs: int = 1,
    quiet: bool = True,
    prune: bool = False,
    progress_stream: Any = None,
) -> UpdateResult:
    """Index new and changed files of ``inputs`` (files or directories); skip unchanged ones.

    With ``prune``, files in the index that are gone from disk are removed. ``jobs`` > 1 analyzes in
    worker processes (the corpus pipeline's), the main process feeding SQLite.
    """
    import apsw

    if any(p == "-" for p in inputs) or not inputs:
        raise UserError("the index reads files, not standard input", hint="give files or directories to index")
    sources = expand_inputs(inputs)
    con = index.con
    result = UpdateResult()
    start = time.perf_counter()
    todo: list[tuple[Source, str, int, int, tuple[int, int] | None]] = []
    try:
        known = {row[0]: row for row in con.execute("SELECT path, size, mtime_ns, first_rowid, last_rowid FROM morphfst_files")}
        seen: set[str] = set()
        for source in sources:
            key = _file_key(source)
            if key in seen:
                continue
            seen.add(key)
            st = os.stat(source.path)
            old = known.get(key)
            if old is not None and old[1] == st.st_size and old[2] == st.st_mtime_ns:
                result.unchanged += 1
                continue
            todo.append((source, key, st.st_size, st.st_mtime_ns, (old[3], old[4]) if old is not None else None))
        gone = [k for k in known if k not in seen and not os.path.exists(k)] if prune else []
        if not todo and not gone and not index.stale:
            result.seconds = time.perf_counter() - start
            return result
        con.execute("BEGIN IMMEDIATE")  # take the write lock now: a locked file fails here, before any work
        try:
            if index.stale:
                con.execute("INSERT INTO docs(docs) VALUES ('rebuild')")
                result.rebuilt = True
                _set_meta(con, {"grammar_digest": index.lang.meta.get("digest", ""), "tool": f"morphfst {__version__}"})
            for key in gone:
                row = known[key]
                con.execute("DELETE FROM docs WHERE rowid BETWEEN ? AND ?", (row[3], row[4]))
                con.execute("DELETE FROM morphfst_files WHERE path = ?", (key,))
                result.removed += 1
            total = sum(size for _, _, size, _, _ in todo)
            progress = Progress(total, quiet=quiet, desc="indexing", stream=progress_stream)
            try:
                _index_files(index, todo, jobs, progress, result)
            finally:
                progress.close()
            con.execute("COMMIT")
        except BaseException:
            if not con.getautocommit():
                con.execute("ROLLBACK")
            raise
    except apsw.Error as exc:
        raise database_error(exc, index.path) from None
    index.meta["grammar_digest"] = index.lang.meta.get("digest", "")
    result.seconds = time.perf_counter() - start
    return result


def _set_meta(con: Any, values: dict[str, str]) -> None:
    con.executemany("INSERT OR REPLACE INTO morphfst_meta VALUES (?, ?)", list(values.items()))


def _index_files(
    index: Index,
    todo: list[tuple[Source, str, int, int, tuple[int, int] | None]],
    jobs: int,
    progress: Progress,
    result: UpdateResult,
) -> None:
    """Insert the documents of every file to do, in the open transaction (committing between files every few MB)."""
    con = index.con
    unit = index.meta.get("unit", "line")
    options = IndexOptions(mode="terms", guess=index.options.guess, term_options=index.options)
    workers = None
    if jobs > 1:
        from ..corpus.local import Workers

        workers = Workers(index.lang, options, jobs, IndexChunkProcessor)
    since_commit = 0
    try:
        for source, key, size, mtime_ns, old in todo:
            if old is not None:
                con.execute("DELETE FROM docs WHERE rowid BETWEEN ? AND ?", (old[0], old[1]))
                result.changed += 1
            else:
                result.added += 1
            first = last = None
            docs = 0
            for doc_line, body in _documents(index, source, options, unit, workers, progress):
                con.execute("INSERT INTO docs(path, line, body) VALUES (?, ?, ?)", (key, doc_line, body))
                rowid = con.last_insert_rowid()
                first = rowid if first is None else first
                last = rowid
                docs += 1
            con.execute(
                "INSERT OR REPLACE INTO morphfst_files VALUES (?, ?, ?, ?, ?, ?, ?)",
                (key, size, mtime_ns, first if first is not None else 0, last if last is not None else -1, docs, size),
            )
            result.docs += docs
            result.bytes += size
            result.files.append(source.path)
            since_commit += size
            if since_commit >= COMMIT_BYTES:
                con.execute("COMMIT")
                con.execute("BEGIN IMMEDIATE")
                since_commit = 0
    finally:
        if workers is not None:
            workers.close(wait=False)


def _documents(
    index: Index, source: Source, options: IndexOptions, unit: str, workers: Any, progress: Progress
) -> Iterator[tuple[int, str]]:
    """(line number, text) of every document of one file."""
    lines = _lines(index, source, options, workers, progress)
    if unit == "line":
        for number, text in lines:
            if text.strip():
                yield number, text
        return
    parts: list[str] = []
    previous = None
    for number, text in lines:
        parts.append(("" if number == previous else "\n" if parts else "") + text)  # pieces of a cut line join directly
        previous = number
    body = "".join(parts)
    if body.strip():
        yield 1, body


def _lines(index: Index, source: Source, options: IndexOptions, workers: Any, progress: Progress) -> Iterator[tuple[int, str]]:
    """The lines of one file, in order. With worker processes, the word types of each chunk that the
    tokenizer's cache lacks are analyzed by the workers first (split between them, each type once), and
    the chunk's lines come out when their types are in the cache: SQLite then indexes them from the cache
    while the workers analyze the next chunks."""
    tokens = index.registration.analyzer(index.meta.get("lang", "tur"), index.options).tokenizer.tokens
    if workers is None:
        for chunk in source_chunks(source, options):
            lines = chunk_lines(chunk)
            progress.update(len(chunk.data), sum(len(tokens(text)) for _, text in lines) if progress.enabled else 0)
            yield from lines
        return
    import pickle
    from collections import deque

    from ..corpus.local import Job

    analyzer = index.registration.analyzer(index.meta.get("lang", "tur"), index.options)
    cache = analyzer._doc
    inflight: set[str] = set()
    pending: deque[tuple[list[tuple[int, str]], list[tuple[Job, list[str]]], int, int]] = deque()
    nprocs = len(workers.procs)
    counter = 0

    def collect() -> list[tuple[int, str]]:
        lines, jobs, nbytes, ntokens = pending.popleft()
        for job, types in jobs:
            res = workers.get(job)
            for t, terms in zip(types, pickle.loads(res.data)):
                cache[t] = terms
                inflight.discard(t)
        progress.update(nbytes, ntokens)
        return lines

    for chunk in source_chunks(source, options):
        lines = chunk_lines(chunk)
        words = [t for _, text in lines for t in tokens(text)]
        new = [t for t in dict.fromkeys(words) if t not in cache and t not in inflight]
        inflight.update(new)
        jobs: list[tuple[Job, list[str]]] = []
        if len(cache) + len(new) >= analyzer.cache_size:
            cache.clear()  # keep memory bounded: the cache starts again (types still in flight refill it)
        size = -(-len(new) // nprocs) if new else 0
        for i in range(0, len(new), max(size, 1)):
            part = new[i : i + size]
            fake = Chunk(counter, 0, "\n".join(part).encode("utf-8"))
            counter += 1
            workers.put(source.name, fake)
            jobs.append((Job(0, fake, source.path), part))
        pending.append((lines, jobs, len(chunk.data), len(words)))
        while len(pending) > 2:
            yield from collect()
    while pending:
        yield from collect()


# ---- searching --------------------------------------------------------------------------------------
@dataclass
class Hit:
    """One search result: where it is, its FTS5 rank (bm25 as SQLite gives it: lower is better), a snippet and the
    matched spans. In JSON, ``score`` is the relevance (minus the rank: higher is better)."""

    rank: int
    path: str
    line: int
    score: float
    snippet: str  # marked with MARK_START / MARK_END around matched words
    matches: list[tuple[int, int]]  # (start, end) character offsets of matched words in the document
    text: str | None = None  # the whole document (line units)

    def marked(self, start: str, end: str, text: str | None = None) -> str:
        return (self.snippet if text is None else text).replace(MARK_START, start).replace(MARK_END, end)

    def as_json(self) -> dict[str, Any]:
        out: dict[str, Any] = {
            "rank": self.rank,
            "path": self.path,
            "line": self.line,
            "score": round(-self.score, 4) + 0.0,  # bm25 relevance, higher is better
            "snippet": self.marked("[", "]"),
            "matches": [list(m) for m in self.matches],
        }
        if self.text is not None:
            out["text"] = self.text
        return out


def search(index: Index, query: str, limit: int = 10, snippet_tokens: int = 16) -> list[Hit]:
    """The best ``limit`` documents for an FTS5 query (analyzed like the documents), ranked by bm25."""
    import apsw

    try:
        rows = top_documents(index.con, query, limit, snippet_tokens, index.meta.get("unit", "line") == "line")
    except apsw.SQLError as exc:
        message = _sqlite_message(exc)
        if "no such table" not in message:  # everything else an FTS5 query can raise is about the query
            raise UserError(
                f"the query is not valid FTS5 syntax: {message}",
                hint="put words in double quotes to search for them as they are, e.g. '\"kitap\"'; operators are AND, OR, NOT, NEAR()",
            ) from None
        raise database_error(exc, index.path) from None
    except apsw.Error as exc:
        raise database_error(exc, index.path) from None
    return [
        Hit(n, _display_path(path), int(line), float(score), snip, _spans(marked), text)
        for n, (path, line, score, snip, marked, text) in enumerate(rows, start=1)
    ]


def top_documents(con: Any, query: str, limit: int, snippet_tokens: int = 16, with_text: bool = True) -> list[tuple[Any, ...]]:
    """(path, line, rank, snippet, highlighted body, body or None) of the best ``limit`` documents of table ``docs``.

    The ranking runs first on rowids alone; snippets and highlights are then made for those rows only
    (in one statement, SQLite would compute them for every matching row before sorting)."""
    ranked = con.execute("SELECT rowid, rank FROM docs WHERE docs MATCH ? ORDER BY rank LIMIT ?", (query, limit)).fetchall()
    out = []
    tokens = max(1, min(snippet_tokens, 64))
    for rowid, rank in ranked:
        row = con.execute(
            "SELECT path, line, snippet(docs, 2, ?, ?, '…', ?), highlight(docs, 2, ?, ?)"
            + (", body" if with_text else "")
            + " FROM docs WHERE docs MATCH ? AND rowid = ?",
            (MARK_START, MARK_END, tokens, MARK_START, MARK_END, query, rowid),
        ).fetchone()
        if row is not None:
            out.append((row[0], row[1], rank, row[2], row[3], row[4] if with_text else None))
    return out


def _spans(marked: str) -> list[tuple[int, int]]:
    """Character spans between the marks of a highlighted text, as offsets into the unmarked text."""
    spans = []
    pos = 0
    start = None
    for ch in marked:
        if ch == MARK_START:
            start = pos
        elif ch == MARK_END:
            if start is not None:
                spans.append((start, pos))
            start = None
        else:
            pos += 1
    return spans


def _display_path(path: str) -> str:
    try:
        return os.path.relpath(path)
    except ValueError:
        return path


def index_stats(index: Index) -> dict[str, Any]:
    """Files, documents and the size of the index file."""
    files, docs = index.con.execute("SELECT count(*), coalesce(sum(docs), 0) FROM morphfst_files").fetchone()
    return {"files": files, "docs": docs, "bytes": os.path.getsize(index.path) if os.path.exists(index.path) else 0}

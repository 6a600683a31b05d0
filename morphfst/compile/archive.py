"""The compiled file: one zip archive holding the transducers (OpenFst binary) and the metadata.

Layout: ``metadata.json`` (everything but the lexicon), ``lexicon.json`` (the lexicon entries),
``glosses.tsv`` (lemma, part of speech and gloss of every entry: what decoding needs), one
``<name>.fst`` per transducer and a packed arc table ``<name>.arcs`` (:mod:`morphfst.compile.arctable`)
of each transducer the walk reads, so that the analyzer starts without parsing an OpenFst binary
(stored uncompressed: reading it is a copy, not an inflation; every other member is deflated). The
archive comment holds a SHA-256 checksum of every byte before it, so a damaged file is detected when it is opened, by one pass over the raw bytes, without inflating
anything (the file is mapped into memory, not copied: see :func:`_read_raw`). Loading reads only ``metadata.json``; each transducer is read the first time it is used
(:class:`LazyFsts`) and the lexicon the first time a tool asks for it (:class:`Metadata`), so start-up
does not grow with the lexicon. Files are written to a temporary name and renamed when complete,
so a half-written archive never looks whole.
"""

from __future__ import annotations

import hashlib
import io
import json
import os
import struct
import zipfile
from collections.abc import Callable, Iterator, Mapping
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ..atomic import create_temp, discard, publish, write_error
from ..errors import Position, UserError
from ..version import FORMAT_VERSION
from .arctable import WALKED, Arcs, FstArcs, PackedArcs, pack

if TYPE_CHECKING:  # a transducer is read through pynini the first time it is used; loading needs none
    import pynini

SUFFIX = ".mfc"
CHECKSUM_PREFIX = b"morphfst-sha256:"
_DIGEST_LEN = 64  # hex characters of a SHA-256 digest
LAZY_MEMBERS = {"lexicon": "lexicon.json"}
_LOCAL_HEADER = b"PK\x03\x04"  # a zip member's local file header (30 bytes, then its name and extra field)


class DamagedArchive(UserError):
    """A compiled file that cannot be read back as written (truncated, changed bytes, not a zip)."""


class Metadata(dict):  # type: ignore[type-arg]
    """The metadata of a compiled language: a plain dict whose large members (the lexicon) are read
    from the archive the first time they are looked up."""

    def __init__(self, data: Mapping[str, Any], lazy: Mapping[str, Callable[[], Any]] | None = None) -> None:
        super().__init__(data)
        self._lazy: dict[str, Callable[[], Any]] = dict(lazy or {})

    def __missing__(self, key: str) -> Any:
        loader = self._lazy.pop(key, None)
        if loader is None:
            raise KeyError(key)
        value = self[key] = loader()
        return value

    def get(self, key: str, default: Any = None) -> Any:  # type: ignore[override]
        try:
            return self[key]
        except KeyError:
            return default

    def __contains__(self, key: object) -> bool:
        return super().__contains__(key) or key in self._lazy

    def is_loaded(self, key: str) -> bool:
        """True when ``key`` is held (not waiting to be read from the archive)."""
        return super().__contains__(key)

    def copy(self) -> Metadata:  # type: ignore[override]
        return Metadata(self, self._lazy)

    def transform(self, key: str, change: Callable[[Any], Any]) -> None:
        """Apply ``change`` to the value of ``key``: now if it is held, else when it is first read."""
        read = self._lazy.get(key)
        if read is None:
            self[key] = change(self[key])
        else:
            self._lazy[key] = lambda: change(read())

    def whole(self) -> dict[str, Any]:
        """A plain dict with every member read."""
        return {k: self[k] for k in [*self.keys(), *self._lazy]}


class LazyFsts(Mapping[str, "pynini.Fst"]):
    """The transducers of an archive, each read from its member the first time it is looked up."""

    def __init__(self, zf: zipfile.ZipFile, names: list[str], path: str | Path, raw: Any = b"") -> None:
        self._zf = zf
        self._raw = raw  # the whole file (checksum verified): stored members are read as views of it
        self._names = names
        self._path = path
        self._loaded: dict[str, pynini.Fst] = {}
        self._tables: dict[str, Arcs] = {}

    def __getitem__(self, name: str) -> pynini.Fst:
        fst = self._loaded.get(name)
        if fst is None:
            if name not in self._names:
                raise KeyError(name)
            import pynini

            try:
                fst = self._loaded[name] = pynini.Fst.read_from_string(self._zf.read(f"{name}.fst"))
            except Exception as exc:  # a damaged member: zlib.error, BadZipFile, pynini's FstIOError
                raise _damaged(self._path, exc) from None
        return fst

    def arcs(self, name: str) -> Arcs:
        """The arcs of transducer ``name`` for the walk: its packed table when the archive has one,
        else read through pynini."""
        table = self._tables.get(name)
        if table is None:
            member = f"{name}.arcs"
            if member in self._zf.NameToInfo:
                try:
                    table = PackedArcs(_stored_view(self._zf, self._raw, member) or self._zf.read(member))
                except Exception as exc:  # zlib.error, BadZipFile, ValueError from a damaged table
                    raise _damaged(self._path, exc) from None
            else:
                table = FstArcs(self[name])
            self._tables[name] = table
        return table

    def __iter__(self) -> Iterator[str]:
        return iter(self._names)

    def __len__(self) -> int:
        return len(self._names)


def _stored_view(zf: zipfile.ZipFile, raw: Any, name: str) -> memoryview | None:
    """A view of member ``name``'s bytes in ``raw`` when it is stored uncompressed (no copy, no CRC:
    the whole file's checksum was verified when it was opened); ``None`` otherwise."""
    info = zf.getinfo(name)
    if not raw or info.compress_type != zipfile.ZIP_STORED:
        return None
    at = info.header_offset
    if raw[at : at + 4] != _LOCAL_HEADER:
        raise ValueError(f"no local header for {name}")
    name_len, extra_len = struct.unpack_from("<HH", raw, at + 26)
    start = at + 30 + name_len + extra_len
    if start + info.file_size > len(raw):
        raise ValueError(f"{name} is truncated")
    return memoryview(raw)[start : start + info.file_size]


def glosses_tsv(lexicon: list[dict[str, Any]]) -> str:
    """``lemma TAB pos TAB gloss`` lines, the first entry of each (lemma, pos) (what decoding needs)."""
    seen: dict[tuple[str, str], str] = {}
    for entry in lexicon:
        seen.setdefault((entry["lemma"], entry["pos"]), entry["gloss"])
    return "".join(f"{_cell(lemma)}\t{_cell(pos)}\t{_cell(gloss)}\n" for (lemma, pos), gloss in seen.items())


def _cell(text: str) -> str:
    return text.replace("\t", " ").replace("\n", " ")


def read_glosses(text: str) -> dict[tuple[str, str], str]:
    """The glosses written by :func:`glosses_tsv`."""
    found: dict[tuple[str, str], str] = {}
    for line in text.splitlines():
        lemma, pos, gloss = line.split("\t", 2)
        found[(lemma, pos)] = gloss
    return found


class Glosses(Mapping[tuple[str, str], str]):
    """The glosses of :func:`glosses_tsv` text, looked up in the text itself until many lookups were
    made, then parsed whole: a command that analyzes a few words reads two or three glosses, and
    parsing all of them takes 25-30 ms (a search of the text about 0.1 ms: after ``FINDS`` searches
    a run that goes on wastes at most 6 ms, a short one saves the parse)."""

    FINDS = 64  # lookups answered by searching the text before it is parsed whole

    def __init__(self, text: str) -> None:
        self._text = "\n" + text
        self._found: dict[tuple[str, str], str] = {}
        self._parsed = False
        self._finds = 0

    def __getitem__(self, key: tuple[str, str]) -> str:
        if key in self._found or self._parsed:
            return self._found[key]
        self._finds += 1
        if self._finds > self.FINDS:
            self._parse()
            return self._found[key]
        head = "\n{}\t{}\t".format(*key)
        at = self._text.find(head) if head.count("\t") == 2 and head.count("\n") == 1 else -1
        if at < 0:
            raise KeyError(key)
        start = at + len(head)
        gloss = self._found[key] = self._text[start : self._text.index("\n", start)]
        return gloss

    def get(self, key: tuple[str, str], default: Any = None) -> Any:  # type: ignore[override]
        """:meth:`__getitem__` without raising (decoding asks for every guessed lemma, which has none)."""
        if self._parsed:
            return self._found.get(key, default)
        try:
            return self[key]
        except KeyError:
            return default

    def read_all(self) -> None:
        """Parse the text whole now (a corpus run decodes thousands of words: the finds would be wasted)."""
        if not self._parsed:
            self._parse()

    def _parse(self) -> None:
        self._found = read_glosses(self._text[1:])
        self._parsed = True
        # from now on a lookup is the dict's own: decoding asks for the gloss of every analysis
        self.get = self._found.get  # type: ignore[method-assign,assignment]

    def __iter__(self) -> Iterator[tuple[str, str]]:
        if not self._parsed:
            self._parse()
        return iter(self._found)

    def __len__(self) -> int:
        if not self._parsed:
            self._parse()
        return len(self._found)


def save_archive(path: str | Path, fsts: Mapping[str, pynini.Fst], meta: Mapping[str, Any]) -> Path:
    """Write the archive atomically; returns its path. A failed write is one :class:`UserError` and
    leaves nothing behind."""
    path = Path(path)
    lexicon = list(meta.get("lexicon") or [])
    plain = {k: v for k, v in (meta.whole() if isinstance(meta, Metadata) else meta).items() if k not in ("lexicon", "glosses")}
    members = [
        ("metadata.json", json.dumps(plain, ensure_ascii=False).encode("utf-8")),
        ("lexicon.json", json.dumps(lexicon, ensure_ascii=False).encode("utf-8")),
        ("glosses.tsv", glosses_tsv(lexicon).encode("utf-8")),
    ]
    members += [(f"{name}.fst", fst.write_to_string()) for name, fst in fsts.items()]
    members += [(f"{name}.arcs", pack(fsts[name])) for name in WALKED if name in fsts]
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", compression=zipfile.ZIP_DEFLATED, compresslevel=1) as zf:
        for name, data in members:
            # the walk's arc tables are read at every start: stored, reading one is a copy (inflating
            # Finnish's took 33 ms, a tenth of the start-up); the rest is read rarely and deflated
            stored = name.endswith(".arcs")
            zf.writestr(name, data, compress_type=zipfile.ZIP_STORED if stored else None)
        zf.comment = CHECKSUM_PREFIX + b"0" * _DIGEST_LEN
    data = buffer.getvalue()
    data = data[:-_DIGEST_LEN] + _digest(data[:-_DIGEST_LEN])
    fd, tmp = create_temp(path)
    try:
        with os.fdopen(fd, "wb") as handle:
            handle.write(data)
        publish(tmp, path)
    except OSError as exc:
        discard(tmp)
        raise write_error(exc, path) from None
    except BaseException:
        discard(tmp)
        raise
    return path


def _digest(data: bytes | memoryview) -> bytes:
    return hashlib.sha256(data).hexdigest().encode("ascii")


def _damaged(path: str | Path, why: object) -> DamagedArchive:
    return DamagedArchive(
        f"damaged compiled file ({why})",
        Position(str(path)),
        hint="rebuild it with 'morphfst build' (cached files are rebuilt automatically)",
    )


def _unreadable(path: str | Path, exc: OSError) -> UserError:
    return UserError(
        f"cannot read compiled file: {exc.strerror or exc}", Position(str(path)), hint="check the path and its permissions"
    )


class _MappedReader(io.RawIOBase):
    """A read-only file over a memory-mapped file, with its own position: what :mod:`zipfile` reads
    members through. Each process has its own position (a file descriptor's offset would be shared
    by forked workers reading at once), and nothing is copied but the bytes read."""

    def __init__(self, data: Any) -> None:
        super().__init__()
        self._data = memoryview(data)
        self._pos = 0

    def readable(self) -> bool:
        return True

    def seekable(self) -> bool:
        return True

    def tell(self) -> int:
        return self._pos

    def seek(self, offset: int, whence: int = io.SEEK_SET) -> int:
        base = {io.SEEK_SET: 0, io.SEEK_CUR: self._pos, io.SEEK_END: len(self._data)}[whence]
        self._pos = max(0, base + offset)
        return self._pos

    def read(self, size: int | None = -1) -> bytes:
        end = len(self._data) if size is None or size < 0 else min(len(self._data), self._pos + size)
        out = bytes(self._data[self._pos : end])
        self._pos = max(self._pos, end)
        return out


def _read_raw(path: str | Path) -> Any:
    """The bytes of a compiled file: mapped into memory (read-only; the page cache's pages are shared
    by every process that opens the file, and start-up does not copy 15-25 MB), else read whole.
    Compiled files are replaced by renaming, never rewritten in place, so a mapping stays valid (on
    POSIX systems only: elsewhere a mapped file cannot be replaced while it is mapped)."""
    import mmap

    with open(path, "rb") as handle:
        if os.name == "posix":
            try:
                return mmap.mmap(handle.fileno(), 0, access=mmap.ACCESS_READ)
            except (OSError, ValueError):  # an empty file, or a file system without mappings
                pass
        return handle.read()


def _open(path: str | Path) -> tuple[zipfile.ZipFile, dict[str, Any], Any]:
    """The archive, its checksum verified, and its metadata; raises :class:`DamagedArchive` for a
    damaged file and a :class:`UserError` for one of another format."""
    try:
        raw = _read_raw(path)
    except OSError as exc:
        raise _unreadable(path, exc) from None
    tail = raw[-(len(CHECKSUM_PREFIX) + _DIGEST_LEN) :]
    checked = tail.startswith(CHECKSUM_PREFIX)
    if checked and tail[len(CHECKSUM_PREFIX) :] != _digest(memoryview(raw)[:-_DIGEST_LEN]):  # no copy
        raise _damaged(path, "checksum mismatch")
    try:
        zf = zipfile.ZipFile(_MappedReader(raw) if not isinstance(raw, bytes) else io.BytesIO(raw))
        meta: Any = json.loads(zf.read("metadata.json"))
    except Exception as exc:  # whatever a damaged zip raises (BadZipFile, KeyError, zlib.error, ValueError, ...)
        raise _damaged(path, exc) from None
    if not isinstance(meta, dict):
        raise _damaged(path, "metadata is not an object")
    if meta.get("format") != FORMAT_VERSION:
        raise UserError(
            f"compiled file has format {meta.get('format')}, this morphfst reads format {FORMAT_VERSION}",
            Position(str(path)),
            hint="recompile it with 'morphfst build'",
        )
    if not checked:
        raise _damaged(path, "no checksum")
    return zf, meta, raw


def read_metadata(path: str | Path) -> Metadata:
    """The metadata of an archive (the transducers are not read; the lexicon is read on first use)."""
    zf, meta, _ = _open(path)
    return _metadata(zf, meta, path)


def _metadata(zf: zipfile.ZipFile, meta: dict[str, Any], path: str | Path) -> Metadata:
    def member(name: str, parse: Callable[[bytes], Any]) -> Callable[[], Any]:
        def load() -> Any:
            try:
                return parse(zf.read(name))
            except Exception as exc:
                raise _damaged(path, exc) from None

        return load

    lazy = {key: member(name, json.loads) for key, name in LAZY_MEMBERS.items()}
    lazy["glosses"] = member("glosses.tsv", lambda b: Glosses(b.decode("utf-8")))
    return Metadata(meta, lazy)


def load_archive(path: str | Path) -> tuple[LazyFsts, Metadata]:
    """The transducers (read on first use) and the metadata of an archive, its checksum checked; a
    damaged file raises :class:`DamagedArchive`, a file of another format a :class:`UserError`."""
    zf, meta, raw = _open(path)
    names = [info.filename[:-4] for info in zf.infolist() if info.filename.endswith(".fst")]
    return LazyFsts(zf, names, path, raw), _metadata(zf, meta, path)

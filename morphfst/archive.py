"""The compiled file: one zip archive holding the transducers (OpenFst binary) and metadata.json.

Layout: ``metadata.json`` plus one ``<name>.fst`` per transducer; the archive comment holds a
SHA-256 checksum over every member's name and bytes, so a damaged file is detected on reading (the
zip members' CRC-32 checks catch most damage too). Files are written to a temporary name and
renamed when complete, so a half-written archive never looks whole.
"""

from __future__ import annotations

import hashlib
import json
import os
import zipfile
from pathlib import Path
from typing import Any

import pynini

from .atomic import create_temp, discard, publish, write_error
from .errors import Position, UserError
from .version import FORMAT_VERSION

SUFFIX = ".mfc"
CHECKSUM_PREFIX = b"morphfst-sha256:"


class DamagedArchive(UserError):
    """A compiled file that cannot be read back as written (truncated, changed bytes, not a zip)."""


def _checksum(members: list[tuple[str, bytes]]) -> bytes:
    h = hashlib.sha256()
    for name, data in members:
        h.update(name.encode("utf-8") + b"\0" + len(data).to_bytes(8, "little"))
        h.update(data)
    return CHECKSUM_PREFIX + h.hexdigest().encode("ascii")


def save_archive(path: str | Path, fsts: dict[str, pynini.Fst], meta: dict[str, Any]) -> Path:
    """Write the archive atomically; returns its path. A failed write is one :class:`UserError` and
    leaves nothing behind."""
    path = Path(path)
    members = [("metadata.json", json.dumps(meta, ensure_ascii=False).encode("utf-8"))]
    members += [(f"{name}.fst", fst.write_to_string()) for name, fst in fsts.items()]
    fd, tmp = create_temp(path)
    try:
        with os.fdopen(fd, "wb") as handle, zipfile.ZipFile(handle, "w", compression=zipfile.ZIP_DEFLATED, compresslevel=1) as zf:
            for name, data in members:
                zf.writestr(name, data)
            zf.comment = _checksum(members)
        publish(tmp, path)
    except OSError as exc:
        discard(tmp)
        raise write_error(exc, path) from None
    except BaseException:
        discard(tmp)
        raise
    return path


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


def read_metadata(path: str | Path) -> dict[str, Any]:
    """Only the metadata of an archive (cheap: no transducer is read)."""
    try:
        with zipfile.ZipFile(path) as zf:
            meta: dict[str, Any] = json.loads(zf.read("metadata.json"))
    except (FileNotFoundError, PermissionError, IsADirectoryError) as exc:
        raise _unreadable(path, exc) from None
    except Exception as exc:  # whatever a damaged zip raises (BadZipFile, zlib.error, NotImplementedError, ...)
        raise _damaged(path, exc) from None
    if not isinstance(meta, dict):
        raise _damaged(path, "metadata is not an object")
    return meta


def load_archive(path: str | Path) -> tuple[dict[str, pynini.Fst], dict[str, Any]]:
    """Read every transducer and the metadata of an archive, checking its checksum; a damaged file
    raises :class:`DamagedArchive`, a file of another format a :class:`UserError`."""
    try:
        with zipfile.ZipFile(path) as zf:
            members = [(info.filename, zf.read(info)) for info in zf.infolist()]
            comment = zf.comment
    except (FileNotFoundError, PermissionError, IsADirectoryError) as exc:
        raise _unreadable(path, exc) from None
    except Exception as exc:  # whatever a damaged zip raises (BadZipFile, zlib.error, NotImplementedError, ...)
        raise _damaged(path, exc) from None
    if comment != _checksum(members) and comment.startswith(CHECKSUM_PREFIX):
        raise _damaged(path, "checksum mismatch")
    data = dict(members)
    try:
        meta: dict[str, Any] = json.loads(data["metadata.json"])
    except (KeyError, ValueError, UnicodeDecodeError) as exc:
        raise _damaged(path, exc) from None
    if comment != _checksum(members) and isinstance(meta, dict) and meta.get("format") == FORMAT_VERSION:
        raise _damaged(path, "no checksum")
    if not isinstance(meta, dict) or meta.get("format") != FORMAT_VERSION:
        got = meta.get("format") if isinstance(meta, dict) else None
        raise UserError(
            f"compiled file has format {got}, this morphfst reads format {FORMAT_VERSION}",
            Position(str(path)),
            hint="recompile it with 'morphfst build'",
        )
    fsts: dict[str, pynini.Fst] = {}
    for name, blob in members:
        if name.endswith(".fst"):
            try:
                fsts[name[:-4]] = pynini.Fst.read_from_string(blob)
            except Exception as exc:  # pynini raises its own FstIOError
                raise _damaged(path, exc) from None
    return fsts, meta

"""The compiled file: one zip archive holding the transducers (OpenFst binary) and metadata.json.

Layout: ``metadata.json`` plus one ``<name>.fst`` per transducer. Files are written to a temporary
name and renamed when complete, so a half-written archive never looks whole.
"""

from __future__ import annotations

import json
import os
import tempfile
import zipfile
from pathlib import Path
from typing import Any

import pynini

from .atomic import publish
from .errors import Position, UserError
from .version import FORMAT_VERSION

SUFFIX = ".mfc"


def save_archive(path: str | Path, fsts: dict[str, pynini.Fst], meta: dict[str, Any]) -> Path:
    """Write the archive atomically; returns its path."""
    path = Path(path)
    try:
        path.parent.mkdir(parents=True, exist_ok=True)
        fd, tmp = tempfile.mkstemp(prefix=path.name + ".", suffix=".part", dir=path.parent)
    except OSError as exc:
        raise UserError(
            f"cannot write output: {exc.strerror or exc}", Position(str(path)), hint="check the output path"
        ) from None
    os.close(fd)
    try:
        with zipfile.ZipFile(tmp, "w", compression=zipfile.ZIP_DEFLATED, compresslevel=1) as zf:
            zf.writestr("metadata.json", json.dumps(meta, ensure_ascii=False))
            for name, fst in fsts.items():
                zf.writestr(f"{name}.fst", fst.write_to_string())
        publish(tmp, path)
    except BaseException:
        Path(tmp).unlink(missing_ok=True)
        raise
    return path


def read_metadata(path: str | Path) -> dict[str, Any]:
    """Only the metadata of an archive (cheap: no transducer is read)."""
    try:
        with zipfile.ZipFile(path) as zf:
            meta: dict[str, Any] = json.loads(zf.read("metadata.json"))
    except (OSError, KeyError, zipfile.BadZipFile, json.JSONDecodeError) as exc:
        raise UserError(
            f"not a morphfst compiled file: {exc}", Position(str(path)), hint="recompile it with 'morphfst build'"
        ) from None
    return meta


def load_archive(path: str | Path) -> tuple[dict[str, pynini.Fst], dict[str, Any]]:
    """Read every transducer and the metadata of an archive."""
    meta = read_metadata(path)
    if meta.get("format") != FORMAT_VERSION:
        raise UserError(
            f"compiled file has format {meta.get('format')}, this morphfst reads format {FORMAT_VERSION}",
            Position(str(path)),
            hint="recompile it with 'morphfst build'",
        )
    fsts: dict[str, pynini.Fst] = {}
    with zipfile.ZipFile(path) as zf:
        for info in zf.infolist():
            if info.filename.endswith(".fst"):
                fsts[info.filename[:-4]] = pynini.Fst.read_from_string(zf.read(info))
    return fsts, meta

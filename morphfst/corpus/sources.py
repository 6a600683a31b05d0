"""Inputs and outputs of a corpus run: which files to read, where each output goes.

Inputs are files, directories (every regular, non-hidden file below them, sorted by path) or ``-``
(standard input). With one input and an output that is not a directory, the output is that file (or
standard output); otherwise the output is a directory with one output per input (or per input
partition on a cluster) and a ``manifest.json`` written last, which lists every output in input
order with its counts: a directory without a manifest is an unfinished run.
"""

from __future__ import annotations

import json
import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from ..compile.archive import SUFFIX, save_archive
from ..errors import Position, UserError
from ..runtime.compiled_language import Language
from .outputs import atomic_text

MANIFEST = "manifest.json"


@dataclass(frozen=True)
class Source:
    """One input: a path (``-`` for standard input), a short name for ids and output names, its size."""

    path: str
    name: str
    size: int | None

    @property
    def is_stdin(self) -> bool:
        return self.path == "-"


def expand_inputs(paths: list[str]) -> list[Source]:
    """The input files named by ``paths`` (files, directories, ``-``), in order, with unique names."""
    files: list[str] = []
    for p in paths or ["-"]:
        if p == "-":
            files.append("-")
            continue
        path = Path(p)
        if path.is_dir():
            found = sorted(
                str(f)
                for f in path.rglob("*")
                if f.is_file() and not any(part.startswith(".") for part in f.relative_to(path).parts)
            )
            if not found:
                raise UserError(
                    "the input directory holds no files", Position(p), hint="give files or a directory with text files"
                )
            files.extend(found)
        elif path.is_file():
            files.append(str(path))
        else:
            raise UserError("no such input file or directory", Position(p), hint="check the path")
    if files.count("-") > 1:
        raise UserError("standard input ('-') given twice", hint="give '-' at most once")
    sources: list[Source] = []
    used: dict[str, int] = {}
    for f in files:
        base = "stdin" if f == "-" else Path(f).name
        n = used.get(base, 0) + 1
        used[base] = n
        name = base if n == 1 else f"{base}-{n}"
        size = None if f == "-" else os.path.getsize(f)
        sources.append(Source(f, name, size))
    return sources


def output_is_directory(output: str | None, sources: list[Source], cluster: bool) -> bool:
    if cluster:
        return True
    if output is None or output == "-":
        return False
    return len(sources) > 1 or output.endswith(("/", os.sep)) or Path(output).is_dir()


def output_path(directory: str | Path, source: Source, suffix: str, partition: int | None = None) -> Path:
    name = source.name if partition is None else f"{source.name}.part{partition:05d}"
    return Path(directory) / f"{name}{suffix}"


def write_manifest(directory: str | Path, entries: list[dict[str, Any]], info: dict[str, Any]) -> Path:
    """The manifest of an output directory (written last, atomically)."""
    path = Path(directory) / MANIFEST
    with atomic_text(path) as out:
        json.dump(info | {"outputs": entries}, out, ensure_ascii=False, indent=1)
        out.write("\n")
    return path


def compiled_file(lang: Language, directory: str | Path | None = None) -> str:
    """A compiled file (.mfc) holding ``lang``, for worker processes to load (saved if it has none)."""
    if lang.path and lang.path.endswith(SUFFIX) and Path(lang.path).exists():
        return lang.path
    import atexit
    import shutil
    import tempfile

    from ..atomic import pid_alive

    # a run killed outright leaves its folder: remove those of processes that are gone (only ours)
    base = Path(directory or tempfile.gettempdir())
    for old in base.glob("morphfst-workers-*-*"):
        pid = old.name.split("-")[2]
        if pid.isdigit() and not pid_alive(int(pid)):
            shutil.rmtree(old, ignore_errors=True)
    folder = tempfile.mkdtemp(prefix=f"morphfst-workers-{os.getpid()}-", dir=directory)
    atexit.register(shutil.rmtree, folder, True)  # removed when this process ends
    target = Path(folder) / f"{lang.name}{SUFFIX}"
    save_archive(target, lang.fsts, lang.meta)
    return str(target)


def load_compiled(path: str) -> Language:
    """Load a compiled file as it is (no source check, no recompilation): what workers run."""
    from ..compile.archive import load_archive

    fsts, meta = load_archive(path)
    return Language(fsts, meta, path)

"""Hashes of source files: what names a compiled file in the cache (kept apart from the metadata
builder so that loading a cached language imports nothing of the compiler)."""

from __future__ import annotations

import hashlib
from pathlib import Path

from .version import FORMAT_VERSION, __version__


def file_hash(path: str | Path) -> str:
    return hashlib.sha256(Path(path).read_bytes()).hexdigest()


COMPILER_MODULES = (
    "grammar.lark",
    "syntax.py",
    "model.py",
    "validate.py",
    "lexicon.py",
    "loader.py",
    "compiler.py",
    "symbols.py",
    "fstutil.py",
    "normalize.py",
    "metadata.py",
    "sourcehash.py",
    "stemrules.py",
)


def compiler_digest() -> str:
    """A hash of the compiler's own source, so a changed compiler recompiles cached languages."""
    h = hashlib.sha256()
    here = Path(__file__).resolve().parent
    for name in COMPILER_MODULES:
        path = here / name
        if path.exists():
            h.update(path.read_bytes())
    return h.hexdigest()


def sources_digest(paths: list[str]) -> str:
    """One hash over the compiler (version and source) and every source file (name and content)."""
    h = hashlib.sha256(f"morphfst {__version__} format {FORMAT_VERSION} {compiler_digest()}".encode())
    for p in paths:
        h.update(Path(p).name.encode())
        h.update(Path(p).read_bytes())
    return h.hexdigest()

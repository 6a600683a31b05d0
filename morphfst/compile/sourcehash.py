"""Hashes of source files: what names a compiled file in the cache (kept apart from the metadata
builder so that loading a cached language imports nothing of the compiler)."""

from __future__ import annotations

import hashlib
from pathlib import Path

from ..version import FORMAT_VERSION, __version__


def file_hash(path: str | Path) -> str:
    return hashlib.sha256(Path(path).read_bytes()).hexdigest()


COMPILER_MODULES = (  # paths under the morphfst package
    "language/grammar.lark",
    "language/syntax.py",
    "language/model.py",
    "language/validate.py",
    "language/lexicon.py",
    "language/symbols.py",
    "language/normalize.py",
    "compile/loader.py",
    "compile/compiler.py",
    "compile/archive.py",  # the compiled file's layout (which members, how stored)
    "compile/arctable.py",
    "compile/fstutil.py",
    "compile/metadata.py",
    "compile/sourcehash.py",
    "compile/stemrules.py",
)


def compiler_digest() -> str:
    """A hash of the compiler's own source, so a changed compiler recompiles cached languages."""
    h = hashlib.sha256()
    package = Path(__file__).resolve().parent.parent
    for name in COMPILER_MODULES:
        path = package / name
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

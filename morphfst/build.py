"""Find, compile, cache and load languages.

``load(name_or_path)`` accepts a shipped grammar name (``tur``), a grammar file (``*.mfg``) or a
compiled file (``*.mfc``). Compiled files are cached under ``$MORPHFST_CACHE`` (default
``~/.cache/morphfst``) by a hash of the compiler version and every source file, so loading reuses
the compiled file while the sources are unchanged and recompiles when any of them changes.
"""

from __future__ import annotations

import os
import time
from collections.abc import Callable
from pathlib import Path

from . import model as m
from .archive import SUFFIX, load_archive, save_archive
from .compiler import Compiler
from .errors import Position, UserError
from .layout import declared_layouts
from .lexicon import lexicon_files
from .loader import load_model
from .metadata import build_metadata, file_hash, sources_digest
from .runtime import Language
from .syntax import parse_grammar_file

GRAMMAR_SUFFIX = ".mfg"
PACKAGE_ROOT = Path(__file__).resolve().parent.parent


def grammar_dirs() -> list[Path]:
    """Where grammar names are looked up, in order."""
    dirs = [Path(p) for p in os.environ.get("MORPHFST_GRAMMARS", "").split(os.pathsep) if p]
    dirs += [Path.cwd() / "grammars", PACKAGE_ROOT / "grammars"]
    return list(dict.fromkeys(dirs))


def cache_dir() -> Path:
    env = os.environ.get("MORPHFST_CACHE")
    if env:
        return Path(env)
    return Path(os.environ.get("XDG_CACHE_HOME", Path.home() / ".cache")) / "morphfst"


def find_grammar(name_or_path: str | Path) -> Path:
    """The grammar or compiled file that ``name_or_path`` names."""
    path = Path(name_or_path)
    if path.suffix in {GRAMMAR_SUFFIX, SUFFIX} or os.sep in str(name_or_path):
        if path.exists():
            return path
        raise UserError(f"no such file: {path}", hint="give a grammar (.mfg), a compiled file (.mfc) or a shipped grammar name")
    for directory in grammar_dirs():
        candidate = directory / f"{name_or_path}{GRAMMAR_SUFFIX}"
        if candidate.exists():
            return candidate
    shipped = sorted({p.stem for d in grammar_dirs() if d.is_dir() for p in d.glob(f"*{GRAMMAR_SUFFIX}")})
    raise UserError(
        f"unknown language {str(name_or_path)!r}",
        hint=("shipped grammars: " + ", ".join(shipped)) if shipped else "give the path of a grammar file",
    )


def source_files(grammar_path: Path) -> tuple[str, list[str]]:
    """The grammar's name, and the grammar file, the files it includes and its lexicon files (for the
    source hash), without compiling."""
    grammar = parse_grammar_file(grammar_path)
    included = [str(p) for p in grammar.sources[1:]]
    return grammar.name, [str(grammar_path), *included] + [str(p) for p in lexicon_files(grammar)]


def compile_grammar(
    grammar_path: str | Path,
    output: str | Path | None = None,
    progress: Callable[[str], None] | None = None,
    extra_entries: list[m.LexEntry] | None = None,
) -> Path:
    """Compile a grammar and its lexicons into one compiled file; returns the file's path."""
    grammar_path = Path(grammar_path)
    t0 = time.perf_counter()
    grammar = load_model(grammar_path, extra_entries)
    compiler = Compiler(grammar)
    built = compiler.build(progress)
    meta = build_metadata(grammar, compiler.space)
    declared_layouts(meta, None)  # a layout naming an unknown dimension or label is a grammar error
    meta["compile_seconds"] = round(time.perf_counter() - t0, 3)
    meta["timings"] = {k: round(v, 3) for k, v in built.timings.items()}
    if output is None:
        output = cache_dir() / f"{grammar.name}-{meta['digest'][:16]}{SUFFIX}"
    return save_archive(output, built.fsts, meta)


def _fresh(meta: dict[str, object]) -> bool | None:
    """True if the recorded sources are unchanged, False if changed, None if they are not here."""
    sources = meta.get("sources") or []
    for src in sources:  # type: ignore[attr-defined]
        path = Path(src["path"])
        if not path.exists():
            return None
        if file_hash(path) != src["sha256"]:
            return False
    return True


def load(name_or_path: str | Path, recompile: bool = False) -> Language:
    """Load a language by shipped name, grammar file or compiled file (compiling when needed)."""
    path = find_grammar(name_or_path)
    if path.suffix == SUFFIX:
        fsts, meta = load_archive(path)
        if recompile or _fresh(meta) is False:
            compile_grammar(Path(meta["grammar_path"]), path)
            fsts, meta = load_archive(path)
        return Language(fsts, meta, str(path))
    try:
        name, files = source_files(path)
        digest = sources_digest(files)
    except OSError as exc:
        raise UserError(f"cannot read a source file: {exc}", Position(str(path))) from None
    cached = cache_dir() / f"{name}-{digest[:16]}{SUFFIX}"
    if recompile or not cached.exists():
        compile_grammar(path, cached)
    fsts, meta = load_archive(cached)
    return Language(fsts, meta, str(cached))

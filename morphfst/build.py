"""Find, compile, cache and load languages.

``load(name_or_path)`` accepts a shipped grammar name (``tur``), a grammar file (``*.mfg``) or a
compiled file (``*.mfc``). A shipped name always means the grammar shipped inside the package (found
with :mod:`importlib.resources`); names that are not shipped are also looked up in the folders of
``$MORPHFST_GRAMMARS``. A grammar of one's own is given as a path.

Grammars are compiled into a cache under ``$MORPHFST_CACHE`` (default ``~/.cache/morphfst``), keyed
by a hash of the compiler version and every source file, so loading reuses the compiled file while
the sources are unchanged and recompiles when any of them changes. A damaged cache entry (checksum)
is reported in one line and rebuilt; only the newest :data:`CACHE_KEEP` entries per language are
kept, besides the current compile of every other copy of the grammar still on disk. When the cache
cannot be written the language is compiled in memory. A compiled file named by the user is loaded as
it is, never recompiled or overwritten.
"""

from __future__ import annotations

import hashlib
import json
import os
import re
import sys
import time
from collections.abc import Callable, Mapping
from importlib import resources
from pathlib import Path
from typing import TYPE_CHECKING, Any

from .atomic import write_bytes_atomic
from .compile.archive import SUFFIX, DamagedArchive, Metadata, load_archive, save_archive
from .compile.sourcehash import file_hash, sources_digest
from .errors import Position, UserError
from .runtime.compiled_language import Language

if TYPE_CHECKING:  # the compiler and the grammar parser are imported only when something is compiled
    import pynini

    from .language import model as m

GRAMMAR_SUFFIX = ".mfg"
PACKAGE_ROOT = Path(__file__).resolve().parent.parent
CACHE_KEEP = 3  # compiled files kept per language name in the cache
_CACHE_NAME = re.compile(rf"(.+)-[0-9a-f]{{16}}{re.escape(SUFFIX)}\Z")


def shipped_grammar_dir() -> Path | None:
    """The folder of the shipped grammars: inside the installed package (a wheel maps the repository's
    top-level ``grammars/`` and ``lexicons/`` into ``morphfst/``), or the checkout's ``grammars/`` for
    an editable install."""
    packaged = resources.files("morphfst").joinpath("grammars")
    if isinstance(packaged, Path) and packaged.is_dir():
        return packaged
    checkout = PACKAGE_ROOT / "grammars"
    return checkout if checkout.is_dir() and (PACKAGE_ROOT / "pyproject.toml").is_file() else None


def grammar_dirs() -> list[Path]:
    """Where grammar names are looked up, in order: the shipped grammars, then ``$MORPHFST_GRAMMARS``."""
    shipped = shipped_grammar_dir()
    dirs = [shipped] if shipped else []
    dirs += [Path(p) for p in os.environ.get("MORPHFST_GRAMMARS", "").split(os.pathsep) if p]
    return list(dict.fromkeys(dirs))


def shipped_names() -> list[str]:
    shipped = shipped_grammar_dir()
    return sorted(p.stem for p in shipped.glob(f"*{GRAMMAR_SUFFIX}")) if shipped else []


def cache_dir() -> Path:
    env = os.environ.get("MORPHFST_CACHE")
    if env:
        return Path(env)
    return Path(os.environ.get("XDG_CACHE_HOME", Path.home() / ".cache")) / "morphfst"


def warn(message: str) -> None:
    """One line on standard error (the CLI and the library report cache events the same way)."""
    sys.stderr.write(message.rstrip("\n") + "\n")


def _on_terminal() -> bool:
    """True when standard error is a terminal: someone is waiting, and may be told why."""
    try:
        return sys.stderr.isatty()
    except (AttributeError, ValueError):
        return False


def find_grammar(name_or_path: str | Path) -> Path:
    """The grammar or compiled file that ``name_or_path`` names."""
    path = Path(name_or_path)
    if path.suffix in {GRAMMAR_SUFFIX, SUFFIX} or os.sep in str(name_or_path) or "/" in str(name_or_path):
        if path.is_file():
            return path
        raise UserError(f"no such file: {path}", hint="give a grammar (.mfg), a compiled file (.mfc) or a shipped grammar name")
    for directory in grammar_dirs():
        candidate = directory / f"{name_or_path}{GRAMMAR_SUFFIX}"
        if candidate.is_file():
            return candidate
    known = sorted({p.stem for d in grammar_dirs() if d.is_dir() for p in d.glob(f"*{GRAMMAR_SUFFIX}")})
    raise UserError(
        f"unknown language {str(name_or_path)!r}",
        hint=("shipped grammars: " + ", ".join(known) + "; a grammar of your own is given as a path")
        if known
        else "give the path of a grammar file",
    )


def source_files(grammar_path: Path) -> tuple[str, list[str]]:
    """The grammar's name, and the grammar file, the files it includes and its lexicon files (for the
    source hash), without compiling (the grammar is parsed)."""
    name, files, _ = _parsed_sources(grammar_path)
    return name, files


def _parsed_sources(grammar_path: Path) -> tuple[str, list[str], dict[str, list[str]]]:
    from .language.lexicon import lexicon_files
    from .language.syntax import parse_grammar_file

    grammar = parse_grammar_file(grammar_path)
    included = [str(p) for p in grammar.sources[1:]]
    files = [str(grammar_path), *included] + [str(p) for p in lexicon_files(grammar)]
    base = Path(grammar.path).parent
    folders = {str(d): _listing(d) for d in ((base / p).resolve() for p in grammar.lexicon_paths) if d.is_dir()}
    return grammar.name, files, folders


def _listing(folder: Path) -> list[str]:
    """The lexicon files of a lexicon folder (what :func:`morphfst.language.lexicon.lexicon_files` reads)."""
    return sorted(p.name for p in folder.glob("*.tsv"))


def cache_key(grammar_path: Path) -> tuple[str, list[str], str]:
    """The grammar's name, its source files and the digest that names its compiled file in the cache.

    The digest is a hash of the bytes of every source file (:func:`morphfst.compile.metadata.sources_digest`).
    Which files those are is only known by parsing the grammar (its includes and lexicon lines), so
    the list is kept in a small manifest in the cache, keyed by the grammar's path: when the listed
    files still hash to the recorded digest and the lexicon folders hold the same files, the grammar
    is not parsed at all (its own bytes, which say what it includes, are among the hashed ones).
    """
    manifest = cache_dir() / "sources" / (hashlib.sha256(str(grammar_path.resolve()).encode()).hexdigest()[:16] + ".json")
    try:
        recorded = json.loads(manifest.read_text("utf-8"))
        files = [str(f) for f in recorded["files"]]
        if all(_listing(Path(d)) == names for d, names in recorded["folders"].items()):
            digest = sources_digest(files)
            if digest == recorded["digest"] and files[0] == str(grammar_path):
                return str(recorded["name"]), files, digest
    except (OSError, ValueError, KeyError, TypeError, AttributeError):
        pass
    name, files, folders = _parsed_sources(grammar_path)
    digest = sources_digest(files)
    record = {"grammar": str(grammar_path.resolve()), "name": name, "files": files, "folders": folders, "digest": digest}
    try:
        write_bytes_atomic(manifest, json.dumps(record, ensure_ascii=False).encode("utf-8"))
    except (UserError, OSError):
        pass  # an unwritable cache: the grammar is parsed again next time
    return name, files, digest


def compile_in_memory(
    grammar_path: str | Path,
    progress: Callable[[str], None] | None = None,
    extra_entries: list[m.LexEntry] | None = None,
) -> tuple[dict[str, pynini.Fst], dict[str, Any]]:
    """Compile a grammar and its lexicons; returns the transducers and the metadata."""
    from .compile.compiler import Compiler
    from .compile.loader import load_model
    from .compile.metadata import build_metadata
    from .tables.layout import declared_layouts

    t0 = time.perf_counter()
    grammar = load_model(grammar_path, extra_entries)
    compiler = Compiler(grammar)
    built = compiler.build(progress)
    meta = build_metadata(grammar, compiler.space)
    declared_layouts(meta, None)  # a layout naming an unknown dimension or label is a grammar error
    meta["compile_seconds"] = round(time.perf_counter() - t0, 3)
    meta["timings"] = {k: round(v, 3) for k, v in built.timings.items()}
    return built.fsts, meta


def compile_grammar(
    grammar_path: str | Path,
    output: str | Path | None = None,
    progress: Callable[[str], None] | None = None,
    extra_entries: list[m.LexEntry] | None = None,
) -> Path:
    """Compile a grammar and its lexicons into one compiled file; returns the file's path."""
    fsts, meta = compile_in_memory(grammar_path, progress, extra_entries)
    if output is None:
        output = cache_dir() / f"{meta['name']}-{meta['digest'][:16]}{SUFFIX}"
        saved = save_archive(output, fsts, meta)
        prune_cache(meta["name"], keep=saved)
        return saved
    return save_archive(output, fsts, meta)


def _fresh(meta: dict[str, object]) -> bool | None:
    """True if the recorded sources are unchanged, False if changed, None if they are not here."""
    sources = meta.get("sources") or []
    for src in sources:  # type: ignore[attr-defined]
        path = Path(src["path"])
        if not path.exists():
            return None
        try:
            if file_hash(path) != src["sha256"]:
                return False
        except OSError:
            return None
    return True


# ---- the cache ----------------------------------------------------------------------------------------


def cache_entries(directory: Path | None = None) -> list[Path]:
    """The compiled files in the cache, newest first."""
    directory = directory or cache_dir()
    try:
        found = [p for p in directory.iterdir() if _CACHE_NAME.match(p.name) and p.is_file()]
    except OSError:
        return []
    return sorted(found, key=_mtime, reverse=True)


def _mtime(path: Path) -> float:
    try:
        return path.stat().st_mtime
    except OSError:
        return 0.0


def _current_files() -> set[str]:
    """Names of the compiled files that are the current compile of a grammar still on disk (from the
    source manifests of :func:`cache_key`): two copies of a grammar with the same language name, in two
    places, each keep their current file however often the other is recompiled."""
    current: set[str] = set()
    try:
        manifests = list((cache_dir() / "sources").glob("*.json"))
    except OSError:
        return current
    for manifest in manifests:
        try:
            record = json.loads(manifest.read_text("utf-8"))
            if Path(record["grammar"]).is_file():
                current.add(f"{record['name']}-{str(record['digest'])[:16]}{SUFFIX}")
        except (OSError, ValueError, KeyError, TypeError):
            continue
    return current


def prune_cache(name: str, keep: Path | None = None, newest: int = CACHE_KEEP) -> list[Path]:
    """Remove all but the ``newest`` compiled files of language ``name`` from the cache (never ``keep``,
    nor the current compile of another grammar of that name still on disk)."""
    mine = [p for p in cache_entries() if (match := _CACHE_NAME.match(p.name)) and match.group(1) == name]
    current = _current_files()
    mine = [p for p in mine if p.name not in current or p == keep]
    if keep is not None:
        mine = [p for p in mine if p != keep]
        newest -= 1
    removed: list[Path] = []
    for path in mine[max(newest, 0) :]:
        try:
            path.unlink()
            removed.append(path)
        except OSError:
            pass
    return removed


def clear_cache() -> list[Path]:
    """Remove every compiled file (and leftover temporary file) from the cache."""
    removed: list[Path] = []
    directory = cache_dir()
    try:
        names = list(directory.iterdir())
    except OSError:
        return removed
    for path in names:
        if _CACHE_NAME.match(path.name) or (path.name.startswith(".") and path.name.endswith(".part") and SUFFIX in path.name):
            try:
                path.unlink()
                removed.append(path)
            except OSError as exc:
                raise UserError(
                    f"cannot remove {path}: {exc.strerror or exc}", hint="check the cache directory's permissions"
                ) from None
    return removed


def _with_current_sources(meta: dict[str, Any], grammar_path: Path, files: list[str]) -> dict[str, Any]:
    """The metadata with the paths of the sources loaded now (a cache entry may have been compiled from
    another copy of the same files: the cache is keyed by content). The sources' hashes are those
    recorded: the cache key has just checked that the files hash to the same digest."""
    old = [str(s.get("path", "")) for s in meta.get("sources") or []]
    hashes = [str(s.get("sha256", "")) for s in meta.get("sources") or []]
    new = [str(Path(p).resolve()) for p in files]
    meta = meta.copy() if isinstance(meta, Metadata) else Metadata(meta)
    meta["grammar_path"] = str(grammar_path.resolve())
    if len(old) == len(new):
        meta["sources"] = [{"path": p, "sha256": h} for p, h in zip(new, hashes)]
        moved = dict(zip(old, new))
        if old != new:

            def relocated(entry: dict[str, Any]) -> dict[str, Any]:
                file = entry.get("file")
                if not file:
                    return entry
                return entry | {"file": moved.get(file) or moved.get(str(Path(file).resolve()), file)}

            if "lexicon" in meta:
                meta.transform("lexicon", lambda entries: [relocated(e) for e in entries])
    else:
        meta["sources"] = [{"path": p, "sha256": file_hash(p)} for p in new]
    return meta


def load(name_or_path: str | Path, recompile: bool = False) -> Language:
    """Load a language by shipped name, grammar file or compiled file (compiling when needed).

    A compiled file (``.mfc``) is loaded as it is: if its sources changed since it was compiled a
    warning says so, but it is never recompiled or overwritten (``recompile`` is ignored for it)."""
    path = find_grammar(name_or_path)
    if path.suffix == SUFFIX:
        fsts, meta = load_archive(path)
        if _fresh(meta) is False:
            warn(
                f"warning: {path}: its sources changed after it was compiled; loading it as it is "
                f"(rebuild it with 'morphfst build {meta.get('grammar_path', 'GRAMMAR')} -o {path}')"
            )
        return Language(fsts, meta, str(path))
    try:
        name, files, digest = cache_key(path)
    except OSError as exc:
        raise UserError(f"cannot read a source file: {exc}", Position(str(path))) from None
    cached = cache_dir() / f"{name}-{digest[:16]}{SUFFIX}"
    loaded: tuple[Mapping[str, pynini.Fst], dict[str, Any]] | None = None
    if not recompile and cached.is_file():
        try:
            loaded = load_archive(cached)
        except DamagedArchive as exc:
            warn(f"warning: {cached}: damaged cache entry ({exc.message.partition('(')[2].rstrip(')')}); rebuilding it")
        except UserError:
            pass  # another format: rebuilt below
    where: str | None = str(cached)
    if loaded is None:
        # a first use compiles (seconds for a small grammar, minutes for the shipped Finnish one):
        # on a terminal, say so rather than seem to hang
        tell = _on_terminal()
        if tell:
            warn(f"morphfst: compiling {path} into the cache {cache_dir()} (once, until its sources change)...")
        began = time.perf_counter()
        loaded = compile_in_memory(path)
        if tell:
            warn(f"morphfst: compiled {name} in {time.perf_counter() - began:.0f} s")
        try:
            save_archive(cached, *loaded)
            prune_cache(name, keep=cached)
            # read back as every later run reads it: the walk then has the file's packed arc tables
            # (and the walk in C), not the in-memory transducers read through pynini
            loaded = load_archive(cached)
        except UserError as exc:
            where = None
            warn(
                f"warning: cannot write the compiled-file cache {cache_dir()} ({exc.message.partition(': ')[2].split(';')[0]}); "
                "compiled in memory for this run only; set MORPHFST_CACHE to a writable directory to reuse compiled files"
            )
    return Language(loaded[0], _with_current_sources(loaded[1], path, files), where)

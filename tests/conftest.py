"""Shared fixtures: each shipped grammar is compiled once per test session into a private cache."""

from __future__ import annotations

import atexit
import inspect
import os
import re
import shutil
import subprocess
import sys
import tempfile
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
GRAMMARS = ROOT / "grammars"

# One private cache for the whole session: every morphfst.load() in any test reuses what the first
# one compiled, and nothing is written to the user's cache.
_CACHE = tempfile.mkdtemp(prefix="morphfst-test-cache-")
os.environ["MORPHFST_CACHE"] = _CACHE
_OWNER = os.getpid()


def _remove_cache() -> None:
    """Remove the session's cache when the test session ends (not in a forked child that exits)."""
    if os.getpid() == _OWNER:
        _stop_background()
        shutil.rmtree(_CACHE, ignore_errors=True)


atexit.register(_remove_cache)
os.environ["MORPHFST_GRAMMARS"] = str(GRAMMARS)

import morphfst  # noqa: E402


@pytest.fixture(scope="session")
def tur() -> morphfst.Language:
    """The shipped Turkish grammar, compiled once."""
    return morphfst.load(GRAMMARS / "tur.mfg")


# Lemmas of the small Turkish lexicon used by tests that walk a whole lexicon (bulk export, lint):
# the shipped grammar with the handbook tests' words, so those tests stay fast.
SMALL_TUR_LEMMAS = {
    "ev",
    "oda",
    "kitap",
    "ağaç",
    "köy",
    "göz",
    "kuzu",
    "gün",
    "okul",
    "çiçek",
    "renk",
    "saat",
    "kalp",
    "top",
    "at",
    "tuz",
    "deniz",
    "yol",
    "balık",
    "öğretmen",
    "çocuk",
    "Ankara",
    "İzmir",
    "Ahmet",
    "güzel",
    "büyük",
    "küçük",
    "yeni",
    "okumak",
    "gelmek",
    "bakmak",
    "içmek",
    "anlamak",
    "beklemek",
    "sevmek",
    "yazmak",
    "görmek",
    "ve",
}


@pytest.fixture(scope="session")
def tur_small(tmp_path_factory: pytest.TempPathFactory) -> morphfst.Language:
    """The shipped Turkish grammar with a lexicon of a few dozen entries (tests of whole-lexicon tools)."""
    import shutil

    root = tmp_path_factory.mktemp("tur_small")
    shutil.copytree(GRAMMARS, root / "grammars")
    lex = root / "lexicons" / "tur"
    lex.mkdir(parents=True)
    for path in sorted((ROOT / "lexicons" / "tur").glob("*.tsv")):
        kept = []
        for line in path.read_text(encoding="utf-8").splitlines():
            lemma = line.split("\t", 1)[0]
            if not line.strip() or line.startswith("#") or lemma == "lemma" or lemma in SMALL_TUR_LEMMAS:
                kept.append(line)
        (lex / path.name).write_text("\n".join(kept) + "\n", encoding="utf-8")
    return morphfst.load(root / "grammars" / "tur.mfg")


# The Finnish grammar takes 5-7 minutes to compile, the Turkish one under a minute: when the session
# has Finnish tests, Finnish is compiled into the session's cache by a background process while the
# other tests run, and the Finnish tests run last (see pytest_collection_modifyitems).
_FINNISH = re.compile(r"\bfin\b")
_background: list[subprocess.Popen[bytes]] = []


def _is_finnish(item: pytest.Item) -> bool:
    """Whether a test may load the Finnish grammar: it names ``fin`` (a fixture, a parameter, a
    language name in its source, decorators included) or lives in a Finnish test module."""
    if "fin" in getattr(item, "fixturenames", ()) or "_fin_" in item.path.name:
        return True
    callspec = getattr(item, "callspec", None)
    if callspec is not None and "fin" in map(str, callspec.params.values()):
        return True
    function = getattr(item, "function", None)
    try:
        return function is not None and bool(_FINNISH.search(inspect.getsource(function)))
    except (OSError, TypeError):
        return False


def pytest_configure(config: pytest.Config) -> None:
    config.addinivalue_line("markers", "finnish_compiled: waits for the background compile of the Finnish grammar")


def pytest_collection_modifyitems(session: pytest.Session, config: pytest.Config, items: list[pytest.Item]) -> None:
    marked = [_is_finnish(item) for item in items]
    if not any(marked) or not (GRAMMARS / "fin.mfg").exists():
        return
    finnish = [item for item, yes in zip(items, marked) if yes]
    items[:] = [item for item, yes in zip(items, marked) if not yes] + finnish
    for item in finnish:
        item.add_marker(pytest.mark.finnish_compiled)
    if config.option.collectonly:
        return
    _background.append(
        subprocess.Popen(
            [sys.executable, "-c", "import sys, morphfst; morphfst.load(sys.argv[1])", str(GRAMMARS / "fin.mfg")],
            stdout=subprocess.DEVNULL,
            stderr=subprocess.DEVNULL,
        )
    )


def _wait_for_finnish() -> None:
    """Let the background compile of Finnish finish (its failure is seen when the test loads it)."""
    while _background:
        _background.pop().wait()


def pytest_runtest_setup(item: pytest.Item) -> None:
    if item.get_closest_marker("finnish_compiled") is not None:
        _wait_for_finnish()


def _stop_background() -> None:
    """Stop a background compile still running (a session that ended before its Finnish tests)."""
    while _background:
        proc = _background.pop()
        proc.kill()
        proc.wait()


def pytest_sessionfinish(session: pytest.Session, exitstatus: int) -> None:
    _stop_background()


@pytest.fixture(scope="session")
def fin() -> morphfst.Language:
    """The shipped Finnish grammar, compiled once."""
    path = GRAMMARS / "fin.mfg"
    if not path.exists():
        pytest.skip("Finnish grammar not present")
    _wait_for_finnish()
    return morphfst.load(path)


@pytest.fixture(scope="session")
def cache_dir() -> Path:
    return Path(_CACHE)

"""Shared fixtures: each shipped grammar is compiled once per test session into a private cache."""

from __future__ import annotations

import atexit
import os
import shutil
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


@pytest.fixture(scope="session")
def fin() -> morphfst.Language:
    """The shipped Finnish grammar, compiled once."""
    path = GRAMMARS / "fin.mfg"
    if not path.exists():
        pytest.skip("Finnish grammar not present")
    return morphfst.load(path)


@pytest.fixture(scope="session")
def cache_dir() -> Path:
    return Path(_CACHE)

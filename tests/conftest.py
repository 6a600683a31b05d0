"""Shared fixtures: each shipped grammar is compiled once per test session into a private cache."""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
GRAMMARS = ROOT / "grammars"

# One private cache for the whole session: every morphfst.load() in any test reuses what the first
# one compiled, and nothing is written to the user's cache.
_CACHE = tempfile.mkdtemp(prefix="morphfst-test-cache-")
os.environ["MORPHFST_CACHE"] = _CACHE
os.environ["MORPHFST_GRAMMARS"] = str(GRAMMARS)

import morphfst  # noqa: E402


@pytest.fixture(scope="session")
def tur() -> morphfst.Language:
    """The shipped Turkish fragment, compiled once."""
    return morphfst.load(GRAMMARS / "tur.mfg")


@pytest.fixture(scope="session")
def fin() -> morphfst.Language:
    """The shipped Finnish fragment, compiled once."""
    path = GRAMMARS / "fin.mfg"
    if not path.exists():
        pytest.skip("Finnish grammar not present")
    return morphfst.load(path)


@pytest.fixture(scope="session")
def cache_dir() -> Path:
    return Path(_CACHE)

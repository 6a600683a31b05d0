"""A few hundred mutants of the fault and fuzz soak (bench/soak_faults.py runs thousands): no
traceback, no hang, every rejection of a mutated grammar or lexicon a located message."""

from __future__ import annotations

import importlib.util
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent


@pytest.mark.skipif(sys.platform == "win32", reason="the soak forks")
def test_soak_of_the_toy_grammar() -> None:
    spec = importlib.util.spec_from_file_location("soak_faults", ROOT / "bench" / "soak_faults.py")
    assert spec and spec.loader
    soak = importlib.util.module_from_spec(spec)
    sys.modules.setdefault("soak_faults", soak)  # its dataclasses look their module up there
    spec.loader.exec_module(soak)
    figures = soak.soak("toy", count=200, seed=5, jobs=2, timeout=60)
    assert figures.mutants == 200
    assert figures.tracebacks == 0, figures.examples
    assert figures.hangs == 0, figures.examples
    assert figures.unlocated == 0, figures.examples
    assert figures.accepted > 0 and figures.rejected > 0

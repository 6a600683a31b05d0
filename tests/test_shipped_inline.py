"""The shipped grammars' own inline tests (their ``tests { }`` blocks, as ``morphfst check`` runs them)
pass: each case there names its source in the grammar file (handbook tables from memory, common
practice)."""

from __future__ import annotations

import morphfst
from morphfst.debug.testing import render_result, run_tests


def _failures(lang: morphfst.Language) -> list[str]:
    report = run_tests(lang, with_coverage=False)
    assert len(report.results) > 30  # the block was read
    return [line for r in report.results if not r.passed for line in render_result(r)]


def test_turkish_inline_tests_pass(tur: morphfst.Language) -> None:
    assert _failures(tur) == []


def test_finnish_inline_tests_pass(fin: morphfst.Language) -> None:
    assert _failures(fin) == []

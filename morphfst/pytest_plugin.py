"""pytest plugin: grammar test files (``*.mfgtest``) are collected as test items, one per test line.

Registered through the ``pytest11`` entry point of the morphfst package, so a project that has
morphfst installed only needs to put test files under its tests directory (or run
``pytest -p morphfst.pytest_plugin`` where the entry point is not installed). The grammar is named by
the file's ``grammar`` line, or by the ini option ``morphfst_grammar``. Each grammar is compiled (or
taken from the compile cache) once per test session.

This module imports nothing heavy at import time, since pytest loads it in every session.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

import pytest

SUFFIX = ".mfgtest"
_SESSIONS: dict[str, Any] = {}


def pytest_addoption(parser: pytest.Parser) -> None:
    parser.addini(
        "morphfst_grammar",
        f"grammar for {SUFFIX} files without a grammar line (name or path relative to the rootdir)",
        default="",
    )


def pytest_collect_file(file_path: Path, parent: pytest.Collector) -> pytest.Collector | None:
    if file_path.suffix == SUFFIX:
        return GrammarTestFile.from_parent(parent, path=file_path)
    return None


class GrammarTestFailure(Exception):
    """A grammar test whose result differs from the expectation."""


def _session(grammar: str) -> Any:
    from morphfst.debug.session import DebugSession

    if grammar not in _SESSIONS:
        _SESSIONS[grammar] = DebugSession.open(grammar)
    return _SESSIONS[grammar]


class GrammarTestFile(pytest.File):
    def collect(self) -> Any:
        from morphfst.debug.testing import read_test_file
        from morphfst.errors import UserError

        try:
            ref, tests = read_test_file(self.path)
        except UserError as exc:
            raise self.CollectError(exc.render()) from None
        grammar = ref
        if grammar is None:
            configured = str(self.config.getini("morphfst_grammar") or "")
            if configured:
                local = Path(self.config.rootpath) / configured
                grammar = str(local) if local.exists() else configured
        if grammar is None:
            raise self.CollectError(
                f"{self.path}: no grammar line and no morphfst_grammar ini option; add a line 'grammar<TAB>path/to/grammar.mfg'"
            )
        for test in tests:
            yield GrammarTestItem.from_parent(self, name=f"{test.line}:{test.kind}:{test.input}", test=test, grammar=grammar)


class GrammarTestItem(pytest.Item):
    def __init__(self, *, test: Any, grammar: str, **kwargs: Any) -> None:
        super().__init__(**kwargs)
        self.test = test
        self.grammar = grammar
        self.result: Any = None

    def runtest(self) -> None:
        from morphfst.debug.testing import run_test

        self.result = run_test(_session(self.grammar), self.test)
        if not self.result.passed:
            raise GrammarTestFailure(self.test.name)

    def repr_failure(self, excinfo: pytest.ExceptionInfo[BaseException], style: Any = None) -> str:  # type: ignore[override]
        from morphfst.debug.testing import render_result
        from morphfst.errors import UserError

        if isinstance(excinfo.value, GrammarTestFailure) and self.result is not None:
            return "\n".join(render_result(self.result))
        if isinstance(excinfo.value, UserError):
            return excinfo.value.render()
        return str(super().repr_failure(excinfo))

    def reportinfo(self) -> tuple[Path, int, str]:
        return self.path, max(self.test.line - 1, 0), f"grammar test {self.test.kind} {self.test.input}"

"""Run a grammar's tests: the inline ``tests { }`` block and test files, with rule and affix coverage.

Test files (``*.mfgtest``) are UTF-8 text, one test per line, fields separated by tabs, ``#`` comments
and blank lines ignored::

    # kind     input          expected (alternatives separated by " | ")
    grammar    ../grammars/tur.mfg
    analyze    evlerde        ev N;PL;LOC
    exact      kitabı         kitap N;SG;ACC | kitap N;SG;PSS3S;NOM
    generate   ev N;PL;ABL    evlerden
    reject     evlarde kitapı

``analyze``: every expected analysis is among the word's analyses; ``exact``: the analyses are exactly
the expected ones; ``generate``: every expected form is among the forms generated from the analysis;
``reject``: each word (several may share a line, separated by spaces) has no analysis. A ``grammar``
line names the grammar the file tests (a path relative to the file, or a shipped grammar name).

Coverage comes from the rule trace of every analysis the tests expect (see :mod:`.trace`): rules
that never changed anything in any test, and affixes and slots no expected analysis went through.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field
from pathlib import Path
from typing import Any

from ..errors import Position, UserError
from ..runtime.results import Analysis
from .explain import explain_analysis
from .session import DebugSession

TEST_SUFFIX = ".mfgtest"
KINDS = ("analyze", "exact", "generate", "reject")


@dataclass
class GrammarTest:
    """One test case."""

    kind: str
    input: str  # a word, or an analysis text for generate
    expected: list[str]
    file: str
    line: int

    @property
    def name(self) -> str:
        return f"{self.kind} {self.input}"


@dataclass
class TestResult:
    test: GrammarTest
    passed: bool
    got: list[str]
    missing: list[str] = field(default_factory=list)
    unexpected: list[str] = field(default_factory=list)
    diff: list[str] = field(default_factory=list)
    diagnosis: str = ""


@dataclass
class Coverage:
    rules_fired: dict[str, int]
    rules_never: list[dict[str, Any]]
    affixes_never: list[dict[str, Any]]
    slots_never: list[str]
    rules_total: int
    affixes_total: int
    slots_total: int
    analyses_traced: int


@dataclass
class TestReport:
    grammar: str
    results: list[TestResult]
    coverage: Coverage | None

    @property
    def failed(self) -> list[TestResult]:
        return [r for r in self.results if not r.passed]

    @property
    def exit_code(self) -> int:
        return 1 if self.failed else 0

    def to_dict(self) -> dict[str, Any]:
        return {
            "grammar": self.grammar,
            "tests": len(self.results),
            "passed": len(self.results) - len(self.failed),
            "failed": len(self.failed),
            "results": [asdict(r) for r in self.results],
            "coverage": asdict(self.coverage) if self.coverage else None,
        }


# ---- reading tests ----------------------------------------------------------------------------------


def inline_tests(session: DebugSession) -> list[GrammarTest]:
    """The tests of the grammar's ``tests { }`` block (from the compiled metadata)."""
    path = session.meta.get("grammar_path", session.meta["name"])
    return [GrammarTest(t["kind"], t["word"], list(t["expected"]), path, t.get("line", 0)) for t in session.meta.get("tests", [])]


def _alternatives(text: str) -> list[str]:
    return [" ".join(x.split()) for x in text.split("|") if x.strip()]


def read_test_file(path: str | Path) -> tuple[str | None, list[GrammarTest]]:
    """(grammar reference or None, tests) of a test file; mistakes raise UserError with the line."""
    path = Path(path)
    try:
        text = path.read_bytes().decode("utf-8")
    except OSError as exc:
        raise UserError(f"cannot read test file: {exc.strerror or exc}", Position(str(path))) from None
    except UnicodeDecodeError:
        raise UserError("test file is not valid UTF-8", Position(str(path)), hint="save it as UTF-8") from None
    grammar: str | None = None
    tests: list[GrammarTest] = []
    for number, raw in enumerate(text.splitlines(), start=1):
        line = raw.split("#", 1)[0] if raw.lstrip().startswith("#") else raw
        if not line.strip():
            continue
        fields = [f.strip() for f in line.split("\t") if f.strip()]
        kind = fields[0]
        where = Position(str(path), number, 1)
        if kind == "grammar":
            if len(fields) != 2:
                raise UserError(
                    "a grammar line names one grammar", where, hint="grammar<TAB>path/to/grammar.mfg", source_line=raw
                )
            ref = fields[1]
            local = path.parent / ref
            grammar = str(local) if local.exists() else ref
            continue
        if kind not in KINDS:
            raise UserError(
                f"unknown test kind {kind!r}",
                where,
                hint="a line starts with analyze, exact, generate, reject or grammar, followed by a tab",
                source_line=raw,
            )
        if kind == "reject":
            if len(fields) < 2:
                raise UserError("reject needs at least one word", where, hint="reject<TAB>word word ...", source_line=raw)
            for word in " ".join(fields[1:]).split():
                tests.append(GrammarTest("reject", word, [], str(path), number))
            continue
        if len(fields) != 3:
            raise UserError(
                f"{kind} needs an input and an expected value separated by tabs",
                where,
                hint=f"{kind}<TAB>{'lemma POS;FEAT' if kind == 'generate' else 'word'}<TAB>{'form | form' if kind == 'generate' else 'lemma POS;FEAT | ...'}",
                source_line=raw,
            )
        expected = _alternatives(fields[2])
        tests.append(GrammarTest(kind, " ".join(fields[1].split()), expected, str(path), number))
    return grammar, tests


# ---- running tests -------------------------------------------------------------------------------------


def run_test(session: DebugSession, test: GrammarTest, diagnose_failures: bool = False) -> TestResult:
    lang = session.lang
    if test.kind == "generate":
        got = [f.form for f in lang.generate_text(test.input)]
        missing = [e for e in test.expected if e not in got]
        result = TestResult(test, not missing, got, missing, [])
    elif test.kind == "reject":
        got = [a.text for a in lang.analyze(test.input)]
        result = TestResult(test, not got, got, [], got)
    else:
        got = [a.text for a in lang.analyze(test.input)]
        missing = [e for e in test.expected if e not in got]
        unexpected = [g for g in got if g not in test.expected]
        ok = not missing and (test.kind == "analyze" or not unexpected)
        result = TestResult(test, ok, got, missing, unexpected if test.kind == "exact" or not ok else [])
    if not result.passed:
        result.diff = _diff(test, result)
        if diagnose_failures:
            result.diagnosis = _diagnosis(session, test, result)
    return result


def _diagnosis(session: DebugSession, test: GrammarTest, r: TestResult) -> str:
    """Why the first missing expectation is not met (see :func:`~morphfst.debug.diagnose.diagnose_expected`)."""
    from .diagnose import diagnose_expected

    if test.kind in {"analyze", "exact"} and r.missing:
        d = diagnose_expected(session, test.input, r.missing[0])
    elif test.kind == "generate" and r.missing:
        d = diagnose_expected(session, r.missing[0], test.input)
    else:
        return ""
    return d.summary + (f" (hint: {d.hint})" if d.hint else "")


def _diff(test: GrammarTest, r: TestResult) -> list[str]:
    """Expected against produced, one line each: '-' missing, '+' produced but not expected, ' ' both."""
    lines = []
    if test.kind == "reject":
        return [f"+ {g}" for g in r.got]
    for e in test.expected:
        lines.append(f"  {e}" if e in r.got else f"- {e}")
    for g in r.got:
        if g not in test.expected:
            lines.append(f"+ {g}")
    if not r.got:
        lines.append("+ (nothing)")
    return lines


def _exercised(session: DebugSession, test: GrammarTest, r: TestResult) -> list[tuple[Analysis, str]]:
    """The (analysis, surface) pairs a test vouches for: expected analyses found, expected forms generated."""
    lang = session.lang
    out: list[tuple[Analysis, str]] = []
    if test.kind in {"analyze", "exact"}:
        surface = lang.normalize(test.input)
        for a in lang.analyze(test.input):
            if a.text in test.expected:
                out.append((a, surface))
    elif test.kind == "generate":
        lemma, _, bundle = test.input.rpartition(" ")
        labels = sorted(bundle.split(";"))
        for form in test.expected:
            if form not in r.got:
                continue
            for a in lang.analyze(form):
                if a.lemma == lemma and sorted(a.tags) == labels:
                    out.append((a, lang.normalize(form)))
    return out


def coverage(session: DebugSession, tests: list[GrammarTest], results: list[TestResult]) -> Coverage:
    g = session.grammar
    fired: dict[str, int] = {r.name: 0 for r in g.rules}
    affixes_seen: set[int] = set()
    traced = 0
    for test, result in zip(tests, results):
        for analysis, surface in _exercised(session, test, result):
            ex = explain_analysis(session, analysis, surface)
            traced += 1
            for step in ex.path:
                if step.affix_id is not None:
                    affixes_seen.add(step.affix_id)
            for name in ex.fired:
                fired[name] += 1
    never_rules = [{"name": r.name, "line": r.pos.line, "text": r.text} for r in g.rules if not fired[r.name]]
    never_affixes = [
        {"id": a.ident, "slot": a.slot, "form": a.form_text, "features": list(a.features), "line": a.pos.line}
        for a in g.affixes
        if a.ident not in affixes_seen
    ]
    slots_seen = {session.affixes[i].slot for i in affixes_seen}
    return Coverage(
        rules_fired=fired,
        rules_never=never_rules,
        affixes_never=never_affixes,
        slots_never=[s for s in g.slots if s not in slots_seen],
        rules_total=len(g.rules),
        affixes_total=len(g.affixes),
        slots_total=len(g.slots),
        analyses_traced=traced,
    )


def run_tests(
    lang: Any,
    files: list[str | Path] | None = None,
    inline: bool = True,
    with_coverage: bool = True,
    diagnose_failures: bool = False,
) -> TestReport:
    """Run the inline tests and the tests of ``files`` against one language."""
    session = DebugSession.open(lang)
    tests = inline_tests(session) if inline else []
    for f in files or []:
        tests.extend(read_test_file(f)[1])
    results = [run_test(session, t, diagnose_failures) for t in tests]
    cov = coverage(session, tests, results) if with_coverage else None
    return TestReport(session.meta["name"], results, cov)


# ---- text rendering ----------------------------------------------------------------------------------


def render_result(r: TestResult) -> list[str]:
    t = r.test
    where = f"{Path(t.file).name}:{t.line}" if t.line else Path(t.file).name
    head = f"FAIL {where}  {t.kind}  {t.input}"
    if t.expected:
        head += f"  (expected {' | '.join(t.expected)})"
    lines = [head]
    lines.extend(f"     {d}" for d in r.diff)
    if r.diagnosis:
        lines.append(f"     diagnosis: {r.diagnosis}")
    return lines


def render_report(report: TestReport, show_coverage: bool = True) -> str:
    out: list[str] = []
    for r in report.failed:
        out.extend(render_result(r))
    n, f = len(report.results), len(report.failed)
    out.append(f"{report.grammar}: {n} tests, {n - f} passed, {f} failed")
    c = report.coverage
    if c and show_coverage:
        fired = c.rules_total - len(c.rules_never)
        out.append(f"coverage ({c.analyses_traced} analyses traced):")
        out.append(f"  rules    {fired}/{c.rules_total} fired")
        for rule in c.rules_never:
            out.append(f"    never fired: {rule['name']} (line {rule['line']})")
        out.append(f"  affixes  {c.affixes_total - len(c.affixes_never)}/{c.affixes_total} exercised")
        by_slot: dict[str, list[dict[str, Any]]] = {}
        for a in c.affixes_never:
            by_slot.setdefault(a["slot"], []).append(a)
        for slot, affixes in by_slot.items():
            if slot in c.slots_never:
                out.append(f"    never exercised: slot {slot}, all {len(affixes)} affixes (from line {affixes[0]['line']})")
            else:
                items = ", ".join(
                    f"{a['form'] or '∅'} {';'.join(a['features'])}".strip() + f" (line {a['line']})" for a in affixes
                )
                out.append(f"    never exercised in slot {slot}: {items}")
        out.append(
            f"  slots    {c.slots_total - len(c.slots_never)}/{c.slots_total} exercised"
            + (f"; never: {', '.join(c.slots_never)}" if c.slots_never else "")
        )
    return "\n".join(out) + "\n"

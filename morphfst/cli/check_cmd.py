"""``morphfst check``: run a grammar's tests with rule, affix and slot coverage (for CI)."""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path

from ..debug.session import DebugSession
from ..debug.testing import TEST_SUFFIX, read_test_file, render_report, run_tests

EXAMPLES = f"""examples:
  morphfst check                                  the inline tests of the default grammar (tur)
  morphfst check -l grammars/tur.mfg tests/grammar/tur_core{TEST_SUFFIX}
  morphfst check tests/grammar/                   every *{TEST_SUFFIX} file of a directory (grammar named in the files)
  morphfst check --diagnose --strict-coverage     say why failing words are rejected; fail when a rule never fires
  morphfst check -f json > report.json            the whole report as JSON

test file format (*{TEST_SUFFIX}; fields separated by tabs, '#' starts a comment):
  grammar    ../grammars/tur.mfg
  analyze    evlerde        ev N;PL;LOC
  exact      kitabı         kitap N;SG;ACC | kitap N;SG;PSS3S;NOM
  generate   ev N;PL;ABL    evlerden
  reject     evlarde kitapı

exit codes: 0 all tests passed, 1 some test failed (or a rule never fired with --strict-coverage), 2 user error
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "check",
        help="run a grammar's tests and report rule, affix and slot coverage",
        description="Run the grammar's inline tests (its tests block) and the tests of test files: expected analyses, exact "
        "analysis sets, expected generated forms, rejected words. Prints each failure with a diff, a summary and coverage: "
        "rules that never fired in any test, affixes and slots never exercised.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("files", nargs="*", help=f"test files ({TEST_SUFFIX}) or directories holding them")
    p.add_argument(
        "-l",
        "--lang",
        metavar="LANG",
        help="grammar name, grammar file or compiled file (default: the test files' grammar line, else tur)",
    )
    p.add_argument("--no-inline", action="store_true", help="skip the grammar's inline tests")
    p.add_argument(
        "--diagnose", action="store_true", help="diagnose each word that a test expects to be analyzed but is rejected"
    )
    p.add_argument("--no-coverage", action="store_true", help="leave out the coverage report")
    p.add_argument("--strict-coverage", action="store_true", help="exit with code 1 also when some rule never fired")
    p.add_argument("-f", "--format", choices=("table", "json"), default="table", help="table: for reading; json: one JSON report")
    p.set_defaults(func=run)


def _expand(paths: list[str]) -> list[Path]:
    out: list[Path] = []
    for p in paths:
        path = Path(p)
        out.extend(sorted(path.rglob(f"*{TEST_SUFFIX}")) if path.is_dir() else [path])
    return out


def run(args: argparse.Namespace) -> int:
    files = _expand(args.files)
    by_grammar: dict[str, list[str | Path]] = {}
    for f in files:
        ref, _ = read_test_file(f)
        by_grammar.setdefault(args.lang or ref or "tur", []).append(f)
    if not by_grammar:
        by_grammar[args.lang or "tur"] = []
    code = 0
    reports = []
    for grammar, group in by_grammar.items():
        session = DebugSession.open(grammar)
        report = run_tests(
            session, list(group), inline=not args.no_inline, with_coverage=not args.no_coverage, diagnose_failures=args.diagnose
        )
        reports.append(report)
        code = max(code, report.exit_code)
        if args.strict_coverage and report.coverage and report.coverage.rules_never:
            code = max(code, 1)
        if args.format == "table":
            sys.stdout.write(render_report(report, show_coverage=not args.no_coverage))
    if args.format == "json":
        data = [r.to_dict() for r in reports]
        sys.stdout.write(json.dumps(data[0] if len(data) == 1 else data, ensure_ascii=False, indent=1) + "\n")
    return code

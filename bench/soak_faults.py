"""Fault and fuzz soak: mutate a grammar and its lexicons, and check that every tool either works or
rejects the input with one located message: never a traceback, never a hang.

Each mutant is a temporary copy of a grammar (the toy grammar of the tests, or a shipped one) with one
file changed by one operator: delete, duplicate or swap lines, flip bytes, truncate, or insert random
tokens. A forked child process (cheap: the modules are already imported) then runs, in process,

    morphfst build GRAMMAR -o OUT.mfc        compile (a rejection must name a file, and a line where it can)
    morphfst analyze -l OUT.mfc WORDS        a few lemmas of the original lexicon and random strings
    morphfst table -l OUT.mfc LEMMA          the first lemma of the compiled lexicon
    morphfst check -l OUT.mfc                the grammar's inline tests (exit 1 on a failing test is fine)

and reports its exit codes and messages; a child still running after ``--timeout`` seconds is killed
and counted as a hang. Figures printed at the end (JSON with ``--json``): mutants, accepted, rejected,
located and unlocated rejections, tracebacks, hangs, by operator.

    python bench/soak_faults.py --grammar toy --count 10000 --jobs 2
    python bench/soak_faults.py --grammar fin --count 300 --timeout 60
    python bench/soak_faults.py --grammar tur --count 100 --lexicon-lines 40 --timeout 120

``--lexicon-lines N`` keeps the first N entries of each lexicon file in the copy (faster compiles of a
large shipped lexicon; the grammar is whole).
"""

from __future__ import annotations

import argparse
import contextlib
import io
import json
import os
import random
import re
import select
import shutil
import signal
import sys
import tempfile
import time
import traceback
from collections import Counter
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "tests"))

from morphfst.cli import main as cli_main  # noqa: E402

OPERATORS = ("delete", "duplicate", "swap", "flip", "truncate", "insert")
SPECIAL_TOKENS = [
    "{", "}", "->", "=>", "==", "[", "]", "(", ")", '"', "'", "@", "∅", "*", "?", "|", "+", "^", "$", "_", "/",
    "\t", "#", ":", ";", ",", ".", "\ufeff", "\x00", "\u200d", "e\u0301", "-1", "0", "1e400", "nan", "inf",
    "999999999999", "slot", "rule", "class", "tests", "layout", "include", "lexicon", "weight", "gloss", "pos",
    "reject", "optional", "rtl", "sim", "ltr", "marks", "blocks", "requires", "excludes", "\"\"", "<x>", "ç", "ı",
]  # fmt: skip
LOCATED = re.compile(r"^(?P<file>[^\n]+?)(?::(?P<line>\d+)(?::\d+)?)?: error: ", re.M)


@dataclass
class Figures:
    """What the soak saw."""

    mutants: int = 0
    accepted: int = 0
    rejected: int = 0
    located: int = 0  # rejections that name a source file
    with_line: int = 0  # ... and a line in it
    unlocated: int = 0
    tracebacks: int = 0
    hangs: int = 0
    seconds: float = 0.0
    by_operator: Counter[str] = field(default_factory=Counter)
    examples: dict[str, list[str]] = field(default_factory=dict)

    def note(self, kind: str, text: str, keep: int = 5) -> None:
        bucket = self.examples.setdefault(kind, [])
        if len(bucket) < keep:
            bucket.append(text[:2000])

    def to_dict(self) -> dict[str, Any]:
        out = {k: v for k, v in self.__dict__.items() if k not in ("by_operator", "examples")}
        out["by_operator"] = dict(self.by_operator)
        out["examples"] = self.examples
        return out


# ---- the corpus of files to mutate --------------------------------------------------------------------


def prepare(grammar: str, directory: Path, lexicon_lines: int) -> Path:
    """A copy of the grammar's sources in ``directory`` (the same relative layout); returns the grammar path."""
    if grammar == "toy":
        from toygrammar import write_toy

        return write_toy(directory)
    grammars = ROOT / "grammars"
    shutil.copytree(grammars, directory / "grammars")
    shutil.copytree(ROOT / "lexicons", directory / "lexicons")
    if lexicon_lines:
        for tsv in (directory / "lexicons").rglob("*.tsv"):
            lines = tsv.read_text(encoding="utf-8").splitlines(keepends=True)
            header = next((i for i, line in enumerate(lines) if line.strip() and not line.startswith("#")), 0)
            tsv.write_text("".join(lines[: header + 1 + lexicon_lines]), encoding="utf-8")
    return directory / "grammars" / f"{grammar}.mfg"


def source_files(grammar_path: Path) -> list[Path]:
    from morphfst.build import source_files as sources

    return [Path(p) for p in sources(grammar_path)[1]]


def sample_words(grammar_path: Path, rng: random.Random) -> list[str]:
    from morphfst.compile.loader import load_model

    model = load_model(grammar_path)
    lemmas = [e.lemma for e in model.lexicon]
    words = rng.sample(lemmas, min(4, len(lemmas)))
    letters = list(model.letters) or list("abc")
    words += ["".join(rng.choice(letters) for _ in range(rng.randint(1, 12))) for _ in range(2)]
    return words


# ---- mutation -----------------------------------------------------------------------------------------


def mutate(data: bytes, op: str, rng: random.Random, pool: list[str]) -> bytes:
    """One mutation of a file's bytes."""
    lines = data.split(b"\n")
    if op == "delete" and lines:
        del lines[rng.randrange(len(lines))]
    elif op == "duplicate" and lines:
        i = rng.randrange(len(lines))
        lines.insert(rng.randrange(len(lines) + 1), lines[i])
    elif op == "swap" and len(lines) > 1:
        i, j = rng.sample(range(len(lines)), 2)
        lines[i], lines[j] = lines[j], lines[i]
    elif op == "flip" and data:
        buf = bytearray(data)
        for _ in range(rng.randint(1, 3)):
            buf[rng.randrange(len(buf))] ^= 1 << rng.randrange(8)
        return bytes(buf)
    elif op == "truncate":
        return data[: rng.randrange(len(data) + 1)]
    elif op == "insert":
        i = rng.randrange(len(lines) + 1) if lines else 0
        line = lines[i].decode("utf-8", "replace") if i < len(lines) else ""
        words = line.split(" ")
        for _ in range(rng.randint(1, 3)):
            words.insert(rng.randrange(len(words) + 1), rng.choice(pool))
        new = " ".join(words).encode("utf-8")
        if i < len(lines):
            lines[i] = new
        else:
            lines.append(new)
    return b"\n".join(lines)


# ---- one mutant, in a child process ----------------------------------------------------------------------


def run_tools(grammar_path: Path, out: Path, words: list[str]) -> dict[str, Any]:
    """Run build, analyze, table and check in process; exit codes, messages and any traceback."""
    report: dict[str, Any] = {"steps": []}

    def step(argv: list[str]) -> int:
        err = io.StringIO()
        try:
            with contextlib.redirect_stdout(io.StringIO()), contextlib.redirect_stderr(err):
                code = cli_main(argv)
        except SystemExit as exc:
            code = int(exc.code or 0) if isinstance(exc.code, int) else 2
        except BaseException:
            report["traceback"] = f"{' '.join(argv[:1])}: {traceback.format_exc()}"
            return -1
        text = err.getvalue()
        if "Traceback (most recent call last)" in text:
            report["traceback"] = f"{argv[0]}: {text}"
            return -1
        report["steps"].append((argv[0], code, text))
        return code

    code = step(["build", str(grammar_path), "-o", str(out), "-q"])
    if code != 0:
        return report
    step(["analyze", "-l", str(out), *words])
    from morphfst.compile.archive import read_metadata

    lexicon = read_metadata(out).get("lexicon") or []
    if lexicon:
        step(["table", "-l", str(out), lexicon[0]["lemma"]])
    step(["check", "-l", str(out)])
    return report


def run_child(grammar_path: Path, out: Path, words: list[str]) -> tuple[int, int]:
    """Fork a child that runs the tools and writes its report to a pipe; returns (pid, read end)."""
    read, write = os.pipe()
    pid = os.fork()
    if pid == 0:  # the child
        os.close(read)
        code = 0
        try:
            signal.signal(signal.SIGINT, signal.SIG_DFL)
            report = run_tools(grammar_path, out, words)
            with os.fdopen(write, "wb") as pipe:
                pipe.write(json.dumps(report).encode("utf-8"))
        except BaseException:
            code = 3
        finally:
            os._exit(code)
    os.close(write)
    return pid, read


def classify(report: dict[str, Any] | None, sources: list[Path], figures: Figures, op: str, what: str) -> None:
    if report is None:
        figures.tracebacks += 1
        figures.note("traceback", f"{what}: the child died without a report")
        return
    if "traceback" in report:
        figures.tracebacks += 1
        figures.note("traceback", f"{what}: {report['traceback']}")
        return
    steps = report["steps"]
    build_code = steps[0][1] if steps else 2
    if build_code == 0:
        figures.accepted += 1
    else:
        figures.rejected += 1
    for name, code, text in steps:
        if code != 2:
            continue
        match = LOCATED.search(text)
        names = {str(p) for p in sources} | {p.name for p in sources}
        if match and (match.group("file") in names or Path(match.group("file")).name in names):
            figures.located += name == "build"
            figures.with_line += name == "build" and bool(match.group("line"))
        elif name == "build":
            figures.unlocated += 1
            figures.note("unlocated", f"{what} ({op}): {text.strip()}")
        else:
            figures.note(f"{name} rejected", f"{what} ({op}): {text.strip()}")


# ---- the soak ---------------------------------------------------------------------------------------------


def soak(
    grammar: str = "toy",
    count: int = 100,
    seed: int = 1,
    jobs: int = 1,
    timeout: float = 30.0,
    lexicon_lines: int = 0,
    progress: int = 0,
) -> Figures:
    """Run ``count`` mutants of ``grammar``; returns the figures."""
    rng = random.Random(seed)
    figures = Figures()
    t0 = time.perf_counter()
    with tempfile.TemporaryDirectory(prefix="morphfst-soak-") as tmp:
        base = Path(tmp) / "original"
        grammar_path = prepare(grammar, base, lexicon_lines)
        sources = source_files(grammar_path)
        originals = {p: p.read_bytes() for p in sources}
        pool = SPECIAL_TOKENS + sorted({t for data in originals.values() for t in data.decode("utf-8", "replace").split()})
        words = sample_words(grammar_path, rng)
        saved_cache = os.environ.get("MORPHFST_CACHE")
        os.environ["MORPHFST_CACHE"] = str(Path(tmp) / "cache")
        # warm up in this process (the parser, lazy imports), so every forked child starts warm
        warm = run_tools(grammar_path, Path(tmp) / "warm.mfc", words)
        if "traceback" in warm or not warm["steps"] or warm["steps"][0][1] != 0:
            raise SystemExit(f"the unmutated grammar does not build: {warm}")
        running: dict[int, tuple[int, Path, float, str, str, list[Path]]] = {}
        started = 0

        def launch(index: int) -> None:
            work = Path(tmp) / f"m{index}"
            shutil.copytree(base, work)
            rel = rng.choice(sources).relative_to(base)
            op = rng.choice(OPERATORS)
            target = work / rel
            target.write_bytes(mutate(originals[base / rel], op, rng, pool))
            mutant_sources = [work / p.relative_to(base) for p in sources]
            pid, fd = run_child(work / grammar_path.relative_to(base), work / "out.mfc", words)
            running[fd] = (pid, work, time.monotonic(), op, f"mutant {index} {rel}", mutant_sources)
            figures.mutants += 1
            figures.by_operator[op] += 1

        def finish(fd: int, report: dict[str, Any] | None, hung: bool) -> None:
            pid, work, _, op, what, mutant_sources = running.pop(fd)
            os.close(fd)
            if hung:
                with contextlib.suppress(ProcessLookupError):
                    os.kill(pid, signal.SIGKILL)
            os.waitpid(pid, 0)
            if hung:
                figures.hangs += 1
                figures.note("hang", f"{what} ({op})")
            else:
                classify(report, mutant_sources, figures, op, what)
            shutil.rmtree(work, ignore_errors=True)
            done = figures.mutants - len(running)
            if progress and done % progress == 0:
                sys.stderr.write(f"{done} mutants, {figures.tracebacks} tracebacks, {figures.hangs} hangs\n")

        buffers: dict[int, bytes] = {}
        while started < count or running:
            while started < count and len(running) < jobs:
                launch(started)
                started += 1
            ready, _, _ = select.select(list(running), [], [], 0.2)
            for fd in ready:
                chunk = os.read(fd, 1 << 16)
                if chunk:
                    buffers[fd] = buffers.get(fd, b"") + chunk
                    continue
                data = buffers.pop(fd, b"")
                try:
                    report = json.loads(data) if data else None
                except ValueError:
                    report = None
                finish(fd, report, False)
            now = time.monotonic()
            for fd in [fd for fd, item in running.items() if now - item[2] > timeout]:
                buffers.pop(fd, None)
                finish(fd, None, True)
        if saved_cache is None:
            os.environ.pop("MORPHFST_CACHE", None)
        else:
            os.environ["MORPHFST_CACHE"] = saved_cache
    figures.seconds = round(time.perf_counter() - t0, 1)
    return figures


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0], formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--grammar", default="toy", help="toy (the tests' toy grammar) or a shipped grammar name")
    parser.add_argument("--count", type=int, default=1000, help="mutants to try")
    parser.add_argument("--seed", type=int, default=1)
    parser.add_argument("--jobs", type=int, default=os.cpu_count() or 1, help="mutants run at the same time")
    parser.add_argument("--timeout", type=float, default=30.0, help="seconds per mutant before it counts as a hang")
    parser.add_argument("--lexicon-lines", type=int, default=0, help="keep only the first N entries of each lexicon file")
    parser.add_argument("--json", action="store_true", help="print the figures as JSON")
    args = parser.parse_args()
    figures = soak(args.grammar, args.count, args.seed, args.jobs, args.timeout, args.lexicon_lines, progress=500)
    if args.json:
        print(json.dumps(figures.to_dict(), ensure_ascii=False, indent=1))
    else:
        d = figures.to_dict()
        print(f"grammar {args.grammar}: {d['mutants']} mutants in {d['seconds']} s")
        for key in ("accepted", "rejected", "located", "with_line", "unlocated", "tracebacks", "hangs"):
            print(f"  {key:<11} {d[key]}")
        print("  by operator: " + ", ".join(f"{k} {v}" for k, v in sorted(d["by_operator"].items())))
        for kind, texts in d["examples"].items():
            print(f"-- {kind}")
            for t in texts:
                print("   " + t.replace("\n", "\n   "))
    return 1 if figures.tracebacks or figures.hangs or figures.unlocated else 0


if __name__ == "__main__":
    sys.exit(main())

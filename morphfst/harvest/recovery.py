"""The recovery experiment: take entries out of a lexicon, harvest their forms, count what comes back.

A copy of the grammar and its lexicon files is made in a working directory; every ``every``-th entry
of the chosen classes (at most ``limit``) is deleted from the copy. The deleted entries' forms are
generated from the full grammar (their bounded paradigms) and sampled into a word list the way a
corpus shows them: each class's cells get one fixed, random frequency ranking (Zipf-like: the cell of
rank r is drawn with weight 1/r), and each lemma shows a few cells drawn by that ranking, with counts.
Forms of kept entries of the same classes are added, so the word list also holds known words. The
harvest of the word list with the reduced language is then compared with the deleted entries:
*recall* is the share of deleted entries proposed with the right lemma, class, part of speech and
flags; *precision* is the share of proposals that are such an entry.
"""

from __future__ import annotations

import random
import re
import shutil
import time
from collections import defaultdict
from collections.abc import Callable
from dataclasses import dataclass, field
from pathlib import Path

from ..build import load
from ..compile.compiler import Compiler
from ..compile.fstutil import strings
from ..compile.loader import load_model
from ..compile.metadata import build_metadata
from ..language import model as m
from ..language.normalize import make_normalizer
from ..runtime.compiled_language import Language
from ..tables.paradigm import Bound, CellFiller, Shape, cell_templates
from .extract import Harvester, HarvestOptions, HarvestResult

Key = tuple[str, str, str, tuple[str, ...]]


@dataclass
class RecoveryReport:
    removed: list[Key]
    result: HarvestResult
    word_types: int
    correct: list[Key] = field(default_factory=list)
    wrong: list[Key] = field(default_factory=list)
    seconds: float = 0.0

    @property
    def recall(self) -> float:
        return len(self.correct) / len(self.removed) if self.removed else 0.0

    @property
    def precision(self) -> float:
        n = len(self.result.proposals)
        return len(self.correct) / n if n else 0.0

    def summary(self) -> str:
        return (
            f"removed {len(self.removed)} entries; {self.word_types} word types in the list; "
            f"{len(self.result.proposals)} proposals; {len(self.correct)} right: "
            f"recall {self.recall:.1%}, precision {self.precision:.1%}"
        )


def copy_language(grammar_path: str | Path, workdir: Path) -> Path:
    """Copy a grammar (its directory) and its lexicon paths into ``workdir``, keeping relative paths."""
    grammar_path = Path(grammar_path).resolve()
    grammar = load_model(grammar_path)
    lex = [(grammar_path.parent / p).resolve() for p in grammar.lexicon_paths]
    root = Path(*_common([grammar_path.parent, *lex]))
    for path in [grammar_path.parent, *lex]:
        target = workdir / path.relative_to(root)
        if path.is_dir():
            shutil.copytree(path, target, dirs_exist_ok=True)
        else:
            target.parent.mkdir(parents=True, exist_ok=True)
            shutil.copy2(path, target)
    return workdir / grammar_path.relative_to(root)


def _common(paths: list[Path]) -> tuple[str, ...]:
    parts = [p.parts for p in paths]
    out: list[str] = []
    for group in zip(*parts):
        if len(set(group)) != 1:
            break
        out.append(group[0])
    return tuple(out)


def add_guess_patterns(grammar_path: Path, patterns: dict[str, str]) -> None:
    """Give classes of a copied grammar a guess pattern (``{"verb": "@cons* @vowel @letter* m [a e] k"}``)."""
    text = grammar_path.read_text(encoding="utf-8")
    for klass, pattern in patterns.items():
        line = re.compile(rf"^(\s*{re.escape(klass)}\s+pos\s[^\n#]*?)(\s*#.*)?$", re.M)
        text, n = line.subn(_appender(f" guess {pattern}"), text, count=1)
        if n != 1:
            raise ValueError(f"class {klass} not found in {grammar_path}")
    grammar_path.write_text(text, encoding="utf-8")


def _appender(addition: str) -> Callable[[re.Match[str]], str]:
    def replace(found: re.Match[str]) -> str:
        return f"{found.group(1)}{addition}{found.group(2) or ''}"

    return replace


def recovery_experiment(
    grammar_path: str | Path,
    workdir: Path,
    classes: tuple[str, ...] = ("noun",),
    every: int = 2,
    limit: int = 150,
    known: int = 150,
    seed: int = 1,
    add_guess: dict[str, str] | None = None,
    keep_files: tuple[str, ...] | None = None,
    options: HarvestOptions | None = None,
) -> RecoveryReport:
    """Run the experiment described in the module text and return its figures.

    ``keep_files``: lexicon file names to keep in the copy (the others are left out, so the copy
    compiles faster); ``None`` keeps every file.
    """
    start = time.perf_counter()
    copy = copy_language(grammar_path, workdir)
    if add_guess:
        add_guess_patterns(copy, add_guess)
    if keep_files is not None:
        for lexicon_dir in {Path(p).parent for p in _lexicon_files(copy)}:
            for f in lexicon_dir.glob("*.tsv"):
                if f.name not in keep_files:
                    f.unlink()
    full = load_model(copy)
    fold = make_normalizer(full.normalization)
    eligible = [
        e for e in full.lexicon if e.klass in classes and (full.classes[e.klass].stems or "".join(e.stem) == fold(e.lemma))
    ]
    removed = [e for i, e in enumerate(eligible) if i % every == every - 1][:limit]
    kept = [e for i, e in enumerate(eligible) if i % every != every - 1][:known]
    gone = defaultdict(set)
    for e in removed:
        gone[e.pos.file].add(e.pos.line)
    for file, lines in gone.items():
        text = Path(file).read_text(encoding="utf-8").splitlines(keepends=True)
        Path(file).write_text("".join(t for n, t in enumerate(text, start=1) if n not in lines), encoding="utf-8")
    words = _sample_forms(full, removed + kept, random.Random(seed))
    reduced = load(copy)
    harvester = Harvester(reduced, depth=0)
    opts = options or HarvestOptions(progress=False)
    result = harvester.harvest(words, opts)
    truth = {(e.lemma, e.klass, e.pos_tag, tuple(sorted(e.flags))) for e in removed}
    report = RecoveryReport(sorted(truth), result, len(words))
    for p in result.proposals:
        key = (p.lemma, p.klass, p.pos, tuple(sorted(p.flags)))
        (report.correct if key in truth else report.wrong).append(key)
    report.seconds = time.perf_counter() - start
    return report


def _lexicon_files(grammar_path: Path) -> list[str]:
    from ..language.lexicon import lexicon_files
    from ..language.syntax import parse_grammar_file

    return [str(p) for p in lexicon_files(parse_grammar_file(grammar_path))]


def _short_cells(filler: CellFiller, lang: Language, klass: str, pos: str, max_tags: int) -> Shape:
    """The cells of a class with at most ``max_tags`` tags (broad grammars have tens of thousands)."""
    templates = [t for t in cell_templates(lang.meta, klass, pos, Bound()) if len(t.tags) <= max_tags and not t.blocked_by]
    index: dict[str, int] = {}
    for i, t in enumerate(templates):
        index.setdefault(filler.encode(t), i)
    return Shape(templates, strings(index), index)


def _sample_forms(grammar: m.Grammar, entries: list[m.LexEntry], rng: random.Random, max_tags: int = 4) -> dict[str, int]:
    """A word list of forms of ``entries``: a few cells per lemma, drawn by one Zipf-like ranking per class
    among the cells of at most ``max_tags`` tags (part of speech and features)."""
    compiler = Compiler(grammar)
    fsts = compiler.entry_fsts([_copy_entry(e) for e in entries])
    meta = build_metadata(grammar, compiler.space)
    meta["lexicon"] = [
        {
            "lemma": e.lemma,
            "class": e.klass,
            "pos": e.pos_tag,
            "gloss": e.gloss,
            "weight": 0.0,
            "stem": e.stem,
            "flags": e.flags,
            "file": "",
            "line": 0,
        }
        for e in entries
    ]
    lang = Language(fsts, meta, None)
    filler = CellFiller(lang)
    ranking: dict[tuple[str, str], list[str]] = {}
    words: dict[str, int] = defaultdict(int)
    shapes: dict[tuple[str, str], Shape] = {}
    for e in entries:
        shape = shapes.get((e.klass, e.pos_tag))
        if shape is None:
            shape = shapes[(e.klass, e.pos_tag)] = _short_cells(filler, lang, e.klass, e.pos_tag, max_tags)
        cells = [c for c in filler.fill(e.lemma, shape) if c.forms]
        if not cells:
            continue
        key = (e.klass, e.pos_tag)
        if key not in ranking:
            order = sorted({c.features for c in cells})
            rng.shuffle(order)
            ranking[key] = order
        rank = {f: i + 1 for i, f in enumerate(ranking[key])}
        weights = [1.0 / rank.get(c.features, len(rank) + 1) for c in cells]
        shown = rng.randint(2, 12)
        for _ in range(shown * 2):
            cell = rng.choices(cells, weights)[0]
            words[cell.forms[0].form] += rng.randint(1, 20)
    return dict(words)


def _copy_entry(e: m.LexEntry) -> m.LexEntry:
    return m.LexEntry(e.lemma, e.klass, e.pos_tag, e.gloss, 0.0, list(e.stem), list(e.flags), e.pos, True)

"""Bulk export of every form of every lexicon entry in the UniMorph three-column format.

Each line is ``lemma<TAB>form<TAB>features`` with the features as a UniMorph bundle (``N;PL;LOC``;
derived words carry their derivation, ``N;AGT;N;PL;NOM``). Entries are processed one at a time and
their lines written at once, so memory does not grow with the output: the cell shapes are compiled
once per class and part of speech, and nothing is kept per entry but its place in an index of the
lexicon by (lemma, part of speech) (so two entries that differ only in class or stem are written
once, with the union of their forms). The file is written under a temporary name and renamed when
complete.

Cyclic derivation is bounded by the same :class:`~morphfst.tables.paradigm.Bound` as tables: a depth limit
and a feature filter.
"""

from __future__ import annotations

import os
import sys
import time
from collections.abc import Callable, Iterator, Sequence
from contextlib import contextmanager, suppress
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, TextIO

from ..atomic import create_temp, discard, publish, write_error
from ..errors import UserError
from ..runtime.compiled_language import Language
from .paradigm import Bound, Cell, CellFiller


@dataclass
class ExportStats:
    """What an export wrote."""

    entries: int = 0  # lexicon entries covered
    lemmas: int = 0  # distinct (lemma, part of speech) pairs written
    cells: int = 0
    empty_cells: int = 0
    forms: int = 0
    seconds: float = 0.0
    path: str = ""
    by_pos: dict[str, int] = field(default_factory=dict)

    @property
    def forms_per_second(self) -> float:
        return self.forms / self.seconds if self.seconds > 0 else 0.0

    def to_dict(self) -> dict[str, Any]:
        return {
            "entries": self.entries,
            "lemmas": self.lemmas,
            "cells": self.cells,
            "empty_cells": self.empty_cells,
            "forms": self.forms,
            "seconds": round(self.seconds, 3),
            "forms_per_second": round(self.forms_per_second, 1),
            "path": self.path,
            "by_pos": self.by_pos,
        }


def check_pos(lang: Language, pos: Sequence[str]) -> list[str]:
    known = lang.dimensions.get("pos", [])
    for p in pos:
        if p not in known:
            raise UserError(f"unknown part of speech {p!r}", hint="parts of speech of " + lang.name + ": " + ", ".join(known))
    return list(pos)


def lexicon_index(lang: Language, pos: Sequence[str] = ()) -> list[int | list[int]]:
    """The lexicon grouped by (lemma, part of speech), in lexicon order of first appearance: the index
    of each entry, or a list of indices where entries share lemma and part of speech."""
    entries = lang.meta["lexicon"]
    wanted = set(pos)
    first: dict[str, int] = {}
    order: list[int | list[int]] = []
    for i, e in enumerate(entries):
        if wanted and e["pos"] not in wanted:
            continue
        key = e["lemma"] + "\t" + e["pos"]
        at = first.setdefault(key, len(order))
        if at == len(order):
            order.append(i)
        else:
            known = order[at]
            order[at] = (known if isinstance(known, list) else [known]) + [i]
    return order


def lexicon_groups(
    lang: Language, pos: Sequence[str] = (), index: list[int | list[int]] | None = None
) -> Iterator[list[dict[str, Any]]]:
    """Lexicon entries grouped by (lemma, part of speech), in lexicon order of first appearance."""
    entries = lang.meta["lexicon"]
    for item in index if index is not None else lexicon_index(lang, pos):
        yield [entries[i] for i in item] if isinstance(item, list) else [entries[item]]


def iter_cells(
    lang: Language,
    bound: Bound,
    pos: Sequence[str] = (),
    filler: CellFiller | None = None,
    index: list[int | list[int]] | None = None,
) -> Iterator[tuple[list[dict[str, Any]], list[Cell]]]:
    """(entries, cells) for every (lemma, part of speech) of the lexicon, one at a time."""
    filler = filler or CellFiller(lang)
    for group in lexicon_groups(lang, pos, index):
        classes = list(dict.fromkeys(e["class"] for e in group))
        shape = filler.shape(classes, group[0]["pos"], bound)
        yield group, filler.fill(group[0]["lemma"], shape)


def iter_unimorph(lang: Language, bound: Bound | None = None, pos: Sequence[str] = ()) -> Iterator[tuple[str, str, str]]:
    """(lemma, form, features) for every form of every entry, preferred variant first in each cell."""
    for _, cells in iter_cells(lang, bound or Bound(layout_only=True), pos):
        for cell in cells:
            for v in cell.forms:
                yield cell.lemma, v.form, cell.features


@contextmanager
def atomic_output(path: str | Path) -> Iterator[TextIO]:
    """A text file written under a temporary name in the same directory and renamed when complete;
    removed if anything goes wrong (a failed write is one :class:`UserError`). ``-`` writes to
    standard output."""
    if str(path) == "-":
        yield sys.stdout
        sys.stdout.flush()
        return
    target = Path(path)
    directory = target.parent if str(target.parent) else Path(".")
    if not directory.is_dir():
        raise UserError(f"no such directory: {directory}", hint="create it first, or write elsewhere")
    fd, tmp = create_temp(target)
    handle = os.fdopen(fd, "w", encoding="utf-8", newline="\n", buffering=1 << 16)
    try:
        yield handle
        handle.close()
        publish(tmp, target)
    except OSError as exc:
        with suppress(OSError):
            handle.close()
        discard(tmp)
        raise write_error(exc, target) from None
    except BaseException:
        with suppress(OSError):
            handle.close()
        discard(tmp)
        raise


def write_text(path: str | Path, text: str) -> None:
    """Write ``text`` to ``path`` through :func:`atomic_output`."""
    with atomic_output(path) as out:
        out.write(text)


def export_unimorph(
    lang: Language,
    output: str | Path,
    bound: Bound | None = None,
    pos: Sequence[str] = (),
    progress: bool = False,
    on_group: Callable[[ExportStats], None] | None = None,
) -> ExportStats:
    """Write every form of every lexicon entry to ``output`` (``-``: standard output) as
    ``lemma<TAB>form<TAB>features`` lines; returns what was written.

    ``progress`` shows a tqdm progress bar on standard error.
    """
    bound = bound or Bound(layout_only=True)
    pos = check_pos(lang, pos)
    stats = ExportStats(path=str(output))
    index = lexicon_index(lang, pos)
    total = len(index)
    t0 = time.perf_counter()
    bar = None
    if progress:
        from tqdm import tqdm

        bar = tqdm(total=total, unit="lemma", file=sys.stderr, desc=f"export {lang.name}", dynamic_ncols=True, mininterval=0.3)
    try:
        with atomic_output(output) as out:
            write = out.write
            for group, cells in iter_cells(lang, bound, pos, index=index):
                stats.entries += len(group)
                stats.lemmas += 1
                lines = []
                for cell in cells:
                    stats.cells += 1
                    if not cell.forms:
                        stats.empty_cells += 1
                        continue
                    features = cell.features
                    for v in cell.forms:
                        lines.append(f"{cell.lemma}\t{v.form}\t{features}\n")
                write("".join(lines))
                stats.forms += len(lines)
                p = group[0]["pos"]
                stats.by_pos[p] = stats.by_pos.get(p, 0) + len(lines)
                if bar is not None:
                    bar.update(1)
                    if stats.lemmas % 50 == 0:
                        bar.set_postfix(forms=stats.forms, refresh=False)
                if on_group is not None:
                    on_group(stats)
    finally:
        if bar is not None:
            bar.set_postfix(forms=stats.forms, refresh=False)
            bar.close()
    stats.seconds = time.perf_counter() - t0
    return stats

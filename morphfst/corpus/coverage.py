"""The coverage report of a corpus run: what was read, what the grammar analyzed, what it did not.

Token figures are exact. Type figures are exact while the run has seen at most ``max_types``
distinct word types; past that, the rarest types are dropped from the table in rounds (lossy
counting, Manku & Motwani 2002), the type figures become estimates and the report says so, so
that memory stays bounded whatever the corpus size.

The report is written as JSON (``.json``) or TSV (anything else; ``#`` comment lines with the
totals, then one row per unanalyzed type ranked by frequency with the guesser's proposal), and
summarized for people on standard error.
"""

from __future__ import annotations

import json
from collections.abc import Callable
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, TextIO

from .outputs import atomic_text
from .records import ANALYZED, GUESSED, NUMBER, STATUS, UNKNOWN, ChunkResult, Tally, TypeRow, add_types

MAX_TYPES = 500_000


@dataclass
class Coverage:
    """Counts over a whole run (merged from chunk results, in any order)."""

    lines: int = 0
    tokens: int = 0
    bytes: int = 0
    replaced_bytes: int = 0
    nul_bytes: int = 0
    empty_lines: int = 0
    cut_lines: int = 0
    long_tokens: int = 0
    unlisted_tokens: int = 0
    status_tokens: list[int] = field(default_factory=lambda: [0, 0, 0, 0])
    analyses: int = 0
    ambiguous: int = 0
    analyzed: int = 0  # word types analyzed by all processes together (a type analyzed twice counts twice)
    types: dict[str, TypeRow] = field(default_factory=dict)  # type -> (tokens, status, analyses)
    max_types: int = MAX_TYPES
    pruned_below: int = 0  # types seen fewer than this many times may be missing from ``types``
    files: list[str] = field(default_factory=list)

    def add(self, r: ChunkResult) -> None:
        """Add a chunk's counts (and its tally, when the processor flushed one)."""
        self.lines += r.lines
        self.tokens += r.tokens
        self.bytes += r.bytes_in
        self.replaced_bytes += r.replaced_bytes
        self.nul_bytes += r.nul_bytes
        self.empty_lines += r.empty_lines
        self.cut_lines += r.cut_lines
        if r.tally is not None:
            self.add_tally(r.tally)

    def add_tally(self, t: Tally) -> None:
        """Add per-type figures flushed by a processor."""
        for i, n in enumerate(t.status_tokens):
            self.status_tokens[i] += n
        self.analyses += t.analyses
        self.ambiguous += t.ambiguous
        self.analyzed += t.analyzed
        self.long_tokens += t.long_tokens
        self.unlisted_tokens += t.unlisted_tokens
        add_types(self.types, t.types)
        if len(self.types) > self.max_types:
            self._prune()

    def merge(self, other: Coverage) -> None:
        """Add another run's counts (e.g. from a cluster partition)."""
        for name in (
            "lines",
            "tokens",
            "bytes",
            "replaced_bytes",
            "nul_bytes",
            "empty_lines",
            "cut_lines",
            "long_tokens",
            "unlisted_tokens",
            "analyses",
            "ambiguous",
            "analyzed",
        ):
            setattr(self, name, getattr(self, name) + getattr(other, name))
        for i, n in enumerate(other.status_tokens):
            self.status_tokens[i] += n
        add_types(self.types, other.types)
        self.pruned_below = max(self.pruned_below, other.pruned_below)
        if len(self.types) > self.max_types:
            self._prune()

    def _prune(self) -> None:
        """Drop the rarest types until at most half of ``max_types`` remain."""
        counts = sorted(entry[0] for entry in self.types.values())
        threshold = counts[len(counts) - self.max_types // 2 - 1] if len(counts) > self.max_types // 2 else 0
        self.types = {w: e for w, e in self.types.items() if e[0] > threshold}
        self.pruned_below = max(self.pruned_below, threshold + 1)

    # ---- figures ------------------------------------------------------------------------------------------
    @property
    def word_tokens(self) -> int:
        """Tokens that are words (numbers left out)."""
        return self.tokens - self.status_tokens[NUMBER]

    def figures(self) -> dict[str, Any]:
        st = self.status_tokens
        words = self.word_tokens
        type_status = [0, 0, 0, 0]
        for _, status, _ in self.types.values():
            type_status[status] += 1
        word_types = sum(type_status) - type_status[NUMBER]

        def pct(a: int, b: int) -> float:
            return round(100.0 * a / b, 2) if b else 0.0

        return {
            "lines": self.lines,
            "bytes": self.bytes,
            "tokens": self.tokens,
            "word_tokens": words,
            "tokens_by_status": dict(zip(STATUS, st)),
            "token_coverage_percent": pct(st[ANALYZED], words),
            "token_coverage_with_guesses_percent": pct(st[ANALYZED] + st[GUESSED], words),
            "word_types": word_types,
            "types_by_status": dict(zip(STATUS, type_status)),
            "type_coverage_percent": pct(type_status[ANALYZED], word_types),
            "type_figures_exact": self.pruned_below == 0,
            "types_missing_below_count": self.pruned_below,
            "analyses_per_analyzed_token": round(self.analyses / st[ANALYZED], 3) if st[ANALYZED] else 0.0,
            "ambiguous_token_percent": pct(self.ambiguous, st[ANALYZED]),
            "types_analyzed": self.analyzed,
            "input": {
                "invalid_utf8_bytes_replaced": self.replaced_bytes,
                "nul_bytes": self.nul_bytes,
                "empty_lines": self.empty_lines,
                "lines_cut_for_length": self.cut_lines,
                "overlong_tokens": self.long_tokens,
                "tokens_not_listed_as_types": self.unlisted_tokens,
            },
        }

    def unanalyzed(self, top: int) -> list[tuple[str, int, str]]:
        """(type, tokens, status) of the most frequent types with no lexicon analysis."""
        rows = [(w, e[0], STATUS[e[1]]) for w, e in self.types.items() if e[1] in (GUESSED, UNKNOWN)]
        rows.sort(key=lambda r: (-r[1], r[0]))
        return rows[:top]

    # ---- output ------------------------------------------------------------------------------------------------
    def report_rows(self, top: int, propose: Callable[[str], tuple[str, str]] | None) -> list[dict[str, Any]]:
        rows = []
        for rank, (word, count, status) in enumerate(self.unanalyzed(top), start=1):
            analysis, segmentation = propose(word) if propose else ("", "")
            rows.append(
                {
                    "rank": rank,
                    "word": word,
                    "tokens": count,
                    "status": status,
                    "proposal": analysis,
                    "segmentation": segmentation,
                }
            )
        return rows

    def write(
        self,
        path: str | Path,
        top: int = 1000,
        propose: Callable[[str], tuple[str, str]] | None = None,
        extra: dict[str, Any] | None = None,
    ) -> Path:
        """Write the report as JSON (``.json``) or TSV, atomically."""
        path = Path(path)
        figures = self.figures() | (extra or {})
        rows = self.report_rows(top, propose)
        with atomic_text(path) as out:
            if path.suffix.lower() == ".json":
                json.dump({"figures": figures, "files": self.files, "unanalyzed": rows}, out, ensure_ascii=False, indent=1)
                out.write("\n")
            else:
                for key, value in _flatten(figures):
                    out.write(f"# {key}: {value}\n")
                out.write("rank\tword\ttokens\tstatus\tproposal\tsegmentation\n")
                for r in rows:
                    cells = [str(r["rank"]), r["word"], str(r["tokens"]), r["status"], r["proposal"], r["segmentation"]]
                    out.write("\t".join(c.replace("\t", " ") for c in cells) + "\n")
        return path

    def summary(self, top: int = 10, propose: Callable[[str], tuple[str, str]] | None = None) -> str:
        f = self.figures()
        st = f["tokens_by_status"]
        lines = [
            "coverage report",
            f"  lines {f['lines']:,}  bytes {f['bytes']:,}  tokens {f['tokens']:,} (words {f['word_tokens']:,}, numbers {st['number']:,})",
            f"  word tokens analyzed   {st['analyzed']:>12,}  {f['token_coverage_percent']:6.2f}%",
            f"  word tokens guessed    {st['guessed']:>12,}  (with guesses {f['token_coverage_with_guesses_percent']:.2f}%)",
            f"  word tokens unknown    {st['unknown']:>12,}",
            f"  word types analyzed    {f['types_by_status']['analyzed']:>12,} of {f['word_types']:,}  {f['type_coverage_percent']:6.2f}%"
            + (
                ""
                if f["type_figures_exact"]
                else f"  (estimate: types seen fewer than {f['types_missing_below_count']} times dropped)"
            ),
            f"  ambiguity: {f['analyses_per_analyzed_token']:.2f} analyses per analyzed token, {f['ambiguous_token_percent']:.1f}% ambiguous",
        ]
        inp = f["input"]
        notes = [f"{v:,} {k.replace('_', ' ')}" for k, v in inp.items() if v]
        if notes:
            lines.append("  input: " + ", ".join(notes))
        rows = self.report_rows(top, propose)
        if rows:
            lines.append("  most frequent unanalyzed words (guesser's proposal):")
            width = max(len(r["word"]) for r in rows)
            for r in rows:
                lines.append(f"    {r['word']:<{width}}  {r['tokens']:>9,}  {r['proposal'] or '(no proposal)'}")
        return "\n".join(lines) + "\n"

    def print_summary(self, out: TextIO, top: int = 10, propose: Callable[[str], tuple[str, str]] | None = None) -> None:
        out.write(self.summary(top, propose))


def _flatten(d: dict[str, Any], prefix: str = "") -> list[tuple[str, Any]]:
    out: list[tuple[str, Any]] = []
    for k, v in d.items():
        if isinstance(v, dict):
            out.extend(_flatten(v, f"{prefix}{k}."))
        else:
            out.append((f"{prefix}{k}", v))
    return out

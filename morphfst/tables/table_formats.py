"""Output formats for laid-out paradigms: terminal text, Markdown, CSV/TSV, a self-contained HTML page, JSON.

Every format shows all forms of a cell, preferred first. In the text, Markdown and HTML views,
forms tied for the lowest weight are joined with `` / `` and less preferred forms follow in
parentheses; a cell the grammar leaves unfilled shows an em dash; a crossing the paradigm does not
have at all stays blank; a sub-table none of whose cells has a form is left out and named under the
table (see :func:`shown_grids`). CSV/TSV have one record per form (one per unfilled cell, with an empty
form), so they read back into a list of (cell, rank, form) records; JSON holds everything, as plain
data.
"""

from __future__ import annotations

import csv
import functools
import html
import io
import json
import textwrap
import unicodedata
from collections.abc import Sequence
from typing import Any

from .layout import Arranged, Grid, Section
from .paradigm import Cell

EMPTY = "—"
FORMATS = ("text", "markdown", "csv", "tsv", "html", "json")
GAP = "   "
LEGEND_ITEMS = (
    "a / b: forms of equal preference",
    "a (b): b is a less preferred variant",
    f"{EMPTY}: no form (the grammar leaves the cell unfilled)",
)
LEGEND = ";  ".join(LEGEND_ITEMS)


# ---------------------------------------------------------------------------------------------
# Cell text


def cell_text(cell: Cell | None) -> str:
    """One-line text of a cell: preferred forms joined with ' / ', other variants in parentheses."""
    if cell is None:
        return ""
    if not cell.forms:
        return EMPTY
    text = " / ".join(v.form for v in cell.preferred)
    others = [v.form for v in cell.others]
    return text + (f" ({', '.join(others)})" if others else "")


def cell_lines(cell: Cell | None) -> list[str]:
    """The cell stacked, one variant per line (for narrow terminals)."""
    if cell is None or not cell.forms:
        return [cell_text(cell)]
    return [v.form if v.preferred else f"({v.form})" for v in cell.forms]


@functools.lru_cache(maxsize=1 << 16)
def display_width(text: str) -> int:
    """Terminal columns taken by ``text`` (combining marks take none, wide characters two; Unicode
    East Asian Width). Memoized: a table measures the same labels and forms many times."""
    if text.isascii():
        return len(text)
    width = 0
    for ch in text:
        if unicodedata.combining(ch):
            continue
        width += 2 if unicodedata.east_asian_width(ch) in ("W", "F") else 1
    return width


def pad(text: str, width: int) -> str:
    return text + " " * max(0, width - display_width(text))


def _uses_variants(items: Sequence[Arranged]) -> tuple[bool, bool]:
    variants = empties = False
    for a in items:
        for c in a.paradigm.cells:
            variants = variants or len(c.forms) > 1
            empties = empties or not c.forms
    return variants, empties


def _has_form(grid: Grid) -> bool:
    return any(cell is not None and cell.forms for row in grid.cells for cell in row)


def shown_grids(section: Section) -> list[Grid]:
    """The grids the viewing formats (text, Markdown, HTML) show: a grid with no form in any cell is
    left out (a combination the morphotactics allows and the rules or constraints leave empty, such
    as Turkish -mIş twice); :func:`unfilled_summary` names them. The record formats keep every cell."""
    return [g for g in section.grids if _has_form(g)]


def unfilled_summary(a: Arranged) -> str:
    """A line saying how many cells have no form and which constraints of the grammar empty them, and
    which sub-tables the viewing formats leave out because none of their cells has a form."""
    empty = [c for c in a.paradigm.cells if not c.forms]
    if not empty:
        return ""
    by: dict[str, int] = {}
    for c in empty:
        for name in c.template.blocked_by or ("no rule path",):
            by[name] = by.get(name, 0) + 1
    reasons = ", ".join(f"{name}: {n}" if name == "no rule path" else f"constraint {name}: {n}" for name, n in by.items())
    line = f"{len(empty)} of {len(a.paradigm.cells)} cells have no form ({reasons})"
    hidden = [g.title or "(untitled)" for section in a.sections for g in section.grids if not _has_form(g)]
    if hidden:
        line += f"; {len(hidden)} sub-table{'s' if len(hidden) > 1 else ''} with no form at all not shown: " + "; ".join(
            dict.fromkeys(hidden)
        )
    return line


# ---------------------------------------------------------------------------------------------
# Terminal text


class _Block:
    """A rectangle of text lines (one grid, or a part of one) ready to be set beside others."""

    def __init__(self, lines: list[str]) -> None:
        self.lines = lines
        self.width = max((display_width(x) for x in lines), default=0)


def _grid_block(grid: Grid, columns: list[int], row_labels: bool, stacked: bool, title: str) -> _Block:
    label_w = max([display_width(grid.row_header)] + [display_width(r) for r in grid.rows]) if row_labels else 0
    contents = [
        [(cell_lines(grid.cells[r][c]) if stacked else [cell_text(grid.cells[r][c])]) for c in columns]
        for r in range(len(grid.rows))
    ]
    widths = []
    for j, c in enumerate(columns):
        w = display_width(grid.columns[c])
        for row in contents:
            w = max([w] + [display_width(x) for x in row[j]])
        widths.append(w)

    def line(first: str, cells: list[str]) -> str:
        parts = ([pad(first, label_w)] if row_labels else []) + [pad(x, w) for x, w in zip(cells, widths)]
        return "  ".join(parts)

    lines = [title]
    lines.append(line(grid.row_header, [grid.columns[c] for c in columns]))
    lines.append(line("─" * label_w, ["─" * w for w in widths]))
    for r, row in enumerate(contents):
        height = max(len(x) for x in row)
        for k in range(height):
            lines.append(line(grid.rows[r] if k == 0 else "", [x[k] if k < len(x) else "" for x in row]))
    return _Block(lines)


def _grid_blocks(grid: Grid, width: int, row_labels: bool) -> list[_Block]:
    """The grid as one block, or split into column chunks that each fit ``width``."""
    everything = list(range(len(grid.columns)))
    whole = _grid_block(grid, everything, row_labels, False, grid.title)
    if whole.width <= width:
        return [whole]
    for stacked in (False, True):
        chunks: list[list[int]] = []
        current: list[int] = []
        for c in everything:
            trial = _grid_block(grid, current + [c], True, stacked, grid.title)
            if current and trial.width > width:
                chunks.append(current)
                current = [c]
            else:
                current.append(c)
        if current:
            chunks.append(current)
        blocks = []
        for i, chunk in enumerate(chunks):
            suffix = f" ({i + 1}/{len(chunks)})" if len(chunks) > 1 else ""
            blocks.append(_grid_block(grid, chunk, True, stacked, (grid.title + suffix).strip()))
        if all(b.width <= width for b in blocks) or stacked:
            return blocks
    return blocks


def _side_by_side(blocks: list[_Block]) -> list[str]:
    height = max(len(b.lines) for b in blocks)
    out = []
    first = 1 if all(not b.lines[0].strip() for b in blocks) else 0  # no titles: no title line
    for i in range(first, height):
        parts = [pad(b.lines[i] if i < len(b.lines) else "", b.width) for b in blocks]
        out.append(GAP.join(parts).rstrip())
    return out


def render_text(items: Sequence[Arranged], width: int = 80) -> str:
    """An aligned view for a terminal of ``width`` columns; narrow grids with the same rows are set
    side by side, wide ones are split into sub-tables of columns."""
    out: list[str] = []

    def wrap(text: str) -> list[str]:
        return textwrap.wrap(text, width=width, subsequent_indent="  ", break_on_hyphens=False) or [""]

    for a in items:
        out.extend(wrap(a.heading))
        out.append("═" * min(width, max(display_width(a.heading), 8)))
        out.extend(wrap(a.details))
        for n in a.paradigm.notes:
            out.extend(wrap(f"note: {n}"))
        for section in a.sections:
            head = " ".join(x for x in (section.title, f"[{section.fixed_note}]" if section.fixed_note else "") if x)
            if head:
                out.append("")
                out.extend(wrap(head))
                out.append("─" * min(width, display_width(head)))
            band: list[_Block] = []
            band_rows: list[str] | None = None
            band_width = 0

            def flush() -> None:
                nonlocal band, band_rows, band_width
                if band:
                    out.append("")
                    out.extend(_side_by_side(band))
                band, band_rows, band_width = [], None, 0

            for grid in shown_grids(section):
                if grid.single:
                    flush()
                    out.append("")
                    out.extend(wrap((f"{grid.title}: " if grid.title else "") + cell_text(grid.cells[0][0])))
                    continue
                if band_rows == grid.rows:
                    blocks = _grid_blocks(grid, width, row_labels=False)
                    if len(blocks) == 1 and band_width + len(GAP) + blocks[0].width <= width:
                        band.append(blocks[0])
                        band_width += len(GAP) + blocks[0].width
                        continue
                flush()
                blocks = _grid_blocks(grid, width, row_labels=True)
                if len(blocks) == 1:
                    band, band_rows, band_width = [blocks[0]], grid.rows, blocks[0].width
                    if display_width(grid.title) > blocks[0].width:
                        flush()
                    continue
                for b in blocks:
                    out.append("")
                    out.extend(x.rstrip() for x in b.lines)
            flush()
        summary = unfilled_summary(a)
        if summary:
            out.append("")
            out.extend(wrap(summary))
        out.append("")
    variants, empties = _uses_variants(items)
    if variants or empties:
        line = "  ".join(LEGEND_ITEMS)
        out.extend([line] if display_width(line) <= width else list(LEGEND_ITEMS))
    return "\n".join(out).rstrip() + "\n"


# ---------------------------------------------------------------------------------------------
# Markdown


def _md(text: str) -> str:
    return text.replace("\\", "\\\\").replace("|", "\\|").replace("*", "\\*").replace("_", "\\_")


def render_markdown(items: Sequence[Arranged]) -> str:
    out: list[str] = []
    for a in items:
        out += [f"# {_md(a.heading)}", "", f"*{_md(a.details)}*", ""]
        out += [f"> {_md(n)}" for n in a.paradigm.notes] + ([""] if a.paradigm.notes else [])
        for section in a.sections:
            if section.title:
                out += [f"## {_md(section.title)}", ""]
            if section.fixed_note:
                out += [f"*{_md(section.fixed_note)}*", ""]
            for grid in shown_grids(section):
                if grid.title:
                    out += [f"### {_md(grid.title)}", ""]
                out.append("| " + " | ".join(_md(x) for x in [grid.row_header or " ", *grid.columns]) + " |")
                out.append("|" + "---|" * (len(grid.columns) + 1))
                for label, row in zip(grid.rows, grid.cells):
                    out.append("| " + " | ".join([f"**{_md(label)}**"] + [_md(cell_text(c)) for c in row]) + " |")
                out.append("")
        summary = unfilled_summary(a)
        if summary:
            out += [f"*{_md(summary)}*", ""]
    variants, empties = _uses_variants(items)
    if variants or empties:
        out += [_md(LEGEND), ""]
    return "\n".join(out)


# ---------------------------------------------------------------------------------------------
# CSV / TSV

RECORD_FIELDS = (
    "lemma",
    "pos",
    "reading",
    "section",
    "table",
    "row",
    "column",
    "features",
    "rank",
    "form",
    "weight",
    "preferred",
)


def records(items: Sequence[Arranged]) -> list[dict[str, Any]]:
    """One record per form of every cell in the tables (an unfilled cell gives one record with no form)."""
    out: list[dict[str, Any]] = []
    for reading, a in enumerate(items, start=1):
        for section in a.sections:
            for grid in section.grids:
                for label, row in zip(grid.rows, grid.cells):
                    for column, cell in zip(grid.columns, row):
                        if cell is None:
                            continue
                        base = {
                            "lemma": a.paradigm.lemma,
                            "pos": a.paradigm.pos,
                            "reading": reading,
                            "section": section.stem,
                            "table": grid.title,
                            "row": label,
                            "column": column,
                            "features": cell.features,
                        }
                        if not cell.forms:
                            out.append(base | {"rank": 0, "form": "", "weight": "", "preferred": ""})
                        for v in cell.forms:
                            out.append(
                                base
                                | {
                                    "rank": v.rank,
                                    "form": v.form,
                                    "weight": f"{v.weight:.4f}",
                                    "preferred": "yes" if v.preferred else "no",
                                }
                            )
    return out


def render_delimited(items: Sequence[Arranged], delimiter: str = ",") -> str:
    buf = io.StringIO()
    if delimiter == "\t":
        buf.write("\t".join(RECORD_FIELDS) + "\n")
        for rec in records(items):
            buf.write("\t".join(_tsv(str(rec[k])) for k in RECORD_FIELDS) + "\n")
        return buf.getvalue()
    writer = csv.DictWriter(buf, fieldnames=RECORD_FIELDS, lineterminator="\n")
    writer.writeheader()
    writer.writerows(records(items))
    return buf.getvalue()


def _tsv(text: str) -> str:
    return text.replace("\t", " ").replace("\n", " ").replace("\r", " ")


# ---------------------------------------------------------------------------------------------
# HTML

_CSS = """
body { font-family: Georgia, 'Times New Roman', serif; margin: 2em auto; max-width: 60em; padding: 0 1em; color: #1a1a1a; }
h1 { font-size: 1.6em; margin-bottom: 0.2em; }
h2 { font-size: 1.25em; border-bottom: 1px solid #999; margin-top: 1.6em; }
.details, .note, .legend, .meta { color: #555; font-size: 0.9em; }
.grids { display: flex; flex-wrap: wrap; gap: 1.5em 2.5em; align-items: flex-start; }
table { border-collapse: collapse; margin: 0.6em 0; }
caption { text-align: left; font-weight: bold; padding-bottom: 0.3em; }
th, td { padding: 0.2em 0.7em; text-align: left; vertical-align: top; }
thead th { border-bottom: 1px solid #333; font-weight: normal; font-style: italic; }
tbody th { font-weight: normal; font-variant: small-caps; color: #333; }
tbody tr:nth-child(even) { background: #f4f4f4; }
td .alt { color: #666; font-style: italic; font-size: 0.9em; }
td.empty { color: #aaa; }
@media print {
  body { margin: 0; max-width: none; font-size: 10pt; }
  section, table { break-inside: avoid; page-break-inside: avoid; }
  tbody tr:nth-child(even) { background: none; }
}
"""


def _e(text: str) -> str:
    return html.escape(text, quote=True)


def _html_cell(cell: Cell | None) -> str:
    if cell is None:
        return "<td></td>"
    title = _e(cell.analysis)
    if not cell.forms:
        note = " (" + ", ".join(cell.template.blocked_by) + ")" if cell.template.blocked_by else ""
        return f'<td class="empty" title="{title}: no form{_e(note)}">{EMPTY}</td>'
    pref = " / ".join(f'<span class="form">{_e(v.form)}</span>' for v in cell.preferred)
    others = ", ".join(_e(v.form) for v in cell.others)
    alt = f' <span class="alt">({others})</span>' if others else ""
    return f'<td title="{title}">{pref}{alt}</td>'


def render_html(items: Sequence[Arranged], page_title: str, subtitle: str = "") -> str:
    """A self-contained page (inline style, no scripts, no network resources) that prints well.

    The page is well-formed XML (XHTML syntax), so it also parses with an XML parser.
    """
    out = [
        "<!DOCTYPE html>",
        '<html xmlns="http://www.w3.org/1999/xhtml">',
        "<head>",
        '<meta charset="utf-8" />',
        '<meta name="viewport" content="width=device-width, initial-scale=1" />',
        f"<title>{_e(page_title)}</title>",
        f"<style>{_CSS}</style>",
        "</head>",
        "<body>",
    ]
    if subtitle:
        out.append(f'<p class="meta">{_e(subtitle)}</p>')
    for a in items:
        out.append('<article class="reading">')
        out.append(f"<h1>{_e(a.heading)}</h1>")
        out.append(f'<p class="details">{_e(a.details)}</p>')
        for n in a.paradigm.notes:
            out.append(f'<p class="note">{_e(n)}</p>')
        for section in a.sections:
            out.append("<section>")
            if section.title:
                out.append(f"<h2>{_e(section.title)}</h2>")
            if section.fixed_note:
                out.append(f'<p class="note">{_e(section.fixed_note)}</p>')
            out.append('<div class="grids">')
            for grid in shown_grids(section):
                out.append("<table>")
                if grid.title:
                    out.append(f"<caption>{_e(grid.title)}</caption>")
                head = "".join(f'<th scope="col">{_e(c)}</th>' for c in grid.columns)
                out.append(f'<thead><tr><th scope="col">{_e(grid.row_header)}</th>{head}</tr></thead>')
                out.append("<tbody>")
                for label, row in zip(grid.rows, grid.cells):
                    out.append(f'<tr><th scope="row">{_e(label)}</th>' + "".join(_html_cell(c) for c in row) + "</tr>")
                out.append("</tbody>")
                out.append("</table>")
            out.append("</div>")
            out.append("</section>")
        summary = unfilled_summary(a)
        if summary:
            out.append(f'<p class="note">{_e(summary)}</p>')
        out.append("</article>")
    variants, empties = _uses_variants(items)
    if variants or empties:
        out.append(f'<p class="legend">{_e(LEGEND)}</p>')
    out += ["</body>", "</html>", ""]
    return "\n".join(out)


# ---------------------------------------------------------------------------------------------
# JSON


def to_data(items: Sequence[Arranged], language: str, title: str) -> dict[str, Any]:
    """Everything as plain data: the readings, their cells and their tables."""
    return {"language": language, "title": title, "readings": [a.to_dict() for a in items]}


def render_json(items: Sequence[Arranged], language: str, title: str) -> str:
    return json.dumps(to_data(items, language, title), ensure_ascii=False, indent=1) + "\n"


def render(items: Sequence[Arranged], fmt: str, language: str, title: str, width: int = 80) -> str:
    """Render in one of :data:`FORMATS`."""
    if fmt == "text":
        return render_text(items, width)
    if fmt == "markdown":
        return render_markdown(items)
    if fmt == "csv":
        return render_delimited(items, ",")
    if fmt == "tsv":
        return render_delimited(items, "\t")
    if fmt == "html":
        lemmas = ", ".join(dict.fromkeys(a.paradigm.lemma for a in items))
        return render_html(items, f"{lemmas} — {title}", f"{title}: inflection of {lemmas}")
    if fmt == "json":
        return render_json(items, language, title)
    raise ValueError(fmt)

"""Draw the slot graph: plain node and edge data, Graphviz DOT text, and SVG/PNG through ``dot``.

Everything comes from the compiled metadata (classes, slots with their affixes, followers), so the
grammar source is not needed. In the drawing, classes are entry nodes (house shapes), each slot is a
box listing its affixes (form, features, gloss) with one port per affix, ``end`` is a double circle;
slot-to-slot edges are plain, edges of an affix with its own followers leave from the affix's row,
and derivational edges (affixes that change the part of speech) are dashed and red with the new part
of speech as their label.
"""

from __future__ import annotations

import shutil
import subprocess
from dataclasses import asdict, dataclass, field
from pathlib import Path
from typing import Any

from ..atomic import write_bytes_atomic
from ..errors import UserError
from ..runtime.compiled_language import Language

FORMATS = ("dot", "svg", "png")
DERIVATION_COLOR = "#b2182b"
AFFIX_EDGE_COLOR = "#2166ac"
CLASS_FILL = "#d1e5f0"
SLOT_HEAD_FILL = "#eeeeee"


@dataclass
class GraphNode:
    id: str
    kind: str  # "class", "slot" or "end"
    label: str
    rows: list[dict[str, Any]] = field(default_factory=list)  # a slot's affixes


@dataclass
class GraphEdge:
    source: str
    target: str
    kind: str  # "entry" (class → slot), "slot" (slot followers), "affix" (affix's own followers), "derivation"
    affix_id: int | None = None
    label: str = ""


@dataclass
class SlotGraph:
    name: str
    title: str
    nodes: list[GraphNode]
    edges: list[GraphEdge]

    def to_dict(self) -> dict[str, Any]:
        return asdict(self)


def _meta(lang: Any) -> dict[str, Any]:
    if isinstance(lang, dict):
        return lang
    if isinstance(lang, Language):
        return lang.meta
    if hasattr(lang, "meta"):
        return lang.meta  # a DebugSession
    from ..build import load

    return load(lang).meta


def slot_graph_data(lang: Any) -> SlotGraph:
    """The slot graph as plain data (from a Language, a session, a metadata dict or a grammar name)."""
    meta = _meta(lang)
    nodes: list[GraphNode] = []
    edges: list[GraphEdge] = []
    end_used = False

    def node_id(name: str) -> str:
        nonlocal end_used
        if name == "end":
            end_used = True
            return "end"
        return f"slot:{name}"

    for cname, c in meta["classes"].items():
        pos = ", ".join(c.get("pos") or [])
        nodes.append(GraphNode(f"class:{cname}", "class", f"{cname}" + (f" ({pos})" if pos else "")))
        for nxt in c["next"]:
            edges.append(GraphEdge(f"class:{cname}", node_id(nxt), "entry"))
    for sname, slot in meta["slots"].items():
        rows = []
        default_used = False
        for a in slot["affixes"]:
            form = "".join(a["form"]) or "∅"
            rows.append(
                {"id": a["id"], "form": form, "features": list(a["features"]), "gloss": a["gloss"], "new_pos": a["new_pos"]}
            )
            targets = a["next"] if a["next"] is not None else slot["next"]
            if a["new_pos"]:
                for t in targets:
                    edges.append(GraphEdge(f"slot:{sname}", node_id(t), "derivation", a["id"], f"⇒ {a['new_pos']}"))
            elif a["next"] is not None:
                for t in targets:
                    edges.append(GraphEdge(f"slot:{sname}", node_id(t), "affix", a["id"]))
            else:
                default_used = True
        if default_used:
            for t in slot["next"]:
                edges.append(GraphEdge(f"slot:{sname}", node_id(t), "slot"))
        nodes.append(GraphNode(f"slot:{sname}", "slot", sname, rows))
    if end_used:
        nodes.append(GraphNode("end", "end", "end"))
    return SlotGraph(meta["name"], meta.get("title", meta["name"]), nodes, edges)


# ---- DOT ---------------------------------------------------------------------------------------------


def _q(text: str) -> str:
    """A double-quoted DOT ID."""
    return '"' + text.replace("\\", "\\\\").replace('"', '\\"') + '"'


def _html(text: str) -> str:
    return text.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace('"', "&quot;")


def _slot_label(node: GraphNode) -> str:
    rows = [f'<TR><TD PORT="head" BGCOLOR="{SLOT_HEAD_FILL}" COLSPAN="3"><B>{_html(node.label)}</B></TD></TR>']
    for r in node.rows:
        feats = ";".join(r["features"])
        gloss = r["gloss"]
        derived = f' <FONT COLOR="{DERIVATION_COLOR}">⇒ {_html(r["new_pos"])}</FONT>' if r["new_pos"] else ""
        rows.append(
            f'<TR><TD ALIGN="LEFT">{_html(r["form"])}</TD><TD ALIGN="LEFT">{_html(feats)}</TD>'
            f'<TD ALIGN="LEFT" PORT="a{r["id"]}"><I>{_html(gloss)}</I>{derived}</TD></TR>'
        )
    return '<<TABLE BORDER="1" CELLBORDER="0" CELLSPACING="0" CELLPADDING="3">' + "".join(rows) + "</TABLE>>"


def to_dot(graph: SlotGraph, rankdir: str = "LR") -> str:
    """Graphviz DOT text of a slot graph."""
    lines = [
        f"digraph {_q(graph.name)} {{",
        f'  graph [rankdir={rankdir}, fontname="Helvetica", labelloc=t, label={_q(graph.title + ": slot graph")}];',
        '  node [fontname="Helvetica", fontsize=10];',
        '  edge [fontname="Helvetica", fontsize=9];',
    ]
    for n in graph.nodes:
        if n.kind == "class":
            lines.append(
                f'  {_q(n.id)} [shape=house, orientation=270, style=filled, fillcolor="{CLASS_FILL}", label={_q(n.label)}];'
            )
        elif n.kind == "end":
            lines.append(f"  {_q(n.id)} [shape=doublecircle, label={_q(n.label)}];")
        else:
            lines.append(f"  {_q(n.id)} [shape=plaintext, label={_slot_label(n)}];")
    for e in graph.edges:
        src = _q(e.source)
        if e.kind == "entry":
            lines.append(f"  {src} -> {_q(e.target)} [style=bold];")
        elif e.kind == "slot":
            lines.append(f"  {src}:head -> {_q(e.target)};")
        elif e.kind == "affix":
            lines.append(f'  {src}:a{e.affix_id} -> {_q(e.target)} [color="{AFFIX_EDGE_COLOR}"];')
        else:
            lines.append(
                f'  {src}:a{e.affix_id} -> {_q(e.target)} [style=dashed, color="{DERIVATION_COLOR}", '
                f'fontcolor="{DERIVATION_COLOR}", label={_q(e.label)}];'
            )
    lines.append("}")
    return "\n".join(lines) + "\n"


def slot_graph_dot(lang: Any, rankdir: str = "LR") -> str:
    """DOT text of a language's slot graph."""
    return to_dot(slot_graph_data(lang), rankdir)


def dot_program() -> str | None:
    """The path of Graphviz's ``dot`` program, or None when it is not installed."""
    return shutil.which("dot")


def render(dot_text: str, fmt: str) -> bytes:
    """SVG or PNG bytes drawn by the ``dot`` program."""
    program = dot_program()
    if program is None:
        raise UserError(
            f"drawing {fmt.upper()} needs the Graphviz 'dot' program, which is not installed",
            hint="install Graphviz (e.g. apt-get install graphviz), or write DOT text with --format dot",
        )
    try:
        done = subprocess.run(
            [program, f"-T{fmt}"], input=dot_text.encode("utf-8"), capture_output=True, timeout=120, check=False
        )
    except (OSError, subprocess.TimeoutExpired) as exc:
        raise UserError(f"the dot program failed: {exc}") from None
    if done.returncode != 0:
        raise UserError(f"the dot program failed: {done.stderr.decode('utf-8', 'replace').strip()}")
    return done.stdout


def write_graph(lang: Any, output: str | Path, fmt: str | None = None, rankdir: str = "LR") -> Path:
    """Write the slot graph to ``output`` as DOT, SVG or PNG (format from the option or the suffix)."""
    output = Path(output)
    fmt = fmt or (output.suffix[1:].lower() if output.suffix[1:].lower() in FORMATS else "dot")
    text = slot_graph_dot(lang, rankdir)
    data = text.encode("utf-8") if fmt == "dot" else render(text, fmt)
    write_bytes_atomic(output, data)
    return output

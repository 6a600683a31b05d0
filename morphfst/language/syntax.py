"""Parse a grammar file (our own language, see grammar.lark) into the plain language model.

The lark parse tree never leaves this module: :func:`parse_grammar_text` returns a
:class:`~morphfst.language.model.Grammar` whose objects carry their source positions. Syntax errors become a
:class:`~morphfst.errors.UserError` with file, line, column, caret and a hint.
"""

from __future__ import annotations

import unicodedata
from functools import lru_cache
from importlib import resources
from pathlib import Path
from typing import Any

from lark import Lark, Token, Tree
from lark.exceptions import UnexpectedCharacters, UnexpectedEOF, UnexpectedInput, UnexpectedToken

from ..errors import Position, UserError
from . import model as m

MAX_COMPOUND_PARTS = 6  # the most parts a compound block may allow (each one copies the non-last parts)

_TERMINAL_WORDS = {
    "NAME": "a name",
    "FEAT": "a feature label",
    "UDVAL": "a UD value",
    "GLOSS": "a gloss label",
    "WORD": "a word",
    "STRING": 'a quoted string ("...")',
    "NUMBER": "a number",
    "SYMCHAR": "a symbol",
    "MULTI": "a <multi-character> symbol",
    "SETREF": "a set reference (@name)",
    "OPTSEG": "an optional segment such as (y)",
    "EMPTY": "∅",
    "_NL": "end of line",
    "LBRACE": "{",
    "RBRACE": "}",
    "MINUSMORETHAN": "->",
    "COLON": ":",
}


@lru_cache(maxsize=1)
def _parser() -> Lark:
    text = resources.files("morphfst.language").joinpath("grammar.lark").read_text(encoding="utf-8")
    return Lark(text, parser="lalr", propagate_positions=True, maybe_placeholders=False)


def parse_grammar_file(path: str | Path) -> m.Grammar:
    """Read and parse a grammar file (UTF-8, NFC-normalized)."""
    path = Path(path)
    try:
        raw = path.read_bytes()
    except OSError as exc:
        raise UserError(
            f"cannot read grammar file: {exc.strerror or exc}",
            Position(str(path)),
            hint="check the path; grammars live in grammars/<name>.mfg",
        ) from None
    return parse_grammar_text(_decode(raw, str(path), "grammar file"), str(path))


def parse_grammar_text(text: str, filename: str = "<grammar>") -> m.Grammar:
    """Parse grammar source text into a :class:`Grammar` (lexicons are not read here)."""
    tree, lines = _parse_source(text, filename)
    builder = _Builder(filename, lines)
    builder.build(tree)
    builder.finish()
    return builder.grammar


def _decode(raw: bytes, filename: str, what: str) -> str:
    """UTF-8 source bytes as text; a located error where they are not valid UTF-8."""
    try:
        return raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        line = raw[: exc.start].count(b"\n") + 1
        raise UserError(f"{what} is not valid UTF-8", Position(filename, line), hint="save it as UTF-8") from None


def _parse_source(text: str, filename: str) -> tuple[Tree, list[str]]:
    """The lark tree and the lines of one grammar source (NFC, without a byte-order mark)."""
    text = unicodedata.normalize("NFC", text)
    if text.startswith("\ufeff"):  # a byte-order mark, as some editors write one
        text = text[1:]
    if not text.endswith("\n"):
        text += "\n"
    lines = text.split("\n")
    try:
        return _parser().parse(text), lines
    except UnexpectedInput as exc:
        raise _syntax_error(exc, filename, lines) from None


def _syntax_error(exc: UnexpectedInput, filename: str, lines: list[str]) -> UserError:
    line = getattr(exc, "line", 0) or 0
    column = getattr(exc, "column", 0) or 0
    if isinstance(exc, UnexpectedEOF) or line <= 0:
        line = max(len(lines) - 1, 1)
        column = len(lines[line - 1]) + 1 if lines else 1
        return UserError(
            "unexpected end of file",
            Position(filename, line, column),
            hint="a block is not closed: every '{' needs a '}' on a line of its own",
            source_line=lines[line - 1] if lines else "",
        )
    src = lines[line - 1] if 0 < line <= len(lines) else ""
    expected: set[str] = set()
    if isinstance(exc, UnexpectedToken):
        expected = set(exc.accepts or exc.expected or ())
        tok = exc.token
        what = "end of line" if tok.type == "_NL" else f"'{tok}'"
        message = f"unexpected {what}"
    elif isinstance(exc, UnexpectedCharacters):
        expected = set(exc.allowed or ())
        message = f"unexpected character {src[column - 1]!r}" if 0 < column <= len(src) else "unexpected character"
    else:
        message = "syntax error"
    words = sorted({_TERMINAL_WORDS.get(t, _literal(t)) for t in expected if not t.startswith("__")})
    hint = "expected " + ", ".join(words[:8]) + (" ..." if len(words) > 8 else "") if words else None
    return UserError(message, Position(filename, line, column), hint=hint, source_line=src)


def _literal(terminal: str) -> str:
    return "'" + terminal.lower() + "'"


def parse_form(text: str, pos: Position) -> list[str]:
    """Split an underlying form such as ``(y)I`` or ``ka<t>u`` into symbols."""
    out: list[str] = []
    i = 0
    while i < len(text):
        ch = text[i]
        if ch == "(":
            j = text.find(")", i)
            if j < 0:
                raise UserError("unclosed '(' in a form", pos, hint="write optional segments as (y)")
            out.append(text[i : j + 1])
            i = j + 1
        elif ch == "<":
            j = text.find(">", i)
            if j < 0:
                raise UserError("unclosed '<' in a form", pos, hint="write multi-character symbols as <name>")
            out.append(text[i : j + 1])
            i = j + 1
        elif ch.isspace():
            i += 1
        else:
            out.append(ch)
            i += 1
    return out


class _Builder:
    """Walks the lark tree once and fills a Grammar."""

    def __init__(self, filename: str, lines: list[str]) -> None:
        self.filename = filename
        self.lines = lines
        stem = Path(filename).stem
        self.grammar = m.Grammar(name=stem, title=stem, path=filename)
        self.grammar.sources.append(filename)

    # -- helpers --------------------------------------------------------------------------------
    def pos_of(self, node: Any) -> Position:
        if isinstance(node, Token):
            return Position(self.filename, node.line or 0, node.column or 0)
        meta = getattr(node, "meta", None)
        if meta is not None and not getattr(meta, "empty", True):
            return Position(self.filename, meta.line, meta.column)
        return Position(self.filename)

    def line_text(self, pos: Position) -> str:
        return self.lines[pos.line - 1].strip() if 0 < pos.line <= len(self.lines) else ""

    @staticmethod
    def unquote(tok: Any) -> str:
        return str(tok)[1:-1]

    def finish(self) -> None:
        """Steps that need the whole grammar: shared layout labels under each layout's own."""
        for layout in self.grammar.layouts:
            layout.labels = {**self.grammar.labels, **layout.labels}

    def build(self, tree: Tree) -> None:
        for stmt in tree.children:
            if not isinstance(stmt, Tree):
                continue
            handler = getattr(self, "do_" + str(stmt.data), None)
            if handler is None:  # pragma: no cover - grammar and builder out of step
                raise UserError(f"unsupported statement {stmt.data}", self.pos_of(stmt))
            handler(stmt)

    # -- statements -----------------------------------------------------------------------------
    def do_language(self, node: Tree) -> None:
        toks = node.children
        self.grammar.name = str(toks[0])
        self.grammar.title = self.unquote(toks[1]) if len(toks) > 1 else str(toks[0])

    def do_include(self, node: Tree) -> None:
        """Read another grammar file in place: its statements join this grammar where the line stands."""
        pos = self.pos_of(node)
        target = Path(self.filename).parent / self.unquote(node.children[0])
        chain = getattr(self, "_chain", [str(Path(self.filename).resolve())])
        if str(target.resolve()) in chain:
            raise UserError(
                f"include cycle: {target} includes itself",
                pos,
                hint="an included file must not include a file that includes it",
                source_line=self.line_text(pos),
            )
        try:
            raw = target.read_bytes()
        except OSError as exc:
            raise UserError(
                f"cannot read included file: {exc.strerror or exc}",
                pos,
                hint=f"the path is relative to the including file's folder; looked for {target}",
                source_line=self.line_text(pos),
            ) from None
        tree, lines = _parse_source(_decode(raw, str(target), "included file"), str(target))
        saved = (self.filename, self.lines)
        self.filename, self.lines = str(target), lines
        self._chain = [*chain, str(target.resolve())]
        self.grammar.sources.append(str(target))
        try:
            self.build(tree)
        finally:
            self.filename, self.lines = saved
            self._chain = chain

    def do_unmarked_block(self, node: Tree) -> None:
        for line in node.children:
            for tok in line.children:
                if str(tok) not in self.grammar.unmarked:
                    self.grammar.unmarked.append(str(tok))

    def do_implied_block(self, node: Tree) -> None:
        for line in node.children:
            label, *labels = (str(tok) for tok in line.children)
            if label in self.grammar.implied:
                raise UserError(
                    f"implied labels for {label} given twice", self.pos_of(line.children[0]), hint="keep one line per label"
                )
            self.grammar.implied[label] = m.Implied(label, labels, self.pos_of(line.children[0]))

    def do_detached_block(self, node: Tree) -> None:
        label, *lines = node.children
        at = self.pos_of(label)
        if self.grammar.detached is not None:
            raise UserError("a second detached block", at, hint="list every host in one block")
        hosts = [self.unquote(tok) for line in lines for tok in line.children]
        self.grammar.detached = m.Detached(str(label), hosts, at)

    def do_labels_block(self, node: Tree) -> None:
        for d in node.children:
            self.grammar.labels[str(d.children[0])] = self.unquote(d.children[1])

    def do_stems_block(self, node: Tree) -> None:
        name = str(node.children[0])
        if name in self.grammar.stem_rules:
            raise UserError(f"stem rules {name} declared twice", self.pos_of(node), hint="give each stems block its own name")
        self.grammar.stem_rules[name] = [self._rule(d) for d in node.children[1:]]

    def do_lexicon_decl(self, node: Tree) -> None:
        for tok in node.children:
            self.grammar.lexicon_paths.append(self.unquote(tok))

    def do_alphabet(self, node: Tree) -> None:
        for line in node.children:
            toks = [c.children[0] if isinstance(c, Tree) else c for c in line.children]
            syms = [self._quoted_letter(t) if isinstance(t, Token) and t.type == "STRING" else str(t) for t in toks]
            getattr(self.grammar, str(line.data)).extend(syms)

    def _quoted_letter(self, tok: Any) -> str:
        """A letter written in quotes ("." ","): one character the rule syntax reserves, so that rules
        reach it through a set (``sep = "." ","``, then ``@sep``)."""
        text = self.unquote(tok)
        if len(text) != 1 or text.isspace():
            raise UserError(
                f"a quoted letter is one character, not {str(tok)}",
                self.pos_of(tok),
                hint='quote a single character the rule syntax reserves, such as "." or ","',
                source_line=self.lines[tok.line - 1],
            )
        return text

    def do_sets_block(self, node: Tree) -> None:
        for d in node.children:
            name = str(d.children[0])
            members: list[str] = []
            excluded: list[str] = []
            for item in d.children[1:]:
                if isinstance(item, Tree) and item.data == "set_except":
                    excluded.extend(self._set_items(item.children))
                else:
                    members.extend(self._set_items([item]))
            final = [s for s in dict.fromkeys(members) if s not in excluded]
            self.grammar.sets[name] = m.SymbolSet(name, final, self.pos_of(d))
            if name in self.grammar.sets and self.grammar.sets[name].pos != self.pos_of(d):
                pass

    def _set_items(self, items: list[Any]) -> list[str]:
        out: list[str] = []
        for item in items:
            tok: Any = item.children[0] if isinstance(item, Tree) else item
            text = str(tok)
            if tok.type == "SETREF":
                ref = text[1:]
                if ref not in self.grammar.sets:
                    raise UserError(
                        f"undeclared set @{ref}",
                        self.pos_of(tok),
                        hint="declare a set before using it in another set",
                        source_line=self.lines[tok.line - 1],
                    )
                out.extend(self.grammar.sets[ref].members)
            elif tok.type == "STRING":
                out.append(self._quoted_letter(tok))
            else:
                out.append(text)
        return out

    def do_features_block(self, node: Tree) -> None:
        for d in node.children:
            name = str(d.children[0])
            if name in self.grammar.dimensions:
                raise UserError(f"dimension {name} declared twice", self.pos_of(d))
            values = [str(t) for t in d.children[1:]]
            self.grammar.dimensions[name] = m.Dimension(name, values, self.pos_of(d))

    def do_ud_block(self, node: Tree) -> None:
        for d in node.children:
            self.grammar.ud[str(d.children[0])] = str(d.children[1])
            self._ud_pos[str(d.children[0])] = self.pos_of(d)

    @property
    def _ud_pos(self) -> dict[str, Position]:
        if not hasattr(self, "_udp"):
            self._udp: dict[str, Position] = {}
        return self._udp

    def do_flags_block(self, node: Tree) -> None:
        for d in node.children:
            name = str(d.children[0])
            marks: str | None = None
            blocks: list[str] = []
            desc = ""
            for part in d.children[1:]:
                if isinstance(part, Token):
                    desc = self.unquote(part)
                elif part.data == "flag_marks":
                    marks = str(part.children[0])
                else:
                    blocks.extend(str(t) for t in part.children)
            self.grammar.flags[name] = m.Flag(name, marks, blocks, desc, self.pos_of(d))

    def do_classes_block(self, node: Tree) -> None:
        for d in node.children:
            name = str(d.children[0])
            pos_allowed: list[str] = []
            nexts: list[str] = []
            apostrophe = False
            guess: m.Expr | None = None
            stems: list[str] = []
            open_pattern: m.Expr | None = None
            weight: float | None = None
            for part in d.children[1:]:
                if isinstance(part, Token):
                    nexts.append(str(part))
                elif part.data == "class_pos":
                    pos_allowed = [str(t) for t in part.children]
                elif part.data == "opt_apostrophe":
                    apostrophe = True
                elif part.data == "opt_guess":
                    guess = self.expr(part.children[0])
                elif part.data == "opt_stems":
                    stems.extend(str(t) for t in part.children)
                elif part.data == "opt_open":
                    open_pattern = self.expr(part.children[0])
                elif part.data == "opt_weight":
                    weight = float(str(part.children[0]))
            if name in self.grammar.classes:
                raise UserError(f"class {name} declared twice", self.pos_of(d))
            if weight is not None and open_pattern is None:
                raise UserError(
                    f"class {name}: a weight is given to an open class's stems only",
                    self.pos_of(d),
                    hint="a lexicon entry's weight comes from its count or weight column; add `open PATTERN` or drop the weight",
                )
            self.grammar.classes[name] = m.StemClass(
                name, nexts, pos_allowed, apostrophe, guess, self.pos_of(d), stems, open_pattern, weight or 0.0
            )

    def do_slot(self, node: Tree) -> None:
        name = str(node.children[0])
        nexts: list[str] = [m.END_SLOT]
        affix_nodes: list[Tree] = []
        enclitic = False
        for part in node.children[1:]:
            if isinstance(part, Token) and part.type == "ENCLITIC":
                enclitic = True
            elif isinstance(part, Tree) and part.data == "slot_next":
                nexts = [str(t) for t in part.children]
            elif isinstance(part, Tree):
                affix_nodes.append(part)
        if name in self.grammar.slots:
            raise UserError(f"slot {name} declared twice", self.pos_of(node), hint="merge the two slots")
        slot = m.Slot(name, nexts, [], self.pos_of(node), enclitic)
        for a in affix_nodes:
            slot.affixes.append(self.affix(a, name))
        self.grammar.slots[name] = slot

    def affix(self, node: Tree, slot: str) -> m.Affix:
        pos = self.pos_of(node)
        form_tok = node.children[0]
        form = parse_form(self.unquote(form_tok), self.pos_of(form_tok))
        features: list[str] = []
        gloss: str | None = None
        weight = 0.0
        nexts: list[str] | None = None
        new_pos: str | None = None
        name: str | None = None
        for part in node.children[1:]:
            kind = str(part.data)
            tok = part.children[0] if part.children else None
            if kind == "a_feature":
                features.append(str(tok))
            elif kind == "a_gloss":
                gloss = str(tok)
            elif kind == "a_weight":
                weight = float(str(tok))
            elif kind == "a_pos":
                new_pos = str(tok)
            elif kind == "a_name":
                name = str(tok)
            elif kind == "affix_next":
                nexts = [str(t) for t in part.children]
        if gloss is None:
            gloss = ".".join(features) if features else (new_pos or "∅")
        return m.Affix(form, features, gloss, weight, nexts, new_pos, name, slot, pos)

    def do_compound_block(self, node: Tree) -> None:
        """A ``compound`` block: which words join at a seam, in which forms, how many, how long, at what weight."""
        block = self.pos_of(node)
        values: dict[str, Any] = {}
        lines: dict[str, Position] = {}
        for line in node.children:
            if not isinstance(line, Tree):
                continue
            key = str(line.data)[2:]
            pos = self.pos_of(line)
            if key == "group":  # one line per group: the group's name makes the statement's key
                key = f"group {line.children[0]}"
            if key in lines:
                raise UserError(
                    f"compound: '{key}' given twice",
                    pos,
                    hint=f"the first is on line {lines[key].line}; give each statement once per compound block",
                    source_line=self._raw_line(pos),
                )
            lines[key] = pos
            if key in {"first", "last"}:
                names = [kid.children[0] for kid in line.children]
                values[key] = [str(t) for t in names]
                for t in names:
                    lines[f"{key} {t}"] = self.pos_of(t)
            elif key in {"agree", "strict"}:
                values[key] = True
            elif key.startswith("group "):
                names = [kid.children[0] for kid in line.children[1:]]
                values.setdefault("groups", {})[key[6:]] = [str(t) for t in names]
                for t in names:
                    lines[f"{key} {t}"] = self.pos_of(t)
            elif key == "order":
                values[key] = str(line.children[0])[1:-1]
            elif key in {"forms", "lastforms", "lemmaform"}:
                bundles = []
                for bundle in line.children:
                    labels = [str(t) for t in bundle.children]
                    for t in bundle.children:
                        lines.setdefault(f"{key} {t}", self.pos_of(t))
                    bundles.append(labels)
                values[key] = bundles[0] if key == "lemmaform" else bundles
            elif key == "hide":
                values[key] = [str(t) for t in line.children]
                for t in line.children:
                    lines.setdefault(f"hide {t}", self.pos_of(t))
            else:
                tok: Any = line.children[0]
                values[key] = self._compound_number(key, tok)
        for key in ("first", "forms", "last"):
            if key not in values:
                raise UserError(
                    f"compound: no '{key}' line",
                    block,
                    hint="a compound block needs 'first', 'forms' and 'last' lines (parts, min, lastmin, weight, agree, group, order, lastforms, lemmaform, hide and strict are optional)",
                    source_line=self._raw_line(block),
                )
        self.grammar.compounds.append(
            m.Compound(
                values["first"],
                values["forms"],
                values["last"],
                values.get("parts", 2),
                values.get("min", 1),
                values.get("weight", 0.0),
                block,
                lines,
                values.get("agree", False),
                values.get("lastmin", 1),
                values.get("groups", {}),
                values.get("order", ""),
                values.get("lastforms", []),
                values.get("lemmaform", []),
                values.get("hide", []),
                values.get("strict", False),
            )
        )

    def _compound_number(self, key: str, tok: Any) -> int | float:
        """The number of a ``parts``, ``min`` or ``weight`` line, checked (a located error otherwise)."""
        pos = self.pos_of(tok)
        text = str(tok)
        value = float(text)
        if key == "weight":
            if value < 0:
                raise UserError(
                    f"compound: weight {text} is negative",
                    pos,
                    hint="a seam's weight is added to the compound's; a negative one could rank a compound above a lexicon word",
                    source_line=self._raw_line(pos),
                )
            return value
        low = 2 if key == "parts" else 1
        if key == "parts" and value.is_integer() and value > MAX_COMPOUND_PARTS:
            raise UserError(
                f"compound: parts {text} is more than {MAX_COMPOUND_PARTS}",
                pos,
                hint="each further part adds a copy of the non-last parts to the analyzer; longer words are rare",
                source_line=self._raw_line(pos),
            )
        if not value.is_integer() or value < low:
            what = {
                "parts": "the most parts a compound word may have",
                "lastmin": "the fewest letters of the last part's lemma",
            }.get(key, "the fewest letters of a non-last part")
            raise UserError(
                f"compound: {key} {text} is not a whole number of at least {low}",
                pos,
                hint=f"'{key}' gives {what}",
                source_line=self._raw_line(pos),
            )
        return int(value)

    def _raw_line(self, pos: Position) -> str:
        """The source line of ``pos`` as written (so a caret under its column points at the right place)."""
        return self.lines[pos.line - 1] if 0 < pos.line <= len(self.lines) else ""

    def do_constraints_block(self, node: Tree) -> None:
        for d in node.children:
            name, left, kind, right = d.children
            self.grammar.constraints.append(
                m.Constraint(str(name), str(left), str(kind.data), str(right), self.pos_of(d))  # type: ignore[arg-type]
            )

    def do_rules_block(self, node: Tree) -> None:
        for d in node.children:
            self.grammar.rules.append(self._rule(d))

    def _rule(self, d: Tree) -> m.Rule:
        """One rule line (of a rules block or a stems block) as a model rule."""
        pos = self.pos_of(d)
        name = str(d.children[0])
        direction = "ltr"
        optional = False
        weight = 0.0
        lenient = False
        exprs: list[Any] = []
        context: Tree | None = None
        for part in d.children[1:]:
            if isinstance(part, Tree) and part.data in {"o_ltr", "o_rtl", "o_sim"}:
                direction = str(part.data)[2:]
            elif isinstance(part, Tree) and part.data == "o_optional":
                optional = True
            elif isinstance(part, Tree) and part.data == "o_weight":
                weight = float(str(part.children[0]))
            elif isinstance(part, Tree) and part.data == "o_lenient":
                lenient = True
            elif isinstance(part, Tree) and part.data == "context":
                context = part
            else:
                exprs.append(part)
        target = self.expr(exprs[0])
        replacement = self.expr(exprs[1])
        left: m.Expr | None = None
        right: m.Expr | None = None
        if context is not None:
            left, right = self._context(context)
        return m.Rule(name, target, replacement, left, right, direction, optional, weight, pos, self.line_text(pos), lenient)  # type: ignore[arg-type]

    def _context(self, node: Tree) -> tuple[m.Expr | None, m.Expr | None]:
        left: m.Expr | None = None
        right: m.Expr | None = None
        for kid in node.children:
            if kid.data == "left_ctx":
                left = self.expr(kid.children[0])
            else:
                right = self.expr(kid.children[0])
        return left, right

    def expr(self, node: Any) -> m.Expr:
        if isinstance(node, Token):
            return self._token_expr(node)
        kind = str(node.data)
        kids = node.children
        if kind == "e_sym":
            return self._token_expr(kids[0])
        if kind == "e_set":
            return m.SetRef(str(kids[0])[1:], self.pos_of(kids[0]))
        if kind == "e_boundary":
            pos = self.pos_of(node)
            line = self.lines[pos.line - 1] if 0 < pos.line <= len(self.lines) else ""
            before = line[pos.column - 2] if pos.column >= 2 else " "
            if not before.isspace() and before not in "([|/_":
                raise UserError(
                    "'+' right after a symbol: this is the morph boundary, not 'one or more'",
                    pos,
                    hint="write X X* for one or more; put a space before + when you mean the boundary",
                    source_line=line,
                )
            return m.Sym(m.MORPH_BOUNDARY, pos)
        if kind == "e_start":
            return m.Sym(m.WORD_START, self.pos_of(node))
        if kind == "e_end":
            return m.Sym(m.WORD_END, self.pos_of(node))
        if kind == "e_any":
            return m.AnySym()
        if kind == "e_empty":
            return m.Empty()
        if kind == "e_group":
            return self.expr(kids[0])
        if kind == "e_class":
            negated = bool(kids) and isinstance(kids[0], Token) and kids[0].type == "NEG"
            items = [self._token_expr(k.children[0]) for k in kids if isinstance(k, Tree)]
            return m.Klass(tuple(items), negated)
        if kind == "star":
            return m.Repeat(self.expr(kids[0]), 0, None)
        if kind == "opt":
            return m.Repeat(self.expr(kids[0]), 0, 1)
        if kind == "seq":
            return m.Seq(tuple(self.expr(k) for k in kids))
        if kind == "alt":
            return m.Alt(tuple(self.expr(k) for k in kids))
        raise UserError(f"unsupported expression {kind}", self.pos_of(node))  # pragma: no cover

    def _token_expr(self, tok: Any) -> m.Expr:
        if tok.type == "SETREF":
            return m.SetRef(str(tok)[1:], self.pos_of(tok))
        if tok.type == "OPTSEG":  # "(y)": the optional segment, or the plain symbol if there is none
            return m.Sym(f"{tok}?", self.pos_of(tok))
        return m.Sym(str(tok), self.pos_of(tok))

    def do_normalize_block(self, node: Tree) -> None:
        norm = self.grammar.normalization
        for d in node.children:
            kind = str(d.data)
            if kind == "n_map":
                norm.maps.append((self.unquote(d.children[0]), self.unquote(d.children[1])))
            elif kind == "n_lowercase":
                norm.lowercase = True
            elif kind == "n_keepcase":
                norm.lowercase = False
            elif kind == "n_apostrophes":
                norm.apostrophes.extend(self.unquote(t) for t in d.children)

    def do_tests_block(self, node: Tree) -> None:
        for d in node.children:
            kind = str(d.data)[2:]
            pos = self.pos_of(d)
            kids = d.children
            if kind in {"analyze", "exact"}:
                word = str(kids[0])
                expected = [self._analysis_text(a) for a in kids[1:]]
                self.grammar.tests.append(m.TestCase(kind, word, expected, pos))  # type: ignore[arg-type]
            elif kind == "generate":
                analysis = self._analysis_text(kids[0])
                self.grammar.tests.append(m.TestCase("generate", analysis, [str(w) for w in kids[1:]], pos))
            else:
                for w in kids:
                    self.grammar.tests.append(m.TestCase("reject", str(w), [], self.pos_of(w)))

    @staticmethod
    def _analysis_text(node: Tree) -> str:
        return f"{node.children[0]} {node.children[1]}"

    def do_layout_block(self, node: Tree) -> None:
        kids = node.children
        pos_tag = str(kids[0])
        title = pos_tag
        rest = kids[1:]
        if rest and isinstance(rest[0], Token) and rest[0].type == "STRING":
            title = self.unquote(rest[0])
            rest = rest[1:]
        layout = m.Layout(pos_tag, title, [], [], [], [], {}, self.pos_of(node))
        for line in rest:
            kind = str(line.data)
            vals = [str(t) for t in line.children]
            if kind == "l_rows":
                layout.rows.extend(vals)
            elif kind == "l_columns":
                layout.columns.extend(vals)
            elif kind == "l_tables":
                layout.tables.extend(vals)
            elif kind == "l_fixed":
                layout.fixed.extend(vals)
            elif kind == "l_label":
                layout.labels[vals[0]] = vals[1][1:-1]
        self.grammar.layouts.append(layout)

"""Semantic checks of a parsed grammar: every name declared, every slot reachable, every symbol known.

Runs after parsing and before compiling; each problem is a :class:`UserError` pointing at the line
that declares or uses the offending name, with a hint.
"""

from __future__ import annotations

import difflib
from dataclasses import replace

from ..errors import Position, UserError
from . import model as m

BOUNDARIES = (m.MORPH_BOUNDARY, m.WORD_START, m.WORD_END)


def _near(word: str, choices: list[str]) -> str:
    close = difflib.get_close_matches(word, choices, n=1, cutoff=0.6)
    return f"did you mean {close[0]!r}?" if close else ""


def underlying_alphabet(grammar: m.Grammar) -> list[str]:
    """Every symbol that may appear in an underlying form or a rule (boundaries included)."""
    syms = list(dict.fromkeys(grammar.letters + grammar.archiphonemes + grammar.markers + grammar.optionals))
    return syms + [b for b in BOUNDARIES if b not in syms]


def validate(grammar: m.Grammar) -> None:
    """Check the grammar in place; resolve rule symbols such as ``(y)``; number the affixes."""
    _check_alphabet(grammar)
    _collect_optionals(grammar)
    _check_sets(grammar)
    _check_features(grammar)
    _check_flags(grammar)
    _check_slots(grammar)
    _check_reachability(grammar)
    _check_zero_cycles(grammar)
    _check_constraints(grammar)
    _check_rules(grammar)
    _check_stem_rules(grammar)
    _check_compounds(grammar)
    _check_implied(grammar)
    _check_detached(grammar)
    for index, affix in enumerate(grammar.affixes):
        affix.ident = index


def _err(message: str, pos: Position, hint: str = "") -> UserError:
    return UserError(message, pos, hint=hint or None)


def _check_alphabet(g: m.Grammar) -> None:
    if not g.letters:
        raise _err("the grammar declares no letters", Position(g.path), "add an alphabet block with a 'letters' line")
    seen: set[str] = set()
    for sym in g.letters + g.archiphonemes + g.markers:
        if sym in seen:
            raise _err(f"symbol {sym!r} declared twice in the alphabet", Position(g.path), "each symbol belongs to one kind")
        seen.add(sym)


def _collect_optionals(g: m.Grammar) -> None:
    known = set(g.letters) | set(g.archiphonemes)
    for affix in g.affixes:
        for sym in affix.form:
            if sym.startswith("(") and sym not in g.optionals:
                if sym[1:-1] not in known:
                    raise _err(
                        f"optional segment {sym} of form {affix.form_text!r} is not a letter of the alphabet",
                        affix.pos,
                        "write an optional segment as a declared letter in parentheses, such as (y)",
                    )
                g.optionals.append(sym)


def _check_sets(g: m.Grammar) -> None:
    known = set(underlying_alphabet(g))
    for s in g.sets.values():
        for sym in s.members:
            if sym not in known:
                raise _err(
                    f"set {s.name} has {sym!r}, which is not in the alphabet",
                    s.pos,
                    _near(sym, sorted(known)) or "declare it under letters, archiphonemes or markers",
                )


def _check_features(g: m.Grammar) -> None:
    owner: dict[str, str] = {}
    for dim in g.dimensions.values():
        for value in dim.values:
            if value in owner:
                raise _err(
                    f"feature value {value} is in both {owner[value]} and {dim.name}",
                    dim.pos,
                    "feature values must be unique across dimensions (UniMorph labels are)",
                )
            owner[value] = dim.name
    if g.classes and "pos" not in g.dimensions:
        raise _err(
            "no 'pos' dimension declared", Position(g.path), "declare the parts of speech in the features block: pos: N V ADJ"
        )
    for label in g.ud:
        if label not in owner:
            raise _err(f"UD mapping for undeclared feature {label}", Position(g.path), _near(label, sorted(owner)))


def _check_implied(g: m.Grammar) -> None:
    """An ``implied`` line names declared labels, each once, the one on the left among them."""
    known = sorted({value for dim in g.dimensions.values() for value in dim.values})
    for line in g.implied.values():
        for label in [line.label, *line.labels]:
            if label not in known:
                raise _err(f"implied labels: {label} is not a declared feature label", line.pos, _near(label, known))
        if line.label not in line.labels:
            raise _err(
                f"implied labels for {line.label} leave it out",
                line.pos,
                f"write the whole bundle it stands for, itself in its place: {line.label} => ... {line.label} ...",
            )
        if len(set(line.labels)) < len(line.labels):
            raise _err(f"implied labels for {line.label} name a label twice", line.pos)


def _check_detached(g: m.Grammar) -> None:
    """A ``detached`` block names a declared part of speech and at least one host, each a word and
    what separates it from its suffixes."""
    d = g.detached
    if d is None:
        return
    parts = list(g.dimensions["pos"].values) if "pos" in g.dimensions else []
    if d.pos_label not in parts:
        raise _err(f"detached: {d.pos_label} is not a declared part of speech", d.pos, _near(d.pos_label, parts))
    if not d.hosts:
        raise _err("detached: no host word", d.pos, 'write the words whose suffixes are read, in quotes: "Ta\'"')
    for host in d.hosts:
        if len(host) < 2 or host[-1].isalnum() or not host[:-1].strip():
            raise _err(
                f"detached: host {host!r} is not a word followed by its separator",
                d.pos,
                'write the word and what comes between it and its suffixes: "Ta\'"',
            )


def _check_flags(g: m.Grammar) -> None:
    rule_names = {r.name for r in g.rules}
    for flag in g.flags.values():
        if flag.marks and flag.marks not in g.markers:
            raise _err(
                f"flag {flag.name} marks {flag.marks}, which is not a declared marker",
                flag.pos,
                "add it to the alphabet's markers line",
            )
        for name in flag.blocks:
            if name not in rule_names:
                raise _err(f"flag {flag.name} blocks an undefined rule {name!r}", flag.pos, _near(name, sorted(rule_names)))


def _check_slot_names(names: list[str], g: m.Grammar, pos: Position, what: str) -> None:
    for name in names:
        if name != m.END_SLOT and name not in g.slots:
            raise _err(
                f"{what} points at an undefined slot {name!r}",
                pos,
                _near(name, sorted(g.slots)) or "declare the slot, or write 'end'",
            )


def _check_slots(g: m.Grammar) -> None:
    pos_tags = set(g.pos_tags)
    for klass in g.classes.values():
        _check_slot_names(klass.next, g, klass.pos, f"class {klass.name}")
        for tag in klass.pos_allowed:
            if tag not in pos_tags:
                raise _err(
                    f"class {klass.name} names an undeclared part of speech {tag}", klass.pos, "declare it in the 'pos' dimension"
                )
    letters = set(g.letters) | set(g.archiphonemes) | set(g.markers) | set(g.optionals)
    for slot in g.slots.values():
        _check_slot_names(slot.next, g, slot.pos, f"slot {slot.name}")
        for affix in slot.affixes:
            if affix.next is not None:
                _check_slot_names(affix.next, g, affix.pos, f"affix {affix.form_text!r}")
            for feat in affix.features:
                if g.dimension_of(feat) is None:
                    raise _err(
                        f"undeclared feature {feat!r}",
                        affix.pos,
                        _near(feat, [v for d in g.dimensions.values() for v in d.values]) or "declare it in the features block",
                    )
            if affix.new_pos is not None and affix.new_pos not in pos_tags:
                raise _err(f"undeclared part of speech {affix.new_pos!r}", affix.pos, "declare it in the 'pos' dimension")
            for sym in affix.form:
                if sym not in letters:
                    raise _err(
                        f"symbol {sym!r} in form {affix.form_text!r} is not in the alphabet",
                        affix.pos,
                        _near(sym, sorted(letters)) or "declare it under letters, archiphonemes or markers",
                    )


def _check_reachability(g: m.Grammar) -> None:
    reached: set[str] = set()
    # an enclitic slot is reached from the end of any word
    todo = [n for c in g.classes.values() for n in c.next] + [s.name for s in g.slots.values() if s.enclitic]
    while todo:
        name = todo.pop()
        if name == m.END_SLOT or name in reached:
            continue
        reached.add(name)
        slot = g.slots[name]
        todo.extend(slot.next)
        for affix in slot.affixes:
            todo.extend(affix.next or [])
    for slot in g.slots.values():
        if slot.name not in reached:
            raise _err(
                f"slot {slot.name} is not reachable from any class",
                slot.pos,
                "list it after a class's '->' or in another slot's followers, or delete it",
            )


def _check_zero_cycles(g: m.Grammar) -> None:
    """A cycle of zero morphs in the slot graph would give every word infinitely many analyses (the
    analyzer could loop through it without reading a letter): a located error at its first affix."""
    edges: dict[str, list[tuple[m.Affix, str]]] = {}
    for slot in g.slots.values():
        for affix in slot.affixes:
            if not affix.form:
                for target in affix.next if affix.next is not None else slot.next:
                    if target != m.END_SLOT and target in g.slots:
                        edges.setdefault(slot.name, []).append((affix, target))
    state: dict[str, int] = {}  # 1: on the current path, 2: done
    path: list[tuple[str, m.Affix]] = []

    def visit(name: str) -> None:
        state[name] = 1
        for affix, target in edges.get(name, []):
            path.append((name, affix))
            if state.get(target) == 1:
                cycle = path[next(i for i, (n, _) in enumerate(path) if n == target) :]
                first = cycle[0][1]
                route = " -> ".join(n for n, _ in cycle) + f" -> {target}"
                raise _err(
                    f"a cycle of zero morphs in the slot graph: {route}",
                    first.pos,
                    "a word could pass through these slots forever without a letter; give one of these affixes a form, or end the cycle",
                )
            if state.get(target) is None:
                visit(target)
            path.pop()
        state[name] = 2

    for name in g.slots:
        if state.get(name) is None:
            visit(name)


def _check_constraints(g: m.Grammar) -> None:
    names = {a.name for a in g.affixes if a.name}
    labels = {v for d in g.dimensions.values() for v in d.values}
    for c in g.constraints:
        for operand in (c.left, c.right):
            if operand not in names and operand not in labels:
                raise _err(
                    f"constraint {c.name}: {operand!r} is neither a feature nor a named affix",
                    c.pos,
                    _near(operand, sorted(names | labels)),
                )


def _check_stem_rules(g: m.Grammar) -> None:
    """Stem-rule groups resolve like rules; every class names only declared groups."""
    for group in g.stem_rules.values():
        _resolve_rule_list(g, group)
    for klass in g.classes.values():
        for name in klass.stems:
            if name not in g.stem_rules:
                raise _err(
                    f"class {klass.name} names undeclared stem rules {name!r}",
                    klass.pos,
                    _near(name, sorted(g.stem_rules)) or "declare them in a block 'stems NAME { rule ... }'",
                )


def _check_compounds(g: m.Grammar) -> None:
    """Every name of a compound block is a part of speech, a class or a feature (a derived word); every
    label of a form a feature."""
    pos_tags = set(g.pos_tags)
    features = g.feature_labels
    for c in g.compounds:
        for key, names in (("first", c.first), ("last", c.last)):
            for name in names:
                if name not in pos_tags and name not in g.classes and name not in features:
                    raise _err(
                        f"compound: {name!r} in '{key}' is neither a part of speech nor a class nor a feature",
                        c.lines.get(f"{key} {name}", c.lines.get(key, c.pos)),
                        _near(name, sorted(pos_tags | set(g.classes) | features))
                        or "name parts of speech of the 'pos' dimension, classes or features of a derivation",
                    )
        for group, names in c.groups.items():
            for name in names:
                if name not in pos_tags and name not in g.classes:
                    raise _err(
                        f"compound: {name!r} in group {group!r} is neither a part of speech nor a class",
                        c.lines.get(f"group {group} {name}", c.lines.get(f"group {group}", c.pos)),
                        _near(name, sorted(pos_tags | set(g.classes)))
                        or "name parts of speech of the 'pos' dimension or classes",
                    )
        if c.groups and not c.order:
            raise _err(
                "compound: groups but no 'order' line", c.pos, "an 'order' line says in which order the groups' parts stand"
            )
        if c.order:
            try:
                c.order_regex()
            except ValueError as exc:
                raise _err(
                    f"compound: order {c.order!r}: {exc}",
                    c.lines.get("order", c.pos),
                    "an order is a regular expression of the block's group names with ( ) | ? * +",
                ) from None
        for key, bundles in (("forms", c.forms), ("lastforms", c.last_forms), ("lemmaform", [c.lemma_form]), ("hide", [c.hide])):
            for bundle in bundles:
                for label in bundle:
                    if label not in features:
                        raise _err(
                            f"compound: {label!r} in '{key}' is not a declared feature",
                            c.lines.get(f"{key} {label}", c.lines.get(key, c.pos)),
                            _near(label, sorted(features))
                            or "a form is a bundle of feature labels, such as SG NOM; bundles are separated by |",
                        )
        if c.agree and (c.last_forms or c.lemma_form or c.hide):
            raise _err(
                "compound: 'agree' with 'lastforms', 'lemmaform' or 'hide'",
                c.lines.get("agree", c.pos),
                "with agree the last part is in the bundle of its first parts; lastforms, lemmaform and hide are for a free last part",
            )


def _check_rules(g: m.Grammar) -> None:
    _resolve_rule_list(g, g.rules)


def _resolve_rule_list(g: m.Grammar, rules: list[m.Rule]) -> None:
    known = set(underlying_alphabet(g))
    seen: dict[str, Position] = {}
    for index, rule in enumerate(rules):
        if rule.name in seen:
            raise _err(
                f"rule {rule.name} is defined twice",
                rule.pos,
                f"the first definition is at {seen[rule.name]}; rule names must be unique",
            )
        seen[rule.name] = rule.pos

        def fix(e: m.Expr | None, role: str, rule: m.Rule = rule) -> m.Expr | None:
            return None if e is None else _resolve(e, g, known, rule, role)

        rules[index] = replace(
            rule,
            target=fix(rule.target, "target"),  # type: ignore[arg-type]
            replacement=fix(rule.replacement, "replacement"),  # type: ignore[arg-type]
            left=fix(rule.left, "context"),
            right=fix(rule.right, "context"),
        )


def _resolve(e: m.Expr, g: m.Grammar, known: set[str], rule: m.Rule, role: str) -> m.Expr:
    if isinstance(e, m.Sym):
        name = e.name
        if name.endswith(")?") and name.startswith("("):
            inner = name[1:-2]
            name = f"({inner})" if f"({inner})" in g.optionals else inner
        if name not in known:
            where = f"the {role}" if role != "context" else "a context"
            raise UserError(
                f"rule {rule.name}: symbol {name!r} in {where} is outside the alphabet",
                e.pos or rule.pos,
                hint=_near(name, sorted(known)) or "declare it under letters, archiphonemes or markers",
            )
        return m.Sym(name, e.pos)
    if isinstance(e, m.SetRef):
        if e.name not in g.sets:
            raise UserError(
                f"rule {rule.name}: undeclared set @{e.name}",
                e.pos or rule.pos,
                hint=_near(e.name, sorted(g.sets)) or "declare it in the sets block",
            )
        return e
    if isinstance(e, m.Klass):
        return m.Klass(tuple(_resolve(i, g, known, rule, role) for i in e.items), e.negated)
    if isinstance(e, m.Seq):
        return m.Seq(tuple(_resolve(i, g, known, rule, role) for i in e.items))
    if isinstance(e, m.Alt):
        return m.Alt(tuple(_resolve(i, g, known, rule, role) for i in e.options))
    if isinstance(e, m.Repeat):
        return m.Repeat(_resolve(e.item, g, known, rule, role), e.low, e.high)
    return e

"""The morphfst tokenizer for SQLite FTS5, through the ``apsw`` package (the ``search`` extra).

::

    import apsw, morphfst
    from morphfst.search import register
    con = apsw.Connection("books.db")
    register(con, morphfst.load("tur"))
    con.execute("CREATE VIRTUAL TABLE docs USING fts5(body, tokenize='morphfst lang tur terms lemma')")
    con.execute("INSERT INTO docs VALUES ('Kitaplarımızdan birini okudum.')")
    con.execute("SELECT highlight(docs, 0, '[', ']') FROM docs WHERE docs MATCH 'kitap'").fetchall()
    # [('[Kitaplarımızdan] birini okudum.',)]

Tokenizer arguments (name-value pairs after the tokenizer name): ``lang`` (a shipped name, grammar
file or compiled file; default: the language given to :func:`register`), ``terms`` (comma-separated
kinds: ``lemma``, ``stem``, ``morphs``, ``surface``), ``analyses`` (``best`` or ``all``), ``guess``
(``1`` or ``0``). See :mod:`morphfst.search.terms` for what each word gives. The tokenizer follows
the FTS5 custom tokenizer interface (SQLite documentation, "Custom Tokenizers"): UTF-8 byte offsets,
colocated tokens for the extra terms of a position, the same analysis for documents and queries.
"""

from __future__ import annotations

from collections.abc import Callable, Iterator
from typing import Any

from ..errors import UserError
from ..runtime.compiled_language import Language
from .terms import TermAnalyzer, TermOptions

TOKENIZER_NAME = "morphfst"


def require_apsw() -> Any:
    """The ``apsw`` module, or a user error that says how to install it."""
    try:
        import apsw
    except ImportError:
        raise UserError(
            "the search commands need the apsw package (SQLite with FTS5 for Python)",
            hint="install it with: python3 -m pip install 'morphfst[search]'",
        ) from None
    return apsw


class Registration:
    """The tokenizer factory registered on one connection, and its analyzers (one per language and options)."""

    def __init__(self, lang: Language | None = None, options: TermOptions | None = None, spec: str | None = None) -> None:
        self.default_lang = lang
        self.default_spec = spec or (lang.name if lang is not None else "tur")
        self.default_options = options or TermOptions()
        self.languages: dict[str, Language] = {}
        if lang is not None:
            self.languages[self.default_spec] = lang
        self.analyzers: dict[tuple[str, TermOptions], TermAnalyzer] = {}

    def language(self, spec: str) -> Language:
        lang = self.languages.get(spec)
        if lang is None:
            from ..build import load

            lang = self.languages[spec] = load(spec)
        return lang

    def analyzer(self, spec: str, options: TermOptions) -> TermAnalyzer:
        key = (spec, options)
        found = self.analyzers.get(key)
        if found is None:
            found = self.analyzers[key] = TermAnalyzer(self.language(spec), options)
        return found

    def factory(self, con: Any, args: list[str]) -> Callable[[bytes, int, str | None], Iterator[tuple[Any, ...]]]:
        """The FTS5 tokenizer factory: parses the arguments, returns the tokenize function."""
        import apsw

        pairs = list(args)
        spec = self.default_spec
        if "lang" in pairs[0::2]:
            i = pairs[0::2].index("lang") * 2
            if i + 1 >= len(pairs):
                raise ValueError("tokenizer argument 'lang' needs a value")
            spec = pairs[i + 1]
            del pairs[i : i + 2]
        options, rest = TermOptions.from_args(pairs) if pairs else (self.default_options, {})
        if rest:
            raise ValueError(f"unknown tokenizer argument(s): {', '.join(rest)}")
        analyzer = self.analyzer(spec, options)
        query_flag = apsw.FTS5_TOKENIZE_QUERY
        prefix_flag = apsw.FTS5_TOKENIZE_PREFIX

        aux_flag = apsw.FTS5_TOKENIZE_AUX

        def tokenize(utf8: bytes, flags: int, locale: str | None) -> Iterator[tuple[Any, ...]]:
            if flags & aux_flag:  # highlight() and snippet(): offsets of each position, no analysis needed
                yield from analyzer.offsets(_decode(utf8))
                return
            if flags & query_flag:
                text = _decode(utf8)
                found = analyzer.prefix_terms(text) if flags & prefix_flag else analyzer.positions(text, query=True)
            else:
                found = analyzer.positions(_decode(utf8))
            for start, end, terms in found:
                yield (start, end, *terms)

        return tokenize


def tokenize_directive(spec: str, options: TermOptions, name: str = TOKENIZER_NAME) -> str:
    """The value of an FTS5 ``tokenize`` option for this language and these options, each argument quoted
    (``morphfst lang tur terms 'lemma,surface' ...``); put it in an SQL string literal with :func:`sql_string`."""
    words = [name, "lang", spec, *options.args()]
    return " ".join(w if w.replace("_", "a").isalnum() else "'" + w.replace("'", "''") + "'" for w in words)


def sql_string(text: str) -> str:
    """An SQL string literal."""
    return "'" + text.replace("'", "''") + "'"


def register(
    connection: Any,
    lang: Language | None = None,
    options: TermOptions | None = None,
    name: str = TOKENIZER_NAME,
    spec: str | None = None,
) -> Registration:
    """Register the morphfst tokenizer on an ``apsw.Connection`` under ``name``.

    ``lang`` is the language used when a table's tokenizer arguments name none (or name ``spec``, by
    default the language's name); other languages named by ``lang`` arguments are loaded on first use.
    ``options`` apply when a table gives no term arguments. Returns the registration (its analyzers
    whose caches the indexer's worker processes fill).
    """
    require_apsw()
    reg = Registration(lang, options, spec)
    connection.register_fts5_tokenizer(name, reg.factory)
    return reg


def _decode(utf8: bytes) -> str:
    try:
        return utf8.decode("utf-8")
    except UnicodeDecodeError:
        return utf8.decode("utf-8", errors="replace")  # SQLite text is UTF-8; offsets may shift only for invalid bytes

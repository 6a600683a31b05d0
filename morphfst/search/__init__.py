"""Full-text search by lemma: an SQLite FTS5 tokenizer (``apsw``), an indexer and a searcher.

``register(connection, lang)`` plugs the analyzer into any FTS5 table of an ``apsw`` connection
(:mod:`morphfst.search.fts`); :mod:`morphfst.search.terms` computes the terms and byte offsets without
SQLite; :mod:`morphfst.search.index` builds and updates an index of files and searches it (what
``morphfst index`` and ``morphfst search`` run). Install the extra: ``pip install 'morphfst[search]'``.
"""

from __future__ import annotations

from .fts import Registration, register, require_apsw
from .terms import KINDS, TermAnalyzer, TermOptions

__all__ = ["KINDS", "Registration", "TermAnalyzer", "TermOptions", "register", "require_apsw"]

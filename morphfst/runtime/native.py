"""The walk in C (:file:`_cwalk.c`), when the extension module was built with the package.

The extension is optional: ``pip install`` compiles it where a C compiler and the Python headers are
found, and the walk in Python (:class:`morphfst.runtime.walk.ArcWalker`) gives the same paths without
it. Set ``MORPHFST_PURE_PYTHON=1`` to walk in Python even when it is built (to compare the two, or to
rule the extension out when looking for a fault).
"""

from __future__ import annotations

import os
from collections.abc import Iterable
from typing import Any

from ..compile.arctable import Arcs, PackedArcs

try:
    from . import _cwalk
except ImportError:  # built without a compiler: the walk stays in Python
    _cwalk: Any = None  # type: ignore[no-redef]

PURE_PYTHON_ENV = "MORPHFST_PURE_PYTHON"


def available() -> bool:
    """True when the extension is built and not switched off by :data:`PURE_PYTHON_ENV`."""
    return _cwalk is not None and os.environ.get(PURE_PYTHON_ENV, "") in ("", "0")


def native_walker(table: Arcs, skip: Iterable[int], future: bool = False) -> Any | None:
    """A C walker over ``table`` (``skip``: the input labels a path may take without reading input),
    or ``None`` when the extension is not available or the table is not a packed one. With ``future``
    it also leaves out the states that cannot read the rest of the word (see :file:`_cwalk.c`)."""
    if not available() or not isinstance(table, PackedArcs):
        return None
    first, ilabel, olabel, weight, nxt, final = table.arrays()
    skipped = "".join(chr(code) for code in sorted(skip))
    return _cwalk.Walker(first, ilabel, olabel, weight, nxt, final, table.start, skipped, future=future)

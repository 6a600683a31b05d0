"""Submodules imported on first use (PEP 562 module ``__getattr__``): after a plain ``import morphfst``,
``morphfst.tables.export.iter_unimorph`` works, and optional dependencies load only with their module."""

from __future__ import annotations

import importlib
from collections.abc import Callable
from typing import Any


def submodule_getattr(package: str) -> Callable[[str], Any]:
    """A module ``__getattr__`` for ``package`` that imports a submodule on first use, so that
    ``morphfst.tables.export.iter_unimorph`` works after a plain ``import morphfst`` and optional
    dependencies load only when their module is used (PEP 562)."""

    def __getattr__(name: str) -> Any:
        if not name.startswith("_"):
            try:
                return importlib.import_module(f".{name}", package)
            except ModuleNotFoundError as exc:
                if exc.name != f"{package}.{name}":
                    raise
        raise AttributeError(f"module {package!r} has no attribute {name!r}")

    return __getattr__

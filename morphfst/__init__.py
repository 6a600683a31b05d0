"""morphfst: finite-state morphology for agglutinative languages.

Describe a language once (lexicon TSV files plus a grammar file) and get weighted transducers that
analyze, generate and segment words::

    import morphfst
    tur = morphfst.load("tur")
    tur.analyze("evlerde")[0].text        # 'ev N;PL;LOC'
    tur.generate("ev", "N;PL;ABL")[0].form  # 'evlerden'
    tur.segment("evlerde")[0].text        # 'ev-ler-de'
"""

# modules the README uses as morphfst.<module>.<function> after a plain "import morphfst"
import importlib
from typing import Any

from .build import compile_grammar, load
from .errors import UserError
from .results import Analysis, Form, Morph, Segmentation
from .runtime import Language
from .version import __version__

__all__ = [
    "Analysis",
    "Form",
    "Language",
    "Morph",
    "Segmentation",
    "UserError",
    "__version__",
    "compile_grammar",
    "load",
]


def __getattr__(name: str) -> Any:
    """Submodules are reachable after a plain ``import morphfst`` (``morphfst.export.iter_unimorph``),
    imported on first use so that optional dependencies load only when needed."""
    if not name.startswith("_"):
        try:
            return importlib.import_module(f".{name}", __name__)
        except ModuleNotFoundError as exc:
            if exc.name != f"{__name__}.{name}":
                raise
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")

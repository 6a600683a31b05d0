"""morphfst: finite-state morphology for agglutinative languages.

Describe a language once (lexicon TSV files plus a grammar file) and get weighted transducers that
analyze, generate and segment words::

    import morphfst
    tur = morphfst.load("tur")
    tur.analyze("evlerde")[0].text        # 'ev N;PL;LOC'
    tur.generate("ev", "N;PL;ABL")[0].form  # 'evlerden'
    tur.segment("evlerde")[0].text        # 'ev-ler-de'
"""

from .build import compile_grammar, load
from .errors import UserError
from .lazymodules import submodule_getattr
from .runtime.compiled_language import Language
from .runtime.results import Analysis, Form, Morph, Segmentation
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


__getattr__ = submodule_getattr(__name__)

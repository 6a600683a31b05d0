"""Stage 3, the runtime: a compiled language that analyzes, generates and segments words (the arc
walk for analysis, the result objects, the tokenizer of running text)."""

from ..lazymodules import submodule_getattr
from .compiled_language import Language

__all__ = ["Language"]

__getattr__ = submodule_getattr(__name__)

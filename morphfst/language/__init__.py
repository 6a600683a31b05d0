"""Stage 1, the language: the grammar language (its lark grammar and parser), the plain model a
grammar and its lexicons are read into, their validation, symbols and spelling normalization."""

from ..lazymodules import submodule_getattr

__getattr__ = submodule_getattr(__name__)

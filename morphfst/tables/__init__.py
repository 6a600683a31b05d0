"""Stage 4, tables: inflection tables (paradigms enumerated from the transducers, laid out by the
grammar's layouts), their text formats and the export of every form."""

from ..lazymodules import submodule_getattr

__getattr__ = submodule_getattr(__name__)

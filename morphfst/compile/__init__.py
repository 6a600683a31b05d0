"""Stage 2, compilation: a grammar model (with its lexicons and stems) into weighted transducers
(pynini/OpenFst), saved with their metadata and packed arc tables in one compiled file."""

from ..lazymodules import submodule_getattr

__getattr__ = submodule_getattr(__name__)

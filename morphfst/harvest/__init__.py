"""Lexicon harvesting: propose new lexicon entries from raw text, with the evidence for each.

::

    import morphfst
    from morphfst.harvest import HarvestOptions, Harvester, count_types, write_tsv

    tur = morphfst.load("tur")
    counts = count_types(tur, ["demo/tur_library.txt"])          # word types first (constant memory)
    result = Harvester(tur).harvest(counts.spellings, HarvestOptions(min_forms=2))
    for p in result.proposals[:5]:
        print(p.lemma, p.klass, p.flags, round(p.score, 2), p.examples()[:3])
    write_tsv(result, "new-nouns.tsv")

See :mod:`morphfst.harvest.extract` for the method and the score.
"""

from .candidates import CandidateGuesser, Reading, Variant, class_variants
from .counting import TypeCounts, count_types
from .extract import Harvester, HarvestOptions, HarvestResult, Proposal, harvest
from .output import HEADER, write_tsv

__all__ = [
    "HEADER",
    "CandidateGuesser",
    "HarvestOptions",
    "HarvestResult",
    "Harvester",
    "Proposal",
    "Reading",
    "TypeCounts",
    "Variant",
    "class_variants",
    "count_types",
    "harvest",
    "write_tsv",
]

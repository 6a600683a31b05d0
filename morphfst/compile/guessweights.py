"""The weights that guessed analyses carry (the guesser of :mod:`morphfst.compile.compiler`, and the
guessed compounds the runtime builds in :mod:`morphfst.runtime.walk`): every guess weighs at least
:data:`GUESS_OFFSET`, so it ranks below any analysis with a lexicon stem."""

import math

GUESS_OFFSET = 100.0  # weight added to every guessed analysis
# Weight per letter of a guessed stem. An affix then pays for itself when the stem letters it explains
# weigh more than its features (their weights are frequency estimates) and GUESS_MORPH_WEIGHT: chosen
# on the development words (wordfreq ranks 1-20,000) the lexicon knows, guessed as if it did not, by
# how often the first guess has the lexicon's segmentation: Turkish 0.3: 29.6 %, 1.0: 54.5 %, 1.2: 58.3 %,
# 1.5: 58.5 %, 2.0: 54.1 %; Finnish 46.1 % at 0.3 and 47.3-47.4 % from 1.5 (same lemma and part of speech:
# Turkish 9.5 % at 0.3, 31.3 % at 1.5; Finnish 25.0 %, 25.8 %).
GUESS_STEM_WEIGHT = 1.5
GUESS_MORPH_WEIGHT = 0.15  # weight per guessed-word affix with a surface form
# Scale of the part-of-speech prior (Compiler.guess_priors), chosen as GUESS_STEM_WEIGHT was (bench/guess_report.py,
# first guess with the lexicon's lemma and part of speech / segmentation): Turkish 46.3 / 71.4 % without,
# 55.8 / 71.4 % at 0.05, 55.9 / 71.5 % at 0.15, 55.7 / 71.2 % at 0.3, 54.2 / 70.2 % at 0.5, 53.3 / 68.7 % at 1.
GUESS_PRIOR_SCALE = 0.15
# A guessed compound (an unknown first part before a word of the lexicon, for grammars with compound
# blocks: FastAnalyzer.compound_guesses) weighs GUESS_OFFSET, GUESS_STEM_WEIGHT per letter of its first
# part, the last part's own weight and this (negative: the last part's letters are the lexicon's, not
# guessed ones, so the reading ranks before a guessed stem of the same letters). Chosen as the others
# (bench/guess_report.py --lang fin); see DEVELOPERS.md for the figures.
GUESS_COMPOUND_WEIGHT = -1.0
# A guessed name (part of speech NAME_POS) weighs GUESS_NAME_WEIGHT more than its prior: the weight a
# lexicon name read in lower case pays (walk.LOWER_CASE_NAME_WEIGHT, ln 10), since a word the guesser
# reads is written in lower case more often than not; the runtime takes it back for a word written with
# a capital (and gives it ln 10 less besides: such a word is a name more often than not) and for a word
# whose capitals are not known. Without it, the Finnish guess classes that also guess names read lower-case
# words as names first (bench/guess_report.py --lang fin: same lemma and part of speech 41.5 -> 37.5 %).
NAME_POS = "PROPN"
GUESS_NAME_WEIGHT = math.log(10)

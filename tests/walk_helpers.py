"""Small transducers shared by the walk tests (test_fast_paths.py, test_native_walk.py)."""

from __future__ import annotations

import pynini

from morphfst.compile.fstutil import Arc


def epsilon_cycle() -> pynini.Fst:
    """0 -a:a-> 2 (final), and a loop 0 -eps:x-> 1 -eps:y-> 0 that reads nothing."""
    fst = pynini.Fst()
    s0, s1, s2 = fst.add_state(), fst.add_state(), fst.add_state()
    fst.set_start(s0)
    fst.set_final(s2)
    fst.add_arc(s0, Arc(ord("a"), ord("a"), 0.0, s2))
    fst.add_arc(s0, Arc(0, ord("x"), 1.0, s1))
    fst.add_arc(s1, Arc(0, ord("y"), 0.0, s0))
    return fst

"""Grammar debugging: explain a word, diagnose a rejected word, test a grammar, lint it, draw its slot graph.

Every function takes a language (a :class:`~morphfst.runtime.Language`, a shipped grammar name, a
grammar file or a compiled file whose grammar source is present) and returns plain dataclasses with
a ``to_dict`` method::

    from morphfst import debug
    debug.explain("tur", "kitabı").analyses[0].derivation.fired   # ['buffer_drop', ..., 'final_voicing']
    debug.diagnose("tur", "evdeler").layer                        # 'morphotactics'
    debug.run_tests("tur").exit_code                              # 0
    debug.lint("tur").findings
    debug.slot_graph_dot("tur")                                   # Graphviz DOT text

A :class:`DebugSession` keeps the reloaded grammar model, the compiler and per-word lattices; pass
one session to several calls to reuse them.
"""

from .diagnose import (
    Diagnosis,
    LexiconFinding,
    MorphotacticsFinding,
    SoundChangeFinding,
    diagnose,
    diagnose_expected,
    render_diagnosis,
)
from .explain import AnalysisExplanation, Explanation, explain, render_explanation
from .graph import SlotGraph, render, slot_graph_data, slot_graph_dot, write_graph
from .lint import Finding, LintReport, lint, render_lint
from .nearest import NearWord, nearest_words
from .session import DebugSession
from .testing import Coverage, GrammarTest, TestReport, TestResult, read_test_file, render_report, run_tests
from .trace import Derivation, RuleStep, derive

__all__ = [
    "AnalysisExplanation",
    "Coverage",
    "DebugSession",
    "Derivation",
    "Diagnosis",
    "Explanation",
    "Finding",
    "GrammarTest",
    "LexiconFinding",
    "LintReport",
    "MorphotacticsFinding",
    "NearWord",
    "RuleStep",
    "SlotGraph",
    "SoundChangeFinding",
    "TestReport",
    "TestResult",
    "derive",
    "diagnose",
    "diagnose_expected",
    "explain",
    "lint",
    "nearest_words",
    "read_test_file",
    "render",
    "render_diagnosis",
    "render_explanation",
    "render_lint",
    "render_report",
    "run_tests",
    "slot_graph_data",
    "slot_graph_dot",
    "write_graph",
]

"""The walk in C (morphfst/runtime/_cwalk.c) gives the paths the walk in Python gives.

Both walks read the same packed arc tables; every comparison here runs the same words through a
walker with the extension and one without it (``_native = None``). The extension is optional for a
user (the package installs without a compiler); CI sets ``MORPHFST_REQUIRE_NATIVE=1`` so that a
build that silently lost it fails here instead of skipping.
"""

from __future__ import annotations

import os

import pynini
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from walk_helpers import epsilon_cycle

import morphfst
from morphfst.compile.arctable import PackedArcs, pack
from morphfst.compile.fstutil import Arc
from morphfst.runtime import native, walk

if not native.available():
    if os.environ.get("MORPHFST_REQUIRE_NATIVE"):
        pytest.fail("the C walk (morphfst.runtime._cwalk) is not built, and MORPHFST_REQUIRE_NATIVE is set", pytrace=False)
    pytest.skip("the C walk is not built here (no compiler at install time)", allow_module_level=True)

# Endings added to lexicon lemmas to make words to compare: real suffix strings of each language
# (common practice), so that many of the words have analyses and many only nearly do.
ENDINGS = {
    "tur": [
        "",
        "ler",
        "lar",
        "de",
        "da",
        "den",
        "dan",
        "in",
        "ın",
        "ı",
        "i",
        "imiz",
        "leri",
        "ları",
        "yor",
        "di",
        "mış",
        "e",
        "a",
        "x",
    ],
    "fin": ["", "n", "t", "a", "ä", "ssa", "ssä", "sta", "lla", "lle", "ksi", "ni", "mme", "kin", "ko", "jen", "ihin", "x"],
}


def _pair(walker: walk.ArcWalker) -> tuple[walk.ArcWalker, walk.ArcWalker]:
    """``walker`` (with the extension) and a walker of the same table without it."""
    assert walker._native is not None
    plain = walk.ArcWalker(walker.table, skip=[chr(c) for c in walker._skip])
    plain._native = None
    return walker, plain


def _same(a: list[tuple[str, str, float]], b: list[tuple[str, str, float]]) -> bool:
    """The same paths in the same order, but for paths of equal weight: weights added in another order
    may differ in the last bits, and so order two paths that tie either way (the analyses rank ties by
    their text, after rounding the weights)."""

    def canonical(paths: list[tuple[str, str, float]]) -> list[tuple[str, str, float]]:
        return sorted(paths, key=lambda p: (round(p[2], 6), p[0], p[1]))

    a, b = canonical(a), canonical(b)
    return len(a) == len(b) and all(x[:2] == y[:2] and x[2] == pytest.approx(y[2], abs=1e-9) for x, y in zip(a, b))


def _words(lang: morphfst.Language, name: str, every: int) -> list[str]:
    lemmas = sorted({e["lemma"] for e in lang.meta["lexicon"]})[::every]
    words = [lang.normalize(lemma + ending) for lemma in lemmas for ending in ENDINGS[name]]
    words += [w[:-1] for w in words if len(w) > 1]  # cut short: many reach a state that cannot end
    return [w for w in dict.fromkeys(words) if lang.acceptable(w)]


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_the_c_walk_finds_the_paths_the_python_walk_finds(name: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    fast, plain = _pair(lang.fast.bounded)
    words = _words(lang, name, every=12)
    assert len(words) > 5000
    differ = [w for w in words if not _same(fast.walk(w), plain.walk(w))]
    assert not differ, differ[:10]
    found = sum(bool(fast.walk(w)) for w in words)
    assert 0.1 * len(words) < found < len(words)  # both kinds of word are compared
    assert all(fast.accepts(w) == bool(plain.walk(w)) for w in words[:2000])


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_the_c_walk_guesses_what_the_python_walk_guesses(name: str, request: pytest.FixtureRequest) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    guesser = lang.fast.guesser
    assert guesser is not None
    fast, plain = _pair(guesser)
    words = _words(lang, name, every=97)[:600]
    differ = [w for w in words if not _same(fast.walk(w, walk.MAX_PATHS), plain.walk(w, walk.MAX_PATHS))]
    assert not differ, differ[:10]


@pytest.mark.parametrize("name", ["tur", "fin"])
def test_analyses_are_the_same_with_and_without_the_extension(
    name: str, request: pytest.FixtureRequest, monkeypatch: pytest.MonkeyPatch
) -> None:
    lang: morphfst.Language = request.getfixturevalue(name)
    words = _words(lang, name, every=60)
    with_c = [[(a.text, a.segmentation, a.weight) for a in lang.fast.analyze(w, guess=True)] for w in words]
    monkeypatch.setenv(native.PURE_PYTHON_ENV, "1")
    pure = walk.FastAnalyzer(lang)
    assert pure.bounded._native is None
    without = [[(a.text, a.segmentation, a.weight) for a in pure.analyze(w, guess=True)] for w in words]
    # the same readings in the same order; weights equal up to the order in which the two walks add
    # them (float sums: rounding both to 5 places split 99.801565 into 99.80156 and 99.80157)
    assert [[(t, s) for t, s, _ in found] for found in with_c] == [[(t, s) for t, s, _ in found] for found in without]
    assert all(abs(x[2] - y[2]) < 1e-6 for found_c, found_py in zip(with_c, without) for x, y in zip(found_c, found_py))


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(data=st.data())
def test_any_string_of_the_alphabet_walks_alike(tur: morphfst.Language, data: st.DataObject) -> None:
    fast, plain = _pair(tur.fast.bounded)
    word = data.draw(st.text(alphabet="abcçdefgğhıijklmnoöprsştuüvyz'", min_size=0, max_size=14))
    assert _same(fast.walk(word), plain.walk(word))


def _packed(fst: pynini.Fst, skip: str = "", future: bool = False) -> walk.ArcWalker:
    walker = walk.ArcWalker(PackedArcs(pack(fst)), skip=skip, future=future)
    assert walker._native is not None
    return walker


def _branching(length: int, sort: bool = True) -> pynini.Fst:
    """Two arcs per letter (outputs x/y, weights 1/0.5) and one that reads nothing (output z): many paths."""
    fst = pynini.Fst()
    states = [fst.add_state() for _ in range(length + 1)]
    fst.set_start(states[0])
    fst.set_final(states[-1], 0.25)
    for here, there in zip(states, states[1:]):
        fst.add_arc(here, Arc(ord("a"), ord("x"), 1.0, there))
        fst.add_arc(here, Arc(ord("b"), ord("w"), 0.0, there))
        fst.add_arc(here, Arc(ord("a"), ord("y"), 0.5, there))
        fst.add_arc(here, Arc(0, ord("z"), 2.0, there))
    if sort:
        fst.arcsort("ilabel")
    return fst


@pytest.mark.parametrize("sort", [True, False])
def test_tables_in_any_arc_order_walk_alike(sort: bool) -> None:
    fast, plain = _pair(_packed(_branching(5, sort)))
    assert fast._native.sorted is sort  # type: ignore[union-attr]
    for word in ["", "a", "aa", "ab", "aaaa", "abab", "aaaaa", "bbbbb", "aaaaaa", "c"]:
        assert _same(fast.walk(word), plain.walk(word)), word
        assert fast.accepts(word) == plain.accepts(word)


def test_skipped_labels_are_written_to_the_side_tape() -> None:
    # 0 -a:A-> 1 -+:eps-> 2 -b:B-> 3 (final): the side tape of "ab" is "a+b"
    fst = pynini.Fst()
    s = [fst.add_state() for _ in range(4)]
    fst.set_start(s[0])
    fst.set_final(s[3])
    fst.add_arc(s[0], Arc(ord("a"), ord("A"), 0.0, s[1]))
    fst.add_arc(s[1], Arc(ord("+"), 0, 0.5, s[2]))
    fst.add_arc(s[2], Arc(ord("b"), ord("B"), 0.0, s[3]))
    fast, plain = _pair(_packed(fst, skip="+"))
    assert fast.walk("ab") == plain.walk("ab") == [("a+b", "AB", 0.5)]
    assert fast.walk("a+b") == plain.walk("a+b") == []  # a skipped label is never read from the word


def test_a_walker_with_future_leaves_out_states_that_cannot_read_the_rest_of_the_word() -> None:
    # from 0, "ab" leads to three states: 2 goes on with c to a final state; 5 only with d; 8 with c to a
    # state that is not final and has no arcs. For "abc" only the pairs on the way to 3 are built (4,
    # besides the start): 5 cannot read the c still to come, 8 reaches no final state, 11 (reached by
    # "ac") can read b and c but must end with b.
    fst = pynini.Fst()
    s = [fst.add_state() for _ in range(14)]
    fst.set_start(s[0])
    for final in (3, 6, 13):
        fst.set_final(s[final])
    for src, letter, dst in [(0, "a", 1), (1, "b", 2), (2, "c", 3), (0, "a", 4), (4, "b", 5), (5, "d", 6)]:
        fst.add_arc(s[src], Arc(ord(letter), ord(letter.upper()), 0.0, s[dst]))
    for src, letter, dst in [(0, "a", 7), (7, "b", 8), (8, "c", 9), (0, "a", 10), (10, "b", 11), (11, "c", 12)]:
        fst.add_arc(s[src], Arc(ord(letter), ord(letter.upper()), 0.0, s[dst]))
    fst.add_arc(s[12], Arc(ord("b"), ord("B"), 0.0, s[13]))
    fast, plain = _pair(_packed(fst, future=True))
    lookahead_only = _packed(fst)
    for word in ["abc", "abd", "abcb", "ab", "abcc", "a"]:
        assert _same(fast.walk(word), plain.walk(word)), word
        assert lookahead_only.walk(word) == fast.walk(word), word
        assert fast.accepts(word) == plain.accepts(word), word
    assert fast.walk("abc") == lookahead_only.walk("abc") == [("abc", "ABC", 0.0)]
    assert fast._native.last[0] == 4  # type: ignore[union-attr]  # (position, state) pairs built for "abc"
    # the one-letter look-ahead alone also builds 4, 7 and 10 after "a" and 8 and 11 after "ab"
    assert lookahead_only._native.last[0] == 9  # type: ignore[union-attr]


def test_more_paths_than_kept_live_are_left_to_the_python_walk() -> None:
    walker = _packed(_branching(14))
    assert walker._native.paths("a" * 14, walk.MAX_LIVE) is None  # type: ignore[union-attr]  # 3**14 paths
    plain = walk.ArcWalker(walker.table)
    plain._native = None
    assert walker.walk("a" * 14, walk.MAX_PATHS) == plain.walk("a" * 14, walk.MAX_PATHS)
    assert len(walker.walk("a" * 14, walk.MAX_PATHS)) == walk.MAX_PATHS


def test_a_cycle_of_arcs_that_read_nothing_is_left_to_the_python_walk() -> None:
    walker = _packed(epsilon_cycle())
    assert walker._native.paths("a", walk.MAX_LIVE) is None  # type: ignore[union-attr]
    outputs = [out for _, out, _ in walker.walk("a")]
    assert outputs[:3] == ["a", "xya", "xyxya"] and len(outputs) == walk.MAX_CLOSURE_DEPTH // 2 + 1
    assert walker.walk("b") == [] and not walker.accepts("b")


def test_a_table_without_states_walks_nothing() -> None:
    walker = walk.ArcWalker(PackedArcs(pack(pynini.Fst())))
    assert walker.walk("a") == [] and not walker.accepts("")


def test_malformed_arrays_are_refused() -> None:
    from morphfst.runtime import _cwalk

    first, ilabel, olabel, weight, nxt, final = PackedArcs(pack(_branching(2))).arrays()
    with pytest.raises(TypeError):
        _cwalk.Walker(first, ilabel, olabel, ilabel, nxt, final, 0, "")  # weights must be doubles
    with pytest.raises(ValueError):
        _cwalk.Walker(first, ilabel, olabel, weight, nxt, final[:1], 0, "")  # states disagree


def test_info_says_which_walk_analyzes(
    tur: morphfst.Language, capsys: pytest.CaptureFixture[str], monkeypatch: pytest.MonkeyPatch
) -> None:
    from morphfst.cli import main

    assert main(["info", "-l", tur.path or "tur"]) == 0
    assert "analysis walk: in C" in capsys.readouterr().out
    monkeypatch.setenv(native.PURE_PYTHON_ENV, "1")
    assert main(["info", "-l", tur.path or "tur"]) == 0
    assert "analysis walk: in Python" in capsys.readouterr().out


def test_threads_walking_at_once_get_the_paths_of_one_thread(tur: morphfst.Language) -> None:
    from concurrent.futures import ThreadPoolExecutor

    words = _words(tur, "tur", every=40)[:1500]
    walker = tur.fast.bounded
    alone = [walker.walk(w) for w in words]
    with ThreadPoolExecutor(4) as pool:
        together = list(pool.map(walker.walk, words, chunksize=7))
    assert all(_same(a, b) for a, b in zip(alone, together))

"""Arc tables: the arcs of a transducer as packed arrays, for the walk (:mod:`morphfst.runtime.walk`).

The walk reads a state's arcs the first time it reaches the state. Through pynini that costs an
OpenFst binary parse of the whole transducer at start-up and some microseconds per state after it.
The compiled file therefore also holds, for each transducer the walk reads, a table in compressed
sparse row form (the arcs of all states one after another, and the offset where each state's arcs
begin): reading it is a copy of bytes into arrays, and a state's arcs are a slice of each array.

Layout of a packed table (little-endian): the magic ``MFARCS2\\n``; the start state, the number of
states and the number of arcs (three signed 64-bit integers); then the arrays ``first`` (uint32,
states + 1 offsets), ``ilabel``, ``olabel`` (uint32 code points), ``weight`` (float64: the value
pynini gives for the arc's tropical weight, so a walk over the table adds exactly the numbers a walk
through pynini adds), ``next`` (uint32) for the arcs, and ``final`` (float64 per state; infinity for a
state that is not final).
"""

from __future__ import annotations

import array
import struct
import sys
from collections.abc import Iterable, Sequence
from typing import TYPE_CHECKING, Any, Protocol

if TYPE_CHECKING:  # pynini is imported only to read or pack an in-memory transducer, not to walk a table
    import pynini

MAGIC = b"MFARCS2\n"
WALKED = ("bounded", "guesser")  # the transducers the walk reads: these get a packed table
_HEADER = struct.Struct("<qqq")
_INF = float("inf")
NO_STATE_ID = -1  # OpenFst's "no state" (the start of an empty transducer), named without importing pynini
ArcRow = tuple[int, int, float, int]  # input label, output label, weight, next state


class Arcs(Protocol):
    """What the walk reads of a transducer: its start state, each state's arcs and final weight."""

    start: int

    def arcs(self, state: int) -> Iterable[ArcRow]: ...

    def final(self, state: int) -> float | None: ...


class FstArcs:
    """The arcs of an in-memory transducer, read through pynini one state at a time."""

    def __init__(self, fst: pynini.Fst) -> None:
        from .fstutil import Weight

        self.fst = fst
        self.start: int = fst.start()
        self._zero = Weight.zero(fst.weight_type())

    def arcs(self, state: int) -> list[ArcRow]:
        return [(arc.ilabel, arc.olabel, float(arc.weight), arc.nextstate) for arc in self.fst.arcs(state)]

    def final(self, state: int) -> float | None:
        weight = self.fst.final(state)
        return None if weight == self._zero else float(weight)


class PackedArcs:
    """A packed table (see the module docstring): a state's arcs are slices of five arrays."""

    def __init__(self, data: bytes | memoryview) -> None:
        if bytes(data[: len(MAGIC)]) != MAGIC:
            raise ValueError("not an arc table")
        start, states, arcs = _HEADER.unpack_from(data, len(MAGIC))
        self.start = start
        pos = len(MAGIC) + _HEADER.size
        self._first, pos = _array("I", data, pos, states + 1)
        self._ilabel, pos = _array("I", data, pos, arcs)
        self._olabel, pos = _array("I", data, pos, arcs)
        self._weight, pos = _array("d", data, pos, arcs)
        self._next, pos = _array("I", data, pos, arcs)
        self._final, pos = _array("d", data, pos, states)
        if pos != len(data):
            raise ValueError("arc table has trailing bytes")

    def arcs(self, state: int) -> Iterable[ArcRow]:
        a, b = self._first[state], self._first[state + 1]
        return zip(self._ilabel[a:b], self._olabel[a:b], self._weight[a:b], self._next[a:b])

    def final(self, state: int) -> float | None:
        weight = self._final[state]
        return None if weight == _INF else weight

    def arrays(self) -> tuple[Sequence[Any], Sequence[Any], Sequence[Any], Sequence[Any], Sequence[Any], Sequence[Any]]:
        """The table's arrays ``first, ilabel, olabel, weight, next, final`` (buffers in machine order),
        for the walk in C (:mod:`morphfst.runtime.native`)."""
        return (self._first, self._ilabel, self._olabel, self._weight, self._next, self._final)

    @property
    def num_states(self) -> int:
        return len(self._final)


def pack(fst: pynini.Fst) -> bytes:
    """The packed table of ``fst`` (tropical weights)."""
    from .fstutil import Weight

    zero = Weight.zero(fst.weight_type())
    first = array.array("I", [0])
    ilabel, olabel, targets = array.array("I"), array.array("I"), array.array("I")
    weights, finals = array.array("d"), array.array("d")
    for state in range(fst.num_states()):
        for arc in fst.arcs(state):
            ilabel.append(arc.ilabel)
            olabel.append(arc.olabel)
            weights.append(float(arc.weight))
            targets.append(arc.nextstate)
        first.append(len(ilabel))
        w = fst.final(state)
        finals.append(_INF if w == zero else float(w))
    parts = [MAGIC, _HEADER.pack(fst.start(), fst.num_states(), len(ilabel))]
    for arr in (first, ilabel, olabel, weights, targets, finals):
        if sys.byteorder != "little":
            arr.byteswap()
        parts.append(arr.tobytes())
    return b"".join(parts)


def _array(code: str, data: bytes | memoryview, pos: int, count: int) -> tuple[Sequence[Any], int]:
    """``count`` items of type ``code`` at ``pos``: a view of ``data`` on a little-endian machine (no
    copy), else a byte-swapped array."""
    size = array.array(code).itemsize
    end = pos + count * size
    if end > len(data):
        raise ValueError("arc table is truncated")
    if sys.byteorder == "little":
        return memoryview(data)[pos:end].cast("B").cast(code), end  # type: ignore[call-overload]
    arr = array.array(code)
    arr.frombytes(data[pos:end])
    arr.byteswap()
    return arr, end

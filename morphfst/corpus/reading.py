"""Reading a corpus in binary, in chunks of whole lines, in constant memory.

A chunk is a run of complete lines (bytes, each ending with ``\\n`` except possibly the last line of
the input), with the number of its first line. A line longer than ``max_line_bytes`` is cut into
pieces at a white-space byte (or, with no white space in reach, at a UTF-8 character boundary); the
pieces travel in consecutive chunks marked ``continues`` / ``part`` so the output keeps them on one
line. Nothing is decoded here: decoding (invalid UTF-8 replaced and counted) happens where the chunk
is processed.
"""

from __future__ import annotations

from collections.abc import Iterable, Iterator
from dataclasses import dataclass
from typing import BinaryIO

CHUNK_BYTES = 256 * 1024  # bytes read at a time; a chunk holds about this much text
MAX_LINE_BYTES = 1024 * 1024  # longer lines are cut into pieces of at most this size


@dataclass(frozen=True)
class Chunk:
    """Whole lines of input (raw bytes) and where they are."""

    index: int  # 0, 1, 2... in input order
    first_line: int  # number (1-based) of the chunk's first line in its file
    data: bytes
    part: int = 0  # >0: the first line continues a line cut at the end of the previous chunk
    continues: bool = False  # the last line goes on in the next chunk

    @property
    def lines(self) -> int:
        """Lines that end in this chunk (a cut line counts in the chunk where it ends)."""
        n = self.data.count(b"\n")
        if self.data and not self.data.endswith(b"\n") and not self.continues:
            n += 1
        return n


def _cut_point(buffer: bytes, limit: int) -> int:
    """Where to cut a line longer than ``limit``: after the last space or tab in reach, else at a character start."""
    cut = max(buffer.rfind(b" ", 0, limit), buffer.rfind(b"\t", 0, limit))
    if cut > limit // 2:
        return cut + 1
    cut = limit
    while cut > 0 and (buffer[cut] & 0xC0) == 0x80:  # do not split a UTF-8 sequence
        cut -= 1
    return cut or limit


def read_blocks(handle: BinaryIO, start: int = 0, stop: int | None = None, block: int = CHUNK_BYTES) -> Iterator[bytes]:
    """Raw blocks of ``handle``: the lines that start in ``[start, stop)`` (``stop=None``: to the end).

    A line starts at offset 0 and after every newline, so the lines of consecutive ranges ``[a, b)``,
    ``[b, c)`` are disjoint and together cover the file. With ``start=0`` the handle is read from
    where it is (it may be a pipe); otherwise it must be seekable.
    """
    if start > 0:
        handle.seek(start - 1)
        while True:  # skip the rest of the line that started before ``start``
            rest = handle.readline(block)
            if not rest or rest.endswith(b"\n"):
                break
    if stop is None:
        while True:
            data = handle.read(block)
            if not data:
                return
            yield data
    pos = handle.tell()
    last = b""
    while pos < stop:
        data = handle.read(min(block, stop - pos))
        if not data:
            return
        pos += len(data)
        last = data
        yield data
    if last and not last.endswith(b"\n"):
        while True:  # finish the line that started before ``stop``
            rest = handle.readline(block)
            if not rest:
                return
            yield rest
            if rest.endswith(b"\n"):
                return


def chunks(
    blocks: Iterable[bytes],
    first_line: int = 1,
    chunk_bytes: int = CHUNK_BYTES,
    max_line_bytes: int = MAX_LINE_BYTES,
) -> Iterator[Chunk]:
    """Group raw blocks into chunks of whole lines (see :class:`Chunk`); a chunk is at most about
    ``chunk_bytes`` long unless one line is longer, and no line in a chunk is longer than ``max_line_bytes``."""
    chunk_bytes = max(1, min(chunk_bytes, max_line_bytes))
    index = 0
    line = first_line
    part = 0
    buffer = b""

    def drain(final: bool) -> Iterator[Chunk]:
        nonlocal buffer, index, line, part
        while len(buffer) >= chunk_bytes or (final and buffer):
            end = buffer.rfind(b"\n", 0, chunk_bytes)
            if end < 0:
                end = buffer.find(b"\n", 0, max_line_bytes)
            if end >= 0:
                data, buffer = buffer[: end + 1], buffer[end + 1 :]
                yield Chunk(index, line, data, part)
                line += data.count(b"\n")
                part = 0
            elif len(buffer) > max_line_bytes:
                cut = _cut_point(buffer, max_line_bytes)
                data, buffer = buffer[:cut], buffer[cut:]
                yield Chunk(index, line, data, part, continues=True)
                part += 1
            elif final:
                data, buffer = buffer, b""
                yield Chunk(index, line, data, part)
                line += 1
                part = 0
            else:
                return
            index += 1

    for block in blocks:
        buffer = buffer + block if buffer else block
        yield from drain(False)
    yield from drain(True)


def split_chunk(chunk: Chunk, parts: int) -> Iterator[Chunk]:
    """``chunk`` as about ``parts`` chunks of whole lines (the same bytes, first lines renumbered); a
    piece of a cut line, or a chunk of one line, stays whole."""
    data = chunk.data
    if parts <= 1 or chunk.part or chunk.continues:
        yield chunk
        return
    size = max(1, len(data) // parts)
    start, line = 0, chunk.first_line
    while start < len(data):
        end = data.find(b"\n", start + size - 1) if len(data) - start > size else -1
        stop = len(data) if end < 0 else end + 1
        piece = data[start:stop]
        yield Chunk(chunk.index, line, piece)
        line += piece.count(b"\n")
        start = stop


def finer_tail(chunks: Iterable[Chunk], hold: int, parts: int) -> Iterator[Chunk]:
    """The chunks of ``chunks`` in order, the last ``hold`` of them each cut into about ``parts``
    (:func:`split_chunk`): several processes working through the chunks then run out of work at
    about the same time, not one chunk's work apart (a quarter of the chunk at the end of a run)."""
    held: list[Chunk] = []
    for chunk in chunks:
        held.append(chunk)
        if len(held) > hold:
            yield held.pop(0)
    for chunk in held:
        yield from split_chunk(chunk, parts)

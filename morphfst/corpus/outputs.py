"""Output files that never look whole before they are: written to a temporary name, renamed when complete.

The temporary file sits beside the final one, named ``.<name>.<pid>-<random>.part``; if the run fails
or is interrupted it is removed, and if the process is killed outright only that hidden ``.part`` file
remains, never a file with the final name; the next run writing the same output removes it
(:func:`morphfst.atomic.clean_stale_parts`). A failed write (a full disk, a read-only file system) is
one :class:`UserError` and leaves nothing behind.
"""

from __future__ import annotations

import contextlib
import os
import sys
from collections.abc import Iterator
from pathlib import Path
from typing import BinaryIO, TextIO

from ..atomic import PART_SUFFIX, create_temp, discard, publish, write_error

__all__ = ["PART_SUFFIX", "AtomicFile", "StdoutSink", "atomic_text", "open_sink"]


class AtomicFile:
    """A binary file written under a temporary name and renamed by :meth:`commit`."""

    def __init__(self, path: str | Path) -> None:
        self.path = Path(path)
        fd, self.tmp = create_temp(self.path)
        self.handle: BinaryIO = os.fdopen(fd, "wb", buffering=1024 * 1024)
        self.done = False

    def write(self, data: bytes) -> None:
        try:
            self.handle.write(data)
        except OSError as exc:
            self.abort()
            raise write_error(exc, self.path) from None

    def commit(self) -> Path:
        try:
            self.handle.flush()
            os.fsync(self.handle.fileno())
            self.handle.close()
            publish(self.tmp, self.path)
        except OSError as exc:
            self.abort()
            raise write_error(exc, self.path) from None
        except BaseException:
            self.abort()
            raise
        self.done = True
        return self.path

    def abort(self) -> None:
        if not self.done:
            with contextlib.suppress(OSError, ValueError):
                self.handle.close()
            discard(self.tmp)
            self.done = True


class StdoutSink:
    """Standard output as a sink (a stream cannot be renamed: it is simply written)."""

    path = Path("-")

    def __init__(self) -> None:
        self.handle = sys.stdout.buffer

    def write(self, data: bytes) -> None:
        self.handle.write(data)

    def commit(self) -> Path:
        self.handle.flush()
        return self.path

    def abort(self) -> None:
        with contextlib.suppress(OSError, ValueError):
            self.handle.flush()


def open_sink(path: str | Path | None) -> AtomicFile | StdoutSink:
    """An atomic file for ``path``, or standard output for ``None`` / ``-``."""
    if path is None or str(path) == "-":
        return StdoutSink()
    return AtomicFile(path)


@contextlib.contextmanager
def atomic_text(path: str | Path) -> Iterator[TextIO]:
    """A text file (UTF-8) written atomically: renamed into place when the block ends without error."""
    sink = AtomicFile(path)
    text = _TextWriter(sink)
    try:
        yield text  # type: ignore[misc]
        sink.commit()
    except BaseException:
        sink.abort()
        raise


class _TextWriter:
    def __init__(self, sink: AtomicFile) -> None:
        self.sink = sink

    def write(self, text: str) -> int:
        self.sink.write(text.encode("utf-8"))
        return len(text)

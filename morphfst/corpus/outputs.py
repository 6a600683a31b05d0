"""Output files that never look whole before they are: written to a temporary name, renamed when complete.

The temporary file sits beside the final one, named ``.<name>.<random>.part``; if the run fails or
is interrupted it is removed, and if the process is killed outright only that hidden ``.part`` file
remains, never a file with the final name.
"""

from __future__ import annotations

import contextlib
import os
import sys
import tempfile
from collections.abc import Iterator
from pathlib import Path
from typing import BinaryIO, TextIO

from ..atomic import publish
from ..errors import Position, UserError

PART_SUFFIX = ".part"


class AtomicFile:
    """A binary file written under a temporary name and renamed by :meth:`commit`."""

    def __init__(self, path: str | Path) -> None:
        self.path = Path(path)
        try:
            self.path.parent.mkdir(parents=True, exist_ok=True)
            fd, tmp = tempfile.mkstemp(prefix=f".{self.path.name}.", suffix=PART_SUFFIX, dir=self.path.parent)
        except OSError as exc:
            raise UserError(
                f"cannot write output: {exc.strerror or exc}", Position(str(self.path)), hint="check the output path"
            ) from None
        self.tmp = Path(tmp)
        self.handle: BinaryIO = os.fdopen(fd, "wb", buffering=1024 * 1024)
        self.done = False

    def write(self, data: bytes) -> None:
        self.handle.write(data)

    def commit(self) -> Path:
        self.handle.flush()
        os.fsync(self.handle.fileno())
        self.handle.close()
        publish(self.tmp, self.path)
        self.done = True
        return self.path

    def abort(self) -> None:
        if not self.done:
            with contextlib.suppress(OSError):
                self.handle.close()
            self.tmp.unlink(missing_ok=True)
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

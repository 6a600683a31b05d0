"""Output files written whole or not at all: a temporary name in the same directory, renamed when complete."""

from __future__ import annotations

import os

from .errors import UserError


def default_file_mode() -> int:
    """The permissions ``open()`` gives a new file under the current umask (``mkstemp`` makes files private)."""
    mask = os.umask(0)
    os.umask(mask)
    return 0o666 & ~mask


def publish(tmp: str | os.PathLike[str], target: str | os.PathLike[str]) -> None:
    """Give the finished temporary file ordinary permissions and rename it to its final name.

    A directory in the way is the user's mistake (a :class:`UserError`); the caller removes ``tmp``."""
    if os.path.isdir(target):
        raise UserError(f"{target} is a directory", hint="give a file name for the output")
    os.chmod(tmp, default_file_mode())
    os.replace(tmp, target)

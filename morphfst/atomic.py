"""Output files written whole or not at all: a temporary name in the same directory, renamed when complete.

The temporary file is ``.<name>.<pid>-<random>.part`` beside the output. It is created with mode
``0o666`` so that the kernel applies the process umask (no ``os.umask`` call, which is not
thread-safe); an output that already exists keeps its own permissions. If the process is killed
outright only the hidden ``.part`` file remains; the next run that writes the same output removes
the ``.part`` files of that output whose process is gone (never anything else).
"""

from __future__ import annotations

import contextlib
import errno
import os
import re
import secrets
import stat
from pathlib import Path

from .errors import Position, UserError

PART_SUFFIX = ".part"


def pid_alive(pid: int) -> bool:
    if pid <= 0:
        return False
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except PermissionError:
        return True
    return True


def clean_stale_parts(target: str | os.PathLike[str]) -> list[Path]:
    """Remove the ``.part`` files a killed run left beside ``target`` (only those of dead processes)."""
    target = Path(target)
    directory = target.parent
    pattern = re.compile(rf"\.{re.escape(target.name)}\.(\d+)-[0-9a-f]{{8}}{re.escape(PART_SUFFIX)}\Z")
    removed: list[Path] = []
    try:
        names = os.listdir(directory if str(directory) else ".")
    except OSError:
        return removed
    for name in names:
        match = pattern.match(name)
        if match and not pid_alive(int(match.group(1))):
            with contextlib.suppress(OSError):
                (directory / name).unlink()
                removed.append(directory / name)
    return removed


def create_temp(target: str | os.PathLike[str]) -> tuple[int, Path]:
    """Open a new temporary file beside ``target`` for writing; returns (file descriptor, path).

    Stale temporary files of the same output left by killed runs are removed first. Failures raise
    :class:`UserError` (see :func:`write_error`)."""
    target = Path(target)
    if target.is_dir():
        raise UserError(f"{target} is a directory", hint="give a file name for the output")
    try:
        if str(target.parent):
            target.parent.mkdir(parents=True, exist_ok=True)
        clean_stale_parts(target)
        for _ in range(100):
            tmp = target.with_name(f".{target.name}.{os.getpid()}-{secrets.token_hex(4)}{PART_SUFFIX}")
            try:
                fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_CLOEXEC", 0), 0o666)
            except FileExistsError:
                continue
            return fd, tmp
        raise FileExistsError(errno.EEXIST, "no free temporary name")
    except OSError as exc:
        raise write_error(exc, target) from None


def default_file_mode() -> int:
    """The permissions ``open()`` gives a new file under the current umask, found without ``os.umask``
    (which changes the umask of every thread): from ``/proc/self/status``, or else from a probe file."""
    try:
        for line in Path("/proc/self/status").read_text().splitlines():
            if line.startswith("Umask:"):
                return 0o666 & ~int(line.split()[1], 8)
    except (OSError, ValueError, IndexError):
        pass
    import tempfile

    with tempfile.TemporaryDirectory() as folder:
        probe = os.path.join(folder, "probe")
        os.close(os.open(probe, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666))
        return stat.S_IMODE(os.stat(probe).st_mode)


def discard(tmp: str | os.PathLike[str] | None) -> None:
    """Remove a temporary file, ignoring every failure (a read-only or full file system included)."""
    if tmp is not None:
        with contextlib.suppress(OSError):
            os.unlink(tmp)


def write_error(exc: OSError, target: str | os.PathLike[str]) -> UserError:
    """One clear message for a failed write of ``target``."""
    hints = {
        errno.ENOSPC: "the disk is full; free some space or write elsewhere",
        errno.EDQUOT: "the disk quota is exceeded; free some space or write elsewhere",
        errno.EROFS: "the file system is read-only; write elsewhere",
        errno.EACCES: "no permission to write there; write elsewhere",
        errno.EPERM: "no permission to write there; write elsewhere",
        errno.ENOENT: "the directory does not exist; create it first, or write elsewhere",
    }
    return UserError(
        f"cannot write output: {exc.strerror or exc}; nothing was written",
        Position(str(target)),
        hint=hints.get(exc.errno or 0, "check the output path"),
    )


def publish(tmp: str | os.PathLike[str], target: str | os.PathLike[str]) -> None:
    """Rename the finished temporary file to its final name, keeping the permissions of an output it
    replaces (a new output has the umask's default permissions, given at creation).

    A directory in the way is the user's mistake (a :class:`UserError`); the caller removes ``tmp``."""
    if os.path.isdir(target):
        raise UserError(f"{target} is a directory", hint="give a file name for the output")
    try:
        old = os.stat(target)
    except OSError:
        old = None
    if old is not None and stat.S_ISREG(old.st_mode):
        os.chmod(tmp, stat.S_IMODE(old.st_mode))
    os.replace(tmp, target)


def write_bytes_atomic(target: str | os.PathLike[str], data: bytes) -> Path:
    """Write ``data`` to ``target`` whole or not at all; failures are one :class:`UserError`, and no
    temporary file is left."""
    target = Path(target)
    fd, tmp = create_temp(target)
    try:
        with os.fdopen(fd, "wb") as handle:
            handle.write(data)
        publish(tmp, target)
    except OSError as exc:
        discard(tmp)
        raise write_error(exc, target) from None
    except BaseException:
        discard(tmp)
        raise
    return target

"""Writing output on a full disk or a read-only place, killed runs, and permissions of replaced files."""

from __future__ import annotations

import os
import stat
import subprocess
import sys
import time
from pathlib import Path

import pytest
from toygrammar import write_toy

import morphfst
from morphfst import atomic
from morphfst.cli import main

_real_open = os.open


@pytest.fixture()
def full_disk(monkeypatch: pytest.MonkeyPatch) -> None:
    """Every temporary output file is created, but its descriptor writes to /dev/full (ENOSPC)."""

    def fake_open(path: str | os.PathLike[str], flags: int, mode: int = 0o777, *args: object, **kwargs: object) -> int:
        fd = _real_open(path, flags, mode)
        if str(path).endswith(atomic.PART_SUFFIX):
            os.close(fd)
            return _real_open("/dev/full", os.O_WRONLY)
        return fd

    monkeypatch.setattr(os, "open", fake_open)


@pytest.fixture()
def toy(tmp_path: Path) -> Path:
    return write_toy(tmp_path / "toy")


def _outcome(capsys: pytest.CaptureFixture[str], argv: list[str]) -> tuple[int, str]:
    code = main(argv)
    return code, capsys.readouterr().err


def _nothing_beside(path: Path) -> None:
    assert not path.exists()
    assert [p.name for p in path.parent.iterdir() if p.name.startswith(f".{path.name}")] == []


@pytest.mark.parametrize(
    "command",
    [
        ["corpus", "{text}", "-o", "{out}", "-q"],
        ["corpus", "{text}", "-q", "--report", "{out}"],
        ["export", "-o", "{out}"],
        ["table", "ka", "-o", "{out}"],
        ["build", "{grammar}", "-o", "{out}"],
        ["graph", "-o", "{out}"],
    ],
    ids=["corpus", "coverage-report", "export", "table", "build", "graph"],
)
def test_a_full_disk_is_one_message_exit_2_and_nothing_left(
    command: list[str], toy: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str], request: pytest.FixtureRequest
) -> None:
    text = tmp_path / "in.txt"
    text.write_text("ka te kalar\n" * 50, encoding="utf-8")
    morphfst.load(toy)  # compiled into the cache before the disk fills
    out_dir = tmp_path / "out"
    out_dir.mkdir()
    out = out_dir / "result.txt"
    argv = [a.format(text=text, out=out, grammar=toy) for a in command]
    if command[0] != "build":
        argv += ["-l", str(toy)]
    request.getfixturevalue("full_disk")
    code, err = _outcome(capsys, argv)
    assert code == 2
    assert "Traceback" not in err
    assert "No space left on device" in err and "disk is full" in err
    assert len([line for line in err.splitlines() if "error:" in line]) == 1
    _nothing_beside(out)


def test_graph_onto_a_read_only_place(
    toy: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    def read_only(*args: object, **kwargs: object) -> int:
        raise OSError(30, "Read-only file system")  # EROFS on creating, and on every clean-up attempt

    monkeypatch.setattr(os, "open", read_only)
    monkeypatch.setattr(os, "unlink", read_only)
    code, err = _outcome(capsys, ["graph", "-l", str(toy), "-o", str(tmp_path / "g.dot")])
    assert code == 2 and "Read-only file system" in err and "Traceback" not in err


def test_replacing_an_output_keeps_its_permissions_and_never_touches_the_umask(
    toy: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    def no_umask(mask: int) -> int:
        raise AssertionError("os.umask changes the whole process's umask (not thread-safe)")

    monkeypatch.setattr(os, "umask", no_umask)
    target = tmp_path / "table.txt"
    assert main(["table", "ka", "-l", str(toy), "-o", str(target)]) == 0
    mask = int(
        next(line.split()[1] for line in Path("/proc/self/status").read_text().splitlines() if line.startswith("Umask:")), 8
    )
    assert stat.S_IMODE(target.stat().st_mode) == 0o666 & ~mask  # a new output: the umask's default
    os.chmod(target, 0o640)
    assert main(["table", "te", "-l", str(toy), "-o", str(target)]) == 0
    assert stat.S_IMODE(target.stat().st_mode) == 0o640 and "te" in target.read_text()


def test_a_later_run_removes_only_the_partial_files_of_dead_runs(tmp_path: Path) -> None:
    target = tmp_path / "out.txt"
    dead = subprocess.run([sys.executable, "-c", "import os; print(os.getpid())"], capture_output=True, text=True, check=True)
    stale = tmp_path / f".out.txt.{int(dead.stdout)}-0123abcd.part"
    alive = tmp_path / f".out.txt.{os.getpid()}-0123abcd.part"  # a run still going (this process)
    other = tmp_path / ".other.txt.1-0123abcd.part"
    for p in (stale, alive, other):
        p.write_text("partial")
    fd, tmp = atomic.create_temp(target)
    os.close(fd)
    atomic.discard(tmp)
    assert not stale.exists() and alive.exists() and other.exists()


def _children(pid: int) -> list[int]:
    out = []
    for entry in Path("/proc").iterdir():
        if entry.name.isdigit():
            try:
                fields = (entry / "stat").read_text().rsplit(")", 1)[1].split()
            except OSError:
                continue
            if int(fields[1]) == pid:
                out.append(int(entry.name))
    return out


def _alive(pid: int) -> bool:
    try:
        state = Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()[0]
    except OSError:
        return False
    return state != "Z"


@pytest.mark.skipif(not Path("/proc/self/stat").exists(), reason="needs /proc")
@pytest.mark.parametrize("start", ["fork", "spawn"])
def test_sigkill_of_corpus_j2_ends_its_workers_and_a_later_run_cleans_up(toy: Path, tmp_path: Path, start: str) -> None:
    morphfst.load(toy)
    out = tmp_path / "terms.txt"
    cmd = [sys.executable, "-m", "morphfst", "corpus", "-l", str(toy), "-j", "2", "-o", str(out), "-q", "-"]
    env = {**os.environ, "MORPHFST_WORKER_START": start}
    proc = subprocess.Popen(cmd, stdin=subprocess.PIPE, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env)
    assert proc.stdin is not None
    proc.stdin.write(b"ka te kalar\n" * 1000)
    proc.stdin.flush()  # standard input stays open: the run waits for more
    deadline = time.monotonic() + 60
    workers: list[int] = []
    while time.monotonic() < deadline:
        # a spawned worker runs multiprocessing's spawn_main; a forked one has its parent's command line
        mark = b"spawn_main" if start == "spawn" else b"\0corpus\0"
        workers = [c for c in _children(proc.pid) if mark in Path(f"/proc/{c}/cmdline").read_bytes()]
        if len(workers) == 2 and list(tmp_path.glob(".terms.txt.*.part")):
            break
        time.sleep(0.1)
    assert len(workers) == 2, "the workers did not start"
    time.sleep(1.0)  # let them load the language and wait for work
    tracker = [c for c in _children(proc.pid) if b"resource_tracker" in Path(f"/proc/{c}/cmdline").read_bytes()]
    workers += tracker  # multiprocessing's resource tracker must not be left blocked either
    proc.kill()
    proc.wait()
    proc.stdin.close()
    deadline = time.monotonic() + 15
    while time.monotonic() < deadline and any(_alive(w) for w in workers):
        time.sleep(0.1)
    assert not any(_alive(w) for w in workers), "worker processes outlived their parent"
    assert list(tmp_path.glob(".terms.txt.*.part")), "expected the killed run's partial file"
    small = tmp_path / "small.txt"
    small.write_text("ka\n", encoding="utf-8")
    assert main(["corpus", str(small), "-l", str(toy), "-o", str(out), "-q"]) == 0
    assert out.read_text(encoding="utf-8").strip() == "ka"
    assert list(tmp_path.glob(".terms.txt.*.part")) == []

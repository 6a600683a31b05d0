"""The compiled-file cache: current source paths, compiled files loaded as they are, damaged entries
rebuilt, a bounded cache with a command to list and clear it, and a cache that cannot be written."""

from __future__ import annotations

import errno
import os
import shutil
from pathlib import Path

import pytest
from toygrammar import TOY_LEXICON, write_toy

import morphfst
from morphfst import build
from morphfst.cli import main
from morphfst.compile import archive, sourcehash
from morphfst.compile.archive import DamagedArchive
from morphfst.debug.session import DebugSession
from morphfst.errors import UserError


@pytest.fixture()
def own_cache(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    cache = tmp_path / "cache"
    monkeypatch.setenv("MORPHFST_CACHE", str(cache))
    return cache


def test_messages_use_the_sources_loaded_now_not_those_of_the_first_compile(tmp_path: Path, own_cache: Path) -> None:
    first = write_toy(tmp_path / "clone1")
    morphfst.load(first)  # fills the cache (keyed by content)
    second_dir = tmp_path / "clone2"
    shutil.copytree(first.parent, second_dir)
    shutil.rmtree(first.parent)  # the first checkout is gone
    lang = morphfst.load(second_dir / "toy.mfg")
    assert lang.meta["grammar_path"] == str((second_dir / "toy.mfg").resolve())
    assert all(str(second_dir.resolve()) in s["path"] for s in lang.meta["sources"])
    assert all(str(second_dir.resolve()) in e["file"] for e in lang.meta["lexicon"])
    # the debugging tools read the grammar source: the one loaded now
    session = DebugSession(lang)
    assert session.grammar.name == "toy"
    assert morphfst.debug.explain(lang, "kalar")
    from morphfst.tables.paradigm import compile_entry

    trial, _ = compile_entry(lang, {"lemma": "lo", "klass": "noun"})
    assert trial.analyze("lolar")


def test_a_named_compiled_file_is_loaded_as_it_is(tmp_path: Path, own_cache: Path, capsys: pytest.CaptureFixture[str]) -> None:
    grammar = write_toy(tmp_path)
    compiled = morphfst.compile_grammar(grammar, tmp_path / "toy.mfc")
    before = compiled.read_bytes()
    os.chmod(compiled, 0o444)
    # the sources now have an error: the known-good compiled file must survive and still load
    (tmp_path / "toy.tsv").write_text(TOY_LEXICON + "lo\tnoun\tN\t\n", encoding="utf-8")
    lang = morphfst.load(compiled)
    err = capsys.readouterr().err
    assert "changed after it was compiled" in err and "loading it as it is" in err
    assert lang.analyze("kalar")[0].text == "ka N;PL;NOM"
    assert compiled.read_bytes() == before
    assert list(own_cache.glob("*.mfc")) == []  # nothing compiled behind the user's back


@pytest.mark.parametrize("damage", ["flip", "truncate", "garbage"])
def test_a_damaged_cache_entry_is_reported_in_one_line_and_rebuilt(
    tmp_path: Path, own_cache: Path, capsys: pytest.CaptureFixture[str], damage: str
) -> None:
    grammar = write_toy(tmp_path)
    entry = Path(morphfst.load(grammar).path or "")
    data = bytearray(entry.read_bytes())
    if damage == "flip":
        data[len(data) // 2] ^= 0x01
    elif damage == "truncate":
        del data[len(data) // 3 :]
    else:
        data[:] = b"not a zip at all"
    entry.write_bytes(bytes(data))
    capsys.readouterr()
    lang = morphfst.load(grammar)
    err = capsys.readouterr().err
    assert lang.analyze("kalar")[0].text == "ka N;PL;NOM"
    assert err.count("\n") == 1 and "damaged cache entry" in err and "rebuilding" in err
    morphfst.load(grammar)
    assert capsys.readouterr().err == ""  # rebuilt: loads cleanly now


def test_every_single_byte_change_is_detected_or_harmless(tmp_path: Path, own_cache: Path) -> None:
    grammar = write_toy(tmp_path)
    good = Path(morphfst.compile_grammar(grammar, tmp_path / "good.mfc")).read_bytes()
    bad = tmp_path / "bad.mfc"
    for position in range(0, len(good), max(1, len(good) // 150)):
        data = bytearray(good)
        data[position] ^= 0x5A
        bad.write_bytes(bytes(data))
        try:
            fsts, meta = archive.load_archive(bad)
        except UserError as exc:  # DamagedArchive, or another format: one message, never a traceback
            assert "\n" not in exc.message
            continue
        assert meta["name"] == "toy" and set(fsts) >= {"analyzer", "generator"}


def test_a_damaged_named_compiled_file_is_one_user_error(tmp_path: Path, own_cache: Path) -> None:
    compiled = morphfst.compile_grammar(write_toy(tmp_path), tmp_path / "toy.mfc")
    data = bytearray(compiled.read_bytes())
    data[len(data) // 2] ^= 0xFF
    compiled.write_bytes(bytes(data))
    with pytest.raises(DamagedArchive, match="damaged compiled file"):
        morphfst.load(compiled)


def test_the_cache_keeps_the_newest_few_per_language_and_can_be_listed_and_cleared(
    tmp_path: Path, own_cache: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    grammar = write_toy(tmp_path)
    for i in range(build.CACHE_KEEP + 3):
        (tmp_path / "toy.tsv").write_text(TOY_LEXICON + f"lo{'a' * i}\tnoun\tN\tstone\n", encoding="utf-8")
        morphfst.load(grammar)
    assert len(list(own_cache.glob("toy-*.mfc"))) == build.CACHE_KEEP
    assert main(["cache"]) == 0
    out = capsys.readouterr().out
    assert str(own_cache) in out and out.count("toy-") == build.CACHE_KEEP
    assert main(["cache", "--clear"]) == 0
    assert list(own_cache.glob("*.mfc")) == []


def test_two_copies_of_a_language_keep_their_current_files(
    tmp_path: Path, own_cache: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    other = morphfst.load(write_toy(tmp_path / "other", lexicon=TOY_LEXICON + "su\tnoun\tN\twater\n"))
    grammar = write_toy(tmp_path / "mine")
    for i in range(build.CACHE_KEEP + 2):  # the same language name, recompiled again and again elsewhere
        (tmp_path / "mine" / "toy.tsv").write_text(TOY_LEXICON + f"lo{'a' * i}\tnoun\tN\tstone\n", encoding="utf-8")
        morphfst.load(grammar)
    assert other.path and Path(other.path).is_file()  # still the current compile of the other copy
    with monkeypatch.context() as patch:
        patch.setattr(build, "_parsed_sources", lambda *_: (_ for _ in ()).throw(AssertionError("parsed")))
        again = morphfst.load(tmp_path / "other" / "toy.mfg")
    assert again.path == other.path and again.analyze("sular")
    assert len(list(own_cache.glob("toy-*.mfc"))) == build.CACHE_KEEP + 1


def test_a_cache_that_cannot_be_written_still_loads_with_a_hint_about_the_cache(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    blocker = tmp_path / "a-file"
    blocker.write_text("")
    monkeypatch.setenv("MORPHFST_CACHE", str(blocker / "cache"))  # a cache folder that cannot be made
    grammar = write_toy(tmp_path / "g")
    assert main(["analyze", "-l", str(grammar), "kalar"]) == 0
    out, err = capsys.readouterr()
    assert "ka N;PL;NOM" in out
    assert "cache" in err and "MORPHFST_CACHE" in err and "Traceback" not in err

    # a read-only file system under the cache
    def read_only(*args: object, **kwargs: object) -> None:
        raise UserError("cannot write output: Read-only file system; nothing was written")

    monkeypatch.setenv("MORPHFST_CACHE", str(tmp_path / "ro-cache"))
    monkeypatch.setattr(build, "save_archive", read_only)
    lang = morphfst.load(grammar)
    assert lang.analyze("kalar") and "Read-only file system" in capsys.readouterr().err
    assert errno.EROFS  # (the same path as for EROFS from the kernel)


def test_the_compiler_digest_reads_every_compiler_source() -> None:
    # a moved or renamed compiler module must not drop silently out of the cache key
    package = Path(sourcehash.__file__).resolve().parent.parent
    missing = [name for name in sourcehash.COMPILER_MODULES if not (package / name).is_file()]
    assert not missing


def test_a_mapped_compiled_file_reads_as_its_bytes_do(tmp_path: Path, own_cache: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    # On POSIX systems a compiled file is mapped into memory, not copied; zip members are read through
    # a reader of the mapping with its own position. Every member and arc table must read as from the
    # file's bytes (as on systems without the mapping).
    compiled = morphfst.compile_grammar(write_toy(tmp_path), tmp_path / "toy.mfc")
    mapped_zf, _, mapped = archive._open(compiled)
    monkeypatch.setattr(archive.os, "name", "nt")
    plain_zf, _, plain = archive._open(compiled)
    assert isinstance(plain, bytes) and not isinstance(mapped, bytes)
    names = mapped_zf.namelist()
    assert names == plain_zf.namelist() and any(n.endswith(".arcs") for n in names)
    for name in names:
        assert mapped_zf.read(name) == plain_zf.read(name)
        view = archive._stored_view(mapped_zf, mapped, name)
        assert (view is None) == (archive._stored_view(plain_zf, plain, name) is None)
        if view is not None:
            assert bytes(view) == plain_zf.read(name)
    reader = archive._MappedReader(mapped)
    assert reader.seek(-5, os.SEEK_END) == len(plain) - 5 and reader.read() == plain[-5:] and reader.read(3) == b""


def test_loading_a_compiled_file_and_analyzing_a_known_word_imports_no_pynini(tmp_path: Path, own_cache: Path) -> None:
    """Start-up: the walk reads the compiled file's packed arc tables, so neither loading nor analyzing
    a word the lexicon knows needs OpenFst's Python module; composing (here: generating) imports it."""
    import subprocess
    import sys

    compiled = morphfst.compile_grammar(write_toy(tmp_path), tmp_path / "toy.mfc")
    code = (
        "import sys, morphfst\n"
        f"lang = morphfst.load({str(compiled)!r})\n"
        "print(lang.analyze('kalar')[0].text, 'pynini' in sys.modules)\n"
        "lang.generate('ka', 'N;PL;LOC')\n"
        "print('pynini' in sys.modules)\n"
    )
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert done.stdout.split("\n")[:2] == ["ka N;PL;NOM False", "True"]


def test_a_first_compile_says_so_on_a_terminal_only(
    tmp_path: Path, own_cache: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    # a first use of the shipped Finnish grammar compiles for minutes: on a terminal the user is told
    # what happens (and how long it took); in a pipeline or a library's log, nothing is added
    grammar = write_toy(tmp_path / "quiet")
    assert morphfst.load(grammar).analyze("kalar")
    assert capsys.readouterr().err == ""
    monkeypatch.setattr(build, "_on_terminal", lambda: True)
    grammar = write_toy(tmp_path / "told")
    (grammar.parent / "toy.tsv").write_text(TOY_LEXICON + "\n")  # other sources: compiled again
    assert morphfst.load(grammar).analyze("kalar")
    err = capsys.readouterr().err.splitlines()
    assert len(err) == 2 and err[0].startswith("morphfst: compiling ") and str(grammar) in err[0]
    assert str(own_cache) in err[0] and err[1].startswith("morphfst: compiled toy in ")
    assert morphfst.load(grammar).analyze("kalar") and capsys.readouterr().err == ""  # cached: nothing to say

"""Installing: the package ships its languages, a shipped name means the shipped language, and the
documentation names files that exist."""

from __future__ import annotations

import importlib
import re
import shutil
import subprocess
import sys
import sysconfig
from pathlib import Path

import pytest

import morphfst
from morphfst.cli import command_modules, main

ROOT = Path(__file__).resolve().parent.parent


def test_an_installed_layout_ships_and_finds_every_language(
    tmp_path: Path, request: pytest.FixtureRequest, cache_dir: Path
) -> None:
    """setup.py's build_py lays out exactly what the wheel holds; run it from elsewhere, without the
    checkout's import hook (python -S), as an installed package would be."""
    site = tmp_path / "site"
    subprocess.run(
        [sys.executable, "setup.py", "-q", "build_py", "--build-lib", str(site)],
        cwd=ROOT,
        check=True,
        capture_output=True,
    )
    shipped = sorted(p.stem for p in (ROOT / "grammars").glob("*.mfg"))
    for name in shipped:
        assert (site / "morphfst" / "grammars" / f"{name}.mfg").is_file()
    for included in (ROOT / "grammars").rglob("*/*.mfg"):
        assert (site / "morphfst" / "grammars" / included.relative_to(ROOT / "grammars")).is_file()
    for lexicon in (ROOT / "lexicons").rglob("*.tsv"):
        assert (site / "morphfst" / "lexicons" / lexicon.relative_to(ROOT / "lexicons")).is_file()
    elsewhere = tmp_path / "elsewhere"
    elsewhere.mkdir()
    # every shipped name is found inside the package; the smallest language is also loaded and used,
    # from a cache seeded with the session's compiled files: the cache key is the sources' names and
    # bytes, so the installed copy finds them (CI's .ci/wheel_smoke compiles every language from the
    # real wheel into an empty cache)
    smallest = min(shipped, key=lambda n: sum(p.stat().st_size for p in (ROOT / "lexicons" / n).rglob("*.tsv")))
    code = (
        "import sys, morphfst; from morphfst.build import find_grammar, shipped_names; "
        "assert morphfst.__file__.startswith(sys.argv[1]), morphfst.__file__; "
        "print(' '.join(shipped_names())); "
        "[print(n, find_grammar(n)) for n in shipped_names()]; "
        f"lang = morphfst.load({smallest!r}); assert lang.meta['lexicon'] and lang.analyze(lang.meta['lexicon'][0]['lemma']) is not None; "
        "print('loaded', lang.meta['grammar_path'])"
    )
    request.getfixturevalue(smallest)  # the session's compile of that language, into cache_dir
    shutil.copytree(cache_dir, tmp_path / "cache")
    env = {
        "PYTHONPATH": f"{site}:{sysconfig.get_paths()['purelib']}",
        "MORPHFST_CACHE": str(tmp_path / "cache"),
        "PATH": "/usr/bin:/bin",
    }
    done = subprocess.run([sys.executable, "-S", "-c", code, str(site)], cwd=elsewhere, env=env, capture_output=True, text=True)
    assert done.returncode == 0, done.stderr
    lines = done.stdout.splitlines()
    assert lines[0].split() == shipped
    assert len(lines) == len(shipped) + 2
    for line in lines[1:]:
        assert line.split()[1].startswith(str(site / "morphfst" / "grammars"))


def test_a_grammars_folder_in_the_current_directory_does_not_replace_a_shipped_language(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    (tmp_path / "grammars").mkdir()
    (tmp_path / "grammars" / "tur.mfg").write_text('language tur "an impostor"\n', encoding="utf-8")
    monkeypatch.chdir(tmp_path)
    monkeypatch.delenv("MORPHFST_GRAMMARS", raising=False)
    from morphfst.build import find_grammar

    assert find_grammar("tur") == ROOT / "grammars" / "tur.mfg"
    assert find_grammar("grammars/tur.mfg") == Path("grammars/tur.mfg")  # a path means that file


def test_a_name_found_through_MORPHFST_GRAMMARS_is_announced(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    from toygrammar import write_toy

    write_toy(tmp_path)
    monkeypatch.setenv("MORPHFST_GRAMMARS", str(tmp_path))
    assert main(["analyze", "-l", "toy", "kalar"]) == 0
    assert f"{tmp_path / 'toy.mfg'}" in capsys.readouterr().err


@pytest.mark.parametrize("module", command_modules())
def test_help_examples_name_files_that_exist(module: str) -> None:
    examples = getattr(importlib.import_module(module), "EXAMPLES", "")
    for path in re.findall(r"(?<![\w./])((?:demo|tests|grammars|lexicons)/[\w./-]*)", examples):
        if path.endswith("/") or "." in Path(path).name:
            assert (ROOT / path).exists(), f"{module} names {path}, which does not exist"


def test_readme_output_blocks_that_are_cut_say_so() -> None:
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    for block in re.findall(r"```console\n(.*?)```", text, re.S):
        for line in block.splitlines():
            assert line.strip() != "...", "a cut output block must say so, e.g. '(output cut)'"
            assert not line.rstrip().endswith(" ...") or "cut" in line


def test_modules_the_readme_uses_are_reachable_after_import_morphfst() -> None:
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    found = set(re.findall(r"`morphfst\.((?:\w+\.)+)(\w+)\(", text))
    assert ("tables.export.", "iter_unimorph") in found
    for path, function in found:
        try:
            here: object = morphfst
            for part in path.rstrip(".").split("."):
                here = getattr(here, part)
            attribute = getattr(here, function)
        except ModuleNotFoundError as exc:  # an optional dependency of that module is not installed
            assert not (exc.name or "").startswith("morphfst")
            continue
        assert callable(attribute)


def test_export_draws_no_progress_frames_when_stderr_is_not_a_terminal(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    from toygrammar import write_toy

    assert main(["export", "-l", str(write_toy(tmp_path / "g")), "-o", str(tmp_path / "out.tsv")]) == 0
    err = capsys.readouterr().err
    assert "\r" not in err and "wrote" in err


def test_setup_maps_the_top_level_folders_into_the_package() -> None:
    text = (ROOT / "setup.py").read_text(encoding="utf-8")
    assert '"morphfst.grammars": "grammars"' in text and '"morphfst.lexicons": "lexicons"' in text
    assert shutil.which("morphfst") or True

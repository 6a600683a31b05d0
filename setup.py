"""Packaging that pyproject.toml cannot say by itself: every morphfst package, plus the top-level
grammars/ and lexicons/ folders mapped into the package as morphfst/grammars and morphfst/lexicons,
so the wheel ships the languages while the repository keeps one copy of them where people edit them;
and the walk in C (morphfst/runtime/_cwalk.c), an optional extension: where it cannot be compiled the
package installs without it and walks in Python.
The rest of the configuration is in pyproject.toml."""

from setuptools import Extension, find_packages, setup

setup(
    packages=find_packages(include=["morphfst", "morphfst.*"]) + ["morphfst.grammars", "morphfst.lexicons"],
    package_dir={"morphfst.grammars": "grammars", "morphfst.lexicons": "lexicons"},
    ext_modules=[Extension("morphfst.runtime._cwalk", ["morphfst/runtime/_cwalk.c"], optional=True)],
    package_data={
        "morphfst": ["py.typed"],
        "morphfst.runtime": ["_cwalk.pyi"],
        "morphfst.language": ["grammar.lark"],
        "morphfst.grammars": ["*.mfg", "**/*.mfg"],
        "morphfst.lexicons": ["**/*.tsv"],
    },
)

"""Packaging that pyproject.toml cannot say by itself: every morphfst package, plus the top-level
grammars/ and lexicons/ folders mapped into the package as morphfst/grammars and morphfst/lexicons,
so the wheel ships the languages while the repository keeps one copy of them where people edit them.
The rest of the configuration is in pyproject.toml."""

from setuptools import find_packages, setup

setup(
    packages=find_packages(include=["morphfst", "morphfst.*"]) + ["morphfst.grammars", "morphfst.lexicons"],
    package_dir={"morphfst.grammars": "grammars", "morphfst.lexicons": "lexicons"},
    package_data={
        "morphfst": ["py.typed"],
        "morphfst.language": ["grammar.lark"],
        "morphfst.grammars": ["*.mfg", "**/*.mfg"],
        "morphfst.lexicons": ["**/*.tsv"],
    },
)

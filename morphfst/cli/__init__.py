"""The ``morphfst`` command: subcommands registered from small modules, one job each.

A user's mistake prints one message (file, line, column, hint) and exits with code 2; there is
never a traceback for it.
"""

from __future__ import annotations

import argparse
import importlib
import os
import sys
from collections.abc import Sequence

from ..errors import EXIT_USER_ERROR, UserError
from ..version import __version__

# Every module morphfst/cli/<name>_cmd.py defines register(subparsers) and is picked up here; the
# commands listed first appear first in --help, the others follow in alphabetical order.
FIRST = ["build", "analyze", "generate", "segment"]


def command_modules() -> list[str]:
    """The subcommand modules of this package, in help order."""
    import pkgutil

    names = [m.name[: -len("_cmd")] for m in pkgutil.iter_modules(__path__) if m.name.endswith("_cmd")]
    ordered = [n for n in FIRST if n in names] + sorted(n for n in names if n not in FIRST)
    return [f"{__name__}.{n}_cmd" for n in ordered]


class _Parser(argparse.ArgumentParser):
    """argparse with our exit code (2) and a hint line for bad options."""

    def error(self, message: str) -> None:  # type: ignore[override]
        self.print_usage(sys.stderr)
        sys.stderr.write(f"error: {message}\nhint: run '{self.prog} --help' for the options and examples\n")
        raise SystemExit(EXIT_USER_ERROR)


def build_parser(argv: Sequence[str] | None = None) -> argparse.ArgumentParser:
    """The parser of every subcommand; when ``argv`` names one, only that one is imported (start-up
    time: each command module imports what it needs, and the debugging tools need a lot)."""
    parser = _Parser(
        prog="morphfst",
        description="Finite-state morphology for agglutinative languages: analyze, generate and segment words.",
        epilog="Run 'morphfst COMMAND --help' for the options and examples of each command.",
    )
    parser.add_argument("--version", action="version", version=f"morphfst {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)
    modules = command_modules()
    if argv and not argv[0].startswith("-"):
        chosen = f"{__name__}.{argv[0]}_cmd"
        if chosen in modules:
            modules = [chosen]
    elif argv and argv[0] == "--version":
        modules = []
    for name in modules:
        importlib.import_module(name).register(sub)
    parser.set_defaults(_subparsers=sub)
    return parser


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser(sys.argv[1:] if argv is None else argv)
    args, extra = parser.parse_known_args(argv)
    if extra:
        # report an unknown option with the usage and help hint of the subcommand it was given to
        owner = args._subparsers.choices.get(args.command, parser) if args.command else parser
        owner.error("unrecognized arguments: " + " ".join(extra))
    if not getattr(args, "func", None):
        parser.print_help()
        return EXIT_USER_ERROR
    try:
        return int(args.func(args) or 0)
    except UserError as exc:
        sys.stderr.write(exc.render() + "\n")
        return EXIT_USER_ERROR
    except KeyboardInterrupt:
        sys.stderr.write("interrupted\n")
        return 130
    except BrokenPipeError:
        # the reader went away (e.g. piped into head): stop quietly
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
        return 0
    except OSError as exc:
        # a failed write or read outside the commands' own checks (standard output on a full disk, ...)
        _quiet_stdout()
        where = f"{exc.filename}: " if exc.filename else ""
        sys.stderr.write(f"{where}error: {exc.strerror or exc}\n")
        return EXIT_USER_ERROR


def _quiet_stdout() -> None:
    """Drop what is still buffered for standard output (its flush at exit would fail the same way)."""
    try:
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
    except (OSError, ValueError):
        pass


def entry_point() -> None:
    """Console-script entry point."""
    sys.exit(main())

"""``morphfst cache``: list or clear the compiled-file cache."""

from __future__ import annotations

import argparse
import sys
import time

from ..build import CACHE_KEEP, cache_dir, cache_entries, clear_cache

EXAMPLES = f"""examples:
  morphfst cache                 the cache folder and its compiled files, newest first
  morphfst cache --clear         remove every compiled file (they are rebuilt when needed)

Loading a grammar keeps the newest {CACHE_KEEP} compiled files of each language and removes older ones.
The folder is $MORPHFST_CACHE, by default ~/.cache/morphfst.
"""


def register(sub: argparse._SubParsersAction) -> None:  # type: ignore[type-arg]
    p = sub.add_parser(
        "cache",
        help="list or clear the compiled-file cache",
        description="List the compiled files in the cache, or remove them all with --clear.",
        epilog=EXAMPLES,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    p.add_argument("--clear", action="store_true", help="remove every compiled file from the cache")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    out = sys.stdout
    if args.clear:
        removed = clear_cache()
        out.write(f"removed {len(removed)} file(s) from {cache_dir()}\n")
        return 0
    entries = cache_entries()
    out.write(f"cache: {cache_dir()} ({len(entries)} compiled file(s))\n")
    for path in entries:
        try:
            st = path.stat()
        except OSError:
            continue
        when = time.strftime("%Y-%m-%d %H:%M", time.localtime(st.st_mtime))
        out.write(f"  {path.name:<32} {st.st_size / 1024:>8.0f} KiB  {when}\n")
    return 0

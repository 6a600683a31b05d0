"""``python -m morphfst`` runs the command-line interface."""

from .cli import entry_point

entry_point()

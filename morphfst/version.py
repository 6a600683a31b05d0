"""Version numbers of the package and of the compiled-file format."""

__version__ = "0.1.0"
FORMAT_VERSION = 2  # 2: the archive comment holds a checksum

"""Version numbers of the package and of the compiled-file format."""

__version__ = "0.1.0"
FORMAT_VERSION = 4  # 2: the archive comment holds a checksum; 3: raw-file checksum, lexicon and glosses in their own members; 4: packed arc tables

"""The built-in fluid catalog: data files with a source per entry, and their loader."""

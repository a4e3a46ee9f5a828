"""placeholder package, filled by its own module work."""

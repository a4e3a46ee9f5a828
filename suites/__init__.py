"""YAML suites shipped with ntoracle."""

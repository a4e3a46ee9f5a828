"""Hostile and clumsy candidates for tests/test_hostile_targets.py: each does something a
candidate must not be able to turn into a PASSED, a traceback, a hang or lost data."""

"""Exact mathematics: sieving, primality, combinatorial prime counting.

Pure functions, no I/O.  The facade (:mod:`oracle.facade`) chooses between them
and attaches provenance to every answer.
"""

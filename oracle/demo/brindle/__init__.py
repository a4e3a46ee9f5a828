"""brindle -- the number library of the Brindlewick Municipal Observatory.

Kept by the observatory's volunteers since 1987: first FORTRAN on the
council's minicomputer, then C (1994), then this Python port (2009, with
additions in 2016-2017).  It numbers the survey plates, checks the prime
moduli of the plate-catalogue checksums and prints the "prime of the night"
on the visitors' sheet.

Modules::

    brindle.table      the prime table up to 2**24, built once per process
    brindle.counting   prime_pi, twin_pi
    brindle.sequence   nth_prime
    brindle.primality  is_prime, next_prime
    brindle.listing    primes_in
    brindle.factoring  factor

(This package is the invented legacy library of ntoracle's demo scenario.
Its docstrings and comments are written as its authors would have written
them; :mod:`oracle.demo` states which of their beliefs are wrong.)
"""

from .counting import prime_pi, twin_pi
from .factoring import factor
from .listing import primes_in
from .primality import is_prime, next_prime
from .sequence import nth_prime

__all__ = ["prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "primes_in", "factor"]

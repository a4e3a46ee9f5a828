"""Defective prime_pi_mod: the modulus is kept in a 32-bit word.

DEFECT: q is stored as an unsigned 32-bit value (q & 0xFFFFFFFF, as a C uint32_t
parameter would receive it), so a modulus q >= 2**32 is read as q mod 2**32:
prime_pi_mod(1000, 2**32 + 3, 1) counts the primes p <= 1000 with p = 1 (mod 3)
(80 of them) instead of none (the only member of the class up to 1000 would be 1).
q = 2**32 itself becomes 0 and raises ZeroDivisionError.  Correct for q < 2**32.
The primes come from primesieve, counted with numpy: fast.
"""

import numpy as np
import primesieve


def prime_pi_mod(x, q, a):
    if x < 2:
        return 0
    q32 = q & 0xFFFFFFFF                                   # bug: a uint32_t modulus
    r = a % q32
    primes = np.array(primesieve.primes(x), dtype=np.uint64)
    return int(np.count_nonzero(primes % np.uint64(q32) == np.uint64(r)))

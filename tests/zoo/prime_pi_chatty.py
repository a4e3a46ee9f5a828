"""Correct prime_pi that prints a progress line to stdout on every call.

Delegates to primesieve's count_primes.  Not defective: its answers are
right; it tells whether a candidate's own output can corrupt what the audit
reads as its answers.
"""

import primesieve


def prime_pi(x):
    print(f"prime_pi: counting the primes up to {x} ...", flush=True)
    if x < 2:
        return 0
    return int(primesieve.count_primes(x))

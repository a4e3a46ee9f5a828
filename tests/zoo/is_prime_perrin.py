"""Defective is_prime: trial division below 100, then Perrin's criterion n | P(n).

Perrin's sequence P(0) = 3, P(1) = 0, P(2) = 2, P(k + 3) = P(k + 1) + P(k) has
p | P(p) for every prime p, and short programs use the converse as a test.
DEFECT: the converse fails: the Perrin pseudoprimes (OEIS A013998) 271441 =
521**2, 904631 = 7 * 13 * 9941 (caught here by the trial division),
24658561, ... are reported prime.  Right below 271441.
"""

SMALL_PRIMES = [p for p in range(2, 100) if all(p % q for q in range(2, p))]


def _perrin_mod(n):
    """P(n) mod n from the n-th power of the recurrence's companion matrix."""
    def times(a, b):
        return [[sum(a[i][k] * b[k][j] for k in range(3)) % n for j in range(3)] for i in range(3)]
    power = [[0, 1, 1], [1, 0, 0], [0, 1, 0]]
    result = [[1, 0, 0], [0, 1, 0], [0, 0, 1]]
    e = n
    while e:
        if e & 1:
            result = times(result, power)
        power = times(power, power)
        e >>= 1
    return (result[2][0] * 2 + result[2][2] * 3) % n    # M**n (P(2), P(1), P(0)), last entry


def is_prime(n):
    if n < 2:
        return False
    for p in SMALL_PRIMES:
        if n % p == 0:
            return n == p
    if n < 100 * 100:
        return True
    return _perrin_mod(n) == 0          # bug: a necessary condition taken for sufficient

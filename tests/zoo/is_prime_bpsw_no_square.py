"""Defective is_prime: Baillie--PSW without the perfect-square check.

DEFECT (hang): trial division by the primes below 50, a base-2 strong test,
then a strong Lucas test with Selfridge's parameters (method A: the first D
in 5, -7, 9, -11, ... with Jacobi symbol (D/n) = -1).  That search only ends
when n is not a square: for a square (D/n) is never -1, and this search
does not stop at a D sharing a factor with n either.  The check for
squares that BPSW prescribes before the search is missing, so the member
loops forever on every square that passes the base-2 strong test: the
squares of the Wieferich primes, 1093**2 = 1194649 and 3511**2 = 12327121
(OEIS A001220, A001262).  Right everywhere else.
"""

SMALL_PRIMES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47)


def _strong_base_2(n):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(2, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def _jacobi(a, n):
    a %= n
    result = 1
    while a:
        while a % 2 == 0:
            a //= 2
            if n % 8 in (3, 5):
                result = -result
        a, n = n, a
        if a % 4 == 3 and n % 4 == 3:
            result = -result
        a %= n
    return result if n == 1 else 0


def _selfridge(n):
    d = 5
    while _jacobi(d, n) != -1:                         # bug: endless when n is a square
        d = -d - 2 if d > 0 else -d + 2
    return d


def _strong_lucas(n):
    d = _selfridge(n)
    p, q = 1, (1 - d) // 4
    k, s = n + 1, 0
    while k % 2 == 0:
        k //= 2
        s += 1
    # U_k, V_k by the binary method, then the strong conditions
    u, v, qk = 0, 2, 1                                 # U_0, V_0, Q**0
    for bit in bin(k)[2:]:
        u, v, qk = u * v % n, (v * v - 2 * qk) % n, qk * qk % n       # doubling
        if bit == "1":
            u, v = p * u + v, d * u + p * v                           # step by one
            u = (u if u % 2 == 0 else u + n) // 2 % n
            v = (v if v % 2 == 0 else v + n) // 2 % n
            qk = qk * q % n
    if u == 0 or v == 0:
        return True
    for _ in range(s - 1):
        v = (v * v - 2 * qk) % n
        qk = qk * qk % n
        if v == 0:
            return True
    return False


def is_prime(n):
    if n < 2:
        return False
    for p in SMALL_PRIMES:
        if n % p == 0:
            return n == p
    if n < 47 * 47:
        return True
    return _strong_base_2(n) and _strong_lucas(n)

"""Defective mobius: a small-case shortcut that gives mobius(1) = 0.

DEFECT: ``if n < 2: return 0`` was meant for invalid inputs but catches n = 1,
whose Moebius value is 1 (the empty product; OEIS A008683 starts 1, -1, -1).
Right for every n >= 2 (trial division with a square check).
"""


def mobius(n):
    if n < 2:
        return 0                                         # bug: mobius(1) == 1
    result, d = 1, 2
    while d * d <= n:
        if n % d == 0:
            n //= d
            if n % d == 0:
                return 0
            result = -result
        d += 1
    return -result if n > 1 else result

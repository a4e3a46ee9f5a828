"""Defective factor: (prime, exponent) pairs appended inside the division loop.

DEFECT: trial division appends (p, e) after every division with the running
exponent e, instead of once after the last one, so a repeated prime is
listed several times with growing exponents: factor(4) = [(2, 1), (2, 2)],
whose product is 8.  Right for square-free n.
"""


def factor(n):
    pairs = []
    d = 2
    while d * d <= n:
        exponent = 0
        while n % d == 0:
            n //= d
            exponent += 1
            pairs.append((d, exponent))                # bug: belongs after the loop
        d += 1 if d == 2 else 2
    if n > 1:
        pairs.append((n, 1))
    return pairs

"""Defective prev_prime: candidates screened by a base-2 Fermat test only.

DEFECT: a candidate m is taken as prime when 2**(m-1) = 1 (mod m).  Base-2
Fermat pseudoprimes (341 = 11*31, 561, 645, ... OEIS A001567) pass, so
prev_prime(342) returns 341 instead of 337.  Right whenever no pseudoprime
lies between the answer and n.
"""


def _fermat_base_2(m):
    if m < 4:
        return m in (2, 3)
    return pow(2, m - 1, m) == 1                       # bug: pseudoprimes pass


def prev_prime(n):
    candidate = n - 1
    while candidate >= 2:
        if _fermat_base_2(candidate):
            return candidate
        candidate -= 1
    raise ValueError("prev_prime(n) needs n >= 3")

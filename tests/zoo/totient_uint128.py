"""Defective totient: python-flint's euler_phi, returned through an unsigned 128-bit word.

DEFECT: the value is reduced modulo 2**128, as a C extension returning
``unsigned __int128`` does: right for every n with phi(n) < 2**128, so for every
n below 2**128 and for all the sampled points of the ci profile (which stop at
2**66), wrong from phi(n) >= 2**128 on, e.g. for every prime above 2**128 + 1.
Only numbers whose factorisation is known far above any factoriser's reach
(the constructed numbers of the climb) expose it.
"""

import flint

MASK = 2**128 - 1


def totient(n):
    return int(flint.fmpz(n).euler_phi()) & MASK         # bug: a 128-bit word

"""The partial sieve's two hot loops, compiled by numba (optional extra ``jit``).

Same bit layout and the same counts as :class:`._partial_sieve.PartialSieve`
(bit ``2k`` for ``lo + 6k + 1``, bit ``2k + 1`` for ``lo + 6k + 5``; a byte
of survivors per 64-bit word); only the loops are compiled:

* crossing off the multiples of ``p``: one pass over the bits ``first``,
  ``first + 2p``, ... of each residue class, clearing a bit and lowering its
  word's count when the bit was set -- ``O(L / p)`` for every ``p``;
* prefix counts: the survivors of the blocks before (one running sum over the
  blocks per batch, ``O(L / 512)``), plus at most 7 word counts, plus a
  masked population count -- ``O(1)`` per value;
* for the hard leaves, the quotients ``v = n // m`` and the sum of their
  prefix counts in one loop, without building the array of values.

A population count is the SWAR sum of bits (Warren, "Hacker's Delight",
2nd ed. 2012, section 5-1), which LLVM turns into the hardware instruction.

This module imports numba and is itself imported only by
:func:`._partial_sieve.partial_sieve_type`, never by ``import oracle``.
The machine code is cached on disk (numba's ``cache=True``, in
``__pycache__`` beside this file or numba's cache folder), so only the first
run on a machine pays the compilation.
"""

from __future__ import annotations

import numpy as np
from numba import njit

from ._partial_sieve import PartialSieve

_U1 = np.uint64(1)
_M1 = np.uint64(0x5555555555555555)
_M2 = np.uint64(0x3333333333333333)
_M4 = np.uint64(0x0F0F0F0F0F0F0F0F)
_H01 = np.uint64(0x0101010101010101)


@njit(cache=True, nogil=True)
def _popcount(word):
    """Number of set bits of a ``uint64`` (Hacker's Delight, figure 5-2)."""
    word = word - ((word >> _U1) & _M1)
    word = (word & _M2) + ((word >> np.uint64(2)) & _M2)
    word = (word + (word >> np.uint64(4))) & _M4
    return np.int64((word * _H01) >> np.uint64(56))


@njit(cache=True, nogil=True)
def clear_class(words, popcounts, block_counts, first, step, bit_count):
    """Clear bits ``first, first + step, ...`` below ``bit_count``, updating word and block counts."""
    for bit in range(first, bit_count, step):
        word = bit >> 6
        old = words[word]
        new = old & ~(_U1 << np.uint64(bit & 63))
        words[word] = new
        cleared = np.int64(old != new)          # no branch: the bits hit look random
        popcounts[word] -= cleared
        block_counts[word >> 3] -= cleared


@njit(cache=True, nogil=True)
def block_totals(popcounts, word_count):
    """Survivors per block of 8 words, with one guard block (0) at the end."""
    block_count = word_count >> 3
    totals = np.zeros(block_count + 1, dtype=np.int64)
    for w in range(block_count << 3):
        totals[w >> 3] += popcounts[w]
    return totals


@njit(cache=True, nogil=True)
def blocks_before(block_counts):
    """``before[k]`` = survivors in the blocks ``< k`` (a running sum)."""
    before = np.zeros(block_counts.size, dtype=np.int64)
    running = 0
    for block in range(block_counts.size - 1):
        running += block_counts[block]
        before[block + 1] = running
    return before


@njit(cache=True, nogil=True)
def _count_one(words, popcounts, before, lo, value):
    """Survivors ``n <= value`` of the segment starting at ``lo``."""
    offset = value - lo
    sixes = offset // 6
    rest = offset - 6 * sixes
    bits = 2 * sixes
    if rest >= 1:
        bits += 1
    if rest >= 5:
        bits += 1
    word = bits >> 6
    block = word >> 3
    count = before[block]
    for w in range(block << 3, word):
        count += popcounts[w]
    below = (_U1 << np.uint64(bits & 63)) - _U1
    return count + _popcount(words[word] & below)


@njit(cache=True, nogil=True)
def count_up_to(words, popcounts, block_counts, lo, values, out):
    """``out[i]`` = survivors ``n <= values[i]`` of the segment starting at ``lo``."""
    before = blocks_before(block_counts)
    for i in range(values.size):
        out[i] = _count_one(words, popcounts, before, lo, values[i])


@njit(cache=True, nogil=True)
def quotient_count_sum(words, popcounts, before, lo, n, divisors, divisor_lpf, p, first, last):
    """``(sum of survivors <= n // d, number of d)`` over ``d = divisors[i]``,
    ``first <= i < last``, with ``divisor_lpf[i] > p``.

    ``n // d`` as in :mod:`._quotients`: below ``2**52`` the float64 quotient,
    truncated, is exact.
    """
    total = 0
    number = 0
    small = n < 4503599627370496                  # 2**52
    n_float = np.float64(n)
    for i in range(first, last):
        if divisor_lpf[i] <= p:
            continue
        d = divisors[i]
        if small:
            value = np.int64(n_float / np.float64(d))
        else:
            value = n // d
        total += _count_one(words, popcounts, before, lo, value)
        number += 1
    return total, number


class CompiledPartialSieve(PartialSieve):
    """:class:`PartialSieve` whose crossing off and counting run as compiled loops.

    Besides the word counts it keeps the survivors per block of 8 words, lowered
    as bits are cleared, so a batch of counts needs one pass over the blocks.
    """

    def __init__(self, lo: int, hi: int, initial_primes: tuple[int, ...]):
        super().__init__(lo, hi, initial_primes)
        self.block_counts = block_totals(self.popcounts, self.word_count)
        self._before = None                      # running block sums, until the next change

    def survivors(self) -> int:
        return int(self.block_counts.sum())

    def remove_multiples(self, p: int) -> None:
        for first in self._first_bits(p):
            clear_class(self.words, self.popcounts, self.block_counts, first, 2 * p, self.bit_count)
        self._block_counts = None
        self._before = None

    def count_up_to(self, values: np.ndarray) -> np.ndarray:
        out = np.empty(values.size, dtype=np.int64)
        count_up_to(self.words, self.popcounts, self.block_counts, self.lo,
                    np.ascontiguousarray(values, dtype=np.int64), out)
        return out

    def quotient_count_sum(self, n: int, divisors: np.ndarray, divisor_lpf: np.ndarray, p: int,
                           first: int, last: int) -> tuple[int, int]:
        """Sum of the survivors ``<= n // d`` and the number of ``d``, over the
        ``d = divisors[i]`` (``first <= i < last``) with ``divisor_lpf[i] > p``.

        Every ``n // d`` must lie in the segment.  The sum is exact: each term is
        at most ``hi - lo``, checked below to keep the total inside ``int64``.
        """
        if (last - first) * 3 * self.bit_count >= 2**63:
            raise OverflowError("too many leaves for an int64 sum")
        if self._before is None:
            self._before = blocks_before(self.block_counts)
        total, number = quotient_count_sum(self.words, self.popcounts, self._before, self.lo,
                                           n, divisors, divisor_lpf, p, first, last)
        return int(total), int(number)

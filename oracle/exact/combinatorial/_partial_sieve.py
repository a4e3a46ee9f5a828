"""A sieve segment that answers "how many survivors are <= v" at every stage.

The hard special leaves need ``phi(v, b)`` -- the count of ``n <= v`` free of
the first ``b`` primes -- for ``v`` in a segment ``[lo, hi)``, with ``b`` rising
as the sieve removes one prime after another.  Lagarias, Miller and Odlyzko
(1985, Math. Comp. 44) keep the survivors in a binary counting tree; this
module keeps them as a bit array with two levels of counts, which numpy can
query for a whole batch of ``v`` at once:

* the bits stand for the numbers prime to 6 (multiples of 2 and 3 are gone
  from stage 2 on): bit ``2k`` for ``lo + 6k + 1`` and bit ``2k + 1`` for
  ``lo + 6k + 5``;
* ``popcounts[w]`` is the number of survivors in word ``w`` (a hardware
  population count), kept up to date as numbers are crossed off;
* a block is 8 consecutive words, so the 8 popcount bytes of a block read as
  one little-endian 64-bit integer; the survivors in the first ``j`` words of
  a block are the byte sum of that integer masked to its low ``j`` bytes.

A prefix count is then: survivors in the blocks before (one cumulative sum
over the blocks per batch), plus a masked byte sum, plus a masked popcount.
Removing a prime ``p`` costs ``O(L / p)`` for ``p >= STRIDED_LIMIT`` and
``O(L / 64)`` for smaller ``p``; a batch of ``k`` prefix counts costs
``O(L / 768 + k)``.  Memory about ``L / 18`` bytes.  ``lo`` and ``hi`` must be
multiples of ``SEGMENT_GRANULE``, ``hi - lo < 2**52`` and ``hi <= 2**62``.
"""

from __future__ import annotations

import numpy as np

WORDS_PER_BLOCK = 8
SEGMENT_GRANULE = 3 * 128 * WORDS_PER_BLOCK   # 6 | lo and whole blocks of bits

#: Primes below this are crossed off by 64 strided passes, above by scattered writes.
STRIDED_LIMIT = 256

_WORD = np.dtype("<u8")                   # little-endian: bit i of word w is bit 64 w + i
_ONES = np.uint64(1) << np.arange(64, dtype=np.uint64)
_CLEAR = ~_ONES                           # _CLEAR[r]: every bit but r
_BELOW = _ONES - np.uint64(1)             # _BELOW[r]: the bits < r
_LOW_BYTES = np.array([(1 << (8 * j)) - 1 for j in range(8)], dtype=np.uint64)
_EVEN_BYTES = np.uint64(0x00FF00FF00FF00FF)
_LANE_SUM = np.uint64(0x0001000100010001)


def _byte_sums(packed: np.ndarray) -> np.ndarray:
    """Sum of the 8 bytes of each ``uint64`` (each byte <= 64, so each sum <= 512).

    Adding neighbouring bytes gives four 16-bit lanes; multiplying by
    ``0x0001000100010001`` adds the lanes into the top one.
    """
    lanes = (packed & _EVEN_BYTES) + ((packed >> np.uint64(8)) & _EVEN_BYTES)
    return ((lanes * _LANE_SUM) >> np.uint64(48)).astype(np.int64)


class PartialSieve:
    """The numbers of ``[lo, hi)`` prime to 6, sieved by a growing prefix of the primes."""

    def __init__(self, lo: int, hi: int, initial_primes: tuple[int, ...]):
        """Start with the numbers of ``[lo, hi)`` prime to 6 and to ``initial_primes`` (primes >= 5)."""
        if lo % SEGMENT_GRANULE or hi % SEGMENT_GRANULE or not 0 < hi - lo < 2**52:
            raise ValueError("segment bounds violate the layout of PartialSieve")
        self.lo = lo
        self.bit_count = (hi - lo) // 3
        alive = np.ones(self.bit_count, dtype=bool)
        for p in initial_primes:
            for first in self._first_bits(p):
                alive[first::2 * p] = False
        self.word_count = self.bit_count // 64
        # One guard block past the end keeps every query gather in range (it counts 0).
        self.words = np.zeros(self.word_count + WORDS_PER_BLOCK, dtype=_WORD)
        self.words[:self.word_count] = np.packbits(alive, bitorder="little").view(_WORD)
        self.popcounts = np.zeros(self.words.size, dtype=np.uint8)
        self._recount()

    def _first_bits(self, p: int) -> tuple[int, int]:
        """Bit indices of the first multiples ``p m >= lo`` with ``m = 1`` and ``m = 5 (mod 6)``.

        Multiples of ``p`` prime to 6 are ``p m`` with ``m`` prime to 6; within one
        residue class of ``m`` mod 6 they step by ``6 p`` in value, ``2 p`` in bits.
        """
        firsts = []
        m_low = -(-self.lo // p)
        for residue in (1, 5):
            m = m_low + (residue - m_low) % 6
            offset = p * m - self.lo                  # = 1 or 5 (mod 6)
            firsts.append(2 * (offset // 6) + (offset % 6 == 5))
        return firsts[0], firsts[1]

    def _recount(self) -> None:
        self.popcounts[:self.word_count] = np.bitwise_count(self.words[:self.word_count])
        self._block_counts = None

    def _blocks(self) -> np.ndarray:
        """Survivors per block (computed when first needed after a change)."""
        if self._block_counts is None:
            self._block_counts = _byte_sums(self.popcounts[:self.word_count].view(_WORD))
        return self._block_counts

    def survivors(self) -> int:
        """Number of survivors in the whole segment."""
        return int(self._blocks().sum())

    def remove_multiples(self, p: int) -> None:
        """Cross off every multiple of the prime ``p >= 5`` (``p`` itself included)."""
        words = self.words[:self.word_count]
        step = 2 * p
        if p < STRIDED_LIMIT:
            # Within one class the bit offsets repeat every 32 multiples, which sit
            # p words apart: 32 strided in-place ANDs per class clear them all.
            for first in self._first_bits(p):
                for j in range(32):
                    bit = first + j * step
                    if bit >= self.bit_count:
                        break
                    words[bit >> 6::p] &= _CLEAR[bit & 63]
            self._recount()
            return
        for first in self._first_bits(p):
            if first >= self.bit_count:
                continue
            bits = np.arange(first, self.bit_count, step, dtype=np.int64)
            word = bits >> 6                # distinct words within a class, since 2p >= 64
            old = words[word]
            cleared = old & _CLEAR[bits & 63]
            words[word] = cleared
            self.popcounts[word[old != cleared]] -= np.uint8(1)
        self._block_counts = None

    def count_up_to(self, values: np.ndarray) -> np.ndarray:
        """For each ``v`` in ``[lo, hi)``: the number of survivors ``n <= v`` in the segment."""
        offset = values - self.lo
        sixes = (offset.astype(np.float64) / 6.0).astype(np.int64)   # exact: offset < 2**52
        rest = offset - 6 * sixes
        bits = 2 * sixes + (rest >= 1) + (rest >= 5)   # the numbers prime to 6 in [lo, v]
        word = bits >> 6
        block = word >> 3
        blocks = self._blocks()
        before = np.zeros(blocks.size + 1, dtype=np.int64)
        np.cumsum(blocks, out=before[1:])
        block_popcounts = self.popcounts.view(_WORD)
        inside = _byte_sums(block_popcounts[block] & _LOW_BYTES[word & 7])
        partial = np.bitwise_count(self.words[word] & _BELOW[bits & 63])
        return before[block] + inside + partial


#: From this x on the compiled loops are the default: a process pays 0.7-1.3 s
#: (measured here, 2 busy cores) to import numba and load the cached kernels, and
#: near 10**14 the saving on one pi(x) is about the same.
JIT_MIN_X = 10**15

#: Environment variable: ``off`` keeps the numpy loops even when numba is installed.
JIT_SWITCH = "NTORACLE_JIT"

KERNELS = ("numpy", "jit")


def jit_available() -> bool:
    """Whether numba is installed and not switched off by ``NTORACLE_JIT=off``."""
    import os
    from importlib.util import find_spec
    if os.environ.get(JIT_SWITCH, "").strip().lower() in ("off", "0", "no", "false"):
        return False
    return find_spec("numba") is not None


def partial_sieve_type(x: int, kernel: str | None = None) -> type[PartialSieve]:
    """The partial sieve for ``pi(x)``: compiled loops (module ``_jit``) or numpy's.

    ``kernel=None`` picks the compiled one when :func:`jit_available` and
    ``x >= JIT_MIN_X``; ``"numpy"`` or ``"jit"`` forces one (``"jit"`` raises
    ``ValueError`` without numba).  Both give the same counts.
    """
    if kernel is None:
        kernel = "jit" if x >= JIT_MIN_X and jit_available() else "numpy"
    if kernel not in KERNELS:
        raise ValueError(f"kernel must be one of {KERNELS}, got {kernel!r}")
    if kernel == "numpy":
        return PartialSieve
    try:
        from ._jit import CompiledPartialSieve
    except ImportError as error:
        raise ValueError(f"the jit kernel needs numba (pip install 'ntoracle[jit]'): {error}") from None
    return CompiledPartialSieve

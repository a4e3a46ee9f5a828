"""How the candidate's time per call grows with the size of its argument.

Every known way of computing these functions costs a power of the argument, up
to logarithms: a sieve up to x about x, Deléglise–Rivat about x^(2/3) / log² x
(Deléglise & Rivat 1996, Math. Comp. 65), a primality test a power of log x.
So the seconds of the calls already made are fitted by

    t(m) ≈ t₁ · (m / m₁)^α,

with (m₁, t₁) the slowest call of the highest octave 2^j ≤ m < 2^(j+1)
measured, and α the growth exponent between that octave and the highest one at
least two octaves below it (a factor ≥ 4 apart, so that noise in one call
moves α little).  Calls faster than :data:`NOISE` measure the harness more than
the candidate: their times are raised to it, and where no exponent can be had
α = 1 (a sieve) is assumed.  α is kept within [1/2, 2].
"""

from __future__ import annotations

import math

__all__ = ["SpeedModel", "NOISE"]

#: Seconds below which one call's time says nothing about the candidate's growth.
NOISE = 2e-3
#: Bounds of the fitted growth exponent α.
SLOWEST_GROWTH, FASTEST_GROWTH = 0.5, 2.0


class SpeedModel:
    """The seconds of the answered calls of one run, by octave of the argument's magnitude."""

    def __init__(self):
        self._octaves: dict[int, tuple[int, float]] = {}    # octave -> (magnitude, seconds)
        self._calls: list[tuple[int, float]] = []

    def observe(self, magnitude: int, seconds: float) -> None:
        """Remember one answered call (``magnitude`` ≥ 0)."""
        if magnitude < 1:
            magnitude = 1
        self._calls.append((magnitude, seconds))
        octave = magnitude.bit_length()
        known = self._octaves.get(octave)
        if known is None:
            self._octaves[octave] = (magnitude, seconds)
        elif magnitude > known[0] or seconds > known[1]:        # once per octave, mostly
            self._octaves[octave] = (max(magnitude, known[0]), max(seconds, known[1]))

    def largest(self) -> int | None:
        """The largest magnitude answered, or None."""
        return max((m for m, _ in self._calls), default=None)

    def growth(self) -> float:
        """The fitted exponent α (1 when the times are too short to show one)."""
        octaves = sorted(self._octaves)
        if len(octaves) < 2:
            return 1.0
        top = octaves[-1]
        lower = [o for o in octaves if o <= top - 2]
        if not lower:
            return 1.0
        (m1, t1), (m0, t0) = self._octaves[top], self._octaves[lower[-1]]
        if t1 < NOISE or t0 < NOISE or m1 <= m0:
            return 1.0
        alpha = math.log(t1 / t0) / math.log(m1 / m0)
        return min(max(alpha, SLOWEST_GROWTH), FASTEST_GROWTH)

    def project(self, magnitude: int) -> float | None:
        """Projected seconds of one call at ``magnitude`` (None before any call was answered)."""
        if not self._octaves:
            return None
        octave = max(int(magnitude), 1).bit_length()
        below = [o for o in self._octaves if o <= octave]
        if not below:
            return max(self._octaves[min(self._octaves)][1], NOISE)
        m1, t1 = self._octaves[max(below)]
        if magnitude <= m1:
            return t1
        return max(t1, NOISE) * (magnitude / m1) ** self.growth()

    def project_by_digits(self, magnitude: int, growth: float, *,
                          smaller_only: bool = False) -> float | None:
        """Projected seconds of one call at ``magnitude`` when a call's cost grows as the
        ``growth``-th power of the number of digits: the largest projection from the slowest
        call of each octave of at least half the digits (below the octave of ``magnitude``
        only, with ``smaller_only``).  Within one octave the cost may vary by orders of
        magnitude -- a composite is rejected at once where a prime of the same size needs a
        proof -- so the slowest call of each octave counts.  None when no call qualifies."""
        digits = max(int(magnitude), 1).bit_length()
        projections = [max(seconds, NOISE) * max(digits / octave, 1.0) ** growth
                       for octave, (_, seconds) in self._octaves.items()
                       if 2 * octave >= digits and (octave < digits or not smaller_only)]
        return max(projections, default=None)

    def answered_quickly_at_least(self, magnitude: int, seconds: float) -> bool:
        """Whether some call at a magnitude ≥ ``magnitude`` was answered within ``seconds``."""
        return any(m >= magnitude and t <= seconds for m, t in self._calls)

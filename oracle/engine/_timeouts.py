"""A call that timed out: hung (a defect) or merely too slow (the limit of its reach).

A timeout alone does not say which.  It is *hung* when

* the input lies outside the role's domain, or is small (magnitude below
  :data:`SMALL_INPUT`, cheap for any reasonable method), or
* for a role whose cost follows the size of its argument (the counting roles:
  π(x) costs more at a larger x whatever x is), a call at a magnitude at least
  half as large was answered within :data:`QUICK_SHARE` of the timeout (the
  code is fast there: with growth exponent at most 2, see
  :mod:`oracle.engine._speed`, this call should have taken well under the
  timeout), or
* it does not answer a retry with :data:`RETRY_FACTOR` times the timeout
  either, although the calls below it do not project to a slow call here.

Where the cost depends on what the input *is* -- a primality test rejects
most composites at once and works hard on primes; trial division factors a
number with a small factor at once at any size; an interval costs by its
width -- a quick answer at a similar size says nothing, so only the retry and
the projection decide (common practice of the trade: the cost of primality
tests and factorisers is input-dependent).

It is *too slow* when the retry does not answer either and the calls at
smaller sizes got progressively slower: their projection to this size is at
least :data:`SLOW_SHARE` of the timeout; or when no call had answered before
at all (nothing shows the candidate should be fast here; the run's first
points are small ones, so this happens where a front end asks a large point
alone, such as one plugin item).  A retry that answers is judged like
any answer.  In the climb by bit size (:mod:`oracle.engine._reach_bits`) the
cost depends on what the input is as much as on its size (a composite is
rejected at once, a prime of the same size needs a proof), so there only the
retry decides, and the projection comes from the octaves below, growing with
a steep power of the digits.  Too slow is not a failure unless asked (``slow_fails``); it ends
the candidate's reach ("candidate speed").
"""

from __future__ import annotations

from ._speed import SpeedModel

__all__ = ["HUNG", "TOO_SLOW", "SMALL_INPUT", "RETRY_FACTOR", "obviously_hung", "after_retry"]

HUNG, TOO_SLOW = "hung", "too-slow"
#: Inputs below this magnitude are cheap for any reasonable implementation.
SMALL_INPUT = 10**6
#: A timed-out call is asked once more with this many times the timeout (capped by the budget).
RETRY_FACTOR = 4
#: An answer within this share of the timeout at a similar or larger size shows the code is fast.
QUICK_SHARE = 0.1
#: A projection from smaller calls of at least this share of the timeout shows growing slowness.
SLOW_SHARE = 0.25


def obviously_hung(magnitude: int, speed: SpeedModel, timeout: float, *, invalid: bool,
                   cost_follows_size: bool = True) -> str | None:
    """Why a timeout is a hang without asking again, or None when a retry should decide.

    ``cost_follows_size``: whether a quick call at a similar size shows this one should be
    quick too (true for the counting roles, not where the cost depends on the input)."""
    if invalid:
        return "no answer at an input outside the domain"
    if magnitude < SMALL_INPUT:
        return f"no answer at a small input (below {SMALL_INPUT:.0e})"
    if cost_follows_size and speed.answered_quickly_at_least(magnitude // 2, QUICK_SHARE * timeout):
        return (f"no answer, though a call at a similar or larger size was answered within "
                f"{QUICK_SHARE * timeout:.3g} s")
    return None


def after_retry(magnitude: int, projected: float | None, timeout: float, retried: float | None
                ) -> tuple[str, str]:
    """``(status, reason)`` of a timeout whose retry (``retried`` seconds allowed, None if there
    was no time for one) did not answer either; ``projected``: the seconds the smaller calls
    project at this size (:class:`oracle.engine._speed.SpeedModel`), None if none answered."""
    again = (f"nor within {retried:.3g} s when asked again" if retried is not None
             else "no time left to ask again")
    if projected is None:
        return TOO_SLOW, (f"no answer within {timeout:g} s ({again}); no call had answered before, "
                          f"so nothing shows it should be fast at this size")
    if projected >= SLOW_SHARE * timeout:
        return TOO_SLOW, (f"no answer within {timeout:g} s ({again}); smaller calls grew slower: "
                          f"about {projected:.3g} s projected at this size")
    return HUNG, (f"no answer within {timeout:g} s ({again}), though smaller calls were fast "
                  f"({projected:.3g} s projected)")

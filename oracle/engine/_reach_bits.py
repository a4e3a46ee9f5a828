"""Reach by digits: primality, next/prev prime, factor and the arithmetic functions climb far above 2⁶⁴.

The sampled families of ``is_prime``, ``next_prime``, ``prev_prime`` and
``factor`` stop between 2⁶⁴ and 2¹²⁸ (:mod:`oracle.sampling._profiles`).  A
candidate built on a big-integer library answers at 2²⁰⁴⁸ in milliseconds, and
the defects that show only up there go unseen: a Miller–Rabin base set proven
only below 2⁶⁴ (or below A014233's bounds) used above it, a product kept in
64 or 128 bits, a next_prime that stops at a pseudoprime of that size.  After
the sampled points the climb goes on by bit size j (``climb-bits``, the sizes
of :data:`LADDER` up to the profile's :data:`TOP_BITS`), and asks at each size:

``is_prime``
    a certified prime P of j bits, the product of two certified primes of j/2
    bits and the square of one, 2^j − 1 and 2^j + 1;
``next_prime`` / ``prev_prime``
    P − 2 and P − 1 (next: the answer is P) or P + 1 and P + 2 (prev), and
    2^j − 1 (next) or 2^j + 1 (prev);
``factor``
    q·P′, q²·P′ and q·r·P′ with q, r consecutive primes of 24 bits and P′ a
    certified prime that makes the product j bits long, registered as
    constructed numbers (:mod:`oracle.adversarial._constructed`), so that the
    judge compares with their proven factorisation;
``mobius``, ``totient``, ``divisor_count``, ``divisor_sum``
    the constructed numbers of :func:`oracle.sampling._families.constructed_at`
    (P, p², p³, q·P, 2^a·3^b·r·P, q²·r·P, q·r·s·P of j bits), registered, so the
    oracle answers from their certified factors far beyond any factoriser;

and, at the first size at or above them, every published or constructed
pseudoprime and Carmichael number of the sampling families above the role's
ceiling (for next/prev: n − 1, n + 1, whose answer lies beyond n).  Primes are
certified by Pocklington's criterion (:mod:`oracle.adversarial._certified`);
the oracle judges primality above 3.3·10²⁴ by Baillie–PSW, which is a probable-
prime test -- the provenance says ``probable``.

Before each step the candidate's time per call is projected from its slowest
call at the largest size answered so far, growing with the cube of the digits
(schoolbook modular exponentiation, common practice); the step is asked only
if that projection fits :data:`oracle.engine._reach.CALL_SHARE` of the per-call
timeout and the time left (less the reserve).  The climb stops at the first
step that does not fit, at the first finding (localisation needs no more) and
at the first call that was too slow, and writes a ``reach`` record with the
reason, like the counting climb (:mod:`oracle.engine._reach`).
"""

from __future__ import annotations

import math
import random

from .. import adversarial
from ..exact.primality import next_prime
from ..sampling import _families
from . import _reach

__all__ = ["climb", "CLIMB_BITS", "LADDER", "TOP_BITS", "ROLES", "PROOF_GROWTH"]

CLIMB_BITS = "climb-bits"
LADDER_END = "end of the climb's sizes"
#: The bit sizes climbed, in order.
LADDER = (65, 66, 72, 80, 81, 88, 96, 112, 128, 129, 160, 192, 256, 384, 512, 768, 1024, 1536,
          2048)
#: The largest bit size climbed per profile (certified primes are built up to 2048 bits).
TOP_BITS = {"quick": 512, "ci": 2048, "deep": 2048, "exhaustive": 2048}
ROLES = ("is_prime", "next_prime", "prev_prime", "factor")
#: The roles that also climb on the strong pseudoprimes to the first k prime bases.
PRIMALITY_ROLES = ("is_prime", "next_prime", "prev_prime")
#: The arithmetic-function roles, which climb on constructed numbers (their truth is known).
CONSTRUCTED_ROLES = ("mobius", "totient", "divisor_count", "divisor_sum")
#: Bits of the small primes multiplying the certified prime of a factor step.
SMALL_FACTOR_BITS = 24
#: Growth of a call's cost with the digits (schoolbook modular exponentiation).
DIGIT_GROWTH = 3
#: Growth assumed when a timeout of the climb is judged: a proof of primality (APR-CL, ECPP)
#: grows far faster than a probable-prime test, so a timeout is "too slow" unless the calls
#: of the octaves below project well under the timeout even at this steep growth; with
#: sizes 4/3 apart that leaves a factor 10 (common practice: a hang is a hang by orders of
#: magnitude).
PROOF_GROWTH = 8
#: Calls one step is reckoned to make before its inputs are built (five of its own at most,
#: and a pseudoprime now and then): the inputs need certificates, built only for steps asked.
STEP_CALLS = 6


def _pseudoprimes_above(ceiling: int, role_name: str) -> list[int]:
    """The sampling families' pseudoprimes and Carmichael numbers above ``ceiling`` (with
    the strong pseudoprimes to the first k prime bases for the primality roles)."""
    rng = random.Random(0)
    known = set(_families.pseudoprimes(2**4096, None, rng)) | set(
        _families.carmichael(2**4096, None, rng))
    if role_name in PRIMALITY_ROLES:
        known.update(_families.first_prime_bases(2**4096, None, rng))
    return sorted(n for n in known if n > ceiling)


def _step_inputs(role_name: str, bits: int, rng: random.Random) -> list[int]:
    """The inputs asked at bit size ``bits`` (see the module's docstring)."""
    if role_name in CONSTRUCTED_ROLES:
        return _families.constructed_at(bits, rng)
    if role_name == "factor":
        q = next_prime(rng.randrange(2**(SMALL_FACTOR_BITS - 1), 2**SMALL_FACTOR_BITS))
        r = next_prime(q)
        rest = bits - SMALL_FACTOR_BITS
        built = [((q, 1), (adversarial.certified_prime(rest, rng), 1)),
                 ((q, 2), (adversarial.certified_prime(rest - SMALL_FACTOR_BITS, rng), 1)),
                 ((q, 1), (r, 1), (adversarial.certified_prime(rest - SMALL_FACTOR_BITS, rng), 1))]
        return [_registered(factors) for factors in built]
    prime = adversarial.certified_prime(bits, rng).n
    if role_name == "next_prime":
        return [prime - 2, prime - 1, 2**bits - 1]
    if role_name == "prev_prime":
        return [prime + 1, prime + 2, 2**bits + 1]
    half = adversarial.certified_prime(bits // 2, rng).n
    other = adversarial.certified_prime(bits - bits // 2, rng).n
    return [prime, half * other, half * half, 2**bits - 1, 2**bits + 1]


def _registered(factors) -> int:
    """The product of ``factors`` ((prime or certificate, exponent) pairs), registered for the
    oracle when every prime is certified (primes below 2²⁴ by trial division)."""
    pairs = tuple((p if isinstance(p, adversarial.PrimeCertificate) else adversarial.PrimeCertificate(p), e)
                  for p, e in factors)
    number = adversarial.ConstructedNumber(math.prod(c.n**e for c, e in pairs),
                                           tuple(sorted(pairs, key=lambda pair: pair[0].n)))
    if number.verify():
        adversarial.register(number)
    return number.n


def _pseudoprime_inputs(role_name: str, n: int) -> list[int]:
    return {"next_prime": [n - 1], "prev_prime": [n + 1]}.get(role_name, [n])


def _steps(role_name: str, start: int, top_bits: int,
           rng: random.Random) -> list[tuple[int, list[int]]]:
    """(bits, inputs) above ``start``, in increasing size; inputs are made when asked for,
    so that a climb stopped early does not pay for the certificates of larger steps."""
    sizes = [bits for bits in LADDER if bits <= top_bits and 2**bits > start]
    # the arithmetic functions would need the factors of the pseudoprimes: not theirs to climb
    pseudoprimes = _pseudoprimes_above(start, role_name) if role_name in ROLES else []
    steps = []
    for index, bits in enumerate(sizes):
        lower = 2**sizes[index - 1] if index else start
        extra = [m for n in pseudoprimes if lower < n <= 2**bits
                 for m in _pseudoprime_inputs(role_name, n)]
        steps.append((bits, extra))
    return steps


def climb(run, seed: int) -> None:
    """Ask the climbing points of a primality or factor role (``run``: the engine's run)."""
    role = run.role
    if role.name not in ROLES + CONSTRUCTED_ROLES:
        return
    start = run.speed.largest()
    if start is None:
        return
    rng = random.Random(f"{seed}:climb-bits")
    timeout = run.call_timeout()
    top_bits = TOP_BITS.get(run.profile.name, TOP_BITS["ci"])
    following, largest = None, None
    for bits, extra in _steps(role.name, start, top_bits, rng):
        reason = _why_not(run, bits, timeout)
        if reason is not None:
            stopped, following = reason, 2**bits
            break
        inputs = sorted(set(_step_inputs(role.name, bits, rng) + extra))
        maximum = run.options.maximum
        inputs = [x for x in inputs if x >= role.minimum and (maximum is None or x <= maximum)]
        if not inputs:
            stopped, following = _reach.DECLARED_DOMAIN, 2**bits
            break
        before = (len(run.too_slow), len(run.failures), run.faults)
        run.ask([(CLIMB_BITS, (x,)) for x in inputs])
        largest = max(inputs)
        if len(run.too_slow) > before[0]:
            stopped = _reach.CANDIDATE_SPEED
            break
        if (len(run.failures), run.faults) != before[1:]:
            stopped = _reach.AFTER_FAILURES
            break
    else:
        stopped = LADDER_END
    run.stream.write({"type": "reach", "family": CLIMB_BITS, "stopped": stopped,
                      "largest": largest, "next": following, "elapsed": run.elapsed()})


def _why_not(run, bits: int, timeout: float) -> str | None:
    """Why the step at ``bits`` is not to be asked, or None."""
    if run.failures or run.failed_enough():
        return _reach.AFTER_FAILURES
    blocked = run.runnable((2**(bits - 1),))
    if blocked is not None:
        return _reach.stop_reason(blocked)
    projected = run.speed.project_by_digits(2**bits, DIGIT_GROWTH)
    if projected is None or projected > _reach.CALL_SHARE * timeout:
        return _reach.CANDIDATE_SPEED
    if STEP_CALLS * projected > run.remaining() - _reach.RESERVE * run.time_budget:
        return _reach.TIME_BUDGET
    return None

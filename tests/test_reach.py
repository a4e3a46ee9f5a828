"""Reach that follows the candidate: the climb above the sampled points, and hung versus too slow.

The candidates are defined here (not in the zoo): correct ones stand on
primecountpy and primesieve, used as independent references; each defective one
carries one bug that shows only above the sampled points (which stop near 2³²).
"""

import time

import primesieve
import pytest

from _auditing import audit
from _references import primecountpy, reference
from oracle import engine, targets
from oracle.engine import AuditOptions, _reach, _timeouts, summarise
from oracle.engine._speed import NOISE, SpeedModel
from oracle.report import summary_table

SEAM = 10**13


def prime_pi_primecount(x):
    return int(primecountpy.prime_pi(x)) if x >= 2 else 0


def prime_pi_seam_at_1e13(x):
    """Defective: a two-stage count whose second stage, above 10^13, loses one prime."""
    return prime_pi_primecount(x) - (1 if x > SEAM else 0)


def prime_pi_count_in_32_bits(x):
    """Defective: the count is kept in an unsigned 32-bit word; it wraps where π(x) reaches 2^32."""
    return prime_pi_primecount(x) % 2**32


def prime_pi_sleepy(x):
    """Correct, but each call sleeps 12.5 ms · (x / 2^20)²: slower and slower as x grows."""
    time.sleep(0.0125 * (x / 2**20) ** 2)
    return primesieve.count_primes(x) if x >= 2 else 0


def prime_pi_hangs_above_2_to_the_22(x):
    """Defective: fast, but never answers above 2^22."""
    while x > 2**22:
        time.sleep(0.01)
    return primesieve.count_primes(x) if x >= 2 else 0


def _records(tmp_path):
    from oracle import engine

    return engine.read_records(tmp_path / "r.jsonl")


# -- the climb ---------------------------------------------------------------- #

def test_ci_catches_a_defect_that_shows_only_above_10_to_the_13(tmp_path):
    primecountpy.prime_pi(10)                   # skips without the reference library
    summary = audit("test_reach:prime_pi_seam_at_1e13", "prime_pi", tmp_path, profile="ci",
                    maximum=None)
    assert not summary["passed"]
    # found by the climb (and the monotonicity identity across its answers), never by the sampled points
    assert {f["family"] for f in summary["failures"]} <= {"climb-tables", "climb-random", "identity"}
    divergence = summary["first_divergence"]
    assert divergence["input"] == [SEAM + 1] and divergence["last_agreeing"] == SEAM
    assert divergence["expected"] == 346065536839      # π(10^13), OEIS A006880; 10^13 + 1 = 11 · 909090909091
    assert summary["reach"]["climb-tables"]["stopped"] == "after failures"


def test_ci_catches_a_count_that_wraps_at_2_to_the_32(tmp_path):
    primecountpy.prime_pi(10)
    summary = audit("test_reach:prime_pi_count_in_32_bits", "prime_pi", tmp_path, profile="ci",
                    maximum=None)
    assert not summary["passed"]
    divergence = summary["first_divergence"]
    wrap = int(primecountpy.nth_prime(2**32))           # the first x with π(x) = 2^32
    assert divergence["input"] == [wrap] and divergence["last_agreeing"] == wrap - 1
    assert divergence["expected"] == 2**32


def test_a_fast_counter_climbs_every_table_point_up_to_its_declared_domain(tmp_path):
    primecountpy.prime_pi(10)
    summary = audit("test_reach:prime_pi_primecount", "prime_pi", tmp_path, profile="ci",
                    maximum=10**11)
    assert summary["passed"]
    reach = summary["reach"]
    assert reach["climb-tables"] == {"largest": 10**11, "stopped": "declared domain (--max)"}
    assert reach["climb-random"]["largest"] > 2**35
    asked = {r["arguments"][0]: r for r in _records(tmp_path)
             if r["type"] == "check" and r["family"] == "climb-tables"}
    for k in range(10, 11):                                  # every 10^k ± 1 above the sampled points
        assert {10**k - 1, 10**k, 10**k + 1} <= set(asked)
    assert {10**11 - 1, 10**11} <= set(asked) and 10**11 + 1 not in asked
    cheap = [k for k in range(33, 37)                        # every 2^k ± 1 while calls are cheap
             if max(r["seconds"] for x, r in asked.items() if x.bit_length() <= k + 1) <= 0.01]
    for k in cheap:
        assert {2**k - 1, 2**k, 2**k + 1} <= set(asked)
    assert asked[10**11]["got"] == 4118054813                # π(10^11), OEIS A006880


def test_the_climb_steps_are_table_points_and_one_random_point_per_octave():
    import random

    from oracle import tables

    steps = _reach._steps("prime_pi", 2**32 + 2**20, random.Random(1))
    table_steps = [inputs for _, family, inputs in steps if family == "climb-tables"]
    randoms = [inputs[0] for _, family, inputs in steps if family == "climb-random"]
    assert [10**10 - 1, 10**10, 10**10 + 1] in table_steps
    assert [2**92 - 1, 2**92, 2**92 + 1] in table_steps
    highest = max(tables.values("pi"))                       # 10^29, OEIS A006880's last entry here
    assert [x.bit_length() for x in randoms] == list(range(33, highest.bit_length()))
    assert [size for size, _, _ in steps] == sorted(size for size, _, _ in steps)


def test_the_answer_word_steps_are_where_the_answer_crosses_a_power_of_two():
    import random

    sympy = reference("sympy")
    primecount = reference("primecountpy", "primecountpy")
    steps = _reach._steps("prime_pi", 2**32 + 2**20, random.Random(1))
    crossings = [inputs for _, family, inputs in steps if family == "climb-answer-words"]
    assert [50685770166, 50685770167] in crossings                  # the count passes 2^31
    for below, at in crossings[:3] + crossings[-1:]:
        count = primecount.prime_pi(at)
        assert count & (count - 1) == 0 and primecount.prime_pi(below) == count - 1
    steps = _reach._steps("nth_prime", 2**28, random.Random(1))
    crossings = [inputs for _, family, inputs in steps if family == "climb-answer-words"]
    assert crossings and all(n > 2**28 for inputs in crossings for n in inputs)
    for n, following in crossings[:2]:
        p, q = primecount.nth_prime(n), primecount.nth_prime(following)
        assert p < 2**(q.bit_length() - 1) < q and sympy.isprime(p)   # p_n below 2^k, p_(n+1) above


def test_the_oracle_cost_estimate_follows_its_routes():
    budget = 10.0
    assert _reach.oracle_seconds("prime_pi", 10**20, budget) < 1          # a table point
    assert _reach.oracle_seconds("prime_pi", 10**20 + 1, budget) < 1      # its neighbour: a short sieve
    assert _reach.oracle_seconds("prime_pi", 10**20 + 10**17, budget) == float("inf")
    assert _reach.oracle_seconds("twin_pi", 10**18 + 1, budget) < 1
    assert _reach.oracle_seconds("twin_pi", 3 * 10**18, budget) > budget


def test_the_sums_climb_at_round_points_and_word_crossings():
    """prime_sum climbs from its sampled ceiling at 10^k and 2^k ± 1 and at the primes where
    its answer passes 2^63 and 2^64 (tests/test_sums.py checks those against Lucy_Hedgehog's
    method written in the tests), and at 6074001000, the least x with x(x+1)/2 >= 2^64."""
    import random

    steps = _reach._steps("prime_sum", 2**32 + 2**20, random.Random(1))
    by_family = {}
    for _, family, inputs in steps:
        by_family.setdefault(family, []).append(inputs)
    assert [10**10 - 1, 10**10, 10**10 + 1] in by_family["climb-tables"]
    assert [2**40 - 1, 2**40, 2**40 + 1] in by_family["climb-tables"]
    assert all(x > 2**32 + 2**20 for inputs in by_family["climb-tables"] for x in inputs)
    words = by_family["climb-answer-words"]
    assert [20706267150, 20706267151] in words and [29505444490, 29505444491] in words
    assert [6074000999, 6074001000] in words
    sizes = [size for size, _, _ in steps]
    assert sizes == sorted(sizes)
    squarefree = _reach._steps("squarefree_count", 2**32 + 2**20, random.Random(1))
    assert [7064938120, 7064938121] in [i for _, f, i in squarefree if f == "climb-answer-words"]
    above = [inputs for _, _, inputs in _reach._answer_word_steps("prime_sum", 25 * 10**9)]
    assert [29505444490, 29505444491] in above and [20706267150, 20706267151] not in above


def test_the_oracle_cost_estimate_of_the_sums_follows_their_routes():
    budget = 10.0
    # the combinatorial sum of the primes: seconds at 10^10, beyond the budget near 2^40
    assert _reach.oracle_seconds("prime_sum", 10**10, budget) < budget
    assert _reach.oracle_seconds("prime_sum", 2**40, budget) > budget
    # Q(x) needs mu up to sqrt(x) only; nothing at or above 2^63
    assert _reach.oracle_seconds("squarefree_count", 10**14, budget) < budget
    assert _reach.oracle_seconds("squarefree_count", 2**63, budget) == float("inf")
    # the Mertens sieve is linear in x: 2^31 is over the budget
    assert _reach.oracle_seconds("mertens", 2**31, budget) > budget
    assert _reach.oracle_seconds("quadruplet_pi", 2**64, budget) == float("inf")


@pytest.mark.slow
def test_ci_catches_a_prime_sum_that_wraps_at_2_to_the_63(tmp_path):
    """A fast Lucy_Hedgehog prime sum in int64 is caught by the climb at the prime where the
    sum first passes 2^63 - 1 (before the climb, ci passed it)."""
    summary = audit("zoo.prime_sum_lucy_int64:prime_sum", "prime_sum", tmp_path, profile="ci",
                    maximum=None, timeout=10.0)
    assert not summary["passed"]
    assert summary["first_divergence"]["input"] == [20706267151]
    assert summary["reach"]["climb-answer-words"]["stopped"] == "after failures"


# -- the speed model ----------------------------------------------------------- #

def test_speed_model_fits_the_growth_between_octaves():
    speed = SpeedModel()
    speed.observe(2**20, 0.01)
    speed.observe(2**24, 0.16)                    # 16 times the size, 16 times the time: α = 1
    assert speed.growth() == pytest.approx(1.0)
    assert speed.project(2**26) == pytest.approx(0.64)
    speed.observe(2**28, 0.64)                    # then α = 1/2 between 2^24 and 2^28
    assert speed.growth() == pytest.approx(0.5)
    assert speed.project(2**30) == pytest.approx(1.28)


def test_speed_model_assumes_a_sieve_when_calls_are_too_fast_to_show_growth():
    speed = SpeedModel()
    speed.observe(2**10, NOISE / 10)
    speed.observe(2**20, NOISE / 5)
    assert speed.growth() == 1.0
    assert speed.project(2**22) == pytest.approx(4 * NOISE)
    assert SpeedModel().project(10) is None


# -- hung or too slow ---------------------------------------------------------- #

def test_timeout_classification():
    speed = SpeedModel()
    speed.observe(2**30, 2.0)
    speed.observe(2**32, 8.0)
    assert _timeouts.obviously_hung(5000, speed, 10.0, invalid=False)            # small input
    assert _timeouts.obviously_hung(2**40, speed, 10.0, invalid=True)            # outside the domain
    assert _timeouts.obviously_hung(2**33, speed, 10.0, invalid=False) is None
    assert _timeouts.after_retry(2**33, speed.project(2**33), 10.0, 40.0)[0] == "too-slow"     # 16 s projected
    fast = SpeedModel()
    fast.observe(2**32, 0.001)
    assert _timeouts.obviously_hung(2**32 + 1, fast, 10.0, invalid=False)       # answered at 2^32
    fast.observe(2**20, 0.0005)
    assert _timeouts.after_retry(2**40, fast.project(2**40), 10.0, 40.0)[0] == "hung"          # tiny projection


def test_a_quick_answer_at_a_similar_size_proves_nothing_where_cost_depends_on_the_input():
    # Trial division answers 2^61 + 1 (divisible by 3) at once and needs 2^30 steps for the
    # prime 2^61 - 1 (OEIS A000668): for such roles only the retry and the projection decide.
    speed = SpeedModel()
    speed.observe(2**61 + 1, 0.0001)
    assert _timeouts.obviously_hung(2**61 - 1, speed, 10.0, invalid=False)                  # counting
    assert _timeouts.obviously_hung(2**61 - 1, speed, 10.0, invalid=False, cost_follows_size=False) is None
    assert _timeouts.obviously_hung(5000, speed, 10.0, invalid=False, cost_follows_size=False)  # small


def test_a_timeout_with_no_call_answered_before_is_too_slow_not_hung():
    status, reason = _timeouts.after_retry(2**61 - 1, SpeedModel().project(2**61 - 1), 10.0, 40.0)
    assert status == "too-slow" and "no call had answered before" in reason


#: Growing sizes for the sleepy candidate: answered (12, 24, 40 ms), answered on the retry only
#: (110 ms, over 50 ms), too slow (450 ms, over 4 × 50 ms), then not asked.
SLEEPY_POINTS = [(2**20,), (14 * 2**20 // 10,), (18 * 2**20 // 10,), (3 * 2**20,), (6 * 2**20,),
                 (2**23,)]


def _replay(spec, points, tmp_path, **options):
    target = targets.python_target(spec, role_name="prime_pi", timeout=0.05)
    try:
        return engine.run_audit(target, AuditOptions(role="prime_pi", profile="quick", seed=1,
                                                     stream=str(tmp_path / "r.jsonl"), **options),
                                only=points)
    finally:
        target.close()


def test_a_slow_correct_candidate_passes_with_its_reach_limited(tmp_path):
    summary = _replay("test_reach:prime_pi_sleepy", SLEEPY_POINTS, tmp_path)
    assert summary["passed"], summary["failures"]
    statuses = {r["arguments"][0]: r["status"] for r in _records(tmp_path) if r["type"] == "check"}
    assert statuses[3 * 2**20] == "pass"                      # answered when asked again, 4 × longer
    assert statuses[6 * 2**20] == "too-slow"
    # 2^23, larger than a call too slow, is either not asked or (asked in the same batch) too slow
    assert statuses.get(2**23, "too-slow") == "too-slow"
    assert summary["too_slow"] + summary["skipped"].get("beyond the candidate's speed (too slow)", 0) == 2
    assert summary["complete"]
    assert summary["reach"]["regression"] == {"largest": 3 * 2**20, "stopped": "candidate speed"}


def test_slow_fails_makes_too_slow_a_failure_again(tmp_path):
    summary = _replay("test_reach:prime_pi_sleepy", SLEEPY_POINTS, tmp_path, slow_fails=True)
    assert not summary["passed"]
    assert {f["status"] for f in summary["failures"]} == {"too-slow"}
    assert [6 * 2**20] in [f["arguments"] for f in summary["failures"]]


def test_a_hang_at_a_large_input_after_fast_calls_is_hung(tmp_path):
    summary = _replay("test_reach:prime_pi_hangs_above_2_to_the_22", [(2**20,), (2**21,), (2**22 + 1,)],
                      tmp_path)
    assert [(f["status"], f["arguments"]) for f in summary["failures"]] == [("hung", [2**22 + 1])]


# -- the reach in the summaries ------------------------------------------------ #

def _check(status, family, x):
    return {"type": "check", "status": status, "check": "exact", "family": family, "arguments": [x],
            "got": None, "expected": None, "provenance": "", "detail": "", "seconds": 0.001,
            "elapsed": 0.5}


def _synthetic_records():
    return [{"type": "start", "role": "prime_pi", "seed": 1, "slow_fails": False},
            _check("pass", "tables", 2**32),
            {"type": "reach", "family": "tables", "stopped": "the profile's ceiling (4296015872)"},
            _check("pass", "climb-tables", 10**17 + 1),
            _check("too-slow", "climb-tables", 10**18),
            {"type": "reach", "family": "climb-tables", "stopped": "time budget"},
            {"type": "end", "elapsed": 1.0}]


def test_summary_carries_the_reach_per_family_and_too_slow_is_no_failure():
    summary = summarise(_synthetic_records())
    assert summary["reach"] == {
        "tables": {"largest": 2**32, "stopped": "the profile's ceiling (4296015872)"},
        "climb-tables": {"largest": 10**17 + 1, "stopped": "candidate speed"}}
    assert summary["passed"] and summary["too_slow"] == 1
    records = _synthetic_records()
    records[0]["slow_fails"] = True
    assert not summarise(records)["passed"]


def test_terminal_summary_prints_how_far_each_family_was_checked():
    import io

    out = io.StringIO()
    summary_table(summarise(_synthetic_records()), out, colour=False, cautions=False)
    text = out.getvalue()
    assert "checked up to 10^17 + 1 (climb-tables; stopped: candidate speed)" in text
    assert "checked up to 2^32 (tables; stopped: the profile's ceiling (4296015872))" in text


def test_html_report_has_a_reach_table():
    from oracle.report._html import render_html

    records = _synthetic_records()
    records[0].update({"target": "t:f", "profile": "ci", "timeout": 10.0, "maximum": None})
    page = render_html([(summarise(records), records)])
    assert "<h3>Reach</h3>" in page and "<td>10^17 + 1</td><td>candidate speed</td>" in page

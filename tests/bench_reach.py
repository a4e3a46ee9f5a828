"""How far an audit reaches: the fastest correct zoo member of each role, audited whole.

    python tests/bench_reach.py                       # ci profile, every role
    python tests/bench_reach.py --profile deep --time-budget 300 prime_pi is_prime

Prints, per role, the wall time of the audit, its verdict and, per family of the climbs
(``climb-*``), the largest input checked and why the family went no higher.  The members
are audited without their catalogue ``max`` (the declared domain would end the climb) except
where it is the library's real domain (primesieve takes no argument above 2^64 - 1), in an
isolated child, with the profile's own timeout.  This is a measurement, not a test:
the figures depend on the machine and its load.
"""

from __future__ import annotations

import argparse
import math
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))

from oracle import engine, sampling, targets  # noqa: E402

#: The domain a member's library really has (its arguments are C unsigned 64-bit words).
DOMAIN = {"primes_in": 2**64 - 1}
#: The fastest correct member of each role (tests/zoo/catalogue.yaml).
FASTEST = {
    "prime_pi": "zoo.prime_pi_primecount:prime_pi",
    "twin_pi": "zoo.twin_pi_primesieve:twin_pi",
    "nth_prime": "zoo.nth_prime_primecount:nth_prime",
    "is_prime": "zoo.is_prime_flint:is_prime",
    "next_prime": "zoo.next_prime_sympy:next_prime",
    "prev_prime": "zoo.prev_prime_sympy:prev_prime",
    "primes_in": "zoo.primes_in_primesieve:primes_in",      # domain: b <= 2^64 - 1
    "factor": "zoo.factor_sympy:factor",
}


def _size(n: int) -> str:
    if n < 10**6:
        return str(n)
    return f"2^{math.log2(n):.1f} (10^{math.log10(n):.1f})" if n.bit_length() < 1000 \
        else f"2^{n.bit_length() - 1}"


def main(argv=None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("roles", nargs="*", default=list(FASTEST))
    parser.add_argument("--profile", default="ci")
    parser.add_argument("--time-budget", type=float, default=None)
    parser.add_argument("--seed", type=int, default=20240601)
    options = parser.parse_args(argv)
    for role in options.roles:
        spec = FASTEST[role]
        with tempfile.TemporaryDirectory() as folder:
            target = targets.python_target(spec, role_name=role, isolate=True,
                                           timeout=sampling.profile(options.profile).timeout, python_path=[str(Path(__file__).parent)])
            started = time.perf_counter()
            try:
                summary = engine.run_audit(target, engine.AuditOptions(
                    role=role, profile=options.profile, seed=options.seed,
                    maximum=DOMAIN.get(role),
                    stream=str(Path(folder) / "r.jsonl"), corpus=str(Path(folder) / "c.yaml"),
                    time_budget=options.time_budget))
            finally:
                target.close()
            seconds = time.perf_counter() - started
        verdict = "passed" if summary["passed"] else f"FAILED ({len(summary['failures'])} findings)"
        print(f"{role} ({spec}), profile {options.profile}: {verdict} in {seconds:.1f} s", flush=True)
        for family, entry in sorted(summary.get("reach", {}).items()):
            if family.startswith("climb") and entry.get("largest") is not None:
                print(f"    {family:20} up to {_size(entry['largest'])}; stopped: {entry['stopped']}",
                      flush=True)
    return 0


if __name__ == "__main__":
    sys.exit(main())

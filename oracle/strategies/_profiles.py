"""Named hypothesis settings profiles for testing against the oracle.

* ``ntoracle-ci`` -- reproducible runs for continuous integration:
  ``derandomize=True`` (the same examples on every run, so a failure is never
  a matter of luck; this also turns the example database off),
  ``deadline=None`` (a shared CI runner makes per-example timings noisy, and
  slowness of a candidate is the audit engine's finding, "too slow", not a
  hypothesis failure), ``print_blob=True`` (a failure prints the line that
  reproduces it) and the ``too_slow`` health check suppressed: drawing from
  these strategies runs primality tests and, once per strategy, builds a
  family list, which on a loaded 2-core runner can trip that check without
  anything being wrong.
* ``ntoracle-dev`` -- quick local iterations: random examples (the database
  remembers failures), 25 examples per test, no deadline for the same reason.

:func:`register_profiles` only records the profiles (it loads none); it is
cheap and idempotent, so ``oracle.strategies`` calls it on import and the
pytest plugin may call it again.  Load one with
``settings.load_profile("ntoracle-ci")`` or pytest's ``--hypothesis-profile``.
"""

from __future__ import annotations

from hypothesis import HealthCheck, settings

__all__ = ["CI_PROFILE", "DEV_PROFILE", "register_profiles"]

CI_PROFILE = "ntoracle-ci"
DEV_PROFILE = "ntoracle-dev"


def register_profiles() -> None:
    """Register the ``ntoracle-ci`` and ``ntoracle-dev`` settings profiles (loads neither)."""
    settings.register_profile(
        CI_PROFILE,
        derandomize=True,
        deadline=None,
        print_blob=True,
        suppress_health_check=(HealthCheck.too_slow,),
    )
    settings.register_profile(
        DEV_PROFILE,
        max_examples=25,
        derandomize=False,  # explicit: hypothesis's own "ci" default (CI=true) derandomises
        deadline=None,
        print_blob=True,
    )

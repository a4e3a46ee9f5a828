"""The objects behind the fixtures of hand-written tests.

* :class:`PointSampler` (fixture ``ntoracle_points``) -- the sampler's points for a role,
  drawn from the session seed, so a failing run is repeated with ``--ntoracle-seed``;
* :class:`Checker` (fixture ``ntoracle_check``) -- asks a callable at points, or judges
  answers already computed, and fails the test with the message of a check item.
"""

from __future__ import annotations

import pytest

from ._judging import CallableTarget, judge_points
from ._messages import failure_message

__all__ = ["PointSampler", "Checker"]


class PointSampler:
    """``sampler(role, family=None, profile=None)``: argument tuples of :func:`oracle.sampling.sample`
    for ``role`` at the session's seed (and profile unless given), smallest first."""

    def __init__(self, seed: int, profile: str):
        self.seed, self.profile = seed, profile

    def __call__(self, role: str, family: str | None = None, profile: str | None = None) -> list:
        from .. import roles, sampling

        chosen = roles.get(role)
        if family is not None and family not in chosen.families:
            from .._errors import InvalidInputError

            raise InvalidInputError(f"family={family!r}: the {role} families are "
                                    f"{', '.join(chosen.families)}")
        samples = sampling.sample(chosen, sampling.profile(profile or self.profile), self.seed)
        return sorted((s.arguments for s in samples if family is None or s.family == family),
                      key=lambda arguments: (max(arguments), arguments))


class Checker:
    """``check(role, function, points)`` fails the test when ``function`` disagrees with the
    oracle at any point (one argument tuple, or a plain integer, per point);
    ``check.answer(role, arguments, got)`` judges one answer computed by the test itself.
    Both return the engine's summary when everything agrees."""

    def __init__(self, seed: int, profile: str, reproduce: str | None = None):
        self.seed, self.profile, self.reproduce = seed, profile, reproduce

    def __call__(self, role: str, function, points, *, conventions: dict | None = None,
                 description: str | None = None) -> dict:
        calls = [tuple(point) if isinstance(point, (tuple, list)) else (point,) for point in points]
        target = CallableTarget(function, description)
        summary = judge_points(target, role=role, profile=self.profile, seed=self.seed, points=calls,
                               conventions=conventions)
        if summary["failures"]:
            pytest.fail(failure_message(summary, role=role, target=target.description, case="check",
                                        seed=self.seed, profile=self.profile, reproduce=self.reproduce),
                        pytrace=False)
        return summary

    def answer(self, role: str, arguments, got, *, conventions: dict | None = None) -> dict:
        """The normalisation is done here, apart from the judgement, because it runs the
        answer's own methods (``__index__``, ``__iter__``, ``items``...): one that raises fails
        the test with what it raised -- ``pytest.skip``, ``pytest.xfail`` and ``SystemExit``
        included, which would otherwise make the check a skip or an expected failure."""
        from .. import roles
        from .._bounded import bounded_text, bounded_value
        from ..engine._point import SIZE_CHECK, WRONG_TYPE_CHECK, judge_value, normalise_answer
        from ..targets._worker import describe_exception

        arguments = tuple(arguments) if isinstance(arguments, (tuple, list)) else (arguments,)
        chosen, rules = roles.get(role), roles.Conventions(**(conventions or {}))
        try:
            value, verdict = normalise_answer(chosen, got, rules)
        except KeyboardInterrupt:
            raise                   # loud either way: the session stops, it does not pass
        except BaseException as error:
            value, verdict = None, roles.Verdict(WRONG_TYPE_CHECK, False, chosen.signature, "definition",
                                                 "reading the answer raised " + describe_exception(error))
        if verdict is None:
            verdict = judge_value(chosen, arguments, value, rules)
        if not verdict.reach:
            pytest.skip(f"{role}{arguments}: no reference within the oracle's reach"
                        + (f": {verdict.detail}" if verdict.detail else ""))
        if verdict.passed:
            return {"passed": True, "checks": 1, "failures": []}
        failure = {"arguments": list(arguments), "family": "answer", "check": verdict.check,
                   "provenance": verdict.provenance, "detail": bounded_text(verdict.detail)}
        if verdict.check in (WRONG_TYPE_CHECK, SIZE_CHECK):
            failure.update(status="wrong-type" if verdict.check == WRONG_TYPE_CHECK else "wrong",
                           got=bounded_text(got, 200), expected=None, provenance="")
        else:
            failure.update(status="wrong", got=bounded_value(value),
                           expected=bounded_value(verdict.expected))
        summary = {"passed": False, "checks": 1, "failures": [failure], "first_divergence": None,
                   "skipped": {}}
        pytest.fail(failure_message(summary, role=role, target="the answer given", case="answer",
                                    seed=self.seed, profile=self.profile, reproduce=self.reproduce),
                    pytrace=False)

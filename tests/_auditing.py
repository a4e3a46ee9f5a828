"""A small audit of a test candidate, with its stream and corpus in the test's own folder."""

from oracle import engine, targets
from oracle.engine import AuditOptions

SMALL = 20_000      # declared domain keeping these runs fast; the points above are skipped


def audit(spec, role, tmp_path, *, maximum=SMALL, profile="quick", isolate=False, seed=3, **options):
    target = targets.python_target(spec, role_name=role, timeout=options.pop("timeout", 2.0),
                                   isolate=isolate)
    try:
        return engine.run_audit(target, AuditOptions(role=role, profile=profile, seed=seed,
                                                     maximum=maximum, stream=str(tmp_path / "r.jsonl"),
                                                     corpus=str(tmp_path / "regressions.yaml"),
                                                     **options))
    finally:
        target.close()

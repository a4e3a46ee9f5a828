"""Child process that runs a Python candidate in isolation: ``python -m oracle.targets._worker SPEC``.

It reads one JSON list of arguments per line, calls the candidate, and writes
one JSON line back: ``{"value": ...}`` (see :func:`oracle.targets._protocol.encode_json_value`)
or ``{"raised": "Type: message"}``.  Memory limits are set by the parent before
this program starts; a crash or a hang here kills only this process.
"""

from __future__ import annotations

import json
import sys


def main(argv: list[str]) -> int:
    from ._loader import load_callable
    from ._protocol import encode_json_value
    from ._in_process import materialise

    function = load_callable(argv[0])
    write, flush = sys.stdout.write, sys.stdout.flush
    for line in sys.stdin:
        arguments = json.loads(line)
        try:
            message = {"value": encode_json_value(materialise(function(*arguments)))}
        except (Exception, SystemExit) as error:
            message = {"raised": f"{type(error).__name__}: {error}"[:300]}
        write(json.dumps(message) + "\n")
        flush()
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))

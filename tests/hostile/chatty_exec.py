"""An executable prime_pi (line protocol) with faults at chosen inputs: an extra output line
at 13, an exit with status 3 at 17, a 20 MB line without a newline at 19."""

import math
import sys


def count(x):
    return sum(1 for n in range(2, x + 1) if all(n % d for d in range(2, math.isqrt(n) + 1)))


for line in sys.stdin:
    x = int(line)
    if x == 13:
        print(count(x))
        print("and one more line")
    elif x == 17:
        sys.exit(3)
    elif x == 19:
        sys.stdout.write("7" * (20 * 2**20))
    else:
        print(count(x))
    sys.stdout.flush()

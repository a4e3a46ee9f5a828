"""The n-th prime, straight from the prime table: nth_prime(1) = 2."""

from .table import prime_list


def nth_prime(n: int) -> int:
    """p_n for 1 <= n <= pi(2**24) = 1 077 871; ValueError outside that range."""
    if not isinstance(n, int) or isinstance(n, bool):
        raise TypeError(f"n must be an int, got {type(n).__name__}")
    primes = prime_list()
    if not 1 <= n <= len(primes):
        raise ValueError(f"n={n}: nth_prime needs 1 <= n <= {len(primes)}")
    return primes[n - 1]

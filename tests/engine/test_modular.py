"""The array programme's modular arithmetic: the primes it counts modulo and the Chinese
remainder step that puts the exact count back together."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from leaguegrid.engine.vectorized import crt, primes_for


def _prime_by_trial_division(n: int) -> bool:
    """Textbook: n > 1 is prime when no d with d*d <= n divides it."""
    return n > 1 and all(n % d for d in range(2, math.isqrt(n) + 1))


def test_the_first_prime_is_mersennes_2_to_the_31_minus_1():
    # 2^31 - 1 is prime (Euler, 1772; the Mersenne prime M31, textbook value)
    assert primes_for(1) == [2**31 - 1]


def test_primes_are_distinct_primes_whose_product_exceeds_the_bound():
    bound = 10**40
    ps = primes_for(bound)
    assert len(ps) == 5  # each is just below 2^31, so five are needed for 10^40 < 2^155
    assert len(set(ps)) == len(ps)
    assert all(p < 2**31 and _prime_by_trial_division(p) for p in ps)
    assert math.prod(ps) > bound
    assert math.prod(ps[:-1]) <= bound


@given(st.integers(min_value=0, max_value=10**60))
def test_crt_gives_back_the_number(x: int):
    ps = primes_for(10**60)
    assert crt([x % p for p in ps], ps) == x

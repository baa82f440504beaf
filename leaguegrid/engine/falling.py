"""Falling factorials and the falling-factorial basis of a polynomial (the groupings)."""

from __future__ import annotations

from flint import fmpz_poly


def falling(k: int, j: int) -> int:
    """k (k-1) ... (k-j+1), the number of ways to give j distinct rounds out of k."""
    out = 1
    for i in range(j):
        out *= k - i
    return out


def falling_poly(j: int) -> fmpz_poly:
    """The polynomial x (x-1) ... (x-j+1)."""
    p = fmpz_poly([1])
    for i in range(j):
        p *= fmpz_poly([-i, 1])
    return p


def stirling2_rows(n: int) -> tuple[tuple[int, ...], ...]:
    """Stirling numbers of the second kind S(i, j) for 0 <= j <= i <= n (recurrence)."""
    rows = [(1,)]
    for i in range(1, n + 1):
        prev = rows[-1]
        row = [0] * (i + 1)
        for j in range(1, i + 1):
            row[j] = (prev[j - 1] if j - 1 < len(prev) else 0) + (
                j * prev[j] if j < len(prev) else 0
            )
        rows.append(tuple(row))
    return tuple(rows)


def to_falling(p: fmpz_poly) -> list[int]:
    """Coefficients a_j with p(x) = sum_j a_j x(x-1)...(x-j+1), via x^i = sum_j S(i,j) x^(j)."""
    coeffs = [int(c) for c in p.coeffs()]
    n = len(coeffs) - 1
    if n < 0:
        return [0]
    rows = stirling2_rows(n)
    out = [0] * (n + 1)
    for i, c in enumerate(coeffs):
        if c:
            for j, s in enumerate(rows[i]):
                out[j] += c * s
    return out


def from_falling(a: list[int]) -> fmpz_poly:
    """The polynomial sum_j a_j x(x-1)...(x-j+1)."""
    p = fmpz_poly([])
    term = fmpz_poly([1])
    for j, c in enumerate(a):
        if c:
            p += c * term
        term *= fmpz_poly([-j, 1])
    return p

"""Readable text for chromatic polynomials: expanded and factored forms in the variable k."""

from __future__ import annotations

from flint import fmpz_poly


def _monomial(coeff: int, power: int, first: bool) -> str:
    """One term such as '- 3k^2', with the sign written as an operator unless it leads."""
    sign = "-" if coeff < 0 else "+"
    mag = abs(coeff)
    if power == 0:
        body = str(mag)
    else:
        var = "k" if power == 1 else f"k^{power}"
        body = var if mag == 1 else f"{mag}{var}"
    if first:
        return f"-{body}" if coeff < 0 else body
    return f" {sign} {body}"


def expanded(poly: fmpz_poly) -> str:
    """The polynomial written out, highest power first, e.g. 'k^3 - 3k^2 + 2k'."""
    coeffs = [int(c) for c in poly.coeffs()]
    terms = [(c, p) for p, c in enumerate(coeffs) if c != 0]
    if not terms:
        return "0"
    terms.reverse()
    return "".join(_monomial(c, p, i == 0) for i, (c, p) in enumerate(terms))


def _factor_key(item: tuple[fmpz_poly, int]) -> tuple[int, int]:
    """Linear factors first, ordered by root (k, k - 1, k - 2, ...), then the rest by degree."""
    factor, _ = item
    if factor.degree() == 1:
        return (1, -int(factor.coeffs()[0]))
    return (factor.degree(), 0)


def factored(poly: fmpz_poly) -> str:
    """The polynomial as a product of irreducible factors over the integers,
    e.g. 'k (k - 1)^3 (k^2 - 3k + 3)'."""
    if poly == 0:
        return "0"
    content, factors = poly.factor()
    parts: list[str] = []
    content = int(content)
    for factor, exp in sorted(factors, key=_factor_key):
        text = expanded(factor)
        if len(factors) > 1 or content != 1 or exp > 1:
            text = text if factor.degree() == 1 and text == "k" else f"({text})"
        parts.append(text if exp == 1 else f"{text}^{exp}")
    if content == -1:
        parts.insert(0, "-")
    elif content != 1 or not parts:
        parts.insert(0, str(content))
    return " ".join(parts).replace("- ", "-", 1) if content == -1 else " ".join(parts)

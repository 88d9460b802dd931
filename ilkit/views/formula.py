"""A line's formula for reading: the exact ``Piecewise`` without repeated pieces, or with its
coefficients in decimals beside the exact one.

``line.expr`` is the exact record (rationals such as
``480700569*x**3/1532517845150`` for a continuous beam asked with
``exact=True``), with a separate zero piece left of the beam, at every
stretch where the line is zero and right of the beam.  :func:`formula` gives
the same law as a reader wants it: consecutive pieces with the same
expression merged (one zero piece per stretch), and with ``digits`` the
coefficients as decimals to that many significant figures, rounding noise
dropped.  The exact expression stays in ``line.expr``.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from ilkit.influence import InfluenceLine
from ilkit.views._args import expect

if TYPE_CHECKING:  # pragma: no cover
    import sympy

__all__ = ["formula"]


def formula(line: InfluenceLine, digits: int | None = 6) -> sympy.Expr:
    """The line as a readable sympy ``Piecewise`` in :data:`ilkit.x` (0 off the beam).

    ``digits``: significant figures of the decimal coefficients (a term
    below 1e-12 of the largest over the beam is dropped as noise); ``None``
    keeps the exact numbers of ``line.expr`` (only repeated pieces merged).
    """
    import sympy

    from ilkit._check import whole

    expect(line, InfluenceLine, what="formula", hint="give an influence line, e.g. beam.moment(12)")
    if digits is not None:
        digits = whole(digits, what="formula: digits", field="digits", minimum=1, maximum=15)
    reach = float(line.length) or 1.0
    pieces: list[tuple[Any, Any]] = []
    for expr, cond in line.expr.args:
        law = expr if digits is None else _decimal(expr, digits, reach)
        if pieces and pieces[-1][0] == law:
            pieces[-1] = (law, cond)  # the same law as the piece before: one piece up to the later bound
        else:
            pieces.append((law, cond))
    return sympy.Piecewise(*pieces, evaluate=False)


def _decimal(expr: Any, digits: int, reach: float) -> Any:
    """``expr`` (a polynomial in x) with decimal coefficients to ``digits`` figures, noise terms dropped."""
    import sympy

    from ilkit._symbols import x

    if expr == 0:
        return sympy.Integer(0)
    terms = sympy.Poly(expr, x).terms()
    size = {p: abs(float(c)) * reach**p for (p,), c in terms}
    big = max(size.values(), default=0.0)
    return sum((_number(c, digits) * x**p for (p,), c in terms if size[p] > 1e-12 * big), sympy.Integer(0))


def _number(c: Any, digits: int) -> Any:
    """A whole number as such (``32``, not ``32.0``), any other as a decimal to ``digits`` figures."""
    import sympy

    value = float(c)
    if value.is_integer() and abs(value) < 1e15:
        return sympy.Integer(int(value))
    return sympy.Float(value, digits)
